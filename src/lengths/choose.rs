//! Choosing a course's string together with its length, for courses that name the kinds they
//! may take instead of a string.
//!
//! With the length free, any gauge can meet a tension: L = √(T/μ)/(2f) (REFERENCES §1.2). What
//! picks the gauge is the bridge line. The choice runs in two steps, then the layout's usual
//! smoothing ([`super::smooth`]) places the chosen strings:
//!
//! 1. **A reference line.** For each course, the lengths its first allowed kind can reach form
//!    an interval in x = ln L: from the heaviest gauge at the lowest tension of the window to the
//!    lightest at the highest, cut to the layout's `length_window` and to the longest length at
//!    which some gauge of the kind stays below the caution stress at the course's highest pitch
//!    (a pulling raise included). Its natural point is the length at which the kind's middle
//!    gauge works at the layout's working stress (`working_stress`, default
//!    [`DEFAULT_WORKING_STRESS`]), kept inside the interval: for a plain string the stress
//!    σ = ρ(2fL)² depends on the length alone (REFERENCES §1.2), so this is the maker's way of
//!    scaling a treble by stress and letting the tension profile pick the gauge. The
//!    same smoothing as the window uses (squared second differences of x plus a pull towards
//!    these points, inside the intervals) draws the reference line through them.
//! 2. **A string per course.** Along the kinds in the course's order of preference (the kinds
//!    of a matching `prefer` rule first, then the course's own), the gauge whose length at the
//!    target tension is nearest the reference line; the first kind whose gauge can sit inside
//!    the tension and length windows below the caution stress is taken. When none can, the
//!    gauge nearest the line of the first kind is taken and the layout's warnings say what is
//!    wrong with it.
//!
//! The choice is our own rule, in the spirit of the plan's choice rule (`taut help choice`):
//! practitioners change construction (nylon to wound) before stringing at the end of a catalog
//! or near the elastic limit.

use crate::instrument::TensionGoal;
use crate::strings::kind::{Gauge, StringKind};
use crate::strings::select::{StressLimits, DEFAULT_TOLERANCE};

use super::smooth;

/// The working stress the reference line aims at by default: half the breaking stress, the
/// low end of the band harp makers work in, three to six semitones below the breaking pitch
/// (REFERENCES §9, common practice), and below the caution limit with room for a raise.
pub const DEFAULT_WORKING_STRESS: f64 = 0.5;
use super::TARGET_PULL;

/// What the chooser needs of one course.
#[derive(Debug, Clone)]
pub struct Need<'k> {
    /// The first string's frequency at its lowest position, Hz.
    pub hz: f64,
    /// The tension goal.
    pub goal: TensionGoal,
    /// The largest ratio a pulling raise multiplies the frequency by (1 without one): the
    /// tension, and so the stress, grows by its square at that position (REFERENCES §8.3).
    pub pull: f64,
    /// The linear density of a string the file names, kg/m; `None` for a string to choose.
    pub named_unit_mass: Option<f64>,
    /// The kinds to choose from, in order of preference.
    pub kinds: Vec<&'k StringKind>,
}

/// The limits every choice respects.
#[derive(Debug, Clone, Copy)]
pub struct Limits {
    /// The stress limits; a chosen string stays below the caution.
    pub stress: StressLimits,
    /// The working stress the reference line aims at, as a fraction of the breaking stress.
    pub working: f64,
    /// The shortest vibrating length allowed, m.
    pub shortest: Option<f64>,
    /// The longest vibrating length allowed, m.
    pub longest: Option<f64>,
}

impl Limits {
    fn bounds(&self) -> (f64, f64) {
        (
            self.shortest.map_or(f64::NEG_INFINITY, f64::ln),
            self.longest.map_or(f64::INFINITY, f64::ln),
        )
    }
}

/// The tension window of a goal, N (a single point when it has none).
fn window(goal: &TensionGoal) -> (f64, f64) {
    match (goal.min_n, goal.max_n) {
        (None, None) => (
            goal.target_n * (1.0 - DEFAULT_TOLERANCE),
            goal.target_n * (1.0 + DEFAULT_TOLERANCE),
        ),
        (min, max) => (min.unwrap_or(goal.target_n), max.unwrap_or(goal.target_n)),
    }
}

/// ln L for tension `tension` on a string of `unit_mass` at `hz`: L = √(T/μ)/(2f), §1.2.
fn log_length(tension: f64, unit_mass: f64, hz: f64) -> f64 {
    0.5 * (tension / unit_mass).ln() - (2.0 * hz).ln()
}

