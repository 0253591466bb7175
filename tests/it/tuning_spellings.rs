//! Tunings as people write them: other spellings of equal divisions are read and the report
//! says how, `13ed3` is the tritave, misspellings get the nearest name, and `tuning show` labels
//! the columns measured from a reference that is not degree 0.

use crate::common::{bad_input, json, number, table};
use approx::assert_abs_diff_eq;

#[test]
fn common_spellings_of_equal_divisions_are_read_and_said() {
    // Before: all refused, `17-edo` with "did you mean `19edo`?".
    for written in ["17-edo", "17tet", "17-TET", "17 EDO", "17et", "17_edo"] {
        let report = json(&["tuning", "show", written]);
        let tuning = &report["tuning"];
        assert_eq!(tuning["name"], "17edo", "{written}");
        assert_eq!(tuning["degrees_per_period"], 17, "{written}");
        let description = tuning["description"].as_str().unwrap();
        assert!(
            description.contains(&format!("read `{written}` as 17edo")),
            "{written}: {description}"
        );
        // One step of 17-EDO is 1200/17 = 70.588 cents (REFERENCES §7.3, DERIVED).
        assert_abs_diff_eq!(
            number(&report["rows"][1]["step_cents"]),
            1200.0 / 17.0,
            epsilon = 1e-9
        );
    }
    let text = table(&["tuning", "show", "17-TET"]);
    assert!(text.contains("read `17-TET` as 17edo"), "{text}");
    // A shipped tuning written another way is the shipped one, source and all.
    let report = json(&["tuning", "show", "19-EDO"]);
    assert!(report["tuning"]["source"].is_string(), "{report}");
}

#[test]
fn thirteen_ed_three_is_the_tritave_not_three_cents() {
    // 13 equal divisions of 3/1: 1901.955/13 = 146.304 cents per step (Ellis 1885 cents,
    // REFERENCES §7.3; Bohlen 1978 for the scale, from memory). Before: refused as ambiguous.
    for written in ["13ed3", "13edt", "13ed3/1"] {
        let report = json(&["tuning", "show", written]);
        assert_abs_diff_eq!(
            number(&report["rows"][1]["step_cents"]),
            146.304,
            epsilon = 5e-4
        );
        assert_eq!(report["rows"][13]["ratio"], "3/1", "{written}");
    }
    // The same steps as the shipped `tritave-13`.
    let shipped = json(&["tuning", "show", "tritave-13"]);
    let inline = json(&["tuning", "show", "13ed3"]);
    for k in 0..=13 {
        assert_abs_diff_eq!(
            number(&shipped["rows"][k]["cents_from_reference"]),
            number(&inline["rows"][k]["cents_from_reference"]),
            epsilon = 1e-9
        );
    }
    // Three cents are written with their unit.
    let report = json(&["tuning", "show", "13ed3c", "--to", "1"]);
    assert_abs_diff_eq!(
        number(&report["rows"][1]["step_cents"]),
        3.0 / 13.0,
        epsilon = 1e-12
    );
    // Equal divisions of the fifth 3/2: 701.955/9 = 77.995 cents (REFERENCES §7.3, DERIVED).
    let report = json(&["tuning", "show", "9edf", "--to", "1"]);
    assert_abs_diff_eq!(
        number(&report["rows"][1]["step_cents"]),
        701.955 / 9.0,
        epsilon = 5e-4
    );
}

#[test]
fn a_misspelt_inline_tuning_suggests_the_name_meant() {
    // Before: "`oo` is not an interval" and no suggestion.
    for (written, meant) in [
        ("12edoo", "12edo"),
        ("17edoo", "17edo"),
        ("12eddo", "12edo"),
    ] {
        let stderr = bad_input(&["tuning", "show", written]);
        assert!(
            stderr.contains(&format!("did you mean `{meant}`?")),
            "{written}: {stderr}"
        );
    }
    let stderr = bad_input(&["plan", "examples/guitar-19edo.yaml", "--tuning", "12edoo"]);
    assert!(stderr.contains("did you mean `12edo`?"), "{stderr}");
}

