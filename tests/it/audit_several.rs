//! `taut audit` under several tunings: each tuning's ordinary audit side by side, the worst
//! verdict per course, and the tuning that decides it.

use crate::common;

const GUITAR: &str = "examples/steel-guitar-12edo.yaml";
const SET: &str = "examples/steel-guitar-set.yaml";

#[test]
fn each_tuning_gets_the_ordinary_audit_and_the_worst_verdict_is_named() {
    // A4 = 587.33 Hz moves every course up a fourth (2^(5/12)): tension × 1.78 (T ∝ f², Mersenne;
    // REFERENCES §1.1), which takes the plain top string past the danger line.
    let fourth_up = "12edo@A4=587.33hz";
    let json = common::json(&[
        "audit", GUITAR, "--set", SET, "--tuning", "12edo", "--tuning", fourth_up,
    ]);
    let blocks = json["tunings"].as_array().unwrap();
    assert_eq!(blocks.len(), 2);
    // The first block is exactly what the single-tuning audit says.
    let single = common::json(&["audit", GUITAR, "--set", SET, "--tuning", "12edo"]);
    for key in ["courses", "total_tension_n", "courses_ok", "warnings"] {
        assert_eq!(blocks[0][key], single[key], "{key}");
    }
    let ratio = common::number(&blocks[1]["total_tension_n"])
        / common::number(&blocks[0]["total_tension_n"]);
    approx::assert_relative_eq!(ratio, 2f64.powf(10.0 / 12.0), max_relative = 1e-4);
    let course_1 = &json["courses"][0];
    assert_eq!(course_1["verdict"], "no");
    assert_eq!(course_1["decided_by"][0], fourth_up);
    assert_eq!(course_1["most_stressed_variants"][0], fourth_up);
    assert_eq!(course_1["slackest_variants"][0], "12edo");
    assert!(common::number(&json["courses_ok_in_every_tuning"]) < 6.0);
    let table = common::table(&[
        "audit", GUITAR, "--set", SET, "--tuning", "12edo", "--tuning", fourth_up,
    ]);
    assert!(
        table.contains(&format!("Course 1 in B {fourth_up}: no:")),
        "{table}"
    );
    assert!(table.contains("Before you string this up"), "{table}");
    for line in table
        .lines()
        .filter(|l| l.starts_with(['│', '┌', '└', '╞']))
    {
        assert!(line.chars().count() <= 100, "too wide: {line}");
    }
}
