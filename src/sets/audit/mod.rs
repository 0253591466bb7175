//! Audit an installed string set under a tuning, without changing any string: per course the
//! tension, stress, breaking pitch, stiffness and feel, the warnings `taut plan` would raise, and
//! a plain yes or no to "can I tune these strings to this?".
//!
//! # The verdict
//!
//! A course gets **no** when any of its strings
//! - runs above the danger fraction of its breaking strength (default 85 %, see
//!   [`crate::strings::select`]): it may break while tuning up;
//! - falls outside the instrument's tension window (below: slack, buzzing; above: too stiff, and
//!   more load than intended);
//! - changes tension by more than [`AuditOptions::max_change`] (default ±30 %) from the
//!   reference tuning, when one is given. This is our own rule of thumb, not a published figure:
//!   tension goes with the square of the pitch, so ±30 % is about −3 to +2.3 semitones, and
//!   players commonly retune a whole tone (−21 %) on the same strings, while larger moves are
//!   usually met with other gauges.
//!
//! It gets **yes, with care** when a string is above the caution fraction (default 65 %), wider
//! than the stated slot, or of unknown strength (a measured string without a material), and
//! **yes** otherwise. These figures are a planning aid; the instrument maker's specifications
//! come first.

use serde::Serialize;

use crate::error::{Error, Result};
use crate::input::units::METRES_PER_INCH;
use crate::instrument::{CourseInput, CourseString, Instrument};
use crate::plan::warning::{with_load_check, StringRef, Warning, WarningKind};
use crate::plan::CoursePitch;
use crate::sets::matching::{cautions_for, check_no_extra_courses, missing_course, set_strings};
use crate::sets::set::{ResolvedString, SetString, StringSet};
use crate::strings::feel::{self, Feel, FeelOptions};
use crate::strings::physics;
use crate::strings::select::{self, Checks, StressLimits, Warnings};
use crate::strings::stock::Stock;
use crate::tuning::Tuning;

pub(crate) mod reference;
pub use reference::{Reference, ReferenceSource};

/// Default largest tension change from the reference tuning before a course gets "no": ±30 %
/// (see the module documentation).
pub const DEFAULT_MAX_CHANGE: f64 = 0.30;

/// Choices for an audit.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct AuditOptions {
    /// Largest accepted relative tension change from the reference tuning.
    pub max_change: f64,
    /// Inputs of the feel figures.
    pub feel: FeelOptions,
}

impl Default for AuditOptions {
    fn default() -> Self {
        AuditOptions {
            max_change: DEFAULT_MAX_CHANGE,
            feel: FeelOptions::default(),
        }
    }
}

/// The answer for one course.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Verdict {
    /// The strings can be tuned to this pitch.
    Yes,
    /// They can, with a caution to heed.
    YesWithCare,
    /// They should not be.
    No,
}

impl Verdict {
    /// The verdict in words.
    pub fn text(self) -> &'static str {
        match self {
            Verdict::Yes => "yes",
            Verdict::YesWithCare => "yes, with care",
            Verdict::No => "no",
        }
    }
}

/// The audit of a set.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Audit {
    /// The instrument's name.
    pub instrument: String,
    /// The set's name.
    pub set: String,
    /// The tuning audited.
    pub tuning: String,
    /// The tuning the tension changes are measured from, if any.
    pub reference_tuning: Option<String>,
    /// One entry per course of the instrument.
    pub courses: Vec<AuditCourse>,
    /// Sum of every string's tension, N.
    pub total_tension_n: f64,
    /// The same sum in the reference tuning, N.
    pub reference_total_tension_n: Option<f64>,
    /// The maker's rated total load, N, when the instrument states one.
    pub rated_load_n: Option<f64>,
    /// Number of courses whose verdict is not "no".
    pub courses_ok: usize,
    /// Every warning, course by course, then the instrument's.
    pub warnings: Vec<Warning>,
    /// Safety cautions, present when any caution or danger fired.
    pub cautions: Vec<String>,
}

