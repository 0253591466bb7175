//! String materials: density, elastic modulus, breaking strength, and where each number comes from.
//!
//! The shipped materials live in `src/strings/data/materials.yaml` (values and provenance from
//! REFERENCES §2, §3 and §4); the build script converts them to JSON, read once through
//! [`crate::input::shipped::parse`]. Users can add their own with [`load_materials_file`], in the
//! same schema, read through [`crate::input::yaml::parse`]; both run the same checks.

use std::fmt;
use std::sync::OnceLock;

use serde::de::{self, MapAccess, SeqAccess, Visitor};
use serde::{Deserialize, Deserializer};

use crate::error::{Error, Result};
use crate::input::id::Id;
use crate::input::registry::{Entry, Registry};
use crate::input::units::{Density, Diameter, Pressure};

/// A property that may depend on the wire's diameter (strength and modulus of drawn wire do).
#[derive(Debug, Clone, PartialEq)]
pub enum Curve {
    /// The same value at every diameter, in SI.
    Constant(f64),
    /// Linear interpolation between (diameter, value) rows sorted by diameter, clamped to the
    /// first and last rows outside the table (as for the ASTM A228 table).
    Linear(Vec<(f64, f64)>),
    /// Ranges: each (diameter, value) row applies to diameters above the previous row's and up
    /// to and including its own (as in "over 0.009 to 0.010 in" tables such as ASTM A313). The
    /// last row's value applies beyond it.
    Steps(Vec<(f64, f64)>),
}

impl Curve {
    /// The value at `diameter` (m), in SI.
    pub fn at(&self, diameter: f64) -> f64 {
        match self {
            Curve::Constant(value) => *value,
            Curve::Linear(rows) => interpolate(rows, diameter),
            Curve::Steps(rows) => rows
                .iter()
                .find(|(upper, _)| diameter <= *upper)
                .or(rows.last())
                .map_or(f64::NAN, |(_, value)| *value),
        }
    }
}

fn interpolate(rows: &[(f64, f64)], diameter: f64) -> f64 {
    let (Some(first), Some(last)) = (rows.first(), rows.last()) else {
        return f64::NAN;
    };
    if diameter <= first.0 {
        return first.1;
    }
    if diameter >= last.0 {
        return last.1;
    }
    let above = rows.partition_point(|(d, _)| *d < diameter);
    let (d1, v1) = rows[above - 1];
    let (d2, v2) = rows[above];
    if d2 == d1 {
        return v2;
    }
    v1 + (v2 - v1) * (diameter - d1) / (d2 - d1)
}

/// How a [`Curve`] is written in a file: `203.4GPa`, or a map with one of
/// `linear_by_diameter` / `steps_by_diameter` holding `[diameter, value]` rows.
impl<'de> Deserialize<'de> for Curve {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> std::result::Result<Self, D::Error> {
        deserializer.deserialize_any(CurveVisitor)
    }
}

struct CurveVisitor;

const CURVE_KEYS: &[&str] = &["linear_by_diameter", "steps_by_diameter"];

impl<'de> Visitor<'de> for CurveVisitor {
    type Value = Curve;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a value with its unit such as `2.1GPa`, or a map with `linear_by_diameter` or `steps_by_diameter` rows")
    }

    fn visit_str<E: de::Error>(self, text: &str) -> std::result::Result<Curve, E> {
        text.parse::<Pressure>()
            .map(|p| Curve::Constant(p.si()))
            .map_err(|err| E::custom(err.plain_message()))
    }

    fn visit_f64<E: de::Error>(self, number: f64) -> std::result::Result<Curve, E> {
        Err(E::custom(format!(
            "`{number}` has no unit; write a stress with its unit, e.g. `2.1GPa`"
        )))
    }

    fn visit_u64<E: de::Error>(self, number: u64) -> std::result::Result<Curve, E> {
        self.visit_f64(number as f64)
    }

    fn visit_i64<E: de::Error>(self, number: i64) -> std::result::Result<Curve, E> {
        self.visit_f64(number as f64)
    }

    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> std::result::Result<Curve, A::Error> {
        let Some(key) = map.next_key::<String>()? else {
            return Err(de::Error::custom(
                "the map is empty; give `linear_by_diameter` or `steps_by_diameter` rows",
            ));
        };
        let rows: Vec<Row> = match key.as_str() {
            "linear_by_diameter" | "steps_by_diameter" => map.next_value()?,
            other => return Err(de::Error::unknown_field(other, CURVE_KEYS)),
        };
        if let Some(extra) = map.next_key::<String>()? {
            return Err(de::Error::custom(format!(
                "unexpected `{extra}`: give exactly one of `linear_by_diameter` or `steps_by_diameter`"
            )));
        }
        let rows: Vec<(f64, f64)> = rows.into_iter().map(|r| (r.0.si(), r.1.si())).collect();
        if rows.is_empty() {
            return Err(de::Error::custom("the table has no rows"));
        }
        if let Some(pair) = rows.windows(2).find(|pair| pair[1].0 <= pair[0].0) {
            return Err(de::Error::custom(format!(
                "the rows must be sorted by increasing diameter; {} m follows {} m",
                pair[1].0, pair[0].0
            )));
        }
        Ok(if key == "linear_by_diameter" {
            Curve::Linear(rows)
        } else {
            Curve::Steps(rows)
        })
    }

    fn visit_seq<A: SeqAccess<'de>>(self, _seq: A) -> std::result::Result<Curve, A::Error> {
        Err(de::Error::custom(
            "a list needs a heading: write `linear_by_diameter:` or `steps_by_diameter:` above the rows",
        ))
    }
}

