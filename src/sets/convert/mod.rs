//! Conversion plans: from the strings installed on an instrument in one tuning to the strings it
//! needs in another tuning, and optionally on another scale length or another layout of courses
//! (a baritone conversion, an added low course).
//!
//! # The rule, per string
//!
//! 1. *Before*: the installed string at its old pitch and length gives the tension the player is
//!    used to (T = μ(2Lf)², REFERENCES §1.2).
//! 2. *Target*: that same tension, so the string keeps its feel, unless the player gives a new
//!    target (`--tension`); a course the old instrument did not have takes the new instrument's
//!    own target.
//! 3. *Keep*: the installed string stays when, at the new pitch and length, its tension is within
//!    the tolerance of the target (default ±10 %, [`crate::strings::select::DEFAULT_TOLERANCE`]), inside
//!    the instrument's tension window, not above the danger stress, and not wider than a stated
//!    slot. Strings that still work are not replaced.
//! 4. *Replace*: otherwise the selector ([`crate::strings::select::select`]) picks a new one, preferring
//!    the installed string's kind, then the kinds the instrument allows for that string.
//!
//! So a conversion to the same tuning and scale returns the same set, for any set whose strings
//! are safe where they are (tested as a property).
//!
//! # Nut slot
//!
//! A new string wider than the slot stated for the course (`max_diameter` in the instrument, or
//! `--slot`) is flagged with the excess. Without a stated width the slot is taken to fit the old
//! string, and a new string wider than the old one is noted with by how much: the slot may need
//! widening, a job for a qualified person.
//!
//! # Total load
//!
//! The sum of all tensions before and after, and the change. A change of more than
//! [`DEFAULT_LOAD_CHANGE`] (10 %, our own threshold for "large") comes with a caution: the neck
//! relief and action will move, and a truss-rod or setup adjustment by a qualified person may be
//! needed.

use serde::Serialize;

use crate::error::{Error, Result};
use crate::input::units::METRES_PER_INCH;
use crate::input::yaml::PathStep;
use crate::instrument::{CourseInput, Instrument, TensionSpec};
use crate::plan::solve::gauge_label;
use crate::plan::warning::{
    with_load_check, Severity, StringRef, Warning, WarningKind, SAFETY_CAUTIONS,
};
use crate::plan::CoursePitch;
use crate::sets::audit::reference::reread_apart_cents;
use crate::sets::matching::{cautions_for, check_no_extra_courses, missing_course, set_strings};
use crate::sets::set::{SetCourse, SetString, StringSet};
use crate::strings::construction::Construction;
use crate::strings::feel::{self, Feel, FeelOptions};
use crate::strings::kind::{StringKind, StringKinds};
use crate::strings::material::Materials;
use crate::strings::physics::{self, BendGeometry};
use crate::strings::select::{self, Checks, Request, StressLimits, Warnings};
use crate::strings::stock::Stock;
use crate::tuning::transpose::Shift;
use crate::tuning::Tuning;

mod course;
#[allow(unused_imports)]
use course::*;
mod strings;
#[allow(unused_imports)]
use strings::*;
mod rule;
use rule::kept_changes;

mod model;
#[allow(unused_imports)]
use model::*;
pub use model::*;
pub use rule::{FeelRule, KeptChange, TargetRule};

/// A total-load change larger than this fraction (either way) comes with the setup caution.
pub const DEFAULT_LOAD_CHANGE: f64 = 0.10;

/// Sentence shown with a large change in total load.
pub const SETUP_CAUTION: &str = "A change this large in total string load moves the neck relief and the action: a truss-rod or setup adjustment by a qualified person may be needed. Change strings one course at a time and bring the tension up gradually.";

/// What one side of the conversion knows about a course.
struct Placed<'a> {
    course: CourseInput<'a>,
    pitch: CoursePitch,
    length_m: f64,
}

