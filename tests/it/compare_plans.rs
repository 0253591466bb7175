//! `taut compare`: two plans, two sets, or a plan and a set side by side. A plan against itself
//! shows no change; a set moved to a longer scale at the same pitches shows the change
//! Mersenne's law predicts, T = μ(2Lf)², so T₂/T₁ = (L₂/L₁)² (REFERENCES §12.3, derived from
//! §1.1: OpenStax *University Physics* Vol. 1 §16.3).

use std::path::{Path, PathBuf};

use crate::common::{self, number, taut, write_file};

/// Writes the steel-string guitar's plan as JSON and its set, and the same guitar on a 27 in
/// neck at the same pitches (an invented scenario).
fn guitar_files(folder: &Path) -> (PathBuf, PathBuf, PathBuf) {
    let plan = folder.join("plan.json");
    let set = folder.join("set.yaml");
    taut()
        .args(["plan", "steel-guitar-12edo", "--format", "json", "-o"])
        .arg(&plan)
        .arg("--save-set")
        .arg(&set)
        .assert()
        .success();
    let text = std::fs::read_to_string(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/steel-guitar-12edo.yaml"),
    )
    .unwrap();
    assert!(text.contains("scale_length: 25.5in"));
    let longer = write_file(
        folder,
        "longer.yaml",
        &text.replace("scale_length: 25.5in", "scale_length: 27in"),
    );
    (plan, set, longer)
}

fn strings(report: &serde_json::Value) -> Vec<&serde_json::Value> {
    report["courses"]
        .as_array()
        .unwrap()
        .iter()
        .flat_map(|c| c["strings"].as_array().unwrap())
        .collect()
}

#[test]
fn a_plan_compared_with_itself_shows_no_change() {
    let folder = tempfile::tempdir().unwrap();
    let (plan, _, _) = guitar_files(folder.path());
    let plan = plan.to_str().unwrap();
    let report = common::json(&["compare", plan, plan]);
    assert_eq!(report["strings_changed"], 0);
    assert_eq!(report["strings_unchanged"], 6);
    assert_eq!(number(&report["total_change_n"]), 0.0);
    for string in strings(&report) {
        assert_eq!(string["changed"], false);
        for field in [
            "diameter_change_mm",
            "tension_change_n",
            "tension_change_pct",
            "stress_change_points",
            "bend_force_change_pct",
        ] {
            assert_eq!(number(&string[field]), 0.0, "{field}");
        }
    }
    let table = common::table(&["compare", plan, plan]);
    assert!(table.contains("0 strings changed, 6 the same"), "{table}");
}

#[test]
fn a_set_moved_to_a_longer_scale_gains_the_square_of_the_length_ratio() {
    let folder = tempfile::tempdir().unwrap();
    let (plan, set, longer) = guitar_files(folder.path());
    // Mersenne: at equal μ and f, T ∝ L² (REFERENCES §12.3): 25.5 in → 27 in.
    let expected_pct = ((27.0_f64 * 25.4) / (25.5 * 25.4)).powi(2) * 100.0 - 100.0;
    assert!((expected_pct - 12.11).abs() < 0.005);
    let report = common::json(&[
        "compare",
        plan.to_str().unwrap(),
        set.to_str().unwrap(),
        "--on",
        longer.to_str().unwrap(),
    ]);
    assert_eq!(report["before"]["source"], "plan");
    assert_eq!(report["after"]["source"], "set");
    for string in strings(&report) {
        let before = number(&string["before"]["tension_n"]);
        let after = number(&string["after"]["tension_n"]);
        assert!((number(&string["tension_change_pct"]) - expected_pct).abs() < 0.01);
        assert!((after - before - number(&string["tension_change_n"])).abs() < 1e-9);
        // Same strings: no change of gauge.
        assert!(number(&string["diameter_change_mm"]).abs() < 1e-9);
    }
    assert!((number(&report["total_change_pct"]) - expected_pct).abs() < 0.01);
    // Two sets, one on each neck, give the same change.
    let sets = common::json(&[
        "compare",
        set.to_str().unwrap(),
        set.to_str().unwrap(),
        "--on",
        "steel-guitar-12edo",
        "--after-on",
        longer.to_str().unwrap(),
    ]);
    assert!((number(&sets["total_change_pct"]) - expected_pct).abs() < 0.01);
    // More load than before by over 10 %: the cautions come with it.
    assert_eq!(report["cautions"].as_array().unwrap().len(), 4);
}

