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

/// Largest input file `taut` reads, in bytes. Real definition files are a few kilobytes; this
/// bound keeps a mistaken path (a disk image, a log) from eating the machine.
pub const MAX_INPUT_BYTES: u64 = 4 * 1024 * 1024;

/// Reads a UTF-8 text file, refusing files that are missing, too large, binary or not UTF-8.
pub fn read_text(path: &Path) -> Result<String> {
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
    String::from_utf8(bytes).map_err(|err| {
        let offset = err.utf8_error().valid_up_to();
        let (line, column) = line_column_of_offset(err.as_bytes(), offset);
        Error::input("the file is not UTF-8 text")
            .at(line, column)
            .in_origin(origin)
            .help("save the file as UTF-8")
    })
}

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
            text.lines()
                .take(*n)
                .any(|l| !l.trim().is_empty() && !l.trim_start().starts_with('#'))
        })
    {
        return Err(
            Error::input("the file holds more than one YAML document; taut reads one")
                .at(line_number + 1, 1)
                .in_origin(origin),
        );
    }
    if let Some((line, column)) = first_too_deep_flow(text) {
        return Err(Error::input(format!(
            "the document nests `[` or `{{` more than {MAX_FLOW_DEPTH} levels deep"
        ))
        .at(line, column)
        .in_origin(origin)
        .help("a definition file nests a few levels; check for unclosed brackets"));
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

/// The next line after `first` (1-based line and column of a key) that holds the same key at
/// the same indentation, before the mapping ends.
fn next_same_key(text: &str, first: (usize, usize), key: &str) -> Option<(usize, usize)> {
    let indent = first.1.saturating_sub(1);
    for (index, line) in text.lines().enumerate().skip(first.0) {
        let (own_indent, body) = split_item_prefix(line);
        if body.is_empty() || body.starts_with('#') {
            continue;
        }
        if own_indent < indent {
            return None;
        }
        let same_key = body.strip_prefix(key).is_some_and(|rest| {
            rest.trim_start_matches(['"', '\''])
                .trim_start()
                .starts_with(':')
        });
        if own_indent == indent && same_key {
            return Some((index + 1, first.1));
        }
    }
    None
}

/// The leading steps of a serde path that [`locate`] can follow.
fn path_steps(path: &serde_path_to_error::Path) -> Vec<PathStep<'_>> {
    use serde_path_to_error::Segment;
    path.iter()
        .map_while(|segment| match segment {
            Segment::Seq { index } => Some(PathStep::Index(*index)),
            Segment::Map { key } => Some(PathStep::Key(key.as_str())),
            _ => None,
        })
        .collect()
}

/// Deepest nesting of flow collections (`[...]`, `{...}`) that [`parse`] hands to the YAML
/// parser. serde_yaml refuses documents nested deeper than 128 levels anyway, but only after
/// scanning them, and the scanner's work grows with the nesting depth times the document length:
/// a 4 MiB file of `[` would take hours to refuse. Checking first keeps that to one pass.
pub const MAX_FLOW_DEPTH: usize = 128;

/// The line and column of the first `[` or `{` that opens a flow collection deeper than
/// [`MAX_FLOW_DEPTH`], by a light scan that skips comments and quoted scalars. Brackets inside
/// plain scalars are counted too, which can only make the estimate deeper, never shallower.
fn first_too_deep_flow(text: &str) -> Option<(usize, usize)> {
    #[derive(PartialEq)]
    enum State {
        Outside,
        DoubleQuoted,
        SingleQuoted,
        Comment,
    }
    let mut state = State::Outside;
    let mut depth = 0usize;
    let (mut line, mut column) = (1usize, 0usize);
    let mut previous: Option<char> = None;
    // Whether a quote here would start a quoted scalar (rather than sit inside a plain one).
    let mut token_may_start = true;
    // Inside an anchor (`&a`) or tag (`!t`), after which a quoted scalar may still start.
    let mut in_property = false;
    // Whether the line so far holds only indentation and `- ` / `? ` indicators.
    let mut only_indicators = true;
    let mut chars = text.chars().peekable();
    while let Some(c) = chars.next() {
        column += 1;
        if c == '\n' {
            line += 1;
            column = 0;
            if state == State::Comment {
                state = State::Outside;
            }
            if state == State::Outside {
                token_may_start = true;
                in_property = false;
                only_indicators = true;
            }
            previous = Some(c);
            continue;
        }
        let next_is_blank = chars.peek().is_none_or(|n| n.is_whitespace());
        match state {
            State::Comment => {}
            State::DoubleQuoted => match c {
                '\\' if chars.next_if(|&n| n != '\n').is_some() => column += 1,
                '"' => state = State::Outside,
                _ => {}
            },
            State::SingleQuoted => {
                if c == '\'' {
                    if chars.next_if_eq(&'\'').is_some() {
                        column += 1;
                    } else {
                        state = State::Outside;
                    }
                }
            }
            State::Outside => match c {
                '#' if previous.is_none_or(char::is_whitespace) => state = State::Comment,
                '[' | '{' => {
                    depth += 1;
                    if depth > MAX_FLOW_DEPTH {
                        return Some((line, column));
                    }
                    token_may_start = true;
                    in_property = false;
                    only_indicators = false;
                }
                ']' | '}' => {
                    depth = depth.saturating_sub(1);
                    token_may_start = false;
                    only_indicators = false;
                }
                '"' | '\'' if token_may_start => {
                    state = if c == '"' {
                        State::DoubleQuoted
                    } else {
                        State::SingleQuoted
                    };
                    only_indicators = false;
                }
                ',' => token_may_start = depth > 0,
                ':' => token_may_start = depth > 0 || next_is_blank,
                '-' | '?' if only_indicators && next_is_blank => token_may_start = true,
                '&' | '!' if token_may_start => {
                    in_property = true;
                    only_indicators = false;
                }
                _ if c.is_whitespace() => in_property = false,
                _ => {
                    if !in_property {
                        token_may_start = false;
                    }
                    only_indicators = false;
                }
            },
        }
        previous = Some(c);
    }
    None
}

