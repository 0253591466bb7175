//! One set of strings for several tunings: every course solved once for the whole list of
//! tunings (or course-pitch variants) with [`crate::strings::select::several`], then shown in
//! each tuning as an ordinary [`Plan`] block.
//!
//! The result keeps `plan`'s JSON fields: `tunings` holds one block per tuning, each a whole
//! plan (same fields) plus the variant's name; `courses` says per string how well the shared
//! string serves the list and which tuning sets its limits (the slackest and the most stressed);
//! `conflicts` names the tunings that cannot share a string, with the closest compromise.
//! With one tuning the block equals `taut plan`'s plan exactly.

mod conflict;
pub mod variants;

use serde::Serialize;

use crate::error::{Error, Result};
use crate::input::yaml::PathStep;
use crate::instrument::{Instrument, TensionSpec};
use crate::plan::solve::{finish_plan, stress_limits, CourseContext, KindLists, PlanWords};
use crate::plan::warning::{Severity, SAFETY_CAUTIONS};
use crate::plan::{CoursePlan, Plan, StringPlan};
use crate::strings::select::several::{self, Agreement, Balance};
use crate::strings::select::{self as selector, Request};
use crate::strings::stock::Stock;

pub use conflict::Conflict;
pub use variants::Resolved;

/// Choices for a plan over several tunings.
#[derive(Debug, Clone, Default)]
pub struct SeveralOptions {
    /// Tunings given on the command line: two or more are the list; one is the base tuning of
    /// the instrument's `variants`.
    pub tunings: Vec<String>,
    /// A tension for every course instead of the file's.
    pub tension: Option<TensionSpec>,
    /// How the shared string is balanced among the tunings.
    pub balance: Balance,
}

/// One tuning's view of the shared set: a whole plan, named.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct TuningBlock {
    /// The variant's name (the tuning's, when the list came from `--tuning`).
    pub variant: String,
    /// Courses whose pitch this variant changes.
    pub retuned_courses: Vec<u32>,
    /// The plan in this tuning: the same fields as `taut plan`'s JSON.
    #[serde(flatten)]
    pub plan: Plan,
}

/// A set planned for several tunings.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SeveralPlan {
    /// The instrument's name.
    pub instrument: String,
    /// The balance rule used (`target` or `stress`).
    pub balance: Balance,
    /// Whether every string serves every tuning (no conflicts).
    pub all_tunings_served: bool,
    /// One block per tuning, in the order given.
    pub tunings: Vec<TuningBlock>,
    /// Per course, how the shared strings fare across the tunings.
    pub courses: Vec<SharedCourse>,
    /// Strings on which the tunings cannot share a string.
    pub conflicts: Vec<Conflict>,
    /// Safety cautions, present when any caution, danger or conflict arose.
    pub cautions: Vec<String>,
}

/// One course across the tunings.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SharedCourse {
    /// The course number.
    pub course: u32,
    /// Its strings.
    pub strings: Vec<SharedString>,
}

/// One shared string across the tunings.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SharedString {
    /// The string within the course, from 1.
    pub string: usize,
    /// The chosen kind.
    pub kind: String,
    /// The chosen gauge, as the trade writes it.
    pub gauge: String,
    /// How well it serves the tunings: `on_target`, `serves` or `conflict`.
    pub agreement: Agreement,
    /// The largest relative distance of its tension from the target over the tunings.
    pub worst_deviation: f64,
    /// The tuning where it is slackest: it sets the lower limit.
    pub slackest_variant: String,
    /// Its tension there, N.
    pub lowest_tension_n: f64,
    /// The tuning where it is most stressed: it sets the upper limit.
    pub most_stressed_variant: String,
    /// Its stress ratio there.
    pub highest_stress_ratio: f64,
}

impl SeveralPlan {
    /// Whether the full safety cautions belong with this plan.
    pub fn needs_safety_cautions(&self) -> bool {
        !self.cautions.is_empty()
    }
}

