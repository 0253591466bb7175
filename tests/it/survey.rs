//! The survey: its fast path agrees with the plain plan solver candidate by candidate, its
//! ranking does not depend on the thread count, it finds a known stringable setting and refuses
//! a known dangerous one, and it refuses empty or absurd spaces before any work.

use crate::common::{bad_input, json, write_file};
use taut::instrument::Instrument;
use taut::plan::warning::WarningKind;
use taut::plan::Plan;
use taut::strings::select::Warnings;
use taut::strings::stock::Stock;
use taut::survey::{Metrics, Rejections, Report, Settings, Survey};

const FOURTHS: &str = include_str!("../../examples/fanned-8-fourths.yaml");

fn kinds() -> &'static Stock {
    Stock::builtin().unwrap()
}

fn search(survey: &Survey<'_>) -> Report {
    survey.search(&|_| {})
}

/// What the plain solver says of a candidate, in the survey's terms.
fn plan_verdict(plan: &Plan) -> (bool, bool) {
    let refusing = [
        WarningKind::StressDanger,
        WarningKind::ThinnerThanPractical,
        WarningKind::ThickerThanCatalog,
        WarningKind::WiderThanSlot,
        WarningKind::TensionBelowWindow,
        WarningKind::TensionAboveWindow,
        WarningKind::OverRatedLoad,
    ];
    let stringable = !plan.warnings.iter().any(|w| refusing.contains(&w.kind));
    let caution = plan
        .warnings
        .iter()
        .any(|w| w.kind == WarningKind::StressCaution);
    (stringable, caution)
}

fn close(a: f64, b: f64) -> bool {
    (a - b).abs() <= 1e-9 * a.abs().max(b.abs()).max(1e-12)
}

/// Every candidate of the survey solved by the plain plan solver and by the fast path: the same
/// string on every course, the same verdict, the same measures; then the parallel sweep lists
/// exactly the stringable ones with those measures, and counts the refused ones' reasons alike.
fn agrees_with_the_plain_solver(instrument: &Instrument, settings_text: &str) -> usize {
    let mut settings = Settings::from_text(settings_text.to_string(), "settings").unwrap();
    let size_guess = 100_000;
    settings.top = size_guess;
    settings.every_offset = true;
    let survey = Survey::prepare(instrument, &settings, kinds()).unwrap();
    let candidates = survey.size().candidates;
    assert!(candidates < size_guess as u64);
    let mut stringable = Vec::new();
    let mut rejected = Rejections::default();
    for index in 0..candidates {
        let plan = survey.candidate_plan(index).unwrap();
        let (metrics, chosen): (Metrics, _) = survey.check(index);
        let planned: Vec<(String, f64)> = plan
            .courses
            .iter()
            .flat_map(|course| &course.strings)
            .map(|string| {
                (
                    string.choice.kind.to_string(),
                    string.choice.diameter_mm / 1000.0,
                )
            })
            .collect();
        assert_eq!(chosen.len(), planned.len());
        for ((kind, diameter), (plan_kind, plan_diameter)) in chosen.iter().zip(&planned) {
            assert_eq!(kind, plan_kind, "candidate {index}");
            assert!(close(*diameter, *plan_diameter), "candidate {index}");
        }
        let (plan_stringable, plan_caution) = plan_verdict(&plan);
        assert_eq!(metrics.stringable(), plan_stringable, "candidate {index}");
        assert_eq!(metrics.caution(), plan_caution, "candidate {index}");
        let tensions: Vec<f64> = plan
            .courses
            .iter()
            .flat_map(|course| &course.strings)
            .map(|string| string.choice.tension_n)
            .collect();
        let spread = tensions.iter().cloned().fold(f64::MIN, f64::max)
            - tensions.iter().cloned().fold(f64::MAX, f64::min);
        let stress = plan
            .courses
            .iter()
            .flat_map(|course| &course.strings)
            .map(|string| string.choice.stress_ratio)
            .fold(0.0, f64::max);
        assert!(
            close(metrics.total_load_n, plan.total_tension_n),
            "candidate {index}"
        );
        assert!(
            close(metrics.worst_stress_ratio, stress),
            "candidate {index}"
        );
        assert!(
            (metrics.tension_spread_n - spread).abs() < 1e-9 * plan.total_tension_n,
            "candidate {index}"
        );
        if plan_stringable {
            stringable.push((index, metrics));
        } else {
            let has = |reason: Warnings| u64::from(metrics.flags & reason.bits() != 0);
            rejected.stress_danger += has(Warnings::STRESS_DANGER);
            rejected.outside_catalog +=
                has(Warnings::THINNER_THAN_CATALOG.union(Warnings::THICKER_THAN_CATALOG));
            rejected.outside_window += has(Warnings::BELOW_WINDOW.union(Warnings::ABOVE_WINDOW));
            rejected.wider_than_slot += has(Warnings::WIDER_THAN_SLOT);
            rejected.strength_unknown += has(Warnings::STRENGTH_UNKNOWN);
            rejected.over_rated_load += u64::from(metrics.over_rated_load);
        }
    }
    let report = search(&survey);
    assert_eq!(report.candidates, candidates);
    // The sweep counts the reasons of a candidate refused for its strings without measuring
    // it: the same counts as measuring every candidate.
    assert_eq!(report.rejected, rejected);
    assert!(rejected.stress_danger + rejected.outside_catalog + rejected.outside_window > 0);
    assert_eq!(report.stringable as usize, stringable.len());
    assert_eq!(report.results.len(), stringable.len());
    for result in &report.results {
        let (_, metrics) = stringable
            .iter()
            .find(|(index, _)| *index == result.candidate)
            .unwrap_or_else(|| panic!("candidate {} is not stringable", result.candidate));
        assert_eq!(result.total_load_n, metrics.total_load_n);
        assert_eq!(result.tension_spread_n, metrics.tension_spread_n);
        assert_eq!(result.worst_stress_ratio, metrics.worst_stress_ratio);
    }
    // Ranked by the default rule: spread never decreases down the list.
    assert!(report
        .results
        .windows(2)
        .all(|pair| pair[0].tension_spread_n <= pair[1].tension_spread_n));
    stringable.len()
}