/// One course of an audit.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct AuditCourse {
    /// The course number.
    pub course: u32,
    /// The course's pitch, written and resolved (flattened: `pitch`, `pitch_label`,
    /// `note_name`, `note_offset_cents`, `pitch_hz`).
    #[serde(flatten)]
    pub pitch: CoursePitch,
    /// Vibrating length, m.
    pub length_m: f64,
    /// The installed strings.
    pub strings: Vec<AuditString>,
    /// Can these strings take this pitch?
    pub verdict: Verdict,
    /// Why, in one sentence.
    pub reason: String,
    /// Warnings about this course.
    pub warnings: Vec<Warning>,
}

/// One installed string under the tuning.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct AuditString {
    /// Interval from the course pitch, as written in the instrument.
    pub interval: String,
    /// The string as the set names it (kind id, or measured).
    pub string: String,
    /// Outer diameter, mm, if known.
    pub diameter_mm: Option<f64>,
    /// Outer diameter, in, if known.
    pub diameter_in: Option<f64>,
    /// Linear density, kg/m.
    pub unit_mass_kg_per_m: f64,
    /// This string's frequency, Hz.
    pub pitch_hz: f64,
    /// Tension at that pitch, N.
    pub tension_n: f64,
    /// Tension in the reference tuning, N.
    pub reference_tension_n: Option<f64>,
    /// Change from the reference tension, % (positive: tighter).
    pub tension_change_pct: Option<f64>,
    /// Stress in the load-bearing section over breaking strength, if known.
    pub stress_ratio: Option<f64>,
    /// Pitch at which it breaks on this length, Hz, if known.
    pub break_pitch_hz: Option<f64>,
    /// Stiffness and feel.
    pub feel: Feel,
}

/// Ends every warning of an audit with what would fix it, each string's build looked up by its
/// kind in `stock`. Shared by the command line and the explorer, so both say the same.
pub fn attach_fixes(report: &mut Audit, stock: &Stock) {
    use crate::plan::remedy::{self, Build};
    use crate::strings::kind::KindBuild;
    let builds: Vec<(u32, usize, Build)> = report
        .courses
        .iter()
        .flat_map(|course| {
            course.strings.iter().enumerate().map(|(index, string)| {
                let build = match stock.kinds().get(&string.string).map(|kind| &kind.build) {
                    Ok(KindBuild::Plain { .. }) => Build::Plain,
                    Ok(KindBuild::Wound { .. }) => Build::Wound,
                    _ => Build::Unknown,
                };
                (course.course, index + 1, build)
            })
        })
        .collect();
    remedy::attach_by_string(
        report
            .courses
            .iter_mut()
            .map(|course| &mut course.warnings)
            .chain(std::iter::once(&mut report.warnings)),
        &builds,
    );
}

