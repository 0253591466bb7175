//! The several-tuning selector (`select::several`): with one tuning it is the selector itself;
//! with several, the chosen string serves every tuning whenever any catalog string does.

use proptest::prelude::*;
use taut::strings::kind::{StringKind, StringKinds};
use taut::strings::select::several::{any_serves, choose, evaluate_at, selection_in, serves};
use taut::strings::select::several::{Agreement, Balance};
use taut::strings::select::{select, Checks, Request, StressLimits};

const KINDS: [&str; 5] = [
    "plain-steel",
    "phosphor-bronze-wound",
    "nylon",
    "nickel-wound",
    "silver-wound-nylon",
];

fn kinds(mask: u8) -> Vec<&'static StringKind> {
    let all = StringKinds::builtin().unwrap();
    let picked: Vec<_> = KINDS
        .iter()
        .enumerate()
        .filter(|(i, _)| mask & (1 << i) != 0)
        .map(|(_, id)| all.get(id).unwrap())
        .collect();
    if picked.is_empty() {
        vec![all.get(KINDS[0]).unwrap()]
    } else {
        picked
    }
}

fn request(
    frequency: f64,
    length: f64,
    target: f64,
    window: (f64, f64),
    slot: Option<f64>,
) -> Request {
    Request {
        frequency,
        length,
        target_tension: target,
        tolerance: 0.10,
        checks: Checks {
            min_tension: Some(target * window.0),
            max_tension: Some(target * window.1),
            widest: slot,
            limits: StressLimits::default(),
        },
    }
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(300))]

    /// One tuning: the same choice, neighbours, flags and alternatives as `select`.
    #[test]
    fn one_tuning_is_the_selector(
        mask in 1u8..32,
        frequency in 40.0f64..900.0,
        length in 0.3f64..1.2,
        target in 20.0f64..180.0,
        low in 0.5f64..1.0,
        high in 1.0f64..1.8,
        slot in prop::option::of(0.0003f64..0.0015),
    ) {
        let kinds = kinds(mask);
        let one = request(frequency, length, target, (low, high), slot);
        let mut best = vec![None; kinds.len()];
        let expected = select(&one, &kinds, &mut best);
        let mut gauges = vec![None; kinds.len()];
        let shared = choose(std::slice::from_ref(&one), &kinds, Balance::Target, &mut gauges).unwrap();
        let mut others = vec![None; kinds.len()];
        let got = selection_in(&one, &kinds, &shared, &gauges, &mut others);
        prop_assert_eq!(got, expected);
        prop_assert_eq!(others, best);
    }

    /// Several tunings: whenever some gauge of some allowed kind serves every tuning (below the
    /// danger stress, inside the window, fitting the slot), the chosen one does too, and it is
    /// never reported as a conflict; when none does, it is.
    #[test]
    fn the_choice_serves_every_tuning_whenever_any_string_does(
        mask in 1u8..32,
        frequency in 40.0f64..900.0,
        ratios in prop::collection::vec(0.7f64..1.5, 1..4),
        length in 0.3f64..1.2,
        target in 20.0f64..180.0,
        low in 0.5f64..1.0,
        high in 1.0f64..1.8,
        slot in prop::option::of(0.0003f64..0.0015),
        by_stress in any::<bool>(),
    ) {
        let kinds = kinds(mask);
        let mut requests = vec![request(frequency, length, target, (low, high), slot)];
        requests.extend(ratios.iter().map(|r| request(frequency * r, length, target, (low, high), slot)));
        let balance = if by_stress { Balance::Stress } else { Balance::Target };
        let mut gauges = vec![None; kinds.len()];
        let shared = choose(&requests, &kinds, balance, &mut gauges).unwrap();
        // Every gauge of every kind, by brute force.
        let any = kinds.iter().enumerate().any(|(k, kind)| {
            (0..kind.gauges().len())
                .any(|g| requests.iter().all(|r| serves(&evaluate_at(r, &kinds, k, g))))
        });
        prop_assert_eq!(any, any_serves(&requests, &kinds));
        let chosen_serves = requests
            .iter()
            .all(|r| serves(&evaluate_at(r, &kinds, shared.kind, shared.gauge)));
        prop_assert_eq!(chosen_serves, any);
        prop_assert_eq!(shared.agreement == Agreement::Conflict, !any);
    }
}
