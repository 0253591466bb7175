//! The crossings sweep against the exhaustive search: random small instruments, catalogs and
//! settings give the same report from both, result by result (candidate, figures bit for bit,
//! rank), with the same counts of stringable and refused candidates, for every ranking rule,
//! with and without `every_offset`. The exhaustive search checks every candidate string by
//! string; the sweep visits only the offsets where some string's choice changes, so this is the
//! check that nothing between two crossings was missed.

use proptest::prelude::*;
use taut::instrument::Instrument;
use taut::strings::stock::Stock;
use taut::survey::{Method, Report, Settings, Survey};

/// One random case, as the texts of its three files.
#[derive(Debug, Clone)]
struct Case {
    stock: String,
    instrument: String,
    settings: String,
}

fn diameters() -> impl Strategy<Value = Vec<u32>> {
    // Micrometres; a few gauges only, so that the catalog's edges are met often.
    proptest::collection::vec(150u32..1600, 1..14).prop_map(|mut list| {
        list.sort_unstable();
        list.dedup();
        list
    })
}

fn kind_text(index: usize, construction: u8, gauges: &[u32]) -> (String, String) {
    let id = format!("random-kind-{index}");
    let list: Vec<String> = gauges
        .iter()
        .map(|um| format!("{}.{:03}mm", um / 1000, um % 1000))
        .collect();
    let catalog = format!(
        "  - id: {id}\n    name: Random catalog {index}\n    diameters: [{}]\n    source: invented for a test\n",
        list.join(", ")
    );
    let body = match construction {
        0 => "plain: {material: music-wire}".to_string(),
        1 => "plain: {material: nylon}".to_string(),
        _ => "wound: {core: {material: music-wire, shape: round}, wraps: [nickel]}".to_string(),
    };
    let kind = format!(
        "  - id: {id}\n    name: Random kind {index}\n    {body}\n    catalog: {id}\n    source: invented for a test\n"
    );
    (catalog, kind)
}

prop_compose! {
    fn stock_text()(
        constructions in proptest::collection::vec(0u8..3, 1..3),
        catalogs in proptest::collection::vec(diameters(), 2),
    ) -> (String, usize) {
        let mut catalog_text = String::from("catalogs:\n");
        let mut kind_list = String::from("kinds:\n");
        for (index, construction) in constructions.iter().enumerate() {
            let (catalog, kind) = kind_text(index, *construction, &catalogs[index]);
            catalog_text.push_str(&catalog);
            kind_list.push_str(&kind);
        }
        (format!("{catalog_text}{kind_list}"), constructions.len())
    }
}

prop_compose! {
    fn instrument_text(kinds: usize)(
        courses in 1usize..4,
        lengths in proptest::collection::vec(250u32..900, 3),
        second_strings in proptest::collection::vec(0u8..4, 3),
        target in 20u32..120,
        window in proptest::option::of((40u32..100, 101u32..250)),
        limits in (40u32..72, 75u32..96),
        rated in proptest::option::of(20u32..400),
        slot in proptest::option::of(500u32..1500),
        tolerance in 3u32..20,
        reversed_kinds in any::<bool>(),
        same_length in any::<bool>(),
    ) -> String {
        let mut kind_ids: Vec<String> = (0..kinds).map(|i| format!("random-kind-{i}")).collect();
        if reversed_kinds {
            kind_ids.reverse();
        }
        let mut text = format!(
            "name: Random instrument\ntolerance: {tolerance}%\nstress_limits: {{caution: {}%, danger: {}%}}\n",
            limits.0, limits.1
        );
        if let Some(rated) = rated {
            text.push_str(&format!("rated_load: {rated}N\n"));
        }
        text.push_str(&format!("defaults:\n  kinds: [{}]\n", kind_ids.join(", ")));
        match window {
            // The window is given as a share of the target, so it always holds it.
            Some((low, high)) => text.push_str(&format!(
                "  tension: {{target: {target}N, min: {:.3}N, max: {:.3}N}}\n",
                f64::from(target) * f64::from(low) / 100.0,
                f64::from(target) * f64::from(high) / 100.0
            )),
            None => text.push_str(&format!("  tension: {target}N\n")),
        }
        if let Some(slot) = slot {
            text.push_str(&format!("  max_diameter: {}.{:03}mm\n", slot / 1000, slot % 1000));
        }
        text.push_str("courses:\n");
        for course in 0..courses {
            let strings = match second_strings[course] {
                0 | 1 => "[unison]",
                2 => "[unison, octave]",
                _ => "[unison, 3/2]",
            };
            text.push_str(&format!(
                "  - pitch: {}\n    scale_length: {}mm\n    strings: {strings}\n",
                ["E2", "A2", "D3"][course],
                // One length for all, so that courses on one degree tie exactly.
                lengths[if same_length { 0 } else { course }]
            ));
        }
        text
    }
}

