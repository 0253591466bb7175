//! Auditing one given string on a course: tension, stress and the breaking pitch.

#[allow(unused_imports)]
use super::*;

/// A given string audited on a course.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Evaluation {
    /// Linear density, kg/m.
    pub unit_mass: f64,
    /// Tension at the pitch, N.
    pub tension: f64,
    /// Stress in the load-bearing section / breaking strength, if the strength is known.
    pub stress_ratio: Option<f64>,
    /// Frequency at which it breaks on this length, Hz, if the strength is known.
    pub break_frequency: Option<f64>,
    /// Flags (stress, window, slot, unknown strength).
    pub warnings: Warnings,
}

/// Audits a concrete string at `frequency` (Hz) on vibrating length `length` (m): tension
/// T = μ(2Lf)² (REFERENCES §1.2), stress ratio against the load-bearing section's strength, and
/// the breaking pitch.
pub fn evaluate(
    string: &Construction<'_>,
    frequency: f64,
    length: f64,
    checks: &Checks,
) -> Evaluation {
    let unit_mass = string.unit_mass();
    let tension = physics::tension(unit_mass, length, frequency);
    let breaking = string.breaking_tension();
    let stress_ratio = breaking.map(|b| tension / b);
    let warnings = stress_flags(stress_ratio.unwrap_or(f64::NAN), checks.limits)
        .union(check_flags(tension, string.outer_diameter(), checks));
    Evaluation {
        unit_mass,
        tension,
        stress_ratio,
        break_frequency: breaking.map(|b| physics::breaking_frequency(b, unit_mass, length)),
        warnings,
    }
}
