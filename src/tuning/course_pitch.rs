//! A course's pitch as every report shows it: as written, as the tuning labels it, the nearest
//! 12-tone note and the frequency.

use serde::{Deserialize, Serialize};

use std::str::FromStr;

use crate::error::Result;
use crate::tuning::pitch::{nearest_note_as_written, PitchSpec};
use crate::tuning::Tuning;

/// A course's pitch as written and as resolved in the tuning. Every report carries one, under
/// the same JSON names.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct CoursePitch {
    /// The pitch as written in the instrument file.
    #[serde(rename = "pitch")]
    pub written: String,
    /// The tuning's own label for the pitch (e.g. a degree).
    #[serde(rename = "pitch_label")]
    pub label: String,
    /// The nearest 12-tone note name at the tuning's concert pitch, e.g. `E4`.
    pub note_name: String,
    /// Offset from that note in cents.
    pub note_offset_cents: f64,
    /// The frequency in hertz.
    #[serde(rename = "pitch_hz")]
    pub hz: f64,
}

impl CoursePitch {
    /// Resolves `written` in `tuning` and names the nearest 12-tone note. Errors carry no
    /// location; the caller points them at the file's line.
    pub fn resolve(written: &str, tuning: &Tuning) -> Result<CoursePitch> {
        let spec = PitchSpec::from_str(written)?;
        let resolved = tuning.resolve(&spec)?;
        let (note_name, note_offset_cents) =
            nearest_note_as_written(&spec, resolved.hz, tuning.concert_a4_hz());
        Ok(CoursePitch {
            written: written.to_string(),
            label: resolved.label,
            note_name,
            note_offset_cents,
            hz: resolved.hz,
        })
    }
}
