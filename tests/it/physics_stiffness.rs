//! Fletcher inharmonicity and the bend/feel model.

use approx::assert_relative_eq;
use proptest::prelude::*;
use std::f64::consts::PI;
use taut::strings::physics::{self, BendGeometry};

#[test]
fn fletcher_b_matches_young_1952_plain_wire_form() {
    // Fletcher 1964, B = π³Ed⁴/(64TL²) (REFERENCES §5.1, READ). Substituting T = πρd²L²f₀² gives
    // R. W. Young's (1952) plain-wire form B = π²(E/ρ)d²/(64 f₀² L⁴) (§5.1, DERIVED), and Young's
    // constant Q/ρ = 25.5×10¹⁰ cm²/s² = 25.5×10⁶ m²/s² (READ) gives E = 200 GPa at 7850 kg/m³.
    let rho = 7850.0;
    let e = 25.5e6 * rho;
    assert_relative_eq!(e, 200.175e9, max_relative = 1e-9);
    for (d, length, f0) in [
        (1.0e-3, 0.62, 261.6256),
        (0.9e-3, 0.181, 1046.502),
        (1.2e-3, 1.2, 110.0),
    ] {
        let t = physics::tension(physics::unit_mass_round(rho, d), length, f0);
        let fletcher = physics::inharmonicity(e, d, t, length);
        let young = PI * PI * (e / rho) * d * d / (64.0 * f0 * f0 * length.powi(4));
        assert_relative_eq!(fletcher, young, max_relative = 1e-12);
        // Written with the second moment πd⁴/64 it is the same number.
        let via_i = physics::inharmonicity_from_second_moment(e, PI * d.powi(4) / 64.0, t, length);
        assert_relative_eq!(via_i, fletcher, max_relative = 1e-12);
    }
}

#[test]
fn partials_follow_fletcher_and_are_reported_against_the_sounding_fundamental() {
    // f_n = n f₀ √(1+Bn²) (Fletcher 1964, REFERENCES §5.1); offsets are against n·f₁ with
    // f₁ = f₀√(1+B) (§5.1, DERIVED).
    let (f0, b) = (100.0, 4e-4);
    let f1 = physics::partial_frequency(f0, b, 1);
    assert_relative_eq!(f1, f0 * (1.0 + b).sqrt(), max_relative = 1e-14);
    assert_eq!(physics::partial_offset_cents(b, 1), 0.0);
    for n in [2u32, 5, 10, 15] {
        let fn_ = physics::partial_frequency(f0, b, n);
        let offset = physics::partial_offset_cents(b, n);
        assert_relative_eq!(
            offset,
            physics::cents(f64::from(n) * f1, fn_),
            max_relative = 1e-9
        );
        // Small-B approximation 865.6·B·(n²−1) cents (§5.1, DERIVED: 1200/(2 ln 2) = 865.6).
        let approx = 865.617 * b * (f64::from(n * n) - 1.0);
        assert_relative_eq!(offset, approx, max_relative = 0.05);
    }
}

#[test]
fn schuck_and_young_fifteenth_partial_near_the_sixteenth_harmonic() {
    // Schuck & Young, JASA 15 (1943) (REFERENCES §5.2, READ abstract): in one string the 15th
    // partial was at about the frequency of a 16th harmonic. Under Fletcher's law that takes
    // B = (256/225 − 1)/(225 − 256/225) = 6.155e-4 (DERIVED); check both ways.
    let b = (256.0 / 225.0 - 1.0) / (225.0 - 256.0 / 225.0);
    assert_relative_eq!(b, 6.155e-4, max_relative = 1e-3);
    let f0 = 55.0;
    let f1 = physics::partial_frequency(f0, b, 1);
    assert_relative_eq!(
        physics::partial_frequency(f0, b, 15),
        16.0 * f1,
        max_relative = 1e-12
    );
    // That is one harmonic step, 1200·log2(16/15) = 111.73 cents sharp of 15·f₁.
    assert_relative_eq!(
        physics::partial_offset_cents(b, 15),
        111.731,
        max_relative = 1e-5
    );
}

fn guitar_geometry() -> BendGeometry {
    BendGeometry::with_default_afterlengths(0.648)
}

// 0.010 in plain steel at E4: T ≈ 72.6 N (see physics_mersenne), E·A = 203.4 GPa × 5.07e-8 m².
const TENSION: f64 = 72.59;
const STIFFNESS: f64 = 203.4e9 * 5.067_074_790_974_977e-8;

