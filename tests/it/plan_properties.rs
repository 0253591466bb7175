//! Properties of every solved string: Mersenne's law holds on the reported figures, and tension
//! grows as the square of frequency (Mersenne; REFERENCES §1.1: f = (1/2L)·√(T/μ)).

use proptest::prelude::*;
use taut::instrument::Instrument;
use taut::plan::solve::{self, SolveOptions};
use taut::plan::Plan;
use taut::strings::stock::Stock;

fn solve_text(text: String) -> Plan {
    let instrument = Instrument::from_text(text, "prop.yaml").unwrap();
    solve::plan(
        &instrument,
        Stock::builtin().unwrap(),
        &SolveOptions::default(),
    )
    .unwrap()
}

fn one_course(hz: f64, length_mm: f64, tension_n: f64, kinds: &str, extra: &str) -> String {
    format!(
        "name: p\nscale_length: {length_mm}mm\ndefaults:\n  kinds: [{kinds}]\n  tension: {tension_n}N\ncourses:\n  - pitch: {hz}hz\n    strings: [unison, octave below, 3/2]\n{extra}"
    )
}

const KINDS: [&str; 5] = [
    "plain-steel",
    "phosphor-bronze-wound",
    "nylon",
    "silver-wound-nylon",
    "plain-steel, nickel-wound, gut",
];

proptest! {
    #![proptest_config(ProptestConfig::with_cases(200))]

    #[test]
    fn reported_mu_length_and_tension_give_back_the_pitch(
        hz in 30.0f64..2000.0,
        length_mm in 100.0f64..1500.0,
        tension_n in 5.0f64..300.0,
        kinds in prop::sample::select(KINDS.to_vec()),
    ) {
        let plan = solve_text(one_course(hz, length_mm, tension_n, kinds, ""));
        let course = &plan.courses[0];
        prop_assert!((course.pitch.hz / hz - 1.0).abs() < 1e-12);
        let ratios = [1.0, 0.5, 1.5];
        for (string, ratio) in course.strings.iter().zip(ratios) {
            let choice = &string.choice;
            let length = course.length_m;
            let recomputed = (choice.tension_n / choice.unit_mass_kg_per_m).sqrt() / (2.0 * length);
            prop_assert!((recomputed / string.pitch_hz - 1.0).abs() < 1e-9);
            prop_assert!((string.pitch_hz / (hz * ratio) - 1.0).abs() < 1e-12);
            // The exact μ the target asks for also gives back the pitch at the target tension.
            let exact = (string.target_tension_n / string.required_unit_mass_kg_per_m).sqrt() / (2.0 * length);
            prop_assert!((exact / string.pitch_hz - 1.0).abs() < 1e-9);
            prop_assert!(choice.stress_ratio > 0.0 && choice.break_pitch_hz > 0.0);
        }
        let total: f64 = course.strings.iter().map(|s| s.choice.tension_n).sum();
        prop_assert!((plan.total_tension_n / total - 1.0).abs() < 1e-12);
    }

    #[test]
    fn tension_grows_as_frequency_squared(
        hz in 60.0f64..600.0,
        factor in 1.01f64..3.0,
        length_mm in 300.0f64..900.0,
    ) {
        // A slot narrower than any gauge pins the choice to the thinnest plain steel string, so
        // both pitches carry the same string and only the frequency changes.
        let extra = "    max_diameter: 0.1mm\n";
        let low = solve_text(one_course(hz, length_mm, 70.0, "plain-steel", extra));
        let high = solve_text(one_course(hz * factor, length_mm, 70.0, "plain-steel", extra));
        let (low, high) = (&low.courses[0].strings[0], &high.courses[0].strings[0]);
        prop_assert_eq!(low.choice.diameter_mm, high.choice.diameter_mm);
        let ratio = high.choice.tension_n / low.choice.tension_n;
        prop_assert!((ratio / (factor * factor) - 1.0).abs() < 1e-9);
        // Plain strings break at the same pitch whatever the tension (σ = ρ(2Lf)², §1.2).
        prop_assert!((high.choice.break_pitch_hz / low.choice.break_pitch_hz - 1.0).abs() < 1e-9);
    }
}
