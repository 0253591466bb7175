//! Layout files (`taut lengths`), read and then laid out with default options: no panic, no
//! hang; a refusal is bad input.
#![no_main]

use libfuzzer_sys::fuzz_target;
use taut::lengths::{lay_out, LayoutInput, LayoutOptions};
use taut::strings::stock::Stock;

fuzz_target!(|text: &str| {
    let Ok(stock) = Stock::builtin() else {
        panic!("the shipped string data must load");
    };
    let input = match LayoutInput::from_text(text.to_string(), "fuzz.yaml", &stock) {
        Ok(input) => input,
        Err(err) => {
            assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}");
            return;
        }
    };
    if let Err(err) = lay_out(&input, &stock, &LayoutOptions::default()) {
        assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}");
    }
});
