//! The order sheet (`--order-sheet FILE`): a string maker's sheet per string. Its core and wrap
//! figures must give back each string's unit mass, recomputed here from the published
//! construction model (REFERENCES §6.1 one close-wound layer, §6.2 hexagonal cores and further
//! layers), with densities read from taut's own material data (the model is what is checked,
//! not the densities); the cut length is anchor + vibrating + post (REFERENCES §12.2); the colour
//! marking follows common practice (REFERENCES §12.1).

use std::collections::HashMap;
use std::path::Path;

use crate::common::{self, number, taut, write_file};

/// Density of every shipped material, kg/m³, read from the shipped YAML.
fn densities() -> HashMap<String, f64> {
    let text = std::fs::read_to_string(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("src/strings/data/materials.yaml"),
    )
    .unwrap();
    let value: serde_yaml::Value = serde_yaml::from_str(&text).unwrap();
    let mut out = HashMap::new();
    for material in value["materials"].as_sequence().unwrap() {
        let id = material["id"].as_str().unwrap().to_string();
        let density = material["density"].as_str().unwrap();
        let figure: f64 = density.trim_end_matches("kg/m3").trim().parse().unwrap();
        out.insert(id, figure);
    }
    out
}

/// Area of a core of nominal diameter `d` (m): a circle, or a regular hexagon, (3√3/2)·R², with
/// R = d/2 across the corners or d/√3 across the flats (REFERENCES §6.2).
fn core_area(shape: &str, d: f64) -> f64 {
    let hexagon = |r: f64| 1.5 * 3f64.sqrt() * r * r;
    match shape {
        "round" => std::f64::consts::PI * d * d / 4.0,
        "hex-across-corners" => hexagon(d / 2.0),
        "hex-across-flats" => hexagon(d / 3f64.sqrt()),
        other => panic!("unknown core shape {other}"),
    }
}

/// μ of a string from the sheet's row (REFERENCES §6.1: a wrap of wire w on a diameter c adds
/// ρ·π²·w·(c + w)/4; each further layer sits on the one beneath).
fn unit_mass_from_row(row: &HashMap<String, String>, densities: &HashMap<String, f64>) -> f64 {
    let mm = |name: &str| row[name].parse::<f64>().unwrap() / 1000.0;
    let core_d = mm("core_diameter_mm");
    let mut mu = densities[&row["core_material"]] * core_area(&row["core_shape"], core_d);
    let mut under = core_d;
    for layer in ["inner_wrap", "outer_wrap"] {
        let material = &row[&format!("{layer}_material")];
        if material.is_empty() {
            continue;
        }
        let w = mm(&format!("{layer}_mm"));
        mu += densities[material] * std::f64::consts::PI.powi(2) * w * (under + w) / 4.0;
        under += 2.0 * w;
    }
    // Outer diameter = core + 2 × each wrap (REFERENCES §6.1).
    let outer = mm("outer_diameter_mm");
    assert!(
        (under - outer).abs() <= 1e-3 * outer,
        "outer diameter {outer} against core and wraps {under}"
    );
    mu
}

fn read_csv(path: &Path) -> Vec<HashMap<String, String>> {
    let mut reader = csv::Reader::from_path(path).unwrap();
    let header: Vec<String> = reader
        .headers()
        .unwrap()
        .iter()
        .map(str::to_string)
        .collect();
    reader
        .records()
        .map(|record| {
            header
                .iter()
                .cloned()
                .zip(record.unwrap().iter().map(str::to_string))
                .collect()
        })
        .collect()
}

/// A harp with plain nylon trebles, single- and double-wound basses, and its anchor and post
/// lengths (an invented scenario).
const HARP: &str = "name: Order-sheet test harp
tuning: 12edo
defaults:
  tension: 120N
  anchor_length: 25mm
  post_length: 60mm
courses:
  - {pitch: C5, scale_length: 300mm, kinds: [nylon]}
  - {pitch: F4, scale_length: 450mm, kinds: [nylon], post_length: 75mm}
  - {pitch: C3, scale_length: 900mm, kinds: [copper-wound-steel]}
  - {pitch: F2, scale_length: 1100mm, kinds: [copper-double-wound-steel]}
";

