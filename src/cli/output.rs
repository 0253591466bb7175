//! Output shared by every subcommand: the `--format` and `--output` options, atomic file
//! writing, quiet broken pipes, and the error message plus exit code at the end of a run.

use std::fs::{self, OpenOptions};
use std::io::{self, ErrorKind, Write};
use std::path::{Path, PathBuf};
use std::process::ExitCode;

use clap::{Args, ValueEnum};
use serde::Serialize;

use taut::error::{Error, Result};
use taut::input::units::{ForceUnit, LengthUnit};

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
    /// Write the report to FILE instead of standard output. The file is written whole or not at
    /// all: on any error an existing FILE is left as it was.
    #[arg(long, short = 'o', value_name = "FILE")]
    pub output: Option<PathBuf>,
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

impl UnitArgs {
    /// The units chosen.
    pub fn units(&self) -> (ForceUnit, LengthUnit) {
        (
            match self.force_unit {
                ForceChoice::N => ForceUnit::N,
                ForceChoice::Lbf => ForceUnit::Lbf,
                ForceChoice::Kgf => ForceUnit::Kgf,
            },
            match self.length_unit {
                LengthChoice::Mm => LengthUnit::Mm,
                LengthChoice::In => LengthUnit::In,
                LengthChoice::M => LengthUnit::M,
            },
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
    /// The report as CSV rows.
    fn csv(&self) -> Result<String>;
}

/// Rounds to 6 significant digits, so CSV shows `0.6477` and not `0.6476999999999999`.
pub fn sig(value: f64) -> f64 {
    if value == 0.0 || !value.is_finite() {
        return value;
    }
    format!("{value:.5e}").parse().unwrap_or(value)
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

/// The report in the chosen format, as text ending in a newline.
pub fn render<R: Render>(
    report: &R,
    args: &OutputArgs,
    units: Option<&UnitArgs>,
) -> Result<String> {
    let mut text = match args.format {
        Format::Table => report.table(&View::new(args, units)),
        Format::Json => serde_json::to_string_pretty(report).map_err(|err| Error::Write {
            path: PathBuf::from("JSON"),
            source: io::Error::other(err),
        })?,
        Format::Csv => report.csv()?,
        Format::Yaml => taut::input::yaml::to_text(report)?,
    };
    if !text.ends_with('\n') {
        text.push('\n');
    }
    Ok(text)
}

/// Renders `report` in the chosen format and writes it to the chosen place.
pub fn emit<R: Render>(report: &R, args: &OutputArgs, units: Option<&UnitArgs>) -> Result<()> {
    let text = render(report, args, units)?;
    match &args.output {
        Some(path) => write_atomically(path, text.as_bytes()),
        None => write_stdout(text.as_bytes()),
    }
}

/// Writes to standard output; a reader that stopped early (`taut … | head`) is not an error.
pub fn write_stdout(bytes: &[u8]) -> Result<()> {
    let mut stdout = io::stdout().lock();
    match stdout.write_all(bytes).and_then(|()| stdout.flush()) {
        Ok(()) => Ok(()),
        Err(err) if err.kind() == ErrorKind::BrokenPipe => Ok(()),
        Err(source) => Err(Error::Write {
            path: PathBuf::from("standard output"),
            source,
        }),
    }
}

/// Writes `bytes` to `path` through a temporary file in the same folder and a rename, so the
/// file appears whole or not at all, and an existing file is replaced only on success.
pub fn write_atomically(path: &Path, bytes: &[u8]) -> Result<()> {
    let fail = |source: io::Error| Error::Write {
        path: path.to_path_buf(),
        source,
    };
    if path.is_dir() {
        return Err(fail(io::Error::other("it is a folder")));
    }
    let file_name = path
        .file_name()
        .ok_or_else(|| fail(io::Error::other("the path names no file")))?;
    let folder = match path.parent() {
        Some(parent) if !parent.as_os_str().is_empty() => parent,
        _ => Path::new("."),
    };
    for attempt in 0..100 {
        let temporary = folder.join(format!(
            ".{}.{}-{attempt}.taut-partial",
            file_name.to_string_lossy(),
            std::process::id()
        ));
        let mut file = match OpenOptions::new()
            .write(true)
            .create_new(true)
            .open(&temporary)
        {
            Ok(file) => file,
            Err(err) if err.kind() == ErrorKind::AlreadyExists => continue,
            Err(err) => return Err(fail(err)),
        };
        let written = file
            .write_all(bytes)
            .and_then(|()| file.sync_all())
            .and_then(|()| {
                drop(file);
                fs::rename(&temporary, path)
            });
        return match written {
            Ok(()) => Ok(()),
            Err(err) => {
                // Best effort: the temporary file is ours and must not be left behind.
                let _ = fs::remove_file(&temporary);
                Err(fail(err))
            }
        };
    }
    Err(fail(io::Error::other(
        "could not create a temporary file beside it",
    )))
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
    fn replaces_a_file_whole_and_leaves_no_temporary_file() {
        let folder = tempfile::tempdir().unwrap();
        let path = folder.path().join("report.json");
        fs::write(&path, "old").unwrap();
        write_atomically(&path, b"new contents").unwrap();
        assert_eq!(fs::read_to_string(&path).unwrap(), "new contents");
        let names: Vec<_> = fs::read_dir(folder.path()).unwrap().collect();
        assert_eq!(names.len(), 1);
    }

    #[test]
    fn refuses_a_folder_and_a_missing_folder_without_leaving_anything() {
        let folder = tempfile::tempdir().unwrap();
        assert!(write_atomically(folder.path(), b"x").is_err());
        let missing = folder.path().join("no/such/folder/out.txt");
        let err = write_atomically(&missing, b"x").unwrap_err();
        assert_eq!(err.exit_code(), taut::error::EXIT_FAILURE);
        assert_eq!(fs::read_dir(folder.path()).unwrap().count(), 0);
    }
}
