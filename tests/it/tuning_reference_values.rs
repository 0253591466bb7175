//! Outside checks: values from standards, published cents figures and Python's `fractions`
//! module, each with its source beside it.

use approx::assert_abs_diff_eq;
use num_rational::Ratio;
use taut::tuning::load;
use taut::tuning::pitch::{cents, cents_of_ratio, PitchSpec};

fn resolve(tuning: &str, pitch: &str) -> taut::tuning::ResolvedPitch {
    load(tuning)
        .unwrap()
        .resolve(&pitch.parse::<PitchSpec>().unwrap())
        .unwrap()
}

#[test]
fn iso_16_concert_pitch_and_twelve_tone_formula() {
    // ISO 16:1975: A4 = 440 Hz (REFERENCES §7.1, READ).
    assert_eq!(resolve("12edo", "A4").hz, 440.0);
    // f = 440·2^((m−69)/12), REFERENCES §7.2 (DERIVED): E2 = 82.4069, E4 = 329.6276,
    // D3 = 146.8324, C8 = 4186.0090 Hz.
    assert_abs_diff_eq!(resolve("12edo", "E2").hz, 82.4069, epsilon = 5e-5);
    assert_abs_diff_eq!(resolve("12edo", "E4").hz, 329.6276, epsilon = 5e-5);
    assert_abs_diff_eq!(resolve("12edo", "D3").hz, 146.8324, epsilon = 5e-5);
    assert_abs_diff_eq!(resolve("12edo", "C8").hz, 4186.0090, epsilon = 5e-4);
}

#[test]
fn cents_per_ellis() {
    // Ellis 1885, REFERENCES §7.3 (DERIVED to 4 places): 81/80 = 21.5063, 3/2 = 701.9550,
    // 7/4 = 968.8259, 9/8 = 203.9100.
    assert_abs_diff_eq!(cents_of_ratio(&Ratio::new(81, 80)), 21.5063, epsilon = 5e-5);
    assert_abs_diff_eq!(cents(1.5), 701.9550, epsilon = 5e-5);
    assert_abs_diff_eq!(cents_of_ratio(&Ratio::new(7, 4)), 968.8259, epsilon = 5e-5);
    let comma = resolve("12edo", "81/80");
    assert_eq!(comma.ratio, Some(Ratio::new(81, 80)));
    assert_abs_diff_eq!(comma.cents_from_reference, 21.5063, epsilon = 5e-5);
}

#[test]
fn step_sizes() {
    // 19-EDO: 1200/19 = 63.1579 cents (REFERENCES §7.3, DERIVED).
    let step = |spec: &str| load(spec).unwrap().degree(1).unwrap().cents_from_reference;
    assert_abs_diff_eq!(step("19edo"), 63.1579, epsilon = 5e-5);
    // 13 equal divisions of 3/1: 1200·log2(3)/13 = 146.3042 cents (Python math:
    // 1200*math.log2(3)/13 = 146.30423083579902).
    assert_abs_diff_eq!(step("tritave-13"), 146.30423083579902, epsilon = 1e-9);
    assert_abs_diff_eq!(step("13ed3/1"), 146.30423083579902, epsilon = 1e-9);
    // 53-EDO: 1200/53 = 22.6415 cents (REFERENCES §7.3, DERIVED).
    assert_abs_diff_eq!(step("53edo"), 22.6415, epsilon = 5e-5);
    // Quarter-comma meantone fifth: 5^(1/4) = 696.578 cents (Python math:
    // 1200*math.log2(5)/4 = 696.5784284662086). C is degree 0 and G degree 7.
    let meantone = load("meantone-quarter-comma").unwrap();
    let fifth = meantone.degree(7).unwrap().cents_from_reference
        - meantone.degree(0).unwrap().cents_from_reference;
    assert_abs_diff_eq!(fifth, 696.5784284662086, epsilon = 1e-9);
    // Four meantone fifths make a pure 5/4 two octaves up: C to E is 386.3137 cents
    // (REFERENCES §7.3).
    let third = meantone.degree(4).unwrap().cents_from_reference
        - meantone.degree(0).unwrap().cents_from_reference;
    assert_abs_diff_eq!(third, 386.3137, epsilon = 5e-5);
}

