//! The shipped data files load, and lookups by id behave.

use taut::strings::gauge::GaugeCatalogs;
use taut::strings::kind::StringKinds;
use taut::strings::material::Materials;

#[test]
fn shipped_materials_catalogs_and_kinds_load() {
    let materials = Materials::builtin().unwrap();
    assert!(materials.all().len() >= 13);
    let catalogs = GaugeCatalogs::builtin().unwrap();
    assert!(catalogs.all().len() >= 4);
    let kinds = StringKinds::builtin().unwrap();
    for kind in kinds.all() {
        assert!(!kind.gauges().is_empty(), "{}", kind.id);
        for gauge in kind.gauges() {
            assert!(
                gauge.unit_mass > 0.0 && gauge.breaking_tension > 0.0,
                "{}",
                kind.id
            );
        }
    }
}
