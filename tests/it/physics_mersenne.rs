//! Mersenne/Taylor string formula, its solved forms, plain-wire stress and breaking pitch, checked
//! against sources outside the project.

use approx::assert_relative_eq;
use proptest::prelude::*;
use taut::input::units::{METRES_PER_INCH, NEWTONS_PER_LBF};
use taut::strings::material::Materials;
use taut::strings::physics;

const E4: f64 = 329.627_6; // REFERENCES §7.2 (DERIVED from ISO 16, A4 = 440 Hz)
const SCALE_648: f64 = 0.648;

#[test]
fn openstax_guitar_string_worked_example() {
    // OpenStax, University Physics Vol. 1 (2016), §16.3 "Wave Speed on a Stretched String",
    // example on a six-string guitar: high E string μ = 3.09e-4 kg/m at 56.40 N; low E string
    // μ = 5.78e-3 kg/m. The problem text was READ (reproduced); the book's answers, v = 427.23 m/s
    // and F_T = 1055.00 N for the low string at the same wave speed, are from memory and agree
    // with v = √(T/μ) to the digits given.
    let speed = (56.40_f64 / 3.09e-4).sqrt();
    assert_relative_eq!(speed, 427.23, max_relative = 1e-5);
    // Same wave speed means the same f·L, so take any length; the tension solve must agree.
    let length = 0.65;
    let f = physics::frequency(56.40, 3.09e-4, length);
    assert_relative_eq!(f, speed / (2.0 * length), max_relative = 1e-12);
    let low_tension = physics::tension(5.78e-3, length, f);
    assert_relative_eq!(low_tension, 1055.0, max_relative = 1e-4);
}

#[test]
fn mersenne_octave_needs_four_times_the_tension_or_half_the_length() {
    // Wikipedia "Mersenne's laws" harmonics table (REFERENCES §1.1, READ): one octave up needs
    // length ×1/2, or tension ×4, or μ ×1/4; harmonic 3 needs tension ×9.
    let (mu, length, f) = (4e-4, 0.648, 200.0);
    let t = physics::tension(mu, length, f);
    assert_relative_eq!(
        physics::tension(mu, length, 2.0 * f),
        4.0 * t,
        max_relative = 1e-12
    );
    assert_relative_eq!(
        physics::tension(mu, length, 3.0 * f),
        9.0 * t,
        max_relative = 1e-12
    );
    assert_relative_eq!(
        physics::frequency(t, mu, length / 2.0),
        2.0 * f,
        max_relative = 1e-12
    );
    assert_relative_eq!(
        physics::frequency(t, mu / 4.0, length),
        2.0 * f,
        max_relative = 1e-12
    );
}

#[test]
fn plain_steel_unit_mass_from_handbook_density() {
    // μ = ρπd²/4 with ρ = 7850 kg/m³ (REFERENCES §2: PRACTICE + READ, piano technicians' list and
    // Beer et al. App. B). 0.010 in = 0.254 mm exactly (NIST SP 811).
    let d = 0.010 * METRES_PER_INCH;
    let expected = 7850.0 * std::f64::consts::PI * 0.254e-3 * 0.254e-3 / 4.0;
    assert_relative_eq!(
        physics::unit_mass_round(7850.0, d),
        expected,
        max_relative = 1e-14
    );
    assert_relative_eq!(expected, 3.977_65e-4, max_relative = 1e-5);
    assert_relative_eq!(
        physics::diameter_for_unit_mass_round(7850.0, expected),
        d,
        max_relative = 1e-12
    );
}

#[test]
fn ten_thousandths_plain_steel_at_e4_on_648_mm_is_about_72_6_newtons() {
    // DERIVED from ρ = 7850 kg/m³ (REFERENCES §2) and T = μ(2Lf)² (§1.2): 72.59 N = 16.32 lbf.
    // Common practice agrees: a 0.010 in plain E string on a 25.5 in scale is quoted near 16 lbf.
    let mu = physics::unit_mass_round(7850.0, 0.010 * METRES_PER_INCH);
    let t = physics::tension(mu, SCALE_648, E4);
    assert_relative_eq!(t, 72.59, max_relative = 2e-4);
    assert_relative_eq!(t / NEWTONS_PER_LBF, 16.32, max_relative = 1e-3);
}

