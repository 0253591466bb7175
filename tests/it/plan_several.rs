//! One set for several tunings (`taut plan` with several `--tuning`s or the file's `variants`):
//! one tuning gives today's plan exactly, a hand-computed whole-tone case, conflicts named with
//! their course and tunings, the saved set, the table's width and bad input.

use crate::common;

use approx::assert_relative_eq;
use serde_json::Value;
use taut::input::units::METRES_PER_INCH;
use taut::instrument::Instrument;
use taut::plan::several::{self, variants};
use taut::plan::solve;
use taut::strings::select::several::Balance;
use taut::strings::stock::Stock;

use crate::common::{bad_input, number, write_file};

// Pitches: 12-TET at A4 = 440 Hz (ISO 16:1975; REFERENCES §7.2, DERIVED values).
const D4: f64 = 293.664_8;
const E4: f64 = 329.627_6;
const A3: f64 = 220.0;

/// Every example file that is an instrument (sets and layouts are skipped).
fn example_instruments() -> Vec<(String, Instrument)> {
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("examples");
    let mut out = Vec::new();
    for entry in std::fs::read_dir(root).unwrap() {
        let path = entry.unwrap().path();
        let spec = path.to_string_lossy().to_string();
        if let Ok(instrument) = Instrument::load(&spec) {
            out.push((spec, instrument));
        }
    }
    assert!(out.len() >= 7, "examples went missing: {}", out.len());
    out
}

#[test]
fn one_tuning_gives_exactly_todays_plan_on_every_example() {
    let stock = Stock::builtin().unwrap();
    for (spec, instrument) in example_instruments() {
        // Each tuning of the example's list on its own (just the file's tuning for most).
        let list = variants::resolve(&instrument, &[], "--tuning").unwrap();
        for variant in &list {
            let alone = several::solve(
                &instrument,
                std::slice::from_ref(variant),
                stock,
                None,
                Balance::Target,
            );
            let fixes_a_string = instrument
                .courses
                .iter()
                .any(|c| c.string.is_some() || c.strings.iter().any(|s| s.string.is_some()));
            if fixes_a_string {
                // Fixed strings are refused for several tunings, by name and line.
                let err = alone.unwrap_err().to_string();
                assert!(err.contains("fixed string"), "{spec}: {err}");
                continue;
            }
            let alone = alone.unwrap();
            let today = solve::solve(&variant.instrument, &variant.tuning, stock, None).unwrap();
            assert_eq!(alone.tunings.len(), 1);
            // The block also keeps the tuning as written, which a plan solved from a tuning
            // alone cannot know; everything else is today's plan.
            let mut block = alone.tunings[0].plan.clone();
            assert_eq!(block.tuning_spec.as_deref(), Some(variant.spec.as_str()));
            block.tuning_spec = None;
            assert_eq!(block, today, "{spec}, {}", variant.name);
        }
    }
}

#[test]
fn one_tuning_through_the_command_line_prints_todays_plan() {
    // `--tuning` once keeps the single-tuning report: the same JSON text as the library's plan.
    let output = common::taut()
        .args([
            "plan",
            "guitar-19edo",
            "--tuning",
            "19edo",
            "--format",
            "json",
        ])
        .output()
        .unwrap();
    let instrument = Instrument::load("guitar-19edo").unwrap();
    let plan = solve::plan(
        &instrument,
        Stock::builtin().unwrap(),
        &solve::SolveOptions::default(),
    )
    .unwrap();
    let expected = serde_json::to_string_pretty(&plan).unwrap() + "\n";
    assert_eq!(String::from_utf8(output.stdout).unwrap(), expected);
}

fn one_plain_course(length: &str, tension: &str, variants: &str) -> String {
    format!(
        "name: test\nscale_length: {length}\ndefaults:\n  kinds: [plain-steel]\n  tension: {tension}\ncourses:\n  - {{course: 1, pitch: E4}}\nvariants:\n{variants}"
    )
}

fn plan_json(folder: &std::path::Path, text: &str) -> Value {
    let path = write_file(folder, "instrument.yaml", text);
    common::json(&["plan", path.to_str().unwrap()])
}

