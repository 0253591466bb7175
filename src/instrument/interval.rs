//! The interval of one string of a course from the course's pitch: `unison`, `octave`,
//! `octave below`, an exact ratio such as `3/2`, or cents such as `+702c`.
//!
//! Cents follow Ellis' definition, c = 1200·log₂(r) (A. J. Ellis, appendix to Helmholtz,
//! *On the Sensations of Tone*, 1885), so a ratio is 2^(c/1200).

use std::fmt;
use std::str::FromStr;

use serde::{Deserialize, Deserializer, Serialize, Serializer};

use crate::error::{Error, Result};

/// The widest interval a string may sit from its course pitch, either way: three octaves. Wider
/// is almost certainly a typing mistake (e.g. `1200` meant as cents but read as a ratio).
pub const MAX_INTERVAL_RATIO: f64 = 8.0;

/// A string's interval from its course pitch, as a frequency ratio, with the words it was
/// written in.
#[derive(Debug, Clone, PartialEq)]
pub struct Interval {
    ratio: f64,
    written: String,
}

impl Interval {
    /// The same pitch as the course.
    pub fn unison() -> Self {
        Interval {
            ratio: 1.0,
            written: "unison".to_string(),
        }
    }

    /// The frequency ratio to the course pitch (2 for an octave above).
    pub fn ratio(&self) -> f64 {
        self.ratio
    }

    /// The interval as the user wrote it.
    pub fn written(&self) -> &str {
        &self.written
    }
}

impl FromStr for Interval {
    type Err = Error;

    fn from_str(text: &str) -> Result<Self> {
        let written = text.trim();
        let words: String = written
            .to_ascii_lowercase()
            .split(|c: char| c.is_whitespace() || c == '-' || c == '_')
            .filter(|w| !w.is_empty())
            .collect::<Vec<_>>()
            .join(" ");
        let ratio = match words.as_str() {
            "unison" => 1.0,
            "octave" | "octave above" | "octave up" => 2.0,
            "octave below" | "octave down" => 0.5,
            _ => parse_ratio_or_cents(written)?,
        };
        if !(ratio.is_finite() && ratio > 0.0) {
            return Err(Error::input(format!(
                "`{written}` is not an interval above zero"
            )));
        }
        if !(1.0 / MAX_INTERVAL_RATIO..=MAX_INTERVAL_RATIO).contains(&ratio) {
            return Err(Error::input(format!(
                "`{written}` puts the string more than three octaves from its course pitch"
            ))
            .help("write cents with a `c` (e.g. `+1200c`) and ratios as `p/q` (e.g. `2/1`)"));
        }
        Ok(Interval {
            ratio,
            written: written.to_string(),
        })
    }
}

fn parse_ratio_or_cents(written: &str) -> Result<f64> {
    let help =
        "write `unison`, `octave`, `octave below`, a ratio such as `3/2`, or cents such as `+702c`";
    if let Some((numerator, denominator)) = written.split_once('/') {
        let numerator: u64 = numerator.trim().parse().map_err(|_| {
            Error::input(format!("`{written}` is not a ratio of whole numbers")).help(help)
        })?;
        let denominator: u64 = denominator.trim().parse().map_err(|_| {
            Error::input(format!("`{written}` is not a ratio of whole numbers")).help(help)
        })?;
        if numerator == 0 || denominator == 0 {
            return Err(Error::input(format!(
                "`{written}` has a zero in it; an interval's ratio needs two positive whole numbers"
            )));
        }
        // Exact for any ratio a person writes; u64 → f64 rounds only beyond 2^53.
        return Ok(numerator as f64 / denominator as f64);
    }
    let number = written
        .strip_suffix("cents")
        .or_else(|| written.strip_suffix("cent"))
        .or_else(|| written.strip_suffix('c'))
        .or_else(|| written.strip_suffix('¢'))
        .map(str::trim)
        .ok_or_else(|| Error::input(format!("`{written}` is not an interval")).help(help))?;
    let cents: f64 = number
        .parse()
        .map_err(|_| Error::input(format!("`{written}` is not a number of cents")).help(help))?;
    if !cents.is_finite() {
        return Err(Error::input(format!(
            "`{written}` is not a finite number of cents"
        )));
    }
    Ok((cents / 1200.0).exp2())
}

impl<'de> Deserialize<'de> for Interval {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> std::result::Result<Self, D::Error> {
        let text = String::deserialize(deserializer)?;
        text.parse()
            .map_err(|err: Error| serde::de::Error::custom(err.plain_message()))
    }
}

impl Serialize for Interval {
    fn serialize<S: Serializer>(&self, serializer: S) -> std::result::Result<S::Ok, S::Error> {
        serializer.serialize_str(&self.written)
    }
}

impl fmt::Display for Interval {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.written)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn words_ratios_and_cents() {
        assert_eq!("unison".parse::<Interval>().unwrap().ratio(), 1.0);
        assert_eq!("Octave".parse::<Interval>().unwrap().ratio(), 2.0);
        assert_eq!("octave-below".parse::<Interval>().unwrap().ratio(), 0.5);
        assert_eq!("3/2".parse::<Interval>().unwrap().ratio(), 1.5);
        // Ellis' cents: 1200 c is exactly 2/1, -1200 c exactly 1/2.
        assert_relative_eq!("+1200c".parse::<Interval>().unwrap().ratio(), 2.0);
        assert_relative_eq!("-1200 cents".parse::<Interval>().unwrap().ratio(), 0.5);
        // 701.955 c is the just fifth 3/2 to 1e-6 (1200·log2(1.5) = 701.955000865...).
        assert_relative_eq!(
            "701.955000865c".parse::<Interval>().unwrap().ratio(),
            1.5,
            max_relative = 1e-12
        );
    }

    #[test]
    fn refuses_nonsense() {
        for bad in [
            "", "fifth", "0/1", "3/0", "-3/2", "1200", "nan c", "20/1", "x c",
        ] {
            assert!(bad.parse::<Interval>().is_err(), "{bad} was accepted");
        }
    }
}
