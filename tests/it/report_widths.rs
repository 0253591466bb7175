//! Every report of every shipped example fits the terminal: 100 columns when standard output is
//! not a terminal and `COLUMNS` is unset (also with `--wide`), and 80 columns for the compact
//! views under `COLUMNS=80`.

use crate::common;

const INSTRUMENTS: [&str; 7] = [
    "guitar-19edo",
    "lever-harp-34",
    "psaltery-26",
    "fanned-8-just",
    "steel-guitar-12edo",
    "guitar-22edo-mode",
    "baritone-guitar",
];

/// Every report command on every shipped example it applies to.
fn reports() -> Vec<Vec<&'static str>> {
    let mut all = Vec::new();
    for name in INSTRUMENTS {
        all.push(vec!["plan", name]);
        all.push(vec![
            "plan",
            name,
            "--force-unit",
            "lbf",
            "--length-unit",
            "in",
        ]);
    }
    for name in ["steel-guitar-12edo", "guitar-22edo-mode", "baritone-guitar"] {
        all.push(vec!["audit", name, "--set", "steel-guitar-set"]);
        all.push(vec![
            "convert",
            "steel-guitar-12edo",
            "--set",
            "steel-guitar-set",
            "--to-instrument",
            name,
        ]);
    }
    all.push(vec![
        "audit",
        "guitar-22edo-mode",
        "--set",
        "steel-guitar-set",
        "--from-instrument",
        "steel-guitar-12edo",
    ]);
    all.push(vec!["lengths", "psaltery-layout"]);
    all.push(vec!["lengths", "lever-harp-36-layout"]);
    all.push(vec!["lengths", "psaltery-44-layout"]);
    all.push(vec!["lengths", "psaltery-layout", "--force-unit", "kgf"]);
    for tuning in [
        "12edo",
        "19edo",
        "53edo",
        "diamond-7-limit",
        "harmonics-8-16",
    ] {
        all.push(vec!["tuning", "show", tuning]);
        all.push(vec!["tuning", "fit", tuning]);
    }
    all.push(vec!["tuning", "compare", "12edo", "just-5-limit"]);
    all.push(vec!["tuning", "find", "31edo", "A4", "~E2", "5/4", "~Bb4"]);
    all.push(vec!["tuning", "list"]);
    all
}

fn widest(args: &[&str], columns: Option<&str>) -> (usize, String) {
    let mut command = common::taut();
    command.args(args);
    match columns {
        Some(columns) => command.env("COLUMNS", columns),
        None => command.env_remove("COLUMNS"),
    };
    let output = command.output().unwrap();
    assert!(
        output.status.success(),
        "taut {args:?}: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    let text = String::from_utf8(output.stdout).unwrap();
    let widest = text
        .lines()
        .map(|line| line.chars().count())
        .max()
        .unwrap_or(0);
    (widest, text)
}

#[test]
fn every_report_fits_100_columns_when_not_a_terminal() {
    for args in reports() {
        let (width, text) = widest(&args, None);
        assert!(width <= 100, "taut {args:?} is {width} wide:\n{text}");
        let mut wide = args.clone();
        wide.push("--wide");
        let (width, text) = widest(&wide, None);
        assert!(width <= 100, "taut {wide:?} is {width} wide:\n{text}");
    }
}

#[test]
fn compact_views_fit_80_columns_and_columns_is_honoured() {
    for args in reports() {
        let (width, text) = widest(&args, Some("80"));
        assert!(
            width <= 80,
            "taut {args:?} at COLUMNS=80 is {width} wide:\n{text}"
        );
    }
    // A wide terminal lets the detail view spread out; a narrow one leaves columns out and
    // says which.
    let (wide, _) = widest(&["plan", "lever-harp-34", "--wide"], Some("160"));
    assert!(wide > 100, "COLUMNS=160 was not used: {wide}");
    let (narrow, text) = widest(&["plan", "fanned-8-just", "--wide"], Some("60"));
    assert!(narrow <= 60, "{text}");
    assert!(text.contains("Left out for width:"), "{text}");
}

/// The reports of `frets`, `survey` and one set for several tunings (side-by-side tables).
fn other_reports() -> Vec<Vec<&'static str>> {
    vec![
        vec!["frets", "guitar-19edo"],
        vec!["frets", "guitar-19edo", "--up-to", "200mm"],
        vec!["frets", "fanned-8-just"],
        vec![
            "frets",
            "fanned-8-just",
            "--count",
            "4",
            "--merge-within",
            "22c",
        ],
        vec!["frets", "lever-harp-34"],
        vec![
            "survey",
            "examples/fanned-8-fourths.yaml",
            "examples/survey-fourths.yaml",
        ],
        vec![
            "plan",
            "steel-guitar-12edo",
            "--tuning",
            "12edo",
            "--tuning",
            "12edo@A4=587.33hz",
        ],
        vec![
            "plan",
            "steel-guitar-12edo",
            "--tuning",
            "12edo",
            "--tuning",
            "12edo@A4=587.33hz",
            "--tuning",
            "12edo@A4=415hz",
            "--tuning",
            "12edo@A4=466.16hz",
            "--tuning",
            "12edo@A4=392hz",
            "--force-unit",
            "lbf",
        ],
        vec![
            "audit",
            "steel-guitar-12edo",
            "--set",
            "steel-guitar-set",
            "--tuning",
            "12edo",
            "--tuning",
            "12edo@A4=415hz",
        ],
    ]
}

#[test]
fn frets_survey_and_several_tunings_fit_100_columns() {
    for args in other_reports() {
        let (width, text) = widest(&args, None);
        assert!(width <= 100, "taut {args:?} is {width} wide:\n{text}");
        assert!(text.lines().count() > 3, "taut {args:?}:\n{text}");
    }
}
