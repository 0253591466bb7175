//! How much tension a course should carry: a single target (`70N`), a window
//! (`{min: 60N, max: 90N}`, optionally with a `target`), or, instrument-wide only, a smooth
//! profile from the first course to the last (`{first: 20N, last: 160N}`), as harp builders give it.

use std::str::FromStr;

use serde::Deserialize;

use super::scalar_or_map::{Expecting, ScalarOrMap};
use crate::error::{Error, Result};
use crate::input::units::{Force, Length};

impl Expecting for Force {
    const EXPECTING: &'static str = "a force such as `70N`, `16lbf` or `7kgf`";
}

impl Expecting for Length {
    const EXPECTING: &'static str = "a length such as `648mm` or `25.5in`";
}

impl Expecting for crate::input::units::Diameter {
    const EXPECTING: &'static str = "a diameter such as `0.012in` or `1.2mm`";
}

/// How a profile moves from its first value to its last.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Deserialize)]
#[serde(rename_all = "lowercase", deny_unknown_fields)]
pub enum Shape {
    /// Equal steps in newtons (or metres) from one course to the next.
    #[default]
    Linear,
    /// Equal ratios from one course to the next (a straight line on a log scale).
    Geometric,
}

impl Shape {
    /// The value a fraction `position` (0 at the first course, 1 at the last) of the way along.
    pub fn between(self, first: f64, last: f64, position: f64) -> f64 {
        match self {
            Shape::Linear => first + (last - first) * position,
            Shape::Geometric => first * (last / first).powf(position),
        }
    }
}

/// The tension asked of a course, in newtons. `min`/`max` bound the acceptable window when one
/// was stated; a window given without a `target` aims at its middle, (min + max)/2 (`taut help
/// choice`).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TensionGoal {
    /// The tension the selector aims for.
    pub target_n: f64,
    /// Below this the string feels floppy and buzzes.
    pub min_n: Option<f64>,
    /// Above this the string is too stiff to play or loads the instrument too much.
    pub max_n: Option<f64>,
}

/// A tension setting as written in an instrument file or on the command line.
#[derive(Debug, Clone, PartialEq)]
pub enum TensionSpec {
    /// The same goal for every course it applies to.
    Fixed(TensionGoal),
    /// A smooth change from the first course to the last; an optional window applies throughout.
    Profile {
        /// Target at the first listed course.
        first_n: f64,
        /// Target at the last listed course.
        last_n: f64,
        /// How the target moves between them.
        shape: Shape,
        /// Lowest acceptable tension anywhere.
        min_n: Option<f64>,
        /// Highest acceptable tension anywhere.
        max_n: Option<f64>,
    },
}

impl TensionSpec {
    /// The goal for a course a fraction `position` of the way from the first course to the last.
    pub fn goal_at(&self, position: f64) -> TensionGoal {
        match *self {
            TensionSpec::Fixed(goal) => goal,
            TensionSpec::Profile {
                first_n,
                last_n,
                shape,
                min_n,
                max_n,
            } => TensionGoal {
                target_n: shape.between(first_n, last_n, position),
                min_n,
                max_n,
            },
        }
    }

    /// Whether this is a profile (which only makes sense for the whole instrument).
    pub fn is_profile(&self) -> bool {
        matches!(self, TensionSpec::Profile { .. })
    }
}

/// The detailed (mapping) form, checked in [`TensionSpec::from_detail`].
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct TensionDetail {
    #[serde(default, deserialize_with = "super::scalar_or_map::optional_scalar")]
    target: Option<Force>,
    #[serde(default, deserialize_with = "super::scalar_or_map::optional_scalar")]
    min: Option<Force>,
    #[serde(default, deserialize_with = "super::scalar_or_map::optional_scalar")]
    max: Option<Force>,
    #[serde(default, deserialize_with = "super::scalar_or_map::optional_scalar")]
    first: Option<Force>,
    #[serde(default, deserialize_with = "super::scalar_or_map::optional_scalar")]
    last: Option<Force>,
    shape: Option<Shape>,
}

