//! The list of tunings a plan or audit compares, resolved: from several `--tuning` options, or
//! from the instrument's `variants` (each a tuning and/or some courses at other pitches), or
//! just the one tuning `plan` uses.

use crate::error::{Error, Result};
use crate::input::yaml::PathStep;
use crate::instrument::{Instrument, MAX_VARIANTS};
use crate::plan::solve::{tuning_for, tuning_spec_for};
use crate::tuning::course_pitch::CoursePitch;
use crate::tuning::{self, Tuning};

/// One tuning of the list, ready to solve: the instrument with this variant's course pitches.
#[derive(Debug, Clone)]
pub struct Resolved {
    /// The name reports use: the variant's, or the tuning's.
    pub name: String,
    /// The tuning.
    pub tuning: Tuning,
    /// The tuning as written (`12edo@A4=415hz`, a file's path), so a report can load it back.
    pub spec: String,
    /// The instrument with this variant's pitches written into its courses.
    pub instrument: Instrument,
    /// The course numbers whose pitch this variant changes, ascending.
    pub retuned_courses: Vec<u32>,
}

/// The tunings to compare for `instrument`: one per `tunings` entry when two or more are given
/// (named as written), else the instrument's `variants` over the base tuning (`tunings[0]`,
/// else the file's own), else just the base tuning. `flag` names the option in errors.
pub fn resolve(instrument: &Instrument, tunings: &[String], flag: &str) -> Result<Vec<Resolved>> {
    if tunings.len() > MAX_VARIANTS {
        return Err(Error::input(format!(
            "{} tunings are given; taut compares at most {MAX_VARIANTS}",
            tunings.len()
        ))
        .in_origin(flag));
    }
    if tunings.len() >= 2 {
        if !instrument.variants.is_empty() {
            return Err(Error::input(format!(
                "the instrument lists its own `variants`, so several {flag} options are ambiguous"
            ))
            .help(format!(
                "give one {flag} (the tuning of every variant without its own), or remove `variants` from {}",
                instrument.origin()
            ))
            .in_origin(flag));
        }
        let mut out: Vec<Resolved> = Vec::with_capacity(tunings.len());
        for spec in tunings {
            let tuning = tuning::load(spec).map_err(|err| err.in_origin(flag))?;
            let name = spec.trim();
            if out.iter().any(|other| other.name == name) {
                return Err(
                    Error::input(format!("the tuning `{name}` is given twice")).in_origin(flag)
                );
            }
            check_pitches(instrument, &tuning, None)?;
            out.push(Resolved {
                name: name.to_string(),
                tuning,
                spec: name.to_string(),
                instrument: instrument.clone(),
                retuned_courses: Vec::new(),
            });
        }
        return Ok(out);
    }
    if let Some(spec) = tunings.first() {
        if !instrument.variants.is_empty() && instrument.variants.iter().all(|v| v.tuning.is_some())
        {
            // The option is the tuning of variants without their own; here it would change
            // nothing, and a silent no-op reads as if it had been used.
            return Err(instrument.point(
                Error::input(format!(
                    "every variant names its own tuning, so {flag} `{spec}` would apply to none of them"
                ))
                .help(format!(
                    "leave out {flag}, or remove `tuning:` from the variants that should follow it"
                )),
                &[PathStep::Key("variants")],
            ));
        }
    }
    let base = tuning_for(instrument, tunings.first().map(String::as_str), flag)?;
    let base_spec = tuning_spec_for(instrument, tunings.first().map(String::as_str)).to_string();
    if instrument.variants.is_empty() {
        return Ok(vec![Resolved {
            name: base.name().to_string(),
            tuning: base,
            spec: base_spec,
            instrument: instrument.clone(),
            retuned_courses: Vec::new(),
        }]);
    }
    let mut out = Vec::with_capacity(instrument.variants.len());
    for (index, variant) in instrument.variants.iter().enumerate() {
        let tuning = match &variant.tuning {
            Some(spec) => tuning::load(spec).map_err(|err| {
                instrument.point(
                    err,
                    &[
                        PathStep::Key("variants"),
                        PathStep::Index(index),
                        PathStep::Key("tuning"),
                    ],
                )
            })?,
            None => base.clone(),
        };
        let mut retuned = instrument.clone();
        for (number, pitch) in &variant.pitches {
            let key = number.to_string();
            CoursePitch::resolve(pitch.trim(), &tuning).map_err(|err| {
                instrument.point(
                    err,
                    &[
                        PathStep::Key("variants"),
                        PathStep::Index(index),
                        PathStep::Key("pitches"),
                        PathStep::Key(&key),
                    ],
                )
            })?;
            for course_index in 0..retuned.courses.len() {
                if retuned.course_number(course_index) == *number {
                    retuned.courses[course_index].pitch = pitch.clone();
                }
            }
        }
        check_pitches(&retuned, &tuning, Some(variant.name.trim()))?;
        out.push(Resolved {
            name: variant.name.trim().to_string(),
            tuning,
            spec: variant
                .tuning
                .as_deref()
                .map_or_else(|| base_spec.clone(), |spec| spec.trim().to_string()),
            instrument: retuned,
            retuned_courses: variant.pitches.keys().copied().collect(),
        });
    }
    Ok(out)
}

