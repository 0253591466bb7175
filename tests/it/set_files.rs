//! Bad string-set files: a clear message naming file, line and field; exit code 2; no panic.

use assert_cmd::Command;
use predicates::prelude::*;

fn audit_with_set(text: &str) -> assert_cmd::assert::Assert {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("set.yaml");
    std::fs::write(&path, text).unwrap();
    let assert = Command::cargo_bin("taut")
        .unwrap()
        .args(["audit", "examples/steel-guitar-12edo.yaml", "--set"])
        .arg(&path)
        .assert();
    drop(dir);
    assert
}

fn six(first: &str) -> String {
    format!(
        "name: s\ncourses:\n  - strings:\n      - {first}\n  - strings: [{{kind: plain-steel, diameter: 0.016in}}]\n  - strings: [{{kind: plain-steel, diameter: 0.020in}}]\n  - strings: [{{kind: phosphor-bronze-wound, diameter: 0.030in}}]\n  - strings: [{{kind: phosphor-bronze-wound, diameter: 0.040in}}]\n  - strings: [{{kind: phosphor-bronze-wound, diameter: 0.052in}}]\n"
    )
}

#[test]
fn a_good_set_reads() {
    audit_with_set(&six("{kind: plain-steel, diameter: 0.012in}")).success();
}

#[test]
fn malformed_yaml_names_its_line() {
    audit_with_set("name: s\ncourses:\n  - strings: [{kind: plain-steel, diameter: 0.012in}\n")
        .code(2)
        .stderr(predicate::str::contains("set.yaml:"))
        .stderr(predicate::str::contains("panicked").not());
}

#[test]
fn unknown_key_names_line_field_and_suggestion() {
    audit_with_set(&six("{kind: plain-steel, diametre: 0.012in}"))
        .code(2)
        .stderr(predicate::str::contains("set.yaml:4:"))
        .stderr(predicate::str::contains("courses[0].strings[0]"))
        .stderr(predicate::str::contains("did you mean `diameter`"));
    audit_with_set("name: s\ncolour: red\ncourses: []\n")
        .code(2)
        .stderr(predicate::str::contains("set.yaml:2:"))
        .stderr(predicate::str::contains("colour"));
}

#[test]
fn negative_zero_and_nan_values_are_refused_at_their_line() {
    for bad in ["-0.012in", "0in", "NaNin", ".nan"] {
        audit_with_set(&six(&format!("{{kind: plain-steel, diameter: {bad}}}")))
            .code(2)
            .stderr(predicate::str::contains("set.yaml:4:"))
            .stderr(predicate::str::contains("courses[0].strings[0].diameter"))
            .stderr(predicate::str::contains("panicked").not());
    }
    audit_with_set(&six("{unit_mass: -1g/m}"))
        .code(2)
        .stderr(predicate::str::contains("courses[0].strings[0].unit_mass"));
}

#[test]
fn missing_fields_are_named() {
    audit_with_set(&six("{kind: plain-steel}"))
        .code(2)
        .stderr(predicate::str::contains("set.yaml:4:"))
        .stderr(predicate::str::contains("has no `diameter`"));
    audit_with_set(&six("{mass: 1.2g}"))
        .code(2)
        .stderr(predicate::str::contains("needs the `length`"));
    audit_with_set(&six("{diameter: 0.012in}"))
        .code(2)
        .stderr(predicate::str::contains(
            "neither its kind nor its linear density",
        ));
    audit_with_set("courses:\n  - strings: [{kind: plain-steel, diameter: 0.012in}]\n")
        .code(2)
        .stderr(predicate::str::contains("name"));
}

#[test]
fn wrong_combinations_and_unknown_ids_are_refused() {
    audit_with_set(&six(
        "{kind: plain-steel, diameter: 0.012in, unit_mass: 0.6g/m}",
    ))
    .code(2)
    .stderr(predicate::str::contains("not several"));
    audit_with_set(&six("{kind: plain-stel, diameter: 0.012in}"))
        .code(2)
        .stderr(predicate::str::contains("did you mean `plain-steel`"));
    audit_with_set(&six("{unit_mass: 0.6g/m, material: unobtainium}"))
        .code(2)
        .stderr(predicate::str::contains("courses[0].strings[0].material"));
    audit_with_set(&six(
        "{kind: phosphor-bronze-wound, diameter: 0.030in, core_diameter: 0.040in}",
    ))
    .code(2)
    .stderr(predicate::str::contains("core_diameter"))
    .stderr(predicate::str::contains("thinner than the whole string"));
}

#[test]
fn sets_that_do_not_match_the_instrument_point_at_the_set() {
    // Five courses for a six-course instrument.
    let five = six("{kind: plain-steel, diameter: 0.012in}")
        .lines()
        .take(8)
        .collect::<Vec<_>>()
        .join("\n");
    audit_with_set(&five)
        .code(2)
        .stderr(predicate::str::contains("set.yaml"))
        .stderr(predicate::str::contains("no strings for course 6"));
    // A pair where the instrument has a single string.
    audit_with_set(&six(
        "{kind: plain-steel, diameter: 0.012in}\n      - {kind: plain-steel, diameter: 0.012in}",
    ))
    .code(2)
    .stderr(predicate::str::contains("set.yaml:3:"))
    .stderr(predicate::str::contains("holds 2 string(s)"));
    // A course number the instrument does not have.
    audit_with_set(&format!(
        "{}  - course: 9\n    strings: [{{kind: plain-steel, diameter: 0.012in}}]\n",
        six("{kind: plain-steel, diameter: 0.012in}")
    ))
    .code(2)
    .stderr(predicate::str::contains("course 9 is not a course"));
}

#[test]
fn missing_and_empty_files_are_clear() {
    Command::cargo_bin("taut")
        .unwrap()
        .args([
            "audit",
            "examples/steel-guitar-12edo.yaml",
            "--set",
            "no/such/set.yaml",
        ])
        .assert()
        .code(2)
        .stderr(predicate::str::contains("no/such/set.yaml"));
    audit_with_set("# nothing\n")
        .code(2)
        .stderr(predicate::str::contains("empty"));
    audit_with_set("name: s\ncourses: []\n")
        .code(2)
        .stderr(predicate::str::contains("no courses"));
}
