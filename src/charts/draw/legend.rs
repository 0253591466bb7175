//! The legend strip under a chart: one sample and label per series, level, band and flag.

#[allow(unused_imports)]
use super::*;

/// One legend entry: what to draw as its sample.
pub(super) enum Sample {
    Swatch,
    Line(Look),
    Mark(Look, bool),
    Ring(Flag),
}

pub(super) fn draw_legend<DB: DrawingBackend>(
    area: &Area<DB>,
    chart: &Chart,
    nudge: i32,
) -> DrawResult<DB> {
    let mut entries: Vec<(Sample, String)> = Vec::new();
    for series in &chart.series {
        let name = if series.secondary {
            format!("{} (right axis)", series.name)
        } else {
            series.name.clone()
        };
        entries.push((Sample::Mark(series.look, series.joined), name));
    }
    for level in &chart.levels {
        entries.push((Sample::Line(level.look), level.name.clone()));
    }
    for band in &chart.bands {
        entries.push((Sample::Swatch, band.name.clone()));
    }
    for (flag, name) in [(Flag::Caution, "caution"), (Flag::Danger, "danger")] {
        if chart
            .series
            .iter()
            .any(|s| s.points.iter().any(|p| p.flag == Some(flag)))
        {
            entries.push((Sample::Ring(flag), format!("{name} warning")));
        }
    }
    let text_style = font(TICK_PX);
    let y = (LEGEND_STRIP_PX / 2) as i32;
    let mut x = 24_i32;
    for (sample, name) in entries {
        draw_sample(area, &sample, (x + 16, y))?;
        area.draw(&Text::new(
            name.clone(),
            (x + 38, y - (TICK_PX as i32) / 2 + nudge),
            text_style.clone(),
        ))?;
        let (width, _) = area
            .estimate_text_size(&name, &text_style)
            .unwrap_or((name.len() as u32 * 9, TICK_PX));
        x += 38 + width as i32 + 28;
    }
    Ok(())
}

pub(super) fn draw_sample<DB: DrawingBackend>(
    area: &Area<DB>,
    sample: &Sample,
    (x, y): (i32, i32),
) -> DrawResult<DB> {
    match sample {
        Sample::Swatch => area.draw(&Rectangle::new(
            [(x - 14, y - 8), (x + 14, y + 8)],
            colour(palette::BAND).filled(),
        )),
        Sample::Line(look) => legend_line(area, *look, (x, y)),
        Sample::Mark(look, joined) => {
            if *joined || look.marker() == Marker::None {
                legend_line(area, *look, (x, y))?;
            }
            let fill = colour(look.colour()).filled();
            match look.marker() {
                Marker::Disc => area.draw(&Circle::new((x, y), MARK_PX, fill)),
                Marker::Square => area.draw(&Rectangle::new(
                    [(x - MARK_PX, y - MARK_PX), (x + MARK_PX, y + MARK_PX)],
                    fill,
                )),
                Marker::Triangle => area.draw(&TriangleMarker::new((x, y), MARK_PX + 2, fill)),
                Marker::Cross => area.draw(&Cross::new(
                    (x, y),
                    MARK_PX,
                    colour(look.colour()).stroke_width(3),
                )),
                Marker::None => Ok(()),
            }
        }
        Sample::Ring(flag) => {
            let (look, width) = ring_look(*flag);
            area.draw(&Circle::new(
                (x, y),
                MARK_PX * 2 + 1,
                colour(look.colour()).stroke_width(width),
            ))
        }
    }
}

pub(super) fn legend_line<DB: DrawingBackend>(
    area: &Area<DB>,
    look: Look,
    (x, y): (i32, i32),
) -> DrawResult<DB> {
    let style = colour(look.colour()).stroke_width(look.width());
    let (dash, gap) = match look.pattern() {
        Pattern::Solid => (30, 0),
        Pattern::Dashed => (8, 5),
        Pattern::Dotted => (3, 3),
    };
    let mut start = x - 15;
    while start < x + 15 {
        let end = (start + dash).min(x + 15);
        area.draw(&PathElement::new(vec![(start, y), (end, y)], style))?;
        start = end + gap;
        if gap == 0 {
            break;
        }
    }
    Ok(())
}
