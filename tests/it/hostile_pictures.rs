//! Hostile input, third round (issue 25), the pictures: whatever the names in the files hold
//! (control characters, markup, CJK, very long text), every SVG taut writes is well-formed XML,
//! the HTML string chart carries no markup from a name, and long names are cut before they are
//! drawn.

use std::fs;
use std::path::Path;

use proptest::prelude::*;
use taut::charts::label::{label, MAX_LABEL_CHARS};

use crate::common::taut;

/// `text` as a YAML double-quoted scalar, every character YAML will not hold raw escaped.
fn quoted(text: &str) -> String {
    let mut out = String::from("\"");
    for c in text.chars() {
        match c {
            '"' => out.push_str("\\\""),
            '\\' => out.push_str("\\\\"),
            c if c.is_control()
                || matches!(c, '\u{2028}' | '\u{2029}' | '\u{fffe}' | '\u{ffff}') =>
            {
                out.push_str(&format!("\\u{:04X}", u32::from(c)));
            }
            c => out.push(c),
        }
    }
    out.push('"');
    out
}

/// A folder with a tuning, an instrument and a layout named `tuning_name` and `name`, and the
/// set planned for the instrument.
fn folder_named(name: &str, tuning_name: &str) -> tempfile::TempDir {
    let dir = tempfile::tempdir().unwrap();
    let put = |file: &str, text: String| fs::write(dir.path().join(file), text).unwrap();
    put(
        "t.yaml",
        format!(
            "name: {}\ndescription: {}\ndivisions: 12\n",
            quoted(tuning_name),
            quoted(tuning_name)
        ),
    );
    put(
        "one.yaml",
        format!(
            "name: {}\nabout: {}\ntuning: t.yaml\nscale_length: 648mm\ndefaults:\n  tension: {{target: 70N, min: 40N, max: 110N}}\n  kinds: [plain-steel, phosphor-bronze-wound]\ncourses:\n  - {{course: 1, pitch: ~E4}}\n  - {{course: 2, pitch: ~B3}}\n  - {{course: 3, pitch: ~G3}}\n",
            quoted(name),
            quoted(name)
        ),
    );
    put(
        "layout.yaml",
        format!(
            "name: {}\ntuning: t.yaml\ntension: {{first: 60N, last: 60N, min: 40N, max: 80N}}\ncourses:\n  - {{pitch: E4, string: {{kind: plain-steel, diameter: 0.010in}}}}\n  - {{pitch: B3, string: {{kind: plain-steel, diameter: 0.013in}}}}\n",
            quoted(name)
        ),
    );
    run(
        dir.path(),
        &[
            "plan",
            "one.yaml",
            "--save-set",
            "set.yaml",
            "-o",
            "/dev/null",
        ],
    );
    dir
}

fn run(dir: &Path, args: &[&str]) {
    let output = taut().current_dir(dir).args(args).output().unwrap();
    assert!(
        output.status.success(),
        "taut {args:?}: {}",
        String::from_utf8_lossy(&output.stderr)
    );
}

/// Every picture and page taut draws, from the folder: (file name, contents).
fn every_picture(dir: &Path, format: &str) -> Vec<(String, Vec<u8>)> {
    let p = |name: &str| format!("{name}.{format}");
    let plots = |charts: &[&str], prefix: &str| -> Vec<String> {
        charts
            .iter()
            .flat_map(|chart| {
                [
                    "--plot".to_string(),
                    format!("{chart}={}", p(&format!("{prefix}-{chart}"))),
                ]
            })
            .collect()
    };
    let mut runs: Vec<Vec<String>> = vec![
        [
            "plan",
            "one.yaml",
            "-o",
            "/dev/null",
            "--string-chart",
            "sheet.html",
        ]
        .map(String::from)
        .into_iter()
        .chain(plots(&["tension", "stress", "diameter"], "plan"))
        .collect(),
        ["audit", "one.yaml", "--set", "set.yaml", "-o", "/dev/null"]
            .map(String::from)
            .into_iter()
            .chain(plots(&["tension", "stress"], "audit"))
            .collect(),
        [
            "convert",
            "one.yaml",
            "--set",
            "set.yaml",
            "--to",
            "19edo",
            "-o",
            "/dev/null",
        ]
        .map(String::from)
        .into_iter()
        .chain(plots(&["tension", "stress"], "convert"))
        .collect(),
        ["lengths", "layout.yaml", "-o", "/dev/null"]
            .map(String::from)
            .into_iter()
            .chain(plots(&["lengths"], "lengths"))
            .collect(),
        ["tuning", "fit", "t.yaml", "-o", "/dev/null"]
            .map(String::from)
            .into_iter()
            .chain(plots(&["errors"], "fit"))
            .collect(),
    ];
    if format == "svg" {
        runs.push(
            ["frets", "one.yaml", "--format", "svg", "-o", "frets.svg"]
                .map(String::from)
                .to_vec(),
        );
    }
    for args in &runs {
        let args: Vec<&str> = args.iter().map(String::as_str).collect();
        run(dir, &args);
    }
    let mut found: Vec<(String, Vec<u8>)> = fs::read_dir(dir)
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|path| path.extension().is_some_and(|e| e == format || e == "html"))
        .map(|path| {
            (
                path.file_name().unwrap().to_string_lossy().to_string(),
                fs::read(&path).unwrap(),
            )
        })
        .collect();
    found.sort();
    let expected = if format == "svg" { 11 } else { 10 };
    assert_eq!(
        found.len(),
        expected,
        "{:?}",
        found.iter().map(|f| &f.0).collect::<Vec<_>>()
    );
    found
}

