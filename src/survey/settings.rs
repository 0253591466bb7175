//! The survey settings file: which tunings, offsets and course patterns to try, and how to rank.
//!
//! ```yaml
//! tunings:
//!   edos: {from: 5, to: 72}        # or `list: [19edo, 31edo, my-tuning.yaml]`
//! course_1: E2                     # course 1's pitch at offset 0 (a note at A4 = 440 Hz, or Hz)
//! offset_cents: {from: -600, to: 600, step: 0.1}
//! courses:
//!   nearest_to: 4/3                # or `steps: [5, 5, 5, 4, 5]` or `modes_of: [2, 2, 1, 2, 2, 2, 1]`
//!   direction: up                  # optional: up (course 1 lowest) or down (course 1 highest);
//!                                  # default and check: the instrument's own pitches
//! rank_by: spread                  # spread | stress | load | target
//! top: 10
//! every_offset: false              # true: every stringable offset, not each setting once
//! ```

use std::path::{Path, PathBuf};
use std::str::FromStr;

use serde::{Deserialize, Serialize};

use crate::error::{Error, Result};
use crate::input::yaml::{self, PathStep};
use crate::tuning::interval::{Divisions, FiniteNumber, IntervalText};
use crate::tuning::pitch::{PitchSpec, ISO_16_A4_HZ};
use crate::tuning::Interval;

use super::range::CentsRange;

/// Most results a survey lists.
pub const MAX_TOP: usize = 10_000;
/// Most tunings one survey tries.
pub const MAX_TUNINGS: usize = 2_000;
/// Most offsets one survey sweeps (the table of offset ratios is kept in memory).
pub const MAX_OFFSETS: u64 = 2_000_000;
/// Most bytes of tuning files one survey reads (each file once): about 3 s of YAML at the
/// 10 MB/s serde_yaml reads.
pub const MAX_TUNING_BYTES: u64 = 32 * 1024 * 1024;
/// Most steps a scale for `modes_of` may have.
pub const MAX_SCALE_STEPS: usize = 1_000;

/// How candidates are ordered. Every rule breaks ties with the others, then by the order the
/// candidates were generated in, so the ranking never depends on the thread count.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum RankRule {
    /// Smallest spread of tensions (highest minus lowest), then worst stress, then total load.
    #[default]
    Spread,
    /// Lowest worst stress ratio, then spread, then total load.
    Stress,
    /// Lowest total load, then spread, then worst stress.
    Load,
    /// Smallest worst relative distance from the target tension, then spread, then stress.
    Target,
}

impl RankRule {
    /// The rule in words, as reports state it.
    pub fn statement(self) -> &'static str {
        match self {
            RankRule::Spread => "smallest tension spread (highest minus lowest string tension), then lowest worst stress, then lowest total load",
            RankRule::Stress => "lowest worst stress ratio, then smallest tension spread, then lowest total load",
            RankRule::Load => "lowest total load, then smallest tension spread, then lowest worst stress",
            RankRule::Target => "smallest worst distance from the target tension, then smallest tension spread, then lowest worst stress",
        }
    }
}

/// Which tunings to try.
#[derive(Debug, Clone, PartialEq)]
pub enum TuningChoice {
    /// N equal divisions of the octave for every N in `from..=to`.
    Edos {
        /// Smallest N.
        from: u64,
        /// Largest N.
        to: u64,
    },
    /// Tunings by shipped name, inline spec or file path.
    List(Vec<String>),
}

impl TuningChoice {
    /// How many tunings this is.
    pub fn count(&self) -> u64 {
        match self {
            TuningChoice::Edos { from, to } => to - from + 1,
            TuningChoice::List(specs) => specs.len() as u64,
        }
    }

    /// The spec of tuning `index`, as [`crate::tuning::load`] reads it.
    pub fn spec(&self, index: usize) -> String {
        match self {
            TuningChoice::Edos { from, .. } => format!("{}edo", from + index as u64),
            TuningChoice::List(specs) => specs.get(index).cloned().unwrap_or_default(),
        }
    }
}

/// Which way the courses run in pitch from course 1: the pattern's intervals and steps are
/// taken in this direction.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum Direction {
    /// Course 1 is the lowest; each course lies above the one before.
    #[default]
    Up,
    /// Course 1 is the highest (as guitarists count); each course lies below the one before.
    Down,
}

