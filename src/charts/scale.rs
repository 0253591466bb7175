//! Axis scales of a chart: the ranges (padded, zero included where asked) and the ticks
//! (whole course numbers named by pitch, or round numbers).

use std::ops::Range;

use plotters::coord::ranged1d::{DefaultFormatting, KeyPointHint, Ranged};

use super::Chart;

/// Course names go under the ticks up to this many courses; above it, numbers only.
const MAX_NAMED_TICKS: usize = 12;

/// `low..high` widened so data never touches the frame; zero included when asked.
pub(super) fn padded(
    values: impl Iterator<Item = f64>,
    from_zero: bool,
    pad_low: bool,
) -> Range<f64> {
    let (mut low, mut high) = values
        .filter(|v| v.is_finite())
        .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), v| {
            (lo.min(v), hi.max(v))
        });
    if from_zero {
        low = low.min(0.0);
        high = high.max(0.0);
    }
    if !low.is_finite() || !high.is_finite() {
        return 0.0..1.0;
    }
    if high - low < 1e-9 {
        let half = (high.abs() * 0.1).max(1.0);
        return (low - half)..(high + half);
    }
    let span = high - low;
    let bottom = if pad_low && !(from_zero && low >= 0.0) {
        low - span * 0.08
    } else {
        low
    };
    bottom..(high + span * 0.12)
}

/// A "nice" tick step (1, 2 or 5 times a power of ten) giving about `count` ticks over `span`.
fn nice_step(span: f64, count: f64) -> f64 {
    let raw = span / count;
    let power = 10_f64.powf(raw.log10().floor());
    let scaled = raw / power;
    let nice = if scaled <= 1.0 {
        1.0
    } else if scaled <= 2.0 {
        2.0
    } else if scaled <= 5.0 {
        5.0
    } else {
        10.0
    };
    nice * power
}

/// The horizontal range and its ticks: whole course numbers, or nice round numbers.
pub(super) fn x_coord(chart: &Chart) -> Ticked {
    let xs = chart
        .series
        .iter()
        .flat_map(|s| s.points.iter().map(|p| p.x))
        .chain(chart.bands.iter().flat_map(|b| b.edges.iter().map(|e| e.0)));
    if chart.x_axis.tick_names.is_empty() {
        let range = padded(xs, chart.x_axis.from_zero, true);
        let step = nice_step(range.end - range.start, 10.0);
        let first = (range.start / step).ceil() as i64;
        let last = (range.end / step).floor() as i64;
        let ticks = (first..=last).map(|i| i as f64 * step).collect();
        (range.start..range.end).into_segmented_free(ticks)
    } else {
        let (low, high) = xs.fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), v| {
            (lo.min(v), hi.max(v))
        });
        let (low, high) = if low.is_finite() {
            (low, high)
        } else {
            (1.0, 1.0)
        };
        let count = chart.x_axis.tick_names.len().max(1);
        let every = count.div_ceil(20).max(1) as i64;
        let ticks = chart
            .x_axis
            .tick_names
            .iter()
            .map(|(n, _)| *n)
            .filter(|n| (n - 1) % every == 0)
            .map(|n| n as f64)
            .collect();
        ((low - 0.6)..(high + 0.6)).into_segmented_free(ticks)
    }
}

/// A linear axis whose ticks are given (whole course numbers, or round numbers we chose).
#[derive(Debug, Clone)]
pub(super) struct Ticked {
    range: Range<f64>,
    ticks: Vec<f64>,
}

impl Ranged for Ticked {
    type ValueType = f64;
    type FormatOption = DefaultFormatting;

    fn range(&self) -> Range<f64> {
        self.range.clone()
    }

    fn map(&self, value: &f64, limit: (i32, i32)) -> i32 {
        let span = self.range.end - self.range.start;
        let share = (value - self.range.start) / span;
        limit.0 + (share * f64::from(limit.1 - limit.0)).round() as i32
    }

    fn key_points<Hint: KeyPointHint>(&self, hint: Hint) -> Vec<f64> {
        if hint.weight().allow_light_points() {
            Vec::new()
        } else {
            self.ticks.clone()
        }
    }
}

trait FreeTicks {
    fn into_segmented_free(self, ticks: Vec<f64>) -> Ticked;
}

impl FreeTicks for Range<f64> {
    fn into_segmented_free(self, ticks: Vec<f64>) -> Ticked {
        Ticked { range: self, ticks }
    }
}

pub(super) fn tick_text(chart: &Chart, x: f64) -> String {
    let names = &chart.x_axis.tick_names;
    if names.is_empty() {
        return trim_number(x);
    }
    let whole = x.round();
    if (x - whole).abs() > 1e-6 {
        return String::new();
    }
    if names.len() <= MAX_NAMED_TICKS {
        if let Some((_, name)) = names.iter().find(|(n, _)| *n as f64 == whole) {
            return name.clone();
        }
    }
    format!("{whole:.0}")
}

pub(super) fn trim_number(value: f64) -> String {
    let text = format!("{value:.2}");
    let text = text.trim_end_matches('0').trim_end_matches('.');
    if text == "-0" {
        "0".to_string()
    } else {
        text.to_string()
    }
}
