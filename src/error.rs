//! Errors a person can act on.
//!
//! Every problem with the user's input becomes an [`Error::Input`] that names where it sits
//! (file, line, column, field) and, where we can, what to write instead. The binary turns the
//! error into one message and a documented exit code (see [`Error::exit_code`]).

use std::fmt;
use std::path::PathBuf;

// The last guard before any report is written or served: shared by the command line's writer
// and the explorer's API, so neither can show `inf`, `NaN` or `null` for a number.
mod finite;
pub use finite::check_finite;

/// Result type used throughout the library.
pub type Result<T, E = Error> = std::result::Result<T, E>;

/// Exit code for a run that found bad input (a file, an inline spec or an option value).
pub const EXIT_BAD_INPUT: u8 = 2;
/// Exit code for a run that could not finish for another reason (e.g. the output could not be written).
pub const EXIT_FAILURE: u8 = 1;

/// Where in the user's input a problem sits. Every part is optional: an inline spec has no
/// file, a semantic check may know the field but not the line.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub struct Location {
    /// The file's path as the user gave it, or a label such as `--tuning` for inline input.
    pub origin: Option<String>,
    /// 1-based line.
    pub line: Option<usize>,
    /// 1-based column.
    pub column: Option<usize>,
    /// Dotted path of the field, e.g. `courses[3].length`.
    pub field: Option<String>,
}

impl fmt::Display for Location {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let mut wrote = false;
        if let Some(origin) = &self.origin {
            write!(f, "{origin}")?;
            if let Some(line) = self.line {
                write!(f, ":{line}")?;
                if let Some(column) = self.column {
                    write!(f, ":{column}")?;
                }
            }
            wrote = true;
        } else if let Some(line) = self.line {
            write!(f, "line {line}")?;
            if let Some(column) = self.column {
                write!(f, ", column {column}")?;
            }
            wrote = true;
        }
        if let Some(field) = &self.field {
            if wrote {
                write!(f, ": ")?;
            }
            write!(f, "field `{field}`")?;
        }
        Ok(())
    }
}

/// Everything that can go wrong in `taut`.
#[derive(Debug, thiserror::Error)]
pub enum Error {
    /// The user's input is wrong or cannot be honoured.
    #[error("{}", render_input(location, message, help.as_deref()))]
    Input {
        /// Where the problem sits.
        location: Location,
        /// What is wrong, as one sentence.
        message: String,
        /// What to write instead, when we know.
        help: Option<String>,
    },
    /// An input file could not be read.
    #[error("cannot read {}: {source}", shown(&path.display().to_string()))]
    Read {
        /// The path as given.
        path: PathBuf,
        /// The operating system's reason.
        #[source]
        source: std::io::Error,
    },
    /// An output file could not be written; nothing of it was left behind.
    #[error("cannot write {}: {source}", shown(&path.display().to_string()))]
    Write {
        /// The path as given.
        path: PathBuf,
        /// The operating system's reason.
        #[source]
        source: std::io::Error,
    },
}

fn render_input(location: &Location, message: &str, help: Option<&str>) -> String {
    // Each part is escaped on its own: the line break before `help:` is ours, any other control
    // character came from the user's text.
    let place = shown(&location.to_string()).into_owned();
    let message = shown(message);
    let mut out = if place.is_empty() {
        message.into_owned()
    } else {
        format!("{place}: {message}")
    };
    if let Some(help) = help {
        out.push_str("\n  help: ");
        out.push_str(&shown(help));
    }
    clip_long_words(&out)
}

