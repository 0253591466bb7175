//! The survey and the way an instrument numbers its courses: the direction comes from the
//! instrument's own pitches (or is stated and checked), a descending instrument is surveyed
//! downwards, and a survey that finds nothing says course by course why.

use crate::common::{bad_input, json, number, table, write_file};
use taut::instrument::Instrument;
use taut::strings::stock::Stock;
use taut::survey::{Settings, Survey};

const GUITAR: &str = "examples/guitar-19edo.yaml";

/// The shipped fourths settings with course 1 at E4: right for a guitar counted from its highest
/// string.
const FROM_E4: &str = "\
tunings: {edos: {from: 5, to: 72}}
course_1: E4
offset_cents: {from: -600, to: 600, step: 5}
courses: {nearest_to: 4/3}
top: 5
";

#[test]
fn a_guitar_counted_from_its_highest_string_is_surveyed_downwards() {
    let folder = tempfile::tempdir().unwrap();
    let settings = write_file(folder.path(), "settings.yaml", FROM_E4);
    let report = json(&["survey", GUITAR, settings.to_str().unwrap()]);
    // Before: course 1 was taken as the lowest, every course climbed a fourth from E4, and
    // nothing was stringable.
    assert_eq!(report["course_direction"], "down");
    assert!(number(&report["stringable"]) > 0.0, "{report}");
    let best = &report["results"][0];
    assert!(
        best["course_pattern"]["steps"]
            .as_array()
            .unwrap()
            .iter()
            .all(|step| number(step) < 0.0),
        "{best}"
    );
    // The best plan's pitches fall from course 1 to course 6, as the guitar's own do (E4 to E2:
    // two octaves, 2400 cents, common practice), within the fourths' rounding.
    let hz: Vec<f64> = report["best_plan"]["courses"]
        .as_array()
        .unwrap()
        .iter()
        .map(|course| number(&course["pitch_hz"]))
        .collect();
    assert!(hz.windows(2).all(|pair| pair[1] < pair[0]), "{hz:?}");
    let span = 1200.0 * (hz[0] / hz[5]).log2();
    // Five fourths of 498.045 cents (a just 4/3, Ellis 1885) rounded to the nearest degree of
    // an EDO from 5 up: within half a 5-EDO step (120 cents) per course.
    assert!((span - 5.0 * 498.045).abs() < 5.0 * 120.0, "{span}");
    let notes = report["notes"].as_array().unwrap();
    assert!(
        notes[0]
            .as_str()
            .unwrap()
            .contains("run down from course 1"),
        "{notes:?}"
    );
}

#[test]
fn a_stated_direction_that_contradicts_the_instrument_is_refused_at_its_line() {
    let folder = tempfile::tempdir().unwrap();
    let text = FROM_E4.replace("{nearest_to: 4/3}", "{nearest_to: 4/3, direction: up}");
    let settings = write_file(folder.path(), "settings.yaml", &text);
    let stderr = bad_input(&["survey", GUITAR, settings.to_str().unwrap()]);
    assert!(stderr.contains("settings.yaml:4"), "{stderr}");
    assert!(stderr.contains("courses.direction"), "{stderr}");
    assert!(stderr.contains("direction: down"), "{stderr}");
    // Stated the right way, it runs.
    let text = FROM_E4.replace("{nearest_to: 4/3}", "{nearest_to: 4/3, direction: down}");
    let settings = write_file(folder.path(), "settings.yaml", &text);
    let report = json(&["survey", GUITAR, settings.to_str().unwrap()]);
    assert_eq!(report["course_direction"], "down");
}

/// The diagnosis of one survey: JSON and table.
fn survey_of(folder: &std::path::Path, course_1: &str) -> serde_json::Value {
    let text =
        format!("tunings: {{list: [19edo]}}\ncourse_1: {course_1}\ncourses: {{nearest_to: 4/3}}\n");
    let settings = write_file(folder, "one.yaml", &text);
    json(&["survey", GUITAR, settings.to_str().unwrap()])
}

