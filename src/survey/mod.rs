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
//! | `search` | the parallel, allocation-free sweep and the ranking |
//!
//! Set-up (loading tunings, building the tables) happens once; the sweep then costs a few
//! multiplications per string. [`Survey::candidate_plan`] solves any candidate with the plain
//! plan solver ([`crate::plan::solve::solve`]), which is how the best candidate's full plan is
//! made and how tests check the fast path.

pub mod range;
mod search;
pub mod settings;
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

pub use search::{Metrics, Rejections};
pub use settings::{PatternRule, RankRule, Settings, TuningChoice};
use table::{StringSpec, StringTable};

/// Most course checks (candidates × courses) one survey may ask for: about 20 s at the
/// 2e8 checks per second the sweep is built for.
pub const MAX_COURSE_CHECKS: u64 = 4_000_000_000;
/// Most (tuning, course pattern) pairs × strings, the per-pair factors kept in memory.
pub const MAX_PAIR_STRINGS: u64 = 5_000_000;
/// Speed assumed in size estimates, course checks per second.
pub const ESTIMATE_RATE: f64 = 2e8;

/// How big a survey is, known before any work.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub struct Size {
    /// Tunings tried.
    pub tunings: u64,
    /// Course patterns per tuning.
    pub patterns: u64,
    /// Offsets per tuning and pattern.
    pub offsets: u64,
    /// Courses of the instrument.
    pub courses: u64,
    /// Candidates: tunings × patterns × offsets.
    pub candidates: u64,
    /// Candidates × courses.
    pub course_checks: u64,
}

impl Size {
    /// The size of the space `settings` describe on `instrument`; refuses an empty or
    /// oversized space with an estimate, pointing at the settings.
    pub fn of(instrument: &Instrument, settings: &Settings) -> Result<Size> {
        let courses = instrument.courses.len() as u64;
        let tunings = settings.tunings.count();
        let patterns = settings.pattern.count();
        let offsets = settings.offsets.len();
        let candidates = u128::from(tunings) * u128::from(patterns) * u128::from(offsets);
        let checks = candidates * u128::from(courses);
        let estimate = format!(
            "{tunings} tuning{} × {patterns} course pattern{} × {offsets} offset{} = {candidates} candidates, {checks} course checks (about {:.1} s at {:.0e} checks/s)",
            plural(tunings),
            plural(patterns),
            plural(offsets),
            checks as f64 / ESTIMATE_RATE,
            ESTIMATE_RATE
        );
        if let PatternRule::Steps(steps) = &settings.pattern {
            if steps.len() as u64 + 1 != courses {
                return Err(settings.point(
                    Error::input(format!(
                        "{} steps are listed, but the instrument's {courses} courses need {}",
                        steps.len(),
                        courses.saturating_sub(1)
                    ))
                    .help("list one step between each pair of neighbouring courses"),
                    &[PathStep::Key("courses"), PathStep::Key("steps")],
                ));
            }
        }
        let too_big = |what: String, path: &[PathStep<'_>]| {
            settings.point(
                Error::input(format!(
                    "the search space is too large: {what}; the survey would try {estimate}"
                ))
                .help(
                    "narrow the range of tunings, use a coarser offset step, or split the survey",
                ),
                path,
            )
        };
        if tunings > settings::MAX_TUNINGS as u64 {
            return Err(too_big(
                format!("{tunings} tunings (at most {})", settings::MAX_TUNINGS),
                &[PathStep::Key("tunings")],
            ));
        }
        if offsets > settings::MAX_OFFSETS {
            return Err(too_big(
                format!("{offsets} offsets (at most {})", settings::MAX_OFFSETS),
                &[PathStep::Key("offset_cents"), PathStep::Key("step")],
            ));
        }
        let strings: u64 = instrument
            .courses
            .iter()
            .map(|course| course.strings.len() as u64)
            .sum();
        if u128::from(tunings * patterns) * u128::from(strings) > u128::from(MAX_PAIR_STRINGS) {
            return Err(too_big(
                format!(
                    "{} tuning and pattern pairs of {strings} strings (at most {MAX_PAIR_STRINGS} in all)",
                    tunings * patterns
                ),
                &[PathStep::Key("courses")],
            ));
        }
        if checks > u128::from(MAX_COURSE_CHECKS) {
            return Err(too_big(
                format!("{checks} course checks (at most {MAX_COURSE_CHECKS})"),
                &[PathStep::Key("offset_cents")],
            ));
        }
        Ok(Size {
            tunings,
            patterns,
            offsets,
            courses,
            candidates: candidates as u64,
            course_checks: checks as u64,
        })
    }
}

