//! Transposing every course by one interval: a player's "a fourth down" written as semitones
//! (`-5`), cents (`-498c`), a frequency ratio (`3/4`) or steps of an equal division of the
//! octave (`-8\19`, eight steps of 19-EDO down). Cents are Ellis's (1885): 1200·log₂ of the
//! ratio, so a 12-EDO semitone is 100 cents (REFERENCES §7.3).

use std::str::FromStr;

use serde::Serialize;

use crate::error::{Error, Result};
use crate::tuning::course_pitch::CoursePitch;
use crate::tuning::pitch::nearest_note_name;
use crate::tuning::Tuning;

/// The largest shift accepted either way: four octaves (4800 cents), beyond any conversion a
/// string can follow.
pub const MAX_SHIFT_CENTS: f64 = 4800.0;

/// The forms a shift may be written in, for help texts.
pub const SHIFT_SYNTAX: &str =
    "semitones (`-5`), cents (`-498c`), a ratio (`3/4`) or EDO steps (`-8\\19`: 8 steps of 19-EDO down)";

/// A transposition of every course, as written and as an interval.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Shift {
    /// The shift as written, e.g. `-5` or `3/4`.
    pub written: String,
    /// The interval in cents (negative: down).
    pub cents: f64,
    /// The frequency ratio, 2^(cents/1200).
    pub ratio: f64,
}

fn refuse(text: &str, why: &str) -> Error {
    Error::input(format!("`{text}` is not a transposition: {why}"))
        .help(format!("write {SHIFT_SYNTAX}"))
}

fn number(text: &str, whole: &str) -> Result<f64> {
    let value: f64 = text
        .trim()
        .trim_start_matches('+')
        .parse()
        .map_err(|_| refuse(whole, &format!("`{text}` is not a number")))?;
    if value.is_finite() {
        Ok(value)
    } else {
        Err(refuse(whole, "the number is not finite"))
    }
}

impl FromStr for Shift {
    type Err = Error;

    fn from_str(text: &str) -> Result<Self> {
        let trimmed = text.trim();
        if trimmed.is_empty() {
            return Err(refuse(text, "it is empty"));
        }
        let cents = if let Some(value) = trimmed.strip_suffix('c') {
            number(value, trimmed)?
        } else if let Some((steps, divisions)) = trimmed.split_once('\\') {
            let steps = number(steps, trimmed)?;
            let divisions = number(divisions, trimmed)?;
            if steps.fract() != 0.0 || divisions.fract() != 0.0 || divisions < 1.0 {
                return Err(refuse(
                    trimmed,
                    "EDO steps are a whole number of steps over a whole number of divisions, e.g. `-8\\19`",
                ));
            }
            1200.0 * steps / divisions
        } else if let Some((num, den)) = trimmed.split_once('/') {
            let (num, den) = (number(num, trimmed)?, number(den, trimmed)?);
            if num <= 0.0 || den <= 0.0 {
                return Err(refuse(trimmed, "a ratio's terms must be above 0"));
            }
            1200.0 * (num / den).log2()
        } else {
            100.0 * number(trimmed, trimmed)?
        };
        if !cents.is_finite() || cents.abs() > MAX_SHIFT_CENTS {
            return Err(refuse(
                trimmed,
                &format!("it is more than {MAX_SHIFT_CENTS:.0} cents (four octaves)"),
            ));
        }
        Ok(Shift {
            written: trimmed.to_string(),
            cents,
            ratio: (cents / 1200.0).exp2(),
        })
    }
}

impl Shift {
    /// `pitch` moved by this shift, named after its nearest 12-tone note at `tuning`'s concert
    /// pitch (`B3`, or `B3 -10.5c` off the note): both its `written` form and its label are
    /// that name.
    pub fn apply(&self, pitch: &CoursePitch, tuning: &Tuning) -> CoursePitch {
        let hz = pitch.hz * self.ratio;
        let (note_name, note_offset_cents) = nearest_note_name(hz, tuning.concert_a4_hz());
        let label = if note_offset_cents.abs() < 0.05 {
            note_name.clone()
        } else {
            format!("{note_name} {note_offset_cents:+.1}c")
        };
        CoursePitch {
            written: label.clone(),
            label,
            note_name,
            note_offset_cents,
            hz,
        }
    }

    /// In words, e.g. `-5 (-500.0 cents, ratio 0.7492)`.
    pub fn describe(&self) -> String {
        format!(
            "{} ({:+.1} cents, ratio {:.4})",
            self.written, self.cents, self.ratio
        )
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_form_reads() {
        // A 12-EDO fourth is 500 cents; the just fourth 4/3 is 498.04 cents (Ellis 1885:
        // 1200·log₂(4/3)); 8 steps of 19-EDO are 8·1200/19 = 505.26 cents.
        let cases = [
            ("-5", -500.0),
            ("+7", 700.0),
            ("-498c", -498.0),
            ("3/4", -498.045),
            ("-8\\19", -505.263),
        ];
        for (text, cents) in cases {
            let shift: Shift = text.parse().unwrap();
            assert!(
                (shift.cents - cents).abs() < 1e-3,
                "{text}: {}",
                shift.cents
            );
            assert!((shift.ratio - (cents / 1200.0f64).exp2()).abs() < 1e-6);
        }
    }

    #[test]
    fn nonsense_is_refused() {
        for bad in [
            "", "down", "0/4", "-3/4", "8\\0", "1.5\\19", "5000c", "inf", "49",
        ] {
            assert!(bad.parse::<Shift>().is_err(), "{bad} was accepted");
        }
    }
}
