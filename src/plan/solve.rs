//! From an instrument, a tuning and options to a [`Plan`]: resolve each course's pitch through
//! the tuning, derive each string's pitch from its interval, ask the selector
//! ([`crate::strings::select::select`]) for a string, and turn its flags into [`Warning`]s.
//!
//! Physics (Mersenne's laws, f = (1/2L)·√(T/μ), REFERENCES.md §1) lives in [`crate::strings::physics`]
//! and the choice rule in [`crate::strings::select`]; this module only wires them to the instrument.
//! Kind lists are resolved once up front into one flat list, and the selector's scratch space
//! is one buffer reused for every string, so solving a course allocates only its output.

use std::ops::Range;

use crate::error::{Error, Result};
use crate::input::units::METRES_PER_INCH;
use crate::input::yaml::PathStep;
use crate::instrument::{field_name, CourseInput, Instrument, TensionSpec};
use crate::plan::warning::{with_load_check, StringRef, Warning, WarningKind};
use crate::plan::{Alternatives, CoursePlan, Plan, StringChoice, StringPlan};
use crate::strings::kind::{KindBuild, StringKind, StringKinds};
use crate::strings::select::{self, Checks, Choice, Request, StressLimits, Warnings};
use crate::strings::stock::Stock;
use crate::tuning::{self, Tuning};

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
    solve(instrument, &tuning, stock.kinds(), options.tension.as_ref())
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

/// Solves every course of `instrument` in `tuning` with strings of `kinds`; `tension` replaces
/// the file's tension settings when given.
pub fn solve(
    instrument: &Instrument,
    tuning: &Tuning,
    kinds: &StringKinds,
    tension: Option<&TensionSpec>,
) -> Result<Plan> {
    let limits = stress_limits(instrument)?;
    let tolerance = instrument
        .tolerance
        .map_or(select::DEFAULT_TOLERANCE, |percent| percent.fraction());
    let lists = KindLists::resolve(instrument, kinds)?;
    let mut best_per_kind = vec![None; lists.longest];
    let mut courses = Vec::with_capacity(instrument.courses.len());
    let mut string_slot = 0;
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
        };
        let ranges = &lists.per_string[string_slot..string_slot + course.strings.len()];
        string_slot += course.strings.len();
        courses.push(context.solve(&lists.arena, ranges, &mut best_per_kind)?);
    }
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
    Ok(Plan {
        instrument: instrument.name.clone(),
        tuning: tuning.name().to_string(),
        courses,
        total_tension_n,
        rated_load_n,
        caution_stress_ratio: limits.caution,
        danger_stress_ratio: limits.danger,
        warnings,
    })
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

/// Every kind list of the instrument resolved to kinds, in one flat list; each string of each
/// course (in order) gets a range into it.
struct KindLists<'k> {
    arena: Vec<&'k StringKind>,
    per_string: Vec<Range<usize>>,
    longest: usize,
}

impl<'k> KindLists<'k> {
    fn resolve(instrument: &Instrument, kinds: &'k StringKinds) -> Result<Self> {
        let mut lists = KindLists {
            arena: Vec::new(),
            per_string: Vec::new(),
            longest: 0,
        };
        let defaults = match &instrument.defaults.kinds {
            Some(ids) => Some(lists.push(
                instrument,
                kinds,
                ids,
                &[PathStep::Key("defaults"), PathStep::Key("kinds")],
            )?),
            None => None,
        };
        for (index, course) in instrument.courses.iter().enumerate() {
            let course_range = match &course.kinds {
                Some(ids) => Some(lists.push(
                    instrument,
                    kinds,
                    ids,
                    &[
                        PathStep::Key("courses"),
                        PathStep::Index(index),
                        PathStep::Key("kinds"),
                    ],
                )?),
                None => defaults.clone(),
            };
            for (string_index, string) in course.strings.iter().enumerate() {
                let range = match &string.kinds {
                    Some(ids) => Some(lists.push(
                        instrument,
                        kinds,
                        ids,
                        &[
                            PathStep::Key("courses"),
                            PathStep::Index(index),
                            PathStep::Key("strings"),
                            PathStep::Index(string_index),
                            PathStep::Key("kinds"),
                        ],
                    )?),
                    None => course_range.clone(),
                };
                let range = range.ok_or_else(|| {
                    instrument.point(
                        Error::input(format!(
                            "course {} allows no string kinds",
                            instrument.course_number(index)
                        ))
                        .field(format!("courses[{index}].kinds"))
                        .help(format!(
                            "list `kinds` in `defaults` or in the course; known kinds: {}",
                            kinds
                                .all()
                                .iter()
                                .map(|kind| kind.id.as_str())
                                .collect::<Vec<_>>()
                                .join(", ")
                        )),
                        &[PathStep::Key("courses"), PathStep::Index(index)],
                    )
                })?;
                lists.per_string.push(range);
            }
        }
        Ok(lists)
    }

