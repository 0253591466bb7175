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
//! courses:
//!   - pitch: G3
//!     string: {kind: plain-steel, diameter: 0.018in}   # as in a string-set file
//!     tension: 50N                                     # optional, this course only
//! ```
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
use crate::input::yaml::{self, PathStep};
use crate::instrument::{field_name, Percent, TensionSpec};
use crate::plan::warning::{StringRef, Warning, WarningKind};
use crate::plan::CoursePitch;
use crate::sets::audit::cautions_for;
use crate::sets::set::{check_entry, SetString, StringEntryFile};
use crate::strings::feel::{self, Feel, FeelOptions};
use crate::strings::physics;
use crate::strings::select::{self, Checks, StressLimits, Warnings};
use crate::strings::stock::Stock;
use crate::tuning::{self, Tuning};

/// Default largest change of the wave speed √(T/μ) between neighbouring courses: 15 % (see the
/// module documentation).
pub const DEFAULT_MAX_STEP: f64 = 0.15;

/// A length moving against the pitch by at most this fraction (1 %) is not called a fold-back:
/// a bridge pin can sit a few millimetres off a smooth line.
pub const FOLD_BACK_TOLERANCE: f64 = 0.01;

/// The tuning used when the layout names none.
pub const DEFAULT_TUNING: &str = crate::plan::solve::DEFAULT_TUNING;

#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
struct LayoutCourseFile {
    course: Option<u32>,
    pitch: String,
    string: StringEntryFile,
    tension: Option<TensionSpec>,
}

#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
struct LayoutFile {
    name: String,
    about: Option<String>,
    tuning: Option<String>,
    tension: Option<TensionSpec>,
    max_step: Option<Percent>,
    courses: Vec<LayoutCourseFile>,
}

/// One course to lay out, checked.
#[derive(Debug, Clone, PartialEq)]
pub struct LayoutCourseInput {
    /// Course number.
    pub course: u32,
    /// The pitch in the tuning's addressing.
    pub pitch: String,
    /// The chosen string.
    pub string: SetString,
    /// Its own tension, overriding the layout's.
    pub tension: Option<TensionSpec>,
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
    /// Sum of the tensions, N.
    pub total_tension_n: f64,
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
    /// Tension wanted, N.
    pub tension_n: f64,
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
}

/// What kind of jump.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum JumpKind {
    /// √(T/μ) changes by more than the threshold.
    Step,
    /// The length moves against the pitch.
    FoldBack,
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

impl LayoutInput {
    /// Reads a layout file.
    pub fn load(path: &Path, stock: &Stock) -> Result<Self> {
        let text = yaml::read_text(path)?;
        LayoutInput::from_text(text, &yaml::origin_of(path), stock)
    }

