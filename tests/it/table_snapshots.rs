//! The look of every command's table, at 100 columns (a file or a pipe) and at 80 (a narrow
//! terminal), held in insta snapshots under `tests/it/snapshots/`. A change of look shows as a
//! snapshot diff to review (`cargo insta review`, or `INSTA_UPDATE=always` and `git diff`).

use crate::common;

/// Every table the commands print, each on a shipped example.
const COMMANDS: &[(&str, &[&str])] = &[
    (
        "compare_set_on_baritone",
        &[
            "compare",
            "steel-guitar-set",
            "steel-guitar-set",
            "--on",
            "steel-guitar-12edo",
            "--after-on",
            "baritone-guitar",
        ],
    ),
    ("plan_guitar_19edo", &["plan", "guitar-19edo"]),
    ("plan_lever_harp", &["plan", "lever-harp-34"]),
    (
        "plan_psaltery_31edo_kgf",
        &[
            "plan",
            "psaltery-26",
            "--tuning",
            "31edo",
            "--tension",
            "80N",
            "--force-unit",
            "kgf",
        ],
    ),
    (
        "plan_alternatives",
        &["plan", "examples/steel-guitar-12edo.yaml", "--alternatives"],
    ),
    (
        "plan_kept_strings",
        &["plan", "examples/guitar-kept-strings.yaml"],
    ),
    (
        "plan_three_tunings",
        &["plan", "examples/guitar-three-tunings.yaml"],
    ),
    (
        "plan_two_references",
        &[
            "plan",
            "steel-guitar-12edo",
            "--tuning",
            "12edo",
            "--tuning",
            "12edo@A4=587.33hz",
        ],
    ),
    (
        "audit_retune",
        &[
            "audit",
            "examples/guitar-22edo-mode.yaml",
            "--set",
            "examples/steel-guitar-set.yaml",
            "--from-instrument",
            "examples/steel-guitar-12edo.yaml",
        ],
    ),
    (
        "audit_two_tunings",
        &[
            "audit",
            "examples/steel-guitar-12edo.yaml",
            "--set",
            "examples/steel-guitar-set.yaml",
            "--tuning",
            "12edo",
            "--tuning",
            "12edo@A4=587.33hz",
        ],
    ),
    (
        "convert_baritone",
        &[
            "convert",
            "examples/steel-guitar-12edo.yaml",
            "--set",
            "examples/steel-guitar-set.yaml",
            "--to-instrument",
            "examples/baritone-guitar.yaml",
        ],
    ),
    (
        "convert_transpose",
        &[
            "convert",
            "examples/steel-guitar-12edo.yaml",
            "--set",
            "examples/steel-guitar-set.yaml",
            "--transpose",
            "-5",
            "--scale-length",
            "27in",
            "--keep-feel",
            "bend",
        ],
    ),
    (
        "lengths_psaltery",
        &["lengths", "examples/psaltery-layout.yaml"],
    ),
    (
        "lengths_zither_pairs",
        &["lengths", "examples/zither-pairs-layout.yaml"],
    ),
    (
        "frets_guitar_19edo",
        &["frets", "guitar-19edo", "--up-to", "200mm"],
    ),
    (
        "frets_fanned_merged",
        &[
            "frets",
            "fanned-8-just",
            "--count",
            "4",
            "--merge-within",
            "22c",
        ],
    ),
    (
        "survey_fourths",
        &[
            "survey",
            "examples/fanned-8-fourths.yaml",
            "examples/survey-fourths.yaml",
        ],
    ),
    ("tuning_show", &["tuning", "show", "19edo", "--to", "4"]),
    ("tuning_fit", &["tuning", "fit", "12edo", "--limit", "5"]),
    (
        "tuning_compare",
        &["tuning", "compare", "12edo", "just-5-limit", "--to", "4"],
    ),
    (
        "tuning_find",
        &[
            "tuning",
            "find",
            "31edo@A4=415",
            "A4",
            "~E2",
            "deg-8",
            "deg3p1",
            "5/4",
        ],
    ),
    ("tuning_list", &["tuning", "list"]),
    ("plan_wide", &["plan", "guitar-19edo", "--wide"]),
    (
        "audit_wide",
        &[
            "audit",
            "examples/guitar-22edo-mode.yaml",
            "--set",
            "examples/steel-guitar-set.yaml",
            "--from-instrument",
            "examples/steel-guitar-12edo.yaml",
            "--wide",
        ],
    ),
    (
        "convert_wide",
        &[
            "convert",
            "examples/steel-guitar-12edo.yaml",
            "--set",
            "examples/steel-guitar-set.yaml",
            "--to-instrument",
            "examples/baritone-guitar.yaml",
            "--wide",
        ],
    ),
    (
        "lengths_wide",
        &["lengths", "examples/psaltery-layout.yaml", "--wide"],
    ),
];

/// The survey says how long it took; the snapshot holds the rest.
fn without_timing(report: &str) -> String {
    let mut out = String::with_capacity(report.len());
    let mut rest = report;
    while let Some(start) = rest.find("checks in ") {
        let after = start + "checks in ".len();
        out.push_str(&rest[..after]);
        let figures = rest[after..].find(" s").filter(|&end| {
            rest[after..after + end]
                .chars()
                .all(|c| c.is_ascii_digit() || c == '.')
        });
        match figures {
            Some(end) => {
                out.push_str("[time]");
                rest = &rest[after + end..];
            }
            None => rest = &rest[after..],
        }
    }
    out.push_str(rest);
    out
}

fn table_at(columns: usize, args: &[&str]) -> String {
    let output = common::taut()
        .args(args)
        .env("COLUMNS", columns.to_string())
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "taut {args:?} failed: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    let text = String::from_utf8(output.stdout).unwrap();
    for line in text.lines() {
        assert!(
            line.chars().count() <= columns,
            "taut {args:?} at {columns} columns wrote a line of {}: {line}",
            line.chars().count()
        );
    }
    without_timing(&text)
}

#[test]
fn every_table_keeps_its_look_at_100_and_80_columns() {
    let mut settings = insta::Settings::clone_current();
    settings.set_prepend_module_to_snapshot(false);
    settings.set_omit_expression(true);
    settings.bind(|| {
        for (name, args) in COMMANDS {
            for columns in [100, 80] {
                insta::assert_snapshot!(format!("{name}_{columns}"), table_at(columns, args));
            }
        }
    });
}

#[test]
fn the_survey_timing_is_the_only_thing_taken_out() {
    assert_eq!(
        without_timing("1 candidates, 8 course checks in 0.119 s; 2 stringable"),
        "1 candidates, 8 course checks in [time] s; 2 stringable"
    );
    assert_eq!(without_timing("checks in total"), "checks in total");
}
