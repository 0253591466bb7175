//! Bad input through the real binary: each names the file, line and field, exits with 2 and
//! does not panic.

use crate::common::{bad_input, taut, write_file};

fn bad_file(text: &str) -> String {
    let folder = tempfile::tempdir().unwrap();
    let path = write_file(folder.path(), "scale.yaml", text);
    bad_input(&["tuning", "show", path.to_str().unwrap()])
}

const HEAD: &str = "name: test\ndescription: a test scale\n";

#[test]
fn malformed_yaml_names_file_and_line() {
    // A syntax error: a second colon in a plain value.
    let err = bad_file(&format!("{HEAD}divisions: 12\nperiod: 2/1: x\n"));
    assert!(err.contains("scale.yaml:4:"), "{err}");
    // An unterminated quoted string: the parser only notices at the end, but names the field.
    let err = bad_file(&format!(
        "{HEAD}divisions: 12\nperiod: \"2/1\nreference: x\n"
    ));
    assert!(
        err.contains("scale.yaml:") && err.contains("`period`"),
        "{err}"
    );
    // A list where a number belongs.
    let err = bad_file(&format!("{HEAD}divisions: [12]\n"));
    assert!(err.contains("scale.yaml:3:"), "{err}");
    assert!(err.contains("field `divisions`"), "{err}");
    // Tabs for indentation.
    let err = bad_file(&format!("{HEAD}chain:\n\tgenerator: 3/2\n"));
    assert!(
        err.contains("scale.yaml:3:") || err.contains("scale.yaml:4:"),
        "{err}"
    );
}

#[test]
fn unknown_keys_get_a_suggestion() {
    let err = bad_file(&format!("{HEAD}divisons: 12\n"));
    assert!(err.contains("scale.yaml:3:"), "{err}");
    assert!(err.contains("divisons"), "{err}");
    assert!(err.contains("did you mean `divisions`?"), "{err}");
    let err = bad_file(&format!(
        "{HEAD}divisions: 12\nreference:\n  hz: 415\n  degre: 0\n"
    ));
    assert!(err.contains("scale.yaml:6:"), "{err}");
    assert!(err.contains("reference"), "{err}");
    assert!(err.contains("did you mean `degree`?"), "{err}");
}

#[test]
fn zero_and_negative_divisions() {
    for count in ["0", "-12"] {
        let err = bad_file(&format!("{HEAD}divisions: {count}\n"));
        assert!(err.contains("scale.yaml:3:"), "{err}");
        assert!(err.contains("field `divisions`"), "{err}");
        assert!(err.contains("at least 1"), "{err}");
    }
    let err = bad_input(&["tuning", "show", "0edo"]);
    assert!(
        err.contains("tuning `0edo`") && err.contains("divisions"),
        "{err}"
    );
}

#[test]
fn periods_not_above_a_unison() {
    for period in ["1/1", "2/3", "0c", "-1200c"] {
        let err = bad_file(&format!("{HEAD}divisions: 12\nperiod: {period}\n"));
        assert!(err.contains("scale.yaml:4:"), "{period}: {err}");
        assert!(err.contains("field `period`"), "{period}: {err}");
        assert!(err.contains("wider than a unison"), "{period}: {err}");
    }
    let err = bad_file(&format!("{HEAD}divisions: 12\nperiod: 2\n"));
    assert!(err.contains("`2/1`") && err.contains("`2c`"), "{err}");
}

#[test]
fn zero_denominators() {
    let err = bad_file(&format!("{HEAD}ratios:\n  - 1/1\n  - 9/0\n"));
    assert!(err.contains("scale.yaml:5:"), "{err}");
    assert!(err.contains("ratios[1]"), "{err}");
    assert!(err.contains("zero denominator"), "{err}");
    let err = bad_input(&["tuning", "show", "12ed3/0"]);
    assert!(err.contains("zero denominator"), "{err}");
}

