//! The per-string selector: which string of which kind to put on one course, and how safe it is.
//!
//! [`select`] is cheap and allocation-free: kinds carry precomputed gauges sorted by linear
//! density, so each kind costs two binary searches and a handful of multiplications. Results are
//! plain `Copy` data. [`evaluate`] audits a given concrete string at a pitch and length.
//!
//! # Choice rule
//!
//! 1. The linear density the course needs is μ = T/(2Lf)² (REFERENCES §1.2). A tension window
//!    without a stated target aims at its middle (see [`crate::instrument::TensionGoal`]).
//! 2. In each allowed kind the best gauge is the one whose tension is nearest the target, among
//!    the gauges no wider than the slot (if none fits, the thinnest, flagged wider than the slot).
//! 3. Each kind's best then stands in one of three ranks ([`Standing`]):
//!    - *on target*: tension within the tolerance of the target, inside the tension window,
//!      fitting the slot, below the caution stress, of known strength, and the kind's catalog
//!      reaches the linear density the course needs (neither thinner nor thicker than it has);
//!    - *with reservations*: within the tolerance, inside the window, fitting and below the
//!      danger stress, but above the caution stress, at the end of its catalog, of unknown
//!      strength, or a plain monofilament thicker than common practice strings it (the
//!      material's `thickest_plain`);
//!    - *closest*: anything else.
//! 4. The chosen string is the best gauge of the *first kind in the caller's order of
//!    preference* that is on target; failing that, the first with reservations. A kind that
//!    needs a thicker (or thinner) gauge than its catalog has, or runs in the caution zone, so
//!    never beats a later kind that is on target and safe: practitioners change construction
//!    (plain to wound, nylon to wound) before they string at the end of a catalog or near the
//!    elastic limit.
//! 5. If no kind is within reach, the chosen string is the kind's best that goes wrong least,
//!    ranked by: not dangerous first, then fitting the slot, then inside the window, then the
//!    smallest tension error.
//!
//! # Stress limits
//!
//! The stress ratio is the axial stress in the load-bearing section (the core of a wound string)
//! divided by the breaking strength. By default a string is flagged *caution* above 0.65 and
//! *danger* above 0.85 of its breaking strength:
//! - 0.65 is the low end of music wire's elastic limit in tension, 65–75 % of S_ut (Budynas &
//!   Nisbett, *Shigley's Mechanical Engineering Design* 9th ed., Table 10‑5; REFERENCES §9, READ).
//!   Above it a string may take a permanent set. Piano practitioners call 70 % the commonly
//!   accepted maximum (common practice, REFERENCES §9).
//! - 0.85 sits inside the 80–90 % band where practitioners report a high risk of breakage (common
//!   practice, REFERENCES §9); it is 1.4 semitones below the breaking pitch (σ ∝ f², §1.2).
//!
//! Strings break: these flags are a planning aid, not a guarantee. Wear eye protection, bring a
//! new string up to pitch gradually, and keep within the instrument maker's load rating.

use crate::strings::construction::Construction;
use crate::strings::kind::{Gauge, StringKind};
use crate::strings::physics;

mod flags;
#[allow(unused_imports)]
use flags::*;
pub use flags::*;
mod evaluate;
#[allow(unused_imports)]
use evaluate::*;
pub use evaluate::*;

pub mod several;

/// Stress ratios (stress / breaking strength) at which warnings start.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct StressLimits {
    /// Above this, [`Warnings::STRESS_CAUTION`].
    pub caution: f64,
    /// Above this, [`Warnings::STRESS_DANGER`].
    pub danger: f64,
}

/// Default caution limit, 0.65 of breaking strength: see the module documentation.
pub const DEFAULT_CAUTION: f64 = 0.65;
/// Default danger limit, 0.85 of breaking strength: see the module documentation.
pub const DEFAULT_DANGER: f64 = 0.85;
/// Default tension tolerance, ±10 % of the target: roughly one catalog step of plain steel
/// (0.0005 in at 0.010 in is a 10 % step in μ), so the nearest gauge normally lies within it.
pub const DEFAULT_TOLERANCE: f64 = 0.10;

