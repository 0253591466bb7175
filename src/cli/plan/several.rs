//! Renderers of a [`SeveralPlan`] (one set for several tunings): a side-by-side table that fits
//! 100 columns, JSON, CSV and YAML. The table gives each tuning a letter; when the tunings do
//! not fit side by side, they are shown in several tables ([`side_by_side`]).

use taut::error::Result;
use taut::plan::several::SeveralPlan;
use taut::plan::warning::Severity;
use taut::strings::select::several::Agreement;

use super::render::{self, worst_severity};
use crate::cli::layout::{paragraph, Column, Give, Grid};
use crate::cli::output::View;
use crate::cli::text::{
    diameter, diameter_symbol, force, force_with_unit, letter, lettered_warnings, severity_flag,
    share_of_rated, side_by_side, tuning_legend, user, warnings_and_cautions,
};

fn agreement_text(agreement: Agreement) -> &'static str {
    match agreement {
        Agreement::OnTarget => "on target",
        Agreement::Serves => "off target",
        Agreement::Conflict => "CONFLICT",
    }
}

/// The set: per string the chosen kind and gauge, how well it fits the list, and the tunings
/// that set its limits, by letter and name, or by letter alone (the legend above names them)
/// where the names would not fit whole: a name such as `12edo@A4=587.33hz` holds figures.
fn set_table(plan: &SeveralPlan, view: &View) -> String {
    let named = set_table_with(plan, view, true);
    if named.contains('…') {
        set_table_with(plan, view, false)
    } else {
        named
    }
}

/// [`set_table`], the limiting tunings by letter and name (`names`) or by letter alone.
fn set_table_with(plan: &SeveralPlan, view: &View, names: bool) -> String {
    let mut table = Grid::new(vec![
        Column::figure("#"),
        Column::text("string").give(Give::Shorten(12, 1)),
        Column::figure(&format!("⌀ {}", diameter_symbol(view.length))),
        Column::text("fit"),
        Column::text("slackest in").give(Give::Shorten(8, 2)),
        Column::text("most stressed in").give(Give::Shorten(8, 2)),
    ]);
    for (course_index, shared) in plan.courses.iter().enumerate() {
        for (string_index, string) in shared.strings.iter().enumerate() {
            let first = string_index == 0;
            let name = |variant: &str| {
                let index = plan.tunings.iter().position(|b| b.variant == variant);
                if names {
                    format!("{} {variant}", index.map_or('?', letter))
                } else {
                    index.map_or('?', letter).to_string()
                }
            };
            table.row(vec![
                if first {
                    shared.course.to_string()
                } else {
                    String::new()
                },
                user(&if first {
                    string.kind.clone()
                } else {
                    let interval = plan
                        .tunings
                        .first()
                        .and_then(|block| block.plan.courses.get(course_index))
                        .and_then(|course| course.strings.get(string_index))
                        .map_or("", |s| s.interval.as_str());
                    format!("  {interval}: {}", string.kind)
                })
                .into_owned(),
                shown_gauge(plan, course_index, string_index, view)
                    .unwrap_or_else(|| string.gauge.clone()),
                agreement_text(string.agreement).to_string(),
                user(&name(&string.slackest_variant)).into_owned(),
                user(&name(&string.most_stressed_variant)).into_owned(),
            ]);
        }
    }
    table.render(view.width).0
}

/// The diameter of a string of the set in the unit of the report (mm, or thousandths of an
/// inch with `--length-unit in`), as `plan` shows it; the same string in every tuning.
fn shown_gauge(
    plan: &SeveralPlan,
    course_index: usize,
    string_index: usize,
    view: &View,
) -> Option<String> {
    let planned = plan
        .tunings
        .first()?
        .plan
        .courses
        .get(course_index)?
        .strings
        .get(string_index)?;
    Some(diameter(planned.choice.diameter_mm, view.length))
}

/// The tunings `shown` (indices into `plan.tunings`) side by side: per string its gauge, then
/// pitch, tension and stress in each.
fn chunk_table(plan: &SeveralPlan, shown: &[usize], view: &View) -> String {
    let mut columns = vec![
        Column::figure("#"),
        Column::figure(&format!("⌀ {}", diameter_symbol(view.length))),
    ];
    // A tuning's cell is figures (pitch, tension, stress): never shortened.
    columns.extend(
        shown
            .iter()
            .map(|&i| Column::figure(&letter(i).to_string())),
    );
    let mut table = Grid::new(columns);
    for (course_index, shared) in plan.courses.iter().enumerate() {
        for (string_index, string) in shared.strings.iter().enumerate() {
            let first = string_index == 0;
            let mut row = vec![
                if first {
                    shared.course.to_string()
                } else {
                    String::new()
                },
                shown_gauge(plan, course_index, string_index, view)
                    .unwrap_or_else(|| string.gauge.clone()),
            ];
            for &tuning in shown {
                let course = plan
                    .tunings
                    .get(tuning)
                    .and_then(|block| block.plan.courses.get(course_index));
                let cell = course
                    .and_then(|course| {
                        let planned = course.strings.get(string_index)?;
                        let pitch = if first {
                            format!("{} ", course.pitch.label)
                        } else {
                            format!("{} ", planned.interval)
                        };
                        let flag = worst_severity(course, string_index + 1)
                            .filter(|&s| s >= Severity::Caution)
                            .map_or(String::new(), |s| format!(" {}", severity_flag(s)));
                        Some(format!(
                            "{pitch}{} {:.0}%{flag}",
                            force(planned.choice.tension_n, view.force),
                            planned.choice.stress_ratio * 100.0
                        ))
                    })
                    .unwrap_or_default();
                row.push(user(&cell).into_owned());
            }
            table.row(row);
        }
    }
    table.render(view.width).0
}

