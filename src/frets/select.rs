//! Which degrees of a tuning become frets on one course, and where they go.

use std::str::FromStr;

use num_traits::CheckedDiv;

use super::{Fret, DEFAULT_SPAN_CENTS, MIN_RESOLVABLE_SPACING_M};
use crate::error::{Error, Result};
use crate::input::yaml::PathStep;
use crate::instrument::frets::{DegreesFrom, FretSettings, MAX_FRETS};
use crate::instrument::Instrument;
use crate::tuning::pitch::{ratio_from_cents, ratio_to_f64, PitchSpec};
use crate::tuning::Tuning;

/// Where a course's frets stop.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Limits {
    /// At most this many frets.
    pub count: Option<u32>,
    /// No fret further than this from the nut, in metres.
    pub up_to_m: Option<f64>,
    /// The board's end, used as the limit when neither of the above is given.
    pub board_end_m: Option<f64>,
}

/// The steps of one period that get a fret (`None`: all of them), checked against the tuning.
/// Errors name `--degrees` when the list came from the command line, else its line in the file.
pub fn allowed_steps(
    instrument: &Instrument,
    tuning: &Tuning,
    settings: &FretSettings,
    overrides: &FretSettings,
) -> Result<Option<Vec<bool>>> {
    let Some(steps) = &settings.degrees else {
        return Ok(None);
    };
    let fail = |error: Error, item: Option<usize>| {
        if overrides.degrees.is_some() {
            return error.in_origin("--degrees");
        }
        let mut path = vec![PathStep::Key("frets"), PathStep::Key("degrees")];
        if let Some(item) = item {
            path.push(PathStep::Index(item));
        }
        instrument.point(error, &path)
    };
    let n = tuning.degrees_per_period().ok_or_else(|| {
        fail(
            Error::input(format!(
                "`{}` is a list of frequencies without periods, so it has no steps to choose from",
                tuning.name()
            ))
            .help("leave `degrees` out to fret every entry of the list"),
            None,
        )
    })?;
    if steps.is_empty() {
        return Err(fail(
            Error::input("the list of fretted steps is empty")
                .help("list at least one step, or leave `degrees` out to fret every degree"),
            None,
        ));
    }
    let mut allowed = vec![false; n];
    for (item, step) in steps.iter().enumerate() {
        let slot = usize::try_from(step.0)
            .ok()
            .and_then(|s| allowed.get_mut(s))
            .ok_or_else(|| {
                fail(
                    Error::input(format!(
                        "step {} does not exist: `{}` has steps 0 to {} in each period",
                        step.0,
                        tuning.name(),
                        n - 1
                    )),
                    Some(item),
                )
            })?;
        if *slot {
            return Err(fail(
                Error::input(format!("step {} is listed twice", step.0)),
                Some(item),
            ));
        }
        *slot = true;
    }
    Ok(Some(allowed))
}

/// The frets of one course whose open pitch is `pitch` (in the tuning's addressing) and whose
/// vibrating length is `length_m`, and why the list was cut short, if it was.
pub fn frets_of_course(
    tuning: &Tuning,
    pitch: &str,
    length_m: f64,
    allowed: Option<&[bool]>,
    from: DegreesFrom,
    limits: &Limits,
) -> Result<(Vec<Fret>, Option<String>)> {
    let open = tuning.resolve(&PitchSpec::from_str(pitch)?)?;
    // The degree the open pitch lands on, or the one just below it.
    let start = match open.degree {
        Some(k) => k,
        None => {
            let near = tuning
                .nearest_degree(open.hz)
                .ok_or_else(|| Error::input(format!("`{pitch}` is out of this tuning's range")))?;
            if near.hz > open.hz {
                near.degree - 1
            } else {
                near.degree
            }
        }
    };
    let per_period = tuning.degrees_per_period().map(|n| n as i64);
    let mut frets: Vec<Fret> = Vec::new();
    let mut previous = 0.0;
    let mut k = start;
    loop {
        k = match k.checked_add(1) {
            Some(next) => next,
            None => break,
        };
        // Past a frequency list's end, or too far to have a frequency: no more frets.
        let Ok(degree) = tuning.degree(k) else { break };
        if degree.hz <= open.hz * (1.0 + 1e-12) {
            continue;
        }
        if let (Some(mask), Some(n)) = (allowed, per_period) {
            let step = match from {
                DegreesFrom::Open => (k - start).rem_euclid(n),
                DegreesFrom::Tuning => k.rem_euclid(n),
            };
            if !mask.get(step as usize).copied().unwrap_or(false) {
                continue;
            }
        }
        let cents = degree.cents_from_reference - open.cents_from_reference;
        let ratio = match (&degree.ratio, &open.ratio) {
            (Some(fretted), Some(open)) => fretted.checked_div(open),
            _ => None,
        };
        let r = ratio.map_or_else(|| ratio_from_cents(cents), |r| ratio_to_f64(&r));
        let distance = length_m * (1.0 - 1.0 / r);
        let reached = |limit: f64| distance > limit * (1.0 + 1e-12);
        if limits
            .count
            .is_some_and(|count| frets.len() >= count as usize)
            || limits.up_to_m.is_some_and(reached)
        {
            break;
        }
        if limits.count.is_none() && limits.up_to_m.is_none() {
            let past = match limits.board_end_m {
                Some(end) => reached(end),
                None => cents > DEFAULT_SPAN_CENTS + 1e-6,
            };
            if past {
                break;
            }
        }
        if distance - previous < MIN_RESOLVABLE_SPACING_M || distance >= length_m {
            let reason = format!(
                "the frets stop at {}: the next would be under a micrometre from it",
                frets.len()
            );
            return Ok((frets, Some(reason)));
        }
        if frets.len() >= MAX_FRETS as usize {
            let reason = format!(
                "the frets stop at {MAX_FRETS}, the most taut lays out on one course; give `count` or `up_to`"
            );
            return Ok((frets, Some(reason)));
        }
        frets.push(Fret {
            fret: frets.len() as u32 + 1,
            degree: k,
            cents,
            ratio,
            distance_from_nut_m: distance,
            spacing_m: distance - previous,
            angle_deg: None,
        });
        previous = distance;
    }
    Ok((frets, None))
}
