use super::*;
use approx::assert_abs_diff_eq;

#[test]
fn note_numbers_follow_scientific_pitch_notation() {
    // MIDI numbering (from memory, REFERENCES §7.2): C4 = 60, A4 = 69, E2 = 40, C-1 = 0.
    let number = |t: &str| t.parse::<NoteName>().unwrap().number();
    assert_eq!(number("C4"), 60);
    assert_eq!(number("A4"), 69);
    assert_eq!(number("E2"), 40);
    assert_eq!(number("C-1"), 0);
    assert_eq!(number("Bb4"), 70);
    assert_eq!(number("F#3"), 54);
    assert_eq!(number("B#3"), 60);
    assert_eq!(number("Cbb4"), 58);
}

#[test]
fn twelve_tone_frequencies_match_iso_16_and_the_equal_temperament_formula() {
    // ISO 16:1975: A4 = 440 Hz; REFERENCES §7.2 (DERIVED): E2 = 82.4069, E4 = 329.6276,
    // C4 = 261.6256 Hz.
    let hz = |t: &str| t.parse::<NoteName>().unwrap().hz(ISO_16_A4_HZ);
    assert_abs_diff_eq!(hz("A4"), 440.0, epsilon = 1e-12);
    assert_abs_diff_eq!(hz("E2"), 82.4069, epsilon = 5e-5);
    assert_abs_diff_eq!(hz("E4"), 329.6276, epsilon = 5e-5);
    assert_abs_diff_eq!(hz("C4"), 261.6256, epsilon = 5e-5);
}

#[test]
fn cents_match_ellis() {
    // Ellis 1885 via REFERENCES §7.3 (DERIVED values): 3/2 = 701.9550, 81/80 = 21.5063.
    assert_abs_diff_eq!(cents(1.5), 701.9550, epsilon = 5e-5);
    assert_abs_diff_eq!(cents_of_ratio(&Ratio::new(81, 80)), 21.5063, epsilon = 5e-5);
    assert_abs_diff_eq!(ratio_from_cents(1200.0), 2.0, epsilon = 1e-12);
}

#[test]
fn nearest_note_names_the_note_and_offset() {
    let (name, offset) = nearest_note_name(82.4069, 440.0);
    assert_eq!(name, "E2");
    assert!(offset.abs() < 0.01);
    let (name, offset) = nearest_note_name(440.0 * ratio_from_cents(-30.0), 440.0);
    assert_eq!(name, "A4");
    assert_abs_diff_eq!(offset, -30.0, epsilon = 1e-9);
    let (name, _) = nearest_note_name(466.1638, 440.0);
    assert_eq!(name, "A#4");
    assert_eq!(nearest_note_name(f64::NAN, 440.0).0, "?");
    assert_eq!(nearest_note_name(0.0, 440.0).0, "?");
}

#[test]
fn pitch_specs_parse_every_form() {
    let parse = |t: &str| t.parse::<PitchSpec>().unwrap();
    assert!(matches!(
        parse("E2+14c"),
        PitchSpec::Note { offset_cents, has_offset: true, snap: false, .. } if offset_cents == 14.0
    ));
    assert!(matches!(
        parse("C-1"),
        PitchSpec::Note {
            has_offset: false,
            ..
        }
    ));
    assert!(matches!(
        parse("C-1-5c"),
        PitchSpec::Note { offset_cents, .. } if offset_cents == -5.0
    ));
    assert!(matches!(parse("~F#3"), PitchSpec::Note { snap: true, .. }));
    assert_eq!(parse("deg-7"), PitchSpec::Degree { degree: -7 });
    assert!(matches!(parse("D7"), PitchSpec::Note { .. }));
    assert_eq!(
        parse("deg3p-1"),
        PitchSpec::PeriodStep {
            period: -1,
            step: 3
        }
    );
    assert_eq!(parse("-700c"), PitchSpec::Cents { cents: -700.0 });
    assert_eq!(
        parse("5/4"),
        PitchSpec::Ratio {
            ratio: Ratio::new(5, 4)
        }
    );
    assert_eq!(parse("82.5Hz"), PitchSpec::Hz { hz: 82.5 });
    assert_eq!(parse("Bb4").to_string(), "Bb4");
    assert_eq!(parse("~E2+14c").to_string(), "~E2+14c");
}

#[test]
fn bad_pitch_specs_are_refused_with_help() {
    for bad in [
        "", "H2", "E", "3/0", "0/4", "-3/2", "nanc", "0hz", "E2+14", "E#b2", "deg", "degx", "deg3p",
    ] {
        let err = bad.parse::<PitchSpec>().unwrap_err().to_string();
        assert!(!err.is_empty(), "{bad}");
    }
    let err = "3/0".parse::<PitchSpec>().unwrap_err().to_string();
    assert!(err.contains("zero denominator"), "{err}");
}

#[test]
fn checked_powers_are_exact_and_overflow_to_none() {
    // Python: Fraction(3, 2) ** -3 == Fraction(8, 27)
    assert_eq!(
        checked_ratio_pow(&Ratio::new(3, 2), -3),
        Some(Ratio::new(8, 27))
    );
    assert_eq!(
        checked_ratio_pow(&Ratio::new(3, 2), 0),
        Some(Ratio::from_integer(1))
    );
    assert_eq!(checked_ratio_pow(&Ratio::new(3, 2), 200), None);
    assert_eq!(
        checked_ratio_pow(&Ratio::from_integer(1), i64::MIN),
        Some(Ratio::from_integer(1))
    );
}
