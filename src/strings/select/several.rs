//! One string for a course that must sound in several tunings: the selector's rule
//! ([`super`]) generalised from one request to a list of them, one per tuning, all on the same
//! course (same length, target, window, slot and stress limits; only the pitch differs).
//!
//! # Choice rule
//!
//! A gauge *serves* a tuning when, at that tuning's pitch, it is below the danger stress, inside
//! the tension window and fits the slot; it is *on target* there when it also lies within the
//! tolerance of the target tension (the selector's "acceptable").
//!
//! 1. **On target everywhere.** The first kind, in the caller's order of preference, with a
//!    gauge that stands [`Standing::OnTarget`] in every tuning (the selector's rule: within
//!    tolerance and the window, fitting, below the caution stress, inside its catalog); of its
//!    gauges on target everywhere, the one the [`Balance`] rule scores best.
//! 2. **Otherwise, with reservations.** The same for the first kind whose gauge is at worst
//!    [`Standing::WithReservations`] in every tuning (in caution, at its catalog's end, or of
//!    unknown strength, but within tolerance, inside the window and below danger).
//! 3. **Otherwise, least wrong.** Over every gauge of every kind, the smallest of the ranking
//!    (danger in any tuning, wider than the slot, outside the window in any tuning, score): a
//!    gauge that serves every tuning wins over one that does not, and among those the best
//!    score wins. When even this gauge does not serve every tuning, the tunings *conflict* on
//!    this string ([`Agreement::Conflict`]) and the gauge is the closest compromise.
//!
//! Ties go to the earlier kind and the thinner gauge.
//!
//! With a single tuning the candidates of each kind are its one nearest gauge, exactly as in
//! [`super::select`], so a one-tuning list gives the selector's choice unchanged (with
//! [`Balance::Target`]; the stress rule ranks its fallback by stress instead). With several
//! tunings every gauge of every kind is a candidate: the gauge nearest the target in one tuning
//! is rarely the best balance, and a gauge that serves every tuning is found whenever the
//! catalogs hold one.
//!
//! # Balance rules
//!
//! - [`Balance::Target`] (default): the smallest worst-case relative tension deviation,
//!   max over tunings of |T/T_target − 1|. For two pitches f₁ < f₂ on one string the best
//!   linear density is the harmonic mean of the two the target asks for,
//!   μ* = 2·T_target / ((2Lf₁)² + (2Lf₂)²), which puts the two tensions symmetrically around the
//!   target at ±(r − 1)/(r + 1) with r = (f₂/f₁)² (from T = μ(2Lf)², REFERENCES §1.2); a whole
//!   tone (r = 1.266) costs ±11.7 %, more than the default ±10 % tolerance, so such courses are
//!   normally "serves" rather than "on target".
//! - [`Balance::Stress`]: the lowest worst-case stress ratio (stress over breaking strength),
//!   for players who care most about breakage; unknown strengths rank last.
//!
//! Allocation-free like the selector: the caller gives the scratch space.

use serde::Serialize;

use super::{
    evaluate_gauge, finish, nearest_gauge, standing, Choice, Request, Selection, Standing, Warnings,
};
use crate::strings::kind::{Gauge, StringKind};
use crate::strings::physics;

/// How the string that serves several tunings is balanced among them.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Balance {
    /// The smallest worst-case relative deviation of tension from the target.
    #[default]
    Target,
    /// The lowest worst-case stress ratio.
    Stress,
}

impl Balance {
    /// The rule's name, as the command line and JSON spell it.
    pub fn name(self) -> &'static str {
        match self {
            Balance::Target => "target",
            Balance::Stress => "stress",
        }
    }

    /// This rule's figure for one tuning: smaller is better. An unknown strength ranks last.
    fn score(self, choice: &Choice) -> f64 {
        match self {
            Balance::Target => choice.tension_error.abs(),
            Balance::Stress if choice.stress_ratio.is_nan() => f64::MAX,
            Balance::Stress => choice.stress_ratio,
        }
    }
}

