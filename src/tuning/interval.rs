//! Intervals as written in tuning definitions: an exact ratio (`3/2`), cents (`701.955c`) or a
//! rational power of a ratio (`5^(1/4)`, the quarter-comma meantone fifth).

use std::fmt;

use num_rational::Ratio;
use serde::{Deserialize, Serialize};

use crate::error::{Error, Result};
use crate::tuning::pitch::{
    cents_of_ratio, format_ratio, parse_finite, parse_ratio, serialize_optional_ratio, ExactRatio,
};

/// An interval: its size in cents, and its exact ratio when it has one.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Interval {
    /// Size in cents.
    pub cents: f64,
    /// Exact frequency ratio, when the interval is rational.
    #[serde(serialize_with = "serialize_optional_ratio")]
    pub ratio: Option<ExactRatio>,
}

/// How to write an interval, for error help.
pub const INTERVAL_SYNTAX_HELP: &str =
    "write an interval as a ratio `3/2`, as cents `701.955c`, or as a power of a ratio `5^(1/4)`";

impl Interval {
    /// The unison, 1/1.
    pub fn unison() -> Self {
        Interval::from_ratio(Ratio::from_integer(1))
    }

    /// The octave, 2/1.
    pub fn octave() -> Self {
        Interval::from_ratio(Ratio::from_integer(2))
    }

    /// An exact interval.
    pub fn from_ratio(ratio: ExactRatio) -> Self {
        Interval {
            cents: cents_of_ratio(&ratio),
            ratio: Some(ratio),
        }
    }

    /// An interval known only in cents.
    pub fn from_cents(cents: f64) -> Self {
        Interval { cents, ratio: None }
    }

    /// Parses `3/2`, `701.955c` or `5^(1/4)`. A bare number is refused, since it could mean a
    /// ratio or cents.
    pub fn parse(text: &str) -> Result<Self> {
        let trimmed = text.trim();
        let lower = trimmed.to_ascii_lowercase();
        if trimmed.is_empty() {
            return Err(Error::input("the interval is empty").help(INTERVAL_SYNTAX_HELP));
        }
        if let Some(number) = lower.strip_suffix('c') {
            let cents = parse_finite(number, "cents").map_err(|e| e.help(INTERVAL_SYNTAX_HELP))?;
            return Ok(Interval::from_cents(cents));
        }
        if let Some((base, power)) = trimmed.split_once('^') {
            let base = parse_ratio(base).map_err(|e| e.help(INTERVAL_SYNTAX_HELP))?;
            let power = power.trim();
            let inner = power
                .strip_prefix('(')
                .and_then(|p| p.strip_suffix(')'))
                .unwrap_or(power);
            let exponent = parse_ratio(inner).map_err(|_| {
                Error::input(format!(
                    "`{trimmed}`: the power must be a positive fraction in brackets, e.g. `5^(1/4)`"
                ))
            })?;
            let cents =
                cents_of_ratio(&base) * (*exponent.numer() as f64 / *exponent.denom() as f64);
            if !cents.is_finite() {
                return Err(Error::input(format!("`{trimmed}` is too large")));
            }
            // A whole power of an exact ratio stays exact when it fits.
            let ratio = if exponent.is_integer() {
                i64::try_from(*exponent.numer())
                    .ok()
                    .and_then(|e| crate::tuning::pitch::checked_ratio_pow(&base, e))
            } else {
                None
            };
            return Ok(Interval { cents, ratio });
        }
        if trimmed.contains('/') {
            return Ok(Interval::from_ratio(parse_ratio(trimmed)?));
        }
        if trimmed.parse::<f64>().is_ok() {
            return Err(
                Error::input(format!("`{trimmed}` could be a ratio or cents")).help(format!(
                    "write `{trimmed}/1` for a ratio or `{trimmed}c` for cents"
                )),
            );
        }
        Err(Error::input(format!("`{trimmed}` is not an interval")).help(INTERVAL_SYNTAX_HELP))
    }

    /// Whether this interval is wider than a unison (exactly, when both are exact).
    pub fn is_ascending(&self) -> bool {
        match &self.ratio {
            Some(ratio) => *ratio > Ratio::from_integer(1),
            None => self.cents > 0.0,
        }
    }
}

impl fmt::Display for Interval {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match &self.ratio {
            Some(ratio) => write!(f, "{}", format_ratio(ratio)),
            None => write!(f, "{}c", self.cents),
        }
    }
}