/// Plans `instrument` for every tuning the options and the file list, with the string kinds of
/// `stock`.
pub fn plan(
    instrument: &Instrument,
    stock: &Stock,
    options: &SeveralOptions,
) -> Result<SeveralPlan> {
    let list = variants::resolve(instrument, &options.tunings, "--tuning")?;
    solve(
        instrument,
        &list,
        stock,
        options.tension.as_ref(),
        options.balance,
    )
}

/// Solves every course of `instrument` once for all of `list` (at least one).
pub fn solve(
    instrument: &Instrument,
    list: &[Resolved],
    stock: &Stock,
    tension: Option<&TensionSpec>,
    balance: Balance,
) -> Result<SeveralPlan> {
    let limits = stress_limits(instrument)?;
    let tolerance = instrument
        .tolerance
        .map_or(selector::DEFAULT_TOLERANCE, |percent| percent.fraction());
    let lists = KindLists::resolve(instrument, stock.kinds())?;
    let mut best_gauges = vec![None; lists.longest];
    let mut best_choices = vec![None; lists.longest];
    let mut requests: Vec<Request> = Vec::with_capacity(list.len());
    let mut courses_per_variant: Vec<Vec<CoursePlan>> = vec![Vec::new(); list.len()];
    let mut shared_courses = Vec::with_capacity(instrument.courses.len());
    let mut conflicts = Vec::new();
    let mut string_slot = 0;
    let words = PlanWords::default();
    for index in 0..instrument.courses.len() {
        let mut contexts = Vec::with_capacity(list.len());
        let mut pitches = Vec::with_capacity(list.len());
        for variant in list {
            let course = variant
                .instrument
                .course_input(index, tension)
                .ok_or_else(|| Error::input("a course has no vibrating length"))?;
            let context = CourseContext {
                instrument: &variant.instrument,
                tuning: &variant.tuning,
                course,
                limits,
                tolerance,
                stock,
                words: &words,
            };
            pitches.push(variant.instrument.course_pitch(&course, &variant.tuning)?);
            contexts.push(context);
        }
        let Some(first) = contexts.first() else {
            return Err(Error::input("no tuning to plan in"));
        };
        let number = first.course.number;
        let count = first.course.strings.len();
        let ranges = &lists.per_string[string_slot..string_slot + count];
        string_slot += count;
        let mut strings: Vec<Vec<StringPlan>> = vec![Vec::with_capacity(count); list.len()];
        let mut warnings = vec![Vec::new(); list.len()];
        let mut shared_strings = Vec::with_capacity(count);
        for (string_index, range) in ranges.iter().enumerate() {
            if first.course.fixed(string_index).is_some() {
                return Err(first.instrument.point(
                    Error::input(format!(
                        "course {number}: a fixed string (`string:`) cannot be planned for several tunings yet"
                    ))
                    .help("plan each tuning on its own, or let taut choose this string"),
                    &[
                        PathStep::Key("courses"),
                        PathStep::Index(first.course.index),
                    ],
                ));
            }
            let kinds = &lists.arena[range.clone()];
            requests.clear();
            for (context, pitch) in contexts.iter().zip(&pitches) {
                requests.push(context.request(pitch, string_index)?);
            }
            let gauges = &mut best_gauges[..kinds.len()];
            let shared = several::choose(&requests, kinds, balance, gauges)
                .ok_or_else(|| first.no_gauge_error())?;
            for (variant, context) in contexts.iter().enumerate() {
                let others = &mut best_choices[..kinds.len()];
                let selection =
                    several::selection_in(&requests[variant], kinds, &shared, gauges, others);
                strings[variant].push(context.string_plan(
                    string_index,
                    kinds,
                    &requests[variant],
                    &selection,
                    others,
                    &mut warnings[variant],
                )?);
            }
            let in_each: Vec<&StringPlan> = strings.iter().filter_map(|s| s.last()).collect();
            let summary = summarize(string_index, &shared, &in_each, list);
            if shared.agreement == Agreement::Conflict {
                conflicts.push(conflict::analyse(
                    number, &summary, &requests, kinds, &in_each, list,
                ));
            }
            shared_strings.push(summary);
        }
        for (variant, ((context, pitch), (strings, warnings))) in contexts
            .iter()
            .zip(pitches)
            .zip(strings.into_iter().zip(warnings))
            .enumerate()
        {
            courses_per_variant[variant].push(context.course_plan(pitch, strings, warnings));
        }
        shared_courses.push(SharedCourse {
            course: number,
            strings: shared_strings,
        });
    }
    let tunings: Vec<TuningBlock> = list
        .iter()
        .zip(courses_per_variant)
        .map(|(variant, courses)| TuningBlock {
            variant: variant.name.clone(),
            retuned_courses: variant.retuned_courses.clone(),
            plan: Plan {
                // The variant's tuning as written, so the block reads back in that tuning.
                tuning_spec: Some(variant.spec.clone()),
                ..finish_plan(&variant.instrument, &variant.tuning, courses, limits)
            },
        })
        .collect();
    let risky = !conflicts.is_empty()
        || tunings
            .iter()
            .flat_map(|block| &block.plan.warnings)
            .any(|warning| warning.severity >= Severity::Caution);
    Ok(SeveralPlan {
        instrument: instrument.name.clone(),
        balance,
        all_tunings_served: conflicts.is_empty(),
        tunings,
        courses: shared_courses,
        conflicts,
        cautions: if risky {
            SAFETY_CAUTIONS.iter().map(|s| s.to_string()).collect()
        } else {
            Vec::new()
        },
    })
}

