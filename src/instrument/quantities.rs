//! Percentages and scale lengths as instrument files write them.

#[allow(unused_imports)]
use super::*;

/// A fraction written as a percentage, e.g. `10%`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Percent(f64);

impl Percent {
    /// The fraction (0.1 for `10%`).
    pub fn fraction(self) -> f64 {
        self.0
    }
}

impl FromStr for Percent {
    type Err = Error;

    fn from_str(text: &str) -> Result<Self> {
        let trimmed = text.trim();
        let number = trimmed.strip_suffix('%').ok_or_else(|| {
            Error::input(format!("`{trimmed}` is not a percentage"))
                .help("write the per cent sign, e.g. `10%`")
        })?;
        let value: f64 = number
            .trim()
            .parse()
            .map_err(|_| Error::input(format!("`{trimmed}` is not a percentage")))?;
        if !(value.is_finite() && value > 0.0 && value <= 1000.0) {
            return Err(Error::input(format!(
                "`{trimmed}` must be above 0% and at most 1000%"
            )));
        }
        Ok(Percent(value / 100.0))
    }
}

impl Expecting for Percent {
    const EXPECTING: &'static str = "a percentage such as `10%`";
}

impl<'de> Deserialize<'de> for Percent {
    fn deserialize<D: serde::Deserializer<'de>>(
        deserializer: D,
    ) -> std::result::Result<Self, D::Error> {
        scalar_or_map::scalar(deserializer)
    }
}

/// The vibrating length: one for every course, or two end values spread across the courses
/// (a fanned neck, a harp's changing string length given by its ends).
#[derive(Debug, Clone, PartialEq)]
pub enum ScaleLength {
    /// The same length for every course.
    Uniform(Length),
    /// From the first listed course to the last, with a shape between them.
    Spread {
        /// Length at the first listed course.
        first: Length,
        /// Length at the last listed course.
        last: Length,
        /// How the length moves between them (linear for frets fanned on a straight line).
        shape: Shape,
    },
}

#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
struct SpreadDetail {
    #[serde(deserialize_with = "scalar_or_map::scalar")]
    first: Length,
    #[serde(deserialize_with = "scalar_or_map::scalar")]
    last: Length,
    #[serde(default)]
    shape: Shape,
}

impl<'de> Deserialize<'de> for ScaleLength {
    fn deserialize<D: serde::Deserializer<'de>>(
        deserializer: D,
    ) -> std::result::Result<Self, D::Error> {
        Ok(
            match ScalarOrMap::<Length, SpreadDetail>::deserialize(deserializer)? {
                ScalarOrMap::Scalar(length) => ScaleLength::Uniform(length),
                ScalarOrMap::Map(spread) => ScaleLength::Spread {
                    first: spread.first,
                    last: spread.last,
                    shape: spread.shape,
                },
            },
        )
    }
}

impl ScaleLength {
    /// The length in metres a fraction `position` of the way from the first course to the last.
    pub fn at(&self, position: f64) -> f64 {
        match self {
            ScaleLength::Uniform(length) => length.si(),
            ScaleLength::Spread { first, last, shape } => {
                shape.between(first.si(), last.si(), position)
            }
        }
    }
}
