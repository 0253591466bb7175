//! The stiffness model of plain steel through the binary: continuous in diameter (no step at a
//! size-range edge of the modulus table) and still on its published anchors.

use crate::common::{audit_of, number};

const IN: f64 = 0.0254;
const LENGTH: f64 = 1.0;
const PITCH: f64 = 110.0;

/// Audits plain-steel strings of the given diameters (inches), one per course, at A2 on 1 m, and
/// returns each string's diameter (m) and reported inharmonicity B.
fn reported_b(diameters_in: &[f64]) -> Vec<(f64, f64)> {
    let mut instrument = String::from(
        "name: Test wires\ntuning: 12edo\nscale_length: 1000mm\ndefaults:\n  kinds: [plain-steel]\ncourses:\n",
    );
    let mut set = String::from("name: wires\ncourses:\n");
    for d in diameters_in {
        instrument.push_str("  - pitch: A2\n");
        set.push_str(&format!(
            "  - strings: [{{kind: plain-steel, diameter: {d:.5}in}}]\n"
        ));
    }
    let report = audit_of(&instrument, &set);
    report["courses"]
        .as_array()
        .unwrap()
        .iter()
        .map(|course| {
            let string = &course["strings"][0];
            (
                number(&string["diameter_mm"]) / 1000.0,
                number(&string["feel"]["inharmonicity_b"]),
            )
        })
        .collect()
}

/// The modulus a reported B implies for a plain wire: B = π²·(E/ρ)·d²/(64·f²·L⁴) (Fletcher
/// 1964, REFERENCES §5.1; the plain-wire form there), solved for E with ρ = 7850 kg/m³ (§2.1).
fn implied_modulus(diameter: f64, b: f64) -> f64 {
    b * 64.0 * PITCH.powi(2) * LENGTH.powi(4) * 7850.0
        / (std::f64::consts::PI.powi(2) * diameter.powi(2))
}

#[test]
fn plain_steel_stiffness_has_no_step_at_0_032_in() {
    // Before, the modulus stepped from 203.4 to 200 GPa just above 0.032 in: B fell 1.7 % between
    // two strings a tenth of a thousandth apart. Now neighbours differ by far less.
    let diameters: Vec<f64> = (0..=20).map(|i| 0.0310 + 0.0001 * f64::from(i)).collect();
    let moduli: Vec<f64> = reported_b(&diameters)
        .into_iter()
        .map(|(d, b)| implied_modulus(d, b))
        .collect();
    for pair in moduli.windows(2) {
        let change = (pair[1] / pair[0] - 1.0).abs();
        assert!(
            change < 0.001,
            "modulus jumps {change:.4} between neighbours: {moduli:?}"
        );
    }
}

#[test]
fn plain_steel_stiffness_stays_on_its_published_anchors() {
    let rows = reported_b(&[0.020, 0.032, 0.045, 0.063, 0.100]);
    let moduli: Vec<f64> = rows.iter().map(|&(d, b)| implied_modulus(d, b)).collect();
    // Shigley 9th ed., Table 10-5 (REFERENCES §3.1, READ): 29.5 Mpsi (203.4 GPa) up to 0.032 in,
    // 29.0 (200) to 0.063, 28.5 (196.5) to 0.125. Exact at the tops of the ranges, within 1.8 %
    // of the row inside a range.
    for (e, row, tolerance) in [
        (moduli[0], 203.4e9, 1e-3),
        (moduli[1], 203.4e9, 1e-3),
        (moduli[2], 200e9, 0.0182),
        (moduli[3], 200e9, 1e-3),
        (moduli[4], 196.5e9, 0.0182),
    ] {
        assert!((e / row - 1.0).abs() < tolerance, "{e} against {row}");
    }
    // Young (1952), REFERENCES §5.2 (READ): for steel Q/ρ = 25.5×10¹⁰ cm²/s², i.e. E = 200.2 GPa
    // at 7850 kg/m³; Fletcher's B with the reported stiffness stays within 2 % of it across the
    // whole range.
    let young = 25.5e10 * 1e-4 * 7850.0;
    for e in &moduli {
        assert!((e / young - 1.0).abs() < 0.02, "{e} against {young}");
    }
    // And B itself is Fletcher's π³·E·d⁴/(64·T·L²) with T = μ(2Lf)² (REFERENCES §1.2): for
    // 0.020 in at A2 on 1 m, T = 7850·π·(0.508e-3)²/4·(2·1·110)² = 77.0 N, B = 8.52e-5 (DERIVED).
    let (d, b) = rows[0];
    assert!((d / (0.020 * IN) - 1.0).abs() < 1e-9);
    let tension = 7850.0 * std::f64::consts::PI * d * d / 4.0 * (2.0 * LENGTH * PITCH).powi(2);
    let fletcher =
        std::f64::consts::PI.powi(3) * 203.4e9 * d.powi(4) / (64.0 * tension * LENGTH * LENGTH);
    assert!((b / fletcher - 1.0).abs() < 1e-6, "{b} against {fletcher}");
}