#[test]
fn exact_ratios_match_pythons_fractions_module() {
    // Constants computed with Python 3's `fractions.Fraction`.
    let pythagorean = load("pythagorean-12").unwrap();
    // Fraction(2)**-2 * Fraction(243, 128) / Fraction(27, 16) == Fraction(9, 32)
    assert_eq!(
        pythagorean.degree(-13).unwrap().ratio,
        Some(Ratio::new(9, 32))
    );
    // Degree 40 is step 4 of period 3:
    // Fraction(2)**3 * Fraction(81, 64) / Fraction(27, 16) == Fraction(6)
    assert_eq!(
        pythagorean.degree(40).unwrap().ratio,
        Some(Ratio::from_integer(6))
    );
    // Pythagorean tuning is the chain of fifths from D-flat to F-sharp: sorted reductions of
    // Fraction(3, 2)**i for i in -5..=6 give these twelve ratios.
    let chain = load("chain:3/2,6,5").unwrap();
    for k in 0..12 {
        assert_eq!(
            chain.degree(k).unwrap().ratio,
            pythagorean
                .degree(k)
                .unwrap()
                .ratio
                .map(|r| r * Ratio::new(27, 16)),
            "degree {k}"
        );
    }
    // The Pythagorean comma: twelve fifths less seven octaves,
    // Fraction(3, 2)**12 / 2**7 == Fraction(531441, 524288); it is the smallest step of a
    // 13-note chain of fifths.
    let thirteen = load("chain:3/2,12,0").unwrap();
    assert_eq!(
        thirteen.degree(1).unwrap().ratio,
        Some(Ratio::new(531441, 524288))
    );
    let five = load("just-5-limit").unwrap();
    // Fraction(1, 2) * Fraction(4, 3) / Fraction(5, 3) == Fraction(2, 5)
    assert_eq!(five.degree(-7).unwrap().ratio, Some(Ratio::new(2, 5)));
    // Fraction(4) * Fraction(45, 32) / Fraction(5, 3) == Fraction(27, 8)
    assert_eq!(five.degree(30).unwrap().ratio, Some(Ratio::new(27, 8)));
    // With A = 5/3 at 440 Hz, C = 440 / Fraction(5, 3) = 264 Hz.
    assert_abs_diff_eq!(five.degree(0).unwrap().hz, 264.0, epsilon = 1e-9);
    // Fraction(2) * Fraction(11, 8) == Fraction(11, 4)
    let harmonics = load("harmonics-8-16").unwrap();
    assert_eq!(harmonics.degree(11).unwrap().ratio, Some(Ratio::new(11, 4)));
    // Fraction(3)**-2 == Fraction(1, 9)
    let tritave = load("13ed3/1").unwrap();
    assert_eq!(tritave.degree(-26).unwrap().ratio, Some(Ratio::new(1, 9)));
    // Chain of 5/4: 1, 5/4, 25/16; the step from 25/16 to 2/1 is Fraction(2) / Fraction(25, 16)
    // == Fraction(32, 25).
    let thirds = load("chain:5/4,2,0").unwrap();
    let top = thirds.degree(2).unwrap().ratio.unwrap();
    let octave = thirds.degree(3).unwrap().ratio.unwrap();
    assert_eq!(octave / top, Ratio::new(32, 25));
}

#[test]
fn tonality_diamonds_match_pythons_fractions_module() {
    // sorted({reduce(Fraction(a, b)) for a, b in odd pairs <= 7}) - {1}: the shipped 7-limit
    // diamond has exactly these, so every analysis interval sits on a degree.
    let diamond = taut::tuning::analysis::tonality_diamond(7);
    let shipped = load("diamond-7-limit").unwrap();
    for (k, interval) in diamond.iter().enumerate() {
        assert_eq!(shipped.degree(k as i64 + 1).unwrap().ratio, Some(*interval));
    }
    assert_eq!(diamond.len(), 12);
}
