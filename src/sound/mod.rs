//! String sound: the partials of a planned string, and any set of notes rendered to samples.
//!
//! Pure functions in SI units; nothing here reads or writes files. The model, each part with its
//! source:
//!
//! - partial n of a string with ideal frequency f₀ and inharmonicity B sounds at
//!   f_n = n·f₀·√(1 + B·n²) (Fletcher 1964, REFERENCES §5.1);
//! - its amplitude after an ideal pluck at the fraction β of the length goes as sin(nπβ)/n²
//!   (Fletcher & Rossing, REFERENCES §11.1);
//! - it decays as e^(−σt) with σ = b₁ + b₃·ω² (Chaigne & Askenfelt 1994, REFERENCES §11.2).
//!
//! A note is brought to pitch as a player tunes it, by its fundamental: a note asked for at
//! f₁ takes f₀ = f₁/√(1 + B), so its first partial sounds at f₁ and the others run sharp. With
//! B = 0 the same note has ideal harmonic partials n·f₁, for comparison.
//!
//! [`score`] turns a plan and its tuning into notes (a string, a strum, a chord of courses or of
//! degrees, the scale); [`render`] turns notes into samples without allocating per sample:
//! every partial is a complex oscillator advanced by one precomputed multiplication per sample,
//! which carries both its phase step and its decay; [`wav`] encodes samples as a WAV file in
//! memory.

pub mod render;
pub mod score;
pub mod wav;

pub use render::{render, RenderOptions};

/// Most partials rendered per note (fewer when they would pass [`NYQUIST_SHARE`] of the sample
/// rate).
pub const MAX_PARTIALS: u32 = 80;

/// Partials at or above this share of the sample rate are left out, so none folds back.
pub const NYQUIST_SHARE: f64 = 0.45;

/// The frequency-dependent damping of REFERENCES §11.2: σ(ω) = b₁ + b₃·ω².
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Damping {
    /// The frequency-independent decay rate b₁, in 1/s.
    pub b1_per_s: f64,
    /// The coefficient b₃ of ω², in s (so that b₃·ω² is in 1/s).
    pub b3_s: f64,
}

impl Default for Damping {
    /// `taut`'s defaults, b₁ = 0.6 s⁻¹ and b₃ = 4×10⁻⁹ s (REFERENCES §11.2): a fundamental
    /// rings for about 11 s and a partial at 5 kHz for about 1.5 s.
    fn default() -> Self {
        Damping {
            b1_per_s: 0.6,
            b3_s: 4.0e-9,
        }
    }
}

impl Damping {
    /// The decay rate σ = b₁ + b₃·(2πf)² of a partial at `hz`, in 1/s (REFERENCES §11.2).
    pub fn rate_per_s(&self, hz: f64) -> f64 {
        let omega = std::f64::consts::TAU * hz;
        self.b1_per_s + self.b3_s * omega * omega
    }
}

/// One note to render.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Note {
    /// When the note is plucked, in seconds from the start.
    pub start_s: f64,
    /// How long it rings before a short release, in seconds.
    pub duration_s: f64,
    /// The pitch of its fundamental, in hertz (the first partial sounds here).
    pub pitch_hz: f64,
    /// Fletcher's inharmonicity coefficient B (0 for ideal harmonic partials).
    pub inharmonicity: f64,
    /// Where it is plucked, as a fraction β of the vibrating length (0 < β < 1).
    pub pluck: f64,
    /// Relative loudness (1 for every note of an ordinary rendering).
    pub gain: f64,
}

/// One partial of a note.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Partial {
    /// Its number n (1 is the fundamental).
    pub number: u32,
    /// Its frequency in hertz.
    pub hz: f64,
    /// Its initial amplitude, relative (the fundamental of a pluck at the middle has 1).
    pub amplitude: f64,
    /// Its decay rate σ in 1/s.
    pub decay_per_s: f64,
}

/// The frequency of partial `n` of a stiff string with ideal frequency `f0_hz` and
/// inharmonicity `b`: f_n = n·f₀·√(1 + B·n²) (Fletcher 1964, REFERENCES §5.1).
pub fn partial_hz(f0_hz: f64, b: f64, n: u32) -> f64 {
    let n = f64::from(n);
    n * f0_hz * (1.0 + b * n * n).sqrt()
}