/// ln of the longest length at which `gauge` stays at or below `ratio` of its breaking tension
/// at `hz`: T = μ(2fL)² ≤ ratio·T_break.
fn log_stress_length(gauge: &Gauge, ratio: f64, hz: f64) -> f64 {
    let allowed = ratio * gauge.breaking_tension / gauge.unit_mass;
    if allowed.is_finite() && allowed > 0.0 {
        0.5 * allowed.ln() - (2.0 * hz).ln()
    } else {
        f64::NEG_INFINITY
    }
}

/// The interval of x = ln L a kind can reach on a course, and its natural point.
fn kind_reach(kind: &StringKind, need: &Need<'_>, limits: &Limits) -> Option<(f64, f64, f64)> {
    let gauges = kind.gauges();
    let (first, last) = (gauges.first()?, gauges.last()?);
    let (low_t, high_t) = window(&need.goal);
    let (shortest, longest) = limits.bounds();
    let stress_cap = gauges
        .iter()
        .map(|g| log_stress_length(g, limits.stress.caution, need.hz * need.pull))
        .fold(f64::NEG_INFINITY, f64::max);
    let low = log_length(low_t, last.unit_mass, need.hz).max(shortest);
    let high = log_length(high_t, first.unit_mass, need.hz)
        .min(longest)
        .min(stress_cap);
    let middle = &gauges[gauges.len() / 2];
    let natural = log_stress_length(middle, limits.working, need.hz * need.pull);
    (low <= high).then(|| (low, high, natural.clamp(low, high)))
}

/// Where a gauge would sit on the reference line `x`: the length nearest `x` that its tension
/// window and the length window allow, and whether it is acceptable there (inside both windows,
/// below the caution stress at the highest position, not a plain string thicker than common
/// practice strings it).
fn place(gauge: &Gauge, need: &Need<'_>, limits: &Limits, x: f64) -> (f64, bool) {
    let (low_t, high_t) = window(&need.goal);
    let (shortest, longest) = limits.bounds();
    let low = log_length(low_t, gauge.unit_mass, need.hz).max(shortest);
    // Its own stress cap too, a hair below the caution so rounding cannot tip it over.
    let cap = log_stress_length(
        gauge,
        limits.stress.caution * (1.0 - 1e-6),
        need.hz * need.pull,
    );
    let high = log_length(high_t, gauge.unit_mass, need.hz)
        .min(longest)
        .min(cap);
    if low > high {
        return (x, false);
    }
    let at = x.clamp(low, high);
    let tension = gauge.unit_mass * (2.0 * need.hz * at.exp()).powi(2);
    let stress = tension * need.pull * need.pull / gauge.breaking_tension;
    (
        at,
        stress <= limits.stress.caution && !gauge.thick_for_plain,
    )
}

