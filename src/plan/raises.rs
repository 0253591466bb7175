//! Levers and pedals in a plan: every course checked at every position it can be set to.
//!
//! A `stop` raise (a lever or pedal disc) grips the string at x = L·(1 − 1/r) from the nut or
//! top, the fret rule (REFERENCES §8.1), and leaves the tension of the open string; a `pull`
//! raise keeps the length and multiplies the tension, and so the stress, by r² (T = μ(2Lf)²,
//! REFERENCES §1.2). Both are REFERENCES §8.3. Each course is checked where it is worst: the
//! stress at its highest position, the tension against its window at its lowest, and the whole
//! instrument's load with every course at its heaviest position at once.

use serde::{Deserialize, Serialize};

use crate::error::{Error, Result};
use crate::input::yaml::PathStep;
use crate::instrument::{Action, Instrument, RaiseAmount, TensionSpec};
use crate::plan::warning::{over_rated_load, Warning, WarningKind};
use crate::plan::Plan;
use crate::tuning::pitch::nearest_note_name;
use crate::tuning::Tuning;

/// One position of a course's lever or pedal.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct PositionPlan {
    /// The position's name: `open` and `lever`, or `flat`, `natural` and `sharp`.
    pub position: String,
    /// The raise from the open string as written (`1 step`, `16/15`).
    pub raise: String,
    /// `stop` (the string is shortened) or `pull` (the string is tightened).
    pub action: String,
    /// The frequency ratio to the open string.
    pub ratio: f64,
    /// The first string's frequency at this position, Hz.
    pub pitch_hz: f64,
    /// The nearest 12-tone note at the tuning's concert pitch.
    pub note_name: String,
    /// Where a stop grips the string, m from the nut or top: L·(1 − 1/r); absent for a pull.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub stop_from_nut_m: Option<f64>,
    /// The vibrating length at this position, m.
    pub length_m: f64,
    /// The course's tension at this position (every string), N.
    pub tension_n: f64,
    /// The highest stress ratio of the course's strings at this position.
    pub stress_ratio: f64,
}

/// The ratio a raise gives on a course sounding `hz`.
pub fn ratio_of(amount: &RaiseAmount, hz: f64, tuning: &Tuning) -> Result<f64> {
    match amount {
        RaiseAmount::Interval(interval) => Ok(interval.ratio()),
        RaiseAmount::Steps(0) => Ok(1.0),
        RaiseAmount::Steps(steps) => {
            let from = tuning.nearest_degree(hz).ok_or_else(|| {
                Error::input("the course's pitch has no nearest degree in the tuning")
            })?;
            let to = tuning.degree(from.degree + steps)?;
            Ok(to.hz / from.hz)
        }
    }
}

