//! Survey settings files, read and then surveyed on the shipped fanned eight-course example: no
//! panic, no hang; a refusal is bad input; a finished survey's figures are finite.
#![no_main]

use libfuzzer_sys::fuzz_target;
use taut::instrument::Instrument;
use taut::strings::stock::Stock;
use taut::survey::{Settings, Survey};

const INSTRUMENT: &str = include_str!("../../../examples/fanned-8-fourths.yaml");

fuzz_target!(|text: &str| {
    let Ok(instrument) = Instrument::from_text(INSTRUMENT.to_string(), "fanned.yaml") else {
        panic!("the shipped example must load");
    };
    let Ok(stock) = Stock::builtin() else {
        panic!("the shipped string data must load");
    };
    let settings = match Settings::from_text(text.to_string(), "fuzz.yaml") {
        Ok(settings) => settings,
        Err(err) => {
            assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}");
            return;
        }
    };
    let survey = match Survey::prepare(&instrument, &settings, stock) {
        Ok(survey) => survey,
        Err(err) => {
            assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}");
            return;
        }
    };
    // Parsing and preparing are fuzzed whatever the size; the sweep itself only on small spaces,
    // so the fuzzer spends its time on many inputs rather than a few large surveys (the sweep's
    // results are checked against the plain solver in tests/it/survey.rs).
    if survey.size().course_checks > 20_000 {
        return;
    }
    match survey.run(&|_| {}) {
        Ok(report) => {
            assert!(report.stringable <= report.candidates);
            for ranked in &report.results {
                assert!(ranked.course_1_hz.is_finite() && ranked.course_1_hz > 0.0);
            }
        }
        Err(err) => assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}"),
    }
});
