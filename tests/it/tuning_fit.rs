//! `taut tuning fit`: how closely a tuning approximates the odd-limit tonality diamond.

use crate::common::{bad_input, json, number, table};
use approx::assert_abs_diff_eq;

fn row<'a>(report: &'a serde_json::Value, interval: &str) -> &'a serde_json::Value {
    report["intervals"]
        .as_array()
        .unwrap()
        .iter()
        .find(|r| r["interval"] == interval)
        .unwrap_or_else(|| panic!("no {interval} in {report}"))
}

#[test]
fn twelve_edo_errors_match_ellis_cents() {
    // Ellis 1885 cents (REFERENCES §7.3): 5/4 = 386.3137, 3/2 = 701.9550, 6/5 = 315.6413.
    // 12-EDO has 400, 700 and 300 cents for them.
    let report = json(&["tuning", "fit", "12edo", "--limit", "5"]);
    assert_eq!(report["intervals"].as_array().unwrap().len(), 6);
    assert_abs_diff_eq!(
        number(&row(&report, "5/4")["error_cents"]),
        13.6863,
        epsilon = 5e-4
    );
    assert_abs_diff_eq!(
        number(&row(&report, "3/2")["error_cents"]),
        -1.9550,
        epsilon = 5e-4
    );
    assert_abs_diff_eq!(
        number(&row(&report, "6/5")["error_cents"]),
        -15.6413,
        epsilon = 5e-4
    );
    assert_eq!(row(&report, "3/2")["steps"], 7);
    assert_abs_diff_eq!(
        number(&report["max_abs_error_cents"]),
        15.6413,
        epsilon = 5e-4
    );
    // Mean of 15.6413, 13.6863, 1.9550, 1.9550, 13.6863, 15.6413 (the diamond is symmetric).
    assert_abs_diff_eq!(
        number(&report["mean_abs_error_cents"]),
        (15.6413 + 13.6863 + 1.9550) / 3.0,
        epsilon = 5e-4
    );
}

#[test]
fn just_scales_hold_their_own_limit_exactly() {
    let report = json(&["tuning", "fit", "just-5-limit", "--limit", "5"]);
    assert!(number(&report["max_abs_error_cents"]) < 1e-9, "{report}");
    let report = json(&["tuning", "fit", "diamond-7-limit", "--limit", "7"]);
    assert!(number(&report["max_abs_error_cents"]) < 1e-9, "{report}");
    assert_eq!(report["intervals"].as_array().unwrap().len(), 12);
}

#[test]
fn an_unequal_scale_is_credited_with_intervals_between_any_degrees() {
    // Above degree 0, Pythagorean tuning's third is 81/64 (407.82 cents). Its closest 5/4 is the
    // diminished fourth from E (81/64) to A-flat (128/81): 8192/6561 = 384.3600 cents (Python
    // `fractions`: Fraction(128, 81) / Fraction(81, 64) == Fraction(8192, 6561)).
    let report = json(&["tuning", "fit", "pythagorean-12", "--limit", "5"]);
    let third = row(&report, "5/4");
    assert_ne!(third["from_degree"], 0, "{third}");
    assert_abs_diff_eq!(number(&third["tuning_cents"]), 384.3600, epsilon = 5e-4);
}

#[test]
fn fifty_three_edo_table_shows_small_errors() {
    let text = table(&["tuning", "fit", "53edo", "--limit", "5"]);
    assert!(text.contains("Odd limit 5"), "{text}");
    assert!(text.contains("5/4"), "{text}");
    // 53-EDO's largest 5-limit error is the third: 17 steps = 384.906 c vs 386.314 c.
    assert!(text.contains("largest 1.408 cents"), "{text}");
}

#[test]
fn unsupported_limits_are_refused() {
    let err = bad_input(&["tuning", "fit", "12edo", "--limit", "4"]);
    assert!(
        err.contains("odd limit") && err.contains("--limit"),
        "{err}"
    );
}