#[test]
fn every_format_carries_the_same_comparison() {
    let folder = tempfile::tempdir().unwrap();
    let (plan, set, longer) = guitar_files(folder.path());
    let args = [
        "compare",
        plan.to_str().unwrap(),
        set.to_str().unwrap(),
        "--on",
        longer.to_str().unwrap(),
    ];
    let json = common::json(&args);
    let yaml = taut()
        .args(args)
        .args(["--format", "yaml"])
        .output()
        .unwrap();
    let yaml: serde_json::Value = serde_yaml::from_slice(&yaml.stdout).unwrap();
    assert_close(&yaml, &json);
    let csv = common::table(&[&args[..], &["--format", "csv"]].concat());
    let mut reader = csv::Reader::from_reader(csv.as_bytes());
    let header = reader.headers().unwrap().clone();
    assert!(header.iter().any(|h| h == "string.tension_change_pct"));
    assert_eq!(reader.records().count(), 6);
    let table = common::table(&args);
    assert!(table.lines().all(|line| line.chars().count() <= 100));
    assert!(table.contains("Before you string this up"));
    assert!(!table.contains("NaN") && !table.contains("inf"));
}

#[test]
fn sides_that_cannot_be_compared_are_bad_input() {
    let folder = tempfile::tempdir().unwrap();
    let (plan, set, _) = guitar_files(folder.path());
    let (plan, set) = (plan.to_str().unwrap(), set.to_str().unwrap());
    // A set has no tension until it is on an instrument.
    let message = common::bad_input(&["compare", plan, set]);
    assert!(message.contains("--on"), "{message}");
    // A plan for several tunings has no one side.
    let several = folder.path().join("several.json");
    taut()
        .args([
            "plan",
            "examples/guitar-three-tunings.yaml",
            "--format",
            "json",
        ])
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .arg("-o")
        .arg(&several)
        .assert()
        .success();
    let message = common::bad_input(&["compare", several.to_str().unwrap(), plan]);
    assert!(message.contains("several tunings"), "{message}");
    // Missing files and broken plans name the file.
    let message = common::bad_input(&["compare", "no-such-plan.json", plan]);
    assert!(message.contains("no-such-plan.json"), "{message}");
    let broken = write_file(
        folder.path(),
        "broken.json",
        "{\"caution_stress_ratio\": 0.7,",
    );
    let message = common::bad_input(&["compare", broken.to_str().unwrap(), plan]);
    assert!(message.contains("broken.json"), "{message}");
    // The report never replaces one of its inputs.
    let before = std::fs::read(plan).unwrap();
    let output = taut()
        .args(["compare", plan, plan, "-o", plan])
        .output()
        .unwrap();
    assert_eq!(output.status.code(), Some(2));
    assert_eq!(std::fs::read(plan).unwrap(), before);
}

/// The same document, numbers equal to 12 digits (YAML writes floats with their own shortest
/// form, which may differ from JSON's in the last bit).
fn assert_close(a: &serde_json::Value, b: &serde_json::Value) {
    use serde_json::Value;
    match (a, b) {
        (Value::Number(x), Value::Number(y)) => {
            let (x, y) = (x.as_f64().unwrap(), y.as_f64().unwrap());
            assert!(
                (x - y).abs() <= 1e-12 * x.abs().max(y.abs()),
                "{x} against {y}"
            );
        }
        (Value::Array(x), Value::Array(y)) => {
            assert_eq!(x.len(), y.len());
            x.iter().zip(y).for_each(|(x, y)| assert_close(x, y));
        }
        (Value::Object(x), Value::Object(y)) => {
            assert_eq!(x.keys().collect::<Vec<_>>(), y.keys().collect::<Vec<_>>());
            x.iter().for_each(|(key, x)| assert_close(x, &y[key]));
        }
        _ => assert_eq!(a, b),
    }
}
