//! Materials, gauge catalogs and string kinds: shipped values against their sources, and user
//! files with mistakes that must be named by file, line and field.

use approx::assert_relative_eq;
use taut::input::units::{METRES_PER_INCH, PASCALS_PER_PSI};
use taut::strings::gauge::{load_catalogs_file, GaugeCatalogs};
use taut::strings::kind::{load_kinds_file, StringKinds};
use taut::strings::material::{load_materials_file, Materials};

const KSI: f64 = PASCALS_PER_PSI * 1e3;

fn inch(d: f64) -> f64 {
    d * METRES_PER_INCH
}

#[test]
fn music_wire_strength_hits_astm_a228_rows_and_interpolates_between_them() {
    // ASTM A228/A228M Table 1, minimum tensile strength, inch-pound (REFERENCES §4.1, READ in a
    // reproduction).
    let wire = Materials::builtin().unwrap().get("music-wire").unwrap();
    for (d, ksi) in [
        (0.004, 439.0),
        (0.010, 387.0),
        (0.016, 362.0),
        (0.036, 321.0),
        (0.100, 271.0),
        (0.250, 230.0),
    ] {
        assert_relative_eq!(
            wire.strength_at(inch(d)).unwrap(),
            ksi * KSI,
            max_relative = 1e-12
        );
    }
    // Halfway between 0.016 in (362) and 0.018 in (356): 359 ksi, linear in diameter.
    assert_relative_eq!(
        wire.strength_at(inch(0.017)).unwrap(),
        359.0 * KSI,
        max_relative = 1e-9
    );
    // Clamped at the table's ends.
    assert_relative_eq!(
        wire.strength_at(inch(0.002)).unwrap(),
        439.0 * KSI,
        max_relative = 1e-12
    );
    assert_relative_eq!(
        wire.strength_at(inch(0.300)).unwrap(),
        230.0 * KSI,
        max_relative = 1e-12
    );
}

#[test]
fn music_wire_modulus_follows_shigley_table_10_5_by_size() {
    // Budynas & Nisbett, Shigley 9th ed., Table 10-5 (REFERENCES §3.1, READ): 203.4 GPa up to
    // 0.032 in, 200 to 0.063, 196.5 to 0.125, 193 above. Each value holds at the top of its
    // range and the curve runs straight between (DERIVED), so every size stays within 1.8 % of
    // its row of the table.
    let wire = Materials::builtin().unwrap().get("music-wire").unwrap();
    assert_relative_eq!(wire.modulus_at(inch(0.010)), 203.4e9);
    assert_relative_eq!(wire.modulus_at(inch(0.032)), 203.4e9);
    assert_relative_eq!(wire.modulus_at(inch(0.063)), 200e9);
    assert_relative_eq!(wire.modulus_at(inch(0.125)), 196.5e9);
    assert_relative_eq!(wire.modulus_at(inch(0.300)), 193e9);
    for (from, to, row) in [
        (0.033, 0.063, 200e9),
        (0.064, 0.125, 196.5e9),
        (0.126, 0.250, 193e9),
    ] {
        for step in 0..=10 {
            let d = from + (to - from) * f64::from(step) / 10.0;
            let e = wire.modulus_at(inch(d));
            assert!((e / row - 1.0).abs() <= 0.0182, "{d} in: {e}");
        }
    }
}

#[test]
fn stainless_strength_follows_astm_a313_ranges_with_the_flagged_typo_corrected() {
    // ASTM A313 table, Types 302 Class 1 and 304, minimum column (REFERENCES §4.2, READ in a
    // reproduction). "Over 0.012 to 0.013 in" reads 324 ksi there, flagged as a typo for 314.
    let stainless = Materials::builtin()
        .unwrap()
        .get("stainless-steel")
        .unwrap();
    for (d, ksi) in [
        (0.008, 325.0),
        (0.0095, 320.0),
        (0.010, 320.0),
        (0.0125, 314.0),
        (0.0135, 312.0),
        (0.019, 300.0),
        (0.080, 246.0),
    ] {
        assert_relative_eq!(
            stainless.strength_at(inch(d)).unwrap(),
            ksi * KSI,
            max_relative = 1e-12
        );
    }
    // The monotone trend holds through the corrected row.
    let row = |d: f64| stainless.strength_at(inch(d)).unwrap();
    assert!(row(0.0115) > row(0.0125) && row(0.0125) > row(0.0135));
}

