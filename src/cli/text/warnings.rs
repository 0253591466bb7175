//! Warnings and safety cautions as every report ends with them: each warning led by its
//! severity's tag and wrapped under a hanging indent, then the full cautions or the one-line
//! reminder.

#[allow(unused_imports)]
use super::*;

/// The short tag shown for a severity.
pub fn severity_flag(severity: Severity) -> &'static str {
    match severity {
        Severity::Danger => "DANGER",
        Severity::Caution => "caution",
        Severity::Note => "note",
    }
}

/// What leads a warning's first line: its severity's tag, padded so the messages line up under
/// [`WARNING_INDENT`].
pub(super) fn warning_lead(severity: Severity) -> &'static str {
    match severity {
        Severity::Danger => "  DANGER   ",
        Severity::Caution => "  caution  ",
        Severity::Note => "  note     ",
    }
}

/// The hanging indent of a warning's later lines.
pub(super) const WARNING_INDENT: &str = "           ";

/// The warnings list (with any report-wide cautions first) and the safety cautions (the full
/// list when given, else the one-line reminder), wrapped to the view's width.
pub fn warnings_and_cautions(
    warnings: &[Warning],
    extra_cautions: &[String],
    cautions: &[impl AsRef<str>],
    view: &View,
) -> String {
    let mut out = String::new();
    push_warnings_and_cautions(&mut out, warnings, extra_cautions, cautions, view);
    out
}

/// [`warnings_and_cautions`], appended to `out`.
pub fn push_warnings_and_cautions(
    out: &mut String,
    warnings: &[Warning],
    extra_cautions: &[String],
    cautions: &[impl AsRef<str>],
    view: &View,
) {
    let text_bytes: usize = warnings.iter().map(|w| w.message.len()).sum::<usize>()
        + extra_cautions.iter().map(String::len).sum::<usize>()
        + cautions.iter().map(|c| c.as_ref().len()).sum::<usize>();
    // Room for the texts, their leads and indents, and the reminder.
    out.reserve(text_bytes + 32 * (warnings.len() + extra_cautions.len() + cautions.len()) + 512);
    let count = warnings.len() + extra_cautions.len();
    if count == 0 {
        out.push_str("No warnings.\n");
    } else {
        // Writing to a String cannot fail.
        let _ = writeln!(out, "\nWarnings ({count}):");
        for caution in extra_cautions {
            wrap_into(
                out,
                &shown(caution),
                view.width,
                warning_lead(Severity::Caution),
                WARNING_INDENT,
            );
        }
        let mut tagged = String::new();
        for line in grouped_warnings(warnings) {
            let Some(warning) = line.members.first().and_then(|&m| warnings.get(m)) else {
                continue;
            };
            let lead = warning_lead(warning.severity);
            let message = shown(&line.text);
            if view.wide {
                tagged.clear();
                let _ = write!(tagged, "{message} [{}]", warning.kind.name());
                wrap_into(out, &tagged, view.width, lead, WARNING_INDENT);
            } else {
                wrap_into(out, &message, view.width, lead, WARNING_INDENT);
            }
        }
    }
    if cautions.is_empty() {
        wrap_into(out, SAFETY_REMINDER, view.width, "", "");
    } else {
        out.push_str("\nBefore you string this up:\n");
        for caution in cautions {
            wrap_into(out, &shown(caution.as_ref()), view.width, "  - ", "    ");
        }
    }
}

/// The warnings as the terminal shows them: those that say the same thing about several courses
/// or strings on one line (see [`grouping`](super::grouping)); a danger never shares a line with
/// a different figure.
pub fn grouped_warnings(warnings: &[Warning]) -> Vec<super::grouping::Line> {
    let keys: Vec<String> = warnings
        .iter()
        .map(|w| format!("{} {}", w.kind.name(), severity_flag(w.severity)))
        .collect();
    let items: Vec<super::grouping::Item<'_>> = warnings
        .iter()
        .zip(&keys)
        .map(|(warning, key)| super::grouping::Item {
            key,
            ranges: warning.severity < Severity::Danger,
            message: &warning.message,
            course: warning.course,
            string: warning.string,
        })
        .collect();
    super::grouping::group(&items)
}

/// The safety cautions a report shows when any warning is a caution or a danger.
pub fn cautions_for(warnings: &[Warning]) -> &'static [&'static str] {
    if warnings.iter().any(|w| w.severity >= Severity::Caution) {
        &SAFETY_CAUTIONS
    } else {
        &[]
    }
}
