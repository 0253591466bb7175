//! User text on its way into a picture or a page: names from files (instrument, tuning, variant,
//! kind) can hold anything, so every label is cleaned here before it is drawn or written.
//!
//! - Characters that XML 1.0 does not allow (its `Char` production: everything below U+0020
//!   except tab, line feed and carriage return, and U+FFFE, U+FFFF) make an SVG document
//!   not well-formed, and browsers refuse to show it; they are replaced by U+FFFD.
//! - A label longer than [`MAX_LABEL_CHARS`] is cut there with `…`: the cost of measuring and
//!   drawing text grows with its length, and no picture has room for more.

use std::borrow::Cow;

/// Most characters of one label in a picture or a page; longer text is cut with `…`.
pub const MAX_LABEL_CHARS: usize = 200;

/// The character put in place of one that XML forbids.
pub const REPLACEMENT: char = '\u{fffd}';

/// Whether XML 1.0 allows `c` in a document (the `Char` production of the XML 1.0
/// specification, §2.2: `#x9 | #xA | #xD | [#x20-#xD7FF] | [#xE000-#xFFFD] | [#x10000-#x10FFFF]`;
/// a Rust `char` is never a surrogate).
pub fn xml_allows(c: char) -> bool {
    matches!(c, '\t' | '\n' | '\r') || (c >= ' ' && c != '\u{fffe}' && c != '\u{ffff}')
}

/// `text` with the characters XML forbids replaced and cut to [`MAX_LABEL_CHARS`] characters.
pub fn label(text: &str) -> Cow<'_, str> {
    let clean = text.chars().all(xml_allows);
    let cut = text.char_indices().nth(MAX_LABEL_CHARS).map(|(at, _)| at);
    if clean && cut.is_none() {
        return Cow::Borrowed(text);
    }
    let kept = match cut {
        // One character is given up for the ellipsis, so the label stays within the limit.
        Some(_) => {
            let end = text
                .char_indices()
                .nth(MAX_LABEL_CHARS - 1)
                .map_or(text.len(), |(at, _)| at);
            &text[..end]
        }
        None => text,
    };
    let mut out: String = kept
        .chars()
        .map(|c| if xml_allows(c) { c } else { REPLACEMENT })
        .collect();
    if cut.is_some() {
        out.push('…');
    }
    Cow::Owned(out)
}

/// [`label`] escaped for XML and HTML: for names (of an instrument, a tuning, a kind).
pub fn escaped_label(text: &str) -> String {
    escaped(&label(text))
}

/// `text` escaped for XML and HTML text and attribute values (`&`, `<`, `>`, `"`, `'`), with
/// the characters XML forbids replaced; nothing is cut (for sentences such as warnings).
pub fn escaped(text: &str) -> String {
    let mut out = String::with_capacity(text.len());
    for c in text.chars() {
        match c {
            '&' => out.push_str("&amp;"),
            '<' => out.push_str("&lt;"),
            '>' => out.push_str("&gt;"),
            '"' => out.push_str("&quot;"),
            '\'' => out.push_str("&#39;"),
            other if xml_allows(other) => out.push(other),
            _ => out.push(REPLACEMENT),
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn forbidden_characters_are_replaced_and_long_text_is_cut() {
        // XML 1.0, §2.2 Char: U+000B and U+001B are not characters of a document.
        assert_eq!(label("a\u{b}b\u{1b}c\td"), "a\u{fffd}b\u{fffd}c\td");
        assert_eq!(label("\u{ffff}"), "\u{fffd}");
        assert!(matches!(label("plain 名前"), Cow::Borrowed(_)));
        let long = "x".repeat(100_000);
        let cut = label(&long);
        assert_eq!(cut.chars().count(), MAX_LABEL_CHARS);
        assert!(cut.ends_with('…'));
        let exact = "y".repeat(MAX_LABEL_CHARS);
        assert_eq!(label(&exact), exact);
        assert_eq!(
            escaped("<a href='x'>&\"</a>\u{b}"),
            "&lt;a href=&#39;x&#39;&gt;&amp;&quot;&lt;/a&gt;\u{fffd}"
        );
        assert_eq!(escaped_label(&long).chars().count(), MAX_LABEL_CHARS);
    }
}
