//! The bytes of the MIDI Tuning Standard (REFERENCES §11.4): frequency data, the bulk tuning
//! dump with its checksum, and the real-time single-note tuning change.

use crate::error::{Error, Result};

/// Frequency data meaning "no change" (7F 7F 7F).
pub const NO_CHANGE: [u8; 3] = [0x7F, 0x7F, 0x7F];

/// Units of frequency data per semitone: a 14-bit fraction of 100 cents.
pub const UNITS_PER_SEMITONE: i64 = 1 << 14;

/// The largest frequency data value in units: 7F 7F 7E (7F 7F 7F is reserved).
const MAX_UNITS: i64 = 127 * UNITS_PER_SEMITONE + UNITS_PER_SEMITONE - 2;

/// The lowest frequency the standard expresses: MIDI note 0, 440·2^(−69/12) Hz
/// (REFERENCES §11.4, §7.2).
pub fn lowest_hz() -> f64 {
    440.0 * 2f64.powf(-69.0 / 12.0)
}

/// The highest frequency the standard expresses: 7F 7F 7E, about 13289.66 Hz.
pub fn highest_hz() -> f64 {
    note_hz(MAX_UNITS as f64 / UNITS_PER_SEMITONE as f64)
}

/// The fractional MIDI note number m = 69 + 12·log₂(f/440) of a frequency (REFERENCES §11.4).
pub fn note_number(hz: f64) -> f64 {
    69.0 + 12.0 * (hz / 440.0).log2()
}

/// The frequency of a fractional MIDI note number: 440·2^((m − 69)/12) Hz (REFERENCES §7.2).
pub fn note_hz(m: f64) -> f64 {
    440.0 * 2f64.powf((m - 69.0) / 12.0)
}

/// The frequency data (xx yy zz) of `hz`: xx the 12-EDO semitone at or below it, yy zz the
/// fraction of 100 cents above xx in units of 100/16384 cents, high 7 bits first, rounded to
/// the nearest unit (REFERENCES §11.4). Errors outside [`lowest_hz`] … [`highest_hz`].
pub fn frequency_data(hz: f64) -> Result<[u8; 3]> {
    let units = (note_number(hz) * UNITS_PER_SEMITONE as f64).round();
    if !hz.is_finite() || hz <= 0.0 || units < 0.0 || units > MAX_UNITS as f64 {
        return Err(Error::input(format!(
            "{} Hz lies outside the MIDI Tuning Standard's range, {:.4} Hz (MIDI note 0) to \
             {:.2} Hz",
            crate::input::units::short_number(hz),
            lowest_hz(),
            highest_hz()
        )));
    }
    let units = units as i64;
    let semitone = units / UNITS_PER_SEMITONE;
    let fraction = units % UNITS_PER_SEMITONE;
    Ok([
        semitone as u8,
        (fraction >> 7) as u8,
        (fraction & 0x7F) as u8,
    ])
}

/// The frequency three bytes of frequency data stand for, or `None` for "no change" and for
/// bytes that are not 7-bit.
pub fn data_hz(data: [u8; 3]) -> Option<f64> {
    if data == NO_CHANGE || data.iter().any(|&b| b > 0x7F) {
        return None;
    }
    let units =
        i64::from(data[0]) * UNITS_PER_SEMITONE + (i64::from(data[1]) << 7) + i64::from(data[2]);
    Some(note_hz(units as f64 / UNITS_PER_SEMITONE as f64))
}

/// The checksum of a bulk tuning dump: the exclusive-or of `bytes` (every byte from 7E to the
/// last data byte), masked to 7 bits (REFERENCES §11.4).
pub fn checksum(bytes: &[u8]) -> u8 {
    bytes.iter().fold(0u8, |sum, b| sum ^ b) & 0x7F
}

/// The name of a tuning program as the 16 ASCII characters a bulk dump carries: printable
/// ASCII kept, anything else a `?`, cut or padded with spaces.
pub fn program_name(name: &str) -> [u8; 16] {
    let mut out = [b' '; 16];
    for (slot, c) in out.iter_mut().zip(name.chars()) {
        *slot = if c.is_ascii_graphic() || c == ' ' {
            c as u8
        } else {
            b'?'
        };
    }
    out
}

/// A bulk tuning dump (non-real-time): `F0 7E device 08 01 program name[16] (xx yy zz)×128
/// checksum F7`, 408 bytes (REFERENCES §11.4). `device` and `program` are masked to 7 bits.
pub fn bulk_dump(device: u8, program: u8, name: &str, data: &[[u8; 3]; 128]) -> Vec<u8> {
    let mut out = Vec::with_capacity(408);
    out.extend_from_slice(&[0xF0, 0x7E, device & 0x7F, 0x08, 0x01, program & 0x7F]);
    out.extend_from_slice(&program_name(name));
    for entry in data {
        out.extend_from_slice(entry);
    }
    let sum = checksum(&out[1..]);
    out.push(sum);
    out.push(0xF7);
    out
}

/// Most changes in one single-note tuning change message (its count is one 7-bit byte).
pub const MAX_CHANGES_PER_MESSAGE: usize = 127;

/// Real-time single-note tuning changes, `F0 7F device 08 02 program count (note xx yy zz)×count
/// F7` (REFERENCES §11.4): one message per [`MAX_CHANGES_PER_MESSAGE`] changes, each message a
/// `Vec` of its own.
pub fn note_changes(device: u8, program: u8, changes: &[(u8, [u8; 3])]) -> Vec<Vec<u8>> {
    changes
        .chunks(MAX_CHANGES_PER_MESSAGE)
        .map(|chunk| {
            let mut out = Vec::with_capacity(8 + 4 * chunk.len());
            out.extend_from_slice(&[
                0xF0,
                0x7F,
                device & 0x7F,
                0x08,
                0x02,
                program & 0x7F,
                chunk.len() as u8,
            ]);
            for (note, data) in chunk {
                out.push(note & 0x7F);
                out.extend_from_slice(data);
            }
            out.push(0xF7);
            out
        })
        .collect()
}
