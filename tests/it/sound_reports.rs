//! `--sound` on `audit` and `convert` (issue 21, point 2): the WAV plays the strings the report
//! is about (the audited set at the audited pitches; the new set at the new pitches), read back
//! with hound and checked by the energy at the report's own pitch against the old one.

use std::path::Path;

use crate::common::{bad_input, json, taut};

/// Runs `args` with `--sound FILE --play strings --seconds 1` and returns the samples and rate.
fn strings_of(args: &[&str], dir: &Path) -> (Vec<f64>, f64) {
    let wav = dir.join("strings.wav");
    let output = taut()
        .args(args)
        .arg("--sound")
        .arg(&wav)
        .args(["--play", "strings", "--seconds", "1", "-o", "/dev/null"])
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    let reader = hound::WavReader::open(&wav).unwrap();
    let rate = f64::from(reader.spec().sample_rate);
    let samples = reader
        .into_samples::<i16>()
        .map(|s| f64::from(s.unwrap()))
        .collect();
    (samples, rate)
}

/// The power of `samples` at `hz` (Goertzel's algorithm: one DFT bin, G. Goertzel, "An
/// algorithm for the evaluation of finite trigonometric series", Am. Math. Monthly 65, 1958),
/// over a Hann window so that a neighbouring partial does not leak into the bin.
fn power_at(samples: &[f64], rate: f64, hz: f64) -> f64 {
    let n = samples.len() as f64;
    let coefficient = 2.0 * (2.0 * std::f64::consts::PI * hz / rate).cos();
    let (mut s1, mut s2) = (0.0, 0.0);
    for (i, x) in samples.iter().enumerate() {
        let window = 0.5 - 0.5 * (2.0 * std::f64::consts::PI * i as f64 / (n - 1.0)).cos();
        let s0 = x * window + coefficient * s1 - s2;
        s2 = s1;
        s1 = s0;
    }
    s1 * s1 + s2 * s2 - coefficient * s1 * s2
}

/// The first string's second of sound: its energy sits at `now_hz`, not at `old_hz`.
fn first_string_sounds_at(samples: &[f64], rate: f64, now_hz: f64, old_hz: f64) {
    let first = &samples[..rate as usize];
    let (now, old) = (power_at(first, rate, now_hz), power_at(first, rate, old_hz));
    assert!(
        now > 100.0 * old,
        "power at {now_hz:.2} Hz ({now:.3e}) should dwarf that at {old_hz:.2} Hz ({old:.3e})"
    );
}

#[test]
fn a_conversion_plays_the_new_strings_at_their_new_pitches() {
    let dir = tempfile::tempdir().unwrap();
    let args = [
        "convert",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--to-instrument",
        "baritone-guitar",
    ];
    let (samples, rate) = strings_of(&args, dir.path());
    // Six strings one after another, a second each.
    assert_eq!(samples.len(), 6 * rate as usize);
    let report = json(&args);
    let string = &report["courses"][0]["strings"][0];
    let now_hz = string["after"]["pitch_hz"].as_f64().unwrap();
    let old_hz = string["before"]["pitch_hz"].as_f64().unwrap();
    // The baritone's top string is a fourth below the guitar's (B3 against E4).
    assert!(
        (now_hz / old_hz - 0.75).abs() < 0.01,
        "{now_hz} vs {old_hz}"
    );
    first_string_sounds_at(&samples, rate, now_hz, old_hz);
}

#[test]
fn an_audit_plays_the_set_at_the_audited_pitches() {
    let dir = tempfile::tempdir().unwrap();
    let args = [
        "audit",
        "guitar-22edo-mode",
        "--set",
        "steel-guitar-set",
        "--from-instrument",
        "steel-guitar-12edo",
    ];
    let (samples, rate) = strings_of(&args, dir.path());
    assert_eq!(samples.len(), 6 * rate as usize);
    let report = json(&args);
    let now_hz = report["courses"][0]["strings"][0]["pitch_hz"]
        .as_f64()
        .unwrap();
    // Where the strings are now: the 12-EDO guitar's course 1, E4 (ISO 16: A4 = 440 Hz).
    let old_hz = 440.0 * 2f64.powf(-5.0 / 12.0);
    assert!(
        (now_hz / old_hz).log2().abs() > 0.05,
        "{now_hz} vs {old_hz}"
    );
    first_string_sounds_at(&samples, rate, now_hz, old_hz);
}

#[test]
fn sound_with_several_tunings_and_bad_sound_options_are_refused() {
    let stderr = bad_input(&[
        "audit",
        "guitar-three-tunings",
        "--set",
        "steel-guitar-set",
        "--sound",
        "x.wav",
    ]);
    assert!(stderr.contains("--sound plays one tuning"), "{stderr}");
    assert!(stderr.contains("--variant NAME"), "{stderr}");
    let stderr = bad_input(&[
        "convert",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--sound",
        "x.mp3",
    ]);
    assert!(stderr.contains("names no WAV file"), "{stderr}");
    assert!(!Path::new("x.wav").exists() && !Path::new("x.mp3").exists());
}