#[test]
fn a_survey_that_finds_nothing_says_per_course_which_limit_and_how_far() {
    let folder = tempfile::tempdir().unwrap();
    // Course 1 (the guitar's highest string) at E2: two octaves below its own pitch.
    let report = survey_of(folder.path(), "E2");
    assert_eq!(number(&report["stringable"]), 0.0);
    let diagnosis = report["diagnosis"].as_array().unwrap();
    assert_eq!(diagnosis.len(), 6, "{report}");
    let notes = report["notes"].to_string();
    assert!(notes.contains("outside the offsets swept"), "{notes}");
    // Course 6 sounds far below its window: its nearest passing pitch is higher.
    let course_6 = &diagnosis[5];
    assert_eq!(course_6["course"], 6);
    assert_eq!(course_6["refused_candidates"], course_6["candidates"]);
    let limits = course_6["closest"]["limits"].to_string();
    assert!(limits.contains("below-window"), "{course_6}");
    let tension = number(&course_6["closest"]["tension_n"]);
    let window_min = number(&course_6["window_n"][0]);
    assert!(tension < window_min, "{course_6}");
    let cents = number(&course_6["nearest_passing_cents"]);
    assert!(cents > 0.0, "{course_6}");
    // "How far" is exact: course 1 moved by that many cents (plus a little) puts course 6 at a
    // pitch it passes at; moved a little less, it is still refused. Every course moves with
    // course 1, so course 6 moves by the same cents.
    let e2_hz = number(&report["diagnosis"][0]["closest"]["hz"]);
    let moved = |extra: f64| {
        let hz = e2_hz * 2f64.powf((cents + extra) / 1200.0);
        survey_of(folder.path(), &format!("{hz:.9}hz"))
    };
    let past = moved(0.5);
    let refused_past = past["diagnosis"]
        .as_array()
        .unwrap()
        .iter()
        .find(|d| d["course"] == 6)
        .map_or(0.0, |d| number(&d["refused_candidates"]));
    assert_eq!(refused_past, 0.0, "{past}");
    let short = moved(-0.5);
    let course_6_short = short["diagnosis"]
        .as_array()
        .unwrap()
        .iter()
        .find(|d| d["course"] == 6)
        .unwrap_or_else(|| panic!("{short}"));
    assert_eq!(
        course_6_short["refused_candidates"],
        course_6_short["candidates"]
    );
}

#[test]
fn the_nothing_found_table_names_each_course_and_fits_100_columns() {
    let folder = tempfile::tempdir().unwrap();
    let settings = write_file(
        folder.path(),
        "s.yaml",
        "tunings: {list: [19edo]}\ncourse_1: E2\ncourses: {nearest_to: 4/3}\n",
    );
    let text = table(&["survey", GUITAR, settings.to_str().unwrap()]);
    for course in 1..=6 {
        assert!(text.contains(&format!("course {course}:")), "{text}");
    }
    // Before: the safety line alone was 147 characters.
    for line in text.lines() {
        assert!(
            line.chars().count() <= 100,
            "{} columns: {line}",
            line.chars().count()
        );
    }
    assert!(text.contains("eye protection"), "{text}");
}

#[test]
fn the_fast_path_agrees_with_the_plan_solver_on_a_descending_instrument() {
    let text = std::fs::read_to_string(GUITAR).unwrap();
    let instrument = Instrument::from_text(text, "guitar").unwrap();
    for pattern in [
        "{nearest_to: 4/3}",
        "{steps: [5, 6, 5, 5, 5]}",
        "{modes_of: [3, 3, 2, 3, 3, 3, 2]}",
    ] {
        let settings = Settings::from_text(
            format!(
                "tunings: {{list: [19edo, 22edo]}}\ncourse_1: E4\noffset_cents: {{from: -300, to: 300, step: 50}}\ncourses: {pattern}\n"
            ),
            "settings",
        )
        .unwrap();
        let survey = Survey::prepare(&instrument, &settings, Stock::builtin().unwrap()).unwrap();
        let mut stringable = 0;
        for index in 0..survey.size().candidates {
            let plan = survey.candidate_plan(index).unwrap();
            let (metrics, chosen) = survey.check(index);
            // The plain solver's pitches fall from course 1 on, as the fast path assumed.
            let hz: Vec<f64> = plan.courses.iter().map(|c| c.pitch.hz).collect();
            assert!(hz.windows(2).all(|p| p[1] < p[0]), "{pattern}: {hz:?}");
            for ((kind, diameter), string) in chosen
                .iter()
                .zip(plan.courses.iter().flat_map(|c| &c.strings))
            {
                assert_eq!(kind, &*string.choice.kind, "{pattern} candidate {index}");
                assert!(
                    (diameter * 1000.0 - string.choice.diameter_mm).abs() < 1e-9,
                    "{pattern} candidate {index}"
                );
            }
            assert!(
                (metrics.total_load_n - plan.total_tension_n).abs() < 1e-9 * plan.total_tension_n,
                "{pattern} candidate {index}"
            );
            stringable += usize::from(metrics.stringable());
        }
        assert!(stringable > 0, "{pattern}");
    }
}
