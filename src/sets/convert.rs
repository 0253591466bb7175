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
use crate::sets::audit::{
    cautions_for, check_no_extra_courses, missing_course, set_strings, stress_limits,
};
use crate::sets::set::{SetCourse, SetString, StringSet};
use crate::strings::construction::Construction;
use crate::strings::feel::{self, Feel, FeelOptions};
use crate::strings::kind::{StringKind, StringKinds};
use crate::strings::material::Materials;
use crate::strings::physics;
use crate::strings::select::{self, Checks, Request, StressLimits, Warnings};
use crate::strings::stock::Stock;
use crate::tuning::Tuning;

/// A total-load change larger than this fraction (either way) comes with the setup caution.
pub const DEFAULT_LOAD_CHANGE: f64 = 0.10;

/// Sentence shown with a large change in total load.
pub const SETUP_CAUTION: &str = "A change this large in total string load moves the neck relief and the action: a truss-rod or setup adjustment by a qualified person may be needed. Change strings one course at a time and bring the tension up gradually.";

/// Choices for a conversion.
#[derive(Debug, Clone, PartialEq)]
pub struct ConvertOptions {
    /// Accepted relative distance from the target tension.
    pub tolerance: f64,
    /// A new tension target (or window, or profile) instead of each string's old tension.
    pub target: Option<TensionSpec>,
    /// A new vibrating length for every course, m.
    pub scale_length: Option<f64>,
    /// The nut-slot width to check every new string against, m (overrides the instrument's).
    pub slot_width: Option<f64>,
    /// Choose every string afresh, even those that would still do.
    pub reselect_all: bool,
    /// Fraction of total-load change beyond which the setup caution is shown.
    pub load_change_caution: f64,
    /// Inputs of the feel figures.
    pub feel: FeelOptions,
}

impl Default for ConvertOptions {
    fn default() -> Self {
        ConvertOptions {
            tolerance: select::DEFAULT_TOLERANCE,
            target: None,
            scale_length: None,
            slot_width: None,
            reselect_all: false,
            load_change_caution: DEFAULT_LOAD_CHANGE,
            feel: FeelOptions::default(),
        }
    }
}

/// A conversion plan.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Conversion {
    /// The instrument before.
    pub instrument_before: String,
    /// The instrument after (the same name when only the tuning or scale changes).
    pub instrument_after: String,
    /// The installed set's name.
    pub set: String,
    /// The tuning before.
    pub tuning_before: String,
    /// The tuning after.
    pub tuning_after: String,
    /// One entry per course of the instrument after.
    pub courses: Vec<ConvertCourse>,
    /// Courses of the set that the instrument after no longer has.
    pub removed_courses: Vec<u32>,
    /// Sum of all tensions before, N.
    pub total_before_n: f64,
    /// Sum of all tensions after, N.
    pub total_after_n: f64,
    /// Change of the total, %.
    pub total_change_pct: f64,
    /// The setup caution, when the total changes by more than the threshold.
    pub load_caution: Option<String>,
    /// The instrument's rated load, N, if stated.
    pub rated_load_n: Option<f64>,
    /// Number of strings replaced.
    pub strings_replaced: usize,
    /// Every warning, course by course, then the instrument's.
    pub warnings: Vec<Warning>,
    /// Safety cautions, present when a caution, a danger or a large load change came up.
    pub cautions: Vec<String>,
}

/// One course of a conversion.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ConvertCourse {
    /// The course number.
    pub course: u32,
    /// The pitch before, as written in the old instrument (absent for a new course).
    pub pitch_before: Option<String>,
    /// The pitch after, as written in the new instrument.
    pub pitch_after: String,
    /// The tuning's label for the pitch after.
    pub pitch_label: String,
    /// Nearest 12-tone note name of the pitch after.
    pub note_name: String,
    /// Cents from that note to the pitch after.
    pub note_offset_cents: f64,
    /// Frequency before, Hz.
    pub pitch_before_hz: Option<f64>,
    /// Frequency after, Hz.
    pub pitch_after_hz: f64,
    /// Vibrating length before, m.
    pub length_before_m: Option<f64>,
    /// Vibrating length after, m.
    pub length_after_m: f64,
    /// The strings.
    pub strings: Vec<ConvertString>,
    /// Warnings about the course after conversion.
    pub warnings: Vec<Warning>,
}

