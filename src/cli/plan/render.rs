//! Renderers of a [`Plan`]: a terminal table, JSON, CSV and YAML. Each reads the plain model
//! and nothing else, so all four say the same thing.

use serde::Serialize;

use taut::error::Result;
use taut::input::units::{ForceUnit, METRES_PER_INCH};
use taut::plan::warning::Severity;
use taut::plan::{CoursePlan, Plan, Standing, StringChoice};

use crate::cli::layout::{wrap_into, Column, Give};
use crate::cli::output::{sig, sig_opt, View};
use crate::cli::text::{
    cautions_for, course_pitch_text, diameter, diameter_symbol, fixed, force, force_with_unit,
    gauge_line, plural, push_closing, shows_length, status, stress_bar, total_sentence, user,
    warning_kinds, Lead, LeadRanks, StringReport,
};

/// A tension in newtons and, unless the unit is N, also in that unit.
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

/// The worst severity among one string's warnings.
pub(super) fn worst_severity(course: &CoursePlan, string_number: usize) -> Option<Severity> {
    string_warnings(course, string_number)
        .map(|warning| warning.severity)
        .max()
}

fn string_warnings(
    course: &CoursePlan,
    number: usize,
) -> impl Iterator<Item = &taut::plan::warning::Warning> {
    course
        .warnings
        .iter()
        .filter(move |warning| warning.string == Some(number))
}

/// The terminal table: each string led by its status, its tension beside its aim and its
/// stress as a bar; then totals, the set's gauges on one line, warnings and cautions.
pub fn table(plan: &Plan, view: &View) -> String {
    let show_length = shows_length(plan.courses.iter().map(|c| c.length_m), view);
    // Order of giving way (see `taut help reports`): the wide view's details, Hz, then the
    // kind's name shortens; the length (a harp's lengths are the point) goes last.
    let mut columns = vec![
        Column::text("string").give(Give::Shorten(10, 4)),
        Column::figure(&format!("⌀ {}", diameter_symbol(view.length))),
        Column::figure(view.force.symbol()),
        Column::figure("aim").give(Give::Drop(2)),
        Column::text("stress"),
    ];
    if view.wide {
        columns.extend([
            Column::figure("μ g/m").give(Give::Drop(6)),
            Column::figure("breaks at Hz").give(Give::Drop(7)),
            Column::figure("B").give(Give::Drop(8)),
        ]);
    }
    let mut report = StringReport::new(
        view,
        "status",
        show_length,
        LeadRanks { hz: 5, length: 1 },
        columns,
    );
    for course in &plan.courses {
        let pitch = course_pitch_text(&course.pitch);
        for (index, string) in course.strings.iter().enumerate() {
            let choice = &string.choice;
            let mut kind = user(&choice.kind).into_owned();
            if choice.standing == Standing::Fixed {
                kind.push_str(" (fixed)");
            }
            let mut own = vec![
                kind,
                diameter(choice.diameter_mm, view.length),
                force(choice.tension_n, view.force),
                force(string.target_tension_n, view.force),
                stress_bar(
                    Some(choice.stress_ratio),
                    plan.caution_stress_ratio,
                    plan.danger_stress_ratio,
                ),
            ];
            if view.wide {
                own.extend([
                    fixed(choice.unit_mass_kg_per_m * 1000.0, 4),
                    fixed(choice.break_pitch_hz, 1),
                    choice
                        .inharmonicity
                        .map_or_else(|| "-".to_string(), |b| format!("{b:.2e}")),
                ]);
            }
            let lead = Lead {
                course: course.course,
                first: index == 0,
                status: status(string_warnings(course, index + 1)),
                pitch: &pitch,
                interval: &string.interval,
                hz: string.pitch_hz,
                length_m: course.length_m,
            };
            report.row(lead, own);
        }
    }
    let warning_bytes: usize = plan.warnings.iter().map(|w| w.message.len()).sum();
    // Room for the rows (about 110 bytes in the compact view, 150 in the wide one: a stress
    // bar takes three bytes a cell), the warnings with their indents and the lines around
    // them, so the report is written in one piece.
    let mut out = String::with_capacity(plan.string_count() * 160 + warning_bytes * 5 / 4 + 4096);
    report.write(
        &mut out,
        &format!("{} · tuning {}", user(&plan.instrument), user(&plan.tuning)),
        plan.courses.first().map(|c| c.length_m),
    );
    let gauges: Vec<Vec<(f64, bool)>> = plan
        .courses
        .iter()
        .map(|course| {
            course
                .strings
                .iter()
                .map(|s| (s.choice.diameter_mm, &*s.choice.construction == "wound"))
                .collect()
        })
        .collect();
    wrap_into(
        &mut out,
        &gauge_line(&gauges, view.length),
        view.width,
        "",
        "",
    );
    let total = total_sentence(
        format!(
            "Total tension {} over {} {}",
            force_with_unit(plan.total_tension_n, view.force),
            plan.string_count(),
            plural(plan.string_count(), "string", "strings")
        ),
        plan.total_tension_n,
        plan.rated_load_n,
        view,
    );
    wrap_into(&mut out, &total, view.width, "", "");
    positions(&mut out, plan, view);
    push_closing(
        &mut out,
        None,
        &plan.warnings,
        &[],
        cautions_for(&plan.warnings),
        view,
    );
    out
}

