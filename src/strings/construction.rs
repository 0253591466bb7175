//! A concrete string: how it is built, of what, and how thick.
//!
//! Three constructions: a plain solid wire, a round-wound string (core plus one or two layers of
//! round wrap wire), and a measured string whose linear density is known from the maker or from
//! weighing. Only the load-bearing part (the whole of a plain string, the core of a wound one)
//! carries tension (REFERENCES §6.2, PRACTICE).

use crate::strings::material::Material;
use crate::strings::physics::{self, CoreShape, WrapLayer};

/// The core of a wound string.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Core<'m> {
    /// Core material; it carries the tension.
    pub material: &'m Material,
    /// Round or hexagonal section.
    pub shape: CoreShape,
    /// Nominal diameter, m (across the corners or flats for a hexagon, as `shape` says).
    pub diameter: f64,
}

/// One layer of round wrap wire.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Wrap<'m> {
    /// Wrap material.
    pub material: &'m Material,
    /// Diameter of the wrap wire, m.
    pub wire_diameter: f64,
}

/// One or two wrap layers, inner first.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Wraps<'m> {
    /// A single layer.
    One(Wrap<'m>),
    /// Two layers: the inner one, then the outer one.
    Two(Wrap<'m>, Wrap<'m>),
}

impl<'m> Wraps<'m> {
    fn layers(&self) -> ([WrapLayer; 2], usize) {
        let layer = |w: &Wrap<'m>| WrapLayer {
            density: w.material.density(),
            wire_diameter: w.wire_diameter,
        };
        match self {
            Wraps::One(w) => ([layer(w), layer(w)], 1),
            Wraps::Two(inner, outer) => ([layer(inner), layer(outer)], 2),
        }
    }
}

/// A string known by its linear density rather than its build.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Measured<'m> {
    /// Linear density, kg/m.
    pub unit_mass: f64,
    /// Outer diameter, m, if known.
    pub diameter: Option<f64>,
    /// The material whose strength applies, if known. With a diameter, the string is then taken
    /// to be a solid wire of that material for stress and stiffness.
    pub material: Option<&'m Material>,
}

impl<'m> Measured<'m> {
    /// From a weighed piece: μ = m/l (OpenStax *University Physics* Vol. 1 eq. 16.7, READ).
    pub fn from_weighing(
        mass: f64,
        length: f64,
        diameter: Option<f64>,
        material: Option<&'m Material>,
    ) -> Self {
        Measured {
            unit_mass: mass / length,
            diameter,
            material,
        }
    }
}

/// A concrete string.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Construction<'m> {
    /// A solid round wire (or monofilament) of one material.
    Plain {
        /// The material.
        material: &'m Material,
        /// Diameter, m.
        diameter: f64,
    },
    /// Round wire wound on a core.
    Wound {
        /// The load-bearing core.
        core: Core<'m>,
        /// The wrap layers.
        wraps: Wraps<'m>,
    },
    /// Known linear density.
    Measured(Measured<'m>),
}

impl<'m> Construction<'m> {
    /// Linear density μ, kg/m (REFERENCES §1.2 for plain, §6.1–6.2 for wound).
    pub fn unit_mass(&self) -> f64 {
        match self {
            Construction::Plain { material, diameter } => {
                physics::unit_mass_round(material.density(), *diameter)
            }
            Construction::Wound { core, wraps } => {
                let (layers, count) = wraps.layers();
                physics::unit_mass_wound(
                    core.material.density(),
                    core.shape,
                    core.diameter,
                    &layers[..count],
                )
            }
            Construction::Measured(m) => m.unit_mass,
        }
    }

    /// Outer diameter, m, if known.
    pub fn outer_diameter(&self) -> Option<f64> {
        match self {
            Construction::Plain { diameter, .. } => Some(*diameter),
            Construction::Wound { core, wraps } => {
                let (layers, count) = wraps.layers();
                Some(physics::outer_diameter_wound(
                    core.diameter,
                    &layers[..count],
                ))
            }
            Construction::Measured(m) => m.diameter,
        }
    }

