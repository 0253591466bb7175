//! The one look of every report, the shared units and formats, and the warnings that say what to
//! do, checked through the binary.

use crate::common;

use crate::common::{bad_input, json, table, write_file};

fn joined(text: &str) -> String {
    text.split_whitespace().collect::<Vec<_>>().join(" ")
}

#[test]
fn plan_rows_lead_with_status_show_the_aim_a_stress_bar_and_a_gauge_line() {
    let text = table(&["plan", "guitar-19edo", "--length-unit", "in"]);
    let header = text.lines().nth(1).unwrap();
    assert!(header.starts_with("#  status"), "{text}");
    assert!(
        header.contains("aim") && header.contains("stress"),
        "{text}"
    );
    let first = text.lines().nth(3).unwrap();
    assert!(first.starts_with("1  ok"), "{text}");
    assert!(first.contains("75.0") && first.contains('▰'), "{text}");
    // The plan's own gauges, in thousandths of an inch, wound strings marked.
    let plan = json(&["plan", "guitar-19edo"]);
    let expected: Vec<String> = plan["courses"]
        .as_array()
        .unwrap()
        .iter()
        .map(|course| {
            let string = &course["strings"][0];
            let thou = common::number(&string["diameter_in"]) * 1000.0;
            let wound = if string["construction"] == "wound" {
                "w"
            } else {
                ""
            };
            if (thou - thou.round()).abs() < 0.05 {
                format!("{thou:.0}{wound}")
            } else {
                format!("{thou:.1}{wound}")
            }
        })
        .collect();
    let line = format!("Gauges (in/1000, w = wound): {}", expected.join(" "));
    assert!(text.contains(&line), "{line}\n{text}");
}

#[test]
fn statuses_read_danger_and_no_fit() {
    let danger = table(&["plan", "guitar-19edo", "--tuning", "12edo@A4=587.33"]);
    assert!(danger.lines().any(|l| l.contains("DANGER")), "{danger}");
    let fanned = table(&["plan", "fanned-8-just"]);
    assert!(
        fanned.lines().any(|l| l.starts_with("8  no fit")),
        "{fanned}"
    );
}

#[test]
fn every_report_takes_the_same_units_and_formats() {
    for args in [
        vec!["plan", "steel-guitar-12edo"],
        vec!["audit", "steel-guitar-12edo", "--set", "steel-guitar-set"],
        vec![
            "convert",
            "steel-guitar-12edo",
            "--set",
            "steel-guitar-set",
            "--to-instrument",
            "baritone-guitar",
        ],
        vec!["lengths", "psaltery-layout"],
    ] {
        let mut lbf = args.clone();
        lbf.extend(["--force-unit", "lbf", "--length-unit", "in"]);
        let text = table(&lbf);
        assert!(text.contains("lbf"), "{lbf:?}\n{text}");
        assert!(text.contains("in/1000"), "{lbf:?}\n{text}");
        let mut csv = args.clone();
        csv.extend(["--format", "csv"]);
        let header = table(&csv).lines().next().unwrap().to_string();
        for field in [
            "course",
            "pitch",
            "pitch_hz",
            "kind",
            "diameter_mm",
            "tension_n",
            "length_m",
            "stress_ratio",
        ] {
            assert!(
                header.split(',').any(|f| f == field),
                "{csv:?} lacks {field}: {header}"
            );
        }
        for format in ["yaml", "json"] {
            let mut formatted = args.clone();
            formatted.extend(["--format", format]);
            let out = table(&formatted);
            assert!(out.contains("tension_n"), "{formatted:?}:\n{out}");
        }
    }
    // Audit's CSV has the length column; convert shows Hz.
    let csv = table(&[
        "audit",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--format",
        "csv",
    ]);
    assert!(csv.lines().next().unwrap().contains("length_m"), "{csv}");
    assert_eq!(csv.lines().count(), 7, "{csv}");
    let convert = table(&[
        "convert",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--scale-length",
        "26in",
    ]);
    let header = convert.lines().find(|line| line.starts_with('#')).unwrap();
    assert!(header.contains("Hz"), "{convert}");
}