fn convert_error(
    err: &serde_yaml::Error,
    path: &str,
    field_position: Option<(usize, usize)>,
) -> Error {
    let raw = err.to_string();
    // The scanner adds where the construct it was reading began (", while scanning a quoted
    // scalar at line 1 column 7"): the only pointer to an unclosed quote, so keep it.
    let (head, context) = match raw.split_once(", while ") {
        Some((head, context))
            if context.starts_with("scanning") || context.starts_with("parsing") =>
        {
            (head, Some(context))
        }
        _ => (raw.as_str(), None),
    };
    // serde_yaml appends " at line L column C" and sometimes prefixes the path; keep the sentence.
    let mut message = head.split(" at line ").next().unwrap_or(head).to_string();
    // serde_yaml may prefix its own (shorter) path; the field is reported separately.
    if let Some((prefix, rest)) = message.split_once(": ") {
        let own_path = prefix.strip_prefix('.').unwrap_or(prefix);
        if !prefix.contains(' ') && (path.starts_with(own_path) || prefix == ".") {
            message = rest.to_string();
        }
    }
    // serde names the Rust type it wanted (`expected struct StringEntryFile`); say what to write.
    if let Some(at) = message.find("expected struct ") {
        message.truncate(at);
        message.push_str("expected a mapping of `key: value` pairs");
    }
    if let Some(context) = context {
        let context = context
            .replace(" at line ", " that starts at line ")
            .replace(" column ", ", column ");
        message.push_str(&format!(" (while {context})"));
    }
    let mut error = Error::input(message.clone());
    // A value's own check (`#[serde(try_from)]`, a quantity's unit) is reported by serde_yaml at
    // the start of the enclosing mapping, often line 1; the field's own line is more use.
    let serde_position = err.location().map(|l| (l.line(), l.column()));
    let position = match (serde_position, field_position) {
        (Some(reported), Some(field)) if field.0 > reported.0 => Some(field),
        (Some(reported), _) => Some(reported),
        (None, field) => field,
    };
    if let Some((line, column)) = position {
        error = error.at(line, column);
    }
    // serde_path_to_error writes `?` for a place it cannot name; say nothing rather than that.
    let path = path.trim_end_matches(".?");
    if !path.is_empty() && path != "." && path != "?" {
        error = error.field(shorten_field(path));
    }
    if let Some(hint) = unknown_field_hint(&message) {
        error = error.help(hint);
    } else if message.contains("found character that cannot start any token")
        || message.contains("\t")
        || message.contains("tab character")
    {
        error = error.help("YAML is indented with spaces; replace tabs with spaces");
    } else if message.contains("while scanning a quoted scalar") {
        error = error.help("a quote is opened and never closed; close it where the text ends");
    } else if message.contains("recursion limit exceeded")
        || message.contains("repetition limit exceeded")
    {
        error = error.help(
            "the document nests too deeply or repeats aliases too often to be a real definition",
        );
    }
    error
}

/// Cuts a field path that a deeply nested document made too long to read.
fn shorten_field(path: &str) -> String {
    const SHOWN: usize = 80;
    match path.char_indices().nth(SHOWN) {
        Some((cut, _)) => format!("{}…", &path[..cut]),
        None => path.to_string(),
    }
}

