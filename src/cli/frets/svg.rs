//! The board as an SVG drawing at true size: one user unit is one millimetre and the page is
//! sized in millimetres, so printing at 100 % gives a template; a 100 mm scale bar checks it.

use std::fmt::Write;

use taut::frets::drawing::{self, Line};
use taut::frets::FretLayout;

/// Blank space around the drawing, in mm.
const MARGIN: f64 = 12.0;
/// Room below the board for the title, notes and scale bar, in mm.
const FOOTER: f64 = 34.0;
/// Fret numbers closer than this (mm) to the previous label are left out.
const LABEL_GAP: f64 = 3.2;
/// The scale bar's length, in mm.
const SCALE_BAR: f64 = 100.0;

/// A name for the drawing: characters XML forbids replaced, long names cut, markup escaped.
fn escape(text: &str) -> String {
    taut::charts::label::escaped_label(text)
}

/// The SVG document for `layout`.
pub fn svg(layout: &FretLayout) -> String {
    let Some(drawing) = drawing::draw(layout) else {
        return String::new();
    };
    // Board coordinates (m, y up) to page coordinates (mm, y down).
    let points = drawing
        .outline
        .iter()
        .chain(drawing.strings.iter().flat_map(|(_, line)| line.iter()))
        .chain(drawing.frets.iter().flat_map(|f| f.line.iter()));
    let (mut min_x, mut max_x, mut min_y, mut max_y) = (f64::MAX, f64::MIN, f64::MAX, f64::MIN);
    for point in points {
        min_x = min_x.min(point[0]);
        max_x = max_x.max(point[0]);
        min_y = min_y.min(point[1]);
        max_y = max_y.max(point[1]);
    }
    let left = MARGIN + 8.0; // room for course numbers before the nut
    let top = MARGIN + 6.0; // room for fret numbers above the board
    let page_x = |x: f64| left + (x - min_x) * 1000.0;
    let page_y = |y: f64| top + (max_y - y) * 1000.0;
    let board_height = (max_y - min_y) * 1000.0;
    let width = left + (max_x - min_x) * 1000.0 + MARGIN;
    let width = width.max(SCALE_BAR + 2.0 * MARGIN + 60.0);
    let height = top + board_height + 6.0 + FOOTER + MARGIN;
    let line = |out: &mut String, l: &Line, style: &str| {
        let _ = writeln!(
            out,
            r#"<line x1="{:.3}" y1="{:.3}" x2="{:.3}" y2="{:.3}" {style}/>"#,
            page_x(l[0][0]),
            page_y(l[0][1]),
            page_x(l[1][0]),
            page_y(l[1][1])
        );
    };
    let mut out = String::new();
    let _ = writeln!(
        out,
        r#"<svg xmlns="http://www.w3.org/2000/svg" width="{width:.3}mm" height="{height:.3}mm" viewBox="0 0 {width:.3} {height:.3}" font-family="sans-serif">"#
    );
    let _ = writeln!(
        out,
        "<title>{} — frets in {} (1 unit = 1 mm; print at 100 %)</title>",
        escape(&layout.instrument),
        escape(&layout.tuning)
    );
    let _ = writeln!(
        out,
        r#"<rect x="0" y="0" width="{width:.3}" height="{height:.3}" fill="white"/>"#
    );
    let outline: Vec<String> = drawing
        .outline
        .iter()
        .map(|p| format!("{:.3},{:.3}", page_x(p[0]), page_y(p[1])))
        .collect();
    let _ = writeln!(
        out,
        r##"<polygon points="{}" fill="#f4ecdc" stroke="black" stroke-width="0.3"/>"##,
        outline.join(" ")
    );
    for (course, string) in &drawing.strings {
        line(&mut out, string, r##"stroke="#9a9a9a" stroke-width="0.2""##);
        let _ = writeln!(
            out,
            r#"<text x="{:.3}" y="{:.3}" font-size="2.5" text-anchor="end" dominant-baseline="middle">{course}</text>"#,
            page_x(string[0][0]) - 2.5,
            page_y(string[0][1])
        );
    }
    if let Some(joint) = &drawing.body_joint {
        line(
            &mut out,
            joint,
            r##"stroke="#1f5fbf" stroke-width="0.3" stroke-dasharray="2 1""##,
        );
    }
    line(&mut out, &drawing.nut, r#"stroke="black" stroke-width="1""#);
    for fret in &drawing.frets {
        let style = if fret.close {
            r##"stroke="#d01010" stroke-width="0.3""##
        } else {
            r#"stroke="black" stroke-width="0.3""#
        };
        line(&mut out, &fret.line, style);
    }
    // Fret numbers beside the outer courses: above the board for the first, below for the last.
    let outer = [
        (layout.courses.first(), 0usize, -1.5),
        (layout.courses.last(), 1usize, 3.5),
    ];
    for (course, end, offset) in outer {
        let Some(course) = course else { continue };
        let mut last_x = f64::MIN;
        for fret in drawing.frets.iter().filter(|f| f.course == course.course) {
            let point = fret.line[end];
            let x = page_x(point[0]);
            if x - last_x < LABEL_GAP {
                continue;
            }
            last_x = x;
            let _ = writeln!(
                out,
                r#"<text x="{x:.3}" y="{:.3}" font-size="2.2" text-anchor="middle">{}</text>"#,
                page_y(point[1]) + offset,
                fret.fret
            );
        }
        if layout.courses.len() == 1 {
            break;
        }
    }
    // Partial frets that reach neither outer course carry their number beside their line,
    // smaller, so a fret cut for one inner course is not a line without a name.
    let mut last_inner: Vec<(u32, f64)> = Vec::new();
    for fret in drawing::inner_fret_runs(&drawing) {
        let middle = [
            (fret.line[0][0] + fret.line[1][0]) / 2.0,
            (fret.line[0][1] + fret.line[1][1]) / 2.0,
        ];
        let x = page_x(middle[0]) + 0.6;
        let crowded = last_inner
            .iter()
            .any(|&(course, previous)| course == fret.course && (x - previous).abs() < LABEL_GAP);
        if crowded {
            continue;
        }
        last_inner.push((fret.course, x));
        let _ = writeln!(
            out,
            r##"<text x="{x:.3}" y="{:.3}" font-size="1.6" dominant-baseline="middle" fill="#5a4a2a">{}</text>"##,
            page_y(middle[1]),
            fret.fret
        );
    }
    // Title, notes and the scale bar below the board.
    let mut y = top + board_height + 10.0;
    let notes = [
        format!(
            "{} — frets in {}",
            escape(&layout.instrument),
            escape(&layout.tuning)
        ),
        format!(
            "Fret lines mark slot centres; red: closer than {:.1} mm to the fret before{}.",
            layout.min_spacing_m * 1000.0,
            if drawing.body_joint.is_some() {
                "; dashed blue: body joint"
            } else {
                ""
            }
        ),
        format!(
            "Assumes {}.",
            taut::charts::label::escaped(&layout.compensation)
        ),
    ];
    for (index, note) in notes.iter().enumerate() {
        let size = if index == 0 { 3.5 } else { 2.5 };
        let _ = writeln!(
            out,
            r#"<text x="{MARGIN:.3}" y="{y:.3}" font-size="{size}">{note}</text>"#
        );
        y += size + 1.8;
    }
    y += 3.0;
    let _ = writeln!(
        out,
        r#"<line x1="{MARGIN:.3}" y1="{y:.3}" x2="{:.3}" y2="{y:.3}" stroke="black" stroke-width="0.4"/>"#,
        MARGIN + SCALE_BAR
    );
    for tick in 0..=10 {
        let x = MARGIN + f64::from(tick) * SCALE_BAR / 10.0;
        let length = if tick % 5 == 0 { 3.0 } else { 1.5 };
        let _ = writeln!(
            out,
            r#"<line x1="{x:.3}" y1="{:.3}" x2="{x:.3}" y2="{y:.3}" stroke="black" stroke-width="0.3"/>"#,
            y - length
        );
    }
    let _ = writeln!(
        out,
        r#"<text x="{:.3}" y="{:.3}" font-size="2.5">100 mm: print at 100 % (no fit to page) and check this bar measures 100 mm</text>"#,
        MARGIN + SCALE_BAR + 3.0,
        y
    );
    out.push_str("</svg>\n");
    out
}