/// The terminal report: the tunings and their letters, the side-by-side table, the load in each
/// tuning against the rated load, conflicts, every tuning's warnings and the safety cautions.
pub fn table(plan: &SeveralPlan, view: &View) -> String {
    let mut out = paragraph(
        &format!(
            "{} · one set for {} tunings (balance: {})",
            user(&plan.instrument),
            plan.tunings.len(),
            plan.balance.name()
        ),
        view.width,
    );
    out.push_str(&tuning_legend(plan.tunings.iter().map(|block| {
        (
            block.variant.as_str(),
            block.plan.tuning.as_str(),
            block.retuned_courses.as_slice(),
        )
    })));
    out.push_str(&set_table(plan, view));
    out.push_str(&paragraph(
        "Fit: on target in every tuning; off target in some, but safe and inside the window in \
         all; or CONFLICT (see below). The slackest and the most stressed tuning set the limits.",
        view.width,
    ));
    out.push('\n');
    out.push_str(&side_by_side(plan.tunings.len(), view.width, |shown| {
        chunk_table(plan, shown, view)
    }));
    out.push_str(&paragraph(
        &format!(
            "Each tuning: pitch, tension ({}), and stress as a share of breaking strength.",
            view.force.symbol()
        ),
        view.width,
    ));
    out.push_str("Total tension:\n");
    for (index, block) in plan.tunings.iter().enumerate() {
        let mut line = format!(
            "  {}  {}",
            letter(index),
            force_with_unit(block.plan.total_tension_n, view.force)
        );
        if let Some(rated) = block.plan.rated_load_n {
            line.push_str(&format!(
                " ({})",
                share_of_rated(block.plan.total_tension_n, rated, view.force)
            ));
        }
        out.push_str(&line);
        out.push('\n');
    }
    if plan.conflicts.is_empty() {
        out.push_str("Every string serves every tuning.\n");
    } else {
        out.push_str(&format!(
            "\nConflicts ({}): no string serves every tuning on these courses.\n",
            plan.conflicts.len()
        ));
        for conflict in &plan.conflicts {
            out.push_str(&crate::cli::layout::wrap(
                &user(&conflict.message),
                view.width,
                "  ",
                "    ",
            ));
        }
    }
    let warnings = lettered_warnings(plan.tunings.iter().map(|block| &block.plan.warnings));
    out.push_str(&warnings_and_cautions(&warnings, &[], &plan.cautions, view));
    out
}

/// The JSON document (pretty-printed, ending in a newline).
pub fn json(plan: &SeveralPlan) -> Result<String> {
    serde_json::to_string_pretty(plan)
        .map(|mut text| {
            text.push('\n');
            text
        })
        .map_err(|err| taut::Error::input(format!("cannot render the plan as JSON: {err}")))
}

/// The YAML document: the same fields as JSON.
pub fn yaml(plan: &SeveralPlan) -> Result<String> {
    taut::input::yaml::to_text(plan)
}

/// The CSV table: `taut plan`'s rows for every tuning, each led by the variant's name and how
/// well the shared string fits the list.
pub fn csv(plan: &SeveralPlan) -> Result<String> {
    let fits: Vec<&'static str> = plan
        .courses
        .iter()
        .flat_map(|course| &course.strings)
        .map(|string| match string.agreement {
            Agreement::OnTarget => "on_target",
            Agreement::Serves => "serves",
            Agreement::Conflict => "conflict",
        })
        .collect();
    let fail =
        |err: csv::Error| taut::Error::input(format!("cannot render the plan as CSV: {err}"));
    let mut writer = csv::WriterBuilder::new()
        .flexible(true)
        .from_writer(Vec::new());
    for (index, block) in plan.tunings.iter().enumerate() {
        let rows = render::csv(&block.plan)?;
        // Read back as records, so a cell holding a line break stays one cell.
        let mut reader = csv::ReaderBuilder::new()
            .has_headers(false)
            .flexible(true)
            .from_reader(rows.as_bytes());
        let mut records = reader.records();
        let header = records.next().transpose().map_err(fail)?;
        if index == 0 {
            if let Some(header) = header {
                let names = ["variant", "agreement"].into_iter().chain(header.iter());
                writer.write_record(names).map_err(fail)?;
            }
        }
        for (record, fit) in records.zip(fits.iter()) {
            let record = record.map_err(fail)?;
            let cells = [block.variant.as_str(), fit]
                .into_iter()
                .chain(record.iter());
            writer.write_record(cells).map_err(fail)?;
        }
    }
    let bytes = writer
        .into_inner()
        .map_err(|err| taut::Error::input(format!("cannot render the plan as CSV: {err}")))?;
    String::from_utf8(bytes)
        .map_err(|err| taut::Error::input(format!("cannot render the plan as CSV: {err}")))
}
