//! Every shipped tuning loads, states its source, and is found by name from any folder.

use crate::common::{json, taut};
use taut::tuning::library;

#[test]
fn every_shipped_definition_loads_and_names_its_source() {
    let all = library::load_all();
    assert!(all.len() >= 12);
    for (name, loaded) in all {
        let tuning = loaded.unwrap_or_else(|e| panic!("{name}: {e}"));
        assert_eq!(tuning.name(), name, "the name inside matches the file name");
        let source = tuning.source().unwrap_or_default();
        assert!(source.len() > 10, "{name} has no source");
        assert!(!tuning.description().is_empty(), "{name}");
        // Each file also cites its source in a comment.
        let text = library::SHIPPED
            .iter()
            .find(|(n, _)| *n == name)
            .map(|(_, t)| *t)
            .unwrap();
        assert!(text.contains("# Source:"), "{name} lacks a source comment");
        assert!(tuning.degree(0).is_ok());
    }
}

#[test]
fn every_file_in_the_tunings_folder_is_shipped() {
    let folder = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("tunings");
    let mut on_disk: Vec<String> = std::fs::read_dir(folder)
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|p| p.extension().is_some_and(|x| x == "yaml"))
        .map(|p| p.file_stem().unwrap().to_string_lossy().to_string())
        .collect();
    on_disk.sort();
    let mut shipped: Vec<String> = library::names().map(String::from).collect();
    shipped.sort();
    assert_eq!(on_disk, shipped);
}

#[test]
fn the_list_subcommand_shows_every_shipped_tuning_from_any_folder() {
    let folder = tempfile::tempdir().unwrap();
    let output = taut()
        .current_dir(folder.path())
        .args(["tuning", "list", "--format", "json"])
        .output()
        .unwrap();
    assert!(output.status.success());
    let report: serde_json::Value = serde_json::from_slice(&output.stdout).unwrap();
    let tunings = report["tunings"].as_array().unwrap();
    assert_eq!(tunings.len(), library::SHIPPED.len());
    assert!(tunings
        .iter()
        .any(|t| t["name"] == "tritave-13" && t["period"]["ratio"] == "3/1"));
    let text = taut()
        .current_dir(folder.path())
        .args(["tuning", "list"])
        .output()
        .unwrap();
    let text = String::from_utf8(text.stdout).unwrap();
    for name in library::names() {
        assert!(text.contains(name), "{name} missing from:\n{text}");
    }
}

#[test]
fn shipped_names_are_case_insensitive() {
    let report = json(&["tuning", "show", "Pythagorean-12", "--to", "0"]);
    assert_eq!(report["tuning"]["name"], "pythagorean-12");
}

/// Every shipped tuning can be listed, analysed and compared through the binary (issue: "taut
/// tuning lists, analyses and compares every shipped tuning"), and each analysis is sane: one
/// the analysis lists the six intervals of the 5-odd-limit diamond with finite errors.
#[test]
fn every_shipped_tuning_shows_fits_and_compares() {
    for name in library::names() {
        let shown = json(&["tuning", "show", name]);
        assert!(
            !shown["rows"].as_array().unwrap().is_empty(),
            "{name}: {shown}"
        );
        let fit = json(&["tuning", "fit", name, "--limit", "5"]);
        // 6/5, 5/4, 4/3, 3/2, 8/5, 5/3 (the 5-odd-limit tonality diamond within the octave).
        assert_eq!(
            fit["intervals"].as_array().unwrap().len(),
            6,
            "{name}: {fit}"
        );
        let max_error = fit["max_abs_error_cents"].as_f64().unwrap();
        assert!(max_error.is_finite() && max_error >= 0.0, "{name}: {fit}");
        let compared = json(&["tuning", "compare", name, "12edo"]);
        assert!(
            !compared["rows"].as_array().unwrap().is_empty(),
            "{name}: {compared}"
        );
    }
}
