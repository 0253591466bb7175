//! Where the strings are now, in `audit`: a current state is worked out only from something
//! that describes it, and never shows a string above its breaking load as a "was" (issue 19,
//! point 1). Also: a plan's JSON or YAML read back as a set (point 2).

use crate::common::{bad_input, json, number, taut, write_file};

/// A six-course guitar whose pitches are ratios of its own just tuning, with 1/1 at E2.
pub(crate) const JUST_GUITAR: &str = "\
name: Just guitar
tuning: just-5-limit@E2
scale_length: 648mm
defaults:
  tension: {target: 75N, min: 40N, max: 130N}
  kinds: [plain-steel, phosphor-bronze-wound]
courses:
  - {course: 1, pitch: 4/1, kinds: [plain-steel]}
  - {course: 2, pitch: 3/1, kinds: [plain-steel]}
  - {course: 3, pitch: 12/5}
  - {course: 4, pitch: 16/9, kinds: [phosphor-bronze-wound]}
  - {course: 5, pitch: 4/3, kinds: [phosphor-bronze-wound]}
  - {course: 6, pitch: 1/1, kinds: [phosphor-bronze-wound]}
";

/// The same guitar with its pitches as 12-tone notes, in 12-EDO: where the strings are now.
const NOTE_GUITAR: &str = "\
name: Guitar in 12-EDO
tuning: 12edo
scale_length: 648mm
defaults:
  tension: {target: 75N, min: 40N, max: 130N}
  kinds: [plain-steel, phosphor-bronze-wound]
courses:
  - {course: 1, pitch: E4, kinds: [plain-steel]}
  - {course: 2, pitch: B3, kinds: [plain-steel]}
  - {course: 3, pitch: G3}
  - {course: 4, pitch: D3, kinds: [phosphor-bronze-wound]}
  - {course: 5, pitch: A2, kinds: [phosphor-bronze-wound]}
  - {course: 6, pitch: E2, kinds: [phosphor-bronze-wound]}
";

/// A light set for either guitar; `TUNING` is replaced by each test.
const SET: &str = "\
name: Light set
tuning: TUNING
courses:
  - strings: [{kind: plain-steel, diameter: 0.010in}]
  - strings: [{kind: plain-steel, diameter: 0.0135in}]
  - strings: [{kind: plain-steel, diameter: 0.017in}]
  - strings: [{kind: phosphor-bronze-wound, diameter: 0.025in}]
  - strings: [{kind: phosphor-bronze-wound, diameter: 0.033in}]
  - strings: [{kind: phosphor-bronze-wound, diameter: 0.043in}]
";

fn set_in(folder: &std::path::Path, name: &str, tuning: &str) -> String {
    write_file(folder, name, &SET.replace("TUNING", tuning))
        .to_string_lossy()
        .into_owned()
}

/// Ratios of a just tuning read in 12-EDO (whose reference is A4, not E2) name other pitches
/// two octaves and more away; before the fix the audit showed them as "was" (about 1,600 N on a
/// 0.010 in plain string) and gave every course "no" without a word of warning.
#[test]
fn ratio_pitches_read_in_the_sets_other_tuning_are_refused_naming_file_and_option() {
    let folder = tempfile::tempdir().unwrap();
    let instrument = write_file(folder.path(), "just.yaml", JUST_GUITAR);
    let instrument = instrument.to_str().unwrap();
    let set = set_in(folder.path(), "set.yaml", "12edo");
    let stderr = bad_input(&["audit", instrument, "--set", &set]);
    assert!(stderr.contains("set.yaml:2"), "{stderr}");
    assert!(stderr.contains("field `tuning`"), "{stderr}");
    assert!(stderr.contains("course 1's pitch `4/1`"), "{stderr}");
    assert!(stderr.contains("--from-instrument FILE"), "{stderr}");
    // `--from` reads the pitches the same way, so it is refused the same way.
    let same = set_in(folder.path(), "same.yaml", "just-5-limit@E2");
    let stderr = bad_input(&["audit", instrument, "--set", &same, "--from", "12edo"]);
    assert!(stderr.contains("--from"), "{stderr}");
    assert!(stderr.contains("--from-instrument FILE"), "{stderr}");
}