impl Direction {
    /// +1 for up, −1 for down.
    pub fn sign(self) -> i64 {
        match self {
            Direction::Up => 1,
            Direction::Down => -1,
        }
    }

    /// `above` or `below`.
    pub fn word(self) -> &'static str {
        match self {
            Direction::Up => "above",
            Direction::Down => "below",
        }
    }
}

/// Which degree each course takes.
#[derive(Debug, Clone, PartialEq)]
pub enum PatternRule {
    /// Each course the degree nearest this interval above the course before.
    NearestTo(Interval),
    /// These degree steps between neighbouring courses (one fewer than the courses).
    Steps(Vec<i64>),
    /// Every mode of this scale (degree steps, one period): one course per scale note.
    ModesOf(Vec<i64>),
    /// Every mode of a shipped or written tuning used as a scale (`modes_of_scale`): its notes
    /// are placed on the nearest degrees of each surveyed tuning, so one scale gives its modes
    /// in every EDO.
    ScaleModes(Scale),
}

/// A scale for [`PatternRule::ScaleModes`]: its notes within one period.
#[derive(Debug, Clone, PartialEq)]
pub struct Scale {
    /// The tuning's name, for the report.
    pub name: String,
    /// Each note's cents above the first, ascending, the first 0.
    pub note_cents: Vec<f64>,
    /// The period in cents (1200 for an octave).
    pub period_cents: f64,
}

impl Scale {
    /// Loads `spec` (a shipped tuning, an inline spec or a file) as a scale: one period of it.
    fn load(spec: &str) -> Result<Scale> {
        let tuning = crate::tuning::load(spec)?;
        let notes = tuning
            .degrees_per_period()
            .filter(|&n| (1..=MAX_SCALE_STEPS).contains(&n))
            .ok_or_else(|| {
                Error::input(format!(
                    "`{}` is no scale of 1 to {MAX_SCALE_STEPS} notes a period",
                    tuning.name()
                ))
            })?;
        let cents = |k: i64| {
            tuning.cents_above_degree_zero(k).ok_or_else(|| {
                Error::input(format!("degree {k} of `{}` does not exist", tuning.name()))
            })
        };
        let note_cents = (0..notes as i64).map(cents).collect::<Result<Vec<f64>>>()?;
        Ok(Scale {
            name: tuning.name().to_string(),
            note_cents,
            period_cents: cents(notes as i64)?,
        })
    }

    /// The scale's steps in `tuning`'s degrees: each note on the degree nearest it (a step may
    /// be 0 where the tuning is coarser than the scale), or `None` where the tuning cannot place
    /// a note.
    pub fn steps_in(&self, tuning: &crate::tuning::Tuning) -> Option<Vec<i64>> {
        let degree = |cents: f64| {
            tuning
                .nearest_to_cents_above_degree_zero(cents)
                .map(|d| d.degree)
        };
        let mut degrees = self
            .note_cents
            .iter()
            .map(|&c| degree(c))
            .collect::<Option<Vec<i64>>>()?;
        degrees.push(degree(self.period_cents)?);
        Some(degrees.windows(2).map(|w| w[1] - w[0]).collect())
    }
}

impl PatternRule {
    /// How many course patterns one tuning gets.
    pub fn count(&self) -> u64 {
        match self {
            PatternRule::ModesOf(scale) => scale.len() as u64,
            PatternRule::ScaleModes(scale) => scale.note_cents.len() as u64,
            _ => 1,
        }
    }
}

