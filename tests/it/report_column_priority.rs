//! What a narrow terminal leaves out: each command's own order (`taut help reports`), lengths and
//! nut slots kept where they are the point, and no number ever cut.

use crate::common;

fn at_columns(args: &[&str], columns: &str) -> String {
    let output = common::taut()
        .args(args)
        .env("COLUMNS", columns)
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "taut {args:?}: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    String::from_utf8(output.stdout).unwrap()
}

/// The header line of the first table (the line above the first rule).
fn header(text: &str) -> &str {
    let lines: Vec<&str> = text.lines().collect();
    let rule = lines
        .iter()
        .position(|line| line.starts_with('─'))
        .expect("a table");
    lines[rule - 1]
}

#[test]
fn lengths_and_slots_stay_at_80_columns() {
    // A harp's lengths are the point: the wide view leaves out details before them.
    for instrument in ["lever-harp-34", "guitar-19edo", "fanned-8-just"] {
        let text = at_columns(&["plan", instrument, "--wide"], "80");
        assert!(header(&text).contains("length mm"), "{instrument}:\n{text}");
    }
    // A conversion is checked for its nut slots.
    let convert = [
        "convert",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--to-instrument",
        "baritone-guitar",
    ];
    let text = at_columns(&convert, "80");
    assert!(header(&text).contains("slot mm"), "{text}");
    assert!(text.contains("+0.076"), "{text}");
    let mut inches = convert.to_vec();
    inches.extend(["--length-unit", "in"]);
    let text = at_columns(&inches, "80");
    assert!(header(&text).contains("slot in/1000"), "{text}");
}

#[test]
fn kind_names_keep_ten_characters_before_the_length_goes() {
    let text = at_columns(
        &[
            "audit",
            "guitar-22edo-mode",
            "--set",
            "steel-guitar-set",
            "--from-instrument",
            "steel-guitar-12edo",
            "--wide",
        ],
        "80",
    );
    assert!(text.contains("plain-steel"), "{text}");
    assert!(!text.contains("plain-ste…"), "{text}");
}

/// Whether `text` holds a figure cut by the table: `…` right after a digit, a sign, a point or
/// a cents mark.
fn cut_figure(text: &str) -> Option<&str> {
    text.lines().find(|line| {
        let chars: Vec<char> = line.chars().collect();
        chars.windows(2).any(|pair| {
            pair[1] == '…' && (pair[0].is_ascii_digit() || matches!(pair[0], '+' | '-' | '.'))
        })
    })
}

#[test]
fn no_number_is_cut_at_80_or_60_columns() {
    let reports: &[&[&str]] = &[
        &["plan", "fanned-8-just", "--wide"],
        &["plan", "guitar-19edo", "--wide"],
        &["plan", "guitar-22edo-mode"],
        &[
            "survey",
            "examples/fanned-8-fourths.yaml",
            "examples/survey-fourths.yaml",
        ],
        &[
            "audit",
            "guitar-22edo-mode",
            "--set",
            "steel-guitar-set",
            "--from-instrument",
            "steel-guitar-12edo",
            "--wide",
        ],
        &[
            "convert",
            "steel-guitar-12edo",
            "--set",
            "steel-guitar-set",
            "--to-instrument",
            "baritone-guitar",
            "--wide",
        ],
        &[
            "plan",
            "steel-guitar-12edo",
            "--tuning",
            "12edo",
            "--tuning",
            "12edo@A4=587.33hz",
            "--tuning",
            "12edo@A4=415hz",
        ],
        &["tuning", "compare", "12edo", "just-5-limit"],
    ];
    for (index, args) in reports.iter().enumerate() {
        // At 60 columns the survey's tuning names are the last thing that can give (`42…`);
        // its figures still never are.
        let widths: &[&str] = if index == 3 { &["80"] } else { &["80", "60"] };
        for &columns in widths {
            let text = at_columns(args, columns);
            assert_eq!(
                cut_figure(&text),
                None,
                "taut {args:?} at {columns} columns cuts a figure:\n{text}"
            );
        }
    }
    // The survey's best candidate keeps its pitches whole (`deg0 B1-35.3c` was `deg0 B1-3…`).
    let text = at_columns(reports[3], "80");
    assert!(text.contains("deg0 B1-35.3c"), "{text}");
}
