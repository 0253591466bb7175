//! A Standard MIDI File (format 0, one track) written by hand (REFERENCES §11.5): the tuning
//! messages at its start, then a sequence of notes or chords.

/// Ticks per quarter note in the files `taut` writes.
pub const TICKS_PER_QUARTER: u16 = 480;

/// The tempo of the files, in microseconds per quarter note (120 quarters a minute).
pub const MICROSECONDS_PER_QUARTER: u32 = 500_000;

/// Ticks of silence after the tuning messages, so a synthesizer has applied them before the
/// first note.
pub const SETTLE_TICKS: u32 = 240;

/// Note-on velocity.
pub const VELOCITY: u8 = 96;

/// A number as a MIDI variable-length quantity (7 bits a byte, high bytes first, every byte but
/// the last with its top bit set).
pub fn variable_length(mut value: u32, out: &mut Vec<u8>) {
    let mut bytes = [0u8; 5];
    let mut count = 0;
    loop {
        bytes[count] = (value & 0x7F) as u8;
        count += 1;
        value >>= 7;
        if value == 0 {
            break;
        }
    }
    for i in (0..count).rev() {
        out.push(if i == 0 { bytes[i] } else { bytes[i] | 0x80 });
    }
}

/// The ticks of `seconds` at the file's tempo (at least one).
pub fn ticks(seconds: f64) -> u32 {
    let per_second = f64::from(TICKS_PER_QUARTER) * 1e6 / f64::from(MICROSECONDS_PER_QUARTER);
    (seconds * per_second)
        .round()
        .clamp(1.0, f64::from(u32::MAX >> 4)) as u32
}

/// A format-0 Standard MIDI File: the tempo, each of `sysex` (complete messages from F0 to F7)
/// at time 0, [`SETTLE_TICKS`] of silence, then each of `steps` (notes sounding together on
/// channel 1) held for `step_ticks`.
pub fn midi_file(sysex: &[Vec<u8>], steps: &[Vec<u8>], step_ticks: u32) -> Vec<u8> {
    let mut track = Vec::new();
    // Tempo: FF 51 03 tttttt.
    track.extend_from_slice(&[0x00, 0xFF, 0x51, 0x03]);
    track.extend_from_slice(&MICROSECONDS_PER_QUARTER.to_be_bytes()[1..]);
    for message in sysex {
        // A system-exclusive event: F0, the length of what follows, the bytes after F0.
        track.push(0x00);
        track.push(0xF0);
        let body = message.get(1..).unwrap_or(&[]);
        variable_length(body.len() as u32, &mut track);
        track.extend_from_slice(body);
    }
    let mut delta = SETTLE_TICKS;
    for step in steps {
        for &note in step {
            variable_length(delta, &mut track);
            delta = 0;
            track.extend_from_slice(&[0x90, note & 0x7F, VELOCITY]);
        }
        delta += step_ticks;
        for &note in step {
            variable_length(delta, &mut track);
            delta = 0;
            track.extend_from_slice(&[0x80, note & 0x7F, 0x40]);
        }
    }
    variable_length(delta, &mut track);
    track.extend_from_slice(&[0xFF, 0x2F, 0x00]);

    let mut out = Vec::with_capacity(22 + track.len());
    out.extend_from_slice(b"MThd");
    out.extend_from_slice(&6u32.to_be_bytes());
    out.extend_from_slice(&0u16.to_be_bytes()); // format 0
    out.extend_from_slice(&1u16.to_be_bytes()); // one track
    out.extend_from_slice(&TICKS_PER_QUARTER.to_be_bytes());
    out.extend_from_slice(b"MTrk");
    out.extend_from_slice(&(track.len() as u32).to_be_bytes());
    out.extend_from_slice(&track);
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn variable_length_quantities() {
        // The Standard MIDI File specification's examples (REFERENCES §11.5).
        for (value, bytes) in [
            (0u32, vec![0x00]),
            (0x40, vec![0x40]),
            (0x7F, vec![0x7F]),
            (0x80, vec![0x81, 0x00]),
            (0x2000, vec![0xC0, 0x00]),
            (0x3FFF, vec![0xFF, 0x7F]),
            (0x4000, vec![0x81, 0x80, 0x00]),
            (0x0FFF_FFFF, vec![0xFF, 0xFF, 0xFF, 0x7F]),
        ] {
            let mut out = Vec::new();
            variable_length(value, &mut out);
            assert_eq!(out, bytes, "{value:#x}");
        }
    }
}
