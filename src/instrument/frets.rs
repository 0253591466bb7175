//! The optional `frets:` block of an instrument file: which degrees get a fret, how far the
//! frets go, and the board they sit on. Every field is optional; [`crate::frets`] fills in the
//! defaults and lays the frets out. The same settings come from the command line, where each
//! value is parsed by the same `FromStr` as in the file.
//!
//! ```yaml
//! frets:
//!   count: 24                  # at most this many frets per course
//!   up_to: 480mm               # or: no fret further than this from the nut
//!   degrees: [0, 4, 9, 13, 18] # steps of each period that get a fret (default: all)
//!   degrees_from: open         # count those steps from each open string, or `tuning`
//!   min_spacing: 5mm           # warn when two frets are closer
//!   merge_within: 5c           # report neighbouring courses' frets this close in pitch
//!   body_joint: 330mm          # frets past this distance from the nut sit over the body
//!   board_end: 470mm           # frets past this distance from the nut do not fit
//!   board_width: {nut: 43mm, last_fret: 56mm}
//!   edge_margin: 3.5mm         # from the board edge to the outer course
//!   square_at: 0.5             # fanned boards: fraction of each length where frets are square
//! ```

use std::fmt;
use std::str::FromStr;

use serde::de::{self, Visitor};
use serde::{Deserialize, Deserializer};

use super::scalar_or_map::{self, Expecting};
use crate::error::{Error, Result};
use crate::input::units::Length;
use crate::tuning::interval::Count;
use crate::tuning::pitch::parse_finite;

/// The most frets one course may have; more is a typo or a tuning with thousands of degrees.
pub const MAX_FRETS: u32 = 1000;

/// How many frets a course gets, from 1 to [`MAX_FRETS`].
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct FretCount(pub u32);

impl FromStr for FretCount {
    type Err = Error;

    fn from_str(text: &str) -> Result<Self> {
        let number: f64 = parse_finite(text, "a fret count")?;
        FretCount::checked(number)
    }
}

impl FretCount {
    fn checked(number: f64) -> Result<Self> {
        if number.fract() != 0.0 || !(1.0..=f64::from(MAX_FRETS)).contains(&number) {
            return Err(Error::input(format!(
                "`{number}` frets: give a whole number from 1 to {MAX_FRETS}"
            )));
        }
        Ok(FretCount(number as u32))
    }
}

/// A fraction of each course's length from the nut, from 0 (the nut) to 1 (the saddle).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Fraction(pub f64);

impl FromStr for Fraction {
    type Err = Error;

    fn from_str(text: &str) -> Result<Self> {
        let number: f64 = parse_finite(text, "a fraction")?;
        Fraction::checked(number)
    }
}

impl Fraction {
    fn checked(number: f64) -> Result<Self> {
        if !(0.0..=1.0).contains(&number) {
            return Err(Error::input(format!(
                "`{number}` is not a fraction of the scale length: give a number from 0 (the nut) to 1 (the saddle)"
            )));
        }
        Ok(Fraction(number))
    }
}

/// Reads a plain YAML number (or numeric text) through `FromStr`-like checks, keeping the line.
struct NumberVisitor<T>(fn(f64) -> Result<T>, &'static str);

impl<T> Visitor<'_> for NumberVisitor<T> {
    type Value = T;

    fn expecting(&self, formatter: &mut fmt::Formatter) -> fmt::Result {
        formatter.write_str(self.1)
    }

    fn visit_i64<E: de::Error>(self, value: i64) -> std::result::Result<T, E> {
        (self.0)(value as f64).map_err(|err| E::custom(err.plain_message()))
    }

    fn visit_u64<E: de::Error>(self, value: u64) -> std::result::Result<T, E> {
        (self.0)(value as f64).map_err(|err| E::custom(err.plain_message()))
    }

    fn visit_f64<E: de::Error>(self, value: f64) -> std::result::Result<T, E> {
        (self.0)(value).map_err(|err| E::custom(err.plain_message()))
    }

    fn visit_str<E: de::Error>(self, text: &str) -> std::result::Result<T, E> {
        parse_finite(text, self.1)
            .and_then(self.0)
            .map_err(|err| E::custom(err.plain_message()))
    }
}

impl<'de> Deserialize<'de> for FretCount {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> std::result::Result<Self, D::Error> {
        deserializer.deserialize_any(NumberVisitor(FretCount::checked, "a whole number of frets"))
    }
}

impl<'de> Deserialize<'de> for Fraction {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> std::result::Result<Self, D::Error> {
        deserializer.deserialize_any(NumberVisitor(Fraction::checked, "a number from 0 to 1"))
    }
}

