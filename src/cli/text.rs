//! Pieces of terminal output shared by every command: quantities in the chosen units, pitch
//! labels, the status word and stress bar of a string, the gauge line of a set, the warnings
//! list and the safety cautions, all wrapped to the report's width.

use taut::input::units::{ForceUnit, LengthUnit, METRES_PER_INCH};
use taut::plan::remedy::Build;
use taut::plan::warning::{Severity, Warning, SAFETY_CAUTIONS, SAFETY_REMINDER};
use taut::plan::CoursePitch;
use taut::strings::kind::KindBuild;
use taut::strings::stock::Stock;

use super::layout::{paragraph, wrap};
use super::output::View;

/// An optional figure as text, `-` when unknown.
pub fn maybe(value: Option<f64>, render: impl Fn(f64) -> String) -> String {
    value.map_or_else(|| "-".to_string(), render)
}

/// A force in the chosen unit, without its symbol (the column header names it).
pub fn force(newtons: f64, unit: ForceUnit) -> String {
    format!("{:.1}", unit.from_newtons(newtons))
}

/// A force in the chosen unit, with its symbol.
pub fn force_with_unit(newtons: f64, unit: ForceUnit) -> String {
    format!("{} {}", force(newtons, unit), unit.symbol())
}

/// A vibrating length in the chosen unit, without its symbol.
pub fn length(metres: f64, unit: LengthUnit) -> String {
    match unit {
        LengthUnit::Mm => format!("{:.1}", unit.from_metres(metres)),
        LengthUnit::In => format!("{:.2}", unit.from_metres(metres)),
        LengthUnit::M => format!("{:.4}", unit.from_metres(metres)),
    }
}

/// The symbol of the diameter unit that goes with a length unit: thousandths of an inch with
/// inches, millimetres otherwise.
pub fn diameter_symbol(unit: LengthUnit) -> &'static str {
    match unit {
        LengthUnit::In => "in/1000",
        _ => "mm",
    }
}

/// A diameter in the unit that goes with the length unit (see [`diameter_symbol`]).
pub fn diameter(mm: f64, unit: LengthUnit) -> String {
    match unit {
        LengthUnit::In => {
            let thousandths = mm / 1000.0 / METRES_PER_INCH * 1000.0;
            if (thousandths - thousandths.round()).abs() < 0.05 {
                format!("{thousandths:.0}")
            } else {
                format!("{thousandths:.1}")
            }
        }
        _ => format!("{mm:.2}"),
    }
}

/// A signed percentage change with no "-0%": a change that rounds to zero is `0%`.
pub fn change(percent: f64, decimals: usize) -> String {
    let text = format!("{percent:+.decimals$}%");
    let zero = format!("{:.decimals$}", 0.0);
    if text[1..text.len() - 1] == zero {
        format!("{zero}%")
    } else {
        text
    }
}

/// A pitch as written, followed by the nearest 12-EDO note's offset when that adds something:
/// `~E4 -5.3c`, `A2`, `3/4 E4+2.0c`.
pub fn pitch_with_note(label: &str, note_name: &str, note_offset_cents: f64) -> String {
    let offset = if note_offset_cents.abs() < 0.05 || !note_offset_cents.is_finite() {
        String::new()
    } else {
        format!("{note_offset_cents:+.1}c")
    };
    let bare = label.trim_start_matches('~');
    if bare == note_name {
        if offset.is_empty() {
            label.to_string()
        } else {
            format!("{label} {offset}")
        }
    } else {
        format!("{label} {note_name}{offset}")
    }
}

/// A course's pitch as written, with the nearest 12-EDO note when that adds something.
pub fn course_pitch_text(pitch: &CoursePitch) -> String {
    pitch_with_note(&pitch.label, &pitch.note_name, pitch.note_offset_cents)
}

/// The status word that leads a string's row: the worst of its warnings, with the warnings
/// that mean no catalog string lands where it should read as "no fit".
pub fn status<'a>(warnings: impl IntoIterator<Item = &'a Warning>) -> &'static str {
    use taut::plan::warning::WarningKind::{OffTarget, ThickerThanCatalog, ThinnerThanPractical};
    let mut worst: Option<Severity> = None;
    let mut no_fit = false;
    for warning in warnings {
        worst = worst.max(Some(warning.severity));
        no_fit |= matches!(
            warning.kind,
            OffTarget | ThickerThanCatalog | ThinnerThanPractical
        );
    }
    match (worst, no_fit) {
        (Some(Severity::Danger), _) => "DANGER",
        (_, true) => "no fit",
        (Some(Severity::Caution), _) => "caution",
        (Some(Severity::Note), _) => "note",
        (None, _) => "ok",
    }
}

/// Cells in a stress bar.
const BAR_CELLS: usize = 8;

/// Stress against breaking strength as a small bar and a percentage: `▰▰▰▰▱▱▱▱   53%`. The
/// bar is full at 100 %; a stress past the danger limit ends in `!`. The percentage gets a
/// decimal when rounding would make it read as one of the limits it is above.
pub fn stress_bar(ratio: Option<f64>, caution: f64, danger: f64) -> String {
    let Some(ratio) = ratio.filter(|r| r.is_finite()) else {
        return "strength ?".to_string();
    };
    let filled = ((ratio * BAR_CELLS as f64).round() as usize).min(BAR_CELLS);
    let mark = if ratio > danger { '!' } else { ' ' };
    format!(
        "{}{}{mark}{:>5}",
        "▰".repeat(filled),
        "▱".repeat(BAR_CELLS - filled),
        taut::plan::warning::percent_beside(ratio, [caution, danger])
    )
}

