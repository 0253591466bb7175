//! Bad input to `taut frets`, through the real binary: each mistake gets one message naming the
//! file, line and field (or the option), exit code 2, no panic, nothing on standard output, and
//! an earlier `--output` file left exactly as it was.

use assert_cmd::Command;

/// A valid instrument; cases change one thing in it. Line 5 holds `count`, line 6 `degrees`.
const BASE: &str = "\
name: Probe
tuning: 12edo
scale_length: 648mm
frets:
  count: 12
  degrees: [0, 2, 4, 5, 7, 9, 11]
courses:
  - course: 1
    pitch: E4
  - course: 2
    pitch: B3
";

const EARLIER: &str = "an earlier report\n";

/// Runs `taut frets probe.yaml ARGS -o report.txt` on `text`; checks the whole promise and
/// returns standard error.
fn refused(text: &str, args: &[&str]) -> String {
    let folder = tempfile::tempdir().unwrap();
    std::fs::write(folder.path().join("probe.yaml"), text).unwrap();
    let report = folder.path().join("report.txt");
    std::fs::write(&report, EARLIER).unwrap();
    let output = Command::new(env!("CARGO_BIN_EXE_taut"))
        .current_dir(folder.path())
        .args(["frets", "probe.yaml", "-o", "report.txt"])
        .args(args)
        .output()
        .unwrap();
    let stderr = String::from_utf8_lossy(&output.stderr).to_string();
    assert_eq!(output.status.code(), Some(2), "{args:?}: {stderr}");
    assert!(stderr.starts_with("error: "), "{stderr}");
    assert!(!stderr.contains("panicked"), "{stderr}");
    assert!(output.stdout.is_empty());
    assert_eq!(std::fs::read_to_string(&report).unwrap(), EARLIER);
    assert_eq!(
        std::fs::read_dir(folder.path()).unwrap().count(),
        2,
        "a stray file"
    );
    stderr
}

/// [`BASE`] with `from` replaced by `to`, refused at `line` naming `field`.
fn refused_at(from: &str, to: &str, line: usize, field: &str) -> String {
    assert!(BASE.contains(from), "{from}");
    let stderr = refused(&BASE.replacen(from, to, 1), &[]);
    assert!(
        stderr.starts_with(&format!("error: probe.yaml:{line}:")),
        "expected line {line}: {stderr}"
    );
    assert!(stderr.contains(&format!("field `{field}`")), "{stderr}");
    stderr
}

#[test]
fn fret_counts_must_be_whole_and_in_range() {
    let stderr = refused_at("count: 12", "count: 0", 5, "frets.count");
    assert!(stderr.contains("from 1 to 1000"), "{stderr}");
    refused_at("count: 12", "count: 2.5", 5, "frets.count");
    refused_at("count: 12", "count: 5000", 5, "frets.count");
    refused_at("count: 12", "count: many", 5, "frets.count");
}

#[test]
fn unknown_keys_in_the_frets_block_are_named() {
    let stderr = refused_at("count: 12", "cont: 12", 5, "frets.cont");
    assert!(stderr.contains("did you mean `count`"), "{stderr}");
}

#[test]
fn fretted_steps_must_exist_once_each() {
    let stderr = refused_at("[0, 2, 4,", "[0, 12, 4,", 6, "frets.degrees[1]");
    assert!(stderr.contains("steps 0 to 11"), "{stderr}");
    let stderr = refused_at("[0, 2, 4,", "[0, 0, 4,", 6, "frets.degrees[1]");
    assert!(stderr.contains("listed twice"), "{stderr}");
    refused_at("[0, 2, 4, 5, 7, 9, 11]", "[]", 6, "frets.degrees");
    refused_at("[0, 2, 4,", "[-1, 2, 4,", 6, "frets.degrees[0]");
    // A list of frequencies has no periods to choose steps from.
    let stderr = refused_at(
        "tuning: 12edo",
        "tuning: 'hertz:100,200,300'",
        6,
        "frets.degrees",
    );
    assert!(stderr.contains("without periods"), "{stderr}");
}

#[test]
fn lengths_cents_and_fractions_need_their_form() {
    refused_at("count: 12", "up_to: 30", 5, "frets.up_to");
    refused_at("count: 12", "min_spacing: -3mm", 5, "frets.min_spacing");
    let stderr = refused_at("count: 12", "merge_within: 5", 5, "frets.merge_within");
    assert!(stderr.contains("`5c`"), "{stderr}");
    refused_at("count: 12", "merge_within: 5000c", 5, "frets.merge_within");
    let stderr = refused_at("count: 12", "square_at: 1.5", 5, "frets.square_at");
    assert!(stderr.contains("from 0 (the nut) to 1"), "{stderr}");
    refused_at("count: 12", "degrees_from: nut", 5, "frets.degrees_from");
    refused_at(
        "count: 12",
        "board_width: {nut: 43mm}",
        5,
        "frets.board_width",
    );
}

#[test]
fn a_board_too_narrow_for_its_margins_is_refused() {
    let stderr = refused_at(
        "count: 12",
        "board_width: {nut: 5mm, last_fret: 56mm}",
        5,
        "frets.board_width",
    );
    assert!(stderr.contains("no room"), "{stderr}");
}

#[test]
fn a_course_pitch_off_the_tuning_points_at_its_line() {
    let stderr = refused_at("tuning: 12edo", "tuning: 19edo", 9, "courses[0].pitch");
    assert!(stderr.contains("~E4"), "{stderr}");
}

#[test]
fn options_are_named_in_their_errors() {
    for (args, named) in [
        (&["--count", "abc"][..], "--count"),
        (&["--count", "0"], "--count"),
        (&["--up-to", "30"], "--up-to"),
        (&["--degrees", "0,x"], "--degrees"),
        (&["--degrees", "0,30"], "--degrees"),
        (&["--degrees-from", "nut"], "--degrees-from"),
        (&["--min-spacing", "0mm"], "--min-spacing"),
        (&["--merge-within", "5"], "--merge-within"),
        (&["--square-at", "2"], "--square-at"),
        (&["--tuning", "0edo"], "tuning `0edo`"),
    ] {
        let stderr = refused(BASE, args);
        assert!(stderr.contains(named), "{args:?}: {stderr}");
    }
}
