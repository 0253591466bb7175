//! A fret layout as terminal tables, JSON and CSV.

use serde::Serialize;

use taut::error::{Error, Result};
use taut::frets::{CourseFrets, FretLayout};
use taut::tuning::pitch::format_ratio;

use crate::cli::layout::{paragraph, wrap, Column, Grid};
use crate::cli::output::{sig, sig_opt};
use crate::cli::text::grouping::{group, Item};
use crate::cli::text::{course_pitch_text, fixed, user};
use taut::input::units::LengthUnit;

/// Courses whose frets sound the same ratios (so one column of ratios serves them all); one
/// may stop earlier than another (a board end at a different fraction of its length).
fn groups(layout: &FretLayout) -> Vec<Vec<&CourseFrets>> {
    let mut groups: Vec<Vec<&CourseFrets>> = Vec::new();
    for course in &layout.courses {
        let same = |other: &&CourseFrets| {
            other.frets.is_empty() == course.frets.is_empty()
                && other
                    .frets
                    .iter()
                    .zip(&course.frets)
                    .all(|(a, b)| (a.cents - b.cents).abs() < 1e-6)
        };
        match groups
            .iter_mut()
            .find(|group| group.first().is_some_and(same))
        {
            Some(group) => group.push(course),
            None => groups.push(vec![course]),
        }
    }
    groups
}

/// A distance in the chosen unit, without its symbol: mm to 0.01, inches to 0.001, metres to
/// 0.00001.
fn distance(metres: f64, unit: LengthUnit) -> String {
    let decimals = match unit {
        LengthUnit::Mm => 2,
        LengthUnit::In => 3,
        LengthUnit::M => 5,
    };
    fixed(unit.from_metres(metres), decimals)
}

/// A short figure in the chosen unit: mm to 0.1, else as [`distance`].
fn in_unit_figure(metres: f64, unit: LengthUnit) -> String {
    match unit {
        LengthUnit::Mm => fixed(metres * 1000.0, 1),
        _ => distance(metres, unit),
    }
}

/// A sentence of the library's (written in mm) with each `N mm` figure in `unit`.
fn in_unit(text: &str, unit: LengthUnit) -> String {
    if unit == LengthUnit::Mm {
        return text.to_string();
    }
    let mut out = String::with_capacity(text.len() + 8);
    let mut rest = text;
    while let Some(at) = rest.find(" mm") {
        let before = &rest[..at];
        let start = before
            .rfind(|c: char| !(c.is_ascii_digit() || c == '.'))
            .map_or(0, |i| i + 1);
        out.push_str(&before[..start]);
        match before[start..].parse::<f64>() {
            Ok(mm) if start < before.len() => {
                out.push_str(&distance(mm / 1000.0, unit));
                out.push(' ');
                out.push_str(unit.symbol());
            }
            _ => {
                out.push_str(&before[start..]);
                out.push_str(" mm");
            }
        }
        rest = &rest[at + 3..];
    }
    out.push_str(rest);
    out
}

