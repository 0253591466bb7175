//! Pieces of terminal output shared by every command: the table style, aligned cells, pitch
//! labels, the warnings list, the safety cautions, and the colours of status marks.

use comfy_table::{presets, Cell, CellAlignment, ContentArrangement, Table};

use taut::error::shown;
use taut::plan::warning::{Severity, Warning, SAFETY_REMINDER};
use taut::plan::CoursePitch;

/// A fresh table in the project's style: borders only, columns as wide as their content.
pub fn new_table(header: Vec<&str>) -> Table {
    let mut table = Table::new();
    table
        .load_preset(presets::UTF8_BORDERS_ONLY)
        .set_content_arrangement(ContentArrangement::Disabled)
        .set_header(header);
    table
}

/// A cell of text, with the user's control characters (a line break in a name, a terminal
/// escape) shown escaped so they cannot break the table or reach the terminal.
pub fn cell(text: impl AsRef<str>) -> Cell {
    Cell::new(shown(text.as_ref()))
}

/// A cell aligned right (numbers).
pub fn right(text: String) -> Cell {
    cell(text).set_alignment(CellAlignment::Right)
}

/// The user's text (a name, a description) for a line of a report, control characters escaped.
pub fn user(text: &str) -> std::borrow::Cow<'_, str> {
    shown(text)
}

/// An optional figure as text, `-` when unknown.
pub fn maybe(value: Option<f64>, render: impl Fn(f64) -> String) -> String {
    value.map_or_else(|| "-".to_string(), render)
}

/// A pitch as written, followed by the nearest 12-EDO note when that adds something:
/// `~E4 (E4 -5.3c)`, `A2`, `3/4 (E4 +2.0c)`.
pub fn pitch_with_note(label: &str, note_name: &str, note_offset_cents: f64) -> String {
    let note = if note_offset_cents.abs() < 0.05 || !note_offset_cents.is_finite() {
        note_name.to_string()
    } else {
        format!("{note_name} {note_offset_cents:+.1}c")
    };
    if note == label {
        note
    } else {
        format!("{label} ({note})")
    }
}

/// A course's pitch as written, with the nearest 12-EDO note when that adds something.
pub fn course_pitch_text(pitch: &CoursePitch) -> String {
    pitch_with_note(&pitch.label, &pitch.note_name, pitch.note_offset_cents)
}

/// The short flag shown for a severity.
pub fn severity_flag(severity: Severity) -> &'static str {
    match severity {
        Severity::Danger => "DANGER",
        Severity::Caution => "caution",
        Severity::Note => "note",
    }
}

/// The warnings list and the safety cautions (the full list when given, else the one-line
/// reminder), as text below a table.
pub fn warnings_and_cautions(warnings: &[Warning], cautions: &[impl AsRef<str>]) -> String {
    let mut out = String::new();
    if warnings.is_empty() {
        out.push_str("No warnings.\n");
    } else {
        out.push_str(&format!("\nWarnings ({}):\n", warnings.len()));
        for warning in warnings {
            out.push_str(&format!(
                "  {:<7} {}: {}\n",
                severity_flag(warning.severity),
                warning.kind.name(),
                shown(&warning.message)
            ));
        }
    }
    if cautions.is_empty() {
        out.push_str(SAFETY_REMINDER);
        out.push('\n');
    } else {
        out.push_str("\nBefore you string this up:\n");
        for caution in cautions {
            out.push_str(&format!("  - {}\n", shown(caution.as_ref())));
        }
    }
    out
}

