//! `taut audit`: verdicts, warnings that fire and do not fire, totals, safety cautions.

use crate::common::taut;
use predicates::prelude::*;
use serde_json::Value;

fn audit(extra: &[&str]) -> Value {
    let output = taut()
        .args([
            "audit",
            "--set",
            "examples/steel-guitar-set.yaml",
            "--format",
            "json",
        ])
        .args(extra)
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    serde_json::from_slice(&output.stdout).unwrap()
}

fn verdicts(report: &Value) -> Vec<String> {
    report["courses"]
        .as_array()
        .unwrap()
        .iter()
        .map(|c| c["verdict"].as_str().unwrap().to_string())
        .collect()
}

fn warning_kinds(report: &Value) -> Vec<String> {
    report["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .map(|w| w["kind"].as_str().unwrap().to_string())
        .collect()
}

/// Common practice: a steel-string guitar's strings pull several hundred newtons in total (a
/// light 0.012–0.053 in set at standard pitch is usually quoted near 700 N, about 160 lbf).
#[test]
fn a_steel_string_guitar_set_pulls_several_hundred_newtons() {
    let report = audit(&["examples/steel-guitar-12edo.yaml"]);
    let total = report["total_tension_n"].as_f64().unwrap();
    assert!((500.0..900.0).contains(&total), "{total}");
    // Each course's tension is μ(2Lf)² (REFERENCES §1.2) from the set's strings.
    let first = &report["courses"][0]["strings"][0];
    let mu = first["unit_mass_kg_per_m"].as_f64().unwrap();
    let hz = first["pitch_hz"].as_f64().unwrap();
    let expected = mu * (2.0 * 0.6477 * hz).powi(2);
    assert!((first["tension_n"].as_f64().unwrap() / expected - 1.0).abs() < 1e-12);
    // At standard pitch nothing is refused.
    assert!(!verdicts(&report).contains(&"no".to_string()));
}

#[test]
fn retune_to_a_22_edo_mode_answers_per_course_with_reasons() {
    let report = audit(&[
        "examples/guitar-22edo-mode.yaml",
        "--from-instrument",
        "examples/steel-guitar-12edo.yaml",
    ]);
    assert_eq!(report["reference_tuning"], "12edo");
    let v = verdicts(&report);
    // Top string up a minor third: too much stress and tension.
    assert_eq!(v[0], "no");
    assert!(report["courses"][0]["reason"]
        .as_str()
        .unwrap()
        .contains("breaking strength"));
    // Bottom string down a major third: tension falls about 37 % (f² law): too slack.
    assert_eq!(v[5], "no");
    let change = report["courses"][5]["strings"][0]["tension_change_pct"]
        .as_f64()
        .unwrap();
    let expected = ((64.38_f64 / 82.41).powi(2) - 1.0) * 100.0;
    assert!((change - expected).abs() < 0.5, "{change} vs {expected}");
    assert!(report["courses"][5]["reason"]
        .as_str()
        .unwrap()
        .contains("slack"));
    // The middle strings barely move.
    assert_eq!(v[3], "yes");
    assert_eq!(v[4], "yes");
    assert_eq!(report["courses_ok"].as_u64(), Some(4));
}

#[test]
fn danger_fires_with_the_safety_cautions_and_not_at_pitch() {
    // Five semitones up (A4 = 587.33 Hz): the 0.012 in plain top string would run near its
    // breaking strength (σ ∝ f², REFERENCES §1.2).
    let output = taut()
        .args([
            "audit",
            "examples/steel-guitar-12edo.yaml",
            "--set",
            "examples/steel-guitar-set.yaml",
            "--tuning",
            "12edo@A4=587.33",
        ])
        .assert()
        .success();
    output
        .stdout(predicate::str::contains("DANGER"))
        .stdout(predicate::str::contains("eye protection"))
        .stdout(predicate::str::contains("maker's load rating"));
    let calm = audit(&[
        "examples/steel-guitar-12edo.yaml",
        "--tuning",
        "12edo@A4=392",
    ]);
    assert!(!warning_kinds(&calm).contains(&"stress_danger".to_string()));
}

#[test]
fn window_and_change_limits_fire_and_do_not_fire() {
    // Two semitones down: −21 % tension, inside ±30 % and inside the 60–140 N window.
    let down = audit(&[
        "examples/steel-guitar-12edo.yaml",
        "--tuning",
        "12edo@A4=392",
    ]);
    assert!(
        verdicts(&down).iter().all(|v| v != "no"),
        "{:?}",
        verdicts(&down)
    );
    // With a ±15 % limit the same retune is refused for feel.
    let strict = audit(&[
        "examples/steel-guitar-12edo.yaml",
        "--tuning",
        "12edo@A4=392",
        "--max-change",
        "15%",
    ]);
    assert!(verdicts(&strict).iter().all(|v| v == "no"));
    // Six semitones down: below the 60 N window minimum somewhere.
    let slack = audit(&[
        "examples/steel-guitar-12edo.yaml",
        "--tuning",
        "12edo@A4=311.13",
    ]);
    assert!(warning_kinds(&slack).contains(&"tension_below_window".to_string()));
    assert!(!warning_kinds(&down).contains(&"tension_below_window".to_string()));
}

#[test]
fn stiffness_and_feel_are_reported_per_string() {
    let report = audit(&[
        "examples/steel-guitar-12edo.yaml",
        "--bend",
        "50",
        "--push",
        "2N",
    ]);
    let feel = &report["courses"][0]["strings"][0]["feel"];
    assert!(feel["inharmonicity_b"].as_f64().unwrap() > 0.0);
    assert!(feel["partial_8_cents"].as_f64().unwrap() > feel["partial_2_cents"].as_f64().unwrap());
    assert_eq!(feel["bend_cents"].as_f64(), Some(50.0));
    assert_eq!(feel["push_n"].as_f64(), Some(2.0));
    assert!(feel["bend_force_n"].as_f64().unwrap() > 0.0);
}

#[test]
fn a_measured_string_without_material_gets_yes_with_care() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("set.yaml");
    std::fs::write(
        &path,
        "name: weighed\ncourses:\n  - strings: [{mass: 0.60g, length: 1000mm}]\n  - strings: [{kind: plain-steel, diameter: 0.016in}]\n  - strings: [{kind: phosphor-bronze-wound, diameter: 0.024in, core_diameter: 0.013in}]\n  - strings: [{kind: phosphor-bronze-wound, diameter: 0.032in}]\n  - strings: [{kind: phosphor-bronze-wound, diameter: 0.042in}]\n  - strings: [{kind: phosphor-bronze-wound, diameter: 0.053in}]\n",
    )
    .unwrap();
    let output = taut()
        .args([
            "audit",
            "examples/steel-guitar-12edo.yaml",
            "--format",
            "json",
            "--set",
        ])
        .arg(&path)
        .output()
        .unwrap();
    assert!(output.status.success());
    let report: Value = serde_json::from_slice(&output.stdout).unwrap();
    let first = &report["courses"][0];
    assert_eq!(first["verdict"], "yes_with_care");
    assert!(first["reason"]
        .as_str()
        .unwrap()
        .contains("unknown breaking strength"));
    // μ = m/l = 0.60 g/m (OpenStax University Physics Vol. 1 eq. 16.7).
    let mu = first["strings"][0]["unit_mass_kg_per_m"].as_f64().unwrap();
    assert!((mu - 0.00060).abs() < 1e-15);
}

