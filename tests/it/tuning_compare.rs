//! `taut tuning compare`: two tunings side by side in absolute pitch.

use crate::common::{json, number, table};
use approx::assert_abs_diff_eq;

#[test]
fn a_semitone_lower_reference_differs_by_the_rest_of_the_ratio() {
    // 12-EDO at A4 = 415 Hz against 12-EDO at 440 Hz: each degree's nearest neighbour is one
    // semitone away, so the difference is 1200·log2(415/440) + 100 = −1.2706 cents
    // (Python math: 1200*math.log2(415/440)+100).
    let report = json(&["tuning", "compare", "12edo", "12edo@A4=415"]);
    let rows = report["rows"].as_array().unwrap();
    assert_eq!(rows.len(), 13);
    for row in rows {
        assert_abs_diff_eq!(number(&row["difference_cents"]), -1.2706, epsilon = 5e-5);
        assert_eq!(
            row["right_degree"].as_i64().unwrap(),
            row["left_degree"].as_i64().unwrap() + 1
        );
    }
    assert_abs_diff_eq!(
        number(&report["max_abs_difference_cents"]),
        1.2706,
        epsilon = 5e-5
    );
}

#[test]
fn thirty_one_edo_stays_close_to_quarter_comma_meantone() {
    // 31-EDO's fifth (696.774 c) is 0.196 c wider than the quarter-comma fifth 5^(1/4)
    // (696.578 c); with both on the same C, notes up to 8 fifths away differ by under 2 cents
    // (from memory: 31-EDO is the classic near-equivalent of quarter-comma meantone).
    let report = json(&[
        "tuning",
        "compare",
        "meantone-quarter-comma",
        "31edo@263.18138549493483",
    ]);
    assert!(
        number(&report["max_abs_difference_cents"]) < 2.0,
        "{report}"
    );
    assert!(
        number(&report["max_abs_difference_cents"]) > 0.1,
        "{report}"
    );
    let text = table(&[
        "tuning",
        "compare",
        "meantone-quarter-comma",
        "31edo@263.18138549493483",
    ]);
    assert!(text.contains("meantone-quarter-comma deg"), "{text}");
    assert!(text.contains("Mean |apart|"), "{text}");
}

#[test]
fn a_range_of_the_first_tuning_can_be_chosen() {
    let report = json(&[
        "tuning", "compare", "19edo", "12edo", "--from", "-19", "--to", "-17",
    ]);
    let rows = report["rows"].as_array().unwrap();
    assert_eq!(rows.len(), 3);
    assert_eq!(rows[0]["left_degree"], -19);
    assert_eq!(rows[0]["right_degree"], -12);
    assert_abs_diff_eq!(number(&rows[0]["difference_cents"]), 0.0, epsilon = 1e-9);
}
