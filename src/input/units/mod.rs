//! Quantities with units, as practitioners write them.
//!
//! Files and options take a number with its unit (`648mm`, `25.5 in`, `70N`, `16 lbf`, `7kgf`,
//! `82.41Hz`, `7850 kg/m3`, `2.1 GPa`); the library computes in SI. A bare number is refused for
//! a dimensional field, because guessing between inches and millimetres is how strings break.
//!
//! Conversion factors are exact by the international yard-and-pound definitions (NIST SP 811):
//! 1 in = 0.0254 m, 1 lb = 0.45359237 kg, g_n = 9.80665 m/s², so 1 lbf = 4.4482216152605 N and
//! 1 kgf = 9.80665 N.

use std::fmt;
use std::str::FromStr;

use serde::{Deserialize, Serialize};

use crate::error::{Error, Result};

mod bounds;
#[allow(unused_imports)]
use bounds::*;
mod fixed;
pub use fixed::{fixed, push_fixed, push_signed_fixed};

#[cfg(test)]
mod tests;
pub use bounds::*;

/// Metres per inch (exact).
pub const METRES_PER_INCH: f64 = 0.0254;
/// Kilograms per pound (exact).
pub const KG_PER_POUND: f64 = 0.453_592_37;
/// Standard gravity in m/s² (exact, CGPM 1901).
pub const STANDARD_GRAVITY: f64 = 9.806_65;
/// Newtons per pound-force (exact from the definitions above).
pub const NEWTONS_PER_LBF: f64 = KG_PER_POUND * STANDARD_GRAVITY;
/// Newtons per kilogram-force (exact).
pub const NEWTONS_PER_KGF: f64 = STANDARD_GRAVITY;
/// Pascals per pound-force per square inch.
pub const PASCALS_PER_PSI: f64 = NEWTONS_PER_LBF / (METRES_PER_INCH * METRES_PER_INCH);

/// The physical dimension of a quantity; decides which unit symbols a field accepts.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Dimension {
    /// Metres.
    Length,
    /// Newtons.
    Force,
    /// Hertz.
    Frequency,
    /// Kilograms.
    Mass,
    /// Kilograms per metre (linear density, μ).
    UnitMass,
    /// Kilograms per cubic metre.
    Density,
    /// Pascals (stress, strength, modulus).
    Pressure,
}

impl Dimension {
    /// Plain-language name used in messages.
    pub fn noun(self) -> &'static str {
        match self {
            Dimension::Length => "a length",
            Dimension::Force => "a force",
            Dimension::Frequency => "a frequency",
            Dimension::Mass => "a mass",
            Dimension::UnitMass => "a mass per length",
            Dimension::Density => "a density",
            Dimension::Pressure => "a stress",
        }
    }

    /// An example a user can copy.
    pub fn example(self) -> &'static str {
        match self {
            Dimension::Length => "648mm",
            Dimension::Force => "70N",
            Dimension::Frequency => "440Hz",
            Dimension::Mass => "1.2g",
            Dimension::UnitMass => "0.4g/m",
            Dimension::Density => "7850kg/m3",
            Dimension::Pressure => "2400MPa",
        }
    }
}

