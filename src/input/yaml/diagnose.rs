//! Turning the YAML crate's errors into messages that name the file, line and field.

#[allow(unused_imports)]
use super::*;

pub(super) fn convert_error(
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
    // serde_yaml does not expand merge keys; serde reports `<<` as an unknown field.
    if message.starts_with("unknown field `<<`") {
        message = "merge keys (`<<:`) are not supported; write the fields out in full".to_string();
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
    let names_one_string = path == "string" || path.ends_with(".string");
    if message.starts_with("merge keys") {
        error = error.help("an anchor (`&name`) and alias (`*name`) may repeat a whole value");
    } else if names_one_string && message.starts_with("invalid type: sequence") {
        // `string:` names one string outright; a list there is nearly always `strings:` mistyped.
        error = Error::input(
            "`string:` names one string (a mapping such as `{kind: plain-steel, diameter: 0.012in}`), but a list was given here",
        )
        .help("a course's list of strings goes under `strings:` (with an s)");
        if let Some((line, column)) = position {
            error = error.at(line, column);
        }
        error = error.field(shorten_field(path));
    } else if let Some(hint) = unknown_field_hint(&message) {
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
pub(super) fn shorten_field(path: &str) -> String {
    const SHOWN: usize = 80;
    match path.char_indices().nth(SHOWN) {
        Some((cut, _)) => format!("{}…", &path[..cut]),
        None => path.to_string(),
    }
}

/// For serde's "unknown field `x`, expected one of `a`, `b`" messages, suggests the closest name.
pub(super) fn unknown_field_hint(message: &str) -> Option<String> {
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
