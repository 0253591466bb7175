//! Pieces of terminal output shared by every command: quantities in the chosen units, pitch
//! labels, the status word and stress bar of a string, the gauge line of a set, the warnings
//! list and the safety cautions, all wrapped to the report's width, and the colours of status
//! marks.

use std::fmt::Write as _;

use taut::error::shown;
use taut::input::units::{ForceUnit, LengthUnit, METRES_PER_INCH};
use taut::plan::remedy::Build;
use taut::plan::warning::{Severity, Warning, SAFETY_CAUTIONS, SAFETY_REMINDER};
use taut::plan::CoursePitch;
use taut::strings::kind::KindBuild;
use taut::strings::stock::Stock;

/// The user's text (a name, a description) for a line of a report, control characters escaped.
pub fn user(text: &str) -> std::borrow::Cow<'_, str> {
    shown(text)
}

use super::layout::{paragraph, wrap_into, Column, Give};
use super::output::View;

mod colour;
pub mod grouping;
mod string_report;
mod warnings;
#[allow(unused_imports)]
use colour::*;
pub use colour::*;
pub use string_report::*;
pub use taut::input::units::fixed;
use taut::input::units::{push_fixed, push_signed_fixed};
pub use warnings::*;
#[cfg(test)]
mod tests;

/// The word for `count` things: `one` for exactly one, else `many` ("1 string", "6 strings").
pub fn plural(count: usize, one: &'static str, many: &'static str) -> &'static str {
    if count == 1 {
        one
    } else {
        many
    }
}

/// An optional figure as text, `-` when unknown.
pub fn maybe(value: Option<f64>, render: impl Fn(f64) -> String) -> String {
    value.map_or_else(|| "-".to_string(), render)
}

/// A force in the chosen unit, without its symbol (the column header names it).
pub fn force(newtons: f64, unit: ForceUnit) -> String {
    fixed(unit.from_newtons(newtons), 1)
}

/// A force in the chosen unit, with its symbol.
pub fn force_with_unit(newtons: f64, unit: ForceUnit) -> String {
    format!("{} {}", force(newtons, unit), unit.symbol())
}

/// A vibrating length in the chosen unit, without its symbol.
pub fn length(metres: f64, unit: LengthUnit) -> String {
    let decimals = match unit {
        LengthUnit::Mm => 1,
        LengthUnit::In => 2,
        LengthUnit::M => 4,
    };
    fixed(unit.from_metres(metres), decimals)
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
    let mut text = String::with_capacity(8);
    push_diameter(&mut text, mm, unit);
    text
}

/// [`diameter`], appended to `out`.
fn push_diameter(out: &mut String, mm: f64, unit: LengthUnit) {
    match unit {
        LengthUnit::In => {
            let thousandths = mm / 1000.0 / METRES_PER_INCH * 1000.0;
            if (thousandths - thousandths.round()).abs() < 0.05 {
                push_fixed(out, thousandths, 0);
            } else {
                push_fixed(out, thousandths, 1);
            }
        }
        _ => push_fixed(out, mm, 3),
    }
}

/// A total load as a share of the maker's rated load: `56% of the rated 800.0 N`.
pub fn share_of_rated(total_n: f64, rated_n: f64, unit: ForceUnit) -> String {
    format!(
        "{:.0}% of the rated {}",
        total_n / rated_n * 100.0,
        force_with_unit(rated_n, unit)
    )
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
    let shows_offset = note_offset_cents.abs() >= 0.05 && note_offset_cents.is_finite();
    let names_note = label.trim_start_matches('~') != note_name;
    let mut text = String::with_capacity(label.len() + note_name.len() + 8);
    text.push_str(label);
    if names_note || shows_offset {
        text.push(' ');
    }
    if names_note {
        text.push_str(note_name);
    }
    if shows_offset {
        push_signed_fixed(&mut text, note_offset_cents, 1);
        text.push('c');
    }
    text
}

/// Whether a per-string report shows a length column: in the wide view, or when the courses'
/// lengths differ (a fanned board, a harp).
pub fn shows_length(lengths: impl IntoIterator<Item = f64>, view: &View) -> bool {
    let mut lengths = lengths.into_iter();
    let first = lengths.next();
    view.wide || first.is_some_and(|first| lengths.any(|l| (l - first).abs() > 1e-9))
}

/// Where the leading columns of a per-string report stand in its command's order of giving way
/// (see [`Give`]: the highest rank gives way first).
#[derive(Debug, Clone, Copy)]
pub struct LeadRanks {
    /// The rank at which the Hz column is left out.
    pub hz: u8,
    /// The rank at which the length column is left out.
    pub length: u8,
}