    /// The material that carries the tension, if known.
    pub fn load_material(&self) -> Option<&'m Material> {
        match self {
            Construction::Plain { material, .. } => Some(material),
            Construction::Wound { core, .. } => Some(core.material),
            Construction::Measured(m) => m.material,
        }
    }

    /// Nominal diameter of the load-bearing section, m, if known.
    pub fn load_diameter(&self) -> Option<f64> {
        match self {
            Construction::Plain { diameter, .. } => Some(*diameter),
            Construction::Wound { core, .. } => Some(core.diameter),
            Construction::Measured(m) => m.material.and(m.diameter),
        }
    }

    fn load_shape(&self) -> CoreShape {
        match self {
            Construction::Wound { core, .. } => core.shape,
            _ => CoreShape::Round,
        }
    }

    /// Area of the load-bearing section, m², if known.
    pub fn load_area(&self) -> Option<f64> {
        self.load_diameter().map(|d| self.load_shape().area(d))
    }

    /// Breaking strength of the load-bearing material at its diameter, Pa, if known.
    pub fn breaking_strength(&self) -> Option<f64> {
        let diameter = self.load_diameter()?;
        self.load_material()?.strength_at(diameter)
    }

    /// Tension at which the load-bearing section reaches its breaking strength, N, if known.
    pub fn breaking_tension(&self) -> Option<f64> {
        Some(self.breaking_strength()? * self.load_area()?)
    }

    /// Axial stiffness E·A of the load-bearing section, N, if known (for the bend model).
    pub fn axial_stiffness(&self) -> Option<f64> {
        let diameter = self.load_diameter()?;
        Some(self.load_material()?.modulus_at(diameter) * self.load_area()?)
    }

    /// Fletcher's inharmonicity coefficient B at this tension and length, if the load-bearing
    /// section is known (REFERENCES §5.1; core only for wound strings, §5.3).
    pub fn inharmonicity(&self, tension: f64, length: f64) -> Option<f64> {
        let diameter = self.load_diameter()?;
        let modulus = self.load_material()?.modulus_at(diameter);
        let second_moment = self.load_shape().second_moment(diameter);
        Some(physics::inharmonicity_from_second_moment(
            modulus,
            second_moment,
            tension,
            length,
        ))
    }
}

const IN: f64 = 0.0254;

/// Default core-to-outer ratios of a hexagonal steel core under one wrap layer (guitar and
/// electric-bass wound strings), as (outer diameter m, ratio) knots; the ratio is read across the
/// corners, as the shipped kinds are, and interpolated linearly between knots.
///
/// Thin wound strings carry relatively thick cores: a fixed ratio either starves a 0.024 in G of
/// core (it read as 88 % of its breaking strength at standard pitch, where such strings are
/// routinely tuned a whole step up) or overstates the core of a bass string.
/// - The trade's core sizes (from memory: about 0.012–0.0135 in in a 0.024–0.026 in string,
///   0.015 in in 0.032 in, 0.017 in in 0.042 in, 0.018–0.0185 in in 0.046–0.053 in) are taken
///   as micrometer readings, which settle on a hexagon's flats; across the corners they are
///   2/√3 = 1.155 times larger (DERIVED): about 0.60, 0.54, 0.46 and 0.40 of the outer diameter.
/// - Cross-check (DERIVED, REFERENCES §5.4): with these ratios the open-string B of a light
///   acoustic set's D3, A2 and E2 (0.032/0.042/0.053 in) comes out 4.7e-5, 7.5e-5 and 1.2e-4,
///   against measured 5.0e-5, 6.6e-5 and 1.08e-4 (Järveläinen & Karjalainen, *Acta Acustica*
///   92, 2006, READ-R; the measured strings' gauges are not known), and a 0.046 in electric E2
///   gives 1.5e-4 against 1.56e-4 (Barbancho et al., *IEEE TASLP* 20, 2012, READ-R). A fixed
///   0.39 gives the D3 a quarter of the measured B (1.2e-5).
/// - All of them lie inside the 33–66 % a bass-string article gives (REFERENCES §6.3,
///   PRACTICE, READ).
///
/// Beyond 0.053 in the ratio stays 0.40 (the earlier fixed default there was 0.39; PRACTICE,
/// from memory).
pub const HEX_CORE_RATIOS: [(f64, f64); 4] = [
    (0.026 * IN, 0.60),
    (0.032 * IN, 0.54),
    (0.042 * IN, 0.46),
    (0.053 * IN, 0.40),
];

