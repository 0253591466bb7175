//! Draws a [`Chart`] with plotters: SVG text, or PNG bytes rendered in memory with the bundled
//! font (`src/charts/fonts/DejaVuSans.ttf`), so no system font, fontconfig or FreeType is needed.
//!
//! The legend sits in its own strip under the plot, so it never hides data; warning rings and
//! shaded windows get legend entries only when the chart has them.

use std::io;
use std::path::PathBuf;
use std::sync::OnceLock;

use plotters::coord::types::RangedCoordf64;
use plotters::coord::Shift;
use plotters::prelude::*;
use plotters::style::FontStyle;

use crate::error::{Error, Result};

use super::label::label;
use super::palette::{self, Marker, Pattern, Rgb};
use super::scale::{padded, tick_text, trim_number, x_coord, Ticked};
use super::{Chart, Flag, Look, Point};

mod legend;
#[allow(unused_imports)]
use legend::*;

/// The bundled font (DejaVu Sans 2.37, free licence in `src/charts/fonts/LICENSE`).
static FONT: &[u8] = include_bytes!("fonts/DejaVuSans.ttf");
/// The family name charts ask for; SVG readers use their own sans-serif face.
const FAMILY: &str = "sans-serif";

/// Pixel size of a picture.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Size {
    /// Width in pixels.
    pub width: u32,
    /// Height in pixels.
    pub height: u32,
}

/// The default size: readable at 100 % on a laptop screen, fits an A4 page width when printed.
pub const DEFAULT_SIZE: Size = Size {
    width: 1000,
    height: 600,
};

const TITLE_PX: u32 = 24;
const AXIS_PX: u32 = 19;
const TICK_PX: u32 = 16;
const LEGEND_STRIP_PX: u32 = 44;
const MARK_PX: i32 = 6;
/// The bitmap font path places centred text a few pixels high; this moves tick and legend
/// labels back onto their ticks and samples (measured on the rendered pictures).
const BITMAP_TEXT_NUDGE_PX: i32 = 5;

fn drawing_error(err: impl std::fmt::Display) -> Error {
    Error::Write {
        path: PathBuf::from("plot"),
        source: io::Error::other(format!("drawing failed: {err}")),
    }
}

fn ensure_font() -> Result<()> {
    static REGISTERED: OnceLock<bool> = OnceLock::new();
    let ok = *REGISTERED
        .get_or_init(|| plotters::style::register_font(FAMILY, FontStyle::Normal, FONT).is_ok());
    if ok {
        Ok(())
    } else {
        Err(drawing_error("the bundled font could not be read"))
    }
}

/// A copy of `chart` whose every text passes [`label`]: characters XML forbids replaced, long
/// names cut, so the SVG is well-formed and the cost of laying out text stays bounded whatever
/// the files named things.
fn with_clean_labels(chart: &Chart) -> Chart {
    let clean = |text: &mut String| {
        if let std::borrow::Cow::Owned(cleaned) = label(text) {
            *text = cleaned;
        }
    };
    let mut chart = chart.clone();
    clean(&mut chart.title);
    let axes = [&mut chart.x_axis, &mut chart.y_axis]
        .into_iter()
        .chain(chart.y2_axis.as_mut());
    for axis in axes {
        clean(&mut axis.label);
        for (_, name) in &mut axis.tick_names {
            clean(name);
        }
    }
    for band in &mut chart.bands {
        clean(&mut band.name);
    }
    for level in &mut chart.levels {
        clean(&mut level.name);
    }
    for series in &mut chart.series {
        clean(&mut series.name);
        for tag in series.points.iter_mut().filter_map(|p| p.tag.as_mut()) {
            clean(tag);
        }
    }
    chart
}

/// The chart as an SVG document of `size` pixels (text as `<text>` in a sans-serif family).
pub fn svg(chart: &Chart, size: Size) -> Result<String> {
    ensure_font()?;
    let chart = &with_clean_labels(chart);
    let mut text = String::new();
    {
        let root =
            SVGBackend::with_string(&mut text, (size.width, size.height)).into_drawing_area();
        paint(&root, chart, 0).map_err(drawing_error)?;
        root.present().map_err(drawing_error)?;
    }
    Ok(text)
}