/// The ideal frequency f₀ = f₁/√(1 + B) of a string whose fundamental sounds at `pitch_hz`
/// (REFERENCES §5.1: f₁ = f₀·√(1 + B)).
pub fn ideal_f0_hz(pitch_hz: f64, b: f64) -> f64 {
    pitch_hz / (1.0 + b).sqrt()
}

/// The relative amplitude sin(nπβ)/n² of partial `n` after an ideal pluck at the fraction
/// `beta` of the length (Fletcher & Rossing, REFERENCES §11.1).
pub fn pluck_amplitude(n: u32, beta: f64) -> f64 {
    let n = f64::from(n);
    (n * std::f64::consts::PI * beta).sin() / (n * n)
}

/// The partials of `note` below [`NYQUIST_SHARE`] of `sample_rate_hz`, at most
/// [`MAX_PARTIALS`], written into `out` (cleared first). Partials a pluck leaves silent
/// (|amplitude| below 10⁻¹² of the fundamental's scale, e.g. the even ones at β = 1/2) are left
/// out.
pub fn partials(note: &Note, damping: &Damping, sample_rate_hz: f64, out: &mut Vec<Partial>) {
    out.clear();
    let f0 = ideal_f0_hz(note.pitch_hz, note.inharmonicity);
    for n in 1..=MAX_PARTIALS {
        let hz = partial_hz(f0, note.inharmonicity, n);
        if hz >= NYQUIST_SHARE * sample_rate_hz {
            break;
        }
        let amplitude = pluck_amplitude(n, note.pluck) * note.gain;
        if amplitude.abs() < 1e-12 * note.gain.abs() {
            continue;
        }
        out.push(Partial {
            number: n,
            hz,
            amplitude,
            decay_per_s: damping.rate_per_s(hz),
        });
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn fletcher_partials_and_the_tuned_fundamental() {
        // REFERENCES §5.1: with f₀ = f₁/√(1+B), partial 1 sounds at f₁ exactly.
        let b = 1e-3;
        let f0 = ideal_f0_hz(100.0, b);
        assert!((partial_hz(f0, b, 1) - 100.0).abs() < 1e-9);
        // Partial 10: 10·f₀·√(1 + 0.1), by hand.
        let by_hand = 10.0 * 100.0 / 1.001_f64.sqrt() * 1.1_f64.sqrt();
        assert!((partial_hz(f0, b, 10) - by_hand).abs() < 1e-9);
        assert_eq!(partial_hz(50.0, 0.0, 7), 350.0);
    }

    #[test]
    fn a_pluck_at_a_third_silences_every_third_partial() {
        // REFERENCES §11.1: sin(nπ/3) = 0 for n = 3, 6, 9.
        let note = Note {
            start_s: 0.0,
            duration_s: 1.0,
            pitch_hz: 100.0,
            inharmonicity: 0.0,
            pluck: 1.0 / 3.0,
            gain: 1.0,
        };
        let mut out = Vec::new();
        partials(&note, &Damping::default(), 48_000.0, &mut out);
        assert!(out.iter().all(|p| p.number % 3 != 0));
        assert!(out.iter().any(|p| p.number == 4));
        // 100 Hz partials below 0.45 · 48 kHz, at most 80: 1…80 less the 26 multiples of 3.
        assert_eq!(out.len(), 80 - 26);
        // sin(π/3)/1 against sin(2π/3)/4.
        assert!((out[0].amplitude - (3f64).sqrt() / 2.0).abs() < 1e-12);
        assert!((out[1].amplitude - (3f64).sqrt() / 8.0).abs() < 1e-12);
    }

    #[test]
    fn higher_partials_decay_faster() {
        let damping = Damping::default();
        assert!(damping.rate_per_s(5000.0) > damping.rate_per_s(100.0));
        // T60 = ln(1000)/σ: about 11 s at low frequency, as REFERENCES §11.2 states.
        let t60 = 1000f64.ln() / damping.rate_per_s(50.0);
        assert!((10.0..12.0).contains(&t60), "{t60}");
    }
}
