//! Notes to samples: every partial of every note as a decaying sine, summed, then scaled so the
//! loudest sample sits at [`PEAK`].

use crate::error::{Error, Result};

use super::{Damping, Note, Partial};

/// The loudest sample of a rendering, as a share of full scale (−1 dBFS).
pub const PEAK: f32 = 0.891;

/// Most notes in one rendering.
pub const MAX_NOTES: usize = 512;

/// Longest rendering, in seconds.
pub const MAX_SECONDS: f64 = 600.0;

/// Sample rates a rendering may use, in hertz.
pub const SAMPLE_RATES: [u32; 2] = [44_100, 48_000];

/// Most partial-samples (partials × samples, summed over the notes) one rendering may take:
/// about a few seconds of work, so no accepted request runs for minutes.
pub const MAX_WORK: f64 = 2.0e9;

/// Each note ends with a linear release of this length, in seconds, so it stops without a click.
pub const RELEASE_S: f64 = 0.01;

/// How to render.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct RenderOptions {
    /// Samples per second: one of [`SAMPLE_RATES`].
    pub sample_rate_hz: u32,
    /// The decay of the partials.
    pub damping: Damping,
}

impl Default for RenderOptions {
    fn default() -> Self {
        RenderOptions {
            sample_rate_hz: 44_100,
            damping: Damping::default(),
        }
    }
}

/// The length of a rendering of `notes`: until the last note ends, in seconds.
pub fn length_s(notes: &[Note]) -> f64 {
    notes
        .iter()
        .map(|n| n.start_s + n.duration_s)
        .fold(0.0, f64::max)
}

/// Checks notes and options before any work: the sample rate, the count of notes, every
/// note's timing, pitch, stiffness and pluck position, and the whole length.
pub fn check(notes: &[Note], options: &RenderOptions) -> Result<()> {
    if !SAMPLE_RATES.contains(&options.sample_rate_hz) {
        return Err(Error::input(format!(
            "{} Hz is not a sample rate taut writes",
            options.sample_rate_hz
        ))
        .help("use 44100 or 48000"));
    }
    if notes.is_empty() {
        return Err(Error::input("there is no note to play"));
    }
    if notes.len() > MAX_NOTES {
        return Err(Error::input(format!(
            "{} notes are too many: taut renders at most {MAX_NOTES} in one file",
            notes.len()
        ))
        .help("play fewer strings, degrees or courses"));
    }
    for note in notes {
        let fine = note.start_s.is_finite()
            && note.start_s >= 0.0
            && note.duration_s.is_finite()
            && note.duration_s > 0.0
            && note.pitch_hz.is_finite()
            && note.pitch_hz > 0.0
            && note.inharmonicity.is_finite()
            && note.inharmonicity >= 0.0
            && note.pluck > 0.0
            && note.pluck < 1.0
            && note.gain.is_finite();
        if !fine {
            return Err(Error::input(format!(
                "a note at {} Hz cannot be rendered (start {} s, length {} s, B {}, pluck {})",
                note.pitch_hz, note.start_s, note.duration_s, note.inharmonicity, note.pluck
            )));
        }
    }
    let seconds = length_s(notes);
    if seconds > MAX_SECONDS {
        return Err(Error::input(format!(
            "the sound would last {seconds:.1} s; taut writes at most {MAX_SECONDS} s"
        ))
        .help("shorten each note or play fewer notes"));
    }
    let rate = f64::from(options.sample_rate_hz);
    let work: f64 = notes
        .iter()
        .map(|note| {
            let partials = (super::NYQUIST_SHARE * rate / note.pitch_hz)
                .floor()
                .clamp(0.0, f64::from(super::MAX_PARTIALS));
            partials * note.duration_s * rate
        })
        .sum();
    if work > MAX_WORK {
        return Err(Error::input(format!(
            "{} notes ringing {:.1} s in all are more sound than taut renders in one file              ({:.1e} partial-samples, at most {MAX_WORK:.0e})",
            notes.len(),
            notes.iter().map(|n| n.duration_s).sum::<f64>(),
            work
        ))
        .help("shorten each note or play fewer notes"));
    }
    Ok(())
}

