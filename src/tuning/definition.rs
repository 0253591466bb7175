//! Tuning definition files (YAML).
//!
//! ```yaml
//! name: 19edo                      # required
//! description: 19 equal divisions of the octave   # required
//! source: "where the system is published"          # optional for your own files
//! # exactly one of the five layouts:
//! divisions: 19                    # equal steps of `period`
//! ratios: [1/1, 9/8, 5/4]          # exact ratios of one period, from 1/1
//! cents: [0, 203.9, 386.3]         # cents of one period, from 0
//! hertz: [98, 110, 123.5]          # a fixed list of frequencies (no period, no reference)
//! chain: {generator: 3/2, up: 6, down: 5}   # a stacked generator reduced into the period
//! period: 2/1                      # the repeating interval (default 2/1): `3/1`, `1200c`
//! reference: {degree: 0, note: A4, hz: 440}  # default: degree 0 = A4 = 440 Hz
//! ```
//!
//! Intervals are written `3/2` (ratio), `701.955c` (cents) or `5^(1/4)` (power of a ratio).
//! Checks that concern one value run while the YAML is read, so errors carry its line; checks
//! across values (ascending order, the period) run afterwards and are pointed back at their line
//! with [`crate::input::yaml::locate`].

use std::path::Path;

use serde::Deserialize;

use super::interval::{Count, Divisions, FiniteNumber, Interval, IntervalText, RatioText};
use super::reference::{Reference, ReferenceSpec};
use super::shape::Shape;
use super::Tuning;
use crate::error::{Error, Result};
use crate::input::yaml::{self, PathStep};

