//! Matching a set's courses to an instrument's: the strings of each course resolved and
//! counted, courses missing or extra, and the stress limits and cautions both audit and
//! conversion apply.

use crate::error::{Error, Result};
use crate::input::yaml::PathStep;
use crate::instrument::{CourseInput, Instrument};
use crate::plan::warning::{Severity, Warning, SAFETY_CAUTIONS};
use crate::sets::set::{ResolvedString, SetString, StringSet};
use crate::strings::kind::StringKinds;
use crate::strings::material::Materials;

/// The set's course for an instrument course, with its strings resolved, checking the counts.
pub(crate) fn set_strings<'k>(
    set: &StringSet,
    instrument: &Instrument,
    course: &CourseInput<'_>,
    kinds: &'k StringKinds,
    materials: &'k Materials,
) -> Result<Option<Vec<(SetString, ResolvedString<'k>)>>> {
    let Some((set_index, set_course)) = set.course(course.number) else {
        return Ok(None);
    };
    if set_course.strings.len() != course.strings.len() {
        return Err(set.point(
            Error::input(format!(
                "course {} holds {} string(s) here, but the instrument `{}` lists {} for it",
                course.number,
                set_course.strings.len(),
                instrument.name,
                course.strings.len()
            )),
            &[
                PathStep::Key("courses"),
                PathStep::Index(set_index),
                PathStep::Key("strings"),
            ],
        ));
    }
    let mut out = Vec::with_capacity(set_course.strings.len());
    for (string_index, string) in set_course.strings.iter().enumerate() {
        let resolved = string.resolve(kinds, materials).map_err(|err| {
            set.point(
                err,
                &[
                    PathStep::Key("courses"),
                    PathStep::Index(set_index),
                    PathStep::Key("strings"),
                    PathStep::Index(string_index),
                ],
            )
        })?;
        out.push((string.clone(), resolved));
    }
    Ok(Some(out))
}

/// The error for an instrument course the set does not string.
pub(crate) fn missing_course(set: &StringSet, instrument: &Instrument, number: u32) -> Error {
    set.point(
        Error::input(format!(
            "the set has no strings for course {number}, which the instrument `{}` lists",
            instrument.name
        ))
        .help("add the course to the set, numbered as in the instrument"),
        &[PathStep::Key("courses")],
    )
}

/// Refuses set courses the instrument does not have.
pub(crate) fn check_no_extra_courses(set: &StringSet, instrument: &Instrument) -> Result<()> {
    for (index, course) in set.courses.iter().enumerate() {
        let known =
            (0..instrument.courses.len()).any(|i| instrument.course_number(i) == course.course);
        if !known {
            return Err(set.point(
                Error::input(format!(
                    "course {} is not a course of the instrument `{}`",
                    course.course, instrument.name
                ))
                .help("number the set's courses as the instrument numbers them"),
                &[PathStep::Key("courses"), PathStep::Index(index)],
            ));
        }
    }
    Ok(())
}

/// Safety cautions to show when any warning is a caution or a danger.
pub(crate) fn cautions_for(warnings: &[Warning]) -> Vec<String> {
    if warnings
        .iter()
        .any(|warning| warning.severity >= Severity::Caution)
    {
        SAFETY_CAUTIONS.iter().map(|s| s.to_string()).collect()
    } else {
        Vec::new()
    }
}
