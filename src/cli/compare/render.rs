//! The comparison as a table: one row per string on either side, led like every per-string
//! report, then the totals, the second side's warnings and the cautions.

use taut::sets::compare::{CompareString, Comparison, SideSource, SideSummary};
use taut::strings::select::{DEFAULT_CAUTION, DEFAULT_DANGER};

use crate::cli::layout::{paragraph, Column, Give};
use crate::cli::output::View;
use crate::cli::text::{
    change, diameter, diameter_symbol, fixed, force, force_with_unit, length, maybe, plural,
    push_closing, shows_length, stress_bar, total_sentence, user, Lead, LeadRanks, StringReport,
};

/// What happened to a string, for the status column.
fn state(string: &CompareString) -> &'static str {
    match (&string.before, &string.after) {
        (None, Some(_)) => "added",
        (Some(_), None) => "gone",
        _ if !string.changed => "same",
        (Some(before), Some(after)) if before.string != after.string => "new kind",
        (Some(before), Some(after))
            if matches!((&before.gauge, &after.gauge), (Some(x), Some(y)) if x != y)
                || before
                    .diameter_mm
                    .zip(after.diameter_mm)
                    .is_some_and(|(b, a)| (a - b).abs() > 1e-9 * a.abs().max(b.abs())) =>
        {
            "regauged"
        }
        (Some(before), Some(after))
            if (before.pitch_hz - after.pitch_hz).abs() > 1e-9 * before.pitch_hz =>
        {
            "retuned"
        }
        // The same string at the same pitch: moved to another length.
        _ => "moved",
    }
}

/// A signed difference with its decimals, `0` when it rounds to nothing.
fn signed(value: f64, decimals: usize) -> String {
    let text = format!("{value:+.decimals$}");
    if text[1..].chars().all(|c| c == '0' || c == '.') {
        fixed(0.0, decimals)
    } else {
        text
    }
}

fn side_words(side: &SideSummary) -> String {
    let what = match side.source {
        SideSource::Plan => "plan",
        SideSource::Set => "set",
    };
    match side.source {
        SideSource::Plan => format!("{what} {}", user(&side.name)),
        SideSource::Set => format!(
            "{what} {} on {} in {}",
            user(&side.name),
            user(&side.instrument),
            user(&side.tuning)
        ),
    }
}

