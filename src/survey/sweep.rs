//! The crossings sweep: a candidate's verdict changes only where some string's pitch crosses a
//! bound of its table, so only those offsets are visited.
//!
//! # Why it gives the exhaustive search's answer exactly
//!
//! Within one (tuning, pattern) pair, string j at offset k has s = (factor_j · ratio_k)², the
//! same float expression the exhaustive search evaluates. The offset ratios ascend (checked when
//! the survey is prepared), and rounding is monotone, so s never falls as k grows, and neither
//! does the string's segment (the number of table bounds at or below s). The offset where a
//! bound b is crossed is the first k with s ≥ b: a guess from logarithms, then corrected by
//! evaluating s itself on either side, so it is exact, not estimated. Between two crossings
//! every string keeps its segment: the chosen kinds, gauges and flags, hence the verdict, are
//! constant over the whole run, and its refusals are counted by multiplying.
//!
//! Inside a stringable run the measures still move with the offset, and the ranking needs the
//! best offset of each run (and, with `every_offset`, every offset that can make the list). In
//! exact arithmetic every tension is μ_j·factor_j²·ratio², so the total load, the worst stress
//! and the spread rise with the offset and the worst distance from the target falls, then rises.
//! The floats the ranking compares keep most of that exactly:
//!
//! - total load and worst stress are sums and maxima of rounded products of a rising s, so they
//!   never fall: the offsets tying the run's first value are found by binary search;
//! - the worst target distance is max(U, D) with U = max(μ/T·s − 1) never falling and
//!   D = max(1 − μ/T·s) never rising, so its smallest value and the offsets holding it are
//!   found by binary searches on U and D;
//! - the spread is a difference of two rising floats, which may fall by a few units in the last
//!   place. Its rounding error is below `SPREAD_NOISE` of the total load (four roundings per
//!   tension, one for the difference: about 9 units of 2⁻⁵³ of the highest tension), so a scan
//!   from the run's start stops at the first offset whose spread exceeds the best one by twice
//!   that: no later offset can come back below it. Normally that is the second offset.
//!
//! Each candidate that is compared is measured by the same function the exhaustive search uses
//! ([`super::search::measure`]), so the listed figures are bit for bit the same.

use rayon::prelude::*;

use super::search::{measure, order, reject_mask, Entry, Metrics, Podium, Tally};
use super::{RankRule, Survey};

/// Bound on the spread's rounding error, relative to the total load (see the module
/// documentation; about ten times the error it covers).
const SPREAD_NOISE: f64 = 1e-14;

/// How one of the ranking's measures moves with the offset inside a run.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Shape {
    /// Never falls, exactly (total load, worst stress).
    Rising,
    /// Rises in exact arithmetic; the floats may wobble by `SPREAD_NOISE` (the spread).
    Wobbling,
    /// Always 0 (the spread of a one-string instrument: its highest tension is its lowest).
    Zero,
    /// Falls, then rises, exactly (the worst distance from the target).
    Valley,
}

fn shapes(rule: RankRule, one_string: bool) -> [Shape; 3] {
    let spread = if one_string {
        Shape::Zero
    } else {
        Shape::Wobbling
    };
    match rule {
        RankRule::Spread => [spread, Shape::Rising, Shape::Rising],
        RankRule::Stress | RankRule::Load => [Shape::Rising, spread, Shape::Rising],
        RankRule::Target => [Shape::Valley, spread, Shape::Rising],
    }
}

/// The first index in `lo..hi` where `pred` holds, `hi` when none does. For a predicate that
/// turns from false to true once, that is the turning point; for any predicate, the index
/// returned is `hi` or one where `pred` holds.
fn first(mut lo: usize, mut hi: usize, mut pred: impl FnMut(usize) -> bool) -> usize {
    while lo < hi {
        let mid = lo + (hi - lo) / 2;
        if pred(mid) {
            hi = mid;
        } else {
            lo = mid + 1;
        }
    }
    lo
}

/// A stringable run of offsets `from..to` of one pair, with its best candidate.
#[derive(Debug, Clone, Copy)]
struct Run {
    pair: usize,
    from: usize,
    to: usize,
    flags: u16,
    best: Entry,
}

