//! `taut frets` through the real binary: fret positions against the equal-temperament rule, a
//! historical fretting rule and exact just ratios; fanned angles by plain geometry; per-course
//! frets, mergeable pairs, warnings; the JSON, CSV and SVG forms.

use crate::common::{json, number, table, taut, write_file};
use approx::assert_relative_eq;
use serde_json::Value;

/// One course, 648 mm (the project's usual check length), in `tuning`, with extra `frets:` lines.
fn one_course(folder: &std::path::Path, tuning: &str, frets: &str) -> String {
    let text = format!(
        "name: Probe\ntuning: '{tuning}'\nscale_length: 648mm\n{frets}courses:\n  - pitch: deg0\n"
    );
    write_file(folder, "probe.yaml", &text)
        .to_string_lossy()
        .into_owned()
}

fn frets_of(report: &Value, course: usize) -> Vec<Value> {
    report["courses"][course]["frets"]
        .as_array()
        .unwrap()
        .clone()
}

fn distance_mm(fret: &Value) -> f64 {
    number(&fret["distance_from_nut_m"]) * 1000.0
}

#[test]
fn twelve_edo_puts_fret_12_at_half_the_length_and_fret_1_at_0_05613_l() {
    let folder = tempfile::tempdir().unwrap();
    let file = one_course(folder.path(), "12edo", "");
    let report = json(&["frets", &file]);
    let frets = frets_of(&report, 0);
    // Equal temperament: fret n at L·(1 − 2^(−n/12)); fret 12 (the octave) at L/2 and fret 1
    // at about 0.05613·L (the "rule of 17.817"). Source: the equal-temperament fret formula
    // d = L − L/2^(n/12), standard in luthiery handbooks and in the encyclopedic article "Fret"
    // (common practice, from memory); it follows from Mersenne's first law, f ∝ 1/L.
    assert_relative_eq!(distance_mm(&frets[11]), 324.0, max_relative = 1e-12);
    assert_relative_eq!(distance_mm(&frets[0]) / 648.0, 0.05613, epsilon = 5e-6);
    assert_relative_eq!(
        distance_mm(&frets[0]),
        648.0 * (1.0 - 2f64.powf(-1.0 / 12.0)),
        max_relative = 1e-12
    );
    // Frets 5, 7 and 24 from the same formula (REFERENCES §8.1 values for 648 mm, DERIVED).
    assert_relative_eq!(distance_mm(&frets[4]), 162.5485, epsilon = 1e-4);
    assert_relative_eq!(distance_mm(&frets[6]), 215.5119, epsilon = 1e-4);
    assert_relative_eq!(distance_mm(&frets[23]), 486.0, epsilon = 1e-9);
    // Two octaves by default, 100 cents apart, no exact ratio in 12-EDO except the octaves.
    assert_eq!(frets.len(), 24);
    assert_relative_eq!(number(&frets[0]["cents"]), 100.0, epsilon = 1e-9);
    assert!(frets[0]["ratio"].is_null());
    assert_relative_eq!(
        number(&frets[0]["spacing_m"]),
        number(&frets[0]["distance_from_nut_m"])
    );
}

#[test]
fn nineteen_edo_matches_its_step_and_the_hand_computed_table() {
    let folder = tempfile::tempdir().unwrap();
    let file = one_course(folder.path(), "19edo", "");
    let frets = frets_of(&json(&["frets", &file]), 0);
    // 19-EDO: "each 19-tet step is 1200/19 cents, or about 63.16 cents" (W. A. Sethares,
    // "Tunings for 19 Tone Equal Tempered Guitar", Experimental Musical Instruments VI(6), 1991).
    assert_relative_eq!(number(&frets[0]["cents"]), 1200.0 / 19.0, epsilon = 1e-9);
    // Distances for L = 648 mm computed by hand from x_n = L·(1 − 2^(−n/19)) (REFERENCES §8.2,
    // DERIVED): fret 1 23.214 mm, fret 9 181.360 mm, fret 19 (the octave) 324.000 mm.
    assert_relative_eq!(distance_mm(&frets[0]), 23.214, epsilon = 5e-4);
    assert_relative_eq!(distance_mm(&frets[8]), 181.360, epsilon = 5e-4);
    assert_relative_eq!(distance_mm(&frets[18]), 324.0, epsilon = 1e-9);
    assert_eq!(frets.len(), 38);
}

