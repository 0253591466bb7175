//! The builder's string chart: one printable row per string (pitch, length, string, diameter,
//! tension, stress), as CSV, or as a self-contained HTML page with the plan's charts inline as
//! SVG and print styles for A4 and US Letter. The page loads nothing from anywhere.

use serde::Serialize;

use crate::error::{Error, Result};
use crate::input::units::{ForceUnit, METRES_PER_INCH};
use crate::plan::warning::{Severity, SAFETY_CAUTIONS};
use crate::plan::Plan;

use super::draw::{self, Size};
use super::label::label;
use super::palette::{self, Look};
use super::Named;

/// One row of the string chart: one string of one course. Field names are the CSV header.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SheetRow {
    /// Course number.
    pub course: u32,
    /// String within the course, from 1.
    pub string: usize,
    /// The pitch as the tuning labels it (first string), or the interval from it.
    pub pitch: String,
    /// The nearest 12-tone note and its offset, e.g. `E4 -5.3c`.
    pub note: String,
    /// This string's frequency, Hz.
    pub pitch_hz: f64,
    /// Vibrating length, mm.
    pub length_mm: f64,
    /// The string kind's id.
    pub kind: String,
    /// The catalog gauge.
    pub gauge: String,
    /// Outer diameter, mm.
    pub diameter_mm: f64,
    /// Outer diameter, inches.
    pub diameter_in: f64,
    /// Tension at pitch, N.
    pub tension_n: f64,
    /// Tension at pitch, lbf.
    pub tension_lbf: f64,
    /// Stress as a percentage of the breaking strength.
    pub stress_pct: f64,
    /// The worst warning on this string: `danger`, `caution`, `note` or empty.
    pub flag: String,
}

/// The rows of a plan's string chart, in course order.
pub fn rows(plan: &Plan) -> Vec<SheetRow> {
    let mut rows = Vec::with_capacity(plan.string_count());
    for course in &plan.courses {
        for (index, string) in course.strings.iter().enumerate() {
            let number = index + 1;
            let worst = course
                .warnings
                .iter()
                .filter(|w| w.string.is_none_or(|s| s == number))
                .map(|w| w.severity)
                .max();
            let note = if course.pitch.note_offset_cents.abs() < 0.05 {
                course.pitch.note_name.clone()
            } else {
                format!(
                    "{} {:+.1}c",
                    course.pitch.note_name, course.pitch.note_offset_cents
                )
            };
            rows.push(SheetRow {
                course: course.course,
                string: number,
                pitch: if index == 0 {
                    course.pitch.label.clone()
                } else {
                    format!("{} + {}", course.pitch.label, string.interval)
                },
                note,
                pitch_hz: round(string.pitch_hz, 2),
                length_mm: round(course.length_m * 1000.0, 1),
                kind: string.choice.kind.to_string(),
                gauge: string.choice.gauge.to_string(),
                diameter_mm: round(string.choice.diameter_mm, 3),
                diameter_in: round(string.choice.diameter_mm / 1000.0 / METRES_PER_INCH, 4),
                tension_n: round(string.choice.tension_n, 1),
                tension_lbf: round(ForceUnit::Lbf.from_newtons(string.choice.tension_n), 1),
                stress_pct: round(string.choice.stress_ratio * 100.0, 1),
                flag: worst.map_or(String::new(), severity_word),
            });
        }
    }
    rows
}

fn severity_word(severity: Severity) -> String {
    match severity {
        Severity::Danger => "danger",
        Severity::Caution => "caution",
        Severity::Note => "note",
    }
    .to_string()
}

fn round(value: f64, places: i32) -> f64 {
    let scale = 10_f64.powi(places);
    (value * scale).round() / scale
}

/// The string chart as CSV: a header of [`SheetRow`]'s field names, one row per string.
pub fn csv(plan: &Plan) -> Result<String> {
    let fail = |err: &dyn std::fmt::Display| {
        Error::input(format!("cannot render the string chart as CSV: {err}"))
    };
    let mut writer = csv::Writer::from_writer(Vec::new());
    for row in rows(plan) {
        writer.serialize(row).map_err(|e| fail(&e))?;
    }
    let bytes = writer.into_inner().map_err(|e| fail(&e))?;
    String::from_utf8(bytes).map_err(|e| fail(&e))
}

/// Escapes text for HTML content and attribute values; characters XML forbids are replaced
/// (see [`super::label`]).
pub fn escape(text: &str) -> String {
    super::label::escaped(text)
}

