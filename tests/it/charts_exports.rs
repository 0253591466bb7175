//! Exports: the builder's string chart (HTML structure checked with an HTML parser, CSV), CSV and
//! YAML for every report with the JSON field names, the plan's JSON/YAML read back as a string
//! set, output files replaced whole or left alone, completions and manual pages.

use std::fs;
use std::path::Path;

use crate::common::{json, taut};
use scraper::{Html, Selector};
use taut::plan::Plan;
use taut::sets::set::{SetString, StringSet};
use taut::strings::stock::Stock;

fn run_ok(args: &[&str]) -> Vec<u8> {
    let output = taut().args(args).output().unwrap();
    assert!(
        output.status.success(),
        "taut {args:?}: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    output.stdout
}

fn select<'a>(page: &'a Html, css: &str) -> Vec<scraper::ElementRef<'a>> {
    page.select(&Selector::parse(css).unwrap()).collect()
}

/// The same strings on the same courses: kinds equal, diameters within 1 nm (the set file
/// writes diameters as short decimals in inches, which parse back within float rounding).
fn same_strings(left: &StringSet, right: &StringSet) -> bool {
    left.courses.len() == right.courses.len()
        && left.courses.iter().zip(&right.courses).all(|(a, b)| {
            a.course == b.course
                && a.strings.len() == b.strings.len()
                && a.strings.iter().zip(&b.strings).all(|pair| match pair {
                    (
                        SetString::Kind {
                            kind: k1,
                            diameter: d1,
                            core_diameter: c1,
                        },
                        SetString::Kind {
                            kind: k2,
                            diameter: d2,
                            core_diameter: c2,
                        },
                    ) => k1 == k2 && (d1 - d2).abs() < 1e-9 && c1 == c2,
                    _ => false,
                })
        })
}

/// Two JSON documents equal up to the last bits of their floats (YAML writes and reads floats
/// through another formatter).
fn same_document(left: &serde_json::Value, right: &serde_json::Value) -> bool {
    use serde_json::Value;
    match (left, right) {
        (Value::Number(a), Value::Number(b)) => {
            let (a, b) = (a.as_f64().unwrap(), b.as_f64().unwrap());
            (a - b).abs() <= 1e-12 * a.abs().max(b.abs()).max(1e-300)
        }
        (Value::Array(a), Value::Array(b)) => {
            a.len() == b.len() && a.iter().zip(b).all(|(x, y)| same_document(x, y))
        }
        (Value::Object(a), Value::Object(b)) => {
            a.len() == b.len()
                && a.iter()
                    .all(|(k, v)| b.get(k).is_some_and(|w| same_document(v, w)))
        }
        (a, b) => a == b,
    }
}

fn names_in(folder: &Path) -> Vec<String> {
    let mut names: Vec<String> = fs::read_dir(folder)
        .unwrap()
        .map(|e| e.unwrap().file_name().to_string_lossy().to_string())
        .collect();
    names.sort();
    names
}