#[test]
fn a_whole_tone_apart_gets_the_gauge_with_the_smallest_worst_deviation() {
    let folder = tempfile::tempdir().unwrap();
    let json = plan_json(
        folder.path(),
        &one_plain_course(
            "648mm",
            "{target: 70N, min: 50N, max: 100N}",
            "  - {name: high, pitches: {1: E4}}\n  - {name: low, pitches: {1: D4}}\n",
        ),
    );
    // By hand: T = μ(2Lf)² (Mersenne/Taylor; OpenStax University Physics Vol. 1, §16.3 wave
    // speed v = √(T/μ) and §16.6 standing waves f = v/2L), with μ = ρπd²/4 for a round wire,
    // ρ = 7850 kg/m³ (REFERENCES §2, handbook density of carbon steel). Over the plain inch grid
    // (common practice: half-thousandths to 0.0135 in, thousandths above), the gauge whose worse
    // deviation from 70 N over E4 and D4 is smallest.
    let length = 0.648;
    let grid = [
        0.007, 0.0075, 0.008, 0.0085, 0.009, 0.0095, 0.010, 0.0105, 0.011, 0.0115, 0.012, 0.0125,
        0.013, 0.0135, 0.014, 0.015, 0.016, 0.017, 0.018, 0.019, 0.020, 0.022, 0.024, 0.026,
    ];
    let mu = |inches: f64| {
        let d = inches * METRES_PER_INCH;
        7850.0 * std::f64::consts::PI * d * d / 4.0
    };
    let tension = |inches: f64, f: f64| mu(inches) * (2.0 * length * f).powi(2);
    let worst = |inches: f64| {
        [E4, D4]
            .iter()
            .map(|&f| (tension(inches, f) / 70.0 - 1.0).abs())
            .fold(0.0, f64::max)
    };
    let best = grid
        .iter()
        .copied()
        .min_by(|a, b| worst(*a).partial_cmp(&worst(*b)).unwrap())
        .unwrap();
    // The ideal μ is the harmonic mean of the two the target asks for, which puts both
    // tensions (r−1)/(r+1) = 11.5 % from the target, r = (E4/D4)² = 2^(4/12) (a 12-EDO whole
    // tone); the catalog step adds a little.
    let r = (E4 / D4).powi(2);
    assert_relative_eq!((r - 1.0) / (r + 1.0), 0.1150, max_relative = 1e-3);
    assert!(worst(best) >= (r - 1.0) / (r + 1.0));
    // By hand: μ* = 2·70 N / ((2·0.648·329.63)² + (2·0.648·293.66)²) = 4.277e-4 kg/m, a
    // 0.01037 in wire; of its neighbours 0.010 in gives 72.6 N / 57.6 N (worst −17.7 %) and
    // 0.0105 in gives 80.0 N / 63.5 N (worst +14.3 %).
    assert_eq!(best, 0.0105, "the hand computation itself");
    assert_relative_eq!(worst(best), 0.1433, max_relative = 2e-3);
    let blocks = json["tunings"].as_array().unwrap();
    assert_eq!(blocks.len(), 2);
    for (block, f) in blocks.iter().zip([E4, D4]) {
        let string = &block["courses"][0]["strings"][0];
        assert_relative_eq!(number(&string["diameter_in"]), best, max_relative = 1e-9);
        assert_relative_eq!(number(&string["pitch_hz"]), f, max_relative = 1e-6);
        // Both tunings' figures obey T = μ(2Lf)² with the handbook μ.
        assert_relative_eq!(
            number(&string["tension_n"]),
            tension(best, f),
            max_relative = 1e-6
        );
    }
    let shared = &json["courses"][0]["strings"][0];
    // 11.7 % is past the ±10 % tolerance, but both tensions are inside the 50–100 N window.
    assert_eq!(shared["agreement"], "serves");
    assert_relative_eq!(
        number(&shared["worst_deviation"]),
        worst(best),
        max_relative = 1e-5
    );
    assert_eq!(shared["slackest_variant"], "low");
    assert_eq!(shared["most_stressed_variant"], "high");
    assert_eq!(json["all_tunings_served"], true);
    assert!(json["conflicts"].as_array().unwrap().is_empty());
}

#[test]
fn the_stress_rule_takes_the_lower_worst_stress() {
    let folder = tempfile::tempdir().unwrap();
    let path = write_file(
        folder.path(),
        "i.yaml",
        &one_plain_course(
            "648mm",
            "{target: 70N, min: 40N, max: 110N}",
            "  - {name: high, pitches: {1: E4}}\n  - {name: low, pitches: {1: D4}}\n",
        ),
    );
    let path = path.to_str().unwrap();
    let by_target = common::json(&["plan", path]);
    let by_stress = common::json(&["plan", path, "--balance", "stress"]);
    assert_eq!(by_stress["balance"], "stress");
    let worst = |json: &Value| number(&json["courses"][0]["strings"][0]["highest_stress_ratio"]);
    assert!(worst(&by_stress) <= worst(&by_target));
    // ASTM A228 strength falls as the wire thickens, so at one pitch a thinner plain wire runs
    // at a lower share of its strength (σ = ρ(2Lf)²/S_ut for a solid wire; REFERENCES §1.2).
    let gauge =
        |json: &Value| number(&json["tunings"][0]["courses"][0]["strings"][0]["diameter_in"]);
    assert!(gauge(&by_stress) < gauge(&by_target));
}