    /// Parses and checks a layout; `origin` names it in messages.
    pub fn from_text(text: String, origin: &str, stock: &Stock) -> Result<Self> {
        let file: LayoutFile = yaml::parse(&text, origin)?;
        let mut input = LayoutInput {
            name: file.name,
            about: file.about,
            tuning: file.tuning,
            tension: file.tension,
            max_step: file
                .max_step
                .map_or(DEFAULT_MAX_STEP, |percent| percent.fraction()),
            courses: Vec::with_capacity(file.courses.len()),
            origin: origin.to_string(),
            text,
        };
        if file.courses.is_empty() {
            return Err(input.point(
                Error::input("the layout has no courses; list at least one"),
                &[PathStep::Key("courses")],
            ));
        }
        if file.courses.len() > crate::instrument::MAX_COURSES {
            return Err(input.point(
                Error::input(format!(
                    "the layout lists {} courses; taut lays out at most {}",
                    file.courses.len(),
                    crate::instrument::MAX_COURSES
                )),
                &[PathStep::Key("courses")],
            ));
        }
        let (kinds, materials) = (stock.kinds(), stock.materials());
        for (index, course) in file.courses.into_iter().enumerate() {
            let at = |key: &'static str| {
                [
                    PathStep::Key("courses"),
                    PathStep::Index(index),
                    PathStep::Key(key),
                ]
            };
            let number = match course.course {
                Some(0) => {
                    return Err(
                        input.point(Error::input("course numbers start at 1"), &at("course"))
                    )
                }
                Some(number) => number,
                None => u32::try_from(index + 1).unwrap_or(u32::MAX),
            };
            if input.courses.iter().any(|c| c.course == number) {
                return Err(input.point(
                    Error::input(format!("course number {number} is used twice")),
                    &at("course"),
                ));
            }
            if course.pitch.trim().is_empty() {
                return Err(input.point(Error::input("the pitch is empty"), &at("pitch")));
            }
            if course.tension.as_ref().is_some_and(TensionSpec::is_profile) {
                return Err(input.point(
                    Error::input("a tension profile (`first`/`last`) spans the whole layout")
                        .help("put the profile in the top-level `tension`"),
                    &at("tension"),
                ));
            }
            let string = check_entry(course.string, kinds, materials).map_err(|(err, key)| {
                input.point(
                    err,
                    &[
                        PathStep::Key("courses"),
                        PathStep::Index(index),
                        PathStep::Key("string"),
                        PathStep::Key(key),
                    ],
                )
            })?;
            input.courses.push(LayoutCourseInput {
                course: number,
                pitch: course.pitch.trim().to_string(),
                string,
                tension: course.tension,
            });
        }
        if input.tension.as_ref().is_some_and(TensionSpec::is_profile) && input.courses.len() < 2 {
            return Err(input.point(
                Error::input("a tension profile runs from the first course to the last; it needs at least two courses"),
                &[PathStep::Key("tension")],
            ));
        }
        Ok(input)
    }

    /// A one-course layout from command-line values: `string` is a set-file string entry such as
    /// `{kind: plain-steel, diameter: 0.016in}`.
    pub fn single(pitch: &str, string: &str, tension: TensionSpec, stock: &Stock) -> Result<Self> {
        let entry: StringEntryFile = yaml::parse(string, "--string")?;
        let (kinds, materials) = (stock.kinds(), stock.materials());
        let string = check_entry(entry, kinds, materials)
            .map_err(|(err, key)| err.field(key).in_origin("--string"))?;
        if tension.is_profile() {
            return Err(
                Error::input("a profile needs several courses; give one tension")
                    .in_origin("--tension"),
            );
        }
        Ok(LayoutInput {
            name: format!("{pitch} on one course"),
            about: None,
            tuning: None,
            tension: Some(tension),
            max_step: DEFAULT_MAX_STEP,
            courses: vec![LayoutCourseInput {
                course: 1,
                pitch: pitch.trim().to_string(),
                string,
                tension: None,
            }],
            origin: "--pitch".to_string(),
            text: String::new(),
        })
    }

    /// Attaches this file's name, the field and, where found, its line to an error.
    pub fn point(&self, error: Error, path: &[PathStep<'_>]) -> Error {
        let mut error = error.field(field_name(path));
        let mut search = path;
        while !search.is_empty() {
            if let Some((line, column)) = yaml::locate(&self.text, search) {
                error = error.at(line, column);
                break;
            }
            search = &search[..search.len() - 1];
        }
        error.in_origin(self.origin.clone())
    }
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

/// Lays out the courses of `input` in `tuning`.
pub fn solve_layout(
    input: &LayoutInput,
    tuning: &Tuning,
    stock: &Stock,
    options: &LayoutOptions,
) -> Result<Layout> {
    let (kinds, materials) = (stock.kinds(), stock.materials());
    let max_step = options.max_step.unwrap_or(input.max_step);
    let limits = StressLimits::default();
    let count = input.courses.len();
    let mut courses: Vec<LayoutCourse> = Vec::with_capacity(count);
    let mut warnings = Vec::new();
    let mut jumps = Vec::new();
    for (index, course) in input.courses.iter().enumerate() {
        let at_key = |key: &'static str| {
            [
                PathStep::Key("courses"),
                PathStep::Index(index),
                PathStep::Key(key),
            ]
        };
        let resolved = CoursePitch::resolve(&course.pitch, tuning)
            .map_err(|err| input.point(err, &at_key("pitch")))?;
        let position = if count > 1 {
            index as f64 / (count - 1) as f64
        } else {
            0.0
        };
        let spec = options
            .tension
            .as_ref()
            .or(course.tension.as_ref())
            .or(input.tension.as_ref())
            .ok_or_else(|| {
                input.point(
                    Error::input(format!("course {} has no tension", course.course))
                        .help("give a top-level `tension` (a target or a `first`/`last` profile), the course's own, or --tension"),
                    &[PathStep::Key("courses"), PathStep::Index(index)],
                )
            })?;
        let tension_n = spec.goal_at(position).target_n;
        let string = course
            .string
            .resolve(kinds, materials)
            .map_err(|err| input.point(err, &at_key("string")))?;
        let unit_mass = string.construction.unit_mass();
        let length_m = physics::length_for_tension(tension_n, unit_mass, resolved.hz);
        // Bounded inputs can still ask for a length no instrument has (a heavy string at a high
        // pitch and a low tension): say so rather than lay out a 1 µm string.
        let bounds = crate::input::units::LENGTH_BOUNDS;
        if !bounds.contains(length_m) {
            return Err(input.point(
                Error::input(format!(
                    "course {} would need a vibrating length of {} m at {} Hz and {} N, outside the range taut accepts for {}: {}",
                    course.course,
                    crate::input::units::short_number(length_m),
                    crate::input::units::short_number(resolved.hz),
                    crate::input::units::short_number(tension_n),
                    bounds.what,
                    bounds.shown
                ))
                .help("choose a lighter or heavier string, or another tension"),
                &at_key("string"),
            ));
        }
        let evaluation = select::evaluate(
            &string.construction,
            resolved.hz,
            length_m,
            &Checks {
                limits,
                ..Checks::default()
            },
        );
        let at = StringRef {
            course: course.course,
            string: 1,
        };
        if let (Some(ratio), Some(break_hz)) = (evaluation.stress_ratio, evaluation.break_frequency)
        {
            if evaluation.warnings.contains(Warnings::STRESS_DANGER) {
                warnings.push(at.stress(
                    WarningKind::StressDanger,
                    ratio,
                    limits.danger,
                    break_hz,
                    resolved.hz,
                ));
            } else if evaluation.warnings.contains(Warnings::STRESS_CAUTION) {
                warnings.push(at.stress(
                    WarningKind::StressCaution,
                    ratio,
                    limits.caution,
                    break_hz,
                    resolved.hz,
                ));
            }
        }
        // f·L = √(T/μ)/2: the step of the wave speed between neighbours.
        let speed = (tension_n / unit_mass).sqrt();
        let step_pct = courses.last().map(|previous| {
            let previous_speed = (previous.tension_n / previous.unit_mass_kg_per_m).sqrt();
            (speed / previous_speed - 1.0) * 100.0
        });
        if let (Some(previous), Some(step)) = (courses.last(), step_pct) {
            if step.abs() > max_step * 100.0 {
                jumps.push(Jump {
                    kind: JumpKind::Step,
                    from_course: previous.course,
                    to_course: course.course,
                    value_pct: step,
                    message: format!(
                        "Courses {} to {}: √(T/μ) changes by {:+.0}% (limit ±{:.0}%), so the length steps by {:+.0}% more than the pitch asks; choose a {} string for course {} or move the tension to smooth the bridge line.",
                        previous.course,
                        course.course,
                        step,
                        max_step * 100.0,
                        step,
                        if step > 0.0 { "heavier" } else { "lighter" },
                        course.course
                    ),
                });
            }
            let pitch_direction = resolved.hz - previous.pitch.hz;
            let length_direction = length_m - previous.length_m;
            if pitch_direction * length_direction > 0.0
                && (length_m / previous.length_m - 1.0).abs() > FOLD_BACK_TOLERANCE
            {
                let change = (length_m / previous.length_m - 1.0) * 100.0;
                jumps.push(Jump {
                    kind: JumpKind::FoldBack,
                    from_course: previous.course,
                    to_course: course.course,
                    value_pct: change,
                    message: format!(
                        "Courses {} to {}: the pitch goes {} but the length goes {} ({:+.1}%), so the bridge line folds back.",
                        previous.course,
                        course.course,
                        if pitch_direction > 0.0 { "up" } else { "down" },
                        if length_direction > 0.0 { "up" } else { "down" },
                        change
                    ),
                });
            }
        }
        let diameter = course.string.diameter();
        courses.push(LayoutCourse {
            course: course.course,
            pitch: resolved,
            string: course.string.label(),
            diameter_mm: diameter.map(|d| d * 1000.0),
            diameter_in: diameter.map(|d| d / METRES_PER_INCH),
            unit_mass_kg_per_m: unit_mass,
            tension_n,
            length_m,
            stress_ratio: evaluation.stress_ratio,
            break_pitch_hz: evaluation.break_frequency,
            step_pct,
            feel: feel::feel(&string.construction, tension_n, length_m, &options.feel),
        });
    }
    Ok(Layout {
        name: input.name.clone(),
        tuning: tuning.name().to_string(),
        max_step,
        total_tension_n: courses.iter().map(|c| c.tension_n).sum(),
        cautions: cautions_for(&warnings),
        courses,
        jumps,
        warnings,
    })
}