const STYLE: &str = r#"
:root { --ink: INK; --rule: #c9ccd3; --band: BAND; }
* { box-sizing: border-box; }
body { font-family: "DejaVu Sans", Verdana, sans-serif; color: var(--ink); margin: 24px auto;
       max-width: 1040px; padding: 0 16px; line-height: 1.35; }
h1 { font-size: 1.5rem; margin: 0 0 4px; }
h2 { font-size: 1.15rem; margin: 24px 0 8px; border-bottom: 2px solid var(--ink); }
p.summary { margin: 0 0 12px; }
table { border-collapse: collapse; width: 100%; font-size: 0.85rem; font-variant-numeric: tabular-nums; }
th, td { padding: 4px 5px; border-bottom: 1px solid var(--rule); text-align: right; white-space: nowrap; }
th { white-space: normal; }
td.kind { white-space: normal; overflow-wrap: break-word; }
th { background: var(--band); border-bottom: 2px solid var(--ink); vertical-align: bottom; }
th.text, td.text { text-align: left; }
tr.first td { border-top: 1px solid var(--ink); }
td.flag { text-align: left; font-weight: bold; }
tr.flag-danger td.flag { color: DANGER; }
tr.flag-caution td.flag { color: CAUTION; }
tr.flag-danger td.flag::before { content: "!! "; }
tr.flag-caution td.flag::before { content: "! "; }
figure { margin: 16px 0; break-inside: avoid; page-break-inside: avoid; }
figure svg { display: block; width: 100%; height: auto; border: 1px solid var(--rule); }
figcaption { font-size: 0.85rem; margin-top: 4px; }
ul { padding-left: 1.2em; }
.cautions { border: 2px solid var(--ink); padding: 4px 12px; margin-top: 16px; break-inside: avoid; }
footer { font-size: 0.8rem; margin-top: 24px; color: #555; }
@page { margin: 12mm; }
@media print {
  body { margin: 0; max-width: none; padding: 0; font-size: 9.5pt; }
  table { font-size: 8.5pt; }
  th, td { padding: 2px 4px; }
  thead { display: table-header-group; }
  tr { break-inside: avoid; page-break-inside: avoid; }
  section.charts { break-before: page; page-break-before: always; }
  figure svg { border: none; max-height: 105mm; }
  figure { margin: 6mm 0; }
  th { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
}
"#;

/// The string chart as one HTML page: header, the per-string table, the charts as inline SVG,
/// the warnings and the safety cautions. `charts` are drawn at `size` (see [`draw::svg`]).
pub fn html(plan: &Plan, charts: &[Named], size: Size) -> Result<String> {
    let style = style();
    // Names are cut to a label's length: a page has no room for more.
    let title = format!(
        "String chart: {} in {}",
        label(&plan.instrument),
        label(&plan.tuning)
    );
    let mut out = String::new();
    out.push_str("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
    out.push_str("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
    out.push_str(&format!("<title>{}</title>\n", escape(&title)));
    out.push_str(&format!("<style>{style}</style>\n</head>\n<body>\n"));
    out.push_str(&format!("<header>\n<h1>{}</h1>\n", escape(&title)));
    let mut summary = format!(
        "{} {}, {} {}. Total tension {:.1} N ({:.1} lbf)",
        plan.courses.len(),
        if plan.courses.len() == 1 {
            "course"
        } else {
            "courses"
        },
        plan.string_count(),
        if plan.string_count() == 1 {
            "string"
        } else {
            "strings"
        },
        plan.total_tension_n,
        ForceUnit::Lbf.from_newtons(plan.total_tension_n)
    );
    if let Some(rated) = plan.rated_load_n {
        summary.push_str(&format!(
            ", {:.0} % of the rated {rated:.0} N",
            plan.total_tension_n / rated * 100.0
        ));
    }
    summary.push_str(&format!(
        ". Stress lines: caution above {:.0} %, danger above {:.0} % of breaking strength.",
        plan.caution_stress_ratio * 100.0,
        plan.danger_stress_ratio * 100.0
    ));
    out.push_str(&format!(
        "<p class=\"summary\">{}</p>\n</header>\n",
        escape(&summary)
    ));
    out.push_str(&table(plan));
    out.push_str("<section class=\"charts\">\n<h2>Charts</h2>\n");
    for named in charts {
        let svg = draw::svg(&named.chart, size)?;
        // The XML prolog, if any, is not allowed inside HTML; the <svg> element is.
        let start = svg.find("<svg").unwrap_or(0);
        out.push_str(&format!(
            "<figure id=\"chart-{}\">\n{}<figcaption>{}</figcaption>\n</figure>\n",
            named.name,
            &svg[start..],
            escape(caption(named.name))
        ));
    }
    out.push_str("</section>\n");
    out.push_str("<section class=\"warnings\">\n<h2>Warnings</h2>\n");
    if plan.warnings.is_empty() {
        out.push_str("<p>No warnings.</p>\n");
    } else {
        out.push_str("<ul>\n");
        for warning in &plan.warnings {
            out.push_str(&format!(
                "<li><strong>{}</strong> {}: {}</li>\n",
                escape(&severity_word(warning.severity)),
                escape(warning.kind.name()),
                escape(&warning.message)
            ));
        }
        out.push_str("</ul>\n");
    }
    out.push_str(
        "</section>\n<section class=\"cautions\">\n<h2>Before you string this up</h2>\n<ul>\n",
    );
    for caution in SAFETY_CAUTIONS {
        out.push_str(&format!("<li>{}</li>\n", escape(caution)));
    }
    out.push_str("</ul>\n</section>\n");
    out.push_str(
        "<footer>Made by taut from an instrument file; figures are planning estimates.</footer>\n",
    );
    out.push_str("</body>\n</html>\n");
    Ok(out)
}

/// The page's style sheet with taut's own colours filled in (shared with the order sheet's
/// page, [`super::order::html`]).
pub(crate) fn style() -> String {
    STYLE
        .replace("INK", &palette::hex(palette::INK))
        .replace("BAND", &palette::hex(palette::BAND))
        .replace("DANGER", &Look::Danger.hex())
        .replace("CAUTION", &Look::Caution.hex())
}

/// What to read in each chart of a plan.
fn caption(name: &str) -> &'static str {
    match name {
        "tension" => "Tension of each string at pitch. Shaded: the course's tension window, where the instrument states one; dashed: the target; rings: strings with a caution (thin) or danger (thick).",
        "stress" => "Stress in each string as a share of its breaking strength. Above the dashed line: caution; above the solid line: danger of breaking while tuning up.",
        "diameter" => "Outer diameter of each string, one mark shape per construction: check that the nut slots and bridge holes take them.",
        _ => "",
    }
}

fn table(plan: &Plan) -> String {
    let mut out =
        String::from("<section class=\"strings\">\n<h2>Strings</h2>\n<table>\n<thead>\n<tr>");
    for (head, class) in [
        ("Course", ""),
        ("String", ""),
        ("Pitch", "text"),
        ("Nearest note", "text"),
        ("Hz", ""),
        ("Length mm", ""),
        ("Kind", "text"),
        ("Gauge", "text"),
        ("⌀ mm", ""),
        ("⌀ in", ""),
        ("Tension N", ""),
        ("Tension lbf", ""),
        ("Stress %", ""),
        ("Flag", "text"),
    ] {
        if class.is_empty() {
            out.push_str(&format!("<th scope=\"col\">{head}</th>"));
        } else {
            out.push_str(&format!("<th scope=\"col\" class=\"{class}\">{head}</th>"));
        }
    }
    out.push_str("</tr>\n</thead>\n<tbody>\n");
    for row in rows(plan) {
        let mut classes = Vec::new();
        if row.string == 1 {
            classes.push("first".to_string());
        }
        if !row.flag.is_empty() {
            classes.push(format!("flag-{}", row.flag));
        }
        out.push_str(&format!(
            "<tr class=\"{}\"><td>{}</td><td>{}</td><td class=\"text\">{}</td><td class=\"text\">{}</td><td>{:.2}</td><td>{:.1}</td><td class=\"text kind\">{}</td><td class=\"text\">{}</td><td>{:.3}</td><td>{:.4}</td><td>{:.1}</td><td>{:.1}</td><td>{:.0}</td><td class=\"flag\">{}</td></tr>\n",
            classes.join(" "),
            row.course,
            row.string,
            escape(&label(&row.pitch)),
            escape(&label(&row.note)),
            row.pitch_hz,
            row.length_mm,
            escape(&label(&row.kind)),
            escape(&label(&row.gauge)),
            row.diameter_mm,
            row.diameter_in,
            row.tension_n,
            row.tension_lbf,
            row.stress_pct,
            escape(&row.flag),
        ));
    }
    out.push_str("</tbody>\n</table>\n</section>\n");
    out
}
