//! `taut plan --stock FILE`: strings from the user's own shelf, and bad stock files.

use crate::common::{bad_input, json, number, write_file};

const SHELF: &str = "\
# Three nylon monofilaments measured on the bench (demo data).
catalogs:
  - id: bench-nylon
    name: Nylon on the bench
    diameters: [0.62mm, 0.71mm, 0.81mm]
    source: measured with a micrometer (demo)
kinds:
  - id: bench-nylon
    name: Nylon from the bench
    plain: {material: nylon}
    catalog: bench-nylon
    source: demo
";

const ZITHER: &str = "\
name: Small zither
scale_length: 300mm
defaults:
  kinds: [bench-nylon]
  tension: 40N
courses:
  - pitch: C5
  - pitch: G4
";

#[test]
fn a_plan_chooses_from_the_stock_file_only_when_asked() {
    let folder = tempfile::tempdir().unwrap();
    let shelf = write_file(folder.path(), "shelf.yaml", SHELF);
    let zither = write_file(folder.path(), "zither.yaml", ZITHER);
    let plan = json(&[
        "plan",
        zither.to_str().unwrap(),
        "--stock",
        shelf.to_str().unwrap(),
    ]);
    let shelf_diameters = [0.62, 0.71, 0.81];
    for course in plan["courses"].as_array().unwrap() {
        let string = &course["strings"][0];
        assert_eq!(string["kind"], "bench-nylon");
        let diameter = number(&string["diameter_mm"]);
        assert!(
            shelf_diameters.iter().any(|d| (d - diameter).abs() < 1e-9),
            "{diameter} mm is not on the shelf"
        );
    }
    // Without the stock file the kind is unknown, and the message says where it is named.
    let stderr = bad_input(&["plan", zither.to_str().unwrap()]);
    assert!(
        stderr.contains("zither.yaml:4:") && stderr.contains("bench-nylon"),
        "{stderr}"
    );
}

#[test]
fn bad_stock_files_name_file_line_and_field() {
    let folder = tempfile::tempdir().unwrap();
    let zither = write_file(folder.path(), "zither.yaml", ZITHER);
    let zither = zither.to_str().unwrap();

    let misspelt = write_file(
        folder.path(),
        "misspelt.yaml",
        &SHELF.replace("catalogs:", "catalgos:"),
    );
    let stderr = bad_input(&["plan", zither, "--stock", misspelt.to_str().unwrap()]);
    assert!(
        stderr.contains("misspelt.yaml:2:") && stderr.contains("catalogs"),
        "{stderr}"
    );

    let negative = write_file(
        folder.path(),
        "negative.yaml",
        &SHELF.replace("0.71mm", "-0.71mm"),
    );
    let stderr = bad_input(&["plan", zither, "--stock", negative.to_str().unwrap()]);
    assert!(
        stderr.contains("negative.yaml:5:") && stderr.contains("greater than zero"),
        "{stderr}"
    );

    let taken = write_file(
        folder.path(),
        "taken.yaml",
        &SHELF.replace(
            "  - id: bench-nylon\n    name: Nylon from",
            "  - id: gut\n    name: Nylon from",
        ),
    );
    let stderr = bad_input(&["plan", zither, "--stock", taken.to_str().unwrap()]);
    assert!(
        stderr.contains("taken.yaml") && stderr.contains("`gut` is already defined"),
        "{stderr}"
    );

    let stderr = bad_input(&["plan", zither, "--stock", "no-such-shelf.yaml"]);
    assert!(stderr.contains("no-such-shelf.yaml"), "{stderr}");
}

const WEIGHED: &str = "\
# Two unmarked nylon strings from a drawer, measured and weighed (demo data).
kinds:
  - id: drawer-nylon
    name: Weighed nylon from the drawer
    measured:
      material: nylon
      strings:
        - {diameter: 0.80mm, mass: 0.52g, length: 900mm}
        - {diameter: 1.00mm, unit_mass: 0.90g/m}
    source: weighed on a kitchen scale (demo)
";

