//! Why a string was chosen (issue 9 §2) and strings fixed in the instrument file (§3), through
//! the binary. Expectations come from the library's own evaluation in the plan's JSON (so they
//! follow any recalibration of wound-string data) and from plain-steel physics.

use crate::common::{bad_input, json, number, table, write_file};
use serde_json::Value;

/// A 25.5 in guitar with both plain steel and phosphor-bronze wound allowed everywhere.
fn guitar(tension: &str, extra_d3: &str) -> String {
    format!(
        "name: Choice guitar\nscale_length: 25.5in\ndefaults:\n  tension: {tension}\n  kinds: [plain-steel, phosphor-bronze-wound]\ncourses:\n  - {{pitch: E4}}\n  - {{pitch: B3}}\n  - {{pitch: G3}}\n  - {{pitch: D3{extra_d3}}}\n  - {{pitch: A2}}\n  - {{pitch: E2}}\n"
    )
}

fn string_of(plan: &Value, course: usize) -> &Value {
    &plan["courses"][course]["strings"][0]
}

fn flags(choice: &Value) -> Vec<&str> {
    choice["flags"]
        .as_array()
        .unwrap()
        .iter()
        .map(|f| f.as_str().unwrap())
        .collect()
}

#[test]
fn an_on_target_kind_beats_one_at_the_end_of_its_catalog() {
    let dir = tempfile::tempdir().unwrap();
    let file = write_file(
        dir.path(),
        "g.yaml",
        &guitar("{target: 100N, min: 50N, max: 140N}", ""),
    );
    let plan = json(&["plan", file.to_str().unwrap()]);
    let d3 = string_of(&plan, 3);
    let target = number(&d3["target_tension_n"]);
    assert_eq!(target, 100.0);
    // The plain string the old rule took: its catalog ends below the μ D3 asks at 100 N, yet
    // its heaviest gauge lands within the ±10 % tolerance. It must lose to the wound kind.
    let plain = d3["alternatives"]["other_kinds"]
        .as_array()
        .unwrap()
        .iter()
        .find(|c| c["kind"] == "plain-steel")
        .expect("plain steel is listed as the other kind");
    assert!(flags(plain).contains(&"thicker_than_catalog"), "{plain}");
    assert!((number(&plain["tension_n"]) / target - 1.0).abs() <= 0.10);
    assert_eq!(plain["standing"], "with_reservations");
    assert_eq!(d3["kind"], "phosphor-bronze-wound");
    assert_eq!(d3["standing"], "on_target");
    assert!((number(&d3["tension_n"]) / target - 1.0).abs() <= 0.10);
    assert!(number(&d3["stress_ratio"]) <= number(&plan["caution_stress_ratio"]));
    assert!(flags(d3).is_empty(), "{d3}");
    // The table shows the target, and --alternatives says why.
    let text = table(&["plan", file.to_str().unwrap(), "--alternatives"]);
    let header = text.lines().find(|line| line.starts_with('#')).unwrap();
    assert!(header.contains("aim"), "{text}");
    assert!(text.contains("Course 4, target 100.0 N"), "{text}");
    assert!(
        text.contains("or plain-steel 0.026 in") && text.contains("thicker than catalog"),
        "{text}"
    );
}

#[test]
fn a_kind_in_the_caution_zone_gives_way_to_a_safe_one() {
    // Plain strings' stress is ρ(2Lf)² whatever the gauge (OpenStax University Physics Vol. 1
    // §16.3 with σ = T/A): at D4 on 648 mm, music wire sits near 43 % of its ASTM A228
    // strength and nylon near 47 % of its own (DERIVED, tests/it/strings_select.rs). With the
    // caution limit at 45 % nylon runs in caution and steel does not.
    let dir = tempfile::tempdir().unwrap();
    let file = write_file(
        dir.path(),
        "d4.yaml",
        "name: Caution test\nscale_length: 648mm\nstress_limits: {caution: 45%, danger: 80%}\ndefaults:\n  tension: 60N\n  kinds: [nylon, plain-steel]\ncourses:\n  - {pitch: D4}\n",
    );
    let plan = json(&["plan", file.to_str().unwrap()]);
    let d4 = string_of(&plan, 0);
    let nylon = &d4["alternatives"]["other_kinds"][0];
    assert_eq!(nylon["kind"], "nylon");
    assert!(flags(nylon).contains(&"stress_caution"), "{nylon}");
    assert!((number(&nylon["tension_n"]) / 60.0 - 1.0).abs() <= 0.10);
    assert_eq!(d4["kind"], "plain-steel");
    assert_eq!(d4["standing"], "on_target");
    assert!(number(&d4["stress_ratio"]) < 0.45);
    // Without the steel, nylon is still chosen, with reservations.
    let alone = write_file(
        dir.path(),
        "alone.yaml",
        "name: Caution test\nscale_length: 648mm\nstress_limits: {caution: 45%, danger: 80%}\ndefaults:\n  tension: 60N\n  kinds: [nylon]\ncourses:\n  - {pitch: D4}\n",
    );
    let plan = json(&["plan", alone.to_str().unwrap()]);
    assert_eq!(string_of(&plan, 0)["standing"], "with_reservations");
}

