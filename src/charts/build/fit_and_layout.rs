//! The charts of a tuning's fit and of a length layout.

#[allow(unused_imports)]
use super::*;

/// The chart of a tuning's fit: each just interval at its size in cents against the error of the
/// tuning's best approximation, tagged with its ratio.
pub fn fit(report: &FitReport) -> Vec<Named> {
    let points = report
        .intervals
        .iter()
        .map(|fit| Point {
            tag: Some(format_ratio(&fit.interval)),
            ..Point::at(fit.just_cents, fit.error_cents)
        })
        .collect();
    vec![Named {
        name: "errors",
        chart: Chart {
            title: format!(
                "{}: best degrees against just intervals ({}-odd-limit)",
                report.tuning.name, report.odd_limit
            ),
            x_axis: Axis::numeric("just interval (cents)", true),
            y_axis: Axis::numeric("tuning minus just (cents)", false),
            y2_axis: None,
            bands: Vec::new(),
            levels: vec![Level {
                name: "just (0 cents)".to_string(),
                y: 0.0,
                look: Look::Reference,
            }],
            series: vec![series("best approximation", Look::Main, false, points)],
        },
    }]
}

/// The chart of a length layout: the bridge line (vibrating length per course, left axis) with
/// the tension profile (right axis); courses after an impractical jump are flagged.
pub fn layout(layout: &Layout) -> Vec<Named> {
    let axis = course_axis(
        layout
            .courses
            .iter()
            .map(|c| (c.course, pitch_name(&c.pitch))),
    );
    let mut lengths = Vec::new();
    let mut tension = Vec::new();
    for course in &layout.courses {
        let x = f64::from(course.course);
        let jumped = layout
            .jumps
            .iter()
            .any(|jump| jump.to_course == course.course)
            .then_some(Flag::Caution);
        let warned = layout
            .warnings
            .iter()
            .filter(|w| w.course == Some(course.course))
            .filter_map(|w| flag_of(w.severity))
            .max();
        lengths.push(flagged(x, course.length_m * 1000.0, jumped.max(warned)));
        tension.push(Point::at(x, course.tension_n));
    }
    let mut profile = series("tension profile", Look::Second, true, tension);
    profile.secondary = true;
    vec![Named {
        name: "lengths",
        chart: Chart {
            title: format!(
                "{}, {}: bridge line and tension",
                layout.name, layout.tuning
            ),
            x_axis: axis,
            y_axis: Axis::numeric("vibrating length (mm)", true),
            y2_axis: Some(Axis::numeric(TENSION_AXIS, true)),
            bands: Vec::new(),
            levels: Vec::new(),
            series: vec![
                series("vibrating length", Look::Main, true, lengths),
                profile,
            ],
        },
    }]
}