/// With the instrument as strung now, the same audit runs, and each "was" is T = μ(2Lf)² at the
/// string's pitch now (Mersenne's law, REFERENCES §1.2), below its breaking load.
#[test]
fn the_instrument_as_strung_now_gives_the_real_current_state() {
    let folder = tempfile::tempdir().unwrap();
    let instrument = write_file(folder.path(), "just.yaml", JUST_GUITAR);
    let now = write_file(folder.path(), "now.yaml", NOTE_GUITAR);
    let set = set_in(folder.path(), "set.yaml", "12edo");
    let report = json(&[
        "audit",
        instrument.to_str().unwrap(),
        "--set",
        &set,
        "--from-instrument",
        now.to_str().unwrap(),
    ]);
    // Course 1 is E4 now: 440 · 2^(−5/12) Hz (ISO 16 and 12-EDO, REFERENCES §7.1, §7.2).
    let e4 = 440.0 * 2f64.powf(-5.0 / 12.0);
    let string = &report["courses"][0]["strings"][0];
    let mu = number(&string["unit_mass_kg_per_m"]);
    let expected = mu * (2.0 * 0.648 * e4).powi(2);
    let was = number(&string["reference_tension_n"]);
    assert!(
        (was - expected).abs() < 0.01 * expected,
        "{was} vs {expected}"
    );
    for course in report["courses"].as_array().unwrap() {
        for string in course["strings"].as_array().unwrap() {
            // stress ratio scales with tension on the same string: below 1 means below breaking.
            let ratio_then = number(&string["stress_ratio"])
                * number(&string["reference_tension_n"])
                / number(&string["tension_n"]);
            assert!(
                ratio_then < 1.0,
                "course {}: {ratio_then}",
                course["course"]
            );
        }
    }
}

/// Ratios whose reference is the same in both tunings name the same pitch in both: no false
/// alarm, and no tension change.
#[test]
fn ratio_pitches_that_read_the_same_in_both_tunings_are_audited() {
    let folder = tempfile::tempdir().unwrap();
    // just-5-limit's reference is A4 = 440 Hz, as 12-EDO's is: 1/1 and 3/4 sound alike in both.
    let instrument = write_file(
        folder.path(),
        "just-a.yaml",
        &JUST_GUITAR
            .replace("just-5-limit@E2", "just-5-limit")
            .replace("pitch: 4/1,", "pitch: 3/4,")
            .replace("pitch: 3/1,", "pitch: 9/16,")
            .replace("pitch: 12/5}", "pitch: 9/20}")
            .replace("pitch: 16/9,", "pitch: 1/3,")
            .replace("pitch: 4/3,", "pitch: 1/4,")
            .replace("pitch: 1/1,", "pitch: 3/16,"),
    );
    let set = set_in(folder.path(), "set.yaml", "12edo");
    let report = json(&["audit", instrument.to_str().unwrap(), "--set", &set]);
    for course in report["courses"].as_array().unwrap() {
        let change = number(&course["strings"][0]["tension_change_pct"]);
        assert!(change.abs() < 1e-6, "course {}: {change}", course["course"]);
    }
}

