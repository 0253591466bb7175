//! Where the strings are now, and the checks that keep a state the strings cannot be in out of
//! a report.
//!
//! Without `--from-instrument`, the strings' current pitches are the audited instrument's own
//! course pitches read in another tuning (the set file's `tuning:` or `--from`). That reading
//! only describes the strings when a pitch names the same note in both tunings: a note name
//! (`E2`, `~G4`, `E2+14c`) or a frequency does; a degree, a ratio or cents from the tuning's
//! reference are counted in the tuning they are read in, so in another tuning they can name a
//! note an octave or more away. Such a course is refused unless both readings agree. And no
//! current state may put a string above its breaking load, however it was worked out: a string
//! that would have broken is not where the strings are now.

use crate::error::{Error, Result};
use crate::input::yaml::PathStep;
use crate::instrument::{CourseInput, Instrument};
use crate::plan::CoursePitch;
use crate::sets::set::StringSet;
use crate::tuning::pitch::PitchSpec;
use crate::tuning::Tuning;

/// Two readings of a pitch closer than this, in cents, are the same pitch (float noise only).
const SAME_PITCH_CENTS: f64 = 0.01;

/// What a refusal asks for, whatever the reference came from.
const GIVE_THE_STATE_NOW: &str = "give the instrument as it is strung now with --from-instrument FILE (an instrument file whose course pitches and tuning are where the strings are now)";

/// Where the strings are now, for measuring tension changes: an instrument (often the same one)
/// in a tuning. Courses are matched by number.
#[derive(Debug, Clone, Copy)]
pub struct Reference<'a> {
    /// The instrument as strung now.
    pub instrument: &'a Instrument,
    /// The tuning it is in now.
    pub tuning: &'a Tuning,
    /// Where this reference comes from, so a refusal names the file or option behind it.
    pub source: ReferenceSource<'a>,
}

/// What says where the strings are now.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ReferenceSource<'a> {
    /// The set file's `tuning:` line (the spec as written), with the audited instrument's own
    /// course pitches.
    SetTuning(&'a str),
    /// An option naming a tuning (e.g. `--from`), with the audited instrument's own course
    /// pitches; the text names the option.
    TuningOption(&'a str),
    /// The audited instrument in its own tuning (when another tuning is audited).
    OwnTuning,
    /// An instrument file as strung now (`--from-instrument`), with its own course pitches.
    Instrument,
}

impl ReferenceSource<'_> {
    /// Whether the audited instrument's pitches are read in a tuning other than their own.
    fn rereads_pitches(self) -> bool {
        matches!(
            self,
            ReferenceSource::SetTuning(_) | ReferenceSource::TuningOption(_)
        )
    }
}

/// How far apart, in cents, a course's pitch lands when read in another tuning than the one it
/// was written for, if that reading names another pitch: a degree, a ratio or cents count in the
/// tuning they are read in, while a note name or a frequency reads the same in any tuning.
/// `None` when both readings agree (float noise aside).
pub(crate) fn reread_apart_cents(
    course: &CourseInput<'_>,
    written_for: &CoursePitch,
    read_as: &CoursePitch,
) -> Option<f64> {
    let relative = matches!(
        course.pitch.parse::<PitchSpec>(),
        Ok(PitchSpec::Degree { .. }
            | PitchSpec::PeriodStep { .. }
            | PitchSpec::Ratio { .. }
            | PitchSpec::Cents { .. })
    );
    let apart_cents = 1200.0 * (read_as.hz / written_for.hz).log2();
    (relative && apart_cents.abs() >= SAME_PITCH_CENTS).then_some(apart_cents)
}

impl Reference<'_> {
    /// Refuses a course whose pitch, written as a degree, ratio or cents of the audited
    /// tuning, names another pitch when read in the reference tuning: that reading says nothing
    /// about where the string is now.
    pub(super) fn check_reading(
        &self,
        set: &StringSet,
        instrument: &Instrument,
        audited_tuning: &Tuning,
        course: &CourseInput<'_>,
        audited: &CoursePitch,
        now: &CoursePitch,
    ) -> Result<()> {
        if !self.source.rereads_pitches() {
            return Ok(());
        }
        let Some(apart_cents) = reread_apart_cents(course, audited, now) else {
            return Ok(());
        };
        let message = format!(
            "course {}'s pitch `{}` in {} counts in the audited tuning {}; read in {}, as {} \
             has it, it is {:.1} Hz instead of {:.1} Hz ({:+.0} cents), so it cannot say where \
             the strings are now",
            course.number,
            course.pitch.trim(),
            instrument.origin(),
            audited_tuning.name(),
            self.tuning.name(),
            self.source_words(),
            now.hz,
            audited.hz,
            apart_cents,
        );
        Err(self.locate(Error::input(message), set, instrument, course.index))
    }

    /// Refuses a current state in which a string carries its breaking load or more.
    #[allow(clippy::too_many_arguments)]
    pub(super) fn check_possible(
        &self,
        set: &StringSet,
        course: &CourseInput<'_>,
        string: Option<usize>,
        label: &str,
        hz_now: f64,
        tension_now: f64,
        breaking: Option<f64>,
    ) -> Result<()> {
        let Some(breaking) = breaking.filter(|b| tension_now >= *b) else {
            return Ok(());
        };
        let which = match string {
            Some(index) => format!("course {} string {}", course.number, index + 1),
            None => format!("course {}", course.number),
        };
        let message = format!(
            "{which} ({label}) cannot be at {hz_now:.1} Hz now, as {} says: it would carry \
             {tension_now:.1} N there, beyond its breaking load of {breaking:.1} N",
            self.source_words(),
        );
        let origin_instrument = self.instrument;
        let index = (0..origin_instrument.courses.len())
            .find(|&i| origin_instrument.course_number(i) == course.number)
            .unwrap_or(course.index);
        Err(self.locate(Error::input(message), set, origin_instrument, index))
    }

    /// What says where the strings are, in words.
    fn source_words(&self) -> String {
        match self.source {
            ReferenceSource::SetTuning(spec) => format!("the set's `tuning: {}`", spec.trim()),
            ReferenceSource::TuningOption(option) => {
                format!("{option} {}", self.tuning.name())
            }
            ReferenceSource::OwnTuning => format!(
                "{} in its own tuning {}",
                self.instrument.origin(),
                self.tuning.name()
            ),
            ReferenceSource::Instrument => format!(
                "--from-instrument {} in {}",
                self.instrument.origin(),
                self.tuning.name()
            ),
        }
    }

    /// Points a refusal at the line behind the reference and says what to give instead.
    fn locate(
        &self,
        error: Error,
        set: &StringSet,
        instrument: &Instrument,
        course_index: usize,
    ) -> Error {
        let pitch_line = [
            PathStep::Key("courses"),
            PathStep::Index(course_index),
            PathStep::Key("pitch"),
        ];
        match self.source {
            ReferenceSource::SetTuning(_) => set
                .point(error, &[PathStep::Key("tuning")])
                .help(format!(
                    "{GIVE_THE_STATE_NOW}; or remove the set's `tuning:` line to audit without tension changes"
                )),
            ReferenceSource::TuningOption(option) => error
                .in_origin(option)
                .help(format!("{GIVE_THE_STATE_NOW}, instead of {option}")),
            ReferenceSource::OwnTuning => instrument
                .point(error, &pitch_line)
                .help(GIVE_THE_STATE_NOW),
            ReferenceSource::Instrument => instrument.point(error, &pitch_line).help(
                "check the pitches and tuning of the --from-instrument file: they must be where the strings are now",
            ),
        }
    }
}
