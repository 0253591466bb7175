//! Reading string-kinds files: the schema as written, resolved against the materials and catalogs.

#[allow(unused_imports)]
use super::*;

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
pub(super) struct KindSpec {
    id: Id,
    name: String,
    #[serde(default)]
    plain: Option<PlainSpec>,
    #[serde(default)]
    wound: Option<WoundSpec>,
    #[serde(default)]
    measured: Option<MeasuredSpec>,
    #[serde(default)]
    catalog: Option<Id>,
    source: String,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
pub(super) struct MeasuredSpec {
    #[serde(default)]
    material: Option<Id>,
    strings: Vec<MeasuredString>,
}

/// One measured string: its diameter and either its linear density or a weighed piece.
#[derive(Deserialize)]
#[serde(deny_unknown_fields, try_from = "RawMeasuredString")]
pub(super) struct MeasuredString {
    diameter: f64,
    unit_mass: f64,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
pub(super) struct RawMeasuredString {
    diameter: Diameter,
    #[serde(default)]
    unit_mass: Option<UnitMass>,
    #[serde(default)]
    mass: Option<Mass>,
    #[serde(default)]
    length: Option<Length>,
}

impl TryFrom<RawMeasuredString> for MeasuredString {
    type Error = String;

    fn try_from(raw: RawMeasuredString) -> std::result::Result<Self, String> {
        let unit_mass = match (raw.unit_mass, raw.mass, raw.length) {
            (Some(unit_mass), None, None) => unit_mass.si(),
            // A weighed piece: μ = m/l (OpenStax University Physics Vol. 1 eq. 16.7).
            (None, Some(mass), Some(length)) => mass.si() / length.si(),
            _ => {
                return Err(
                    "give either `unit_mass` (e.g. `0.62g/m`) or a weighed piece as `mass` and `length` (e.g. `mass: 0.55g`, `length: 900mm`)"
                        .to_string(),
                )
            }
        };
        crate::input::units::check_measured_string(unit_mass, Some(raw.diameter.si()))
            .map_err(|err| err.plain_message())?;
        Ok(MeasuredString {
            diameter: raw.diameter.si(),
            unit_mass,
        })
    }
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
pub(super) struct PlainSpec {
    material: Id,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
pub(super) struct WoundSpec {
    core: CoreSpec,
    wraps: Vec<Id>,
    #[serde(default)]
    inner_share: Option<f64>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
pub(super) struct CoreSpec {
    material: Id,
    shape: CoreShape,
    #[serde(default)]
    ratio: Option<f64>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
pub(super) struct KindsFile {
    #[serde(default)]
    kinds: Vec<KindSpec>,
    // A stock file (`taut plan --stock`) may hold all three sections in one document.
    #[serde(default, rename = "materials")]
    _materials: Option<serde::de::IgnoredAny>,
    #[serde(default, rename = "catalogs")]
    _catalogs: Option<serde::de::IgnoredAny>,
}

/// Reads a string-kinds file (`kinds:` list, schema as `src/strings/data/kinds.yaml`) and resolves its
/// material and catalog ids, naming `origin`, line and field on bad input.
pub fn load_kinds_file(
    text: &str,
    origin: &str,
    materials: &Materials,
    catalogs: &GaugeCatalogs,
) -> Result<StringKinds> {
    let file: KindsFile = crate::input::yaml::parse(text, origin)?;
    kinds_from_file(file, text, origin, materials, catalogs)
}

/// Checks a read kinds file and resolves its ids; `text` is the YAML it was read from (or
/// converted from), for the line of a problem.
pub(super) fn kinds_from_file(
    file: KindsFile,
    text: &str,
    origin: &str,
    materials: &Materials,
    catalogs: &GaugeCatalogs,
) -> Result<StringKinds> {
    let mut kinds = StringKinds::default();
    for (index, spec) in file.kinds.into_iter().enumerate() {
        let place = |err: Error, path: &[&str]| {
            use crate::input::yaml::PathStep;
            let mut steps = vec![PathStep::Key("kinds"), PathStep::Index(index)];
            steps.extend(path.iter().map(|key| PathStep::Key(key)));
            let err = err.field(format!("kinds[{index}].{}", path.join(".")));
            let err = match crate::input::yaml::locate(text, &steps) {
                Some((line, column)) => err.at(line, column),
                None => err,
            };
            err.in_origin(origin)
        };
        if kinds.contains(spec.id.as_str()) {
            return Err(place(
                Error::input(format!("string kind `{}` appears twice", spec.id)),
                &["id"],
            ));
        }
        let material = |id: &Id, path: &[&str]| {
            materials
                .get(id.as_str())
                .cloned()
                .map_err(|err| place(err, path))
        };
        let load_bearing = |m: Material, path: &[&str]| {
            if m.breaking_strength.is_none() {
                Err(place(
                    Error::input(format!(
                        "material `{}` has no breaking strength, so it cannot carry the tension",
                        m.id
                    ))
                    .help("use it as a wrap, or give the material a `breaking_strength`"),
                    path,
                ))
            } else {
                Ok(m)
            }
        };
        let build = match (&spec.plain, &spec.wound, &spec.measured) {
            (Some(plain), None, None) => KindBuild::Plain {
                material: load_bearing(
                    material(&plain.material, &["plain", "material"])?,
                    &["plain", "material"],
                )?,
            },
            (None, Some(wound), None) => {
                let core_path = ["wound", "core", "material"];
                let core_material =
                    load_bearing(material(&wound.core.material, &core_path)?, &core_path)?;
                let (inner, outer_id) = match wound.wraps.as_slice() {
                    [only] => (material(only, &["wound", "wraps"])?, None),
                    [inner, outer] => (material(inner, &["wound", "wraps"])?, Some(outer)),
                    _ => {
                        return Err(place(
                            Error::input("a wound kind has one or two wrap layers")
                                .help("write e.g. `wraps: [nickel-plated-steel]`"),
                            &["wound", "wraps"],
                        ))
                    }
                };
                let ratio = wound.core.ratio.map_or_else(
                    || {
                        default_core_ratio(
                            wound.core.shape,
                            wound.wraps.len(),
                            core_material.density(),
                        )
                    },
                    CoreRatio::Fixed,
                );
                match ratio {
                    CoreRatio::Fixed(fixed) if !CORE_RATIO_BOUNDS.contains(fixed) => {
                        return Err(place(
                            Error::input(format!(
                                "core ratio {} is outside the range taut accepts: {}",
                                short_number(fixed),
                                CORE_RATIO_BOUNDS.shown
                            )),
                            &["wound", "core", "ratio"],
                        ));
                    }
                    _ => {}
                }
                let share = wound.inner_share.unwrap_or(DEFAULT_INNER_SHARE);
                if !(share > 0.0 && share < 1.0) {
                    return Err(place(
                        Error::input(format!("inner share {share} must lie between 0 and 1")),
                        &["wound", "inner_share"],
                    ));
                }
                let outer = match outer_id {
                    Some(id) => Some((material(id, &["wound", "wraps"])?, share)),
                    None => None,
                };
                KindBuild::Wound {
                    core_material,
                    core_shape: wound.core.shape,
                    core_ratio: ratio,
                    inner,
                    outer,
                }
            }
            (None, None, Some(measured)) => {
                let material = match &measured.material {
                    Some(id) => Some(material(id, &["measured", "material"])?),
                    None => None,
                };
                let mut strings: Vec<(f64, f64)> = measured
                    .strings
                    .iter()
                    .map(|s| (s.diameter, s.unit_mass))
                    .collect();
                strings.sort_by(|a, b| a.1.total_cmp(&b.1));
                if strings.is_empty() || strings.windows(2).any(|w| w[1].1 <= w[0].1) {
                    return Err(place(
                        Error::input("measured strings need at least one entry, each of a different linear density"),
                        &["measured", "strings"],
                    ));
                }
                KindBuild::Measured { material, strings }
            }
            _ => {
                return Err(place(
                    Error::input("a kind is exactly one of `plain:`, `wound:` or `measured:`"),
                    &["id"],
                ))
            }
        };
        let diameters: Vec<f64> = match (&build, &spec.catalog) {
            (KindBuild::Measured { strings, .. }, None) => strings.iter().map(|s| s.0).collect(),
            (KindBuild::Measured { .. }, Some(_)) => {
                return Err(place(
                    Error::input("measured strings are their own catalog; leave out `catalog`"),
                    &["catalog"],
                ))
            }
            (_, Some(catalog)) => catalogs
                .get(catalog.as_str())
                .map_err(|err| place(err, &["catalog"]))?
                .diameters()
                .to_vec(),
            (_, None) => {
                return Err(place(
                    Error::input("this kind needs a `catalog` of gauges"),
                    &["id"],
                ))
            }
        };
        let mut kind = StringKind {
            id: spec.id,
            name: spec.name,
            catalog: spec.catalog.clone(),
            source: spec.source,
            build,
            gauges: Vec::with_capacity(diameters.len()),
        };
        let gauges: Vec<Gauge> = diameters
            .iter()
            .map(|&diameter| {
                let string = kind.construction(diameter);
                Gauge {
                    diameter,
                    unit_mass: string.unit_mass(),
                    breaking_tension: string.breaking_tension().unwrap_or(f64::NAN),
                    thick_for_plain: match &kind.build {
                        KindBuild::Plain { material } => material
                            .thickest_plain()
                            .is_some_and(|thickest| diameter > thickest * (1.0 + 1e-9)),
                        _ => false,
                    },
                }
            })
            .collect();
        // The selector binary-searches by linear density; a fixed recipe makes it grow with the
        // diameter, and this check keeps that promise explicit.
        if gauges.windows(2).any(|w| w[1].unit_mass <= w[0].unit_mass) {
            return Err(place(
                Error::input("linear density does not grow with diameter for this kind"),
                &["id"],
            ));
        }
        kind.gauges = gauges;
        kinds.push(kind);
    }
    Ok(kinds)
}
