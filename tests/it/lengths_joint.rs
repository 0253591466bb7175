//! Lengths and strings solved together (issue 22, point 1), through the binary: the generated
//! 36-course lever harp and 44-course double psaltery stay inside their tension and length
//! windows, their catalogs and the smoothness limit of the bridge line, follow the builder's
//! `prefer` rule, and round-trip through `plan` as instrument files; a property test holds
//! every printed solution to Mersenne's law.

use proptest::prelude::*;
use serde_json::Value;

use crate::common::{json, number, taut, write_file};

const HARP: &str = "examples/lever-harp-36-layout.yaml";
const PSALTERY: &str = "examples/psaltery-44-layout.yaml";

/// The windows and the rule an example file states (inputs, read from the file itself).
struct Stated {
    min_n: f64,
    max_n: f64,
    shortest_m: f64,
    longest_m: f64,
    max_step: f64,
    rule_below: String,
    rule_kind: String,
}

fn si(text: &str) -> f64 {
    let value = |suffix: &str| text.trim_end_matches(suffix).parse::<f64>().unwrap();
    if text.ends_with("mm") {
        value("mm") / 1000.0
    } else {
        value("N")
    }
}

fn stated(path: &str) -> Stated {
    let text = std::fs::read_to_string(path).unwrap();
    let file: serde_yaml::Value = serde_yaml::from_str(&text).unwrap();
    let text_of = |v: &serde_yaml::Value| v.as_str().unwrap().to_string();
    Stated {
        min_n: si(&text_of(&file["tension"]["min"])),
        max_n: si(&text_of(&file["tension"]["max"])),
        shortest_m: si(&text_of(&file["length_window"]["min"])),
        longest_m: si(&text_of(&file["length_window"]["max"])),
        max_step: 15.0, // the layout files state no `max_step`: the default, 15 %
        rule_below: text_of(&file["prefer"][0]["below"]),
        rule_kind: text_of(&file["prefer"][0]["kinds"][0]),
    }
}

/// Whether `diameter_mm` is a gauge of `kind`'s catalog.
fn in_catalog(kind: &str, diameter_mm: f64) -> bool {
    let stock = taut::strings::stock::Stock::builtin().unwrap();
    let kind = stock.kinds().get(kind).unwrap();
    kind.gauges()
        .iter()
        .any(|g| (g.diameter * 1000.0 - diameter_mm).abs() < 1e-9)
}

fn every_string(course: &Value) -> Vec<(&str, f64, f64)> {
    let mut strings = vec![(
        course["string"].as_str().unwrap(),
        number(&course["diameter_mm"]),
        number(&course["tension_n"]),
    )];
    for other in course["other_strings"].as_array().unwrap() {
        strings.push((
            other["string"].as_str().unwrap(),
            number(&other["diameter_mm"]),
            number(&other["tension_n"]),
        ));
    }
    strings
}

fn check_example(path: &str, courses_expected: usize) -> Value {
    let stated = stated(path);
    let layout = json(&["lengths", path]);
    let courses = layout["courses"].as_array().unwrap();
    assert_eq!(courses.len(), courses_expected);
    // The rule's pitch, in the same tuning (12-EDO at A4 = 440 Hz, REFERENCES §7.2).
    let rule_hz = json(&[
        "lengths",
        "--pitch",
        &stated.rule_below,
        "--string",
        "{kind: plain-steel, diameter: 0.010in}",
        "--tension",
        "50N",
    ])["courses"][0]["pitch_hz"]
        .as_f64()
        .unwrap();
    for course in courses {
        let length = number(&course["length_m"]);
        assert!(
            length >= stated.shortest_m * (1.0 - 1e-9) && length <= stated.longest_m * (1.0 + 1e-9),
            "course {} length {length} outside the length window",
            course["course"]
        );
        for (kind, diameter, tension) in every_string(course) {
            assert!(
                in_catalog(kind, diameter),
                "course {}: {kind} {diameter} mm is not in its catalog",
                course["course"]
            );
            assert!(
                tension >= stated.min_n * (1.0 - 1e-9) && tension <= stated.max_n * (1.0 + 1e-9),
                "course {}: {tension} N outside the tension window",
                course["course"]
            );
        }
        if let Some(step) = course["step_pct"].as_f64() {
            assert!(
                step.abs() <= stated.max_step,
                "course {}: step {step}%",
                course["course"]
            );
        }
        // The builder's rule: below its pitch, its kind; above it, not.
        let below = number(&course["pitch_hz"]) < rule_hz;
        assert_eq!(
            course["string"].as_str().unwrap() == stated.rule_kind,
            below,
            "course {} ({}) against the rule",
            course["course"],
            course["pitch"]
        );
        assert!(course["stress_ratio"].as_f64().unwrap() <= 0.65);
    }
    assert!(
        layout["jumps"].as_array().unwrap().is_empty(),
        "{}",
        layout["jumps"]
    );
    assert!(layout["warnings"].as_array().unwrap().is_empty());
    layout
}

#[test]
fn the_36_course_lever_harp_stays_inside_every_window() {
    check_example(HARP, 36);
}

#[test]
fn the_44_course_double_psaltery_stays_inside_every_window() {
    let layout = check_example(PSALTERY, 44);
    // A pair stays a pair: the second string is the first one's kind and gauge.
    for course in layout["courses"].as_array().unwrap() {
        let other = &course["other_strings"][0];
        assert_eq!(other["string"], course["string"]);
        assert_eq!(other["diameter_mm"], course["diameter_mm"]);
    }
}