/// Every accepted unit symbol, its dimension and its factor to SI.
const UNITS: &[(&str, Dimension, f64)] = &[
    ("m", Dimension::Length, 1.0),
    ("cm", Dimension::Length, 0.01),
    ("mm", Dimension::Length, 0.001),
    ("in", Dimension::Length, METRES_PER_INCH),
    ("\"", Dimension::Length, METRES_PER_INCH),
    ("N", Dimension::Force, 1.0),
    ("kN", Dimension::Force, 1000.0),
    ("lbf", Dimension::Force, NEWTONS_PER_LBF),
    ("kgf", Dimension::Force, NEWTONS_PER_KGF),
    // What people write for a force in pounds: `16 lb` and `16 lbs` mean pound-force there.
    ("lb", Dimension::Force, NEWTONS_PER_LBF),
    ("lbs", Dimension::Force, NEWTONS_PER_LBF),
    ("Hz", Dimension::Frequency, 1.0),
    ("kHz", Dimension::Frequency, 1000.0),
    ("kg", Dimension::Mass, 1.0),
    ("g", Dimension::Mass, 0.001),
    ("mg", Dimension::Mass, 1e-6),
    ("lb", Dimension::Mass, KG_PER_POUND),
    ("lbs", Dimension::Mass, KG_PER_POUND),
    ("kg/m", Dimension::UnitMass, 1.0),
    ("g/m", Dimension::UnitMass, 0.001),
    ("lb/in", Dimension::UnitMass, KG_PER_POUND / METRES_PER_INCH),
    ("kg/m3", Dimension::Density, 1.0),
    ("kg/m^3", Dimension::Density, 1.0),
    ("g/cm3", Dimension::Density, 1000.0),
    ("g/cm^3", Dimension::Density, 1000.0),
    (
        "lb/in3",
        Dimension::Density,
        KG_PER_POUND / (METRES_PER_INCH * METRES_PER_INCH * METRES_PER_INCH),
    ),
    ("Pa", Dimension::Pressure, 1.0),
    ("kPa", Dimension::Pressure, 1e3),
    ("MPa", Dimension::Pressure, 1e6),
    ("GPa", Dimension::Pressure, 1e9),
    ("N/mm2", Dimension::Pressure, 1e6),
    ("psi", Dimension::Pressure, PASCALS_PER_PSI),
    ("ksi", Dimension::Pressure, PASCALS_PER_PSI * 1e3),
];

/// Parses `text` as a number followed by a unit of `dimension`, returning the SI value.
///
/// The number must be finite. Sign and zero are the caller's business (see the newtypes below).
pub fn parse_quantity(text: &str, dimension: Dimension) -> Result<f64> {
    let trimmed = text.trim();
    let split = trimmed
        .char_indices()
        .find(|&(i, c)| {
            !(c.is_ascii_digit()
                || c == '.'
                || c == '+'
                || c == '-'
                || ((c == 'e' || c == 'E') && i > 0 && is_exponent(trimmed, i)))
        })
        .map_or(trimmed.len(), |(i, _)| i);
    let (number, unit) = trimmed.split_at(split);
    let unit = unit.trim();
    let accepted = || {
        UNITS
            .iter()
            .filter(|(_, d, _)| *d == dimension)
            .map(|(s, _, _)| *s)
            .collect::<Vec<_>>()
            .join(", ")
    };
    if number.is_empty() {
        return Err(Error::input(format!(
            "`{trimmed}` is not {}: it has no number",
            dimension.noun()
        ))
        .help(format!("write e.g. `{}`", dimension.example())));
    }
    let value: f64 = number.parse().map_err(|_| {
        Error::input(format!("`{number}` in `{trimmed}` is not a number"))
            .help(format!("write e.g. `{}`", dimension.example()))
    })?;
    if !value.is_finite() {
        return Err(Error::input(format!("`{trimmed}` is not a finite number")));
    }
    if unit.is_empty() {
        return Err(Error::input(format!(
            "`{trimmed}` has no unit; this field needs {}",
            dimension.noun()
        ))
        .help(format!(
            "write the unit too, e.g. `{}` (units: {})",
            dimension.example(),
            accepted()
        )));
    }
    // A symbol may mean two dimensions (`lb`): the one this field needs comes first.
    let entry = UNITS
        .iter()
        .find(|(symbol, found, _)| *symbol == unit && *found == dimension)
        .or_else(|| UNITS.iter().find(|(symbol, _, _)| *symbol == unit));
    match entry {
        Some((_, found, factor)) if *found == dimension => {
            // A finite number can still overflow once converted (1e308 kN).
            let si = value * factor;
            if si.is_finite() {
                Ok(si)
            } else {
                Err(Error::input(format!(
                    "`{trimmed}` is too large to compute with"
                )))
            }
        }
        Some((_, found, _)) => Err(Error::input(format!(
            "`{trimmed}` is {}, but this field needs {}",
            found.noun(),
            dimension.noun()
        ))
        .help(format!("units for this field: {}", accepted()))),
        None => {
            let same_dimension: Vec<&str> = UNITS
                .iter()
                .filter(|(_, d, _)| *d == dimension)
                .map(|(s, _, _)| *s)
                .collect();
            let hint = match crate::error::did_you_mean(unit, same_dimension.iter().copied()) {
                Some(best) => format!("did you mean `{number}{best}`? (units: {})", accepted()),
                None => format!("units for this field: {}", accepted()),
            };
            Err(Error::input(format!("unknown unit `{unit}` in `{trimmed}`")).help(hint))
        }
    }
}