#[test]
fn galileis_rule_of_eighteen_is_reproduced_by_the_ratio_18_17() {
    let folder = tempfile::tempdir().unwrap();
    let file = one_course(folder.path(), "1ed18/17", "frets: {count: 2}\n");
    let frets = frets_of(&json(&["frets", &file]), 0);
    // V. Galilei, Dialogo della musica antica et della moderna (1581): each fret is placed 1/18
    // of the remaining string length beyond the last (REFERENCES §8.2). For 648 mm: 648/18 = 36
    // and (648 − 36)/18 = 34, so 36 mm and 70 mm, exactly; the step is the ratio 18/17.
    assert_relative_eq!(distance_mm(&frets[0]), 36.0, epsilon = 1e-9);
    assert_relative_eq!(distance_mm(&frets[1]), 70.0, epsilon = 1e-9);
    assert_eq!(frets[0]["ratio"], "18/17");
    assert_eq!(frets[1]["ratio"], "324/289");
}

#[test]
fn a_just_scale_lands_on_exact_rational_positions() {
    let folder = tempfile::tempdir().unwrap();
    let file = one_course(
        folder.path(),
        "ratios:1/1,9/8,5/4,4/3,3/2,5/3,15/8",
        "frets: {count: 7}\n",
    );
    let frets = frets_of(&json(&["frets", &file]), 0);
    // x(r) = L·(1 − 1/r) (Mersenne's first law, REFERENCES §8.1), in exact fractions of 648 mm:
    // 9/8 → 648/9 = 72, 5/4 → 648/5 = 129.6, 4/3 → 648/4 = 162, 3/2 → 648/3 = 216,
    // 5/3 → 648·2/5 = 259.2, 15/8 → 648·7/15 = 302.4, 2/1 → 324 (REFERENCES §8.1 table).
    let expected = [
        ("9/8", 72.0),
        ("5/4", 129.6),
        ("4/3", 162.0),
        ("3/2", 216.0),
        ("5/3", 259.2),
        ("15/8", 302.4),
        ("2/1", 324.0),
    ];
    for (fret, (ratio, mm)) in frets.iter().zip(expected) {
        assert_eq!(fret["ratio"], ratio);
        assert_relative_eq!(distance_mm(fret), mm, max_relative = 1e-12);
    }
    assert_eq!(frets.len(), 7);
}

/// Two courses, 700 mm and 640 mm, with a `frets:` block.
fn fanned_pair(folder: &std::path::Path, frets: &str) -> String {
    let text = format!(
        "name: Fan\ntuning: 12edo\ncourses:\n  - {{course: 2, pitch: E2, scale_length: 700mm}}\n  - {{course: 1, pitch: E4, scale_length: 640mm}}\nfrets:\n{frets}"
    );
    write_file(folder, "fan.yaml", &text)
        .to_string_lossy()
        .into_owned()
}

#[test]
fn fanned_angles_by_plain_geometry() {
    let folder = tempfile::tempdir().unwrap();
    // Parallel courses 50 mm apart (57 mm board, 3.5 mm edges), square nut. The octave crosses
    // the courses at 350 mm and 320 mm from their nuts, so tan θ = (320 − 350)/50 = −0.6 and
    // θ = −30.964°. Fret 24 (3/4 of each length): tan θ = (480 − 525)/50 = −0.9.
    let file = fanned_pair(
        folder.path(),
        "  board_width: {nut: 57mm, last_fret: 57mm}\n",
    );
    let report = json(&["frets", &file]);
    assert_eq!(report["fanned"], true);
    let bass = frets_of(&report, 0);
    assert_relative_eq!(number(&bass[11]["angle_deg"]), -30.96376, epsilon = 1e-5);
    assert_relative_eq!(
        number(&bass[23]["angle_deg"]),
        (-0.9f64).atan().to_degrees(),
        epsilon = 1e-9
    );
    // Both courses report the same angle for the same fan line.
    let treble = frets_of(&report, 1);
    assert_relative_eq!(number(&treble[11]["angle_deg"]), -30.96376, epsilon = 1e-5);
    // Square at the octave: the octave is square and fret 24 crosses at 525 mm and
    // 30 + 480 = 510 mm (the treble nut sits 0.5·(700 − 640) = 30 mm further along), so
    // tan θ = −15/50 and θ = −16.699°.
    let report = json(&["frets", &file, "--square-at", "0.5"]);
    let bass = frets_of(&report, 0);
    assert!(number(&bass[11]["angle_deg"]).abs() < 1e-9);
    assert_relative_eq!(number(&bass[23]["angle_deg"]), -16.69924, epsilon = 1e-5);
}

