//! Lengths for builders: the other way round from `plan`. Given each course's pitch, the string
//! chosen for it and the tension wanted, the vibrating length it needs,
//! L = √(T/μ)/(2f) (REFERENCES §1.2, [`physics::length_for_tension`]), and across many courses
//! the lengths that follow a smooth tension profile: what a harp, zither or psaltery builder lays
//! out before drawing the neck or bridge.
//!
//! A layout file is YAML:
//!
//! ```yaml
//! name: Twenty-course psaltery
//! tuning: 12edo                        # optional; pitches are in its addressing
//! tension: {first: 30N, last: 55N}     # a target, a window or a profile over the courses
//! max_step: 15%                        # optional; see below
//! rated_load: 2500N                   # optional: the most total tension the frame takes
//! courses:
//!   - pitch: G3
//!     string: {kind: plain-steel, diameter: 0.018in}   # as in a string-set file
//!     tension: 50N                                     # optional, this course only
//!     strings: [unison, unison]                        # optional: a pair, as in instruments
//!   - pitch: A3
//!     string: {kind: plain-steel, diameter: 0.016in}
//!     strings: [unison, {interval: octave, string: {kind: plain-steel, diameter: 0.009in}}]
//! ```
//!
//! A course holds 1 to 3 strings on one length. The first string listed sets the length; the
//! others (with `string:` of their own, or the course's) take whatever tension their pitch asks
//! on it, and every string counts in the total.
//!
//! # The tension window
//!
//! A fixed target gives each course exactly that tension. A window (`{min, max}`, with or
//! without a target or profile inside it) lets each course move within it to smooth the bridge
//! line: the logarithms of the lengths are chosen to minimise the sum of squared second
//! differences from course to course (a bridge line without kinks) plus a small pull towards
//! each course's target (weight [`TARGET_PULL`]), inside each course's window (see
//! [`smooth::smooth`]).
//!
//! # Impractical jumps
//!
//! Between neighbouring courses the length would follow the pitch alone (L ∝ 1/f) if tension and
//! linear density stayed put. What moves it beyond that is the wave speed v = √(T/μ), since
//! f·L = v/2. A step is flagged when v, and so f·L, changes by more than `max_step` between
//! neighbours (default [`DEFAULT_MAX_STEP`], 15 %): the bridge line then kinks instead of
//! following a smooth curve. Our own threshold, chosen so that ordinary gauge steps pass: one step
//! of a plain-steel inch catalog changes μ by about 10 %, so v by about 5 %; 15 % in v is roughly
//! three such steps in one course, or a change of construction (plain to wound) without
//! re-gauging. A course whose length moves the opposite way from its pitch by more than 1 %
//! ([`FOLD_BACK_TOLERANCE`]; a lower course shorter than its higher neighbour) is flagged as a
//! fold-back, which a straight or gently curved bridge cannot follow.

use std::path::Path;

use serde::{Deserialize, Serialize};

use crate::error::{Error, Result};
use crate::input::units::METRES_PER_INCH;
use crate::input::units::{Force, Length};
use crate::input::yaml::{self, PathStep};
use crate::instrument::{CourseString, Interval, Percent, Raises, TensionSpec};
use crate::plan::warning::{with_load_check, StringRef, Warning, WarningKind};
use crate::plan::CoursePitch;
use crate::sets::matching::cautions_for;
use crate::sets::set::{check_entry, SetString, StringEntryFile};
use crate::strings::feel::{self, Feel, FeelOptions};
use crate::strings::physics;
use crate::strings::select::{self, Checks, StressLimits, Warnings};
use crate::strings::stock::Stock;
use crate::tuning::{self, Tuning};

pub mod choose;
mod read;
mod save;
#[allow(unused_imports)]
use read::*;
mod solve;
#[allow(unused_imports)]
use solve::*;
pub use solve::*;
pub mod smooth;

/// Default largest change of the wave speed √(T/μ) between neighbouring courses: 15 % (see the
/// module documentation).
pub const DEFAULT_MAX_STEP: f64 = 0.15;

/// A length moving against the pitch by at most this fraction (1 %) is not called a fold-back:
/// a bridge pin can sit a few millimetres off a smooth line.
pub const FOLD_BACK_TOLERANCE: f64 = 0.01;

/// Weight of the pull towards each course's target against the smoothness of the bridge line
/// when a window lets the tension move (our own choice: small enough that a kink of a few per
/// cent is smoothed, large enough that a course without a reason to move stays on target).
pub const TARGET_PULL: f64 = 0.05;

/// The tuning used when the layout names none.
pub const DEFAULT_TUNING: &str = crate::plan::solve::DEFAULT_TUNING;