/// A pitch distance in cents, from 0 to 1200, written `5c`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Cents(pub f64);

impl FromStr for Cents {
    type Err = Error;

    fn from_str(text: &str) -> Result<Self> {
        let trimmed = text.trim();
        let number = trimmed
            .strip_suffix("cents")
            .or_else(|| trimmed.strip_suffix('c'))
            .ok_or_else(|| {
                Error::input(format!("`{trimmed}` is not a number of cents"))
                    .help("write it with a `c`, e.g. `5c`")
            })?;
        let value = parse_finite(number, "cents")?;
        if !(0.0..=1200.0).contains(&value) {
            return Err(Error::input(format!(
                "`{trimmed}` must be from 0c to 1200c"
            )));
        }
        Ok(Cents(value))
    }
}

impl Expecting for Cents {
    const EXPECTING: &'static str = "cents such as `5c`";
}

/// Where the steps listed in `degrees` are counted from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum DegreesFrom {
    /// From each course's open pitch: the same intervals on every course (a mode of the open
    /// string).
    #[default]
    Open,
    /// From the tuning's own degree 0: the same pitches on every course (a scale).
    Tuning,
}

impl FromStr for DegreesFrom {
    type Err = Error;

    fn from_str(text: &str) -> Result<Self> {
        match text.trim() {
            "open" => Ok(DegreesFrom::Open),
            "tuning" => Ok(DegreesFrom::Tuning),
            other => Err(Error::input(format!(
                "`{other}` is neither `open` nor `tuning`"
            ))),
        }
    }
}

/// The board's width across, at the nut and at the last fret.
#[derive(Debug, Clone, Copy, PartialEq, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct BoardWidth {
    /// Width at the nut.
    #[serde(deserialize_with = "scalar_or_map::scalar")]
    pub nut: Length,
    /// Width at the last fret.
    #[serde(deserialize_with = "scalar_or_map::scalar")]
    pub last_fret: Length,
}

/// The `frets:` block as written; every field is optional.
#[derive(Debug, Clone, Default, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct FretSettings {
    /// At most this many frets per course.
    pub count: Option<FretCount>,
    /// No fret further than this from the nut.
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub up_to: Option<Length>,
    /// Steps of each period that get a fret (default: every step).
    pub degrees: Option<Vec<Count>>,
    /// Where the steps in `degrees` are counted from.
    pub degrees_from: Option<DegreesFrom>,
    /// Frets closer than this to the previous one are reported.
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub min_spacing: Option<Length>,
    /// Frets of neighbouring courses this close in pitch are reported as mergeable.
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub merge_within: Option<Cents>,
    /// Distance from the nut to the body joint, along each course.
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub body_joint: Option<Length>,
    /// Distance from the nut to the end of the board, along each course.
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub board_end: Option<Length>,
    /// The board's width at the nut and at the last fret.
    pub board_width: Option<BoardWidth>,
    /// From the board's edge to the outer course's string.
    #[serde(default, deserialize_with = "scalar_or_map::optional_scalar")]
    pub edge_margin: Option<Length>,
    /// Where frets are square to the board on a fanned board, as a fraction of each length.
    pub square_at: Option<Fraction>,
}

impl FretSettings {
    /// These settings with every field `over` gives replacing this one's.
    pub fn overridden_by(&self, over: &FretSettings) -> FretSettings {
        FretSettings {
            count: over.count.or(self.count),
            up_to: over.up_to.or(self.up_to),
            degrees: over.degrees.clone().or_else(|| self.degrees.clone()),
            degrees_from: over.degrees_from.or(self.degrees_from),
            min_spacing: over.min_spacing.or(self.min_spacing),
            merge_within: over.merge_within.or(self.merge_within),
            body_joint: over.body_joint.or(self.body_joint),
            board_end: over.board_end.or(self.board_end),
            board_width: over.board_width.or(self.board_width),
            edge_margin: over.edge_margin.or(self.edge_margin),
            square_at: over.square_at.or(self.square_at),
        }
    }
}

/// Parses a comma-separated list of steps, e.g. `0,4,9,13,18` (for the command line).
pub fn parse_degree_list(text: &str) -> Result<Vec<Count>> {
    text.split(',')
        .map(|item| {
            let item = item.trim();
            item.parse::<u64>()
                .ok()
                .filter(|&n| n <= crate::tuning::MAX_DEGREES_PER_PERIOD as u64)
                .map(Count)
                .ok_or_else(|| {
                    Error::input(format!("`{item}` is not a step number"))
                        .help("list whole numbers from 0, separated by commas, e.g. `0,4,9,13,18`")
                })
        })
        .collect()
}