/// How well the chosen string serves the listed tunings.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Agreement {
    /// Within the tolerance of the target and safe in every tuning.
    OnTarget,
    /// Safe, inside the window and fitting the slot in every tuning; off target in some.
    Serves,
    /// No catalog string serves every tuning; the chosen one is the closest compromise.
    Conflict,
}

/// The string chosen for several tunings.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Shared {
    /// Index of the kind in the slice given to [`choose`].
    pub kind: usize,
    /// Index of the gauge in the kind's gauges.
    pub gauge: usize,
    /// How well it serves the tunings.
    pub agreement: Agreement,
}

/// One gauge judged over every tuning.
#[derive(Debug, Clone, Copy)]
struct Judged {
    /// The worst of the gauge's standings over the tunings ([`Standing`]).
    standing: Standing,
    /// (danger somewhere, wider than the slot, outside the window somewhere, score): smaller is
    /// better; the selector's fallback ranking when there is one tuning.
    key: (bool, bool, bool, f64),
}

impl Judged {
    fn serves(&self) -> bool {
        !(self.key.0 || self.key.1 || self.key.2)
    }
}

/// The gauge `gauge` of `kinds[kind]` evaluated at one request's pitch.
pub fn evaluate_at(request: &Request, kinds: &[&StringKind], kind: usize, gauge: usize) -> Choice {
    let required = required_unit_mass(request);
    evaluate_gauge(request, kind, kinds[kind].gauges(), gauge, required)
}

fn required_unit_mass(request: &Request) -> f64 {
    physics::unit_mass_for_tension(request.target_tension, request.length, request.frequency)
}

fn judge(
    requests: &[Request],
    kind: usize,
    gauges: &[Gauge],
    gauge: usize,
    balance: Balance,
) -> Judged {
    let mut judged = Judged {
        standing: Standing::OnTarget,
        key: (false, false, false, f64::MIN),
    };
    for request in requests {
        let choice = evaluate_gauge(request, kind, gauges, gauge, required_unit_mass(request));
        judged.standing = judged.standing.max(standing(&choice, request.tolerance));
        judged.key.0 |= choice.warnings.contains(Warnings::STRESS_DANGER);
        judged.key.1 |= choice.warnings.contains(Warnings::WIDER_THAN_SLOT);
        judged.key.2 |= choice
            .warnings
            .intersects(Warnings::BELOW_WINDOW.union(Warnings::ABOVE_WINDOW));
        judged.key.3 = judged.key.3.max(balance.score(&choice));
    }
    judged
}

/// The gauges of one kind a choice looks at: the nearest one for a single tuning (the
/// selector's candidate), all of them for several.
fn candidates(requests: &[Request], gauges: &[Gauge]) -> std::ops::Range<usize> {
    match requests {
        [one] => nearest_gauge(gauges, required_unit_mass(one), one.checks.widest)
            .map_or(0..0, |g| g..g + 1),
        _ => 0..gauges.len(),
    }
}

fn is_less(a: (bool, bool, bool, f64), b: (bool, bool, bool, f64)) -> bool {
    a.partial_cmp(&b).is_some_and(|o| o.is_lt())
}

