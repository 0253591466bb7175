//! `taut plan` run as a real binary: every shipped example, the outside check on a plain steel
//! string, the JSON field names, output files and bad input.

use crate::common::taut;
use predicates::prelude::*;
use serde_json::Value;

const TEMPLATES: [&str; 4] = [
    "guitar-19edo",
    "lever-harp-34",
    "psaltery-26",
    "fanned-8-just",
];

fn write(dir: &tempfile::TempDir, name: &str, text: &str) -> String {
    let path = dir.path().join(name);
    std::fs::write(&path, text).unwrap();
    path.to_string_lossy().into_owned()
}

fn plan_json(args: &[&str]) -> Value {
    let output = taut()
        .arg("plan")
        .args(args)
        .args(["--format", "json"])
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    serde_json::from_slice(&output.stdout).unwrap()
}

#[test]
fn every_example_solves_in_every_format() {
    for name in TEMPLATES {
        // By template name and by path: both must give the same plan.
        let by_name = plan_json(&[name]);
        let path = format!("{}/examples/{name}.yaml", env!("CARGO_MANIFEST_DIR"));
        assert_eq!(by_name, plan_json(&[&path]), "{name}");
        let courses = by_name["courses"].as_array().unwrap();
        assert!(!courses.is_empty(), "{name}");
        for format in ["table", "csv", "yaml"] {
            taut()
                .args(["plan", name, "--format", format])
                .assert()
                .success()
                .stdout(predicate::str::is_empty().not());
        }
    }
}

#[test]
fn examples_have_the_courses_their_scenarios_promise() {
    let count = |name: &str| plan_json(&[name])["courses"].as_array().unwrap().len();
    assert_eq!(count("guitar-19edo"), 6);
    assert_eq!(count("lever-harp-34"), 34);
    assert_eq!(count("psaltery-26"), 26);
    assert_eq!(count("fanned-8-just"), 8);
    // The harp changes from nylon to wound strings in the bass.
    let harp = plan_json(&["lever-harp-34"]);
    let constructions: Vec<&str> = harp["courses"]
        .as_array()
        .unwrap()
        .iter()
        .map(|course| course["strings"][0]["construction"].as_str().unwrap())
        .collect();
    assert_eq!(constructions[0], "plain");
    assert_eq!(constructions[33], "wound");
    // The psaltery's courses are pairs.
    let psaltery = plan_json(&["psaltery-26"]);
    assert!(psaltery["courses"]
        .as_array()
        .unwrap()
        .iter()
        .all(|course| course["strings"].as_array().unwrap().len() == 2));
}

const STEEL_E4: &str = "\
name: steel E4 check
tuning: 12edo
scale_length: 648mm
defaults:
  kinds: [plain-steel]
  tension: 72N
courses:
  - pitch: E4
";