/// The chart as a PNG file (8-bit RGB) of `size` pixels.
pub fn png(chart: &Chart, size: Size) -> Result<Vec<u8>> {
    ensure_font()?;
    let chart = &with_clean_labels(chart);
    let pixels = (size.width as usize)
        .checked_mul(size.height as usize)
        .and_then(|n| n.checked_mul(3))
        .ok_or_else(|| drawing_error("the picture is too large"))?;
    let mut rgb = vec![0_u8; pixels];
    {
        let root =
            BitMapBackend::with_buffer(&mut rgb, (size.width, size.height)).into_drawing_area();
        paint(&root, chart, BITMAP_TEXT_NUDGE_PX).map_err(drawing_error)?;
        root.present().map_err(drawing_error)?;
    }
    let mut out = Vec::new();
    let mut encoder = png::Encoder::new(&mut out, size.width, size.height);
    encoder.set_color(png::ColorType::Rgb);
    encoder.set_depth(png::BitDepth::Eight);
    let mut writer = encoder.write_header().map_err(drawing_error)?;
    writer.write_image_data(&rgb).map_err(drawing_error)?;
    writer.finish().map_err(drawing_error)?;
    Ok(out)
}

fn colour((r, g, b): Rgb) -> RGBColor {
    RGBColor(r, g, b)
}

fn font(px: u32) -> TextStyle<'static> {
    (FAMILY, px).into_font().color(&colour(palette::INK))
}

type Area<DB> = DrawingArea<DB, Shift>;

/// The title and its pixel size: smaller type for a long title, then cut with `…` if still too
/// wide, so it never runs off the picture.
fn fitted_title<DB: DrawingBackend>(area: &Area<DB>, title: &str, room: u32) -> (String, u32) {
    let fits = |text: &str, px: u32| {
        area.estimate_text_size(text, &font(px))
            .is_ok_and(|(width, _)| width <= room)
    };
    for px in (TITLE_PX - 6..=TITLE_PX).rev().step_by(2) {
        if fits(title, px) {
            return (title.to_string(), px);
        }
    }
    let px = TITLE_PX - 6;
    let mut chars: Vec<char> = title.chars().collect();
    while chars.len() > 8 {
        chars.pop();
        let cut = format!("{}…", chars.iter().collect::<String>().trim_end());
        if fits(&cut, px) {
            return (cut, px);
        }
    }
    (title.to_string(), px)
}
type DrawResult<DB> =
    std::result::Result<(), DrawingAreaErrorKind<<DB as DrawingBackend>::ErrorType>>;

fn paint<DB: DrawingBackend>(root: &Area<DB>, chart: &Chart, nudge: i32) -> DrawResult<DB> {
    root.fill(&colour(palette::PAPER))?;
    let (_, height) = root.dim_in_pixel();
    let (plot_area, legend_area) = root.split_vertically(height.saturating_sub(LEGEND_STRIP_PX));
    let primary: Vec<&super::Series> = chart.series.iter().filter(|s| !s.secondary).collect();
    let y_range = padded(
        primary
            .iter()
            .flat_map(|s| s.points.iter().map(|p| p.y))
            .chain(chart.levels.iter().map(|l| l.y))
            .chain(
                chart
                    .bands
                    .iter()
                    .flat_map(|b| b.edges.iter().flat_map(|e| [e.1, e.2])),
            ),
        chart.y_axis.from_zero,
        true,
    );
    let secondary_axis = chart.y2_axis.as_ref().map(|axis| {
        let range = padded(
            chart
                .series
                .iter()
                .filter(|s| s.secondary)
                .flat_map(|s| s.points.iter().map(|p| p.y)),
            axis.from_zero,
            true,
        );
        (axis, range)
    });
    let (width, _) = plot_area.dim_in_pixel();
    let title = fitted_title(&plot_area, &chart.title, width.saturating_sub(40));
    let mut builder = ChartBuilder::on(&plot_area);
    builder
        .caption(&title.0, font(title.1))
        .margin_top(12)
        .margin_left(16)
        .margin_right(if secondary_axis.is_some() { 16 } else { 32 })
        .x_label_area_size(58)
        .y_label_area_size(86);
    if secondary_axis.is_some() {
        builder.right_y_label_area_size(86);
    }
    let x = x_coord(chart);
    let context = builder.build_cartesian_2d(x, y_range.clone())?;
    match secondary_axis {
        Some((axis, range)) => {
            let (from, to) = (range.clone(), y_range);
            let rescale = move |y: f64| {
                to.start + (y - from.start) / (from.end - from.start) * (to.end - to.start)
            };
            let x = x_coord(chart);
            // The primary mesh is drawn only now: before this, it would also label the right
            // axis, which belongs to the secondary scale.
            let mut dual = context.set_secondary_coord(x, range);
            mesh(&mut dual, chart, nudge)?;
            let y_formatter = |y: &f64| trim_number(*y);
            dual.configure_secondary_axes()
                .y_desc(axis.label.as_str())
                .axis_desc_style(font(AXIS_PX))
                .label_style(font(TICK_PX))
                .y_label_formatter(&y_formatter)
                .y_labels(8)
                .y_label_offset(nudge)
                .axis_style(colour(palette::INK).stroke_width(1))
                .draw()?;
            draw_data(&mut dual, chart, &rescale)?;
        }
        None => {
            let mut context = context;
            mesh(&mut context, chart, nudge)?;
            draw_data(&mut context, chart, &|y| y)?;
        }
    }
    draw_legend(&legend_area, chart, nudge)
}