impl Default for StressLimits {
    fn default() -> Self {
        StressLimits {
            caution: DEFAULT_CAUTION,
            danger: DEFAULT_DANGER,
        }
    }
}

/// The checks applied to a string on a course, besides its tension target.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Checks {
    /// Lowest acceptable tension, N.
    pub min_tension: Option<f64>,
    /// Highest acceptable tension, N.
    pub max_tension: Option<f64>,
    /// Widest string the slot or hole takes, m.
    pub widest: Option<f64>,
    /// Stress limits.
    pub limits: StressLimits,
}

/// What one course asks of its string (SI units).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Request {
    /// Sounding frequency, Hz.
    pub frequency: f64,
    /// Vibrating length, m.
    pub length: f64,
    /// Tension wanted, N.
    pub target_tension: f64,
    /// Accepted relative tension error, e.g. 0.10 for ±10 %.
    pub tolerance: f64,
    /// Window, slot and stress checks.
    pub checks: Checks,
}

impl Request {
    /// A request with the default tolerance, no window, no slot limit and default stress limits.
    pub fn new(frequency: f64, length: f64, target_tension: f64) -> Self {
        Request {
            frequency,
            length,
            target_tension,
            tolerance: DEFAULT_TOLERANCE,
            checks: Checks::default(),
        }
    }
}

/// One gauge of one kind, evaluated on a course.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Choice {
    /// Index of the kind in the slice given to [`select`].
    pub kind: usize,
    /// Index of the gauge in the kind's [`StringKind::gauges`].
    pub gauge: usize,
    /// Outer diameter, m.
    pub diameter: f64,
    /// Linear density, kg/m.
    pub unit_mass: f64,
    /// Tension at the requested pitch, N.
    pub tension: f64,
    /// Relative tension error against the target: tension/target − 1.
    pub tension_error: f64,
    /// Stress in the load-bearing section / breaking strength.
    pub stress_ratio: f64,
    /// Frequency at which this string breaks on this length, Hz.
    pub break_frequency: f64,
    /// Flags for this string on this course.
    pub warnings: Warnings,
}

/// The selector's answer for one course.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Selection {
    /// Exact linear density the target tension needs, before rounding to a catalog, kg/m.
    pub required_unit_mass: f64,
    /// The chosen string (`None` only when no kind has any gauge).
    pub chosen: Option<Choice>,
    /// The next thinner gauge of the chosen kind.
    pub thinner: Option<Choice>,
    /// The next thicker gauge of the chosen kind.
    pub thicker: Option<Choice>,
    /// The chosen string's flags, plus [`Warnings::NONE_WITHIN_TOLERANCE`] when it applies.
    pub warnings: Warnings,
    /// How the chosen string stands against the rule (why it was chosen).
    pub standing: Standing,
}

/// How one kind's best gauge stands against the choice rule (see the module documentation);
/// the order is the order of preference.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub enum Standing {
    /// Within tolerance, inside the window, fitting, below the caution stress, of known strength,
    /// and inside its kind's catalog.
    OnTarget,
    /// Within tolerance, inside the window, fitting and below the danger stress, but in the
    /// caution zone, at the end of its catalog, or of unknown strength.
    WithReservations,
    /// Neither: the string that goes wrong least.
    Closest,
}

impl Standing {
    /// Stable name, e.g. `on-target`.
    pub fn name(self) -> &'static str {
        match self {
            Standing::OnTarget => "on-target",
            Standing::WithReservations => "with-reservations",
            Standing::Closest => "closest",
        }
    }
}

