//! Renderers of a [`Plan`]: a terminal table, JSON, CSV and YAML. Each reads the plain model
//! and nothing else, so all four say the same thing.

use serde::Serialize;

use taut::error::{Error, Result};
use taut::input::units::{ForceUnit, LengthUnit, METRES_PER_INCH};
use taut::plan::warning::{Severity, SAFETY_CAUTIONS};
use taut::plan::{CoursePlan, Plan, Standing, StringChoice};

use crate::cli::text::{
    cell, course_pitch_text, new_table, right, severity_flag, user, warnings_and_cautions,
};

/// How quantities are shown in the table.
#[derive(Debug, Clone, Copy)]
pub struct DisplayUnits {
    /// Tension is shown in newtons and, unless this is N, also in this unit.
    pub force: ForceUnit,
    /// Vibrating lengths are shown in this unit.
    pub length: LengthUnit,
}

pub(super) fn tension_text(newtons: f64, unit: ForceUnit) -> String {
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

pub(super) fn worst_severity(course: &CoursePlan, string_number: usize) -> Option<Severity> {
    course
        .warnings
        .iter()
        .filter(|warning| warning.string == Some(string_number))
        .map(|warning| warning.severity)
        .max()
}

/// The terminal table: one row per string, then totals, warnings and (when needed) the safety
/// cautions.
pub fn table(plan: &Plan, units: DisplayUnits) -> String {
    let mut table = new_table(vec![
        "Course", "Pitch", "Hz", "Length", "Kind", "⌀ in", "⌀ mm", "μ g/m", "Target", "Tension",
        "Stress", "",
    ]);
    for course in &plan.courses {
        for (index, string) in course.strings.iter().enumerate() {
            let number = index + 1;
            let first = index == 0;
            let pitch = if first {
                course_pitch_text(&course.pitch)
            } else {
                format!("  {}", string.interval)
            };
            table.add_row(vec![
                right(if first {
                    course.course.to_string()
                } else {
                    String::new()
                }),
                cell(pitch),
                right(format!("{:.2}", string.pitch_hz)),
                right(if first {
                    length_text(course.length_m, units.length)
                } else {
                    String::new()
                }),
                cell(&if string.choice.standing == Standing::Fixed {
                    format!("{} (fixed)", string.choice.kind)
                } else {
                    string.choice.kind.clone()
                }),
                right(format!("{:.4}", string.choice.diameter_in)),
                right(format!("{:.3}", string.choice.diameter_mm)),
                right(format!("{:.4}", string.choice.unit_mass_kg_per_m * 1000.0)),
                right(format!("{:.1} N", string.target_tension_n)),
                right(tension_text(string.choice.tension_n, units.force)),
                right(format!("{:.0}%", string.choice.stress_ratio * 100.0)),
                cell(worst_severity(course, number).map_or("", severity_flag)),
            ]);
        }
    }
    let mut out = format!(
        "{} — tuning {}\n{table}\n",
        user(&plan.instrument),
        user(&plan.tuning)
    );
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
    let cautions: &[&str] = if plan.needs_safety_cautions() {
        &SAFETY_CAUTIONS
    } else {
        &[]
    };
    out.push_str(&warnings_and_cautions(&plan.warnings, cautions));
    out
}

fn flags_text(choice: &StringChoice) -> String {
    choice.flags.join(", ").replace('_', " ")
}

fn choice_text(choice: &StringChoice, units: DisplayUnits) -> String {
    let mut text = format!(
        "{} {} {}",
        choice.kind,
        choice.gauge,
        tension_text(choice.tension_n, units.force)
    );
    if choice.standing != Standing::OnTarget {
        text.push_str(&format!(" ({}", choice.standing.words()));
        if !choice.flags.is_empty() {
            text.push_str(&format!(": {}", flags_text(choice)));
        }
        text.push(')');
    }
    text
}

/// The detail view (`--alternatives`): for every string, the target, the chosen string and why,
/// the next thinner and thicker gauge of its kind and the best of each other allowed kind.
pub fn alternatives(plan: &Plan, units: DisplayUnits) -> String {
    let mut out = String::from(
        "\nChoices (target; chosen; next thinner and thicker gauge; best of each other allowed kind):\n",
    );
    for course in &plan.courses {
        for (index, string) in course.strings.iter().enumerate() {
            let label = if course.strings.len() > 1 {
                format!("Course {} string {}", course.course, index + 1)
            } else {
                format!("Course {}", course.course)
            };
            let chosen = &string.choice;
            let mut why = match chosen.standing {
                Standing::Closest => "the closest: no allowed kind is acceptable",
                other => other.words(),
            }
            .to_string();
            if !chosen.flags.is_empty() {
                why.push_str(&format!(" ({})", flags_text(chosen)));
            }
            out.push_str(&format!(
                "  {label}, target {}: {} {} {}, {why}\n",
                tension_text(string.target_tension_n, units.force),
                chosen.kind,
                chosen.gauge,
                tension_text(chosen.tension_n, units.force),
            ));
            let alternatives = &string.alternatives;
            let neighbours: Vec<String> = [
                ("thinner", &alternatives.thinner),
                ("thicker", &alternatives.thicker),
            ]
            .into_iter()
            .filter_map(|(name, choice)| {
                choice
                    .as_ref()
                    .map(|c| format!("{name} {}", choice_text(c, units)))
            })
            .collect();
            if !neighbours.is_empty() {
                out.push_str(&format!("      {}\n", neighbours.join("; ")));
            }
            for other in &alternatives.other_kinds {
                out.push_str(&format!("      or {}\n", choice_text(other, units)));
            }
        }
    }
    out
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
    taut::input::yaml::to_text(plan)
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
                    pitch: &course.pitch.written,
                    note_name: &course.pitch.note_name,
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