/// The table for one group of courses that share their fret ratios.
fn group_table(
    layout: &FretLayout,
    group: &[&CourseFrets],
    width: usize,
    unit: LengthUnit,
) -> String {
    let mm = |metres: f64| distance(metres, unit);
    let symbol = unit.symbol();
    let Some(first) = group.first() else {
        return String::new();
    };
    let Some(longest) = group.iter().max_by_key(|c| c.frets.len()) else {
        return String::new();
    };
    let one_length = group
        .iter()
        .all(|c| (c.length_m - first.length_m).abs() < 1e-9);
    let names: Vec<String> = group
        .iter()
        .map(|c| format!("{} {}", c.course, course_pitch_text(&c.pitch)))
        .collect();
    let title = if group.len() == 1 {
        format!("Course {}", names.join(""))
    } else {
        format!("Courses {}", names.join(", "))
    };
    let mut header = vec!["fret".to_string(), "cents".to_string(), "ratio".to_string()];
    if one_length {
        header.push(format!("from nut {symbol}"));
        header.push(format!("spacing {symbol}"));
    } else {
        header.extend(group.iter().map(|c| format!("c{} {symbol}", c.course)));
        header.push(format!("min spacing {symbol}"));
    }
    if layout.fanned {
        header.push("angle °".to_string());
    }
    let mut table = Grid::new(header.iter().map(|name| Column::figure(name)).collect());
    for (index, fret) in longest.frets.iter().enumerate() {
        let mut row = vec![
            fret.fret.to_string(),
            format!("{:.2}", fret.cents),
            fret.ratio.as_ref().map_or("-".to_string(), format_ratio),
        ];
        let spacing = group
            .iter()
            .filter_map(|c| c.frets.get(index).map(|f| f.spacing_m))
            .fold(f64::MAX, f64::min);
        let flag = if spacing < layout.min_spacing_m {
            " !"
        } else {
            ""
        };
        if one_length {
            row.push(mm(fret.distance_from_nut_m));
            // Equal lengths and ratios: every course of the group has this fret.
        } else {
            for course in group {
                let distance = course.frets.get(index).map(|f| f.distance_from_nut_m);
                row.push(distance.map_or("-".to_string(), &mm));
            }
        }
        row.push(format!("{}{flag}", mm(spacing)));
        if layout.fanned {
            let angles: Vec<f64> = group
                .iter()
                .filter_map(|c| c.frets.get(index).and_then(|f| f.angle_deg))
                .collect();
            let low = angles.iter().copied().fold(f64::MAX, f64::min);
            let high = angles.iter().copied().fold(f64::MIN, f64::max);
            row.push(if angles.is_empty() {
                "-".to_string()
            } else if high - low < 0.005 {
                format!("{low:+.2}")
            } else {
                format!("{low:+.2}…{high:+.2}")
            });
        }
        table.row(row);
    }
    let lengths: Vec<String> = group.iter().map(|c| mm(c.length_m)).collect();
    let mut lengths = lengths;
    lengths.dedup();
    let mut counts: Vec<String> = group.iter().map(|c| c.frets.len().to_string()).collect();
    counts.dedup();
    let one_fret = group.iter().all(|c| c.frets.len() == 1);
    let mut out = paragraph(
        &format!(
            "{} · {} {symbol}, {} {}",
            user(&title),
            lengths.join("/"),
            counts.join("/"),
            if one_fret { "fret" } else { "frets" }
        ),
        width,
    );
    out.push_str(&table.render(width).0);
    out
}