#[test]
fn the_string_chart_page_is_complete_and_self_contained() {
    let folder = tempfile::tempdir().unwrap();
    let path = folder.path().join("chart.html");
    let path_text = path.to_str().unwrap();
    run_ok(&["plan", "fanned-8-just", "--string-chart", path_text]);
    let plan = json(&["plan", "fanned-8-just"]);
    let strings: usize = plan["courses"]
        .as_array()
        .unwrap()
        .iter()
        .map(|c| c["strings"].as_array().unwrap().len())
        .sum();
    let text = fs::read_to_string(&path).unwrap();
    let page = Html::parse_document(&text);
    assert!(text.starts_with("<!DOCTYPE html>"));
    assert_eq!(select(&page, "html[lang=en]").len(), 1);
    assert_eq!(select(&page, "meta[charset=utf-8]").len(), 1);
    let title = select(&page, "title")[0].text().collect::<String>();
    assert!(
        title.contains(plan["instrument"].as_str().unwrap()),
        "{title}"
    );
    // One table row per string, and the columns a builder needs.
    assert_eq!(
        select(&page, "section.strings table tbody tr").len(),
        strings
    );
    let heads: Vec<String> = select(&page, "thead th")
        .iter()
        .map(|th| th.text().collect())
        .collect();
    for column in [
        "Pitch",
        "Length mm",
        "Kind",
        "Gauge",
        "⌀ mm",
        "Tension N",
        "Stress %",
    ] {
        assert!(
            heads.iter().any(|h| h == column),
            "no {column} in {heads:?}"
        );
    }
    // The three plan charts, inline, each a figure with a caption.
    for name in ["tension", "stress", "diameter"] {
        let figure = select(&page, &format!("figure#chart-{name}"));
        assert_eq!(figure.len(), 1, "{name}");
        assert_eq!(
            select(&page, &format!("figure#chart-{name} > svg")).len(),
            1
        );
        assert_eq!(
            select(&page, &format!("figure#chart-{name} > figcaption")).len(),
            1
        );
    }
    // The safety cautions are there, and nothing is loaded from anywhere.
    assert!(select(&page, "section.cautions li").len() >= 3);
    assert!(select(&page, "script, link, img, iframe, object, embed").is_empty());
    let linked: Vec<String> = select(&page, "[src], [href]")
        .iter()
        .map(|e| e.html())
        .collect();
    assert!(linked.is_empty(), "external references: {linked:?}");
    assert!(
        !text.contains("http://")
            || text.matches("http://").count()
                == text.matches("http://www.w3.org/2000/svg").count()
    );
    assert!(!text.contains("https://"));
    assert!(!text.contains("@import") && !text.contains("url("));
    // Print styles for A4 and Letter: page margins, no fixed paper size, header rows repeat.
    let style = select(&page, "style")[0].text().collect::<String>();
    assert!(style.contains("@page { margin: 12mm; }"));
    assert!(style.contains("@media print"));
    assert!(style.contains("thead { display: table-header-group; }"));
    for paper in ["size: A4", "size: letter", "size: Letter"] {
        assert!(!style.contains(paper));
    }
}

#[test]
fn the_string_chart_csv_has_one_row_per_string() {
    let folder = tempfile::tempdir().unwrap();
    let path = folder.path().join("chart.csv");
    run_ok(&[
        "plan",
        "guitar-19edo",
        "--string-chart",
        path.to_str().unwrap(),
    ]);
    let text = fs::read_to_string(&path).unwrap();
    let lines: Vec<&str> = text.lines().collect();
    assert_eq!(
        lines[0],
        "course,string,pitch,note,pitch_hz,length_mm,kind,gauge,diameter_mm,diameter_in,tension_n,tension_lbf,stress_pct,flag"
    );
    assert_eq!(lines.len(), 7);
    let plan = json(&["plan", "guitar-19edo"]);
    let first = &plan["courses"][0]["strings"][0];
    let cells: Vec<&str> = lines[1].split(',').collect();
    assert_eq!(cells[6], first["kind"].as_str().unwrap());
    let tension: f64 = cells[10].parse().unwrap();
    assert!((tension - first["tension_n"].as_f64().unwrap()).abs() <= 0.05);
}

