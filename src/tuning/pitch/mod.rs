//! Pitch addressing: cents, exact ratios, note names and the [`PitchSpec`] syntax.
//!
//! Cents follow A. J. Ellis, "On the Musical Scales of Various Nations", *Journal of the Society
//! of Arts* 33 (1885): 1200 cents make an octave, so an interval of frequency ratio `r` measures
//! `1200 · log2(r)` cents. Note names are scientific pitch notation (C4 is middle C, A4 the
//! concert pitch of ISO 16:1975, 440 Hz by default), placed in 12-tone equal temperament:
//! `f = a4 · 2^((m − 69)/12)` with `m` the MIDI-style note number (A4 = 69).
//!
//! # Pitch syntax
//!
//! | form | example | meaning |
//! |---|---|---|
//! | note name | `E2`, `F#3`, `Bb4`, `C-1` | a 12-tone note at the tuning's concert A4; must land on a degree |
//! | note with offset | `E2+14c`, `A4-3.5c` | that note moved by the cents given; a free pitch |
//! | snapped note | `~E2`, `~C#4+20c` | the degree nearest to the note |
//! | degree | `deg7`, `deg-12` | degree k of the tuning (degree 0 starts period 0) |
//! | degree in a period | `deg3p1`, `deg0p-2` | degree 3 of period 1 (period 0 holds degrees 0 … N−1) |
//! | cents | `386.3c`, `-700c` | cents above (or below) the reference pitch |
//! | ratio | `3/2`, `5/4` | exact frequency ratio to the reference pitch |
//! | frequency | `82.41hz`, `440Hz` | absolute frequency |

use std::fmt;
use std::str::FromStr;

use num_rational::Ratio;
use num_traits::CheckedMul;
use serde::Serialize;

use crate::error::{Error, Result};

mod ratio;
#[allow(unused_imports)]
use ratio::*;
pub use ratio::*;
#[cfg(test)]
mod tests;

/// Concert pitch of ISO 16:1975: A4 = 440 Hz.
pub const ISO_16_A4_HZ: f64 = 440.0;

/// MIDI-style number of A4 (C4 = 60).
const A4_NUMBER: i64 = 69;

/// Parses a finite number, naming what it is for in the error.
pub(crate) fn parse_finite(text: &str, what: &str) -> Result<f64> {
    let trimmed = text.trim();
    let value: f64 = trimmed
        .parse()
        .map_err(|_| Error::input(format!("`{trimmed}` is not a number ({what})")))?;
    if !value.is_finite() {
        return Err(Error::input(format!(
            "`{trimmed}` is not a finite number ({what})"
        )));
    }
    Ok(value)
}

/// A 12-tone note name in scientific pitch notation, e.g. `F#3`.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub struct NoteName {
    letter: char,
    /// Sharps (positive) or flats (negative).
    alteration: i8,
    octave: i32,
}

impl NoteName {
    /// Semitones above C of the same octave, before alteration.
    fn letter_semitones(letter: char) -> i64 {
        match letter {
            'C' => 0,
            'D' => 2,
            'E' => 4,
            'F' => 5,
            'G' => 7,
            'A' => 9,
            _ => 11,
        }
    }

    /// The MIDI-style note number (C4 = 60, A4 = 69); notes outside MIDI's 0–127 keep counting.
    pub fn number(&self) -> i64 {
        (i64::from(self.octave) + 1) * 12
            + Self::letter_semitones(self.letter)
            + i64::from(self.alteration)
    }

    /// Semitones above A4 (negative below).
    pub fn semitones_from_a4(&self) -> i64 {
        self.number() - A4_NUMBER
    }

    /// The 12-tone equal-tempered frequency of this note for a concert A4.
    pub fn hz(&self, concert_a4_hz: f64) -> f64 {
        concert_a4_hz * (self.semitones_from_a4() as f64 / 12.0).exp2()
    }
}

impl fmt::Display for NoteName {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let accidental = match self.alteration {
            2 => "##",
            1 => "#",
            -1 => "b",
            -2 => "bb",
            _ => "",
        };
        write!(f, "{}{accidental}{}", self.letter, self.octave)
    }
}

impl FromStr for NoteName {
    type Err = Error;