/// The user's text made safe to print on a terminal: control characters (C0, DEL, C1) and the
/// invisible bidirectional overrides are written as escapes (`\n`, `\t`, `\r`, `\u{1b}`), so a
/// name holding `ESC ] 0 ; … BEL` or `ESC [ 31 m` cannot retitle the window, recolour the
/// screen or fake a line of the report. Every renderer of user text and every error message
/// goes through this one function. Text without such characters is returned as it is.
pub fn shown(text: &str) -> std::borrow::Cow<'_, str> {
    fn needs_escape(c: char) -> bool {
        c.is_control() || matches!(c, '\u{202a}'..='\u{202e}' | '\u{2066}'..='\u{2069}')
    }
    /// Whether the character at `at` (a character boundary) is one to escape, read from its
    /// bytes: C0 controls and DEL are single bytes, the C1 controls are `C2 80`..`C2 9F`, the
    /// bidirectional marks `E2 80 AA`..`E2 80 AE` and `E2 81 A6`..`E2 81 A9`.
    fn escape_at(bytes: &[u8], at: usize) -> bool {
        let byte_after = |count: usize| bytes.get(at + count).copied().unwrap_or(0);
        match bytes[at] {
            byte if byte < 0x20 || byte == 0x7f => true,
            0xc2 => matches!(byte_after(1), 0x80..=0x9f),
            0xe2 => match byte_after(1) {
                0x80 => matches!(byte_after(2), 0xaa..=0xae),
                0x81 => matches!(byte_after(2), 0xa6..=0xa9),
                _ => false,
            },
            _ => false,
        }
    }
    /// Where the first character to escape starts. Whole reports pass through here and nearly
    /// all of them need nothing escaped, so the bytes are first tested a block at a time for
    /// any that can start such a character (a branch-free test the compiler runs on the whole
    /// block), and only a block that has one is looked at byte by byte.
    fn first_to_escape(text: &str) -> Option<usize> {
        const BLOCK: usize = 16;
        let bytes = text.as_bytes();
        let mut blocks = bytes.chunks_exact(BLOCK);
        let mut from = 0;
        for block in &mut blocks {
            let mut may_start = 0u8;
            for &byte in block {
                may_start |= u8::from(byte < 0x20)
                    | u8::from(byte == 0x7f)
                    | u8::from(byte == 0xc2)
                    | u8::from(byte == 0xe2);
            }
            if may_start != 0 {
                if let Some(at) = (from..from + BLOCK).find(|&at| escape_at(bytes, at)) {
                    return Some(at);
                }
            }
            from += BLOCK;
        }
        (from..bytes.len()).find(|&at| escape_at(bytes, at))
    }
    let Some(start) = first_to_escape(text) else {
        return std::borrow::Cow::Borrowed(text);
    };
    let mut out = String::with_capacity(text.len() + 8);
    out.push_str(&text[..start]);
    for c in text[start..].chars() {
        match c {
            '\n' => out.push_str("\\n"),
            '\r' => out.push_str("\\r"),
            '\t' => out.push_str("\\t"),
            c if needs_escape(c) => {
                // Writing to a String cannot fail.
                let _ = fmt::Write::write_fmt(&mut out, format_args!("\\u{{{:x}}}", u32::from(c)));
            }
            c => out.push(c),
        }
    }
    std::borrow::Cow::Owned(out)
}

/// Longest run of non-blank characters a message repeats whole, and the longest message. A
/// 3 MiB pitch on one line was echoed back in full, twice; its start is enough to find it.
const MAX_WORD_CHARS: usize = 100;
const MAX_MESSAGE_CHARS: usize = 3000;

/// Cuts every run of non-blank characters longer than [`MAX_WORD_CHARS`], then the whole text
/// at [`MAX_MESSAGE_CHARS`].
fn clip_long_words(text: &str) -> String {
    let mut out = String::with_capacity(text.len().min(MAX_MESSAGE_CHARS + 100));
    let mut word = String::new();
    let mut word_chars = 0usize;
    let flush = |word: &mut String, word_chars: &mut usize, out: &mut String| {
        if *word_chars > MAX_WORD_CHARS {
            let cut = word
                .char_indices()
                .nth(MAX_WORD_CHARS - 20)
                .map_or(word.len(), |(i, _)| i);
            out.push_str(&word[..cut]);
            out.push_str(&format!("…({word_chars} characters)"));
        } else {
            out.push_str(word);
        }
        word.clear();
        *word_chars = 0;
    };
    for c in text.chars() {
        if c.is_whitespace() {
            flush(&mut word, &mut word_chars, &mut out);
            out.push(c);
        } else {
            word_chars += 1;
            if word_chars <= MAX_WORD_CHARS {
                word.push(c);
            }
        }
    }
    flush(&mut word, &mut word_chars, &mut out);
    match out.char_indices().nth(MAX_MESSAGE_CHARS) {
        Some((cut, _)) => format!("{}…", &out[..cut]),
        None => out,
    }
}

