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
        let tension_n = spec.goal_at(position).target_n;
        let string = course
            .string
            .resolve(kinds, materials)
            .map_err(|err| input.point(err, &at_key("string")))?;
        let unit_mass = string.construction.unit_mass();
        let length_m = physics::length_for_tension(tension_n, unit_mass, resolved.hz);
        let evaluation = select::evaluate(
            &string.construction,
            resolved.hz,
            length_m,
            &Checks {
                limits,
                ..Checks::default()
            },
        );
        let at = StringRef {
            course: course.course,
            string: 1,
        };
        if let (Some(ratio), Some(break_hz)) = (evaluation.stress_ratio, evaluation.break_frequency)
        {
            if evaluation.warnings.contains(Warnings::STRESS_DANGER) {
                warnings.push(at.stress(
                    WarningKind::StressDanger,
                    ratio,
                    limits.danger,
                    break_hz,
                    resolved.hz,
                ));
            } else if evaluation.warnings.contains(Warnings::STRESS_CAUTION) {
                warnings.push(at.stress(
                    WarningKind::StressCaution,
                    ratio,
                    limits.caution,
                    break_hz,
                    resolved.hz,
                ));
            }
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
            let pitch_direction = resolved.hz - previous.pitch.hz;
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
        let diameter = course.string.diameter();
        courses.push(LayoutCourse {
            course: course.course,
            pitch: resolved,
            string: course.string.label(),
            diameter_mm: diameter.map(|d| d * 1000.0),
            diameter_in: diameter.map(|d| d / METRES_PER_INCH),
            unit_mass_kg_per_m: unit_mass,
            tension_n,
            length_m,
            stress_ratio: evaluation.stress_ratio,
            break_pitch_hz: evaluation.break_frequency,
            step_pct,
            feel: feel::feel(&string.construction, tension_n, length_m, &options.feel),
        });
    }
    Ok(Layout {
        name: input.name.clone(),
        tuning: tuning.name().to_string(),
        max_step,
        total_tension_n: courses.iter().map(|c| c.tension_n).sum(),
        cautions: cautions_for(&warnings),
        courses,
        jumps,
        warnings,
    })
}