#[test]
fn a_tapered_fanned_board_by_hand() {
    let folder = tempfile::tempdir().unwrap();
    // Spread 50 mm at the nut, 60 mm at the last fret (the octave: 12 frets). Each outer course
    // moves out 5 mm while running to its last fret, so sin α = 5/350 on the bass and 5/320 on
    // the treble; cos α = √(1 − sin²α) = 0.99989795 and 0.99987792. Along the board the octave
    // lies at 350·0.99989795 = 349.96428 mm and 320·0.99987792 = 319.96094 mm, 60 mm apart
    // across: tan θ = (319.96094 − 349.96428)/60 = −0.500056, θ = −26.5676°.
    let file = fanned_pair(
        folder.path(),
        "  board_width: {nut: 57mm, last_fret: 67mm}\n  count: 12\n",
    );
    let bass = frets_of(&json(&["frets", &file]), 0);
    assert_relative_eq!(number(&bass[11]["angle_deg"]), -26.56761, epsilon = 1e-4);
}

#[test]
fn straight_boards_carry_no_angle() {
    let report = json(&["frets", "guitar-19edo"]);
    assert_eq!(report["fanned"], false);
    for course in report["courses"].as_array().unwrap() {
        assert!(course["frets"][0].get("angle_deg").is_none());
    }
}

#[test]
fn just_courses_get_partial_frets_and_comma_pairs_are_mergeable() {
    let report = json(&["frets", "fanned-8-just", "--merge-within", "22c"]);
    let courses = report["courses"].as_array().unwrap();
    // Course 8 (A) and course 7 (E) sound different first steps in the 5-limit scale.
    let first_cents = |c: &Value| number(&c["frets"][0]["cents"]);
    assert!((first_cents(&courses[0]) - first_cents(&courses[1])).abs() > 1.0);
    // Their near-coincident frets differ by the syntonic comma 81/80 = 21.506 cents (Barbour,
    // Tuning and Temperament, 1951; cents by Ellis's 1200·log2) or by 2048/2025 = 19.553 cents.
    let pairs = report["mergeable"].as_array().unwrap();
    assert!(!pairs.is_empty());
    for pair in pairs {
        let apart = number(&pair["cents_apart"]).abs();
        let comma = 1200.0 * (81.0f64 / 80.0).log2();
        let diaschisma = 1200.0 * (2048.0f64 / 2025.0).log2();
        assert!(
            (apart - comma).abs() < 1e-6 || (apart - diaschisma).abs() < 1e-6,
            "{pair}"
        );
    }
    // At the default 5 cents none of those qualify.
    let report = json(&["frets", "fanned-8-just"]);
    assert!(report["mergeable"].as_array().unwrap().is_empty());
}

#[test]
fn a_mode_of_22_frets_only_its_steps() {
    let args = [
        "frets",
        "examples/guitar-22edo-mode.yaml",
        "--degrees",
        "0,4,8,9,13,17,21",
    ];
    let report = json(&args);
    for course in report["courses"].as_array().unwrap() {
        let cents: Vec<f64> = course["frets"]
            .as_array()
            .unwrap()
            .iter()
            .map(|f| number(&f["cents"]))
            .collect();
        let step = 1200.0 / 22.0;
        for (cents, steps) in cents.iter().zip([4, 8, 9, 13, 17, 21, 22]) {
            assert_relative_eq!(*cents, steps as f64 * step, epsilon = 1e-9);
        }
        // The octave (fret 7 of the mode) lands at half of 25.5 in.
        assert_relative_eq!(
            number(&course["frets"][6]["distance_from_nut_m"]),
            25.5 * 0.0254 / 2.0,
            max_relative = 1e-12
        );
    }
    // Counted from the tuning's degree 0 instead, courses on different degrees differ.
    let mut args = args.to_vec();
    args.extend(["--degrees-from", "tuning"]);
    let report = json(&args);
    let cents = |course: usize| -> Vec<f64> {
        frets_of(&report, course)
            .iter()
            .map(|f| number(&f["cents"]))
            .collect()
    };
    // ~G4 and ~C4 lie on different degrees, so the same pitches sit at different steps.
    assert_ne!(cents(0), cents(1));
    // ~G4 and ~G3 are an octave apart: the same frets.
    assert_eq!(cents(0).len(), cents(2).len());
    for (a, b) in cents(0).iter().zip(cents(2)) {
        assert_relative_eq!(*a, b, epsilon = 1e-9);
    }
}

