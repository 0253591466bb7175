//! Levers and pedals (issue 22, point 2), through the binary: where a stop grips the string
//! (the fret rule), a course safe when open that breaks when pulled up, the load at the worst
//! setting, the keys a lever harp reaches, every output format, and bad raises.

use serde_json::Value;

use crate::common::{bad_input, json, number, taut, write_file};

/// A one-course instrument with `raises`, at 648 mm.
fn one_course(string: &str, tension: &str, raises: &str) -> String {
    format!(
        "name: Lever test\ntuning: 12edo\ncourses:\n  - pitch: E4\n    scale_length: 648mm\n    tension: {tension}\n    string: {string}\n    raises: {raises}\n"
    )
}

fn plan_of(text: &str) -> Value {
    let folder = tempfile::tempdir().unwrap();
    let path = write_file(folder.path(), "instrument.yaml", text);
    json(&["plan", path.to_str().unwrap()])
}

#[test]
fn a_semitone_lever_stops_where_the_first_fret_sits() {
    let plan = plan_of(&one_course(
        "{kind: plain-steel, diameter: 0.010in}",
        "70N",
        "{lever: 1 step}",
    ));
    let lever = &plan["courses"][0]["positions"][1];
    assert_eq!(lever["position"], "lever");
    let stop_mm = number(&lever["stop_from_nut_m"]) * 1000.0;
    // The fret rule x = L·(1 − 2^(−1/12)) for 12-EDO (REFERENCES §8.1): on 648 mm, fret 1 at
    // 36.3694 mm, the check value of the shared fret table (derived from the 12-EDO ratio).
    assert!((stop_mm - 36.3694).abs() < 0.01, "{stop_mm}");
    assert!((stop_mm - 648.0 * (1.0 - 2f64.powf(-1.0 / 12.0))).abs() < 0.01);
    // The lever sounds a 12-EDO semitone up: F4 = 349.2282 Hz (REFERENCES §7.2).
    assert!((number(&lever["pitch_hz"]) - 349.2282).abs() < 1e-3);
    // A stop leaves the tension and stress of the open string (Mersenne's first law, §1.1).
    let open = &plan["courses"][0]["strings"][0];
    assert!((number(&lever["tension_n"]) / number(&open["tension_n"]) - 1.0).abs() < 1e-12);
    assert!((number(&lever["length_m"]) - 0.648 * 2f64.powf(-1.0 / 12.0)).abs() < 1e-9);
}

#[test]
fn a_course_safe_open_but_breaking_when_pulled_up_is_flagged_at_that_position() {
    let string = "{kind: plain-steel, diameter: 0.012in}";
    let open = plan_of(&one_course(string, "90N", "{lever: 4 steps}"));
    let open_stress = number(&open["courses"][0]["strings"][0]["stress_ratio"]);
    let caution = number(&open["caution_stress_ratio"]);
    let danger = number(&open["danger_stress_ratio"]);
    // The same string stopped four steps up: the tension stays, so nothing fires.
    assert!(open_stress <= caution, "{open_stress}");
    assert!(open["warnings"].as_array().unwrap().is_empty());
    let pulled = plan_of(&one_course(string, "90N", "{lever: 4 steps, action: pull}"));
    let lever = &pulled["courses"][0]["positions"][1];
    // T = μ(2Lf)² at fixed L: four 12-EDO steps multiply it by 2^(8/12) (REFERENCES §1.2, §7.2).
    let factor = 2f64.powf(8.0 / 12.0);
    assert!((number(&lever["stress_ratio"]) / (open_stress * factor) - 1.0).abs() < 1e-9);
    assert!(
        open_stress * factor > danger,
        "the case must break when pulled up"
    );
    let warnings = pulled["courses"][0]["warnings"].as_array().unwrap();
    let flagged = warnings
        .iter()
        .find(|w| w["kind"] == "stress_danger")
        .expect("a danger at the raised position");
    assert!(flagged["message"]
        .as_str()
        .unwrap()
        .contains("lever position"));
    assert_eq!(flagged["severity"], "danger");
    // The table says so with the cautions.
    let folder = tempfile::tempdir().unwrap();
    let path = write_file(
        folder.path(),
        "i.yaml",
        &one_course(string, "90N", "{lever: 4 steps, action: pull}"),
    );
    let out = taut().arg("plan").arg(&path).output().unwrap();
    let text = String::from_utf8(out.stdout).unwrap();
    assert!(
        text.contains("DANGER") && text.contains("eye protection"),
        "{text}"
    );
}

