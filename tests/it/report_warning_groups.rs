//! Warnings that say the same thing about several courses or strings share one line of the
//! terminal text ("Courses 1–6, string 1: …"); JSON keeps one warning per course and string; a
//! danger never shares a line with a different figure, and keeps its severity.

use crate::common;

/// Lines of a report's warnings list that start with `lead` (a severity tag or a kind).
fn lines_starting(text: &str, lead: &str) -> Vec<String> {
    text.lines()
        .filter(|line| line.trim_start().starts_with(lead))
        .map(str::to_string)
        .collect()
}

#[test]
fn a_conversions_slot_notes_share_one_line() {
    let args = [
        "convert",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--to-instrument",
        "baritone-guitar",
    ];
    let text = common::table(&args);
    let notes = lines_starting(&text, "note");
    // The plain strings' fix (a wound kind) differs from the wound strings' (a denser wrap), so
    // the six notes make two lines, each with its figures kept as their range.
    assert_eq!(notes.len(), 2, "{text}");
    assert!(
        notes[0].contains("Courses 1, 2, string 1: the new string is"),
        "{text}"
    );
    assert!(
        notes[1].contains("Courses 3–6, string 1: the new string is"),
        "{text}"
    );
    assert!(text.contains("0.076 to 0.102 mm wider"), "{text}");
    assert!(text.contains("0.152 to 0.330 mm wider"), "{text}");
    assert!(text.contains("Warnings (6):"), "{text}");
    let json = common::json(&args);
    let warnings = json["warnings"].as_array().unwrap();
    let slot: Vec<_> = warnings
        .iter()
        .filter(|w| w["kind"] == "wider_than_slot")
        .collect();
    assert_eq!(slot.len(), 6, "{json}");
}

#[test]
fn both_strings_of_a_paired_course_share_one_line() {
    let folder = tempfile::tempdir().unwrap();
    let layout = common::write_file(
        folder.path(),
        "pairs.yaml",
        "name: Pairs\ntuning: 12edo\ntension: {first: 100N, last: 160N}\ncourses:\n\
         \x20 - {pitch: G3, strings: [unison, unison], string: {kind: phosphor-bronze-wound, diameter: 0.022in}}\n\
         \x20 - {pitch: A3, strings: [unison, unison], string: {kind: phosphor-bronze-wound, diameter: 0.020in}}\n\
         \x20 - {pitch: B3, strings: [unison, unison], string: {kind: plain-steel, diameter: 0.016in}}\n",
    );
    let path = layout.to_str().unwrap();
    let text = common::table(&["lengths", path]);
    let cautions = lines_starting(&text, "caution");
    assert_eq!(cautions.len(), 1, "{text}");
    assert!(
        cautions[0].contains("Course 2, strings 1, 2: runs at"),
        "{text}"
    );
    let json = common::json(&["lengths", path]);
    let stress: Vec<_> = json["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|w| w["course"] == 2)
        .collect();
    assert_eq!(stress.len(), 2, "{json}");
}

#[test]
fn a_straight_boards_spacing_warning_is_given_once() {
    let args = ["frets", "guitar-19edo", "--min-spacing", "12mm"];
    let text = common::table(&args);
    let spacing = lines_starting(&text, "close-spacing:");
    assert_eq!(spacing.len(), 1, "{text}");
    assert!(spacing[0].contains("courses 1–6: frets 20–38"), "{text}");
    let json = common::json(&args);
    assert_eq!(json["warnings"].as_array().unwrap().len(), 6, "{json}");
}

#[test]
fn dangers_keep_their_own_figures_and_severity() {
    let folder = tempfile::tempdir().unwrap();
    // Plain steel on 700 mm cannot reach E5 and above: every course is a danger, with a
    // different figure on courses 1 and 2 and the same on 3 and 4 (the same pitch).
    let instrument = common::write_file(
        folder.path(),
        "danger.yaml",
        "name: Danger\ntuning: 12edo\nscale_length: 700mm\n\
         defaults:\n  tension: {target: 60N}\n  kinds: [plain-steel]\n\
         courses:\n  - {course: 1, pitch: E5}\n  - {course: 2, pitch: F5}\n\
         \x20 - {course: 3, pitch: G5}\n  - {course: 4, pitch: G5}\n",
    );
    let path = instrument.to_str().unwrap();
    let text = common::table(&["plan", path]);
    let dangers = lines_starting(&text, "DANGER");
    assert_eq!(dangers.len(), 3, "{text}");
    assert!(
        dangers[0].contains("Course 1 string 1 can never reach"),
        "{text}"
    );
    assert!(
        dangers[1].contains("Course 2 string 1 can never reach"),
        "{text}"
    );
    assert!(
        dangers[2].contains("Courses 3, 4, string 1: can never"),
        "{text}"
    );
    assert!(!text.contains("238 to"), "{text}");
    let json = common::json(&["plan", path]);
    let danger_count = json["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|w| w["severity"] == "danger")
        .count();
    assert_eq!(danger_count, 4, "{json}");
}
