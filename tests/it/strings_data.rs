//! The shipped data files load, and lookups by id behave.

use std::fmt::Debug;

use taut::input::registry::{Entry, Registry};
use taut::strings::gauge::{load_catalogs_file, GaugeCatalogs, BUILTIN_GAUGES_YAML};
use taut::strings::kind::{load_kinds_file, StringKinds, BUILTIN_KINDS_YAML};
use taut::strings::material::{load_materials_file, Materials, BUILTIN_MATERIALS_YAML};

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

/// Asserts that two registries hold the same entries in the same order, comparing Debug output
/// (every f64 printed to the bit, and NaN equal to NaN), entry by entry so a failure names the id.
fn assert_same<T: Entry + Debug>(from_yaml: &Registry<T>, shipped: &Registry<T>) {
    let ids = |registry: &Registry<T>| {
        registry
            .all()
            .iter()
            .map(|entry| entry.id().to_string())
            .collect::<Vec<_>>()
    };
    assert_eq!(ids(from_yaml), ids(shipped));
    for (yaml_entry, shipped_entry) in from_yaml.all().iter().zip(shipped.all()) {
        assert_eq!(
            format!("{yaml_entry:?}"),
            format!("{shipped_entry:?}"),
            "{} `{}` differs between the YAML and the build-time copy",
            T::NOUN,
            yaml_entry.id()
        );
    }
}

/// The shipped data reaches the binary converted to JSON at build time (`src/build.rs`); reading
/// the YAML files themselves, as a user's file is read, must give exactly the same data.
#[test]
fn the_build_time_copy_of_the_shipped_data_equals_the_yaml() {
    let materials = load_materials_file(BUILTIN_MATERIALS_YAML, "materials.yaml").unwrap();
    assert!(!materials.all().is_empty());
    assert_same(&materials, Materials::builtin().unwrap());

    let catalogs = load_catalogs_file(BUILTIN_GAUGES_YAML, "gauges.yaml").unwrap();
    assert!(!catalogs.all().is_empty());
    assert_same(&catalogs, GaugeCatalogs::builtin().unwrap());

    let kinds = load_kinds_file(BUILTIN_KINDS_YAML, "kinds.yaml", &materials, &catalogs).unwrap();
    assert!(!kinds.all().is_empty());
    assert_same(&kinds, StringKinds::builtin().unwrap());
}