    fn push(
        &mut self,
        instrument: &Instrument,
        kinds: &'k StringKinds,
        ids: &[String],
        path: &[PathStep<'_>],
    ) -> Result<Range<usize>> {
        if ids.len() > MAX_KINDS_PER_LIST {
            return Err(instrument.point(
                Error::input(format!(
                    "{} kinds are listed; at most {MAX_KINDS_PER_LIST} are allowed",
                    ids.len()
                )),
                path,
            ));
        }
        let start = self.arena.len();
        for (position, id) in ids.iter().enumerate() {
            let kind = kinds.get(id.trim()).map_err(|err| {
                // Flow lists (`[a, b]`) cannot be located item by item: point at the key's line.
                instrument.point(err.field(format!("{}[{position}]", field_name(path))), path)
            })?;
            self.arena.push(kind);
        }
        self.longest = self.longest.max(ids.len());
        Ok(start..self.arena.len())
    }
}

/// Everything one course's solve reads.
struct CourseContext<'a> {
    instrument: &'a Instrument,
    tuning: &'a Tuning,
    course: CourseInput<'a>,
    limits: StressLimits,
    tolerance: f64,
}

impl CourseContext<'_> {
    fn path(&self, key: &'static str) -> [PathStep<'static>; 3] {
        [
            PathStep::Key("courses"),
            PathStep::Index(self.course.index),
            PathStep::Key(key),
        ]
    }

    fn solve(
        &self,
        arena: &[&StringKind],
        ranges: &[Range<usize>],
        best_per_kind: &mut [Option<Choice>],
    ) -> Result<CoursePlan> {
        let course = self.course;
        let resolved = self.instrument.course_pitch(&course, self.tuning)?;
        let goal = course.tension.ok_or_else(|| {
            self.instrument.point(
                Error::input(format!("course {} has no tension target", course.number))
                    .field(format!("courses[{}].tension", course.index))
                    .help("give `tension` in `defaults` or in the course (e.g. `tension: 70N`), or pass --tension"),
                &[PathStep::Key("courses"), PathStep::Index(course.index)],
            )
        })?;
        let mut strings = Vec::with_capacity(course.strings.len());
        let mut warnings = Vec::new();
        for (string_index, (string, range)) in course.strings.iter().zip(ranges).enumerate() {
            let kinds = &arena[range.clone()];
            let pitch_hz = resolved.hz * string.interval.ratio();
            let request = Request {
                frequency: pitch_hz,
                length: course.length_m,
                target_tension: goal.target_n,
                tolerance: self.tolerance,
                checks: Checks {
                    min_tension: goal.min_n,
                    max_tension: goal.max_n,
                    widest: course.max_diameter_m,
                    limits: self.limits,
                },
            };
            let scratch = &mut best_per_kind[..kinds.len()];
            let selection = select::select(&request, kinds, scratch);
            let chosen = selection.chosen.ok_or_else(|| {
                self.instrument.point(
                    Error::input(format!(
                        "course {}: none of the allowed kinds has any gauge to choose from",
                        course.number
                    )),
                    &self.path("kinds"),
                )
            })?;
            let at = StringRef {
                course: course.number,
                string: string_index + 1,
            };
            let kind = kinds[chosen.kind];
            self.flag(
                &mut warnings,
                at,
                &request,
                &selection.warnings,
                &chosen,
                selection.required_unit_mass,
                kind,
                pitch_hz,
            );
            let choice_of = |choice: &Choice| describe(kinds[choice.kind], choice, &request);
            let feel = crate::strings::feel::feel(
                &kind.construction(chosen.diameter),
                chosen.tension,
                course.length_m,
                &crate::strings::feel::FeelOptions::default(),
            );
            strings.push(StringPlan {
                interval: string.interval.written().to_string(),
                pitch_hz,
                target_tension_n: goal.target_n,
                required_unit_mass_kg_per_m: selection.required_unit_mass,
                choice: choice_of(&chosen),
                alternatives: Alternatives {
                    thinner: selection.thinner.as_ref().map(choice_of),
                    thicker: selection.thicker.as_ref().map(choice_of),
                    other_kinds: scratch
                        .iter()
                        .flatten()
                        .filter(|other| other.kind != chosen.kind)
                        .map(choice_of)
                        .collect(),
                },
                feel: Some(feel),
            });
        }
        Ok(CoursePlan {
            course: course.number,
            pitch: resolved,
            length_m: course.length_m,
            strings,
            warnings,
        })
    }

    /// Turns the selector's flags for one string into warnings with figures.
    #[allow(clippy::too_many_arguments)]
    fn flag(
        &self,
        warnings: &mut Vec<Warning>,
        at: StringRef,
        request: &Request,
        flags: &Warnings,
        chosen: &Choice,
        required_unit_mass: f64,
        kind: &StringKind,
        pitch_hz: f64,
    ) {
        let limits = request.checks.limits;
        if flags.contains(Warnings::STRESS_DANGER) {
            warnings.push(at.stress(
                WarningKind::StressDanger,
                chosen.stress_ratio,
                limits.danger,
                chosen.break_frequency,
                pitch_hz,
            ));
        } else if flags.contains(Warnings::STRESS_CAUTION) {
            warnings.push(at.stress(
                WarningKind::StressCaution,
                chosen.stress_ratio,
                limits.caution,
                chosen.break_frequency,
                pitch_hz,
            ));
        }
        let gauges = kind.gauges();
        if flags.contains(Warnings::THINNER_THAN_CATALOG) {
            if let Some(lightest) = gauges.first() {
                warnings.push(at.thinner_than_practical(required_unit_mass, lightest.unit_mass));
            }
        }
        if flags.contains(Warnings::THICKER_THAN_CATALOG) {
            if let Some(heaviest) = gauges.last() {
                warnings.push(at.thicker_than_catalog(required_unit_mass, heaviest.unit_mass));
            }
        }
        if flags.contains(Warnings::WIDER_THAN_SLOT) {
            if let Some(widest) = request.checks.widest {
                warnings.push(at.wider_than_slot(chosen.diameter, widest));
            }
        }
        if let Some(window) = at.outside_window(
            chosen.tension,
            request.checks.min_tension,
            request.checks.max_tension,
        ) {
            warnings.push(window);
        }
        if flags.contains(Warnings::NONE_WITHIN_TOLERANCE) {
            warnings.push(at.off_target(chosen.tension, request.target_tension, self.tolerance));
        }
    }
}

