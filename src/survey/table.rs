//! Per string, everything about the choice that does not change from candidate to candidate,
//! laid out so that a candidate costs a few multiplications and a walk along a sorted array.
//!
//! # Why the choice is a function of one number
//!
//! On a fixed string (length L, target T, window, slot, kinds, limits) only the frequency f
//! changes between candidates, and the selector ([`select::select`]) reads f only through
//! s = (2Lf)²: the linear density it asks for is μ = T/s (REFERENCES §1.2), a gauge's tension
//! is μ_g·s, its stress ratio μ_g·s/T_break. Every rule of the selector compares one of these
//! with a constant, so each gauge's flags and the nearest gauge of each kind change only where s
//! crosses one of these values:
//!
//! | crossing | value of s |
//! |---|---|
//! | μ = μ_g (which gauges lie above the need) | T/μ_g |
//! | nearer of two neighbours switches | 2T/(μ_g + μ_g+1) |
//! | stress at the caution / danger limit | limit·T_break/μ_g |
//! | tension at the window's ends | min/μ_g, max/μ_g |
//! | tension at the tolerance's ends | (1 ± tol)·T/μ_g |
//!
//! Sorting those crossings cuts the s axis into segments on which the chosen kind, gauge and
//! flags are constant. The table asks the library's own selector for its choice once inside each
//! segment, so it follows the selector's rule by construction; a candidate then finds its
//! segment by walking from the previous candidate's (frequencies change little between
//! neighbouring offsets) and reads μ_g, 1/T_break and the flags. The one difference from calling
//! the selector: a frequency within a rounding error (about 1e-16 relative) of a crossing may
//! land on the other side of it.

use crate::input::units::FREQUENCY_BOUNDS;
use crate::strings::kind::StringKind;
use crate::strings::select::{self, Checks, Request, Warnings};

/// A survey's own flag, beside the selector's: the string's frequency lies outside the
/// plausible range every pitch of a plan keeps to (1 Hz to 30 kHz, `taut help ranges`). The
/// selector's flags leave this bit free.
pub const OUTSIDE_PITCH_RANGE: u16 = 1 << 15;

/// What the selector chooses for a string inside one segment of s.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Outcome {
    /// Linear density of the chosen gauge, kg/m (tension = μ·s).
    pub unit_mass: f64,
    /// μ / breaking tension (stress ratio = this·s); NaN when the strength is unknown.
    pub unit_mass_over_break: f64,
    /// μ / target tension (tension / target = this·s).
    pub unit_mass_over_target: f64,
    /// The chosen string's flags (without the whole-selection `NONE_WITHIN_TOLERANCE`).
    pub flags: u16,
    /// Index of the chosen kind in the string's kind list.
    pub kind: u16,
    /// Index of the chosen gauge in its kind.
    pub gauge: u32,
}

/// The segment table of one string.
#[derive(Debug, Clone)]
pub struct StringTable {
    /// Segment i covers `bounds[i-1] <= s < bounds[i]` (the first and last are open-ended).
    pub bounds: Vec<f64>,
    /// One outcome per segment; `outcomes.len() == bounds.len() + 1`.
    pub outcomes: Vec<Outcome>,
    /// Each outcome's flags again, packed: a candidate refused for its strings reads only
    /// these.
    pub flags: Vec<u16>,
}

/// What one string asks, besides its frequency.
#[derive(Debug, Clone, Copy)]
pub struct StringSpec<'k> {
    /// Vibrating length, m.
    pub length: f64,
    /// Target tension, N.
    pub target: f64,
    /// Tolerance, relative.
    pub tolerance: f64,
    /// Window, slot and stress limits.
    pub checks: Checks,
    /// Allowed kinds in order of preference.
    pub kinds: &'k [&'k StringKind],
}

