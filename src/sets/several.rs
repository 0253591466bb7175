//! Auditing an installed set under several tunings (or course-pitch variants) at once: the
//! ordinary audit ([`crate::sets::audit`]) in each tuning, then per course the worst verdict,
//! the tunings that give it, and which tuning sets each string's limits (the slackest and the
//! most stressed).

use serde::Serialize;

use crate::error::Result;
use crate::plan::several::{limiting, Resolved};
use crate::plan::warning::Severity;
use crate::sets::audit::{self, Audit, AuditOptions, Reference, Verdict};
use crate::sets::matching::cautions_for;
use crate::sets::set::StringSet;
use crate::strings::stock::Stock;

/// One tuning's audit, named.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct AuditBlock {
    /// The variant's name (the tuning's, when the list came from `--tuning`).
    pub variant: String,
    /// Courses whose pitch this variant changes.
    pub retuned_courses: Vec<u32>,
    /// The audit in this tuning: the same fields as `taut audit`'s JSON.
    #[serde(flatten)]
    pub audit: Audit,
}

/// One course across the tunings.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SharedVerdict {
    /// The course number.
    pub course: u32,
    /// The worst verdict over the tunings.
    pub verdict: Verdict,
    /// The tunings that give that verdict, when it is not a plain yes.
    pub decided_by: Vec<String>,
    /// Per string, the tuning where it is slackest (sets the lower limit).
    pub slackest_variants: Vec<String>,
    /// Per string, the tuning where it is most stressed (sets the upper limit).
    pub most_stressed_variants: Vec<String>,
}

/// An installed set under several tunings.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SeveralAudit {
    /// The instrument's name.
    pub instrument: String,
    /// The set's name.
    pub set: String,
    /// One audit per tuning, in the order given.
    pub tunings: Vec<AuditBlock>,
    /// Per course, the verdict over every tuning.
    pub courses: Vec<SharedVerdict>,
    /// Courses whose strings can take every tuning (verdict not "no").
    pub courses_ok_in_every_tuning: usize,
    /// Safety cautions, present when any caution or danger fired in any tuning.
    pub cautions: Vec<String>,
}

/// Audits `set` on the instrument in every tuning of `list`; tension changes are measured from
/// `reference` when given.
pub fn audit(
    set: &StringSet,
    list: &[Resolved],
    reference: Option<Reference<'_>>,
    stock: &Stock,
    options: &AuditOptions,
) -> Result<SeveralAudit> {
    let mut tunings = Vec::with_capacity(list.len());
    for variant in list {
        tunings.push(AuditBlock {
            variant: variant.name.clone(),
            retuned_courses: variant.retuned_courses.clone(),
            audit: audit::audit(
                &variant.instrument,
                set,
                &variant.tuning,
                reference,
                stock,
                options,
            )?,
        });
    }
    let name = |i: usize| list.get(i).map_or_else(String::new, |v| v.name.clone());
    let course_count = tunings.first().map_or(0, |block| block.audit.courses.len());
    let mut courses = Vec::with_capacity(course_count);
    for index in 0..course_count {
        let in_each: Vec<_> = tunings
            .iter()
            .filter_map(|block| block.audit.courses.get(index))
            .collect();
        let verdict = in_each
            .iter()
            .map(|course| course.verdict)
            .max()
            .unwrap_or(Verdict::Yes);
        let decided_by = if verdict == Verdict::Yes {
            Vec::new()
        } else {
            (0..in_each.len())
                .filter(|&i| in_each[i].verdict == verdict)
                .map(name)
                .collect()
        };
        let strings = in_each.first().map_or(0, |course| course.strings.len());
        let (mut slackest, mut stressed) = (Vec::new(), Vec::new());
        for string in 0..strings {
            let (low, high) = limiting(in_each.iter().map(|course| {
                course
                    .strings
                    .get(string)
                    .map_or((f64::NAN, None), |s| (s.tension_n, s.stress_ratio))
            }));
            slackest.push(name(low));
            stressed.push(name(high));
        }
        courses.push(SharedVerdict {
            course: in_each.first().map_or(0, |course| course.course),
            verdict,
            decided_by,
            slackest_variants: slackest,
            most_stressed_variants: stressed,
        });
    }
    let warnings: Vec<_> = tunings
        .iter()
        .flat_map(|block| block.audit.warnings.iter().cloned())
        .filter(|warning| warning.severity >= Severity::Caution)
        .collect();
    Ok(SeveralAudit {
        instrument: list
            .first()
            .map_or_else(String::new, |v| v.instrument.name.clone()),
        set: set.name.clone(),
        courses_ok_in_every_tuning: courses
            .iter()
            .filter(|course| course.verdict != Verdict::No)
            .count(),
        courses,
        tunings,
        cautions: cautions_for(&warnings),
    })
}
