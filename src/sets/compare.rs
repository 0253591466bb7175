//! Two stringings side by side: two plans, two sets, or a plan and a set, course by course.
//!
//! Each side is first reduced to a [`Listing`]: per course its pitch and length, per string what
//! it is (kind, gauge, outer diameter) and how it stands (tension, stress, bend force). A plan's
//! export carries these figures itself ([`Listing::from_plan`]); a set has none until it is put on
//! an instrument in a tuning, so it is audited first and listed from the audit
//! ([`Listing::from_audit`]). [`compare`] then matches courses by number and strings by their
//! place in the course, and gives each string's changes and the change of the total load.
//!
//! Why the changes are what they are (REFERENCES §12.3): at a fixed pitch and μ, T = μ(2Lf)²
//! grows with L², so the same set moved from 647.7 mm to 685.8 mm pulls (685.8/647.7)² − 1 =
//! 12.11 % more on every string; the comparison shows exactly that.

use serde::{Deserialize, Serialize};

use crate::plan::warning::{Severity, Warning, SAFETY_CAUTIONS};
use crate::plan::Plan;
use crate::sets::audit::Audit;

/// Where a side's figures come from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum SideSource {
    /// A plan's JSON or YAML export: its own figures.
    Plan,
    /// A string-set file, checked on an instrument in a tuning.
    Set,
}

/// One side of a comparison, reduced to what is compared.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Listing {
    /// Plan or set.
    pub source: SideSource,
    /// The plan's instrument and tuning, or the set's name.
    pub name: String,
    /// The instrument the figures are for.
    pub instrument: String,
    /// The tuning the figures are for.
    pub tuning: String,
    /// The instrument's rated total load, N, when it states one.
    pub rated_load_n: Option<f64>,
    /// The courses, in the side's order.
    pub courses: Vec<ListedCourse>,
    /// The side's own warnings (a plan's, or the audit's).
    pub warnings: Vec<Warning>,
}

/// One course of a side.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct ListedCourse {
    /// The course number.
    pub course: u32,
    /// The course's pitch as its report labels it.
    pub pitch_label: String,
    /// Vibrating length, m.
    pub length_m: f64,
    /// The strings, in course order.
    pub strings: Vec<ListedString>,
}

/// One string of a side.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct ListedString {
    /// The string kind's id, or how a measured string was known.
    pub string: String,
    /// The catalog's name for the gauge, where there is one.
    pub gauge: Option<String>,
    /// Outer diameter, mm, where known.
    pub diameter_mm: Option<f64>,
    /// The string's pitch, Hz.
    pub pitch_hz: f64,
    /// Tension at that pitch, N.
    pub tension_n: f64,
    /// Stress over breaking strength, where the strength is known.
    pub stress_ratio: Option<f64>,
    /// Sideways force at mid-length for the feel bend, N, where the string's stiffness is known.
    pub bend_force_n: Option<f64>,
    /// The bend the force is for, cents.
    pub bend_cents: f64,
}

impl Listing {
    /// A plan's strings with the plan's own figures.
    pub fn from_plan(plan: &Plan) -> Self {
        Listing {
            source: SideSource::Plan,
            name: format!("{} in {}", plan.instrument, plan.tuning),
            instrument: plan.instrument.clone(),
            tuning: plan.tuning.clone(),
            rated_load_n: plan.rated_load_n,
            courses: plan
                .courses
                .iter()
                .map(|course| ListedCourse {
                    course: course.course,
                    pitch_label: course.pitch.label.clone(),
                    length_m: course.length_m,
                    strings: course
                        .strings
                        .iter()
                        .map(|string| {
                            let choice = &string.choice;
                            ListedString {
                                string: choice.kind.to_string(),
                                gauge: Some(choice.gauge.to_string()),
                                diameter_mm: (choice.diameter_mm > 0.0)
                                    .then_some(choice.diameter_mm),
                                pitch_hz: string.pitch_hz,
                                tension_n: choice.tension_n,
                                stress_ratio: Some(choice.stress_ratio),
                                bend_force_n: string.feel.and_then(|feel| feel.bend_force_n),
                                bend_cents: string
                                    .feel
                                    .map_or(crate::strings::feel::DEFAULT_BEND_CENTS, |feel| {
                                        feel.bend_cents
                                    }),
                            }
                        })
                        .collect(),
                })
                .collect(),
            warnings: plan.warnings.clone(),
        }
    }

    /// A set's strings as the audit found them on its instrument in its tuning.
    pub fn from_audit(audit: &Audit) -> Self {
        Listing {
            source: SideSource::Set,
            name: audit.set.clone(),
            instrument: audit.instrument.clone(),
            tuning: audit.tuning.clone(),
            rated_load_n: audit.rated_load_n,
            courses: audit
                .courses
                .iter()
                .map(|course| ListedCourse {
                    course: course.course,
                    pitch_label: course.pitch.label.clone(),
                    length_m: course.length_m,
                    strings: course
                        .strings
                        .iter()
                        .map(|string| ListedString {
                            string: string.string.clone(),
                            gauge: None,
                            diameter_mm: string.diameter_mm,
                            pitch_hz: string.pitch_hz,
                            tension_n: string.tension_n,
                            stress_ratio: string.stress_ratio,
                            bend_force_n: string.feel.bend_force_n,
                            bend_cents: string.feel.bend_cents,
                        })
                        .collect(),
                })
                .collect(),
            warnings: audit.warnings.clone(),
        }
    }