/// The instrument as one of its variants, for the commands that draw or audit one tuning: the
/// variant's course pitches written into its courses, no variants left, and the tuning the
/// variant names, if any. `tuning` is the option's tuning for a variant without its own; a
/// variant that names its own beside it is refused (the option would change nothing). `flag`
/// names the option that picks the variant.
pub fn pick(
    instrument: &Instrument,
    name: &str,
    tuning: Option<&str>,
    flag: &str,
) -> Result<(Instrument, Option<String>)> {
    let names: Vec<&str> = instrument.variants.iter().map(|v| v.name.trim()).collect();
    if names.is_empty() {
        return Err(Error::input(format!(
            "{} lists no `variants`, so there is no variant `{}` to pick",
            instrument.origin(),
            name.trim()
        ))
        .in_origin(flag)
        .help(format!(
            "leave out {flag}, or add a `variants:` list to the file"
        )));
    }
    let Some(index) = names.iter().position(|n| *n == name.trim()) else {
        let error = Error::input(format!(
            "{} has no variant named `{}`",
            instrument.origin(),
            name.trim()
        ))
        .in_origin(flag);
        return Err(
            match crate::error::did_you_mean(name.trim(), names.iter().copied()) {
                Some(best) => error.help(format!("did you mean `{best}`?")),
                None => error.help(format!("its variants are: {}", names.join(", "))),
            },
        );
    };
    let own = instrument.variants[index].tuning.clone();
    if let (Some(own), Some(given)) = (&own, tuning) {
        return Err(instrument.point(
            Error::input(format!(
                "the variant `{}` names its own tuning `{}`, so --tuning `{given}` would not apply",
                name.trim(),
                own.trim()
            ))
            .help("leave out --tuning when picking a variant that names its tuning"),
            &[
                PathStep::Key("variants"),
                PathStep::Index(index),
                PathStep::Key("tuning"),
            ],
        ));
    }
    let given: Vec<String> = tuning.map(str::to_string).into_iter().collect();
    let mut resolved = resolve(instrument, &given, "--tuning")?;
    if index >= resolved.len() {
        return Err(Error::input("the variants could not be resolved").in_origin(flag));
    }
    let mut picked = resolved.swap_remove(index).instrument;
    picked.variants.clear();
    // Reports and pictures name the variant beside the instrument.
    picked.name = format!("{} (variant {})", picked.name, name.trim());
    Ok((picked, own.or_else(|| tuning.map(str::to_string))))
}

/// Resolves every course pitch up front, so a pitch a tuning cannot address is reported with
/// the variant it belongs to before any solving.
fn check_pitches(instrument: &Instrument, tuning: &Tuning, variant: Option<&str>) -> Result<()> {
    for index in 0..instrument.courses.len() {
        if let Some(course) = instrument.course_input(index, None) {
            instrument
                .course_pitch(&course, tuning)
                .map_err(|err| match variant {
                    Some(name) => err.help(format!(
                        "variant `{name}` reads this pitch in the tuning {}",
                        tuning.name()
                    )),
                    None => err,
                })?;
        }
    }
    Ok(())
}
