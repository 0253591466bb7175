//! String-set files (the strings installed on an instrument): no panic, no hang; a refusal is
//! bad input.
#![no_main]

use libfuzzer_sys::fuzz_target;
use taut::set::StringSet;

fuzz_target!(|text: &str| {
    if let Err(err) = StringSet::from_text(text.to_string(), "fuzz.yaml") {
        assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}");
    }
});