/// Adds every course's positions to `plan`, their warnings, the load at the worst setting
/// and the keys the raises reach.
pub fn apply(
    instrument: &Instrument,
    tuning: &Tuning,
    plan: &mut Plan,
    tension: Option<&TensionSpec>,
) -> Result<()> {
    let (caution, danger) = (plan.caution_stress_ratio, plan.danger_stress_ratio);
    let mut any = false;
    let mut worst_total = 0.0;
    for (index, course) in plan.courses.iter_mut().enumerate() {
        let open_total: f64 = course.strings.iter().map(|s| s.choice.tension_n).sum();
        let input = instrument.course_input(index, tension);
        let Some((raises, input)) = input.and_then(|i| i.raises.map(|r| (r, i))) else {
            worst_total += open_total;
            continue;
        };
        any = true;
        let own = instrument.courses[index].raises.is_some();
        let path: Vec<PathStep<'_>> = if own {
            vec![
                PathStep::Key("courses"),
                PathStep::Index(index),
                PathStep::Key("raises"),
            ]
        } else {
            vec![PathStep::Key("defaults"), PathStep::Key("raises")]
        };
        let mut heaviest = 0.0_f64;
        let mut positions = Vec::with_capacity(raises.positions.len());
        for (name, amount) in &raises.positions {
            let ratio = ratio_of(amount, course.pitch.hz, tuning)
                .map_err(|err| instrument.point(err, &path))?;
            if raises.action == Action::Stop && ratio < 1.0 - 1e-12 {
                return Err(instrument.point(
                    Error::input(format!(
                        "course {}: the {name} position ({}) is below the open string, and a stop can only shorten it",
                        course.course,
                        amount.written()
                    ))
                    .help("write the lowest position as the course's `pitch`, or give `action: pull` for a changer that lowers"),
                    &path,
                ));
            }
            // Stop: the same tension on L/r. Pull: the same length at r² the tension.
            let (factor, length_m, stop) = match raises.action {
                Action::Stop => (
                    1.0,
                    course.length_m / ratio,
                    Some(course.length_m * (1.0 - 1.0 / ratio)),
                ),
                Action::Pull => (ratio * ratio, course.length_m, None),
            };
            let tension_n = open_total * factor;
            heaviest = heaviest.max(tension_n);
            let stress_ratio = course
                .strings
                .iter()
                .map(|s| s.choice.stress_ratio * factor)
                .fold(0.0, f64::max);
            let pitch_hz = course.pitch.hz * ratio;
            for (string_index, string) in course.strings.iter().enumerate() {
                let stress = string.choice.stress_ratio * factor;
                let open_stress = string.choice.stress_ratio;
                // Only what the position adds: the open string's own stress is already flagged.
                let raised = if stress > danger && open_stress <= danger {
                    Some((WarningKind::StressDanger, danger))
                } else if stress > caution && open_stress <= caution {
                    Some((WarningKind::StressCaution, caution))
                } else {
                    None
                };
                if let Some((kind, limit)) = raised {
                    course.warnings.push(Warning {
                        kind,
                        severity: kind.severity(),
                        course: Some(course.course),
                        string: Some(string_index + 1),
                        value: stress,
                        limit,
                        message: format!(
                            "Course {} string {} at its {name} position ({}, pulled up to {:.2} Hz): stress {:.0}% of breaking strength ({} above {:.0}%), though {:.0}% when open.",
                            course.course,
                            string_index + 1,
                            amount.written(),
                            string.pitch_hz * ratio,
                            stress * 100.0,
                            if kind == WarningKind::StressDanger { "danger" } else { "caution" },
                            limit * 100.0,
                            open_stress * 100.0
                        ),
                    });
                }
                if let Some(min) = input.tension.and_then(|goal| goal.min_n) {
                    let pulled = string.choice.tension_n * factor;
                    if pulled < min && string.choice.tension_n >= min {
                        course.warnings.push(Warning {
                            kind: WarningKind::TensionBelowWindow,
                            severity: WarningKind::TensionBelowWindow.severity(),
                            course: Some(course.course),
                            string: Some(string_index + 1),
                            value: pulled,
                            limit: min,
                            message: format!(
                                "Course {} string {} at its {name} position ({}): {:.1} N, below the window's {:.1} N: slack and buzzing.",
                                course.course,
                                string_index + 1,
                                amount.written(),
                                pulled,
                                min
                            ),
                        });
                    }
                }
            }
            positions.push(PositionPlan {
                position: (*name).to_string(),
                raise: amount.written(),
                action: raises.action.name().to_string(),
                ratio,
                pitch_hz,
                note_name: nearest_note_name(pitch_hz, tuning.concert_a4_hz()).0,
                stop_from_nut_m: stop,
                length_m,
                tension_n,
                stress_ratio,
            });
        }
        worst_total += heaviest;
        course.positions = positions;
    }
    if !any {
        return Ok(());
    }
    plan.worst_setting_total_n = Some(worst_total);
    let mut warnings: Vec<Warning> = plan
        .courses
        .iter()
        .flat_map(|course| course.warnings.iter().cloned())
        .collect();
    if let Some(rated) = plan.rated_load_n {
        if plan.total_tension_n > rated {
            warnings.push(over_rated_load(plan.total_tension_n, rated));
        } else if worst_total > rated {
            let mut warning = over_rated_load(worst_total, rated);
            warning.message = format!(
                "With every lever and pedal at its heaviest setting the strings pull {:.0} N in total, {:.0}% of the {:.0} N the instrument is rated for.",
                worst_total,
                worst_total / rated * 100.0,
                rated
            );
            warnings.push(warning);
        }
    }
    plan.warnings = warnings;
    plan.reachable_keys = reachable_keys(plan, tuning);
    Ok(())
}

