//! Units that follow `--length-unit` everywhere: a conversion's slot widths, the diameters of one
//! set for several tunings (mm by default, as `plan` gives them), and the fret tables.

use crate::common;

#[test]
fn slot_widths_follow_the_length_unit() {
    let args = [
        "convert",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--to-instrument",
        "baritone-guitar",
        "--length-unit",
        "in",
    ];
    let text = common::table(&args);
    assert!(text.contains("slot in/1000"), "{text}");
    let warnings = &text[text.find("Warnings").expect("warnings")..];
    // 0.076 mm wider than the old 0.305 mm string: 0.0030 in and 0.0120 in. Plain and wound
    // strings get different fixes, so their notes are two groups.
    assert!(warnings.contains("0.0030 to 0.0040 in wider"), "{text}");
    assert!(warnings.contains("0.0060 to 0.0130 in wider"), "{text}");
    assert!(!warnings.contains(" mm"), "{text}");
}

#[test]
fn several_tunings_give_diameters_in_the_length_unit() {
    let args = [
        "plan",
        "guitar-19edo",
        "--tuning",
        "19edo",
        "--tuning",
        "22edo",
    ];
    let text = common::table(&args);
    assert!(text.contains("⌀ mm"), "{text}");
    // The catalog's labels (`0.010 in`) were shown before.
    assert!(!text.contains("0.010 in"), "{text}");
    // The same first string as `plan` shows: 0.254 mm.
    let single = common::table(&["plan", "guitar-19edo"]);
    assert!(single.contains("0.254"), "{single}");
    assert!(text.contains("0.254"), "{text}");
    let mut inches = args.to_vec();
    inches.extend(["--length-unit", "in"]);
    let text = common::table(&inches);
    assert!(text.contains("⌀ in/1000"), "{text}");
    let audit = common::table(&[
        "audit",
        "steel-guitar-12edo",
        "--set",
        "steel-guitar-set",
        "--tuning",
        "12edo",
        "--tuning",
        "12edo@A4=415hz",
    ]);
    assert!(audit.contains("⌀ mm"), "{audit}");
    assert!(audit.contains("0.305"), "{audit}");
}

#[test]
fn frets_take_a_length_unit() {
    let millimetres = common::table(&["frets", "guitar-19edo", "--count", "3"]);
    let inches = common::table(&[
        "frets",
        "guitar-19edo",
        "--count",
        "3",
        "--length-unit",
        "in",
    ]);
    assert!(millimetres.contains("from nut mm"), "{millimetres}");
    assert!(inches.contains("from nut in"), "{inches}");
    assert!(!inches.contains(" mm"), "{inches}");
    // Fret 1 of 19-EDO on 648 mm lies at 23.214 mm (REFERENCES §8.2), 0.914 in at 25.4 mm to
    // the inch.
    assert!(millimetres.contains("23.21"), "{millimetres}");
    assert!(inches.contains("0.914"), "{inches}");
    // The warnings' figures follow the unit too: 12 mm is 0.472 in.
    let warned = common::table(&[
        "frets",
        "guitar-19edo",
        "--min-spacing",
        "12mm",
        "--length-unit",
        "in",
    ]);
    assert!(warned.contains("closer than 0.472 in"), "{warned}");
    assert!(!warned.contains(" mm"), "{warned}");
    // JSON stays in metres whatever the table shows.
    let json = common::json(&["frets", "guitar-19edo", "--length-unit", "in"]);
    let first = common::number(&json["courses"][0]["frets"][0]["distance_from_nut_m"]);
    assert!((first - 0.023_21).abs() < 1e-5, "{first}");
}