    fn from_str(text: &str) -> Result<Self> {
        let mut chars = text.trim().chars().peekable();
        let help = "write a note as letter, optional # or b, octave: `E2`, `F#3`, `Bb4`, `C-1`";
        let letter = match chars.next().map(|c| c.to_ascii_uppercase()) {
            Some(c @ 'A'..='G') => c,
            _ => return Err(Error::input(format!("`{text}` is not a note name")).help(help)),
        };
        let mut alteration: i8 = 0;
        while let Some(&c) = chars.peek() {
            let step = match c {
                '#' | '♯' => 1,
                'b' | '♭' => -1,
                _ => break,
            };
            if alteration != 0 && alteration.signum() != step {
                return Err(Error::input(format!("`{text}` mixes sharps and flats")).help(help));
            }
            alteration += step;
            if alteration.abs() > 2 {
                return Err(
                    Error::input(format!("`{text}` has more than two sharps or flats")).help(help),
                );
            }
            chars.next();
        }
        let octave_text: String = chars.collect();
        let octave: i32 = octave_text.parse().map_err(|_| {
            Error::input(format!("`{text}` has no octave number after the letter")).help(help)
        })?;
        if !(-10..=20).contains(&octave) {
            return Err(Error::input(format!(
                "`{text}`: octave {octave} is outside the audible and sub-audible range taut handles (-10 to 20)"
            )));
        }
        Ok(NoteName {
            letter,
            alteration,
            octave,
        })
    }
}

/// The nearest 12-tone equal-tempered note to a frequency, and the frequency's offset from it in
/// cents (positive: sharp of the note). Sharps name the black keys. For a frequency that is not
/// positive and finite, the name is `?` and the offset NaN.
pub fn nearest_note_name(hz: f64, concert_a4_hz: f64) -> (String, f64) {
    let semitones = 12.0 * (hz / concert_a4_hz).log2();
    if !semitones.is_finite() || semitones.abs() > 1.0e6 {
        return ("?".to_string(), f64::NAN);
    }
    let nearest = semitones.round();
    let offset = (semitones - nearest) * 100.0;
    let number = nearest as i64 + A4_NUMBER;
    const NAMES: [&str; 12] = [
        "C", "C#", "D", "D#", "E", "F", "F#", "G", "G#", "A", "A#", "B",
    ];
    let name = NAMES[number.rem_euclid(12) as usize];
    let octave = number.div_euclid(12) - 1;
    (format!("{name}{octave}"), offset)
}

/// The nearest 12-tone note as [`nearest_note_name`] finds it, spelt as the user wrote it when
/// `spec` is a note on the same key (`Bb4` stays `Bb4`, not `A#4`).
pub fn nearest_note_as_written(spec: &PitchSpec, hz: f64, concert_a4_hz: f64) -> (String, f64) {
    let (name, offset) = nearest_note_name(hz, concert_a4_hz);
    if let PitchSpec::Note { note, .. } = spec {
        let semitones = 12.0 * (hz / concert_a4_hz).log2();
        if semitones.is_finite() && note.semitones_from_a4() == semitones.round() as i64 {
            return (note.to_string(), offset);
        }
    }
    (name, offset)
}

/// A pitch as the user wrote it; resolve it against a tuning with
/// [`crate::tuning::Tuning::resolve`]. See the [module documentation](self) for the syntax.
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(tag = "form", rename_all = "snake_case")]
pub enum PitchSpec {
    /// A 12-tone note name, optionally moved by cents, optionally snapped to the nearest degree.
    Note {
        /// The note.
        note: NoteName,
        /// Cents added to the note (0 when none was written).
        offset_cents: f64,
        /// Whether an offset was written (then the pitch is free and need not land on a degree).
        has_offset: bool,
        /// Whether to use the nearest degree (`~` prefix).
        snap: bool,
    },
    /// A degree counted from degree 0 of the tuning.
    Degree {
        /// The degree (negative below degree 0).
        degree: i64,
    },
    /// A step within a numbered period.
    PeriodStep {
        /// The period (0 holds degrees 0 … N−1).
        period: i64,
        /// The step within the period, 0 … N−1.
        step: i64,
    },
    /// Cents from the reference pitch.
    Cents {
        /// Cents (negative below the reference).
        cents: f64,
    },
    /// An exact ratio to the reference pitch.
    Ratio {
        /// The ratio.
        #[serde(serialize_with = "serialize_ratio")]
        ratio: ExactRatio,
    },
    /// An absolute frequency.
    Hz {
        /// Frequency in hertz.
        hz: f64,
    },
}

/// One-line summary of the pitch syntax, for error help and `--help`.
pub const PITCH_SYNTAX_HELP: &str = "pitches: note `E2`, `F#3`, `Bb4`, `C-1`; note with cents `E2+14c`; nearest degree to a note `~E2`; degree `deg7`, `deg-3`; degree of a period `deg3p1`; cents from the reference `386.3c`; ratio to the reference `3/2`; frequency `82.41hz`";

