//! The plausible range of every kind of quantity, and the checks of measured strings against them.

#[allow(unused_imports)]
use super::*;

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
