//! The order sheet: what a string maker needs to make each string, one row per string.
//!
//! Per string: course, pitch and nearest note, kind; the construction (core material, section
//! and diameter, each wrap's material and wire diameter, outer diameter, and the unit mass they
//! give by the construction model of REFERENCES §6.1–6.2); the vibrating length, and the cut
//! length from anchor to tuning post where the instrument states both ends (REFERENCES §12.2);
//! the tension the string is to carry at pitch; and, when asked for, the colour marking harp
//! strings usually carry (REFERENCES §12.1, common practice).
//!
//! The rows are plain SI data; `src/cli/order.rs` renders them as a table, CSV or an HTML page
//! in the units asked for.

use serde::Serialize;

use super::label::{escaped, label};
use crate::error::{Error, Result};
use crate::input::units::ForceUnit;
use crate::plan::warning::SAFETY_CAUTIONS;
use crate::strings::construction::{Construction, Wrap, Wraps};
use crate::strings::physics::CoreShape;

/// One string to order, as a command knows it.
#[derive(Debug, Clone, Copy)]
pub struct OrderString<'a> {
    /// Course number.
    pub course: u32,
    /// String within the course, from 1.
    pub string: usize,
    /// The pitch as the report labels it.
    pub pitch: &'a str,
    /// The nearest 12-tone note name, e.g. `C4` (for the colour marking).
    pub note_name: &'a str,
    /// This string's frequency, Hz.
    pub pitch_hz: f64,
    /// The kind's id, or how a measured string was known.
    pub kind: &'a str,
    /// The concrete string.
    pub construction: Construction<'a>,
    /// Vibrating length, m.
    pub length_m: f64,
    /// String from the anchor to the near end of the vibrating length, m, where stated.
    pub anchor_m: Option<f64>,
    /// String from the far end of the vibrating length to the tuning post, m, where stated.
    pub post_m: Option<f64>,
    /// The tension the string is to carry at pitch, N.
    pub tension_n: f64,
}

/// One wrap layer as ordered.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct OrderWrap {
    /// The wrap wire's material id.
    pub material: String,
    /// The wrap wire's diameter, m.
    pub wire_diameter_m: f64,
}

/// One row of the order sheet.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct OrderRow {
    /// Course number.
    pub course: u32,
    /// String within the course, from 1.
    pub string: usize,
    /// The pitch as the report labels it.
    pub pitch: String,
    /// The nearest 12-tone note name.
    pub note: String,
    /// Frequency, Hz.
    pub pitch_hz: f64,
    /// The kind's id.
    pub kind: String,
    /// `plain`, `wound` or `measured`.
    pub build: &'static str,
    /// The load-bearing material's id (the whole of a plain string, the core of a wound one),
    /// where known.
    pub core_material: Option<String>,
    /// The core's section: `round`, `hex-across-corners` or `hex-across-flats`.
    pub core_shape: Option<CoreShape>,
    /// The core's (or plain string's) nominal diameter, m, where known.
    pub core_diameter_m: Option<f64>,
    /// The inner (or only) wrap, for a wound string.
    pub inner_wrap: Option<OrderWrap>,
    /// The outer wrap, for a string with two.
    pub outer_wrap: Option<OrderWrap>,
    /// Outer diameter, m, where known.
    pub outer_diameter_m: Option<f64>,
    /// Mass per length the construction gives, kg/m (REFERENCES §6.1–6.2).
    pub unit_mass_kg_per_m: f64,
    /// Vibrating length, m.
    pub vibrating_length_m: f64,
    /// Anchor to tuning post: anchor length + vibrating length + post length, m, where the
    /// instrument states both ends (REFERENCES §12.2).
    pub cut_length_m: Option<f64>,
    /// The tension the string is to carry at pitch, N.
    pub target_tension_n: f64,
    /// The colour marking, when asked for: `red` on C strings, `dark blue` on F strings, empty
    /// otherwise (REFERENCES §12.1, common practice).
    pub marking: Option<&'static str>,
}

