//! What to play: a plan's strings and its tuning turned into [`Note`]s.
//!
//! Every note is played on a planned string: open, or stopped above its open pitch, keeping the
//! string's tension and taking the shorter length's inharmonicity B·(f/f_open)²
//! (REFERENCES §11.3).

use std::str::FromStr;

use crate::error::{Error, Result};
use crate::plan::Plan;
use crate::tuning::Tuning;

use super::render::MAX_NOTES;
use super::Note;

/// Time between the strings of one strum, in seconds.
pub const STRUM_GAP_S: f64 = 0.03;

/// Silence between the stiff rendering and the harmonic one of [`Partials::Both`], in seconds.
pub const COMPARE_GAP_S: f64 = 0.5;

/// What to play.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Play {
    /// Every open string, course by course, strummed into one chord.
    Strum,
    /// Every open string, one after another.
    Strings,
    /// The open strings of these courses (numbers as the plan counts them), strummed together.
    Courses(Vec<u32>),
    /// These degrees of the tuning, strummed together, each on the string that reaches it.
    Degrees(Vec<i64>),
    /// One period of the tuning upward from the lowest string, one degree after another.
    Scale,
}

/// How to write [`Play`], for help texts.
pub const PLAY_SYNTAX: &str =
    "`strum` (every open string), `strings` (one after another), `scale` (one period upward from \
     the lowest string), `courses:1,3,5` (a chord of courses) or `degrees:0,4,7` (a chord of \
     degrees)";

impl FromStr for Play {
    type Err = Error;

    fn from_str(text: &str) -> Result<Self> {
        let text = text.trim();
        let bad = |why: String| Error::input(why).help(format!("write {PLAY_SYNTAX}"));
        match text {
            "strum" => return Ok(Play::Strum),
            "strings" => return Ok(Play::Strings),
            "scale" => return Ok(Play::Scale),
            _ => {}
        }
        let (kind, list) = text
            .split_once(':')
            .ok_or_else(|| bad(format!("`{text}` is not something taut can play")))?;
        let items: Vec<&str> = list.split(',').map(str::trim).collect();
        if items.iter().any(|item| item.is_empty()) {
            return Err(bad(format!("`{text}` has an empty item in its list")));
        }
        if items.len() > MAX_NOTES {
            return Err(bad(format!(
                "`{kind}:` lists {} items; taut plays at most {MAX_NOTES} notes",
                items.len()
            )));
        }
        match kind.trim() {
            "courses" => items
                .iter()
                .map(|item| {
                    item.parse::<u32>()
                        .ok()
                        .filter(|&n| n > 0)
                        .ok_or_else(|| bad(format!("`{item}` is not a course number")))
                })
                .collect::<Result<Vec<_>>>()
                .map(Play::Courses),
            "degrees" => items
                .iter()
                .map(|item| {
                    let digits = item.strip_prefix("deg").unwrap_or(item);
                    digits
                        .parse::<i64>()
                        .map_err(|_| bad(format!("`{item}` is not a degree")))
                })
                .collect::<Result<Vec<_>>>()
                .map(Play::Degrees),
            other => Err(bad(format!("`{other}:` is not something taut can play"))),
        }
    }
}

/// Which partials the notes have.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Partials {
    /// The planned strings' own stiffness (Fletcher's B).
    #[default]
    Stiff,
    /// Ideal harmonic partials (B = 0).
    Harmonic,
    /// The stiff rendering, a short silence, then the same notes harmonic.
    Both,
}

/// How to play.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ScoreOptions {
    /// How long each note or chord rings, in seconds.
    pub seconds: f64,
    /// Pluck position as a fraction of the vibrating length.
    pub pluck: f64,
    /// Stiff, harmonic or both.
    pub partials: Partials,
}

/// One string as a sound source: its course, open pitch and stiffness. Plans, audits and
/// conversions each give theirs ([`sources_of_plan`], [`sources_of_audit`],
/// [`sources_of_conversion`]), so every report plays through the same [`score_sources`].
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Source {
    /// The course the string belongs to.
    pub course: u32,
    /// Its open pitch, Hz.
    pub hz: f64,
    /// Fletcher's inharmonicity coefficient B (0 where the kind gives no modulus).
    pub b: f64,
}