/// The lever and pedal positions of every course that has them, the load at the worst setting
/// and the keys reached; nothing for an instrument without raises.
fn positions(out: &mut String, plan: &Plan, view: &View) {
    if plan
        .courses
        .iter()
        .all(|course| course.positions.is_empty())
    {
        return;
    }
    let unit = view.length.symbol();
    out.push('\n');
    wrap_into(
        out,
        "Levers and pedals, each course at each position (stop: gripped at the distance from the nut or top, the tension unchanged; pull: tightened on the same length). Stress is the course's highest:",
        view.width,
        "",
        "",
    );
    for course in plan.courses.iter().filter(|c| !c.positions.is_empty()) {
        let parts: Vec<String> = course
            .positions
            .iter()
            .map(|p| {
                let place = match p.stop_from_nut_m {
                    Some(stop) if p.ratio > 1.0 => format!(
                        ", stop at {} {unit}, sounding {} {unit}",
                        crate::cli::text::length(stop, view.length),
                        crate::cli::text::length(p.length_m, view.length)
                    ),
                    Some(_) => String::new(),
                    None => ", pulled".to_string(),
                };
                format!(
                    "{} ({}) {} {:.2} Hz{place}, {}, stress {:.0}%",
                    p.position,
                    p.raise,
                    p.note_name,
                    p.pitch_hz,
                    force_with_unit(p.tension_n, view.force),
                    p.stress_ratio * 100.0
                )
            })
            .collect();
        wrap_into(
            out,
            &format!(
                "Course {} {}: {}.",
                course.course,
                user(&course.pitch.written),
                parts.join("; ")
            ),
            view.width,
            "  ",
            "    ",
        );
    }
    if let Some(worst) = plan.worst_setting_total_n {
        let sentence = total_sentence(
            format!(
                "At the worst setting (every lever and pedal at its heaviest) the total is {}",
                force_with_unit(worst, view.force)
            ),
            worst,
            plan.rated_load_n,
            view,
        );
        wrap_into(out, &sentence, view.width, "", "");
    }
    if !plan.reachable_keys.is_empty() {
        wrap_into(
            out,
            &format!(
                "Keys the levers and pedals reach: {}.",
                plan.reachable_keys.join(", ")
            ),
            view.width,
            "",
            "",
        );
    }
}

fn flags_text(choice: &StringChoice) -> String {
    choice.flags.join(", ").replace('_', " ")
}