/// Which tunings set a string's limits, from its (tension, stress ratio) in each: the index of
/// the lowest tension (the slackest, the lower limit) and of the highest known stress ratio (the
/// most stressed, the upper limit). Ties and unknown figures go to the earlier tuning.
pub fn limiting(figures: impl Iterator<Item = (f64, Option<f64>)>) -> (usize, usize) {
    let (mut slackest, mut stressed) = (0, 0);
    let (mut lowest, mut highest) = (f64::INFINITY, f64::NEG_INFINITY);
    for (index, (tension, stress)) in figures.enumerate() {
        if tension < lowest {
            (slackest, lowest) = (index, tension);
        }
        if let Some(stress) = stress.filter(|&s| s > highest) {
            (stressed, highest) = (index, stress);
        }
    }
    (slackest, stressed)
}

/// One shared string's figures across the tunings: its worst deviation and the tunings that set
/// its lower (slackest) and upper (most stressed) limits.
fn summarize(
    string_index: usize,
    shared: &several::Shared,
    in_each: &[&StringPlan],
    list: &[Resolved],
) -> SharedString {
    let (slackest, stressed) = limiting(
        in_each
            .iter()
            .map(|s| (s.choice.tension_n, Some(s.choice.stress_ratio))),
    );
    let name = |i: usize| list.get(i).map_or_else(String::new, |v| v.name.clone());
    let first = in_each.first();
    SharedString {
        string: string_index + 1,
        kind: first.map_or_else(String::new, |s| s.choice.kind.to_string()),
        gauge: first.map_or_else(String::new, |s| s.choice.gauge.to_string()),
        agreement: shared.agreement,
        worst_deviation: in_each
            .iter()
            .map(|s| (s.choice.tension_n / s.target_tension_n - 1.0).abs())
            .fold(0.0, f64::max),
        slackest_variant: name(slackest),
        lowest_tension_n: in_each.get(slackest).map_or(0.0, |s| s.choice.tension_n),
        most_stressed_variant: name(stressed),
        highest_stress_ratio: in_each.get(stressed).map_or(0.0, |s| s.choice.stress_ratio),
    }
}
