//! Output shared by every subcommand: the `--format` and `--output` options, atomic file
//! writing, quiet broken pipes, and the error message plus exit code at the end of a run.

use std::fs::{self, OpenOptions};
use std::io::{self, ErrorKind, Write};
use std::path::{Path, PathBuf};
use std::process::ExitCode;

use clap::{Args, ValueEnum};
use serde::Serialize;

use taut::error::{Error, Result};

/// How a report is written.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum Format {
    /// A table for reading in a terminal.
    Table,
    /// JSON for other programs (numbers unrounded, exact ratios as "p/q" text).
    Json,
    /// CSV: one row per item of the report's main list, columns named as the JSON fields.
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
    /// Write the report to FILE instead of standard output. The file is written whole or not at
    /// all: on any error an existing FILE is left as it was.
    #[arg(long, short = 'o', value_name = "FILE")]
    pub output: Option<PathBuf>,
}

/// A report that renders as a terminal table and serializes as JSON.
pub trait Render: Serialize {
    /// The report as terminal text, ending in a newline.
    fn table(&self) -> String;
}

/// Renders `report` in the chosen format and writes it to the chosen place.
pub fn emit<R: Render>(report: &R, args: &OutputArgs) -> Result<()> {
    let text = match args.format {
        Format::Table => {
            let mut text = report.table();
            if !text.ends_with('\n') {
                text.push('\n');
            }
            text
        }
        Format::Json => {
            let mut text = serde_json::to_string_pretty(report).map_err(|err| Error::Write {
                path: PathBuf::from("JSON"),
                source: io::Error::other(err),
            })?;
            text.push('\n');
            text
        }
        Format::Csv => taut::charts::records::csv(report)?,
        Format::Yaml => taut::input::yaml::to_text(report)?,
    };
    match &args.output {
        Some(path) => write_atomically(path, text.as_bytes()),
        None if args.format == Format::Table => {
            write_stdout(super::text::for_terminal(text).as_bytes())
        }
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