#[test]
fn bend_with_no_push_raises_nothing() {
    let g = guitar_geometry();
    assert_eq!(physics::bend_rise_cents(g, STIFFNESS, TENSION, 0.0), 0.0);
    assert_eq!(physics::bend_force(g, STIFFNESS, TENSION, 0.0), 0.0);
    assert_eq!(
        physics::bend_displacement_for_force(g, STIFFNESS, TENSION, 0.0),
        0.0
    );
    assert_eq!(
        physics::bend_rise_for_force(g, STIFFNESS, TENSION, 0.0),
        0.0
    );
    assert_eq!(
        physics::bend_displacement_for_rise(g, STIFFNESS, TENSION, 0.0),
        0.0
    );
}

#[test]
fn small_bends_grow_with_the_square_of_the_displacement() {
    // ΔL ≈ 2δ²/L for δ ≪ L (Pythagoras), so the rise ∝ δ² at first (DERIVED).
    let g = guitar_geometry();
    let small = physics::bend_rise_cents(g, STIFFNESS, TENSION, 0.2e-3);
    let double = physics::bend_rise_cents(g, STIFFNESS, TENSION, 0.4e-3);
    assert!(small > 0.0);
    assert_relative_eq!(double / small, 4.0, max_relative = 1e-3);
    // And matches the linearised form: cents ≈ (600/ln2)·(E·A·2δ²/L)/(L_total·T).
    let delta: f64 = 0.2e-3;
    let linear = 600.0 / std::f64::consts::LN_2 * STIFFNESS * 2.0 * delta * delta
        / (0.648 * g.anchored_length() * TENSION);
    assert_relative_eq!(small, linear, max_relative = 1e-3);
}

#[test]
fn a_whole_tone_bend_by_hand() {
    // Raising 200 cents needs T' = T·2^(1/3) (f ∝ √T, §1.1), so ΔT = 18.87 N; Hooke's law over the
    // anchored length 0.768 m stretches the string by ΔL = ΔT·L_total/(E·A) = 1.406 mm, and the
    // midpoint travel is √((L/2 + ΔL/2)² − (L/2)²) = 21.35 mm (all DERIVED by hand).
    let g = guitar_geometry();
    let added = TENSION * (2f64.powf(1.0 / 3.0) - 1.0);
    let stretch = added * 0.768 / STIFFNESS;
    let by_hand = ((0.324 + stretch / 2.0).powi(2) - 0.324f64.powi(2)).sqrt();
    assert_relative_eq!(by_hand, 21.35e-3, max_relative = 1e-3);
    let delta = physics::bend_displacement_for_rise(g, STIFFNESS, TENSION, 200.0);
    assert_relative_eq!(delta, by_hand, max_relative = 1e-9);
    assert_relative_eq!(
        physics::bend_rise_cents(g, STIFFNESS, TENSION, delta),
        200.0,
        max_relative = 1e-9
    );
    // Longer afterlengths spread the stretch: the same displacement gives less rise.
    let long = BendGeometry {
        nut_afterlength: 0.3,
        ..g
    };
    assert!(physics::bend_rise_cents(long, STIFFNESS, TENSION, delta) < 200.0);
}

proptest! {
    #[test]
    fn bend_inverses_round_trip(rise in 0.5f64..300.0) {
        let g = guitar_geometry();
        let force = physics::bend_force_for_rise(g, STIFFNESS, TENSION, rise);
        let back = physics::bend_rise_for_force(g, STIFFNESS, TENSION, force);
        prop_assert!((back / rise - 1.0).abs() < 1e-6, "{rise} -> {force} N -> {back}");
    }
}

proptest! {
    #[test]
    fn the_displacement_for_a_push_gives_back_that_push(
        force in 1e-4f64..500.0,
        tension in 5.0f64..400.0,
        stiffness in 1e2f64..1e6,
    ) {
        // The inverse of the statics F(δ) = 2·T'·δ/ℓ, from tiny pushes to ones far beyond a
        // player's hand, on slack and stiff strings alike.
        let g = guitar_geometry();
        let delta = physics::bend_displacement_for_force(g, stiffness, tension, force);
        prop_assert!(delta > 0.0 && delta.is_finite());
        let back = physics::bend_force(g, stiffness, tension, delta);
        prop_assert!((back / force - 1.0).abs() < 1e-12, "{force} N -> {delta} m -> {back} N");
    }
}