#[test]
fn plain_steel_on_648_mm_breaks_a_few_semitones_above_e4_whatever_its_diameter() {
    // ASTM A228 Table 1 minimum strengths (REFERENCES §4.1, READ in a reproduction) with
    // ρ = 7850: f_break = √(S/ρ)/(2L) (§1.2). For 0.007–0.026 in the break lies 4.2 to 5.8
    // semitones above E4 (DERIVED), which is the trade's "plain steel E tops out near A4".
    let music_wire = Materials::builtin().unwrap().get("music-wire").unwrap();
    for thousandths in [
        7.0, 8.0, 10.0, 12.0, 14.0, 16.0, 18.0, 20.0, 22.0, 24.0, 26.0,
    ] {
        let d = thousandths * 1e-3 * METRES_PER_INCH;
        let strength = music_wire.strength_at(d).unwrap();
        let f_break = physics::breaking_frequency_plain(strength, 7850.0, SCALE_648);
        let semitones = physics::cents(E4, f_break) / 100.0;
        assert!(
            (4.0..6.0).contains(&semitones),
            "{thousandths} thou breaks {semitones} semitones above E4"
        );
        // The same break pitch from the diameter-dependent route: T_break = S·A, μ = ρA.
        let area = physics::circle_area(d);
        let via_tension = physics::breaking_frequency(
            strength * area,
            physics::unit_mass_round(7850.0, d),
            SCALE_648,
        );
        assert_relative_eq!(via_tension, f_break, max_relative = 1e-12);
    }
    // 0.010 in: 387 ksi → 449.9 Hz (DERIVED).
    let s = music_wire.strength_at(0.010 * METRES_PER_INCH).unwrap();
    assert_relative_eq!(
        physics::breaking_frequency_plain(s, 7850.0, SCALE_648),
        449.86,
        max_relative = 1e-4
    );
}

#[test]
fn stress_below_the_breaking_pitch_falls_as_the_square() {
    // REFERENCES §1.2 (DERIVED): k semitones below the breaking pitch the stress is 2^(−k/6) of
    // the breaking stress: 3 semitones → 0.7071, 6 → 0.5000, 12 → 0.2500.
    let (rho, length, strength) = (7850.0, 0.648, 2.6e9);
    let f_break = physics::breaking_frequency_plain(strength, rho, length);
    for (k, ratio) in [
        (1.0, 0.8909),
        (3.0, std::f64::consts::FRAC_1_SQRT_2), // 0.7071 in §1.2
        (4.0, 0.6300),
        (6.0, 0.5),
        (12.0, 0.25),
    ] {
        let f = f_break * 2f64.powf(-k / 12.0);
        assert_relative_eq!(
            physics::plain_stress(rho, length, f) / strength,
            ratio,
            epsilon = 1e-4
        );
    }
}

#[test]
fn equal_unit_mass_gives_equal_tension_regardless_of_construction() {
    // Mersenne/Taylor (§1.1) sees only μ: a wound string and a plain one of the same μ need the
    // same tension for the same pitch and length.
    let materials = Materials::builtin().unwrap();
    let kinds = taut::strings::kind::StringKinds::builtin().unwrap();
    let wound = kinds
        .get("phosphor-bronze-wound")
        .unwrap()
        .construction(0.030 * METRES_PER_INCH);
    let mu = wound.unit_mass();
    let d_plain = physics::diameter_for_unit_mass_round(7850.0, mu);
    let plain = taut::strings::construction::Construction::Plain {
        material: materials.get("music-wire").unwrap(),
        diameter: d_plain,
    };
    assert_relative_eq!(plain.unit_mass(), mu, max_relative = 1e-12);
    assert_relative_eq!(
        physics::tension(plain.unit_mass(), 0.648, 146.8324),
        physics::tension(wound.unit_mass(), 0.648, 146.8324),
        max_relative = 1e-12
    );
}

proptest! {
    #[test]
    fn frequency_recomputes_from_the_tension_solve(
        mu in 1e-5f64..0.05, length in 0.05f64..2.5, f in 20.0f64..5000.0,
    ) {
        let t = physics::tension(mu, length, f);
        let back = physics::frequency(t, mu, length);
        prop_assert!((back / f - 1.0).abs() < 1e-9);
    }

    #[test]
    fn tension_grows_as_frequency_squared(
        mu in 1e-5f64..0.05, length in 0.05f64..2.5, f in 20.0f64..5000.0, k in 0.1f64..10.0,
    ) {
        let ratio = physics::tension(mu, length, k * f) / physics::tension(mu, length, f);
        prop_assert!((ratio / (k * k) - 1.0).abs() < 1e-12);
    }

    #[test]
    fn length_solve_inverts_the_tension_solve(
        mu in 1e-5f64..0.05, length in 0.05f64..2.5, f in 20.0f64..5000.0,
    ) {
        let t = physics::tension(mu, length, f);
        let back = physics::length_for_tension(t, mu, f);
        prop_assert!((back / length - 1.0).abs() < 1e-12);
        let mu_back = physics::unit_mass_for_tension(t, length, f);
        prop_assert!((mu_back / mu - 1.0).abs() < 1e-12);
    }
}
