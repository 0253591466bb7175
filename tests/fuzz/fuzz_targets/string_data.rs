//! User files of string data: materials, gauge catalogs and string kinds (the first byte picks
//! which reader): no panic, no hang; a refusal is bad input.
#![no_main]

use libfuzzer_sys::fuzz_target;
use taut::strings::gauge::{load_catalogs_file, GaugeCatalogs};
use taut::strings::kind::load_kinds_file;
use taut::strings::material::{load_materials_file, Materials};

fuzz_target!(|bytes: &[u8]| {
    let Some((&which, rest)) = bytes.split_first() else {
        return;
    };
    let Ok(text) = std::str::from_utf8(rest) else {
        return;
    };
    let outcome = match which % 3 {
        0 => load_materials_file(text, "fuzz.yaml").map(|m| {
            for material in m.all() {
                assert!(material.density().is_finite() && material.density() > 0.0);
            }
        }),
        1 => load_catalogs_file(text, "fuzz.yaml").map(|c| {
            for catalog in c.all() {
                for &d in catalog.diameters() {
                    assert!(d.is_finite() && d > 0.0, "diameter {d}");
                }
            }
        }),
        _ => {
            let (Ok(materials), Ok(catalogs)) = (Materials::builtin(), GaugeCatalogs::builtin()) else {
                panic!("the shipped data must load");
            };
            load_kinds_file(text, "fuzz.yaml", materials, catalogs).map(|kinds| {
                for kind in kinds.all() {
                    for gauge in kind.gauges() {
                        assert!(gauge.unit_mass.is_finite() && gauge.unit_mass > 0.0);
                    }
                }
            })
        }
    };
    if let Err(err) = outcome {
        assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}");
    }
});
