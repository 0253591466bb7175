//! Pictures and exports of results: charts of a plan, an audit, a conversion, a tuning's fit and
//! a length layout; the builder's string chart (a printable table per course); and flat records
//! of any result for spreadsheets.
//!
//! The flow is the same as everywhere else in taut: [`build`] turns a result into a plain
//! [`Chart`] (numbers, names, looks), and [`draw`] renders any chart as SVG text or PNG bytes
//! with plotters and the bundled font. Nothing here sees the command line or writes a file; the
//! CLI layer writes what these functions return.

pub mod build;
pub mod draw;
pub mod label;
pub mod order;
pub mod palette;
pub mod records;
mod scale;
pub mod sheet;

use serde::Serialize;

pub use palette::Look;

/// A chart ready to draw: axes, data series, shaded bands and level lines.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Chart {
    /// Title above the plot.
    pub title: String,
    /// The horizontal axis.
    pub x_axis: Axis,
    /// The left vertical axis.
    pub y_axis: Axis,
    /// A right vertical axis for series marked `secondary`, when the chart has one.
    pub y2_axis: Option<Axis>,
    /// Shaded regions drawn first, behind everything else.
    pub bands: Vec<Band>,
    /// Horizontal reference lines across the whole plot (left axis).
    pub levels: Vec<Level>,
    /// The data, drawn in order.
    pub series: Vec<Series>,
}

/// One axis: its label (with the unit) and, for course axes, a name per whole number.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Axis {
    /// The label, naming the unit in brackets: `tension (N)`.
    pub label: String,
    /// Tick names at whole numbers (course numbers with their pitches); empty for plain numbers.
    pub tick_names: Vec<(i64, String)>,
    /// Whether the axis must include zero (tensions and diameters start at nothing).
    pub from_zero: bool,
}

impl Axis {
    /// A numeric axis.
    pub fn numeric(label: impl Into<String>, from_zero: bool) -> Self {
        Axis {
            label: label.into(),
            tick_names: Vec::new(),
            from_zero,
        }
    }
}

/// A data series: points drawn with one look, optionally joined by a line.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Series {
    /// Name in the legend.
    pub name: String,
    /// Colour, marker and line pattern.
    pub look: Look,
    /// Whether neighbouring points are joined by a line.
    pub joined: bool,
    /// Whether the series uses the right-hand axis.
    pub secondary: bool,
    /// The points in drawing order.
    pub points: Vec<Point>,
}

/// One data point, with the warning it carries (drawn as a ring around the mark).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Point {
    /// Horizontal position (course number, or cents).
    pub x: f64,
    /// Vertical position in the axis unit.
    pub y: f64,
    /// A short text drawn beside the mark (a ratio on a tuning chart), when any.
    pub tag: Option<String>,
    /// The worst warning on this point, when any.
    pub flag: Option<Flag>,
}

impl Point {
    /// A plain point.
    pub fn at(x: f64, y: f64) -> Self {
        Point {
            x,
            y,
            tag: None,
            flag: None,
        }
    }
}

/// How serious the warning on a point is; drawn as a thin or a thick ring.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Flag {
    /// A caution: works, but check it.
    Caution,
    /// A danger: may break or overload.
    Danger,
}

/// A shaded region between a lower and an upper edge (e.g. a tension window per course).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Band {
    /// Name in the legend.
    pub name: String,
    /// `(x, low, high)` along the band, in x order.
    pub edges: Vec<(f64, f64, f64)>,
}

/// A horizontal line at one value, with a name in the legend.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Level {
    /// Name in the legend, with its value.
    pub name: String,
    /// The value on the left axis.
    pub y: f64,
    /// Colour and pattern.
    pub look: Look,
}

/// Every chart of one result, each with a short name used in file names and options.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Named {
    /// Short name: `tension`, `stress`, `diameter`, `lengths`, `errors`.
    pub name: &'static str,
    /// The chart.
    pub chart: Chart,
}
