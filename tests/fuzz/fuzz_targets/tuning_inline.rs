//! Inline tuning specs (`19edo`, `ratios:1/1,9/8:2/1`, `cents:...`, `hertz:...`, `chain:...`),
//! each optionally with `@reference`: no panic, no hang, and any accepted tuning gives finite,
//! positive frequencies.
#![no_main]

#[path = "common.rs"]
mod common;

use libfuzzer_sys::fuzz_target;
use taut::tuning::{inline, ReferenceSpec};

fuzz_target!(|spec: &str| {
    let (body, reference) = match spec.rsplit_once('@') {
        Some((body, reference)) => (body, Some(reference)),
        None => (spec, None),
    };
    let _ = inline::looks_inline(body);
    let Ok(tuning) = inline::parse(body) else {
        return;
    };
    common::check_tuning(&tuning);
    if let Some(text) = reference {
        if let Ok(reference) = ReferenceSpec::parse(text).and_then(|r| r.resolve()) {
            assert!(reference.hz.is_finite() && reference.hz > 0.0);
            if let Ok(placed) = tuning.with_reference(reference) {
                common::check_tuning(&placed);
            }
        }
    }
});
