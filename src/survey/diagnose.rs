//! Why a survey found nothing, course by course: for each string, in how many candidates it is
//! refused, by which limits, and how far the candidates are from a pitch it would pass at.
//!
//! Runs only when no candidate is stringable, after the sweep, so the sweep itself stays as it
//! was. Each string is looked at alone: its frequency in every candidate is
//! `factor · offset ratio`, and the offset ratios ascend, so the candidates of one (tuning,
//! pattern) pair cover one stretch of the string's segment table. Walking that stretch segment
//! by segment, and finding with a binary search where each run of accepted segments starts and
//! ends among the offsets, counts the candidates exactly without visiting them one by one.

use serde::Serialize;

use crate::strings::select::Warnings;

use super::search::reject_mask;
use super::table::OUTSIDE_PITCH_RANGE;
use super::Survey;

/// A limit that refuses a string.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Limit {
    /// Stress above the danger limit.
    StressDanger,
    /// The string would need to be lighter than its kinds' lightest gauge.
    ThinnerThanCatalog,
    /// The string would need to be heavier than its kinds' heaviest gauge.
    ThickerThanCatalog,
    /// Tension below the window's minimum.
    BelowWindow,
    /// Tension above the window's maximum.
    AboveWindow,
    /// Wider than the slot.
    WiderThanSlot,
    /// The chosen kind's strength is unknown.
    StrengthUnknown,
    /// The string's pitch lies outside the plausible range of 1 Hz to 30 kHz.
    OutsidePitchRange,
}

impl Limit {
    const ALL: [(Limit, u16); 8] = [
        (Limit::StressDanger, Warnings::STRESS_DANGER.bits()),
        (
            Limit::ThinnerThanCatalog,
            Warnings::THINNER_THAN_CATALOG.bits(),
        ),
        (
            Limit::ThickerThanCatalog,
            Warnings::THICKER_THAN_CATALOG.bits(),
        ),
        (Limit::BelowWindow, Warnings::BELOW_WINDOW.bits()),
        (Limit::AboveWindow, Warnings::ABOVE_WINDOW.bits()),
        (Limit::WiderThanSlot, Warnings::WIDER_THAN_SLOT.bits()),
        (Limit::StrengthUnknown, Warnings::STRENGTH_UNKNOWN.bits()),
        (Limit::OutsidePitchRange, OUTSIDE_PITCH_RANGE),
    ];

    fn of_flags(flags: u16) -> Vec<Limit> {
        Limit::ALL
            .iter()
            .filter(|(_, bits)| flags & bits != 0)
            .map(|(limit, _)| *limit)
            .collect()
    }
}

/// The string as chosen in the candidate nearest to passing (the end of the swept range that
/// lies nearest a pitch the string passes at).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Closest {
    /// Its frequency there, Hz.
    pub hz: f64,
    /// The chosen kind's id (none when no kind has a gauge).
    pub kind: Option<String>,
    /// The chosen gauge's diameter, m.
    pub diameter_m: Option<f64>,
    /// Its tension there, N.
    pub tension_n: Option<f64>,
    /// Its stress ratio there (share of breaking strength), when the strength is known.
    pub stress_ratio: Option<f64>,
    /// The limits that refuse it there.
    pub limits: Vec<Limit>,
}

/// Why one string of one course fails, over every candidate of a survey.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CourseDiagnosis {
    /// The course's number as the instrument shows it.
    pub course: u32,
    /// The string within the course, from 1.
    pub string: usize,
    /// Candidates in which this string is refused.
    pub refused_candidates: u64,
    /// Candidates in all.
    pub candidates: u64,
    /// Every limit that refuses it in some candidate.
    pub limits: Vec<Limit>,
    /// When the string is refused in every candidate: how many cents its pitch would have to
    /// move beyond the swept range to pass (positive: higher); none when no pitch passes.
    pub nearest_passing_cents: Option<f64>,
    /// When the string is refused in every candidate: the string at the end of the range
    /// nearest to passing.
    pub closest: Option<Closest>,
    /// The string's tension window, N.
    pub window_n: (Option<f64>, Option<f64>),
    /// The danger limit, as a share of breaking strength.
    pub danger_ratio: f64,
    /// The slot's width, m.
    pub slot_m: Option<f64>,
}

