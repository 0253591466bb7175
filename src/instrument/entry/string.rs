//! One set string: how it is written back, and the construction it resolves to.

#[allow(unused_imports)]
use super::*;

impl SetString {
    /// The string as one YAML flow mapping, e.g. `{kind: plain-steel, diameter: 0.012in}`.
    pub fn to_yaml_flow(&self) -> String {
        match self {
            SetString::Kind {
                kind,
                diameter,
                core_diameter,
            } => {
                let mut text = format!("{{kind: {kind}, diameter: {}", length_text(*diameter));
                if let Some(core) = core_diameter {
                    let _ = write!(text, ", core_diameter: {}", length_text(*core));
                }
                text.push('}');
                text
            }
            SetString::Measured {
                unit_mass,
                diameter,
                material,
                weighed,
            } => {
                let mut text = match weighed {
                    Some((mass, length)) => format!(
                        "{{mass: {}g, length: {}",
                        trimmed(mass * 1000.0, 6),
                        length_text(*length)
                    ),
                    None => format!("{{unit_mass: {}g/m", trimmed(unit_mass * 1000.0, 9)),
                };
                if let Some(diameter) = diameter {
                    let _ = write!(text, ", diameter: {}", length_text(*diameter));
                }
                if let Some(material) = material {
                    let _ = write!(text, ", material: {material}");
                }
                text.push('}');
                text
            }
        }
    }

    /// Outer diameter, m, if known.
    pub fn diameter(&self) -> Option<f64> {
        match self {
            SetString::Kind { diameter, .. } => Some(*diameter),
            SetString::Measured { diameter, .. } => *diameter,
        }
    }

    /// The concrete string, from the given kinds and materials.
    pub fn resolve<'k>(
        &self,
        kinds: &'k StringKinds,
        materials: &'k Materials,
    ) -> Result<ResolvedString<'k>> {
        match self {
            SetString::Kind {
                kind,
                diameter,
                core_diameter,
            } => {
                let kind = kinds.get(kind)?;
                let construction = match (core_diameter, &kind.build) {
                    (
                        Some(core),
                        KindBuild::Wound {
                            core_material,
                            core_shape,
                            inner,
                            outer,
                            ..
                        },
                    ) => WoundRecipe {
                        core_material,
                        core_shape: *core_shape,
                        core_ratio: crate::strings::construction::CoreRatio::Fixed(core / diameter),
                        inner,
                        outer: outer.as_ref().map(|(m, share)| (m, *share)),
                    }
                    .build(*diameter),
                    _ => kind.construction(*diameter),
                };
                Ok(ResolvedString {
                    construction,
                    kind: Some(kind),
                })
            }
            SetString::Measured {
                unit_mass,
                diameter,
                material,
                ..
            } => {
                let material: Option<&Material> = match material {
                    Some(id) => Some(materials.get(id)?),
                    None => None,
                };
                Ok(ResolvedString {
                    construction: Construction::Measured(Measured {
                        unit_mass: *unit_mass,
                        diameter: *diameter,
                        material,
                    }),
                    kind: None,
                })
            }
        }
    }

    /// A short description: the kind id, or `measured` with the material when known.
    pub fn label(&self) -> String {
        match self {
            SetString::Kind { kind, .. } => kind.clone(),
            SetString::Measured {
                material: Some(material),
                weighed,
                ..
            } => format!(
                "{} ({material})",
                if weighed.is_some() {
                    "weighed"
                } else {
                    "measured"
                }
            ),
            SetString::Measured { weighed, .. } => if weighed.is_some() {
                "weighed"
            } else {
                "measured"
            }
            .to_string(),
        }
    }
}

/// A length as a practitioner writes it: inches on the half-thousandth grid of inch catalogs,
/// millimetres otherwise (six decimals at most, so the value reads back to within 1 nm).
pub fn length_text(metres: f64) -> String {
    let inches = metres / METRES_PER_INCH;
    let half_thousandths = inches * 2000.0;
    if (half_thousandths - half_thousandths.round()).abs() < 1e-6 && inches < 1.0 {
        // The trade writes whole thousandths with three decimals (0.020 in), halves with four.
        let steps = half_thousandths.round();
        let decimals = if steps % 2.0 == 0.0 { 3 } else { 4 };
        format!("{:.*}in", decimals, steps / 2000.0)
    } else {
        format!("{}mm", trimmed(metres * 1000.0, 6))
    }
}

pub(super) fn trimmed(value: f64, decimals: usize) -> String {
    let text = format!("{value:.decimals$}");
    if text.contains('.') {
        text.trim_end_matches('0').trim_end_matches('.').to_string()
    } else {
        text
    }
}