/// The degree a header names, e.g. 9 in `from deg 9`.
fn degree_named(header: &str, lead: &str) -> i64 {
    let at = header
        .find(lead)
        .unwrap_or_else(|| panic!("no `{lead}` in {header}"))
        + lead.len();
    header[at..]
        .split_whitespace()
        .next()
        .and_then(|word| word.parse().ok())
        .unwrap_or_else(|| panic!("no degree after `{lead}` in {header}"))
}

#[test]
fn columns_measured_from_the_reference_name_the_degree_they_are_measured_from() {
    // just-5-limit: A (degree 9, 5/3 above C) = 440 Hz. Before: "up from 0" over a column
    // measured from degree 9 (degree 0 read -884.359c, "exact 3/5").
    let text = table(&["tuning", "show", "just-5-limit"]);
    let header = text.lines().find(|l| l.starts_with("deg ")).unwrap();
    let from = degree_named(header, "from deg ");
    let ratio_to = degree_named(header, "ratio to deg ");
    assert_eq!(from, ratio_to);
    let report = json(&["tuning", "show", "just-5-limit"]);
    let rows = report["rows"].as_array().unwrap();
    let base = rows
        .iter()
        .find(|row| row["degree"] == from)
        .unwrap_or_else(|| panic!("degree {from} not listed"));
    let base_hz = number(&base["hz"]);
    for row in rows {
        // Cents from the degree the header names: 1200·log2(f/f_named) (Ellis 1885;
        // REFERENCES §7.3); the ratio column is f/f_named exactly.
        let cents = 1200.0 * (number(&row["hz"]) / base_hz).log2();
        assert_abs_diff_eq!(number(&row["cents_from_reference"]), cents, epsilon = 1e-6);
        let ratio = row["ratio"].as_str().unwrap();
        let (p, q) = ratio.split_once('/').unwrap();
        let value = p.parse::<f64>().unwrap() / q.parse::<f64>().unwrap();
        assert_abs_diff_eq!(value, number(&row["hz"]) / base_hz, epsilon = 1e-9);
        // And the table prints those figures on that degree's row.
        let line = text
            .lines()
            .find(|l| l.split_whitespace().next() == Some(&row["degree"].to_string()))
            .unwrap();
        assert!(line.contains(&format!("{cents:.3}c")), "{line}");
        assert!(line.contains(ratio), "{line}");
    }
    // Degree 0 of the just scale is C, 5/3 below A: 3/5 and -884.359 cents from degree 9.
    assert_eq!(rows[0]["ratio"], "3/5");
    assert_eq!(from, 9);
    // Where the reference is degree 0 the header says so.
    let text = table(&["tuning", "show", "19edo"]);
    let header = text.lines().find(|l| l.starts_with("deg ")).unwrap();
    assert_eq!(degree_named(header, "from deg "), 0);
}

#[test]
fn the_partials_column_names_its_baseline_and_the_figures_follow_it() {
    // Before: headed "partials c" with no baseline.
    let output = crate::common::taut()
        .args(["lengths", "examples/psaltery-layout.yaml", "--wide"])
        .env("COLUMNS", "200")
        .output()
        .unwrap();
    let text = String::from_utf8(output.stdout).unwrap();
    assert!(text.contains("partials c vs n·f1"), "{text}");
    assert!(text.contains("sounding fundamental f1"), "{text}");
    // The JSON field measures from the same baseline: partial n sits
    // 1200·log2(f_n/(n·f_1)) = 600·log2((1+Bn²)/(1+B)) cents above n times the sounding
    // fundamental (Fletcher 1964, REFERENCES §5.1), not 600·log2(1+Bn²) above n·f_0.
    let report = json(&["lengths", "examples/psaltery-layout.yaml"]);
    let feel = &report["courses"][0]["feel"];
    let b = number(&feel["inharmonicity_b"]);
    for n in [2.0_f64, 4.0, 8.0] {
        let field = format!("partial_{n}_cents");
        let sounding = 600.0 * ((1.0 + b * n * n) / (1.0 + b)).log2();
        let ideal = 600.0 * (1.0 + b * n * n).log2();
        let value = number(&feel[field.as_str()]);
        assert_abs_diff_eq!(value, sounding, epsilon = 1e-9);
        assert!((value - ideal).abs() > 1e-6, "{field}");
    }
    let topic = table(&["help", "feel"]);
    assert!(topic.contains("partial_2_cents"), "{topic}");
    assert!(topic.contains("n·f₁"), "{topic}");
}