/// Makes the reference line run against the pitch (a lower course never shorter than a higher
/// one), where the courses' pitches run one way: the smoothing alone can bend a line that
/// reaches the longest length down again, which a bridge cannot follow. The nearest such line
/// in least squares is the pool-adjacent-violators solution of isotonic regression (Barlow,
/// Bartholomew, Bremner and Brunk, *Statistical Inference under Order Restrictions*, 1972,
/// from memory); it is then kept inside each course's interval.
fn keep_direction(line: &mut [f64], needs: &[Need<'_>], lows: &[f64], highs: &[f64]) {
    let rising = needs.windows(2).all(|w| w[1].hz >= w[0].hz);
    let falling = needs.windows(2).all(|w| w[1].hz <= w[0].hz);
    if line.len() < 2 || !(rising || falling) {
        return;
    }
    // In course order, x must not increase when the pitch rises, and not decrease when it
    // falls; work on a non-decreasing sequence.
    let sign = if rising { -1.0 } else { 1.0 };
    // Blocks of (sum, count), merged while they break the order.
    let mut blocks: Vec<(f64, usize)> = Vec::with_capacity(line.len());
    for &x in line.iter() {
        blocks.push((sign * x, 1));
        while blocks.len() > 1 {
            let (last_sum, last_count) = blocks[blocks.len() - 1];
            let (prev_sum, prev_count) = blocks[blocks.len() - 2];
            if prev_sum / prev_count as f64 <= last_sum / last_count as f64 {
                break;
            }
            blocks.pop();
            if let Some(prev) = blocks.last_mut() {
                *prev = (prev_sum + last_sum, prev_count + last_count);
            }
        }
    }
    let mut index = 0;
    for (sum, count) in blocks {
        for _ in 0..count {
            line[index] =
                (sign * sum / count as f64).clamp(lows[index], highs[index].max(lows[index]));
            index += 1;
        }
    }
}

/// How many catalog steps either side of the nearest gauge the chooser tries in one kind.
const NEIGHBOURS: usize = 4;

/// The gauge of `kind` whose linear density is nearest `unit_mass` (in ratio).
pub fn nearest_gauge(kind: &StringKind, unit_mass: f64) -> Option<usize> {
    let gauges = kind.gauges();
    if gauges.is_empty() || unit_mass.is_nan() || unit_mass <= 0.0 {
        return None;
    }
    let above = gauges.partition_point(|g| g.unit_mass < unit_mass);
    let error = |i: usize| (gauges[i].unit_mass / unit_mass).ln().abs();
    Some(match above {
        0 => 0,
        n if n == gauges.len() => n - 1,
        n if error(n - 1) <= error(n) => n - 1,
        n => n,
    })
}

/// For each course, the chosen kind (an index into its `kinds`) and gauge; `None` for a course
/// whose string is named, or whose kinds have no gauges.
pub fn choose(needs: &[Need<'_>], limits: &Limits) -> Vec<Option<(usize, usize)>> {
    let count = needs.len();
    let mut lows = Vec::with_capacity(count);
    let mut highs = Vec::with_capacity(count);
    let mut naturals = Vec::with_capacity(count);
    for need in needs {
        let (low_t, high_t) = window(&need.goal);
        let reach = match need.named_unit_mass {
            Some(unit_mass) => {
                let natural = log_length(need.goal.target_n, unit_mass, need.hz);
                Some((
                    log_length(low_t, unit_mass, need.hz).min(natural),
                    log_length(high_t, unit_mass, need.hz).max(natural),
                    natural,
                ))
            }
            None => need
                .kinds
                .iter()
                .find_map(|kind| kind_reach(kind, need, limits))
                // No kind reaches the windows: aim at the first kind's natural point and let
                // the warnings say why it falls short.
                .or_else(|| {
                    let kind = need.kinds.first()?;
                    let (first, last) = (kind.gauges().first()?, kind.gauges().last()?);
                    let x = log_length(
                        need.goal.target_n,
                        (first.unit_mass * last.unit_mass).sqrt(),
                        need.hz,
                    );
                    Some((x, x, x))
                }),
        };
        let (low, high, natural) = reach.unwrap_or((0.0, 0.0, 0.0));
        lows.push(low);
        highs.push(high);
        naturals.push(natural);
    }
    let mut line = smooth::smooth(&naturals, &lows, &highs, TARGET_PULL);
    keep_direction(&mut line, needs, &lows, &highs);
    needs
        .iter()
        .zip(line)
        .map(|(need, x)| {
            if need.named_unit_mass.is_some() {
                return None;
            }
            let unit_mass_at = |x: f64| need.goal.target_n / (2.0 * need.hz * x.exp()).powi(2);
            let mut fallback = None;
            for (index, kind) in need.kinds.iter().enumerate() {
                let Some(gauge) = nearest_gauge(kind, unit_mass_at(x)) else {
                    continue;
                };
                fallback.get_or_insert((index, gauge));
                // The nearest gauge first, then its neighbours outwards, a few catalog steps
                // either way: a heavier gauge sits shorter (less stress), a lighter one longer.
                let gauges = kind.gauges();
                for step in 0..=NEIGHBOURS {
                    for candidate in [gauge.checked_add(step), gauge.checked_sub(step)] {
                        let Some(candidate) = candidate.filter(|&g| g < gauges.len()) else {
                            continue;
                        };
                        if place(&gauges[candidate], need, limits, x).1 {
                            return Some((index, candidate));
                        }
                    }
                }
            }
            fallback
        })
        .collect()
}

/// A further string of a course (a pair's second string, an octave string) on a known length:
/// the gauge whose tension at `hz` is nearest `tension`, from the first kind whose catalog holds
/// the linear density that asks for (else the nearest of the first kind).
pub fn choose_other<'k>(
    kinds: &[&'k StringKind],
    tension: f64,
    length: f64,
    hz: f64,
) -> Option<(&'k StringKind, usize)> {
    let unit_mass = crate::strings::physics::unit_mass_for_tension(tension, length, hz);
    let inside = kinds.iter().find(|kind| {
        let gauges = kind.gauges();
        gauges
            .first()
            .is_some_and(|g| g.unit_mass <= unit_mass * (1.0 + 1e-9))
            && gauges
                .last()
                .is_some_and(|g| g.unit_mass >= unit_mass * (1.0 - 1e-9))
    });
    let kind = inside.or_else(|| kinds.first())?;
    nearest_gauge(kind, unit_mass).map(|gauge| (*kind, gauge))
}
