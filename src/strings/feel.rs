//! Stiffness and feel of one string on its course: how inharmonic it is, and how hard it is to
//! bend. Built on the pure functions of [`crate::strings::physics`]; this module only chooses what to
//! report and with which defaults.
//!
//! # Inharmonicity
//!
//! Fletcher's coefficient B = π³·E·d⁴/(64·T·L²) (H. Fletcher, *J. Acoust. Soc. Am.* 36, 203
//! (1964); REFERENCES §5.1), through [`Construction::inharmonicity`]. For a wound string d and E
//! are the *core's*: the wrap adds mass but almost no bending stiffness (M. Zollner, *Physics of
//! the Electric Guitar* §1.2, READ; REFERENCES §5.3), while T is the actual tension of the whole
//! string. A hexagonal core uses its own second moment of area. B is unknown for a measured string
//! without a material and diameter.
//!
//! The partial offsets are how many cents partials 2, 4 and 8 sit above n times the *sounding*
//! fundamental f₁ = f₀·√(1+B) (not the ideal f₀): 600·log₂((1+Bn²)/(1+B)), so a tuner that sets
//! f₁ to the tuning's pitch hears exactly these offsets (REFERENCES §5.1, DERIVED). Pinned ends
//! are assumed; clamped ends add a small further sharpening that is not included.
//!
//! # Bend
//!
//! The player's figure: the sideways force at mid-length that raises the pitch by
//! [`FeelOptions::bend_cents`] (default 100 cents, a semitone bend), and the pitch rise a push of
//! [`FeelOptions::push_n`] (default 1 N) gives. Model ([`physics::bend_rise_cents`]): pushing
//! the midpoint aside stretches the string, and the added tension E·A·ΔL/L_total spreads along
//! the whole string between its two anchors, the vibrating length plus the afterlengths beyond
//! the nut and the bridge (defaults 80 mm and 40 mm, [`physics::DEFAULT_NUT_AFTERLENGTH`] and
//! [`physics::DEFAULT_BRIDGE_AFTERLENGTH`]: a typical guitar headstock and bridge; set them for
//! your instrument). Longer afterlengths spread the added tension over more string: the string
//! gives more under the finger, and the same rise takes a longer travel and a bigger push.
//! Friction at the nut and
//! saddle, which makes real strings stiffer to bend, is not modelled; E·A is the load-bearing
//! section's (the core of a wound string).

use serde::{Deserialize, Serialize};

use crate::strings::construction::Construction;
use crate::strings::physics::{self, BendGeometry};

/// The partials whose offsets are reported.
pub const PARTIALS: [u32; 3] = [2, 4, 8];

/// Default bend for the force figure: 100 cents, a semitone (a common bend on a fretted string).
pub const DEFAULT_BEND_CENTS: f64 = 100.0;
/// Default push for the rise figure: 1 N, about the weight of 100 g held in the hand.
pub const DEFAULT_PUSH_N: f64 = 1.0;

/// Inputs of the bend model.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FeelOptions {
    /// String beyond the nut to its anchor, m.
    pub nut_afterlength: f64,
    /// String beyond the bridge to its anchor, m.
    pub bridge_afterlength: f64,
    /// Rise for which the force is reported, cents.
    pub bend_cents: f64,
    /// Push for which the rise is reported, N.
    pub push_n: f64,
}

impl Default for FeelOptions {
    fn default() -> Self {
        FeelOptions {
            nut_afterlength: physics::DEFAULT_NUT_AFTERLENGTH,
            bridge_afterlength: physics::DEFAULT_BRIDGE_AFTERLENGTH,
            bend_cents: DEFAULT_BEND_CENTS,
            push_n: DEFAULT_PUSH_N,
        }
    }
}

