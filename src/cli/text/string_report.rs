//! The layout every per-string report shares (plan, audit, convert and lengths): the leading
//! columns, each string's row, the title with its scale, the totals line and the closing
//! legend, warnings and cautions. Each command adds only the columns that are its own.

use std::fmt::Write as _;

use taut::plan::warning::Warning;

use super::{
    feel_legend, fixed, leading_columns, length, push_warnings_and_cautions, share_of_rated,
    LeadRanks,
};
use crate::cli::layout::{hidden_note, wrap_into, Column, Give, Grid};
use crate::cli::output::View;

/// A per-string report being built: a row for every string, led by the same columns in every
/// command.
pub struct StringReport<'v> {
    grid: Grid,
    view: &'v View,
    show_length: bool,
}

/// The cells that lead a string's row.
#[derive(Clone, Copy)]
pub struct Lead<'a> {
    /// The course's number.
    pub course: u32,
    /// Whether this is the first string of its course: the course number, pitch and length
    /// are written on that row only.
    pub first: bool,
    /// The status word (or verdict) under the report's status header.
    pub status: &'a str,
    /// The course's pitch as the report writes it, for the first string.
    pub pitch: &'a str,
    /// The interval of a further string of the course from its first.
    pub interval: &'a str,
    /// The string's pitch in Hz.
    pub hz: f64,
    /// The course's vibrating length in metres.
    pub length_m: f64,
}

impl<'v> StringReport<'v> {
    /// A report led by `#`, `status_header`, pitch, Hz and (when `show_length`) the length,
    /// followed by the command's `own` columns; `ranks` places Hz and length in the command's
    /// order of giving way.
    pub fn new(
        view: &'v View,
        status_header: &str,
        show_length: bool,
        ranks: LeadRanks,
        own: impl IntoIterator<Item = Column>,
    ) -> Self {
        let mut columns = leading_columns(status_header, show_length, ranks, view);
        columns.extend(own);
        StringReport {
            grid: Grid::new(columns),
            view,
            show_length,
        }
    }

    /// Adds one string's row: its leading cells, then the command's own cells.
    pub fn row(&mut self, lead: Lead<'_>, own: impl IntoIterator<Item = String>) {
        let mut row = Vec::with_capacity(12);
        row.push(if lead.first {
            lead.course.to_string()
        } else {
            String::new()
        });
        row.push(lead.status.to_string());
        row.push(if lead.first {
            lead.pitch.to_string()
        } else {
            format!("  {}", lead.interval)
        });
        row.push(fixed(lead.hz, 2));
        if self.show_length {
            row.push(if lead.first {
                length(lead.length_m, self.view.length)
            } else {
                String::new()
            });
        }
        row.extend(own);
        self.grid.row(row);
    }

    /// Writes the title (with the scale length beside it when no length column shows it), the
    /// table, and the note naming any column left out for width.
    pub fn write(&self, out: &mut String, title: &str, scale_m: Option<f64>) {
        let mut title = title.to_string();
        if let Some(scale) = scale_m.filter(|_| !self.show_length) {
            let _ = write!(
                title,
                " · {} {} scale",
                length(scale, self.view.length),
                self.view.length.symbol()
            );
        }
        wrap_into(out, &title, self.view.width, "", "");
        let hidden = self.grid.render_into(out, self.view.width);
        out.push_str(&hidden_note(&hidden, self.view.wide, self.view.width));
    }
}

/// The stiffness and feel columns of the wide view (the cells come from
/// `taut::strings::feel::cells`): every command leaves them out first, bend, then partials,
/// then B.
pub fn feel_columns() -> [Column; 3] {
    [
        Column::figure("B").give(Give::Drop(FEEL_RANK)),
        Column::figure("partials c vs n·f1").give(Give::Drop(FEEL_RANK + 1)),
        Column::figure("bend N").give(Give::Drop(FEEL_RANK + 2)),
    ]
}

/// The rank of the first feel column to go (see [`feel_columns`]); each command's own ranks
/// stay below it.
pub const FEEL_RANK: u8 = 20;

/// A totals sentence: `lead`, then the share of the rated load where the instrument gives one,
/// and a full stop.
pub fn total_sentence(lead: String, total_n: f64, rated_n: Option<f64>, view: &View) -> String {
    let mut sentence = lead;
    if let Some(rated) = rated_n {
        let _ = write!(sentence, ", {}", share_of_rated(total_n, rated, view.force));
    }
    sentence.push('.');
    sentence
}

/// How a per-string report ends: the feel legend in the wide view (where the report has feel
/// columns, `bend_cents` the bend they were worked out for), then the warnings and cautions.
pub fn push_closing(
    out: &mut String,
    bend_cents: Option<f64>,
    warnings: &[Warning],
    extra_cautions: &[String],
    cautions: &[impl AsRef<str>],
    view: &View,
) {
    if let Some(bend_cents) = bend_cents.filter(|_| view.wide) {
        out.push_str(&feel_legend(bend_cents, view));
    }
    push_warnings_and_cautions(out, warnings, extra_cautions, cautions, view);
}

/// The kinds of `warnings` as a CSV cell: their stable names joined by `;`.
pub fn warning_kinds<'a>(warnings: impl IntoIterator<Item = &'a Warning>) -> String {
    let mut cell = String::new();
    for warning in warnings {
        if !cell.is_empty() {
            cell.push(';');
        }
        cell.push_str(warning.kind.name());
    }
    cell
}
