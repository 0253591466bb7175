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

mod sets;
#[allow(unused_imports)]
use sets::*;
pub use sets::*;
mod fit_and_layout;
#[allow(unused_imports)]
use fit_and_layout::*;
pub use fit_and_layout::*;

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
                .find(|(name, _)| *name == *choice.construction)
            {
                Some((_, points)) => points.push(point),
                None => by_construction.push((choice.construction.to_string(), vec![point])),
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