/// Stiffness and feel figures of one string; each is `None` when the string's load-bearing
/// material or section is unknown.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct Feel {
    /// Fletcher's inharmonicity coefficient B (dimensionless).
    pub inharmonicity_b: Option<f64>,
    /// Cents partial 2 sits above twice the sounding fundamental f₁ = f₀·√(1+B) (the
    /// baseline is n·f₁, not n·f₀ of the flexible string).
    pub partial_2_cents: Option<f64>,
    /// Cents partial 4 sits above four times the sounding fundamental f₁ = f₀·√(1+B) (the
    /// baseline is n·f₁, not n·f₀ of the flexible string).
    pub partial_4_cents: Option<f64>,
    /// Cents partial 8 sits above eight times the sounding fundamental f₁ = f₀·√(1+B) (the
    /// baseline is n·f₁, not n·f₀ of the flexible string).
    pub partial_8_cents: Option<f64>,
    /// The rise the bend figures are for, cents.
    pub bend_cents: f64,
    /// Sideways force at mid-length for that rise, N.
    pub bend_force_n: Option<f64>,
    /// How far the midpoint moves for that rise, m.
    pub bend_displacement_m: Option<f64>,
    /// The push the rise figure is for, N.
    pub push_n: f64,
    /// Pitch rise for that push, cents.
    pub push_rise_cents: Option<f64>,
}

/// The feel of `string` at `tension` (N) on vibrating length `length` (m).
pub fn feel(string: &Construction<'_>, tension: f64, length: f64, options: &FeelOptions) -> Feel {
    let inharmonicity_b = string.inharmonicity(tension, length);
    let offset = |n: u32| inharmonicity_b.map(|b| physics::partial_offset_cents(b, n));
    let geometry = BendGeometry {
        vibrating_length: length,
        nut_afterlength: options.nut_afterlength,
        bridge_afterlength: options.bridge_afterlength,
    };
    let stiffness = string.axial_stiffness();
    Feel {
        inharmonicity_b,
        partial_2_cents: offset(PARTIALS[0]),
        partial_4_cents: offset(PARTIALS[1]),
        partial_8_cents: offset(PARTIALS[2]),
        bend_cents: options.bend_cents,
        bend_force_n: stiffness
            .map(|ea| physics::bend_force_for_rise(geometry, ea, tension, options.bend_cents)),
        bend_displacement_m: stiffness.map(|ea| {
            physics::bend_displacement_for_rise(geometry, ea, tension, options.bend_cents)
        }),
        push_n: options.push_n,
        push_rise_cents: stiffness
            .map(|ea| physics::bend_rise_for_force(geometry, ea, tension, options.push_n)),
    }
}

/// Table cells for a feel: B, the three partial offsets, and the bend force.
pub fn cells(feel: &Feel) -> [String; 3] {
    let b = feel
        .inharmonicity_b
        .map_or("-".to_string(), |b| format!("{b:.2e}"));
    let partials = match (
        feel.partial_2_cents,
        feel.partial_4_cents,
        feel.partial_8_cents,
    ) {
        (Some(p2), Some(p4), Some(p8)) => format!("{p2:.2}/{p4:.1}/{p8:.0}"),
        _ => "-".to_string(),
    };
    let bend = feel
        .bend_force_n
        .map_or("-".to_string(), |force| format!("{force:.1}"));
    [b, partials, bend]
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::strings::material::Materials;

    #[test]
    fn partial_offsets_grow_with_partial_number() {
        let materials = Materials::builtin().unwrap();
        let steel = materials.get("music-wire").unwrap();
        let string = Construction::Plain {
            material: steel,
            diameter: 0.000254,
        };
        let feel = feel(&string, 72.6, 0.648, &FeelOptions::default());
        let (p2, p4, p8) = (
            feel.partial_2_cents.unwrap(),
            feel.partial_4_cents.unwrap(),
            feel.partial_8_cents.unwrap(),
        );
        assert!(0.0 < p2 && p2 < p4 && p4 < p8, "{p2} {p4} {p8}");
        assert!(feel.bend_force_n.unwrap() > 0.0);
    }

    #[test]
    fn unknown_material_gives_no_figures() {
        let string = Construction::Measured(crate::strings::construction::Measured {
            unit_mass: 0.001,
            diameter: None,
            material: None,
        });
        let feel = feel(&string, 50.0, 0.6, &FeelOptions::default());
        assert!(feel.inharmonicity_b.is_none() && feel.bend_force_n.is_none());
        assert_eq!(cells(&feel)[0], "-");
    }
}