fn is_exponent(text: &str, index: usize) -> bool {
    // `e` belongs to the number only when digits follow (`1e3`), not in units such as `Hz`... or `ksi`.
    let rest = &text[index + 1..];
    let rest = rest.strip_prefix(['+', '-']).unwrap_or(rest);
    rest.chars().next().is_some_and(|c| c.is_ascii_digit())
}

macro_rules! positive_quantity {
    ($(#[$doc:meta])* $name:ident, $dimension:expr, $bounds:expr, $si:literal) => {
        $(#[$doc])*
        #[derive(Debug, Clone, Copy, PartialEq, PartialOrd, Serialize)]
        #[serde(transparent)]
        pub struct $name(f64);

        impl $name {
            /// The plausible range of this quantity.
            pub const BOUNDS: Bounds = $bounds;

            #[doc = concat!("Builds from a value in ", $si, "; refuses values outside [`Self::BOUNDS`] (so zero, negative and non-finite values too).")]
            pub fn new(si: f64) -> Result<Self> {
                Self::BOUNDS.check(si).map(Self)
            }

            #[doc = concat!("The value in ", $si, ".")]
            pub fn si(self) -> f64 {
                self.0
            }
        }

        impl FromStr for $name {
            type Err = Error;

            fn from_str(text: &str) -> Result<Self> {
                let value = parse_quantity(text, $dimension)?;
                if value <= 0.0 {
                    Err(Error::input(format!(
                        "`{}` must be greater than zero",
                        text.trim()
                    )))
                } else if Self::BOUNDS.contains(value) {
                    Ok(Self(value))
                } else {
                    Err(Self::BOUNDS.refusal(text.trim()))
                }
            }
        }

        impl<'de> Deserialize<'de> for $name {
            fn deserialize<D: serde::Deserializer<'de>>(deserializer: D) -> std::result::Result<Self, D::Error> {
                let raw = deserializer.deserialize_any(QuantityVisitor($dimension))?;
                match raw {
                    QuantityText::Text(text) => text.parse().map_err(|err: Error| serde::de::Error::custom(err.plain_message())),
                    QuantityText::Number(number) => Err(serde::de::Error::custom(format!(
                        "`{number}` has no unit; write {} with its unit, e.g. `{}`",
                        $dimension.noun(),
                        $dimension.example()
                    ))),
                }
            }
        }

        impl fmt::Display for $name {
            fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
                write!(f, "{} {}", self.0, $si)
            }
        }
    };
}

positive_quantity!(
    /// A diameter (outer, core, gauge, nut slot), in metres, within [`DIAMETER_BOUNDS`].
    Diameter,
    Dimension::Length,
    DIAMETER_BOUNDS,
    "m"
);

/// A YAML scalar that should hold a quantity: text such as `648mm`, or a bare number (refused).
enum QuantityText {
    Number(f64),
    Text(String),
}

/// Reads a [`QuantityText`] of one dimension. A visitor rather than an untagged enum: the
/// untagged form buffered every value and built an error message for each failed variant, which
/// made quantities the costliest part of reading a file; the visitor also names the dimension
/// when the value is of the wrong type (a list, a mapping, `true`).
struct QuantityVisitor(Dimension);

