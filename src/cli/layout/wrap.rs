//! Wrapping text to the report's width, counting each word once.

#[allow(unused_imports)]
use super::*;

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
            let (cut, taken) = cut_at_cells(&text[word_start..word.end], room);
            let cut = word_start + cut;
            copy(out, &mut pending);
            if !empty {
                out.push(' ');
            }
            out.push_str(&text[word_start..cut]);
            new_line(out, &mut line_start, &mut line_cells);
            empty = true;
            word_start = cut;
            word_cells = word_cells.saturating_sub(taken);
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

/// Where to cut `word` so its head takes at most `room` display columns (at least one
/// character, so a line always moves on): the byte index of the cut and the columns the head
/// takes.
fn cut_at_cells(word: &str, room: usize) -> (usize, usize) {
    let mut taken = 0;
    for (index, c) in word.char_indices() {
        let width = char_cells(c);
        if taken + width > room && index > 0 {
            return (index, taken);
        }
        taken += width;
    }
    (word.len(), taken)
}

/// Columns one character takes on screen (see [`cells`]).
fn char_cells(c: char) -> usize {
    if c.is_ascii() {
        1
    } else {
        unicode_width::UnicodeWidthChar::width(c).unwrap_or(0)
    }
}

/// Whether an ASCII byte is blank, as [`char::is_whitespace`] has it (which, unlike
/// [`u8::is_ascii_whitespace`], counts the vertical tab).
fn is_ascii_blank(byte: u8) -> bool {
    matches!(byte, b' ' | b'\t'..=b'\r')
}

/// The words of `text` as [`str::split_whitespace`] finds them, as byte ranges of `text` with
/// the display columns each takes (a wide character counts two), found in one pass: printable ASCII, nearly all of a report, is
/// taken a byte at a time, and only other characters are decoded.
fn words(text: &str) -> impl Iterator<Item = (Range<usize>, usize)> + '_ {
    let bytes = text.as_bytes();
    let mut at = 0;
    // The length in bytes of the character at `at`, whether it is blank, and the columns it
    // takes.
    let character_at = move |at: usize| match bytes[at] {
        byte if byte.is_ascii() => (1, is_ascii_blank(byte), 1),
        _ => text[at..].chars().next().map_or((1, false, 1), |c| {
            (c.len_utf8(), c.is_whitespace(), char_cells(c))
        }),
    };
    std::iter::from_fn(move || {
        while at < bytes.len() {
            let (length, blank, _) = character_at(at);
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
            let (length, blank, width) = character_at(at);
            if blank {
                break;
            }
            at += length;
            word_cells += width;
        }
        Some((start..at, word_cells))
    })
}

/// A paragraph wrapped flush left.
pub fn paragraph(text: &str, width: usize) -> String {
    wrap(text, width, "", "")
}

/// Ends the line that starts at `line_start` in `out`: trailing blanks go, a newline follows.
fn end_line(out: &mut String, line_start: usize) {
    let kept = out[line_start..].trim_end().len();
    out.truncate(line_start + kept);
    out.push('\n');
}