/// The most degrees per period for which the keys are worked out (each transposition checks
/// every course, so this keeps the work to a few thousand steps per course).
const MAX_KEY_DEGREES: usize = 72;

/// The transpositions of the open strings' pitch classes that the raises reach. The courses of
/// one open class are set alike (as a harp's strings of one letter are); each class then takes
/// one position every course of it can sound, and the transposed set is reached when these
/// cover it one to one (a perfect matching, found by augmenting paths; Kuhn 1955, from
/// memory). Named as major keys in 12-EDO when the open set is diatonic, else as steps above
/// the open set.
fn reachable_keys(plan: &Plan, tuning: &Tuning) -> Vec<String> {
    let Some(n) = tuning
        .degrees_per_period()
        .filter(|&n| n <= MAX_KEY_DEGREES)
    else {
        return Vec::new();
    };
    let class = |hz: f64| {
        tuning
            .nearest_degree(hz)
            .map(|d| d.degree.rem_euclid(n as i64) as usize)
    };
    // For each open class, the classes every course of it can sound.
    let mut reach: Vec<Option<Vec<bool>>> = vec![None; n];
    for course in &plan.courses {
        let Some(base) = class(course.pitch.hz) else {
            return Vec::new();
        };
        let mut own = vec![false; n];
        own[base] = true;
        for position in &course.positions {
            match class(position.pitch_hz) {
                Some(c) => own[c] = true,
                None => return Vec::new(),
            }
        }
        let entry = reach[base].get_or_insert_with(|| vec![true; n]);
        for (c, can) in entry.iter_mut().enumerate() {
            *can &= own[c];
        }
    }
    let open: Vec<usize> = (0..n).filter(|&c| reach[c].is_some()).collect();
    let is_open = |c: usize| reach[c].is_some();
    // A diatonic open set in 12-EDO: its major tonic, and a course sounding it.
    let major = [0, 2, 4, 5, 7, 9, 11];
    let tonic = (n == 12 && open.len() == 7)
        .then(|| (0..12).find(|&c| major.iter().all(|&s| is_open((c + s) % 12))))
        .flatten()
        .and_then(|c| {
            plan.courses
                .iter()
                .find(|course| class(course.pitch.hz) == Some(c))
                .map(|course| course.pitch.hz)
        });
    let mut keys = Vec::new();
    for t in 0..n {
        let wanted = |c: usize| is_open((c + n - t) % n);
        // matched[target class] = the open class sounding it.
        let mut matched: Vec<Option<usize>> = vec![None; n];
        let mut perfect = true;
        for &from in &open {
            let mut seen = vec![false; n];
            if !augment(from, &reach, &wanted, &mut matched, &mut seen) {
                perfect = false;
                break;
            }
        }
        if perfect {
            keys.push(match tonic {
                Some(hz) => {
                    let name =
                        nearest_note_name(hz * 2f64.powf(t as f64 / 12.0), tuning.concert_a4_hz())
                            .0;
                    let letters: String = name
                        .chars()
                        .take_while(|c| !c.is_ascii_digit() && *c != '-')
                        .collect();
                    // Major keys are spelt with flats, except F#.
                    let spelt = match letters.as_str() {
                        "C#" => "Db",
                        "D#" => "Eb",
                        "G#" => "Ab",
                        "A#" => "Bb",
                        other => other,
                    };
                    format!("{spelt} major")
                }
                None if t == 0 => "open".to_string(),
                None => format!("open +{t} steps"),
            });
        }
    }
    keys
}

/// One augmenting path from open class `from` (Kuhn's algorithm).
fn augment(
    from: usize,
    reach: &[Option<Vec<bool>>],
    wanted: &dyn Fn(usize) -> bool,
    matched: &mut [Option<usize>],
    seen: &mut [bool],
) -> bool {
    let Some(can) = &reach[from] else {
        return false;
    };
    for target in 0..can.len() {
        if !can[target] || !wanted(target) || seen[target] {
            continue;
        }
        seen[target] = true;
        let free = match matched[target] {
            None => true,
            Some(other) => augment(other, reach, wanted, matched, seen),
        };
        if free {
            matched[target] = Some(from);
            return true;
        }
    }
    false
}