impl TensionSpec {
    fn from_detail(detail: TensionDetail) -> Result<Self> {
        let si = |force: Option<Force>| force.map(Force::si);
        let (min_n, max_n) = (si(detail.min), si(detail.max));
        if let (Some(min), Some(max)) = (min_n, max_n) {
            if min > max {
                return Err(Error::input(format!(
                    "the window's `min` ({min:.1} N) is above its `max` ({max:.1} N)"
                )));
            }
        }
        match (detail.first, detail.last) {
            (Some(first), Some(last)) => {
                if detail.target.is_some() {
                    return Err(Error::input(
                        "a profile (`first`/`last`) and a `target` cannot be given together",
                    ));
                }
                Ok(TensionSpec::Profile {
                    first_n: first.si(),
                    last_n: last.si(),
                    shape: detail.shape.unwrap_or_default(),
                    min_n,
                    max_n,
                })
            }
            (Some(_), None) | (None, Some(_)) => Err(Error::input(
                "a tension profile needs both `first` and `last`",
            )),
            (None, None) => {
                if detail.shape.is_some() {
                    return Err(Error::input(
                        "`shape` belongs to a profile with `first` and `last`",
                    ));
                }
                let target_n = match (si(detail.target), min_n, max_n) {
                    (Some(target), _, _) => target,
                    (None, Some(min), Some(max)) => 0.5 * (min + max),
                    _ => {
                        return Err(Error::input(
                            "a tension window needs a `target`, or both `min` and `max`",
                        )
                        .help("write e.g. `tension: {min: 60N, max: 90N}` or `tension: 70N`"))
                    }
                };
                if min_n.is_some_and(|min| target_n < min)
                    || max_n.is_some_and(|max| target_n > max)
                {
                    return Err(Error::input(format!(
                        "the target ({target_n:.1} N) lies outside the window"
                    )));
                }
                Ok(TensionSpec::Fixed(TensionGoal {
                    target_n,
                    min_n,
                    max_n,
                }))
            }
        }
    }
}

impl FromStr for TensionSpec {
    type Err = Error;

    /// `70N` (a target) or `60N..90N` (a window, aiming at its middle).
    fn from_str(text: &str) -> Result<Self> {
        if let Some((low, high)) = text.split_once("..") {
            let (min, max): (Force, Force) = (low.parse()?, high.parse()?);
            return TensionSpec::from_detail(TensionDetail {
                target: None,
                min: Some(min),
                max: Some(max),
                first: None,
                last: None,
                shape: None,
            });
        }
        let target: Force = text.parse()?;
        Ok(TensionSpec::Fixed(TensionGoal {
            target_n: target.si(),
            min_n: None,
            max_n: None,
        }))
    }
}

impl Expecting for TensionSpec {
    const EXPECTING: &'static str = "a tension such as `70N` or a window such as `60N..90N`";
}

impl<'de> Deserialize<'de> for TensionSpec {
    fn deserialize<D: serde::Deserializer<'de>>(
        deserializer: D,
    ) -> std::result::Result<Self, D::Error> {
        match ScalarOrMap::<TensionSpec, TensionDetail>::deserialize(deserializer)? {
            ScalarOrMap::Scalar(spec) => Ok(spec),
            ScalarOrMap::Map(detail) => TensionSpec::from_detail(detail)
                .map_err(|err| serde::de::Error::custom(err.plain_message())),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn forms_parse() {
        let fixed: TensionSpec = crate::input::yaml::parse("70N", "t").unwrap();
        assert_eq!(fixed.goal_at(0.3).target_n, 70.0);
        let window: TensionSpec = crate::input::yaml::parse("{min: 60N, max: 90N}", "t").unwrap();
        assert_eq!(
            window.goal_at(0.0),
            TensionGoal {
                target_n: 75.0,
                min_n: Some(60.0),
                max_n: Some(90.0)
            }
        );
        let profile: TensionSpec =
            crate::input::yaml::parse("{first: 20N, last: 80N, shape: geometric}", "t").unwrap();
        assert!((profile.goal_at(0.5).target_n - 40.0).abs() < 1e-12);
        assert!(profile.is_profile());
        let range: TensionSpec = "60N..90N".parse().unwrap();
        assert_eq!(range.goal_at(1.0).target_n, 75.0);
    }

    #[test]
    fn contradictions_are_refused() {
        for bad in [
            "{min: 90N, max: 60N}",
            "{first: 20N}",
            "{min: 60N}",
            "{target: 50N, min: 60N, max: 90N}",
            "{first: 20N, last: 80N, target: 40N}",
            "{target: 50N, shape: linear}",
            "{target: 50N, maxx: 60N}",
            "70",
            "-70N",
        ] {
            assert!(
                crate::input::yaml::parse::<TensionSpec>(bad, "t").is_err(),
                "{bad} was accepted"
            );
        }
    }
}
