//! The rendered sound of a planned string, measured back with an FFT of the WAV file.
//!
//! Outside checks: Fletcher's stiff-string partials f_n = n·f₀·√(1+B·n²) (REFERENCES §5.1), with
//! the string brought to pitch by its fundamental, f₀ = f₁/√(1+B); the ideal pluck's partial
//! amplitudes sin(nπβ)/n², which vanish for even n at β = 1/2 (REFERENCES §11.1).

use std::path::Path;

use rustfft::{num_complex::Complex, FftPlanner};

use crate::common::{number, taut, write_file};

/// One plain steel string, G3 on 500 mm at about 70 N: stiff enough that its 8th partial runs
/// about 28 cents sharp.
const ONE_STRING: &str = "\
name: One plain steel string
description: A test instrument with a single plain steel string.
tuning: 12edo
scale_length: 500mm
defaults:
  tension: {target: 70N}
  kinds: [plain-steel]
courses:
  - {course: 1, pitch: G3}
";

const RATE: u32 = 48_000;

/// Renders the one string with `extra` options; returns (pitch in Hz, the plan's B, samples).
fn render(dir: &Path, name: &str, extra: &[&str]) -> (f64, f64, Vec<f64>) {
    let instrument = write_file(dir, "one.yaml", ONE_STRING);
    let wav = dir.join(format!("{name}.wav"));
    let report = dir.join(format!("{name}.json"));
    let output = taut()
        .arg("plan")
        .arg(&instrument)
        .args(["--format", "json", "-o"])
        .arg(&report)
        .arg("--sound")
        .arg(&wav)
        .args([
            "--play",
            "courses:1",
            "--seconds",
            "3",
            "--sample-rate",
            "48000",
        ])
        .args(extra)
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    let plan: serde_json::Value =
        serde_json::from_str(&std::fs::read_to_string(&report).unwrap()).unwrap();
    let string = &plan["courses"][0]["strings"][0];
    let pitch = number(&string["pitch_hz"]);
    let b = number(&string["inharmonicity"]);
    let reader = hound::WavReader::open(&wav).unwrap();
    assert_eq!(reader.spec().sample_rate, RATE);
    assert_eq!(reader.spec().channels, 1);
    assert_eq!(reader.spec().bits_per_sample, 16);
    assert_eq!(reader.len(), 3 * RATE);
    let samples = reader
        .into_samples::<i16>()
        .map(|s| f64::from(s.unwrap()) / 32768.0)
        .collect();
    (pitch, b, samples)
}

/// The magnitude spectrum of the first 2^17 samples (2.73 s, before the note's release),
/// Hann-windowed and zero-padded four times; returns (magnitudes, Hz per bin).
fn spectrum(samples: &[f64]) -> (Vec<f64>, f64) {
    let taken = 1 << 17;
    let size = taken * 4;
    let mut buffer: Vec<Complex<f64>> = (0..size)
        .map(|i| {
            if i < taken {
                let w = 0.5 - 0.5 * (std::f64::consts::TAU * i as f64 / taken as f64).cos();
                Complex::new(samples[i] * w, 0.0)
            } else {
                Complex::new(0.0, 0.0)
            }
        })
        .collect();
    FftPlanner::new()
        .plan_fft_forward(size)
        .process(&mut buffer);
    let magnitudes = buffer[..size / 2].iter().map(|c| c.norm()).collect();
    (magnitudes, f64::from(RATE) / size as f64)
}

/// The strongest peak within `width` Hz of `near`: (frequency by parabolic interpolation of the
/// log magnitude, magnitude at the peak bin).
fn peak(magnitudes: &[f64], bin_hz: f64, near: f64, width: f64) -> (f64, f64) {
    let low = ((near - width) / bin_hz).floor() as usize;
    let high = ((near + width) / bin_hz).ceil() as usize;
    let k = (low..=high)
        .max_by(|&a, &b| magnitudes[a].total_cmp(&magnitudes[b]))
        .unwrap();
    let (a, b, c) = (
        magnitudes[k - 1].ln(),
        magnitudes[k].ln(),
        magnitudes[k + 1].ln(),
    );
    let offset = 0.5 * (a - c) / (a - 2.0 * b + c);
    ((k as f64 + offset) * bin_hz, magnitudes[k])
}

fn cents(measured: f64, expected: f64) -> f64 {
    1200.0 * (measured / expected).log2()
}

