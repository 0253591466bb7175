//! Renderers of a [`Plan`]: a terminal table, JSON, CSV and YAML. Each reads the plain model
//! and nothing else, so all four say the same thing.

use comfy_table::{presets, Cell, CellAlignment, ContentArrangement, Table};
use serde::Serialize;

use taut::error::{Error, Result};
use taut::plan::{CoursePlan, Plan, StringPlan};
use taut::units::{ForceUnit, LengthUnit, METRES_PER_INCH};
use taut::warning::{Severity, SAFETY_CAUTIONS};

/// How quantities are shown in the table.
#[derive(Debug, Clone, Copy)]
pub struct DisplayUnits {
    /// Tension is shown in newtons and, unless this is N, also in this unit.
    pub force: ForceUnit,
    /// Vibrating lengths are shown in this unit.
    pub length: LengthUnit,
}

fn tension_text(newtons: f64, unit: ForceUnit) -> String {
    match unit {
        ForceUnit::N => format!("{newtons:.1} N"),
        other => format!(
            "{newtons:.1} N / {:.1} {}",
            other.from_newtons(newtons),
            other.symbol()
        ),
    }
}

fn length_text(metres: f64, unit: LengthUnit) -> String {
    match unit {
        LengthUnit::Mm => format!("{:.1} mm", unit.from_metres(metres)),
        LengthUnit::In => format!("{:.2} in", unit.from_metres(metres)),
        LengthUnit::M => format!("{:.4} m", unit.from_metres(metres)),
    }
}

fn worst_severity(course: &CoursePlan, string_number: usize) -> Option<Severity> {
    course
        .warnings
        .iter()
        .filter(|warning| warning.string == Some(string_number))
        .map(|warning| warning.severity)
        .max()
}

fn flag(severity: Option<Severity>) -> &'static str {
    match severity {
        Some(Severity::Danger) => "DANGER",
        Some(Severity::Caution) => "caution",
        Some(Severity::Note) => "note",
        None => "",
    }
}

/// The terminal table: one row per string, then totals, warnings and (when needed) the safety
/// cautions.
pub fn table(plan: &Plan, units: DisplayUnits) -> String {
    let mut table = Table::new();
    table
        .load_preset(presets::UTF8_BORDERS_ONLY)
        .set_content_arrangement(ContentArrangement::Disabled)
        .set_header(vec![
            "Course",
            "Pitch",
            "Hz",
            "Length",
            "String",
            "Diameter in",
            "mm",
            "μ g/m",
            "Tension",
            "Stress",
            "",
        ]);
    for course in &plan.courses {
        for (index, string) in course.strings.iter().enumerate() {
            let number = index + 1;
            let first = index == 0;
            let pitch = if first {
                format!("{} ({})", course.pitch_label, note_text(course))
            } else {
                format!("  {}", string.interval)
            };
            table.add_row(vec![
                Cell::new(if first {
                    course.course.to_string()
                } else {
                    String::new()
                })
                .set_alignment(CellAlignment::Right),
                Cell::new(pitch),
                Cell::new(format!("{:.2}", string.pitch_hz)).set_alignment(CellAlignment::Right),
                Cell::new(if first {
                    length_text(course.length_m, units.length)
                } else {
                    String::new()
                })
                .set_alignment(CellAlignment::Right),
                Cell::new(string_text(string)),
                Cell::new(format!("{:.4}", string.choice.diameter_in))
                    .set_alignment(CellAlignment::Right),
                Cell::new(format!("{:.3}", string.choice.diameter_mm))
                    .set_alignment(CellAlignment::Right),
                Cell::new(format!("{:.4}", string.choice.unit_mass_kg_per_m * 1000.0))
                    .set_alignment(CellAlignment::Right),
                Cell::new(tension_text(string.choice.tension_n, units.force))
                    .set_alignment(CellAlignment::Right),
                Cell::new(format!("{:.0}%", string.choice.stress_ratio * 100.0))
                    .set_alignment(CellAlignment::Right),
                Cell::new(flag(worst_severity(course, number))),
            ]);
        }
    }
    let mut out = format!("{} in {}\n{table}\n", plan.instrument, plan.tuning);
    out.push_str(&format!(
        "Total tension: {} over {} strings",
        tension_text(plan.total_tension_n, units.force),
        plan.string_count()
    ));
    if let Some(rated) = plan.rated_load_n {
        out.push_str(&format!(
            " ({:.0}% of the rated {})",
            plan.total_tension_n / rated * 100.0,
            tension_text(rated, units.force)
        ));
    }
    out.push('\n');
    if plan.warnings.is_empty() {
        out.push_str("No warnings.\n");
    } else {
        out.push_str(&format!("\nWarnings ({}):\n", plan.warnings.len()));
        for warning in &plan.warnings {
            out.push_str(&format!(
                "  {:<7} {}: {}\n",
                flag(Some(warning.severity)),
                warning.kind.name(),
                warning.message
            ));
        }
    }
    if plan.needs_safety_cautions() {
        out.push_str("\nBefore you string this up:\n");
        for caution in SAFETY_CAUTIONS {
            out.push_str(&format!("  - {caution}\n"));
        }
    }
    out
}