#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
struct LayoutCourseFile {
    course: Option<u32>,
    pitch: String,
    string: Option<StringEntryFile>,
    strings: Option<Vec<CourseString>>,
    tension: Option<TensionSpec>,
    kinds: Option<Vec<String>>,
    raises: Option<Raises>,
}

/// A builder's rule that puts some kinds first for the courses on one side of a pitch, e.g.
/// `{below: G2, kinds: [harp-wound-nylon]}` for "wound below G2".
#[derive(Debug, Clone, PartialEq, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct PreferRule {
    /// The rule applies to courses sounding below this pitch.
    pub below: Option<String>,
    /// The rule applies to courses sounding above this pitch.
    pub above: Option<String>,
    /// The kinds put first, in order.
    pub kinds: Vec<String>,
}

/// The shortest and longest vibrating length the frame allows, as written.
#[derive(Debug, Clone, Copy, PartialEq, Deserialize)]
#[serde(deny_unknown_fields)]
struct LengthWindowFile {
    #[serde(default, deserialize_with = "crate::instrument::optional_scalar")]
    min: Option<Length>,
    #[serde(default, deserialize_with = "crate::instrument::optional_scalar")]
    max: Option<Length>,
}

#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
struct LayoutFile {
    name: String,
    // `description` as in tuning files; `about` is the older name, still read.
    #[serde(rename = "description", alias = "about")]
    about: Option<String>,
    tuning: Option<String>,
    tension: Option<TensionSpec>,
    max_step: Option<Percent>,
    #[serde(default, deserialize_with = "crate::instrument::optional_scalar")]
    rated_load: Option<Force>,
    kinds: Option<Vec<String>>,
    #[serde(default)]
    prefer: Vec<PreferRule>,
    length_window: Option<LengthWindowFile>,
    working_stress: Option<Percent>,
    raises: Option<Raises>,
    courses: Vec<LayoutCourseFile>,
}

/// One course to lay out, checked.
#[derive(Debug, Clone, PartialEq)]
pub struct LayoutCourseInput {
    /// Course number.
    pub course: u32,
    /// The pitch in the tuning's addressing.
    pub pitch: String,
    /// The first string, which sets the length; `None` when it is chosen from `kinds`
    /// together with the length (see [`choose`]).
    pub string: Option<SetString>,
    /// The kinds a chosen string may be, in the course's order of preference (the course's own
    /// `kinds`, else the layout's); empty when every string is named.
    pub kinds: Vec<String>,
    /// The course's other strings on the same length (a pair, an octave string), with their
    /// intervals from the course pitch; the first string's interval is `first_interval`. A
    /// string without its own is chosen from `kinds` once the length is known.
    pub others: Vec<(Interval, Option<SetString>)>,
    /// The first string's interval from the course pitch (unison unless written otherwise).
    pub first_interval: Interval,
    /// Its own tension, overriding the layout's.
    pub tension: Option<TensionSpec>,
    /// Its lever or pedal (its own, else the layout's), carried into `--save-instrument`; a
    /// pulling raise's highest position also bounds the stress a chosen string may take.
    pub raises: Option<Raises>,
}

/// A checked layout request.
#[derive(Debug, Clone)]
pub struct LayoutInput {
    /// Name.
    pub name: String,
    /// A sentence about it.
    pub about: Option<String>,
    /// Tuning spec, if the file names one.
    pub tuning: Option<String>,
    /// Tension for every course without its own.
    pub tension: Option<TensionSpec>,
    /// Largest accepted step of √(T/μ) between neighbours, as a fraction.
    pub max_step: f64,
    /// The most total tension the frame is rated for, N.
    pub rated_load: Option<f64>,
    /// The builder's rules that put some kinds first on one side of a pitch.
    pub prefer: Vec<PreferRule>,
    /// The shortest and longest vibrating length the frame allows, m.
    pub length_window: (Option<f64>, Option<f64>),
    /// The working stress chosen strings aim at, as a fraction of the breaking stress.
    pub working_stress: f64,
    /// Courses in order.
    pub courses: Vec<LayoutCourseInput>,
    origin: String,
    text: String,
}

/// The solved layout.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Layout {
    /// Name.
    pub name: String,
    /// The tuning used.
    pub tuning: String,
    /// The step threshold used, as a fraction.
    pub max_step: f64,
    /// One entry per course.
    pub courses: Vec<LayoutCourse>,
    /// Sum of the tensions of every string, N.
    pub total_tension_n: f64,
    /// Number of strings over all courses.
    pub string_count: usize,
    /// The rated load, N, when the layout or the command line gives one.
    pub rated_load_n: Option<f64>,
    /// Impractical steps between neighbours.
    pub jumps: Vec<Jump>,
    /// Stress warnings.
    pub warnings: Vec<Warning>,
    /// Safety cautions, present when a caution or danger fired.
    pub cautions: Vec<String>,
}

