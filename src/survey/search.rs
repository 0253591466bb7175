//! What both ways of searching share (a candidate's measures, the reasons it fails, the
//! bounded ranking), and the exhaustive way: every candidate checked, in parallel, without
//! allocating per candidate. The default way, which visits only the offsets where some
//! string's choice changes, is [`super::sweep`]; this one stays as its reference.
//!
//! Candidates are cut into chunks of neighbouring offsets of one (tuning, pattern) pair. Inside a
//! chunk the frequency of every string moves a little from one offset to the next, so each
//! string's segment is found by walking from the previous candidate's
//! ([`super::table::StringTable::walk`]); a chunk starts with a binary search. rayon spreads the
//! chunks over the threads; each thread keeps its own best N and counts, merged at the end in a
//! total order (score, tie-breaks, then candidate number), so the answer does not depend on how
//! the chunks were shared out.

use std::cmp::Ordering;
use std::collections::BinaryHeap;
use std::time::Instant;

use rayon::prelude::*;
use serde::Serialize;

use crate::strings::select::Warnings;

use super::table::OUTSIDE_PITCH_RANGE;
use super::{Method, RankRule, Ranked, Report, StringSlot, Survey, Verdict};

/// Offsets per chunk: enough to amortise the chunk's binary searches, small enough to keep
/// both cores busy to the end.
const CHUNK: u64 = 2048;

/// Flags that make a string unstringable.
#[inline]
pub(super) fn reject_mask() -> u16 {
    Warnings::STRESS_DANGER
        .union(Warnings::THINNER_THAN_CATALOG)
        .union(Warnings::THICKER_THAN_CATALOG)
        .union(Warnings::WIDER_THAN_SLOT)
        .union(Warnings::BELOW_WINDOW)
        .union(Warnings::ABOVE_WINDOW)
        .union(Warnings::STRENGTH_UNKNOWN)
        .bits()
        | OUTSIDE_PITCH_RANGE
}

/// One candidate's measures.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Metrics {
    /// Sum of tensions, N.
    pub total_load_n: f64,
    /// Highest minus lowest tension, N.
    pub tension_spread_n: f64,
    /// Highest stress ratio.
    pub worst_stress_ratio: f64,
    /// Largest |tension/target − 1|.
    pub worst_target_error: f64,
    /// Every string's selector flags, combined.
    pub flags: u16,
    /// Whether the total load exceeds the instrument's rated load.
    pub over_rated_load: bool,
}

impl Metrics {
    /// Stringable: no string flagged with a reason to refuse, and within the rated load.
    pub fn stringable(&self) -> bool {
        self.flags & reject_mask() == 0 && !self.over_rated_load
    }

    /// Whether some string is above the caution limit.
    pub fn caution(&self) -> bool {
        self.flags & Warnings::STRESS_CAUTION.bits() != 0
    }

    pub(super) fn key(&self, rule: RankRule) -> [f64; 3] {
        let (spread, stress, load, target) = (
            self.tension_spread_n,
            self.worst_stress_ratio,
            self.total_load_n,
            self.worst_target_error,
        );
        match rule {
            RankRule::Spread => [spread, stress, load],
            RankRule::Stress => [stress, spread, load],
            RankRule::Load => [load, spread, stress],
            RankRule::Target => [target, spread, stress],
        }
    }
}

/// How many candidates failed for each reason (a candidate may count under several).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize)]
pub struct Rejections {
    /// Some string above the danger limit.
    pub stress_danger: u64,
    /// Some string lighter or heavier than its kind's catalog reaches.
    pub outside_catalog: u64,
    /// Some string's tension outside the window.
    pub outside_window: u64,
    /// Some string wider than its slot.
    pub wider_than_slot: u64,
    /// Some string of a kind whose strength is unknown.
    pub strength_unknown: u64,
    /// Total load above the instrument's rated load.
    pub over_rated_load: u64,
    /// Some string's pitch outside the plausible range of 1 Hz to 30 kHz.
    pub outside_pitch_range: u64,
}

