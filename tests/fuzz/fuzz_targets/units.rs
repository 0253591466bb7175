//! Quantity strings (`648mm`, `70N`, ...): no panic, and anything accepted is finite and positive.
#![no_main]

use libfuzzer_sys::fuzz_target;
use taut::input::units::{Density, Dimension, Force, Frequency, Length, Mass, Pressure, UnitMass};

fuzz_target!(|text: &str| {
    for dimension in [
        Dimension::Length,
        Dimension::Force,
        Dimension::Frequency,
        Dimension::Mass,
        Dimension::UnitMass,
        Dimension::Density,
        Dimension::Pressure,
    ] {
        if let Ok(value) = taut::input::units::parse_quantity(text, dimension) {
            assert!(value.is_finite(), "{text:?} parsed to {value}");
        }
    }
    macro_rules! positive {
        ($($ty:ty),*) => {$(
            if let Ok(q) = text.parse::<$ty>() {
                assert!(q.si().is_finite() && q.si() > 0.0, "{text:?} parsed to {}", q.si());
            }
        )*};
    }
    positive!(Length, Force, Frequency, Mass, UnitMass, Density, Pressure);
});
