//! A tuning's degrees over a range, as plain rows for reports.

use serde::Serialize;

use super::{Tuning, TuningSummary};
use crate::error::{Error, Result};
use crate::tuning::pitch::{nearest_note_name, serialize_optional_ratio, ExactRatio};

/// Most rows one listing may hold: the default range (one period and its closing degree) of the
/// largest tuning taut accepts, so that every accepted tuning lists without options.
pub const MAX_ROWS: u64 = super::MAX_DEGREES_PER_PERIOD as u64 + 1;

/// One degree in a listing.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct DegreeRow {
    /// The degree.
    pub degree: i64,
    /// Cents from the reference pitch.
    pub cents_from_reference: f64,
    /// Cents above the degree below, when that degree exists.
    pub step_cents: Option<f64>,
    /// Exact ratio to the reference, when known.
    #[serde(serialize_with = "serialize_optional_ratio")]
    pub ratio: Option<ExactRatio>,
    /// Frequency in hertz.
    pub hz: f64,
    /// Nearest 12-tone equal-tempered note at the tuning's concert A4.
    pub nearest_note: String,
    /// Offset from that note in cents.
    pub note_offset_cents: f64,
}

/// A listing of degrees.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct DegreeListing {
    /// The tuning listed.
    pub tuning: TuningSummary,
    /// One row per degree, ascending.
    pub rows: Vec<DegreeRow>,
}

/// The default range: one period from degree 0 including its closing degree, or the whole list.
pub fn default_range(tuning: &Tuning) -> (i64, i64) {
    match (tuning.degrees_per_period(), tuning.degree_bounds()) {
        (Some(n), _) => (0, n as i64),
        (None, Some(bounds)) => bounds,
        (None, None) => (0, 0),
    }
}

/// Checks a requested range of degrees: ascending and at most [`MAX_ROWS`] long.
pub fn check_range(from: i64, to: i64) -> Result<()> {
    if to < from {
        return Err(Error::input(format!(
            "the range runs backwards: from degree {from} to degree {to}"
        ))
        .field("--to"));
    }
    let rows = (i128::from(to) - i128::from(from) + 1) as u128;
    if rows > u128::from(MAX_ROWS) {
        return Err(Error::input(format!(
            "{rows} degrees are too many to list: at most {MAX_ROWS}"
        ))
        .field("--to"));
    }
    Ok(())
}

/// Lists degrees `from ..= to` of a tuning.
pub fn list(tuning: &Tuning, from: i64, to: i64) -> Result<DegreeListing> {
    check_range(from, to)?;
    let mut rows = Vec::new();
    let mut previous = from.checked_sub(1).and_then(|k| tuning.degree(k).ok());
    for k in from..=to {
        let pitch = tuning.degree(k)?;
        let (nearest_note, note_offset_cents) = nearest_note_name(pitch.hz, tuning.concert_a4_hz());
        rows.push(DegreeRow {
            degree: k,
            cents_from_reference: pitch.cents_from_reference,
            step_cents: previous
                .as_ref()
                .map(|p| pitch.cents_from_reference - p.cents_from_reference),
            ratio: pitch.ratio,
            hz: pitch.hz,
            nearest_note,
            note_offset_cents,
        });
        previous = Some(pitch);
    }
    Ok(DegreeListing {
        tuning: tuning.summary(),
        rows,
    })
}
