//! Harp basses through the binary: thick plain monofilament is flagged and gives way to a wound
//! kind, and wound strings on a nylon core are built for harp tensions when the kind says so.

use serde_json::Value;

use crate::common::{json, number, write_file};

/// The shipped lever harp with its eight bass courses (C3 to C2, about 140-190 N on 0.74-1.3 m)
/// allowed `bass_kinds` instead of copper-wound steel.
fn harp_plan(bass_kinds: &str) -> Value {
    let dir = tempfile::tempdir().unwrap();
    let example = std::fs::read_to_string(
        std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/lever-harp-34.yaml"),
    )
    .unwrap();
    let text = example.replace(
        "kinds: [copper-wound-steel]",
        &format!("kinds: [{bass_kinds}]"),
    );
    assert_ne!(text, example);
    let path = write_file(dir.path(), "harp.yaml", &text);
    json(&["plan", path.to_str().unwrap()])
}

fn bass(plan: &Value) -> Vec<&Value> {
    plan["courses"].as_array().unwrap()[26..]
        .iter()
        .map(|course| &course["strings"][0])
        .collect()
}

fn warnings_of_kind<'a>(plan: &'a Value, kind: &str) -> Vec<&'a Value> {
    // The plan's own list holds every course's warnings.
    plan["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|w| w["kind"] == kind)
        .collect()
}

#[test]
fn a_mixed_bass_gets_no_plain_string_thicker_than_common_practice() {
    // Before: 2.05-2.50 mm plain nylon on C3-E2 and 2.10-2.20 mm fluorocarbon on D2-C2, on
    // target and without a word. Plain nylon and fluorocarbon harp strings stop at about 2 mm,
    // where harps change to wound basses (common practice, from memory; materials.yaml).
    let plan = harp_plan("nylon, fluorocarbon, silver-wound-nylon, copper-wound-steel");
    for string in bass(&plan) {
        let kind = string["kind"].as_str().unwrap();
        let diameter = number(&string["diameter_mm"]);
        if kind == "nylon" || kind == "fluorocarbon" {
            assert!(diameter <= 2.0 + 1e-9, "{kind} {diameter} mm");
        }
        assert_eq!(string["standing"], "on_target", "{string}");
    }
    // Where the monofilaments run out, a wound string takes over.
    assert!(bass(&plan)
        .iter()
        .any(|s| s["kind"] == "copper-wound-steel"));
    assert!(warnings_of_kind(&plan, "thick_monofilament").is_empty());
}

#[test]
fn a_plain_nylon_bass_says_it_is_thicker_than_common_practice() {
    let plan = harp_plan("nylon");
    let warnings = warnings_of_kind(&plan, "thick_monofilament");
    let thick: Vec<f64> = bass(&plan)
        .iter()
        .map(|s| number(&s["diameter_mm"]))
        .filter(|&d| d > 2.0 + 1e-9)
        .collect();
    assert!(!thick.is_empty());
    // One note per string over 2.0 mm, naming its diameter and the usual limit.
    assert_eq!(warnings.len(), thick.len(), "{warnings:?}");
    for (warning, diameter) in warnings.iter().zip(&thick) {
        assert_eq!(warning["severity"], "note");
        assert!((number(&warning["value"]) * 1000.0 - diameter).abs() < 1e-9);
        assert!((number(&warning["limit"]) - 0.002).abs() < 1e-12);
        let message = warning["message"].as_str().unwrap();
        assert!(
            message.contains(&format!("{diameter:.2} mm plain nylon")),
            "{message}"
        );
        assert!(message.contains("Fix: a wound kind"), "{message}");
    }
    // The shipped harp's own plain strings (to 1.95 mm on D3) stay free of it.
    let shipped = json(&["plan", "lever-harp-34"]);
    assert!(warnings_of_kind(&shipped, "thick_monofilament").is_empty());
}

#[test]
fn wound_nylon_core_strings_for_harp_basses_are_on_target_and_below_caution() {
    // Before: every nylon-core wound kind was refused on these courses ("stress danger"),
    // because its default core is sized for a guitar's 70 N (about 0.5 mm).
    let plan = harp_plan("harp-wound-nylon, silver-wound-nylon, copper-wound-steel");
    let strings = bass(&plan);
    let mut previous_diameter = 0.0;
    for string in &strings {
        assert_eq!(string["kind"], "harp-wound-nylon", "{string}");
        assert_eq!(string["standing"], "on_target", "{string}");
        // Below the caution limit of 65 % (REFERENCES §9).
        let stress = number(&string["stress_ratio"]);
        assert!(stress < 0.65, "{stress}");
        // The outer diameter (and with it the core) grows towards the bass.
        let diameter = number(&string["diameter_mm"]);
        assert!(diameter > previous_diameter);
        previous_diameter = diameter;
    }
    // The guitar-sized nylon-core kind is still refused here: a real danger stays a danger.
    let guitar = harp_plan("silver-wound-nylon");
    for string in bass(&guitar) {
        assert!(number(&string["stress_ratio"]) > 0.85, "{string}");
    }
    assert!(!warnings_of_kind(&guitar, "stress_danger").is_empty());
}
