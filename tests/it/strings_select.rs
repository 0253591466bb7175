//! The per-course selector and the audit of a given string: choice rule, neighbours, every
//! warning flag (one case that raises it, one that does not), and recomputation properties.

use approx::assert_relative_eq;
use proptest::prelude::*;
use taut::input::units::METRES_PER_INCH;
use taut::strings::construction::{Construction, Measured};
use taut::strings::kind::{StringKind, StringKinds};
use taut::strings::material::Materials;
use taut::strings::physics;
use taut::strings::select::{
    evaluate, select, Checks, Choice, Request, Selection, StressLimits, Warnings,
};

// Pitches: 12-TET at A4 = 440 Hz (ISO 16; REFERENCES §7.2, DERIVED values).
const D4: f64 = 293.664_8;
const E4: f64 = 329.627_6;
const G4: f64 = 391.995_4;
const A4: f64 = 440.0;
const SCALE: f64 = 0.648;

fn kinds(ids: &[&str]) -> Vec<&'static StringKind> {
    let all = StringKinds::builtin().unwrap();
    ids.iter().map(|id| all.get(id).unwrap()).collect()
}

fn run(request: &Request, ids: &[&str]) -> (Selection, Vec<Option<Choice>>) {
    let kinds = kinds(ids);
    let mut best = vec![None; kinds.len()];
    let selection = select(request, &kinds, &mut best);
    (selection, best)
}

fn chosen(request: &Request, ids: &[&str]) -> Choice {
    run(request, ids).0.chosen.unwrap()
}

#[test]
fn plain_e4_on_648_mm_picks_the_ten_thousandths() {
    // 72.6 N is what 0.010 in plain steel needs at E4 on 648 mm (physics_mersenne, DERIVED from
    // ρ = 7850 kg/m³), so the selector must land exactly there.
    let request = Request::new(E4, SCALE, 72.59);
    let (selection, best) = run(&request, &["plain-steel"]);
    let choice = selection.chosen.unwrap();
    assert_relative_eq!(
        choice.diameter,
        0.010 * METRES_PER_INCH,
        max_relative = 1e-12
    );
    assert!(choice.tension_error.abs() < 1e-3);
    assert_relative_eq!(
        selection.required_unit_mass,
        physics::unit_mass_for_tension(72.59, SCALE, E4),
        max_relative = 1e-14
    );
    assert!(
        selection.warnings.is_empty(),
        "{:?}",
        selection.warnings.names().collect::<Vec<_>>()
    );
    assert_eq!(best[0], Some(choice));
    // Neighbours in the same kind: 0.0095 in and 0.0105 in.
    assert_relative_eq!(
        selection.thinner.unwrap().diameter,
        0.0095 * METRES_PER_INCH,
        max_relative = 1e-12
    );
    assert_relative_eq!(
        selection.thicker.unwrap().diameter,
        0.0105 * METRES_PER_INCH,
        max_relative = 1e-12
    );
    // Stress ratio = ρ(2Lf)²/S with S = 387 ksi (ASTM A228 Table 1, 0.010 in): 0.537 (DERIVED).
    assert_relative_eq!(choice.stress_ratio, 0.5369, epsilon = 5e-4);
    // Break pitch is that of any plain steel string on this length: 449.9 Hz (DERIVED).
    assert_relative_eq!(choice.break_frequency, 449.86, max_relative = 1e-4);
}

#[test]
fn stress_caution_is_raised_above_065_and_not_below() {
    // Plain steel on 648 mm breaks at ≈ 450 Hz whatever its gauge (ASTM A228 + ρ, DERIVED):
    // G4 is at (392/450)² ≈ 0.76 of breaking stress, E4 at 0.54.
    let g4 = chosen(&Request::new(G4, SCALE, 100.0), &["plain-steel"]);
    assert!(g4.warnings.contains(Warnings::STRESS_CAUTION));
    assert!(!g4.warnings.contains(Warnings::STRESS_DANGER));
    let e4 = chosen(&Request::new(E4, SCALE, 72.59), &["plain-steel"]);
    assert!(!e4.warnings.contains(Warnings::STRESS_CAUTION));
}