type Coord = Cartesian2d<Ticked, RangedCoordf64>;

fn mesh<DB: DrawingBackend>(
    context: &mut ChartContext<'_, DB, Coord>,
    chart: &Chart,
    nudge: i32,
) -> DrawResult<DB> {
    let formatter = |x: &f64| tick_text(chart, *x);
    let y_formatter = |y: &f64| trim_number(*y);
    context
        .configure_mesh()
        .x_desc(chart.x_axis.label.as_str())
        .y_desc(chart.y_axis.label.as_str())
        .axis_desc_style(font(AXIS_PX))
        .label_style(font(TICK_PX))
        .x_label_formatter(&formatter)
        .y_label_formatter(&y_formatter)
        .y_labels(8)
        .y_label_offset(nudge)
        .bold_line_style(colour(palette::GRID).stroke_width(1))
        .light_line_style(TRANSPARENT)
        .axis_style(colour(palette::INK).stroke_width(1))
        .draw()
}

fn draw_data<DB: DrawingBackend>(
    context: &mut ChartContext<'_, DB, Coord>,
    chart: &Chart,
    rescale: &dyn Fn(f64) -> f64,
) -> DrawResult<DB> {
    let band_fill = colour(palette::BAND).filled();
    for band in &chart.bands {
        context.draw_series(
            band.edges.iter().map(|&(x, low, high)| {
                Rectangle::new([(x - 0.5, low), (x + 0.5, high)], band_fill)
            }),
        )?;
    }
    let (x_low, x_high) = {
        let range = context.x_range();
        (range.start, range.end)
    };
    for level in &chart.levels {
        line(
            context,
            level.look,
            vec![(x_low, level.y), (x_high, level.y)],
        )?;
    }
    for series in &chart.series {
        let points: Vec<Point> = series
            .points
            .iter()
            .map(|p| Point {
                y: if series.secondary { rescale(p.y) } else { p.y },
                ..p.clone()
            })
            .collect();
        if series.joined && points.len() > 1 {
            line(
                context,
                series.look,
                points.iter().map(|p| (p.x, p.y)).collect(),
            )?;
        }
        for flag in [Flag::Caution, Flag::Danger] {
            let (look, width) = ring_look(flag);
            context.draw_series(points.iter().filter(|p| p.flag == Some(flag)).map(|p| {
                Circle::new(
                    (p.x, p.y),
                    MARK_PX * 2 + 1,
                    colour(look.colour()).stroke_width(width),
                )
            }))?;
        }
        marks(context, series.look, &points)?;
        context.draw_series(points.iter().filter_map(|p| {
            p.tag.as_ref().map(|tag| {
                EmptyElement::at((p.x, p.y)) + Text::new(tag.clone(), (7, -20), font(TICK_PX - 2))
            })
        }))?;
    }
    Ok(())
}