/// However the current state is worked out, a string above its breaking load is not in it.
#[test]
fn a_current_state_above_a_strings_breaking_load_is_refused() {
    let folder = tempfile::tempdir().unwrap();
    let instrument = write_file(folder.path(), "notes.yaml", NOTE_GUITAR);
    let instrument = instrument.to_str().unwrap();
    // Note names at A4 = 880 Hz are an octave up: 0.010 in plain steel at E5 on 648 mm would
    // carry about 290 N, past the ≈135 N it breaks at (ASTM A228 strength, REFERENCES §4.1).
    let set = set_in(folder.path(), "octave.yaml", "12edo@A4=880");
    let stderr = bad_input(&["audit", instrument, "--set", &set]);
    assert!(stderr.contains("octave.yaml:2"), "{stderr}");
    assert!(stderr.contains("`tuning: 12edo@A4=880`"), "{stderr}");
    assert!(stderr.contains("beyond its breaking load"), "{stderr}");
    assert!(stderr.contains("--from-instrument FILE"), "{stderr}");
    // An instrument file "as strung now" with the top string an octave up is refused too, at
    // its line.
    let up = write_file(
        folder.path(),
        "up.yaml",
        &NOTE_GUITAR.replace("pitch: E4,", "pitch: E5,"),
    );
    let same = set_in(folder.path(), "set.yaml", "12edo");
    let stderr = bad_input(&[
        "audit",
        instrument,
        "--set",
        &same,
        "--from-instrument",
        up.to_str().unwrap(),
    ]);
    assert!(stderr.contains("up.yaml:8"), "{stderr}");
    assert!(stderr.contains("course 1"), "{stderr}");
    assert!(stderr.contains("beyond its breaking load"), "{stderr}");
    // In the instrument's own tuning there is no change to measure: the audit runs.
    let output = taut()
        .args(["audit", instrument, "--set", &same])
        .output()
        .unwrap();
    assert!(output.status.success());
}

/// A plan's JSON and YAML exports read back as the set `--save-set` writes: audited, each
/// gives the same strings and the plan's tensions. Before, `--set plan.json` failed with
/// "unknown field `pitch`".
#[test]
fn a_plans_json_and_yaml_read_back_as_its_set_in_audit() {
    let folder = tempfile::tempdir().unwrap();
    let path = |name: &str| folder.path().join(name).to_string_lossy().into_owned();
    for example in [
        "guitar-19edo",
        "lever-harp-34",
        "examples/guitar-kept-strings.yaml",
    ] {
        let plan = json(&["plan", example]);
        let (saved, as_json, as_yaml) = (path("saved.yaml"), path("plan.json"), path("plan.yaml"));
        let run = |args: &[&str]| {
            let output = taut().args(args).output().unwrap();
            assert!(
                output.status.success(),
                "{args:?}: {}",
                String::from_utf8_lossy(&output.stderr)
            );
        };
        run(&[
            "plan",
            example,
            "--save-set",
            &saved,
            "-o",
            &as_json,
            "--format",
            "json",
        ]);
        run(&["plan", example, "-o", &as_yaml, "--format", "yaml"]);
        let audits: Vec<_> = [&saved, &as_json, &as_yaml]
            .iter()
            .map(|set| json(&["audit", example, "--set", set]))
            .collect();
        for (course_index, course) in plan["courses"].as_array().unwrap().iter().enumerate() {
            for (string_index, planned) in course["strings"].as_array().unwrap().iter().enumerate()
            {
                for (audit, name) in audits.iter().zip(["--save-set", "JSON", "YAML"]) {
                    let audited = &audit["courses"][course_index]["strings"][string_index];
                    let at = format!("{example} ({name}) course {}", course["course"]);
                    let (d_plan, d_audit) = (
                        number(&planned["diameter_mm"]),
                        number(&audited["diameter_mm"]),
                    );
                    assert!(
                        (d_plan - d_audit).abs() < 1e-9,
                        "{at}: {d_plan} vs {d_audit}"
                    );
                    let (t_plan, t_audit) =
                        (number(&planned["tension_n"]), number(&audited["tension_n"]));
                    assert!(
                        (t_plan - t_audit).abs() <= 1e-6 * t_plan,
                        "{at}: {t_plan} vs {t_audit}"
                    );
                    // The same string: the plan's kind, or (a measured or weighed string,
                    // which an export holds as its μ) a measured string of the same μ.
                    if planned["construction"] == "measured" {
                        assert!(audited["string"]
                            .as_str()
                            .unwrap()
                            .ends_with("(music-wire)"));
                    } else {
                        assert_eq!(audited["string"], planned["kind"], "{at}");
                    }
                    let (mu_plan, mu_audit) = (
                        number(&planned["unit_mass_kg_per_m"]),
                        number(&audited["unit_mass_kg_per_m"]),
                    );
                    assert!((mu_plan - mu_audit).abs() <= 1e-6 * mu_plan, "{at}");
                }
            }
        }
    }
}

