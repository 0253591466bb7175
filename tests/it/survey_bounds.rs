//! The survey's bounds through the binary (issue 23, point 3): the two search methods give the
//! same report, more threads than help change nothing, and pitches outside the plausible range
//! (1 Hz to 30 kHz, as `plan` keeps to) are refused and counted.

use crate::common::{json, write_file};

/// Everything of a survey's JSON but its timing, which differs run to run.
fn without_timing(mut report: serde_json::Value) -> serde_json::Value {
    report.as_object_mut().unwrap().remove("elapsed_s");
    report
}

const SMALL: &str = "\
tunings:
  edos: {from: 5, to: 72}
course_1: E2
offset_cents: {from: -600, to: 600, step: 1}
courses:
  nearest_to: 4/3
rank_by: target
top: 8
";

#[test]
fn both_methods_and_any_thread_count_give_the_same_report() {
    let folder = tempfile::tempdir().unwrap();
    let settings = write_file(folder.path(), "small.yaml", SMALL);
    let settings = settings.to_str().unwrap();
    let base = ["survey", "examples/fanned-8-fourths.yaml", settings];
    let crossings = without_timing(json(&base));
    assert!(crossings["stringable"].as_u64().unwrap() > 0);
    for extra in [
        &["--method", "exhaustive"][..],
        &["--threads", "1"][..],
        &["--threads", "10000"][..],
        &["--method", "exhaustive", "--every-offset", "--top", "500"][..],
    ] {
        let mut args = base.to_vec();
        args.extend_from_slice(extra);
        let other = without_timing(json(&args));
        if extra.contains(&"--every-offset") {
            let mut same = base.to_vec();
            same.extend_from_slice(&["--every-offset", "--top", "500"]);
            assert_eq!(without_timing(json(&same)), other, "{extra:?}");
        } else {
            assert_eq!(crossings, other, "{extra:?}");
        }
    }
}

/// Course 1 at 20 kHz with courses a fourth apart climbs past 30 kHz by course 3: every
/// candidate is refused for its pitch range (as well as for stress), and the diagnosis says so.
#[test]
fn pitches_beyond_the_plausible_range_are_refused_and_counted() {
    let folder = tempfile::tempdir().unwrap();
    let settings = write_file(
        folder.path(),
        "high.yaml",
        "tunings:\n  edos: {from: 12, to: 12}\ncourse_1: 20000hz\noffset_cents: {from: -100, to: 100, step: 50}\ncourses:\n  nearest_to: 4/3\ntop: 3\n",
    );
    let report = json(&[
        "survey",
        "examples/fanned-8-fourths.yaml",
        settings.to_str().unwrap(),
    ]);
    assert_eq!(report["candidates"], 5);
    assert_eq!(report["stringable"], 0);
    assert_eq!(report["rejected"]["outside_pitch_range"], 5);
    assert!(report["results"].as_array().unwrap().is_empty());
}
