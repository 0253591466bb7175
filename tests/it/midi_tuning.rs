//! `taut tuning midi` and the MIDI Tuning Standard bytes behind it.
//!
//! Outside checks (REFERENCES §11.4): the standard's frequency data format (the 12-EDO semitone
//! at or below the pitch, then a 14-bit fraction of 100 cents, high 7 bits first) and its worked
//! values, as corrected on the MIDI association's forum (the printed table's last decimals are
//! wrong in places); the bulk dump's layout and checksum (exclusive-or of the bytes from 7E to
//! the last data byte); the single-note change's layout. Standard MIDI Files are read back with
//! `midly`, an independent parser (REFERENCES §11.5).

use std::path::Path;

use midly::{MetaMessage, Smf, Timing, TrackEventKind};
use taut::midi::mts::{checksum, data_hz, frequency_data, highest_hz, lowest_hz};

use crate::common::{bad_input, taut};

/// The standard's worked values: frequency data and the frequency it stands for, to 4 decimals.
const WORKED: [([u8; 3], f64); 9] = [
    ([0x00, 0x00, 0x00], 8.1758),
    ([0x01, 0x00, 0x00], 8.6620),
    ([0x0C, 0x00, 0x00], 16.3516),
    ([0x3C, 0x00, 0x00], 261.6256),
    ([0x3D, 0x00, 0x00], 277.1826),
    ([0x44, 0x7F, 0x7F], 439.9984),
    ([0x45, 0x00, 0x00], 440.0000),
    ([0x78, 0x00, 0x00], 8372.0181),
    ([0x7F, 0x7F, 0x7E], 13289.6566),
];

#[test]
fn frequency_data_matches_the_standards_worked_values() {
    for (data, hz) in WORKED {
        let decoded = data_hz(data).unwrap();
        assert!(
            (decoded - hz).abs() < 6e-5,
            "{data:02X?}: {decoded} against {hz}"
        );
        // Encoding the exact frequency of those bytes gives the bytes back.
        assert_eq!(frequency_data(decoded).unwrap(), data, "{hz} Hz");
    }
    // 440 Hz itself: note 69 (0x45), no fraction.
    assert_eq!(frequency_data(440.0).unwrap(), [0x45, 0x00, 0x00]);
    // One unit is 100/16384 cents: 00 00 01 lies 0.0061 cents above note 0 (REFERENCES §11.4).
    let one_unit = data_hz([0, 0, 1]).unwrap() / data_hz([0, 0, 0]).unwrap();
    assert!((1200.0 * one_unit.log2() - 100.0 / 16384.0).abs() < 1e-9);
    // "No change" is no frequency.
    assert_eq!(data_hz([0x7F, 0x7F, 0x7F]), None);
    // The range ends: below note 0 and above 7F 7F 7E are refused.
    assert!((lowest_hz() - 8.1758).abs() < 1e-4);
    assert!((highest_hz() - 13289.6566).abs() < 1e-3);
    assert!(frequency_data(8.17).is_err());
    assert!(frequency_data(13_300.0).is_err());
    assert!(frequency_data(f64::NAN).is_err());
}

#[test]
fn a_just_major_third_above_a440_by_hand() {
    // 5/4 · 440 = 550 Hz: m = 69 + 12·log₂(5/4) = 72.863137…; 0.863137 · 16384 = 14141.6,
    // rounded 14142 = 110·128 + 62, so 48 6E 3E (computed by hand from the standard's format).
    assert_eq!(frequency_data(550.0).unwrap(), [0x48, 0x6E, 0x3E]);
}

