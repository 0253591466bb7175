//! Property tests: cents and ratios round-trip, equal divisions stack to their period, and a
//! period's degrees ascend.

use num_rational::Ratio;
use proptest::prelude::*;
use taut::tuning::load;
use taut::tuning::pitch::{cents, cents_of_ratio, ratio_from_cents, ratio_to_f64};

proptest! {
    #[test]
    fn ratio_cents_round_trip(numer in 1i128..1_000_000, denom in 1i128..1_000_000) {
        let ratio = Ratio::new(numer, denom);
        let c = cents_of_ratio(&ratio);
        let back = ratio_from_cents(c);
        prop_assert!((back / ratio_to_f64(&ratio) - 1.0).abs() < 1e-12);
        prop_assert!((cents(back) - c).abs() < 1e-7);
    }

    #[test]
    fn every_edo_degree_n_is_one_period_up(divisions in 1u32..2000, k in -5000i64..5000) {
        // Beyond about 1000 octaves from 440 Hz a frequency no longer fits in an f64.
        prop_assume!(k.abs() / i64::from(divisions) < 900);
        let tuning = load(&format!("{divisions}edo")).unwrap();
        let n = i64::from(divisions);
        let low = tuning.degree(k).unwrap();
        let high = tuning.degree(k + n).unwrap();
        prop_assert!((high.cents_from_reference - low.cents_from_reference - 1200.0).abs() < 1e-7);
        prop_assert!((high.hz / low.hz - 2.0).abs() < 1e-12);
        let period = tuning.degree(n).unwrap();
        prop_assert_eq!(period.ratio, Some(Ratio::from_integer(2)));
    }

    #[test]
    fn equal_divisions_of_any_ratio_stack_to_it(divisions in 1u32..200, p in 2i128..50, q in 1i128..50) {
        prop_assume!(p > q);
        let tuning = load(&format!("{divisions}ed{p}/{q}")).unwrap();
        let top = tuning.degree(i64::from(divisions)).unwrap();
        prop_assert_eq!(top.ratio, Some(Ratio::new(p, q)));
    }

    #[test]
    fn a_periods_degrees_ascend(
        generator_cents in 50.0f64..1150.0,
        up in 0u64..30,
        down in 0u64..30,
        period in 0i64..4,
    ) {
        // Chains may land twice on a degree; those are refused, the rest must ascend.
        if let Ok(tuning) = load(&format!("chain:{generator_cents}c,{up},{down}")) {
            let n = tuning.degrees_per_period().unwrap() as i64;
            prop_assert_eq!(n as u64, up + down + 1);
            let mut previous = f64::NEG_INFINITY;
            for k in period * n..=(period + 1) * n {
                let c = tuning.degree(k).unwrap().cents_from_reference;
                prop_assert!(c > previous, "degree {} at {} after {}", k, c, previous);
                previous = c;
            }
        }
    }

    #[test]
    fn nearest_degree_of_a_degree_is_itself(divisions in 1u32..500, k in -2000i64..2000) {
        prop_assume!(k.abs() / i64::from(divisions) < 900);
        let tuning = load(&format!("{divisions}edo")).unwrap();
        let pitch = tuning.degree(k).unwrap();
        prop_assert_eq!(tuning.nearest_degree(pitch.hz).unwrap().degree, k);
    }

    #[test]
    fn pitch_parsing_never_panics(text in "\\PC{0,12}") {
        let _ = text.parse::<taut::tuning::pitch::PitchSpec>();
        let _ = load(&text);
    }
}
