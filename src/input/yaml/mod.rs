//! The one place that reads YAML.
//!
//! All of `taut`'s definition files (tunings, instruments, string sets, materials, gauge catalogs)
//! go through [`parse`], so the YAML crate can be swapped here alone. Reading a file goes through
//! [`read_text`], which refuses oversized, binary and non-UTF-8 files with a clear message.
//!
//! Validation belongs in deserialization (`#[serde(try_from = ...)]`, checked newtypes), because
//! that is where the YAML parser still knows the line and column; errors found later can be
//! pointed back at their line with [`locate`].

use std::path::Path;

use serde::de::DeserializeOwned;

use crate::error::{did_you_mean, Error, Result};

mod locate;
#[allow(unused_imports)]
use locate::*;
pub use locate::*;
mod depth;
#[allow(unused_imports)]
use depth::*;
pub use depth::*;
mod diagnose;
#[allow(unused_imports)]
use diagnose::*;
#[cfg(test)]
mod tests;

/// Largest input file `taut` reads, in bytes. Real definition files are a few kilobytes; this
/// bound keeps a mistaken path (a disk image, a log) from eating the machine.
pub const MAX_INPUT_BYTES: u64 = 4 * 1024 * 1024;

/// How an input path is named in messages: `standard input` for `-`, else the path as given.
pub fn origin_of(path: &Path) -> String {
    if path == Path::new("-") {
        "standard input".to_string()
    } else {
        path.display().to_string()
    }
}

/// Whether standard input has been read already (it can be read once per run).
static STANDARD_INPUT_READ: std::sync::atomic::AtomicBool =
    std::sync::atomic::AtomicBool::new(false);

/// Reads standard input (the path `-`) with the same limits as a file.
fn read_standard_input() -> Result<String> {
    use std::io::Read;
    let shown = "standard input";
    if STANDARD_INPUT_READ.swap(true, std::sync::atomic::Ordering::SeqCst) {
        return Err(Error::input(
            "standard input (`-`) is given for two inputs; it can be read only once",
        )
        .in_origin(shown));
    }
    if let Ok(meta) = std::fs::metadata("/dev/stdin") {
        crate::input::opened::note(Path::new(shown), &meta);
    }
    let mut bytes = Vec::new();
    std::io::stdin()
        .lock()
        .take(MAX_INPUT_BYTES + 1)
        .read_to_end(&mut bytes)
        .map_err(|source| Error::Read {
            path: shown.into(),
            source,
        })?;
    if bytes.len() as u64 > MAX_INPUT_BYTES {
        return Err(Error::input(format!(
            "the input goes on past {MAX_INPUT_BYTES} bytes; taut reads definition files of at most {MAX_INPUT_BYTES} bytes"
        ))
        .in_origin(shown));
    }
    text_from_bytes(bytes, shown)
}

/// Reads a UTF-8 text file (`-` is standard input), refusing files that are missing, too large,
/// binary or not UTF-8. A UTF-8 byte-order mark at the start is dropped.
pub fn read_text(path: &Path) -> Result<String> {
    if path == Path::new("-") {
        return read_standard_input();
    }
    let shown = path.display().to_string();
    let metadata = std::fs::metadata(path).map_err(|source| Error::Read {
        path: path.to_path_buf(),
        source,
    })?;
    if metadata.is_dir() {
        return Err(Error::input("this is a folder, not a file").in_origin(shown));
    }
    if metadata.len() > MAX_INPUT_BYTES {
        return Err(Error::input(format!(
            "the file is {} bytes; taut reads definition files of at most {} bytes",
            metadata.len(),
            MAX_INPUT_BYTES
        ))
        .in_origin(shown));
    }
    // Devices and pipes report a length of 0 (`/dev/zero`, `<(cmd)`): read at most one byte past
    // the limit, so an endless stream is refused instead of filling the memory.
    let mut bytes = Vec::new();
    std::fs::File::open(path)
        .and_then(|file| {
            use std::io::Read;
            // Noted before reading: whatever happens next, no output may land on this file.
            if let Ok(meta) = file.metadata() {
                crate::input::opened::note(path, &meta);
            }
            file.take(MAX_INPUT_BYTES + 1).read_to_end(&mut bytes)
        })
        .map_err(|source| Error::Read {
            path: path.to_path_buf(),
            source,
        })?;
    if bytes.len() as u64 > MAX_INPUT_BYTES {
        return Err(Error::input(format!(
            "the input goes on past {MAX_INPUT_BYTES} bytes; taut reads definition files of at most {MAX_INPUT_BYTES} bytes"
        ))
        .in_origin(shown));
    }
    text_from_bytes(bytes, &shown)
}

/// Checks that `bytes` are UTF-8 text without NUL bytes, naming the line of the first bad byte.
pub fn text_from_bytes(bytes: Vec<u8>, origin: &str) -> Result<String> {
    if let Some(offset) = bytes.iter().position(|&b| b == 0) {
        let (line, column) = line_column_of_offset(&bytes, offset);
        return Err(Error::input(
            "this looks like a binary file (it contains a NUL byte), not a YAML text file",
        )
        .at(line, column)
        .in_origin(origin));
    }
    let text = String::from_utf8(bytes).map_err(|err| {
        let offset = err.utf8_error().valid_up_to();
        let (line, column) = line_column_of_offset(err.as_bytes(), offset);
        Error::input("the file is not UTF-8 text")
            .at(line, column)
            .in_origin(origin)
            .help("save the file as UTF-8")
    })?;
    // Some editors start UTF-8 files with a byte-order mark; it is no part of the document.
    Ok(match text.strip_prefix(BYTE_ORDER_MARK) {
        Some(rest) => rest.to_string(),
        None => text,
    })
}

