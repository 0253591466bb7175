//! A light pre-scan that bounds nesting before the YAML parser runs.

#[allow(unused_imports)]
use super::*;

/// Deepest nesting of flow collections (`[...]`, `{...}`) that [`parse`] hands to the YAML
/// parser. serde_yaml refuses documents nested deeper than 128 levels anyway, but only after
/// scanning them, and the scanner's work grows with the nesting depth times the document length:
/// a 4 MiB file of `[` would take hours to refuse. Checking first keeps that to one pass.
pub const MAX_FLOW_DEPTH: usize = 128;

/// Deepest nesting of block collections (`- - - x`, `? ? x`, indentation) that [`parse`] hands
/// to the YAML parser. serde_yaml refuses more than 128 levels too, but only after loading every
/// event of the document: 4 MiB of `- - - …` on one line took 631 MB before the refusal.
pub const MAX_BLOCK_DEPTH: usize = 128;

/// Which kind of nesting went too deep.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(super) enum Nesting {
    /// `[` and `{`.
    Flow,
    /// Block sequences and mappings.
    Block,
}

/// Where nesting first went too deep.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(super) struct TooDeep {
    pub line: usize,
    pub column: usize,
    pub kind: Nesting,
}

/// The first place where flow collections nest deeper than [`MAX_FLOW_DEPTH`] or block
/// collections deeper than [`MAX_BLOCK_DEPTH`], by one light pass that skips comments and quoted
/// scalars. Brackets inside plain scalars are counted too, and every node that starts a line (or
/// follows `- `, `? `, `: ` at its start) counts as one block level below the nodes left of it,
/// which can only make the estimate deeper, never shallower.
pub(super) fn first_too_deep(text: &str) -> Option<TooDeep> {
    if cannot_nest_too_deep(text) {
        return None;
    }
    scan_too_deep(text)
}

/// The pass of [`first_too_deep`], without its quick bound.
fn scan_too_deep(text: &str) -> Option<TooDeep> {
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
    // Columns of the block nodes open at this point, leftmost first (at most one past the limit).
    let mut block: Vec<usize> = Vec::new();
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
        if state == State::Outside
            && depth == 0
            && only_indicators
            && !c.is_whitespace()
            && c != '#'
        {
            // A node starts here: it closes the nodes at or right of its column.
            while block.last().is_some_and(|&open| open >= column) {
                block.pop();
            }
            block.push(column);
            if block.len() > MAX_BLOCK_DEPTH {
                return Some(TooDeep {
                    line,
                    column,
                    kind: Nesting::Block,
                });
            }
            if c == ':' && next_is_blank {
                // `: value` of a complex key: the value is a node of its own, as after `- `.
                token_may_start = true;
                previous = Some(c);
                continue;
            }
        }
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
                        return Some(TooDeep {
                            line,
                            column,
                            kind: Nesting::Flow,
                        });
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

/// Whether `text` is too small to nest too deep, by two byte counts far quicker than the pass of
/// [`first_too_deep`]: flow depth never exceeds the number of `[` and `{`, and the open block
/// nodes sit at strictly increasing columns, so block depth never exceeds the longest line.
fn cannot_nest_too_deep(text: &str) -> bool {
    let openers = text.bytes().filter(|&b| b == b'[' || b == b'{').count();
    openers <= MAX_FLOW_DEPTH && text.split('\n').all(|line| line.len() <= MAX_BLOCK_DEPTH)
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    proptest! {
        // The quick bound may only skip texts that the full pass finds shallow enough.
        #[test]
        fn the_quick_bound_never_hides_deep_nesting(
            lines in proptest::collection::vec("[-?:\\[\\]{} #\"'a]{0,140}", 0..20)
        ) {
            let text = lines.join("\n");
            if cannot_nest_too_deep(&text) {
                prop_assert_eq!(scan_too_deep(&text), None);
            }
        }
    }

    #[test]
    fn the_quick_bound_holds_at_its_edges() {
        let flow_at_limit = "[".repeat(MAX_FLOW_DEPTH);
        assert!(cannot_nest_too_deep(&flow_at_limit));
        let flow_past_limit = "[".repeat(MAX_FLOW_DEPTH + 1);
        assert!(!cannot_nest_too_deep(&flow_past_limit));
        assert_eq!(
            first_too_deep(&flow_past_limit).map(|deep| deep.kind),
            Some(Nesting::Flow)
        );
        // 65 `- ` marks make a 130-byte line: past the bound, so the full pass runs.
        let block = "- ".repeat(65);
        assert!(!cannot_nest_too_deep(&block));
        assert_eq!(first_too_deep(&block), None);
        let deep_block = "- ".repeat(MAX_BLOCK_DEPTH + 1);
        assert_eq!(
            first_too_deep(&deep_block).map(|deep| deep.kind),
            Some(Nesting::Block)
        );
    }
}