fn note_text(course: &CoursePlan) -> String {
    if course.note_offset_cents.abs() < 0.05 {
        course.note_name.clone()
    } else {
        format!("{} {:+.1}c", course.note_name, course.note_offset_cents)
    }
}

fn string_text(string: &StringPlan) -> String {
    format!(
        "{} {} ({})",
        string.choice.construction, string.choice.material, string.choice.gauge
    )
}

/// The JSON document (pretty-printed, ending in a newline).
pub fn json(plan: &Plan) -> Result<String> {
    serde_json::to_string_pretty(plan)
        .map(|mut text| {
            text.push('\n');
            text
        })
        .map_err(|err| Error::input(format!("cannot render the plan as JSON: {err}")))
}

/// The YAML document: the same fields as JSON.
pub fn yaml(plan: &Plan) -> Result<String> {
    taut::yaml::to_text(plan)
}

/// One CSV row per string.
#[derive(Serialize)]
struct CsvRow<'a> {
    course: u32,
    string: usize,
    interval: &'a str,
    pitch: &'a str,
    note_name: &'a str,
    pitch_hz: f64,
    length_m: f64,
    kind: &'a str,
    construction: &'a str,
    material: &'a str,
    gauge: &'a str,
    diameter_mm: f64,
    diameter_in: f64,
    unit_mass_kg_per_m: f64,
    target_tension_n: f64,
    required_unit_mass_kg_per_m: f64,
    tension_n: f64,
    stress_ratio: f64,
    break_pitch_hz: f64,
    warnings: String,
}

/// The CSV table: one row per string, warning kinds joined with `;`.
pub fn csv(plan: &Plan) -> Result<String> {
    let mut writer = csv::Writer::from_writer(Vec::new());
    let fail = |err: csv::Error| Error::input(format!("cannot render the plan as CSV: {err}"));
    for course in &plan.courses {
        for (index, string) in course.strings.iter().enumerate() {
            let warnings = course
                .warnings
                .iter()
                .filter(|warning| warning.string == Some(index + 1))
                .map(|warning| warning.kind.name())
                .collect::<Vec<_>>()
                .join(";");
            writer
                .serialize(CsvRow {
                    course: course.course,
                    string: index + 1,
                    interval: &string.interval,
                    pitch: &course.pitch,
                    note_name: &course.note_name,
                    pitch_hz: string.pitch_hz,
                    length_m: course.length_m,
                    kind: &string.choice.kind,
                    construction: &string.choice.construction,
                    material: &string.choice.material,
                    gauge: &string.choice.gauge,
                    diameter_mm: string.choice.diameter_mm,
                    diameter_in: string.choice.diameter_mm / 1000.0 / METRES_PER_INCH,
                    unit_mass_kg_per_m: string.choice.unit_mass_kg_per_m,
                    target_tension_n: string.target_tension_n,
                    required_unit_mass_kg_per_m: string.required_unit_mass_kg_per_m,
                    tension_n: string.choice.tension_n,
                    stress_ratio: string.choice.stress_ratio,
                    break_pitch_hz: string.choice.break_pitch_hz,
                    warnings,
                })
                .map_err(fail)?;
        }
    }
    let bytes = writer
        .into_inner()
        .map_err(|err| Error::input(format!("cannot render the plan as CSV: {err}")))?;
    String::from_utf8(bytes)
        .map_err(|err| Error::input(format!("cannot render the plan as CSV: {err}")))
}
