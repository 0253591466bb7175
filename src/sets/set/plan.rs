//! A plan's JSON or YAML export read as a string set: each string's kind and diameter (or, for
//! a measured string, its μ, diameter and material), so `taut plan … --format json -o plan.json`
//! and `taut audit … --set plan.json` are one flow, as with `--save-set`.
//!
//! JSON is YAML, so both exports go through the one YAML reader. A plan for several tunings
//! holds one set for all of them; its first tuning's block names the strings.

use serde::de::IgnoredAny;

#[allow(unused_imports)]
use super::*;
use crate::instrument::entry::SetString;
use crate::plan::StringPlan;

/// The top-level keys that tell a plan's export from a set file.
#[derive(Debug, Deserialize)]
struct Probe {
    caution_stress_ratio: Option<IgnoredAny>,
    all_tunings_served: Option<IgnoredAny>,
}

/// The part of a several-tunings plan a set needs.
#[derive(Debug, Deserialize)]
struct SeveralPlanFile {
    instrument: String,
    tunings: Vec<SeveralBlock>,
}

#[derive(Debug, Deserialize)]
struct SeveralBlock {
    variant: String,
    #[serde(flatten)]
    plan: Plan,
}

/// The set file a plan's export stands for, or `None` when `text` is not a plan's export.
pub(super) fn plan_as_set_file(text: &str, origin: &str, stock: &Stock) -> Result<Option<SetFile>> {
    let Ok(probe) = yaml::parse::<Probe>(text, origin) else {
        return Ok(None);
    };
    let (plan, name, tuning, path): (Plan, String, Option<String>, Vec<PathStep<'static>>) =
        if probe.all_tunings_served.is_some() {
            let file: SeveralPlanFile = yaml::parse(text, origin)?;
            let names: Vec<&str> = file.tunings.iter().map(|b| b.variant.as_str()).collect();
            let name = format!("{} for {}", file.instrument, names.join(", "));
            let Some(first) = file.tunings.into_iter().next() else {
                return Err(
                    Error::input("the plan lists no tunings, so it holds no strings")
                        .in_origin(origin.to_string()),
                );
            };
            // One set serves every tuning: none of them is where the strings are.
            (
                first.plan,
                name,
                None,
                vec![PathStep::Key("tunings"), PathStep::Index(0)],
            )
        } else if probe.caution_stress_ratio.is_some() {
            let plan: Plan = yaml::parse(text, origin)?;
            let name = format!("{} in {}", plan.instrument, plan.tuning);
            // The tuning as given loads back with its reference (a ratio pitch depends on
            // it); an older export has only the name, which loads for a shipped or inline
            // tuning. What does not load is left out rather than recorded wrong.
            let spec = plan
                .tuning_spec
                .clone()
                .unwrap_or_else(|| plan.tuning.clone());
            let tuning = crate::tuning::load(&spec).is_ok().then_some(spec);
            (plan, name, tuning, Vec::new())
        } else {
            return Ok(None);
        };
    let mut courses = Vec::with_capacity(plan.courses.len());
    for (course_index, course) in plan.courses.iter().enumerate() {
        let mut strings = Vec::with_capacity(course.strings.len());
        for (string_index, string) in course.strings.iter().enumerate() {
            let mut at = path.clone();
            at.extend([
                PathStep::Key("courses"),
                PathStep::Index(course_index),
                PathStep::Key("strings"),
                PathStep::Index(string_index),
            ]);
            let entry = entry_of(string, stock).map_err(|err| {
                yaml::point(
                    err.help(
                        "save the set with `taut plan INSTRUMENT --save-set FILE`, which writes every string as it was given",
                    ),
                    text,
                    origin,
                    &at,
                )
            })?;
            strings.push(entry);
        }
        courses.push(SetCourseFile {
            course: Some(course.course),
            strings,
        });
    }
    Ok(Some(SetFile {
        name,
        about: Some("Strings chosen by `taut plan`, read from its export.".to_string()),
        instrument: Some(plan.instrument),
        tuning,
        courses,
    }))
}

/// One planned string as a set file writes it.
fn entry_of(string: &StringPlan, stock: &Stock) -> Result<StringEntryFile> {
    let choice = &string.choice;
    let diameter = choice.diameter_mm / 1000.0;
    let written = if &*choice.construction == "measured" {
        SetString::Measured {
            unit_mass: choice.unit_mass_kg_per_m,
            diameter: (diameter > 0.0).then_some(diameter),
            material: stock
                .materials()
                .get(&choice.material)
                .is_ok()
                .then(|| choice.material.to_string()),
            weighed: None,
        }
    } else {
        let written = SetString::Kind {
            kind: choice.kind.to_string(),
            diameter,
            core_diameter: None,
        };
        // A wound string the instrument fixed with its own core weighs other than the kind's
        // default core at that diameter; the export does not record the core, so say so
        // rather than read back another string.
        if let Ok(resolved) = written.resolve(stock.kinds(), stock.materials()) {
            let mu = resolved.construction.unit_mass();
            if (mu / choice.unit_mass_kg_per_m - 1.0).abs() > 1e-6 {
                return Err(Error::input(format!(
                    "the plan's {} at {:.3} mm weighs {:.4} g/m, but that kind at that diameter \
                     weighs {:.4} g/m: its stated core is not in the export",
                    choice.kind,
                    choice.diameter_mm,
                    choice.unit_mass_kg_per_m * 1000.0,
                    mu * 1000.0
                )));
            }
        }
        written
    };
    yaml::parse(&written.to_yaml_flow(), "the plan's string")
}
