//! The one look of every report: a title, a table of plain columns under a rule, and notes
//! wrapped to the terminal's width.
//!
//! Width: `COLUMNS` when set, else the terminal's width, else 100 columns (a file or a pipe).
//! A table that is wider than that first shortens its flexible columns (names, with `…`), then
//! leaves out its least needed columns and says which, so no line is ever wider than the width.

use std::fmt::Write as _;

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

fn shorten(text: &str, width: usize) -> String {
    if cells(text) <= width {
        return text.to_string();
    }
    if width == 0 {
        return String::new();
    }
    let mut out: String = text.chars().take(width - 1).collect();
    out.push('…');
    out
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

    fn natural(&self, index: usize) -> usize {
        self.rows
            .iter()
            .map(|row| cells(&row[index]))
            .chain(std::iter::once(cells(&self.columns[index].header)))
            .max()
            .unwrap_or(0)
    }

    /// The table laid out within `width`, and the headers of the columns left out.
    pub fn render(&self, width: usize) -> (String, Vec<String>) {
        let count = self.columns.len();
        let mut widths: Vec<usize> = (0..count).map(|i| self.natural(i)).collect();
        let mut shown = vec![true; count];
        let total = |widths: &[usize], shown: &[bool]| {
            let visible: Vec<usize> = (0..count)
                .filter(|&i| shown[i])
                .map(|i| widths[i])
                .collect();
            visible.iter().sum::<usize>() + GAP.len() * visible.len().saturating_sub(1)
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
        let line = |cells_of: &dyn Fn(usize) -> String| {
            let mut out = String::new();
            let visible: Vec<usize> = (0..count).filter(|&i| shown[i]).collect();
            for (position, &i) in visible.iter().enumerate() {
                let text = shorten(&cells_of(i), widths[i]);
                let pad = widths[i] - cells(&text);
                if position > 0 {
                    out.push_str(GAP);
                }
                if self.columns[i].right {
                    out.push_str(&" ".repeat(pad));
                    out.push_str(&text);
                } else {
                    out.push_str(&text);
                    if position + 1 < visible.len() {
                        out.push_str(&" ".repeat(pad));
                    }
                }
            }
            out.trim_end().to_string()
        };
        let mut out = String::new();
        let _ = writeln!(out, "{}", line(&|i| self.columns[i].header.clone()));
        let _ = writeln!(out, "{}", "─".repeat(total(&widths, &shown)));
        for row in &self.rows {
            let _ = writeln!(out, "{}", line(&|i| row[i].clone()));
        }
        let hidden = (0..count)
            .filter(|&i| !shown[i])
            .map(|i| self.columns[i].header.clone())
            .collect();
        (out, hidden)
    }
}

/// Wraps `text` to `width`: the first line starts with `first`, the others with `rest`
/// (usually spaces as wide as `first`, for a hanging indent). Words longer than a line are
/// broken.
pub fn wrap(text: &str, width: usize, first: &str, rest: &str) -> String {
    let mut out = String::new();
    let mut line = first.to_string();
    let mut empty = true;
    for word in text.split_whitespace() {
        let room = width.saturating_sub(cells(&line));
        let needed = cells(word) + usize::from(!empty);
        if !empty && needed > room {
            out.push_str(line.trim_end());
            out.push('\n');
            line = rest.to_string();
            empty = true;
        }
        let mut word = word.to_string();
        // A word wider than a whole line is cut into pieces.
        while cells(&line) + cells(&word) + usize::from(!empty) > width
            && cells(&word) > width.saturating_sub(cells(rest)).max(1)
        {
            let room = width
                .saturating_sub(cells(&line) + usize::from(!empty))
                .max(1);
            let head: String = word.chars().take(room).collect();
            if !empty {
                line.push(' ');
            }
            line.push_str(&head);
            out.push_str(line.trim_end());
            out.push('\n');
            line = rest.to_string();
            empty = true;
            word = word.chars().skip(room).collect();
        }
        if !empty {
            line.push(' ');
        }
        line.push_str(&word);
        empty = false;
    }
    out.push_str(line.trim_end());
    out.push('\n');
    out
}

/// A paragraph wrapped flush left.
pub fn paragraph(text: &str, width: usize) -> String {
    wrap(text, width, "", "")
}

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
mod tests {
    use super::*;

    fn widest(text: &str) -> usize {
        text.lines().map(cells).max().unwrap_or(0)
    }

    #[test]
    fn wraps_with_a_hanging_indent_and_never_overflows() {
        let text = "one two three four five six seven eight nine ten eleven twelve";
        let out = wrap(text, 20, "- ", "  ");
        assert!(widest(&out) <= 20, "{out}");
        assert!(out.starts_with("- one"));
        assert!(
            out.lines().skip(1).all(|line| line.starts_with("  ")),
            "{out}"
        );
        let long = wrap(&"x".repeat(50), 20, "  ", "  ");
        assert!(widest(&long) <= 20, "{long}");
        assert_eq!(long.matches('x').count(), 50);
    }

    #[test]
    fn a_wide_table_shortens_then_drops_columns() {
        let mut grid = Grid::new(vec![
            Column::figure("#"),
            Column::text("name").give(Give::Shorten(6)),
            Column::figure("extra").give(Give::Drop(1)),
            Column::figure("value"),
        ]);
        grid.row(vec![
            "1".into(),
            "a rather long name indeed".into(),
            "12345678".into(),
            "9.5".into(),
        ]);
        let (wide, hidden) = grid.render(100);
        assert!(hidden.is_empty());
        assert!(wide.contains("a rather long name indeed"));
        // A little too wide: the name gives up a few characters, nothing is left out.
        let (narrow, hidden) = grid.render(38);
        assert!(widest(&narrow) <= 38, "{narrow}");
        assert!(narrow.contains('…'), "{narrow}");
        assert!(hidden.is_empty(), "{hidden:?}");
        // Much too wide: a column is left out rather than the name cut to a stub.
        let (tight, hidden) = grid.render(30);
        assert!(widest(&tight) <= 30, "{tight}");
        assert_eq!(hidden, vec!["extra".to_string()]);
        let (tiny, _) = grid.render(20);
        assert!(widest(&tiny) <= 20, "{tiny}");
    }
}