#[test]
fn a_plan_exported_as_json_or_yaml_reads_back_as_the_same_string_set() {
    let folder = tempfile::tempdir().unwrap();
    let set_path = folder.path().join("set.yaml");
    let stock = Stock::builtin().unwrap();
    for example in ["guitar-19edo", "fanned-8-just", "lever-harp-34"] {
        let json_text = run_ok(&[
            "plan",
            example,
            "--format",
            "json",
            "--save-set",
            set_path.to_str().unwrap(),
        ]);
        let saved = StringSet::load(&set_path, stock).unwrap();
        let from_json: Plan = serde_json::from_slice(&json_text).unwrap();
        assert!(
            same_strings(&StringSet::from_plan(&from_json), &saved),
            "{example} (JSON)"
        );
        let yaml_text = String::from_utf8(run_ok(&["plan", example, "--format", "yaml"])).unwrap();
        let from_yaml: Plan = taut::input::yaml::parse(&yaml_text, "export.yaml").unwrap();
        assert!(
            same_strings(&StringSet::from_plan(&from_yaml), &saved),
            "{example} (YAML)"
        );
        // And the two exports say the same thing.
        assert!(same_document(
            &serde_json::to_value(&from_yaml).unwrap(),
            &serde_json::to_value(&from_json).unwrap()
        ));
    }
}

/// Every report: YAML holds the same document as JSON, and CSV's header uses the plan's field
/// names for the string reports and the JSON names for the others.
#[test]
fn every_report_exports_as_csv_and_yaml_with_the_json_field_names() {
    let reports: [(&[&str], &str, &[&str]); 8] = [
        (
            &[
                "audit",
                "examples/guitar-22edo-mode.yaml",
                "--set",
                "examples/steel-guitar-set.yaml",
            ],
            "courses",
            &[
                "course",
                "pitch_hz",
                "verdict",
                "tension_n",
                "reference_tension_n",
                "inharmonicity",
            ],
        ),
        (
            &[
                "convert",
                "examples/steel-guitar-12edo.yaml",
                "--set",
                "examples/steel-guitar-set.yaml",
                "--to-instrument",
                "examples/baritone-guitar.yaml",
            ],
            "courses",
            &["course", "pitch_before", "tension_n", "tension_n_before"],
        ),
        (
            &["lengths", "examples/psaltery-layout.yaml"],
            "courses",
            &["course", "length_m", "tension_n", "inharmonicity"],
        ),
        (
            &["tuning", "show", "19edo", "--to", "4"],
            "rows",
            &["degree", "cents_from_reference", "hz"],
        ),
        (
            &["tuning", "fit", "12edo", "--limit", "5"],
            "intervals",
            &["interval", "just_cents", "error_cents"],
        ),
        (
            &["tuning", "compare", "12edo", "just-5-limit", "--to", "4"],
            "rows",
            &["left_degree", "difference_cents"],
        ),
        (
            &["tuning", "find", "31edo", "A4", "5/4"],
            "pitches",
            &["written", "nearest_note"],
        ),
        (&["tuning", "list"], "tunings", &["name", "description"]),
    ];
    for (args, list, columns) in reports {
        let from_json = json(args);
        let mut yaml_args = args.to_vec();
        yaml_args.extend(["--format", "yaml"]);
        let yaml_text = String::from_utf8(run_ok(&yaml_args)).unwrap();
        let from_yaml: serde_json::Value = taut::input::yaml::parse(&yaml_text, "export").unwrap();
        assert!(same_document(&from_yaml, &from_json), "{args:?}");
        let mut csv_args = args.to_vec();
        csv_args.extend(["--format", "csv"]);
        let csv_text = String::from_utf8(run_ok(&csv_args)).unwrap();
        let mut reader = csv::Reader::from_reader(csv_text.as_bytes());
        let header: Vec<String> = reader
            .headers()
            .unwrap()
            .iter()
            .map(str::to_string)
            .collect();
        for column in columns {
            assert!(
                header.iter().any(|h| h == column),
                "{args:?}: no {column} in {header:?}"
            );
        }
        let items = from_json[list].as_array().unwrap();
        let per_item: usize = items
            .iter()
            .map(|item| item["strings"].as_array().map_or(1, Vec::len))
            .sum();
        assert_eq!(reader.records().count(), per_item, "{args:?}");
        assert!(
            !csv_text.contains("NaN") && !csv_text.contains("inf") && !csv_text.contains("null"),
            "{args:?}"
        );
    }
}

