//! Which way an instrument's courses run in pitch from course 1, read from its own pitches (or
//! stated in the settings and checked against them).
//!
//! Instruments are numbered both ways: a harp or a fanned eight-course may count from the
//! lowest course, a guitar counts from the highest. The survey's pattern (`nearest_to`, `steps`,
//! `modes_of`) is taken in the direction the instrument's own pitches run from course 1 to the
//! last course, so settings written for one numbering do not silently tune the other upside
//! down.

#[allow(unused_imports)]
use super::*;

use crate::tuning::course_pitch::CoursePitch;

/// The direction a survey walks the courses in, and the sentences saying why.
#[derive(Debug, Clone, PartialEq)]
pub(super) struct CourseOrder {
    /// Up: course 1 is the lowest.
    pub direction: Direction,
    /// How the direction was decided, and a note when `course_1` is far from the instrument's
    /// own course 1.
    pub notes: Vec<String>,
}

/// The number a course is shown with.
fn number(instrument: &Instrument, index: usize) -> u32 {
    instrument.courses[index]
        .course
        .unwrap_or_else(|| u32::try_from(index + 1).unwrap_or(u32::MAX))
}

/// The instrument's own first and last course pitches, in its own tuning.
fn own_ends(instrument: &Instrument) -> Result<(CoursePitch, CoursePitch)> {
    let tuning = solve::tuning_for(instrument, None, "tuning")?;
    let first = instrument
        .courses
        .first()
        .ok_or_else(|| Error::input("the instrument has no courses"))?;
    let last = instrument
        .courses
        .last()
        .ok_or_else(|| Error::input("the instrument has no courses"))?;
    Ok((
        CoursePitch::resolve(&first.pitch, &tuning)?,
        CoursePitch::resolve(&last.pitch, &tuning)?,
    ))
}

fn described(pitch: &CoursePitch) -> String {
    format!("{}, {:.2} Hz", pitch.written.trim(), pitch.hz)
}

impl CourseOrder {
    /// Decides the direction: the settings' `direction` when given (refused when the
    /// instrument's pitches run the other way), else the instrument's own pitches (course 1
    /// against the last course), else up.
    pub(super) fn of(instrument: &Instrument, settings: &Settings) -> Result<CourseOrder> {
        let stated = settings.direction;
        let courses = instrument.courses.len();
        let mut notes = Vec::new();
        if courses < 2 {
            return Ok(CourseOrder {
                direction: stated.unwrap_or_default(),
                notes,
            });
        }
        let last_number = number(instrument, courses - 1);
        let first_number = number(instrument, 0);
        let ends = own_ends(instrument);
        let inferred = match &ends {
            Ok((first, last)) if last.hz < first.hz => Some(Direction::Down),
            Ok((first, last)) if last.hz > first.hz => Some(Direction::Up),
            _ => None,
        };
        if let (Some(stated), Some(inferred), Ok((first, last))) = (stated, inferred, &ends) {
            if stated != inferred {
                let (said, lies) = match stated {
                    Direction::Up => ("course 1 is the lowest", "above"),
                    Direction::Down => ("course 1 is the highest", "below"),
                };
                return Err(settings.point(
                    Error::input(format!(
                        "`direction: {}` says {said}, but the instrument's course {first_number} ({}) lies {lies} its course {last_number} ({})",
                        match stated {
                            Direction::Up => "up",
                            Direction::Down => "down",
                        },
                        described(first),
                        described(last)
                    ))
                    .help(format!(
                        "write `direction: {}`, or leave `direction` out to follow the instrument's own pitches",
                        match inferred {
                            Direction::Up => "up",
                            Direction::Down => "down",
                        }
                    )),
                    &[PathStep::Key("courses"), PathStep::Key("direction")],
                ));
            }
        }
        let direction = stated.or(inferred).unwrap_or_default();
        let (run, end) = match direction {
            Direction::Up => ("up", "lowest"),
            Direction::Down => ("down", "highest"),
        };
        let way = match direction {
            Direction::Up => "upwards",
            Direction::Down => "downwards",
        };
        let why = match (&ends, stated, inferred) {
            (_, Some(_), _) => "as the settings' `direction` states".to_string(),
            (Ok((first, last)), None, Some(_)) => format!(
                "as the instrument's own pitches do (course {first_number}: {}; course {last_number}: {})",
                described(first),
                described(last)
            ),
            (Ok(_), None, None) => format!(
                "by default: the instrument's course {first_number} and course {last_number} sound the same pitch; set `direction` under `courses` to choose"
            ),
            (Err(err), None, _) => format!(
                "by default: the instrument's own pitches could not be read ({}); set `direction` under `courses` to choose",
                err.to_string().lines().next().unwrap_or_default()
            ),
        };
        notes.push(format!(
            "Courses run {run} from course {first_number} (the {end}), {why}; the pattern's intervals and steps are taken {way}."
        ));
        if let Ok((first, _)) = &ends {
            let lowest = settings.course_1_hz * ratio_from_cents(settings.offsets.cents(0));
            let highest = settings.course_1_hz
                * ratio_from_cents(
                    settings
                        .offsets
                        .cents(settings.offsets.len().saturating_sub(1)),
                );
            if first.hz < lowest || first.hz > highest {
                let apart = crate::tuning::pitch::cents(first.hz / settings.course_1_hz);
                notes.push(format!(
                    "`course_1` is {} ({:.2} Hz), but the instrument's own course {first_number} is {}, {:.0} cents {} and outside the offsets swept: its lengths, kinds and tensions were chosen for that pitch.",
                    settings.course_1,
                    settings.course_1_hz,
                    described(first),
                    apart.abs(),
                    if apart > 0.0 { "higher" } else { "lower" }
                ));
            }
        }
        Ok(CourseOrder { direction, notes })
    }
}
