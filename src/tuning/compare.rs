//! Two tunings side by side: for each degree of the first, the nearest degree of the second and
//! the difference between them in cents (absolute pitch, so references count).

use serde::Serialize;

use super::listing::check_range;
use super::{Tuning, TuningSummary};
use crate::error::Result;
use crate::tuning::pitch::cents;

/// One degree of the first tuning against the nearest of the second.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ComparedDegree {
    /// Degree of the first tuning.
    pub left_degree: i64,
    /// Its frequency in hertz.
    pub left_hz: f64,
    /// Its cents from the first tuning's reference.
    pub left_cents: f64,
    /// Nearest degree of the second tuning.
    pub right_degree: i64,
    /// Its frequency in hertz.
    pub right_hz: f64,
    /// Second minus first, in cents.
    pub difference_cents: f64,
}

/// A comparison of two tunings.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Comparison {
    /// The first tuning.
    pub left: TuningSummary,
    /// The second tuning.
    pub right: TuningSummary,
    /// One row per degree of the first tuning in the range.
    pub rows: Vec<ComparedDegree>,
    /// Mean of the absolute differences, in cents.
    pub mean_abs_difference_cents: f64,
    /// Largest absolute difference, in cents.
    pub max_abs_difference_cents: f64,
}

/// Compares degrees `from ..= to` of `left` with the nearest degrees of `right`.
pub fn compare(left: &Tuning, right: &Tuning, from: i64, to: i64) -> Result<Comparison> {
    check_range(from, to)?;
    let mut rows = Vec::new();
    for k in from..=to {
        let pitch = left.degree(k)?;
        let Some(nearest) = right.nearest_degree(pitch.hz) else {
            continue;
        };
        rows.push(ComparedDegree {
            left_degree: k,
            left_hz: pitch.hz,
            left_cents: pitch.cents_from_reference,
            right_degree: nearest.degree,
            right_hz: nearest.hz,
            difference_cents: cents(nearest.hz / pitch.hz),
        });
    }
    let differences: Vec<f64> = rows.iter().map(|r| r.difference_cents.abs()).collect();
    Ok(Comparison {
        left: left.summary(),
        right: right.summary(),
        mean_abs_difference_cents: if differences.is_empty() {
            0.0
        } else {
            differences.iter().sum::<f64>() / differences.len() as f64
        },
        max_abs_difference_cents: differences.iter().copied().fold(0.0, f64::max),
        rows,
    })
}
