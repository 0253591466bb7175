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

/// The plausible range of one kind of quantity: generous, but what a real string or instrument
/// can have. Values outside it are refused where they are read, with the range in the message,
/// so that nothing downstream computes with `1e300 m` or `1e-300 mm` (and no report can show
/// `inf` or `NaN`). The table with the reasons is in DEVELOPERS.md ("Plausible ranges").
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Bounds {
    /// Smallest accepted value, SI.
    pub min: f64,
    /// Largest accepted value, SI.
    pub max: f64,
    /// What is bounded, for messages (`a vibrating length`).
    pub what: &'static str,
    /// The range as people write it (`1 mm to 100 m`).
    pub shown: &'static str,
    /// The SI unit symbol, for showing a value.
    pub unit: &'static str,
}

impl Bounds {
    /// Whether `si` lies in the range (NaN never does).
    pub fn contains(self, si: f64) -> bool {
        si >= self.min && si <= self.max
    }

    /// `si` if it lies in the range; else an error that gives the value and the range.
    pub fn check(self, si: f64) -> Result<f64> {
        if self.contains(si) {
            Ok(si)
        } else {
            Err(self.refusal(&format!("{} {}", short_number(si), self.unit)))
        }
    }

    /// The error for a value (written as the user wrote it) outside the range.
    pub fn refusal(self, written: &str) -> Error {
        Error::input(format!(
            "`{written}` is outside the range taut accepts for {}: {}",
            self.what, self.shown
        ))
        .help("no real string or instrument comes near it; check the number and its unit")
    }
}

/// A number short enough for a message: plain for everyday sizes, with an exponent otherwise.
pub fn short_number(value: f64) -> String {
    if value != 0.0 && (value.abs() >= 1e6 || value.abs() < 1e-3) {
        format!("{value:.3e}")
    } else {
        let text = format!("{value:.4}");
        let text = text.trim_end_matches('0').trim_end_matches('.');
        text.to_string()
    }
}

/// Vibrating, scale and afterlengths and weighed pieces: 1 mm to 100 m. A concert grand's
/// longest string is about 2 m and a double bass's about 1.1 m (common practice, from memory);
/// long-string installations reach tens of metres.
pub const LENGTH_BOUNDS: Bounds = Bounds {
    min: 0.001,
    max: 100.0,
    what: "a length",
    shown: "1 mm to 100 m",
    unit: "m",
};

/// Diameters (outer, core, gauges, nut slots): 0.01 mm to 25 mm. The finest instrument wire is
/// about 0.1 mm and piano bass strings reach about 7 mm (common practice, from memory).
pub const DIAMETER_BOUNDS: Bounds = Bounds {
    min: 1e-5,
    max: 0.025,
    what: "a diameter",
    shown: "0.01 mm to 25 mm",
    unit: "m",
};

/// Forces (tensions, loads, pushes): 0.001 N to 1000 kN. A slack nylon string holds a few newtons,
/// a concert grand's frame about 200 kN in all (common practice, from memory).
pub const FORCE_BOUNDS: Bounds = Bounds {
    min: 0.001,
    max: 1e6,
    what: "a force",
    shown: "0.001 N to 1000 kN",
    unit: "N",
};

/// Frequencies (pitches, references): 1 Hz to 30 kHz. A piano's lowest string sounds at
/// 27.5 Hz and its highest at 4186 Hz (ISO 16 pitch, 12-EDO); hearing ends near 20 kHz.
pub const FREQUENCY_BOUNDS: Bounds = Bounds {
    min: 1.0,
    max: 30_000.0,
    what: "a frequency",
    shown: "1 Hz to 30 kHz",
    unit: "Hz",
};

/// Masses of weighed strings: 0.1 mg to 10 kg (a piano's heaviest string weighs a few hundred
/// grams; common practice, from memory).
pub const MASS_BOUNDS: Bounds = Bounds {
    min: 1e-7,
    max: 10.0,
    what: "a mass",
    shown: "0.1 mg to 10 kg",
    unit: "kg",
};

/// Linear densities μ: 0.01 mg/m to 10 kg/m. Nylon of 0.01 mm is about 0.09 mg/m; a tungsten
/// rod of 25 mm would be about 9.5 kg/m (DERIVED from handbook densities).
pub const UNIT_MASS_BOUNDS: Bounds = Bounds {
    min: 1e-8,
    max: 10.0,
    what: "a mass per length",
    shown: "0.00001 g/m to 10 kg/m",
    unit: "kg/m",
};

/// Densities: 300 to 25,000 kg/m³. The lightest string plastics are about 900 kg/m³ and a wound
/// string's average is lower (the gaps between wraps); the densest metal, osmium, is about
/// 22,590 kg/m³ (CRC Handbook of Chemistry and Physics, from memory).
pub const DENSITY_BOUNDS: Bounds = Bounds {
    min: 300.0,
    max: 25_000.0,
    what: "a density",
    shown: "300 to 25000 kg/m3",
    unit: "kg/m3",
};

/// Stresses, strengths and moduli: 1 MPa to 1 TPa. Nylon's modulus is a few GPa, steel's about
/// 200 GPa, tungsten's about 411 GPa (Shigley; handbook values, from memory).
pub const PRESSURE_BOUNDS: Bounds = Bounds {
    min: 1e6,
    max: 1e12,
    what: "a stress, strength or modulus",
    shown: "1 MPa to 1 TPa",
    unit: "Pa",
};