#[test]
fn twelve_edo_at_a440_sends_every_note_at_its_own_pitch() {
    let dir = tempfile::tempdir().unwrap();
    let bulk = dir.path().join("t.syx");
    let output = taut()
        .args(["tuning", "midi", "12edo", "--format", "json", "--bulk"])
        .arg(&bulk)
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    let bytes = std::fs::read(&bulk).unwrap();
    // F0 7E device 08 01 program name[16] (xx yy zz)×128 checksum F7.
    assert_eq!(bytes.len(), 6 + 16 + 3 * 128 + 2);
    assert_eq!(&bytes[..6], &[0xF0, 0x7E, 0x7F, 0x08, 0x01, 0x00]);
    assert_eq!(&bytes[6..22], b"12edo           ");
    for note in 0..128u8 {
        let at = 22 + 3 * usize::from(note);
        assert_eq!(&bytes[at..at + 3], &[note, 0, 0], "note {note}");
    }
    assert_eq!(*bytes.last().unwrap(), 0xF7);
    // The checksum: XOR of every byte from 7E to the last data byte, masked to 7 bits.
    let by_hand = bytes[1..bytes.len() - 2].iter().fold(0u8, |x, b| x ^ b) & 0x7F;
    assert_eq!(bytes[bytes.len() - 2], by_hand);
    assert_eq!(checksum(&bytes[1..bytes.len() - 2]), by_hand);
    // No byte inside the message has its top bit set.
    assert!(bytes[1..bytes.len() - 1].iter().all(|b| b & 0x80 == 0));
    // The note table says which note carries which degree.
    let report: serde_json::Value = serde_json::from_slice(&output.stdout).unwrap();
    assert_eq!(report["anchor_note"], 69);
    assert_eq!(report["notes"].as_array().unwrap().len(), 128);
    assert_eq!(report["notes"][69]["degree"], 0);
    assert_eq!(report["notes"][69]["frequency_data"], "45 00 00");
}

#[test]
fn the_checksum_changes_with_the_data() {
    let dir = tempfile::tempdir().unwrap();
    let first = dir.path().join("a.syx");
    let second = dir.path().join("b.syx");
    for (tuning, path) in [("12edo", &first), ("12edo@A4=441", &second)] {
        taut()
            .args(["tuning", "midi", tuning, "-o", "/dev/null", "--bulk"])
            .arg(path)
            .assert()
            .success();
    }
    let (a, b) = (
        std::fs::read(&first).unwrap(),
        std::fs::read(&second).unwrap(),
    );
    for bytes in [&a, &b] {
        let sum = bytes[1..bytes.len() - 2].iter().fold(0u8, |x, b| x ^ b) & 0x7F;
        assert_eq!(bytes[bytes.len() - 2], sum);
    }
    assert_ne!(a[22..406], b[22..406]);
}

#[test]
fn single_note_changes_carry_a_just_scale() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("n.syx");
    taut()
        .args(["tuning", "midi", "ratios:1/1,5/4,3/2", "--degrees", "0..2"])
        .args(["--program", "3", "-o", "/dev/null", "--note-changes"])
        .arg(&path)
        .assert()
        .success();
    let bytes = std::fs::read(&path).unwrap();
    // F0 7F device 08 02 program count (note xx yy zz)×count F7: degree 0 = A4 = 440 Hz on
    // note 69, 5/4 (550 Hz, by hand above) on 70, 3/2 (660 Hz: m = 76.019550, 0.019550 · 16384
    // = 320.3, so 4C 02 40) on 71.
    assert_eq!(
        bytes,
        vec![
            0xF0, 0x7F, 0x7F, 0x08, 0x02, 0x03, 0x03, //
            69, 0x45, 0x00, 0x00, //
            70, 0x48, 0x6E, 0x3E, //
            71, 0x4C, 0x02, 0x40, //
            0xF7
        ]
    );
}

fn midi_file(dir: &Path, args: &[&str]) -> Vec<u8> {
    let path = dir.join("s.mid");
    let output = taut()
        .args(["tuning", "midi"])
        .args(args)
        .args(["-o", "/dev/null", "--midi-file"])
        .arg(&path)
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    std::fs::read(path).unwrap()
}