/// The colour harp strings of this note letter usually carry: C red, F dark blue (some makers
/// use black); the rest plain (REFERENCES §12.1, common practice, from memory).
pub fn harp_marking(note_name: &str) -> &'static str {
    match note_name.chars().next() {
        Some('C') => "red",
        Some('F') => "dark blue",
        _ => "",
    }
}

fn wrap(layer: &Wrap<'_>) -> OrderWrap {
    OrderWrap {
        material: layer.material.id.as_str().to_string(),
        wire_diameter_m: layer.wire_diameter,
    }
}

/// The order sheet's rows, in the order given; `markings` adds the colour column.
pub fn rows<'a>(
    strings: impl IntoIterator<Item = OrderString<'a>>,
    markings: bool,
) -> Vec<OrderRow> {
    strings
        .into_iter()
        .map(|s| {
            let c = &s.construction;
            let (build, core_shape, inner_wrap, outer_wrap) = match c {
                Construction::Plain { .. } => ("plain", Some(CoreShape::Round), None, None),
                Construction::Wound { core, wraps } => {
                    let (inner, outer) = match wraps {
                        Wraps::One(only) => (Some(wrap(only)), None),
                        Wraps::Two(inner, outer) => (Some(wrap(inner)), Some(wrap(outer))),
                    };
                    ("wound", Some(core.shape), inner, outer)
                }
                Construction::Measured(_) => ("measured", None, None, None),
            };
            OrderRow {
                course: s.course,
                string: s.string,
                pitch: s.pitch.to_string(),
                note: s.note_name.to_string(),
                pitch_hz: s.pitch_hz,
                kind: s.kind.to_string(),
                build,
                core_material: c.load_material().map(|m| m.id.as_str().to_string()),
                core_shape: c.load_diameter().and(core_shape),
                core_diameter_m: c.load_diameter(),
                inner_wrap,
                outer_wrap,
                outer_diameter_m: c.outer_diameter(),
                unit_mass_kg_per_m: c.unit_mass(),
                vibrating_length_m: s.length_m,
                cut_length_m: s
                    .anchor_m
                    .zip(s.post_m)
                    .map(|(anchor, post)| anchor + s.length_m + post),
                target_tension_n: s.tension_n,
                marking: markings.then(|| harp_marking(s.note_name)),
            }
        })
        .collect()
}

/// The figures of one row in display units: diameters in mm, lengths in mm, the tension in
/// `force`, the unit mass in g/m, each to 6 significant digits (see [`super::records`]).
fn cells(row: &OrderRow, force: ForceUnit, markings: bool) -> Vec<String> {
    let mm = |m: Option<f64>| m.map_or(String::new(), |m| number(m * 1000.0));
    let mut cells = vec![
        row.course.to_string(),
        row.string.to_string(),
        row.pitch.clone(),
        row.note.clone(),
        number(row.pitch_hz),
        row.kind.clone(),
        row.build.to_string(),
        row.core_material.clone().unwrap_or_default(),
        row.core_shape.map_or(String::new(), shape_word),
        mm(row.core_diameter_m),
        row.inner_wrap
            .as_ref()
            .map_or(String::new(), |w| w.material.clone()),
        mm(row.inner_wrap.as_ref().map(|w| w.wire_diameter_m)),
        row.outer_wrap
            .as_ref()
            .map_or(String::new(), |w| w.material.clone()),
        mm(row.outer_wrap.as_ref().map(|w| w.wire_diameter_m)),
        mm(row.outer_diameter_m),
        number(row.unit_mass_kg_per_m * 1000.0),
        number(row.vibrating_length_m * 1000.0),
        mm(row.cut_length_m),
        number(force.from_newtons(row.target_tension_n)),
    ];
    if markings {
        cells.push(row.marking.unwrap_or_default().to_string());
    }
    cells
}

fn number(value: f64) -> String {
    super::records::significant(value).to_string()
}

/// A core section in the words the sheet uses (the names set files use).
pub fn shape_word(shape: CoreShape) -> String {
    match shape {
        CoreShape::Round => "round",
        CoreShape::HexAcrossCorners => "hex-across-corners",
        CoreShape::HexAcrossFlats => "hex-across-flats",
    }
    .to_string()
}

