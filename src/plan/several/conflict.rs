//! When no string serves every tuning: which tunings cannot share one, and what the closest
//! compromise costs in each.
//!
//! A tuning no allowed string serves even alone is *unservable* (its pitch is past the danger
//! stress on every gauge, or its window cannot be met); two tunings each servable alone but not
//! together are a *conflicting pair* (typically their pitches ask for a tension ratio wider than
//! the window, or the higher one pushes every gauge that is tight enough in the lower one past
//! the danger stress). When every pair can share a string but the whole list cannot, the whole
//! list is named.

use serde::Serialize;

use super::{Resolved, SharedString};
use crate::plan::StringPlan;
use crate::strings::kind::StringKind;
use crate::strings::select::several::any_serves;
use crate::strings::select::Request;

/// Tunings that cannot share a string on one course, and the compromise chosen.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Conflict {
    /// The course number.
    pub course: u32,
    /// The string within the course, from 1.
    pub string: usize,
    /// Every tuning named in this conflict.
    pub tunings: Vec<String>,
    /// Tunings that no allowed string serves even on its own.
    pub unservable: Vec<String>,
    /// Pairs of tunings, each servable alone, that no allowed string serves together.
    pub conflicting_pairs: Vec<[String; 2]>,
    /// The compromise's kind.
    pub kind: String,
    /// The compromise's gauge.
    pub gauge: String,
    /// What the compromise costs: one sentence per tuning where it falls short.
    pub costs: Vec<String>,
    /// The whole finding in one paragraph.
    pub message: String,
}

/// Describes the conflict on string `summary.string` of course `course`.
pub(super) fn analyse(
    course: u32,
    summary: &SharedString,
    requests: &[Request],
    kinds: &[&StringKind],
    in_each: &[&StringPlan],
    list: &[Resolved],
) -> Conflict {
    let name = |i: usize| list.get(i).map_or_else(String::new, |v| v.name.clone());
    let alone: Vec<bool> = requests
        .iter()
        .map(|request| any_serves(std::slice::from_ref(request), kinds))
        .collect();
    let unservable: Vec<String> = (0..requests.len())
        .filter(|&i| !alone[i])
        .map(name)
        .collect();
    let mut conflicting_pairs = Vec::new();
    for i in 0..requests.len() {
        for j in i + 1..requests.len() {
            if alone[i] && alone[j] && !any_serves(&[requests[i], requests[j]], kinds) {
                conflicting_pairs.push([name(i), name(j)]);
            }
        }
    }
    let mut tunings: Vec<String> = Vec::new();
    for named in unservable.iter().chain(conflicting_pairs.iter().flatten()) {
        if !tunings.contains(named) {
            tunings.push(named.clone());
        }
    }
    let whole_list = tunings.is_empty();
    if whole_list {
        tunings = (0..requests.len()).map(name).collect();
    }
    let costs: Vec<String> = in_each
        .iter()
        .zip(requests)
        .enumerate()
        .filter_map(|(i, (string, request))| cost(&name(i), string, request))
        .collect();
    let quoted = |names: &[String]| {
        names
            .iter()
            .map(|n| format!("`{n}`"))
            .collect::<Vec<_>>()
            .join(", ")
    };
    let mut findings = Vec::new();
    for pair in &conflicting_pairs {
        findings.push(format!(
            "tunings `{}` and `{}` cannot share a string (no allowed string serves both)",
            pair[0], pair[1]
        ));
    }
    if !unservable.is_empty() {
        findings.push(format!(
            "no allowed string serves {} even on its own",
            quoted(&unservable)
        ));
    }
    if whole_list {
        findings.push(format!(
            "no allowed string serves {} together, though every two of them can share one",
            quoted(&tunings)
        ));
    }
    let message = format!(
        "Course {course} string {}: {}. Closest compromise, {} {}: {}.",
        summary.string,
        findings.join("; "),
        summary.kind,
        summary.gauge,
        costs.join("; ")
    );
    Conflict {
        course,
        string: summary.string,
        tunings,
        unservable,
        conflicting_pairs,
        kind: summary.kind.clone(),
        gauge: summary.gauge.clone(),
        costs,
        message,
    }
}

/// What the compromise costs in one tuning, if it falls short there: how slack, how tight, how
/// stressed, or too wide.
fn cost(variant: &str, string: &StringPlan, request: &Request) -> Option<String> {
    let tension = string.choice.tension_n;
    let stress = string.choice.stress_ratio;
    let checks = &request.checks;
    let mut parts = Vec::new();
    if let Some(min) = checks.min_tension.filter(|&min| tension < min) {
        parts.push(format!(
            "{tension:.1} N, {:.0}% below the window's {min:.1} N (slack, may buzz)",
            (1.0 - tension / min) * 100.0
        ));
    }
    if let Some(max) = checks.max_tension.filter(|&max| tension > max) {
        parts.push(format!(
            "{tension:.1} N, {:.0}% above the window's {max:.1} N",
            (tension / max - 1.0) * 100.0
        ));
    }
    if stress > checks.limits.danger {
        parts.push(format!(
            "{:.0}% of its breaking strength (danger above {:.0}%; it breaks near {:.1} Hz)",
            stress * 100.0,
            checks.limits.danger * 100.0,
            string.choice.break_pitch_hz
        ));
    }
    if let Some(widest) = checks
        .widest
        .filter(|&w| string.choice.diameter_mm / 1000.0 > w)
    {
        parts.push(format!(
            "{:.3} mm across, wider than the slot's {:.3} mm",
            string.choice.diameter_mm,
            widest * 1000.0
        ));
    }
    (!parts.is_empty()).then(|| format!("in `{variant}` {}", parts.join(", ")))
}
