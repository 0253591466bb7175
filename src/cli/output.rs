//! Output shared by every subcommand: the `--format` and `--output` options, the guard that no
//! report holds a number that is not finite, and the one writer of every file and of standard
//! output (see [`files`]), plus the error message and exit code at the end of a run.

mod files;
mod finite;

use std::io::{self, Write};
use std::process::ExitCode;

use clap::{Args, ValueEnum};
use serde::Serialize;

use taut::error::{shown, Error, Result};

pub use files::{note_standard_output, write_bytes, Inputs, Outputs, Target};
pub use finite::check_finite;

/// How a report is written.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum Format {
    /// A table for reading in a terminal.
    Table,
    /// JSON for other programs (numbers unrounded, exact ratios as "p/q" text).
    Json,
    /// CSV: one row per item of the report's main list, columns named by their JSON paths.
    Csv,
    /// The JSON document's fields as YAML.
    Yaml,
}

/// The output options every report-writing subcommand takes.
#[derive(Debug, Clone, Args)]
pub struct OutputArgs {
    /// Output format.
    #[arg(long, value_enum, default_value_t = Format::Table)]
    pub format: Format,
    /// Write the report to FILE instead of standard output (`-` is standard output). A file is
    /// written whole or not at all, never over one of the command's own inputs; see README.
    #[arg(long, short = 'o', value_name = "FILE")]
    pub output: Option<Target>,
}

/// A report that renders as a terminal table and serializes as JSON.
pub trait Render: Serialize {
    /// The report as terminal text, ending in a newline.
    fn table(&self) -> String;
}

/// Renders `report` in the chosen format; the numbers are checked first (see [`check_finite`]).
pub fn render<R: Render>(report: &R, format: Format) -> Result<String> {
    check_finite(report)?;
    Ok(match format {
        Format::Table => terminal_text(report.table()),
        Format::Json => json_text(report)?,
        Format::Csv => taut::charts::records::csv(report)?,
        Format::Yaml => taut::input::yaml::to_text(report)?,
    })
}

/// Renders `report` in the chosen format and writes it to the chosen place, refusing to write
/// over any of `inputs`.
pub fn emit<R: Render>(report: &R, args: &OutputArgs, inputs: &Inputs) -> Result<()> {
    let text = report_text(report, args)?;
    // The text moves into the writer: a 25 MB report is not copied.
    write_bytes("--output", args.output.as_ref(), text.into_bytes(), inputs)
}

/// [`render`], with the status marks of a table coloured when it goes to a terminal.
pub fn report_text<R: Render>(report: &R, args: &OutputArgs) -> Result<String> {
    let text = render(report, args.format)?;
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
pub fn terminal_text(text: String) -> String {
    let mut lines: Vec<String> = text.split('\n').map(|l| shown(l).into_owned()).collect();
    if lines.last().is_some_and(|l| !l.is_empty()) {
        lines.push(String::new());
    }
    lines.join("\n")
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
    }
}
