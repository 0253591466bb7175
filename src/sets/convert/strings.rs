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

/// What a refusal of the current state asks for.
const SAY_WHERE_THE_STRINGS_ARE: &str = "write the instrument's course pitches as notes (`E2`) or frequencies, which read the same in any tuning, or give --from the tuning the pitches are written in (it overrides the set's `tuning:` line)";

/// Refuses a course whose pitch, written as a degree, ratio or cents of the instrument's own
/// tuning, names another pitch in the tuning the strings are said to be in now (`--from` or
/// the set's `tuning:`): that reading cannot say where the strings are, and every "before"
/// tension built on it would be invented (the rule `audit` follows, `sets::audit::reference`).
pub(super) fn check_reading(
    before: &Instrument,
    own_tuning: &Tuning,
    tuning_now: &Tuning,
    course: &CourseInput<'_>,
    now: &CoursePitch,
) -> Result<()> {
    let written_for = before.course_pitch(course, own_tuning)?;
    let Some(apart_cents) = reread_apart_cents(course, &written_for, now) else {
        return Ok(());
    };
    let message = format!(
        "course {}'s pitch `{}` counts in {}, the instrument's own tuning; read in {}, the \
         tuning the strings are said to be in now, it is {:.1} Hz instead of {:.1} Hz ({:+.0} \
         cents), so it cannot say where the strings are now",
        course.number,
        course.pitch.trim(),
        own_tuning.name(),
        tuning_now.name(),
        now.hz,
        written_for.hz,
        apart_cents,
    );
    Err(before
        .point(Error::input(message), &pitch_line(course.index))
        .help(SAY_WHERE_THE_STRINGS_ARE))
}

/// Refuses a current state in which an installed string carries its breaking load or more: a
/// string that would have broken is not where the strings are now, and its tension is no
/// "before" to keep.
pub(super) fn check_possible(
    before: &Instrument,
    tuning_now: &Tuning,
    course: &CourseInput<'_>,
    written: &SetString,
    hz: f64,
    tension_n: f64,
    construction: &Construction<'_>,
) -> Result<()> {
    let Some(breaking) = construction.breaking_tension().filter(|b| tension_n >= *b) else {
        return Ok(());
    };
    let message = format!(
        "course {} ({}) cannot be at {hz:.1} Hz now, in {}: it would carry {tension_n:.1} N \
         there, beyond its breaking load of {breaking:.1} N",
        course.number,
        written.label(),
        tuning_now.name(),
    );
    Err(before
        .point(Error::input(message), &pitch_line(course.index))
        .help(SAY_WHERE_THE_STRINGS_ARE))
}

/// The path of a course's `pitch:` line in an instrument file.
fn pitch_line(course_index: usize) -> [PathStep<'static>; 3] {
    [
        PathStep::Key("courses"),
        PathStep::Index(course_index),
        PathStep::Key("pitch"),
    ]
}
