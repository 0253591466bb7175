//! The list of tunings a plan or audit compares, resolved: from several `--tuning` options, or
//! from the instrument's `variants` (each a tuning and/or some courses at other pitches), or
//! just the one tuning `plan` uses.

use crate::error::{Error, Result};
use crate::input::yaml::PathStep;
use crate::instrument::{Instrument, MAX_VARIANTS};
use crate::plan::solve::tuning_for;
use crate::tuning::course_pitch::CoursePitch;
use crate::tuning::{self, Tuning};

/// One tuning of the list, ready to solve: the instrument with this variant's course pitches.
#[derive(Debug, Clone)]
pub struct Resolved {
    /// The name reports use: the variant's, or the tuning's.
    pub name: String,
    /// The tuning.
    pub tuning: Tuning,
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
                instrument: instrument.clone(),
                retuned_courses: Vec::new(),
            });
        }
        return Ok(out);
    }
    let base = tuning_for(instrument, tunings.first().map(String::as_str), flag)?;
    if instrument.variants.is_empty() {
        return Ok(vec![Resolved {
            name: base.name().to_string(),
            tuning: base,
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
            instrument: retuned,
            retuned_courses: variant.pitches.keys().copied().collect(),
        });
    }
    Ok(out)
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