impl Rejections {
    fn count(&mut self, metrics: &Metrics) {
        self.count_flags(metrics.flags);
        self.over_rated_load += u64::from(metrics.over_rated_load);
    }

    /// Counts the reasons in a refused candidate's combined string flags.
    fn count_flags(&mut self, flags: u16) {
        self.count_flags_times(flags, 1);
    }

    /// Counts the reasons of `times` refused candidates that share their combined flags.
    pub(super) fn count_flags_times(&mut self, flags: u16, times: u64) {
        let has = |reason: u16| if flags & reason != 0 { times } else { 0 };
        self.stress_danger += has(Warnings::STRESS_DANGER.bits());
        self.outside_catalog += has(Warnings::THINNER_THAN_CATALOG
            .union(Warnings::THICKER_THAN_CATALOG)
            .bits());
        self.outside_window += has(Warnings::BELOW_WINDOW.union(Warnings::ABOVE_WINDOW).bits());
        self.wider_than_slot += has(Warnings::WIDER_THAN_SLOT.bits());
        self.strength_unknown += has(Warnings::STRENGTH_UNKNOWN.bits());
        self.outside_pitch_range += has(OUTSIDE_PITCH_RANGE);
    }

    pub(super) fn add(&mut self, other: &Rejections) {
        self.stress_danger += other.stress_danger;
        self.outside_catalog += other.outside_catalog;
        self.outside_window += other.outside_window;
        self.wider_than_slot += other.wider_than_slot;
        self.strength_unknown += other.strength_unknown;
        self.over_rated_load += other.over_rated_load;
        self.outside_pitch_range += other.outside_pitch_range;
    }
}

