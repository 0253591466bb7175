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
//! - `kind` + `diameter`: the construction and materials of the kind (see `src/strings/data/kinds.yaml`)
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

use serde::Deserialize;

use crate::error::{Error, Result};
use crate::input::yaml::{self, PathStep};
use crate::plan::Plan;
use crate::strings::stock::Stock;

mod plan;
mod read;
pub(crate) use crate::instrument::entry::{check_entry, StringEntryFile};
pub use crate::instrument::entry::{length_text, ResolvedString, SetString};
#[allow(unused_imports)]
use plan::*;
#[allow(unused_imports)]
use read::*;
#[cfg(test)]
mod tests;

/// The most courses a set may list (the same bound as instruments).
pub const MAX_SET_COURSES: usize = crate::instrument::MAX_COURSES;

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
    /// The tuning the strings are in (a tuning spec, checked to load): `audit` and `convert`
    /// take it as the strings' current tuning when no option names one.
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