#[test]
fn weighed_strings_are_planned_with_their_measured_unit_mass() {
    let folder = tempfile::tempdir().unwrap();
    let drawer = write_file(folder.path(), "drawer.yaml", WEIGHED);
    let zither = write_file(
        folder.path(),
        "zither.yaml",
        &ZITHER.replace("bench-nylon", "drawer-nylon"),
    );
    let plan = json(&[
        "plan",
        zither.to_str().unwrap(),
        "--stock",
        drawer.to_str().unwrap(),
    ]);
    for course in plan["courses"].as_array().unwrap() {
        let string = &course["strings"][0];
        assert_eq!(string["construction"], "measured");
        assert_eq!(string["material"], "nylon");
        let mu = number(&string["unit_mass_kg_per_m"]);
        // μ = m/l for the weighed piece (OpenStax University Physics Vol. 1 eq. 16.7), or as given.
        let weighed = 0.52e-3 / 0.900;
        assert!(
            (mu - weighed).abs() < 1e-12 || (mu - 0.90e-3).abs() < 1e-12,
            "{mu}"
        );
        // Taylor/Mersenne: T = μ(2Lf)² (OpenStax University Physics Vol. 1 §16.3).
        let expected = mu * (2.0 * 0.300 * number(&string["pitch_hz"])).powi(2);
        assert!((number(&string["tension_n"]) - expected).abs() < 1e-9 * expected);
    }
}

#[test]
fn measured_kinds_need_a_density_or_a_weighed_piece() {
    let folder = tempfile::tempdir().unwrap();
    let zither = write_file(
        folder.path(),
        "zither.yaml",
        &ZITHER.replace("bench-nylon", "drawer-nylon"),
    );
    let half = write_file(
        folder.path(),
        "half.yaml",
        &WEIGHED.replace("mass: 0.52g, length: 900mm", "mass: 0.52g"),
    );
    let stderr = bad_input(&[
        "plan",
        zither.to_str().unwrap(),
        "--stock",
        half.to_str().unwrap(),
    ]);
    assert!(
        stderr.contains("half.yaml:8:") && stderr.contains("weighed piece"),
        "{stderr}"
    );
}

#[test]
fn lengths_audit_and_convert_take_stock_files_too() {
    let folder = tempfile::tempdir().unwrap();
    let drawer = write_file(folder.path(), "drawer.yaml", WEIGHED);
    let drawer = drawer.to_str().unwrap();
    let layout = json(&[
        "lengths",
        "--pitch",
        "C5",
        "--string",
        "{kind: drawer-nylon, diameter: 0.80mm}",
        "--tension",
        "40N",
        "--stock",
        drawer,
    ]);
    let course = &layout["courses"][0];
    // L = √(T/μ)/(2f), Mersenne's law solved for the length (OpenStax University Physics Vol. 1 §16.3).
    let mu: f64 = 0.52e-3 / 0.900;
    let expected = (40.0 / mu).sqrt() / (2.0 * number(&course["pitch_hz"]));
    assert!(
        (number(&course["length_m"]) - expected).abs() < 1e-9,
        "{course}"
    );

    let zither = write_file(
        folder.path(),
        "zither.yaml",
        &ZITHER.replace("bench-nylon", "drawer-nylon"),
    );
    let set = write_file(
        folder.path(),
        "set.yaml",
        "name: Drawer strings\ncourses:\n  - course: 1\n    strings: [{kind: drawer-nylon, diameter: 0.80mm}]\n  - course: 2\n    strings: [{kind: drawer-nylon, diameter: 1.00mm}]\n",
    );
    for command in ["audit", "convert"] {
        let report = json(&[
            command,
            zither.to_str().unwrap(),
            "--set",
            set.to_str().unwrap(),
            "--stock",
            drawer,
        ]);
        assert!(
            report["courses"].as_array().is_some_and(|c| c.len() == 2),
            "{report}"
        );
        // Without the stock file the set names a kind nobody knows.
        let stderr = bad_input(&[
            command,
            zither.to_str().unwrap(),
            "--set",
            set.to_str().unwrap(),
        ]);
        assert!(
            stderr.contains("set.yaml:4:")
                && stderr.contains("courses[0].strings[0].kind")
                && stderr.contains("drawer-nylon"),
            "{stderr}"
        );
    }
}
