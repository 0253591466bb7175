//! Builders' lengths (issue 9 §6), through the binary: paired and octave strings agree with
//! `plan`, a tension window smooths the bridge line, a rated load is checked, and fold-backs
//! and steps are marked apart.

use crate::common::{bad_input, json, number, table, write_file};
use serde_json::Value;

const ZITHER: &str = "examples/zither-pairs-layout.yaml";
const PSALTERY: &str = "examples/psaltery-layout.yaml";

fn string_yaml(course: &Value, other: Option<&Value>) -> String {
    // The layout JSON names the kind and the diameter; write them back as a fixed string.
    let (kind, diameter_mm) = match other {
        Some(o) => (o["string"].as_str().unwrap(), number(&o["diameter_mm"])),
        None => (
            course["string"].as_str().unwrap(),
            number(&course["diameter_mm"]),
        ),
    };
    format!("{{kind: {kind}, diameter: {diameter_mm:.9}mm}}")
}

#[test]
fn pairs_and_octave_strings_count_as_in_plan() {
    let layout = json(&["lengths", ZITHER]);
    let courses = layout["courses"].as_array().unwrap();
    assert_eq!(number(&layout["string_count"]), 24.0);
    let summed: f64 = courses
        .iter()
        .map(|c| {
            number(&c["tension_n"])
                + c["other_strings"]
                    .as_array()
                    .unwrap()
                    .iter()
                    .map(|o| number(&o["tension_n"]))
                    .sum::<f64>()
        })
        .sum();
    assert!((number(&layout["total_tension_n"]) / summed - 1.0).abs() < 1e-12);
    // The same zither as an instrument file, each string fixed at the solved length: `plan`
    // must find the same tensions (T = μ(2Lf)² both ways) and the same total.
    let mut instrument = String::from(
        "name: Zither as laid out\ndefaults:\n  tension: {target: 60N, min: 45N, max: 75N}\ncourses:\n",
    );
    for course in courses {
        instrument.push_str(&format!(
            "  - pitch: {}\n    scale_length: {:.9}mm\n    strings:\n      - {{interval: unison, string: {}}}\n",
            course["pitch"].as_str().unwrap(),
            number(&course["length_m"]) * 1000.0,
            string_yaml(course, None)
        ));
        for other in course["other_strings"].as_array().unwrap() {
            instrument.push_str(&format!(
                "      - {{interval: {}, string: {}}}\n",
                other["interval"].as_str().unwrap(),
                string_yaml(course, Some(other))
            ));
        }
    }
    let dir = tempfile::tempdir().unwrap();
    let file = write_file(dir.path(), "zither.yaml", &instrument);
    let plan = json(&["plan", file.to_str().unwrap()]);
    let plan_total = number(&plan["total_tension_n"]);
    assert!(
        (plan_total / number(&layout["total_tension_n"]) - 1.0).abs() < 1e-6,
        "plan {plan_total} vs lengths {}",
        layout["total_tension_n"]
    );
    // The octave string of course 1 doubles the frequency on the same length.
    let octave = &courses[0]["other_strings"][0];
    assert!((number(&octave["pitch_hz"]) / number(&courses[0]["pitch_hz"]) - 2.0).abs() < 1e-12);
}

fn kinks(layout: &Value) -> f64 {
    let lengths: Vec<f64> = layout["courses"]
        .as_array()
        .unwrap()
        .iter()
        .map(|c| number(&c["length_m"]).ln())
        .collect();
    lengths
        .windows(3)
        .map(|w| (w[0] - 2.0 * w[1] + w[2]).powi(2))
        .sum()
}

#[test]
fn a_window_smooths_the_bridge_line_within_its_bounds() {
    // The shipped psaltery aims at a 40 N to 60 N profile with no window: every course takes
    // its target, and the bridge line has two fold-backs and a step.
    let fixed = json(&["lengths", PSALTERY]);
    assert_eq!(fixed["jumps"].as_array().unwrap().len(), 3);
    let windowed = json(&["lengths", PSALTERY, "--tension", "36N..64N"]);
    let midpoint = json(&["lengths", PSALTERY, "--tension", "50N"]);
    for course in windowed["courses"].as_array().unwrap() {
        let tension = number(&course["tension_n"]);
        assert!((36.0 - 1e-9..=64.0 + 1e-9).contains(&tension), "{course}");
        assert_eq!(number(&course["target_tension_n"]), 50.0);
    }
    // The window's whole width is used: the line has fewer kinks than at the midpoint alone,
    // and no fold-back or step is left.
    assert!(kinks(&windowed) < 0.25 * kinks(&midpoint));
    assert!(
        windowed["jumps"].as_array().unwrap().is_empty(),
        "{}",
        windowed["jumps"]
    );
}

#[test]
fn a_rated_load_is_checked() {
    let within = json(&["lengths", ZITHER]);
    assert_eq!(number(&within["rated_load_n"]), 1800.0);
    assert!(within["warnings"].as_array().unwrap().is_empty());
    let over = json(&["lengths", ZITHER, "--rated-load", "1000N"]);
    let warning = over["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .find(|w| w["kind"] == "over_rated_load")
        .expect("the load check fires");
    assert_eq!(warning["severity"], "danger");
    assert!((number(&warning["value"]) - number(&over["total_tension_n"])).abs() < 1e-9);
    let text = table(&["lengths", ZITHER, "--rated-load", "1000N"]);
    assert!(text.contains("eye protection"), "{text}");
}

#[test]
fn fold_backs_and_steps_have_their_own_marks() {
    let text = table(&["lengths", PSALTERY]);
    let row = |course: &str| {
        text.lines()
            .find(|line| line.split_whitespace().next() == Some(course) && line.contains('%'))
            .unwrap_or_else(|| panic!("no row {course}: {text}"))
            .to_string()
    };
    // Course 3: both a step over the limit and a fold-back; course 11: a fold-back only;
    // course 4: neither (README's example output shows the same).
    assert!(
        row("3").contains('↶') && row("3").contains(" !"),
        "{}",
        row("3")
    );
    assert!(
        row("11").contains('↶') && !row("11").contains(" !"),
        "{}",
        row("11")
    );
    assert!(
        !row("4").contains('↶') && !row("4").contains(" !"),
        "{}",
        row("4")
    );
    assert!(text.contains("↶ marks a fold-back"), "{text}");
}

#[test]
fn bad_course_strings_are_refused_with_their_line() {
    let dir = tempfile::tempdir().unwrap();
    for (course, expected) in [
        ("  - {pitch: G3, strings: [unison, unison]}\n", "does not say its string"),
        (
            "  - {pitch: G3, string: {kind: plain-steel, diameter: 0.018in}, strings: [{interval: unison, kinds: [nylon]}]}\n",
            "kinds",
        ),
        (
            "  - {pitch: G3, string: {kind: plain-steel, diameter: 0.018in}, strings: [unison, unison, unison, unison]}\n",
            "1 to 3",
        ),
    ] {
        let text = format!("name: Bad\ntension: 50N\ncourses:\n{course}");
        let file = write_file(dir.path(), "bad.yaml", &text);
        let stderr = bad_input(&["lengths", file.to_str().unwrap()]);
        assert!(stderr.contains("bad.yaml:4:"), "{stderr}");
        assert!(stderr.contains(expected), "{expected}: {stderr}");
    }
}
