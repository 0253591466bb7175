//! The round-wound linear-density model (REFERENCES §6): its identities, hexagonal cores and the
//! default constructions against common practice.
//!
//! No published wound-string construction with core, wrap and mass (outside makers' product
//! files) was found for an outside check, so these tests pin the model's own identities, each
//! DERIVED in REFERENCES §6.1 and §6.2.

use approx::assert_relative_eq;
use proptest::prelude::*;
use std::f64::consts::PI;
use taut::input::units::{METRES_PER_INCH, NEWTONS_PER_LBF};
use taut::strings::construction::{Construction, Core, Wrap, Wraps};
use taut::strings::kind::StringKinds;
use taut::strings::material::Materials;
use taut::strings::physics::{self, CoreShape, WrapLayer};

#[test]
fn hexagon_area_ratios_match_the_derived_constants() {
    // REFERENCES §6.2 (DERIVED): hexagon/circle area 0.8270 across corners, 1.1027 across flats.
    let d = 0.5e-3;
    let circle = physics::circle_area(d);
    assert_relative_eq!(
        CoreShape::HexAcrossCorners.area(d) / circle,
        0.8270,
        epsilon = 5e-5
    );
    assert_relative_eq!(
        CoreShape::HexAcrossFlats.area(d) / circle,
        1.1027,
        epsilon = 5e-5
    );
    assert_relative_eq!(
        CoreShape::HexAcrossCorners.area(d) / circle,
        physics::HEX_ACROSS_CORNERS_AREA_RATIO,
        max_relative = 1e-14
    );
    // μ_core = ρ·(3√3/2)·R² for circumradius R (§6.2).
    let r = d / 2.0;
    assert_relative_eq!(
        physics::unit_mass_wound(7850.0, CoreShape::HexAcrossCorners, d, &[]),
        7850.0 * 1.5 * 3f64.sqrt() * r * r,
        max_relative = 1e-14
    );
}

#[test]
fn hexagon_second_moment_is_that_of_six_triangles() {
    // Regular hexagon of side a: I = (5√3/16)a⁴ (standard section property, from memory); for a
    // circle πd⁴/64. Cross-check: the hexagon lies between its inscribed and circumscribed circles.
    let d = 1e-3;
    let hex = CoreShape::HexAcrossCorners.second_moment(d);
    let outer = CoreShape::Round.second_moment(d);
    let inner = CoreShape::Round.second_moment(d * 3f64.sqrt() / 2.0);
    assert!(inner < hex && hex < outer);
    assert_relative_eq!(
        hex,
        5.0 * 3f64.sqrt() / 16.0 * (d / 2.0).powi(4),
        max_relative = 1e-14
    );
}

proptest! {
    #[test]
    fn wrap_fills_pi_over_four_of_its_annulus(
        core in 0.1e-3f64..2e-3, wire in 0.05e-3f64..1e-3, rho in 1000.0f64..20000.0,
    ) {
        // Packing identity (REFERENCES §6.1, DERIVED exact): wrap term = (π/4)·ρ·annulus area.
        let outer = core + 2.0 * wire;
        let annulus = PI / 4.0 * (outer * outer - core * core);
        let wrap = physics::unit_mass_wrap_layer(rho, wire, core);
        prop_assert!((wrap / (PI / 4.0 * rho * annulus) - 1.0).abs() < 1e-12);
    }

    #[test]
    fn two_layers_add_layer_by_layer(
        core in 0.1e-3f64..2e-3, w1 in 0.05e-3f64..1e-3, w2 in 0.05e-3f64..1e-3,
    ) {
        // Multi-layer rule (REFERENCES §6.2, DERIVED): each layer seats on the diameter beneath it.
        let layers = [
            WrapLayer { density: 8960.0, wire_diameter: w1 },
            WrapLayer { density: 8860.0, wire_diameter: w2 },
        ];
        let total = physics::unit_mass_wound(7850.0, CoreShape::Round, core, &layers);
        let by_hand = physics::unit_mass_round(7850.0, core)
            + physics::unit_mass_wrap_layer(8960.0, w1, core)
            + physics::unit_mass_wrap_layer(8860.0, w2, core + 2.0 * w1);
        prop_assert!((total / by_hand - 1.0).abs() < 1e-12);
        prop_assert!(
            (physics::outer_diameter_wound(core, &layers) - (core + 2.0 * w1 + 2.0 * w2)).abs() < 1e-15
        );
    }
}

#[test]
fn wound_string_carries_load_in_its_core_only() {
    // REFERENCES §6.2 (PRACTICE): core stress = T/A_core.
    let materials = Materials::builtin().unwrap();
    let core = Core {
        material: materials.get("music-wire").unwrap(),
        shape: CoreShape::Round,
        diameter: 0.016 * METRES_PER_INCH,
    };
    let wraps = Wraps::One(Wrap {
        material: materials.get("copper").unwrap(),
        wire_diameter: 0.012 * METRES_PER_INCH,
    });
    let string = Construction::Wound { core, wraps };
    assert_relative_eq!(
        string.load_area().unwrap(),
        physics::circle_area(core.diameter)
    );
    assert_relative_eq!(
        string.outer_diameter().unwrap(),
        0.040 * METRES_PER_INCH,
        max_relative = 1e-12
    );
    // ASTM A228 Table 1 (REFERENCES §4.1, READ): 0.016 in → 362 ksi minimum.
    let strength = 362.0 * 6.894_757_293_168e6;
    assert_relative_eq!(
        string.breaking_strength().unwrap(),
        strength,
        max_relative = 1e-9
    );
    assert_relative_eq!(
        string.breaking_tension().unwrap(),
        strength * physics::circle_area(core.diameter),
        max_relative = 1e-9
    );
    // The copper's own strength is irrelevant (it has none in the data).
    assert!(materials
        .get("copper")
        .unwrap()
        .strength_at(0.3e-3)
        .is_none());
}

#[test]
fn default_nickel_wound_low_e_is_near_the_usual_tension() {
    // Common practice (from memory): a 0.046 in nickel-wound E2 on a 25.5 in scale runs near
    // 17–18 lbf. The default construction (hex core 0.40 of the outer, src/construction.rs)
    // should land within ±10 % of 17.5 lbf.
    let kinds = StringKinds::builtin().unwrap();
    let string = kinds
        .get("nickel-wound")
        .unwrap()
        .construction(0.046 * METRES_PER_INCH);
    let t = physics::tension(string.unit_mass(), 0.648, 82.4069) / NEWTONS_PER_LBF;
    assert!((t / 17.5 - 1.0).abs() < 0.10, "{t} lbf");
}

#[test]
fn measured_string_from_weighing() {
    // μ = m/l (OpenStax University Physics Vol. 1 eq. 16.7, READ; its example: 0.06 kg over
    // 2.00 m gives 0.03 kg/m).
    let m = taut::strings::construction::Measured::from_weighing(0.06, 2.00, None, None);
    assert_relative_eq!(m.unit_mass, 0.03, max_relative = 1e-14);
    let string = Construction::Measured(m);
    assert!(string.breaking_tension().is_none());
    assert!(string.load_area().is_none());
    // With a diameter and a material it is treated as a solid wire of that material.
    let nylon = Materials::builtin().unwrap().get("nylon").unwrap();
    let known = Construction::Measured(taut::strings::construction::Measured::from_weighing(
        0.06,
        2.00,
        Some(1e-3),
        Some(nylon),
    ));
    assert_relative_eq!(
        known.breaking_tension().unwrap(),
        350e6 * physics::circle_area(1e-3)
    );
}
