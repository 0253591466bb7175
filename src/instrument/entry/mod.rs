//! One string named outright: a kind and a diameter, a measured linear density, or a weighed
//! piece of string. String-set files (`crate::sets::set`), layout files (`crate::lengths`) and
//! instrument files (a course's fixed `string:`) all write a string this way:
//!
//! ```yaml
//! {kind: plain-steel, diameter: 0.012in}                               # a kind at a diameter
//! {kind: phosphor-bronze-wound, diameter: 0.053in, core_diameter: 0.021in}
//! {unit_mass: 6.2g/m, diameter: 0.046in, material: music-wire}         # a known μ
//! {mass: 1.43g, length: 900mm, diameter: 1.1mm}                        # weighed: μ = m/l
//! ```
//!
//! Reading checks each key's value where the line is known; `check_entry` checks the
//! combination and the ids against the kinds and materials in stock.

use std::fmt::Write as _;

use serde::{Deserialize, Deserializer};

use crate::error::{Error, Result};
use crate::input::units::{Diameter, Length, Mass, UnitMass, METRES_PER_INCH};
use crate::instrument::{Expecting, NoDetail, ScalarOrMap};
use crate::strings::construction::{Construction, Measured, WoundRecipe};
use crate::strings::kind::{KindBuild, StringKind, StringKinds};
use crate::strings::material::{Material, Materials};

mod check;
pub(crate) use check::{check_entry, check_fixed};
mod string;
pub use string::length_text;

impl Expecting for UnitMass {
    const EXPECTING: &'static str = "a mass per length such as `0.4g/m`";
}

impl Expecting for Mass {
    const EXPECTING: &'static str = "a mass such as `1.2g`";
}

/// A quantity read through the located scalar reader, so a bad value names its line.
#[derive(Debug, Clone, Copy, PartialEq)]
struct Located<S>(S);

impl<'de, S> Deserialize<'de> for Located<S>
where
    S: std::str::FromStr<Err = Error> + Expecting,
{
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> std::result::Result<Self, D::Error> {
        match ScalarOrMap::<S, NoDetail>::deserialize(deserializer)? {
            ScalarOrMap::Scalar(value) => Ok(Located(value)),
            ScalarOrMap::Map(never) => match never {},
        }
    }
}

/// One string as written (in a set, a layout or an instrument file): every key optional here, the valid combinations checked in
/// `check_form` and `check_entry` by whoever read it, where the line can still be found.
#[derive(Debug, Clone, PartialEq, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct StringEntryFile {
    kind: Option<String>,
    diameter: Option<Located<Diameter>>,
    core_diameter: Option<Located<Diameter>>,
    unit_mass: Option<Located<UnitMass>>,
    mass: Option<Located<Mass>>,
    length: Option<Located<Length>>,
    material: Option<String>,
}

/// One installed string, checked.
#[derive(Debug, Clone, PartialEq)]
pub enum SetString {
    /// A string of a named kind at an outer diameter.
    Kind {
        /// The kind's id.
        kind: String,
        /// Outer diameter, m.
        diameter: f64,
        /// Core diameter, m, when stated (wound kinds only).
        core_diameter: Option<f64>,
    },
    /// A string known by its linear density.
    Measured {
        /// Linear density, kg/m.
        unit_mass: f64,
        /// Outer diameter, m, if known.
        diameter: Option<f64>,
        /// Id of the load-bearing material, if known.
        material: Option<String>,
        /// The weighing it came from, (mass kg, length m), if it was weighed.
        weighed: Option<(f64, f64)>,
    },
}

/// A set string resolved to a concrete construction.
#[derive(Debug, Clone, Copy)]
pub struct ResolvedString<'k> {
    /// The physical string.
    pub construction: Construction<'k>,
    /// Its kind, when it was given by kind.
    pub kind: Option<&'k StringKind>,
}