#[test]
fn close_frets_warn_below_the_minimum_and_not_above_it() {
    // 31-EDO on 648 mm: spacing L·(2^(−(n−1)/31) − 2^(−n/31)) first drops below 5 mm at
    // fret 49 (5.03 mm at 48, 4.92 mm at 49, from the formula by hand).
    let report = json(&["frets", "guitar-19edo", "--tuning", "31edo"]);
    let warnings = report["warnings"].as_array().unwrap();
    assert_eq!(warnings.len(), 6);
    for warning in warnings {
        assert_eq!(warning["kind"], "close-spacing");
        assert!(
            warning["message"]
                .as_str()
                .unwrap()
                .contains("frets 49–62 are closer than 5.0 mm"),
            "{warning}"
        );
    }
    let report = json(&[
        "frets",
        "guitar-19edo",
        "--tuning",
        "31edo",
        "--min-spacing",
        "3mm",
    ]);
    assert!(report["warnings"].as_array().unwrap().is_empty());
}

#[test]
fn frets_past_the_body_joint_and_the_board_end_are_reported() {
    // The example's board ends at 500 mm; by default frets stop there, so no fret is past it.
    let report = json(&["frets", "fanned-8-just"]);
    let kinds: Vec<&str> = report["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .map(|w| w["kind"].as_str().unwrap())
        .collect();
    assert!(kinds.iter().all(|k| *k == "past-body-joint"), "{kinds:?}");
    assert_eq!(kinds.len(), 8);
    // 24 frets on every course: the long courses run past the 500 mm board end.
    let report = json(&["frets", "fanned-8-just", "--count", "24"]);
    let past_end: Vec<&Value> = report["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|w| w["kind"] == "past-board-end")
        .collect();
    // Course 8 (700 mm): fret 22 (18/5) at 700·(1 − 5/18) = 505.6 mm is the first past 500 mm.
    assert!(past_end.iter().any(|w| w["course"] == 8
        && w["message"]
            .as_str()
            .unwrap()
            .contains("frets 22–24 are past the board's end")));
    assert!(past_end.iter().all(|w| w["course"] != 3));
}

#[test]
fn every_format_renders_and_the_drawing_is_at_true_scale() {
    let folder = tempfile::tempdir().unwrap();
    let file = one_course(
        folder.path(),
        "12edo",
        "frets: {board_width: {nut: 43mm, last_fret: 43mm}}\n",
    );
    let text = table(&["frets", &file]);
    assert!(text.contains("no compensation"), "{text}");
    assert!(text.contains("36.37"), "{text}");
    let csv = table(&["frets", &file, "--format", "csv"]);
    assert_eq!(csv.lines().count(), 25);
    assert!(csv.starts_with("course,pitch,length_m,fret,degree,cents,ratio,distance_from_nut_m"));
    let svg = table(&["frets", &file, "--format", "svg"]);
    assert!(svg.starts_with("<svg "));
    let width = svg
        .split("width=\"")
        .nth(1)
        .unwrap()
        .split("mm\"")
        .next()
        .unwrap();
    assert!(
        svg.contains(&format!("viewBox=\"0 0 {width} ")),
        "one unit is one mm"
    );
    assert!(svg.contains("100 mm"));
    // The nut and fret 1 are drawn 36.369 mm apart: true scale in millimetres.
    let x1 = |line: &str| -> f64 {
        line.split("x1=\"")
            .nth(1)
            .unwrap()
            .split('"')
            .next()
            .unwrap()
            .parse()
            .unwrap()
    };
    let lines: Vec<&str> = svg.lines().filter(|l| l.starts_with("<line")).collect();
    let nut = lines
        .iter()
        .find(|l| l.contains("stroke-width=\"1\""))
        .unwrap();
    let fret = lines
        .iter()
        .find(|l| l.contains("stroke=\"black\" stroke-width=\"0.3\""))
        .unwrap();
    assert_relative_eq!(x1(fret) - x1(nut), 36.369, epsilon = 2e-3);
    // --output writes the same text to a file.
    let out = folder.path().join("board.svg");
    taut()
        .args(["frets", &file, "--format", "svg", "-o"])
        .arg(&out)
        .assert()
        .success();
    assert_eq!(std::fs::read_to_string(out).unwrap(), svg);
}