#[test]
fn stress_danger_is_raised_above_085_and_not_below() {
    // A4 on 648 mm is at ≈ 0.96 of breaking stress for plain steel (DERIVED as above).
    let a4 = chosen(&Request::new(A4, SCALE, 100.0), &["plain-steel"]);
    assert!(a4.warnings.contains(Warnings::STRESS_DANGER));
    assert!(!a4.warnings.contains(Warnings::STRESS_CAUTION));
    let g4 = chosen(&Request::new(G4, SCALE, 100.0), &["plain-steel"]);
    assert!(!g4.warnings.contains(Warnings::STRESS_DANGER));
}

#[test]
fn thinner_and_thicker_than_catalog() {
    // 30 N at E4 needs d ≈ 0.0064 in, below the catalog's 0.007 in.
    let light = run(&Request::new(E4, SCALE, 30.0), &["plain-steel"]).0;
    assert!(light.warnings.contains(Warnings::THINNER_THAN_CATALOG));
    assert_relative_eq!(
        light.chosen.unwrap().diameter,
        0.007 * METRES_PER_INCH,
        max_relative = 1e-12
    );
    assert!(light.thinner.is_none());
    // 700 N needs far more than 0.026 in.
    let heavy = run(&Request::new(E4, SCALE, 700.0), &["plain-steel"]).0;
    assert!(heavy.warnings.contains(Warnings::THICKER_THAN_CATALOG));
    assert!(heavy.thicker.is_none());
    assert!(!light.warnings.contains(Warnings::THICKER_THAN_CATALOG));
    assert!(!heavy.warnings.contains(Warnings::THINNER_THAN_CATALOG));
    let normal = run(&Request::new(E4, SCALE, 72.59), &["plain-steel"]).0;
    assert!(!normal
        .warnings
        .intersects(Warnings::THINNER_THAN_CATALOG.union(Warnings::THICKER_THAN_CATALOG)));
}

#[test]
fn slot_width_limits_the_choice_and_flags_only_when_nothing_fits() {
    let mut request = Request::new(E4, SCALE, 72.59);
    request.checks.widest = Some(0.009 * METRES_PER_INCH);
    let capped = chosen(&request, &["plain-steel"]);
    assert!(capped.diameter <= 0.009 * METRES_PER_INCH * (1.0 + 1e-12));
    assert!(!capped.warnings.contains(Warnings::WIDER_THAN_SLOT));
    request.checks.widest = Some(0.005 * METRES_PER_INCH);
    let too_narrow = chosen(&request, &["plain-steel"]);
    assert!(too_narrow.warnings.contains(Warnings::WIDER_THAN_SLOT));
    request.checks.widest = Some(0.020 * METRES_PER_INCH);
    assert!(!chosen(&request, &["plain-steel"])
        .warnings
        .contains(Warnings::WIDER_THAN_SLOT));
}

#[test]
fn tension_window_flags_below_and_above() {
    let mut request = Request::new(E4, SCALE, 72.59);
    request.checks.min_tension = Some(80.0);
    let below = run(&request, &["plain-steel"]).0;
    assert!(below.warnings.contains(Warnings::BELOW_WINDOW));
    assert!(!below.warnings.contains(Warnings::ABOVE_WINDOW));
    request.checks.min_tension = None;
    request.checks.max_tension = Some(60.0);
    let above = run(&request, &["plain-steel"]).0;
    assert!(above.warnings.contains(Warnings::ABOVE_WINDOW));
    assert!(!above.warnings.contains(Warnings::BELOW_WINDOW));
    request.checks.min_tension = Some(60.0);
    request.checks.max_tension = Some(80.0);
    let inside = run(&request, &["plain-steel"]).0;
    assert!(!inside
        .warnings
        .intersects(Warnings::BELOW_WINDOW.union(Warnings::ABOVE_WINDOW)));
}

