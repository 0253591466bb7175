//! Small things in the words of reports and messages: counts read "1 string" and "2 strings",
//! `string:` holding a list (meant as `strings:`) gets a message that says so, and a set saved by
//! a conversion is named for the instrument it is now on.

use crate::common;

/// A one-course instrument, a one-string set for it, in a fresh folder.
fn one_course() -> tempfile::TempDir {
    let folder = tempfile::tempdir().unwrap();
    common::write_file(
        folder.path(),
        "one.yaml",
        "name: One course\ntuning: 12edo\nscale_length: 648mm\nrated_load: 800N\n\
         defaults:\n  tension: {target: 110N, min: 60N, max: 140N}\n  kinds: [plain-steel]\n\
         courses:\n  - {course: 1, pitch: E4}\n",
    );
    common::write_file(
        folder.path(),
        "set.yaml",
        "name: One string\ntuning: 12edo\ncourses:\n\
         \x20 - {course: 1, strings: [{kind: plain-steel, diameter: 0.010in}]}\n",
    );
    folder
}

fn run_in(folder: &std::path::Path, args: &[&str]) -> String {
    let output = common::taut()
        .args(args)
        .current_dir(folder)
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "taut {args:?}: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    String::from_utf8(output.stdout).unwrap()
}

#[test]
fn one_of_a_thing_is_counted_in_the_singular() {
    let folder = one_course();
    let dir = folder.path();
    let plan = run_in(dir, &["plan", "one.yaml"]);
    assert!(plan.contains(" over 1 string,"), "{plan}");
    assert!(!plan.contains("1 strings"), "{plan}");
    let audit = run_in(dir, &["audit", "one.yaml", "--set", "set.yaml"]);
    assert!(
        audit.contains("of 1 course can take this tuning"),
        "{audit}"
    );
    let several = run_in(
        dir,
        &[
            "audit",
            "one.yaml",
            "--set",
            "set.yaml",
            "--tuning",
            "12edo",
            "--tuning",
            "12edo@A4=415hz",
        ],
    );
    assert!(
        several.contains("of 1 course can take every tuning"),
        "{several}"
    );
    let frets = run_in(dir, &["frets", "one.yaml", "--count", "1"]);
    assert!(frets.contains("mm, 1 fret\n"), "{frets}");
    assert!(!frets.contains("fret(s)"), "{frets}");
    let six = common::table(&["frets", "guitar-19edo", "--count", "3"]);
    assert!(
        six.contains(" 3 frets") || six.contains(" 3\nfrets"),
        "{six}"
    );
    run_in(
        dir,
        &[
            "plan",
            "one.yaml",
            "--string-chart",
            "chart.html",
            "-o",
            "plan.txt",
        ],
    );
    let page = std::fs::read_to_string(dir.join("chart.html")).unwrap();
    assert!(page.contains("1 course, 1 string."), "{page}");
}

#[test]
fn a_list_under_string_suggests_strings() {
    let folder = one_course();
    let dir = folder.path();
    // An instrument's course: `string:` names one string, so a list there is `strings:`.
    let instrument = common::write_file(
        dir,
        "pair.yaml",
        "name: Pairs\ntuning: 12edo\nscale_length: 648mm\ncourses:\n\
         \x20 - {course: 1, pitch: E4, string: [unison, octave]}\n",
    );
    let stderr = common::bad_input(&["plan", instrument.to_str().unwrap()]);
    assert!(stderr.contains("pair.yaml:5:"), "{stderr}");
    assert!(stderr.contains("field `courses[0].string`"), "{stderr}");
    assert!(stderr.contains("`strings:`"), "{stderr}");
    assert!(!stderr.contains("invalid type"), "{stderr}");
    // A string-set file with `string:` was taken for a layout file.
    let set = common::write_file(
        dir,
        "typo-set.yaml",
        "name: Typo\ntuning: 12edo\ncourses:\n\
         \x20 - {course: 1, string: [{kind: plain-steel, diameter: 0.010in}]}\n",
    );
    let one = dir.join("one.yaml");
    let stderr = common::bad_input(&[
        "audit",
        one.to_str().unwrap(),
        "--set",
        set.to_str().unwrap(),
    ]);
    assert!(stderr.contains("typo-set.yaml:4:"), "{stderr}");
    assert!(stderr.contains("field `courses[0].string`"), "{stderr}");
    assert!(stderr.contains("`strings`"), "{stderr}");
    assert!(!stderr.contains("layout file"), "{stderr}");
    // A layout file's course with a list under `string:`.
    let layout = common::write_file(
        dir,
        "typo-layout.yaml",
        "name: Typo\ntuning: 12edo\ntension: 50N\ncourses:\n\
         \x20 - {pitch: G4, string: [{kind: plain-steel, diameter: 0.012in}]}\n\
         \x20 - {pitch: A4, string: {kind: plain-steel, diameter: 0.012in}}\n",
    );
    let stderr = common::bad_input(&["lengths", layout.to_str().unwrap()]);
    assert!(stderr.contains("typo-layout.yaml:5:"), "{stderr}");
    assert!(stderr.contains("`strings:`"), "{stderr}");
}

#[test]
fn a_converted_set_is_named_for_the_instrument_it_is_now_on() {
    let folder = tempfile::tempdir().unwrap();
    let saved = folder.path().join("baritone-set.yaml");
    let report = folder.path().join("report.txt");
    common::table(&[
        "convert",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--to-instrument",
        "baritone-guitar",
        "--save-set",
        saved.to_str().unwrap(),
        "-o",
        report.to_str().unwrap(),
    ]);
    let text = std::fs::read_to_string(&saved).unwrap();
    assert!(
        text.contains("\ninstrument: \"Baritone steel-string guitar\"\n"),
        "{text}"
    );
    assert!(
        text.contains("\nname: \"Baritone steel-string guitar"),
        "{text}"
    );
}
