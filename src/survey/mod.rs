//! Stage 7, survey: which settings of one instrument can be strung, searched over a space of
//! tunings, pitch offsets and course patterns, and ranked.
//!
//! A *candidate* is one tuning, one offset of course 1's pitch (in cents) and one course pattern
//! (which degree each course takes). Each is solved course by course against the catalog with
//! the selector's rule ([`crate::strings::select`]) and is *stringable* when no chosen string is
//! in the danger zone, every string lies within its kind's catalog, inside the tension window
//! and the slot, its strength is known, and the total load stays within the instrument's rated
//! load. Stringable candidates are ranked by a stated, selectable rule ([`RankRule`]).
//!
//! | module | holds |
//! |---|---|
//! | [`settings`] | the settings file: tunings, offsets, course pattern, ranking |
//! | [`range`] | offsets in exact decimal steps |
//! | [`table`] | per string, the selector's choice as a function of s = (2Lf)² |
//! | `sweep` | the default search: only the offsets where some string's choice changes |
//! | `search` | the exhaustive search (every candidate, the reference) and the bounded ranking |
//!
//! Set-up (loading tunings, building the tables) happens once; the sweep then costs a few
//! evaluations per crossing of a table bound, whatever the offset step. [`Survey::candidate_plan`] solves any candidate with the plain
//! plan solver ([`crate::plan::solve::solve`]), which is how the best candidate's full plan is
//! made and how tests check the fast path.

pub mod range;
mod search;
pub mod settings;
mod sweep;
pub mod table;

use serde::Serialize;

use crate::error::{Error, Result};
use crate::input::yaml::PathStep;
use crate::instrument::Instrument;
use crate::plan::solve;
use crate::plan::Plan;
use crate::strings::kind::StringKind;
use crate::strings::select::{self, Checks};
use crate::strings::stock::Stock;
use crate::tuning::pitch::ratio_from_cents;
use crate::tuning::{self, Layout, Reference, Tuning};

pub use diagnose::{CourseDiagnosis, Limit};
pub use search::{Metrics, Rejections};
pub use settings::{Direction, PatternRule, RankRule, Settings, TuningChoice};
use table::{StringSpec, StringTable};

mod diagnose;
mod order;
mod prepare;
mod size;
#[allow(unused_imports)]
use size::*;
pub use size::*;

/// How a survey searches its space. Both give the same report (but for `elapsed_s`).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Method {
    /// Visit only the offsets where some string's pitch crosses a bound of its table (a
    /// catalog step, a window edge, a stress limit, a change of kind), and count the runs
    /// between them: the time grows with the crossings, not with the offsets.
    #[default]
    Crossings,
    /// Check every candidate, string by string: the reference the crossings are tested
    /// against.
    Exhaustive,
}

/// One string of the instrument as the sweep sees it.
#[derive(Debug, Clone)]
struct StringSlot<'a> {
    /// Index of its course.
    course: usize,
    /// 2L, m.
    two_length: f64,
    /// Interval ratio from the course pitch.
    interval_ratio: f64,
    /// The selector's choice as a function of s.
    table: StringTable,
    /// The allowed kinds, in order of preference.
    kinds: Vec<&'a StringKind>,
}

/// One (tuning, course pattern) pair.
#[derive(Debug, Clone)]
struct Pair {
    tuning: usize,
    tuning_name: String,
    /// Pattern number (mode number for `modes_of`, else 0).
    pattern: usize,
    /// The degree course 1 sits on.
    start: i64,
    /// Each course's degree relative to `start`.
    degrees: Vec<i64>,
    /// Per string: 2L · f(course 1 at offset 0) · the string's ratio to course 1.
    factors: Vec<f64>,
}

/// A survey ready to run: tables built, tunings resolved into per-string factors.
#[derive(Debug)]
pub struct Survey<'a> {
    instrument: &'a Instrument,
    settings: &'a Settings,
    stock: &'a Stock,
    size: Size,
    strings: Vec<StringSlot<'a>>,
    pairs: Vec<Pair>,
    offset_ratios: Vec<f64>,
    rated_load_n: Option<f64>,
    /// Which way the courses run from course 1, and why.
    order: order::CourseOrder,
    /// Per string (in the order of `strings`), its window, slot and stress limits.
    checks: Vec<Checks>,
    /// Whether `offset_ratios` never fall (what the crossings sweep relies on).
    offsets_ascend: bool,
    /// Table bounds crossed over the whole space, every pair and string.
    crossings: u64,
    /// Seconds spent preparing: loading tunings, building the tables.
    prepared_s: f64,
}

