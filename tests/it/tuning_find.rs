//! `taut tuning find`: every pitch form resolved through the real binary.

use crate::common;

use crate::common::{json, number, table};
use approx::assert_abs_diff_eq;

#[test]
fn every_pitch_form_resolves_in_twelve_edo() {
    let report = json(&[
        "tuning",
        "find",
        "12edo",
        "E2",
        "F#3",
        "Bb4",
        "C-1",
        "E2+14c",
        "~E2",
        "deg7",
        "deg3p-1",
        "386.3137c",
        "3/2",
        "82.41hz",
    ]);
    let pitches = report["pitches"].as_array().unwrap();
    let get = |i: usize, key: &str| pitches[i][key].clone();
    // REFERENCES §7.2 (DERIVED, ISO 16 A4 = 440 Hz): E2 = 82.4069 Hz.
    assert_abs_diff_eq!(number(&get(0, "hz")), 82.4069, epsilon = 5e-5);
    assert_eq!(get(0, "degree"), -29);
    assert_eq!(get(0, "label"), "E2");
    assert_eq!(get(1, "degree"), -15);
    assert_eq!(get(2, "degree"), 1);
    // C-1 is MIDI note 0, 69 semitones below A4: 440·2^(−69/12) = 8.1758 Hz.
    assert_abs_diff_eq!(number(&get(3, "hz")), 8.1758, epsilon = 5e-5);
    assert_eq!(get(4, "degree"), serde_json::Value::Null);
    assert_abs_diff_eq!(
        number(&get(4, "cents_from_reference")),
        -2886.0,
        epsilon = 1e-9
    );
    assert_eq!(get(5, "degree"), -29);
    assert_eq!(get(6, "degree"), 7);
    assert_eq!(get(7, "degree"), -9);
    assert_eq!(get(8, "degree"), serde_json::Value::Null);
    assert_eq!(get(9, "ratio"), "3/2");
    assert_abs_diff_eq!(number(&get(9, "hz")), 660.0, epsilon = 1e-9);
    assert_abs_diff_eq!(number(&get(10, "hz")), 82.41, epsilon = 1e-12);
    assert_eq!(get(10, "nearest_note"), "E2");
}

#[test]
fn negative_cents_follow_a_double_dash() {
    let output = common::taut()
        .args([
            "tuning", "find", "12edo", "--format", "json", "--", "-1200c",
        ])
        .output()
        .unwrap();
    assert!(output.status.success());
    let report: serde_json::Value = serde_json::from_slice(&output.stdout).unwrap();
    assert_eq!(report["pitches"][0]["degree"], -12);
    assert_eq!(report["pitches"][0]["ratio"], serde_json::Value::Null);
}

#[test]
fn note_names_use_the_tunings_concert_a() {
    // With A4 = 415 Hz, E2 is 415·2^(−29/12) = 77.7247 Hz (Python: 415*2**(-29/12)).
    let report = json(&["tuning", "find", "12edo@A4=415", "E2"]);
    assert_abs_diff_eq!(number(&report["pitches"][0]["hz"]), 77.7247, epsilon = 5e-5);
    // A frequency reference keeps concert A4 = 440 Hz: C4 = 261.6256 Hz lands on degree 0.
    let report = json(&["tuning", "find", "12edo@261.6256", "C4", "A4"]);
    assert_eq!(report["pitches"][0]["degree"], 0);
    assert_eq!(report["pitches"][1]["degree"], 9);
}

#[test]
fn snapping_in_nineteen_edo_is_shown_in_the_table() {
    let text = table(&["tuning", "find", "19edo", "~E2", "A4"]);
    assert!(text.contains("~E2"), "{text}");
    assert!(text.contains("-46"), "{text}");
    assert!(text.contains("440.0000"), "{text}");
}