/// One pair's strings at one place of the sweep.
struct Walk<'w, 'a> {
    survey: &'w Survey<'a>,
    pair: usize,
    factors: &'w [f64],
    segments: Vec<usize>,
    flags: u16,
    base: u64,
    rule: RankRule,
    shapes: [Shape; 3],
}

impl Walk<'_, '_> {
    fn s(&self, string: usize, offset: usize) -> f64 {
        let two_l_f = self.factors[string] * self.survey.offset_ratios[offset];
        two_l_f * two_l_f
    }

    fn metrics(&self, offset: usize) -> Metrics {
        measure(
            &self.survey.strings,
            self.factors,
            self.survey.offset_ratios[offset],
            &self.segments,
            self.flags,
            self.survey.rated_load_n,
        )
    }

    fn entry(&self, offset: usize) -> Entry {
        let metrics = self.metrics(offset);
        Entry {
            key: metrics.key(self.rule),
            index: self.base + offset as u64,
            pair: self.pair,
            metrics,
        }
    }

    /// U and D of the target distance (module documentation), with `measure`'s arithmetic.
    fn rise_and_fall(&self, offset: usize) -> (f64, f64) {
        let ratio = self.survey.offset_ratios[offset];
        let mut rise = f64::NEG_INFINITY;
        let mut fall = f64::NEG_INFINITY;
        for ((slot, factor), &segment) in self
            .survey
            .strings
            .iter()
            .zip(self.factors)
            .zip(&self.segments)
        {
            let two_l_f = factor * ratio;
            let s = two_l_f * two_l_f;
            let above = slot.table.outcomes[segment].unit_mass_over_target * s - 1.0;
            rise = if above > rise { above } else { rise };
            fall = if -above > fall { -above } else { fall };
        }
        (rise, fall)
    }

    /// The offsets of `from..to` whose target distance is at most `level` (the smallest
    /// distance in the run when `None`): one interval, since the distance falls then rises.
    fn valley(&self, from: usize, to: usize, level: Option<f64>) -> (usize, usize) {
        let level = level.unwrap_or_else(|| {
            let turn = first(from, to, |k| {
                let (rise, fall) = self.rise_and_fall(k);
                rise >= fall
            });
            let mut least = f64::INFINITY;
            if turn > from {
                least = self.rise_and_fall(turn - 1).1;
            }
            if turn < to {
                let rise = self.rise_and_fall(turn).0;
                least = if rise < least { rise } else { least };
            }
            least
        });
        let low = first(from, to, |k| self.rise_and_fall(k).1 <= level);
        let high = first(from, to, |k| self.rise_and_fall(k).0 > level);
        (low, high)
    }

    /// Twice the bound on the spread's rounding error anywhere in `from..to`.
    fn spread_margin(&self, to: usize) -> f64 {
        2.0 * SPREAD_NOISE * self.metrics(to - 1).total_load_n
    }

    /// The best candidate of `from..to`, where measures before `measure` tie throughout.
    fn best(&self, from: usize, to: usize, measure: usize) -> Entry {
        if measure == 3 || to - from == 1 {
            // Everything ties: the candidate generated first wins.
            return self.entry(from);
        }
        match self.shapes[measure] {
            Shape::Zero => self.best(from, to, measure + 1),
            Shape::Rising => {
                let value = self.entry(from).key[measure];
                let end = first(from + 1, to, |k| {
                    self.entry(k).key[measure].total_cmp(&value).is_gt()
                });
                self.best(from, end, measure + 1)
            }
            Shape::Valley => {
                let (low, high) = self.valley(from, to, None);
                self.best(low, high, measure + 1)
            }
            Shape::Wobbling => {
                let margin = self.spread_margin(to);
                let mut best = self.entry(from);
                for k in from + 1..to {
                    let entry = self.entry(k);
                    if order(&entry, &best).is_lt() {
                        best = entry;
                    }
                    if entry.key[measure] - margin > best.key[measure] {
                        break;
                    }
                }
                best
            }
        }
    }

