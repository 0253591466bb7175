//! Gauge catalogs: the diameters a kind of string is available in.
//!
//! The shipped catalogs (`src/strings/data/gauges.yaml`) hold the usual trade steps (PRACTICE);
//! they reach the binary as JSON converted at build time ([`crate::input::shipped`]). A user can
//! list what is on their own shelf in a YAML file of the same schema ([`load_catalogs_file`]).

use std::sync::OnceLock;

use serde::Deserialize;

use crate::error::{Error, Result};
use crate::input::id::Id;
use crate::input::registry::{Entry, Registry};
use crate::input::units::Diameter;

/// Largest number of gauges one catalog may hold; a range with a tiny step is a mistake.
pub const MAX_GAUGES: usize = 2000;

/// A list of available diameters, sorted thinnest first, without duplicates.
#[derive(Debug, Clone, PartialEq)]
pub struct GaugeCatalog {
    /// Identifier used by string kinds, e.g. `steel-plain-inch`.
    pub id: Id,
    /// Name shown to people.
    pub name: String,
    /// Where the list comes from.
    pub source: String,
    diameters: Vec<f64>,
}

impl GaugeCatalog {
    /// The diameters in metres, thinnest first.
    pub fn diameters(&self) -> &[f64] {
        &self.diameters
    }
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct CatalogSpec {
    id: Id,
    name: String,
    #[serde(default)]
    diameters: Vec<Diameter>,
    #[serde(default)]
    ranges: Vec<RangeSpec>,
    source: String,
}

/// `from`, `to` (both included) and `step`, e.g. 0.40mm to 1.00mm by 0.02mm.
#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RangeSpec {
    from: Diameter,
    to: Diameter,
    step: Diameter,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct CatalogsFile {
    #[serde(default)]
    catalogs: Vec<CatalogSpec>,
    // A stock file (`taut plan --stock`) may hold all three sections in one document.
    #[serde(default, rename = "materials")]
    _materials: Option<serde::de::IgnoredAny>,
    #[serde(default, rename = "kinds")]
    _kinds: Option<serde::de::IgnoredAny>,
}

/// Gauge catalogs, looked up by id.
pub type GaugeCatalogs = Registry<GaugeCatalog>;

impl Entry for GaugeCatalog {
    const NOUN: &'static str = "gauge catalog";
    const PLURAL: &'static str = "catalogs";
    fn id(&self) -> &Id {
        &self.id
    }
}

/// The shipped gauge catalogs, as written (the source of [`GaugeCatalogs::builtin`]).
pub const BUILTIN_GAUGES_YAML: &str = include_str!("data/gauges.yaml");

/// The same data converted to JSON by the build script (`src/build.rs`), fast to read.
const BUILTIN_GAUGES_JSON: &str = include_str!(concat!(env!("OUT_DIR"), "/gauges.json"));

impl Registry<GaugeCatalog> {
    /// The catalogs shipped with `taut`, read once from their build-time JSON copy and checked
    /// as a user's file is.
    pub fn builtin() -> Result<&'static GaugeCatalogs> {
        static BUILTIN: OnceLock<std::result::Result<GaugeCatalogs, String>> = OnceLock::new();
        BUILTIN
            .get_or_init(|| {
                let origin = "built-in gauges.yaml";
                crate::input::shipped::parse(BUILTIN_GAUGES_JSON, BUILTIN_GAUGES_YAML, origin)
                    .and_then(|file| catalogs_from_file(file, BUILTIN_GAUGES_YAML, origin))
                    .map_err(|err| err.to_string())
            })
            .as_ref()
            .map_err(|message| Error::input(format!("taut's own gauge data is broken: {message}")))
    }
}

/// Reads a gauge catalog file (`catalogs:` list; each catalog has `diameters`, `ranges` or both),
/// naming `origin`, line and field on bad input.
pub fn load_catalogs_file(text: &str, origin: &str) -> Result<GaugeCatalogs> {
    let file: CatalogsFile = crate::input::yaml::parse(text, origin)?;
    catalogs_from_file(file, text, origin)
}

/// Checks a read catalogs file and expands its ranges; `text` is the YAML it was read from (or
/// converted from), for the line of a problem.
fn catalogs_from_file(file: CatalogsFile, text: &str, origin: &str) -> Result<GaugeCatalogs> {
    let mut catalogs = GaugeCatalogs::default();
    for (index, spec) in file.catalogs.into_iter().enumerate() {
        let place = |err: Error, field: &str, sub: Option<usize>| {
            use crate::input::yaml::PathStep;
            let mut path = vec![
                PathStep::Key("catalogs"),
                PathStep::Index(index),
                PathStep::Key(field),
            ];
            if let Some(sub) = sub {
                path.push(PathStep::Index(sub));
            }
            let field_path = match sub {
                Some(sub) => format!("catalogs[{index}].{field}[{sub}]"),
                None => format!("catalogs[{index}].{field}"),
            };
            let err = err.field(field_path);
            let err = match crate::input::yaml::locate(text, &path) {
                Some((line, column)) => err.at(line, column),
                None => err,
            };
            err.in_origin(origin)
        };
        if catalogs.contains(spec.id.as_str()) {
            return Err(place(
                Error::input(format!("gauge catalog `{}` appears twice", spec.id)),
                "id",
                None,
            ));
        }
        let mut diameters: Vec<f64> = spec.diameters.iter().map(|d| d.si()).collect();
        for (range_index, range) in spec.ranges.iter().enumerate() {
            let (from, to, step) = (range.from.si(), range.to.si(), range.step.si());
            if to < from {
                return Err(place(
                    Error::input("`to` is smaller than `from`"),
                    "ranges",
                    Some(range_index),
                ));
            }
            let steps = ((to - from) / step).round();
            if steps > MAX_GAUGES as f64 {
                return Err(place(
                    Error::input(format!(
                        "this range makes {steps} gauges; a catalog holds at most {MAX_GAUGES}"
                    )),
                    "ranges",
                    Some(range_index),
                ));
            }
            if (from + steps * step - to).abs() > 1e-6 * to {
                return Err(place(
                    Error::input("`to` is not reached in whole steps from `from`")
                        .help("make `to` − `from` a whole number of `step`s"),
                    "ranges",
                    Some(range_index),
                ));
            }
            // Multiplying rather than accumulating keeps 0.40 + 30 × 0.02 equal to 1.00.
            diameters.extend((0..=steps as usize).map(|i| from + i as f64 * step));
        }
        if diameters.is_empty() {
            return Err(place(
                Error::input("the catalog lists no diameters")
                    .help("add `diameters: [0.010in, 0.011in]` or a `ranges` entry"),
                "id",
                None,
            ));
        }
        if diameters.len() > MAX_GAUGES {
            return Err(place(
                Error::input(format!("a catalog holds at most {MAX_GAUGES} gauges")),
                "diameters",
                None,
            ));
        }
        diameters.sort_by(f64::total_cmp);
        // Ranges meet at their ends (1.00 mm ends one and starts the next): merge near-equal values.
        diameters.dedup_by(|later, earlier| (*later - *earlier).abs() <= 1e-9 * *later);
        catalogs.push(GaugeCatalog {
            id: spec.id,
            name: spec.name,
            source: spec.source,
            diameters,
        });
    }
    Ok(catalogs)
}