impl Error {
    /// A bad-input error with just a message; add the location with the builder methods.
    pub fn input(message: impl Into<String>) -> Self {
        Error::Input {
            location: Location::default(),
            message: message.into(),
            help: None,
        }
    }

    /// Sets the origin (file path or option name) unless one is already set.
    pub fn in_origin(mut self, origin: impl Into<String>) -> Self {
        if let Error::Input { location, .. } = &mut self {
            if location.origin.is_none() {
                location.origin = Some(origin.into());
            }
        }
        self
    }

    /// Sets line and column (1-based) unless a line is already set.
    pub fn at(mut self, line: usize, column: usize) -> Self {
        if let Error::Input { location, .. } = &mut self {
            if location.line.is_none() {
                location.line = Some(line);
                location.column = Some(column);
            }
        }
        self
    }

    /// Sets the field path unless one is already set.
    pub fn field(mut self, field: impl Into<String>) -> Self {
        if let Error::Input { location, .. } = &mut self {
            if location.field.is_none() {
                location.field = Some(field.into());
            }
        }
        self
    }

    /// Prefixes the field path with a parent, e.g. `pitch` inside `courses[2]` becomes `courses[2].pitch`.
    pub fn within(mut self, parent: &str) -> Self {
        if let Error::Input { location, .. } = &mut self {
            location.field = Some(match location.field.take() {
                Some(child) if child.starts_with('[') => format!("{parent}{child}"),
                Some(child) => format!("{parent}.{child}"),
                None => parent.to_string(),
            });
        }
        self
    }

    /// Adds a hint on what to write instead (replaces an earlier hint).
    pub fn help(mut self, hint: impl Into<String>) -> Self {
        if let Error::Input { help, .. } = &mut self {
            *help = Some(hint.into());
        }
        self
    }

    /// The message and hint without a location, for errors raised inside deserialization,
    /// where the YAML parser adds the line and field itself.
    pub fn plain_message(&self) -> String {
        match self {
            Error::Input {
                message,
                help: Some(help),
                ..
            } => format!("{message} ({help})"),
            Error::Input { message, .. } => message.clone(),
            other => other.to_string(),
        }
    }

    /// The location, for bad-input errors.
    pub fn location(&self) -> Option<&Location> {
        match self {
            Error::Input { location, .. } => Some(location),
            _ => None,
        }
    }

    /// The documented process exit code for this error: [`EXIT_BAD_INPUT`] for anything the user
    /// can fix in their input (including an input file that cannot be read), [`EXIT_FAILURE`]
    /// otherwise.
    pub fn exit_code(&self) -> u8 {
        match self {
            Error::Input { .. } | Error::Read { .. } => EXIT_BAD_INPUT,
            Error::Write { .. } => EXIT_FAILURE,
        }
    }
}

/// The closest of `candidates` to `word`, if it is close enough to be a likely misspelling.
pub fn did_you_mean<'a>(
    word: &str,
    candidates: impl IntoIterator<Item = &'a str>,
) -> Option<&'a str> {
    candidates
        .into_iter()
        .map(|candidate| (strsim::jaro_winkler(word, candidate), candidate))
        .filter(|(score, _)| *score > 0.8)
        .max_by(|a, b| a.0.total_cmp(&b.0))
        .map(|(_, candidate)| candidate)
}

#[cfg(test)]
mod tests;