#[test]
fn a_fifth_apart_near_the_breaking_pitch_is_a_named_conflict() {
    let folder = tempfile::tempdir().unwrap();
    // 800 mm puts E4 near the danger line for plain steel (stress ∝ (Lf)², independent of the
    // gauge but for the strength curve); a fifth down asks for 1/2.25 the tension, wider than
    // the 50–100 N window allows.
    let text = one_plain_course(
        "800mm",
        "{target: 70N, min: 50N, max: 100N}",
        "  - {name: low, pitches: {1: A3}}\n  - {name: high, pitches: {1: E4}}\n",
    );
    let json = plan_json(folder.path(), &text);
    assert_eq!(json["all_tunings_served"], false);
    let conflicts = json["conflicts"].as_array().unwrap();
    assert_eq!(conflicts.len(), 1);
    let conflict = &conflicts[0];
    assert_eq!(conflict["course"], 1);
    assert_eq!(conflict["string"], 1);
    assert_eq!(conflict["conflicting_pairs"][0][0], "low");
    assert_eq!(conflict["conflicting_pairs"][0][1], "high");
    let message = conflict["message"].as_str().unwrap();
    assert!(message.contains("Course 1 string 1"), "{message}");
    assert!(message.contains("`low` and `high`"), "{message}");
    assert_eq!(json["courses"][0]["strings"][0]["agreement"], "conflict");
    // The compromise's cost is stated with its figures: here it sits inside the window in one
    // tuning and outside it in the other (T_high/T_low = (E4/A3)² = 2.245 > 100/50).
    let low = &json["tunings"][0]["courses"][0]["strings"][0];
    let high = &json["tunings"][1]["courses"][0]["strings"][0];
    let ratio = number(&high["tension_n"]) / number(&low["tension_n"]);
    assert_relative_eq!(ratio, (E4 / A3).powi(2), max_relative = 1e-6);
    assert!(number(&low["tension_n"]) < 50.0 || number(&high["tension_n"]) > 100.0);
    assert!(!conflict["costs"].as_array().unwrap().is_empty());
    // The table says so too, and never that every string serves.
    let path = write_file(folder.path(), "i.yaml", &text);
    let table = common::table(&["plan", path.to_str().unwrap()]);
    assert!(table.contains("CONFLICT"), "{table}");
    assert!(table.contains("Conflicts (1)"), "{table}");
    assert!(!table.contains("Every string serves"), "{table}");
    assert!(table.contains("Before you string this up"), "{table}");
}

#[test]
fn a_tuning_past_the_breaking_pitch_is_named_as_unservable() {
    let folder = tempfile::tempdir().unwrap();
    // 900 mm: E4 on plain steel runs above 85 % of its breaking strength whatever the gauge.
    let json = plan_json(
        folder.path(),
        &one_plain_course(
            "900mm",
            "{target: 70N, min: 30N, max: 150N}",
            "  - {name: low, pitches: {1: A3}}\n  - {name: high, pitches: {1: E4}}\n",
        ),
    );
    let conflict = &json["conflicts"][0];
    assert_eq!(conflict["unservable"][0], "high");
    let message = conflict["message"].as_str().unwrap();
    assert!(message.contains("`high` even on its own"), "{message}");
    assert!(message.contains("breaking strength"), "{message}");
    let stress = number(&json["tunings"][1]["courses"][0]["strings"][0]["stress_ratio"]);
    assert!(stress > 0.85, "{stress}");
}

#[test]
fn several_tunings_on_the_command_line_name_each_block() {
    let json = common::json(&[
        "plan",
        "examples/steel-guitar-12edo.yaml",
        "--tuning",
        "12edo",
        "--tuning",
        "12edo@A4=415hz",
    ]);
    let blocks = json["tunings"].as_array().unwrap();
    assert_eq!(blocks[0]["variant"], "12edo");
    assert_eq!(blocks[1]["variant"], "12edo@A4=415hz");
    // Each block has every field of `taut plan`'s JSON.
    let plan = common::json(&["plan", "examples/steel-guitar-12edo.yaml"]);
    for key in plan.as_object().unwrap().keys() {
        assert!(blocks[1].get(key).is_some(), "block lacks `{key}`");
    }
    // The same string is on each course in every tuning.
    let gauges = |block: &Value| -> Vec<Value> {
        block["courses"]
            .as_array()
            .unwrap()
            .iter()
            .map(|course| course["strings"][0]["gauge"].clone())
            .collect()
    };
    assert_eq!(gauges(&blocks[0]), gauges(&blocks[1]));
    assert_eq!(gauges(&blocks[0]).len(), 6);
}

