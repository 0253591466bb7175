//! The charts of an audit and of a conversion.

#[allow(unused_imports)]
use super::*;

/// The charts of an audit of a set on `instrument`: `tension` (the instrument's windows shaded
/// when it states them) and `stress` with the instrument's caution and danger lines. Strings of
/// unknown strength are left out of the stress chart.
pub fn audit(audit: &Audit, instrument: &Instrument) -> Vec<Named> {
    let windows = tension_windows(instrument, None);
    let limits = stress_limits(instrument);
    let axis = course_axis(
        audit
            .courses
            .iter()
            .map(|c| (c.course, pitch_name(&c.pitch))),
    );
    let joined = audit.courses.iter().all(|c| c.strings.len() == 1);
    let mut tension = Vec::new();
    let mut before = Vec::new();
    let mut stress = Vec::new();
    for course in &audit.courses {
        let x = f64::from(course.course);
        for (index, string) in course.strings.iter().enumerate() {
            let flag = worst_flag(&course.warnings, index + 1);
            tension.push(flagged(x, string.tension_n, flag));
            if let Some(reference) = string.reference_tension_n {
                before.push(Point::at(x, reference));
            }
            if let Some(ratio) = string.stress_ratio {
                stress.push(flagged(x, ratio * 100.0, flag));
            }
        }
    }
    let numbers: Vec<u32> = audit.courses.iter().map(|c| c.course).collect();
    let mut tension_series = Vec::new();
    if !before.is_empty() {
        let name = match &audit.reference_tuning {
            Some(reference) => format!("tension now, in {reference}"),
            None => "tension now".to_string(),
        };
        tension_series.push(series(&name, Look::Second, joined, before));
    }
    tension_series.push(series(
        &format!("tension in {}", audit.tuning),
        Look::Main,
        joined,
        tension,
    ));
    let title = format!(
        "{}, set {}, in {}",
        audit.instrument, audit.set, audit.tuning
    );
    vec![
        Named {
            name: "tension",
            chart: Chart {
                title: format!("{title}: tension per course"),
                x_axis: axis.clone(),
                y_axis: Axis::numeric(TENSION_AXIS, true),
                y2_axis: None,
                bands: window_band(&numbers, &windows),
                levels: Vec::new(),
                series: tension_series,
            },
        },
        Named {
            name: "stress",
            chart: Chart {
                title: format!("{title}: stress per course"),
                x_axis: axis,
                y_axis: Axis::numeric(STRESS_AXIS, true),
                y2_axis: None,
                bands: Vec::new(),
                levels: stress_levels(limits),
                series: vec![series("stress", Look::Main, joined, stress)],
            },
        },
    ]
}

/// The charts of a conversion: `tension` and `stress` before and after on one chart each, with
/// the caution and danger lines of the instrument `after` conversion.
pub fn conversion(conversion: &Conversion, after: &Instrument) -> Vec<Named> {
    let limits = stress_limits(after);
    let axis = course_axis(
        conversion
            .courses
            .iter()
            .map(|c| (c.course, c.pitch_label.as_str())),
    );
    let joined = conversion.courses.iter().all(|c| c.strings.len() == 1);
    let (mut tension_before, mut tension_after) = (Vec::new(), Vec::new());
    let (mut stress_before, mut stress_after) = (Vec::new(), Vec::new());
    for course in &conversion.courses {
        let x = f64::from(course.course);
        for (index, string) in course.strings.iter().enumerate() {
            let flag = worst_flag(&course.warnings, index + 1);
            if let Some(before) = &string.before {
                tension_before.push(Point::at(x, before.tension_n));
                if let Some(ratio) = before.stress_ratio {
                    stress_before.push(Point::at(x, ratio * 100.0));
                }
            }
            tension_after.push(flagged(x, string.after.tension_n, flag));
            if let Some(ratio) = string.after.stress_ratio {
                stress_after.push(flagged(x, ratio * 100.0, flag));
            }
        }
    }
    let before_name = format!("before: {}", conversion.tuning_before);
    let after_name = format!("after: {}", conversion.tuning_after);
    let title = format!(
        "{} → {}",
        conversion.instrument_before, conversion.instrument_after
    );
    vec![
        Named {
            name: "tension",
            chart: Chart {
                title: format!("{title}: tension before and after"),
                x_axis: axis.clone(),
                y_axis: Axis::numeric(TENSION_AXIS, true),
                y2_axis: None,
                bands: Vec::new(),
                levels: Vec::new(),
                series: vec![
                    series(&before_name, Look::Second, joined, tension_before),
                    series(&after_name, Look::Main, joined, tension_after),
                ],
            },
        },
        Named {
            name: "stress",
            chart: Chart {
                title: format!("{title}: stress before and after"),
                x_axis: axis,
                y_axis: Axis::numeric(STRESS_AXIS, true),
                y2_axis: None,
                bands: Vec::new(),
                levels: stress_levels(limits),
                series: vec![
                    series(&before_name, Look::Second, joined, stress_before),
                    series(&after_name, Look::Main, joined, stress_after),
                ],
            },
        },
    ]
}
