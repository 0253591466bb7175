//! From an instrument, a tuning and options to a [`Plan`]: resolve each course's pitch through
//! the tuning, derive each string's pitch from its interval, ask the selector
//! ([`crate::strings::select::select`]) for a string, and turn its flags into [`Warning`]s.
//!
//! Physics (Mersenne's laws, f = (1/2L)·√(T/μ), REFERENCES §1.1) lives in [`crate::strings::physics`]
//! and the choice rule in [`crate::strings::select`]; this module only wires them to the instrument.
//! Kind lists are resolved once up front into one flat list, and the selector's scratch space
//! is one buffer reused for every string, so solving a course allocates only its output.

use std::ops::Range;

use crate::error::{Error, Result};
use crate::input::units::{fixed, METRES_PER_INCH};
use crate::input::yaml::PathStep;
use crate::instrument::{field_name, CourseInput, Instrument, TensionSpec};
use crate::plan::warning::{with_load_check, StringRef, Warning, WarningKind};
use crate::plan::{Alternatives, CoursePitch, CoursePlan, Plan, StringChoice, StringPlan};
use crate::strings::kind::{KindBuild, StringKind, StringKinds};
use crate::strings::select::{self, Checks, Choice, Request, Selection, StressLimits, Warnings};
use crate::strings::stock::Stock;
use crate::tuning::{self, Tuning};

mod course;
#[allow(unused_imports)]
pub(crate) use course::*;
mod fixed;
mod words;
pub(crate) use words::PlanWords;

/// The tuning used when neither the command line nor the instrument names one: 12 equal
/// divisions of the octave at A4 = 440 Hz (ISO 16:1975).
pub const DEFAULT_TUNING: &str = "12edo";

/// The most kinds one course or string may list; the selector's scratch space is this long.
pub const MAX_KINDS_PER_LIST: usize = 32;

/// Choices that override the instrument file.
#[derive(Debug, Clone, Default)]
pub struct SolveOptions {
    /// A tuning (name, inline spec or file) instead of the instrument's own.
    pub tuning: Option<String>,
    /// A tension for every course instead of the file's targets, windows and profile.
    pub tension: Option<TensionSpec>,
}

/// Loads the tuning the options or the instrument name (or [`DEFAULT_TUNING`]) and solves.
/// `stock` holds the string kinds to choose from ([`Stock::builtin`] for the shipped ones).
pub fn plan(instrument: &Instrument, stock: &Stock, options: &SolveOptions) -> Result<Plan> {
    let tuning = tuning_for(instrument, options.tuning.as_deref(), "--tuning")?;
    let mut plan = solve(instrument, &tuning, stock, options.tension.as_ref())?;
    plan.tuning_spec = Some(tuning_spec_for(instrument, options.tuning.as_deref()).to_string());
    Ok(plan)
}

/// The tuning spec `instrument` is planned in, as written: `given`, else the file's own
/// `tuning:`, else [`DEFAULT_TUNING`] (the order [`tuning_for`] loads them in), trimmed.
pub fn tuning_spec_for<'a>(instrument: &'a Instrument, given: Option<&'a str>) -> &'a str {
    given
        .or(instrument.tuning.as_deref())
        .unwrap_or(DEFAULT_TUNING)
        .trim()
}

/// The tuning to use for `instrument`: the one given on the command line as `flag` (errors
/// name the flag), else the file's own `tuning:` (errors point at its line), else
/// [`DEFAULT_TUNING`].
pub fn tuning_for(instrument: &Instrument, given: Option<&str>, flag: &str) -> Result<Tuning> {
    match (given, &instrument.tuning) {
        (Some(spec), _) => tuning::load(spec).map_err(|err| err.in_origin(flag)),
        (None, Some(spec)) => {
            tuning::load(spec).map_err(|err| instrument.point(err, &[PathStep::Key("tuning")]))
        }
        (None, None) => tuning::load(DEFAULT_TUNING),
    }
}

/// Solves every course of `instrument` in `tuning` with the string kinds and materials of
/// `stock`; `tension` replaces the file's tension settings when given. Strings the file fixes
/// (`string:`) are checked, not chosen.
pub fn solve(
    instrument: &Instrument,
    tuning: &Tuning,
    stock: &Stock,
    tension: Option<&TensionSpec>,
) -> Result<Plan> {
    let kinds = stock.kinds();
    let limits = stress_limits(instrument)?;
    let tolerance = instrument
        .tolerance
        .map_or(select::DEFAULT_TOLERANCE, |percent| percent.fraction());
    let lists = KindLists::resolve(instrument, kinds)?;
    let mut best_per_kind = vec![None; lists.longest];
    let mut courses = Vec::with_capacity(instrument.courses.len());
    let mut string_slot = 0;
    let words = PlanWords::default();
    for index in 0..instrument.courses.len() {
        let course = instrument
            .course_input(index, tension)
            .ok_or_else(|| Error::input("a course has no vibrating length"))?;
        let context = CourseContext {
            instrument,
            tuning,
            course,
            limits,
            tolerance,
            stock,
            words: &words,
        };
        let ranges = &lists.per_string[string_slot..string_slot + course.strings.len()];
        string_slot += course.strings.len();
        courses.push(context.solve(&lists.arena, ranges, &mut best_per_kind)?);
    }
    let mut plan = finish_plan(instrument, tuning, courses, limits);
    crate::plan::raises::apply(instrument, tuning, &mut plan, tension)?;
    Ok(plan)
}