/// Audits `set` on `instrument` in `tuning`; tension changes are measured from `reference`
/// (where the strings are now) when given.
pub fn audit(
    instrument: &Instrument,
    set: &StringSet,
    tuning: &Tuning,
    reference: Option<Reference<'_>>,
    stock: &Stock,
    options: &AuditOptions,
) -> Result<Audit> {
    check_no_extra_courses(set, instrument)?;
    let (kinds, materials) = (stock.kinds(), stock.materials());
    let limits = crate::plan::solve::stress_limits(instrument)?;
    let mut courses = Vec::with_capacity(instrument.courses.len());
    for index in 0..instrument.courses.len() {
        let course = instrument
            .course_input(index, None)
            .ok_or_else(|| Error::input("a course has no vibrating length"))?;
        let strings = set_strings(set, instrument, &course, kinds, materials)?
            .ok_or_else(|| missing_course(set, instrument, course.number))?;
        let pitch = instrument.course_pitch(&course, tuning)?;
        let mut now = None;
        if let Some(reference) = reference {
            let found = (0..reference.instrument.courses.len())
                .find(|&i| reference.instrument.course_number(i) == course.number)
                .and_then(|i| reference.instrument.course_input(i, None));
            if let Some(old) = found {
                if old.strings.len() == course.strings.len() {
                    let old_pitch = reference.instrument.course_pitch(&old, reference.tuning)?;
                    reference
                        .check_reading(set, instrument, tuning, &course, &pitch, &old_pitch)?;
                    now = Some((old_pitch, old.length_m, old.strings));
                }
            }
        }
        let course_audit = audit_course(
            &course,
            &pitch,
            now.as_ref().map(|(p, l, s)| (p, *l, *s)),
            &strings,
            limits,
            options,
        );
        // A state the strings cannot be in is refused, never shown as "was".
        if let Some(reference) = reference {
            for (index, (string, (_, resolved))) in
                course_audit.strings.iter().zip(&strings).enumerate()
            {
                if let (Some(tension), Some(now)) = (string.reference_tension_n, &now) {
                    let hz = now.0.hz * now.2[index].interval.ratio();
                    reference.check_possible(
                        set,
                        &course,
                        (strings.len() > 1).then_some(index),
                        &match string.diameter_mm {
                            Some(mm) => format!("{} {mm:.3} mm", string.string),
                            None => string.string.clone(),
                        },
                        hz,
                        tension,
                        resolved.construction.breaking_tension(),
                    )?;
                }
            }
        }
        courses.push(course_audit);
    }
    let total_tension_n = courses
        .iter()
        .flat_map(|c| &c.strings)
        .map(|s| s.tension_n)
        .sum();
    let reference_total_tension_n = reference.map(|_| {
        courses
            .iter()
            .flat_map(|c| &c.strings)
            .filter_map(|s| s.reference_tension_n)
            .sum()
    });
    let rated_load_n = instrument.rated_load.map(|load| load.si());
    let warnings = with_load_check(
        courses.iter().flat_map(|c| &c.warnings),
        total_tension_n,
        rated_load_n,
    );
    Ok(Audit {
        instrument: instrument.name.clone(),
        set: set.name.clone(),
        tuning: tuning.name().to_string(),
        reference_tuning: reference.map(|r| r.tuning.name().to_string()),
        courses_ok: courses.iter().filter(|c| c.verdict != Verdict::No).count(),
        cautions: cautions_for(&warnings),
        courses,
        total_tension_n,
        reference_total_tension_n,
        rated_load_n,
        warnings,
    })
}