/// The comparison as a table fitted to `view`.
pub fn table(report: &Comparison, view: &View) -> String {
    let show_length = shows_length(
        report
            .courses
            .iter()
            .flat_map(|c| c.length_after_m.or(c.length_before_m)),
        view,
    );
    let d = diameter_symbol(view.length);
    let f = view.force.symbol();
    let mut columns = Vec::new();
    if view.wide {
        columns.extend([
            Column::text("string before").give(Give::Drop(10)),
            Column::figure(&format!("⌀ {d} before")).give(Give::Drop(11)),
            Column::figure(&format!("{f} before")).give(Give::Drop(12)),
        ]);
    }
    columns.extend([
        Column::text("string").give(Give::Shorten(10, 3)),
        Column::figure(&format!("⌀ {d}")),
        Column::figure(&format!("Δ⌀ {d}")).give(Give::Drop(5)),
        Column::figure(f),
        Column::figure(&format!("Δ {f}")).give(Give::Drop(4)),
        Column::figure("Δ%"),
        Column::text("stress").give(Give::Drop(6)),
        Column::figure("Δ stress").give(Give::Drop(1)),
        Column::figure("Δ bend").give(Give::Drop(2)),
    ]);
    let mut table = StringReport::new(
        view,
        "change",
        show_length,
        LeadRanks { hz: 7, length: 8 },
        columns,
    );
    for course in &report.courses {
        let pitch = match (&course.pitch_before, &course.pitch_after) {
            (Some(old), Some(new)) if old != new => format!("{} → {}", user(old), user(new)),
            (_, Some(new)) => user(new).into_owned(),
            (Some(old), None) => user(old).into_owned(),
            (None, None) => String::new(),
        };
        for (index, string) in course.strings.iter().enumerate() {
            let shown = string.after.as_ref().or(string.before.as_ref());
            let mut own = Vec::with_capacity(12);
            if view.wide {
                let before = string.before.as_ref();
                own.extend([
                    before.map_or("-".to_string(), |b| user(&b.string).into_owned()),
                    maybe(before.and_then(|b| b.diameter_mm), |mm| {
                        diameter(mm, view.length)
                    }),
                    maybe(before.map(|b| b.tension_n), |t| force(t, view.force)),
                ]);
            }
            let after = string.after.as_ref();
            own.extend([
                after.map_or("(none)".to_string(), |a| user(&a.string).into_owned()),
                maybe(after.and_then(|a| a.diameter_mm), |mm| {
                    diameter(mm, view.length)
                }),
                maybe(string.diameter_change_mm, |mm| {
                    let shown = diameter(mm.abs(), view.length);
                    if shown.chars().all(|c| c == '0' || c == '.') {
                        shown
                    } else if mm < 0.0 {
                        format!("-{shown}")
                    } else {
                        format!("+{shown}")
                    }
                }),
                maybe(after.map(|a| a.tension_n), |t| force(t, view.force)),
                maybe(string.tension_change_n, |t| {
                    signed(view.force.from_newtons(t), 1)
                }),
                maybe(string.tension_change_pct, |p| change(p, 1)),
                stress_bar(
                    after.and_then(|a| a.stress_ratio),
                    DEFAULT_CAUTION,
                    DEFAULT_DANGER,
                ),
                maybe(string.stress_change_points, |p| {
                    format!("{} pt", signed(p, 1))
                }),
                maybe(string.bend_force_change_pct, |p| change(p, 0)),
            ]);
            let lead = Lead {
                course: course.course,
                first: index == 0,
                status: state(string),
                pitch: &pitch,
                interval: "",
                hz: shown.map_or(0.0, |s| s.pitch_hz),
                length_m: course
                    .length_after_m
                    .or(course.length_before_m)
                    .unwrap_or(0.0),
            };
            table.row(lead, own);
        }
    }
    let mut out = String::new();
    table.write(
        &mut out,
        &format!(
            "{} → {}",
            side_words(&report.before),
            side_words(&report.after)
        ),
        if show_length {
            None
        } else {
            report
                .courses
                .first()
                .and_then(|c| c.length_after_m.or(c.length_before_m))
        },
    );
    if let Some(first) = report.courses.first() {
        if let (Some(before), Some(after)) = (first.length_before_m, first.length_after_m) {
            if (before - after).abs() > 1e-9 {
                out.push_str(&paragraph(
                    &format!(
                        "Vibrating length of course {} {} → {} {}.",
                        first.course,
                        length(before, view.length),
                        length(after, view.length),
                        view.length.symbol()
                    ),
                    view.width,
                ));
            }
        }
    }
    let (changed, same) = (report.strings_changed, report.strings_unchanged);
    out.push_str(&paragraph(
        &format!(
            "{changed} {} changed, {same} the same. Δ stress is in points of the breaking strength; Δ bend is the change of the sideways force for the same bend.",
            plural(changed, "string", "strings")
        ),
        view.width,
    ));
    out.push_str(&paragraph(
        &total_sentence(
            format!(
                "Total load {} → {} ({})",
                force_with_unit(report.before.total_tension_n, view.force),
                force_with_unit(report.after.total_tension_n, view.force),
                change(report.total_change_pct, 1)
            ),
            report.after.total_tension_n,
            report.after.rated_load_n,
            view,
        ),
        view.width,
    ));
    push_closing(
        &mut out,
        None,
        &report.warnings,
        &[],
        &report.cautions,
        view,
    );
    out
}
