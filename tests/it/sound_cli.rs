//! `taut plan --sound`: the WAV file read back with `hound` (header, length, sample rate), and
//! every bad sound option refused with exit 2, the option named and no file written.

use std::path::Path;

use crate::common::{bad_input, taut};

fn wav_of(args: &[&str], dir: &Path) -> hound::WavReader<std::io::BufReader<std::fs::File>> {
    let wav = dir.join("out.wav");
    let output = taut()
        .args(args)
        .arg("--sound")
        .arg(&wav)
        .args(["-o", "/dev/null"])
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    hound::WavReader::open(&wav).unwrap()
}

#[test]
fn a_strum_of_six_strings_lasts_its_chord_and_the_strum() {
    let dir = tempfile::tempdir().unwrap();
    let reader = wav_of(&["plan", "steel-guitar-12edo"], dir.path());
    let spec = reader.spec();
    assert_eq!(spec.sample_rate, 44_100);
    assert_eq!(spec.channels, 1);
    assert_eq!(spec.bits_per_sample, 16);
    assert_eq!(spec.sample_format, hound::SampleFormat::Int);
    // Six strings 30 ms apart, the last ringing 3 s: 3.15 s.
    assert_eq!(reader.len(), (3.15f64 * 44_100.0).ceil() as u32);
    let samples: Vec<i16> = reader.into_samples().map(|s| s.unwrap()).collect();
    let peak = samples.iter().map(|s| s.unsigned_abs()).max().unwrap();
    // Scaled to −1 dBFS, never clipped.
    assert!((29_000..=29_300).contains(&peak), "{peak}");
}

#[test]
fn the_scale_and_the_comparison_last_as_long_as_their_notes() {
    let dir = tempfile::tempdir().unwrap();
    // guitar-19edo: one period of 19-EDO upward from the lowest string, 20 notes of 0.5 s,
    // then half a second of silence and the same 20 notes harmonic: 20.5 s at 48 kHz.
    let reader = wav_of(
        &[
            "plan",
            "guitar-19edo",
            "--play",
            "scale",
            "--seconds",
            "0.5",
            "--partials",
            "both",
            "--sample-rate",
            "48000",
        ],
        dir.path(),
    );
    assert_eq!(reader.spec().sample_rate, 48_000);
    assert_eq!(reader.len(), 20 * 2 * 24_000 + 24_000);
}

#[test]
fn bad_sound_options_exit_2_and_write_nothing() {
    let dir = tempfile::tempdir().unwrap();
    let wav = dir.path().join("x.wav");
    let wav = wav.to_str().unwrap();
    let many: String = format!("degrees:{}", vec!["0"; 513].join(","));
    for (args, words) in [
        (vec!["--seconds", "0"], "--seconds"),
        (vec!["--seconds", "1e9"], "at most 60"),
        (vec!["--seconds", "NaN"], "--seconds"),
        (
            vec!["--play", "strings", "--seconds", "60"],
            "at most 600 s",
        ),
        (vec!["--play", many.as_str()], "at most 512"),
        (vec!["--play", "courses:99"], "no course 99"),
        (
            vec!["--play", "strum", "--seconds", "60"],
            "partial-samples",
        ),
        (vec!["--play", "degrees:-100"], "below every open string"),
        (vec!["--play", "chord"], "--play"),
        (vec!["--pluck", "1"], "--pluck"),
        (vec!["--pluck", "0"], "--pluck"),
        (vec!["--sample-rate", "22050"], "--sample-rate"),
        (
            vec!["--tuning", "12edo", "--tuning", "19edo"],
            "several tunings",
        ),
    ] {
        let instrument = if args.contains(&"strings") || args.contains(&"strum") {
            "lever-harp-34"
        } else {
            "guitar-19edo"
        };
        let mut all = vec!["plan", instrument, "--sound", wav, "-o", "report.txt"];
        all.extend(args.iter().copied());
        let stderr = bad_input(&all);
        assert!(stderr.contains(words), "{args:?}: {stderr}");
        assert!(!Path::new(wav).exists(), "{args:?} wrote the WAV file");
    }
    let stderr = bad_input(&["plan", "guitar-19edo", "--sound", "x.mp3"]);
    assert!(stderr.contains("--sound"), "{stderr}");
}
