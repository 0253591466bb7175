//! Samples as a WAV file in memory (16-bit PCM, mono), written with the `hound` crate
//! (REFERENCES §11.5). The caller writes the bytes where it likes.

use std::io::Cursor;

use crate::error::{Error, Result};

/// The bytes of a mono 16-bit WAV file holding `samples` (−1…1) at `sample_rate_hz`.
pub fn wav_bytes(samples: &[f32], sample_rate_hz: u32) -> Result<Vec<u8>> {
    let spec = hound::WavSpec {
        channels: 1,
        sample_rate: sample_rate_hz,
        bits_per_sample: 16,
        sample_format: hound::SampleFormat::Int,
    };
    let failed = |err: hound::Error| Error::input(format!("the WAV file could not be made: {err}"));
    let mut cursor = Cursor::new(Vec::with_capacity(44 + 2 * samples.len()));
    let mut writer = hound::WavWriter::new(&mut cursor, spec).map_err(failed)?;
    {
        let mut samples16 = writer.get_i16_writer(samples.len() as u32);
        for sample in super::render::to_i16(samples) {
            samples16.write_sample(sample);
        }
        samples16.flush().map_err(failed)?;
    }
    writer.finalize().map_err(failed)?;
    Ok(cursor.into_inner())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_wav_reads_back_with_its_rate_and_length() {
        let samples = [0.0f32, 0.5, -0.5, 0.25];
        let bytes = wav_bytes(&samples, 48_000).unwrap();
        let reader = hound::WavReader::new(Cursor::new(bytes)).unwrap();
        assert_eq!(reader.spec().sample_rate, 48_000);
        assert_eq!(reader.spec().channels, 1);
        assert_eq!(reader.len(), 4);
        let read: Vec<i16> = reader.into_samples::<i16>().map(|s| s.unwrap()).collect();
        assert_eq!(read, vec![0, 16384, -16384, 8192]);
    }
}