    /// Offers every candidate of `from..to` that can make the podium (`every_offset`).
    fn offer_all(&self, from: usize, to: usize, podium: &mut Podium) {
        // Measures that are 0 throughout tie everywhere: the first other one leads.
        let lead = if self.shapes[0] == Shape::Zero { 1 } else { 0 };
        match self.shapes[lead] {
            Shape::Rising | Shape::Wobbling | Shape::Zero => {
                let margin = if self.shapes[lead] == Shape::Wobbling {
                    self.spread_margin(to)
                } else {
                    0.0
                };
                for k in from..to {
                    let entry = self.entry(k);
                    if podium
                        .worst()
                        .is_some_and(|worst| entry.key[lead] - margin > worst.key[lead])
                    {
                        // Every later offset measures at least this much (less the margin).
                        break;
                    }
                    podium.offer(entry);
                }
            }
            Shape::Valley => {
                let (low, high) = match podium.worst() {
                    Some(worst) => self.valley(from, to, Some(worst.key[0])),
                    None => (from, to),
                };
                for k in low..high {
                    podium.offer(self.entry(k));
                }
            }
        }
    }

    fn combine_flags(&mut self) {
        self.flags = self
            .survey
            .strings
            .iter()
            .zip(&self.segments)
            .fold(0, |flags, (slot, &segment)| {
                flags | slot.table.flags[segment]
            });
    }

    /// Puts every string on its segment at `offset` (binary search).
    fn place_at(&mut self, offset: usize) {
        for string in 0..self.segments.len() {
            let s = self.s(string, offset);
            self.segments[string] = self.survey.strings[string].table.find(s);
        }
        self.combine_flags();
    }

    /// The first offset in `lowest..` where string `string`'s s reaches `bound`, knowing that
    /// the last offset's does: a guess from logarithms, widened until it brackets the answer,
    /// then a binary search on s itself.
    fn crossing(&self, string: usize, bound: f64, lowest: usize) -> usize {
        let survey = self.survey;
        let count = survey.offset_ratios.len();
        let factor = self.factors[string];
        let offsets = &survey.settings.offsets;
        let cents = 600.0 * (bound / (factor * factor)).log2();
        let guess = ((cents - offsets.cents(0)) / offsets.step_cents()).ceil();
        let guess = if guess.is_finite() {
            (guess.max(0.0) as usize).clamp(lowest, count - 1)
        } else {
            lowest
        };
        let reaches = |k: usize| self.s(string, k) >= bound;
        let (low, high) = if reaches(guess) {
            let mut step = 1;
            let mut high = guess;
            loop {
                let next = guess.saturating_sub(step).max(lowest);
                if next == high || !reaches(next) {
                    break (next, high + 1);
                }
                high = next;
                step *= 2;
            }
        } else {
            let mut step = 1;
            let mut low = guess + 1;
            loop {
                let next = (guess + step).min(count - 1);
                if reaches(next) {
                    break (low, next + 1);
                }
                low = next + 1;
                step *= 2;
            }
        };
        first(low, high, reaches)
    }
}

/// What one thread of the sweep gathers.
struct Gathered {
    podium: Podium,
    tally: Tally,
    runs: Vec<Run>,
    events: Vec<u64>,
}

impl<'a> Survey<'a> {
    fn walk(&self, pair: usize) -> Walk<'_, 'a> {
        Walk {
            survey: self,
            pair,
            factors: &self.pairs[pair].factors,
            segments: vec![0; self.strings.len()],
            flags: 0,
            base: pair as u64 * self.size.offsets,
            rule: self.settings.rank_by,
            shapes: shapes(self.settings.rank_by, self.strings.len() == 1),
        }
    }

