//! Exact ratios and cents: conversions, checked powers, and the `p/q` text form.

#[allow(unused_imports)]
use super::*;

/// Exact frequency ratio, in checked 128-bit arithmetic.
pub type ExactRatio = Ratio<i128>;

/// The interval in cents of a frequency ratio: `1200 · log2(ratio)` (Ellis 1885).
pub fn cents(ratio: f64) -> f64 {
    1200.0 * ratio.log2()
}

/// The frequency ratio of an interval in cents: `2^(cents/1200)` (inverse of [`cents`]).
pub fn ratio_from_cents(cents: f64) -> f64 {
    (cents / 1200.0).exp2()
}

/// Cents of an exact ratio, computed as `1200 · (log2 p − log2 q)` so that large numerators and
/// denominators do not lose precision in one division first.
pub fn cents_of_ratio(ratio: &ExactRatio) -> f64 {
    1200.0 * ((*ratio.numer() as f64).log2() - (*ratio.denom() as f64).log2())
}

/// An exact ratio as a float.
pub fn ratio_to_f64(ratio: &ExactRatio) -> f64 {
    *ratio.numer() as f64 / *ratio.denom() as f64
}

/// `base^exponent` in checked arithmetic; `None` on overflow or for a zero base with a negative
/// exponent.
pub fn checked_ratio_pow(base: &ExactRatio, exponent: i64) -> Option<ExactRatio> {
    let mut factor = if exponent < 0 {
        if *base.numer() == 0 {
            return None;
        }
        // The reciprocal keeps the sign in the numerator, as Ratio expects.
        let (numer, denom) = (*base.denom(), *base.numer());
        if denom < 0 {
            Ratio::new_raw(numer.checked_neg()?, denom.checked_neg()?)
        } else {
            Ratio::new_raw(numer, denom)
        }
    } else {
        *base
    };
    let mut remaining = exponent.unsigned_abs();
    let mut result = Ratio::from_integer(1);
    while remaining > 0 {
        if remaining & 1 == 1 {
            result = result.checked_mul(&factor)?;
        }
        remaining >>= 1;
        if remaining > 0 {
            factor = factor.checked_mul(&factor)?;
        }
    }
    Some(result)
}

/// Formats an exact ratio as `p/q` (always with the denominator, so `2/1` reads as a ratio).
pub fn format_ratio(ratio: &ExactRatio) -> String {
    format!("{}/{}", ratio.numer(), ratio.denom())
}

/// Serializes an exact ratio as the text `p/q`, which JSON readers keep exact.
pub fn serialize_ratio<S: serde::Serializer>(
    ratio: &ExactRatio,
    serializer: S,
) -> std::result::Result<S::Ok, S::Error> {
    serializer.serialize_str(&format_ratio(ratio))
}

/// Serializes an optional exact ratio as `p/q` or `null`.
pub fn serialize_optional_ratio<S: serde::Serializer>(
    ratio: &Option<ExactRatio>,
    serializer: S,
) -> std::result::Result<S::Ok, S::Error> {
    match ratio {
        Some(ratio) => serializer.serialize_str(&format_ratio(ratio)),
        None => serializer.serialize_none(),
    }
}

/// Parses `p/q` (or a whole number `p`, read as `p/1`) into an exact positive ratio.
pub fn parse_ratio(text: &str) -> Result<ExactRatio> {
    let text = text.trim();
    let (numer_text, denom_text) = text.split_once('/').unwrap_or((text, "1"));
    let part = |digits: &str, what: &str| -> Result<i128> {
        let digits = digits.trim();
        if digits.is_empty() || !digits.bytes().all(|b| b.is_ascii_digit()) {
            return Err(Error::input(format!(
                "`{text}` is not a ratio: the {what} must be a whole number without a sign"
            ))
            .help("write a ratio such as `3/2`"));
        }
        digits.parse::<i128>().map_err(|_| {
            Error::input(format!(
                "`{text}` is too large for exact arithmetic (at most 38 digits each side)"
            ))
        })
    };
    let numer = part(numer_text, "numerator")?;
    let denom = part(denom_text, "denominator")?;
    if denom == 0 {
        return Err(Error::input(format!(
            "`{text}` has a zero denominator, which is not a ratio"
        )));
    }
    if numer == 0 {
        return Err(Error::input(format!(
            "`{text}` is zero; a frequency ratio must be above zero"
        )));
    }
    Ok(Ratio::new(numer, denom))
}