#[test]
fn shipped_densities_are_the_cited_values() {
    // REFERENCES §2: music wire 7850 (PRACTICE + READ), stainless 302 7916 (READ, Beer et al.),
    // PA66 1140 (READ), PVDF 1780 (READ), C51000 8860 (READ), C24000 8660 (READ), copper 8960
    // (from memory, CRC), nickel 8908 (READ), gut 1300 (from memory / DERIVED), silk 1340 (READ, weak).
    let materials = Materials::builtin().unwrap();
    for (id, rho) in [
        ("music-wire", 7850.0),
        ("stainless-steel", 7916.0),
        ("nylon", 1140.0),
        ("fluorocarbon", 1780.0),
        ("phosphor-bronze", 8860.0),
        ("brass-80-20", 8660.0),
        ("copper", 8960.0),
        ("nickel", 8908.0),
        ("gut", 1300.0),
        ("silk", 1340.0),
    ] {
        let material = materials.get(id).unwrap();
        assert_relative_eq!(material.density(), rho);
        assert!(!material.source.is_empty());
    }
}

#[test]
fn unknown_material_suggests_the_closest_id() {
    let err = Materials::builtin()
        .unwrap()
        .get("music-wir")
        .unwrap_err()
        .to_string();
    assert!(
        err.contains("unknown material `music-wir`") && err.contains("did you mean `music-wire`"),
        "{err}"
    );
    let err = Materials::builtin()
        .unwrap()
        .get("zzzz")
        .unwrap_err()
        .to_string();
    assert!(err.contains("known materials:"), "{err}");
}

const USER_MATERIAL: &str = "materials:
  - id: titanium-wire
    name: My titanium wire
    density: 4507kg/m3
    elastic_modulus: 116GPa
    breaking_strength: 900MPa
    source: measured on my bench
";

#[test]
fn user_materials_load_and_extend_the_builtin_set() {
    let user = load_materials_file(USER_MATERIAL, "shelf.yaml").unwrap();
    let mut all = Materials::builtin().unwrap().clone();
    all.extend(user).unwrap();
    let ti = all.get("titanium-wire").unwrap();
    assert_relative_eq!(ti.density(), 4507.0);
    assert_relative_eq!(ti.strength_at(1e-3).unwrap(), 900e6);
    // A second copy of an existing id is refused.
    let again = load_materials_file(USER_MATERIAL, "shelf.yaml").unwrap();
    assert!(all
        .extend(again)
        .unwrap_err()
        .to_string()
        .contains("already defined"));
}

#[test]
fn bad_user_materials_are_named_by_file_line_and_field() {
    let no_unit = USER_MATERIAL.replace("4507kg/m3", "4507");
    let err = load_materials_file(&no_unit, "shelf.yaml")
        .unwrap_err()
        .to_string();
    // The reader points a bare number at the key's own line (line 4 of USER_MATERIAL).
    assert!(
        err.starts_with("shelf.yaml:4:")
            && err.contains("materials[0].density")
            && err.contains("no unit"),
        "{err}"
    );

    let typo = USER_MATERIAL.replace("density:", "densty:");
    let err = load_materials_file(&typo, "shelf.yaml")
        .unwrap_err()
        .to_string();
    assert!(
        err.contains("shelf.yaml:4:") && err.contains("did you mean `density`"),
        "{err}"
    );

    let unsorted = USER_MATERIAL.replace(
        "breaking_strength: 900MPa",
        "breaking_strength:\n      linear_by_diameter:\n        - [1mm, 900MPa]\n        - [0.5mm, 950MPa]",
    );
    let err = load_materials_file(&unsorted, "shelf.yaml")
        .unwrap_err()
        .to_string();
    assert!(
        err.contains("shelf.yaml:") && err.contains("sorted by increasing diameter"),
        "{err}"
    );

    let empty_source = USER_MATERIAL.replace("measured on my bench", "\"\"");
    let err = load_materials_file(&empty_source, "shelf.yaml")
        .unwrap_err()
        .to_string();
    assert!(
        err.starts_with("shelf.yaml:7:") && err.contains("materials[0].source"),
        "{err}"
    );

    let bad_id = USER_MATERIAL.replace("titanium-wire", "Titanium Wire");
    let err = load_materials_file(&bad_id, "shelf.yaml")
        .unwrap_err()
        .to_string();
    assert!(
        err.starts_with("shelf.yaml:2:") && err.contains("not a valid id"),
        "{err}"
    );
}

#[test]
fn shipped_catalogs_hold_the_usual_steps() {
    // Common practice: plain steel 0.007–0.026 in; wound 0.017–0.135 in; monofilament
    // 0.40–1.00 mm by 0.02 mm and 1.00–2.50 mm by 0.05 mm (31 + 31 − 1 shared = 61 gauges).
    let catalogs = GaugeCatalogs::builtin().unwrap();
    let plain = catalogs.get("steel-plain-inch").unwrap().diameters();
    assert_relative_eq!(plain[0], inch(0.007));
    assert_relative_eq!(*plain.last().unwrap(), inch(0.026));
    assert!(plain.iter().any(|d| (d - inch(0.010)).abs() < 1e-12));
    let wound = catalogs.get("wound-inch").unwrap().diameters();
    assert_relative_eq!(wound[0], inch(0.017));
    assert_relative_eq!(*wound.last().unwrap(), inch(0.135), max_relative = 1e-12);
    let polymer = catalogs.get("polymer-metric").unwrap().diameters();
    assert_eq!(polymer.len(), 61);
    assert_relative_eq!(polymer[30], 1.00e-3, max_relative = 1e-12);
    assert!(polymer.windows(2).all(|w| w[1] > w[0]));
    let err = catalogs.get("wound-inches").unwrap_err().to_string();
    assert!(err.contains("did you mean `wound-inch`"), "{err}");
}

