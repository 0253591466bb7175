//! Tests of the report layout: widths, tables and wrapping.

use super::*;

fn widest(text: &str) -> usize {
    text.lines().map(cells).max().unwrap_or(0)
}

#[test]
fn wraps_with_a_hanging_indent_and_never_overflows() {
    let text = "one two three four five six seven eight nine ten eleven twelve";
    let out = wrap(text, 20, "- ", "  ");
    assert!(widest(&out) <= 20, "{out}");
    assert!(out.starts_with("- one"));
    assert!(
        out.lines().skip(1).all(|line| line.starts_with("  ")),
        "{out}"
    );
    let long = wrap(&"x".repeat(50), 20, "  ", "  ");
    assert!(widest(&long) <= 20, "{long}");
    assert_eq!(long.matches('x').count(), 50);
}

/// Wrapping as first written: every line rebuilt and recounted for each word. The one-pass
/// [`wrap`] must write the same text.
fn wrap_recounting(text: &str, width: usize, first: &str, rest: &str) -> String {
    let mut out = String::new();
    let mut line = first.to_string();
    let mut empty = true;
    for word in text.split_whitespace() {
        let room = width.saturating_sub(cells(&line));
        let needed = cells(word) + usize::from(!empty);
        if !empty && needed > room {
            out.push_str(line.trim_end());
            out.push('\n');
            line = rest.to_string();
            empty = true;
        }
        let mut word = word.to_string();
        while cells(&line) + cells(&word) + usize::from(!empty) > width
            && cells(&word) > width.saturating_sub(cells(rest)).max(1)
        {
            let room = width
                .saturating_sub(cells(&line) + usize::from(!empty))
                .max(1);
            // The head takes at most `room` display columns, and at least one character.
            let mut head = String::new();
            for c in word.chars() {
                if !head.is_empty() && cells(&head) + cells(c.encode_utf8(&mut [0; 4])) > room {
                    break;
                }
                head.push(c);
            }
            if !empty {
                line.push(' ');
            }
            line.push_str(&head);
            out.push_str(line.trim_end());
            out.push('\n');
            line = rest.to_string();
            empty = true;
            word = word[head.len()..].to_string();
        }
        if !empty {
            line.push(' ');
        }
        line.push_str(&word);
        empty = false;
    }
    out.push_str(line.trim_end());
    out.push('\n');
    out
}

#[test]
fn wraps_wide_characters_by_the_columns_they_take() {
    // Each of these characters takes two columns on a terminal: twenty of them fill 40.
    let text = "調律の名前 ".repeat(8);
    let out = wrap(&text, 30, "- ", "  ");
    assert!(widest(&out) <= 30, "{out}");
    assert!(out.starts_with("- 調律の名前 調律の名前\n"), "{out}");
    let long = wrap(&"調".repeat(40), 21, "", "");
    assert!(widest(&long) <= 21, "{long}");
    assert_eq!(long.matches('調').count(), 40);
}

#[test]
fn wraps_as_recounting_every_line_does() {
    // Words of every length, blanks of every kind (ASCII, no-break, ideographic, vertical
    // tab) and characters of one to four bytes.
    let pieces = [
        "a",
        "bc",
        "def",
        "ghij",
        "klmnopqrstu",
        "é",
        "─▰",
        "…",
        "𝄞x",
        "漢字",
        "調律",
        "0.254w",
        "averyveryveryverylongwordthatmustbebroken",
        " ",
        "  ",
        "\t",
        "\n",
        "\u{a0}",
        "\u{3000}",
        "\u{b}",
        "\u{85}",
        "\u{1b}",
    ];
    let mut state: u64 = 0x9e37_79b9_7f4a_7c15;
    let mut next = move |bound: usize| {
        state ^= state << 13;
        state ^= state >> 7;
        state ^= state << 17;
        (state % bound as u64) as usize
    };
    let indents = [
        ("", ""),
        ("- ", "  "),
        ("  caution  ", "           "),
        ("x", " "),
    ];
    for _ in 0..3000 {
        let text: String = (0..next(30)).map(|_| pieces[next(pieces.len())]).collect();
        let width = next(70);
        let (first, rest) = indents[next(indents.len())];
        assert_eq!(
            wrap(&text, width, first, rest),
            wrap_recounting(&text, width, first, rest),
            "{text:?} at {width}"
        );
    }
    let mut out = String::from("kept\n");
    wrap_into(&mut out, "one two three", 8, "> ", "  ");
    assert_eq!(out, "kept\n> one\n  two\n  three\n");
}