/// Where `choice` stands against the rule for a request with `tolerance`.
pub fn standing(choice: &Choice, tolerance: f64) -> Standing {
    if !is_acceptable(choice, tolerance) {
        Standing::Closest
    } else if choice.warnings.intersects(
        Warnings::STRESS_CAUTION
            .union(Warnings::THINNER_THAN_CATALOG)
            .union(Warnings::THICKER_THAN_CATALOG)
            .union(Warnings::STRENGTH_UNKNOWN)
            .union(Warnings::THICK_MONOFILAMENT),
    ) {
        Standing::WithReservations
    } else {
        Standing::OnTarget
    }
}

fn stress_flags(stress_ratio: f64, limits: StressLimits) -> Warnings {
    if stress_ratio.is_nan() {
        Warnings::STRENGTH_UNKNOWN
    } else if stress_ratio > limits.danger {
        Warnings::STRESS_DANGER
    } else if stress_ratio > limits.caution {
        Warnings::STRESS_CAUTION
    } else {
        Warnings::NONE
    }
}

fn check_flags(tension: f64, diameter: Option<f64>, checks: &Checks) -> Warnings {
    let mut warnings = Warnings::NONE;
    if checks.min_tension.is_some_and(|min| tension < min) {
        warnings.insert(Warnings::BELOW_WINDOW);
    }
    if checks.max_tension.is_some_and(|max| tension > max) {
        warnings.insert(Warnings::ABOVE_WINDOW);
    }
    if let (Some(widest), Some(diameter)) = (checks.widest, diameter) {
        if diameter > widest {
            warnings.insert(Warnings::WIDER_THAN_SLOT);
        }
    }
    warnings
}

fn evaluate_gauge(
    request: &Request,
    kind_index: usize,
    gauges: &[Gauge],
    gauge_index: usize,
    required_unit_mass: f64,
) -> Choice {
    let gauge = gauges[gauge_index];
    let tension = physics::tension(gauge.unit_mass, request.length, request.frequency);
    let stress_ratio = tension / gauge.breaking_tension;
    let mut warnings = stress_flags(stress_ratio, request.checks.limits).union(check_flags(
        tension,
        Some(gauge.diameter),
        &request.checks,
    ));
    // A relative margin far below any catalog step, so a string whose own tension is the
    // target (μ·x/x rounding to one unit in the last place off) does not read as off the
    // catalog's end.
    const EDGE: f64 = 1e-9;
    if gauges
        .first()
        .is_some_and(|g| required_unit_mass < g.unit_mass * (1.0 - EDGE))
    {
        warnings.insert(Warnings::THINNER_THAN_CATALOG);
    }
    if gauges
        .last()
        .is_some_and(|g| required_unit_mass > g.unit_mass * (1.0 + EDGE))
    {
        warnings.insert(Warnings::THICKER_THAN_CATALOG);
    }
    if gauge.thick_for_plain {
        warnings.insert(Warnings::THICK_MONOFILAMENT);
    }
    Choice {
        kind: kind_index,
        gauge: gauge_index,
        diameter: gauge.diameter,
        unit_mass: gauge.unit_mass,
        tension,
        tension_error: tension / request.target_tension - 1.0,
        stress_ratio,
        break_frequency: request.frequency * (gauge.breaking_tension / tension).sqrt(),
        warnings,
    }
}

/// The gauge of `gauges` whose tension is nearest the target among those fitting the slot.
fn nearest_gauge(gauges: &[Gauge], required_unit_mass: f64, widest: Option<f64>) -> Option<usize> {
    if gauges.is_empty() {
        return None;
    }
    let fitting = match widest {
        Some(widest) => gauges.partition_point(|g| g.diameter <= widest),
        None => gauges.len(),
    };
    if fitting == 0 {
        return Some(0);
    }
    let above = gauges[..fitting].partition_point(|g| g.unit_mass < required_unit_mass);
    if above == 0 {
        return Some(0);
    }
    if above == fitting {
        return Some(fitting - 1);
    }
    let error = |i: usize| (gauges[i].unit_mass / required_unit_mass - 1.0).abs();
    Some(if error(above - 1) <= error(above) {
        above - 1
    } else {
        above
    })
}

