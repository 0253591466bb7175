//! The conversion as a table and as CSV rows, and the fixes its warnings end with.

#[allow(unused_imports)]
use super::*;
use crate::cli::text::{
    feel_columns, plural, push_closing, shows_length, total_sentence, warning_kinds, Lead,
    LeadRanks, StringReport,
};

impl Render for Conversion {
    fn table(&self, view: &View) -> String {
        let show_length = shows_length(self.courses.iter().map(|c| c.length_after_m), view);
        let mut columns = Vec::new();
        if view.wide {
            columns.extend([
                Column::text("old string").give(Give::Drop(5)),
                Column::figure("⌀").give(Give::Drop(6)),
                Column::figure(&format!("{} before", view.force.symbol())).give(Give::Drop(7)),
            ]);
        }
        columns.extend([
            Column::text("new string").give(Give::Shorten(10, 3)),
            Column::figure(&format!("⌀ {}", diameter_symbol(view.length))),
            Column::figure(view.force.symbol()),
            Column::figure("change").give(Give::Drop(2)),
            Column::text("stress"),
            // The nut slot is what a conversion is checked for: it goes last.
            Column::figure(&format!("slot {}", diameter_symbol(view.length))).give(Give::Drop(1)),
        ]);
        if view.wide {
            columns.extend(feel_columns());
        }
        let mut report = StringReport::new(
            view,
            "status",
            show_length,
            LeadRanks { hz: 8, length: 2 },
            columns,
        );
        for course in &self.courses {
            let pitch = pitch_with_note(
                &course.pitch_label,
                &course.note_name,
                course.note_offset_cents,
            );
            let pitch = match &course.pitch_before {
                Some(old) if *old != course.pitch_after => format!("{old} → {pitch}"),
                _ => pitch,
            };
            for (index, string) in course.strings.iter().enumerate() {
                let before = string.before.as_ref();
                let string_warnings = course
                    .warnings
                    .iter()
                    .filter(|w| w.string == Some(index + 1));
                let state = match (before, string.kept, status(string_warnings)) {
                    (_, _, "ok" | "note") if string.kept => "kept",
                    (None, _, "ok" | "note") => "new",
                    (Some(_), _, "ok" | "note") => "replace",
                    (_, _, other) => other,
                };
                let mut own = Vec::with_capacity(12);
                if view.wide {
                    own.extend([
                        before.map_or("(new course)".to_string(), |b| user(&b.string).into_owned()),
                        maybe(before.and_then(|b| b.diameter_mm), |d| {
                            diameter(d, view.length)
                        }),
                        maybe(before.map(|b| b.tension_n), |t| force(t, view.force)),
                    ]);
                }
                own.extend([
                    user(&string.after.string).into_owned(),
                    maybe(string.after.diameter_mm, |d| diameter(d, view.length)),
                    force(string.after.tension_n, view.force),
                    maybe(string.tension_change_pct, |c| change(c, 1)),
                    stress_bar(string.after.stress_ratio, DEFAULT_CAUTION, DEFAULT_DANGER),
                    match &string.slot {
                        Some(fit) if !fit.fits => {
                            format!("+{}", diameter(fit.wider_by_mm, view.length))
                        }
                        Some(_) => "fits".to_string(),
                        None => "-".to_string(),
                    },
                ]);
                if view.wide {
                    own.extend(feel::cells(&string.feel_after));
                }
                let lead = Lead {
                    course: course.course,
                    first: index == 0,
                    status: state,
                    pitch: &pitch,
                    interval: &string.interval,
                    hz: string.after.pitch_hz,
                    length_m: course.length_after_m,
                };
                report.row(lead, own);
            }
        }
        let mut out = String::new();
        report.write(
            &mut out,
            &format!(
                "{} ({}) → {} ({}) · set now {}",
                user(&self.instrument_before),
                user(&self.tuning_before),
                user(&self.instrument_after),
                user(&self.tuning_after),
                user(&self.set)
            ),
            None,
        );
        if let Some(first) = self.courses.first() {
            if let Some(before) = first.length_before_m {
                if (before - first.length_after_m).abs() > 1e-9 {
                    out.push_str(&format!(
                        "Scale length {} → {} {}.\n",
                        length(before, view.length),
                        length(first.length_after_m, view.length),
                        view.length.symbol()
                    ));
                }
            }
        }
        let strings = self.courses.iter().flat_map(|c| &c.strings);
        let added = strings.clone().filter(|s| s.before.is_none()).count();
        let kept = strings.clone().filter(|s| s.kept).count();
        let replaced = strings.filter(|s| !s.kept && s.before.is_some()).count();
        let mut counts = vec![
            format!(
                "{replaced} {} replaced",
                plural(replaced, "string", "strings")
            ),
            format!("{kept} kept"),
        ];
        if added > 0 {
            counts.push(format!("{added} new on added courses"));
        }
        out.push_str(&paragraph(&format!("{}.", counts.join(", ")), view.width));
        if let Some(shift) = &self.transpose {
            out.push_str(&paragraph(
                &format!(
                    "Transposed by {}: the pitches after are named anew.",
                    shift.describe()
                ),
                view.width,
            ));
        }
        out.push_str(&paragraph(
            &self.rule.sentence(
                self.courses
                    .first()
                    .and_then(|c| c.strings.first())
                    .map_or(feel::DEFAULT_BEND_CENTS, |s| s.feel_after.bend_cents),
            ),
            view.width,
        ));
        for change in &self.kept_tension_changes {
            out.push_str(&crate::cli::layout::wrap(
                &user(&change.message),
                view.width,
                "  ",
                "    ",
            ));
        }
        if !self.removed_courses.is_empty() {
            out.push_str(&paragraph(
                &format!(
                    "Courses no longer on the instrument: {}.",
                    self.removed_courses
                        .iter()
                        .map(u32::to_string)
                        .collect::<Vec<_>>()
                        .join(", ")
                ),
                view.width,
            ));
        }
        let gauges: Vec<Vec<(f64, bool)>> = self
            .courses
            .iter()
            .map(|course| {
                course
                    .strings
                    .iter()
                    .filter_map(|s| {
                        s.after
                            .diameter_mm
                            .map(|d| (d, s.after.string.contains("wound")))
                    })
                    .collect()
            })
            .collect();
        out.push_str(&paragraph(&gauge_line(&gauges, view.length), view.width));
        let total = format!(
            "Total load {} → {} ({})",
            force_with_unit(self.total_before_n, view.force),
            force_with_unit(self.total_after_n, view.force),
            change(self.total_change_pct, 1)
        );
        out.push_str(&paragraph(
            &total_sentence(total, self.total_after_n, self.rated_load_n, view),
            view.width,
        ));
        let bend_cents = self
            .courses
            .first()
            .and_then(|c| c.strings.first())
            .map_or(feel::DEFAULT_BEND_CENTS, |s| s.feel_after.bend_cents);
        let load: Vec<String> = self
            .load_caution
            .iter()
            .map(|c| user(c).into_owned())
            .collect();
        push_closing(
            &mut out,
            Some(bend_cents),
            &self.warnings,
            &load,
            &self.cautions,
            view,
        );
        out
    }

