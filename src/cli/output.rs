//! Output shared by every subcommand: the `--format` and `--output` options, the guard that no
//! report holds a number that is not finite, and the one writer of every file and of standard
//! output (see [`files`]), plus the error message and exit code at the end of a run.

mod files;
mod partial;

use std::borrow::Cow;
use std::io::{self, Write};
use std::process::ExitCode;

use clap::{Args, ValueEnum};
use serde::Serialize;

use taut::error::{shown, Error, Result};
use taut::input::units::{ForceUnit, LengthUnit};

pub use files::{note_standard_output, write_bytes, Inputs, Outputs, Target, STANDARD_OUTPUT_ONLY};
pub use partial::watch_signals;
pub use taut::error::check_finite;

/// How a report is written.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum Format {
    /// A table for reading in a terminal, fitted to its width.
    Table,
    /// JSON for other programs (SI units named in each field, numbers unrounded, exact ratios
    /// as "p/q" text).
    Json,
    /// One CSV row per string (or degree, interval, pitch), the JSON field names as headers,
    /// numbers to 6 significant digits.
    Csv,
    /// The JSON document's fields as YAML.
    Yaml,
}

/// Units a tension can be shown in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum ForceChoice {
    /// Newtons.
    N,
    /// Pound-force.
    Lbf,
    /// Kilogram-force.
    Kgf,
}

/// Units a length or diameter can be shown in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum LengthChoice {
    /// Millimetres.
    Mm,
    /// Inches (diameters in thousandths of an inch).
    In,
    /// Metres (diameters in millimetres).
    M,
}

/// The output options every report-writing subcommand takes.
#[derive(Debug, Clone, Args)]
pub struct OutputArgs {
    /// Output format.
    #[arg(long, value_enum, default_value_t = Format::Table)]
    pub format: Format,
    /// Write the report to FILE instead of standard output (`-` is standard output). A file is
    /// written whole or not at all, never over one of the command's own inputs; see `taut help output-files`.
    #[arg(long, short = 'o', value_name = "FILE")]
    pub output: Option<Target>,
    /// Show every column (a detail view); the default view is compact and fits 80 columns.
    /// Tables never grow wider than the terminal (`COLUMNS`, else 100 when not a terminal).
    #[arg(long)]
    pub wide: bool,
}

/// The unit options of the string reports (plan, audit, convert, lengths).
#[derive(Debug, Clone, Args)]
pub struct UnitArgs {
    /// Show tensions and loads in this unit (JSON, CSV and YAML stay in newtons).
    #[arg(long, value_enum, default_value = "n", value_name = "UNIT")]
    pub force_unit: ForceChoice,
    /// Show lengths in this unit, and diameters in mm (or thousandths of an inch for `in`).
    #[arg(long, value_enum, default_value = "mm", value_name = "UNIT")]
    pub length_unit: LengthChoice,
}

impl LengthChoice {
    /// The unit chosen.
    pub fn unit(self) -> LengthUnit {
        match self {
            LengthChoice::Mm => LengthUnit::Mm,
            LengthChoice::In => LengthUnit::In,
            LengthChoice::M => LengthUnit::M,
        }
    }
}

impl UnitArgs {
    /// The units chosen.
    pub fn units(&self) -> (ForceUnit, LengthUnit) {
        (
            match self.force_unit {
                ForceChoice::N => ForceUnit::N,
                ForceChoice::Lbf => ForceUnit::Lbf,
                ForceChoice::Kgf => ForceUnit::Kgf,
            },
            self.length_unit.unit(),
        )
    }
}

/// How a table is laid out: width, detail and units.
#[derive(Debug, Clone, Copy)]
pub struct View {
    /// Widest line allowed.
    pub width: usize,
    /// Every column, not only the compact set.
    pub wide: bool,
    /// Unit of tensions and loads.
    pub force: ForceUnit,
    /// Unit of lengths (and, through it, of diameters).
    pub length: LengthUnit,
}

impl View {
    /// The view for these options (units default to N and mm for reports without them).
    pub fn new(args: &OutputArgs, units: Option<&UnitArgs>) -> Self {
        let (force, length) = units.map_or((ForceUnit::N, LengthUnit::Mm), UnitArgs::units);
        View {
            width: crate::cli::layout::width(),
            wide: args.wide,
            force,
            length,
        }
    }
}

/// A report that renders as a terminal table and as CSV, and serializes as JSON and YAML.
pub trait Render: Serialize {
    /// The report as terminal text, ending in a newline.
    fn table(&self, view: &View) -> String;
    /// The report as CSV rows: by default one row per item of its main list, columns named by
    /// their JSON paths.
    fn csv(&self) -> Result<String>
    where
        Self: Sized,
    {
        taut::charts::records::csv(self)
    }
}

/// Rounds to 6 significant digits, so CSV shows `0.6477` and not `0.6476999999999999`.
pub fn sig(value: f64) -> f64 {
    taut::charts::records::significant(value)
}

