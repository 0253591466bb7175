//! Smoothing the bridge line inside each course's tension window.
//!
//! Each course i has a target xᵢ* and a window [loᵢ, hiᵢ] for x = ln L, the logarithm of its
//! vibrating length (L = √(T/μ)/(2f), REFERENCES §1.2, so the tension window bounds it). A
//! bridge line without kinks has small second differences of x from course to course.
//! [`smooth`] minimises
//!
//! J(x) = Σ (xᵢ₋₁ − 2xᵢ + xᵢ₊₁)² + w·Σ (xᵢ − xᵢ*)²
//!
//! subject to loᵢ ≤ xᵢ ≤ hiᵢ: squared second differences (kinks in the line) plus a pull of
//! weight w towards the targets. J is a convex quadratic and the constraints are a box, so
//! projected Gauss–Seidel (minimise in one coordinate at a time, clamp, repeat) converges to the
//! minimum (the standard result for strictly convex quadratics over a box; Bertsekas, *Nonlinear
//! Programming*, §2.7 on coordinate descent, from memory).

/// Sweeps at most; each costs a few operations per course, and the change per sweep shrinks
/// geometrically, so a thousand courses settle well within this.
const MAX_SWEEPS: usize = 20_000;
/// A sweep moving no coordinate more than this (in ln units, 10⁻¹⁰ ≈ a 10⁻⁸ % change of
/// length) ends the iteration.
const SETTLED: f64 = 1e-10;

/// The smoothed values for `targets` inside `[lows[i], highs[i]]` with target weight `pull`
/// (> 0). A course whose window is a single point stays there. All slices have one entry per
/// course; a window that does not contain its target is widened to contain it.
pub fn smooth(targets: &[f64], lows: &[f64], highs: &[f64], pull: f64) -> Vec<f64> {
    let n = targets.len();
    let low = |i: usize| lows[i].min(targets[i]);
    let high = |i: usize| highs[i].max(targets[i]);
    let mut x: Vec<f64> = targets.to_vec();
    if n < 3 {
        return x;
    }
    for _ in 0..MAX_SWEEPS {
        let mut moved: f64 = 0.0;
        for i in 0..n {
            // J as a function of xᵢ alone is a·xᵢ² − 2b·xᵢ + const; its minimum is b/a.
            let mut a = pull;
            let mut b = pull * targets[i];
            // Second-difference terms j (centre j, from j−1 to j+1) that contain xᵢ, with the
            // coefficient of xᵢ in each and the sum of the other two entries.
            for centre in i.saturating_sub(1)..=(i + 1).min(n - 1) {
                if centre == 0 || centre == n - 1 {
                    continue;
                }
                let coefficient = if centre == i { -2.0 } else { 1.0 };
                let rest = x[centre - 1] - 2.0 * x[centre] + x[centre + 1] - coefficient * x[i];
                a += coefficient * coefficient;
                b -= coefficient * rest;
            }
            let next = (b / a).clamp(low(i), high(i));
            moved = moved.max((next - x[i]).abs());
            x[i] = next;
        }
        if moved < SETTLED {
            break;
        }
    }
    x
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn fixed_windows_keep_the_targets() {
        let targets = [1.0, 1.5, 1.2, 2.0];
        assert_eq!(smooth(&targets, &targets, &targets, 0.05), targets);
    }

    #[test]
    fn a_kink_is_smoothed_inside_wide_windows() {
        // A line with one course pushed up: with room to move, it goes back onto the line.
        let targets = [0.0, 1.0, 2.0, 3.5, 4.0, 5.0, 6.0];
        let x = smooth(&targets, &[-10.0; 7], &[10.0; 7], 1e-3);
        let kink = |v: &[f64]| (v[2] - 2.0 * v[3] + v[4]).abs();
        assert!(kink(&x) < 0.2 * kink(&targets), "{x:?}");
        // Narrow windows hold it near its target.
        let lows: Vec<f64> = targets.iter().map(|t| t - 0.01).collect();
        let highs: Vec<f64> = targets.iter().map(|t| t + 0.01).collect();
        let held = smooth(&targets, &lows, &highs, 1e-3);
        for (value, target) in held.iter().zip(targets) {
            assert!((value - target).abs() <= 0.01 + 1e-12);
        }
    }
}