    /// Sum of every string's tension, N.
    pub fn total_tension_n(&self) -> f64 {
        self.courses
            .iter()
            .flat_map(|course| &course.strings)
            .map(|string| string.tension_n)
            .sum()
    }
}

/// What a side was, in the comparison's header.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct SideSummary {
    /// The file it was read from, as given.
    pub file: String,
    /// Plan or set.
    pub source: SideSource,
    /// The plan's instrument and tuning, or the set's name.
    pub name: String,
    /// The instrument the figures are for.
    pub instrument: String,
    /// The tuning the figures are for.
    pub tuning: String,
    /// Sum of every string's tension, N.
    pub total_tension_n: f64,
    /// The instrument's rated total load, N, when it states one.
    pub rated_load_n: Option<f64>,
}

/// Two stringings side by side.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Comparison {
    /// The first side (the one changed from).
    pub before: SideSummary,
    /// The second side (the one changed to).
    pub after: SideSummary,
    /// Every course on either side, by number: the first side's order, then courses only the
    /// second side has.
    pub courses: Vec<CompareCourse>,
    /// Total tension after minus before, N.
    pub total_change_n: f64,
    /// The same as a percentage of the total before.
    pub total_change_pct: f64,
    /// Strings whose string, pitch or length differ, or that only one side has.
    pub strings_changed: usize,
    /// Strings on both sides with nothing changed.
    pub strings_unchanged: usize,
    /// The second side's warnings (what the change leads to).
    pub warnings: Vec<Warning>,
    /// The usual cautions, when the second side raises a caution or danger, or the total load
    /// moves by more than [`crate::sets::convert::DEFAULT_LOAD_CHANGE`].
    pub cautions: Vec<String>,
}

/// One course on either side.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct CompareCourse {
    /// The course number.
    pub course: u32,
    /// The pitch before, when the first side has the course.
    pub pitch_before: Option<String>,
    /// The pitch after, when the second side has the course.
    pub pitch_after: Option<String>,
    /// Vibrating length before, m.
    pub length_before_m: Option<f64>,
    /// Vibrating length after, m.
    pub length_after_m: Option<f64>,
    /// Its strings, matched by place in the course.
    pub strings: Vec<CompareString>,
}

/// One string on either side, and what changed.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct CompareString {
    /// The string before, when the first side has it.
    pub before: Option<ListedString>,
    /// The string after, when the second side has it.
    pub after: Option<ListedString>,
    /// Whether anything differs (a string only one side has counts as changed).
    pub changed: bool,
    /// Outer diameter after minus before, mm.
    pub diameter_change_mm: Option<f64>,
    /// Tension after minus before, N.
    pub tension_change_n: Option<f64>,
    /// The same as a percentage of the tension before.
    pub tension_change_pct: Option<f64>,
    /// Stress after minus before, in percentage points of the breaking strength.
    pub stress_change_points: Option<f64>,
    /// Bend force after over before, as a percentage change (the feel under the fingers).
    pub bend_force_change_pct: Option<f64>,
}

/// Relative difference below which two figures count as the same (rounding in an export).
const SAME: f64 = 1e-9;

fn same(a: f64, b: f64) -> bool {
    (a - b).abs() <= SAME * a.abs().max(b.abs()).max(1e-12)
}

fn pct(before: f64, after: f64) -> Option<f64> {
    (before.abs() > 0.0).then(|| (after / before - 1.0) * 100.0)
}

fn compare_string(before: Option<&ListedString>, after: Option<&ListedString>) -> CompareString {
    let both = before.zip(after);
    let changed = match both {
        Some((b, a)) => {
            b.string != a.string
                // A set names no catalog gauge; its diameter says the same.
                || matches!((&b.gauge, &a.gauge), (Some(x), Some(y)) if x != y)
                || !same(b.pitch_hz, a.pitch_hz)
                || !same(b.tension_n, a.tension_n)
                || match (b.diameter_mm, a.diameter_mm) {
                    (Some(x), Some(y)) => !same(x, y),
                    (x, y) => x.is_some() != y.is_some(),
                }
        }
        None => true,
    };
    CompareString {
        before: before.cloned(),
        after: after.cloned(),
        changed,
        // The same diameter read back from a set differs in its last bits: that is no change.
        diameter_change_mm: both.and_then(|(b, a)| {
            let (x, y) = (b.diameter_mm?, a.diameter_mm?);
            Some(if same(x, y) { 0.0 } else { y - x })
        }),
        tension_change_n: both.map(|(b, a)| {
            if changed {
                a.tension_n - b.tension_n
            } else {
                0.0
            }
        }),
        tension_change_pct: both
            .and_then(|(b, a)| pct(b.tension_n, a.tension_n))
            .map(|p| if changed { p } else { 0.0 }),
        stress_change_points: both
            .and_then(|(b, a)| Some((a.stress_ratio? - b.stress_ratio?) * 100.0))
            .map(|p| if changed { p } else { 0.0 }),
        bend_force_change_pct: both
            .and_then(|(b, a)| pct(b.bend_force_n?, a.bend_force_n?))
            .map(|p| if changed { p } else { 0.0 }),
    }
}

