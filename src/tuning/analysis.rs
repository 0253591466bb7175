//! How closely a tuning approximates just intervals.
//!
//! The just intervals of odd limit L are the tonality diamond: every ratio a/b with a and b odd
//! and at most L, reduced into the octave [1/1, 2/1), unison left out. For each interval we find
//! the pair of degrees of the tuning (any lower degree of period 0, any upper degree) whose
//! interval is closest, so an unequal scale is credited with an interval it holds anywhere, not
//! only above degree 0.

use num_rational::Ratio;
use serde::Serialize;

use super::{Layout, Tuning, TuningSummary};
use crate::error::{Error, Result};
use crate::tuning::pitch::{cents_of_ratio, serialize_ratio, ExactRatio};

/// Odd limits the analysis accepts.
pub const ODD_LIMITS: [u32; 6] = [3, 5, 7, 9, 11, 13];

/// The best approximation of one just interval.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct IntervalFit {
    /// The just interval.
    #[serde(serialize_with = "serialize_ratio")]
    pub interval: ExactRatio,
    /// Its size in cents.
    pub just_cents: f64,
    /// Lower degree of the best pair.
    pub from_degree: i64,
    /// Upper degree of the best pair.
    pub to_degree: i64,
    /// Degrees between them.
    pub steps: i64,
    /// The tuning's interval in cents.
    pub tuning_cents: f64,
    /// Tuning minus just, in cents.
    pub error_cents: f64,
}

/// The analysis of one tuning at one odd limit.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct FitReport {
    /// The tuning analysed.
    pub tuning: TuningSummary,
    /// The odd limit.
    pub odd_limit: u32,
    /// One row per just interval, ascending.
    pub intervals: Vec<IntervalFit>,
    /// Mean of the absolute errors, in cents.
    pub mean_abs_error_cents: f64,
    /// Largest absolute error, in cents.
    pub max_abs_error_cents: f64,
}

/// The odd-limit tonality diamond reduced into the octave, without the unison, ascending.
pub fn tonality_diamond(odd_limit: u32) -> Vec<ExactRatio> {
    let odds: Vec<i128> = (1..=i128::from(odd_limit)).step_by(2).collect();
    let mut ratios: Vec<ExactRatio> = Vec::new();
    let one = Ratio::from_integer(1);
    let two = Ratio::from_integer(2);
    for &a in &odds {
        for &b in &odds {
            let mut r = Ratio::new(a, b);
            while r < one {
                r *= 2;
            }
            while r >= two {
                r /= 2;
            }
            if r != one && !ratios.contains(&r) {
                ratios.push(r);
            }
        }
    }
    ratios.sort();
    ratios
}

/// Analyses how well `tuning` approximates the intervals of `odd_limit`.
pub fn fit(tuning: &Tuning, odd_limit: u32) -> Result<FitReport> {
    if !ODD_LIMITS.contains(&odd_limit) {
        return Err(
            Error::input(format!("{odd_limit} is not an odd limit taut analyses"))
                .field("--limit")
                .help("choose 3, 5, 7, 9, 11 or 13"),
        );
    }
    let lower_degrees: Vec<i64> = match tuning.layout() {
        Layout::Periodic { steps, .. } => (0..steps.len() as i64).collect(),
        Layout::Absolute { hz } => (0..hz.len() as i64).collect(),
    };
    let mut intervals = Vec::new();
    for interval in tonality_diamond(odd_limit) {
        let just_cents = cents_of_ratio(&interval);
        let mut best: Option<IntervalFit> = None;
        for &from in &lower_degrees {
            let Some(base) = tuning.cents_above_degree_zero(from) else {
                continue;
            };
            let Some(upper) = tuning.nearest_to_cents_above_degree_zero(base + just_cents) else {
                continue;
            };
            let Some(top) = tuning.cents_above_degree_zero(upper.degree) else {
                continue;
            };
            let tuning_cents = top - base;
            let error_cents = tuning_cents - just_cents;
            if best
                .as_ref()
                .is_none_or(|b| error_cents.abs() < b.error_cents.abs() - 1e-9)
            {
                best = Some(IntervalFit {
                    interval,
                    just_cents,
                    from_degree: from,
                    to_degree: upper.degree,
                    steps: upper.degree - from,
                    tuning_cents,
                    error_cents,
                });
            }
        }
        if let Some(best) = best {
            intervals.push(best);
        }
    }
    if intervals.is_empty() {
        return Err(Error::input(format!(
            "`{}` has too few degrees to approximate any interval",
            tuning.name()
        )));
    }
    let errors: Vec<f64> = intervals.iter().map(|i| i.error_cents.abs()).collect();
    Ok(FitReport {
        tuning: tuning.summary(),
        odd_limit,
        mean_abs_error_cents: errors.iter().sum::<f64>() / errors.len() as f64,
        max_abs_error_cents: errors.iter().copied().fold(0.0, f64::max),
        intervals,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn diamond_sizes_match_pythons_fractions() {
        // Python 3 `fractions.Fraction`: the octave-reduced odd-limit diamonds (unison included)
        // have 3, 7, 13, 19, 29 and 41 members for limits 3 … 13.
        for (limit, with_unison) in [(3, 3), (5, 7), (7, 13), (9, 19), (11, 29), (13, 41)] {
            assert_eq!(tonality_diamond(limit).len(), with_unison - 1, "{limit}");
        }
        assert_eq!(
            tonality_diamond(5),
            ["6/5", "5/4", "4/3", "3/2", "8/5", "5/3"]
                .iter()
                .map(|t| crate::tuning::pitch::parse_ratio(t).unwrap())
                .collect::<Vec<_>>()
        );
    }
}
