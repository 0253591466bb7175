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
    // 0.076 mm wider than the old 0.305 mm string: 0.0030 in and 0.0120 in.
    assert!(warnings.contains("0.0030 to 0.0130 in wider"), "{text}");
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
