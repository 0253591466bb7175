//! Tuning definition files: no panic, no hang; an accepted tuning gives finite, positive
//! frequencies; a refusal is bad input (exit code 2).
#![no_main]

#[path = "common.rs"]
mod common;

use libfuzzer_sys::fuzz_target;

fuzz_target!(|text: &str| {
    match taut::tuning::definition::parse(text, "fuzz.yaml") {
        Ok(tuning) => common::check_tuning(&tuning),
        Err(err) => assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT),
    }
});