#[test]
fn the_fast_path_agrees_with_the_plan_solver_on_edos_and_offsets() {
    let instrument = Instrument::from_text(FOURTHS.to_string(), "fourths").unwrap();
    let settings = "\
tunings: {edos: {from: 5, to: 31}}
course_1: E2
offset_cents: {from: -600, to: 600, step: 37.5}
courses: {nearest_to: 4/3}
";
    let stringable = agrees_with_the_plain_solver(&instrument, settings);
    // The space must hold both kinds of candidate for the comparison to mean something.
    assert!(stringable > 10, "{stringable}");
}

#[test]
fn the_fast_path_agrees_on_modes_double_courses_and_a_rated_load() {
    // Invented: six courses, the two lowest doubled an octave up, a rated load that some
    // transpositions exceed, a slot limit, and a tension profile.
    let text = "\
name: six courses
scale_length: {first: 640mm, last: 600mm}
rated_load: 600N
defaults:
  kinds: [plain-steel, phosphor-bronze-wound]
  tension: {first: 90N, last: 60N, min: 45N, max: 110N}
  max_diameter: 1.2mm
courses:
  - pitch: E2
    strings: [unison, {interval: octave, kinds: [plain-steel]}]
  - pitch: A2
    strings: [unison, octave]
  - pitch: D3
  - pitch: G3
  - pitch: B3
  - pitch: E4
";
    let instrument = Instrument::from_text(text.to_string(), "six").unwrap();
    let settings = "\
tunings: {list: [12edo, 19edo, meantone-quarter-comma]}
course_1: D2
offset_cents: {from: -300, to: 900, step: 40}
courses: {modes_of: [2, 2, 1, 2, 2, 2, 1]}
";
    let stringable = agrees_with_the_plain_solver(&instrument, settings);
    assert!(stringable > 0);
}

/// The fourths example over every EDO, with a coarse offset step: a few thousand stringable
/// candidates, few enough to list them all.
fn coarse_fourths_settings(every_offset: bool, top: usize) -> Settings {
    let mut settings = Settings::from_text(
        "\
tunings: {edos: {from: 5, to: 72}}
course_1: E2
offset_cents: {from: -600, to: 600, step: 1.3}
courses: {nearest_to: 4/3}
"
        .to_string(),
        "settings",
    )
    .unwrap();
    settings.every_offset = every_offset;
    settings.top = top;
    settings
}

#[test]
fn the_ranking_is_the_same_on_one_thread_and_on_two() {
    let instrument = Instrument::from_text(FOURTHS.to_string(), "fourths").unwrap();
    for (every_offset, expected) in [(true, 200), (false, 40)] {
        let settings = coarse_fourths_settings(every_offset, expected);
        let survey = Survey::prepare(&instrument, &settings, kinds()).unwrap();
        let on = |threads: usize| {
            rayon::ThreadPoolBuilder::new()
                .num_threads(threads)
                .build()
                .unwrap()
                .install(|| search(&survey))
        };
        let (one, two) = (on(1), on(2));
        assert_eq!(one.results.len(), expected);
        assert_eq!(one.results, two.results);
        assert_eq!(one.stringable, two.stringable);
        assert_eq!(one.rejected, two.rejected);
    }
}