/// Compares `before` (read from `before_file`) with `after` (from `after_file`).
pub fn compare(
    before: &Listing,
    before_file: &str,
    after: &Listing,
    after_file: &str,
) -> Comparison {
    let mut numbers: Vec<u32> = before.courses.iter().map(|c| c.course).collect();
    for course in &after.courses {
        if !numbers.contains(&course.course) {
            numbers.push(course.course);
        }
    }
    let find = |listing: &'_ Listing, number: u32| -> Option<ListedCourse> {
        listing
            .courses
            .iter()
            .find(|course| course.course == number)
            .cloned()
    };
    let mut courses = Vec::with_capacity(numbers.len());
    for number in numbers {
        let (old, new) = (find(before, number), find(after, number));
        let count = old
            .as_ref()
            .map_or(0, |c| c.strings.len())
            .max(new.as_ref().map_or(0, |c| c.strings.len()));
        let strings = (0..count)
            .map(|index| {
                compare_string(
                    old.as_ref().and_then(|c| c.strings.get(index)),
                    new.as_ref().and_then(|c| c.strings.get(index)),
                )
            })
            .collect();
        courses.push(CompareCourse {
            course: number,
            pitch_before: old.as_ref().map(|c| c.pitch_label.clone()),
            pitch_after: new.as_ref().map(|c| c.pitch_label.clone()),
            length_before_m: old.as_ref().map(|c| c.length_m),
            length_after_m: new.as_ref().map(|c| c.length_m),
            strings,
        });
    }
    let strings = courses.iter().flat_map(|c| &c.strings);
    let strings_changed = strings.clone().filter(|s| s.changed).count();
    let strings_unchanged = strings.filter(|s| !s.changed).count();
    let (total_before, total_after) = (before.total_tension_n(), after.total_tension_n());
    let total_change_n = if strings_changed == 0 {
        0.0
    } else {
        total_after - total_before
    };
    let total_change_pct = if total_before > 0.0 {
        total_change_n / total_before * 100.0
    } else {
        0.0
    };
    let alarming = after
        .warnings
        .iter()
        .any(|warning| warning.severity >= Severity::Caution)
        || total_change_pct.abs() > crate::sets::convert::DEFAULT_LOAD_CHANGE * 100.0;
    let summary = |listing: &Listing, file: &str, total: f64| SideSummary {
        file: file.to_string(),
        source: listing.source,
        name: listing.name.clone(),
        instrument: listing.instrument.clone(),
        tuning: listing.tuning.clone(),
        total_tension_n: total,
        rated_load_n: listing.rated_load_n,
    };
    Comparison {
        before: summary(before, before_file, total_before),
        after: summary(after, after_file, total_after),
        courses,
        total_change_n,
        total_change_pct,
        strings_changed,
        strings_unchanged,
        warnings: after.warnings.clone(),
        cautions: if alarming {
            SAFETY_CAUTIONS.iter().map(|s| s.to_string()).collect()
        } else {
            Vec::new()
        },
    }
}

/// The top-level keys that tell a plan's export from a set file.
#[derive(Debug, Deserialize)]
struct Probe {
    caution_stress_ratio: Option<serde::de::IgnoredAny>,
    all_tunings_served: Option<serde::de::IgnoredAny>,
}

/// The plan in `text` when it is a one-tuning plan's JSON or YAML export; `None` when it is not
/// a plan's export (a set file, say). A plan for several tunings is refused: its strings are
/// one set, but its figures differ per tuning, so there is no one side to compare.
pub fn plan_export(text: &str, origin: &str) -> crate::error::Result<Option<Plan>> {
    use crate::input::yaml;
    let Ok(probe) = yaml::parse::<Probe>(text, origin) else {
        return Ok(None);
    };
    if probe.all_tunings_served.is_some() {
        return Err(crate::error::Error::input(
            "this plan serves several tunings, and a comparison takes one tuning per side",
        )
        .in_origin(origin.to_string())
        .help("export one tuning's plan (`taut plan INSTRUMENT --variant NAME --format json -o FILE`), or compare the set it saves"));
    }
    if probe.caution_stress_ratio.is_none() {
        return Ok(None);
    }
    yaml::parse::<Plan>(text, origin).map(Some)
}