#[test]
fn core_and_wraps_give_back_each_strings_unit_mass_within_a_tenth_of_a_percent() {
    let folder = tempfile::tempdir().unwrap();
    let harp = write_file(folder.path(), "harp.yaml", HARP);
    let densities = densities();
    for (instrument, kinds_expected) in [
        (harp.to_str().unwrap(), 3),
        ("steel-guitar-12edo", 2),
        ("lever-harp-34", 2),
    ] {
        let sheet = folder.path().join("order.csv");
        let plan = common::json(&["plan", instrument, "--order-sheet", sheet.to_str().unwrap()]);
        let rows = read_csv(&sheet);
        let mut builds = std::collections::BTreeSet::new();
        let mut index = 0;
        for course in plan["courses"].as_array().unwrap() {
            for string in course["strings"].as_array().unwrap() {
                let row = &rows[index];
                index += 1;
                assert_eq!(row["kind"], string["kind"].as_str().unwrap());
                let planned = number(&string["unit_mass_kg_per_m"]);
                let build = row["build"].clone();
                let from_sheet = if build == "plain" {
                    let d = row["core_diameter_mm"].parse::<f64>().unwrap() / 1000.0;
                    densities[&row["core_material"]] * core_area("round", d)
                } else {
                    unit_mass_from_row(row, &densities)
                };
                let both = if row["outer_wrap_material"].is_empty() {
                    build.clone()
                } else {
                    "two wraps".to_string()
                };
                builds.insert(both);
                assert!(
                    (from_sheet / planned - 1.0).abs() < 1e-3,
                    "{instrument} course {}: sheet gives {from_sheet}, plan {planned}",
                    row["course"]
                );
                // The sheet's own μ column agrees too.
                let column = row["unit_mass_g_per_m"].parse::<f64>().unwrap() / 1000.0;
                assert!((column / planned - 1.0).abs() < 1e-3);
            }
        }
        assert_eq!(index, rows.len(), "{instrument}: one row per string");
        assert_eq!(builds.len(), kinds_expected, "{instrument}: {builds:?}");
    }
}

#[test]
fn cut_length_adds_anchor_and_post_and_tension_follows_the_force_unit() {
    let folder = tempfile::tempdir().unwrap();
    let harp = write_file(folder.path(), "harp.yaml", HARP);
    let sheet = folder.path().join("order.csv");
    let plan = common::json(&[
        "plan",
        harp.to_str().unwrap(),
        "--order-sheet",
        sheet.to_str().unwrap(),
        "--force-unit",
        "kgf",
        "--marking",
    ]);
    let rows = read_csv(&sheet);
    // Course 2 states its own post length; the others take the defaults.
    for (row, post) in rows.iter().zip([60.0, 75.0, 60.0, 60.0]) {
        let length: f64 = row["vibrating_length_mm"].parse().unwrap();
        let cut: f64 = row["cut_length_mm"].parse().unwrap();
        assert!((cut - (25.0 + length + post)).abs() < 1e-6, "{row:?}");
    }
    // 1 kgf = 9.806 65 N exactly (REFERENCES §1.3).
    for (row, course) in rows.iter().zip(plan["courses"].as_array().unwrap()) {
        let newtons = number(&course["strings"][0]["tension_n"]);
        let kgf: f64 = row["target_tension_kgf"].parse().unwrap();
        assert!((kgf * 9.80665 / newtons - 1.0).abs() < 1e-5);
    }
    // C strings red, F strings dark blue (common practice, REFERENCES §12.1).
    let marks: Vec<&str> = rows.iter().map(|r| r["marking"].as_str()).collect();
    assert_eq!(marks, ["red", "dark blue", "red", "dark blue"]);
}