/// Rounds an optional figure to 6 significant digits.
pub fn sig_opt(value: Option<f64>) -> Option<f64> {
    value.map(sig)
}

/// Writes `rows` as CSV with their field names as the header.
pub fn csv_text<T: Serialize>(rows: impl IntoIterator<Item = T>) -> Result<String> {
    let fail = |err: String| Error::input(format!("cannot write the report as CSV: {err}"));
    let mut writer = csv::Writer::from_writer(Vec::new());
    for row in rows {
        writer.serialize(row).map_err(|err| fail(err.to_string()))?;
    }
    let bytes = writer.into_inner().map_err(|err| fail(err.to_string()))?;
    String::from_utf8(bytes).map_err(|err| fail(err.to_string()))
}

/// A CSV export made safe to open in a spreadsheet: every cell that a spreadsheet would run as
/// a formula gets a leading `'` (see [`taut::charts::records::safe_cell`]). Every CSV taut writes
/// passes through here.
pub fn safe_csv(text: &str) -> Result<String> {
    taut::charts::records::guarded(text)
}

/// Renders `report` in the chosen format, as text ending in a newline; the numbers are checked
/// first (see [`check_finite`]).
pub fn render<R: Render>(
    report: &R,
    args: &OutputArgs,
    units: Option<&UnitArgs>,
) -> Result<String> {
    check_finite(report)?;
    let mut text = match args.format {
        Format::Table => terminal_text(report.table(&View::new(args, units))),
        Format::Json => json_text(report)?,
        Format::Csv => safe_csv(&report.csv()?)?,
        Format::Yaml => taut::input::yaml::to_text(report)?,
    };
    if !text.ends_with('\n') {
        text.push('\n');
    }
    Ok(text)
}

/// Renders `report` in the chosen format and writes it to the chosen place, refusing to write
/// over any of `inputs`.
pub fn emit<R: Render>(report: &R, args: &OutputArgs, inputs: &Inputs) -> Result<()> {
    emit_in(report, args, None, inputs)
}

/// [`emit`] for a report shown in the chosen units.
pub fn emit_in<R: Render>(
    report: &R,
    args: &OutputArgs,
    units: Option<&UnitArgs>,
    inputs: &Inputs,
) -> Result<()> {
    let text = report_text(report, args, units)?;
    // The text moves into the writer: a 25 MB report is not copied.
    write_bytes("--output", args.output.as_ref(), text.into_bytes(), inputs)
}

/// [`render`], with the status marks of a table coloured when it goes to a terminal.
pub fn report_text<R: Render>(
    report: &R,
    args: &OutputArgs,
    units: Option<&UnitArgs>,
) -> Result<String> {
    let text = render(report, args, units)?;
    Ok(if args.output.is_none() && args.format == Format::Table {
        super::text::for_terminal(text)
    } else {
        text
    })
}

/// Pretty JSON ending in a newline.
pub fn json_text<T: Serialize + ?Sized>(value: &T) -> Result<String> {
    let mut text = serde_json::to_string_pretty(value).map_err(|err| Error::Write {
        path: "JSON".into(),
        source: io::Error::other(err),
    })?;
    text.push('\n');
    Ok(text)
}

/// A table report made safe for a terminal: ends in a newline, and any control character other
/// than the line breaks the table is made of is shown escaped (renderers escape the user's text
/// cell by cell already; this is the last guard).
pub fn terminal_text(mut text: String) -> String {
    // Nearly every report has nothing to escape: it is kept as it is, without a copy.
    let clean = text
        .split('\n')
        .all(|line| matches!(shown(line), Cow::Borrowed(_)));
    if !clean {
        let mut escaped = String::with_capacity(text.len() + 64);
        for (index, line) in text.split('\n').enumerate() {
            if index > 0 {
                escaped.push('\n');
            }
            escaped.push_str(&shown(line));
        }
        text = escaped;
    }
    if !text.is_empty() && !text.ends_with('\n') {
        text.push('\n');
    }
    text
}

/// Prints an error (if any) and turns the run's result into the process exit code.
pub fn finish(result: Result<()>) -> ExitCode {
    match result {
        Ok(()) => ExitCode::SUCCESS,
        Err(error) => {
            // If standard error is gone too, the exit code still tells.
            let _ = writeln!(io::stderr(), "error: {error}");
            ExitCode::from(error.exit_code())
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn terminal_text_escapes_controls_but_keeps_lines() {
        let text = terminal_text("a\u{1b}[31mb\nc\u{7}".to_string());
        assert_eq!(text, "a\\u{1b}[31mb\nc\\u{7}\n");
        assert_eq!(terminal_text("x\n".to_string()), "x\n");
        assert_eq!(terminal_text(String::new()), "");
        assert_eq!(terminal_text("\n\n".to_string()), "\n\n");
        assert_eq!(terminal_text("a\r\n\tb".to_string()), "a\\r\n\\tb\n");
        assert_eq!(
            terminal_text("─ ▰▱ … é\u{202e}".to_string()),
            "─ ▰▱ … é\\u{202e}\n"
        );
    }
}