    fn csv(&self) -> Result<String> {
        let mut rows = Vec::new();
        for course in &self.courses {
            for (index, string) in course.strings.iter().enumerate() {
                let before = string.before.as_ref();
                rows.push(ConvertRow {
                    course: course.course,
                    string: index + 1,
                    interval: &string.interval,
                    pitch_before: course.pitch_before.as_deref(),
                    pitch: &course.pitch_after,
                    note_name: &course.note_name,
                    pitch_hz: sig(string.after.pitch_hz),
                    length_before_m: sig_opt(course.length_before_m),
                    length_m: sig(course.length_after_m),
                    kind_before: before.map(|b| b.string.as_str()),
                    diameter_mm_before: sig_opt(before.and_then(|b| b.diameter_mm)),
                    tension_n_before: sig_opt(before.map(|b| b.tension_n)),
                    kind: &string.after.string,
                    gauge: string.after.gauge.as_deref(),
                    diameter_mm: sig_opt(string.after.diameter_mm),
                    diameter_in: sig_opt(string.after.diameter_in),
                    unit_mass_kg_per_m: sig(string.after.unit_mass_kg_per_m),
                    target_tension_n: sig(string.target_tension_n),
                    tension_n: sig(string.after.tension_n),
                    tension_change_pct: sig_opt(string.tension_change_pct),
                    stress_ratio: sig_opt(string.after.stress_ratio),
                    break_pitch_hz: sig_opt(string.after.break_pitch_hz),
                    kept: string.kept,
                    slot_fits: string.slot.as_ref().map(|fit| fit.fits),
                    warnings: warning_kinds(
                        course
                            .warnings
                            .iter()
                            .filter(|w| w.string == Some(index + 1)),
                    ),
                });
            }
        }
        csv_text(rows)
    }
}

/// One CSV row of a conversion: the plan's field names for the new string, `_before` for the
/// old one.
#[derive(Serialize)]
pub(super) struct ConvertRow<'a> {
    course: u32,
    string: usize,
    interval: &'a str,
    pitch_before: Option<&'a str>,
    pitch: &'a str,
    note_name: &'a str,
    pitch_hz: f64,
    length_before_m: Option<f64>,
    length_m: f64,
    kind_before: Option<&'a str>,
    diameter_mm_before: Option<f64>,
    tension_n_before: Option<f64>,
    kind: &'a str,
    gauge: Option<&'a str>,
    diameter_mm: Option<f64>,
    diameter_in: Option<f64>,
    unit_mass_kg_per_m: f64,
    target_tension_n: f64,
    tension_n: f64,
    tension_change_pct: Option<f64>,
    stress_ratio: Option<f64>,
    break_pitch_hz: Option<f64>,
    kept: bool,
    slot_fits: Option<bool>,
    warnings: String,
}

/// Ends every warning of a conversion with what would fix it.
pub(super) fn attach_fixes(report: &mut Conversion, stock: &Stock) {
    let builds: Vec<(u32, usize, Build)> = report
        .courses
        .iter()
        .flat_map(|course| {
            course.strings.iter().enumerate().map(|(index, string)| {
                (
                    course.course,
                    index + 1,
                    build_of_kind(stock, &string.after.string),
                )
            })
        })
        .collect();
    remedy::attach_by_string(
        report
            .courses
            .iter_mut()
            .map(|course| &mut course.warnings)
            .chain(std::iter::once(&mut report.warnings)),
        &builds,
    );
}