/// The columns a per-string report leads with: the course number, the status word under
/// `status`, the pitch (never shortened: its figures would be cut), Hz, and the length when
/// `show_length`.
pub fn leading_columns(
    status: &str,
    show_length: bool,
    ranks: LeadRanks,
    view: &View,
) -> Vec<Column> {
    let mut columns = vec![
        Column::figure("#"),
        Column::text(status),
        Column::text("pitch"),
        Column::figure("Hz").give(Give::Drop(ranks.hz)),
    ];
    if show_length {
        columns.push(
            Column::figure(&format!("length {}", view.length.symbol()))
                .give(Give::Drop(ranks.length)),
        );
    }
    columns
}

/// A course's pitch as written, with the nearest 12-EDO note when that adds something.
pub fn course_pitch_text(pitch: &CoursePitch) -> String {
    pitch_with_note(&pitch.label, &pitch.note_name, pitch.note_offset_cents)
}

/// The status word that leads a string's row: the worst of its warnings. "no fit" is kept for
/// a string no catalog string brings within the tolerance (`off_target`); the heaviest or
/// lightest gauge of a kind used because the catalog ends there, while the string lands within
/// the tolerance, reads as "heaviest" or "lightest" (when nothing worse is said).
pub fn status<'a>(warnings: impl IntoIterator<Item = &'a Warning>) -> &'static str {
    use taut::plan::warning::WarningKind::{OffTarget, ThickerThanCatalog, ThinnerThanPractical};
    let mut worst: Option<Severity> = None;
    let mut no_fit = false;
    let mut catalog_end = None;
    for warning in warnings {
        worst = worst.max(Some(warning.severity));
        no_fit |= warning.kind == OffTarget;
        match warning.kind {
            ThickerThanCatalog => catalog_end = Some("heaviest"),
            ThinnerThanPractical => catalog_end = Some("lightest"),
            _ => {}
        }
    }
    match (worst, no_fit, catalog_end) {
        (Some(Severity::Danger), _, _) => "DANGER",
        (_, true, _) => "no fit",
        (Some(Severity::Caution), _, _) => "caution",
        (_, _, Some(word)) => word,
        (Some(Severity::Note), _, _) => "note",
        (None, _, _) => "ok",
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
    // Each cell of the bar takes three bytes.
    let mut bar = String::with_capacity(3 * BAR_CELLS + 8);
    bar.extend(std::iter::repeat_n('▰', filled));
    bar.extend(std::iter::repeat_n('▱', BAR_CELLS - filled));
    bar.push(mark);
    // Writing to a String cannot fail.
    let _ = write!(
        bar,
        "{:>5}",
        taut::plan::warning::percent_beside(ratio, [caution, danger])
    );
    bar
}

/// The gauges of a set on one line, course by course in the table's order, `w` marking wound
/// strings and `+` joining the strings of one course: `10 13 17 26w 36w 46w`.
pub fn gauge_line(courses: &[Vec<(f64, bool)>], unit: LengthUnit) -> String {
    let mut line = String::with_capacity(32 + 8 * courses.len());
    line.push_str("Gauges (");
    line.push_str(diameter_symbol(unit));
    line.push_str(", w = wound): ");
    for (index, strings) in courses.iter().enumerate() {
        if index > 0 {
            line.push(' ');
        }
        for (position, &(mm, wound)) in strings.iter().enumerate() {
            if position > 0 {
                line.push('+');
            }
            push_diameter(&mut line, mm, unit);
            if wound {
                line.push('w');
            }
        }
    }
    line
}

/// How a kind is built, from its id in the stock.
pub fn build_of_kind(stock: &Stock, id: &str) -> Build {
    match stock.kinds().get(id).map(|kind| &kind.build) {
        Ok(KindBuild::Plain { .. }) => Build::Plain,
        Ok(KindBuild::Wound { .. }) => Build::Wound,
        _ => Build::Unknown,
    }
}

/// The footnote explaining the stiffness and feel columns (wide views only).
pub fn feel_legend(bend_cents: f64, view: &View) -> String {
    paragraph(
        &format!(
            "B: Fletcher's inharmonicity coefficient (core diameter for wound strings). Partials c vs n·f1: cents that partials 2/4/8 sit above 2, 4 and 8 times the sounding fundamental f1 (not the flexible string's f0). Bend: sideways force at mid-length for a {bend_cents:.0}-cent rise."
        ),
        view.width,
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
pub fn side_by_side<T: std::fmt::Display>(
    count: usize,
    max_width: usize,
    build: impl Fn(&[usize]) -> T,
) -> String {
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
        if widest <= max_width.min(MAX_WIDTH) {
            break;
        }
        per_table -= 1;
    }
    all.chunks(even(per_table))
        .map(|shown| format!("{}\n", build(shown).to_string().trim_end()))
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