#[test]
fn csv_numbers_carry_no_float_noise() {
    for args in [
        vec!["plan", "steel-guitar-12edo", "--format", "csv"],
        vec![
            "audit",
            "steel-guitar-12edo",
            "--set",
            "steel-guitar-set",
            "--format",
            "csv",
        ],
        vec!["lengths", "psaltery-layout", "--format", "csv"],
        vec!["tuning", "show", "31edo", "--format", "csv"],
    ] {
        let text = table(&args);
        for cell in text.split([',', '\n']) {
            if cell.parse::<f64>().is_ok() {
                let digits = cell.chars().filter(char::is_ascii_digit).count();
                assert!(digits <= 12, "{args:?}: `{cell}`");
            }
        }
        // 25.5 in is 0.6477 m, not 0.6476999999999999.
        if args[0] == "plan" || args[0] == "audit" {
            assert!(text.contains(",0.6477,"), "{text}");
        }
    }
}

#[test]
fn forces_accept_what_people_write() {
    let lb = json(&["plan", "guitar-19edo", "--tension", "16 lb"]);
    let lbf = json(&["plan", "guitar-19edo", "--tension", "16lbf"]);
    let lbs = json(&["plan", "guitar-19edo", "--tension", "16lbs"]);
    assert_eq!(lb["total_tension_n"], lbf["total_tension_n"]);
    assert_eq!(lbs["total_tension_n"], lbf["total_tension_n"]);
}

