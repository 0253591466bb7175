//! The audit as a table and as CSV rows, and the fixes its warnings end with.

#[allow(unused_imports)]
use super::*;
use crate::cli::text::{
    feel_columns, plural, push_closing, shows_length, total_sentence, warning_kinds, Lead,
    LeadRanks, StringReport,
};

impl Render for Audit {
    fn table(&self, view: &View) -> String {
        let show_length = shows_length(self.courses.iter().map(|c| c.length_m), view);
        let mut columns = vec![
            // Order of giving way (see `taut help reports`): feel, Hz, the tension before,
            // then the kind's name shortens; the length goes last.
            Column::text("string").give(Give::Shorten(10, 3)),
            Column::figure(&format!("⌀ {}", diameter_symbol(view.length))),
            Column::figure(view.force.symbol()),
            Column::figure("was").give(Give::Drop(4)),
            Column::figure("change"),
            Column::text("stress"),
        ];
        if view.wide {
            columns.extend(feel_columns());
        }
        let mut report = StringReport::new(
            view,
            "verdict",
            show_length,
            LeadRanks { hz: 5, length: 1 },
            columns,
        );
        for course in &self.courses {
            let pitch = course_pitch_text(&course.pitch);
            for (index, string) in course.strings.iter().enumerate() {
                let first = index == 0;
                let mut own = vec![
                    user(&string.string).into_owned(),
                    maybe(string.diameter_mm, |d| diameter(d, view.length)),
                    force(string.tension_n, view.force),
                    maybe(string.reference_tension_n, |t| force(t, view.force)),
                    maybe(string.tension_change_pct, |c| change(c, 0)),
                    stress_bar(string.stress_ratio, DEFAULT_CAUTION, DEFAULT_DANGER),
                ];
                if view.wide {
                    own.extend(feel::cells(&string.feel));
                }
                let lead = Lead {
                    course: course.course,
                    first,
                    status: if first { course.verdict.text() } else { "" },
                    pitch: &pitch,
                    interval: &string.interval,
                    hz: string.pitch_hz,
                    length_m: course.length_m,
                };
                report.row(lead, own);
            }
        }
        let mut title = format!(
            "{} · set {} · tuning {}",
            user(&self.instrument),
            user(&self.set),
            user(&self.tuning)
        );
        if let Some(reference) = &self.reference_tuning {
            title.push_str(&format!(" (strings now in {})", user(reference)));
        }
        let mut out = String::new();
        report.write(&mut out, &title, self.courses.first().map(|c| c.length_m));
        out.push_str(&format!(
            "{} of {} {} can take this tuning.\n",
            self.courses_ok,
            self.courses.len(),
            plural(self.courses.len(), "course", "courses")
        ));
        for course in &self.courses {
            if course.verdict != Verdict::Yes {
                out.push_str(&wrap(
                    &format!("{}: {}.", course.verdict.text(), user(&course.reason)),
                    view.width,
                    &format!("  course {:<3} ", course.course),
                    "             ",
                ));
            }
        }
        let mut total = format!(
            "Total tension {}",
            force_with_unit(self.total_tension_n, view.force)
        );
        if let Some(before) = self.reference_total_tension_n {
            total.push_str(&format!(
                " (was {}, {})",
                force_with_unit(before, view.force),
                change((self.total_tension_n / before - 1.0) * 100.0, 0)
            ));
        }
        out.push_str(&paragraph(
            &total_sentence(total, self.total_tension_n, self.rated_load_n, view),
            view.width,
        ));
        let bend_cents = self
            .courses
            .first()
            .and_then(|c| c.strings.first())
            .map_or(DEFAULT_BEND_CENTS, |s| s.feel.bend_cents);
        push_closing(
            &mut out,
            Some(bend_cents),
            &self.warnings,
            &[],
            &self.cautions,
            view,
        );
        out
    }

    fn csv(&self) -> Result<String> {
        let mut rows = Vec::new();
        for course in &self.courses {
            for (index, string) in course.strings.iter().enumerate() {
                rows.push(AuditRow {
                    course: course.course,
                    string: index + 1,
                    interval: &string.interval,
                    pitch: &course.pitch.written,
                    note_name: &course.pitch.note_name,
                    pitch_hz: sig(string.pitch_hz),
                    length_m: sig(course.length_m),
                    kind: &string.string,
                    diameter_mm: sig_opt(string.diameter_mm),
                    diameter_in: sig_opt(string.diameter_in),
                    unit_mass_kg_per_m: sig(string.unit_mass_kg_per_m),
                    tension_n: sig(string.tension_n),
                    reference_tension_n: sig_opt(string.reference_tension_n),
                    tension_change_pct: sig_opt(string.tension_change_pct),
                    stress_ratio: sig_opt(string.stress_ratio),
                    break_pitch_hz: sig_opt(string.break_pitch_hz),
                    inharmonicity: sig_opt(string.feel.inharmonicity_b),
                    verdict: course.verdict.text(),
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

/// One CSV row of an audit: the plan's field names where they mean the same.
#[derive(Serialize)]
pub(super) struct AuditRow<'a> {
    course: u32,
    string: usize,
    interval: &'a str,
    pitch: &'a str,
    note_name: &'a str,
    pitch_hz: f64,
    length_m: f64,
    kind: &'a str,
    diameter_mm: Option<f64>,
    diameter_in: Option<f64>,
    unit_mass_kg_per_m: f64,
    tension_n: f64,
    reference_tension_n: Option<f64>,
    tension_change_pct: Option<f64>,
    stress_ratio: Option<f64>,
    break_pitch_hz: Option<f64>,
    inharmonicity: Option<f64>,
    verdict: &'a str,
    warnings: String,
}

/// Ends every warning of an audit with what would fix it (shared with the explorer).
pub(super) fn attach_fixes(report: &mut Audit, stock: &Stock) {
    taut::sets::audit::attach_fixes(report, stock);
}
