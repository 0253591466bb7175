//! Instrument definitions: the courses to string, their pitches and lengths, and what each may
//! carry.
//!
//! An instrument file is YAML (read through [`crate::input::yaml::parse`]); its schema is documented in
//! `taut help instrument-file` and in the examples/ folder. Checks that need one value are done while reading, so they
//! name line and column; checks across values (duplicate course numbers, a course without any
//! length) run in [`Instrument::from_text`] and are pointed back at their line with
//! [`crate::input::yaml::locate`].

mod check;
pub mod entry;
pub mod frets;
mod interval;
mod quantities;
pub mod raises;
mod scalar_or_map;
mod templates;
mod tension;
mod variants;

use std::str::FromStr;

use serde::Deserialize;

pub use crate::input::yaml::field_name;
pub use entry::StringEntryFile;
pub use frets::FretSettings;
pub use interval::Interval;
pub use quantities::{Percent, ScaleLength};
pub use raises::{Action, RaiseAmount, Raises};
pub use scalar_or_map::{optional_scalar, Expecting, NoDetail, ScalarOrMap};
pub use templates::{template, TEMPLATES};
pub use tension::{Shape, TensionGoal, TensionSpec};
pub use variants::{Variant, MAX_VARIANTS};

use crate::error::{Error, Result};
use crate::input::units::{Diameter, Force, Length};
use crate::input::yaml::{self, PathStep};
use crate::tuning::course_pitch::CoursePitch;
use crate::tuning::Tuning;

/// The most courses one instrument may have. Concert harps have 47 and large zithers a few
/// hundred; a thousand leaves room while catching a runaway generated file.
pub const MAX_COURSES: usize = 1000;
/// The most strings one course may hold (single, pair or triple courses).
pub const MAX_STRINGS_PER_COURSE: usize = 3;

/// Fractions of the breaking strength at which the stress warnings fire.
#[derive(Debug, Clone, Copy, PartialEq, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct StressLimits {
    /// Above this fraction a caution is shown.
    pub caution: Option<Percent>,
    /// Above this fraction a danger is shown.
    pub danger: Option<Percent>,
}

/// Settings any course may give and the instrument's `defaults` give for all.
#[derive(Debug, Clone, Default, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct CourseSettings {
    /// Ids of the string kinds (construction, materials and gauge catalog) allowed.
    pub kinds: Option<Vec<String>>,
    /// Tension target, window or (in `defaults` only) profile.
    pub tension: Option<TensionSpec>,
    /// The widest string the nut slot, bridge hole or tuner takes.
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub max_diameter: Option<Diameter>,
    /// String from its anchor (tail block, soundboard eyelet, hitch pin) to the near end of the
    /// vibrating length: with `post_length`, the order sheet's cut length (REFERENCES §12.2).
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub anchor_length: Option<Length>,
    /// String from the far end of the vibrating length (nut, bridge pin) to the tuning post.
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub post_length: Option<Length>,
    /// A lever or pedal on every course that does not give its own.
    pub raises: Option<Raises>,
}

/// One string of a course.
#[derive(Debug, Clone, PartialEq)]
pub struct CourseString {
    /// Its interval from the course pitch.
    pub interval: Interval,
    /// Kinds allowed for this string alone (e.g. a plain octave string in a wound course).
    pub kinds: Option<Vec<String>>,
    /// The string named outright (`string: {kind: plain-steel, diameter: 0.012in}`): it is not
    /// chosen, only checked.
    pub string: Option<StringEntryFile>,
}

#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
struct CourseStringDetail {
    interval: Interval,
    kinds: Option<Vec<String>>,
    string: Option<StringEntryFile>,
}

impl Expecting for Interval {
    const EXPECTING: &'static str =
        "an interval such as `unison`, `octave`, `octave below`, `3/2` or `+702c`";
}

impl<'de> Deserialize<'de> for CourseString {
    fn deserialize<D: serde::Deserializer<'de>>(
        deserializer: D,
    ) -> std::result::Result<Self, D::Error> {
        Ok(
            match ScalarOrMap::<Interval, CourseStringDetail>::deserialize(deserializer)? {
                ScalarOrMap::Scalar(interval) => CourseString {
                    interval,
                    kinds: None,
                    string: None,
                },
                ScalarOrMap::Map(detail) => CourseString {
                    interval: detail.interval,
                    kinds: detail.kinds,
                    string: detail.string,
                },
            },
        )
    }
}