/// The course pattern of a result.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CoursePattern {
    /// The rule, e.g. `nearest 4/3`, `steps` or `mode 3 of 7`.
    pub rule: String,
    /// The degree course 1 takes in the tuning.
    pub start_degree: i64,
    /// Each course's degree relative to course 1's (negative below it).
    pub degrees: Vec<i64>,
    /// Degree steps between neighbouring courses, from course 1 on (negative where a course
    /// lies below the one before).
    pub steps: Vec<i64>,
}

/// Whether a listed candidate needs care.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Verdict {
    /// Every string below the caution limit too.
    Stringable,
    /// Stringable, but some string is above the caution limit.
    StringableWithCaution,
}

/// One ranked candidate.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Ranked {
    /// 1 for the best.
    pub rank: usize,
    /// The candidate's number in the order they are generated (tuning, then pattern, then
    /// offset), from 0.
    pub candidate: u64,
    /// The tuning's name.
    pub tuning: String,
    /// Offset of course 1 from the settings' `course_1`, cents.
    pub offset_cents: f64,
    /// Course 1's pitch, Hz.
    pub course_1_hz: f64,
    /// Which degree each course takes.
    pub course_pattern: CoursePattern,
    /// The ranking rule's first measure for this candidate (smaller is better).
    pub score: f64,
    /// Stringable, with or without caution.
    pub verdict: Verdict,
    /// Highest minus lowest string tension, N.
    pub tension_spread_n: f64,
    /// Highest stress ratio of any string.
    pub worst_stress_ratio: f64,
    /// Sum of every string's tension, N.
    pub total_load_n: f64,
    /// Largest |tension / target − 1| of any string.
    pub worst_target_error: f64,
}

/// A survey's answer: the plain data the table and JSON renderers read.
#[derive(Debug, Clone, Serialize)]
pub struct Report {
    /// The instrument's name.
    pub instrument: String,
    /// The ranking rule's name.
    pub rank_by: RankRule,
    /// The ranking rule in words, with how the list treats offsets of one setting.
    pub ranking_rule: String,
    /// Whether the results list every stringable offset (`every_offset`), rather than each
    /// tuning and course pattern once, at its best offset.
    pub every_offset: bool,
    /// Candidates tried.
    pub candidates: u64,
    /// Candidates × courses.
    pub course_checks: u64,
    /// Candidates that passed.
    pub stringable: u64,
    /// Why the others failed (a candidate may fail for several reasons).
    pub rejected: Rejections,
    /// Seconds the survey's own work took: loading the tunings and building the tables,
    /// searching the space, ranking and, when nothing passes, the diagnosis (not reading the
    /// instrument and settings, nor solving the best candidate's full plan).
    pub elapsed_s: f64,
    /// Which way the courses run in pitch from course 1 (`up`: course 1 is the lowest).
    pub course_direction: Direction,
    /// How the direction was decided, and anything about the settings worth knowing (e.g.
    /// `course_1` far from the instrument's own course 1), as sentences.
    pub notes: Vec<String>,
    /// When no candidate is stringable: per string, which limit refuses it and how far it is
    /// from passing (empty otherwise).
    pub diagnosis: Vec<CourseDiagnosis>,
    /// The best candidates, best first.
    pub results: Vec<Ranked>,
    /// The full plan of the best candidate, from the plain plan solver.
    pub best_plan: Option<Plan>,
    /// The best candidate's number (for [`Survey::candidate_plan`]).
    #[serde(skip)]
    pub best_candidate: Option<u64>,
}

impl<'a> Survey<'a> {
    /// The size checked before any work.
    pub fn size(&self) -> Size {
        self.size
    }

    /// Table bounds crossed over the whole space (every tuning, pattern and string): the
    /// crossings sweep's work.
    pub fn crossings(&self) -> u64 {
        self.crossings
    }

    /// The work a search by `method` does, in the units its `progress` callback counts:
    /// crossings plus one per string and pair for [`Method::Crossings`], candidates for
    /// [`Method::Exhaustive`].
    pub fn work(&self, method: Method) -> u64 {
        match method {
            Method::Crossings => {
                self.crossings + self.pairs.len() as u64 * self.strings.len() as u64
            }
            Method::Exhaustive => self.size.candidates,
        }
    }