/// The whole plan from its courses: the total load, its check against the rated load, and
/// every warning in course order.
pub(crate) fn finish_plan(
    instrument: &Instrument,
    tuning: &Tuning,
    courses: Vec<CoursePlan>,
    limits: StressLimits,
) -> Plan {
    let total_tension_n: f64 = courses
        .iter()
        .flat_map(|course| &course.strings)
        .map(|string| string.choice.tension_n)
        .sum();
    let rated_load_n = instrument.rated_load.map(|load| load.si());
    let warnings = with_load_check(
        courses.iter().flat_map(|course| &course.warnings),
        total_tension_n,
        rated_load_n,
    );
    Plan {
        instrument: instrument.name.clone(),
        tuning: tuning.name().to_string(),
        tuning_spec: None,
        courses,
        total_tension_n,
        rated_load_n,
        caution_stress_ratio: limits.caution,
        danger_stress_ratio: limits.danger,
        warnings,
        worst_setting_total_n: None,
        reachable_keys: Vec::new(),
    }
}

/// The stress limits `instrument` sets (its own `stress_limits` over the defaults), checked.
pub fn stress_limits(instrument: &Instrument) -> Result<StressLimits> {
    let mut limits = StressLimits::default();
    if let Some(own) = instrument.stress_limits {
        if let Some(caution) = own.caution {
            limits.caution = caution.fraction();
        }
        if let Some(danger) = own.danger {
            limits.danger = danger.fraction();
        }
        if limits.caution >= limits.danger {
            return Err(instrument.point(
                Error::input(format!(
                    "the caution limit ({:.0}%) must be below the danger limit ({:.0}%)",
                    limits.caution * 100.0,
                    limits.danger * 100.0
                )),
                &[PathStep::Key("stress_limits")],
            ));
        }
    }
    Ok(limits)
}

/// A kind's construction (`plain`, `wound`, `measured`) and its materials in words.
fn construction_words(kind: &StringKind) -> (&'static str, String) {
    match &kind.build {
        KindBuild::Plain { material } => ("plain", material.id.as_str().to_string()),
        KindBuild::Wound {
            core_material,
            inner,
            outer,
            ..
        } => (
            "wound",
            match outer {
                Some((outer, _)) => format!(
                    "{} and {} on {}",
                    inner.id.as_str(),
                    outer.id.as_str(),
                    core_material.id.as_str()
                ),
                None => format!("{} on {}", inner.id.as_str(), core_material.id.as_str()),
            },
        ),
        KindBuild::Measured { material, .. } => (
            "measured",
            material
                .as_ref()
                .map_or_else(|| "unknown".to_string(), |m| m.id.as_str().to_string()),
        ),
    }
}

/// The way the trade writes this diameter: inches for gauges on the half-thousandth grid of
/// inch catalogs, millimetres otherwise.
pub fn gauge_label(diameter_m: f64) -> String {
    let inches = diameter_m / METRES_PER_INCH;
    let half_thousandths = inches * 2000.0;
    // Through `fixed`, which writes what `format!` would without the general float formatter
    // (a description is written four times per planned string).
    if (half_thousandths - half_thousandths.round()).abs() < 1e-6 {
        let mut text = fixed(inches, 4);
        if text.ends_with('0') {
            text.pop();
        }
        text.push_str(" in");
        text
    } else {
        let mut text = fixed(diameter_m * 1000.0, 2);
        text.push_str(" mm");
        text
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn gauge_labels_follow_the_catalog_grid() {
        assert_eq!(gauge_label(0.010 * METRES_PER_INCH), "0.010 in");
        assert_eq!(gauge_label(0.0105 * METRES_PER_INCH), "0.0105 in");
        assert_eq!(gauge_label(0.00080), "0.80 mm");
        // Whole inches and the last half-thousandth keep their digits.
        assert_eq!(gauge_label(1.0 * METRES_PER_INCH), "1.000 in");
        assert_eq!(gauge_label(0.0595 * METRES_PER_INCH), "0.0595 in");
    }
}
