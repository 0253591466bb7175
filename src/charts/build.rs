//! Results into charts: a plan's tension, stress and diameters; an audit's tension and stress; a
//! conversion's before and after; a tuning's errors against just intervals; a length layout's
//! bridge line with its tension profile. Pure functions over the result types.

use crate::instrument::{Instrument, TensionSpec};
use crate::lengths::Layout;
use crate::plan::warning::{Severity, Warning};
use crate::plan::{CoursePitch, Plan};
use crate::sets::audit::Audit;
use crate::sets::convert::Conversion;
use crate::strings::select::StressLimits;
use crate::tuning::analysis::FitReport;
use crate::tuning::pitch::format_ratio;

use super::{Axis, Band, Chart, Flag, Level, Look, Named, Point, Series};

/// The tension window (lowest, highest acceptable, in newtons) of each course of `instrument`,
/// in course order; `None` where the course states no complete window.
pub fn tension_windows(
    instrument: &Instrument,
    tension: Option<&TensionSpec>,
) -> Vec<Option<(f64, f64)>> {
    (0..instrument.courses.len())
        .map(|index| {
            let goal = instrument.course_input(index, tension)?.tension?;
            Some((goal.min_n?, goal.max_n?))
        })
        .collect()
}

/// The stress fractions at which an instrument's cautions and dangers start (its own, or the
/// selector's defaults; limits the plan refuses were refused before any chart is drawn).
pub fn stress_limits(instrument: &Instrument) -> StressLimits {
    crate::plan::solve::stress_limits(instrument).unwrap_or_default()
}

/// The flag a warning puts on a point: cautions and dangers are drawn, notes are not.
fn flag_of(severity: Severity) -> Option<Flag> {
    match severity {
        Severity::Danger => Some(Flag::Danger),
        Severity::Caution => Some(Flag::Caution),
        Severity::Note => None,
    }
}

/// The worst drawn flag among `warnings` for one string (1-based) or for the whole course.
fn worst_flag(warnings: &[Warning], string: usize) -> Option<Flag> {
    warnings
        .iter()
        .filter(|w| w.string.is_none_or(|s| s == string))
        .filter_map(|w| flag_of(w.severity))
        .max()
}

/// The course axis: course numbers, each named by number and pitch.
fn course_axis<'a>(courses: impl Iterator<Item = (u32, &'a str)>) -> Axis {
    Axis {
        label: "course".to_string(),
        tick_names: courses
            .map(|(number, pitch)| (i64::from(number), format!("{number} {pitch}")))
            .collect(),
        from_zero: false,
    }
}

fn series(name: &str, look: Look, joined: bool, points: Vec<Point>) -> Series {
    Series {
        name: name.to_string(),
        look,
        joined,
        secondary: false,
        points,
    }
}

fn flagged(x: f64, y: f64, flag: Option<Flag>) -> Point {
    Point {
        flag,
        ..Point::at(x, y)
    }
}

fn stress_levels(limits: StressLimits) -> Vec<Level> {
    vec![
        Level {
            name: format!("caution ({:.0} %)", limits.caution * 100.0),
            y: limits.caution * 100.0,
            look: Look::Caution,
        },
        Level {
            name: format!("danger ({:.0} %)", limits.danger * 100.0),
            y: limits.danger * 100.0,
            look: Look::Danger,
        },
    ]
}

fn window_band(courses: &[u32], windows: &[Option<(f64, f64)>]) -> Vec<Band> {
    let edges: Vec<(f64, f64, f64)> = courses
        .iter()
        .zip(windows)
        .filter_map(|(course, window)| window.map(|(low, high)| (f64::from(*course), low, high)))
        .collect();
    if edges.is_empty() {
        Vec::new()
    } else {
        vec![Band {
            name: "tension window".to_string(),
            edges,
        }]
    }
}

const STRESS_AXIS: &str = "stress (% of breaking strength)";
const TENSION_AXIS: &str = "tension (N)";

fn pitch_name(pitch: &CoursePitch) -> &str {
    &pitch.label
}

/// The charts of a plan: `tension` (with each course's window shaded and its target dashed),
/// `stress` (with the caution and danger lines) and `diameter` (one series per construction).
/// `windows` are the courses' tension windows in course order (see [`tension_windows`]).
pub fn plan(plan: &Plan, windows: &[Option<(f64, f64)>]) -> Vec<Named> {
    let axis = course_axis(
        plan.courses
            .iter()
            .map(|c| (c.course, pitch_name(&c.pitch))),
    );
    let joined = plan.courses.iter().all(|c| c.strings.len() == 1);
    let mut tension = Vec::new();
    let mut target = Vec::new();
    let mut stress = Vec::new();
    let mut by_construction: Vec<(String, Vec<Point>)> = Vec::new();
    for course in &plan.courses {
        let x = f64::from(course.course);
        for (index, string) in course.strings.iter().enumerate() {
            let flag = worst_flag(&course.warnings, index + 1);
            let choice = &string.choice;
            tension.push(flagged(x, choice.tension_n, flag));
            stress.push(flagged(x, choice.stress_ratio * 100.0, flag));
            let point = Point::at(x, choice.diameter_mm);
            match by_construction
                .iter_mut()
                .find(|(name, _)| *name == choice.construction)
            {
                Some((_, points)) => points.push(point),
                None => by_construction.push((choice.construction.clone(), vec![point])),
            }
        }
        if let Some(first) = course.strings.first() {
            target.push(Point::at(x, first.target_tension_n));
        }
    }
    let numbers: Vec<u32> = plan.courses.iter().map(|c| c.course).collect();
    let limits = StressLimits {
        caution: plan.caution_stress_ratio,
        danger: plan.danger_stress_ratio,
    };
    vec![
        Named {
            name: "tension",
            chart: Chart {
                title: format!("{}, {}: tension per course", plan.instrument, plan.tuning),
                x_axis: axis.clone(),
                y_axis: Axis::numeric(TENSION_AXIS, true),
                y2_axis: None,
                bands: window_band(&numbers, windows),
                levels: Vec::new(),
                series: vec![
                    series("target", Look::Reference, true, target),
                    series("string tension", Look::Main, joined, tension),
                ],
            },
        },
        Named {
            name: "stress",
            chart: Chart {
                title: format!("{}, {}: stress per course", plan.instrument, plan.tuning),
                x_axis: axis.clone(),
                y_axis: Axis::numeric(STRESS_AXIS, true),
                y2_axis: None,
                bands: Vec::new(),
                levels: stress_levels(limits),
                series: vec![series("stress", Look::Main, joined, stress)],
            },
        },
        Named {
            name: "diameter",
            chart: Chart {
                title: format!(
                    "{}, {}: diameter per course by construction",
                    plan.instrument, plan.tuning
                ),
                x_axis: axis,
                y_axis: Axis::numeric("outer diameter (mm)", true),
                y2_axis: None,
                bands: Vec::new(),
                levels: Vec::new(),
                series: by_construction
                    .into_iter()
                    .zip(Look::DATA.iter().cycle())
                    .map(|((name, points), look)| series(&name, *look, false, points))
                    .collect(),
            },
        },
    ]
}

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
