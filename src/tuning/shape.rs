//! The five ways to lay out a tuning's degrees, shared by YAML files and inline specs, and the
//! checks that turn each into a [`Layout`].
//!
//! Errors name the field as the YAML schema spells it (`divisions`, `ratios[3]`, `period`,
//! `chain.up`), so the file loader can point at the line.

use num_rational::Ratio;
use num_traits::CheckedMul;

use super::interval::Interval;
use super::{Layout, MAX_DEGREES_PER_PERIOD};
use crate::error::{Error, Result};
use crate::tuning::pitch::{cents_of_ratio, checked_ratio_pow, ExactRatio};

/// Two degrees closer than this (in cents) count as the same degree in float-only layouts.
const SAME_DEGREE_CENTS: f64 = 1.0e-6;

/// A tuning's layout as written, before checking.
#[derive(Debug, Clone)]
pub enum Shape {
    /// `divisions` equal steps of `period`.
    Equal {
        /// Number of steps.
        divisions: u64,
        /// The interval divided.
        period: Interval,
    },
    /// Exact ratios of one period, starting at 1/1.
    Ratios {
        /// The degrees of one period.
        ratios: Vec<ExactRatio>,
        /// The repeating interval.
        period: Interval,
    },
    /// Cents of one period, starting at 0.
    Cents {
        /// The degrees of one period.
        cents: Vec<f64>,
        /// The repeating interval.
        period: Interval,
    },
    /// A fixed, non-repeating set of frequencies.
    Hertz {
        /// Frequencies in ascending order.
        hz: Vec<f64>,
    },
    /// A generator stacked `up` times upward and `down` times downward, reduced into the period.
    Chain {
        /// The stacked interval.
        generator: Interval,
        /// Generators above the start.
        up: u64,
        /// Generators below the start.
        down: u64,
        /// The interval every stacked note is reduced into.
        period: Interval,
    },
}

impl Shape {
    /// Checks the shape and lays out its degrees.
    pub fn into_layout(self) -> Result<Layout> {
        match self {
            Shape::Equal { divisions, period } => {
                check_count(divisions, "divisions")?;
                if divisions == 0 {
                    return Err(Error::input("there must be at least 1 division")
                        .field("divisions")
                        .help("write the number of equal steps, e.g. `divisions: 19`"));
                }
                check_period(&period)?;
                let steps = (0..divisions)
                    .map(|i| {
                        if i == 0 {
                            Interval::unison()
                        } else {
                            Interval::from_cents(period.cents * i as f64 / divisions as f64)
                        }
                    })
                    .collect();
                Ok(Layout::Periodic { period, steps })
            }
            Shape::Ratios { ratios, period } => {
                check_list_len(ratios.len(), "ratios")?;
                check_period(&period)?;
                if ratios.first() != Some(&Ratio::from_integer(1)) {
                    return Err(Error::input(
                        "the first ratio must be 1/1: the list starts at the period's first degree",
                    )
                    .field("ratios[0]"));
                }
                for (i, pair) in ratios.windows(2).enumerate() {
                    if pair[1] <= pair[0] {
                        return Err(Error::input(format!(
                            "ratios must be strictly ascending, but {} is not above {}",
                            crate::tuning::pitch::format_ratio(&pair[1]),
                            crate::tuning::pitch::format_ratio(&pair[0])
                        ))
                        .field(format!("ratios[{}]", i + 1)));
                    }
                }
                let steps: Vec<Interval> = ratios.into_iter().map(Interval::from_ratio).collect();
                check_below_period(&steps, &period, "ratios")?;
                Ok(Layout::Periodic { period, steps })
            }
            Shape::Cents { cents, period } => {
                check_list_len(cents.len(), "cents")?;
                check_period(&period)?;
                if let Some(i) = cents.iter().position(|c| !c.is_finite()) {
                    return Err(
                        Error::input("cents must be finite numbers").field(format!("cents[{i}]"))
                    );
                }
                if cents.first() != Some(&0.0) {
                    return Err(Error::input(
                        "the first entry must be 0: the list starts at the period's first degree",
                    )
                    .field("cents[0]"));
                }
                for (i, pair) in cents.windows(2).enumerate() {
                    if pair[1] <= pair[0] {
                        return Err(Error::input(format!(
                            "cents must be strictly ascending, but {} is not above {}",
                            pair[1], pair[0]
                        ))
                        .field(format!("cents[{}]", i + 1)));
                    }
                }
                // The first entry is 0 cents, the unison: exactly 1/1, so degree 0 and the
                // period's own degrees keep their exact ratios.
                let steps: Vec<Interval> = cents
                    .into_iter()
                    .enumerate()
                    .map(|(i, c)| {
                        if i == 0 {
                            Interval::from_ratio(Ratio::from_integer(1))
                        } else {
                            Interval::from_cents(c)
                        }
                    })
                    .collect();
                check_below_period(&steps, &period, "cents")?;
                Ok(Layout::Periodic { period, steps })
            }
            Shape::Hertz { hz } => {
                check_list_len(hz.len(), "hertz")?;
                for (i, value) in hz.iter().enumerate() {
                    if !value.is_finite() || *value <= 0.0 {
                        return Err(Error::input(format!(
                            "{value} is not a frequency: frequencies must be finite and above 0 Hz"
                        ))
                        .field(format!("hertz[{i}]")));
                    }
                    crate::input::units::FREQUENCY_BOUNDS
                        .check(*value)
                        .map_err(|err| err.field(format!("hertz[{i}]")))?;
                }
                for (i, pair) in hz.windows(2).enumerate() {
                    if pair[1] <= pair[0] {
                        return Err(Error::input(format!(
                            "frequencies must be strictly ascending, but {} is not above {}",
                            pair[1], pair[0]
                        ))
                        .field(format!("hertz[{}]", i + 1)));
                    }
                }
                Ok(Layout::Absolute { hz })
            }
            Shape::Chain {
                generator,
                up,
                down,
                period,
            } => {
                check_count(up, "chain.up")?;
                check_count(down, "chain.down")?;
                if up + down + 1 > MAX_DEGREES_PER_PERIOD as u64 {
                    return Err(Error::input(format!(
                        "{} stacked notes are too many: taut handles at most {MAX_DEGREES_PER_PERIOD} degrees per period",
                        up + down + 1
                    ))
                    .field("chain"));
                }
                check_period(&period)?;
                if generator.cents.abs() < SAME_DEGREE_CENTS {
                    return Err(Error::input(
                        "the generator is a unison, so stacking it gives no new degrees",
                    )
                    .field("chain.generator"));
                }
                let mut steps = Vec::new();
                for power in -(down as i64)..=(up as i64) {
                    steps.push(reduce_into_period(&generator, power, &period));
                }
                steps.sort_by(|a, b| a.cents.total_cmp(&b.cents));
                for pair in steps.windows(2) {
                    let same = match (&pair[0].ratio, &pair[1].ratio) {
                        (Some(a), Some(b)) => a == b,
                        _ => (pair[1].cents - pair[0].cents).abs() < SAME_DEGREE_CENTS,
                    };
                    if same {
                        return Err(Error::input(format!(
                            "stacking the generator lands twice on {:.4} cents within the period",
                            pair[0].cents
                        ))
                        .field("chain")
                        .help("stack fewer generators, or choose a generator that does not divide the period evenly"));
                    }
                }
                Ok(Layout::Periodic { period, steps })
            }
        }
    }
}

