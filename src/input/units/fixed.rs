//! Figures with a fixed number of decimals, written exactly as `format!("{value:.N}")` writes
//! them but without the general float formatter for the common case: a table of a few hundred
//! strings writes thousands of such figures.

use std::fmt::Write as _;

/// Powers of ten a scaled figure is built with; the most decimals the quick path takes is one
/// less than their count.
const POWERS_OF_TEN: [u64; 5] = [1, 10, 100, 1_000, 10_000];

/// Largest scaled figure the quick path takes. Below it, scaling by a power of ten is off by
/// less than 1e-7 of a unit in the last place shown, far less than [`TIE_MARGIN`].
const MAX_SCALED: f64 = 1e9;

/// How far from half-way between two figures a scaled value must be for the quick path: closer,
/// the scaling's rounding could tip it, so the general formatter decides.
const TIE_MARGIN: f64 = 1e-6;

/// `value` with `decimals` digits after the point, byte for byte as
/// `format!("{value:.decimals$}")` writes it.
pub fn fixed(value: f64, decimals: usize) -> String {
    let mut text = String::with_capacity(12);
    push_fixed(&mut text, value, decimals);
    text
}

/// [`fixed`], appended to `out`.
pub fn push_fixed(out: &mut String, value: f64, decimals: usize) {
    push_figure(out, value, decimals, false);
}

/// `value` with `decimals` digits after the point and always a sign, byte for byte as
/// `format!("{value:+.decimals$}")` writes it, appended to `out`.
pub fn push_signed_fixed(out: &mut String, value: f64, decimals: usize) {
    push_figure(out, value, decimals, true);
}

fn push_figure(out: &mut String, value: f64, decimals: usize, plus: bool) {
    // Writing to a String cannot fail.
    let _ = match quick_digits(value.abs(), decimals) {
        Some((scaled, unit)) => {
            // The formatter keeps the sign of a negative value that rounds to zero (`-0.0`).
            if value.is_sign_negative() {
                out.push('-');
            } else if plus {
                out.push('+');
            }
            let mut digits = itoa::Buffer::new();
            out.push_str(digits.format(scaled / unit));
            if decimals > 0 {
                out.push('.');
                let fraction = digits.format(scaled % unit);
                out.extend(std::iter::repeat_n('0', decimals - fraction.len()));
                out.push_str(fraction);
            }
            Ok(())
        }
        None if plus => write!(out, "{value:+.decimals$}"),
        None => write!(out, "{value:.decimals$}"),
    };
}

/// The size of a figure scaled to a whole number of its last shown digit, and that digit's
/// power of ten, when that number is certainly the correctly rounded one: a finite size, not
/// too large, and not near half-way.
fn quick_digits(size: f64, decimals: usize) -> Option<(u64, u64)> {
    let unit = *POWERS_OF_TEN.get(decimals)?;
    if !size.is_finite() {
        return None;
    }
    // Exact for these powers of ten, so the product is the exact one rounded once.
    let scaled = size * unit as f64;
    if scaled >= MAX_SCALED {
        return None;
    }
    let nearest = scaled.round();
    ((scaled - nearest).abs() < 0.5 - TIE_MARGIN).then_some((nearest as u64, unit))
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A small xorshift generator: the same values on every run.
    struct Values(u64);

    impl Values {
        fn next(&mut self) -> u64 {
            self.0 ^= self.0 << 13;
            self.0 ^= self.0 >> 7;
            self.0 ^= self.0 << 17;
            self.0
        }

        fn unit(&mut self) -> f64 {
            (self.next() >> 11) as f64 / (1u64 << 53) as f64
        }
    }

    fn same_as_the_formatter(value: f64) {
        for decimals in 0..7 {
            same_to(value, decimals);
        }
    }

    fn same_to(value: f64, decimals: usize) {
        for value in [value, -value] {
            assert_eq!(
                fixed(value, decimals),
                format!("{value:.decimals$}"),
                "{value:e} to {decimals} decimals"
            );
            let mut signed = String::new();
            push_signed_fixed(&mut signed, value, decimals);
            assert_eq!(
                signed,
                format!("{value:+.decimals$}"),
                "{value:e} to {decimals} decimals, signed"
            );
        }
    }

    #[test]
    fn writes_what_the_formatter_writes() {
        for value in [
            0.0,
            -0.0,
            0.5,
            1.5,
            2.5,
            0.125,
            0.375,
            1.005,
            2.675,
            0.05,
            0.15,
            0.25,
            0.35,
            9.995,
            99.95,
            999.9995,
            1e-9,
            1e8,
            1e9,
            1e12,
            1e300,
            -1.25,
            -0.04,
            f64::MIN_POSITIVE,
            f64::MAX,
            f64::INFINITY,
            f64::NEG_INFINITY,
            f64::NAN,
        ] {
            same_as_the_formatter(value);
        }
        let mut values = Values(0x9e37_79b9_7f4a_7c15);
        for _ in 0..20_000 {
            // Spread over the magnitudes a report shows, from micrometres to kilohertz.
            let magnitude = 10f64.powi((values.next() % 12) as i32 - 4);
            same_as_the_formatter(values.unit() * magnitude);
        }
    }

    #[test]
    fn figures_near_half_way_are_left_to_the_formatter() {
        let mut values = Values(0x2545_f491_4f6c_dd1d);
        for _ in 0..20_000 {
            let decimals = (values.next() % 5) as usize;
            let step = 10f64.powi(-(decimals as i32));
            let half_way = ((values.next() % 100_000) as f64 + 0.5) * step;
            for nudge in [-2.0, -1.0, 0.0, 1.0, 2.0] {
                same_to(half_way + nudge * half_way * f64::EPSILON, decimals);
            }
        }
    }
}