impl FromStr for PitchSpec {
    type Err = Error;

    fn from_str(text: &str) -> Result<Self> {
        let trimmed = text.trim();
        let lower = trimmed.to_ascii_lowercase();
        let fail = |message: String| Error::input(message).help(PITCH_SYNTAX_HELP);
        if trimmed.is_empty() {
            return Err(fail("the pitch is empty".to_string()));
        }
        if let Some(number) = lower.strip_suffix("hz") {
            let hz = parse_finite(number, "frequency in hertz")?;
            if hz <= 0.0 {
                return Err(fail(format!("`{trimmed}`: a frequency must be above 0 Hz")));
            }
            return Ok(PitchSpec::Hz { hz });
        }
        if let Some(rest) = lower.strip_prefix("deg") {
            let bad = || {
                fail(format!(
                    "`{trimmed}` is not a degree; write `deg7`, `deg-3`, or `deg3p1` for degree 3 of period 1"
                ))
            };
            return match rest.split_once('p') {
                Some((step, period)) => Ok(PitchSpec::PeriodStep {
                    period: period.parse().map_err(|_| bad())?,
                    step: step.parse().map_err(|_| bad())?,
                }),
                None => Ok(PitchSpec::Degree {
                    degree: rest.parse().map_err(|_| bad())?,
                }),
            };
        }
        if trimmed.contains('/') {
            return Ok(PitchSpec::Ratio {
                ratio: parse_ratio(trimmed).map_err(|e| e.help(PITCH_SYNTAX_HELP))?,
            });
        }
        if let Some(number) = lower.strip_suffix('c') {
            if number.starts_with(|c: char| c.is_ascii_digit() || "+-.".contains(c)) {
                return Ok(PitchSpec::Cents {
                    cents: parse_finite(number, "cents")?,
                });
            }
        }
        let (snap, body) = match trimmed.strip_prefix('~') {
            Some(rest) => (true, rest),
            None => (false, trimmed),
        };
        if body.starts_with(|c: char| c.is_ascii_alphabetic()) {
            // The octave may be negative (`C-1`), so the offset's sign is the first + or - after
            // the octave digits begin.
            let octave_start = body
                .char_indices()
                .skip(1)
                .find(|(_, c)| c.is_ascii_digit() || *c == '-')
                .map(|(i, _)| i);
            let split = octave_start.and_then(|start| {
                let after_sign = if body[start..].starts_with('-') {
                    start + 1
                } else {
                    start
                };
                body[after_sign..]
                    .find(['+', '-'])
                    .map(|offset| after_sign + offset)
            });
            let (note_text, offset_text) = match split {
                Some(at) => (&body[..at], Some(&body[at..])),
                None => (body, None),
            };
            let note: NoteName = note_text
                .parse()
                .map_err(|e: Error| e.help(PITCH_SYNTAX_HELP))?;
            let offset_cents = match offset_text {
                Some(offset) => {
                    let number = offset
                        .strip_suffix('c')
                        .or_else(|| offset.strip_suffix('C'))
                        .ok_or_else(|| {
                            fail(format!(
                                "`{trimmed}`: an offset from a note is in cents and ends in `c`, e.g. `E2+14c`"
                            ))
                        })?;
                    parse_finite(number, "cents offset")?
                }
                None => 0.0,
            };
            return Ok(PitchSpec::Note {
                note,
                offset_cents,
                has_offset: offset_text.is_some(),
                snap,
            });
        }
        Err(fail(format!("`{trimmed}` is not a pitch")))
    }
}

impl fmt::Display for PitchSpec {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            PitchSpec::Note {
                note,
                offset_cents,
                has_offset,
                snap,
            } => {
                if *snap {
                    write!(f, "~")?;
                }
                write!(f, "{note}")?;
                if *has_offset {
                    write!(f, "{offset_cents:+}c")?;
                }
                Ok(())
            }
            PitchSpec::Degree { degree } => write!(f, "deg{degree}"),
            PitchSpec::PeriodStep { period, step } => write!(f, "deg{step}p{period}"),
            PitchSpec::Cents { cents } => write!(f, "{cents}c"),
            PitchSpec::Ratio { ratio } => write!(f, "{}", format_ratio(ratio)),
            PitchSpec::Hz { hz } => write!(f, "{hz} Hz"),
        }
    }
}