    /// Seconds a search by `method` is expected to take on the current rayon pool, from the
    /// rates measured on the development machine (see DEVELOPERS.md, Benchmarks).
    pub fn estimated_seconds(&self, method: Method) -> f64 {
        let threads = rayon::current_num_threads().max(1) as f64;
        match method {
            Method::Crossings => self.work(method) as f64 / (CROSSINGS_RATE * threads),
            Method::Exhaustive => self.size.course_checks as f64 / (CHECKS_RATE * threads),
        }
    }

    /// How many threads can help a search by `method`: no more than its parts (pairs for the
    /// sweep, chunks of offsets for the exhaustive search).
    pub fn useful_threads(&self, method: Method) -> usize {
        let parts = match method {
            Method::Crossings => self.pairs.len() as u64,
            Method::Exhaustive => self.pairs.len() as u64 * self.size.offsets.div_ceil(2048),
        };
        usize::try_from(parts.max(1)).unwrap_or(usize::MAX)
    }

    /// Course checks per candidate (the instrument's courses).
    pub fn courses(&self) -> usize {
        self.instrument.courses.len()
    }

    fn decode(&self, index: u64) -> (usize, usize) {
        let offsets = self.size.offsets;
        ((index / offsets) as usize, (index % offsets) as usize)
    }

    /// Course 1's frequency for candidate `index`.
    pub fn course_1_hz(&self, index: u64) -> f64 {
        let (_, offset) = self.decode(index);
        self.settings.course_1_hz * self.offset_ratios[offset]
    }

    /// Candidate `index` solved by the plain plan solver: its tuning moved so that course 1's
    /// degree sounds at course 1's pitch, every course given its degree.
    pub fn candidate_plan(&self, index: u64) -> Result<Plan> {
        let (pair, _) = self.decode(index);
        let pair = &self.pairs[pair];
        let tuning = tuning::load(&self.settings.tuning_spec(pair.tuning))?;
        let concert_a4_hz = tuning.concert_a4_hz();
        let tuning = tuning.with_reference(Reference {
            degree: pair.start,
            hz: self.course_1_hz(index),
            concert_a4_hz,
        })?;
        let mut instrument = self.instrument.clone();
        for (course, degree) in instrument.courses.iter_mut().zip(&pair.degrees) {
            course.pitch = format!("deg{}", pair.start + degree);
        }
        solve::solve(&instrument, &tuning, self.stock, None)
    }

    /// Candidate `index` checked by the fast path alone (binary search, no walk), for tests
    /// and for comparing with [`Survey::candidate_plan`]: its measures and, per string, the
    /// chosen kind's id and gauge diameter (m).
    pub fn check(&self, index: u64) -> (Metrics, Vec<(String, f64)>) {
        let (pair, offset) = self.decode(index);
        let pair = &self.pairs[pair];
        let mut pointers: Vec<usize> = self
            .strings
            .iter()
            .zip(&pair.factors)
            .map(|(slot, factor)| {
                let two_l_f = factor * self.offset_ratios[offset];
                slot.table.find(two_l_f * two_l_f)
            })
            .collect();
        let metrics = search::evaluate(
            &self.strings,
            &pair.factors,
            self.offset_ratios[offset],
            &mut pointers,
            self.rated_load_n,
        );
        let chosen = self
            .strings
            .iter()
            .zip(&pointers)
            .map(|(slot, &segment)| {
                let outcome = slot.table.outcomes[segment];
                match slot.kinds.get(usize::from(outcome.kind)) {
                    Some(kind) => (
                        kind.id.as_str().to_string(),
                        kind.gauges()
                            .get(outcome.gauge as usize)
                            .map_or(f64::NAN, |g| g.diameter),
                    ),
                    None => (String::new(), f64::NAN),
                }
            })
            .collect();
        (metrics, chosen)
    }

    fn pattern_of(&self, pair: &Pair) -> CoursePattern {
        let rule = match &self.settings.pattern {
            PatternRule::NearestTo(interval) => match self.order.direction {
                Direction::Up => format!("nearest {interval}"),
                Direction::Down => format!("nearest {interval} below"),
            },
            PatternRule::Steps(_) => "steps".to_string(),
            PatternRule::ModesOf(scale) => format!("mode {} of {}", pair.pattern + 1, scale.len()),
            PatternRule::ScaleModes(scale) => {
                format!("mode {} of {}", pair.pattern + 1, scale.name)
            }
        };
        CoursePattern {
            rule,
            start_degree: pair.start,
            steps: pair.degrees.windows(2).map(|w| w[1] - w[0]).collect(),
            degrees: pair.degrees.clone(),
        }
    }
}
