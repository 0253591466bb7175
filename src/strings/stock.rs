//! A user's own string data: extra materials, gauge catalogs and string kinds — what is on the
//! workshop shelf — added to the shipped ones.
//!
//! A stock file is one YAML document with any of the sections `materials:`, `catalogs:` and
//! `kinds:`, each in the schema of the shipped files in `src/strings/data/`. Its kinds may use the
//! shipped materials and catalogs as well as its own. Ids must be new: a stock file adds, it
//! never silently replaces a shipped value.

use std::borrow::Cow;
use std::path::Path;
use std::sync::OnceLock;

use crate::error::{Error, Result};
use crate::strings::gauge::{load_catalogs_file, GaugeCatalogs};
use crate::strings::kind::{load_kinds_file, StringKinds};
use crate::strings::material::{load_materials_file, Materials};

/// Materials, gauge catalogs and string kinds available to a solve.
#[derive(Debug, Clone)]
pub struct Stock {
    materials: Materials,
    catalogs: GaugeCatalogs,
    kinds: StringKinds,
}

impl Stock {
    /// The shipped data only, built once.
    pub fn builtin() -> Result<&'static Stock> {
        static BUILTIN: OnceLock<std::result::Result<Stock, String>> = OnceLock::new();
        BUILTIN
            .get_or_init(|| {
                Ok(Stock {
                    materials: Materials::builtin().map_err(|e| e.to_string())?.clone(),
                    catalogs: GaugeCatalogs::builtin().map_err(|e| e.to_string())?.clone(),
                    kinds: StringKinds::builtin().map_err(|e| e.to_string())?.clone(),
                })
            })
            .as_ref()
            .map_err(|message| Error::input(format!("taut's own string data is broken: {message}")))
    }

    /// The shipped data plus every stock file, in order; the shipped data itself when there is
    /// no file.
    pub fn with_files(paths: &[impl AsRef<Path>]) -> Result<Cow<'static, Stock>> {
        let builtin = Stock::builtin()?;
        if paths.is_empty() {
            return Ok(Cow::Borrowed(builtin));
        }
        let mut stock = builtin.clone();
        for path in paths {
            let path = path.as_ref();
            let text = crate::input::yaml::read_text(path)?;
            stock.add_text(&text, &crate::input::yaml::origin_of(path))?;
        }
        Ok(Cow::Owned(stock))
    }

    /// Adds the sections of one stock document; `origin` names it in errors.
    pub fn add_text(&mut self, text: &str, origin: &str) -> Result<()> {
        let materials = load_materials_file(text, origin)?;
        let catalogs = load_catalogs_file(text, origin)?;
        let added_materials = !materials.all().is_empty();
        let added_catalogs = !catalogs.all().is_empty();
        self.materials
            .extend(materials)
            .map_err(|err| err.field("materials").in_origin(origin))?;
        self.catalogs
            .extend(catalogs)
            .map_err(|err| err.field("catalogs").in_origin(origin))?;
        let kinds = load_kinds_file(text, origin, &self.materials, &self.catalogs)?;
        if kinds.all().is_empty() && !added_materials && !added_catalogs {
            return Err(Error::input(
                "a stock file lists `materials`, `catalogs` or `kinds`; this one has none",
            )
            .in_origin(origin));
        }
        self.kinds
            .extend(kinds)
            .map_err(|err| err.field("kinds").in_origin(origin))
    }

    /// The string kinds a plan may choose from.
    pub fn kinds(&self) -> &StringKinds {
        &self.kinds
    }

    /// The materials, shipped and added.
    pub fn materials(&self) -> &Materials {
        &self.materials
    }

    /// The gauge catalogs, shipped and added.
    pub fn catalogs(&self) -> &GaugeCatalogs {
        &self.catalogs
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    const SHELF: &str = "\
catalogs:
  - id: shelf-nylon
    name: Nylon on the shelf
    diameters: [0.62mm, 0.71mm, 0.81mm]
    source: measured with a micrometer (demo)
kinds:
  - id: shelf-nylon
    name: Nylon from the shelf
    plain: {material: nylon}
    catalog: shelf-nylon
    source: demo
";

    #[test]
    fn a_stock_file_adds_a_catalog_and_a_kind_over_shipped_materials() {
        let mut stock = Stock::builtin().unwrap().clone();
        let before = stock.kinds().all().len();
        stock.add_text(SHELF, "shelf.yaml").unwrap();
        assert_eq!(stock.kinds().all().len(), before + 1);
        let kind = stock.kinds().get("shelf-nylon").unwrap();
        assert_eq!(kind.gauges().len(), 3);
    }

    #[test]
    fn a_stock_file_cannot_replace_a_shipped_kind() {
        let text = SHELF.replace(
            "  - id: shelf-nylon\n    name: Nylon from",
            "  - id: nylon\n    name: Nylon from",
        );
        let err = Stock::builtin()
            .unwrap()
            .clone()
            .add_text(&text, "shelf.yaml")
            .unwrap_err()
            .to_string();
        assert!(
            err.contains("shelf.yaml") && err.contains("already defined"),
            "{err}"
        );
    }

    #[test]
    fn an_empty_or_misspelt_stock_file_is_refused() {
        let err = Stock::builtin()
            .unwrap()
            .clone()
            .add_text("kind:\n  - id: x\n", "s.yaml")
            .unwrap_err()
            .to_string();
        assert!(
            err.starts_with("s.yaml:1:") && err.contains("kind"),
            "{err}"
        );
        let err = Stock::builtin()
            .unwrap()
            .clone()
            .add_text("kinds: []\n", "s.yaml")
            .unwrap_err()
            .to_string();
        assert!(err.contains("has none"), "{err}");
    }
}