/// Plans the conversion of `set`, installed on `before` in `tuning_before`, to `after` in
/// `tuning_after` (pass the same instrument twice when only the tuning or scale changes).
pub fn convert(
    before: &Instrument,
    set: &StringSet,
    tuning_before: &Tuning,
    after: &Instrument,
    tuning_after: &Tuning,
    stock: &Stock,
    options: &ConvertOptions,
) -> Result<Conversion> {
    check_no_extra_courses(set, before)?;
    let (kinds, materials) = (stock.kinds(), stock.materials());
    let limits = crate::plan::solve::stress_limits(after)?;
    let limits_before = crate::plan::solve::stress_limits(before)?;
    let mut courses = Vec::with_capacity(after.courses.len());
    let mut total_before_n = 0.0;
    let mut seen_before = Vec::new();
    let own_tuning = crate::plan::solve::tuning_for(before, None, "tuning")?;
    // The whole set, before: every course of the old instrument.
    for index in 0..before.courses.len() {
        let course = before
            .course_input(index, None)
            .ok_or_else(|| Error::input("a course has no vibrating length"))?;
        let strings = installed(set, before, &course, kinds, materials)?;
        let pitch = before.course_pitch(&course, tuning_before)?;
        check_reading(before, &own_tuning, tuning_before, &course, &pitch)?;
        for ((written, construction, _), layout) in strings.iter().zip(course.strings) {
            let hz = pitch.hz * layout.interval.ratio();
            let tension = physics::tension(construction.unit_mass(), course.length_m, hz);
            check_possible(
                before,
                tuning_before,
                &course,
                written,
                hz,
                tension,
                construction,
            )?;
            total_before_n += tension;
        }
        seen_before.push(course.number);
    }
    for index in 0..after.courses.len() {
        let course = after
            .course_input(index, options.target.as_ref())
            .ok_or_else(|| Error::input("a course has no vibrating length"))?;
        let pitch = after.course_pitch(&course, tuning_after)?;
        let pitch = match &options.transpose {
            Some(shift) => shift.apply(&pitch, tuning_after),
            None => pitch,
        };
        let placed_after = Placed {
            length_m: options.scale_length.unwrap_or(course.length_m),
            course,
            pitch,
        };
        let before_index =
            (0..before.courses.len()).find(|&i| before.course_number(i) == course.number);
        let placed_before = match before_index {
            Some(i) => {
                let old = before
                    .course_input(i, None)
                    .ok_or_else(|| Error::input("a course has no vibrating length"))?;
                Some(Placed {
                    pitch: before.course_pitch(&old, tuning_before)?,
                    length_m: old.length_m,
                    course: old,
                })
            }
            None => None,
        };
        let strings = match &placed_before {
            Some(old) => Some(installed(set, before, &old.course, kinds, materials)?),
            None => None,
        };
        if let (Some(strings), Some(old)) = (&strings, &placed_before) {
            if strings.len() != placed_after.course.strings.len() {
                return Err(after.point(
                    Error::input(format!(
                        "course {} holds {} string(s) before and {} after; taut converts string by string",
                        course.number,
                        old.course.strings.len(),
                        placed_after.course.strings.len()
                    ))
                    .help("give the changed course its own number, so it is planned as a new course"),
                    &[
                        PathStep::Key("courses"),
                        PathStep::Index(index),
                        PathStep::Key("strings"),
                    ],
                ));
            }
        }
        courses.push(convert_course(
            after,
            index,
            &placed_after,
            placed_before.as_ref(),
            strings.as_deref(),
            kinds,
            Limits {
                after: limits,
                before: limits_before,
            },
            options,
        )?);
    }
    let removed_courses: Vec<u32> = seen_before
        .iter()
        .copied()
        .filter(|number| !courses.iter().any(|c| c.course == *number))
        .collect();
    let total_after_n: f64 = courses
        .iter()
        .flat_map(|c| &c.strings)
        .map(|s| s.after.tension_n)
        .sum();
    let change = total_after_n / total_before_n - 1.0;
    let load_caution = (change.abs() > options.load_change_caution).then(|| {
        format!(
            "Total load changes from {total_before_n:.0} N to {total_after_n:.0} N ({:+.0}%). {SETUP_CAUTION}",
            change * 100.0
        )
    });
    let rated_load_n = after.rated_load.map(|load| load.si());
    let warnings = with_load_check(
        courses.iter().flat_map(|c| &c.warnings),
        total_after_n,
        rated_load_n,
    );
    let kept_tension_changes = kept_changes(&courses, options.tolerance);
    let mut cautions = cautions_for(&warnings);
    if cautions.is_empty() && load_caution.is_some() {
        cautions = SAFETY_CAUTIONS.iter().map(|s| s.to_string()).collect();
    }
    Ok(Conversion {
        instrument_before: before.name.clone(),
        instrument_after: after.name.clone(),
        set: set.name.clone(),
        tuning_before: tuning_before.name().to_string(),
        tuning_after: tuning_after.name().to_string(),
        transpose: options.transpose.clone(),
        rule: match (&options.target, options.rule) {
            (Some(_), _) => TargetRule::GivenTension,
            (None, FeelRule::EqualTension) => TargetRule::EqualTension,
            (None, FeelRule::EqualBend) => TargetRule::EqualBend,
        },
        tolerance: options.tolerance,
        kept_tension_changes,
        strings_replaced: courses
            .iter()
            .flat_map(|c| &c.strings)
            .filter(|s| !s.kept)
            .count(),
        courses,
        removed_courses,
        total_before_n,
        total_after_n,
        total_change_pct: change * 100.0,
        load_caution,
        rated_load_n,
        warnings,
        cautions,
    })
}
