//! Instrument files with tunings and variants, planned as one set for all of them with the
//! shipped string kinds: no panic, no hang; a refusal is bad input; a finished plan has finite
//! numbers.
#![no_main]

use libfuzzer_sys::fuzz_target;
use taut::instrument::Instrument;
use taut::plan::several::{plan, SeveralOptions};
use taut::strings::stock::Stock;

fuzz_target!(|text: &str| {
    let instrument = match Instrument::from_text(text.to_string(), "fuzz.yaml") {
        Ok(instrument) => instrument,
        Err(err) => {
            assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}");
            return;
        }
    };
    let Ok(stock) = Stock::builtin() else {
        panic!("the shipped string data must load");
    };
    let options = SeveralOptions {
        tunings: Vec::new(),
        tension: None,
        balance: Default::default(),
    };
    match plan(&instrument, stock, &options) {
        Ok(several) => {
            for block in &several.tunings {
                assert!(block.plan.total_tension_n.is_finite(), "{}", block.plan.total_tension_n);
            }
        }
        Err(err) => assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}"),
    }
});