#[test]
fn the_table_fits_100_columns_and_csv_yaml_and_the_saved_set_work() {
    let folder = tempfile::tempdir().unwrap();
    let mut args = vec!["plan", "guitar-19edo"];
    for tuning in [
        "19edo", "12edo", "22edo", "31edo", "17edo", "24edo", "41edo",
    ] {
        args.extend(["--tuning", tuning]);
    }
    let table = common::table(&args);
    for line in table
        .lines()
        .filter(|l| l.starts_with(['│', '┌', '└', '╞']))
    {
        assert!(line.chars().count() <= 100, "too wide: {line}");
    }
    for letter in ["A", "G"] {
        assert!(table.contains(&format!("  {letter}  ")), "{table}");
    }
    let csv = common::table(&[&args[..], &["--format", "csv"]].concat());
    let mut lines = csv.lines();
    assert!(lines
        .next()
        .unwrap()
        .starts_with("variant,agreement,course,string,"));
    assert_eq!(lines.count(), 7 * 6);
    let yaml = common::table(&[&args[..], &["--format", "yaml"]].concat());
    assert!(yaml.contains("all_tunings_served: true"), "{yaml}");
    let set = folder.path().join("set.yaml");
    common::table(&[
        "plan",
        "examples/guitar-three-tunings.yaml",
        "--save-set",
        set.to_str().unwrap(),
    ]);
    let text = std::fs::read_to_string(&set).unwrap();
    assert!(text.contains("standard, dropped, nineteen"), "{text}");
    // The saved set audits in the same three tunings, with a verdict per tuning.
    let audit = common::json(&[
        "audit",
        "examples/guitar-three-tunings.yaml",
        "--set",
        set.to_str().unwrap(),
    ]);
    assert_eq!(audit["tunings"].as_array().unwrap().len(), 3);
    assert_eq!(audit["courses_ok_in_every_tuning"], 6);
}

#[test]
fn bad_variants_name_file_line_and_field() {
    let folder = tempfile::tempdir().unwrap();
    let run = |text: &str| {
        let path = write_file(folder.path(), "bad.yaml", text);
        bad_input(&["plan", path.to_str().unwrap()])
    };
    let base = "name: t\nscale_length: 648mm\ndefaults: {kinds: [plain-steel], tension: 70N}\ncourses:\n  - {course: 1, pitch: E4}\nvariants:\n";
    let message = run(&format!(
        "{base}  - name: a\n  - name: b\n    pitches:\n      7: D4\n"
    ));
    assert!(message.contains("bad.yaml:10:"), "{message}");
    assert!(message.contains("variants[1].pitches.7"), "{message}");
    assert!(message.contains("course 7 is not a course"), "{message}");
    let message = run(&format!("{base}  - name: a\n  - name: a\n"));
    assert!(message.contains("bad.yaml:8:"), "{message}");
    assert!(message.contains("variants[1].name"), "{message}");
    let message = run(&format!(
        "{base}  - name: a\n  - name: b\n    tuning: 0edo\n"
    ));
    assert!(message.contains("bad.yaml:9:"), "{message}");
    assert!(message.contains("variants[1].tuning"), "{message}");
    let message = run(&format!(
        "{base}  - name: a\n  - name: b\n    pitches:\n      1: Q9\n"
    ));
    assert!(message.contains("bad.yaml:10:"), "{message}");
    assert!(message.contains("variants[1].pitches.1"), "{message}");
    let message = run(&format!("{base}  - name: a\n    colour: red\n"));
    assert!(message.contains("bad.yaml:8:"), "{message}");
    let message = run(&format!(
        "{base}  - name: a\n  - name: b\n    tuning: 19edo\n"
    ));
    assert!(message.contains("variant `b`"), "{message}");
    // Several tunings on the command line and variants in the file: which list is meant?
    let path = write_file(folder.path(), "ok.yaml", &format!("{base}  - name: a\n"));
    let message = bad_input(&[
        "plan",
        path.to_str().unwrap(),
        "--tuning",
        "12edo",
        "--tuning",
        "24edo",
    ]);
    assert!(message.contains("--tuning"), "{message}");
    let message = bad_input(&[
        "plan",
        "guitar-19edo",
        "--tuning",
        "19edo",
        "--tuning",
        "19edo",
    ]);
    assert!(message.contains("given twice"), "{message}");
}
