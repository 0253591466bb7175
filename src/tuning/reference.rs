//! Where a tuning sits in absolute pitch: which degree sounds at which frequency, and the concert
//! A4 that note names use.
//!
//! By default degree 0 is A4 at 440 Hz (ISO 16:1975). When the reference is written as a note
//! (`A4=415`, `C4=256`), concert A4 follows from it by 12-tone equal temperament; otherwise
//! concert A4 stays at 440 Hz.

use serde::{Deserialize, Serialize};

use super::interval::FiniteNumber;
use crate::error::{Error, Result};
use crate::input::units::{short_number, FREQUENCY_BOUNDS};
use crate::tuning::pitch::{parse_finite, NoteName, ISO_16_A4_HZ};

/// A resolved reference.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Reference {
    /// The degree that sounds at `hz`.
    pub degree: i64,
    /// Its frequency in hertz.
    pub hz: f64,
    /// Concert A4 for note names, in hertz.
    pub concert_a4_hz: f64,
}

impl Default for Reference {
    fn default() -> Self {
        Reference {
            degree: 0,
            hz: ISO_16_A4_HZ,
            concert_a4_hz: ISO_16_A4_HZ,
        }
    }
}

/// A reference as written: any of degree, note and frequency (at least a note or a frequency).
#[derive(Debug, Clone, PartialEq, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct ReferenceSpec {
    /// The degree the reference names (default 0).
    #[serde(default)]
    pub degree: i64,
    /// The note that degree is, in scientific pitch notation.
    #[serde(default, deserialize_with = "note_from_text")]
    pub note: Option<NoteName>,
    /// The frequency of that degree, in hertz.
    #[serde(default, deserialize_with = "hz_from_number")]
    pub hz: Option<f64>,
}

fn note_from_text<'de, D: serde::Deserializer<'de>>(
    deserializer: D,
) -> std::result::Result<Option<NoteName>, D::Error> {
    let text = String::deserialize(deserializer)?;
    text.parse().map(Some).map_err(serde::de::Error::custom)
}

fn hz_from_number<'de, D: serde::Deserializer<'de>>(
    deserializer: D,
) -> std::result::Result<Option<f64>, D::Error> {
    let FiniteNumber(hz) = FiniteNumber::deserialize(deserializer)?;
    check_hz(hz).map(Some).map_err(serde::de::Error::custom)
}

fn check_hz(hz: f64) -> Result<f64> {
    if hz <= 0.0 || !hz.is_finite() {
        return Err(Error::input(format!(
            "{hz} Hz is not a frequency: it must be above 0 Hz"
        )));
    }
    FREQUENCY_BOUNDS.check(hz)
}

/// A placed reference must put both its degree and concert A4 at real pitches (`C-10=440`
/// would put A4 at 450 kHz).
fn check_reference(reference: Reference) -> Result<Reference> {
    FREQUENCY_BOUNDS.check(reference.hz)?;
    FREQUENCY_BOUNDS
        .check(reference.concert_a4_hz)
        .map_err(|_| {
            Error::input(format!(
            "this reference puts concert A4 at {} Hz, outside the range taut accepts for {}: {}",
            short_number(reference.concert_a4_hz),
            FREQUENCY_BOUNDS.what,
            FREQUENCY_BOUNDS.shown
        ))
        })?;
    Ok(reference)
}

/// How to write a reference after `@`, for error help.
pub const REFERENCE_SYNTAX_HELP: &str =
    "write a reference as `A4=415` (note at Hz), `C4` (note at concert A4 = 440 Hz), `261.6256` (degree 0 at Hz), or prefix a degree: `deg9=A4=440`";

impl ReferenceSpec {
    /// Parses the inline form: `[deg<k>=]<note>[=<hz>]` or `[deg<k>=]<hz>`.
    pub fn parse(text: &str) -> Result<Self> {
        let mut parts: Vec<&str> = text.split('=').map(str::trim).collect();
        let mut degree = 0;
        if let Some(first) = parts.first() {
            if let Some(k) = first.to_ascii_lowercase().strip_prefix("deg") {
                degree = k.parse().map_err(|_| {
                    Error::input(format!("`{first}` is not a degree")).help(REFERENCE_SYNTAX_HELP)
                })?;
                parts.remove(0);
            }
        }
        let number = |t: &str| -> Result<f64> {
            let lower = t.to_ascii_lowercase();
            let digits = lower.strip_suffix("hz").unwrap_or(&lower);
            check_hz(parse_finite(digits, "reference frequency")?)
        };
        let (note, hz) = match parts.as_slice() {
            [single] if single.starts_with(|c: char| c.is_ascii_digit() || c == '.') => {
                (None, Some(number(single)?))
            }
            [note] => (Some(note.parse::<NoteName>()?), None),
            [note, hz] => (Some(note.parse::<NoteName>()?), Some(number(hz)?)),
            _ => {
                return Err(Error::input(format!("`{text}` is not a reference"))
                    .help(REFERENCE_SYNTAX_HELP))
            }
        };
        Ok(ReferenceSpec { degree, note, hz })
    }

    /// Turns the written reference into degree, frequency and concert A4.
    pub fn resolve(&self) -> Result<Reference> {
        let reference = match (self.note, self.hz) {
            (Some(note), Some(hz)) => Ok::<_, Error>(Reference {
                degree: self.degree,
                hz,
                concert_a4_hz: hz / note.hz(1.0),
            }),
            (Some(note), None) => Ok(Reference {
                degree: self.degree,
                hz: note.hz(ISO_16_A4_HZ),
                concert_a4_hz: ISO_16_A4_HZ,
            }),
            (None, Some(hz)) => Ok(Reference {
                degree: self.degree,
                hz,
                concert_a4_hz: ISO_16_A4_HZ,
            }),
            (None, None) => Err(
                Error::input("the reference needs a note, a frequency, or both")
                    .field("reference")
                    .help("e.g. `reference: {degree: 0, note: A4, hz: 415}`"),
            ),
        }?;
        check_reference(reference)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_abs_diff_eq;

    #[test]
    fn a_note_reference_moves_concert_a4() {
        let reference = ReferenceSpec::parse("A4=415").unwrap().resolve().unwrap();
        assert_abs_diff_eq!(reference.concert_a4_hz, 415.0, epsilon = 1e-9);
        // C4 = 256 Hz puts A4 nine equal semitones higher: 256 · 2^(9/12) (REFERENCES §7.2 formula).
        let reference = ReferenceSpec::parse("deg2=C4=256")
            .unwrap()
            .resolve()
            .unwrap();
        assert_eq!(reference.degree, 2);
        assert_abs_diff_eq!(
            reference.concert_a4_hz,
            256.0 * 2f64.powf(9.0 / 12.0),
            epsilon = 1e-9
        );
    }

    #[test]
    fn a_frequency_reference_keeps_iso_16_concert_pitch() {
        let reference = ReferenceSpec::parse("261.6256").unwrap().resolve().unwrap();
        assert_eq!(reference.hz, 261.6256);
        assert_eq!(reference.concert_a4_hz, 440.0);
        let reference = ReferenceSpec::parse("E2").unwrap().resolve().unwrap();
        assert_abs_diff_eq!(reference.hz, 82.4069, epsilon = 5e-5);
    }

    #[test]
    fn bad_references_are_refused() {
        for bad in ["", "A4=0", "A4=-3", "A4=x", "degx=A4", "A4=440=3", "H4"] {
            assert!(
                ReferenceSpec::parse(bad).and_then(|r| r.resolve()).is_err(),
                "{bad}"
            );
        }
    }
}