#[test]
fn the_table_and_the_page_carry_every_string_and_the_cautions() {
    let folder = tempfile::tempdir().unwrap();
    let text = folder.path().join("order.txt");
    let page = folder.path().join("order.html");
    for path in [&text, &page] {
        taut()
            .args(["plan", "lever-harp-34", "--marking", "-o", "/dev/null"])
            .arg("--order-sheet")
            .arg(path)
            .assert()
            .success();
    }
    let table = std::fs::read_to_string(&text).unwrap();
    assert!(table.lines().all(|line| line.chars().count() <= 100));
    assert!(table.contains("Before you string this up"));
    assert!(table.contains("copper-wound-steel: wound, core music-wire (round), wrap copper."));
    let html = std::fs::read_to_string(&page).unwrap();
    let document = scraper::Html::parse_document(&html);
    let rows = scraper::Selector::parse("section.order tbody tr").unwrap();
    assert_eq!(document.select(&rows).count(), 34);
    let cautions = scraper::Selector::parse("section.cautions li").unwrap();
    assert_eq!(document.select(&cautions).count(), 4);
    assert!(!html.contains("<script") && !html.contains("http"));
}

#[test]
fn anchor_and_post_lengths_that_are_not_lengths_are_bad_input() {
    let folder = tempfile::tempdir().unwrap();
    for (line, bad) in [
        ("  anchor_length: 0mm", "anchor_length"),
        ("  post_length: -40mm", "post_length"),
        ("  post_length: .nan", "post_length"),
        ("  anchor_length: 3km", "anchor_length"),
    ] {
        let text = HARP.replace("  anchor_length: 25mm\n  post_length: 60mm", line);
        let file = write_file(folder.path(), "bad.yaml", &text);
        let message = common::bad_input(&["plan", file.to_str().unwrap()]);
        assert!(message.contains("bad.yaml"), "{message}");
        assert!(message.contains(":5"), "names the line: {message}");
        assert!(message.contains(bad), "names the field: {message}");
    }
}

#[test]
fn the_order_sheet_never_replaces_an_input() {
    let folder = tempfile::tempdir().unwrap();
    let harp = write_file(folder.path(), "harp.yaml", HARP);
    let output = taut()
        .args(["plan", harp.to_str().unwrap(), "--order-sheet"])
        .arg(&harp)
        .output()
        .unwrap();
    assert_eq!(output.status.code(), Some(2));
    assert_eq!(std::fs::read_to_string(&harp).unwrap(), HARP);
}

#[test]
fn lengths_and_convert_write_the_same_sheet_from_their_own_strings() {
    let folder = tempfile::tempdir().unwrap();
    let densities = densities();
    let sheet = folder.path().join("order.csv");
    let path = sheet.to_str().unwrap();
    let layout = common::json(&["lengths", "zither-pairs-layout", "--order-sheet", path]);
    let mut planned = Vec::new();
    for course in layout["courses"].as_array().unwrap() {
        planned.push((
            number(&course["unit_mass_kg_per_m"]),
            number(&course["length_m"]),
        ));
        for other in course["other_strings"].as_array().unwrap() {
            planned.push((
                number(&other["unit_mass_kg_per_m"]),
                number(&course["length_m"]),
            ));
        }
    }
    let converted = common::json(&[
        "convert",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--to-instrument",
        "baritone-guitar",
        "--order-sheet",
        path,
    ]);
    let lengths_rows = {
        common::table(&["lengths", "zither-pairs-layout", "--order-sheet", path]);
        read_csv(&sheet)
    };
    assert_eq!(lengths_rows.len(), planned.len());
    common::table(&[
        "convert",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--to-instrument",
        "baritone-guitar",
        "--order-sheet",
        path,
    ]);
    let convert_rows = read_csv(&sheet);
    for course in converted["courses"].as_array().unwrap() {
        for string in course["strings"].as_array().unwrap() {
            planned.push((
                number(&string["after"]["unit_mass_kg_per_m"]),
                number(&course["length_after_m"]),
            ));
        }
    }
    let rows = lengths_rows.iter().chain(&convert_rows);
    assert_eq!(rows.clone().count(), planned.len());
    for (row, (mu, length)) in rows.zip(planned) {
        let from_sheet = if row["build"] == "plain" {
            let d = row["core_diameter_mm"].parse::<f64>().unwrap() / 1000.0;
            densities[&row["core_material"]] * core_area("round", d)
        } else {
            unit_mass_from_row(row, &densities)
        };
        assert!((from_sheet / mu - 1.0).abs() < 1e-3, "{row:?}: {mu}");
        let sheet_length: f64 = row["vibrating_length_mm"].parse().unwrap();
        assert!((sheet_length / (length * 1000.0) - 1.0).abs() < 1e-5);
    }
}