#[test]
fn by_default_each_setting_is_listed_once_at_its_best_offset() {
    // The reference: every stringable candidate ranked, then the first (best) row of each
    // tuning and course pattern, in order.
    let instrument = Instrument::from_text(FOURTHS.to_string(), "fourths").unwrap();
    let every = coarse_fourths_settings(true, taut::survey::settings::MAX_TOP);
    let every = search(&Survey::prepare(&instrument, &every, kinds()).unwrap());
    assert!((every.results.len() as u64) == every.stringable && every.stringable > 100);
    let mut expected: Vec<&taut::survey::Ranked> = Vec::new();
    for result in &every.results {
        if !expected.iter().any(|seen| {
            seen.tuning == result.tuning && seen.course_pattern == result.course_pattern
        }) {
            expected.push(result);
        }
    }
    let top = 25;
    assert!(expected.len() > top);
    let once = coarse_fourths_settings(false, top);
    let once = search(&Survey::prepare(&instrument, &once, kinds()).unwrap());
    assert!(!once.every_offset && once.ranking_rule.contains("at its best offset"));
    let listed: Vec<(u64, &str)> = once
        .results
        .iter()
        .map(|r| (r.candidate, r.tuning.as_str()))
        .collect();
    let reference: Vec<(u64, &str)> = expected[..top]
        .iter()
        .map(|r| (r.candidate, r.tuning.as_str()))
        .collect();
    assert_eq!(listed, reference);
    assert_eq!(once.stringable, every.stringable);
}

#[test]
fn the_steps_of_nearest_fourths_are_round_n_log2_four_thirds() {
    // The benchmark's definition: neighbouring courses round(N·log2(4/3)) steps apart.
    let instrument = Instrument::from_text(FOURTHS.to_string(), "fourths").unwrap();
    let settings = Settings::from_text(
        "tunings: {edos: {from: 5, to: 72}}\ncourse_1: E2\ncourses: {nearest_to: 4/3}\ntop: 10000\n"
            .to_string(),
        "settings",
    )
    .unwrap();
    let survey = Survey::prepare(&instrument, &settings, kinds()).unwrap();
    let report = search(&survey);
    assert!(!report.results.is_empty());
    for result in &report.results {
        let n: f64 = result.tuning.trim_end_matches("edo").parse().unwrap();
        let fourth = (n * (4.0f64 / 3.0).log2()).round() as i64;
        assert!(
            result.course_pattern.steps.iter().all(|&s| s == fourth),
            "{}: {:?}",
            result.tuning,
            result.course_pattern.steps
        );
    }
}

/// Music wire (ASTM A228 Table 1, inch-pound requirements, read in a reproduction;
/// REFERENCES §4.1): the strongest catalog wire, 0.007 in, is at most 449 ksi; the weakest,
/// 0.026 in, at least 337 ksi. Density 7850 kg/m³ (common practice; REFERENCES §2). A plain string's stress
/// σ = ρ(2Lf)² does not depend on its diameter, and it breaks at f = √(σ_UTS/ρ)/(2L)
/// (REFERENCES §1.2, DERIVED from Mersenne's laws).
const KSI: f64 = 6.894_757_293_168e6;
const STEEL_DENSITY: f64 = 7850.0;

#[test]
fn a_tiny_survey_finds_a_stringable_pitch_and_refuses_one_above_the_break_pitch() {
    let length = 0.648;
    let instrument = Instrument::from_text(
        "name: one plain course\nscale_length: 648mm\ndefaults: {kinds: [plain-steel], tension: 70N}\ncourses: [{pitch: E4}]\n"
            .to_string(),
        "one",
    )
    .unwrap();
    // E4 (329.63 Hz at A4 = 440 Hz, ISO 16) and the B4 a fifth above it.
    let settings = Settings::from_text(
        "tunings: {list: [12edo]}\ncourse_1: E4\noffset_cents: {from: 0, to: 700, step: 700}\ncourses: {nearest_to: 4/3}\n"
            .to_string(),
        "settings",
    )
    .unwrap();
    let survey = Survey::prepare(&instrument, &settings, kinds()).unwrap();
    let (e4, b4) = (survey.course_1_hz(0), survey.course_1_hz(1));
    let stress = |f: f64, strength_ksi: f64| {
        STEEL_DENSITY * (2.0 * length * f).powi(2) / (strength_ksi * KSI)
    };
    let break_pitch =
        |strength_ksi: f64| (strength_ksi * KSI / STEEL_DENSITY).sqrt() / (2.0 * length);
    // By the handbook alone: E4 is below 0.65 of even the weakest wire's strength, and B4 is
    // above the break pitch of even the strongest.
    assert!(stress(e4, 337.0) < 0.65, "{}", stress(e4, 337.0));
    assert!(b4 > break_pitch(449.0), "{b4} vs {}", break_pitch(449.0));
    let report = search(&survey);
    assert_eq!(report.candidates, 2);
    assert_eq!(report.stringable, 1);
    assert_eq!(report.rejected.stress_danger, 1);
    assert_eq!(report.results.len(), 1);
    assert_eq!(report.results[0].offset_cents, 0.0);
    assert!(report.results[0].worst_stress_ratio < 0.65);
}

