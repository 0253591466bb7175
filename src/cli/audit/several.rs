//! The terminal view of [`SeveralAudit`]: an installed set under several tunings side by side,
//! with a verdict per tuning and the worst over all; JSON comes from serde.

use comfy_table::{Cell, Table};

use taut::sets::audit::Verdict;
use taut::sets::several::SeveralAudit;

use crate::cli::output::Render;
use crate::cli::text::{
    letter, lettered_warnings, maybe, new_table, right, side_by_side, tuning_legend,
    warnings_and_cautions,
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
fn chunk_table(this: &SeveralAudit, shown: &[usize]) -> Table {
    let letters: Vec<String> = shown.iter().map(|&i| letter(i).to_string()).collect();
    let mut header = vec!["Course", "String"];
    header.extend(letters.iter().map(String::as_str));
    header.push("Limits");
    let mut table = new_table(header);
    let Some(first_block) = this.tunings.first() else {
        return table;
    };
    for (course_index, course) in first_block.audit.courses.iter().enumerate() {
        for (string_index, string) in course.strings.iter().enumerate() {
            let first = string_index == 0;
            let mut row = vec![
                right(if first {
                    course.course.to_string()
                } else {
                    String::new()
                }),
                Cell::new(format!(
                    "{} {}",
                    string.string,
                    maybe(string.diameter_mm, |d| format!("{d:.3} mm"))
                )),
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
                            "{pitch}{:.1} N {}{verdict}",
                            audited.tension_n,
                            maybe(audited.stress_ratio, |s| format!("{:.0}%", s * 100.0))
                        ))
                    })
                    .unwrap_or_default();
                row.push(right(cell));
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
            row.push(Cell::new(limits.unwrap_or_default()));
            table.add_row(row);
        }
    }
    table
}

impl Render for SeveralAudit {
    fn table(&self) -> String {
        let mut out = format!(
            "{} — set: {} — {} tunings\n",
            self.instrument,
            self.set,
            self.tunings.len()
        );
        out.push_str(&tuning_legend(self.tunings.iter().map(|block| {
            (
                block.variant.as_str(),
                block.audit.tuning.as_str(),
                block.retuned_courses.as_slice(),
            )
        })));
        out.push_str(&side_by_side(self.tunings.len(), |shown| {
            chunk_table(self, shown)
        }));
        out.push_str(
            "Each tuning: pitch, tension, stress as a share of breaking strength, and whether the\n\
             course can take it (yes, care: yes with care, NO). Limits: the tuning where the\n\
             string is slackest, then the one where it is most stressed.\n",
        );
        out.push_str(&format!(
            "{} of {} courses can take every tuning.\n",
            self.courses_ok_in_every_tuning,
            self.courses.len()
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
                    out.push_str(&format!(
                        "  Course {} in {} {}: {}: {}.\n",
                        shared.course,
                        letter(tuning),
                        name,
                        course.verdict.text(),
                        course.reason
                    ));
                }
            }
        }
        out.push_str("Total tension:\n");
        for (index, block) in self.tunings.iter().enumerate() {
            out.push_str(&format!(
                "  {}  {:.1} N",
                letter(index),
                block.audit.total_tension_n
            ));
            if let Some(rated) = block.audit.rated_load_n {
                out.push_str(&format!(
                    " ({:.0}% of the rated {rated:.0} N)",
                    block.audit.total_tension_n / rated * 100.0
                ));
            }
            out.push('\n');
        }
        let warnings = lettered_warnings(self.tunings.iter().map(|block| &block.audit.warnings));
        out.push_str(&warnings_and_cautions(&warnings, &self.cautions));
        out
    }
}
