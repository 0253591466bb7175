//! Solving each course's length for its tension, then smoothing the bridge line and finding jumps.

#[allow(unused_imports)]
use super::*;

/// Lays out the courses of `input` in `tuning`.
pub fn solve_layout(
    input: &LayoutInput,
    tuning: &Tuning,
    stock: &Stock,
    options: &LayoutOptions,
) -> Result<Layout> {
    let (kinds, materials) = (stock.kinds(), stock.materials());
    let max_step = options.max_step.unwrap_or(input.max_step);
    let limits = StressLimits::default();
    let count = input.courses.len();
    let mut courses: Vec<LayoutCourse> = Vec::with_capacity(count);
    let mut warnings = Vec::new();
    let mut jumps = Vec::new();
    let mut previous_first_hz = 0.0;
    // First pass: each course's pitch and its tension goal.
    let mut pitched = Vec::with_capacity(count);
    for (index, course) in input.courses.iter().enumerate() {
        let at_key = |key: &'static str| {
            [
                PathStep::Key("courses"),
                PathStep::Index(index),
                PathStep::Key(key),
            ]
        };
        let resolved = CoursePitch::resolve(&course.pitch, tuning)
            .map_err(|err| input.point(err, &at_key("pitch")))?;
        let position = if count > 1 {
            index as f64 / (count - 1) as f64
        } else {
            0.0
        };
        let spec = options
            .tension
            .as_ref()
            .or(course.tension.as_ref())
            .or(input.tension.as_ref())
            .ok_or_else(|| {
                input.point(
                    Error::input(format!("course {} has no tension", course.course))
                        .help("give a top-level `tension` (a target or a `first`/`last` profile), the course's own, or --tension"),
                    &[PathStep::Key("courses"), PathStep::Index(index)],
                )
            })?;
        pitched.push((resolved, spec.goal_at(position)));
    }
    // Strings named outright, and the others chosen together with the lengths.
    let firsts = first_strings(input, tuning, stock, limits, &pitched)?;
    let mut prepared = Vec::with_capacity(count);
    for (index, ((resolved, goal), written)) in pitched.into_iter().zip(&firsts).enumerate() {
        let string = written.resolve(kinds, materials).map_err(|err| {
            input.point(
                err,
                &[
                    PathStep::Key("courses"),
                    PathStep::Index(index),
                    PathStep::Key("string"),
                ],
            )
        })?;
        prepared.push((resolved, goal, string));
    }
    // The window lets each course move to smooth the bridge line (see `smooth`): in the
    // logarithm of the length, ln L = ln √(T/μ) − ln 2f (L = √(T/μ)/(2f), REFERENCES §1.2).
    let log_length = |tension: f64, index: usize| {
        let (pitch, _, string) = &prepared[index];
        let hz = pitch.hz * input.courses[index].first_interval.ratio();
        0.5 * (tension / string.construction.unit_mass()).ln() - (2.0 * hz).ln()
    };
    let targets: Vec<f64> = (0..count)
        .map(|i| log_length(prepared[i].1.target_n, i))
        .collect();
    let lows: Vec<f64> = (0..count)
        .map(|i| {
            prepared[i]
                .1
                .min_n
                .map_or(targets[i], |min| log_length(min, i))
        })
        .collect();
    let highs: Vec<f64> = (0..count)
        .map(|i| {
            prepared[i]
                .1
                .max_n
                .map_or(targets[i], |max| log_length(max, i))
        })
        .collect();
    let (mut targets, mut lows, mut highs) = (targets, lows, highs);
    // The frame's length window narrows each course's own, where the tension window lets it.
    let (shortest, longest) = (
        input.length_window.0.map_or(f64::NEG_INFINITY, f64::ln),
        input.length_window.1.map_or(f64::INFINITY, f64::ln),
    );
    for i in 0..count {
        let (mut low, mut high) = (lows[i].max(shortest), highs[i].min(longest));
        // A chosen string was chosen below the caution stress: the smoothing keeps it there
        // (T = μ(2fL)² ≤ caution·T_break gives the longest length).
        if input.courses[i].string.is_none() {
            let string = &prepared[i].2;
            if let Some(breaking) = string.construction.breaking_tension() {
                let cap = log_length(limits.caution * (1.0 - 1e-6) * breaking, i);
                high = high.min(cap);
                low = low.min(high);
            }
        }
        if low <= high {
            lows[i] = low;
            highs[i] = high;
            targets[i] = targets[i].clamp(low, high);
        }
    }
    let smoothed = smooth::smooth(&targets, &lows, &highs, TARGET_PULL);
    for (index, (course, (resolved, goal, string))) in
        input.courses.iter().zip(prepared).enumerate()
    {
        let unit_mass = string.construction.unit_mass();
        let first_hz = resolved.hz * course.first_interval.ratio();
        // T = μ·(2fL)² with L = e^x, kept inside the window against rounding.
        let mut tension_n = unit_mass * (2.0 * first_hz * smoothed[index].exp()).powi(2);
        if let Some(min) = goal.min_n {
            tension_n = tension_n.max(min);
        }
        if let Some(max) = goal.max_n {
            tension_n = tension_n.min(max);
        }
        if goal.min_n.is_none() && goal.max_n.is_none() {
            tension_n = goal.target_n;
        }
        let length_m = physics::length_for_tension(tension_n, unit_mass, first_hz);
        // Bounded inputs can still ask for a length no instrument has (a heavy string at a high
        // pitch and a low tension): say so rather than lay out a 1 µm string.
        let bounds = crate::input::units::LENGTH_BOUNDS;
        if !bounds.contains(length_m) {
            return Err(input.point(
                Error::input(format!(
                    "course {} would need a vibrating length of {} m at {} Hz and {} N, outside the range taut accepts for {}: {}",
                    course.course,
                    crate::input::units::short_number(length_m),
                    crate::input::units::short_number(first_hz),
                    crate::input::units::short_number(tension_n),
                    bounds.what,
                    bounds.shown
                ))
                .help("choose a lighter or heavier string, or another tension"),
                &[
                    PathStep::Key("courses"),
                    PathStep::Index(index),
                    PathStep::Key("string"),
                ],
            ));
        }
        let stress_checks = Checks {
            limits,
            ..Checks::default()
        };
        let evaluation = select::evaluate(&string.construction, first_hz, length_m, &stress_checks);
        let at = StringRef {
            course: course.course,
            string: 1,
        };
        stress_warning(&mut warnings, at, &evaluation, limits);
        let mut other_strings = Vec::with_capacity(course.others.len());
        for (other_index, (interval, named)) in course.others.iter().enumerate() {
            let hz = resolved.hz * interval.ratio();
            let written = match named {
                Some(named) => named.clone(),
                None => chosen_other(course, &firsts[index], kinds, tension_n, length_m, hz)
                    .ok_or_else(|| {
                        input.point(
                            Error::input(format!(
                                "course {}: none of its kinds has a gauge for string {}",
                                course.course,
                                other_index + 2
                            )),
                            &[
                                PathStep::Key("courses"),
                                PathStep::Index(index),
                                PathStep::Key("kinds"),
                            ],
                        )
                    })?,
            };
            let other = written.resolve(kinds, materials).map_err(|err| {
                input.point(
                    err,
                    &[
                        PathStep::Key("courses"),
                        PathStep::Index(index),
                        PathStep::Key("strings"),
                        PathStep::Index(other_index + 1),
                    ],
                )
            })?;
            let other_evaluation =
                select::evaluate(&other.construction, hz, length_m, &stress_checks);
            let at = StringRef {
                course: course.course,
                string: other_index + 2,
            };
            stress_warning(&mut warnings, at, &other_evaluation, limits);
            other_strings.push(LayoutString {
                interval: interval.written().to_string(),
                string: written.label(),
                diameter_mm: written.diameter().map(|d| d * 1000.0),
                unit_mass_kg_per_m: other_evaluation.unit_mass,
                pitch_hz: hz,
                tension_n: other_evaluation.tension,
                stress_ratio: other_evaluation.stress_ratio,
                break_pitch_hz: other_evaluation.break_frequency,
                entry: written,
            });
        }
        // f·L = √(T/μ)/2: the step of the wave speed between neighbours.
        let speed = (tension_n / unit_mass).sqrt();
        let step_pct = courses.last().map(|previous| {
            let previous_speed = (previous.tension_n / previous.unit_mass_kg_per_m).sqrt();
            (speed / previous_speed - 1.0) * 100.0
        });
        if let (Some(previous), Some(step)) = (courses.last(), step_pct) {
            if step.abs() > max_step * 100.0 {
                jumps.push(Jump {
                    kind: JumpKind::Step,
                    from_course: previous.course,
                    to_course: course.course,
                    value_pct: step,
                    message: format!(
                        "Courses {} to {}: √(T/μ) changes by {:+.0}% (limit ±{:.0}%), so the length steps by {:+.0}% more than the pitch asks; choose a {} string for course {} or move the tension to smooth the bridge line.",
                        previous.course,
                        course.course,
                        step,
                        max_step * 100.0,
                        step,
                        if step > 0.0 { "heavier" } else { "lighter" },
                        course.course
                    ),
                });
            }
            let pitch_direction = first_hz - previous_first_hz;
            let length_direction = length_m - previous.length_m;
            if pitch_direction * length_direction > 0.0
                && (length_m / previous.length_m - 1.0).abs() > FOLD_BACK_TOLERANCE
            {
                let change = (length_m / previous.length_m - 1.0) * 100.0;
                jumps.push(Jump {
                    kind: JumpKind::FoldBack,
                    from_course: previous.course,
                    to_course: course.course,
                    value_pct: change,
                    message: format!(
                        "Courses {} to {}: the pitch goes {} but the length goes {} ({:+.1}%), so the bridge line folds back.",
                        previous.course,
                        course.course,
                        if pitch_direction > 0.0 { "up" } else { "down" },
                        if length_direction > 0.0 { "up" } else { "down" },
                        change
                    ),
                });
            }
        }
        if !(input
            .length_window
            .0
            .is_none_or(|min| length_m >= min * (1.0 - 1e-9))
            && input
                .length_window
                .1
                .is_none_or(|max| length_m <= max * (1.0 + 1e-9)))
        {
            jumps.push(Jump {
                kind: JumpKind::OutsideLengthWindow,
                from_course: course.course,
                to_course: course.course,
                value_pct: 0.0,
                message: format!(
                    "Course {}: the length {} mm lies outside the length window; choose another string or widen the tension window.",
                    course.course,
                    crate::input::units::short_number(length_m * 1000.0)
                ),
            });
        }
        let entry = firsts[index].clone();
        let diameter = entry.diameter();
        courses.push(LayoutCourse {
            course: course.course,
            pitch: resolved,
            string: entry.label(),
            diameter_mm: diameter.map(|d| d * 1000.0),
            diameter_in: diameter.map(|d| d / METRES_PER_INCH),
            unit_mass_kg_per_m: unit_mass,
            tension_n,
            target_tension_n: goal.target_n,
            length_m,
            stress_ratio: evaluation.stress_ratio,
            break_pitch_hz: evaluation.break_frequency,
            step_pct,
            feel: feel::feel(&string.construction, tension_n, length_m, &options.feel),
            other_strings,
            chosen: course.string.is_none(),
            entry,
            window_n: (goal.min_n, goal.max_n),
        });
        previous_first_hz = first_hz;
    }
    let total_tension_n: f64 = courses
        .iter()
        .map(|c| c.tension_n + c.other_strings.iter().map(|o| o.tension_n).sum::<f64>())
        .sum();
    let rated_load_n = options.rated_load.or(input.rated_load);
    let warnings = with_load_check(&warnings, total_tension_n, rated_load_n);
    Ok(Layout {
        name: input.name.clone(),
        tuning: tuning.name().to_string(),
        max_step,
        total_tension_n,
        string_count: courses.iter().map(|c| 1 + c.other_strings.len()).sum(),
        rated_load_n,
        cautions: cautions_for(&warnings),
        courses,
        jumps,
        warnings,
    })
}