/// B from measured partials by least squares on (f_n/n)² = f₀² + f₀²·B·n² (REFERENCES §5.1).
fn fitted_b(partials: &[(u32, f64)]) -> f64 {
    let points: Vec<(f64, f64)> = partials
        .iter()
        .map(|&(n, f)| {
            let n = f64::from(n);
            (n * n, (f / n).powi(2))
        })
        .collect();
    let count = points.len() as f64;
    let mean_x = points.iter().map(|p| p.0).sum::<f64>() / count;
    let mean_y = points.iter().map(|p| p.1).sum::<f64>() / count;
    let slope = points
        .iter()
        .map(|p| (p.0 - mean_x) * (p.1 - mean_y))
        .sum::<f64>()
        / points.iter().map(|p| (p.0 - mean_x).powi(2)).sum::<f64>();
    let intercept = mean_y - slope * mean_x;
    slope / intercept
}

/// Measures the first 8 partials near the frequencies `expected(n)`.
fn measure(samples: &[f64], expected: impl Fn(u32) -> f64, spacing: f64) -> Vec<(u32, f64)> {
    let (magnitudes, bin_hz) = spectrum(samples);
    (1..=8)
        .map(|n| (n, peak(&magnitudes, bin_hz, expected(n), spacing / 4.0).0))
        .collect()
}

#[test]
fn the_first_eight_partials_sit_at_fletchers_frequencies_and_give_back_b() {
    let dir = tempfile::tempdir().unwrap();
    let (pitch, b, samples) = render(dir.path(), "stiff", &[]);
    assert!(b > 1e-4, "the test string should be stiff, B = {b}");
    // Fletcher (REFERENCES §5.1), tuned by the fundamental.
    let f0 = pitch / (1.0 + b).sqrt();
    let fletcher = |n: u32| {
        let n = f64::from(n);
        n * f0 * (1.0 + b * n * n).sqrt()
    };
    let measured = measure(&samples, fletcher, pitch);
    for &(n, f) in &measured {
        let error = cents(f, fletcher(n));
        println!(
            "partial {n}: measured {f:.4} Hz, Fletcher {:.4} Hz, {error:+.4} cents",
            fletcher(n)
        );
        assert!(
            error.abs() < 0.5,
            "partial {n}: {error} cents off Fletcher's frequency"
        );
    }
    // Partial 8 is well away from 8·f₁: the stretch is real, not within the tolerance.
    assert!(cents(measured[7].1, 8.0 * pitch) > 10.0);
    let fitted = fitted_b(&measured);
    println!(
        "B fitted {fitted:.6e}, plan {b:.6e}, {:+.3} %",
        100.0 * (fitted / b - 1.0)
    );
    assert!(
        (fitted / b - 1.0).abs() < 0.05,
        "fitted B {fitted} against the plan's {b}"
    );
}

#[test]
fn a_harmonic_rendering_has_no_stretch() {
    let dir = tempfile::tempdir().unwrap();
    let (pitch, b, samples) = render(dir.path(), "harmonic", &["--partials", "harmonic"]);
    let measured = measure(&samples, |n| f64::from(n) * pitch, pitch);
    for &(n, f) in &measured {
        let error = cents(f, f64::from(n) * pitch);
        assert!(error.abs() < 0.5, "partial {n}: {error} cents off n·f₁");
    }
    let fitted = fitted_b(&measured);
    assert!(
        fitted.abs() < 0.02 * b,
        "harmonic partials fitted B = {fitted}"
    );
}

#[test]
fn a_pluck_at_the_middle_has_no_even_partials() {
    let dir = tempfile::tempdir().unwrap();
    let (pitch, b, samples) = render(dir.path(), "middle", &["--pluck", "0.5"]);
    let f0 = pitch / (1.0 + b).sqrt();
    let fletcher = |n: f64| n * f0 * (1.0 + b * n * n).sqrt();
    let (magnitudes, bin_hz) = spectrum(&samples);
    let (_, fundamental) = peak(&magnitudes, bin_hz, fletcher(1.0), pitch / 4.0);
    for n in [2.0, 4.0, 6.0, 8.0] {
        let (_, even) = peak(&magnitudes, bin_hz, fletcher(n), pitch / 4.0);
        let db = 20.0 * (even / fundamental).log10();
        assert!(db < -60.0, "partial {n} at {db:.1} dB");
    }
    // The odd partials are there (sin(3π/2)/9 is −19 dB before damping): the check can fail.
    let (_, third) = peak(&magnitudes, bin_hz, fletcher(3.0), pitch / 4.0);
    assert!(20.0 * (third / fundamental).log10() > -30.0);
}