/// A string's figures on one side of the conversion.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Side {
    /// The string (kind id, or measured).
    pub string: String,
    /// The trade's name for its diameter, e.g. `0.012 in`, if known.
    pub gauge: Option<String>,
    /// Outer diameter, mm.
    pub diameter_mm: Option<f64>,
    /// Outer diameter, in.
    pub diameter_in: Option<f64>,
    /// Linear density, kg/m.
    pub unit_mass_kg_per_m: f64,
    /// Frequency, Hz.
    pub pitch_hz: f64,
    /// Tension, N.
    pub tension_n: f64,
    /// Stress over breaking strength, if known.
    pub stress_ratio: Option<f64>,
    /// Pitch at which it breaks on this length, Hz, if known.
    pub break_pitch_hz: Option<f64>,
}

/// How a new string fits the nut slot.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SlotFit {
    /// The width it was measured against, mm.
    pub width_mm: f64,
    /// `stated` (instrument or --slot) or `old string` (no width stated).
    pub against: String,
    /// How much wider the new string is, mm (negative: narrower).
    pub wider_by_mm: f64,
    /// Whether it fits.
    pub fits: bool,
}

/// One string of a conversion.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ConvertString {
    /// Interval from the course pitch (after).
    pub interval: String,
    /// The installed string before (absent on a new course).
    pub before: Option<Side>,
    /// The string after.
    pub after: Side,
    /// Whether the installed string is kept.
    pub kept: bool,
    /// The tension aimed for, N.
    pub target_tension_n: f64,
    /// Tension change, % (absent on a new course).
    pub tension_change_pct: Option<f64>,
    /// Stress change, % of the stress before (absent when unknown).
    pub stress_change_pct: Option<f64>,
    /// Fit in the nut slot, when a width is known.
    pub slot: Option<SlotFit>,
    /// Stiffness and feel after.
    pub feel_after: Feel,
    /// The string after as a set entry.
    #[serde(skip)]
    pub set_string: SetString,
}

impl Conversion {
    /// The set after conversion, named after the tuning it is for.
    pub fn new_set(&self) -> StringSet {
        let courses = self
            .courses
            .iter()
            .map(|course| SetCourse {
                course: course.course,
                strings: course
                    .strings
                    .iter()
                    .map(|s| s.set_string.clone())
                    .collect(),
            })
            .collect();
        StringSet::chosen_for(
            &self.instrument_after,
            &self.tuning_after,
            format!(
                "Converted by taut from `{}` in {}.",
                self.set, self.tuning_before
            ),
            courses,
            "the conversion",
        )
    }
}

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
    let limits = stress_limits(after);
    let limits_before = stress_limits(before);
    let mut courses = Vec::with_capacity(after.courses.len());
    let mut total_before_n = 0.0;
    let mut seen_before = Vec::new();
    // The whole set, before: every course of the old instrument.
    for index in 0..before.courses.len() {
        let course = before
            .course_input(index, None)
            .ok_or_else(|| Error::input("a course has no vibrating length"))?;
        let strings = installed(set, before, &course, kinds, materials)?;
        let pitch = before.course_pitch(&course, tuning_before)?;
        for ((_, construction, _), layout) in strings.iter().zip(course.strings) {
            total_before_n += physics::tension(
                construction.unit_mass(),
                course.length_m,
                pitch.hz * layout.interval.ratio(),
            );
        }
        seen_before.push(course.number);
    }
    for index in 0..after.courses.len() {
        let course = after
            .course_input(index, options.target.as_ref())
            .ok_or_else(|| Error::input("a course has no vibrating length"))?;
        let pitch = after.course_pitch(&course, tuning_after)?;
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

type Installed<'k> = Vec<(SetString, Construction<'k>, Option<&'k StringKind>)>;

fn installed<'k>(
    set: &StringSet,
    instrument: &Instrument,
    course: &CourseInput<'_>,
    kinds: &'k StringKinds,
    materials: &'k Materials,
) -> Result<Installed<'k>> {
    let strings = set_strings(set, instrument, course, kinds, materials)?
        .ok_or_else(|| missing_course(set, instrument, course.number))?;
    Ok(strings
        .into_iter()
        .map(|(written, resolved)| (written, resolved.construction, resolved.kind))
        .collect())
}

