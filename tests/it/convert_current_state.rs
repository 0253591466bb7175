//! Where the strings are now, in `convert`: the "before" tensions a conversion keeps are worked
//! out only from pitches that really say where the strings are, and never from a state in which
//! a string would already have broken (issue 19, point 1, as `audit` does it).

use crate::audit_current_state::JUST_GUITAR;
use crate::common::{bad_input, json, write_file};

/// A light set; `TUNING` and `TOP` are replaced by each test.
const SET: &str = "\
name: Light set
tuning: TUNING
courses:
  - strings: [{kind: TOP}]
  - strings: [{kind: plain-steel, diameter: 0.0135in}]
  - strings: [{kind: plain-steel, diameter: 0.017in}]
  - strings: [{kind: phosphor-bronze-wound, diameter: 0.025in}]
  - strings: [{kind: phosphor-bronze-wound, diameter: 0.033in}]
  - strings: [{kind: phosphor-bronze-wound, diameter: 0.043in}]
";

fn set(folder: &std::path::Path, name: &str, tuning: &str, top: &str) -> String {
    let text = SET
        .replace("TUNING", tuning)
        .replace("{kind: TOP}", &format!("{{kind: {top}}}"));
    write_file(folder, name, &text)
        .to_string_lossy()
        .into_owned()
}

/// Before the fix, `4/1` read in the set's 12-EDO (reference A4) was A6, 1760 Hz: the report
/// showed a "before" total of 12,822 N for a light set and replaced every string to keep it.
#[test]
fn ratio_pitches_read_in_the_sets_other_tuning_are_refused() {
    let folder = tempfile::tempdir().unwrap();
    let instrument = write_file(folder.path(), "just.yaml", JUST_GUITAR);
    let instrument = instrument.to_str().unwrap();
    let set = set(
        folder.path(),
        "set.yaml",
        "12edo",
        "plain-steel, diameter: 0.010in",
    );
    let stderr = bad_input(&[
        "convert",
        instrument,
        "--set",
        &set,
        "--to",
        "just-5-limit@D2",
    ]);
    assert!(stderr.contains("just.yaml:8"), "{stderr}");
    assert!(stderr.contains("course 1's pitch `4/1`"), "{stderr}");
    // 4/1 above A4 is 1760 Hz; 4/1 above E2 (329.63 Hz) is E4: 2900 cents apart.
    assert!(stderr.contains("1760.0 Hz instead of 329.6 Hz"), "{stderr}");
    assert!(stderr.contains("--from"), "{stderr}");
}

/// The same files with the pitches' own tuning named (in the set, or by --from) convert, and the
/// tensions kept are those of a light set: about 75 N a string, nowhere near a breaking load.
#[test]
fn the_tuning_the_pitches_are_written_in_gives_a_real_before_state() {
    let folder = tempfile::tempdir().unwrap();
    let instrument = write_file(folder.path(), "just.yaml", JUST_GUITAR);
    let instrument = instrument.to_str().unwrap();
    let own = set(
        folder.path(),
        "own.yaml",
        "just-5-limit@E2",
        "plain-steel, diameter: 0.010in",
    );
    let other = set(
        folder.path(),
        "other.yaml",
        "12edo",
        "plain-steel, diameter: 0.010in",
    );
    let by_set = json(&[
        "convert",
        instrument,
        "--set",
        &own,
        "--to",
        "just-5-limit@D2",
    ]);
    let by_option = json(&[
        "convert",
        instrument,
        "--set",
        &other,
        "--from",
        "just-5-limit@E2",
        "--to",
        "just-5-limit@D2",
    ]);
    assert_eq!(by_set["courses"], by_option["courses"]);
    let before = by_set["total_before_n"].as_f64().unwrap();
    // Six light strings at a 648 mm scale (common practice: 50-90 N each).
    assert!((300.0..540.0).contains(&before), "{before}");
}

/// A set whose top string could not be at its pitch without breaking (a 0.043 in wound string
/// at E4 would need well over a kilonewton) is refused, not converted from an invented state.
#[test]
fn a_before_state_beyond_the_breaking_load_is_refused() {
    let folder = tempfile::tempdir().unwrap();
    let instrument = write_file(folder.path(), "just.yaml", JUST_GUITAR);
    let instrument = instrument.to_str().unwrap();
    let heavy = set(
        folder.path(),
        "heavy.yaml",
        "just-5-limit@E2",
        "phosphor-bronze-wound, diameter: 0.043in",
    );
    let stderr = bad_input(&[
        "convert",
        instrument,
        "--set",
        &heavy,
        "--to",
        "just-5-limit@D2",
    ]);
    assert!(stderr.contains("course 1"), "{stderr}");
    assert!(stderr.contains("beyond its breaking load"), "{stderr}");
}
