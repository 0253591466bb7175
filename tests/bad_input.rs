//! The bad-input catalogue: one test per class of mistake a user (or a hostile file) can make.
//!
//! Every case checks the same promise: the run fails with the documented exit code (2 for bad
//! input, 1 for an output that cannot be written), the message names the file and the line,
//! column and field where there is one, nothing panics, and a `--output` file is either written
//! whole or not at all (an existing one is left untouched).
//!
//! The reader cases at the top go through the library's one YAML reader (`taut::yaml`) and the
//! quantity parser (`taut::units`) with a probe schema, so they hold for every file kind; the
//! command-line cases below run the real binary.

use std::path::{Path, PathBuf};

use serde::Deserialize;
use taut::error::{Error, EXIT_BAD_INPUT};
use taut::units::{Force, Frequency, Length};

// ---------------------------------------------------------------------------------------------
// Helpers: each case is a line or two.
// ---------------------------------------------------------------------------------------------

/// A schema shaped like taut's definition files, to drive the shared reader.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
#[allow(dead_code)]
struct Probe {
    name: String,
    #[serde(default)]
    load: Option<Force>,
    courses: Vec<ProbeCourse>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
#[allow(dead_code)]
struct ProbeCourse {
    length: Length,
    pitch: String,
    #[serde(default)]
    strings: Option<u32>,
}

/// Parses `text` as a probe document and returns the rendered error, checking it is bad input.
fn refused(text: &str) -> String {
    let err = taut::yaml::parse::<Probe>(text, "probe.yaml")
        .expect_err("the reader accepted a bad document");
    assert_eq!(err.exit_code(), EXIT_BAD_INPUT, "{err}");
    let shown = err.to_string();
    assert!(shown.starts_with("probe.yaml"), "origin missing: {shown}");
    shown
}

/// Like [`refused`] but also demands a `file:line:column` position and the named field (the
/// reported field may go deeper, e.g. `courses[1]` for an unknown key `courses[1].lenght`).
fn refused_at(text: &str, line: usize, field: &str) -> String {
    let shown = refused(text);
    let place = format!("probe.yaml:{line}:");
    assert!(shown.starts_with(&place), "expected {place}…: {shown}");
    assert!(
        shown.contains(&format!("field `{field}")),
        "expected field `{field}`: {shown}"
    );
    shown
}

/// A valid document with one course line swapped for `course`.
fn with_course(course: &str) -> String {
    format!("name: probe\ncourses:\n  - length: 648mm\n    pitch: E2\n{course}")
}

/// Reads a file through the library's reader and returns the rendered error.
fn read_refused(path: &Path) -> Error {
    let err = taut::yaml::read_text(path).expect_err("the reader accepted a bad file");
    assert_eq!(err.exit_code(), EXIT_BAD_INPUT, "{err}");
    err
}

fn scratch() -> tempfile::TempDir {
    tempfile::tempdir().expect("a temporary folder")
}

fn write(dir: &Path, name: &str, bytes: impl AsRef<[u8]>) -> PathBuf {
    let path = dir.join(name);
    std::fs::write(&path, bytes).expect("write a test file");
    path
}

// ---------------------------------------------------------------------------------------------
// Reader: malformed YAML
// ---------------------------------------------------------------------------------------------

#[test]
fn yaml_tab_indentation() {
    let shown = refused("name: probe\ncourses:\n\t- length: 648mm\n");
    assert!(shown.contains("probe.yaml:3:"), "{shown}");
    assert!(shown.contains("tabs"), "{shown}");
}

#[test]
fn yaml_bad_indentation() {
    // The second key is indented under a scalar value.
    let shown = refused("name: probe\n  courses: []\n");
    assert!(shown.contains("probe.yaml:2:"), "{shown}");
}

#[test]
fn yaml_unclosed_quote() {
    let shown = refused("name: \"probe\ncourses: []\n");
    assert!(shown.contains("starts at line 1, column 7"), "{shown}");
    assert!(shown.contains("never closed"), "{shown}");
}

#[test]
fn yaml_unclosed_flow_sequence() {
    let shown = refused("name: probe\ncourses: [ {length: 648mm, pitch: E2}\n");
    assert!(shown.contains("starts at line 2, column 10"), "{shown}");
}

#[test]
fn yaml_more_than_one_document() {
    let shown = refused("name: probe\ncourses: []\n---\nname: again\n");
    assert!(shown.starts_with("probe.yaml:3:1:"), "{shown}");
    assert!(shown.contains("more than one YAML document"), "{shown}");
}

#[test]
fn yaml_duplicate_key() {
    let shown = refused("name: probe\nname: again\ncourses: []\n");
    assert!(shown.contains("probe.yaml:"), "{shown}");
    assert!(shown.contains("duplicate"), "{shown}");
}

#[test]
fn yaml_top_level_not_a_mapping() {
    let shown = refused("- just\n- a list\n");
    assert!(shown.contains("probe.yaml:1:"), "{shown}");
}

// ---------------------------------------------------------------------------------------------
// Reader: schema mistakes
// ---------------------------------------------------------------------------------------------

#[test]
fn wrong_type_text_for_number() {
    refused_at(
        &with_course("  - length: 648mm\n    pitch: E2\n    strings: two\n"),
        7,
        "courses[1].strings",
    );
}

#[test]
fn wrong_type_mapping_for_list() {
    refused_at("name: probe\ncourses:\n  length: 648mm\n", 3, "courses");
}

#[test]
fn unknown_key_suggests_the_right_one() {
    let shown = refused_at(
        &with_course("  - lenght: 648mm\n    pitch: A2\n"),
        5,
        "courses[1]",
    );
    assert!(shown.contains("did you mean `length`?"), "{shown}");
}

#[test]
fn unknown_key_far_from_any_lists_the_allowed() {
    let shown = refused("name: probe\nzzzzzz: 1\ncourses: []\n");
    assert!(shown.contains("allowed:"), "{shown}");
}

#[test]
fn missing_required_field() {
    let shown = refused_at(&with_course("  - pitch: A2\n"), 5, "courses[1]");
    assert!(shown.contains("missing field `length`"), "{shown}");
}

#[test]
fn empty_file() {
    assert!(refused("").contains("empty"));
}

#[test]
fn comments_only_file() {
    assert!(refused("# a tuning, one day\n\n   \n# nothing yet\n").contains("empty"));
}

#[test]
fn negative_integer_for_a_count() {
    refused_at(
        &with_course("  - length: 648mm\n    pitch: A2\n    strings: -2\n"),
        7,
        "courses[1].strings",
    );
}

#[test]
fn integer_too_large_for_a_count() {
    refused_at(
        &with_course("  - length: 648mm\n    pitch: A2\n    strings: 99999999999999999999999\n"),
        7,
        "courses[1].strings",
    );
}

// ---------------------------------------------------------------------------------------------
// Reader: quantities with units, in a file (line, column, field) and alone (message, hint)
// ---------------------------------------------------------------------------------------------

#[test]
fn quantity_without_unit() {
    let shown = refused_at(
        &with_course("  - length: 648\n    pitch: A2\n"),
        5,
        "courses[1].length",
    );
    assert!(shown.contains("no unit"), "{shown}");
}

#[test]
fn quantity_of_the_wrong_dimension() {
    let shown = refused_at(
        &with_course("  - length: 70N\n    pitch: A2\n"),
        5,
        "courses[1].length",
    );
    assert!(
        shown.contains("is a force") && shown.contains("needs a length"),
        "{shown}"
    );
}

#[test]
fn quantity_with_unknown_unit_suggests() {
    let shown = refused_at(
        &with_course("  - length: 648 mn\n    pitch: A2\n"),
        5,
        "courses[1].length",
    );
    assert!(
        shown.contains("unknown unit `mn`") && shown.contains("did you mean"),
        "{shown}"
    );
}

#[test]
fn quantity_negative() {
    refused_at(
        &with_course("  - length: -648mm\n    pitch: A2\n"),
        5,
        "courses[1].length",
    );
}

#[test]
fn quantity_zero() {
    refused_at(
        &with_course("  - length: 0mm\n    pitch: A2\n"),
        5,
        "courses[1].length",
    );
}

#[test]
fn quantity_nan() {
    refused_at(
        &with_course("  - length: NaN mm\n    pitch: A2\n"),
        5,
        "courses[1].length",
    );
    assert!("nan Hz".parse::<Frequency>().is_err());
}

#[test]
fn quantity_infinite() {
    refused_at(
        &with_course("  - length: inf mm\n    pitch: A2\n"),
        5,
        "courses[1].length",
    );
    assert!("1e999N".parse::<Force>().is_err());
}

#[test]
fn quantity_that_overflows_when_converted() {
    // The number is finite, but times the unit's factor it is not: 1e308 kN = 1e311 N.
    let err = "1e308kN"
        .parse::<Force>()
        .expect_err("an infinite force was accepted");
    assert_eq!(err.exit_code(), EXIT_BAD_INPUT);
    assert!(taut::units::Force::new(f64::INFINITY).is_err());
    refused_at(
        &format!("name: probe\nload: 1e308kN\ncourses: []\n"),
        2,
        "load",
    );
}

#[test]
fn quantity_without_number() {
    let shown = "mm".parse::<Length>().expect_err("accepted").to_string();
    assert!(shown.contains("no number"), "{shown}");
}

#[test]
fn quantity_with_garbled_number() {
    let shown = "6.4.8mm"
        .parse::<Length>()
        .expect_err("accepted")
        .to_string();
    assert!(shown.contains("not a number"), "{shown}");
}

// ---------------------------------------------------------------------------------------------
// Reader: files that are not definition files
// ---------------------------------------------------------------------------------------------

#[test]
fn missing_file() {
    let dir = scratch();
    let err = read_refused(&dir.path().join("no-such.yaml"));
    assert!(err.to_string().contains("no-such.yaml"), "{err}");
}

#[test]
fn folder_given_as_file() {
    let dir = scratch();
    let err = read_refused(dir.path()).to_string();
    assert!(err.contains("folder"), "{err}");
}

#[test]
fn path_through_a_regular_file() {
    // A path whose "folder" is a file: fails reliably even as root.
    let dir = scratch();
    let file = write(dir.path(), "plain.txt", "x");
    let err = read_refused(&file.join("inner.yaml"));
    assert!(err.to_string().contains("inner.yaml"), "{err}");
}

#[test]
fn binary_file() {
    let dir = scratch();
    let file = write(
        dir.path(),
        "image.yaml",
        b"name: x\n\x89PNG\r\n\x1a\n\0\0\0\rIHDR",
    );
    let err = read_refused(&file).to_string();
    assert!(
        err.contains("image.yaml:4:1:") && err.contains("binary"),
        "{err}"
    );
}

#[test]
fn non_utf8_text() {
    let dir = scratch();
    // "Saitenstärke" in Latin-1: the ä is the byte 0xE4.
    let file = write(dir.path(), "latin1.yaml", b"name: Saitenst\xe4rke\n");
    let err = read_refused(&file).to_string();
    assert!(
        err.contains("latin1.yaml:1:15:") && err.contains("UTF-8"),
        "{err}"
    );
}

#[test]
fn file_over_the_size_limit() {
    let dir = scratch();
    let big = "# padding\n".repeat((taut::yaml::MAX_INPUT_BYTES as usize) / 10 + 1);
    let file = write(dir.path(), "huge.yaml", big);
    let err = read_refused(&file).to_string();
    assert!(
        err.contains("huge.yaml") && err.contains("at most"),
        "{err}"
    );
}

// ---------------------------------------------------------------------------------------------
// Reader: documents built to eat the machine
// ---------------------------------------------------------------------------------------------

#[test]
fn alias_bomb() {
    let mut text = String::from("a0: &a0 [x, x, x, x, x, x, x, x, x, x]\n");
    for level in 1..12 {
        let previous = format!("*a{}", level - 1);
        let row = vec![previous.as_str(); 10].join(", ");
        text.push_str(&format!("a{level}: &a{level} [{row}]\n"));
    }
    text.push_str("name: probe\ncourses: []\n");
    let shown = refused(&text);
    assert!(shown.contains("help:"), "{shown}");
}

#[test]
fn deeply_nested_flow_document() {
    let depth = 100_000;
    let text = format!(
        "name: {}x{}\ncourses: []\n",
        "[".repeat(depth),
        "]".repeat(depth)
    );
    let shown = refused(&text);
    assert!(
        shown.contains("probe.yaml:1:135:") && shown.contains("more than 128 levels"),
        "{shown}"
    );
}

#[test]
fn deeply_nested_block_document() {
    let mut text = String::from("name: probe\ncourses: []\nload:\n");
    for depth in 1..2000 {
        text.push_str(&" ".repeat(depth));
        text.push_str("k:\n");
    }
    refused(&text);
}

#[test]
fn very_long_line() {
    // A 3 MiB pitch on one line: under the size limit, so it reaches the schema and is
    // reported like any other value (here: the course lacks its length).
    let long = "E".repeat(3 * 1024 * 1024);
    let shown = refused(&format!("name: probe\ncourses:\n  - pitch: {long}\n"));
    assert!(
        shown.contains("probe.yaml:3:"),
        "{}",
        &shown[..shown.len().min(300)]
    );
    assert!(shown.len() < 10_000, "the message echoes the whole line");
}
