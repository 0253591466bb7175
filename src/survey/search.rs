//! The sweep: every candidate checked, in parallel, without allocating per candidate.
//!
//! Candidates are cut into chunks of neighbouring offsets of one (tuning, pattern) pair. Inside a
//! chunk the frequency of every string moves a little from one offset to the next, so each
//! string's segment is found by walking from the previous candidate's
//! ([`super::table::StringTable::walk`]); a chunk starts with a binary search. rayon spreads the
//! chunks over the threads; each thread keeps its own best N and counts, merged at the end in a
//! total order (score, tie-breaks, then candidate number), so the answer does not depend on how
//! the chunks were shared out.

use std::cmp::Ordering;
use std::time::Instant;

use rayon::prelude::*;
use serde::Serialize;

use crate::strings::select::Warnings;

use super::{RankRule, Ranked, Report, StringSlot, Survey, Verdict};

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

    fn key(&self, rule: RankRule) -> [f64; 3] {
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
}

impl Rejections {
    fn count(&mut self, metrics: &Metrics) {
        self.count_flags(metrics.flags);
        self.over_rated_load += u64::from(metrics.over_rated_load);
    }

    /// Counts the reasons in a refused candidate's combined string flags.
    fn count_flags(&mut self, flags: u16) {
        let has = |reason: Warnings| u64::from(flags & reason.bits() != 0);
        self.stress_danger += has(Warnings::STRESS_DANGER);
        self.outside_catalog +=
            has(Warnings::THINNER_THAN_CATALOG.union(Warnings::THICKER_THAN_CATALOG));
        self.outside_window += has(Warnings::BELOW_WINDOW.union(Warnings::ABOVE_WINDOW));
        self.wider_than_slot += has(Warnings::WIDER_THAN_SLOT);
        self.strength_unknown += has(Warnings::STRENGTH_UNKNOWN);
    }

    fn add(&mut self, other: &Rejections) {
        self.stress_danger += other.stress_danger;
        self.outside_catalog += other.outside_catalog;
        self.outside_window += other.outside_window;
        self.wider_than_slot += other.wider_than_slot;
        self.strength_unknown += other.strength_unknown;
        self.over_rated_load += other.over_rated_load;
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
struct Entry {
    key: [f64; 3],
    index: u64,
    pair: usize,
    metrics: Metrics,
}

fn order(a: &Entry, b: &Entry) -> Ordering {
    a.key[0]
        .total_cmp(&b.key[0])
        .then(a.key[1].total_cmp(&b.key[1]))
        .then(a.key[2].total_cmp(&b.key[2]))
        .then(a.index.cmp(&b.index))
}

/// What one thread found.
struct Found {
    best: Vec<Entry>,
    top: usize,
    /// Whether a tuning-and-pattern pair may fill several places (`every_offset`).
    every_offset: bool,
    stringable: u64,
    rejected: Rejections,
}

impl Found {
    fn new(top: usize, every_offset: bool) -> Found {
        Found {
            best: Vec::with_capacity(top + 1),
            top,
            every_offset,
            stringable: 0,
            rejected: Rejections::default(),
        }
    }

    /// Keeps `entry` if it is among the best `top` (each pair once, at its best, unless
    /// `every_offset`); never grows past `top + 1`, so never reallocates.
    ///
    /// One place per pair stays exact when offers arrive in any order and lists are merged: a
    /// pair pushed out had `top` other pairs ahead of it, and those only get better.
    fn offer(&mut self, entry: Entry) {
        if self.best.len() == self.top
            && self
                .best
                .last()
                .is_some_and(|worst| order(&entry, worst).is_ge())
        {
            return;
        }
        if !self.every_offset {
            if let Some(held) = self.best.iter().position(|e| e.pair == entry.pair) {
                if order(&entry, &self.best[held]).is_ge() {
                    return;
                }
                self.best.remove(held);
            }
        }
        let at = self.best.partition_point(|e| order(e, &entry).is_lt());
        self.best.insert(at, entry);
        self.best.truncate(self.top);
    }

    fn merge(mut self, other: Found) -> Found {
        for entry in other.best {
            self.offer(entry);
        }
        self.stringable += other.stringable;
        self.rejected.add(&other.rejected);
        self
    }
}

impl Survey<'_> {
    /// Checks every candidate, ranks the stringable ones and solves the best with the plain
    /// plan solver; `progress` is told how many candidates each finished chunk held. Runs on the
    /// current rayon pool.
    pub fn run(&self, progress: &(dyn Fn(u64) + Sync)) -> crate::error::Result<Report> {
        let mut report = self.search(progress);
        if let Some(best) = report.best_candidate {
            report.best_plan = Some(self.candidate_plan(best)?);
        }
        Ok(report)
    }

    /// [`Survey::run`] without the best candidate's plan: the sweep and the ranking only.
    pub fn search(&self, progress: &(dyn Fn(u64) + Sync)) -> Report {
        let started = Instant::now();
        let rule = self.settings.rank_by;
        let top = self.settings.top;
        let every_offset = self.settings.every_offset;
        let offsets = self.size.offsets;
        let chunks: Vec<(usize, u64)> = (0..self.pairs.len())
            .flat_map(|pair| (0..offsets.div_ceil(CHUNK)).map(move |c| (pair, c * CHUNK)))
            .collect();
        let found = chunks
            .par_iter()
            .fold(
                || {
                    (
                        Found::new(top, every_offset),
                        Vec::<usize>::with_capacity(self.strings.len()),
                    )
                },
                |(mut found, mut segments), &(pair_index, first)| {
                    let pair = &self.pairs[pair_index];
                    let last = (first + CHUNK).min(offsets);
                    let ratio = self.offset_ratios[first as usize];
                    segments.clear();
                    segments.extend(self.strings.iter().zip(&pair.factors).map(
                        |(slot, factor)| {
                            let two_l_f = factor * ratio;
                            slot.table.find(two_l_f * two_l_f)
                        },
                    ));
                    let base = pair_index as u64 * offsets;
                    for offset in first..last {
                        let ratio = self.offset_ratios[offset as usize];
                        let flags = place(&self.strings, &pair.factors, ratio, &mut segments);
                        // Refused for its strings: only the reasons are counted, unless a rated
                        // load asks for the total too.
                        if flags & reject_mask() != 0 && self.rated_load_n.is_none() {
                            found.rejected.count_flags(flags);
                            continue;
                        }
                        let metrics = measure(
                            &self.strings,
                            &pair.factors,
                            ratio,
                            &segments,
                            flags,
                            self.rated_load_n,
                        );
                        if metrics.stringable() {
                            found.stringable += 1;
                            found.offer(Entry {
                                key: metrics.key(rule),
                                index: base + offset,
                                pair: pair_index,
                                metrics,
                            });
                        } else {
                            found.rejected.count(&metrics);
                        }
                    }
                    progress(last - first);
                    (found, segments)
                },
            )
            .map(|(found, _)| found)
            .reduce(|| Found::new(top, every_offset), Found::merge);
        let elapsed_s = started.elapsed().as_secs_f64();
        let results = found
            .best
            .iter()
            .enumerate()
            .map(|(rank, entry)| self.ranked(rank + 1, entry))
            .collect();
        Report {
            best_candidate: found.best.first().map(|best| best.index),
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
            stringable: found.stringable,
            rejected: found.rejected,
            elapsed_s,
            course_direction: self.order.direction,
            notes: self.order.notes.clone(),
            diagnosis: if found.stringable == 0 {
                self.diagnose()
            } else {
                Vec::new()
            },
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