/// An interval read from YAML: a string (`3/2`, `701.955c`, `5^(1/4)`), checked where it stands
/// so that errors keep their line.
#[derive(Debug, Clone, PartialEq)]
pub struct IntervalText(pub Interval);

impl<'de> Deserialize<'de> for IntervalText {
    fn deserialize<D: serde::Deserializer<'de>>(
        deserializer: D,
    ) -> std::result::Result<Self, D::Error> {
        deserializer.deserialize_any(IntervalVisitor)
    }
}

struct IntervalVisitor;

impl serde::de::Visitor<'_> for IntervalVisitor {
    type Value = IntervalText;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("an interval such as `3/2`, `701.955c` or `5^(1/4)`")
    }

    fn visit_str<E: serde::de::Error>(self, text: &str) -> std::result::Result<Self::Value, E> {
        Interval::parse(text).map(IntervalText).map_err(E::custom)
    }

    fn visit_i64<E: serde::de::Error>(self, value: i64) -> std::result::Result<Self::Value, E> {
        Interval::parse(&value.to_string())
            .map(IntervalText)
            .map_err(E::custom)
    }

    fn visit_u64<E: serde::de::Error>(self, value: u64) -> std::result::Result<Self::Value, E> {
        Interval::parse(&value.to_string())
            .map(IntervalText)
            .map_err(E::custom)
    }

    fn visit_f64<E: serde::de::Error>(self, value: f64) -> std::result::Result<Self::Value, E> {
        Interval::parse(&value.to_string())
            .map(IntervalText)
            .map_err(E::custom)
    }
}

/// An exact ratio read from YAML (`9/8`, or a whole number `3` for 3/1).
#[derive(Debug, Clone, PartialEq)]
pub struct RatioText(pub ExactRatio);

impl<'de> Deserialize<'de> for RatioText {
    fn deserialize<D: serde::Deserializer<'de>>(
        deserializer: D,
    ) -> std::result::Result<Self, D::Error> {
        deserializer.deserialize_any(RatioVisitor)
    }
}

struct RatioVisitor;

impl serde::de::Visitor<'_> for RatioVisitor {
    type Value = RatioText;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("an exact ratio such as `9/8`")
    }

    fn visit_str<E: serde::de::Error>(self, text: &str) -> std::result::Result<Self::Value, E> {
        parse_ratio(text).map(RatioText).map_err(E::custom)
    }

    fn visit_i64<E: serde::de::Error>(self, value: i64) -> std::result::Result<Self::Value, E> {
        parse_ratio(&value.to_string())
            .map(RatioText)
            .map_err(E::custom)
    }

    fn visit_u64<E: serde::de::Error>(self, value: u64) -> std::result::Result<Self::Value, E> {
        parse_ratio(&value.to_string())
            .map(RatioText)
            .map_err(E::custom)
    }

    fn visit_f64<E: serde::de::Error>(self, value: f64) -> std::result::Result<Self::Value, E> {
        Err(E::custom(format!(
            "`{value}` is not an exact ratio; write it as a fraction such as `9/8`"
        )))
    }
}

/// A finite number read from YAML, checked where it stands.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FiniteNumber(pub f64);

impl<'de> Deserialize<'de> for FiniteNumber {
    fn deserialize<D: serde::Deserializer<'de>>(
        deserializer: D,
    ) -> std::result::Result<Self, D::Error> {
        deserializer.deserialize_any(FiniteVisitor)
    }
}

struct FiniteVisitor;

impl serde::de::Visitor<'_> for FiniteVisitor {
    type Value = FiniteNumber;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a number")
    }

    fn visit_i64<E: serde::de::Error>(self, value: i64) -> std::result::Result<Self::Value, E> {
        Ok(FiniteNumber(value as f64))
    }

    fn visit_u64<E: serde::de::Error>(self, value: u64) -> std::result::Result<Self::Value, E> {
        Ok(FiniteNumber(value as f64))
    }

    fn visit_f64<E: serde::de::Error>(self, value: f64) -> std::result::Result<Self::Value, E> {
        if value.is_finite() {
            Ok(FiniteNumber(value))
        } else {
            Err(E::custom(format!("`{value}` is not a finite number")))
        }
    }

    fn visit_str<E: serde::de::Error>(self, text: &str) -> std::result::Result<Self::Value, E> {
        parse_finite(text, "a plain number is expected here")
            .map(FiniteNumber)
            .map_err(E::custom)
    }
}

/// A whole count read from YAML (divisions, generator steps), refused when negative or above
/// [`crate::tuning::MAX_DEGREES_PER_PERIOD`] before anything is allocated.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Count(pub u64);