#[derive(Clone, Copy)]
struct Limits {
    after: StressLimits,
    before: StressLimits,
}

#[allow(clippy::too_many_arguments)]
fn convert_course(
    after: &Instrument,
    index: usize,
    placed: &Placed<'_>,
    before: Option<&Placed<'_>>,
    installed: Option<&[(SetString, Construction<'_>, Option<&StringKind>)]>,
    kinds: &StringKinds,
    limits: Limits,
    options: &ConvertOptions,
) -> Result<ConvertCourse> {
    let course = &placed.course;
    let slot_stated = options.slot_width.or(course.max_diameter_m);
    let mut strings = Vec::with_capacity(course.strings.len());
    let mut warnings = Vec::new();
    for (string_index, layout) in course.strings.iter().enumerate() {
        let at = StringRef {
            course: course.number,
            string: string_index + 1,
        };
        let pitch_hz = placed.pitch.hz * layout.interval.ratio();
        let old = installed.and_then(|list| list.get(string_index));
        let before_side = match (old, before) {
            (Some((written, construction, _)), Some(place)) => {
                let old_layout = &place.course.strings[string_index];
                let hz = place.pitch.hz * old_layout.interval.ratio();
                let checks = Checks {
                    limits: limits.before,
                    ..Checks::default()
                };
                let evaluation = select::evaluate(construction, hz, place.length_m, &checks);
                Some(side(written, &evaluation, hz))
            }
            _ => None,
        };
        // Target: the old tension (keep the feel), or the player's new target, or for a new
        // course the new instrument's own.
        let goal = course.tension;
        let target_tension_n = match (&options.target, &before_side) {
            (None, Some(old)) => old.tension_n,
            _ => goal.map(|g| g.target_n).ok_or_else(|| {
                after.point(
                    Error::input(format!(
                        "course {} is new and has no tension target",
                        course.number
                    ))
                    .help("give the course a `tension` in the instrument, or pass --tension"),
                    &[PathStep::Key("courses"), PathStep::Index(index)],
                )
            })?,
        };
        let checks = Checks {
            min_tension: goal.and_then(|g| g.min_n),
            max_tension: goal.and_then(|g| g.max_n),
            widest: slot_stated,
            limits: limits.after,
        };
        let request = Request {
            frequency: pitch_hz,
            length: placed.length_m,
            target_tension: target_tension_n,
            tolerance: options.tolerance,
            checks,
        };
        let keep = match old {
            Some((written, construction, _)) if !options.reselect_all => {
                let evaluation = select::evaluate(construction, pitch_hz, placed.length_m, &checks);
                let close =
                    (evaluation.tension / target_tension_n - 1.0).abs() <= options.tolerance;
                let blocked = evaluation.warnings.intersects(
                    Warnings::STRESS_DANGER
                        .union(Warnings::BELOW_WINDOW)
                        .union(Warnings::ABOVE_WINDOW)
                        .union(Warnings::WIDER_THAN_SLOT),
                );
                (close && !blocked).then(|| (written.clone(), *construction, evaluation))
            }
            _ => None,
        };
        // Whether a newly chosen string is already the heaviest or the thinnest of its catalog,
        // so that a window it misses is out of reach for its kind.
        let mut catalog_end = (false, false);
        let (set_string, construction, evaluation, selection_flags) = match keep {
            Some((written, construction, evaluation)) => {
                (written, construction, evaluation, evaluation.warnings)
            }
            None => {
                let allowed = allowed_kinds(after, index, course, string_index, old, kinds)?;
                let mut scratch = vec![None; allowed.len()];
                let selection = select::select(&request, &allowed, &mut scratch);
                let chosen = selection.chosen.ok_or_else(|| {
                    after.point(
                        Error::input(format!(
                            "course {}: none of the allowed kinds has any gauge to choose from",
                            course.number
                        )),
                        &[PathStep::Key("courses"), PathStep::Index(index)],
                    )
                })?;
                let kind = allowed[chosen.kind];
                let construction = kind.construction(chosen.diameter);
                let evaluation =
                    select::evaluate(&construction, pitch_hz, placed.length_m, &checks);
                flag_catalog(&mut warnings, at, &selection, kind, &request);
                let gauges = kind.gauges();
                catalog_end = (
                    gauges.last().is_some_and(|g| g.diameter == chosen.diameter),
                    gauges
                        .first()
                        .is_some_and(|g| g.diameter == chosen.diameter),
                );
                (
                    SetString::Kind {
                        kind: kind.id.as_str().to_string(),
                        diameter: chosen.diameter,
                        core_diameter: None,
                    },
                    construction,
                    evaluation,
                    selection.warnings,
                )
            }
        };
        let kept = old.is_some_and(|(written, _, _)| *written == set_string);
        let after_side = side(&set_string, &evaluation, pitch_hz);
        flag_common(
            &mut warnings,
            at,
            &evaluation,
            selection_flags,
            &checks,
            pitch_hz,
            set_string.diameter(),
            catalog_end,
        );
        let slot = slot_fit(
            slot_stated,
            before_side
                .as_ref()
                .and_then(|b| b.diameter_mm.map(|d| d / 1000.0)),
            set_string.diameter(),
        );
        if let Some(fit) = slot
            .as_ref()
            .filter(|fit| !fit.fits && fit.against == OLD_STRING)
        {
            warnings.push(Warning {
                kind: WarningKind::WiderThanSlot,
                severity: Severity::Note,
                course: Some(course.number),
                string: Some(string_index + 1),
                value: (fit.width_mm + fit.wider_by_mm) / 1000.0,
                limit: fit.width_mm / 1000.0,
                message: format!(
                    "Course {} string {}: the new string is {:.3} mm wider than the old one ({:.3} mm); the nut slot was cut for the old string and may need widening by a qualified person.",
                    course.number,
                    string_index + 1,
                    fit.wider_by_mm,
                    fit.width_mm
                ),
            });
        }
        let change = |after: f64, before: f64| (after / before - 1.0) * 100.0;
        strings.push(ConvertString {
            interval: layout.interval.written().to_string(),
            tension_change_pct: before_side
                .as_ref()
                .map(|b| change(after_side.tension_n, b.tension_n)),
            stress_change_pct: match (
                before_side.as_ref().and_then(|b| b.stress_ratio),
                after_side.stress_ratio,
            ) {
                (Some(b), Some(a)) => Some(change(a, b)),
                _ => None,
            },
            before: before_side,
            after: after_side,
            kept,
            target_tension_n,
            slot,
            feel_after: feel::feel(
                &construction,
                evaluation.tension,
                placed.length_m,
                &options.feel,
            ),
            set_string,
        });
    }
    Ok(ConvertCourse {
        course: course.number,
        pitch_before: before.map(|b| b.course.pitch.to_string()),
        pitch_after: course.pitch.to_string(),
        pitch_label: placed.pitch.label.clone(),
        note_name: placed.pitch.note_name.clone(),
        note_offset_cents: placed.pitch.note_offset_cents,
        pitch_before_hz: before.map(|b| b.pitch.hz),
        pitch_after_hz: placed.pitch.hz,
        length_before_m: before.map(|b| b.length_m),
        length_after_m: placed.length_m,
        strings,
        warnings,
    })
}

const OLD_STRING: &str = "old string";

fn slot_fit(stated: Option<f64>, old: Option<f64>, new: Option<f64>) -> Option<SlotFit> {
    let new = new?;
    let (width, against) = match (stated, old) {
        (Some(width), _) => (width, "stated"),
        (None, Some(old)) => (old, OLD_STRING),
        (None, None) => return None,
    };
    // A micrometre is far below any slot's tolerance: equal diameters read back from a file fit.
    let wider_by = new - width;
    Some(SlotFit {
        width_mm: width * 1000.0,
        against: against.to_string(),
        wider_by_mm: wider_by * 1000.0,
        fits: wider_by <= 1e-6,
    })
}

/// The kinds a replacement may be chosen from: the installed string's kind first, then the
/// instrument's list for this string (its own, the course's, or the defaults).
fn allowed_kinds<'k>(
    after: &Instrument,
    index: usize,
    course: &CourseInput<'_>,
    string_index: usize,
    old: Option<&(SetString, Construction<'_>, Option<&'k StringKind>)>,
    kinds: &'k StringKinds,
) -> Result<Vec<&'k StringKind>> {
    let mut allowed: Vec<&StringKind> = Vec::new();
    if let Some(kind) = old.and_then(|(_, _, kind)| *kind) {
        allowed.push(kind);
    }
    let ids = course.strings[string_index]
        .kinds
        .as_deref()
        .or(course.kinds)
        .unwrap_or(&[]);
    for (position, id) in ids.iter().enumerate() {
        let kind = kinds.get(id.trim()).map_err(|err| {
            after.point(
                err.field(format!("courses[{index}].kinds[{position}]")),
                &[
                    PathStep::Key("courses"),
                    PathStep::Index(index),
                    PathStep::Key("kinds"),
                ],
            )
        })?;
        if !allowed.iter().any(|k| k.id == kind.id) {
            allowed.push(kind);
        }
    }
    if allowed.is_empty() {
        return Err(after.point(
            Error::input(format!(
                "course {}: the installed string has no kind and the instrument allows none, so there is nothing to choose a replacement from",
                course.number
            ))
            .help("list `kinds` for the course or in `defaults`"),
            &[PathStep::Key("courses"), PathStep::Index(index)],
        ));
    }
    Ok(allowed)
}