#[test]
fn none_within_tolerance_is_flagged_only_when_every_kind_misses() {
    // Midway between 0.010 in (72.6 N) and 0.0105 in (80.0 N): about 5 % from either.
    let mut request = Request::new(E4, SCALE, 76.3);
    request.tolerance = 0.01;
    let missed = run(&request, &["plain-steel"]).0;
    assert!(missed.warnings.contains(Warnings::NONE_WITHIN_TOLERANCE));
    request.tolerance = 0.10;
    let hit = run(&request, &["plain-steel"]).0;
    assert!(!hit.warnings.contains(Warnings::NONE_WITHIN_TOLERANCE));
    // A second kind that can meet the target clears the flag.
    request.tolerance = 0.01;
    let either = run(&request, &["plain-steel", "nylon"]).0;
    assert!(!either.warnings.contains(Warnings::NONE_WITHIN_TOLERANCE));
}

#[test]
fn strength_unknown_only_for_a_measured_string_without_material() {
    let checks = Checks::default();
    let unknown = Construction::Measured(Measured {
        unit_mass: 4e-4,
        diameter: Some(0.254e-3),
        material: None,
    });
    let audit = evaluate(&unknown, E4, SCALE, &checks);
    assert!(audit.warnings.contains(Warnings::STRENGTH_UNKNOWN));
    assert!(audit.stress_ratio.is_none() && audit.break_frequency.is_none());
    let wire = Materials::builtin().unwrap().get("music-wire").unwrap();
    let known = Construction::Measured(Measured {
        unit_mass: 4e-4,
        diameter: Some(0.254e-3),
        material: Some(wire),
    });
    let audit = evaluate(&known, E4, SCALE, &checks);
    assert!(!audit.warnings.contains(Warnings::STRENGTH_UNKNOWN));
    assert!(audit.stress_ratio.is_some());
}

#[test]
fn evaluate_flags_slot_window_and_stress_for_an_installed_string() {
    let wire = Materials::builtin().unwrap().get("music-wire").unwrap();
    let string = Construction::Plain {
        material: wire,
        diameter: 0.010 * METRES_PER_INCH,
    };
    let checks = Checks {
        min_tension: Some(80.0),
        max_tension: None,
        widest: Some(0.009 * METRES_PER_INCH),
        limits: StressLimits::default(),
    };
    let audit = evaluate(&string, A4, SCALE, &checks);
    assert!(audit.warnings.contains(Warnings::WIDER_THAN_SLOT));
    assert!(audit.warnings.contains(Warnings::STRESS_DANGER));
    assert!(!audit.warnings.contains(Warnings::BELOW_WINDOW)); // 129 N at A4
    let relaxed = evaluate(&string, E4, SCALE, &Checks::default());
    assert!(relaxed.warnings.is_empty());
    assert_relative_eq!(relaxed.tension, 72.59, max_relative = 2e-4);
    assert_relative_eq!(
        relaxed.break_frequency.unwrap(),
        449.86,
        max_relative = 1e-4
    );
}

#[test]
fn first_acceptable_kind_in_the_callers_order_wins() {
    // Both plain steel and nylon meet 72.6 N at E4 within tolerance and below the danger limit.
    let request = Request::new(E4, SCALE, 72.59);
    let (selection, best) = run(&request, &["nylon", "plain-steel"]);
    assert_eq!(selection.chosen.unwrap().kind, 0);
    assert!(best[1].is_some());
    let (selection, _) = run(&request, &["plain-steel", "nylon"]);
    assert_eq!(selection.chosen.unwrap().kind, 0);
    assert_relative_eq!(
        selection.chosen.unwrap().diameter,
        0.010 * METRES_PER_INCH,
        max_relative = 1e-12
    );
}

#[test]
fn a_dangerous_first_choice_gives_way_to_a_safe_one() {
    // At D4 on 648 mm the stress ratio is ρ(2Lf)²/S: nylon 0.47 (1140 kg/m³, 350 MPa) and plain
    // steel 0.43 (7850 kg/m³, A228). With the danger limit at 0.45, nylon is out (DERIVED).
    let mut request = Request::new(D4, SCALE, 60.0);
    request.checks.limits = StressLimits {
        caution: 0.40,
        danger: 0.45,
    };
    let selection = run(&request, &["nylon", "plain-steel"]).0;
    let choice = selection.chosen.unwrap();
    assert_eq!(choice.kind, 1);
    assert!(!choice.warnings.contains(Warnings::STRESS_DANGER));
}