/// Outside check: a 0.010 in plain steel string at E4 on a 648 mm scale carries ≈ 72.6 N
/// (≈ 16.3 lbf). DERIVED from the handbook density of carbon steel, 7850 kg/m³
/// (REFERENCES §2, PRACTICE + READ), with T = μ(2Lf)² (Mersenne/Taylor, OpenStax University
/// Physics vol. 1 §16.3) and E4 = 329.6276 Hz (ISO 16 A4 = 440 Hz, 12-EDO):
/// μ = 7850·π·(0.000254 m)²/4 = 3.9777e-4 kg/m, (2·0.648·329.6276)² = 182 497.5 → 72.59 N.
/// Common practice (published tension charts of plain guitar strings) agrees on about 16 lbf.
#[test]
fn plain_steel_e4_on_648_mm_carries_72_6_newtons() {
    let dir = tempfile::tempdir().unwrap();
    let path = write(&dir, "steel.yaml", STEEL_E4);
    let plan = plan_json(&[&path]);
    let course = &plan["courses"][0];
    assert!((course["pitch_hz"].as_f64().unwrap() - 329.6276).abs() < 1e-3);
    assert!((course["length_m"].as_f64().unwrap() - 0.648).abs() < 1e-12);
    let string = &course["strings"][0];
    assert!((string["diameter_in"].as_f64().unwrap() - 0.010).abs() < 1e-9);
    assert!((string["diameter_mm"].as_f64().unwrap() - 0.254).abs() < 1e-9);
    let tension = string["tension_n"].as_f64().unwrap();
    assert!((tension - 72.6).abs() < 0.1, "{tension}");
    assert!((tension / 4.448_221_615_260_5 - 16.3).abs() < 0.05);
    // The target asks for μ = 72/182 497.5 kg/m exactly, before rounding to the catalog.
    let required = string["required_unit_mass_kg_per_m"].as_f64().unwrap();
    assert!(
        (required - 72.0 / 182_497.54).abs() / required < 1e-6,
        "{required}"
    );
    assert!((plan["total_tension_n"].as_f64().unwrap() - tension).abs() < 1e-12);
    // Stress ratio: σ = ρ(2Lf)² = 1.4326 GPa against ASTM A228's 387 ksi minimum at 0.010 in
    // (2668 MPa, REFERENCES §4.1, READ) is 0.537.
    let stress = string["stress_ratio"].as_f64().unwrap();
    assert!((stress - 0.537).abs() < 0.005, "{stress}");
    // The table shows tension in the chosen unit (newtons by default) and diameters in mm, or
    // in thousandths of an inch with `--length-unit in`.
    taut()
        .args(["plan", &path])
        .assert()
        .success()
        .stdout(predicate::str::contains("72.6"))
        .stdout(predicate::str::contains("0.25"));
    taut()
        .args(["plan", &path, "--force-unit", "lbf", "--length-unit", "in"])
        .assert()
        .success()
        .stdout(predicate::str::contains("16.3"))
        .stdout(predicate::str::contains("lbf"))
        .stdout(predicate::str::contains(
            "Gauges (in/1000, w = wound): 10\n",
        ));
    taut()
        .args(["plan", &path, "--force-unit", "kgf"])
        .assert()
        .success()
        .stdout(predicate::str::contains("7.4"))
        .stdout(predicate::str::contains("kgf"));
}

/// Outside check: a plain steel string on 648 mm breaks a few semitones above E4 whatever its
/// diameter: f_break = √(σ/ρ)/(2L) (REFERENCES §1.2, DERIVED) with ASTM A228's minimum
/// strengths (§4.1, READ) between 2.6 and 2.8 GPa gives 449–466 Hz, i.e. 5.4–6.0 semitones
/// above E4.
#[test]
fn plain_steel_on_648_mm_breaks_a_few_semitones_above_e4() {
    let dir = tempfile::tempdir().unwrap();
    for tension in ["50N", "72N", "110N"] {
        let text = STEEL_E4.replace("72N", tension);
        let path = write(&dir, "steel.yaml", &text);
        let plan = plan_json(&[&path]);
        let break_hz = plan["courses"][0]["strings"][0]["break_pitch_hz"]
            .as_f64()
            .unwrap();
        let semitones = 12.0 * (break_hz / 329.6276_f64).log2();
        assert!((5.0..6.5).contains(&semitones), "{tension}: {semitones}");
    }
}

#[test]
fn json_has_the_documented_fields() {
    let plan = plan_json(&["fanned-8-just"]);
    for key in ["courses", "total_tension_n", "warnings"] {
        assert!(plan.get(key).is_some(), "top-level {key}");
    }
    for course in plan["courses"].as_array().unwrap() {
        for key in ["course", "pitch_hz", "length_m", "strings", "warnings"] {
            assert!(course.get(key).is_some(), "course {key}");
        }
        for string in course["strings"].as_array().unwrap() {
            for key in [
                "pitch_hz",
                "construction",
                "material",
                "diameter_mm",
                "diameter_in",
                "unit_mass_kg_per_m",
                "target_tension_n",
                "required_unit_mass_kg_per_m",
                "tension_n",
                "stress_ratio",
                "break_pitch_hz",
                "alternatives",
            ] {
                assert!(string.get(key).is_some(), "string {key}");
            }
        }
    }
    let warning = &plan["warnings"][0];
    for key in ["kind", "course", "message"] {
        assert!(warning.get(key).is_some(), "warning {key}");
    }
}