fn side(written: &SetString, evaluation: &select::Evaluation, pitch_hz: f64) -> Side {
    let diameter = written.diameter();
    Side {
        string: written.label(),
        gauge: diameter.map(gauge_label),
        diameter_mm: diameter.map(|d| d * 1000.0),
        diameter_in: diameter.map(|d| d / METRES_PER_INCH),
        unit_mass_kg_per_m: evaluation.unit_mass,
        pitch_hz,
        tension_n: evaluation.tension,
        stress_ratio: evaluation.stress_ratio,
        break_pitch_hz: evaluation.break_frequency,
    }
}

fn flag_catalog(
    warnings: &mut Vec<Warning>,
    at: StringRef,
    selection: &select::Selection,
    kind: &StringKind,
    request: &Request,
) {
    let gauges = kind.gauges();
    if selection.warnings.contains(Warnings::THINNER_THAN_CATALOG) {
        if let Some(lightest) = gauges.first() {
            warnings
                .push(at.thinner_than_practical(selection.required_unit_mass, lightest.unit_mass));
        }
    }
    if selection.warnings.contains(Warnings::THICKER_THAN_CATALOG) {
        if let Some(heaviest) = gauges.last() {
            warnings
                .push(at.thicker_than_catalog(selection.required_unit_mass, heaviest.unit_mass));
        }
    }
    if selection.warnings.contains(Warnings::NONE_WITHIN_TOLERANCE) {
        if let Some(chosen) = selection.chosen {
            warnings.push(at.off_target(chosen.tension, request.target_tension, request.tolerance));
        }
    }
}