/// Checked survey settings.
#[derive(Debug, Clone)]
pub struct Settings {
    /// The tunings to try.
    pub tunings: TuningChoice,
    /// Course 1's pitch at offset 0, as written.
    pub course_1: String,
    /// Course 1's pitch at offset 0, in hertz.
    pub course_1_hz: f64,
    /// The offsets to sweep.
    pub offsets: CentsRange,
    /// How courses climb.
    pub pattern: PatternRule,
    /// The direction the settings state (`courses: direction`), if any; the survey checks it
    /// against the instrument's own pitches and otherwise takes the direction from them.
    pub direction: Option<Direction>,
    /// The ranking rule.
    pub rank_by: RankRule,
    /// How many results to list.
    pub top: usize,
    /// List every stringable offset, rather than each tuning and course pattern once at its
    /// best offset (the default: neighbouring offsets of one setting would fill the list).
    pub every_offset: bool,
    origin: String,
    text: String,
    folder: Option<PathBuf>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct SettingsFile {
    tunings: TuningsSpec,
    course_1: String,
    #[serde(default)]
    offset_cents: Option<RangeSpec>,
    courses: PatternSpec,
    #[serde(default)]
    rank_by: RankRule,
    #[serde(default)]
    top: Option<usize>,
    #[serde(default)]
    every_offset: bool,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct TuningsSpec {
    #[serde(default)]
    edos: Option<EdoSpec>,
    #[serde(default)]
    list: Option<Vec<String>>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct EdoSpec {
    from: Divisions,
    to: Divisions,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RangeSpec {
    from: FiniteNumber,
    to: FiniteNumber,
    step: FiniteNumber,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct PatternSpec {
    #[serde(default)]
    nearest_to: Option<IntervalText>,
    #[serde(default)]
    steps: Option<Vec<i64>>,
    #[serde(default)]
    modes_of: Option<Vec<i64>>,
    #[serde(default)]
    modes_of_scale: Option<String>,
    #[serde(default)]
    direction: Option<Direction>,
}

/// Default number of results listed.
pub const DEFAULT_TOP: usize = 10;

impl Settings {
    /// Reads a settings file, or the shipped example of that name (`survey-fourths`).
    pub fn load(spec: &str) -> Result<Settings> {
        let (text, origin) = crate::input::examples::read(spec, "SETTINGS")?;
        let mut settings = Settings::from_text(text, &origin)?;
        let path = Path::new(spec);
        if path.exists() {
            settings.folder = path.parent().map(Path::to_path_buf);
        }
        Ok(settings)
    }

    /// Parses and checks settings; `origin` names them in messages.
    pub fn from_text(text: String, origin: &str) -> Result<Settings> {
        let file: SettingsFile = yaml::parse(&text, origin)?;
        let mut settings = Settings {
            tunings: TuningChoice::List(Vec::new()),
            course_1: file.course_1.trim().to_string(),
            course_1_hz: 0.0,
            offsets: CentsRange::single(0.0)?,
            pattern: PatternRule::Steps(Vec::new()),
            direction: file.courses.direction,
            rank_by: file.rank_by,
            top: file.top.unwrap_or(DEFAULT_TOP),
            every_offset: file.every_offset,
            origin: origin.to_string(),
            text,
            folder: None,
        };
        settings.tunings = match (file.tunings.edos, file.tunings.list) {
            (Some(edos), None) => {
                if edos.to.0 < edos.from.0 {
                    return Err(settings.point(
                        Error::input(format!(
                            "the range of EDOs is empty: `to` ({}) is below `from` ({}), so the survey would try 0 candidates",
                            edos.to.0, edos.from.0
                        )),
                        &[PathStep::Key("tunings"), PathStep::Key("edos")],
                    ));
                }
                TuningChoice::Edos {
                    from: edos.from.0,
                    to: edos.to.0,
                }
            }
            (None, Some(list)) if !list.is_empty() => TuningChoice::List(list),
            (None, Some(_)) => {
                return Err(settings.point(
                    Error::input("the list of tunings is empty")
                        .help("name at least one, e.g. `list: [19edo]`"),
                    &[PathStep::Key("tunings"), PathStep::Key("list")],
                ))
            }
            _ => {
                return Err(settings.point(
                    Error::input("give exactly one of `edos` and `list` under `tunings`")
                        .help("e.g. `edos: {from: 5, to: 72}` or `list: [19edo, 31edo]`"),
                    &[PathStep::Key("tunings")],
                ))
            }
        };
        settings.course_1_hz = settings
            .course_1_pitch()
            .map_err(|err| settings.point(err, &[PathStep::Key("course_1")]))?;
        if let Some(range) = file.offset_cents {
            settings.offsets =
                CentsRange::new(range.from.0, range.to.0, range.step.0).map_err(|err| {
                    settings.point(
                        Error::input(format!(
                            "{}; the survey would try no candidates",
                            err.message
                        )),
                        &[PathStep::Key("offset_cents"), PathStep::Key(err.field)],
                    )
                })?;
        }
        let pattern_path = [PathStep::Key("courses")];
        settings.pattern = match (
            file.courses.nearest_to,
            file.courses.steps,
            file.courses.modes_of,
            file.courses.modes_of_scale,
        ) {
            (Some(interval), None, None, None) => PatternRule::NearestTo(interval.0),
            (None, Some(steps), None, None) => PatternRule::Steps(steps),
            (None, None, None, Some(spec)) => PatternRule::ScaleModes(
                Scale::load(&spec).map_err(|err| {
                    settings.point(
                        err,
                        &[PathStep::Key("courses"), PathStep::Key("modes_of_scale")],
                    )
                })?,
            ),
            (None, None, Some(scale), None) => {
                let at = [PathStep::Key("courses"), PathStep::Key("modes_of")];
                if scale.is_empty() || scale.len() > MAX_SCALE_STEPS {
                    return Err(settings.point(
                        Error::input(format!(
                            "a scale for `modes_of` has 1 to {MAX_SCALE_STEPS} steps; this one has {}",
                            scale.len()
                        )),
                        &at,
                    ));
                }
                if scale.iter().any(|&step| step < 1) {
                    return Err(settings.point(
                        Error::input("every step of a scale climbs by at least one degree"),
                        &at,
                    ));
                }
                PatternRule::ModesOf(scale)
            }
            _ => {
                return Err(settings.point(
                    Error::input(
                        "give exactly one of `nearest_to`, `steps`, `modes_of` and `modes_of_scale` under `courses`",
                    )
                    .help("e.g. `nearest_to: 4/3` for neighbouring courses a fourth apart"),
                    &pattern_path,
                ))
            }
        };
        if settings.top == 0 || settings.top > MAX_TOP {
            return Err(settings.point(
                Error::input(format!("`top` lists 1 to {MAX_TOP} results")),
                &[PathStep::Key("top")],
            ));
        }
        Ok(settings)
    }

    fn course_1_pitch(&self) -> Result<f64> {
        match PitchSpec::from_str(&self.course_1)? {
            PitchSpec::Note {
                note, offset_cents, ..
            } => Ok(note.hz(ISO_16_A4_HZ) * crate::tuning::pitch::ratio_from_cents(offset_cents)),
            PitchSpec::Hz { hz } => Ok(hz),
            _ => Err(
                Error::input(format!("`{}` is not an absolute pitch", self.course_1)).help(
                    "write a note such as `E2` (A4 = 440 Hz) or a frequency such as `82.41hz`",
                ),
            ),
        }
    }

    /// Attaches this file's name and the line of `path` to an error.
    pub fn point(&self, error: Error, path: &[PathStep<'_>]) -> Error {
        yaml::point(error, &self.text, &self.origin, path)
    }

    /// What reading tuning `index` costs and which other entries read the same: its key (the
    /// file's canonical path and any `@reference` for a file, the spec itself otherwise) and the
    /// bytes of file it reads (0 for a shipped name or an inline spec; the file's size for a
    /// regular file; the most a definition file may hold for standard input, a device or a
    /// pipe, whose size is not known before reading). Mirrors the order of
    /// [`crate::tuning::load`]: shipped names and inline specs come before files.
    pub fn tuning_source(&self, index: usize) -> (String, u64) {
        let spec = self.tuning_spec(index);
        let trimmed = spec.trim();
        let (body, reference) = match trimmed.rsplit_once('@') {
            Some((body, reference)) if !Path::new(trimmed).exists() => (body.trim(), reference),
            _ => (trimmed, ""),
        };
        let built_in = crate::tuning::library::names().any(|name| name.eq_ignore_ascii_case(body))
            || crate::tuning::inline::looks_inline(body)
            || (!Path::new(body).exists() && crate::tuning::inline::read_spelling(body).is_some());
        if built_in || body.is_empty() {
            return (spec, 0);
        }
        let most = yaml::MAX_INPUT_BYTES;
        if body == "-" {
            return ("-".to_string(), most);
        }
        let path = Path::new(body);
        let bytes = match std::fs::metadata(path) {
            Ok(meta) if meta.is_file() => meta.len().min(most + 1),
            Ok(_) => most,
            // Missing: loading it fails with its own message, having read nothing.
            Err(_) => 0,
        };
        let canonical = std::fs::canonicalize(path).unwrap_or_else(|_| path.to_path_buf());
        (format!("{}@{reference}", canonical.display()), bytes)
    }

    /// The spec of tuning `index` for [`crate::tuning::load`]: a relative file path is taken
    /// from the settings file's folder when the file is there.
    pub fn tuning_spec(&self, index: usize) -> String {
        let spec = self.tunings.spec(index);
        match &self.folder {
            Some(folder) if !Path::new(&spec).exists() && folder.join(&spec).exists() => {
                folder.join(&spec).display().to_string()
            }
            _ => spec,
        }
    }
}
