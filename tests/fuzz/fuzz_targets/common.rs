//! Checks shared by the targets: what any accepted tuning or plan must satisfy.

use taut::tuning::Tuning;

/// Degrees a user can ask for, including the far ends of `i64`.
const DEGREES: [i64; 9] = [i64::MIN, -100_000, -50, -1, 0, 1, 19, 100_000, i64::MAX];

/// Every degree the tuning can address has a finite, positive frequency; the nearest degree to a
/// few frequencies exists or is refused without panic.
pub fn check_tuning(tuning: &Tuning) {
    for k in DEGREES {
        if let Ok(pitch) = tuning.degree(k) {
            assert!(pitch.hz.is_finite() && pitch.hz > 0.0, "degree {k}: {} Hz", pitch.hz);
        }
    }
    for hz in [1e-300, 27.5, 440.0, 1e300, f64::MAX] {
        if let Some(pitch) = tuning.nearest_degree(hz) {
            assert!(pitch.hz.is_finite() && pitch.hz > 0.0, "near {hz}: {} Hz", pitch.hz);
        }
    }
    let _ = tuning.summary();
}
