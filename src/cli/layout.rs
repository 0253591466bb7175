//! The one look of every report: a title, a table of plain columns under a rule (drawn by
//! comfy-table with the house preset), and notes wrapped to the terminal's width.
//!
//! Width: `COLUMNS` when set, else the terminal's width, else 100 columns (a file or a pipe).
//! A table that is wider than that first shortens its flexible columns (names, with `…`), then
//! leaves out its least needed columns and says which, so no line is ever wider than the width.

use std::ops::Range;

/// Width used when standard output is not a terminal and `COLUMNS` is not set.
pub const DEFAULT_WIDTH: usize = 100;
/// Narrowest width a report is laid out for; narrower requests are raised to it.
pub const MIN_WIDTH: usize = 40;

/// The width reports are laid out for.
pub fn width() -> usize {
    if let Some(columns) = std::env::var("COLUMNS")
        .ok()
        .and_then(|text| text.trim().parse::<usize>().ok())
        .filter(|&columns| columns > 0)
    {
        return columns.max(MIN_WIDTH);
    }
    match terminal_size::terminal_size() {
        Some((terminal_size::Width(columns), _)) if columns > 0 => {
            usize::from(columns).max(MIN_WIDTH)
        }
        _ => DEFAULT_WIDTH,
    }
}

/// Columns a text takes on screen: its display width, so a wide (CJK) character counts two
/// and a combining mark none, as a terminal and comfy-table count them.
pub fn cells(text: &str) -> usize {
    if text.is_ascii() {
        text.len()
    } else {
        unicode_width::UnicodeWidthStr::width(text)
    }
}

/// How a column gives way when the table is too wide. Each command states its own order:
/// columns give way rank by rank, the highest rank first, until the table fits; a column of
/// figures is never shortened (its numbers would be cut), only left out.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Give {
    /// Always shown at full width.
    Never,
    /// A column of names, shortened with `…` down to this many characters at its rank (the
    /// second field) when the table is too wide.
    Shorten(usize, u8),
    /// Left out at its rank when the table does not fit.
    Drop(u8),
}

impl Give {
    /// The rank at which the column gives way, if it ever does.
    fn rank(self) -> Option<u8> {
        match self {
            Give::Never => None,
            Give::Shorten(_, rank) | Give::Drop(rank) => Some(rank),
        }
    }
}

/// One column of a [`Grid`].
#[derive(Debug, Clone)]
pub struct Column {
    header: String,
    right: bool,
    give: Give,
}

impl Column {
    /// A left-aligned column (words).
    pub fn text(header: &str) -> Self {
        Column {
            header: header.to_string(),
            right: false,
            give: Give::Never,
        }
    }

    /// A right-aligned column (figures).
    pub fn figure(header: &str) -> Self {
        Column {
            right: true,
            ..Column::text(header)
        }
    }

    /// Sets how the column gives way when the table is too wide.
    pub fn give(mut self, give: Give) -> Self {
        self.give = give;
        self
    }
}

/// A table: columns and rows of text, drawn by comfy-table in the house look.
#[derive(Debug, Clone, Default)]
pub struct Grid {
    columns: Vec<Column>,
    rows: Vec<Vec<String>>,
}

/// The blank between two columns.
const GAP: usize = 2;

/// The house look as a comfy-table preset, one character per `TableComponent` in its order:
/// no borders and no lines between columns, only the rule under the header (`HeaderLines`).
const HOUSE_PRESET: &str = "     ─             ";

/// Which columns a table shows, and how wide each is, to fit a width.
struct Fit {
    widths: Vec<usize>,
    shown: Vec<bool>,
}

impl Grid {
    /// A grid with these columns and no rows.
    pub fn new(columns: Vec<Column>) -> Self {
        Grid {
            columns,
            rows: Vec::new(),
        }
    }

    /// Adds a row; missing cells are empty, extra cells are ignored.
    pub fn row(&mut self, mut cells: Vec<String>) {
        cells.resize(self.columns.len(), String::new());
        self.rows.push(cells);
    }

    /// The table laid out within `width`, and the headers of the columns left out.
    pub fn render(&self, width: usize) -> (String, Vec<String>) {
        let mut out = String::new();
        let hidden = self.render_into(&mut out, width);
        (out, hidden)
    }

    /// [`Grid::render`], appending the table to `out`; returns the headers of the columns left
    /// out.
    pub fn render_into(&self, out: &mut String, width: usize) -> Vec<String> {
        let fit = self.fit(width);
        self.draw(out, &fit);
        (0..self.columns.len())
            .filter(|&i| !fit.shown[i])
            .map(|i| self.columns[i].header.clone())
            .collect()
    }

