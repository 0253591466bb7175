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

/// Wraps `text` to `width`: the first line starts with `first`, the others with `rest`
/// (usually spaces as wide as `first`, for a hanging indent). Words longer than a line are
/// broken.
pub fn wrap(text: &str, width: usize, first: &str, rest: &str) -> String {
    let mut out = String::with_capacity(text.len() + first.len() + 8);
    wrap_into(&mut out, text, width, first, rest);
    out
}

/// [`wrap`], appending to `out`.
pub fn wrap_into(out: &mut String, text: &str, width: usize, first: &str, rest: &str) {
    let rest_cells = cells(rest);
    // The line being filled is the end of `out` from `line_start`, then the words in `pending`;
    // `line_cells` counts both, so every word is counted once and the text is wrapped in one
    // pass.
    let mut line_start = out.len();
    out.push_str(first);
    let mut line_cells = cells(first);
    let mut empty = true;
    // The words on the line not yet copied: a span of `text` whose words are one space apart,
    // as the line shows them, so a line is copied in a few pieces rather than word by word.
    let mut pending = 0..0;
    let copy = |out: &mut String, pending: &mut Range<usize>| {
        out.push_str(&text[pending.clone()]);
        *pending = 0..0;
    };
    let new_line = |out: &mut String, line_start: &mut usize, line_cells: &mut usize| {
        end_line(out, *line_start);
        *line_start = out.len();
        out.push_str(rest);
        *line_cells = rest_cells;
    };
    for (word, whole_cells) in words(text) {
        let mut word_start = word.start;
        let mut word_cells = whole_cells;
        if !empty && word_cells + 1 > width.saturating_sub(line_cells) {
            copy(out, &mut pending);
            new_line(out, &mut line_start, &mut line_cells);
            empty = true;
        }
        // A word wider than a whole line is cut into pieces.
        while line_cells + word_cells + usize::from(!empty) > width
            && word_cells > width.saturating_sub(rest_cells).max(1)
        {
            let room = width
                .saturating_sub(line_cells + usize::from(!empty))
                .max(1);
            let cut = text[word_start..word.end]
                .char_indices()
                .nth(room)
                .map_or(word.end, |(index, _)| word_start + index);
            copy(out, &mut pending);
            if !empty {
                out.push(' ');
            }
            out.push_str(&text[word_start..cut]);
            new_line(out, &mut line_start, &mut line_cells);
            empty = true;
            word_start = cut;
            word_cells = word_cells.saturating_sub(room);
        }
        let one_space_after_pending = !pending.is_empty()
            && pending.end + 1 == word_start
            && text.as_bytes()[pending.end] == b' ';
        if empty {
            pending = word_start..word.end;
        } else if one_space_after_pending {
            pending.end = word.end;
            line_cells += 1;
        } else {
            copy(out, &mut pending);
            out.push(' ');
            pending = word_start..word.end;
            line_cells += 1;
        }
        line_cells += word_cells;
        empty = false;
    }
    copy(out, &mut pending);
    end_line(out, line_start);
}

/// Whether an ASCII byte is blank, as [`char::is_whitespace`] has it (which, unlike
/// [`u8::is_ascii_whitespace`], counts the vertical tab).
fn is_ascii_blank(byte: u8) -> bool {
    matches!(byte, b' ' | b'\t'..=b'\r')
}

/// The words of `text` as [`str::split_whitespace`] finds them, as byte ranges of `text` with
/// the characters each takes, found in one pass: printable ASCII, nearly all of a report, is
/// taken a byte at a time, and only other characters are decoded.
fn words(text: &str) -> impl Iterator<Item = (Range<usize>, usize)> + '_ {
    let bytes = text.as_bytes();
    let mut at = 0;
    // The length in bytes of the character at `at` (a character boundary), and whether it is
    // blank.
    let character_at = move |at: usize| match bytes[at] {
        byte if byte.is_ascii() => (1, is_ascii_blank(byte)),
        _ => text[at..]
            .chars()
            .next()
            .map_or((1, false), |c| (c.len_utf8(), c.is_whitespace())),
    };
    std::iter::from_fn(move || {
        while at < bytes.len() {
            let (length, blank) = character_at(at);
            if !blank {
                break;
            }
            at += length;
        }
        if at >= bytes.len() {
            return None;
        }
        let start = at;
        let mut word_cells = 0;
        while at < bytes.len() {
            let printable = bytes[at..]
                .iter()
                .position(|byte| !(b'!'..=0x7f).contains(byte))
                .unwrap_or(bytes.len() - at);
            at += printable;
            word_cells += printable;
            if at == bytes.len() {
                break;
            }
            let (length, blank) = character_at(at);
            if blank {
                break;
            }
            at += length;
            word_cells += 1;
        }
        Some((start..at, word_cells))
    })
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

    /// Wrapping as first written: every line rebuilt and recounted for each word. The one-pass
    /// [`wrap`] must write the same text.
    fn wrap_recounting(text: &str, width: usize, first: &str, rest: &str) -> String {
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

    #[test]
    fn wraps_as_recounting_every_line_does() {
        // Words of every length, blanks of every kind (ASCII, no-break, ideographic, vertical
        // tab) and characters of one to four bytes.
        let pieces = [
            "a",
            "bc",
            "def",
            "ghij",
            "klmnopqrstu",
            "é",
            "─▰",
            "…",
            "𝄞x",
            "0.254w",
            "averyveryveryverylongwordthatmustbebroken",
            " ",
            "  ",
            "\t",
            "\n",
            "\u{a0}",
            "\u{3000}",
            "\u{b}",
            "\u{85}",
            "\u{1b}",
        ];
        let mut state: u64 = 0x9e37_79b9_7f4a_7c15;
        let mut next = move |bound: usize| {
            state ^= state << 13;
            state ^= state >> 7;
            state ^= state << 17;
            (state % bound as u64) as usize
        };
        let indents = [
            ("", ""),
            ("- ", "  "),
            ("  caution  ", "           "),
            ("x", " "),
        ];
        for _ in 0..3000 {
            let text: String = (0..next(30)).map(|_| pieces[next(pieces.len())]).collect();
            let width = next(70);
            let (first, rest) = indents[next(indents.len())];
            assert_eq!(
                wrap(&text, width, first, rest),
                wrap_recounting(&text, width, first, rest),
                "{text:?} at {width}"
            );
        }
        let mut out = String::from("kept\n");
        wrap_into(&mut out, "one two three", 8, "> ", "  ");
        assert_eq!(out, "kept\n> one\n  two\n  three\n");
    }

    #[test]
    fn cells_too_wide_are_cut_with_an_ellipsis_and_rows_end_without_blanks() {
        let mut grid = Grid::new(vec![
            Column::figure("#"),
            Column::text("name").give(Give::Shorten(4)),
            Column::text("note"),
        ]);
        grid.row(vec!["1".into(), "éèêëēĕėęě".into(), String::new()]);
        grid.row(vec![String::new(), "ab".into()]);
        let (table, hidden) = grid.render(13);
        assert!(hidden.is_empty());
        assert_eq!(
            table, "#  name  note\n─────────────\n1  éèê…\n   ab\n",
            "{table}"
        );
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