#[test]
fn the_example_runs_through_the_binary_as_json() {
    let report = json(&[
        "survey",
        "examples/fanned-8-fourths.yaml",
        "examples/survey-fourths.yaml",
        "--top",
        "3",
    ]);
    assert_eq!(report["candidates"], 307 * 120_001);
    assert_eq!(report["course_checks"], 307 * 120_001 * 8);
    let results = report["results"].as_array().unwrap();
    assert_eq!(results.len(), 3);
    assert!(report["stringable"].as_u64().unwrap() >= 3);
    assert!(report["elapsed_s"].as_f64().unwrap() > 0.0);
    for key in [
        "tuning",
        "offset_cents",
        "course_pattern",
        "score",
        "verdict",
    ] {
        assert!(results[0].get(key).is_some(), "{key}");
    }
    // Each tuning once by default; `--every-offset` lists the best one's neighbouring offsets.
    let tunings: Vec<&str> = results
        .iter()
        .filter_map(|r| r["tuning"].as_str())
        .collect();
    assert!(
        tunings[0] != tunings[1] && tunings[1] != tunings[2],
        "{tunings:?}"
    );
    assert_eq!(report["every_offset"], false);
    let every = json(&[
        "survey",
        "examples/fanned-8-fourths.yaml",
        "examples/survey-fourths.yaml",
        "--top",
        "3",
        "--every-offset",
    ]);
    let every_results = every["results"].as_array().unwrap();
    assert_eq!(every["every_offset"], true);
    assert_eq!(every_results[0], results[0]);
    assert!(every_results
        .iter()
        .all(|r| r["tuning"] == results[0]["tuning"]));
    // The best candidate's full plan, from the plan solver, is stringable too.
    let plan = &report["best_plan"];
    assert_eq!(plan["courses"].as_array().unwrap().len(), 8);
    assert!(plan["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .all(|w| w["severity"] != "danger"));
}

#[test]
fn empty_and_absurd_spaces_are_refused_with_an_estimate_before_any_work() {
    let folder = tempfile::tempdir().unwrap();
    let write =
        |name: &str, text: &str| write_file(folder.path(), name, text).display().to_string();
    let instrument = "examples/fanned-8-fourths.yaml";
    let cases = [
        (
            "tunings: {edos: {from: 72, to: 5}}\ncourse_1: E2\ncourses: {nearest_to: 4/3}\n",
            ":1:",
            "0 candidates",
        ),
        (
            "tunings: {edos: {from: 5, to: 72}}\ncourse_1: E2\noffset_cents: {from: 0, to: 10, step: 0}\ncourses: {nearest_to: 4/3}\n",
            ":3:",
            "step",
        ),
        (
            "tunings: {edos: {from: 5, to: 72}}\ncourse_1: E2\noffset_cents: {from: 10, to: 0, step: 1}\ncourses: {nearest_to: 4/3}\n",
            ":3:",
            "empty",
        ),
        // 1.2 million offsets × 1996 tunings: 1.9e10 course checks. The list of tunings also
        // names a file that does not exist: the size is refused before any tuning is read.
        (
            "tunings: {edos: {from: 5, to: 2000}}\ncourse_1: E2\noffset_cents: {from: -600, to: 600, step: 0.001}\ncourses: {nearest_to: 4/3}\n",
            ":3:",
            "19161615968 course checks",
        ),
        (
            "tunings: {list: [12edo, no-such-tuning.yaml]}\ncourse_1: E2\noffset_cents: {from: -600, to: 600, step: 0.0000001}\ncourses: {nearest_to: 4/3}\n",
            "offsets",
            "candidates",
        ),
        (
            "tunings: {list: [12edo]}\ncourse_1: E2\ncourses: {steps: [5, 5]}\n",
            ":3:",
            "need 7",
        ),
    ];
    for (index, (text, place, words)) in cases.iter().enumerate() {
        let settings = write(&format!("s{index}.yaml"), text);
        let message = bad_input(&["survey", instrument, &settings]);
        assert!(message.contains(&settings), "{message}");
        assert!(message.contains(place), "{place}: {message}");
        assert!(message.contains(words), "{words}: {message}");
    }
}