prop_compose! {
    fn settings_text(courses: usize)(
        first_edo in 5u32..40,
        more_edos in 0u32..3,
        listed in any::<bool>(),
        course_1 in prop::sample::select(vec!["3hz", "41hz", "82.4hz", "196hz", "440hz", "9000hz", "E2"]),
        from in -1200i32..200,
        offsets in 1u32..250,
        step in prop::sample::select(vec!["0.01", "0.1", "0.7", "1", "3.3", "25"]),
        pattern in 0u8..4,
        steps in proptest::collection::vec(-3i32..8, 2),
        rank in prop::sample::select(vec!["spread", "stress", "load", "target"]),
        top in 1usize..25,
        every_offset in any::<bool>(),
    ) -> String {
        let tunings = if listed {
            "{list: [12edo, 19edo, \"ratios:1/1,9/8,5/4,4/3,3/2,5/3,15/8\"]}".to_string()
        } else {
            format!("{{edos: {{from: {first_edo}, to: {}}}}}", first_edo + more_edos)
        };
        let step_value: f64 = step.parse().unwrap_or(1.0);
        let to = f64::from(from) + step_value * f64::from(offsets - 1);
        let pattern = match pattern {
            0 => "{nearest_to: 4/3}".to_string(),
            1 => "{nearest_to: 1/1}".to_string(),
            2 => format!(
                "{{steps: [{}]}}",
                steps[..courses - 1]
                    .iter()
                    .map(i32::to_string)
                    .collect::<Vec<_>>()
                    .join(", ")
            ),
            _ => "{modes_of: [2, 2, 1, 2, 2, 2, 1]}".to_string(),
        };
        format!(
            "tunings: {tunings}\ncourse_1: {course_1}\noffset_cents: {{from: {from}, to: {to:.4}, step: {step}}}\ncourses: {pattern}\nrank_by: {rank}\ntop: {top}\nevery_offset: {every_offset}\n"
        )
    }
}

fn case() -> impl Strategy<Value = Case> {
    stock_text().prop_flat_map(|(stock, kinds)| {
        instrument_text(kinds).prop_flat_map(move |instrument| {
            let courses = instrument.matches("- pitch:").count();
            let stock = stock.clone();
            settings_text(courses).prop_map(move |settings| Case {
                stock: stock.clone(),
                instrument: instrument.clone(),
                settings,
            })
        })
    })
}

/// The report as JSON, without the time it took (the one field allowed to differ).
fn comparable(report: &Report) -> serde_json::Value {
    let mut value = serde_json::to_value(report).unwrap();
    if let Some(object) = value.as_object_mut() {
        object.remove("elapsed_s");
    }
    value
}

/// Runs one case both ways; `None` when the case is refused before any search (a tuning
/// without the degrees asked for, a pitch out of any range): refusals are the settings
/// checks' business, tested elsewhere.
fn both_ways(case: &Case) -> Option<(Report, Report)> {
    let mut stock = Stock::builtin().unwrap().clone();
    stock.add_text(&case.stock, "random stock").unwrap();
    let instrument = Instrument::from_text(case.instrument.clone(), "random instrument").unwrap();
    let settings = Settings::from_text(case.settings.clone(), "random settings").unwrap();
    let survey = Survey::prepare(&instrument, &settings, &stock).ok()?;
    let crossings = survey.search_with(Method::Crossings, &|_| {});
    let exhaustive = survey.search_with(Method::Exhaustive, &|_| {});
    Some((crossings, exhaustive))
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 10_000, ..ProptestConfig::default() })]

    #[test]
    fn the_crossings_sweep_gives_the_exhaustive_report(case in case()) {
        if let Some((crossings, exhaustive)) = both_ways(&case) {
            // Counted the same: every candidate is stringable or refused in both.
            prop_assert_eq!(crossings.stringable, exhaustive.stringable);
            prop_assert_eq!(crossings.rejected, exhaustive.rejected);
            prop_assert_eq!(crossings.results.len(), exhaustive.results.len());
            for (sweep, every) in crossings.results.iter().zip(&exhaustive.results) {
                prop_assert_eq!(sweep, every);
            }
            prop_assert_eq!(crossings.best_candidate, exhaustive.best_candidate);
            prop_assert_eq!(comparable(&crossings), comparable(&exhaustive));
        }
    }
}

/// The generator reaches what the property is about: stringable runs, refusals of each kind
/// the sweep counts by multiplying, and several results to rank.
#[test]
fn the_random_cases_meet_runs_refusals_and_rankings() {
    use proptest::strategy::ValueTree;
    use proptest::test_runner::TestRunner;
    let mut runner = TestRunner::deterministic();
    let strategy = case();
    let (mut surveyed, mut with_results, mut several, mut over_load, mut out_of_range) =
        (0, 0, 0, 0, 0);
    for _ in 0..400 {
        let case = strategy.new_tree(&mut runner).unwrap().current();
        if let Some((report, _)) = both_ways(&case) {
            surveyed += 1;
            with_results += usize::from(report.stringable > 0);
            several += usize::from(report.results.len() > 1);
            over_load += usize::from(report.rejected.over_rated_load > 0);
            out_of_range += usize::from(report.rejected.outside_pitch_range > 0);
        }
    }
    println!("{surveyed} surveyed, {with_results} with results, {several} several, {over_load} over load, {out_of_range} out of range");
    assert!(surveyed > 300, "{surveyed} of 400 cases surveyed");
    assert!(
        with_results > 40,
        "{with_results} cases with a stringable candidate"
    );
    assert!(several > 20, "{several} cases with several results");
    assert!(over_load > 5, "{over_load} cases over the rated load");
    assert!(
        out_of_range > 5,
        "{out_of_range} cases outside the pitch range"
    );
}