/// The plan's description of one evaluated gauge.
fn describe(kind: &StringKind, choice: &Choice, request: &Request) -> StringChoice {
    let (construction, material) = match &kind.build {
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
    };
    StringChoice {
        kind: kind.id.as_str().to_string(),
        construction: construction.to_string(),
        material,
        gauge: gauge_label(choice.diameter),
        diameter_mm: choice.diameter * 1000.0,
        diameter_in: choice.diameter / METRES_PER_INCH,
        unit_mass_kg_per_m: choice.unit_mass,
        tension_n: choice.tension,
        stress_ratio: choice.stress_ratio,
        break_pitch_hz: choice.break_frequency,
        inharmonicity: kind
            .construction(choice.diameter)
            .inharmonicity(choice.tension, request.length),
    }
}

/// The way the trade writes this diameter: inches for gauges on the half-thousandth grid of
/// inch catalogs, millimetres otherwise.
pub fn gauge_label(diameter_m: f64) -> String {
    let inches = diameter_m / METRES_PER_INCH;
    let half_thousandths = inches * 2000.0;
    if (half_thousandths - half_thousandths.round()).abs() < 1e-6 {
        let text = format!("{inches:.4}");
        let text = text.strip_suffix('0').unwrap_or(&text);
        format!("{text} in")
    } else {
        format!("{:.2} mm", diameter_m * 1000.0)
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
    }
}
