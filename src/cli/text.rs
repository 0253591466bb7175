//! Pieces of terminal output shared by every command: the table style, aligned cells, pitch
//! labels, the warnings list and the safety cautions.

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

/// The footnote explaining the stiffness and feel columns.
pub fn feel_legend(bend_cents: f64) -> String {
    format!(
        "B: Fletcher's inharmonicity coefficient (core diameter for wound strings). Partials: cents that partials 2/4/8 sit above 2, 4 and 8 times the sounding fundamental. Bend: sideways force at mid-length for a {bend_cents:.0}-cent rise.\n"
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn pitch_labels_show_the_note_only_when_it_adds_something() {
        assert_eq!(pitch_with_note("A2", "A2", 0.0), "A2");
        assert_eq!(pitch_with_note("~E4", "E4", -5.26), "~E4 (E4 -5.3c)");
        assert_eq!(pitch_with_note("~A2", "A2", 0.01), "~A2 (A2)");
    }
}