/// The CSV header: field names with their units; the tension's follows `force`.
fn header(force: ForceUnit, markings: bool) -> Vec<String> {
    let mut header: Vec<String> = [
        "course",
        "string",
        "pitch",
        "note",
        "pitch_hz",
        "kind",
        "build",
        "core_material",
        "core_shape",
        "core_diameter_mm",
        "inner_wrap_material",
        "inner_wrap_mm",
        "outer_wrap_material",
        "outer_wrap_mm",
        "outer_diameter_mm",
        "unit_mass_g_per_m",
        "vibrating_length_mm",
        "cut_length_mm",
    ]
    .iter()
    .map(|s| s.to_string())
    .collect();
    header.push(format!(
        "target_tension_{}",
        force.symbol().to_ascii_lowercase()
    ));
    if markings {
        header.push("marking".to_string());
    }
    header
}

/// The order sheet as CSV: a header naming each column and its unit, one row per string. The
/// caller passes it through the CSV guard (`output::safe_csv`) like every CSV.
pub fn csv(rows: &[OrderRow], force: ForceUnit) -> Result<String> {
    let fail = |err: &dyn std::fmt::Display| {
        Error::input(format!("cannot render the order sheet as CSV: {err}"))
    };
    let markings = rows.iter().any(|row| row.marking.is_some());
    let mut writer = csv::Writer::from_writer(Vec::new());
    writer
        .write_record(header(force, markings))
        .map_err(|e| fail(&e))?;
    for row in rows {
        writer
            .write_record(cells(row, force, markings))
            .map_err(|e| fail(&e))?;
    }
    let bytes = writer.into_inner().map_err(|e| fail(&e))?;
    String::from_utf8(bytes).map_err(|e| fail(&e))
}

/// The order sheet as one self-contained HTML page (the string chart's print styles): a table
/// of every string, the notes on what the figures mean, and the safety cautions.
pub fn html(title: &str, rows: &[OrderRow], force: ForceUnit) -> String {
    let title = format!("Order sheet: {}", label(title));
    let markings = rows.iter().any(|row| row.marking.is_some());
    let mut out = String::new();
    out.push_str("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
    out.push_str(&format!("<title>{}</title>\n", escaped(&title)));
    out.push_str(&format!(
        "<style>{}</style>\n</head>\n<body>\n",
        super::sheet::style()
    ));
    out.push_str(&format!("<header>\n<h1>{}</h1>\n", escaped(&title)));
    out.push_str(&format!(
        "<p class=\"summary\">{}</p>\n</header>\n",
        escaped(&notes(force).join(" "))
    ));
    out.push_str("<section class=\"order\">\n<table>\n<thead>\n<tr>");
    for head in header(force, markings) {
        out.push_str(&format!("<th scope=\"col\">{}</th>", escaped(&head)));
    }
    out.push_str("</tr>\n</thead>\n<tbody>\n");
    for row in rows {
        out.push_str(if row.string == 1 {
            "<tr class=\"first\">"
        } else {
            "<tr>"
        });
        for cell in cells(row, force, markings) {
            out.push_str(&format!("<td>{}</td>", escaped(&label(&cell))));
        }
        out.push_str("</tr>\n");
    }
    out.push_str("</tbody>\n</table>\n</section>\n");
    out.push_str("<section class=\"cautions\">\n<h2>Before you string this up</h2>\n<ul>\n");
    for caution in SAFETY_CAUTIONS {
        out.push_str(&format!("<li>{}</li>\n", escaped(caution)));
    }
    out.push_str("</ul>\n</section>\n");
    out.push_str(
        "<footer>Made by taut; figures are planning estimates for the maker to confirm.</footer>\n",
    );
    out.push_str("</body>\n</html>\n");
    out
}

/// What the sheet's figures mean, for the text and HTML forms.
pub fn notes(force: ForceUnit) -> Vec<String> {
    vec![
        "Diameters are nominal: a hexagonal core across the corners or the flats as its shape says; wrap figures are wire diameters, inner layer first.".to_string(),
        "Cut length runs from the anchor to the tuning post (anchor length + vibrating length + post length); add the turns the post takes.".to_string(),
        format!(
            "Target tension ({}) is what the string carries at pitch on its vibrating length.",
            force.symbol()
        ),
    ]
}