/// One solved course.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct LayoutCourse {
    /// Course number.
    pub course: u32,
    /// The course's pitch, written and resolved (flattened: `pitch`, `pitch_label`,
    /// `note_name`, `note_offset_cents`, `pitch_hz`).
    #[serde(flatten)]
    pub pitch: CoursePitch,
    /// The string (kind id, or measured).
    pub string: String,
    /// Outer diameter, mm, if known.
    pub diameter_mm: Option<f64>,
    /// Outer diameter, in, if known.
    pub diameter_in: Option<f64>,
    /// Linear density, kg/m.
    pub unit_mass_kg_per_m: f64,
    /// Tension of the first string, N: its target, or where the window let it move to smooth
    /// the bridge line.
    pub tension_n: f64,
    /// The target before smoothing, N.
    pub target_tension_n: f64,
    /// The vibrating length that gives it, m.
    pub length_m: f64,
    /// Stress over breaking strength at that length, if known.
    pub stress_ratio: Option<f64>,
    /// Pitch at which the string breaks on that length, Hz, if known.
    pub break_pitch_hz: Option<f64>,
    /// Change of √(T/μ) from the previous course, % (absent on the first).
    pub step_pct: Option<f64>,
    /// Stiffness and feel at that length.
    pub feel: Feel,
    /// The course's other strings on the same length.
    pub other_strings: Vec<LayoutString>,
    /// Whether the string was chosen by `taut` (from the course's kinds) rather than named.
    #[serde(skip_serializing_if = "std::ops::Not::not")]
    pub chosen: bool,
    /// The string as a layout or instrument file writes it, for `--save-instrument`.
    #[serde(skip)]
    pub entry: SetString,
    /// The tension window the course was solved in, N (min, max), for `--save-instrument`.
    #[serde(skip)]
    pub window_n: (Option<f64>, Option<f64>),
}

/// A further string of a course (a pair's second string, an octave string) on the length the
/// first string set.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct LayoutString {
    /// Interval from the course pitch, as written.
    pub interval: String,
    /// The string (kind id, or measured).
    pub string: String,
    /// Outer diameter, mm, if known.
    pub diameter_mm: Option<f64>,
    /// Linear density, kg/m.
    pub unit_mass_kg_per_m: f64,
    /// Its frequency, Hz.
    pub pitch_hz: f64,
    /// Its tension on the course's length, N.
    pub tension_n: f64,
    /// Stress over breaking strength, if known.
    pub stress_ratio: Option<f64>,
    /// Pitch at which it breaks on that length, Hz, if known.
    pub break_pitch_hz: Option<f64>,
    /// The string as a layout or instrument file writes it, for `--save-instrument`.
    #[serde(skip)]
    pub entry: SetString,
}

/// What kind of jump.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum JumpKind {
    /// √(T/μ) changes by more than the threshold.
    Step,
    /// The length moves against the pitch.
    FoldBack,
    /// The length lies outside the layout's `length_window`.
    OutsideLengthWindow,
}

/// An impractical step between two neighbouring courses.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Jump {
    /// What kind.
    pub kind: JumpKind,
    /// The earlier course.
    pub from_course: u32,
    /// The later course.
    pub to_course: u32,
    /// The figure: step of √(T/μ) in %, or the length change in % for a fold-back.
    pub value_pct: f64,
    /// A plain sentence.
    pub message: String,
}

/// Choices that override the layout file.
#[derive(Debug, Clone, Default)]
pub struct LayoutOptions {
    /// Tuning instead of the file's.
    pub tuning: Option<String>,
    /// Tension for every course instead of the file's.
    pub tension: Option<TensionSpec>,
    /// Step threshold instead of the file's.
    pub max_step: Option<f64>,
    /// Rated load instead of the file's, N.
    pub rated_load: Option<f64>,
    /// Inputs of the feel figures.
    pub feel: FeelOptions,
}

/// Loads the tuning (options, file, or [`DEFAULT_TUNING`]) and lays the courses out.
pub fn lay_out(input: &LayoutInput, stock: &Stock, options: &LayoutOptions) -> Result<Layout> {
    let tuning = match (&options.tuning, &input.tuning) {
        (Some(spec), _) => tuning::load(spec).map_err(|err| err.in_origin("--tuning"))?,
        (None, Some(spec)) => {
            tuning::load(spec).map_err(|err| input.point(err, &[PathStep::Key("tuning")]))?
        }
        (None, None) => tuning::load(DEFAULT_TUNING)?,
    };
    solve_layout(input, &tuning, stock, options)
}