#[test]
fn cents_not_ascending() {
    let err = bad_file(&format!("{HEAD}cents:\n  - 0\n  - 200\n  - 150\n  - 700\n"));
    assert!(err.contains("scale.yaml:6:"), "{err}");
    assert!(err.contains("field `cents[2]`"), "{err}");
    assert!(err.contains("ascending"), "{err}");
    let err = bad_file(&format!("{HEAD}cents: [0, 100, .nan]\n"));
    assert!(
        err.contains("scale.yaml:3:") && err.contains("finite"),
        "{err}"
    );
}

#[test]
fn absurd_sizes_are_refused() {
    let err = bad_file(&format!("{HEAD}divisions: 1000000\n"));
    assert!(
        err.contains("scale.yaml:3:") && err.contains("too many"),
        "{err}"
    );
    let err = bad_input(&["tuning", "show", "1000000edo"]);
    assert!(err.contains("too many"), "{err}");
    let err = bad_input(&["tuning", "show", "chain:3/2,9000,9000"]);
    assert!(err.contains("too many"), "{err}");
    let long_list: Vec<String> = (0..10_001).map(|i| i.to_string()).collect();
    let err = bad_file(&format!("{HEAD}cents: [{}]\n", long_list.join(", ")));
    assert!(
        err.contains("scale.yaml:3:") && err.contains("too many"),
        "{err}"
    );
}

#[test]
fn unknown_tuning_names_get_a_suggestion() {
    let err = bad_input(&["tuning", "show", "pythagorian-12"]);
    assert!(err.contains("`pythagorian-12`"), "{err}");
    assert!(err.contains("did you mean `pythagorean-12`?"), "{err}");
    let err = bad_input(&["tuning", "show", "no-such-file.yaml"]);
    assert!(err.contains("no-such-file.yaml"), "{err}");
}

#[test]
fn pitches_the_tuning_cannot_address() {
    let err = bad_input(&["tuning", "find", "hertz:98,110,123.47", "deg5"]);
    assert!(err.contains("cannot address"), "{err}");
    assert!(err.contains("pitch `deg5`"), "{err}");
    let err = bad_input(&["tuning", "find", "19edo", "E2"]);
    assert!(err.contains("not a degree of `19edo`"), "{err}");
    assert!(err.contains("~E2"), "{err}");
    let err = bad_input(&["tuning", "find", "12edo", "deg12p0"]);
    assert!(err.contains("0 to 11"), "{err}");
    let err = bad_input(&["tuning", "find", "12edo", "H7"]);
    assert!(err.contains("not a note name"), "{err}");
}

#[test]
fn a_frequency_list_refuses_period_and_reference() {
    let err = bad_file(&format!("{HEAD}hertz: [100, 200]\nperiod: 2/1\n"));
    assert!(
        err.contains("scale.yaml:4:") && err.contains("period"),
        "{err}"
    );
    let err = bad_file(&format!("{HEAD}hertz: [100, 200]\nreference:\n  hz: 300\n"));
    assert!(
        err.contains("scale.yaml:4:") && err.contains("reference"),
        "{err}"
    );
    let err = bad_input(&["tuning", "show", "hertz:100,200@A4=415"]);
    assert!(err.contains("no reference"), "{err}");
}

#[test]
fn bad_references_name_the_spec() {
    let err = bad_input(&["tuning", "show", "12edo@A4=0"]);
    assert!(err.contains("tuning `12edo@A4=0`"), "{err}");
    let err = bad_file(&format!("{HEAD}divisions: 12\nreference:\n  note: Q4\n"));
    assert!(
        err.contains("scale.yaml:5:") && err.contains("note"),
        "{err}"
    );
}

#[test]
fn a_failed_run_leaves_an_existing_output_file_untouched() {
    let folder = tempfile::tempdir().unwrap();
    let path = write_file(folder.path(), "out.json", "keep me");
    let output = taut()
        .args(["tuning", "show", "0edo", "--output", path.to_str().unwrap()])
        .output()
        .unwrap();
    assert_eq!(output.status.code(), Some(2));
    assert_eq!(std::fs::read_to_string(&path).unwrap(), "keep me");
    assert_eq!(std::fs::read_dir(folder.path()).unwrap().count(), 1);
}
