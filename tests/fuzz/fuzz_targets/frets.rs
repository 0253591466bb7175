//! Instrument files with `frets:` settings, laid out in the instrument's own tuning: no panic,
//! no hang; a refusal is bad input; every fret lies on the string.
#![no_main]

use libfuzzer_sys::fuzz_target;
use taut::frets::lay_out;
use taut::instrument::{FretSettings, Instrument};
use taut::plan::solve::tuning_for;

fuzz_target!(|text: &str| {
    let instrument = match Instrument::from_text(text.to_string(), "fuzz.yaml") {
        Ok(instrument) => instrument,
        Err(err) => {
            assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}");
            return;
        }
    };
    let tuning = match tuning_for(&instrument, None, "--tuning") {
        Ok(tuning) => tuning,
        Err(err) => {
            assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}");
            return;
        }
    };
    match lay_out(&instrument, &tuning, &FretSettings::default()) {
        Ok(layout) => {
            for course in &layout.courses {
                for fret in &course.frets {
                    assert!(fret.distance_from_nut_m.is_finite() && fret.distance_from_nut_m >= 0.0);
                }
            }
        }
        Err(err) => assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}"),
    }
});