fn is_acceptable(choice: &Choice, tolerance: f64) -> bool {
    choice.tension_error.abs() <= tolerance
        && !choice.warnings.intersects(
            Warnings::STRESS_DANGER
                .union(Warnings::WIDER_THAN_SLOT)
                .union(Warnings::BELOW_WINDOW)
                .union(Warnings::ABOVE_WINDOW),
        )
}

/// Ranking key for the fallback when no kind is acceptable: smaller is better.
fn fallback_key(choice: &Choice) -> (bool, bool, bool, f64) {
    (
        choice.warnings.contains(Warnings::STRESS_DANGER),
        choice.warnings.contains(Warnings::WIDER_THAN_SLOT),
        choice
            .warnings
            .intersects(Warnings::BELOW_WINDOW.union(Warnings::ABOVE_WINDOW)),
        choice.tension_error.abs(),
    )
}

/// Chooses a string for one course from `kinds` (in order of preference); see the module
/// documentation for the rule.
///
/// `best_per_kind[i]` receives the best gauge of `kinds[i]` (or `None` for a kind without
/// gauges), so the caller can show the alternatives in other kinds without any allocation here.
/// A shorter slice receives only the first entries; a longer one keeps its tail untouched.
pub fn select(
    request: &Request,
    kinds: &[&StringKind],
    best_per_kind: &mut [Option<Choice>],
) -> Selection {
    let required =
        physics::unit_mass_for_tension(request.target_tension, request.length, request.frequency);
    let mut first_on_target: Option<Choice> = None;
    let mut first_reserved: Option<Choice> = None;
    let mut fallback: Option<Choice> = None;
    let mut any_within_tolerance = false;
    for (kind_index, kind) in kinds.iter().enumerate() {
        let gauges = kind.gauges();
        let best = nearest_gauge(gauges, required, request.checks.widest)
            .map(|g| evaluate_gauge(request, kind_index, gauges, g, required));
        if let Some(slot) = best_per_kind.get_mut(kind_index) {
            *slot = best;
        }
        let Some(best) = best else { continue };
        any_within_tolerance |= best.tension_error.abs() <= request.tolerance;
        match standing(&best, request.tolerance) {
            Standing::OnTarget if first_on_target.is_none() => first_on_target = Some(best),
            Standing::WithReservations if first_reserved.is_none() => first_reserved = Some(best),
            _ => {}
        }
        let better = match &fallback {
            None => true,
            Some(current) => fallback_key(&best)
                .partial_cmp(&fallback_key(current))
                .is_some_and(|o| o.is_lt()),
        };
        if better {
            fallback = Some(best);
        }
    }
    let (chosen, standing) = match (first_on_target, first_reserved) {
        (Some(choice), _) => (Some(choice), Standing::OnTarget),
        (None, Some(choice)) => (Some(choice), Standing::WithReservations),
        (None, None) => (fallback, Standing::Closest),
    };
    finish(
        request,
        kinds,
        chosen,
        standing,
        required,
        any_within_tolerance,
    )
}

/// The selector's answer around a chosen string: its catalog neighbours and its flags, plus
/// [`Warnings::NONE_WITHIN_TOLERANCE`] when no kind's best came within the tolerance.
fn finish(
    request: &Request,
    kinds: &[&StringKind],
    chosen: Option<Choice>,
    standing: Standing,
    required: f64,
    any_within_tolerance: bool,
) -> Selection {
    let neighbour = |offset: isize| {
        let choice = chosen?;
        let gauges = kinds.get(choice.kind)?.gauges();
        let index = choice.gauge.checked_add_signed(offset)?;
        (index < gauges.len())
            .then(|| evaluate_gauge(request, choice.kind, gauges, index, required))
    };
    let mut warnings = chosen.map_or(Warnings::NONE, |c| c.warnings);
    if !any_within_tolerance {
        warnings.insert(Warnings::NONE_WITHIN_TOLERANCE);
    }
    Selection {
        required_unit_mass: required,
        chosen,
        thinner: neighbour(-1),
        thicker: neighbour(1),
        warnings,
        standing,
    }
}