#[test]
fn warnings_end_with_their_fix() {
    // A plain string near its breaking pitch: no plain gauge lowers its stress.
    let text = joined(&table(&[
        "plan",
        "guitar-19edo",
        "--tuning",
        "12edo@A4=587.33",
    ]));
    assert!(text.contains("no plain gauge helps"), "{text}");
    // A plain string tuned above its breaking pitch: no gauge helps.
    let above = joined(&table(&[
        "plan",
        "guitar-19edo",
        "--tuning",
        "12edo@A4=700",
    ]));
    assert!(
        above.contains("no gauge helps, since a plain string's breaking pitch depends only on its length and material"),
        "{above}"
    );
    assert!(
        text.contains("a shorter length, a stronger material or a wound string"),
        "{text}"
    );
    // Thicker than the catalog on the fanned bass course: a wound kind or a longer length.
    let folder = tempfile::tempdir().unwrap();
    let heavy = write_file(
        folder.path(),
        "heavy.yaml",
        "name: Heavy\nscale_length: 300mm\ndefaults: {kinds: [plain-steel], tension: 150N}\ncourses:\n  - {pitch: E2}\n",
    );
    let report = json(&["plan", heavy.to_str().unwrap()]);
    let messages: Vec<&str> = report["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .map(|w| w["message"].as_str().unwrap())
        .collect();
    assert!(
        messages
            .iter()
            .any(|m| m.contains("a wound kind") && m.contains("longer length")),
        "{messages:?}"
    );
    // Slack: a heavier gauge or a wound kind.
    let slack = write_file(
        folder.path(),
        "slack.yaml",
        "name: Slack\nscale_length: 648mm\ndefaults: {kinds: [plain-steel], tension: {target: 70N, min: 60N, max: 90N}, max_diameter: 0.3mm}\ncourses:\n  - {pitch: E2}\n",
    );
    let text = joined(&table(&["plan", slack.to_str().unwrap()]));
    assert!(text.contains("a heavier gauge or a wound kind"), "{text}");
}

#[test]
fn small_defects_stay_fixed() {
    // No "-0%" in a change column.
    let audit = table(&["audit", "steel-guitar-12edo", "--set", "steel-guitar-set"]);
    assert!(!audit.contains("-0%") && !audit.contains("+0%"), "{audit}");
    // A load caution is listed among the warnings, never followed by "No warnings.".
    let convert = table(&[
        "convert",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--tension",
        "70N",
    ]);
    assert!(!convert.contains("No warnings."), "{convert}");
    assert!(convert.contains("Warnings ("), "{convert}");
    // Strings on added courses are counted as new, not as replaced.
    let folder = tempfile::tempdir().unwrap();
    let seven = std::fs::read_to_string("examples/steel-guitar-12edo.yaml")
        .unwrap()
        .replace("name: Steel-string guitar", "name: Seven-string guitar")
        + "  - {course: 7, pitch: B1, kinds: [phosphor-bronze-wound]}\n";
    let seven = write_file(folder.path(), "seven.yaml", &seven);
    let text = table(&[
        "convert",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--to-instrument",
        seven.to_str().unwrap(),
    ]);
    assert!(text.contains("1 new on added courses"), "{text}");
    // The user's spelling of a note is kept.
    let flat = write_file(
        folder.path(),
        "flat.yaml",
        "name: Flat\nscale_length: 400mm\ndefaults: {kinds: [plain-steel], tension: 60N}\ncourses:\n  - {pitch: Bb4}\n",
    );
    let text = table(&["plan", flat.to_str().unwrap()]);
    assert!(text.contains("Bb4") && !text.contains("A#4"), "{text}");
    let found = table(&["tuning", "find", "12edo", "Bb4"]);
    assert!(!found.contains("A#4"), "{found}");
    // A cents tuning has 1/1 at degree 0 and 2/1 at its period.
    let cents = json(&["tuning", "show", "cents:0,200,400,500,700"]);
    assert_eq!(cents["rows"][0]["ratio"], "1/1");
    assert_eq!(cents["rows"][5]["ratio"], "2/1");
}

#[test]
fn a_stress_just_above_a_limit_does_not_read_as_the_limit() {
    // Move the reference pitch until the top string sits between 65.0 % and 65.5 % of its
    // breaking strength (a plain string's stress grows with f², so bisection converges).
    let (mut low, mut high) = (400.0_f64, 520.0_f64);
    let mut found = None;
    for _ in 0..40 {
        let middle = (low + high) / 2.0;
        let reference = format!("12edo@A4={middle:.6}");
        let plan = json(&["plan", "steel-guitar-12edo", "--tuning", &reference]);
        let stress = common::number(&plan["courses"][0]["strings"][0]["stress_ratio"]);
        if stress > 0.650 && stress < 0.655 {
            found = Some(reference);
            break;
        }
        if stress <= 0.650 {
            low = middle;
        } else {
            high = middle;
        }
    }
    let reference = found.expect("a reference pitch with the top string just above 65 %");
    let text = joined(&table(&[
        "plan",
        "steel-guitar-12edo",
        "--tuning",
        &reference,
    ]));
    assert!(
        text.contains("of its breaking strength (limit 65%)"),
        "{text}"
    );
    assert!(
        !text.contains(" 65% of its breaking strength (limit 65%)"),
        "{text}"
    );
    assert!(text.contains("caution"), "{text}");
}

#[test]
fn description_is_read_everywhere_and_about_still_is() {
    let folder = tempfile::tempdir().unwrap();
    for key in ["description", "about"] {
        let instrument = write_file(
            folder.path(),
            &format!("{key}.yaml"),
            &format!(
                "name: X\n{key}: words\nscale_length: 648mm\ndefaults: {{kinds: [plain-steel], tension: 70N}}\ncourses:\n  - {{pitch: E4}}\n"
            ),
        );
        table(&["plan", instrument.to_str().unwrap()]);
        let tuning = write_file(
            folder.path(),
            &format!("t-{key}.yaml"),
            &format!("name: t\n{key}: words\ndivisions: 12\n"),
        );
        table(&["tuning", "show", tuning.to_str().unwrap()]);
    }
}

#[test]
fn every_shipped_example_loads_by_name_and_a_wrong_kind_is_named() {
    for name in [
        "guitar-19edo",
        "lever-harp-34",
        "psaltery-26",
        "fanned-8-just",
        "steel-guitar-12edo",
        "guitar-22edo-mode",
        "baritone-guitar",
    ] {
        table(&["plan", name]);
    }
    table(&["audit", "steel-guitar-12edo", "--set", "steel-guitar-set"]);
    table(&["lengths", "psaltery-layout"]);
    let set = bad_input(&["plan", "steel-guitar-set"]);
    assert!(
        set.contains("is a string-set file") && set.contains("taut audit"),
        "{set}"
    );
    let layout = bad_input(&["plan", "examples/psaltery-layout.yaml"]);
    assert!(
        layout.contains("is a layout file") && layout.contains("taut lengths"),
        "{layout}"
    );
    let instrument = bad_input(&["audit", "steel-guitar-12edo", "--set", "guitar-19edo"]);
    assert!(instrument.contains("is an instrument file"), "{instrument}");
}