/// Core-to-outer diameter ratios of wound strings: 0.05 to 0.95 (common practice: about 0.3 to
/// 0.6 for guitar and piano strings, from memory).
pub const CORE_RATIO_BOUNDS: Bounds = Bounds {
    min: 0.05,
    max: 0.95,
    what: "a core-to-outer diameter ratio",
    shown: "0.05 to 0.95",
    unit: "",
};

/// Checks a measured string: its μ (given, or a weighed mass over its length) must be a
/// plausible linear density, and with a diameter it must imply a plausible average density
/// ρ = μ / (π d²/4) (mass per volume of a cylinder; OpenStax University Physics Vol. 1 §16.3
/// for μ). A string of 1 mm weighing 77 g/m would be 99,000 kg/m³ through: a slipped unit.
pub fn check_measured_string(unit_mass: f64, diameter: Option<f64>) -> Result<()> {
    UNIT_MASS_BOUNDS.check(unit_mass).map_err(|_| {
        Error::input(format!(
            "the string's mass per length comes to {} g/m, outside the range taut accepts for {}: {}",
            short_number(unit_mass * 1000.0),
            UNIT_MASS_BOUNDS.what,
            UNIT_MASS_BOUNDS.shown
        ))
        .help("check the mass and the length, and their units")
    })?;
    if let Some(diameter) = diameter {
        let density = unit_mass / (std::f64::consts::PI * diameter * diameter / 4.0);
        if !DENSITY_BOUNDS.contains(density) {
            return Err(Error::input(format!(
                "a string {} mm thick with {} g/m would be {} kg/m3 through, outside {} for {}",
                short_number(diameter * 1000.0),
                short_number(unit_mass * 1000.0),
                short_number(density.round()),
                DENSITY_BOUNDS.shown,
                DENSITY_BOUNDS.what
            ))
            .help("check the diameter and the mass (or mass per length), and their units"));
        }
    }
    Ok(())
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
                let raw = QuantityText::deserialize(deserializer)?;
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
#[derive(Deserialize)]
#[serde(untagged)]
enum QuantityText {
    Number(f64),
    Text(String),
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

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn parses_practitioners_units() {
        // Exact conversion factors: NIST SP 811 (international inch and pound, standard gravity).
        assert_relative_eq!("648mm".parse::<Length>().unwrap().si(), 0.648);
        assert_relative_eq!(
            "25.5 in".parse::<Length>().unwrap().si(),
            0.6477,
            epsilon = 1e-12
        );
        assert_relative_eq!(
            "16lbf".parse::<Force>().unwrap().si(),
            71.171_545_844_168,
            epsilon = 1e-9
        );
        assert_relative_eq!(
            "7 kgf".parse::<Force>().unwrap().si(),
            68.646_55,
            epsilon = 1e-9
        );
        assert_relative_eq!("82.41Hz".parse::<Frequency>().unwrap().si(), 82.41);
        assert_relative_eq!(
            "0.284lb/in3".parse::<Density>().unwrap().si(),
            7861.093,
            epsilon = 0.01
        );
        assert_relative_eq!(
            "1ksi".parse::<Pressure>().unwrap().si(),
            6.894_757_293_168e6,
            epsilon = 1e-3
        );
        assert_relative_eq!("1e3N".parse::<Force>().unwrap().si(), 1000.0);
        // `lb` and `lbs` are pound-force where a force is asked for, pounds where a mass is.
        assert_relative_eq!(
            "16 lb".parse::<Force>().unwrap().si(),
            16.0 * NEWTONS_PER_LBF
        );
        assert_relative_eq!(
            "16lbs".parse::<Force>().unwrap().si(),
            16.0 * NEWTONS_PER_LBF
        );
        assert_relative_eq!("2 lbs".parse::<Mass>().unwrap().si(), 2.0 * KG_PER_POUND);
    }

    #[test]
    fn refuses_wrong_dimension_missing_unit_and_non_positive() {
        let err = "70N".parse::<Length>().unwrap_err().to_string();
        assert!(
            err.contains("is a force") && err.contains("needs a length"),
            "{err}"
        );
        assert!("648"
            .parse::<Length>()
            .unwrap_err()
            .to_string()
            .contains("no unit"));
        assert!("0mm".parse::<Length>().is_err());
        assert!("-3mm".parse::<Length>().is_err());
        assert!("NaNmm".parse::<Length>().is_err());
        assert!("infmm".parse::<Length>().is_err());
        let err = "648 milimetres".parse::<Length>().unwrap_err().to_string();
        assert!(err.contains("unknown unit"), "{err}");
        assert!(Length::new(f64::NAN).is_err());
    }

    #[test]
    fn deserialize_names_the_problem() {
        #[derive(Debug, Deserialize)]
        #[allow(dead_code)]
        struct Probe {
            length: Length,
        }
        let err = crate::input::yaml::parse::<Probe>("length: 648\n", "p.yaml")
            .unwrap_err()
            .to_string();
        assert!(
            err.contains("p.yaml:1:") && err.contains("no unit"),
            "{err}"
        );
        let ok: Probe = crate::input::yaml::parse("length: 25.5in\n", "p.yaml").unwrap();
        assert_relative_eq!(ok.length.si(), 0.6477, epsilon = 1e-12);
    }

    #[test]
    fn output_units_convert_back() {
        assert_relative_eq!(ForceUnit::Lbf.from_newtons(NEWTONS_PER_LBF), 1.0);
        assert_relative_eq!(LengthUnit::In.from_metres(0.0254), 1.0);
    }
}
