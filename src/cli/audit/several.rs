//! The terminal view of [`SeveralAudit`]: an installed set under several tunings side by side,
//! with a verdict per tuning and the worst over all; JSON comes from serde.

use taut::sets::audit::Verdict;
use taut::sets::several::SeveralAudit;

use crate::cli::layout::{paragraph, wrap, Column, Give, Grid};
use crate::cli::output::{Render, View};
use crate::cli::text::{
    diameter, diameter_symbol, force, force_with_unit, letter, lettered_warnings, maybe, plural,
    share_of_rated, side_by_side, tuning_legend, user, warnings_and_cautions,
};

/// A short verdict for a cell.
fn short(verdict: Verdict) -> &'static str {
    match verdict {
        Verdict::Yes => "yes",
        Verdict::YesWithCare => "care",
        Verdict::No => "NO",
    }
}

/// The tunings `shown` side by side: per string pitch, tension, stress and (on the course's
/// first row) that tuning's verdict, then the tunings that set the string's limits.
fn chunk_table(this: &SeveralAudit, shown: &[usize], view: &View) -> String {
    let mut columns = vec![
        Column::figure("#"),
        Column::text("string").give(Give::Shorten(12, 1)),
        Column::figure(&format!("⌀ {}", diameter_symbol(view.length))),
    ];
    // A tuning's cell is figures (pitch, tension, stress, verdict): never shortened.
    columns.extend(
        shown
            .iter()
            .map(|&i| Column::figure(&letter(i).to_string())),
    );
    columns.push(Column::text("limits"));
    let mut table = Grid::new(columns);
    let Some(first_block) = this.tunings.first() else {
        return table.render(view.width).0;
    };
    for (course_index, course) in first_block.audit.courses.iter().enumerate() {
        for (string_index, string) in course.strings.iter().enumerate() {
            let first = string_index == 0;
            let mut row = vec![
                if first {
                    course.course.to_string()
                } else {
                    String::new()
                },
                user(&string.string).into_owned(),
                maybe(string.diameter_mm, |d| diameter(d, view.length)),
            ];
            for &tuning in shown {
                let cell = this
                    .tunings
                    .get(tuning)
                    .and_then(|block| block.audit.courses.get(course_index))
                    .and_then(|course| {
                        let audited = course.strings.get(string_index)?;
                        let (pitch, verdict) = if first {
                            (
                                format!("{} ", course.pitch.label),
                                format!(" {}", short(course.verdict)),
                            )
                        } else {
                            (format!("{} ", audited.interval), String::new())
                        };
                        Some(format!(
                            "{pitch}{} {}{verdict}",
                            force(audited.tension_n, view.force),
                            maybe(audited.stress_ratio, |s| format!("{:.0}%", s * 100.0))
                        ))
                    })
                    .unwrap_or_default();
                row.push(user(&cell).into_owned());
            }
            let index_of = |name: Option<&String>| {
                name.and_then(|name| this.tunings.iter().position(|b| &b.variant == name))
                    .map_or('?', letter)
            };
            let limits = this.courses.get(course_index).map(|shared| {
                format!(
                    "{}·{}",
                    index_of(shared.slackest_variants.get(string_index)),
                    index_of(shared.most_stressed_variants.get(string_index))
                )
            });
            row.push(limits.unwrap_or_default());
            table.row(row);
        }
    }
    table.render(view.width).0
}

impl Render for SeveralAudit {
    fn table(&self, view: &View) -> String {
        let mut out = paragraph(
            &format!(
                "{} · set {} · {} tunings",
                user(&self.instrument),
                user(&self.set),
                self.tunings.len()
            ),
            view.width,
        );
        out.push_str(&tuning_legend(self.tunings.iter().map(|block| {
            (
                block.variant.as_str(),
                block.audit.tuning.as_str(),
                block.retuned_courses.as_slice(),
            )
        })));
        out.push_str(&side_by_side(self.tunings.len(), view.width, |shown| {
            chunk_table(self, shown, view)
        }));
        out.push_str(&paragraph(
            &format!(
                "Each tuning: pitch, tension ({}), stress as a share of breaking strength, and \
                 whether the course can take it (yes, care: yes with care, NO). Limits: the \
                 tuning where the string is slackest, then the one where it is most stressed.",
                view.force.symbol()
            ),
            view.width,
        ));
        out.push_str(&format!(
            "{} of {} {} can take every tuning.\n",
            self.courses_ok_in_every_tuning,
            self.courses.len(),
            plural(self.courses.len(), "course", "courses")
        ));
        for (index, shared) in self.courses.iter().enumerate() {
            if shared.verdict == Verdict::Yes {
                continue;
            }
            for name in &shared.decided_by {
                let Some((tuning, block)) = self
                    .tunings
                    .iter()
                    .enumerate()
                    .find(|(_, block)| &block.variant == name)
                else {
                    continue;
                };
                if let Some(course) = block.audit.courses.get(index) {
                    out.push_str(&wrap(
                        &format!(
                            "Course {} in {} {}: {}: {}.",
                            shared.course,
                            letter(tuning),
                            user(name),
                            course.verdict.text(),
                            user(&course.reason)
                        ),
                        view.width,
                        "  ",
                        "    ",
                    ));
                }
            }
        }
        out.push_str("Total tension:\n");
        for (index, block) in self.tunings.iter().enumerate() {
            out.push_str(&format!(
                "  {}  {}",
                letter(index),
                force_with_unit(block.audit.total_tension_n, view.force)
            ));
            if let Some(rated) = block.audit.rated_load_n {
                out.push_str(&format!(
                    " ({})",
                    share_of_rated(block.audit.total_tension_n, rated, view.force)
                ));
            }
            out.push('\n');
        }
        let warnings = lettered_warnings(self.tunings.iter().map(|block| &block.audit.warnings));
        out.push_str(&warnings_and_cautions(&warnings, &[], &self.cautions, view));
        out
    }
}