/// Default ratios of a round steel core under one wrap layer (harp and piano style), as knots.
/// At the thin end, 0.55: a round core with the load-bearing area of the hexagonal default there
/// (0.60 × √0.827 = 0.546, DERIVED; REFERENCES §6.2 for the 0.827). From 0.042 in, 0.45, the
/// earlier default (PRACTICE, from memory). A single copper layer on the 1.051 mm core of a
/// grand piano's C2 would need a ratio of 0.55 to give its published μ (REFERENCES §6.3,
/// DERIVED illustration only: that string may be double-wound), so 0.45 errs towards a thinner
/// core, i.e. towards warning early.
pub const ROUND_CORE_RATIOS: [(f64, f64); 2] = [(0.026 * IN, 0.55), (0.042 * IN, 0.45)];

/// Default core fraction for a round steel core under two wrap layers (piano and harp basses):
/// 0.40. PRACTICE, from memory. Consistent with a grand piano's D♯1 (core 1.492 mm, μ 75.5 g/m,
/// Chabassier et al. 2013 via REFERENCES §6.3, READ-R): two equal copper layers at this ratio
/// give that μ at an outer diameter of 3.7 mm (DERIVED; the string's outer diameter is not
/// published there, so this is an illustration, not a check).
pub const DOUBLE_WRAP_CORE_RATIO: f64 = 0.40;

/// Default ratios of a multifilament nylon core (the wound basses of nylon-strung instruments),
/// as (outer diameter m, ratio) knots.
///
/// The basses of a normal-tension classical set carry about even tension (about 6–8 kgf each,
/// common practice, from memory) and only the core carries it, so their cores are about the same
/// size whatever the outer diameter: about 0.5 mm from the 0.76 mm D3 to the 1.09 mm E2
/// (PRACTICE, from memory; the wrap wire grows instead). A fixed ratio (the earlier 0.65) made
/// the E2 string far too light (48 N against 74 N on the D3). At 0.76 mm the ratio 0.68 gives
/// μ = 1.92 g/m, within 2 % of the 1.95 g/m measured on a commercial normal-tension D3
/// (Woodhouse 2004, Table I, REFERENCES §5.4, READ-R; that string's diameter is not given).
/// Below 0.60 mm and above 1.09 mm the end ratios hold.
pub const MULTIFILAMENT_CORE_RATIOS: [(f64, f64); 4] = [
    (0.60e-3, 0.75),
    (0.76e-3, 0.68),
    (0.89e-3, 0.57),
    (1.09e-3, 0.46),
];

/// Default share of the total wrap thickness taken by the inner of two layers: one half.
/// PRACTICE assumption.
pub const DEFAULT_INNER_SHARE: f64 = 0.5;

/// A wound kind's core diameter as a fraction of its outer diameter.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum CoreRatio {
    /// The same fraction at every gauge.
    Fixed(f64),
    /// A fraction that depends on the outer diameter: (outer diameter m, ratio) knots in rising
    /// order of diameter, interpolated linearly and held constant beyond the first and last.
    ByOuterDiameter(&'static [(f64, f64)]),
}

impl CoreRatio {
    /// The ratio at the given outer diameter (m).
    pub fn at(self, outer_diameter: f64) -> f64 {
        match self {
            CoreRatio::Fixed(ratio) => ratio,
            CoreRatio::ByOuterDiameter(knots) => interpolate(knots, outer_diameter),
        }
    }
}