/// The strings of a plan as sound sources.
pub fn sources_of_plan(plan: &Plan) -> Vec<Source> {
    plan.courses
        .iter()
        .flat_map(|course| {
            course.strings.iter().map(|string| Source {
                course: course.course,
                hz: string.pitch_hz,
                b: string.choice.inharmonicity.unwrap_or(0.0),
            })
        })
        .collect()
}

/// The strings of an audited set, at the audited pitches, as sound sources.
pub fn sources_of_audit(audit: &crate::sets::audit::Audit) -> Vec<Source> {
    audit
        .courses
        .iter()
        .flat_map(|course| {
            course.strings.iter().map(|string| Source {
                course: course.course,
                hz: string.pitch_hz,
                b: string.feel.inharmonicity_b.unwrap_or(0.0),
            })
        })
        .collect()
}

/// The strings of a converted set (the new strings at the new pitches) as sound sources.
pub fn sources_of_conversion(conversion: &crate::sets::convert::Conversion) -> Vec<Source> {
    conversion
        .courses
        .iter()
        .flat_map(|course| {
            course.strings.iter().map(|string| Source {
                course: course.course,
                hz: string.after.pitch_hz,
                b: string.feel_after.inharmonicity_b.unwrap_or(0.0),
            })
        })
        .collect()
}

/// The notes that play `play` on `plan`'s strings. `tuning` (the plan's) is needed for
/// [`Play::Degrees`] and [`Play::Scale`].
pub fn score(
    plan: &Plan,
    tuning: Option<&Tuning>,
    play: &Play,
    options: &ScoreOptions,
) -> Result<Vec<Note>> {
    score_sources(&sources_of_plan(plan), tuning, play, options)
}

/// The notes that play `play` on the strings `sources` (in course order); `tuning` is needed
/// for [`Play::Degrees`] and [`Play::Scale`].
pub fn score_sources(
    sources: &[Source],
    tuning: Option<&Tuning>,
    play: &Play,
    options: &ScoreOptions,
) -> Result<Vec<Note>> {
    if !(options.seconds.is_finite() && options.seconds > 0.0) {
        return Err(Error::input(format!(
            "{} s is not a duration: a note must ring for more than 0 s",
            options.seconds
        )));
    }
    if !(options.pluck > 0.0 && options.pluck < 1.0) {
        return Err(Error::input(format!(
            "{} is not a pluck position: give a fraction of the length between 0 and 1",
            options.pluck
        )));
    }
    // (start, pitch, B) for each note.
    let mut events: Vec<(f64, f64, f64)> = Vec::new();
    let strum = |index: usize| index as f64 * STRUM_GAP_S;
    match play {
        Play::Strum => {
            for (i, s) in sources.iter().enumerate() {
                events.push((strum(i), s.hz, s.b));
            }
        }
        Play::Strings => {
            for (i, s) in sources.iter().enumerate() {
                events.push((i as f64 * options.seconds, s.hz, s.b));
            }
        }
        Play::Courses(courses) => {
            for &number in courses {
                let chosen: Vec<&Source> = sources.iter().filter(|s| s.course == number).collect();
                if chosen.is_empty() {
                    return Err(
                        Error::input(format!("the report has no course {number}")).help(format!(
                            "its courses are numbered 1 to {}",
                            sources.iter().map(|s| s.course).max().unwrap_or(0)
                        )),
                    );
                }
                for s in chosen {
                    events.push((strum(events.len()), s.hz, s.b));
                }
            }
        }
        Play::Degrees(degrees) => {
            let tuning = tuning.ok_or_else(|| Error::input("degrees need a tuning"))?;
            for &k in degrees {
                let hz = tuning.degree(k)?.hz;
                let b = stopped(sources, hz, &format!("degree {k}"))?;
                events.push((strum(events.len()), hz, b));
            }
        }
        Play::Scale => {
            let tuning = tuning.ok_or_else(|| Error::input("a scale needs a tuning"))?;
            for (i, (k, hz)) in scale(tuning, sources)?.into_iter().enumerate() {
                let b = stopped(sources, hz, &format!("degree {k}"))?;
                events.push((i as f64 * options.seconds, hz, b));
            }
        }
    }
    if events.len() > MAX_NOTES / 2 && options.partials == Partials::Both
        || events.len() > MAX_NOTES
    {
        return Err(Error::input(format!(
            "{} notes are too many: taut plays at most {MAX_NOTES} in one file (half of that \
             with the harmonic comparison)",
            events.len()
        ))
        .help("play fewer strings, degrees or courses"));
    }
    let note = |(start, hz, b): (f64, f64, f64), offset: f64, harmonic: bool| Note {
        start_s: start + offset,
        duration_s: options.seconds,
        pitch_hz: hz,
        inharmonicity: if harmonic { 0.0 } else { b },
        pluck: options.pluck,
        gain: 1.0,
    };
    let end = events
        .iter()
        .map(|e| e.0 + options.seconds)
        .fold(0.0, f64::max);
    let notes = match options.partials {
        Partials::Stiff => events.iter().map(|&e| note(e, 0.0, false)).collect(),
        Partials::Harmonic => events.iter().map(|&e| note(e, 0.0, true)).collect(),
        Partials::Both => events
            .iter()
            .map(|&e| note(e, 0.0, false))
            .chain(events.iter().map(|&e| note(e, end + COMPARE_GAP_S, true)))
            .collect(),
    };
    Ok(notes)
}