#[test]
fn the_total_at_the_worst_setting_counts_every_pedal_at_its_heaviest() {
    let text = "name: Pedal test\ntuning: 12edo\nrated_load: 125N\ndefaults:\n  tension: 60N\n  kinds: [plain-steel]\ncourses:\n  - {pitch: C4, scale_length: 600mm, raises: {pedal: {flat: -1 step, natural: 0 steps, sharp: 1 step}, action: pull}}\n  - {pitch: D4, scale_length: 560mm, raises: {lever: 1 step}}\n";
    let plan = plan_of(text);
    let courses = plan["courses"].as_array().unwrap();
    let open: Vec<f64> = courses
        .iter()
        .map(|c| number(&c["strings"][0]["tension_n"]))
        .collect();
    // Worst: the pedal pulled a 12-EDO semitone up (T × 2^(2/12)), the lever's stop unchanged.
    let expected = open[0] * 2f64.powf(2.0 / 12.0) + open[1];
    assert!((number(&plan["worst_setting_total_n"]) / expected - 1.0).abs() < 1e-12);
    // Inside the rating when open, over it at the worst setting: a danger that says so.
    assert!(number(&plan["total_tension_n"]) < 125.0 && expected > 125.0);
    let load = plan["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .find(|w| w["kind"] == "over_rated_load")
        .expect("the rated load at the worst setting");
    assert!(load["message"]
        .as_str()
        .unwrap()
        .contains("heaviest setting"));
    // The pedal's flat is a pull downwards: its tension is the lowest, T × 2^(−2/12).
    let flat = &courses[0]["positions"][0];
    assert!((number(&flat["tension_n"]) / (open[0] * 2f64.powf(-2.0 / 12.0)) - 1.0).abs() < 1e-12);
}

#[test]
fn a_lever_harp_tuned_in_e_flat_reaches_eight_keys() {
    // Common practice: a lever harp tuned in E-flat major, a semitone lever on every string,
    // plays from three flats to four sharps: E-flat, B-flat, F, C, G, D, A and E major.
    let mut text = String::from(
        "name: Small lever harp\ntuning: 12edo\ndefaults:\n  kinds: [nylon]\n  tension: 60N\n  raises: {lever: 1 step}\ncourses:\n",
    );
    for (pitch, length) in [
        ("F5", 280),
        ("Eb5", 300),
        ("D5", 320),
        ("C5", 340),
        ("Bb4", 360),
        ("Ab4", 380),
        ("G4", 400),
        ("F4", 420),
        ("Eb4", 440),
    ] {
        text.push_str(&format!(
            "  - {{pitch: {pitch}, scale_length: {length}mm}}\n"
        ));
    }
    let plan = plan_of(&text);
    let keys: Vec<&str> = plan["reachable_keys"]
        .as_array()
        .unwrap()
        .iter()
        .map(|k| k.as_str().unwrap())
        .collect();
    let mut expected = [
        "Eb major", "Bb major", "F major", "C major", "G major", "D major", "A major", "E major",
    ];
    let mut found = keys.clone();
    found.sort_unstable();
    expected.sort_unstable();
    assert_eq!(found, expected);
}

#[test]
fn positions_show_in_every_format() {
    let text = one_course(
        "{kind: plain-steel, diameter: 0.010in}",
        "70N",
        "{pedal: {natural: 1 step, sharp: 2 steps}}",
    );
    let folder = tempfile::tempdir().unwrap();
    let path = write_file(folder.path(), "i.yaml", &text);
    let run = |format: &str| {
        let out = taut()
            .arg("plan")
            .arg(&path)
            .args(["--format", format])
            .output()
            .unwrap();
        assert!(out.status.success());
        String::from_utf8(out.stdout).unwrap()
    };
    let table = run("table");
    assert!(
        table.contains("Levers and pedals") && table.contains("sharp (2 steps)"),
        "{table}"
    );
    assert!(table.lines().all(|line| line.chars().count() <= 100));
    let from_json: Value = serde_json::from_str(&run("json")).unwrap();
    let from_yaml: Value = taut::input::yaml::parse(&run("yaml"), "yaml").unwrap();
    assert_eq!(
        from_yaml["courses"][0]["positions"],
        from_json["courses"][0]["positions"]
    );
    let csv = run("csv");
    assert!(csv.starts_with("course,string,interval,pitch,kind,gauge,position,"));
    assert_eq!(csv.lines().count(), 1 + 3, "{csv}");
    assert!(!csv.contains("NaN") && !csv.contains("inf"));
}

#[test]
fn bad_raises_are_refused_with_file_line_and_field() {
    let string = "{kind: plain-steel, diameter: 0.010in}";
    for (raises, field, words) in [
        (
            "{lever: 1 step, pedal: {sharp: 2 steps}}",
            "raises",
            "either a `lever` or a `pedal`",
        ),
        ("{lever: 1 stp}", "raises.lever", ""),
        ("{lever: 99 steps}", "raises.lever", "more than 24 steps"),
        ("{lever: 1 step, action: push}", "raises.action", ""),
        ("{lever: 1 step, zzz: 1}", "raises", "zzz"),
        (
            "{pedal: {flat: -1 step}}",
            "raises",
            "below the open string",
        ),
    ] {
        let folder = tempfile::tempdir().unwrap();
        let path = write_file(folder.path(), "i.yaml", &one_course(string, "70N", raises));
        let stderr = bad_input(&["plan", path.to_str().unwrap()]);
        assert!(
            stderr.contains("i.yaml:") && stderr.contains(&format!("`courses[0].{field}")),
            "{raises}: {stderr}"
        );
        assert!(stderr.contains(words), "{raises}: {stderr}");
    }
}
