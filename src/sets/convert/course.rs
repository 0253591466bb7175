//! Converting one course: keeping each string's tension, or choosing a replacement where the old string cannot follow.

#[allow(unused_imports)]
use super::*;

#[derive(Clone, Copy)]
pub(super) struct Limits {
    pub(super) after: StressLimits,
    pub(super) before: StressLimits,
}

#[allow(clippy::too_many_arguments)]
pub(super) fn convert_course(
    after: &Instrument,
    index: usize,
    placed: &Placed<'_>,
    before: Option<&Placed<'_>>,
    installed: Option<&[(SetString, Construction<'_>, Option<&StringKind>)]>,
    kinds: &StringKinds,
    limits: Limits,
    options: &ConvertOptions,
) -> Result<ConvertCourse> {
    let course = &placed.course;
    let slot_stated = options.slot_width.or(course.max_diameter_m);
    let mut strings = Vec::with_capacity(course.strings.len());
    let mut warnings = Vec::new();
    for (string_index, layout) in course.strings.iter().enumerate() {
        let at = StringRef {
            course: course.number,
            string: string_index + 1,
        };
        let pitch_hz = placed.pitch.hz * layout.interval.ratio();
        let old = installed.and_then(|list| list.get(string_index));
        let before_side = match (old, before) {
            (Some((written, construction, _)), Some(place)) => {
                let old_layout = &place.course.strings[string_index];
                let hz = place.pitch.hz * old_layout.interval.ratio();
                let checks = Checks {
                    limits: limits.before,
                    ..Checks::default()
                };
                let evaluation = select::evaluate(construction, hz, place.length_m, &checks);
                Some(side(written, &evaluation, hz))
            }
            _ => None,
        };
        // Target: the old tension (keep the feel), or the player's new target, or for a new
        // course the new instrument's own.
        let goal = course.tension;
        let target_tension_n = match (&options.target, &before_side) {
            (None, Some(old)) => old.tension_n,
            _ => goal.map(|g| g.target_n).ok_or_else(|| {
                after.point(
                    Error::input(format!(
                        "course {} is new and has no tension target",
                        course.number
                    ))
                    .help("give the course a `tension` in the instrument, or pass --tension"),
                    &[PathStep::Key("courses"), PathStep::Index(index)],
                )
            })?,
        };
        // With the bend rule, the target depends on the string: the tension at which it takes
        // the old string's push for the same bend on the new length.
        let feel_before = match (old, before, &before_side) {
            (Some((_, construction, _)), Some(place), Some(side)) => Some(feel::feel(
                construction,
                side.tension_n,
                place.length_m,
                &options.feel,
            )),
            _ => None,
        };
        let bend_goal = match (options.rule, &options.target) {
            (FeelRule::EqualBend, None) => feel_before.and_then(|feel| feel.bend_force_n),
            _ => None,
        };
        let geometry = BendGeometry {
            vibrating_length: placed.length_m,
            nut_afterlength: options.feel.nut_afterlength,
            bridge_afterlength: options.feel.bridge_afterlength,
        };
        // The bend target stays inside the instrument's window, with the tolerance's room to
        // spare at either edge: a push matched above the window's `max` would trade one problem
        // for another, and a target right at an edge lets the nearest catalog gauge fall outside.
        let (low, high) = (
            goal.and_then(|g| g.min_n).unwrap_or(0.0),
            goal.and_then(|g| g.max_n).unwrap_or(f64::INFINITY),
        );
        let room = 1.0 + options.tolerance;
        let window = if low * room <= high / room {
            (low * room, high / room)
        } else {
            (low, high)
        };
        let target_for = |construction: &Construction<'_>| -> f64 {
            match (bend_goal, construction.axial_stiffness()) {
                (Some(force), Some(stiffness)) => physics::tension_for_bend_force(
                    geometry,
                    stiffness,
                    force,
                    options.feel.bend_cents,
                )
                .clamp(window.0, window.1.max(window.0)),
                _ => target_tension_n,
            }
        };
        let checks = Checks {
            min_tension: goal.and_then(|g| g.min_n),
            max_tension: goal.and_then(|g| g.max_n),
            widest: slot_stated,
            limits: limits.after,
        };
        let mut request = Request {
            frequency: pitch_hz,
            length: placed.length_m,
            target_tension: old.map_or(target_tension_n, |(_, c, _)| target_for(c)),
            tolerance: options.tolerance,
            checks,
        };
        let keep = match old {
            Some((written, construction, _)) if !options.reselect_all => {
                let evaluation = select::evaluate(construction, pitch_hz, placed.length_m, &checks);
                let close =
                    (evaluation.tension / request.target_tension - 1.0).abs() <= options.tolerance;
                let blocked = evaluation.warnings.intersects(
                    Warnings::STRESS_DANGER
                        .union(Warnings::BELOW_WINDOW)
                        .union(Warnings::ABOVE_WINDOW)
                        .union(Warnings::WIDER_THAN_SLOT),
                );
                (close && !blocked).then(|| (written.clone(), *construction, evaluation))
            }
            _ => None,
        };
        // Whether a newly chosen string is already the heaviest or the thinnest of its catalog,
        // so that a window it misses is out of reach for its kind.
        let mut catalog_end = (false, false);
        let (set_string, construction, evaluation, selection_flags) = match keep {
            Some((written, construction, evaluation)) => {
                (written, construction, evaluation, evaluation.warnings)
            }
            None => {
                let allowed = allowed_kinds(after, index, course, string_index, old, kinds)?;
                let mut scratch = vec![None; allowed.len()];
                let mut selection = select::select(&request, &allowed, &mut scratch);
                // The bend rule's target moves with the string chosen: settle it in a few
                // rounds (the gauge steps are coarse, so it stops moving at once or after one).
                for _ in 0..4 {
                    let Some(chosen) = selection.chosen else {
                        break;
                    };
                    let next = target_for(&allowed[chosen.kind].construction(chosen.diameter));
                    if (next / request.target_tension - 1.0).abs() < 1e-3 {
                        break;
                    }
                    request.target_tension = next;
                    selection = select::select(&request, &allowed, &mut scratch);
                }
                let chosen = selection.chosen.ok_or_else(|| {
                    after.point(
                        Error::input(format!(
                            "course {}: none of the allowed kinds has any gauge to choose from",
                            course.number
                        )),
                        &[PathStep::Key("courses"), PathStep::Index(index)],
                    )
                })?;
                let kind = allowed[chosen.kind];
                let construction = kind.construction(chosen.diameter);
                let evaluation =
                    select::evaluate(&construction, pitch_hz, placed.length_m, &checks);
                flag_catalog(&mut warnings, at, &selection, kind, &request);
                let gauges = kind.gauges();
                catalog_end = (
                    gauges.last().is_some_and(|g| g.diameter == chosen.diameter),
                    gauges
                        .first()
                        .is_some_and(|g| g.diameter == chosen.diameter),
                );
                (
                    SetString::Kind {
                        kind: kind.id.as_str().to_string(),
                        diameter: chosen.diameter,
                        core_diameter: None,
                    },
                    construction,
                    evaluation,
                    selection.warnings,
                )
            }
        };
        let target_tension_n = request.target_tension;
        let kept = old.is_some_and(|(written, _, _)| *written == set_string);
        let after_side = side(&set_string, &evaluation, pitch_hz);
        flag_common(
            &mut warnings,
            at,
            &evaluation,
            selection_flags,
            &checks,
            pitch_hz,
            set_string.diameter(),
            catalog_end,
        );
        let slot = slot_fit(
            slot_stated,
            before_side
                .as_ref()
                .and_then(|b| b.diameter_mm.map(|d| d / 1000.0)),
            set_string.diameter(),
        );
        if let Some(fit) = slot
            .as_ref()
            .filter(|fit| !fit.fits && fit.against == OLD_STRING)
        {
            warnings.push(Warning {
                kind: WarningKind::WiderThanSlot,
                severity: Severity::Note,
                course: Some(course.number),
                string: Some(string_index + 1),
                value: (fit.width_mm + fit.wider_by_mm) / 1000.0,
                limit: fit.width_mm / 1000.0,
                message: format!(
                    "Course {} string {}: the new string is {:.3} mm wider than the old one ({:.3} mm); the nut slot was cut for the old string and may need widening by a qualified person.",
                    course.number,
                    string_index + 1,
                    fit.wider_by_mm,
                    fit.width_mm
                ),
            });
        }
        let change = |after: f64, before: f64| (after / before - 1.0) * 100.0;
        strings.push(ConvertString {
            interval: layout.interval.written().to_string(),
            tension_change_pct: before_side
                .as_ref()
                .map(|b| change(after_side.tension_n, b.tension_n)),
            stress_change_pct: match (
                before_side.as_ref().and_then(|b| b.stress_ratio),
                after_side.stress_ratio,
            ) {
                (Some(b), Some(a)) => Some(change(a, b)),
                _ => None,
            },
            before: before_side,
            after: after_side,
            kept,
            target_tension_n,
            slot,
            feel_before,
            feel_after: feel::feel(
                &construction,
                evaluation.tension,
                placed.length_m,
                &options.feel,
            ),
            set_string,
        });
    }
    Ok(ConvertCourse {
        course: course.number,
        pitch_before: before.map(|b| b.course.pitch.to_string()),
        pitch_after: placed.pitch.written.clone(),
        pitch_label: placed.pitch.label.clone(),
        note_name: placed.pitch.note_name.clone(),
        note_offset_cents: placed.pitch.note_offset_cents,
        pitch_before_hz: before.map(|b| b.pitch.hz),
        pitch_after_hz: placed.pitch.hz,
        length_before_m: before.map(|b| b.length_m),
        length_after_m: placed.length_m,
        strings,
        warnings,
    })
}