#[test]
fn plan_save_then_audit_is_one_flow() {
    let dir = tempfile::tempdir().unwrap();
    let set = dir.path().join("planned.yaml");
    let plan = taut()
        .args([
            "plan",
            "examples/steel-guitar-12edo.yaml",
            "--format",
            "json",
            "--save-set",
        ])
        .arg(&set)
        .output()
        .unwrap();
    assert!(plan.status.success());
    let plan: Value = serde_json::from_slice(&plan.stdout).unwrap();
    let output = taut()
        .args([
            "audit",
            "examples/steel-guitar-12edo.yaml",
            "--format",
            "json",
            "--set",
        ])
        .arg(&set)
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    let audit: Value = serde_json::from_slice(&output.stdout).unwrap();
    for (planned, audited) in plan["courses"]
        .as_array()
        .unwrap()
        .iter()
        .zip(audit["courses"].as_array().unwrap())
    {
        let a = planned["strings"][0]["tension_n"].as_f64().unwrap();
        let b = audited["strings"][0]["tension_n"].as_f64().unwrap();
        assert!((a / b - 1.0).abs() < 1e-6, "{a} vs {b}");
    }
    // The plan carries the same feel figures.
    assert!(
        plan["courses"][0]["strings"][0]["feel"]["inharmonicity_b"]
            .as_f64()
            .unwrap()
            > 0.0
    );
}