/// The B of a note at `hz` stopped on the string with the highest open pitch at or below it
/// (REFERENCES §11.3); an error names `what` when every open string is higher.
fn stopped(sources: &[Source], hz: f64, what: &str) -> Result<f64> {
    let tolerance = 1.0 + 1e-9;
    sources
        .iter()
        .filter(|s| s.hz <= hz * tolerance)
        .max_by(|a, b| a.hz.total_cmp(&b.hz))
        .map(|s| s.b * (hz / s.hz).powi(2))
        .ok_or_else(|| {
            let lowest = sources.iter().map(|s| s.hz).fold(f64::INFINITY, f64::min);
            Error::input(format!(
                "{what} ({hz:.2} Hz) lies below every open string (the lowest is {lowest:.2} Hz)"
            ))
            .help("choose degrees at or above the lowest string's pitch")
        })
}

/// One period of `tuning` upward from the degree nearest the lowest string (the next one up
/// when that degree lies below it): the degrees and their frequencies. A frequency list plays
/// up to twelve degrees.
fn scale(tuning: &Tuning, sources: &[Source]) -> Result<Vec<(i64, f64)>> {
    let lowest = sources.iter().map(|s| s.hz).fold(f64::INFINITY, f64::min);
    let start = tuning
        .nearest_degree(lowest)
        .ok_or_else(|| Error::input("no degree of the tuning lies near the lowest string"))?;
    let mut first = start.degree;
    if start.hz < lowest * (1.0 - 1e-9) {
        first += 1;
    }
    let count = match tuning.degrees_per_period() {
        Some(n) => n + 1,
        None => 12,
    };
    if count > MAX_NOTES {
        return Err(Error::input(format!(
            "one period of `{}` has {} degrees; taut plays at most {MAX_NOTES} notes",
            tuning.name(),
            count - 1
        ))
        .help("play a chord of chosen degrees instead (`degrees:0,4,7`)"));
    }
    let mut out = Vec::with_capacity(count);
    for k in first..first + count as i64 {
        match tuning.degree(k) {
            Ok(degree) => out.push((k, degree.hz)),
            Err(_) if !out.is_empty() => break,
            Err(err) => return Err(err),
        }
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn play_forms_parse() {
        assert_eq!("strum".parse::<Play>().unwrap(), Play::Strum);
        assert_eq!(
            "courses:1, 3".parse::<Play>().unwrap(),
            Play::Courses(vec![1, 3])
        );
        assert_eq!(
            "degrees:0,deg4,-5".parse::<Play>().unwrap(),
            Play::Degrees(vec![0, 4, -5])
        );
        for bad in [
            "",
            "chord",
            "courses:",
            "courses:0",
            "courses:1,,2",
            "degrees:x",
            "nope:1",
        ] {
            assert!(bad.parse::<Play>().is_err(), "{bad}");
        }
    }
}