    /// The widths that fit `width`: the part comfy-table cannot decide, since it knows neither
    /// which columns a report needs least nor how short a name may become before a column should
    /// rather go. Columns give way rank by rank, highest first: at its rank a `Drop` column is
    /// left out and a `Shorten` column loses characters (the widest first, down to its floor)
    /// until the table fits. Width that a later step frees goes back to shortened names. Only
    /// when every rank has given way and the table is still too wide (a very narrow terminal)
    /// are names shortened below their floors, to three characters; figures never are.
    fn fit(&self, width: usize) -> Fit {
        let count = self.columns.len();
        let mut natural: Vec<usize> = self.columns.iter().map(|c| cells(&c.header)).collect();
        for row in &self.rows {
            for (widest, text) in natural.iter_mut().zip(row) {
                *widest = (*widest).max(cells(text));
            }
        }
        let total = |widths: &[usize], shown: &[bool]| {
            let (sum, visible) = widths
                .iter()
                .zip(shown)
                .filter(|(_, &shown)| shown)
                .fold((0, 0), |(sum, visible), (&width, _)| {
                    (sum + width, visible + 1)
                });
            sum + GAP * usize::saturating_sub(visible, 1)
        };
        let mut widths = natural.clone();
        let mut shown = vec![true; count];
        let mut ranks: Vec<u8> = self.columns.iter().filter_map(|c| c.give.rank()).collect();
        ranks.sort_unstable_by(|a, b| b.cmp(a));
        ranks.dedup();
        // Shortens the widest of `columns` one character at a time, each down to `floor`,
        // until the table fits.
        let shorten = |widths: &mut Vec<usize>,
                       shown: &[bool],
                       columns: &[usize],
                       floor: &dyn Fn(usize) -> usize| {
            while total(widths, shown) > width {
                let widest = columns
                    .iter()
                    .copied()
                    .filter(|&i| shown[i] && widths[i] > floor(i))
                    .max_by_key(|&i| widths[i]);
                match widest {
                    Some(i) => widths[i] -= 1,
                    None => break,
                }
            }
        };
        for &rank in &ranks {
            if total(&widths, &shown) <= width {
                break;
            }
            let at_rank: Vec<usize> = (0..count)
                .filter(|&i| self.columns[i].give.rank() == Some(rank))
                .collect();
            for &i in &at_rank {
                if matches!(self.columns[i].give, Give::Drop(_)) {
                    shown[i] = false;
                }
            }
            // A name shortens to its floor, and never so far that its header is cut.
            let floor = |i: usize| match self.columns[i].give {
                Give::Shorten(limit, _) => {
                    limit.max(cells(&self.columns[i].header)).min(natural[i])
                }
                _ => natural[i],
            };
            shorten(&mut widths, &shown, &at_rank, &floor);
        }
        // Width freed by a later step goes back to the names shortened before it.
        let mut spare = width.saturating_sub(total(&widths, &shown));
        while spare > 0 {
            let Some(i) = (0..count)
                .filter(|&i| shown[i] && widths[i] < natural[i])
                .max_by_key(|&i| natural[i] - widths[i])
            else {
                break;
            };
            widths[i] += 1;
            spare -= 1;
        }
        // Last resort: names below their floors.
        let names: Vec<usize> = (0..count)
            .filter(|&i| matches!(self.columns[i].give, Give::Shorten(..)))
            .collect();
        shorten(&mut widths, &shown, &names, &|i| 3.min(natural[i]));
        Fit { widths, shown }
    }

    /// Draws the table with comfy-table at the fitted widths: a cell too wide for its column
    /// keeps one line, cut and ended with `…`.
    fn draw(&self, out: &mut String, fit: &Fit) {
        use comfy_table::{
            Cell, CellAlignment, ColumnConstraint, ContentArrangement, Row, Table, Width,
        };
        // A character no cell holds, so a long cell is cut where the width ends rather than at
        // its last space.
        const NEVER_SPLIT: char = '\u{0}';
        let row = |texts: &[String]| {
            let mut row = Row::from(texts.iter().map(|text| Cell::new(text.as_str())));
            row.max_height(1);
            row
        };
        let mut table = Table::new();
        table
            .load_preset(HOUSE_PRESET)
            .set_content_arrangement(ContentArrangement::Disabled)
            .set_truncation_indicator("…")
            .set_delimiter(NEVER_SPLIT);
        let headers: Vec<String> = self.columns.iter().map(|c| c.header.clone()).collect();
        table.set_header(row(&headers));
        for cells in &self.rows {
            table.add_row(row(cells));
        }
        let mut first_shown = true;
        for (index, column) in table.column_iter_mut().enumerate() {
            if !fit.shown[index] {
                column.set_constraint(ColumnConstraint::Hidden);
                continue;
            }
            let gap = if first_shown { 0 } else { GAP as u16 };
            first_shown = false;
            let content = u16::try_from(fit.widths[index]).unwrap_or(u16::MAX);
            column
                .set_padding((gap, 0))
                .set_constraint(ColumnConstraint::Absolute(Width::Fixed(content + gap)))
                .set_cell_alignment(if self.columns[index].right {
                    CellAlignment::Right
                } else {
                    CellAlignment::Left
                });
        }
        for line in table.lines() {
            out.push_str(line.trim_end());
            out.push('\n');
        }
    }
}

mod wrap;
pub use wrap::*;

/// The note under a table that names the columns left out for width.
pub fn hidden_note(hidden: &[String], wide: bool, width: usize) -> String {
    if hidden.is_empty() {
        return String::new();
    }
    let how = if wide {
        "a wider terminal (or COLUMNS) shows them"
    } else {
        "--wide or a wider terminal shows them"
    };
    paragraph(
        &format!("Left out for width: {}; {how}.", hidden.join(", ")),
        width,
    )
}

#[cfg(test)]
mod tests;