/// The keys that choose a layout; a definition has exactly one.
pub const LAYOUT_KEYS: [&str; 5] = ["divisions", "ratios", "cents", "hertz", "chain"];

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct RawDefinition {
    name: String,
    // `about` is what instrument files used to call it; both are read.
    #[serde(alias = "about")]
    description: String,
    #[serde(default)]
    source: Option<String>,
    #[serde(default)]
    divisions: Option<Divisions>,
    #[serde(default)]
    ratios: Option<Vec<RatioText>>,
    #[serde(default)]
    cents: Option<Vec<FiniteNumber>>,
    #[serde(default)]
    hertz: Option<Vec<FiniteNumber>>,
    #[serde(default)]
    chain: Option<RawChain>,
    #[serde(default)]
    period: Option<IntervalText>,
    #[serde(default)]
    reference: Option<ReferenceSpec>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct RawChain {
    generator: IntervalText,
    #[serde(default = "zero_count")]
    up: Count,
    #[serde(default = "zero_count")]
    down: Count,
}

fn zero_count() -> Count {
    Count(0)
}

/// Reads and checks a tuning definition file.
pub fn load_file(path: &Path) -> Result<Tuning> {
    let text = yaml::read_text(path)?;
    parse(&text, &yaml::origin_of(path))
}

/// Parses and checks a tuning definition; `origin` names the file in errors.
pub fn parse(text: &str, origin: &str) -> Result<Tuning> {
    let raw: RawDefinition = yaml::parse(text, origin)?;
    build(raw).map_err(|error| point_at_line(error, text).in_origin(origin))
}

fn build(raw: RawDefinition) -> Result<Tuning> {
    let present: Vec<&str> = [
        raw.divisions.is_some(),
        raw.ratios.is_some(),
        raw.cents.is_some(),
        raw.hertz.is_some(),
        raw.chain.is_some(),
    ]
    .iter()
    .zip(LAYOUT_KEYS)
    .filter_map(|(here, key)| here.then_some(key))
    .collect();
    match present.as_slice() {
        [] => {
            return Err(Error::input(format!(
                "the definition has no layout: give one of {}",
                LAYOUT_KEYS.join(", ")
            ))
            .help("e.g. `divisions: 19` for 19 equal divisions of the octave"))
        }
        [_] => {}
        [_, second, ..] => {
            return Err(Error::input(format!(
                "the definition gives more than one layout ({}); keep one",
                present.join(", ")
            ))
            .field(*second))
        }
    }
    let period_given = raw.period.is_some();
    let period = raw
        .period
        .map(|IntervalText(interval)| interval)
        .unwrap_or_else(Interval::octave);
    let shape = if let Some(Divisions(divisions)) = raw.divisions {
        Shape::Equal { divisions, period }
    } else if let Some(ratios) = raw.ratios {
        Shape::Ratios {
            ratios: ratios.into_iter().map(|RatioText(r)| r).collect(),
            period,
        }
    } else if let Some(cents) = raw.cents {
        Shape::Cents {
            cents: cents.into_iter().map(|FiniteNumber(c)| c).collect(),
            period,
        }
    } else if let Some(hertz) = raw.hertz {
        if period_given {
            return Err(Error::input(
                "a list of frequencies does not repeat, so it takes no period",
            )
            .field("period"));
        }
        Shape::Hertz {
            hz: hertz.into_iter().map(|FiniteNumber(f)| f).collect(),
        }
    } else if let Some(chain) = raw.chain {
        Shape::Chain {
            generator: chain.generator.0,
            up: chain.up.0,
            down: chain.down.0,
            period,
        }
    } else {
        return Err(Error::input("the definition has no layout"));
    };
    let is_list_of_frequencies = matches!(shape, Shape::Hertz { .. });
    let layout = shape.into_layout()?;
    let reference = match raw.reference {
        Some(_) if is_list_of_frequencies => {
            return Err(Error::input(
                "a list of frequencies fixes its own pitch, so it takes no reference",
            )
            .field("reference"))
        }
        Some(spec) => spec.resolve()?,
        None if is_list_of_frequencies => Reference {
            degree: 0,
            hz: match &layout {
                super::Layout::Absolute { hz } => hz.first().copied().unwrap_or(1.0),
                super::Layout::Periodic { .. } => 1.0,
            },
            concert_a4_hz: crate::tuning::pitch::ISO_16_A4_HZ,
        },
        None => Reference::default(),
    };
    Tuning::new(raw.name, raw.description, raw.source, layout, reference)
}

/// Gives a semantic error the line of the field it names (or of the nearest enclosing field).
pub(crate) fn point_at_line(error: Error, text: &str) -> Error {
    let Some(field) = error.location().and_then(|l| l.field.clone()) else {
        return error;
    };
    if error.location().and_then(|l| l.line).is_some() {
        return error;
    }
    let mut steps = Vec::new();
    for part in field.split('.') {
        let (key, indices) = part.split_once('[').unwrap_or((part, ""));
        steps.push(PathStep::Key(key));
        for index in indices.split('[') {
            if let Ok(i) = index.trim_end_matches(']').parse::<usize>() {
                steps.push(PathStep::Index(i));
            }
        }
    }
    let found = (1..=steps.len())
        .rev()
        .find_map(|n| yaml::locate(text, &steps[..n]));
    match found {
        Some((line, column)) => error.at(line, column),
        None => error,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn cross_value_errors_point_at_their_line() {
        let text = "name: x\ndescription: y\nratios:\n  - 1/1\n  - 5/4\n  - 9/8\n";
        let err = parse(text, "x.yaml").unwrap_err().to_string();
        assert!(err.starts_with("x.yaml:6:"), "{err}");
        assert!(err.contains("ratios[2]"), "{err}");
        assert!(err.contains("ascending"), "{err}");
    }

    #[test]
    fn value_errors_keep_their_line() {
        let text = "name: x\ndescription: y\ndivisions: 0\n";
        let err = parse(text, "x.yaml").unwrap_err().to_string();
        assert!(err.starts_with("x.yaml:3:"), "{err}");
        assert!(err.contains("divisions"), "{err}");
        let text = "name: x\ndescription: y\nratios: [1/1, 3/0]\n";
        let err = parse(text, "x.yaml").unwrap_err().to_string();
        assert!(err.starts_with("x.yaml:3:"), "{err}");
        assert!(err.contains("zero denominator"), "{err}");
    }

    #[test]
    fn layouts_must_be_exactly_one() {
        let text = "name: x\ndescription: y\n";
        assert!(parse(text, "x.yaml")
            .unwrap_err()
            .to_string()
            .contains("no layout"));
        let text = "name: x\ndescription: y\ndivisions: 12\ncents: [0]\n";
        let err = parse(text, "x.yaml").unwrap_err().to_string();
        assert!(err.starts_with("x.yaml:4:"), "{err}");
    }
}