#[test]
fn with_nothing_acceptable_the_smallest_tension_error_wins() {
    let mut request = Request::new(E4, SCALE, 76.3);
    request.tolerance = 1e-9;
    let (selection, best) = run(&request, &["plain-steel", "nylon", "fluorocarbon"]);
    let choice = selection.chosen.unwrap();
    for other in best.iter().flatten() {
        if !other.warnings.contains(Warnings::STRESS_DANGER) {
            assert!(choice.tension_error.abs() <= other.tension_error.abs());
        }
    }
}

#[test]
fn warning_names_are_stable() {
    let flags = Warnings::STRESS_CAUTION.union(Warnings::WIDER_THAN_SLOT);
    assert_eq!(
        flags.names().collect::<Vec<_>>(),
        ["stress-caution", "wider-than-slot"]
    );
    assert!(Warnings::NONE.names().next().is_none());
}

#[test]
fn selector_and_audit_agree_on_the_same_string() {
    let request = Request::new(110.0, SCALE, 80.0);
    let (selection, _) = run(&request, &["phosphor-bronze-wound"]);
    let choice = selection.chosen.unwrap();
    let kind = kinds(&["phosphor-bronze-wound"])[0];
    let audit = evaluate(
        &kind.construction(choice.diameter),
        110.0,
        SCALE,
        &Checks::default(),
    );
    assert_relative_eq!(audit.tension, choice.tension, max_relative = 1e-12);
    assert_relative_eq!(
        audit.stress_ratio.unwrap(),
        choice.stress_ratio,
        max_relative = 1e-12
    );
    assert_relative_eq!(
        audit.break_frequency.unwrap(),
        choice.break_frequency,
        max_relative = 1e-12
    );
}

proptest! {
    #[test]
    fn selection_recomputes_to_the_requested_pitch(
        f in 40.0f64..1500.0, length in 0.2f64..1.5, target in 20.0f64..200.0,
    ) {
        let request = Request::new(f, length, target);
        let ids = ["plain-steel", "nickel-wound", "nylon", "copper-double-wound-steel"];
        let (selection, best) = run(&request, &ids);
        let choice = selection.chosen.unwrap();
        let back = physics::frequency(choice.tension, choice.unit_mass, length);
        prop_assert!((back / f - 1.0).abs() < 1e-9);
        let t = physics::tension(selection.required_unit_mass, length, f);
        prop_assert!((t / target - 1.0).abs() < 1e-12);
        // The best gauge of each kind is the nearest by tension error.
        let all = kinds(&ids);
        for (kind, best) in all.iter().zip(&best) {
            let best = best.unwrap();
            for gauge in kind.gauges() {
                let error = (gauge.unit_mass / selection.required_unit_mass - 1.0).abs();
                prop_assert!(best.tension_error.abs() <= error + 1e-12);
            }
        }
    }
}

#[test]
fn a_kind_in_caution_loses_to_a_later_kind_on_target() {
    // D4 on 648 mm: music wire at 0.43 and nylon at 0.47 of their strength (DERIVED above).
    // With caution at 0.45, nylon first in the list is only "with reservations".
    let mut request = Request::new(D4, SCALE, 60.0);
    request.checks.limits = StressLimits {
        caution: 0.45,
        danger: 0.80,
    };
    let (selection, best) = run(&request, &["nylon", "plain-steel"]);
    let nylon = best[0].unwrap();
    assert!(nylon.warnings.contains(Warnings::STRESS_CAUTION));
    assert_eq!(
        taut::strings::select::standing(&nylon, request.tolerance),
        taut::strings::select::Standing::WithReservations
    );
    assert_eq!(selection.chosen.unwrap().kind, 1);
    assert_eq!(
        selection.standing,
        taut::strings::select::Standing::OnTarget
    );
    // Alone, nylon is still chosen, and says so.
    let (alone, _) = run(&request, &["nylon"]);
    assert_eq!(
        alone.standing,
        taut::strings::select::Standing::WithReservations
    );
}