/// `lengths --save-instrument` then `plan`: the same strings, the same tensions.
fn round_trip(layout_path: &str) {
    let folder = tempfile::tempdir().unwrap();
    let saved = folder.path().join("solved.yaml");
    let output = taut()
        .args([
            "lengths",
            layout_path,
            "--format",
            "json",
            "--save-instrument",
        ])
        .arg(&saved)
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    let layout: Value = serde_json::from_slice(&output.stdout).unwrap();
    let plan = json(&["plan", saved.to_str().unwrap()]);
    let (laid, planned) = (
        layout["courses"].as_array().unwrap(),
        plan["courses"].as_array().unwrap(),
    );
    assert_eq!(laid.len(), planned.len());
    for (course, planned) in laid.iter().zip(planned) {
        assert_eq!(course["course"], planned["course"]);
        let strings = planned["strings"].as_array().unwrap();
        let laid_strings = every_string(course);
        assert_eq!(laid_strings.len(), strings.len());
        for ((kind, diameter, tension), string) in laid_strings.iter().zip(strings) {
            assert_eq!(string["kind"].as_str().unwrap(), *kind);
            assert!((number(&string["diameter_mm"]) - diameter).abs() < 1e-9);
            // Lengths are written to a nanometre (1e-8 relative here), tensions follow as L².
            let relative = number(&string["tension_n"]) / tension - 1.0;
            assert!(
                relative.abs() < 1e-6,
                "course {}: {relative}",
                course["course"]
            );
        }
        assert!((number(&planned["length_m"]) / number(&course["length_m"]) - 1.0).abs() < 1e-8);
    }
    assert!(
        (number(&plan["total_tension_n"]) / number(&layout["total_tension_n"]) - 1.0).abs() < 1e-6
    );
}

#[test]
fn a_solved_harp_round_trips_through_plan() {
    round_trip(HARP);
}

#[test]
fn a_solved_double_psaltery_round_trips_through_plan() {
    round_trip(PSALTERY);
}

#[test]
fn the_saved_instrument_never_replaces_the_layout() {
    let folder = tempfile::tempdir().unwrap();
    let layout = write_file(
        folder.path(),
        "layout.yaml",
        &std::fs::read_to_string(HARP).unwrap(),
    );
    let before = std::fs::read(&layout).unwrap();
    let output = taut()
        .args(["lengths"])
        .arg(&layout)
        .arg("--save-instrument")
        .arg(&layout)
        .output()
        .unwrap();
    // Refused as bad input before anything is written, naming the option.
    assert_eq!(output.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&output.stderr).contains("--save-instrument"));
    assert_eq!(std::fs::read(&layout).unwrap(), before);
}

const KINDS: [&str; 5] = [
    "plain-steel",
    "phosphor-bronze-wound",
    "nylon",
    "copper-wound-steel",
    "gut",
];
const NOTES: [&str; 7] = ["C", "D", "E", "F", "G", "A", "B"];

proptest! {
    #![proptest_config(ProptestConfig::with_cases(24))]

    /// Every solution `lengths` prints obeys Mersenne's law, f = (1/2L)·√(T/μ),
    /// REFERENCES §1.1 (OpenStax *University Physics* Vol. 1 §16.3 for v = √(T/μ) and §16.6
    /// for λ = 2L), to 1e-9 relative, with the stated tension.
    #[test]
    fn every_printed_solution_obeys_mersennes_law(
        start in 14usize..35,
        count in 2usize..10,
        kinds in proptest::sample::subsequence(KINDS.to_vec(), 1..4),
        first_n in 30.0f64..120.0,
        last_n in 30.0f64..120.0,
        windowed in any::<bool>(),
        pairs in any::<bool>(),
    ) {
        let mut text = format!(
            "name: Random layout\ntension: {{first: {first_n:.3}N, last: {last_n:.3}N{}}}\nkinds: [{}]\ncourses:\n",
            if windowed { ", min: 25N, max: 140N" } else { "" },
            kinds.join(", ")
        );
        for degree in start..start + count {
            let pitch = format!("{}{}", NOTES[degree % 7], degree / 7);
            let strings = if pairs { ", strings: [unison, octave]" } else { "" };
            text.push_str(&format!("  - {{pitch: {pitch}{strings}}}\n"));
        }
        let folder = tempfile::tempdir().unwrap();
        let path = write_file(folder.path(), "random.yaml", &text);
        let output = taut()
            .args(["lengths", path.to_str().unwrap(), "--format", "json"])
            .output()
            .unwrap();
        // A layout the chooser cannot lay out is refused as bad input, never a panic.
        let stderr = String::from_utf8_lossy(&output.stderr);
        prop_assert!(!stderr.contains("panicked"), "{}", stderr);
        if !output.status.success() {
            prop_assert_eq!(output.status.code(), Some(2), "{}", stderr);
            return Ok(());
        }
        let layout: Value = serde_json::from_slice(&output.stdout).unwrap();
        for course in layout["courses"].as_array().unwrap() {
            let length = number(&course["length_m"]);
            let mersenne = |tension: f64, unit_mass: f64| (tension / unit_mass).sqrt() / (2.0 * length);
            let f = mersenne(number(&course["tension_n"]), number(&course["unit_mass_kg_per_m"]));
            let relative = f / number(&course["pitch_hz"]) - 1.0;
            prop_assert!(relative.abs() < 1e-9, "course {}: {}", course["course"], relative);
            for other in course["other_strings"].as_array().unwrap() {
                let f = mersenne(number(&other["tension_n"]), number(&other["unit_mass_kg_per_m"]));
                let relative = f / number(&other["pitch_hz"]) - 1.0;
                prop_assert!(relative.abs() < 1e-9, "course {} other: {}", course["course"], relative);
            }
        }
    }
}
