//! String kinds: named, selectable combinations of a construction, its materials and a gauge
//! catalog (e.g. `nickel-wound` = hexagonal music-wire core, nickel-plated steel wrap, inch
//! gauges). Instrument files refer to kinds by id.
//!
//! The shipped kinds live in `src/strings/data/kinds.yaml` and reach the binary as JSON converted
//! at build time ([`crate::input::shipped`]). Resolving a kind computes, once, every gauge's
//! linear density and breaking tension, so that the selector only reads precomputed numbers.

use std::sync::OnceLock;

use serde::Deserialize;

use crate::error::{Error, Result};
use crate::input::id::Id;
use crate::input::registry::{Entry, Registry};
use crate::input::units::{short_number, Diameter, Length, Mass, UnitMass, CORE_RATIO_BOUNDS};
use crate::strings::construction::{
    default_core_ratio, Construction, CoreRatio, Measured, WoundRecipe, DEFAULT_INNER_SHARE,
};
use crate::strings::gauge::GaugeCatalogs;
use crate::strings::material::{Material, Materials};
use crate::strings::physics::CoreShape;

mod file;
#[allow(unused_imports)]
use file::*;
pub use file::*;

/// One available gauge of a kind, with the numbers the selector needs (all SI).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Gauge {
    /// Outer diameter, m.
    pub diameter: f64,
    /// Linear density, kg/m.
    pub unit_mass: f64,
    /// Tension at which the load-bearing section reaches its breaking strength, N.
    pub breaking_tension: f64,
    /// A plain string thicker than its material's thickest plain string in common practice
    /// ([`Material::thickest_plain`]).
    pub thick_for_plain: bool,
}

/// How a kind's strings are built.
// Built once per kind and never moved in a hot loop, so the wound variant's size does not matter.
#[allow(clippy::large_enum_variant)]
#[derive(Debug, Clone, PartialEq)]
pub enum KindBuild {
    /// Solid wire or monofilament.
    Plain {
        /// The material.
        material: Material,
    },
    /// Round-wound on a core.
    Wound {
        /// Core material.
        core_material: Material,
        /// Core section.
        core_shape: CoreShape,
        /// Core nominal diameter / outer diameter.
        core_ratio: CoreRatio,
        /// Inner (or only) wrap material.
        inner: Material,
        /// Outer wrap material and the inner layer's share of the wrap thickness.
        outer: Option<(Material, f64)>,
    },
    /// Strings measured one by one (weighed, or with a known μ), each a gauge of its own.
    Measured {
        /// The material whose strength applies, if known.
        material: Option<Material>,
        /// `(outer diameter m, linear density kg/m)` per string, lightest first.
        strings: Vec<(f64, f64)>,
    },
}

/// A resolved string kind.
#[derive(Debug, Clone, PartialEq)]
pub struct StringKind {
    /// Identifier, e.g. `plain-steel`.
    pub id: Id,
    /// Name shown to people.
    pub name: String,
    /// The gauge catalog's id (`None` for measured strings, which are their own catalog).
    pub catalog: Option<Id>,
    /// Where the construction choices come from.
    pub source: String,
    /// How it is built.
    pub build: KindBuild,
    gauges: Vec<Gauge>,
}

impl StringKind {
    /// The gauges, thinnest (and lightest) first.
    pub fn gauges(&self) -> &[Gauge] {
        &self.gauges
    }

    /// The full construction of a string of this kind with the given outer diameter.
    pub fn construction(&self, outer_diameter: f64) -> Construction<'_> {
        match &self.build {
            KindBuild::Plain { material } => Construction::Plain {
                material,
                diameter: outer_diameter,
            },
            KindBuild::Wound {
                core_material,
                core_shape,
                core_ratio,
                inner,
                outer,
            } => WoundRecipe {
                core_material,
                core_shape: *core_shape,
                core_ratio: *core_ratio,
                inner,
                outer: outer.as_ref().map(|(m, share)| (m, *share)),
            }
            .build(outer_diameter),
            KindBuild::Measured { material, strings } => {
                // The selector only asks for diameters it took from this kind's own gauges.
                let unit_mass = strings
                    .iter()
                    .min_by(|a, b| {
                        (a.0 - outer_diameter)
                            .abs()
                            .total_cmp(&(b.0 - outer_diameter).abs())
                    })
                    .map_or(f64::NAN, |&(_, unit_mass)| unit_mass);
                Construction::Measured(Measured {
                    unit_mass,
                    diameter: Some(outer_diameter),
                    material: material.as_ref(),
                })
            }
        }
    }
}

/// String kinds, looked up by id.
pub type StringKinds = Registry<StringKind>;

impl Entry for StringKind {
    const NOUN: &'static str = "string kind";
    const PLURAL: &'static str = "kinds";
    fn id(&self) -> &Id {
        &self.id
    }
}

/// The shipped string kinds, as written (the source of [`StringKinds::builtin`]).
pub const BUILTIN_KINDS_YAML: &str = include_str!("data/kinds.yaml");

/// The same data converted to JSON by the build script (`src/build.rs`), fast to read.
const BUILTIN_KINDS_JSON: &str = include_str!(concat!(env!("OUT_DIR"), "/kinds.json"));

impl Registry<StringKind> {
    /// The kinds shipped with `taut`, read once from their build-time JSON copy and resolved
    /// against the shipped materials and catalogs as a user's file is.
    pub fn builtin() -> Result<&'static StringKinds> {
        static BUILTIN: OnceLock<std::result::Result<StringKinds, String>> = OnceLock::new();
        BUILTIN
            .get_or_init(|| {
                let materials = Materials::builtin().map_err(|e| e.to_string())?;
                let catalogs = GaugeCatalogs::builtin().map_err(|e| e.to_string())?;
                let origin = "built-in kinds.yaml";
                crate::input::shipped::parse(BUILTIN_KINDS_JSON, BUILTIN_KINDS_YAML, origin)
                    .and_then(|file| {
                        kinds_from_file(file, BUILTIN_KINDS_YAML, origin, materials, catalogs)
                    })
                    .map_err(|err| err.to_string())
            })
            .as_ref()
            .map_err(|message| {
                Error::input(format!("taut's own string kinds are broken: {message}"))
            })
    }
}
