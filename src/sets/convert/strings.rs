//! The strings on either side of a conversion: the installed ones, the kinds a replacement may come from, slot fit and flags.

#[allow(unused_imports)]
use super::*;

pub(super) type Installed<'k> = Vec<(SetString, Construction<'k>, Option<&'k StringKind>)>;

pub(super) fn installed<'k>(
    set: &StringSet,
    instrument: &Instrument,
    course: &CourseInput<'_>,
    kinds: &'k StringKinds,
    materials: &'k Materials,
) -> Result<Installed<'k>> {
    let strings = set_strings(set, instrument, course, kinds, materials)?
        .ok_or_else(|| missing_course(set, instrument, course.number))?;
    Ok(strings
        .into_iter()
        .map(|(written, resolved)| (written, resolved.construction, resolved.kind))
        .collect())
}

pub(super) const OLD_STRING: &str = "old string";

pub(super) fn slot_fit(stated: Option<f64>, old: Option<f64>, new: Option<f64>) -> Option<SlotFit> {
    let new = new?;
    let (width, against) = match (stated, old) {
        (Some(width), _) => (width, "stated"),
        (None, Some(old)) => (old, OLD_STRING),
        (None, None) => return None,
    };
    // A micrometre is far below any slot's tolerance: equal diameters read back from a file fit.
    let wider_by = new - width;
    Some(SlotFit {
        width_mm: width * 1000.0,
        against: against.to_string(),
        wider_by_mm: wider_by * 1000.0,
        fits: wider_by <= 1e-6,
    })
}

/// The kinds a replacement may be chosen from: the installed string's kind first, then the
/// instrument's list for this string (its own, the course's, or the defaults).
pub(super) fn allowed_kinds<'k>(
    after: &Instrument,
    index: usize,
    course: &CourseInput<'_>,
    string_index: usize,
    old: Option<&(SetString, Construction<'_>, Option<&'k StringKind>)>,
    kinds: &'k StringKinds,
) -> Result<Vec<&'k StringKind>> {
    let mut allowed: Vec<&StringKind> = Vec::new();
    if let Some(kind) = old.and_then(|(_, _, kind)| *kind) {
        allowed.push(kind);
    }
    let ids = course.strings[string_index]
        .kinds
        .as_deref()
        .or(course.kinds)
        .unwrap_or(&[]);
    for (position, id) in ids.iter().enumerate() {
        let kind = kinds.get(id.trim()).map_err(|err| {
            after.point(
                err.field(format!("courses[{index}].kinds[{position}]")),
                &[
                    PathStep::Key("courses"),
                    PathStep::Index(index),
                    PathStep::Key("kinds"),
                ],
            )
        })?;
        if !allowed.iter().any(|k| k.id == kind.id) {
            allowed.push(kind);
        }
    }
    if allowed.is_empty() {
        return Err(after.point(
            Error::input(format!(
                "course {}: the installed string has no kind and the instrument allows none, so there is nothing to choose a replacement from",
                course.number
            ))
            .help("list `kinds` for the course or in `defaults`"),
            &[PathStep::Key("courses"), PathStep::Index(index)],
        ));
    }
    Ok(allowed)
}

pub(super) fn side(written: &SetString, evaluation: &select::Evaluation, pitch_hz: f64) -> Side {
    let diameter = written.diameter();
    Side {
        string: written.label(),
        gauge: diameter.map(gauge_label),
        diameter_mm: diameter.map(|d| d * 1000.0),
        diameter_in: diameter.map(|d| d / METRES_PER_INCH),
        unit_mass_kg_per_m: evaluation.unit_mass,
        pitch_hz,
        tension_n: evaluation.tension,
        stress_ratio: evaluation.stress_ratio,
        break_pitch_hz: evaluation.break_frequency,
    }
}

pub(super) fn flag_catalog(
    warnings: &mut Vec<Warning>,
    at: StringRef,
    selection: &select::Selection,
    kind: &StringKind,
    request: &Request,
) {
    let gauges = kind.gauges();
    if selection.warnings.contains(Warnings::THINNER_THAN_CATALOG) {
        if let Some(lightest) = gauges.first() {
            warnings
                .push(at.thinner_than_practical(selection.required_unit_mass, lightest.unit_mass));
        }
    }
    if selection.warnings.contains(Warnings::THICKER_THAN_CATALOG) {
        if let Some(heaviest) = gauges.last() {
            warnings
                .push(at.thicker_than_catalog(selection.required_unit_mass, heaviest.unit_mass));
        }
    }
    if selection.warnings.contains(Warnings::NONE_WITHIN_TOLERANCE) {
        if let Some(chosen) = selection.chosen {
            warnings.push(at.off_target(chosen.tension, request.target_tension, request.tolerance));
        }
    }
}

#[allow(clippy::too_many_arguments)]
pub(super) fn flag_common(
    warnings: &mut Vec<Warning>,
    at: StringRef,
    evaluation: &select::Evaluation,
    flags: Warnings,
    checks: &Checks,
    pitch_hz: f64,
    diameter: Option<f64>,
    (heaviest, thinnest): (bool, bool),
) {
    if let (Some(ratio), Some(break_hz)) = (evaluation.stress_ratio, evaluation.break_frequency) {
        if flags.contains(Warnings::STRESS_DANGER) || ratio > checks.limits.danger {
            warnings.push(at.stress(
                WarningKind::StressDanger,
                ratio,
                checks.limits.danger,
                break_hz,
                pitch_hz,
            ));
        } else if ratio > checks.limits.caution {
            warnings.push(at.stress(
                WarningKind::StressCaution,
                ratio,
                checks.limits.caution,
                break_hz,
                pitch_hz,
            ));
        }
    }
    if let (Some(widest), Some(diameter)) = (checks.widest, diameter) {
        if diameter > widest {
            warnings.push(at.wider_than_slot(diameter, widest));
        }
    }
    if let Some(window) = at.outside_window_of_catalog(
        evaluation.tension,
        checks.min_tension,
        checks.max_tension,
        heaviest,
        thinnest,
    ) {
        warnings.push(window);
    }
}
