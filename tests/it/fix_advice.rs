//! The fix appended to a warning follows from what the command solves for, never proposes what
//! the string already is, and a status word names the real reason (issue 19, points 3 and 5).

use crate::common::{json, number, table, write_file};

/// A layout whose top course is a 0.008 in plain steel string at 100 N: past its breaking
/// strength at that tension, whatever length is solved.
const THIN_LAYOUT: &str = "\
name: Test board
tuning: 12edo
tension: 100N
courses:
  - {pitch: A4, string: {kind: plain-steel, diameter: 0.008in}}
  - {pitch: E4, string: {kind: plain-steel, diameter: 0.012in}}
";

/// `lengths` holds the tension and solves the length: the stress T/A falls with a heavier
/// gauge. Before, the fix read "no gauge helps … a shorter length does", which is the advice
/// for a fixed length, and the warning said the string "can never reach its pitch".
#[test]
fn lengths_advises_a_heavier_gauge_at_the_same_tension_and_it_helps() {
    let folder = tempfile::tempdir().unwrap();
    let layout = write_file(folder.path(), "board.yaml", THIN_LAYOUT);
    let layout = layout.to_str().unwrap();
    let report = json(&["lengths", layout]);
    let warning = report["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .find(|w| w["kind"] == "stress_danger")
        .expect("a stress danger on course 1");
    let message = warning["message"].as_str().unwrap();
    assert!(!message.contains("no gauge helps"), "{message}");
    assert!(!message.contains("never reach its pitch"), "{message}");
    assert!(message.contains("heavier gauge"), "{message}");
    assert!(message.contains("100.0 N"), "{message}");

    // Following the advice: 0.010 in at the same 100 N. Stress = T/A falls (the ASTM A228
    // strength falls more slowly with diameter, REFERENCES §4.1), and the solved length
    // L = √(T/μ)/(2f) (REFERENCES §1.2) is shorter by √(μ_thin/μ_heavy).
    let heavier = write_file(
        folder.path(),
        "heavier.yaml",
        &THIN_LAYOUT.replace("0.008in}}\n  - {pitch: E4", "0.010in}}\n  - {pitch: E4"),
    );
    let after = json(&["lengths", heavier.to_str().unwrap()]);
    let (before, after) = (&report["courses"][0], &after["courses"][0]);
    assert!(number(&after["stress_ratio"]) < number(&before["stress_ratio"]));
    assert!(number(&after["stress_ratio"]) < 1.0);
    let expected = number(&before["length_m"])
        * (number(&before["unit_mass_kg_per_m"]) / number(&after["unit_mass_kg_per_m"])).sqrt();
    assert!((number(&after["length_m"]) - expected).abs() < 1e-6);
}

/// The load of a layout is the sum of the tensions asked for: lighter strings only lengthen
/// the courses. Before, the fix said "use lighter strings".
#[test]
fn lengths_load_fix_asks_for_less_tension_not_lighter_strings() {
    let folder = tempfile::tempdir().unwrap();
    let layout = write_file(folder.path(), "board.yaml", THIN_LAYOUT);
    let text = table(&["lengths", layout.to_str().unwrap(), "--rated-load", "100N"]);
    let joined = text.split_whitespace().collect::<Vec<_>>().join(" ");
    assert!(
        joined.contains("rated for. Fix: lower the tensions"),
        "{text}"
    );
    assert!(!joined.contains("use lighter strings"), "{text}");
}
