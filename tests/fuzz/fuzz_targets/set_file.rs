//! String-set files (the strings installed on an instrument): no panic, no hang; a refusal is
//! bad input.
#![no_main]

use libfuzzer_sys::fuzz_target;
use taut::sets::set::StringSet;
use taut::strings::stock::Stock;

fuzz_target!(|text: &str| {
    let Ok(stock) = Stock::builtin() else {
        panic!("the shipped string data must load");
    };
    if let Err(err) = StringSet::from_text(text.to_string(), "fuzz.yaml", &stock) {
        assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}");
    }
});
