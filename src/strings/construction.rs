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

/// Default core diameter as a fraction of the outer diameter for a hexagonal steel core with one
/// wrap layer (guitar and electric-bass wound strings) from 0.046 in outer upwards: 0.39.
/// PRACTICE, from memory: common constructions run about 0.39 for a 0.046 in string (0.018 in
/// core) up to 0.5 for thin wound; see [`CoreRatio::HexTapered`].
pub const HEX_CORE_RATIO: f64 = 0.39;
/// Default core fraction for a round steel core with one wrap layer (harp and piano style): 0.45.
/// PRACTICE, from memory.
pub const ROUND_CORE_RATIO: f64 = 0.45;
/// Default core fraction for a round steel core under two wrap layers (piano and harp basses):
/// 0.40. PRACTICE, from memory.
pub const DOUBLE_WRAP_CORE_RATIO: f64 = 0.40;
/// Default core fraction for a multifilament nylon core (wound basses of nylon-strung
/// instruments): 0.65. PRACTICE, from memory.
pub const MULTIFILAMENT_CORE_RATIO: f64 = 0.65;
/// Default share of the total wrap thickness taken by the inner of two layers: one half.
/// PRACTICE assumption.
pub const DEFAULT_INNER_SHARE: f64 = 0.5;

/// Core-to-outer diameter ratio of the hexagonal-core default at its thin end (0.020 in and
/// below). PRACTICE, from memory: thin wound strings have relatively thick cores.
pub const HEX_CORE_RATIO_THIN: f64 = 0.50;
/// Outer diameter (m) up to which [`HEX_CORE_RATIO_THIN`] applies: 0.020 in.
pub const HEX_CORE_THIN_OUTER: f64 = 0.020 * 0.0254;
/// Outer diameter (m) from which [`HEX_CORE_RATIO`] applies: 0.046 in.
pub const HEX_CORE_THICK_OUTER: f64 = 0.046 * 0.0254;

/// A wound kind's core diameter as a fraction of its outer diameter.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum CoreRatio {
    /// The same fraction at every gauge.
    Fixed(f64),
    /// The hexagonal-core single-wrap default: [`HEX_CORE_RATIO_THIN`] up to 0.020 in outer,
    /// falling linearly to [`HEX_CORE_RATIO`] at 0.046 in and constant beyond. One fixed ratio
    /// either starves thin wound strings of core (a 0.024 in D string would read as overstressed)
    /// or overstates the core of bass strings. PRACTICE, from memory.
    HexTapered,
}

impl CoreRatio {
    /// The ratio at the given outer diameter (m).
    pub fn at(self, outer_diameter: f64) -> f64 {
        match self {
            CoreRatio::Fixed(ratio) => ratio,
            CoreRatio::HexTapered => {
                let t = ((outer_diameter - HEX_CORE_THIN_OUTER)
                    / (HEX_CORE_THICK_OUTER - HEX_CORE_THIN_OUTER))
                    .clamp(0.0, 1.0);
                HEX_CORE_RATIO_THIN + t * (HEX_CORE_RATIO - HEX_CORE_RATIO_THIN)
            }
        }
    }
}

/// The default core-to-outer ratio for a construction family, used when a kind does not give one.
/// A core material lighter than 2000 kg/m³ is taken to be a polymer bundle.
pub fn default_core_ratio(shape: CoreShape, wrap_layers: usize, core_density: f64) -> CoreRatio {
    if core_density < 2000.0 {
        CoreRatio::Fixed(MULTIFILAMENT_CORE_RATIO)
    } else if wrap_layers >= 2 {
        CoreRatio::Fixed(DOUBLE_WRAP_CORE_RATIO)
    } else if shape == CoreShape::Round {
        CoreRatio::Fixed(ROUND_CORE_RATIO)
    } else {
        CoreRatio::HexTapered
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
