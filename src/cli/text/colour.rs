//! taut's own colours for status marks on a terminal, and when to use them (a terminal, `NO_COLOR` unset).

#[allow(unused_imports)]
use super::*;

/// taut's palette for status marks on a terminal (256-colour codes). The words differ on their
/// own (`DANGER` in capitals, `caution`, `note`; `no`, `yes, with care`, `yes`), so nothing is
/// lost without colour; danger is bold as well.
pub(super) const MARK_COLOURS: [(&str, &str); 10] = [
    ("DANGER", "1;38;5;160"),
    ("caution", "38;5;172"),
    ("note", "38;5;67"),
    ("heaviest", "38;5;67"),
    ("lightest", "38;5;67"),
    ("yes, with care", "38;5;172"),
    ("yes", "38;5;71"),
    ("no fit", "1;38;5;160"),
    ("no", "1;38;5;160"),
    ("ok", "38;5;71"),
];

/// Whether standard output gets colours: a terminal, and `NO_COLOR` unset or empty
/// (the convention at no-color.org).
pub fn colour_wanted() -> bool {
    use std::io::IsTerminal;
    std::env::var_os("NO_COLOR").is_none_or(|value| value.is_empty())
        && std::io::stdout().is_terminal()
}

/// A report for standard output: status marks coloured when [`colour_wanted`].
pub fn for_terminal(text: String) -> String {
    if colour_wanted() {
        colour_marks(&text)
    } else {
        text
    }
}

pub(super) fn paint(mark: &str, code: &str) -> String {
    format!("\x1b[{code}m{mark}\x1b[0m")
}

/// Colours the status marks of a report: the status cell that follows the first cell of a
/// report row (`3  DANGER  ~G3 …`), the last cell of a boxed table row (`… DANGER │`) and the
/// flag that opens a warnings-list line (`  caution  …`). Colour codes take no
/// room on a terminal, so the table stays aligned.
pub fn colour_marks(text: &str) -> String {
    let mut out = String::with_capacity(text.len() + 64);
    for line in text.split_inclusive('\n') {
        out.push_str(&colour_line(line));
    }
    out
}

pub(super) fn colour_line(line: &str) -> String {
    let body = line.trim_end_matches('\n');
    let ending = &line[body.len()..];
    if let Some(inner) = body.strip_suffix('│') {
        let cell = inner.trim_end();
        for (mark, code) in MARK_COLOURS {
            if let Some(before) = cell.strip_suffix(mark) {
                if before.ends_with("  ") {
                    return format!(
                        "{before}{}{}│{ending}",
                        paint(mark, code),
                        &inner[cell.len()..]
                    );
                }
            }
        }
        return line.to_string();
    }
    for (mark, code) in MARK_COLOURS.iter().take(3) {
        if let Some(rest) = body.strip_prefix("  ").and_then(|b| b.strip_prefix(mark)) {
            if rest.starts_with(' ') {
                return format!("  {}{rest}{ending}", paint(mark, code));
            }
        }
    }
    colour_status_cell(body).map_or_else(|| line.to_string(), |row| row + ending)
}

/// A report row led by a short first cell (the string's number) and then its status word, two
/// spaces apart: the status word coloured, or `None` when the line is not such a row.
pub(super) fn colour_status_cell(body: &str) -> Option<String> {
    let indent = body.len() - body.trim_start_matches(' ').len();
    let first_end = indent + body[indent..].find(' ')?;
    let first = &body[indent..first_end];
    let short_label = !first.is_empty()
        && first.chars().count() <= 6
        && first
            .chars()
            .all(|c| c.is_alphanumeric() || c == '.' || c == '-');
    let after = &body[first_end..];
    let status = after.trim_start_matches(' ');
    if !short_label || after.len() - status.len() < 2 {
        return None;
    }
    MARK_COLOURS.iter().find_map(|(mark, code)| {
        let rest = status.strip_prefix(mark)?;
        (rest.is_empty() || rest.starts_with("  ")).then(|| {
            let lead = &body[..body.len() - status.len()];
            format!("{lead}{}{rest}", paint(mark, code))
        })
    })
}