/// A plan for several tunings holds one set for all of them: its export reads back as that set.
#[test]
fn a_several_tunings_plan_reads_back_as_its_one_set() {
    let folder = tempfile::tempdir().unwrap();
    let example = "examples/guitar-three-tunings.yaml";
    let as_json = folder
        .path()
        .join("plan.json")
        .to_string_lossy()
        .into_owned();
    let saved = folder
        .path()
        .join("saved.yaml")
        .to_string_lossy()
        .into_owned();
    let output = taut()
        .args([
            "plan",
            example,
            "--format",
            "json",
            "-o",
            &as_json,
            "--save-set",
            &saved,
        ])
        .output()
        .unwrap();
    assert!(output.status.success());
    let from_json = json(&["audit", example, "--set", &as_json]);
    let from_saved = json(&["audit", example, "--set", &saved]);
    assert_eq!(from_json["courses"], from_saved["courses"]);
    assert_eq!(from_json["tunings"], from_saved["tunings"]);
}

/// A wound string fixed with its own core: the export does not record the core, so reading it
/// back as the kind's default core would give another string; it is refused, pointing at
/// `--save-set`.
#[test]
fn a_plan_export_that_cannot_say_a_strings_core_is_refused() {
    let folder = tempfile::tempdir().unwrap();
    let instrument = write_file(
        folder.path(),
        "core.yaml",
        &NOTE_GUITAR.replace(
            "pitch: E2, kinds: [phosphor-bronze-wound]}",
            "pitch: E2, string: {kind: phosphor-bronze-wound, diameter: 0.053in, core_diameter: 0.021in}}",
        ),
    );
    let instrument = instrument.to_str().unwrap();
    let as_json = folder
        .path()
        .join("plan.json")
        .to_string_lossy()
        .into_owned();
    let output = taut()
        .args(["plan", instrument, "--format", "json", "-o", &as_json])
        .output()
        .unwrap();
    assert!(output.status.success());
    let stderr = bad_input(&["audit", instrument, "--set", &as_json]);
    assert!(stderr.contains("courses[5].strings[0]"), "{stderr}");
    assert!(stderr.contains("--save-set"), "{stderr}");
}

/// A plan in a tuning placed by a reference (`just-5-limit@E2`, on which the ratio pitches
/// depend) reads back in that same tuning: the export keeps the tuning as given beside its name.
/// Before, it kept only `just-5-limit`, and the audit refused its own plan.
#[test]
fn a_plan_in_a_referenced_tuning_reads_back_in_that_tuning() {
    let folder = tempfile::tempdir().unwrap();
    let instrument = write_file(folder.path(), "just.yaml", JUST_GUITAR);
    let instrument = instrument.to_str().unwrap();
    let plan = json(&["plan", instrument]);
    assert_eq!(plan["tuning_spec"], "just-5-limit@E2");
    for format in ["json", "yaml"] {
        let export = folder.path().join(format!("plan.{format}"));
        let output = taut()
            .args(["plan", instrument, "--format", format, "-o"])
            .arg(&export)
            .output()
            .unwrap();
        assert!(output.status.success());
        let audit = json(&["audit", instrument, "--set", export.to_str().unwrap()]);
        for (planned, audited) in plan["courses"]
            .as_array()
            .unwrap()
            .iter()
            .zip(audit["courses"].as_array().unwrap())
        {
            let (t_plan, t_audit) = (
                number(&planned["strings"][0]["tension_n"]),
                number(&audited["strings"][0]["tension_n"]),
            );
            assert!(
                (t_plan - t_audit).abs() < 1e-6 * t_plan,
                "{format}: {t_plan} vs {t_audit}"
            );
        }
    }
}