/// The terminal report: a table per group of courses sharing their frets, mergeable frets,
/// warnings and what the layout assumes.
pub fn table(layout: &FretLayout, unit: LengthUnit) -> String {
    let symbol = unit.symbol();
    let width = crate::cli::layout::width();
    let mut out = paragraph(
        &format!(
            "{} · tuning {}",
            user(&layout.instrument),
            user(&layout.tuning)
        ),
        width,
    );
    let groups = groups(layout);
    if groups.len() == 1 && layout.courses.len() > 1 {
        out.push_str("Every course has the same frets (straight across the board).\n");
    } else if groups.len() > 1 {
        out.push_str(&format!(
            "The courses need {} different sets of frets (partial frets where they differ).\n",
            groups.len()
        ));
    }
    // A group of courses of different lengths has a column per course: a wide group is shown
    // a few courses at a time so each table fits the width.
    let per_table = (width.saturating_sub(50) / 10).max(1);
    for group in &groups {
        let one_length = group
            .iter()
            .all(|c| (c.length_m - group[0].length_m).abs() < 1e-9);
        if one_length {
            out.push_str(&group_table(layout, group, width, unit));
        } else {
            for part in group.chunks(per_table) {
                out.push_str(&group_table(layout, part, width, unit));
            }
        }
    }
    if groups.len() > 1 {
        if layout.mergeable.is_empty() {
            out.push_str(&paragraph(
                &format!(
                    "No frets of neighbouring courses lie within {:.1}c of each other without already coinciding.",
                    layout.merge_within_cents
                ),
                width,
            ));
        } else {
            out.push('\n');
            out.push_str(&paragraph(
                &format!(
                    "Frets of neighbouring courses within {:.1}c (one shared fret half way leaves each course about half the gap off):",
                    layout.merge_within_cents
                ),
                width,
            ));
            for pair in &layout.mergeable {
                out.push_str(&wrap(
                    &format!(
                    "courses {} and {}: frets {} and {} are {:.2}c apart, {} {symbol} along course {}",
                    pair.courses[0],
                    pair.courses[1],
                    pair.frets[0],
                    pair.frets[1],
                    pair.cents_apart.abs(),
                    distance(pair.apart_m, unit),
                    pair.courses[0]
                ),
                    width,
                    "  ",
                    "    ",
                ));
            }
        }
    }
    if layout.warnings.is_empty() {
        out.push_str("No warnings.\n");
    } else {
        out.push_str(&format!("\nWarnings ({}):\n", layout.warnings.len()));
        // Courses with the very same warning (a straight board's frets) share one line; the
        // JSON and CSV keep one warning per course.
        let messages: Vec<String> = layout
            .warnings
            .iter()
            .map(|warning| in_unit(&warning.message, unit))
            .collect();
        let items: Vec<Item<'_>> = layout
            .warnings
            .iter()
            .enumerate()
            .map(|(index, warning)| Item {
                key: warning.kind.name(),
                ranges: false,
                message: &messages[index],
                course: Some(warning.course),
                string: None,
            })
            .collect();
        for line in group(&items) {
            let Some(warning) = line.members.first().and_then(|&m| layout.warnings.get(m)) else {
                continue;
            };
            out.push_str(&wrap(
                &format!("{}: {}", warning.kind.name(), user(&line.text)),
                width,
                "  ",
                "    ",
            ));
        }
    }
    out.push_str(&paragraph(
        &format!(
            "Distances run from the nut along each course; ! marks spacing under {} {symbol}. Assumes {}.",
            in_unit_figure(layout.min_spacing_m, unit),
            layout.compensation
        ),
        width,
    ));
    if layout.fanned {
        let first = layout.courses.first().map_or(0, |c| c.course);
        let last = layout.courses.last().map_or(0, |c| c.course);
        out.push_str(&paragraph(
            &format!(
                "Angle: each fret's angle from square across the board, positive where its end at course {last} lies further from the nut than at course {first}; frets are square at {:.3} of each length.",
                layout.board.square_at
            ),
            width,
        ));
    }
    out
}

/// The JSON document (pretty-printed, ending in a newline).
pub fn json(layout: &FretLayout) -> Result<String> {
    serde_json::to_string_pretty(layout)
        .map(|mut text| {
            text.push('\n');
            text
        })
        .map_err(|err| Error::input(format!("cannot render the frets as JSON: {err}")))
}

/// One CSV row per fret.
#[derive(Serialize)]
struct CsvRow<'a> {
    course: u32,
    pitch: &'a str,
    length_m: f64,
    fret: u32,
    degree: i64,
    cents: f64,
    ratio: Option<String>,
    distance_from_nut_m: f64,
    spacing_m: f64,
    angle_deg: Option<f64>,
}

/// The CSV table: one row per fret of every course (ratio and angle empty when there is none).
pub fn csv(layout: &FretLayout) -> Result<String> {
    let mut writer = csv::Writer::from_writer(Vec::new());
    let fail = |err: csv::Error| Error::input(format!("cannot render the frets as CSV: {err}"));
    for course in &layout.courses {
        for fret in &course.frets {
            writer
                .serialize(CsvRow {
                    course: course.course,
                    pitch: &course.pitch.written,
                    length_m: sig(course.length_m),
                    fret: fret.fret,
                    degree: fret.degree,
                    cents: sig(fret.cents),
                    ratio: fret.ratio.as_ref().map(format_ratio),
                    distance_from_nut_m: sig(fret.distance_from_nut_m),
                    spacing_m: sig(fret.spacing_m),
                    angle_deg: sig_opt(fret.angle_deg),
                })
                .map_err(fail)?;
        }
    }
    let bytes = writer
        .into_inner()
        .map_err(|err| Error::input(format!("cannot render the frets as CSV: {err}")))?;
    String::from_utf8(bytes)
        .map_err(|err| Error::input(format!("cannot render the frets as CSV: {err}")))
}