fn ring_look(flag: Flag) -> (Look, u32) {
    match flag {
        Flag::Caution => (Look::Caution, 2),
        Flag::Danger => (Look::Danger, 3),
    }
}

fn line<DB: DrawingBackend>(
    context: &mut ChartContext<'_, DB, Coord>,
    look: Look,
    points: Vec<(f64, f64)>,
) -> DrawResult<DB> {
    let style = colour(look.colour()).stroke_width(look.width());
    match look.pattern() {
        Pattern::Solid => {
            context.draw_series(LineSeries::new(points, style))?;
        }
        Pattern::Dashed => {
            context.draw_series(DashedLineSeries::new(points, 10, 6, style))?;
        }
        Pattern::Dotted => {
            context.draw_series(DashedLineSeries::new(points, 3, 4, style))?;
        }
    }
    Ok(())
}

fn marks<DB: DrawingBackend>(
    context: &mut ChartContext<'_, DB, Coord>,
    look: Look,
    points: &[Point],
) -> DrawResult<DB> {
    let fill = colour(look.colour()).filled();
    let at = points.iter().map(|p| (p.x, p.y));
    match look.marker() {
        Marker::Disc => {
            context.draw_series(at.map(|c| Circle::new(c, MARK_PX, fill)))?;
        }
        Marker::Square => {
            context.draw_series(at.map(|c| {
                EmptyElement::at(c)
                    + Rectangle::new([(-MARK_PX, -MARK_PX), (MARK_PX, MARK_PX)], fill)
            }))?;
        }
        Marker::Triangle => {
            context.draw_series(at.map(|c| TriangleMarker::new(c, MARK_PX + 2, fill)))?;
        }
        Marker::Cross => {
            let stroke = colour(look.colour()).stroke_width(3);
            context.draw_series(at.map(|c| Cross::new(c, MARK_PX, stroke)))?;
        }
        Marker::None => {}
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::charts::{Axis, Band, Level, Series};

    #[test]
    fn every_text_of_a_chart_is_cleaned_and_cut_before_drawing() {
        // The work of measuring and drawing text grows with its length: a 100,000-character
        // name must reach plotters (SVG and PNG alike) as a label of bounded length.
        let long = format!("a\u{b}b\u{1b}{}", "x".repeat(100_000));
        let mut axis = Axis::numeric(long.clone(), true);
        axis.tick_names.push((1, long.clone()));
        let chart = Chart {
            title: long.clone(),
            x_axis: axis.clone(),
            y_axis: axis.clone(),
            y2_axis: Some(axis),
            bands: vec![Band {
                name: long.clone(),
                edges: vec![(1.0, 1.0, 2.0)],
            }],
            levels: vec![Level {
                name: long.clone(),
                y: 1.0,
                look: Look::Danger,
            }],
            series: vec![Series {
                name: long.clone(),
                look: Look::Danger,
                joined: false,
                secondary: false,
                points: vec![Point {
                    x: 1.0,
                    y: 1.0,
                    tag: Some(long.clone()),
                    flag: None,
                }],
            }],
        };
        let cleaned = with_clean_labels(&chart);
        let texts = serde_json::to_value(&cleaned).unwrap();
        let mut strings = Vec::new();
        fn walk<'a>(value: &'a serde_json::Value, out: &mut Vec<&'a str>) {
            match value {
                serde_json::Value::String(text) => out.push(text),
                serde_json::Value::Array(items) => items.iter().for_each(|i| walk(i, out)),
                serde_json::Value::Object(map) => map.values().for_each(|v| walk(v, out)),
                _ => {}
            }
        }
        walk(&texts, &mut strings);
        let labels: Vec<&&str> = strings.iter().filter(|s| s.starts_with('a')).collect();
        assert_eq!(labels.len(), 11, "{labels:?}");
        for text in labels {
            assert_eq!(text.chars().count(), crate::charts::label::MAX_LABEL_CHARS);
            assert!(text.starts_with("a\u{fffd}b\u{fffd}x") && text.ends_with('…'));
        }
    }
}