fn check_count(count: u64, field: &str) -> Result<()> {
    if count > MAX_DEGREES_PER_PERIOD as u64 {
        return Err(Error::input(format!(
            "{count} is too many: taut handles at most {MAX_DEGREES_PER_PERIOD} degrees per period"
        ))
        .field(field));
    }
    Ok(())
}

fn check_list_len(len: usize, field: &str) -> Result<()> {
    if len == 0 {
        return Err(Error::input("the list is empty").field(field));
    }
    if len > MAX_DEGREES_PER_PERIOD {
        return Err(Error::input(format!(
            "{len} entries are too many: taut handles at most {MAX_DEGREES_PER_PERIOD}"
        ))
        .field(field));
    }
    Ok(())
}

fn check_period(period: &Interval) -> Result<()> {
    if !period.is_ascending() || !period.cents.is_finite() {
        return Err(Error::input(format!(
            "the period must be wider than a unison (above 1/1, above 0c), but it is {period}"
        ))
        .field("period")
        .help("the period is the interval after which the degrees repeat, usually `2/1`"));
    }
    if period.cents > MAX_PERIOD_CENTS {
        return Err(Error::input(format!(
            "the period is {period}, wider than the {MAX_PERIOD_CENTS} cents (ten octaves) taut accepts"
        ))
        .field("period")
        .help("real tunings repeat at the octave (`2/1`), the tritave (`3/1`) or thereabouts"));
    }
    Ok(())
}

/// Widest period accepted: ten octaves (a frequency ratio of 1024), well beyond the tritave and
/// the double octave of real non-octave tunings, and beyond the 1 Hz to 30 kHz pitch range.
pub const MAX_PERIOD_CENTS: f64 = 12_000.0;

fn check_below_period(steps: &[Interval], period: &Interval, field: &str) -> Result<()> {
    for (i, step) in steps.iter().enumerate() {
        let inside = match (&step.ratio, &period.ratio) {
            (Some(step), Some(period)) => step < period,
            _ => step.cents < period.cents - SAME_DEGREE_CENTS,
        };
        if !inside {
            return Err(Error::input(format!(
                "{step} is not below the period {period}; list one period, without its closing degree"
            ))
            .field(format!("{field}[{i}]")));
        }
    }
    Ok(())
}

/// `generator^power` reduced into `[1/1, period)`, exact when both are exact and it fits.
fn reduce_into_period(generator: &Interval, power: i64, period: &Interval) -> Interval {
    let raw_cents = generator.cents * power as f64;
    let periods = (raw_cents / period.cents).floor() as i64;
    let exact = match (&generator.ratio, &period.ratio) {
        (Some(generator), Some(period_ratio)) => {
            checked_ratio_pow(generator, power).and_then(|raw| {
                // The float estimate of the period count may be one off at the boundary.
                let mut reduced = raw.checked_mul(&checked_ratio_pow(period_ratio, -periods)?)?;
                let one = Ratio::from_integer(1);
                while reduced < one {
                    reduced = reduced.checked_mul(period_ratio)?;
                }
                while reduced >= *period_ratio {
                    reduced = reduced.checked_mul(&checked_ratio_pow(period_ratio, -1)?)?;
                }
                Some(reduced)
            })
        }
        _ => None,
    };
    match exact {
        Some(ratio) => Interval {
            cents: cents_of_ratio(&ratio),
            ratio: Some(ratio),
        },
        None => {
            let mut cents = raw_cents - periods as f64 * period.cents;
            if cents >= period.cents - SAME_DEGREE_CENTS {
                cents -= period.cents;
            }
            if cents.abs() < SAME_DEGREE_CENTS {
                cents = 0.0;
            }
            Interval::from_cents(cents)
        }
    }
}