fn audit_course(
    course: &CourseInput<'_>,
    pitch: &CoursePitch,
    reference: Option<(&CoursePitch, f64, &[CourseString])>,
    strings: &[(SetString, ResolvedString<'_>)],
    limits: StressLimits,
    options: &AuditOptions,
) -> AuditCourse {
    let checks = Checks {
        min_tension: course.tension.and_then(|goal| goal.min_n),
        max_tension: course.tension.and_then(|goal| goal.max_n),
        widest: course.max_diameter_m,
        limits,
    };
    let mut out = Vec::with_capacity(strings.len());
    let mut warnings = Vec::new();
    let mut verdict = Verdict::Yes;
    let mut reasons: Vec<String> = Vec::new();
    for (string_index, ((written, resolved), layout)) in
        strings.iter().zip(course.strings).enumerate()
    {
        let at = StringRef {
            course: course.number,
            string: string_index + 1,
        };
        let pitch_hz = pitch.hz * layout.interval.ratio();
        let evaluation =
            select::evaluate(&resolved.construction, pitch_hz, course.length_m, &checks);
        let reference_tension_n = reference.map(|(old_pitch, old_length, old_strings)| {
            physics::tension(
                evaluation.unit_mass,
                old_length,
                old_pitch.hz * old_strings[string_index].interval.ratio(),
            )
        });
        let change = reference_tension_n.map(|before| evaluation.tension / before - 1.0);
        let flags = evaluation.warnings;
        let which = if strings.len() > 1 {
            format!("string {} ", string_index + 1)
        } else {
            String::new()
        };
        if let (Some(ratio), Some(break_hz)) = (evaluation.stress_ratio, evaluation.break_frequency)
        {
            if flags.contains(Warnings::STRESS_DANGER) {
                warnings.push(at.stress(
                    WarningKind::StressDanger,
                    ratio,
                    limits.danger,
                    break_hz,
                    pitch_hz,
                ));
                verdict = verdict.max(Verdict::No);
                reasons.push(format!(
                    "{which}would run at {:.0}% of its breaking strength",
                    ratio * 100.0
                ));
            } else if flags.contains(Warnings::STRESS_CAUTION) {
                warnings.push(at.stress(
                    WarningKind::StressCaution,
                    ratio,
                    limits.caution,
                    break_hz,
                    pitch_hz,
                ));
                verdict = verdict.max(Verdict::YesWithCare);
                reasons.push(format!(
                    "{which}runs at {:.0}% of its breaking strength",
                    ratio * 100.0
                ));
            }
        }
        if flags.contains(Warnings::STRENGTH_UNKNOWN) {
            verdict = verdict.max(Verdict::YesWithCare);
            reasons.push(format!(
                "{which}has an unknown breaking strength (name its material in the set)"
            ));
        }
        if let Some(window) =
            at.outside_window(evaluation.tension, checks.min_tension, checks.max_tension)
        {
            verdict = verdict.max(Verdict::No);
            reasons.push(if window.kind == WarningKind::TensionBelowWindow {
                format!(
                    "{which}would be slack at {:.1} N (window from {:.1} N)",
                    evaluation.tension, window.limit
                )
            } else {
                format!(
                    "{which}would be too tight at {:.1} N (window up to {:.1} N)",
                    evaluation.tension, window.limit
                )
            });
            warnings.push(window);
        }
        if let (Some(widest), Some(diameter)) = (checks.widest, written.diameter()) {
            if flags.contains(Warnings::WIDER_THAN_SLOT) {
                warnings.push(at.wider_than_slot(diameter, widest));
                verdict = verdict.max(Verdict::YesWithCare);
                reasons.push(format!("{which}is wider than the stated slot"));
            }
        }
        if let Some(change) = change.filter(|c| c.abs() > options.max_change) {
            verdict = verdict.max(Verdict::No);
            reasons.push(format!(
                "{which}would change tension by {:+.0}% (limit ±{:.0}%): {}",
                change * 100.0,
                options.max_change * 100.0,
                if change < 0.0 {
                    "it would feel slack; a heavier gauge keeps the feel"
                } else {
                    "it would feel much stiffer; a lighter gauge keeps the feel"
                }
            ));
        }
        out.push(AuditString {
            interval: layout.interval.written().to_string(),
            string: written.label(),
            diameter_mm: written.diameter().map(|d| d * 1000.0),
            diameter_in: written.diameter().map(|d| d / METRES_PER_INCH),
            unit_mass_kg_per_m: evaluation.unit_mass,
            pitch_hz,
            tension_n: evaluation.tension,
            reference_tension_n,
            tension_change_pct: change.map(|c| c * 100.0),
            stress_ratio: evaluation.stress_ratio,
            break_pitch_hz: evaluation.break_frequency,
            feel: feel::feel(
                &resolved.construction,
                evaluation.tension,
                course.length_m,
                &options.feel,
            ),
        });
    }
    let reason = if reasons.is_empty() {
        match out.iter().filter_map(|s| s.stress_ratio).reduce(f64::max) {
            Some(ratio) => format!(
                "tension and stress are within limits (highest stress {:.0}% of breaking strength)",
                ratio * 100.0
            ),
            None => "tension is within limits".to_string(),
        }
    } else {
        reasons.join("; ")
    };
    AuditCourse {
        course: course.number,
        pitch: pitch.clone(),
        length_m: course.length_m,
        strings: out,
        verdict,
        reason,
        warnings,
    }
}