#[test]
fn output_files_are_replaced_whole_and_left_alone_on_refusal() {
    let folder = tempfile::tempdir().unwrap();
    let dir = folder.path();
    let png = dir.join("tension.png");
    let html = dir.join("chart.html");
    fs::write(&png, "old picture").unwrap();
    fs::write(&html, "old page").unwrap();
    // Overwriting needs no --force: a file is replaced whole, and no temporary file stays.
    taut()
        .current_dir(dir)
        .args([
            "plan",
            "guitar-19edo",
            "--plot",
            "tension.png",
            "--string-chart",
            "chart.html",
        ])
        .assert()
        .success();
    assert!(fs::read(&png).unwrap().starts_with(b"\x89PNG"));
    assert!(fs::read_to_string(&html)
        .unwrap()
        .starts_with("<!DOCTYPE html>"));
    assert_eq!(names_in(dir), ["chart.html", "tension.png"]);
    // A refused option (bad chart name, bad extension, bad size) writes nothing at all.
    for bad in [
        vec!["--plot", "tension.png", "--plot", "loudness=x.svg"],
        vec!["--plot", "tension.gif"],
        vec!["--plot", "tension.png", "--plot-size", "20x20"],
        vec!["--string-chart", "chart.pdf", "--plot", "tension.png"],
    ] {
        fs::write(&png, "old picture").unwrap();
        let output = taut()
            .current_dir(dir)
            .args(["plan", "guitar-19edo"])
            .args(&bad)
            .output()
            .unwrap();
        assert_eq!(output.status.code(), Some(2), "{bad:?}");
        assert!(output.stdout.is_empty());
        assert_eq!(fs::read_to_string(&png).unwrap(), "old picture", "{bad:?}");
        assert_eq!(names_in(dir), ["chart.html", "tension.png"], "{bad:?}");
    }
    // A folder that does not exist: exit 1, nothing left behind anywhere.
    let output = taut()
        .current_dir(dir)
        .args(["plan", "guitar-19edo", "--plot", "missing/tension.svg"])
        .output()
        .unwrap();
    assert_eq!(output.status.code(), Some(1));
    assert_eq!(names_in(dir), ["chart.html", "tension.png"]);
}

#[test]
fn reports_piped_elsewhere_carry_no_colour_codes() {
    // Standard output here is a pipe, not a terminal: never any escape codes, with or without
    // NO_COLOR.
    for no_colour in [None, Some("1")] {
        let mut command = taut();
        command.args(["plan", "guitar-19edo", "--tension", "250N"]);
        if let Some(value) = no_colour {
            command.env("NO_COLOR", value);
        }
        let output = command.output().unwrap();
        let text = String::from_utf8(output.stdout).unwrap();
        assert!(text.contains("caution") && !text.contains('\u{1b}'));
    }
}

#[test]
fn completions_and_manual_pages_come_from_the_command_line() {
    let bash = String::from_utf8(run_ok(&["generate", "completions", "bash"])).unwrap();
    assert!(bash.contains("_taut()") && bash.contains("--plot") && bash.contains("--string-chart"));
    let zsh = String::from_utf8(run_ok(&["generate", "completions", "zsh"])).unwrap();
    assert!(zsh.starts_with("#compdef taut"));
    let man = String::from_utf8(run_ok(&["generate", "man"])).unwrap();
    assert!(man.contains(".TH taut 1") && man.contains("plan"));
    let folder = tempfile::tempdir().unwrap();
    run_ok(&["generate", "man", "--dir", folder.path().to_str().unwrap()]);
    let names = names_in(folder.path());
    for page in ["taut.1", "taut-plan.1", "taut-audit.1", "taut-generate.1"] {
        assert!(names.iter().any(|n| n == page), "{names:?}");
    }
    let plan_page = fs::read_to_string(folder.path().join("taut-plan.1")).unwrap();
    assert!(plan_page.contains("\\-\\-plot") && plan_page.contains("\\-\\-string\\-chart"));
}
