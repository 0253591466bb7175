//! A light pre-scan that bounds nesting before the YAML parser runs.

#[allow(unused_imports)]
use super::*;

/// Deepest nesting of flow collections (`[...]`, `{...}`) that [`parse`] hands to the YAML
/// parser. serde_yaml refuses documents nested deeper than 128 levels anyway, but only after
/// scanning them, and the scanner's work grows with the nesting depth times the document length:
/// a 4 MiB file of `[` would take hours to refuse. Checking first keeps that to one pass.
pub const MAX_FLOW_DEPTH: usize = 128;

/// The line and column of the first `[` or `{` that opens a flow collection deeper than
/// [`MAX_FLOW_DEPTH`], by a light scan that skips comments and quoted scalars. Brackets inside
/// plain scalars are counted too, which can only make the estimate deeper, never shallower.
pub(super) fn first_too_deep_flow(text: &str) -> Option<(usize, usize)> {
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
