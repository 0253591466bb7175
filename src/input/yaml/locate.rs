//! Finding where a field is written in the source text, for messages that point at its line.

#[allow(unused_imports)]
use super::*;

/// The next line after `first` (1-based line and column of a key) that holds the same key at
/// the same indentation, before the mapping ends.
pub(super) fn next_same_key(
    text: &str,
    first: (usize, usize),
    key: &str,
) -> Option<(usize, usize)> {
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
pub(super) fn path_steps(path: &serde_path_to_error::Path) -> Vec<PathStep<'_>> {
    use serde_path_to_error::Segment;
    path.iter()
        .map_while(|segment| match segment {
            Segment::Seq { index } => Some(PathStep::Index(*index)),
            Segment::Map { key } => Some(PathStep::Key(key.as_str())),
            _ => None,
        })
        .collect()
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
pub(super) fn locate_in_item(
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
pub(super) fn split_item_prefix(line: &str) -> (usize, &str) {
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

/// Renders a path as `courses[3].pitch`.
pub fn field_name(path: &[PathStep<'_>]) -> String {
    let mut out = String::new();
    for step in path {
        match step {
            PathStep::Key(key) => {
                if !out.is_empty() {
                    out.push('.');
                }
                out.push_str(key);
            }
            PathStep::Index(index) => out.push_str(&format!("[{index}]")),
        }
    }
    out
}

/// `error` naming the field at `path` and, where the text has it, its line and column (the
/// deepest ancestor [`locate`] finds), in `origin`.
pub fn point(error: Error, text: &str, origin: &str, path: &[PathStep<'_>]) -> Error {
    let mut error = error.field(field_name(path));
    if let Some((line, column)) = locate(text, path) {
        error = error.at(line, column);
    }
    error.in_origin(origin.to_string())
}