/// Renders `notes` to mono samples at `options.sample_rate_hz`, scaled so the loudest sample is
/// [`PEAK`] (silence stays silence).
///
/// Each partial (from [`super::partials`]) is the imaginary part of a complex oscillator z
/// started at 1 and multiplied every sample by e^((−σ + iω)/f_s): phase step ω/f_s and decay
/// factor e^(−σ/f_s), both precomputed, so a sample costs one complex multiplication per
/// sounding partial and nothing is allocated per sample. Starting at phase 0 of the sine, no
/// note begins with a jump; each ends with a linear release of [`RELEASE_S`].
pub fn render(notes: &[Note], options: &RenderOptions) -> Result<Vec<f32>> {
    check(notes, options)?;
    let rate = f64::from(options.sample_rate_hz);
    let total = (length_s(notes) * rate).ceil() as usize;
    let mut out = vec![0.0f32; total];
    let mut buffer: Vec<Partial> = Vec::with_capacity(super::MAX_PARTIALS as usize);
    let release = ((RELEASE_S * rate).round() as usize).max(1);
    for note in notes {
        let first = ((note.start_s * rate).round() as usize).min(total);
        let count = ((note.duration_s * rate).round() as usize).min(total - first);
        let ring = count.saturating_sub(release);
        super::partials(note, &options.damping, rate, &mut buffer);
        for partial in &buffer {
            add_partial(&mut out[first..first + count], ring, partial, rate);
        }
    }
    let peak = out.iter().fold(0.0f32, |m, s| m.max(s.abs()));
    if peak > 0.0 && peak.is_finite() {
        let scale = PEAK / peak;
        for sample in &mut out {
            *sample *= scale;
        }
    }
    Ok(out)
}

/// Adds one decaying partial to `span`: full level for the first `ring` samples, then a linear
/// release to zero over the rest.
fn add_partial(span: &mut [f32], ring: usize, partial: &Partial, rate: f64) {
    let decay = (-partial.decay_per_s / rate).exp();
    let step = std::f64::consts::TAU * partial.hz / rate;
    let (c, s) = (decay * step.cos(), decay * step.sin());
    let (mut re, mut im) = (1.0f64, 0.0f64);
    let (head, tail) = span.split_at_mut(ring.min(span.len()));
    for sample in head {
        *sample += (partial.amplitude * im) as f32;
        (re, im) = (re * c - im * s, re * s + im * c);
    }
    let length = tail.len() as f64;
    for (k, sample) in tail.iter_mut().enumerate() {
        let envelope = 1.0 - k as f64 / length;
        *sample += (partial.amplitude * im * envelope) as f32;
        (re, im) = (re * c - im * s, re * s + im * c);
    }
}

/// Converts samples in −1…1 to 16-bit integers (clamped, rounded to nearest).
pub fn to_i16(samples: &[f32]) -> Vec<i16> {
    samples
        .iter()
        .map(|s| (s.clamp(-1.0, 1.0) * f32::from(i16::MAX)).round() as i16)
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn note(pitch_hz: f64, start_s: f64, duration_s: f64) -> Note {
        Note {
            start_s,
            duration_s,
            pitch_hz,
            inharmonicity: 0.0,
            pluck: 0.5,
            gain: 1.0,
        }
    }

    #[test]
    fn a_rendering_lasts_until_the_last_note_ends_and_peaks_at_peak() {
        let notes = [note(220.0, 0.0, 0.5), note(330.0, 0.25, 0.5)];
        let samples = render(&notes, &RenderOptions::default()).unwrap();
        assert_eq!(samples.len(), (0.75f64 * 44_100.0).ceil() as usize);
        let peak = samples.iter().fold(0.0f32, |m, s| m.max(s.abs()));
        assert!((peak - PEAK).abs() < 1e-6);
        // Starts at zero (sine phase) and ends at zero (release).
        assert_eq!(samples[0], 0.0);
        assert!(samples.last().unwrap().abs() < 0.01);
    }

    #[test]
    fn bad_notes_and_rates_are_refused() {
        let options = RenderOptions::default();
        assert!(render(&[], &options).is_err());
        assert!(render(&[note(220.0, 0.0, 0.0)], &options).is_err());
        assert!(render(&[note(220.0, 0.0, MAX_SECONDS + 1.0)], &options).is_err());
        assert!(render(&[note(f64::NAN, 0.0, 1.0)], &options).is_err());
        let many = vec![note(220.0, 0.0, 0.1); MAX_NOTES + 1];
        assert!(render(&many, &options).is_err());
        // 512 low notes of 60 s each: within the note count and the length, too much work.
        let heavy = vec![note(50.0, 0.0, 60.0); MAX_NOTES];
        let err = render(&heavy, &options).unwrap_err();
        assert!(err.to_string().contains("partial-samples"), "{err}");
        let odd_rate = RenderOptions {
            sample_rate_hz: 22_050,
            ..options
        };
        assert!(render(&[note(220.0, 0.0, 0.1)], &odd_rate).is_err());
    }

    #[test]
    fn samples_convert_to_sixteen_bits() {
        assert_eq!(
            to_i16(&[0.0, 1.0, -1.0, 2.0, 0.5]),
            vec![0, 32767, -32767, 32767, 16384]
        );
    }
}