fn plural(count: u64) -> &'static str {
    if count == 1 {
        ""
    } else {
        "s"
    }
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
}

/// The course pattern of a result.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CoursePattern {
    /// The rule, e.g. `nearest 4/3`, `steps` or `mode 3 of 7`.
    pub rule: String,
    /// The degree course 1 takes in the tuning.
    pub start_degree: i64,
    /// Each course's degree above course 1's.
    pub degrees: Vec<i64>,
    /// Degree steps between neighbouring courses.
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
    /// The ranking rule in words.
    pub ranking_rule: String,
    /// Candidates tried.
    pub candidates: u64,
    /// Candidates × courses.
    pub course_checks: u64,
    /// Candidates that passed.
    pub stringable: u64,
    /// Why the others failed (a candidate may fail for several reasons).
    pub rejected: Rejections,
    /// Seconds the search took (building the tables and checking every candidate).
    pub elapsed_s: f64,
    /// The best candidates, best first.
    pub results: Vec<Ranked>,
    /// The full plan of the best candidate, from the plain plan solver.
    pub best_plan: Option<Plan>,
    /// The best candidate's number (for [`Survey::candidate_plan`]).
    #[serde(skip)]
    pub best_candidate: Option<u64>,
}

impl<'a> Survey<'a> {
    /// Checks the size of the space first (see [`Size::of`]), then loads the tunings and
    /// builds the per-string tables.
    pub fn prepare(
        instrument: &'a Instrument,
        settings: &'a Settings,
        stock: &'a Stock,
    ) -> Result<Survey<'a>> {
        let kinds = stock.kinds();
        let size = Size::of(instrument, settings)?;
        let limits = solve::stress_limits(instrument)?;
        let tolerance = instrument
            .tolerance
            .map_or(select::DEFAULT_TOLERANCE, |percent| percent.fraction());
        let mut strings = Vec::new();
        for index in 0..instrument.courses.len() {
            let course = instrument
                .course_input(index, None)
                .ok_or_else(|| Error::input("a course has no vibrating length"))?;
            let at = [PathStep::Key("courses"), PathStep::Index(index)];
            let goal = course.tension.ok_or_else(|| {
                instrument.point(
                    Error::input(format!("course {} has no tension target", course.number))
                        .help("give `tension` in `defaults` or in the course"),
                    &at,
                )
            })?;
            for (string_index, string) in course.strings.iter().enumerate() {
                if course.fixed(string_index).is_some() {
                    return Err(instrument.point(
                        Error::input(format!(
                            "course {}: a fixed string (`string:`) cannot be surveyed yet",
                            course.number
                        ))
                        .help("let taut choose this string for the survey"),
                        &at,
                    ));
                }
                let ids = string.kinds.as_deref().or(course.kinds).ok_or_else(|| {
                    instrument.point(
                        Error::input(format!("course {} allows no string kinds", course.number))
                            .help("list `kinds` in `defaults` or in the course"),
                        &at,
                    )
                })?;
                if ids.len() > solve::MAX_KINDS_PER_LIST {
                    return Err(instrument.point(
                        Error::input(format!(
                            "{} kinds are listed; at most {} are allowed",
                            ids.len(),
                            solve::MAX_KINDS_PER_LIST
                        )),
                        &at,
                    ));
                }
                let mut kind_list: Vec<&StringKind> = Vec::with_capacity(ids.len());
                for id in ids {
                    kind_list.push(
                        kinds
                            .get(id.trim())
                            .map_err(|err| instrument.point(err, &at))?,
                    );
                }
                let spec = StringSpec {
                    length: course.length_m,
                    target: goal.target_n,
                    tolerance,
                    checks: Checks {
                        min_tension: goal.min_n,
                        max_tension: goal.max_n,
                        widest: course.max_diameter_m,
                        limits,
                    },
                    kinds: &kind_list,
                };
                let table = StringTable::build(&spec);
                strings.push(StringSlot {
                    course: index,
                    two_length: 2.0 * course.length_m,
                    interval_ratio: string.interval.ratio(),
                    table,
                    kinds: kind_list,
                });
            }
        }
        let offset_ratios: Vec<f64> = (0..size.offsets)
            .map(|k| ratio_from_cents(settings.offsets.cents(k)))
            .collect();
        let mut survey = Survey {
            instrument,
            settings,
            stock,
            size,
            strings,
            pairs: Vec::new(),
            offset_ratios,
            rated_load_n: instrument.rated_load.map(|load| load.si()),
        };
        for tuning_index in 0..size.tunings as usize {
            let spec = settings.tuning_spec(tuning_index);
            let tuning = tuning::load(&spec)
                .map_err(|err| settings.point(err, &[PathStep::Key("tunings")]))?;
            if matches!(tuning.layout(), Layout::Absolute { .. }) {
                return Err(settings.point(
                    Error::input(format!(
                        "`{spec}` is a fixed list of frequencies; a survey moves tunings in pitch, so it needs a tuning with degrees"
                    )),
                    &[PathStep::Key("tunings")],
                ));
            }
            for pattern in 0..size.patterns as usize {
                let pair = survey.pair(&tuning, tuning_index, pattern)?;
                survey.pairs.push(pair);
            }
        }
        Ok(survey)
    }

    fn pair(&self, tuning: &Tuning, tuning_index: usize, pattern: usize) -> Result<Pair> {
        let courses = self.instrument.courses.len();
        let cents = |k: i64| {
            tuning.cents_above_degree_zero(k).ok_or_else(|| {
                self.settings.point(
                    Error::input(format!("degree {k} of `{}` does not exist", tuning.name())),
                    &[PathStep::Key("courses")],
                )
            })
        };
        let mut degrees = Vec::with_capacity(courses);
        let start = match &self.settings.pattern {
            PatternRule::ModesOf(scale) => scale[..pattern].iter().sum(),
            _ => 0,
        };
        degrees.push(0);
        for course in 1..courses {
            let previous = degrees[course - 1];
            let next = match &self.settings.pattern {
                PatternRule::NearestTo(interval) => {
                    let target = cents(start + previous)? + interval.cents;
                    let nearest = tuning
                        .nearest_to_cents_above_degree_zero(target)
                        .ok_or_else(|| {
                            self.settings.point(
                                Error::input(format!(
                                    "course {} would lie outside the range of `{}`",
                                    course + 1,
                                    tuning.name()
                                )),
                                &[PathStep::Key("courses")],
                            )
                        })?;
                    nearest.degree - start
                }
                PatternRule::Steps(steps) => previous + steps[course - 1],
                PatternRule::ModesOf(scale) => {
                    previous + scale[(pattern + course - 1) % scale.len()]
                }
            };
            degrees.push(next);
        }
        let base = cents(start)?;
        let mut course_ratio = Vec::with_capacity(courses);
        for &degree in &degrees {
            course_ratio.push(ratio_from_cents(cents(start + degree)? - base));
        }
        let factors: Vec<f64> = self
            .strings
            .iter()
            .map(|slot| {
                slot.two_length
                    * (self.settings.course_1_hz * course_ratio[slot.course] * slot.interval_ratio)
            })
            .collect();
        // The sweep's extremes must give finite squares, or tensions would print as infinity.
        let lowest = self.offset_ratios.first().copied().unwrap_or(1.0);
        let highest = self.offset_ratios.last().copied().unwrap_or(1.0);
        for (slot, factor) in self.strings.iter().zip(&factors) {
            for extreme in [factor * lowest, factor * highest] {
                if !(extreme * extreme).is_finite() || extreme <= 0.0 {
                    return Err(self.settings.point(
                        Error::input(format!(
                            "in `{}`, course {} would sound at a pitch out of any range",
                            tuning.name(),
                            slot.course + 1
                        )),
                        &[PathStep::Key("courses")],
                    ));
                }
            }
        }
        Ok(Pair {
            tuning: tuning_index,
            tuning_name: tuning.name().to_string(),
            pattern,
            start,
            degrees,
            factors,
        })
    }

    /// The size checked before any work.
    pub fn size(&self) -> Size {
        self.size
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
            PatternRule::NearestTo(interval) => format!("nearest {interval}"),
            PatternRule::Steps(_) => "steps".to_string(),
            PatternRule::ModesOf(scale) => format!("mode {} of {}", pair.pattern + 1, scale.len()),
        };
        CoursePattern {
            rule,
            start_degree: pair.start,
            steps: pair.degrees.windows(2).map(|w| w[1] - w[0]).collect(),
            degrees: pair.degrees.clone(),
        }
    }
}