/// For serde's "unknown field `x`, expected one of `a`, `b`" messages, suggests the closest name.
fn unknown_field_hint(message: &str) -> Option<String> {
    let rest = message
        .strip_prefix("unknown field `")
        .or_else(|| message.strip_prefix("unknown variant `"))?;
    let (word, expected) = rest.split_once('`')?;
    let candidates: Vec<&str> = expected.split('`').skip(1).step_by(2).collect();
    match did_you_mean(word, candidates.iter().copied()) {
        Some(best) => Some(format!("did you mean `{best}`?")),
        None if !candidates.is_empty() => Some(format!("allowed: {}", candidates.join(", "))),
        None => None,
    }
}

/// Writes a value as one YAML document (for reports such as `taut plan --format yaml`), so that
/// writing, like reading, goes through this module alone.
pub fn to_text<T: serde::Serialize>(value: &T) -> Result<String> {
    serde_yaml::to_string(value)
        .map_err(|err| Error::input(format!("cannot write the report as YAML: {err}")))
}

/// One step of a field path: a map key or a sequence index.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum PathStep<'a> {
    /// A key in a mapping.
    Key(&'a str),
    /// A 0-based index in a sequence.
    Index(usize),
}

/// Finds the 1-based line and column of a field in block-style YAML, for errors found after
/// deserialization (e.g. a pitch the tuning cannot address). Where the rest of the path is
/// written in flow style (`{kind: x}`) or cannot be followed, it returns the deepest ancestor it
/// found, so the message still points at the right line; `None` only when not even the first
/// step is there. The error names the full field path in any case.
pub fn locate(text: &str, path: &[PathStep<'_>]) -> Option<(usize, usize)> {
    let lines: Vec<&str> = text.lines().collect();
    let is_content = |line: &str| {
        let t = line.trim_start();
        !t.is_empty() && !t.starts_with('#')
    };
    let leading = |line: &str| line.len() - line.trim_start_matches(' ').len();
    // The scope being searched: a range of lines.
    let (mut start, mut end) = (0usize, lines.len());
    let mut found = None;
    for (i, step) in path.iter().enumerate() {
        let Some(first) = (start..end).find(|&n| is_content(lines[n])) else {
            return found;
        };
        match step {
            PathStep::Key(key) => {
                // Keys of this mapping sit at the effective indentation of its first line.
                let key_indent = split_item_prefix(lines[first]).0;
                let hit = (first..end).find(|&n| {
                    let (indent, body) = split_item_prefix(lines[n]);
                    indent == key_indent
                        && body
                            .strip_prefix(key)
                            .map(|rest| {
                                rest.trim_start_matches(['"', '\''])
                                    .trim_start()
                                    .starts_with(':')
                            })
                            .unwrap_or(false)
                });
                let Some(n) = hit else {
                    return found;
                };
                found = Some((n + 1, key_indent + 1));
                let own = leading(lines[n]);
                let block_end = (n + 1..end)
                    .find(|&m| {
                        is_content(lines[m])
                            && (leading(lines[m]) < own
                                || (leading(lines[m]) == own
                                    && !lines[m].trim_start().starts_with("- ")))
                    })
                    .unwrap_or(end);
                let value_on_same_line = lines[n]
                    .split_once(':')
                    .is_some_and(|(_, v)| !v.trim().is_empty());
                start = if value_on_same_line { n } else { n + 1 };
                end = block_end.max(n + 1);
            }
            PathStep::Index(wanted) => {
                let dash_indent = leading(lines[first]);
                if !lines[first].trim_start().starts_with('-') {
                    return found;
                }
                let items: Vec<usize> = (first..end)
                    .filter(|&n| {
                        leading(lines[n]) == dash_indent && lines[n].trim_start().starts_with('-')
                    })
                    .collect();
                let Some(&n) = items.get(*wanted) else {
                    return found;
                };
                let item_end = items.get(wanted + 1).copied().unwrap_or(end);
                let found = Some((n + 1, dash_indent + 3));
                return locate_in_item(&lines, n, item_end, dash_indent, &path[i + 1..]).or(found);
            }
        }
    }
    found
}

/// Continues [`locate`] inside one sequence item whose dash sits at `dash_indent`.
fn locate_in_item(
    lines: &[&str],
    start: usize,
    end: usize,
    dash_indent: usize,
    rest: &[PathStep<'_>],
) -> Option<(usize, usize)> {
    if rest.is_empty() {
        return None;
    }
    // Replace the item's dash by a space, so the item reads as a plain mapping.
    let mut owned: Vec<String> = lines[start..end].iter().map(|l| l.to_string()).collect();
    if let Some(first) = owned.first_mut() {
        // Only when the dash really sits there: `trim_start` also skips non-ASCII blanks
        // (U+0085), which `leading` does not count, and cutting inside one would panic.
        if first.as_bytes().get(dash_indent) == Some(&b'-') {
            first.replace_range(dash_indent..dash_indent + 1, " ");
        }
    }
    let text = owned.join("\n");
    locate(&text, rest).map(|(line, column)| (line + start, column))
}

/// Splits a line into its indentation (counting a leading `- ` as indentation) and its body.
fn split_item_prefix(line: &str) -> (usize, &str) {
    let mut indent = 0;
    let mut body = line;
    loop {
        let trimmed = body.trim_start_matches(' ');
        indent += body.len() - trimmed.len();
        if let Some(rest) = trimmed.strip_prefix("- ") {
            indent += 2;
            body = rest;
        } else {
            return (indent, trimmed);
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use serde::Deserialize;

    #[derive(Debug, Deserialize)]
    #[serde(deny_unknown_fields)]
    #[allow(dead_code)]
    struct Course {
        length: f64,
        pitch: String,
    }

    #[derive(Debug, Deserialize)]
    #[serde(deny_unknown_fields)]
    #[allow(dead_code)]
    struct Doc {
        name: String,
        courses: Vec<Course>,
    }

    #[test]
    fn unknown_key_names_line_field_and_suggestion() {
        let text =
            "name: x\ncourses:\n  - length: 1\n    pitch: E2\n  - lenght: 2\n    pitch: A2\n";
        let err = parse::<Doc>(text, "i.yaml").unwrap_err().to_string();
        assert!(err.starts_with("i.yaml:5:"), "{err}");
        assert!(err.contains("courses[1]"), "{err}");
        assert!(err.contains("did you mean `length`?"), "{err}");
    }

    #[test]
    fn wrong_type_names_field() {
        let text = "name: x\ncourses:\n  - length: long\n    pitch: E2\n";
        let err = parse::<Doc>(text, "i.yaml").unwrap_err().to_string();
        assert!(err.contains("i.yaml:3:"), "{err}");
        assert!(err.contains("courses[0].length"), "{err}");
    }

    #[test]
    fn empty_and_binary_and_non_utf8_are_refused() {
        assert!(parse::<Doc>("  \n# only a comment\n", "e.yaml")
            .unwrap_err()
            .to_string()
            .contains("empty"));
        let err = text_from_bytes(b"name: x\n\0\0".to_vec(), "b.yaml")
            .unwrap_err()
            .to_string();
        assert!(
            err.starts_with("b.yaml:2:1:") && err.contains("binary"),
            "{err}"
        );
        let err = text_from_bytes(b"name: \xff\n".to_vec(), "u.yaml")
            .unwrap_err()
            .to_string();
        assert!(
            err.starts_with("u.yaml:1:7:") && err.contains("UTF-8"),
            "{err}"
        );
    }

    #[test]
    fn alias_bomb_is_refused() {
        let mut text = String::from("a0: &a0 [x, x, x, x, x, x, x, x, x, x]\n");
        for i in 1..10 {
            let p = i - 1;
            text.push_str(&format!(
                "a{i}: &a{i} [*a{p}, *a{p}, *a{p}, *a{p}, *a{p}, *a{p}, *a{p}, *a{p}, *a{p}, *a{p}]\n"
            ));
        }
        let result = parse::<serde_yaml::Value>(&text, "bomb.yaml");
        assert!(result.is_err());
    }

    #[test]
    fn locate_finds_nested_fields() {
        let text =
            "name: x\ncourses:\n  - length: 1\n    pitch: E2\n  - length: 2\n    pitch: A2\n";
        assert_eq!(locate(text, &[PathStep::Key("name")]), Some((1, 1)));
        assert_eq!(
            locate(text, &[PathStep::Key("courses"), PathStep::Index(1)]),
            Some((5, 5))
        );
        assert_eq!(
            locate(
                text,
                &[
                    PathStep::Key("courses"),
                    PathStep::Index(1),
                    PathStep::Key("pitch")
                ]
            ),
            Some((6, 5))
        );
        assert_eq!(
            locate(
                text,
                &[
                    PathStep::Key("courses"),
                    PathStep::Index(0),
                    PathStep::Key("length")
                ]
            ),
            Some((3, 5))
        );
        assert_eq!(locate(text, &[PathStep::Key("missing")]), None);
        // Flow style below a block key: the deepest block-style ancestor is reported.
        let flow = "name: x\ncourses:\n  - course: 1\n    strings: [{kind: a}]\n";
        assert_eq!(
            locate(
                flow,
                &[
                    PathStep::Key("courses"),
                    PathStep::Index(0),
                    PathStep::Key("strings"),
                    PathStep::Index(0),
                    PathStep::Key("kind")
                ]
            ),
            Some((4, 5))
        );
    }
}