#[test]
fn a_midi_file_reads_back_with_its_tuning_first_then_the_scale() {
    let dir = tempfile::tempdir().unwrap();
    let bytes = midi_file(dir.path(), &["19edo"]);
    let smf = Smf::parse(&bytes).unwrap();
    assert_eq!(smf.header.format, midly::Format::SingleTrack);
    assert_eq!(smf.header.timing, Timing::Metrical(480.into()));
    assert_eq!(smf.tracks.len(), 1);
    let track = &smf.tracks[0];
    // Tempo, then the single-note changes (128 notes: two messages), all at time 0.
    assert!(matches!(
        track[0].kind,
        TrackEventKind::Meta(MetaMessage::Tempo(t)) if t.as_int() == 500_000
    ));
    let sysex: Vec<&[u8]> = track
        .iter()
        .filter_map(|e| match e.kind {
            TrackEventKind::SysEx(data) => Some(data),
            _ => None,
        })
        .collect();
    assert_eq!(sysex.len(), 2);
    assert_eq!(&sysex[0][..6], &[0x7F, 0x7F, 0x08, 0x02, 0x00, 127]);
    assert_eq!(&sysex[1][..6], &[0x7F, 0x7F, 0x08, 0x02, 0x00, 1]);
    assert!(track[..3].iter().all(|e| e.delta.as_int() == 0));
    // One period of 19-EDO upward from the reference (A4 on note 69): 20 notes, 69 … 88.
    let ons: Vec<u8> = track
        .iter()
        .filter_map(|e| match e.kind {
            TrackEventKind::Midi {
                message: midly::MidiMessage::NoteOn { key, vel },
                ..
            } if vel > 0 => Some(key.as_int()),
            _ => None,
        })
        .collect();
    assert_eq!(ons, (69..=88).collect::<Vec<u8>>());
    assert!(matches!(
        track.last().unwrap().kind,
        TrackEventKind::Meta(MetaMessage::EndOfTrack)
    ));
}

#[test]
fn chords_play_together_on_the_notes_that_carry_their_degrees() {
    let dir = tempfile::tempdir().unwrap();
    let bytes = midi_file(
        dir.path(),
        &[
            "31edo@C4",
            "--chord",
            "0,10,18",
            "--chord",
            "0,8,18",
            "--seconds",
            "1",
        ],
    );
    let smf = Smf::parse(&bytes).unwrap();
    let mut ons = Vec::new();
    let mut time = 0u32;
    for event in &smf.tracks[0] {
        time += event.delta.as_int();
        if let TrackEventKind::Midi {
            message: midly::MidiMessage::NoteOn { key, .. },
            ..
        } = event.kind
        {
            ons.push((time, key.as_int()));
        }
    }
    // C4 is note 60 (the anchor, degree 0); 1 s = 960 ticks at 120 quarters a minute.
    let start = ons[0].0;
    assert_eq!(
        ons,
        vec![
            (start, 60),
            (start, 70),
            (start, 78),
            (start + 960, 60),
            (start + 960, 68),
            (start + 960, 78)
        ]
    );
}

#[test]
fn bad_input_is_refused_with_the_option_named() {
    let dir = tempfile::tempdir().unwrap();
    let out = dir.path().join("x.syx");
    let out = out.to_str().unwrap();
    for (args, words) in [
        (
            vec!["12edo", "--degrees", "0..200"],
            "more than the 128 MIDI notes",
        ),
        (vec!["12edo", "--degrees", "-80..0"], "outside 0 to 127"),
        (
            vec!["5edo", "--degrees", "-60..60"],
            "outside the MIDI Tuning Standard's range",
        ),
        (vec!["hertz:2,4,6"], "no degree"),
        (vec!["12edo", "--anchor-note", "200"], "--anchor-note"),
        (vec!["12edo", "--degrees", "a..b"], "--degrees"),
        (vec!["12edo", "--bulk", "x.txt"], "--bulk"),
        (vec!["12edo", "--chord", "0,4,7"], "--midi-file"),
        (
            vec!["12edo", "--midi-file", "s.mid", "--seconds", "0"],
            "--seconds",
        ),
        (
            vec![
                "12edo",
                "--midi-file",
                "s.mid",
                "--degrees",
                "0..12",
                "--chord",
                "0,40",
            ],
            "degree 40",
        ),
    ] {
        let mut all = vec!["tuning", "midi"];
        all.extend(args.iter().copied());
        all.extend(["--note-changes", out]);
        let stderr = bad_input(&all);
        assert!(stderr.contains(words), "{args:?}: {stderr}");
        assert!(!Path::new(out).exists(), "{args:?} wrote a file");
    }
}