/// taut's palette for status marks on a terminal (256-colour codes). The words differ on their
/// own (`DANGER` in capitals, `caution`, `note`; `no`, `yes, with care`, `yes`), so nothing is
/// lost without colour; danger is bold as well.
const MARK_COLOURS: [(&str, &str); 6] = [
    ("DANGER", "1;38;5;160"),
    ("caution", "38;5;172"),
    ("note", "38;5;67"),
    ("yes, with care", "38;5;172"),
    ("yes", "38;5;71"),
    ("no", "1;38;5;160"),
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

fn paint(mark: &str, code: &str) -> String {
    format!("\x1b[{code}m{mark}\x1b[0m")
}

/// Colours the status marks of a report: the last cell of a table row (`… DANGER │`) and the
/// flag that opens a warnings-list line (`  caution stress_caution: …`). Colour codes take no
/// room on a terminal, so the table stays aligned.
pub fn colour_marks(text: &str) -> String {
    let mut out = String::with_capacity(text.len() + 64);
    for line in text.split_inclusive('\n') {
        out.push_str(&colour_line(line));
    }
    out
}

fn colour_line(line: &str) -> String {
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
    line.to_string()
}

/// The footnote explaining the stiffness and feel columns.
pub fn feel_legend(bend_cents: f64) -> String {
    format!(
        "B: Fletcher's inharmonicity coefficient (core diameter for wound strings). Partials: cents that partials 2/4/8 sit above 2, 4 and 8 times the sounding fundamental. Bend: sideways force at mid-length for a {bend_cents:.0}-cent rise.\n"
    )
}

/// The widest table a side-by-side report writes, in columns.
pub const MAX_WIDTH: usize = 100;

/// The letter that stands for the tuning at `index` in side-by-side reports (A, B, …).
pub fn letter(index: usize) -> char {
    char::from(b'A' + u8::try_from(index % 26).unwrap_or(0))
}

fn width(text: &str) -> usize {
    text.lines()
        .map(|line| line.chars().count())
        .max()
        .unwrap_or(0)
}

/// Tables of `count` columns (tunings) side by side, as many per table as fit in [`MAX_WIDTH`]
/// columns (at least one), spread evenly over the tables; `build` makes the table for the given
/// indices. Each table ends in a newline.
pub fn side_by_side(count: usize, build: impl Fn(&[usize]) -> Table) -> String {
    let all: Vec<usize> = (0..count).collect();
    let even = |per_table: usize| {
        let tables = count.div_ceil(per_table.max(1)).max(1);
        count.div_ceil(tables).max(1)
    };
    let mut per_table = count.max(1);
    while per_table > 1 {
        let widest = all
            .chunks(even(per_table))
            .map(|shown| width(&build(shown).to_string()))
            .max()
            .unwrap_or(0);
        if widest <= MAX_WIDTH {
            break;
        }
        per_table -= 1;
    }
    all.chunks(even(per_table))
        .map(|shown| format!("{}\n", build(shown)))
        .collect()
}

/// The legend of a side-by-side report: one line per tuning with its letter, name, tuning and
/// the courses it retunes; `entries` yields (name, tuning, retuned course numbers).
pub fn tuning_legend<'a>(entries: impl Iterator<Item = (&'a str, &'a str, &'a [u32])>) -> String {
    let mut out = String::new();
    for (index, (name, tuning, retuned)) in entries.enumerate() {
        out.push_str(&format!("  {}  {name}: tuning {tuning}", letter(index)));
        if !retuned.is_empty() {
            let courses: Vec<String> = retuned.iter().map(u32::to_string).collect();
            out.push_str(&format!(", course {} retuned", courses.join(", ")));
        }
        out.push('\n');
    }
    out
}

/// Every tuning's warnings in one list, each message led by its tuning's letter.
pub fn lettered_warnings<'a>(per_tuning: impl Iterator<Item = &'a Vec<Warning>>) -> Vec<Warning> {
    per_tuning
        .enumerate()
        .flat_map(|(index, warnings)| {
            warnings.iter().map(move |warning| Warning {
                message: format!("[{}] {}", letter(index), warning.message),
                ..warning.clone()
            })
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn status_marks_are_coloured_only_where_they_are_marks() {
        let table =
            "│ 1   E4   53%   DANGER  │\n│ 2   B3   31%           │\n│ 3  no  yes, with care │\n";
        let coloured = colour_marks(table);
        assert!(
            coloured.contains("\x1b[1;38;5;160mDANGER\x1b[0m  │"),
            "{coloured}"
        );
        assert!(
            coloured.contains("\x1b[38;5;172myes, with care\x1b[0m │"),
            "{coloured}"
        );
        assert!(!coloured.contains("mno"), "{coloured}");
        let plain: String = coloured
            .replace("\x1b[1;38;5;160m", "")
            .replace("\x1b[38;5;172m", "")
            .replace("\x1b[0m", "");
        assert_eq!(plain, table);
        let list = "  caution stress_caution: Course 1 …\nNo warnings.\n  note    x: y\n";
        let coloured = colour_marks(list);
        assert!(coloured.starts_with("  \x1b[38;5;172mcaution\x1b[0m stress_caution"));
        assert!(coloured.contains("No warnings.\n"));
        assert!(coloured.contains("\x1b[38;5;67mnote\x1b[0m    x"));
    }

    #[test]
    fn pitch_labels_show_the_note_only_when_it_adds_something() {
        assert_eq!(pitch_with_note("A2", "A2", 0.0), "A2");
        assert_eq!(pitch_with_note("~E4", "E4", -5.26), "~E4 (E4 -5.3c)");
        assert_eq!(pitch_with_note("~A2", "A2", 0.01), "~A2 (A2)");
    }
}
