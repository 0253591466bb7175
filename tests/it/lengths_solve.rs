//! `taut lengths`: the length solve, its inverse, jumps, and bad input.

use crate::common::{json, taut};
use predicates::prelude::*;
use proptest::prelude::*;

use taut::instrument::TensionSpec;
use taut::lengths::{lay_out, LayoutInput, LayoutOptions};
use taut::strings::physics;
use taut::strings::stock::Stock;

/// A 0.010 in plain steel string at E4 on a 648 mm scale carries ≈ 72.6 N (REFERENCES §1.2,
/// DERIVED from the handbook density 7850 kg/m³; common practice agrees). Asking for that
/// tension must give back the 648 mm scale.
#[test]
fn plain_steel_e4_at_72_6_newtons_needs_648_mm() {
    let report = json(&[
        "lengths",
        "--pitch",
        "E4",
        "--string",
        "{kind: plain-steel, diameter: 0.010in}",
        "--tension",
        "72.6N",
    ]);
    let length = report["courses"][0]["length_m"].as_f64().unwrap();
    assert!((length - 0.648).abs() < 0.648 * 0.002, "{length}");
}

proptest! {
    /// The length solve inverts the tension solve: T = μ(2Lf)² at the reported L gives back the
    /// tension asked for, and f = √(T/μ)/(2L) the pitch (Mersenne/Taylor, REFERENCES §1.1).
    #[test]
    fn length_solve_inverts_tension_solve(
        semitones in -30i32..30,
        tension in 5.0f64..300.0,
        thousandths in 8u32..30,
    ) {
        let pitch = format!("{:.6}hz", 440.0 * 2f64.powf(f64::from(semitones) / 12.0));
        let string = format!("{{kind: plain-steel, diameter: {}.{:03}in}}", 0, thousandths);
        let input = LayoutInput::single(
            &pitch,
            &string,
            TensionSpec::Fixed(taut::instrument::TensionGoal { target_n: tension, min_n: None, max_n: None }),
            Stock::builtin().unwrap(),
        ).unwrap();
        let layout = lay_out(&input, Stock::builtin().unwrap(), &LayoutOptions::default()).unwrap();
        let course = &layout.courses[0];
        let back = physics::tension(course.unit_mass_kg_per_m, course.length_m, course.pitch.hz);
        prop_assert!((back / tension - 1.0).abs() < 1e-12, "{back} vs {tension}");
        let f = physics::frequency(tension, course.unit_mass_kg_per_m, course.length_m);
        prop_assert!((f / course.pitch.hz - 1.0).abs() < 1e-12);
    }
}

#[test]
fn psaltery_layout_reports_the_wound_to_plain_step_and_fold_backs() {
    let report = json(&["lengths", "examples/psaltery-layout.yaml"]);
    let jumps = report["jumps"].as_array().unwrap();
    let step = jumps.iter().find(|j| j["kind"] == "step").expect("a step");
    assert_eq!(
        (step["from_course"].as_u64(), step["to_course"].as_u64()),
        (Some(2), Some(3))
    );
    assert!(step["value_pct"].as_f64().unwrap() > 15.0);
    assert!(jumps.iter().any(|j| j["kind"] == "fold_back"));
    // The profile runs from 40 N to 60 N.
    let courses = report["courses"].as_array().unwrap();
    assert!((courses[0]["tension_n"].as_f64().unwrap() - 40.0).abs() < 1e-9);
    assert!((courses[17]["tension_n"].as_f64().unwrap() - 60.0).abs() < 1e-9);
}

#[test]
fn smooth_layout_has_no_jumps_and_a_looser_threshold_silences_the_step() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("smooth.yaml");
    // One gauge throughout at one tension: L ∝ 1/f, so √(T/μ) never changes.
    std::fs::write(
        &path,
        "name: smooth\ntension: 50N\ncourses:\n  - {pitch: C4, string: {kind: plain-steel, diameter: 0.012in}}\n  - {pitch: D4, string: {kind: plain-steel, diameter: 0.012in}}\n  - {pitch: E4, string: {kind: plain-steel, diameter: 0.012in}}\n",
    )
    .unwrap();
    let report = json(&["lengths", path.to_str().unwrap()]);
    assert_eq!(report["jumps"].as_array().unwrap().len(), 0);
    let loose = json(&[
        "lengths",
        "examples/psaltery-layout.yaml",
        "--max-step",
        "25%",
    ]);
    assert!(!loose["jumps"]
        .as_array()
        .unwrap()
        .iter()
        .any(|j| j["kind"] == "step"));
}

#[test]
fn a_length_that_overstresses_plain_steel_warns_with_the_cautions() {
    // σ = T/A: 0.008 in steel at 200 N is far past its strength, whatever the length.
    taut()
        .args([
            "lengths",
            "--pitch",
            "A4",
            "--string",
            "{kind: plain-steel, diameter: 0.008in}",
            "--tension",
            "200N",
        ])
        .assert()
        .success()
        .stdout(predicate::str::contains("DANGER"))
        .stdout(predicate::str::contains("eye protection"));
    taut()
        .args([
            "lengths",
            "--pitch",
            "A4",
            "--string",
            "{kind: plain-steel, diameter: 0.012in}",
            "--tension",
            "40N",
        ])
        .assert()
        .success()
        .stdout(predicate::str::contains("No warnings."))
        .stdout(predicate::str::contains("Before you string this up").not())
        .stdout(predicate::str::contains(
            "Strings can break: wear eye protection",
        ));
}

#[test]
fn bad_layouts_name_file_line_and_field() {
    let dir = tempfile::tempdir().unwrap();
    let cases: [(&str, &str, &str); 4] = [
        (
            "name: x\ntension: 50N\ncourses:\n  - {pitch: C4, strng: {kind: plain-steel, diameter: 0.012in}}\n",
            ":4:",
            "strng",
        ),
        (
            "name: x\ntension: 50N\ncourses:\n  - pitch: C4\n    string: {kind: plain-steel, diameter: -0.012in}\n",
            ":5:",
            "courses[0].string.diameter",
        ),
        (
            "name: x\ncourses:\n  - pitch: C4\n    string: {kind: plain-steel, diameter: 0.012in}\n",
            ":3:",
            "no tension",
        ),
        (
            "name: x\ntension: 50N\ncourses:\n  - pitch: Q4\n    string: {kind: plain-steel, diameter: 0.012in}\n",
            ":4:",
            "courses[0].pitch",
        ),
    ];
    for (index, (text, line, words)) in cases.iter().enumerate() {
        let path = dir.path().join(format!("bad{index}.yaml"));
        std::fs::write(&path, text).unwrap();
        taut()
            .args(["lengths", path.to_str().unwrap()])
            .assert()
            .code(2)
            .stderr(predicate::str::contains(*line))
            .stderr(predicate::str::contains(*words))
            .stderr(predicate::str::contains("panicked").not());
    }
}