/// Parses an SVG document as XML 1.0, failing with the parser's reason.
fn well_formed(name: &str, text: &str) {
    if let Err(err) = roxmltree::Document::parse(text) {
        panic!("{name} is not well-formed XML: {err}");
    }
}

/// Checks the string chart page: every inline SVG is well-formed, no element came from a
/// name, and the heading shows the names as text.
fn check_page(text: &str, name: &str, tuning_name: &str) {
    let page = scraper::Html::parse_document(text);
    let select = |css: &str| scraper::Selector::parse(css).unwrap();
    assert_eq!(
        page.select(&select("script")).count(),
        0,
        "a name made a script"
    );
    assert_eq!(page.select(&select("h1")).count(), 1);
    let heading = page.select(&select("h1")).next().unwrap();
    assert_eq!(heading.children().count(), 1, "markup inside the heading");
    let shown: String = heading.text().collect();
    // An HTML parser turns CR and CR LF into LF before anything else (HTML Living Standard,
    // 13.2.3.5 "Preprocessing the input stream"), so the expected text gets the same treatment.
    let expected = format!("String chart: {} in {}", label(name), label(tuning_name))
        .replace("\r\n", "\n")
        .replace('\r', "\n");
    assert_eq!(
        shown, expected,
        "the heading does not show the names as text"
    );
    let figures = page.select(&select("figure")).count();
    assert_eq!(figures, 3);
    let mut rest = text;
    let mut inline = 0;
    while let Some(start) = rest.find("<svg") {
        let end = rest[start..].find("</svg>").unwrap() + start + "</svg>".len();
        well_formed("an inline chart", &rest[start..end]);
        rest = &rest[end..];
        inline += 1;
    }
    assert_eq!(inline, figures);
}

/// Names as hostile as a file can hold: control characters (those XML forbids among them),
/// markup, quotes, CJK, U+FFFE and U+FFFF, and now and then a very long one.
fn hostile_name() -> impl Strategy<Value = String> {
    let piece = prop_oneof![
        "[\\x00-\\x1f\\x7f-\\x9f]",
        Just("<".to_string()),
        Just(">".to_string()),
        Just("&".to_string()),
        Just("\"".to_string()),
        Just("'".to_string()),
        Just("</svg>".to_string()),
        Just("<script>alert(1)</script>".to_string()),
        Just("]]>".to_string()),
        Just("&amp;".to_string()),
        Just("\u{fffe}\u{ffff}".to_string()),
        Just("\u{85}\u{2028}".to_string()),
        "[\u{4e00}-\u{4e80}]{1,4}",
        "[a-zA-Z0-9 ]{1,8}",
    ];
    (
        prop::collection::vec(piece, 1..12),
        prop_oneof![4 => Just(0_usize), 1 => Just(MAX_LABEL_CHARS * 3)],
    )
        .prop_map(|(pieces, padding)| format!("n{}{}", pieces.concat(), "長".repeat(padding)))
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 8, ..ProptestConfig::default() })]

    #[test]
    fn every_svg_and_page_parses_whatever_the_names_hold(
        name in hostile_name(),
        tuning_name in hostile_name(),
    ) {
        let dir = folder_named(&name, &tuning_name);
        for (file, bytes) in every_picture(dir.path(), "svg") {
            let text = String::from_utf8(bytes).unwrap();
            if file.ends_with(".html") {
                check_page(&text, &name, &tuning_name);
            } else {
                well_formed(&file, &text);
            }
        }
    }
}

#[test]
fn a_vertical_tab_and_an_escape_in_names_make_well_formed_svg() {
    // The two characters the outside battery used: XML 1.0's Char production (§2.2) excludes
    // U+000B and U+001B, so an SVG holding them raw is refused by browsers.
    let dir = folder_named("guitar\u{b}one\u{1b}[31m", "tuning\u{b}\u{1b}");
    for (file, bytes) in every_picture(dir.path(), "svg") {
        let text = String::from_utf8(bytes).unwrap();
        assert!(!text.contains(['\u{b}', '\u{1b}']), "{file}");
        if file.ends_with(".html") {
            check_page(&text, "guitar\u{b}one\u{1b}[31m", "tuning\u{b}\u{1b}");
        } else {
            well_formed(&file, &text);
        }
    }
}

#[test]
fn long_names_are_cut_before_they_are_drawn() {
    // A 100,000-character name: every picture and page holds at most a label's length of it
    // (the cost of text is bounded by what is drawn, so this bounds the work).
    let long = "x".repeat(100_000);
    let dir = folder_named(&long, &format!("tuning {long}"));
    let too_long = "x".repeat(MAX_LABEL_CHARS + 1);
    for format in ["svg", "png"] {
        for (file, bytes) in every_picture(dir.path(), format) {
            assert!(bytes.len() < 2_000_000, "{file}: {} bytes", bytes.len());
            if let Ok(text) = String::from_utf8(bytes) {
                assert!(!text.contains(&too_long), "{file} holds the whole name");
                assert!(text.contains("xxx…"), "{file} does not show the cut name");
            }
        }
    }
}