/// Linear interpolation through knots sorted by x, clamped at both ends.
fn interpolate(knots: &[(f64, f64)], x: f64) -> f64 {
    let (Some(&(first_x, first_y)), Some(&(last_x, last_y))) = (knots.first(), knots.last()) else {
        return f64::NAN;
    };
    if x <= first_x {
        return first_y;
    }
    if x >= last_x {
        return last_y;
    }
    knots
        .windows(2)
        .find(|pair| x <= pair[1].0)
        .map_or(last_y, |pair| {
            let ((x0, y0), (x1, y1)) = (pair[0], pair[1]);
            y0 + (x - x0) / (x1 - x0) * (y1 - y0)
        })
}

/// The default core-to-outer ratio for a construction family, used when a kind does not give one.
/// A core material lighter than 2000 kg/m³ is taken to be a polymer bundle.
pub fn default_core_ratio(shape: CoreShape, wrap_layers: usize, core_density: f64) -> CoreRatio {
    if core_density < 2000.0 {
        CoreRatio::ByOuterDiameter(&MULTIFILAMENT_CORE_RATIOS)
    } else if wrap_layers >= 2 {
        CoreRatio::Fixed(DOUBLE_WRAP_CORE_RATIO)
    } else if shape == CoreShape::Round {
        CoreRatio::ByOuterDiameter(&ROUND_CORE_RATIOS)
    } else {
        CoreRatio::ByOuterDiameter(&HEX_CORE_RATIOS)
    }
}

/// How to build a wound string when only its outer diameter is known.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct WoundRecipe<'m> {
    /// Core material.
    pub core_material: &'m Material,
    /// Core section.
    pub core_shape: CoreShape,
    /// Core nominal diameter divided by the outer diameter.
    pub core_ratio: CoreRatio,
    /// Inner wrap material.
    pub inner: &'m Material,
    /// Outer wrap material and the inner layer's share of the wrap thickness, for two layers.
    pub outer: Option<(&'m Material, f64)>,
}

impl<'m> WoundRecipe<'m> {
    /// The wound string of this recipe with the given outer diameter: core = ratio × outer, and
    /// the remaining radial thickness (outer − core)/2 split between the layers.
    pub fn build(&self, outer_diameter: f64) -> Construction<'m> {
        let core_diameter = self.core_ratio.at(outer_diameter) * outer_diameter;
        let wrap_total = (outer_diameter - core_diameter) / 2.0;
        let core = Core {
            material: self.core_material,
            shape: self.core_shape,
            diameter: core_diameter,
        };
        let wraps = match self.outer {
            None => Wraps::One(Wrap {
                material: self.inner,
                wire_diameter: wrap_total,
            }),
            Some((outer, inner_share)) => Wraps::Two(
                Wrap {
                    material: self.inner,
                    wire_diameter: wrap_total * inner_share,
                },
                Wrap {
                    material: outer,
                    wire_diameter: wrap_total * (1.0 - inner_share),
                },
            ),
        };
        Construction::Wound { core, wraps }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ratio_by_outer_diameter_interpolates_between_knots_and_holds_beyond() {
        let ratio = CoreRatio::ByOuterDiameter(&HEX_CORE_RATIOS);
        assert_eq!(ratio.at(0.010 * IN), 0.60);
        assert_eq!(ratio.at(0.026 * IN), 0.60);
        assert!((ratio.at(0.029 * IN) - 0.57).abs() < 1e-12);
        assert!((ratio.at(0.042 * IN) - 0.46).abs() < 1e-12);
        assert_eq!(ratio.at(0.130 * IN), 0.40);
        assert_eq!(CoreRatio::Fixed(0.5).at(1.0), 0.5);
    }

    #[test]
    fn every_default_family_thins_its_core_ratio_as_the_string_thickens() {
        for knots in [
            &HEX_CORE_RATIOS[..],
            &ROUND_CORE_RATIOS[..],
            &MULTIFILAMENT_CORE_RATIOS[..],
        ] {
            assert!(knots
                .windows(2)
                .all(|pair| pair[1].0 > pair[0].0 && pair[1].1 < pair[0].1));
            assert!(knots.iter().all(|&(_, ratio)| ratio > 0.0 && ratio < 1.0));
        }
    }
}
