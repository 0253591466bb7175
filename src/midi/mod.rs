//! Tunings out to synthesizers through the MIDI Tuning Standard (REFERENCES §11.4), and Standard
//! MIDI Files that play a tuning in tune (REFERENCES §11.5).
//!
//! Which MIDI note carries which degree ([`place`]): the tuning's reference degree sits on one
//! note, the *anchor* (by default the 12-EDO note nearest the reference frequency, A4 = note 69
//! at 440 Hz), and consecutive notes carry consecutive degrees: note n carries degree
//! `reference + (n − anchor)`. So 12-EDO at A4 = 440 Hz maps every note to its usual pitch, and
//! 31-EDO puts 31 notes in each octave of pitch. Degrees are chosen either by the caller (a
//! range that must fit on the 128 notes and in the standard's range of pitch) or, by default,
//! every note whose degree exists and whose pitch the standard can express; the other notes keep
//! their 12-EDO pitch in a bulk dump and are left alone by single-note changes.
//!
//! Pure functions that return bytes; nothing here writes files.

pub mod mts;
pub mod smf;

use serde::Serialize;

use crate::error::{Error, Result};
use crate::tuning::Tuning;

/// MIDI notes: 0 … 127.
pub const NOTES: usize = 128;

/// One MIDI note carrying a degree of the tuning.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Placement {
    /// The MIDI note number (0 … 127).
    pub note: u8,
    /// The tuning's degree it carries.
    pub degree: i64,
    /// The degree's frequency in hertz.
    pub hz: f64,
    /// The frequency data sent for it (xx yy zz).
    pub data: [u8; 3],
    /// The frequency those bytes stand for, in hertz (within 0.0031 cents of `hz`).
    pub sent_hz: f64,
}

/// A tuning laid on the MIDI keyboard.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Keyboard {
    /// The tuning's name.
    pub tuning: String,
    /// The reference degree.
    pub reference_degree: i64,
    /// The note that carries the reference degree (may lie outside 0 … 127 when a range of
    /// degrees was asked for).
    pub anchor_note: i64,
    /// The notes that carry a degree, ascending.
    pub placements: Vec<Placement>,
}

/// How to place a tuning on the keyboard.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub struct PlaceOptions {
    /// The note that carries the reference degree; `None`: the 12-EDO note nearest the
    /// reference frequency.
    pub anchor_note: Option<i64>,
    /// The first and last degree to place; `None`: every note whose degree exists and fits.
    pub degrees: Option<(i64, i64)>,
}

/// Lays `tuning` (at its reference pitch) on the 128 MIDI notes; see the module's text for the
/// rule. Errors: a range of degrees wider than 128 notes, a degree that would fall off the
/// keyboard, a degree the tuning lacks, a pitch outside the standard's range, or (by default)
/// no note at all that fits.
pub fn place(tuning: &Tuning, options: &PlaceOptions) -> Result<Keyboard> {
    let reference = tuning.reference();
    let anchor = match options.anchor_note {
        Some(note) => note,
        None => mts::note_number(reference.hz).round().clamp(0.0, 127.0) as i64,
    };
    let degree_of = |note: i64| reference.degree + (note - anchor);
    let mut placements = Vec::new();
    match options.degrees {
        Some((low, high)) => {
            if high < low {
                return Err(Error::input(format!(
                    "the range {low}..{high} is empty: its end is below its start"
                )));
            }
            let count = (high as i128) - (low as i128) + 1;
            if count > NOTES as i128 {
                return Err(Error::input(format!(
                    "degrees {low} to {high} are {count} degrees, more than the 128 MIDI notes"
                ))
                .help("choose at most 128 degrees"));
            }
            for degree in low..=high {
                let note = anchor + (degree - reference.degree);
                if !(0..NOTES as i64).contains(&note) {
                    return Err(Error::input(format!(
                        "degree {degree} would fall on MIDI note {note}, outside 0 to 127"
                    ))
                    .help("move the anchor note, or choose degrees nearer the reference"));
                }
                let hz = tuning.degree(degree)?.hz;
                let data = mts::frequency_data(hz).map_err(|e| {
                    e.help(format!(
                        "degree {degree} cannot be sent; choose degrees within the range"
                    ))
                })?;
                placements.push(placement(note, degree, hz, data));
            }
        }
        None => {
            if !(0..NOTES as i64).contains(&anchor) {
                return Err(Error::input(format!(
                    "MIDI note {anchor} is not a note: notes are 0 to 127"
                )));
            }
            for note in 0..NOTES as i64 {
                let degree = degree_of(note);
                let Ok(pitch) = tuning.degree(degree) else {
                    continue;
                };
                if let Ok(data) = mts::frequency_data(pitch.hz) {
                    placements.push(placement(note, degree, pitch.hz, data));
                }
            }
            if placements.is_empty() {
                return Err(Error::input(format!(
                    "no degree of `{}` fits on the MIDI notes within the standard's range of pitch",
                    tuning.name()
                )));
            }
        }
    }
    Ok(Keyboard {
        tuning: tuning.name().to_string(),
        reference_degree: reference.degree,
        anchor_note: anchor,
        placements,
    })
}

fn placement(note: i64, degree: i64, hz: f64, data: [u8; 3]) -> Placement {
    Placement {
        note: note as u8,
        degree,
        hz,
        data,
        sent_hz: mts::data_hz(data).unwrap_or(hz),
    }
}

impl Keyboard {
    /// The frequency data of all 128 notes for a bulk dump: a placed note's degree, any other
    /// note its own 12-EDO pitch (xx 00 00).
    pub fn bulk_data(&self) -> [[u8; 3]; NOTES] {
        let mut data: [[u8; 3]; NOTES] = std::array::from_fn(|note| [note as u8, 0, 0]);
        for p in &self.placements {
            data[usize::from(p.note)] = p.data;
        }
        data
    }

    /// The note carrying `degree`, if any.
    pub fn note_of(&self, degree: i64) -> Option<u8> {
        self.placements
            .iter()
            .find(|p| p.degree == degree)
            .map(|p| p.note)
    }

    /// A bulk tuning dump of the keyboard (REFERENCES §11.4).
    pub fn bulk_dump(&self, device: u8, program: u8) -> Vec<u8> {
        mts::bulk_dump(device, program, &self.tuning, &self.bulk_data())
    }

    /// Real-time single-note tuning changes for every placed note (one message per 127 notes).
    pub fn note_changes(&self, device: u8, program: u8) -> Vec<Vec<u8>> {
        let changes: Vec<(u8, [u8; 3])> =
            self.placements.iter().map(|p| (p.note, p.data)).collect();
        mts::note_changes(device, program, &changes)
    }

    /// The degrees of one period upward from the reference degree (twelve for a frequency
    /// list), those the keyboard carries.
    pub fn scale_degrees(&self, tuning: &Tuning) -> Vec<i64> {
        let count = tuning.degrees_per_period().unwrap_or(12) as i64;
        let first = self.reference_degree;
        (first..=first.saturating_add(count))
            .filter(|&k| self.note_of(k).is_some())
            .collect()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn twelve_edo_at_a440_keeps_every_note_where_it_is() {
        let tuning = crate::tuning::load("12edo").unwrap();
        let keyboard = place(&tuning, &PlaceOptions::default()).unwrap();
        assert_eq!(keyboard.anchor_note, 69);
        assert_eq!(keyboard.placements.len(), 128);
        for p in &keyboard.placements {
            assert_eq!(p.data, [p.note, 0, 0], "note {}", p.note);
            assert_eq!(p.degree, i64::from(p.note) - 69);
        }
    }
}