fn one_unison() -> Vec<CourseString> {
    vec![CourseString {
        interval: Interval::unison(),
        kinds: None,
        string: None,
    }]
}

/// One course: its pitch, its strings and anything it sets for itself.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Course {
    /// The course number shown in output; defaults to its position in the list, from 1.
    pub course: Option<u32>,
    /// The pitch in the tuning's own addressing (e.g. `E2`, a degree, a ratio, Hz).
    pub pitch: String,
    /// This course's own vibrating length.
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub scale_length: Option<Length>,
    /// The strings of the course (default: one string at unison).
    #[serde(default = "one_unison")]
    pub strings: Vec<CourseString>,
    /// Kinds allowed on this course.
    pub kinds: Option<Vec<String>>,
    /// Tension target or window for this course.
    pub tension: Option<TensionSpec>,
    /// The widest string this course's slot or hole takes.
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub max_diameter: Option<Diameter>,
    /// The string named outright for every string of the course that does not name its own:
    /// the player's own string, kept while the rest are solved.
    pub string: Option<StringEntryFile>,
    /// This course's anchor length (see [`CourseSettings::anchor_length`]).
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub anchor_length: Option<Length>,
    /// This course's post length (see [`CourseSettings::post_length`]).
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub post_length: Option<Length>,
    /// The course's lever or pedal: the positions it can be set to above the open string.
    pub raises: Option<Raises>,
}

/// The file's contents, as written.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
struct InstrumentFile {
    name: String,
    // `description` as in tuning files; `about` is the older name, still read.
    #[serde(rename = "description", alias = "about")]
    about: Option<String>,
    tuning: Option<String>,
    scale_length: Option<ScaleLength>,
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    rated_load: Option<Force>,
    tolerance: Option<Percent>,
    stress_limits: Option<StressLimits>,
    #[serde(default)]
    defaults: CourseSettings,
    courses: Vec<Course>,
    frets: Option<FretSettings>,
    #[serde(default)]
    variants: Vec<Variant>,
}

/// A checked instrument definition, with the text it came from so later errors can point at
/// their line.
#[derive(Debug, Clone)]
pub struct Instrument {
    /// The instrument's name.
    pub name: String,
    /// A sentence about it.
    pub about: Option<String>,
    /// The tuning to use when none is given on the command line.
    pub tuning: Option<String>,
    /// Instrument-wide vibrating length.
    pub scale_length: Option<ScaleLength>,
    /// The most total tension the maker rates the neck or soundboard for.
    pub rated_load: Option<Force>,
    /// How far a chosen string's tension may sit from the target before a warning.
    pub tolerance: Option<Percent>,
    /// Overrides of the stress warning thresholds.
    pub stress_limits: Option<StressLimits>,
    /// Settings for every course that does not give its own.
    pub defaults: CourseSettings,
    /// The courses in the order written (at least one).
    pub courses: Vec<Course>,
    /// Fret layout settings (`taut frets`), as written.
    pub frets: Option<FretSettings>,
    /// The tunings and course-pitch variants the player moves between (empty: just the one).
    pub variants: Vec<Variant>,
    origin: String,
    text: String,
}

/// What the solver needs for one course, with every default applied. Borrows from the
/// [`Instrument`], so building it does not allocate.
#[derive(Debug, Clone, Copy)]
pub struct CourseInput<'a> {
    /// Position in the course list, from 0.
    pub index: usize,
    /// The course number shown to the user.
    pub number: u32,
    /// The pitch as written.
    pub pitch: &'a str,
    /// Vibrating length in metres.
    pub length_m: f64,
    /// Tension target and window, in newtons.
    pub tension: Option<TensionGoal>,
    /// Kinds allowed on the course, before any string's own choice.
    pub kinds: Option<&'a [String]>,
    /// The widest string the slot takes, in metres.
    pub max_diameter_m: Option<f64>,
    /// The course's strings (at least one).
    pub strings: &'a [CourseString],
    /// The string the course names outright for its strings without their own.
    pub string: Option<&'a StringEntryFile>,
    /// String from the anchor to the vibrating length, m, where the file states it.
    pub anchor_m: Option<f64>,
    /// String from the vibrating length to the tuning post, m, where the file states it.
    pub post_m: Option<f64>,
    /// The course's lever or pedal (its own, else the defaults').
    pub raises: Option<&'a Raises>,
}

impl CourseInput<'_> {
    /// The string fixed for the course's string at `index`: its own, else the course's.
    pub fn fixed(&self, index: usize) -> Option<&StringEntryFile> {
        self.strings
            .get(index)
            .and_then(|string| string.string.as_ref())
            .or(self.string)
    }
}