impl<'de> serde::de::Visitor<'de> for QuantityVisitor {
    type Value = QuantityText;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(
            f,
            "{} with its unit, e.g. `{}`",
            self.0.noun(),
            self.0.example()
        )
    }

    fn visit_str<E: serde::de::Error>(self, text: &str) -> std::result::Result<QuantityText, E> {
        Ok(QuantityText::Text(text.to_string()))
    }

    fn visit_f64<E: serde::de::Error>(self, number: f64) -> std::result::Result<QuantityText, E> {
        Ok(QuantityText::Number(number))
    }

    fn visit_i64<E: serde::de::Error>(self, number: i64) -> std::result::Result<QuantityText, E> {
        Ok(QuantityText::Number(number as f64))
    }

    fn visit_u64<E: serde::de::Error>(self, number: u64) -> std::result::Result<QuantityText, E> {
        Ok(QuantityText::Number(number as f64))
    }
}

positive_quantity!(
    /// A length (vibrating length, afterlength, a weighed piece), in metres, within
    /// [`LENGTH_BOUNDS`].
    Length,
    Dimension::Length,
    LENGTH_BOUNDS,
    "m"
);
positive_quantity!(
    /// A force greater than zero (tension, load), in newtons.
    Force,
    Dimension::Force,
    FORCE_BOUNDS,
    "N"
);
positive_quantity!(
    /// A frequency greater than zero, in hertz.
    Frequency,
    Dimension::Frequency,
    FREQUENCY_BOUNDS,
    "Hz"
);
positive_quantity!(
    /// A mass greater than zero (a weighed string), in kilograms.
    Mass,
    Dimension::Mass,
    MASS_BOUNDS,
    "kg"
);
positive_quantity!(
    /// A linear density μ greater than zero, in kilograms per metre.
    UnitMass,
    Dimension::UnitMass,
    UNIT_MASS_BOUNDS,
    "kg/m"
);
positive_quantity!(
    /// A density greater than zero, in kilograms per cubic metre.
    Density,
    Dimension::Density,
    DENSITY_BOUNDS,
    "kg/m³"
);
positive_quantity!(
    /// A stress, strength or elastic modulus greater than zero, in pascals.
    Pressure,
    Dimension::Pressure,
    PRESSURE_BOUNDS,
    "Pa"
);

/// How tensions are shown to the user.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum ForceUnit {
    /// Newtons.
    #[default]
    N,
    /// Pound-force.
    Lbf,
    /// Kilogram-force.
    Kgf,
}

impl ForceUnit {
    /// Converts newtons to this unit.
    pub fn from_newtons(self, newtons: f64) -> f64 {
        match self {
            ForceUnit::N => newtons,
            ForceUnit::Lbf => newtons / NEWTONS_PER_LBF,
            ForceUnit::Kgf => newtons / NEWTONS_PER_KGF,
        }
    }

    /// The unit's symbol.
    pub fn symbol(self) -> &'static str {
        match self {
            ForceUnit::N => "N",
            ForceUnit::Lbf => "lbf",
            ForceUnit::Kgf => "kgf",
        }
    }
}

/// How lengths are shown to the user.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum LengthUnit {
    /// Millimetres.
    #[default]
    Mm,
    /// Inches.
    In,
    /// Metres.
    M,
}

impl LengthUnit {
    /// Converts metres to this unit.
    pub fn from_metres(self, metres: f64) -> f64 {
        match self {
            LengthUnit::Mm => metres * 1000.0,
            LengthUnit::In => metres / METRES_PER_INCH,
            LengthUnit::M => metres,
        }
    }

    /// The unit's symbol.
    pub fn symbol(self) -> &'static str {
        match self {
            LengthUnit::Mm => "mm",
            LengthUnit::In => "in",
            LengthUnit::M => "m",
        }
    }
}