/// Checks one candidate: `factors[j]·ratio` is 2Lf of string j; `segments` holds each
/// string's segment from the previous candidate and receives this one's.
#[inline]
pub(super) fn evaluate(
    strings: &[StringSlot<'_>],
    factors: &[f64],
    ratio: f64,
    segments: &mut [usize],
    rated_load_n: Option<f64>,
) -> Metrics {
    let flags = place(strings, factors, ratio, segments);
    measure(strings, factors, ratio, segments, flags, rated_load_n)
}

/// Moves every string of a candidate to its segment and combines their flags: all that a
/// candidate refused for its strings needs (most of a survey's candidates are).
#[inline]
pub(super) fn place(
    strings: &[StringSlot<'_>],
    factors: &[f64],
    ratio: f64,
    segments: &mut [usize],
) -> u16 {
    let mut flags = 0u16;
    for ((slot, factor), segment) in strings.iter().zip(factors).zip(segments.iter_mut()) {
        let two_l_f = factor * ratio;
        *segment = slot.table.walk(*segment, two_l_f * two_l_f);
        flags |= slot.table.flags[*segment];
    }
    flags
}

/// The measures of a candidate whose strings [`place`] has put on their segments, with the
/// flags it combined.
#[inline]
pub(super) fn measure(
    strings: &[StringSlot<'_>],
    factors: &[f64],
    ratio: f64,
    segments: &[usize],
    flags: u16,
    rated_load_n: Option<f64>,
) -> Metrics {
    let mut total = 0.0;
    let mut lowest = f64::INFINITY;
    let mut highest = f64::NEG_INFINITY;
    let mut stress = 0.0_f64;
    let mut target = 0.0_f64;
    for ((slot, factor), &segment) in strings.iter().zip(factors).zip(segments) {
        let two_l_f = factor * ratio;
        let s = two_l_f * two_l_f;
        let outcome = &slot.table.outcomes[segment];
        let tension = outcome.unit_mass * s;
        total += tension;
        // Plain comparisons compile to single min/max instructions, where f64::min and max
        // spend several on NaN; a NaN stress (strength unknown) is refused by its flag anyway.
        lowest = if tension < lowest { tension } else { lowest };
        highest = if tension > highest { tension } else { highest };
        let string_stress = outcome.unit_mass_over_break * s;
        stress = if string_stress > stress {
            string_stress
        } else {
            stress
        };
        let error = (outcome.unit_mass_over_target * s - 1.0).abs();
        target = if error > target { error } else { target };
    }
    Metrics {
        total_load_n: total,
        tension_spread_n: highest - lowest,
        worst_stress_ratio: stress,
        worst_target_error: target,
        flags,
        over_rated_load: rated_load_n.is_some_and(|rated| total > rated),
    }
}

/// A ranked entry: sort key, candidate number, its tuning-and-pattern pair, measures.
#[derive(Debug, Clone, Copy)]
pub(super) struct Entry {
    pub key: [f64; 3],
    pub index: u64,
    pub pair: usize,
    pub metrics: Metrics,
}

/// The ranking's total order: the rule's three measures (`total_cmp`), then the candidate
/// number, so no two entries tie.
pub(super) fn order(a: &Entry, b: &Entry) -> Ordering {
    a.key[0]
        .total_cmp(&b.key[0])
        .then(a.key[1].total_cmp(&b.key[1]))
        .then(a.key[2].total_cmp(&b.key[2]))
        .then(a.index.cmp(&b.index))
}

impl PartialEq for Entry {
    fn eq(&self, other: &Entry) -> bool {
        order(self, other).is_eq()
    }
}
impl Eq for Entry {}
impl PartialOrd for Entry {
    fn partial_cmp(&self, other: &Entry) -> Option<Ordering> {
        Some(self.cmp(other))
    }
}
impl Ord for Entry {
    fn cmp(&self, other: &Entry) -> Ordering {
        order(self, other)
    }
}

/// The best `top` entries so far, in a bounded max-heap (the worst on top, so a better entry
/// replaces it in O(log top)); sorted once at the end.
///
/// With `one_per_pair`, callers offer each tuning-and-pattern pair at most once per podium (its
/// best over the candidates that podium saw); merging keeps each pair's best. That stays exact
/// when a pair's candidates were split between podiums: a pair's best that belongs in the final
/// list had fewer than `top` other pairs ahead of it anywhere, so no podium dropped it, and a
/// partial best of a pair whose true best is not listed has `top` better pairs ahead of it.
pub(super) struct Podium {
    heap: BinaryHeap<Entry>,
    top: usize,
    one_per_pair: bool,
}

impl Podium {
    pub(super) fn new(top: usize, one_per_pair: bool) -> Podium {
        Podium {
            // A small first allocation: `top` may be far larger than the results found.
            heap: BinaryHeap::with_capacity(top.min(1024) + 1),
            top,
            one_per_pair,
        }
    }

    /// The entry a newcomer must beat, once the podium is full.
    pub(super) fn worst(&self) -> Option<&Entry> {
        if self.heap.len() >= self.top {
            self.heap.peek()
        } else {
            None
        }
    }

    /// Keeps `entry` if it is among the best `top`.
    #[inline]
    pub(super) fn offer(&mut self, entry: Entry) {
        if self.heap.len() < self.top {
            self.heap.push(entry);
        } else if let Some(mut worst) = self.heap.peek_mut() {
            if order(&entry, &worst).is_lt() {
                *worst = entry;
            }
        }
    }

    pub(super) fn merge(mut self, other: Podium) -> Podium {
        if self.one_per_pair {
            let mut all: Vec<Entry> = self.heap.into_vec();
            all.extend(other.heap);
            all.sort_unstable();
            let mut seen = std::collections::HashSet::new();
            self.heap = all
                .into_iter()
                .filter(|entry| seen.insert(entry.pair))
                .take(self.top)
                .collect();
        } else {
            for entry in other.heap {
                self.offer(entry);
            }
        }
        self
    }

    /// The entries, best first.
    pub(super) fn into_sorted(self) -> Vec<Entry> {
        self.heap.into_sorted_vec()
    }
}

/// Counts of one part of a search.
#[derive(Debug, Clone, Copy, Default)]
pub(super) struct Tally {
    pub stringable: u64,
    pub rejected: Rejections,
}

impl Tally {
    pub(super) fn add(&mut self, other: &Tally) {
        self.stringable += other.stringable;
        self.rejected.add(&other.rejected);
    }
}

impl Survey<'_> {
    /// Checks every candidate (by the default method, [`Method::Crossings`]), ranks the
    /// stringable ones and solves the best with the plain plan solver; `progress` is told how
    /// much work each finished part held (see [`Survey::work`]). Runs on the current rayon
    /// pool.
    pub fn run(&self, progress: &(dyn Fn(u64) + Sync)) -> crate::error::Result<Report> {
        self.run_with(Method::Crossings, progress)
    }

    /// [`Survey::run`] by the chosen method.
    pub fn run_with(
        &self,
        method: Method,
        progress: &(dyn Fn(u64) + Sync),
    ) -> crate::error::Result<Report> {
        let mut report = self.search_with(method, progress);
        if let Some(best) = report.best_candidate {
            report.best_plan = Some(self.candidate_plan(best)?);
        }
        Ok(report)
    }

    /// [`Survey::run`] without the best candidate's plan: the search and the ranking only.
    pub fn search(&self, progress: &(dyn Fn(u64) + Sync)) -> Report {
        self.search_with(Method::Crossings, progress)
    }

    /// [`Survey::search`] by the chosen method. Both give the same report but for
    /// `elapsed_s`.
    pub fn search_with(&self, method: Method, progress: &(dyn Fn(u64) + Sync)) -> Report {
        let started = Instant::now();
        let method = if self.offsets_ascend {
            method
        } else {
            // The crossings need each string's pitch to rise with the offset; a ratio table
            // that does not (never seen, but floats are not promised monotone) is searched
            // candidate by candidate.
            Method::Exhaustive
        };
        let (podium, tally) = match method {
            Method::Crossings => self.sweep(progress),
            Method::Exhaustive => self.exhaustive(progress),
        };
        let best = podium.into_sorted();
        let elapsed_s = self.prepared_s + started.elapsed().as_secs_f64();
        self.report(best, tally, elapsed_s)
    }

    fn exhaustive(&self, progress: &(dyn Fn(u64) + Sync)) -> (Podium, Tally) {
        let rule = self.settings.rank_by;
        let top = self.settings.top;
        let every_offset = self.settings.every_offset;
        let offsets = self.size.offsets;
        let chunks: Vec<(usize, u64)> = (0..self.pairs.len())
            .flat_map(|pair| (0..offsets.div_ceil(CHUNK)).map(move |c| (pair, c * CHUNK)))
            .collect();
        // Each accumulator sees its chunks in order, so the chunks of one pair arrive together:
        // `current` holds the best of the pair being read, offered when the next pair starts.
        struct Acc {
            podium: Podium,
            tally: Tally,
            current: Option<Entry>,
            segments: Vec<usize>,
        }
        let flush = |acc: &mut Acc| {
            if let Some(entry) = acc.current.take() {
                acc.podium.offer(entry);
            }
        };
        let found = chunks
            .par_iter()
            .fold(
                || Acc {
                    podium: Podium::new(top, !every_offset),
                    tally: Tally::default(),
                    current: None,
                    segments: Vec::with_capacity(self.strings.len()),
                },
                |mut acc, &(pair_index, first)| {
                    let pair = &self.pairs[pair_index];
                    if acc.current.is_some_and(|held| held.pair != pair_index) {
                        flush(&mut acc);
                    }
                    let last = (first + CHUNK).min(offsets);
                    let ratio = self.offset_ratios[first as usize];
                    acc.segments.clear();
                    acc.segments
                        .extend(
                            self.strings
                                .iter()
                                .zip(&pair.factors)
                                .map(|(slot, factor)| {
                                    let two_l_f = factor * ratio;
                                    slot.table.find(two_l_f * two_l_f)
                                }),
                        );
                    let base = pair_index as u64 * offsets;
                    for offset in first..last {
                        let ratio = self.offset_ratios[offset as usize];
                        let flags = place(&self.strings, &pair.factors, ratio, &mut acc.segments);
                        // Refused for its strings: only the reasons are counted, unless a rated
                        // load asks for the total too.
                        if flags & reject_mask() != 0 && self.rated_load_n.is_none() {
                            acc.tally.rejected.count_flags(flags);
                            continue;
                        }
                        let metrics = measure(
                            &self.strings,
                            &pair.factors,
                            ratio,
                            &acc.segments,
                            flags,
                            self.rated_load_n,
                        );
                        if metrics.stringable() {
                            acc.tally.stringable += 1;
                            let entry = Entry {
                                key: metrics.key(rule),
                                index: base + offset,
                                pair: pair_index,
                                metrics,
                            };
                            if every_offset {
                                acc.podium.offer(entry);
                            } else if acc.current.is_none_or(|held| order(&entry, &held).is_lt()) {
                                acc.current = Some(entry);
                            }
                        } else {
                            acc.tally.rejected.count(&metrics);
                        }
                    }
                    progress(last - first);
                    acc
                },
            )
            .map(|mut acc| {
                flush(&mut acc);
                (acc.podium, acc.tally)
            })
            .reduce(
                || (Podium::new(top, !every_offset), Tally::default()),
                |(podium, mut tally), (other, other_tally)| {
                    tally.add(&other_tally);
                    (podium.merge(other), tally)
                },
            );
        found
    }

    fn report(&self, best: Vec<Entry>, tally: Tally, elapsed_s: f64) -> Report {
        let rule = self.settings.rank_by;
        let every_offset = self.settings.every_offset;
        let diagnosis = if tally.stringable == 0 {
            self.diagnose()
        } else {
            Vec::new()
        };
        let results = best
            .iter()
            .enumerate()
            .map(|(rank, entry)| self.ranked(rank + 1, entry))
            .collect();
        Report {
            best_candidate: best.first().map(|best| best.index),
            instrument: self.instrument.name.clone(),
            rank_by: rule,
            ranking_rule: if every_offset {
                format!("{}; every stringable offset listed", rule.statement())
            } else {
                format!(
                    "{}; each tuning and course pattern once, at its best offset",
                    rule.statement()
                )
            },
            every_offset,
            candidates: self.size.candidates,
            course_checks: self.size.course_checks,
            stringable: tally.stringable,
            rejected: tally.rejected,
            elapsed_s,
            course_direction: self.order.direction,
            notes: self.order.notes.clone(),
            diagnosis,
            results,
            best_plan: None,
        }
    }

    fn ranked(&self, rank: usize, entry: &Entry) -> Ranked {
        let (pair, offset) = self.decode(entry.index);
        let pair = &self.pairs[pair];
        let metrics = entry.metrics;
        Ranked {
            rank,
            candidate: entry.index,
            tuning: pair.tuning_name.clone(),
            offset_cents: self.settings.offsets.cents(offset as u64),
            course_1_hz: self.course_1_hz(entry.index),
            course_pattern: self.pattern_of(pair),
            score: entry.key[0],
            verdict: if metrics.caution() {
                Verdict::StringableWithCaution
            } else {
                Verdict::Stringable
            },
            tension_spread_n: metrics.tension_spread_n,
            worst_stress_ratio: metrics.worst_stress_ratio,
            total_load_n: metrics.total_load_n,
            worst_target_error: metrics.worst_target_error,
        }
    }
}