#[test]
fn user_shelf_catalog_loads_and_its_mistakes_are_located() {
    let shelf = "catalogs:\n  - id: my-shelf\n    name: What I have\n    diameters: [0.011in, 0.010in, 0.010in]\n    source: my drawer\n";
    let catalogs = load_catalogs_file(shelf, "shelf.yaml").unwrap();
    assert_eq!(catalogs.get("my-shelf").unwrap().diameters().len(), 2);

    let uneven = "catalogs:\n  - id: odd\n    name: x\n    ranges:\n      - {from: 0.40mm, to: 1.01mm, step: 0.02mm}\n    source: x\n";
    let err = load_catalogs_file(uneven, "c.yaml")
        .unwrap_err()
        .to_string();
    assert!(
        err.starts_with("c.yaml:5:") && err.contains("whole steps"),
        "{err}"
    );

    let empty = "catalogs:\n  - id: none\n    name: x\n    source: x\n";
    let err = load_catalogs_file(empty, "c.yaml").unwrap_err().to_string();
    assert!(
        err.starts_with("c.yaml:2:") && err.contains("no diameters"),
        "{err}"
    );
}

const USER_KIND: &str = "kinds:
  - id: my-copper-bass
    name: Copper on steel, my recipe
    wound:
      core: {material: music-wire, shape: round, ratio: 0.5}
      wraps: [copper]
    catalog: wound-inch
    source: my own
";

#[test]
fn user_kinds_resolve_against_materials_and_catalogs() {
    let materials = Materials::builtin().unwrap();
    let catalogs = GaugeCatalogs::builtin().unwrap();
    let kinds = load_kinds_file(USER_KIND, "k.yaml", materials, catalogs).unwrap();
    let kind = kinds.get("my-copper-bass").unwrap();
    let string = kind.construction(inch(0.040));
    // Core is half the outer diameter, as the recipe says.
    assert_relative_eq!(
        string.load_area().unwrap(),
        taut::strings::physics::circle_area(inch(0.020)),
        max_relative = 1e-12
    );
    let mut all = StringKinds::builtin().unwrap().clone();
    all.extend(kinds).unwrap();
    assert!(all.get("my-copper-bass").is_ok());
}

#[test]
fn bad_user_kinds_are_named_by_file_line_and_field() {
    let materials = Materials::builtin().unwrap();
    let catalogs = GaugeCatalogs::builtin().unwrap();
    let typo = USER_KIND.replace("wraps: [copper]", "wraps: [coper]");
    let err = load_kinds_file(&typo, "k.yaml", materials, catalogs)
        .unwrap_err()
        .to_string();
    assert!(
        err.starts_with("k.yaml:6:") && err.contains("did you mean `copper`"),
        "{err}"
    );

    let weak_core = USER_KIND.replace("material: music-wire", "material: copper");
    let err = load_kinds_file(&weak_core, "k.yaml", materials, catalogs)
        .unwrap_err()
        .to_string();
    // Inside flow-style braces the line of the nearest block-style key (`core:`) is reported and
    // the field names the key.
    assert!(
        err.starts_with("k.yaml:5:")
            && err.contains("kinds[0].wound.core.material")
            && err.contains("no breaking strength"),
        "{err}"
    );

    let bad_catalog = USER_KIND.replace("catalog: wound-inch", "catalog: wound-inchs");
    let err = load_kinds_file(&bad_catalog, "k.yaml", materials, catalogs)
        .unwrap_err()
        .to_string();
    assert!(
        err.starts_with("k.yaml:7:") && err.contains("did you mean `wound-inch`"),
        "{err}"
    );

    let bad_ratio = USER_KIND.replace("ratio: 0.5", "ratio: 1.5");
    let err = load_kinds_file(&bad_ratio, "k.yaml", materials, catalogs)
        .unwrap_err()
        .to_string();
    assert!(
        err.contains("k.yaml:") && err.contains("0.05 to 0.95"),
        "{err}"
    );

    let neither = "kinds:\n  - id: x\n    name: x\n    catalog: wound-inch\n    source: x\n";
    let err = load_kinds_file(neither, "k.yaml", materials, catalogs)
        .unwrap_err()
        .to_string();
    assert!(err.contains("exactly one"), "{err}");

    let err = StringKinds::builtin()
        .unwrap()
        .get("nickle-wound")
        .unwrap_err()
        .to_string();
    assert!(err.contains("did you mean `nickel-wound`"), "{err}");
}