/// Chooses one string for a course sounding at each of `requests` (one per tuning; none empty)
/// from `kinds` in order of preference, by the rule in the module documentation.
///
/// `best_per_kind[i]` receives each kind's best-balanced gauge whatever its flags (the nearest
/// one for a single tuning; among gauges fitting the slot for several), for the alternatives in
/// other kinds. Returns `None` when no kind has any gauge or `requests` is empty.
pub fn choose(
    requests: &[Request],
    kinds: &[&StringKind],
    balance: Balance,
    best_per_kind: &mut [Option<usize>],
) -> Option<Shared> {
    if requests.is_empty() {
        return None;
    }
    let mut first_on_target: Option<Shared> = None;
    let mut first_reserved: Option<Shared> = None;
    let mut least_wrong: Option<(Shared, (bool, bool, bool, f64))> = None;
    for (kind, string_kind) in kinds.iter().enumerate() {
        let gauges = string_kind.gauges();
        let mut best_here: Option<(usize, f64)> = None;
        let mut on_target_here: Option<(usize, f64)> = None;
        let mut reserved_here: Option<(usize, f64)> = None;
        for gauge in candidates(requests, gauges) {
            let judged = judge(requests, kind, gauges, gauge, balance);
            let score = judged.key.3;
            let fits = !judged.key.1 || gauge == 0;
            if fits && best_here.is_none_or(|(_, best)| score < best) {
                best_here = Some((gauge, score));
            }
            let better = |here: Option<(usize, f64)>| here.is_none_or(|(_, best)| score < best);
            match judged.standing {
                Standing::OnTarget if better(on_target_here) => {
                    on_target_here = Some((gauge, score));
                }
                Standing::WithReservations if better(reserved_here) => {
                    reserved_here = Some((gauge, score));
                }
                _ => {}
            }
            if least_wrong.is_none_or(|(_, key)| is_less(judged.key, key)) {
                let agreement = if judged.serves() {
                    Agreement::Serves
                } else {
                    Agreement::Conflict
                };
                least_wrong = Some((
                    Shared {
                        kind,
                        gauge,
                        agreement,
                    },
                    judged.key,
                ));
            }
        }
        if let Some(slot) = best_per_kind.get_mut(kind) {
            *slot = best_here.map(|(gauge, _)| gauge);
        }
        let on_target = |(gauge, _): (usize, f64)| Shared {
            kind,
            gauge,
            agreement: Agreement::OnTarget,
        };
        if first_on_target.is_none() {
            first_on_target = on_target_here.map(on_target);
        }
        if first_reserved.is_none() {
            first_reserved = reserved_here.map(on_target);
        }
    }
    first_on_target
        .or(first_reserved)
        .or(least_wrong.map(|(shared, _)| shared))
}

/// Whether any gauge of any of `kinds` serves every one of `requests` (in danger nowhere,
/// inside the window everywhere, fitting the slot).
pub fn any_serves(requests: &[Request], kinds: &[&StringKind]) -> bool {
    kinds.iter().enumerate().any(|(kind, string_kind)| {
        let gauges = string_kind.gauges();
        (0..gauges.len())
            .any(|gauge| judge(requests, kind, gauges, gauge, Balance::Target).serves())
    })
}

/// Whether `choice` serves its request (see the module documentation).
pub fn serves(choice: &Choice) -> bool {
    !choice.warnings.intersects(
        Warnings::STRESS_DANGER
            .union(Warnings::WIDER_THAN_SLOT)
            .union(Warnings::BELOW_WINDOW)
            .union(Warnings::ABOVE_WINDOW),
    )
}

/// The selector's answer in one tuning for the string [`choose`] picked: the chosen string and
/// its neighbours evaluated at `request`, and in `best_out[i]` each kind's best gauge
/// (`best_per_kind` from [`choose`]) evaluated there. With a single tuning this equals
/// [`super::select`]'s answer.
pub fn selection_in(
    request: &Request,
    kinds: &[&StringKind],
    shared: &Shared,
    best_per_kind: &[Option<usize>],
    best_out: &mut [Option<Choice>],
) -> Selection {
    let required = required_unit_mass(request);
    let mut any_within_tolerance = false;
    for (kind, string_kind) in kinds.iter().enumerate() {
        let best = best_per_kind
            .get(kind)
            .copied()
            .flatten()
            .map(|gauge| evaluate_gauge(request, kind, string_kind.gauges(), gauge, required));
        if let Some(best) = &best {
            any_within_tolerance |= best.tension_error.abs() <= request.tolerance;
        }
        if let Some(slot) = best_out.get_mut(kind) {
            *slot = best;
        }
    }
    let chosen = kinds
        .get(shared.kind)
        .map(|kind| evaluate_gauge(request, shared.kind, kind.gauges(), shared.gauge, required));
    let standing = chosen.map_or(Standing::Closest, |choice| {
        standing(&choice, request.tolerance)
    });
    finish(
        request,
        kinds,
        chosen,
        standing,
        required,
        any_within_tolerance,
    )
}