#[allow(clippy::too_many_arguments)]
fn flag_common(
    warnings: &mut Vec<Warning>,
    at: StringRef,
    evaluation: &select::Evaluation,
    flags: Warnings,
    checks: &Checks,
    pitch_hz: f64,
    diameter: Option<f64>,
    (heaviest, thinnest): (bool, bool),
) {
    if let (Some(ratio), Some(break_hz)) = (evaluation.stress_ratio, evaluation.break_frequency) {
        if flags.contains(Warnings::STRESS_DANGER) || ratio > checks.limits.danger {
            warnings.push(at.stress(
                WarningKind::StressDanger,
                ratio,
                checks.limits.danger,
                break_hz,
                pitch_hz,
            ));
        } else if ratio > checks.limits.caution {
            warnings.push(at.stress(
                WarningKind::StressCaution,
                ratio,
                checks.limits.caution,
                break_hz,
                pitch_hz,
            ));
        }
    }
    if let (Some(widest), Some(diameter)) = (checks.widest, diameter) {
        if diameter > widest {
            warnings.push(at.wider_than_slot(diameter, widest));
        }
    }
    if let Some(window) = at.outside_window_of_catalog(
        evaluation.tension,
        checks.min_tension,
        checks.max_tension,
        heaviest,
        thinnest,
    ) {
        warnings.push(window);
    }
}
