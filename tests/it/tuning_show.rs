//! `taut tuning show`: degrees with cents, step, ratio, Hz and nearest note.

use crate::common::{bad_input, json, number, table};
use approx::assert_abs_diff_eq;

#[test]
fn twelve_edo_around_e2_matches_iso_16_in_json() {
    // ISO 16:1975 A4 = 440 Hz and f = 440·2^((m−69)/12) (REFERENCES §7.2, DERIVED):
    // E2 = 82.4069 Hz, A2 = 110 Hz.
    let report = json(&["tuning", "show", "12edo", "--from", "-29", "--to", "-24"]);
    let rows = report["rows"].as_array().unwrap();
    assert_eq!(rows.len(), 6);
    assert_eq!(rows[0]["degree"], -29);
    assert_abs_diff_eq!(number(&rows[0]["hz"]), 82.4069, epsilon = 5e-5);
    assert_eq!(rows[0]["nearest_note"], "E2");
    assert_abs_diff_eq!(
        number(&rows[0]["cents_from_reference"]),
        -2900.0,
        epsilon = 1e-9
    );
    assert_eq!(rows[5]["ratio"], "1/4");
    assert_abs_diff_eq!(number(&rows[5]["hz"]), 110.0, epsilon = 1e-9);
    for row in rows {
        assert_abs_diff_eq!(number(&row["step_cents"]), 100.0, epsilon = 1e-9);
    }
}

#[test]
fn nineteen_edo_step_in_json_and_table() {
    // 1200/19 = 63.1579 cents (REFERENCES §7.3, DERIVED).
    let report = json(&["tuning", "show", "19edo"]);
    let rows = report["rows"].as_array().unwrap();
    assert_eq!(rows.len(), 20, "one period and its closing degree");
    assert_abs_diff_eq!(number(&rows[1]["step_cents"]), 63.1579, epsilon = 5e-5);
    assert_eq!(rows[19]["ratio"], "2/1");
    assert_abs_diff_eq!(number(&rows[19]["hz"]), 880.0, epsilon = 1e-9);
    let text = table(&["tuning", "show", "19edo"]);
    assert!(text.contains("63.158"), "{text}");
    assert!(text.contains("880.0000"), "{text}");
    // Degree 19 is A5 exactly: the note needs no offset.
    assert!(
        text.lines()
            .any(|line| line.trim_start().starts_with("19 ") && line.trim_end().ends_with("A5")),
        "{text}"
    );
}

#[test]
fn a_range_from_a_start_defaults_to_one_period() {
    let report = json(&["tuning", "show", "31edo", "--from", "-31"]);
    let rows = report["rows"].as_array().unwrap();
    assert_eq!(rows.len(), 32);
    assert_eq!(rows[31]["degree"], 0);
    assert_eq!(rows[0]["ratio"], "1/2");
}

#[test]
fn a_frequency_list_lists_all_its_entries() {
    let report = json(&["tuning", "show", "hertz:98,110,123.47"]);
    let rows = report["rows"].as_array().unwrap();
    assert_eq!(rows.len(), 3);
    assert_eq!(
        report["tuning"]["degrees_per_period"],
        serde_json::Value::Null
    );
    assert_abs_diff_eq!(number(&rows[2]["hz"]), 123.47, epsilon = 1e-12);
}

#[test]
fn reference_suffix_moves_the_tuning() {
    let report = json(&["tuning", "show", "12edo@A4=415", "--to", "0"]);
    assert_abs_diff_eq!(number(&report["rows"][0]["hz"]), 415.0, epsilon = 1e-9);
    assert_abs_diff_eq!(
        number(&report["tuning"]["reference"]["concert_a4_hz"]),
        415.0,
        epsilon = 1e-9
    );
    // Concert A4 = 415 Hz, so degree 0 is A4 exactly, not a flat A#4.
    assert_eq!(report["rows"][0]["nearest_note"], "A4");
}

#[test]
fn oversized_or_backward_ranges_are_refused() {
    let err = bad_input(&["tuning", "show", "12edo", "--from", "0", "--to", "1000000"]);
    assert!(err.contains("too many"), "{err}");
    let err = bad_input(&["tuning", "show", "12edo", "--from", "5", "--to", "1"]);
    assert!(err.contains("backwards"), "{err}");
    let err = bad_input(&[
        "tuning",
        "show",
        "hertz:100,200",
        "--from",
        "0",
        "--to",
        "5",
    ]);
    assert!(err.contains("cannot address"), "{err}");
}