impl<'de> Deserialize<'de> for Count {
    fn deserialize<D: serde::Deserializer<'de>>(
        deserializer: D,
    ) -> std::result::Result<Self, D::Error> {
        deserializer.deserialize_any(CountVisitor)
    }
}

struct CountVisitor;

impl serde::de::Visitor<'_> for CountVisitor {
    type Value = Count;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a whole number")
    }

    fn visit_i64<E: serde::de::Error>(self, value: i64) -> std::result::Result<Self::Value, E> {
        u64::try_from(value)
            .map_err(|_| E::custom(format!("`{value}` is negative; a count must be 0 or more")))
            .and_then(|v| self.visit_u64(v))
    }

    fn visit_u64<E: serde::de::Error>(self, value: u64) -> std::result::Result<Self::Value, E> {
        if value > crate::tuning::MAX_DEGREES_PER_PERIOD as u64 {
            return Err(E::custom(format!(
                "{value} is too many: taut handles at most {} degrees per period",
                crate::tuning::MAX_DEGREES_PER_PERIOD
            )));
        }
        Ok(Count(value))
    }

    fn visit_f64<E: serde::de::Error>(self, value: f64) -> std::result::Result<Self::Value, E> {
        Err(E::custom(format!("`{value}` is not a whole number")))
    }

    fn visit_str<E: serde::de::Error>(self, text: &str) -> std::result::Result<Self::Value, E> {
        Err(E::custom(format!("`{text}` is not a whole number")))
    }
}

/// A number of equal divisions read from YAML: a whole number from 1 to
/// [`crate::tuning::MAX_DEGREES_PER_PERIOD`], checked where it stands.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Divisions(pub u64);

impl<'de> Deserialize<'de> for Divisions {
    fn deserialize<D: serde::Deserializer<'de>>(
        deserializer: D,
    ) -> std::result::Result<Self, D::Error> {
        deserializer.deserialize_any(DivisionsVisitor)
    }
}

struct DivisionsVisitor;

impl serde::de::Visitor<'_> for DivisionsVisitor {
    type Value = Divisions;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a whole number of divisions, at least 1")
    }

    fn visit_i64<E: serde::de::Error>(self, value: i64) -> std::result::Result<Self::Value, E> {
        if value <= 0 {
            return Err(E::custom(format!(
                "{value} divisions cannot divide an interval: there must be at least 1"
            )));
        }
        self.visit_u64(value.unsigned_abs())
    }

    fn visit_u64<E: serde::de::Error>(self, value: u64) -> std::result::Result<Self::Value, E> {
        if value == 0 {
            return Err(E::custom(
                "0 divisions cannot divide an interval: there must be at least 1",
            ));
        }
        CountVisitor.visit_u64(value).map(|Count(n)| Divisions(n))
    }

    fn visit_f64<E: serde::de::Error>(self, value: f64) -> std::result::Result<Self::Value, E> {
        CountVisitor.visit_f64(value).map(|Count(n)| Divisions(n))
    }

    fn visit_str<E: serde::de::Error>(self, text: &str) -> std::result::Result<Self::Value, E> {
        CountVisitor.visit_str(text).map(|Count(n)| Divisions(n))
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_abs_diff_eq;

    #[test]
    fn parses_each_interval_form() {
        assert_eq!(
            Interval::parse("3/2").unwrap().ratio,
            Some(Ratio::new(3, 2))
        );
        assert_abs_diff_eq!(
            Interval::parse("1200c").unwrap().cents,
            1200.0,
            epsilon = 1e-12
        );
        // Quarter-comma meantone fifth: the fourth root of 5, 696.578 cents (from memory; the
        // brief's check value, REFERENCES §7.3 gives the 81/80 comma it tempers by a quarter).
        let fifth = Interval::parse("5^(1/4)").unwrap();
        assert_abs_diff_eq!(fifth.cents, 696.578, epsilon = 5e-4);
        assert_eq!(fifth.ratio, None);
        assert_eq!(
            Interval::parse("3/2^(2)").unwrap().ratio,
            Some(Ratio::new(9, 4))
        );
    }

    #[test]
    fn refuses_ambiguous_and_broken_intervals() {
        for bad in ["2", "", "3/0", "abc", "nanc", "5^(x)", "infc"] {
            assert!(Interval::parse(bad).is_err(), "{bad}");
        }
        let err = Interval::parse("2").unwrap_err().to_string();
        assert!(err.contains("`2/1`") && err.contains("`2c`"), "{err}");
    }
}
