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
        for line in grouped_warnings(warnings, view) {
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
pub fn grouped_warnings(warnings: &[Warning], view: &View) -> Vec<super::grouping::Line> {
    let texts: Vec<std::borrow::Cow<'_, str>> =
        warnings.iter().map(|w| in_length_unit(w, view)).collect();
    let keys: Vec<String> = warnings
        .iter()
        .map(|w| format!("{} {}", w.kind.name(), severity_flag(w.severity)))
        .collect();
    let items: Vec<super::grouping::Item<'_>> = warnings
        .iter()
        .zip(&keys)
        .zip(&texts)
        .map(|((warning, key), text)| super::grouping::Item {
            key,
            ranges: warning.severity < Severity::Danger,
            message: text,
            course: warning.course,
            string: warning.string,
        })
        .collect();
    super::grouping::group(&items)
}

/// A warning's sentence with its string widths in the report's unit: the library writes them
/// in mm; with `--length-unit in` a conversion's slot note gives them in inches, as the set's
/// gauges are written.
fn in_length_unit<'w>(warning: &'w Warning, view: &View) -> std::borrow::Cow<'w, str> {
    use taut::plan::warning::WarningKind;
    if view.length != LengthUnit::In || warning.kind != WarningKind::WiderThanSlot {
        return std::borrow::Cow::Borrowed(&warning.message);
    }
    // Each `0.076 mm` (three decimals, as the library writes a width) becomes `0.0030 in`.
    let mut out = String::with_capacity(warning.message.len() + 8);
    let mut rest = warning.message.as_str();
    while let Some(at) = rest.find(" mm") {
        let before = &rest[..at];
        let start = before
            .rfind(|c: char| !(c.is_ascii_digit() || c == '.'))
            .map_or(0, |i| i + 1);
        match before[start..].parse::<f64>() {
            Ok(mm) if before[start..].contains('.') => {
                out.push_str(&before[..start]);
                push_fixed(&mut out, mm / 1000.0 / METRES_PER_INCH, 4);
                out.push_str(" in");
            }
            _ => {
                out.push_str(before);
                out.push_str(" mm");
            }
        }
        rest = &rest[at + 3..];
    }
    out.push_str(rest);
    std::borrow::Cow::Owned(out)
}

/// The safety cautions a report shows when any warning is a caution or a danger.
pub fn cautions_for(warnings: &[Warning]) -> &'static [&'static str] {
    if warnings.iter().any(|w| w.severity >= Severity::Caution) {
        &SAFETY_CAUTIONS
    } else {
        &[]
    }
}
