//! A range of cents swept in exact decimal steps.
//!
//! Adding 0.1 to itself ten thousand times in binary floating point drifts (0.1 has no exact
//! binary form), so offsets are held as whole numbers of nanocents and only the final value is
//! turned into a float: offset k is `(from + k·step) / 10⁹` cents, one correctly rounded
//! division, never an accumulated sum.

use crate::error::{Error, Result};

/// Decimal places a cents value may carry (nanocents).
pub const DECIMALS: u32 = 9;
const SCALE: i64 = 1_000_000_000;
/// Largest magnitude of a cents value: 100 octaves either way, far beyond any instrument.
pub const MAX_ABS_CENTS: i64 = 120_000;

/// A checked, non-empty range `from, from + step, …` up to the last value not above `to`.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct CentsRange {
    from: i64,
    step: i64,
    count: u64,
}

/// Why a range was refused, with the field it concerns.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct RangeError {
    /// `from`, `to` or `step`.
    pub field: &'static str,
    /// What is wrong.
    pub message: String,
}

impl CentsRange {
    /// One offset only.
    pub fn single(cents: f64) -> Result<CentsRange> {
        let value = to_nanocents(cents).map_err(Error::input)?;
        Ok(CentsRange {
            from: value,
            step: SCALE,
            count: 1,
        })
    }

    /// Checks a range written as decimal numbers. The numbers come from YAML as floats; their
    /// shortest decimal form (what was written, for up to 15 significant digits) is read back
    /// exactly.
    pub fn new(from: f64, to: f64, step: f64) -> std::result::Result<CentsRange, RangeError> {
        let field = |field: &'static str| move |message: String| RangeError { field, message };
        let from_n = to_nanocents(from).map_err(field("from"))?;
        let to_n = to_nanocents(to).map_err(field("to"))?;
        let step_n = to_nanocents(step).map_err(field("step"))?;
        if step_n == 0 {
            return Err(RangeError {
                field: "step",
                message: "the step is 0, so the range would never advance".to_string(),
            });
        }
        if step_n < 0 {
            return Err(RangeError {
                field: "step",
                message: format!(
                    "the step {step} is negative; give `from` ≤ `to` and a positive step"
                ),
            });
        }
        if to_n < from_n {
            return Err(RangeError {
                field: "to",
                message: format!("the range is empty: `to` ({to}) is below `from` ({from})"),
            });
        }
        // Both ends lie within ±MAX_ABS_CENTS·10⁹, so the difference fits easily in i64.
        let count = ((to_n - from_n) / step_n) as u64 + 1;
        Ok(CentsRange {
            from: from_n,
            step: step_n,
            count,
        })
    }

    /// How many offsets the range holds (at least one).
    pub fn len(&self) -> u64 {
        self.count
    }

    /// Always false: a range holds at least one offset.
    pub fn is_empty(&self) -> bool {
        false
    }

    /// Offset `k` in cents (`k < len()`).
    pub fn cents(&self, k: u64) -> f64 {
        let nanocents = self.from + k as i64 * self.step;
        nanocents as f64 / SCALE as f64
    }

    /// The step in cents (as a float: for estimates only, never to place an offset).
    pub fn step_cents(&self) -> f64 {
        self.step as f64 / SCALE as f64
    }

    /// Offset `k` as exact decimal text, e.g. `-12.3`.
    pub fn text(&self, k: u64) -> String {
        decimal_text(self.from + k as i64 * self.step)
    }
}

fn decimal_text(nanocents: i64) -> String {
    let sign = if nanocents < 0 { "-" } else { "" };
    let magnitude = nanocents.unsigned_abs();
    let whole = magnitude / SCALE as u64;
    let fraction = magnitude % SCALE as u64;
    if fraction == 0 {
        return format!("{sign}{whole}");
    }
    let digits = format!("{fraction:09}");
    format!("{sign}{whole}.{}", digits.trim_end_matches('0'))
}

/// Reads a float's shortest decimal form exactly into nanocents.
fn to_nanocents(value: f64) -> std::result::Result<i64, String> {
    if !value.is_finite() {
        return Err(format!("`{value}` is not a finite number of cents"));
    }
    if value.abs() > MAX_ABS_CENTS as f64 {
        return Err(format!(
            "{value} cents is beyond ±{MAX_ABS_CENTS} cents (100 octaves)"
        ));
    }
    // Rust prints the shortest text that reads back as the same float, never in exponent form.
    let text = value.to_string();
    let (negative, digits) = match text.strip_prefix('-') {
        Some(rest) => (true, rest),
        None => (false, text.as_str()),
    };
    let (whole, fraction) = digits.split_once('.').unwrap_or((digits, ""));
    if fraction.len() > DECIMALS as usize {
        return Err(format!(
            "{value} has more than {DECIMALS} decimal places; cents are read to the nanocent"
        ));
    }
    let whole: i64 = whole
        .parse()
        .map_err(|_| format!("`{value}` is not a number of cents"))?;
    let padded = format!("{fraction:0<9}");
    let fraction: i64 = padded
        .parse()
        .map_err(|_| format!("`{value}` is not a number of cents"))?;
    let magnitude = whole * SCALE + fraction;
    Ok(if negative { -magnitude } else { magnitude })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn tenth_cent_steps_land_exactly_on_decimals() {
        let range = CentsRange::new(-600.0, 600.0, 0.1).unwrap();
        assert_eq!(range.len(), 12_001);
        // Exact decimal: offset 6000 is 0 exactly, offset 12000 is 600 exactly, and every value
        // is the float nearest its decimal (the same as parsing the decimal text).
        assert_eq!(range.cents(6000), 0.0);
        assert_eq!(range.cents(12_000), 600.0);
        for k in [1, 3, 7, 4321, 11_999] {
            let text = range.text(k);
            assert_eq!(range.cents(k), text.parse::<f64>().unwrap(), "{text}");
        }
        assert_eq!(range.text(1), "-599.9");
        // Summing 0.1 drifts: the accumulated value differs from the decimal one.
        let mut drifting = -600.0_f64;
        for _ in 0..4321 {
            drifting += 0.1;
        }
        assert_ne!(drifting, range.cents(4321));
    }

    #[test]
    fn a_range_stops_at_the_last_step_within_to() {
        let range = CentsRange::new(0.0, 1.0, 0.3).unwrap();
        assert_eq!(range.len(), 4);
        assert_eq!(range.text(3), "0.9");
    }

    #[test]
    fn empty_zero_step_and_bad_values_are_named() {
        assert_eq!(CentsRange::new(1.0, 0.0, 0.1).unwrap_err().field, "to");
        assert_eq!(CentsRange::new(0.0, 1.0, 0.0).unwrap_err().field, "step");
        assert_eq!(CentsRange::new(0.0, 1.0, -0.5).unwrap_err().field, "step");
        assert_eq!(CentsRange::new(0.0, 1.0, 1e-12).unwrap_err().field, "step");
        assert_eq!(CentsRange::new(-1e9, 1.0, 1.0).unwrap_err().field, "from");
    }
}