/// The gauges of a set on one line, course by course in the table's order, `w` marking wound
/// strings and `+` joining the strings of one course: `10 13 17 26w 36w 46w`.
pub fn gauge_line(courses: &[Vec<(f64, bool)>], unit: LengthUnit) -> String {
    let courses: Vec<String> = courses
        .iter()
        .map(|strings| {
            strings
                .iter()
                .map(|&(mm, wound)| {
                    format!("{}{}", diameter(mm, unit), if wound { "w" } else { "" })
                })
                .collect::<Vec<_>>()
                .join("+")
        })
        .collect();
    format!(
        "Gauges ({}, w = wound): {}",
        diameter_symbol(unit),
        courses.join(" ")
    )
}

/// How a kind is built, from its id in the stock.
pub fn build_of_kind(stock: &Stock, id: &str) -> Build {
    match stock.kinds().get(id).map(|kind| &kind.build) {
        Ok(KindBuild::Plain { .. }) => Build::Plain,
        Ok(KindBuild::Wound { .. }) => Build::Wound,
        _ => Build::Unknown,
    }
}

/// The short tag shown for a severity.
pub fn severity_flag(severity: Severity) -> &'static str {
    match severity {
        Severity::Danger => "DANGER",
        Severity::Caution => "caution",
        Severity::Note => "note",
    }
}

/// The warnings list (with any report-wide cautions first) and the safety cautions (the full
/// list when given, else the one-line reminder), wrapped to the view's width.
pub fn warnings_and_cautions(
    warnings: &[Warning],
    extra_cautions: &[String],
    cautions: &[impl AsRef<str>],
    view: &View,
) -> String {
    let mut out = String::new();
    let count = warnings.len() + extra_cautions.len();
    if count == 0 {
        out.push_str("No warnings.\n");
    } else {
        out.push_str(&format!("\nWarnings ({count}):\n"));
        for caution in extra_cautions {
            out.push_str(&wrap(caution, view.width, "  caution  ", "           "));
        }
        for warning in warnings {
            let first = format!("  {:<7}  ", severity_flag(warning.severity));
            let text = if view.wide {
                format!("{} [{}]", warning.message, warning.kind.name())
            } else {
                warning.message.clone()
            };
            out.push_str(&wrap(&text, view.width, &first, "           "));
        }
    }
    if cautions.is_empty() {
        out.push_str(&paragraph(SAFETY_REMINDER, view.width));
    } else {
        out.push_str("\nBefore you string this up:\n");
        for caution in cautions {
            out.push_str(&wrap(caution.as_ref(), view.width, "  - ", "    "));
        }
    }
    out
}

/// The safety cautions a report shows when any warning is a caution or a danger.
pub fn cautions_for(warnings: &[Warning]) -> &'static [&'static str] {
    if warnings.iter().any(|w| w.severity >= Severity::Caution) {
        &SAFETY_CAUTIONS
    } else {
        &[]
    }
}

/// The footnote explaining the stiffness and feel columns (wide views only).
pub fn feel_legend(bend_cents: f64, view: &View) -> String {
    paragraph(
        &format!(
            "B: Fletcher's inharmonicity coefficient (core diameter for wound strings). Partials: cents that partials 2/4/8 sit above 2, 4 and 8 times the sounding fundamental. Bend: sideways force at mid-length for a {bend_cents:.0}-cent rise."
        ),
        view.width,
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn pitch_labels_show_the_note_only_when_it_adds_something() {
        assert_eq!(pitch_with_note("A2", "A2", 0.0), "A2");
        assert_eq!(pitch_with_note("~E4", "E4", -5.26), "~E4 -5.3c");
        assert_eq!(pitch_with_note("~A2", "A2", 0.01), "~A2");
        assert_eq!(pitch_with_note("3/4", "E4", 1.96), "3/4 E4+2.0c");
    }

    #[test]
    fn a_change_that_rounds_to_zero_has_no_sign() {
        assert_eq!(change(-0.3, 0), "0%");
        assert_eq!(change(0.04, 1), "0.0%");
        assert_eq!(change(-1.6, 0), "-2%");
        assert_eq!(change(38.2, 0), "+38%");
    }

    #[test]
    fn the_stress_bar_fills_with_the_stress() {
        assert_eq!(stress_bar(Some(0.5), 0.65, 0.85), "▰▰▰▰▱▱▱▱   50%");
        assert!(stress_bar(Some(0.9), 0.65, 0.85).contains('!'));
        assert_eq!(stress_bar(Some(1.4), 0.65, 0.85), "▰▰▰▰▰▰▰▰! 140%");
        // Just above the caution limit reads as above it, not as the limit itself.
        assert!(stress_bar(Some(0.652), 0.65, 0.85).ends_with("65.2%"));
    }

    #[test]
    fn diameters_follow_the_length_unit() {
        assert_eq!(diameter(0.254, LengthUnit::In), "10");
        assert_eq!(diameter(0.3429, LengthUnit::In), "13.5");
        assert_eq!(diameter(0.254, LengthUnit::Mm), "0.25");
    }
}