impl StringTable {
    /// Builds the table by asking [`select::select`] once per segment.
    pub fn build(spec: &StringSpec<'_>) -> StringTable {
        let target = spec.target;
        let mut cuts: Vec<f64> = Vec::new();
        for kind in spec.kinds {
            let gauges = kind.gauges();
            for (index, gauge) in gauges.iter().enumerate() {
                let mu = gauge.unit_mass;
                cuts.push(target / mu);
                cuts.push((1.0 - spec.tolerance) * target / mu);
                cuts.push((1.0 + spec.tolerance) * target / mu);
                cuts.push(spec.checks.limits.caution * gauge.breaking_tension / mu);
                cuts.push(spec.checks.limits.danger * gauge.breaking_tension / mu);
                if let Some(min) = spec.checks.min_tension {
                    cuts.push(min / mu);
                }
                if let Some(max) = spec.checks.max_tension {
                    cuts.push(max / mu);
                }
                if let Some(next) = gauges.get(index + 1) {
                    cuts.push(2.0 * target / (mu + next.unit_mass));
                }
            }
        }
        // The plausible range of pitches, as s: below (2L·1 Hz)² and above (2L·30 kHz)² a
        // string is refused. The upper cut sits one step above, so 30 kHz itself passes.
        let (lowest_s, highest_s) = pitch_range_s(spec.length);
        cuts.push(lowest_s);
        cuts.push(next_above(highest_s));
        cuts.retain(|cut| cut.is_finite() && *cut > 0.0);
        cuts.sort_by(f64::total_cmp);
        cuts.dedup();
        let mut table = StringTable {
            bounds: Vec::with_capacity(cuts.len()),
            outcomes: Vec::with_capacity(cuts.len() + 1),
            flags: Vec::new(),
        };
        let mut scratch = [None; crate::plan::solve::MAX_KINDS_PER_LIST];
        let choose = |s: f64, scratch: &mut [Option<select::Choice>]| -> Outcome {
            let frequency = s.sqrt() / (2.0 * spec.length);
            let request = Request {
                frequency,
                length: spec.length,
                target_tension: target,
                tolerance: spec.tolerance,
                checks: spec.checks,
            };
            let selection = select::select(&request, spec.kinds, scratch);
            match selection.chosen {
                Some(choice) => {
                    let breaking = spec.kinds[choice.kind].gauges()[choice.gauge].breaking_tension;
                    Outcome {
                        unit_mass: choice.unit_mass,
                        unit_mass_over_break: choice.unit_mass / breaking,
                        unit_mass_over_target: choice.unit_mass / target,
                        flags: choice.warnings.bits(),
                        kind: choice.kind as u16,
                        gauge: choice.gauge as u32,
                    }
                }
                // No kind has a gauge: the catalog cannot string it at all.
                None => Outcome {
                    unit_mass: 0.0,
                    unit_mass_over_break: 0.0,
                    unit_mass_over_target: 0.0,
                    flags: Warnings::THICKER_THAN_CATALOG.bits(),
                    kind: u16::MAX,
                    gauge: u32::MAX,
                },
            }
        };
        let probe = |s: f64, scratch: &mut [Option<select::Choice>]| -> Outcome {
            let outcome = choose(s, scratch);
            if s < lowest_s || s > highest_s {
                Outcome {
                    flags: outcome.flags | OUTSIDE_PITCH_RANGE,
                    ..outcome
                }
            } else {
                outcome
            }
        };
        let representative = |segment: usize| -> f64 {
            match (segment.checked_sub(1).map(|i| cuts[i]), cuts.get(segment)) {
                (None, Some(&high)) => high / 2.0,
                (Some(low), None) => low * 2.0,
                (Some(low), Some(&high)) => (low * high).sqrt(),
                // No cuts at all: any s gives the same answer.
                (None, None) => 1.0,
            }
        };
        let mut current = probe(representative(0), &mut scratch);
        for segment in 1..=cuts.len() {
            let next = probe(representative(segment), &mut scratch);
            if (next.kind, next.gauge, next.flags) != (current.kind, current.gauge, current.flags) {
                table.bounds.push(cuts[segment - 1]);
                table.outcomes.push(current);
                current = next;
            }
        }
        table.outcomes.push(current);
        table.flags = table.outcomes.iter().map(|outcome| outcome.flags).collect();
        table
    }

    /// The segment holding `s`, found by binary search.
    pub fn find(&self, s: f64) -> usize {
        self.bounds.partition_point(|&bound| bound <= s)
    }

    /// The segment holding `s`, walking from `from` (cheap when s moved little).
    #[inline]
    pub fn walk(&self, mut from: usize, s: f64) -> usize {
        while from < self.bounds.len() && s >= self.bounds[from] {
            from += 1;
        }
        while from > 0 && s < self.bounds[from - 1] {
            from -= 1;
        }
        from
    }
}

/// The plausible range of a string's pitch as s = (2Lf)², for a vibrating length `length` (m).
pub fn pitch_range_s(length: f64) -> (f64, f64) {
    let low = 2.0 * length * FREQUENCY_BOUNDS.min;
    let high = 2.0 * length * FREQUENCY_BOUNDS.max;
    (low * low, high * high)
}

/// The next float above a positive finite `value`.
fn next_above(value: f64) -> f64 {
    if value.is_finite() && value > 0.0 {
        f64::from_bits(value.to_bits() + 1)
    } else {
        value
    }
}