/// Adds a stress caution or danger for one string, when its stress is known and high. The
/// tension is given here and the length solved, so the warning names the tension.
fn stress_warning(
    warnings: &mut Vec<Warning>,
    at: StringRef,
    evaluation: &select::Evaluation,
    limits: StressLimits,
) {
    if let Some(ratio) = evaluation.stress_ratio {
        if evaluation.warnings.contains(Warnings::STRESS_DANGER) {
            warnings.push(at.stress_at_tension(
                WarningKind::StressDanger,
                ratio,
                limits.danger,
                evaluation.tension,
            ));
        } else if evaluation.warnings.contains(Warnings::STRESS_CAUTION) {
            warnings.push(at.stress_at_tension(
                WarningKind::StressCaution,
                ratio,
                limits.caution,
                evaluation.tension,
            ));
        }
    }
}

/// The first string of every course: the one named, or the one chosen with the length
/// ([`choose::choose`]).
fn first_strings(
    input: &LayoutInput,
    tuning: &Tuning,
    stock: &Stock,
    limits: StressLimits,
    pitched: &[(CoursePitch, crate::instrument::TensionGoal)],
) -> Result<Vec<SetString>> {
    let (kinds, materials) = (stock.kinds(), stock.materials());
    if input.courses.iter().all(|course| course.string.is_some()) {
        return Ok(input
            .courses
            .iter()
            .filter_map(|course| course.string.clone())
            .collect());
    }
    // The rules' pitches, resolved once.
    let mut rules = Vec::with_capacity(input.prefer.len());
    for (index, rule) in input.prefer.iter().enumerate() {
        let (key, written, below) = match (&rule.below, &rule.above) {
            (Some(pitch), _) => ("below", pitch, true),
            (None, Some(pitch)) => ("above", pitch, false),
            (None, None) => continue,
        };
        let hz = CoursePitch::resolve(written.trim(), tuning)
            .map_err(|err| {
                input.point(
                    err,
                    &[
                        PathStep::Key("prefer"),
                        PathStep::Index(index),
                        PathStep::Key(key),
                    ],
                )
            })?
            .hz;
        let mut listed = Vec::with_capacity(rule.kinds.len());
        for id in &rule.kinds {
            listed.push(kinds.get(id)?);
        }
        rules.push((hz, below, listed));
    }
    let mut needs = Vec::with_capacity(input.courses.len());
    for (index, (course, (pitch, goal))) in input.courses.iter().zip(pitched).enumerate() {
        let hz = pitch.hz * course.first_interval.ratio();
        let named_unit_mass = match &course.string {
            Some(named) => Some(named.resolve(kinds, materials)?.construction.unit_mass()),
            None => None,
        };
        let mut ordered: Vec<&crate::strings::kind::StringKind> = Vec::new();
        for (rule_hz, below, listed) in &rules {
            let applies = if *below { hz < *rule_hz } else { hz > *rule_hz };
            if applies {
                for kind in listed {
                    if !ordered.iter().any(|k| k.id == kind.id) {
                        ordered.push(kind);
                    }
                }
            }
        }
        for id in &course.kinds {
            let kind = kinds.get(id)?;
            if !ordered.iter().any(|k| k.id == kind.id) {
                ordered.push(kind);
            }
        }
        // A pulling raise tightens the string by the square of its highest ratio.
        let mut pull: f64 = 1.0;
        if let Some(raises) = course
            .raises
            .as_ref()
            .filter(|r| r.action == crate::instrument::Action::Pull)
        {
            for (_, amount) in &raises.positions {
                let ratio = crate::plan::raises::ratio_of(amount, hz, tuning).map_err(|err| {
                    input.point(err, &[PathStep::Key("courses"), PathStep::Index(index)])
                })?;
                pull = pull.max(ratio);
            }
        }
        needs.push(choose::Need {
            hz,
            goal: *goal,
            pull,
            named_unit_mass,
            kinds: ordered,
        });
    }
    let picks = choose::choose(
        &needs,
        &choose::Limits {
            stress: limits,
            working: input.working_stress,
            shortest: input.length_window.0,
            longest: input.length_window.1,
        },
    );
    input
        .courses
        .iter()
        .zip(needs.iter().zip(picks))
        .enumerate()
        .map(
            |(index, (course, (need, pick)))| match (&course.string, pick) {
                (Some(named), _) => Ok(named.clone()),
                (None, Some((kind, gauge))) => Ok(SetString::Kind {
                    kind: need.kinds[kind].id.as_str().to_string(),
                    diameter: need.kinds[kind].gauges()[gauge].diameter,
                    core_diameter: None,
                }),
                (None, None) => Err(input.point(
                    Error::input(format!(
                        "course {}: none of its kinds has a gauge to choose",
                        course.course
                    )),
                    &[PathStep::Key("courses"), PathStep::Index(index)],
                )),
            },
        )
        .collect()
}

/// A further string of a course without one of its own, chosen from the course's kinds on the
/// solved length for the first string's tension ([`choose::choose_other`]).
fn chosen_other(
    course: &LayoutCourseInput,
    first: &SetString,
    kinds: &crate::strings::kind::StringKinds,
    tension: f64,
    length: f64,
    hz: f64,
) -> Option<SetString> {
    // The first string's kind first, so a pair stays a pair of one kind.
    let first_kind = match first {
        SetString::Kind { kind, .. } => kinds.get(kind).ok(),
        SetString::Measured { .. } => None,
    };
    let mut listed: Vec<_> = first_kind.into_iter().collect();
    for kind in course.kinds.iter().filter_map(|id| kinds.get(id).ok()) {
        if !listed.iter().any(|k| k.id == kind.id) {
            listed.push(kind);
        }
    }
    let (kind, gauge) = choose::choose_other(&listed, tension, length, hz)?;
    Some(SetString::Kind {
        kind: kind.id.as_str().to_string(),
        diameter: kind.gauges()[gauge].diameter,
        core_diameter: None,
    })
}