#[test]
fn tension_option_overrides_the_file() {
    let light = plan_json(&["guitar-19edo", "--tension", "40N"]);
    let heavy = plan_json(&["guitar-19edo", "--tension", "20lbf"]);
    let target = |plan: &Value| {
        plan["courses"][0]["strings"][0]["target_tension_n"]
            .as_f64()
            .unwrap()
    };
    assert_eq!(target(&light), 40.0);
    assert!((target(&heavy) - 88.964_432_305_21).abs() < 1e-9);
    assert!(
        light["total_tension_n"].as_f64().unwrap() < heavy["total_tension_n"].as_f64().unwrap()
    );
    taut()
        .args(["plan", "guitar-19edo", "--tension", "40"])
        .assert()
        .code(2)
        .stderr(predicate::str::contains("--tension").and(predicate::str::contains("no unit")));
}

#[test]
fn tuning_option_overrides_the_file() {
    let dir = tempfile::tempdir().unwrap();
    let path = write(&dir, "steel.yaml", STEEL_E4);
    let plan = plan_json(&[&path, "--tuning", "12edo@A4=415"]);
    let hz = plan["courses"][0]["pitch_hz"].as_f64().unwrap();
    // E4 at A4 = 415 Hz is 415·2^(−5/12) = 310.8987 Hz (12-EDO formula, DERIVED).
    assert!((hz - 310.8987).abs() < 1e-3, "{hz}");
}

#[test]
fn output_file_is_written_whole_and_not_at_all_on_error() {
    let dir = tempfile::tempdir().unwrap();
    let out = dir.path().join("plan.csv");
    taut()
        .args(["plan", "psaltery-26", "--format", "csv", "--output"])
        .arg(&out)
        .assert()
        .success()
        .stdout("");
    let text = std::fs::read_to_string(&out).unwrap();
    assert!(text.starts_with("course,string,interval,"), "{text}");
    assert_eq!(text.lines().count(), 1 + 52);

    let bad = write(&dir, "bad.yaml", "name: x\ncourses: []\n");
    let failed = dir.path().join("failed.json");
    taut()
        .args(["plan", &bad, "--format", "json", "--output"])
        .arg(&failed)
        .assert()
        .code(2);
    assert!(!failed.exists());
    let leftovers: Vec<_> = std::fs::read_dir(dir.path())
        .unwrap()
        .map(|entry| entry.unwrap().file_name().to_string_lossy().into_owned())
        .filter(|name| name.contains("partial"))
        .collect();
    assert!(leftovers.is_empty(), "{leftovers:?}");
}

/// Runs `taut plan` on `text` and returns its error output, checking exit code 2 and the
/// `file:line:` prefix.
fn bad_input(text: &str, line: usize) -> String {
    let dir = tempfile::tempdir().unwrap();
    let path = write(&dir, "bad.yaml", text);
    let output = taut().args(["plan", &path]).output().unwrap();
    let stderr = String::from_utf8_lossy(&output.stderr).into_owned();
    assert_eq!(output.status.code(), Some(2), "{stderr}");
    assert!(output.stdout.is_empty());
    assert!(!stderr.contains("panicked"), "{stderr}");
    assert!(
        stderr.contains(&format!("{path}:{line}:")),
        "expected line {line}: {stderr}"
    );
    stderr
}

#[test]
fn no_courses() {
    let err = bad_input("name: x\nscale_length: 648mm\ncourses: []\n", 3);
    assert!(
        err.contains("`courses`") && err.contains("no courses"),
        "{err}"
    );
}

#[test]
fn course_without_length() {
    let err = bad_input(
        "name: x\ndefaults: {kinds: [plain-steel], tension: 70N}\ncourses:\n  - pitch: E4\n",
        4,
    );
    assert!(err.contains("courses[0].scale_length"), "{err}");
}

#[test]
fn negative_and_nan_values() {
    let err = bad_input(
        "name: x\nscale_length: -648mm\ndefaults: {kinds: [plain-steel], tension: 70N}\ncourses:\n  - pitch: E4\n",
        2,
    );
    assert!(
        err.contains("`scale_length`") && err.contains("greater than zero"),
        "{err}"
    );
    let err = bad_input(
        "name: x\nscale_length: 648mm\ndefaults:\n  kinds: [plain-steel]\n  tension: .nan\ncourses:\n  - pitch: E4\n",
        5,
    );
    assert!(err.contains("defaults.tension"), "{err}");
    let err = bad_input(
        "name: x\nscale_length: 648mm\nrated_load: -5N\ncourses:\n  - pitch: E4\n",
        3,
    );
    assert!(err.contains("rated_load"), "{err}");
}