#[test]
fn a_fixed_string_is_checked_and_the_rest_are_solved() {
    let plan = json(&["plan", "examples/guitar-kept-strings.yaml"]);
    let e4 = string_of(&plan, 0);
    assert_eq!(e4["standing"], "fixed");
    assert_eq!(e4["kind"], "plain-steel");
    // T = μ(2Lf)² with μ = ρπd²/4, ρ = 7850 kg/m³ for carbon steel (handbook value, from
    // memory), d = 0.012 in, L = 25.5 in, f = E4 = 329.628 Hz (ISO 16): 104.4 N.
    let d = 0.012 * 0.0254;
    let mu = 7850.0 * std::f64::consts::PI * d * d / 4.0;
    let expected = mu * (2.0 * 25.5 * 0.0254 * 329.627_6_f64).powi(2);
    assert!((number(&e4["tension_n"]) / expected - 1.0).abs() < 2e-3);
    assert!(e4["alternatives"]["other_kinds"]
        .as_array()
        .unwrap()
        .is_empty());
    // The weighed string: μ = m/l = 8.6 g / 0.9 m (OpenStax eq. 16.7).
    let e2 = string_of(&plan, 5);
    assert_eq!(e2["standing"], "fixed");
    assert!((number(&e2["unit_mass_kg_per_m"]) - 0.0086 / 0.9).abs() < 1e-12);
    // No catalog or target notes about fixed strings; the other courses are chosen.
    for warning in plan["warnings"].as_array().unwrap() {
        assert!(
            ![1, 6].contains(&warning["course"].as_u64().unwrap_or(0))
                || ![
                    "thinner_than_practical",
                    "thicker_than_catalog",
                    "off_target"
                ]
                .contains(&warning["kind"].as_str().unwrap()),
            "{warning}"
        );
    }
    for course in 1..5 {
        assert_ne!(string_of(&plan, course)["standing"], "fixed");
    }
    let text = table(&["plan", "examples/guitar-kept-strings.yaml"]);
    assert!(text.contains("plain-steel (fixed)"), "{text}");
}

#[test]
fn a_fixed_string_keeps_its_real_warnings_and_saves_back_as_written() {
    // Plain steel at G4 on 648 mm runs near 76 % of its strength whatever its gauge (ρ(2Lf)²
    // against ASTM A228, DERIVED in tests/it/strings_select.rs): a stress caution. A light string
    // on A2 falls below the window: slack.
    let dir = tempfile::tempdir().unwrap();
    let file = write_file(
        dir.path(),
        "fixed.yaml",
        "name: Fixed\nscale_length: 648mm\ndefaults:\n  tension: {target: 70N, min: 50N, max: 120N}\n  kinds: [plain-steel]\ncourses:\n  - {pitch: G4, string: {kind: plain-steel, diameter: 0.010in}}\n  - pitch: A2\n    strings: [{interval: unison, string: {unit_mass: 1.0g/m, diameter: 0.4mm, material: music-wire}}]\n  - {pitch: E4}\n",
    );
    let saved = dir.path().join("set.yaml");
    let plan = json(&[
        "plan",
        file.to_str().unwrap(),
        "--save-set",
        saved.to_str().unwrap(),
    ]);
    let kinds: Vec<(u64, &str)> = plan["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .map(|w| (w["course"].as_u64().unwrap(), w["kind"].as_str().unwrap()))
        .collect();
    assert!(kinds.contains(&(1, "stress_caution")), "{kinds:?}");
    assert!(kinds.contains(&(2, "tension_below_window")), "{kinds:?}");
    let set = std::fs::read_to_string(saved).unwrap();
    assert!(
        set.contains("{kind: plain-steel, diameter: 0.010in}"),
        "{set}"
    );
    assert!(
        set.contains("{unit_mass: 1g/m, diameter: 0.4mm, material: music-wire}"),
        "{set}"
    );
}

#[test]
fn bad_fixed_strings_name_their_line() {
    let dir = tempfile::tempdir().unwrap();
    let cases = [
        (
            "  - {pitch: E4, kinds: [plain-steel], string: {kind: plain-steel, diameter: 0.012in}}\n",
            "kinds",
        ),
        (
            "  - {pitch: E4, string: {unit_mass: 0.6g/m, diameter: 0.3mm}}\n",
            "material",
        ),
        (
            "  - {pitch: E4, string: {kind: plain-stel, diameter: 0.012in}}\n",
            "plain-steel",
        ),
        ("  - {pitch: E4, string: {kind: plain-steel}}\n", "diameter"),
    ];
    for (course, expected) in cases {
        let text = format!(
            "name: Bad\nscale_length: 648mm\ndefaults:\n  tension: 70N\n  kinds: [plain-steel]\ncourses:\n{course}"
        );
        let file = write_file(dir.path(), "bad.yaml", &text);
        let stderr = bad_input(&["plan", file.to_str().unwrap()]);
        assert!(stderr.contains("bad.yaml:7:"), "{stderr}");
        assert!(stderr.contains(expected), "{expected}: {stderr}");
    }
}
