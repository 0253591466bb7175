//! String sets: the strings actually on an instrument (or planned for it), course by course.
//!
//! A set file is YAML read through [`crate::input::yaml::parse`] with unknown keys refused. Each string
//! is written in one of three ways:
//!
//! ```yaml
//! name: Steel-string guitar, as strung in March
//! courses:
//!   - course: 1                                  # optional; defaults to the position from 1
//!     strings:
//!       - {kind: plain-steel, diameter: 0.012in}          # a shipped (or user) string kind
//!   - strings:
//!       - {kind: phosphor-bronze-wound, diameter: 0.053in, core_diameter: 0.021in}
//!   - strings:
//!       - {unit_mass: 6.2g/m, diameter: 0.046in, material: music-wire}   # a known μ
//!   - strings:
//!       - {mass: 1.43g, length: 900mm, diameter: 1.1mm}  # a weighed piece of the string
//! ```
//!
//! - `kind` + `diameter`: the construction and materials of the kind (see `src/data/kinds.yaml`)
//!   at that outer diameter; for wound kinds `core_diameter` replaces the kind's default
//!   core-to-outer ratio when the maker states the core.
//! - `unit_mass` (μ) or `mass` over `length` (μ = m/l): a measured string. `diameter` lets the
//!   slot checks run; `material` names what carries the load, so strength, stress and stiffness
//!   can be estimated (the string is then treated as a solid wire of that material).
//!
//! The strings of a course are matched, in order, with the strings the instrument lists for that
//! course; courses are matched by number. [`StringSet::from_plan`] turns a plan into a set, and
//! [`StringSet::to_yaml`] writes one back, so plan → save → audit is one flow.

use std::fmt::Write as _;
use std::path::Path;

use serde::{Deserialize, Deserializer};

use crate::error::{Error, Result};
use crate::input::units::{Length, Mass, UnitMass, METRES_PER_INCH};
use crate::input::yaml::{self, PathStep};
use crate::instrument::{Expecting, NoDetail, ScalarOrMap};
use crate::plan::Plan;
use crate::strings::construction::{Construction, Measured, WoundRecipe};
use crate::strings::kind::{KindBuild, StringKind, StringKinds};
use crate::strings::material::{Material, Materials};
use crate::strings::stock::Stock;

mod read;
#[allow(unused_imports)]
use read::*;
mod string;
#[allow(unused_imports)]
use string::*;
pub use string::*;
mod check;
pub(crate) use check::check_entry;
#[allow(unused_imports)]
use check::*;
#[cfg(test)]
mod tests;

/// The most courses a set may list (the same bound as instruments).
pub const MAX_SET_COURSES: usize = crate::instrument::MAX_COURSES;

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

/// One string as written: every key optional here, the valid combinations checked in
/// [`StringSet::from_text`] where the line can still be found.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub(crate) struct StringEntryFile {
    kind: Option<String>,
    diameter: Option<Located<Length>>,
    core_diameter: Option<Located<Length>>,
    unit_mass: Option<Located<UnitMass>>,
    mass: Option<Located<Mass>>,
    length: Option<Located<Length>>,
    material: Option<String>,
}

#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
struct SetCourseFile {
    course: Option<u32>,
    strings: Vec<StringEntryFile>,
}

#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
struct SetFile {
    name: String,
    // `description` as in tuning files; `about` is the older name, still read.
    #[serde(rename = "description", alias = "about")]
    about: Option<String>,
    instrument: Option<String>,
    tuning: Option<String>,
    courses: Vec<SetCourseFile>,
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

/// One course of a set.
#[derive(Debug, Clone, PartialEq)]
pub struct SetCourse {
    /// The course number (its own, or its position from 1).
    pub course: u32,
    /// Its strings, in the order the instrument lists them.
    pub strings: Vec<SetString>,
}

/// A checked string set, with the text it came from so later errors can point at their line.
#[derive(Debug, Clone)]
pub struct StringSet {
    /// A name for the set.
    pub name: String,
    /// A sentence about it.
    pub about: Option<String>,
    /// The instrument it was planned for, if recorded.
    pub instrument: Option<String>,
    /// The tuning it was planned for, if recorded.
    pub tuning: Option<String>,
    /// The courses, in file order.
    pub courses: Vec<SetCourse>,
    origin: String,
    text: String,
}

impl PartialEq for StringSet {
    /// Two sets are equal when they hold the same strings on the same courses; names, notes and
    /// where they were read from do not count.
    fn eq(&self, other: &Self) -> bool {
        self.courses == other.courses
    }
}

/// A set string resolved to a concrete construction.
#[derive(Debug, Clone, Copy)]
pub struct ResolvedString<'k> {
    /// The physical string.
    pub construction: Construction<'k>,
    /// Its kind, when it was given by kind.
    pub kind: Option<&'k StringKind>,
}
