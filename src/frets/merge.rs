//! Per-course checks (close frets, frets past the body joint or the board's end) and frets of
//! neighbouring courses that nearly coincide.
//!
//! Two frets of neighbouring courses lie on one fan line (one straight fret across both) when
//! they sit at the same fraction of their courses' lengths, 1 − 1/r, that is when they sound the
//! same ratio r above their open strings. Frets whose ratios differ by a few cents could share
//! one fret: put at the other's place, a course sounds that many cents off; put half way, each
//! sounds about half as far off. Such pairs are listed when they are within the tolerance.

use serde::Serialize;

use super::{Board, CourseFrets, Fret, FretWarning, FretWarningKind};

/// Two frets of neighbouring courses that could share one fret.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Mergeable {
    /// The two course numbers, in the order written.
    pub courses: [u32; 2],
    /// The fret numbers, on those courses.
    pub frets: [u32; 2],
    /// How far apart their pitches are, in cents (second minus first).
    pub cents_apart: f64,
    /// How far apart they are along the first course, in metres.
    pub apart_m: f64,
}

/// Frets on neighbouring courses within `tolerance_cents` of each other but not equal (equal
/// ones already form one fret). Each fret is paired with its nearest partner only.
pub fn near_coincidences(courses: &[CourseFrets], tolerance_cents: f64) -> Vec<Mergeable> {
    let mut found = Vec::new();
    for pair in courses.windows(2) {
        let (first, second) = (&pair[0], &pair[1]);
        for fret in &first.frets {
            if nearest(&second.frets, fret.cents).is_some_and(|(_, gap)| gap.abs() < 1e-6) {
                continue;
            }
            let Some((partner, gap)) = nearest(&second.frets, fret.cents) else {
                continue;
            };
            let partner_shared =
                nearest(&first.frets, partner.cents).is_some_and(|(_, g)| g.abs() < 1e-6);
            if gap.abs() > tolerance_cents || partner_shared {
                continue;
            }
            let fraction = partner.distance_from_nut_m / second.length_m;
            found.push(Mergeable {
                courses: [first.course, second.course],
                frets: [fret.fret, partner.fret],
                cents_apart: gap,
                apart_m: (fraction * first.length_m - fret.distance_from_nut_m).abs(),
            });
        }
    }
    found
}

/// The fret of `frets` (ascending) nearest in cents to `cents`, with its distance in cents.
fn nearest(frets: &[Fret], cents: f64) -> Option<(&Fret, f64)> {
    let index = frets.partition_point(|f| f.cents < cents);
    [index.checked_sub(1), Some(index)]
        .into_iter()
        .flatten()
        .filter_map(|i| frets.get(i))
        .map(|f| (f, f.cents - cents))
        .min_by(|a, b| a.1.abs().total_cmp(&b.1.abs()))
}

/// The warnings for one course: frets closer than `min_spacing_m`, frets past the body joint and
/// past the board's end, or no frets at all.
pub fn course_warnings(
    course: &CourseFrets,
    min_spacing_m: f64,
    board: &Board,
) -> Vec<FretWarning> {
    let number = course.course;
    let warn = |kind, message: String| FretWarning {
        kind,
        course: number,
        message: format!("course {number}: {message}"),
    };
    let mut warnings = Vec::new();
    if course.frets.is_empty() {
        warnings.push(warn(
            FretWarningKind::NoFrets,
            "no degree of the tuning lies above the open pitch within the limits, so the course gets no frets".to_string(),
        ));
        return warnings;
    }
    let close: Vec<&Fret> = course
        .frets
        .iter()
        .filter(|f| f.spacing_m < min_spacing_m)
        .collect();
    if let Some(closest) = close
        .iter()
        .min_by(|a, b| a.spacing_m.total_cmp(&b.spacing_m))
    {
        warnings.push(warn(
            FretWarningKind::CloseSpacing,
            format!(
                "{} closer than {:.1} mm to the fret before (closest {:.2} mm, fret {})",
                fret_list(&close),
                min_spacing_m * 1000.0,
                closest.spacing_m * 1000.0,
                closest.fret
            ),
        ));
    }
    let past = |limit: f64| -> Vec<&Fret> {
        course
            .frets
            .iter()
            .filter(|f| f.distance_from_nut_m > limit * (1.0 + 1e-12))
            .collect()
    };
    if let Some(joint) = board.body_joint_m {
        let over = past(joint);
        if !over.is_empty() {
            warnings.push(warn(
                FretWarningKind::PastBodyJoint,
                format!(
                    "{} past the body joint ({:.1} mm from the nut), over the body",
                    fret_list(&over),
                    joint * 1000.0
                ),
            ));
        }
    }
    if let Some(end) = board.board_end_m {
        let over = past(end);
        if !over.is_empty() {
            warnings.push(warn(
                FretWarningKind::PastBoardEnd,
                format!(
                    "{} past the board's end ({:.1} mm from the nut) and do not fit",
                    fret_list(&over),
                    end * 1000.0
                ),
            ));
        }
    }
    warnings
}

/// `fret 3 is`, `frets 3, 5–9 and 12 are`: fret numbers with runs shortened.
fn fret_list(frets: &[&Fret]) -> String {
    let mut runs: Vec<(u32, u32)> = Vec::new();
    for fret in frets {
        match runs.last_mut() {
            Some((_, end)) if *end + 1 == fret.fret => *end = fret.fret,
            _ => runs.push((fret.fret, fret.fret)),
        }
    }
    let texts: Vec<String> = runs
        .iter()
        .map(|&(a, b)| {
            if a == b {
                a.to_string()
            } else {
                format!("{a}–{b}")
            }
        })
        .collect();
    match texts.as_slice() {
        [one] if frets.len() == 1 => format!("fret {one} is"),
        [one] => format!("frets {one} are"),
        [rest @ .., last] => format!("frets {} and {last} are", rest.join(", ")),
        [] => String::new(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn fret(number: u32) -> Fret {
        Fret {
            fret: number,
            degree: i64::from(number),
            cents: f64::from(number) * 100.0,
            ratio: None,
            distance_from_nut_m: 0.0,
            spacing_m: 0.0,
            angle_deg: None,
        }
    }

    #[test]
    fn fret_lists_shorten_runs() {
        let frets: Vec<Fret> = [3, 5, 6, 7, 9].into_iter().map(fret).collect();
        let refs: Vec<&Fret> = frets.iter().collect();
        assert_eq!(fret_list(&refs), "frets 3, 5–7 and 9 are");
        assert_eq!(fret_list(&refs[..1]), "fret 3 is");
        assert_eq!(fret_list(&refs[1..4]), "frets 5–7 are");
    }
}
