//! Levers and pedals: the positions a course can be set to, each a raise from the open string.
//!
//! ```yaml
//! raises: {lever: 1 step}                               # open, and raised one step
//! raises: {lever: 16/15}                                # any interval (ratio or cents)
//! raises: {pedal: {natural: 1 step, sharp: 2 steps}}    # flat (open), natural, sharp
//! raises: {lever: 2 steps, action: pull}                # a changer that pulls the string
//! ```
//!
//! A raise is written in steps of the tuning (`1 step`, `2 steps`: degrees above the course's
//! nearest degree) or as an interval (`16/15`, `+100c`, as a course's `strings:` write them).
//! The course's `pitch` is always the open string. How the raise works is its `action`:
//! `stop` (the default: a lever or pedal disc grips the string and shortens it, as a fret does;
//! the tension stays that of the open string) or `pull` (a changer pulls the string tighter on
//! the same length, so the tension grows with the square of the pitch). REFERENCES §8.3.

use std::fmt;
use std::str::FromStr;

use serde::{Deserialize, Deserializer};

use super::{Expecting, Interval, NoDetail, ScalarOrMap};
use crate::error::{Error, Result};

/// The most steps one raise may move (either way): two octaves of 12-EDO. More is a typing
/// mistake for any lever or pedal.
pub const MAX_RAISE_STEPS: i64 = 24;

/// How far a position sits from the open string.
#[derive(Debug, Clone, PartialEq)]
pub enum RaiseAmount {
    /// Degrees of the tuning above the course's nearest degree.
    Steps(i64),
    /// A fixed interval.
    Interval(Interval),
}

impl RaiseAmount {
    /// The amount as written back (`1 step`, `16/15`).
    pub fn written(&self) -> String {
        match self {
            RaiseAmount::Steps(1) | RaiseAmount::Steps(-1) => format!("{} step", self.steps_text()),
            RaiseAmount::Steps(_) => format!("{} steps", self.steps_text()),
            RaiseAmount::Interval(interval) => interval.written().to_string(),
        }
    }

    fn steps_text(&self) -> String {
        match self {
            RaiseAmount::Steps(n) => n.to_string(),
            RaiseAmount::Interval(_) => String::new(),
        }
    }
}

impl fmt::Display for RaiseAmount {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.written())
    }
}

impl FromStr for RaiseAmount {
    type Err = Error;

    fn from_str(text: &str) -> Result<Self> {
        let written = text.trim();
        let lower = written.to_ascii_lowercase();
        let number = lower
            .strip_suffix("steps")
            .or_else(|| lower.strip_suffix("step"))
            .map(str::trim);
        if let Some(number) = number {
            let steps: i64 = number.trim_start_matches('+').parse().map_err(|_| {
                Error::input(format!("`{written}` is not a whole number of steps"))
                    .help("write e.g. `1 step` or `2 steps`")
            })?;
            if steps.abs() > MAX_RAISE_STEPS {
                return Err(Error::input(format!(
                    "`{written}` moves the string more than {MAX_RAISE_STEPS} steps"
                )));
            }
            return Ok(RaiseAmount::Steps(steps));
        }
        Ok(RaiseAmount::Interval(written.parse()?))
    }
}

impl Expecting for RaiseAmount {
    const EXPECTING: &'static str =
        "a raise such as `1 step`, `2 steps`, a ratio such as `16/15` or cents such as `+100c`";
}

impl<'de> Deserialize<'de> for RaiseAmount {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> std::result::Result<Self, D::Error> {
        match ScalarOrMap::<RaiseAmount, NoDetail>::deserialize(deserializer)? {
            ScalarOrMap::Scalar(amount) => Ok(amount),
            ScalarOrMap::Map(never) => match never {},
        }
    }
}

/// How a raise changes the pitch.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Deserialize)]
#[serde(rename_all = "lowercase", deny_unknown_fields)]
pub enum Action {
    /// The string is gripped and shortened; its tension stays (harp levers, pedal discs).
    #[default]
    Stop,
    /// The string is pulled tighter on the same length (changers).
    Pull,
}

impl Action {
    /// The action's name as written.
    pub fn name(self) -> &'static str {
        match self {
            Action::Stop => "stop",
            Action::Pull => "pull",
        }
    }
}

/// A pedal's three positions, each from the open string.
#[derive(Debug, Clone, PartialEq, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Pedal {
    /// The flat position (default: the open string, `0 steps`).
    pub flat: Option<RaiseAmount>,
    /// The natural position (default `1 step`).
    pub natural: Option<RaiseAmount>,
    /// The sharp position (default `2 steps`).
    pub sharp: Option<RaiseAmount>,
}

/// A course's lever or pedal, as written.
#[derive(Debug, Clone, PartialEq, Deserialize)]
#[serde(try_from = "RaisesFile")]
pub struct Raises {
    /// The positions in order, lowest written first: name and amount from the open string.
    pub positions: Vec<(&'static str, RaiseAmount)>,
    /// How the raises work.
    pub action: Action,
    /// Whether this is a pedal (else a lever).
    pub pedal: bool,
}

#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
struct RaisesFile {
    lever: Option<RaiseAmount>,
    pedal: Option<Pedal>,
    action: Option<Action>,
}

impl TryFrom<RaisesFile> for Raises {
    type Error = Error;

    fn try_from(file: RaisesFile) -> Result<Self> {
        let action = file.action.unwrap_or_default();
        let (positions, pedal) = match (file.lever, file.pedal) {
            (Some(lever), None) => (
                vec![("open", RaiseAmount::Steps(0)), ("lever", lever)],
                false,
            ),
            (None, Some(pedal)) => (
                vec![
                    ("flat", pedal.flat.unwrap_or(RaiseAmount::Steps(0))),
                    ("natural", pedal.natural.unwrap_or(RaiseAmount::Steps(1))),
                    ("sharp", pedal.sharp.unwrap_or(RaiseAmount::Steps(2))),
                ],
                true,
            ),
            _ => {
                return Err(Error::input("give a course either a `lever` or a `pedal`")
                    .help("e.g. `raises: {lever: 1 step}` or `raises: {pedal: {natural: 1 step, sharp: 2 steps}}`"))
            }
        };
        Ok(Raises {
            positions,
            action,
            pedal,
        })
    }
}

impl Raises {
    /// The raises as one YAML flow mapping, as an instrument file writes them.
    pub fn to_yaml_flow(&self) -> String {
        let quoted = crate::input::yaml::quoted;
        let mut text = if self.pedal {
            let amount = |name: &str| {
                self.positions
                    .iter()
                    .find(|(n, _)| *n == name)
                    .map_or_else(String::new, |(_, a)| quoted(&a.written()))
            };
            format!(
                "{{pedal: {{flat: {}, natural: {}, sharp: {}}}",
                amount("flat"),
                amount("natural"),
                amount("sharp")
            )
        } else {
            let lever = self
                .positions
                .get(1)
                .map_or_else(String::new, |(_, a)| quoted(&a.written()));
            format!("{{lever: {lever}")
        };
        if self.action == Action::Pull {
            text.push_str(", action: pull");
        }
        text.push('}');
        text
    }
}