impl Instrument {
    /// Loads an instrument from a file path or, when no such file exists, a shipped example by
    /// name (see [`crate::input::examples`]); a file of another kind is named as such.
    pub fn load(spec: &str) -> Result<Self> {
        use crate::input::examples::{self, FileKind};
        let (text, origin) = examples::read(spec, "INSTRUMENT")?;
        Instrument::from_text(text.clone(), &origin).map_err(|err| {
            examples::wrong_kind(&text, &origin, FileKind::Instrument).unwrap_or(err)
        })
    }

    /// Parses and checks an instrument definition; `origin` names it in messages.
    pub fn from_text(text: String, origin: &str) -> Result<Self> {
        let file: InstrumentFile = yaml::parse(&text, origin)?;
        let instrument = Instrument {
            name: file.name,
            about: file.about,
            tuning: file.tuning,
            scale_length: file.scale_length,
            rated_load: file.rated_load,
            tolerance: file.tolerance,
            stress_limits: file.stress_limits,
            defaults: file.defaults,
            courses: file.courses,
            frets: file.frets,
            variants: file.variants,
            origin: origin.to_string(),
            text,
        };
        instrument.check()?;
        instrument.check_variants()?;
        Ok(instrument)
    }

    /// Where this definition came from (a path or a template label).
    pub fn origin(&self) -> &str {
        &self.origin
    }

    /// Resolves a course's pitch in `tuning`, pointing errors at the course's `pitch` line.
    pub fn course_pitch(&self, course: &CourseInput<'_>, tuning: &Tuning) -> Result<CoursePitch> {
        CoursePitch::resolve(course.pitch, tuning).map_err(|err| {
            self.point(
                err,
                &[
                    PathStep::Key("courses"),
                    PathStep::Index(course.index),
                    PathStep::Key("pitch"),
                ],
            )
        })
    }

    /// Attaches this file's name and, where found, the line of `path` to an error.
    pub fn point(&self, error: Error, path: &[PathStep<'_>]) -> Error {
        // An error from an inline value (`tuning: 0edo`) carries a label for an origin but no
        // line; keep the label in the message so the file and line can be named.
        let error = match error {
            Error::Input {
                location,
                message,
                help,
            } if location.line.is_none() && location.origin.is_some() => Error::Input {
                message: format!("{location}: {message}"),
                location: Default::default(),
                help,
            },
            other => other,
        };
        yaml::point(error, &self.text, &self.origin, path)
    }

    /// The number shown for the course at `index`: its own `course`, or its position from 1.
    pub fn course_number(&self, index: usize) -> u32 {
        self.courses
            .get(index)
            .and_then(|course| course.course)
            .unwrap_or_else(|| u32::try_from(index + 1).unwrap_or(u32::MAX))
    }

    /// The course at `index` with every default applied; `tension_override` replaces any tension
    /// the file gives (e.g. from the command line).
    pub fn course_input(
        &self,
        index: usize,
        tension_override: Option<&TensionSpec>,
    ) -> Option<CourseInput<'_>> {
        let course = self.courses.get(index)?;
        let position = if self.courses.len() > 1 {
            index as f64 / (self.courses.len() - 1) as f64
        } else {
            0.0
        };
        let length_m = match (&course.scale_length, &self.scale_length) {
            (Some(own), _) => own.si(),
            (None, Some(shared)) => shared.at(position),
            // `check` refuses a course without any length, so this is not reached.
            (None, None) => return None,
        };
        let tension = tension_override
            .or(course.tension.as_ref())
            .or(self.defaults.tension.as_ref())
            .map(|spec| spec.goal_at(position));
        Some(CourseInput {
            index,
            number: self.course_number(index),
            pitch: course.pitch.trim(),
            length_m,
            tension,
            kinds: course.kinds.as_deref().or(self.defaults.kinds.as_deref()),
            max_diameter_m: course
                .max_diameter
                .or(self.defaults.max_diameter)
                .map(Diameter::si),
            strings: &course.strings,
            string: course.string.as_ref(),
            anchor_m: course
                .anchor_length
                .or(self.defaults.anchor_length)
                .map(Length::si),
            post_m: course
                .post_length
                .or(self.defaults.post_length)
                .map(Length::si),
            raises: course.raises.as_ref().or(self.defaults.raises.as_ref()),
        })
    }
}

#[cfg(test)]
mod tests;