    /// The crossings sweep (module documentation): every pair's runs counted, each pair's best
    /// offered (or, with `every_offset`, every candidate that can make the list).
    pub(super) fn sweep(&self, progress: &(dyn Fn(u64) + Sync)) -> (Podium, Tally) {
        let top = self.settings.top;
        let every_offset = self.settings.every_offset;
        let gathered = (0..self.pairs.len())
            .into_par_iter()
            .fold(
                || Gathered {
                    podium: Podium::new(top, !every_offset),
                    tally: Tally::default(),
                    runs: Vec::new(),
                    events: Vec::new(),
                },
                |mut gathered, pair| {
                    let crossed = self.sweep_pair(pair, &mut gathered);
                    progress(crossed + self.strings.len() as u64);
                    gathered
                },
            )
            .map(|gathered| (gathered.podium, gathered.tally, gathered.runs))
            .reduce(
                || {
                    (
                        Podium::new(top, !every_offset),
                        Tally::default(),
                        Vec::new(),
                    )
                },
                |(podium, mut tally, mut runs), (other, other_tally, other_runs)| {
                    tally.add(&other_tally);
                    runs.extend(other_runs);
                    (podium.merge(other), tally, runs)
                },
            );
        let (mut podium, tally, mut runs) = gathered;
        if every_offset {
            // The runs whose best is best first: the podium fills with good candidates early,
            // and a run whose best cannot make it ends the search.
            runs.sort_unstable_by(|a, b| order(&a.best, &b.best));
            for run in &runs {
                if podium
                    .worst()
                    .is_some_and(|worst| order(&run.best, worst).is_ge())
                {
                    break;
                }
                let mut walk = self.walk(run.pair);
                walk.place_at(run.from);
                debug_assert_eq!(walk.flags, run.flags);
                walk.offer_all(run.from, run.to, &mut podium);
            }
        }
        (podium, tally)
    }

    /// Sweeps one pair; returns how many crossings it met.
    fn sweep_pair(&self, pair: usize, gathered: &mut Gathered) -> u64 {
        let count = self.offset_ratios.len();
        let mut walk = self.walk(pair);
        let events = &mut gathered.events;
        events.clear();
        for (string, slot) in self.strings.iter().enumerate() {
            let start = slot.table.find(walk.s(string, 0));
            let end = slot.table.find(walk.s(string, count - 1));
            walk.segments[string] = start;
            let mut lowest = 1;
            for &bound in &slot.table.bounds[start..end] {
                let offset = walk.crossing(string, bound, lowest);
                lowest = offset;
                events.push(((offset as u64) << 32) | string as u64);
            }
        }
        events.sort_unstable();
        walk.combine_flags();
        let mut from = 0;
        let mut best: Option<Entry> = None;
        let mut next = 0;
        while next < events.len() {
            let offset = (events[next] >> 32) as usize;
            self.settle(
                &walk,
                from,
                offset,
                (&mut gathered.tally, &mut gathered.runs),
                &mut best,
            );
            while next < events.len() && (events[next] >> 32) as usize == offset {
                walk.segments[(events[next] & 0xffff_ffff) as usize] += 1;
                next += 1;
            }
            walk.combine_flags();
            from = offset;
        }
        self.settle(
            &walk,
            from,
            count,
            (&mut gathered.tally, &mut gathered.runs),
            &mut best,
        );
        if let Some(best) = best {
            gathered.podium.offer(best);
        }
        events.len() as u64
    }

    /// Counts the run `from..to` (every string on one segment) and notes its best candidate.
    fn settle(
        &self,
        walk: &Walk<'_, '_>,
        from: usize,
        to: usize,
        (tally, runs): (&mut Tally, &mut Vec<Run>),
        best: &mut Option<Entry>,
    ) {
        if to <= from {
            return;
        }
        let refused = walk.flags & reject_mask() != 0;
        let mut end = to;
        if let Some(rated) = self.rated_load_n {
            // The total load never falls inside a run: the offsets above the rating are a tail.
            end = first(from, to, |k| walk.metrics(k).total_load_n > rated);
            tally.rejected.over_rated_load += (to - end) as u64;
        }
        if refused {
            tally
                .rejected
                .count_flags_times(walk.flags, (to - from) as u64);
            return;
        }
        if end == from {
            return;
        }
        tally.stringable += (end - from) as u64;
        let run_best = walk.best(from, end, 0);
        if self.settings.every_offset {
            runs.push(Run {
                pair: walk.pair,
                from,
                to: end,
                flags: walk.flags,
                best: run_best,
            });
        } else if best.is_none_or(|held| order(&run_best, &held).is_lt()) {
            *best = Some(run_best);
        }
    }
}