#[test]
fn cells_too_wide_are_cut_with_an_ellipsis_and_rows_end_without_blanks() {
    let mut grid = Grid::new(vec![
        Column::figure("#"),
        Column::text("name").give(Give::Shorten(4, 1)),
        Column::text("note"),
    ]);
    grid.row(vec!["1".into(), "éèêëēĕėęě".into(), String::new()]);
    grid.row(vec![String::new(), "ab".into()]);
    let (table, hidden) = grid.render(13);
    assert!(hidden.is_empty());
    assert_eq!(
        table, "#  name  note\n─────────────\n1  éèê…\n   ab\n",
        "{table}"
    );
}

#[test]
fn a_wide_table_shortens_then_drops_columns() {
    let mut grid = Grid::new(vec![
        Column::figure("#"),
        Column::text("name").give(Give::Shorten(6, 2)),
        Column::figure("extra").give(Give::Drop(1)),
        Column::figure("value"),
    ]);
    grid.row(vec![
        "1".into(),
        "a rather long name indeed".into(),
        "12345678".into(),
        "9.5".into(),
    ]);
    let (wide, hidden) = grid.render(100);
    assert!(hidden.is_empty());
    assert!(wide.contains("a rather long name indeed"));
    // A little too wide: the name gives up a few characters, nothing is left out.
    let (narrow, hidden) = grid.render(38);
    assert!(widest(&narrow) <= 38, "{narrow}");
    assert!(narrow.contains('…'), "{narrow}");
    assert!(hidden.is_empty(), "{hidden:?}");
    // Much too wide: the name (rank 2) shortens to its floor before the extra column (rank 1)
    // goes.
    let (tight, hidden) = grid.render(30);
    assert!(widest(&tight) <= 30, "{tight}");
    assert!(hidden.is_empty(), "{hidden:?}");
    assert!(tight.contains("a rather …"), "{tight}");
    let (tiny, hidden) = grid.render(20);
    assert!(widest(&tiny) <= 20, "{tiny}");
    assert_eq!(hidden, vec!["extra".to_string()]);
    // The other order: the extra column goes first, and the width it frees goes back to the
    // name. Figures are never cut.
    let mut grid = Grid::new(vec![
        Column::figure("#"),
        Column::text("name").give(Give::Shorten(6, 1)),
        Column::figure("extra").give(Give::Drop(2)),
        Column::figure("value"),
    ]);
    grid.row(vec![
        "1".into(),
        "a rather long name indeed".into(),
        "12345678".into(),
        "9.5".into(),
    ]);
    let (tight, hidden) = grid.render(30);
    assert_eq!(hidden, vec!["extra".to_string()]);
    assert!(tight.contains("a rather long name …"), "{tight}");
    let (tiny, _) = grid.render(12);
    assert!(tiny.contains("9.5"), "{tiny}");
}

#[test]
fn wide_characters_count_as_two_columns() {
    let mut grid = Grid::new(vec![
        Column::text("tuning").give(Give::Shorten(4, 1)),
        Column::figure("offset"),
    ]);
    grid.row(vec!["十二平均律の変奏".into(), "-535.2c".into()]);
    let (full, _) = grid.render(100);
    // 16 columns of name, the gap, then the figure right-aligned under its header.
    assert_eq!(
        full.lines().nth(2),
        Some("十二平均律の変奏  -535.2c"),
        "{full}"
    );
    let (narrow, hidden) = grid.render(20);
    assert!(hidden.is_empty());
    for line in narrow.lines() {
        assert!(cells(line) <= 20, "{line:?} takes {} columns", cells(line));
    }
    assert!(
        narrow.contains('…') && narrow.contains("-535.2c"),
        "{narrow}"
    );
}
