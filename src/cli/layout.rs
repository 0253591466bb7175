//! The one look of every report: a title, a table of plain columns under a rule, and notes
//! wrapped to the terminal's width.
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

/// Characters a text takes on screen (every character the reports use is one cell wide).
pub fn cells(text: &str) -> usize {
    text.chars().count()
}

/// How a column gives way when the table is too wide.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Give {
    /// Always shown at full width.
    Never,
    /// Shortened with `…` down to this many characters before any column is left out.
    Shorten(usize),
    /// Left out when the table does not fit; higher ranks go first.
    Drop(u8),
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

/// A table: columns and rows of text.
#[derive(Debug, Clone, Default)]
pub struct Grid {
    columns: Vec<Column>,
    rows: Vec<Vec<String>>,
}

/// The gap between columns.
const GAP: &str = "  ";

/// Writes `text` in a cell `width` characters wide, given that it takes `text_cells`: whole when
/// it fits, else cut and ended with `…`.
fn push_cell(out: &mut String, text: &str, text_cells: usize, width: usize) {
    if text_cells <= width {
        out.push_str(text);
    } else if width > 0 {
        let cut = text
            .char_indices()
            .nth(width - 1)
            .map_or(text.len(), |(index, _)| index);
        out.push_str(&text[..cut]);
        out.push('…');
    }
}

/// Writes `count` spaces.
fn push_spaces(out: &mut String, count: usize) {
    out.extend(std::iter::repeat_n(' ', count));
}

/// Ends the line that starts at `line_start` in `out`: trailing blanks go, a newline follows.
fn end_line(out: &mut String, line_start: usize) {
    let kept = out[line_start..].trim_end().len();
    out.truncate(line_start + kept);
    out.push('\n');
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
        let count = self.columns.len();
        // Every cell is counted once; laying out and writing the rows reuse the counts.
        let header_cells: Vec<usize> = self.columns.iter().map(|c| cells(&c.header)).collect();
        // Row after row, `count` cells each (`row` makes every row that long).
        let row_cells: Vec<usize> = self.rows.iter().flatten().map(|text| cells(text)).collect();
        let mut widths = header_cells.clone();
        for counts in row_cells.chunks_exact(count.max(1)) {
            for (widest, &cell) in widths.iter_mut().zip(counts) {
                *widest = (*widest).max(cell);
            }
        }
        let mut shown = vec![true; count];
        let total = |widths: &[usize], shown: &[bool]| {
            let (sum, visible) = widths
                .iter()
                .zip(shown)
                .filter(|(_, &shown)| shown)
                .fold((0, 0), |(sum, visible), (&width, _)| {
                    (sum + width, visible + 1)
                });
            sum + GAP.len() * usize::saturating_sub(visible, 1)
        };
        // Leave out as few columns as lets the flexible ones keep most of their width; if
        // none does, as few as lets them fit at all.
        let natural = widths.clone();
        let mut droppable: Vec<(u8, usize)> = (0..count)
            .filter_map(|i| match self.columns[i].give {
                Give::Drop(rank) => Some((rank, i)),
                _ => None,
            })
            .collect();
        droppable.sort_unstable_by(|a, b| b.cmp(a));
        let attempt = |dropped: usize, comfortable: bool| {
            let mut widths = natural.clone();
            let mut shown = vec![true; count];
            for &(_, i) in droppable.iter().take(dropped) {
                shown[i] = false;
            }
            let floor = |i: usize, limit: usize| {
                if comfortable {
                    limit.max(natural[i] * 7 / 10).min(natural[i])
                } else {
                    limit
                }
            };
            while total(&widths, &shown) > width {
                let widest = (0..count)
                    .filter(|&i| shown[i])
                    .filter(|&i| matches!(self.columns[i].give, Give::Shorten(limit) if widths[i] > floor(i, limit)))
                    .max_by_key(|&i| widths[i]);
                match widest {
                    Some(i) => widths[i] -= 1,
                    None => break,
                }
            }
            (total(&widths, &shown) <= width).then_some((widths, shown))
        };
        let chosen = (0..=droppable.len())
            .find_map(|dropped| attempt(dropped, true))
            .or_else(|| (0..=droppable.len()).find_map(|dropped| attempt(dropped, false)));
        if let Some((fitted, visible)) = chosen {
            widths = fitted;
            shown = visible;
        } else {
            for &(_, i) in &droppable {
                shown[i] = false;
            }
        }
        // Last resort: shorten the widest column, whatever it is.
        while total(&widths, &shown) > width {
            let widest = (0..count)
                .filter(|&i| shown[i] && widths[i] > 3)
                .max_by_key(|&i| widths[i]);
            match widest {
                Some(i) => widths[i] -= 1,
                None => break,
            }
        }
        let visible: Vec<usize> = (0..count).filter(|&i| shown[i]).collect();
        let line_width = total(&widths, &shown);
        let text_bytes: usize = self.rows.iter().flatten().map(String::len).sum();
        // Room for every cell, its padding and the rule ('─' takes three bytes).
        out.reserve(text_bytes + (self.rows.len() + 1) * (line_width + 1) + 3 * line_width + 1);
        let line = |out: &mut String, texts: &[&str], counts: &[usize]| {
            let line_start = out.len();
            for (position, &i) in visible.iter().enumerate() {
                let pad = widths[i].saturating_sub(counts[i]);
                if position > 0 {
                    out.push_str(GAP);
                }
                if self.columns[i].right {
                    push_spaces(out, pad);
                    push_cell(out, texts[i], counts[i], widths[i]);
                } else {
                    push_cell(out, texts[i], counts[i], widths[i]);
                    if position + 1 < visible.len() {
                        push_spaces(out, pad);
                    }
                }
            }
            end_line(out, line_start);
        };
        let headers: Vec<&str> = self.columns.iter().map(|c| c.header.as_str()).collect();
        line(out, &headers, &header_cells);
        out.extend(std::iter::repeat_n('─', line_width));
        out.push('\n');
        let mut texts: Vec<&str> = Vec::with_capacity(count);
        for (index, row) in self.rows.iter().enumerate() {
            let counts = &row_cells[index * count..(index + 1) * count];
            texts.clear();
            texts.extend(row.iter().map(String::as_str));
            line(out, &texts, counts);
        }
        (0..count)
            .filter(|&i| !shown[i])
            .map(|i| self.columns[i].header.clone())
            .collect()
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
