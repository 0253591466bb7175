//! What a conversion aims each string at ("keep the feel": equal tension or equal bend force),
//! and the kept strings whose tension still moves too far.

use serde::Serialize;

use super::ConvertCourse;
#[allow(unused_imports)]
use crate::strings::physics;

/// What "keep the feel" keeps for each string, when no new tension is given.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum FeelRule {
    /// Each string aims for its old tension.
    #[default]
    EqualTension,
    /// Each string aims for the tension at which a bend of the same size takes the same push
    /// as the old string did ([`physics::tension_for_bend_force`], with the feel options'
    /// afterlengths and bend). On a new length or with a new core this differs from equal
    /// tension.
    EqualBend,
}

/// The rule a conversion's targets came from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum TargetRule {
    /// Each string's old tension.
    EqualTension,
    /// Each string's old bend force.
    EqualBend,
    /// The tension given with `--tension` (or the instrument's, for new courses).
    GivenTension,
}

impl TargetRule {
    /// The rule in a sentence, for reports.
    pub fn sentence(self, bend_cents: f64) -> String {
        match self {
            TargetRule::EqualTension => {
                "Feel kept by equal tension: each string aims for the tension it had.".to_string()
            }
            TargetRule::EqualBend => format!(
                "Feel kept by equal bend: each string aims for the tension at which a {bend_cents:.0}-cent bend takes the push it took before."
            ),
            TargetRule::GivenTension => {
                "Each string aims for the tension given, not its old one.".to_string()
            }
        }
    }
}

/// A kept string whose tension changes by more than the tolerance: it stays on, but will not
/// feel the same.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct KeptChange {
    /// Course number.
    pub course: u32,
    /// String within the course, from 1.
    pub string: usize,
    /// Tension change, %.
    pub tension_change_pct: f64,
    /// The tolerance, %.
    pub limit_pct: f64,
    /// A plain sentence.
    pub message: String,
}

/// The kept strings of `courses` whose tension changes by more than `tolerance`.
pub(super) fn kept_changes(courses: &[ConvertCourse], tolerance: f64) -> Vec<KeptChange> {
    let mut out = Vec::new();
    for course in courses {
        for (index, string) in course.strings.iter().enumerate() {
            let Some(change) = string.tension_change_pct.filter(|_| string.kept) else {
                continue;
            };
            if change.abs() > tolerance * 100.0 {
                out.push(KeptChange {
                    course: course.course,
                    string: index + 1,
                    tension_change_pct: change,
                    limit_pct: tolerance * 100.0,
                    message: format!(
                        "Course {} string {} is kept, but its tension changes by {change:+.0}% (more than ±{:.0}%): it will feel {}.",
                        course.course,
                        index + 1,
                        tolerance * 100.0,
                        if change > 0.0 { "stiffer" } else { "slacker" }
                    ),
                });
            }
        }
    }
    out
}
