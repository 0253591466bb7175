//! Instrument files, read and then solved in 12-EDO with the shipped string kinds: no panic, no
//! hang; a refusal is bad input; a finished plan has finite numbers.
#![no_main]

use libfuzzer_sys::fuzz_target;
use taut::instrument::Instrument;
use taut::strings::stock::Stock;
use taut::tuning::library;

fuzz_target!(|text: &str| {
    let instrument = match Instrument::from_text(text.to_string(), "fuzz.yaml") {
        Ok(instrument) => instrument,
        Err(err) => {
            assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}");
            return;
        }
    };
    let Some(Ok(tuning)) = library::load("12edo") else {
        panic!("the shipped 12edo must load");
    };
    let Ok(stock) = Stock::builtin() else {
        panic!("the shipped stock must load");
    };
    match taut::plan::solve::solve(&instrument, &tuning, stock, None) {
        Ok(plan) => {
            assert!(plan.total_tension_n.is_finite(), "total {}", plan.total_tension_n);
            for course in &plan.courses {
                assert!(course.pitch.hz.is_finite() && course.pitch.hz > 0.0);
                assert!(course.length_m.is_finite() && course.length_m > 0.0);
                for string in &course.strings {
                    assert!(string.choice.tension_n.is_finite());
                }
            }
        }
        Err(err) => assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}"),
    }
});