/// One `[diameter, value]` table row.
#[derive(Deserialize)]
struct Row(Diameter, Pressure);

/// A string material.
#[derive(Debug, Clone, PartialEq, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Material {
    /// Identifier used by string kinds and user files, e.g. `music-wire`.
    pub id: Id,
    /// Name shown to people.
    pub name: String,
    /// Density (kg/m³ once read).
    pub density: Density,
    /// Young's modulus, possibly by diameter (Pa).
    pub elastic_modulus: Curve,
    /// Minimum tensile (breaking) strength, possibly by diameter (Pa). Absent for materials that
    /// only ever serve as a wrap, which carries no load in `taut`'s model (REFERENCES §6.2).
    #[serde(default)]
    pub breaking_strength: Option<Curve>,
    /// The thickest plain string of this material that common practice strings (for a
    /// monofilament such as nylon), if there is such a limit. Thicker plain strings of it are
    /// flagged `thick-monofilament` by the selector: they sound dull, and
    /// makers change to wound strings before they get there.
    #[serde(default)]
    pub thickest_plain: Option<Diameter>,
    /// Where the numbers come from, with provenance tags (READ / from memory / DERIVED / PRACTICE).
    pub source: String,
}

impl Material {
    /// Density in kg/m³.
    pub fn density(&self) -> f64 {
        self.density.si()
    }

    /// Young's modulus (Pa) of a wire of this diameter (m).
    pub fn modulus_at(&self, diameter: f64) -> f64 {
        self.elastic_modulus.at(diameter)
    }

    /// The thickest plain string of this material in common practice (m), if it has such a limit.
    pub fn thickest_plain(&self) -> Option<f64> {
        self.thickest_plain.map(|d| d.si())
    }

    /// Breaking strength (Pa) of a wire of this diameter (m), if the material has one.
    pub fn strength_at(&self, diameter: f64) -> Option<f64> {
        self.breaking_strength.as_ref().map(|c| c.at(diameter))
    }
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct MaterialsFile {
    #[serde(default)]
    materials: Vec<Material>,
    // A stock file (`taut plan --stock`) may hold all three sections in one document.
    #[serde(default, rename = "catalogs")]
    _catalogs: Option<serde::de::IgnoredAny>,
    #[serde(default, rename = "kinds")]
    _kinds: Option<serde::de::IgnoredAny>,
}

/// The materials a solve may use, looked up by id.
pub type Materials = Registry<Material>;

impl Entry for Material {
    const NOUN: &'static str = "material";
    const PLURAL: &'static str = "materials";
    fn id(&self) -> &Id {
        &self.id
    }
}

impl Registry<Material> {
    /// The materials shipped with `taut` (`src/strings/data/materials.yaml`), read once from
    /// their build-time JSON copy and checked as a user's file is.
    pub fn builtin() -> Result<&'static Materials> {
        static BUILTIN: OnceLock<std::result::Result<Materials, String>> = OnceLock::new();
        BUILTIN
            .get_or_init(|| {
                let origin = "built-in materials.yaml";
                crate::input::shipped::parse(BUILTIN_MATERIALS_JSON, BUILTIN_MATERIALS_YAML, origin)
                    .and_then(|file| materials_from_file(file, BUILTIN_MATERIALS_YAML, origin))
                    .map_err(|err| err.to_string())
            })
            .as_ref()
            .map_err(|message| {
                Error::input(format!("taut's own material data is broken: {message}"))
            })
    }
}

/// The shipped material data, as written (the source of [`Materials::builtin`]).
pub const BUILTIN_MATERIALS_YAML: &str = include_str!("data/materials.yaml");

/// The same data converted to JSON by the build script (`src/build.rs`), fast to read.
const BUILTIN_MATERIALS_JSON: &str = include_str!(concat!(env!("OUT_DIR"), "/materials.json"));

/// Reads a materials file (`materials:` list, schema as `src/strings/data/materials.yaml`), naming
/// `origin`, line and field on bad input.
pub fn load_materials_file(text: &str, origin: &str) -> Result<Materials> {
    let file: MaterialsFile = crate::input::yaml::parse(text, origin)?;
    materials_from_file(file, text, origin)
}

/// Checks a read materials file and collects its materials; `text` is the YAML it was read from
/// (or converted from), for the line of a problem.
fn materials_from_file(file: MaterialsFile, text: &str, origin: &str) -> Result<Materials> {
    let mut materials = Materials::default();
    for (index, material) in file.materials.into_iter().enumerate() {
        if material.source.trim().is_empty() {
            return Err(locate(
                Error::input("say where the numbers come from (measured, a data sheet, a book)"),
                text,
                index,
                "source",
            )
            .in_origin(origin));
        }
        if materials.contains(material.id.as_str()) {
            return Err(locate(
                Error::input(format!("material `{}` appears twice", material.id)),
                text,
                index,
                "id",
            )
            .in_origin(origin));
        }
        materials.push(material);
    }
    Ok(materials)
}

fn locate(err: Error, text: &str, index: usize, field: &str) -> Error {
    use crate::input::yaml::PathStep;
    let path = [
        PathStep::Key("materials"),
        PathStep::Index(index),
        PathStep::Key(field),
    ];
    let err = err.field(format!("materials[{index}].{field}"));
    match crate::input::yaml::locate(text, &path) {
        Some((line, column)) => err.at(line, column),
        None => err,
    }
}
