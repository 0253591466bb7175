//! `modes_of_scale`: every mode of a shipped scale as the course pattern, in every surveyed
//! tuning (issue 23, point 4). The scale's notes land on each tuning's nearest degrees.

use crate::common::{bad_input, json, write_file};

fn settings(folder: &std::path::Path, edos: (u32, u32), scale: &str) -> String {
    write_file(
        folder,
        "modes.yaml",
        &format!(
            "tunings:\n  edos: {{from: {}, to: {}}}\ncourse_1: E2\noffset_cents: {{from: -200, to: 200, step: 0.5}}\ncourses:\n  modes_of_scale: {scale}\ntop: 500\nevery_offset: false\n",
            edos.0, edos.1
        ),
    )
    .to_string_lossy()
    .into_owned()
}

/// One pattern per mode: a twelve-note scale gives twelve patterns in every tuning, and both
/// search methods agree on all of them.
#[test]
fn every_mode_of_a_twelve_note_scale_in_every_edo() {
    let folder = tempfile::tempdir().unwrap();
    let file = settings(folder.path(), (12, 53), "just-5-limit");
    let args = ["survey", "examples/fanned-8-fourths.yaml", &file];
    let mut report = json(&args);
    // 42 EDOs × 12 modes × 801 offsets.
    assert_eq!(report["candidates"], 42 * 12 * 801);
    let mut exhaustive_args = args.to_vec();
    exhaustive_args.extend(["--method", "exhaustive"]);
    let mut exhaustive = json(&exhaustive_args);
    for r in [&mut report, &mut exhaustive] {
        r.as_object_mut().unwrap().remove("elapsed_s");
    }
    assert_eq!(report, exhaustive);
    let modes: std::collections::BTreeSet<String> = report["results"]
        .as_array()
        .unwrap()
        .iter()
        .map(|r| r["course_pattern"]["rule"].as_str().unwrap().to_string())
        .collect();
    assert!(modes.len() > 1, "{modes:?}");
}

/// In 12-EDO each note of a twelve-note 5-limit just scale lands on its own semitone (each just
/// interval is within 50 cents of one 12-EDO step: common practice), so every mode climbs by
/// single steps.
#[test]
fn a_twelve_note_just_scale_is_chromatic_in_twelve_edo() {
    let folder = tempfile::tempdir().unwrap();
    let file = settings(folder.path(), (12, 12), "just-5-limit");
    let report = json(&["survey", "examples/fanned-8-fourths.yaml", &file]);
    let results = report["results"].as_array().unwrap();
    assert_eq!(results.len(), 12, "one result per mode at its best offset");
    for result in results {
        let steps = result["course_pattern"]["steps"].as_array().unwrap();
        assert!(steps.iter().all(|s| s == 1), "{result}");
    }
}

#[test]
fn a_scale_that_is_not_one_is_bad_input_at_its_field() {
    let folder = tempfile::tempdir().unwrap();
    let missing = settings(folder.path(), (12, 12), "no-such-scale");
    let stderr = bad_input(&["survey", "examples/fanned-8-fourths.yaml", &missing]);
    assert!(stderr.contains("courses.modes_of_scale"), "{stderr}");
    let pitches = settings(folder.path(), (12, 12), "\"hertz:98,110\"");
    let stderr = bad_input(&["survey", "examples/fanned-8-fourths.yaml", &pitches]);
    assert!(stderr.contains("courses.modes_of_scale"), "{stderr}");
}