/// `text` as a YAML double-quoted scalar that reads back as the same text: every character
/// YAML does not hold raw (controls, DEL, the C1 controls, U+2028, U+2029, U+FEFF, U+FFFE,
/// U+FFFF) is written as an escape, as are `"` and `\`.
pub fn quoted(text: &str) -> String {
    let mut out = String::with_capacity(text.len() + 2);
    out.push('"');
    for c in text.chars() {
        match c {
            '"' => out.push_str("\\\""),
            '\\' => out.push_str("\\\\"),
            '\n' => out.push_str("\\n"),
            '\t' => out.push_str("\\t"),
            c if c.is_control()
                || matches!(
                    c,
                    '\u{2028}' | '\u{2029}' | BYTE_ORDER_MARK | '\u{fffe}' | '\u{ffff}'
                ) =>
            {
                out.push_str(&format!("\\u{:04X}", u32::from(c)));
            }
            c => out.push(c),
        }
    }
    out.push('"');
    out
}

/// The UTF-8 byte-order mark (U+FEFF) some editors write at the start of a file.
const BYTE_ORDER_MARK: char = '\u{feff}';

fn line_column_of_offset(bytes: &[u8], offset: usize) -> (usize, usize) {
    let before = &bytes[..offset.min(bytes.len())];
    let line = before.iter().filter(|&&b| b == b'\n').count() + 1;
    let line_start = before
        .iter()
        .rposition(|&b| b == b'\n')
        .map_or(0, |p| p + 1);
    (line, offset - line_start + 1)
}

/// Parses one YAML document into `T`, naming `origin` (a path or an option name) in errors,
/// with the line, column and field path of the first problem.
pub fn parse<T: DeserializeOwned>(text: &str, origin: &str) -> Result<T> {
    let text = text.strip_prefix(BYTE_ORDER_MARK).unwrap_or(text);
    if text.trim().is_empty()
        || text
            .lines()
            .all(|l| l.trim().is_empty() || l.trim_start().starts_with('#'))
    {
        return Err(Error::input("the file is empty").in_origin(origin));
    }
    if let Some((line_number, _)) = text
        .lines()
        .enumerate()
        .find(|(_, line)| line.trim() == "---" || line.starts_with("--- "))
        .filter(|(n, _)| {
            // Directives (`%YAML 1.1`) before the first `---` belong to the one document.
            text.lines().take(*n).any(|l| {
                !l.trim().is_empty() && !l.trim_start().starts_with('#') && !l.starts_with('%')
            })
        })
    {
        return Err(
            Error::input("the file holds more than one YAML document; taut reads one")
                .at(line_number + 1, 1)
                .in_origin(origin),
        );
    }
    if let Some(too_deep) = first_too_deep(text) {
        let (message, help) = match too_deep.kind {
            Nesting::Flow => (
                format!("the document nests `[` or `{{` more than {MAX_FLOW_DEPTH} levels deep"),
                "a definition file nests a few levels; check for unclosed brackets",
            ),
            Nesting::Block => (
                format!(
                    "the document nests lists or mappings more than {MAX_BLOCK_DEPTH} levels deep"
                ),
                "a definition file nests a few levels; check the indentation and the `- ` marks",
            ),
        };
        return Err(Error::input(message)
            .at(too_deep.line, too_deep.column)
            .in_origin(origin)
            .help(help));
    }
    // Tracking the field path costs about a tenth of the parse; a document that reads cleanly
    // needs no path, so the path is tracked only when reading again to explain an error (the
    // same text fails the same way).
    if let Ok(value) = T::deserialize(serde_yaml::Deserializer::from_str(text)) {
        return Ok(value);
    }
    let deserializer = serde_yaml::Deserializer::from_str(text);
    serde_path_to_error::deserialize(deserializer).map_err(|err| {
        let mut path = err.path().to_string();
        // Real paths are a few steps; a path hundreds deep (a hostile document) would make the
        // line search slow for no gain.
        let mut steps = path_steps(err.path());
        // serde names a duplicate key but places it at the start of its mapping; point at the
        // second occurrence instead.
        let message = err.inner().to_string();
        // serde_yaml may put its own path before the sentence (`defaults: duplicate field …`).
        let duplicate = message
            .split_once("duplicate field `")
            .and_then(|(_, rest)| rest.split_once('`'))
            .map(|(key, _)| key);
        if let Some(key) = duplicate {
            steps.push(PathStep::Key(key));
            path = match path.as_str() {
                "" | "." | "?" => key.to_string(),
                parent => format!("{parent}.{key}"),
            };
        }
        let mut field_position = (steps.len() <= 16).then(|| locate(text, &steps)).flatten();
        if let (Some(key), Some(first)) = (duplicate, field_position) {
            field_position = next_same_key(text, first, key).or(field_position);
        }
        drop(steps);
        let inner = err.into_inner();
        convert_error(&inner, &path, field_position).in_origin(origin)
    })
}

/// writing, like reading, goes through this module alone.
/// Writes a value as one YAML document (for reports such as `taut plan --format yaml`), so that
pub fn to_text<T: serde::Serialize>(value: &T) -> Result<String> {
    serde_yaml::to_string(value)
        .map_err(|err| Error::input(format!("cannot write the report as YAML: {err}")))
}