fn choice_text(choice: &StringChoice, units: ForceUnit) -> String {
    let mut text = format!(
        "{} {} {}",
        choice.kind,
        choice.gauge,
        tension_text(choice.tension_n, units)
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
pub fn alternatives(plan: &Plan, view: &View) -> String {
    let units = view.force;
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
                tension_text(string.target_tension_n, units),
                chosen.kind,
                chosen.gauge,
                tension_text(chosen.tension_n, units),
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
    fit_lines(&out, view.width)
}

/// Lines longer than `width` wrapped with a hanging indent under their own indent.
fn fit_lines(text: &str, width: usize) -> String {
    let mut fitted = String::with_capacity(text.len());
    for line in text.split_inclusive('\n') {
        let body = line.trim_end_matches('\n');
        if crate::cli::layout::cells(body) <= width {
            fitted.push_str(line);
            continue;
        }
        let indent = &body[..body.len() - body.trim_start().len()];
        let rest = format!("{indent}    ");
        fitted.push_str(&crate::cli::layout::wrap(
            body.trim_start(),
            width,
            indent,
            &rest,
        ));
    }
    fitted
}

/// The CSV of a plan with levers or pedals: one row per string and position (a course without
/// raises has its `open` row), the figures of each string at that position.
fn positions_csv(plan: &Plan) -> Result<String> {
    let mut rows = Vec::new();
    for course in &plan.courses {
        for (index, string) in course.strings.iter().enumerate() {
            let warnings = warning_kinds(
                course
                    .warnings
                    .iter()
                    .filter(|warning| warning.string == Some(index + 1)),
            );
            let row = |position: &'_ str,
                       raise: &'_ str,
                       action: &'_ str,
                       ratio: f64,
                       stop: Option<f64>,
                       length: f64,
                       factor: f64| {
                CsvPositionRow {
                    course: course.course,
                    string: index + 1,
                    interval: string.interval.clone(),
                    pitch: course.pitch.written.clone(),
                    kind: string.choice.kind.to_string(),
                    gauge: string.choice.gauge.to_string(),
                    position: position.to_string(),
                    raise: raise.to_string(),
                    action: action.to_string(),
                    ratio: sig(ratio),
                    pitch_hz: sig(string.pitch_hz * ratio),
                    stop_from_nut_m: sig_opt(stop),
                    length_m: sig(length),
                    tension_n: sig(string.choice.tension_n * factor),
                    stress_ratio: sig(string.choice.stress_ratio * factor),
                    warnings: warnings.clone(),
                }
            };
            if course.positions.is_empty() {
                rows.push(row("open", "0 steps", "", 1.0, None, course.length_m, 1.0));
            }
            for p in &course.positions {
                let factor = if p.stop_from_nut_m.is_some() {
                    1.0
                } else {
                    p.ratio * p.ratio
                };
                rows.push(row(
                    &p.position,
                    &p.raise,
                    &p.action,
                    p.ratio,
                    p.stop_from_nut_m,
                    p.length_m,
                    factor,
                ));
            }
        }
    }
    crate::cli::output::csv_text(rows)
}

/// One CSV row per string and lever or pedal position.
#[derive(Serialize)]
struct CsvPositionRow {
    course: u32,
    string: usize,
    interval: String,
    pitch: String,
    kind: String,
    gauge: String,
    position: String,
    raise: String,
    action: String,
    ratio: f64,
    pitch_hz: f64,
    stop_from_nut_m: Option<f64>,
    length_m: f64,
    tension_n: f64,
    stress_ratio: f64,
    warnings: String,
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
    inharmonicity: Option<f64>,
    warnings: String,
}

/// The CSV table: one row per string, warning kinds joined with `;`, numbers to 6 significant
/// digits.
pub fn csv(plan: &Plan) -> Result<String> {
    if plan
        .courses
        .iter()
        .any(|course| !course.positions.is_empty())
    {
        return positions_csv(plan);
    }
    let mut rows = Vec::new();
    for course in &plan.courses {
        for (index, string) in course.strings.iter().enumerate() {
            let warnings = warning_kinds(
                course
                    .warnings
                    .iter()
                    .filter(|warning| warning.string == Some(index + 1)),
            );
            rows.push(CsvRow {
                course: course.course,
                string: index + 1,
                interval: &string.interval,
                pitch: &course.pitch.written,
                note_name: &course.pitch.note_name,
                pitch_hz: sig(string.pitch_hz),
                length_m: sig(course.length_m),
                kind: &string.choice.kind,
                construction: &string.choice.construction,
                material: &string.choice.material,
                gauge: &string.choice.gauge,
                diameter_mm: sig(string.choice.diameter_mm),
                diameter_in: sig(string.choice.diameter_mm / 1000.0 / METRES_PER_INCH),
                unit_mass_kg_per_m: sig(string.choice.unit_mass_kg_per_m),
                target_tension_n: sig(string.target_tension_n),
                required_unit_mass_kg_per_m: sig(string.required_unit_mass_kg_per_m),
                tension_n: sig(string.choice.tension_n),
                stress_ratio: sig(string.choice.stress_ratio),
                break_pitch_hz: sig(string.choice.break_pitch_hz),
                inharmonicity: sig_opt(string.choice.inharmonicity),
                warnings,
            });
        }
    }
    crate::cli::output::csv_text(rows)
}