#[test]
fn unknown_kind_suggests_the_closest() {
    let err = bad_input(
        "name: x\nscale_length: 648mm\ndefaults:\n  tension: 70N\ncourses:\n  - pitch: E4\n    kinds: [plain-stel]\n",
        7,
    );
    assert!(err.contains("courses[0].kinds[0]"), "{err}");
    assert!(err.contains("did you mean `plain-steel`"), "{err}");
}

#[test]
fn pitch_the_tuning_cannot_address() {
    // 19-EDO has no degree within the landing tolerance of 12-EDO's E4 (the nearest is 5.3
    // cents away: 19-EDO steps are 63.16 cents, 1200/19).
    let err = bad_input(
        "name: x\ntuning: 19edo\nscale_length: 648mm\ndefaults: {kinds: [plain-steel], tension: 70N}\ncourses:\n  - pitch: A4\n  - pitch: E4\n",
        7,
    );
    assert!(err.contains("courses[1].pitch"), "{err}");
    assert!(err.contains("not a degree"), "{err}");
    let err = bad_input(
        "name: x\nscale_length: 648mm\ndefaults: {kinds: [plain-steel], tension: 70N}\ncourses:\n  - pitch: H4\n",
        5,
    );
    assert!(err.contains("courses[0].pitch"), "{err}");
}

#[test]
fn duplicate_course_numbers() {
    let err = bad_input(
        "name: x\nscale_length: 648mm\ndefaults: {kinds: [plain-steel], tension: 70N}\ncourses:\n  - {course: 1, pitch: E4}\n  - {course: 1, pitch: B3}\n",
        6,
    );
    assert!(
        err.contains("courses[1].course") && err.contains("used twice"),
        "{err}"
    );
}

#[test]
fn missing_tension_and_kinds_and_unknown_tuning() {
    let err = bad_input(
        "name: x\nscale_length: 648mm\ndefaults: {kinds: [plain-steel]}\ncourses:\n  - pitch: E4\n",
        5,
    );
    assert!(err.contains("no tension target"), "{err}");
    let err = bad_input(
        "name: x\nscale_length: 648mm\ndefaults: {tension: 70N}\ncourses:\n  - pitch: E4\n",
        5,
    );
    assert!(err.contains("allows no string kinds"), "{err}");
    let err = bad_input("name: x\ntuning: 19-edo-ish\nscale_length: 648mm\ndefaults: {kinds: [plain-steel], tension: 70N}\ncourses:\n  - pitch: E4\n", 2);
    assert!(err.contains("`tuning`"), "{err}");
}

#[test]
fn unknown_instrument_suggests_a_template() {
    taut()
        .args(["plan", "lever-harp-43"])
        .assert()
        .code(2)
        .stderr(predicate::str::contains(
            "did you mean the example `lever-harp-34`?",
        ));
    taut()
        .args(["plan", "/no/such/dir/harp.yaml"])
        .assert()
        .code(2);
}

#[test]
fn safety_cautions_appear_only_with_cautions_or_dangers() {
    let dir = tempfile::tempdir().unwrap();
    let safe = write(&dir, "safe.yaml", STEEL_E4);
    taut()
        .args(["plan", &safe])
        .assert()
        .success()
        .stdout(predicate::str::contains("Before you string this up").not())
        .stdout(predicate::str::contains(
            "Strings can break: wear eye protection",
        ));
    let risky = write(
        &dir,
        "risky.yaml",
        &STEEL_E4.replace("pitch: E4", "pitch: A4"),
    );
    taut()
        .args(["plan", &risky])
        .assert()
        .success()
        .stdout(predicate::str::contains("DANGER"))
        .stdout(predicate::function(|text: &str| {
            // Lines wrap at the report's width; the cautions are whole once joined.
            let joined = text.split_whitespace().collect::<Vec<_>>().join(" ");
            [
                "eye protection",
                "gradually",
                "load rating",
                "maker's specifications",
            ]
            .iter()
            .all(|phrase| joined.contains(phrase))
        }));
}