impl Survey<'_> {
    /// Per string, why candidates fail (see the module documentation).
    pub(super) fn diagnose(&self) -> Vec<CourseDiagnosis> {
        let reject = reject_mask();
        let offsets = &self.offset_ratios;
        let (Some(&first_ratio), Some(&last_ratio)) = (offsets.first(), offsets.last()) else {
            return Vec::new();
        };
        let mut per_course = vec![0usize; self.instrument.courses.len()];
        let mut out = Vec::with_capacity(self.strings.len());
        for (j, slot) in self.strings.iter().enumerate() {
            per_course[slot.course] += 1;
            let table = &slot.table;
            let accepted = |segment: usize| table.flags[segment] & reject == 0;
            let mut refused = 0u64;
            let mut flags = 0u16;
            // Smallest |cents| to a passing pitch, with its sign and the end (s, segment).
            let mut nearest: Option<(f64, f64, usize)> = None;
            let mut none_passes = true;
            for pair in &self.pairs {
                let factor = pair.factors[j];
                let s_of = |ratio: f64| {
                    let two_l_f = factor * ratio;
                    two_l_f * two_l_f
                };
                let (low_s, high_s) = (s_of(first_ratio), s_of(last_ratio));
                let (low, high) = (table.find(low_s), table.find(high_s));
                // Offsets whose s lies below `bound`.
                let below = |bound: f64| offsets.partition_point(|&r| s_of(r) < bound) as u64;
                let mut passing = 0u64;
                let mut segment = low;
                while segment <= high {
                    if accepted(segment) {
                        let run_start = segment;
                        while segment < high && accepted(segment + 1) {
                            segment += 1;
                        }
                        let from = if run_start == low {
                            0
                        } else {
                            below(table.bounds[run_start - 1])
                        };
                        let to = if segment == high {
                            offsets.len() as u64
                        } else {
                            below(table.bounds[segment])
                        };
                        passing += to.saturating_sub(from);
                    } else {
                        flags |= table.flags[segment];
                    }
                    segment += 1;
                }
                refused += offsets.len() as u64 - passing;
                if passing > 0 {
                    none_passes = false;
                    continue;
                }
                // Nearest accepted segment below the range: it ends at bounds[a].
                if let Some(a) = (0..low).rev().find(|&a| accepted(a)) {
                    let cents = 600.0 * (table.bounds[a] / low_s).log2();
                    if nearest.is_none_or(|(best, _, _)| cents.abs() < best.abs()) {
                        nearest = Some((cents, low_s, low));
                    }
                }
                // Nearest accepted segment above the range: it starts at bounds[a - 1].
                if let Some(a) = (high + 1..table.outcomes.len()).find(|&a| accepted(a)) {
                    let cents = 600.0 * (table.bounds[a - 1] / high_s).log2();
                    if nearest.is_none_or(|(best, _, _)| cents.abs() < best.abs()) {
                        nearest = Some((cents, high_s, high));
                    }
                }
                if nearest.is_none() {
                    // No pitch passes: describe the end of the first pair's range.
                    nearest = Some((f64::NAN, low_s, low));
                }
            }
            let refused_everywhere = none_passes && !self.pairs.is_empty();
            let closest = nearest
                .filter(|_| refused_everywhere)
                .map(|(_, s, segment)| {
                    let outcome = table.outcomes[segment];
                    let kind = slot.kinds.get(usize::from(outcome.kind));
                    let gauge = kind.and_then(|k| k.gauges().get(outcome.gauge as usize));
                    Closest {
                        hz: s.sqrt() / slot.two_length,
                        kind: kind.map(|k| k.id.as_str().to_string()),
                        diameter_m: gauge.map(|g| g.diameter),
                        tension_n: kind.map(|_| outcome.unit_mass * s),
                        stress_ratio: Some(outcome.unit_mass_over_break * s)
                            .filter(|ratio| kind.is_some() && ratio.is_finite()),
                        limits: Limit::of_flags(outcome.flags & reject),
                    }
                });
            let limits = &self.checks[j];
            out.push(CourseDiagnosis {
                course: self.instrument.courses[slot.course]
                    .course
                    .unwrap_or_else(|| u32::try_from(slot.course + 1).unwrap_or(u32::MAX)),
                string: per_course[slot.course],
                refused_candidates: refused,
                candidates: self.size.candidates,
                limits: Limit::of_flags(flags & reject),
                nearest_passing_cents: nearest
                    .filter(|_| refused_everywhere)
                    .map(|(cents, _, _)| cents)
                    .filter(|cents| cents.is_finite()),
                closest,
                window_n: (limits.min_tension, limits.max_tension),
                danger_ratio: limits.limits.danger,
                slot_m: limits.widest,
            });
        }
        out
    }
}
