//! Resolving a pitch as written (a note, a degree, a ratio, cents or hertz) against a tuning.

#[allow(unused_imports)]
use super::*;

impl Tuning {
    /// Resolves a pitch as written against this tuning. Note names must land on a degree
    /// (within [`LANDING_TOLERANCE_CENTS`]) unless snapped with `~` or moved by an explicit
    /// cents offset; degrees must exist in the tuning.
    /// Every resolved pitch lies within [`crate::input::units::FREQUENCY_BOUNDS`].
    pub fn resolve(&self, spec: &PitchSpec) -> Result<ResolvedPitch> {
        let resolved = self.resolve_unbounded(spec)?;
        let bounds = crate::input::units::FREQUENCY_BOUNDS;
        if bounds.contains(resolved.hz) {
            Ok(resolved)
        } else {
            Err(Error::input(format!(
                "`{}` is at {} Hz, outside the range taut accepts for a pitch: {}",
                resolved.label,
                crate::input::units::short_number(resolved.hz),
                bounds.shown
            ))
            .help("no string sounds there; check the octave, the cents or the frequency"))
        }
    }

    fn resolve_unbounded(&self, spec: &PitchSpec) -> Result<ResolvedPitch> {
        let label = spec.to_string();
        match spec {
            PitchSpec::Degree { degree } => Ok(self.degree(*degree)?.resolved(label)),
            PitchSpec::PeriodStep { period, step } => {
                let n = self.degrees_per_period().ok_or_else(|| {
                    Error::input(format!(
                        "`{label}` names a period, but `{}` is a list of frequencies without periods",
                        self.name
                    ))
                    .help("name a degree instead, e.g. `deg3`")
                })? as i64;
                if !(0..n).contains(step) {
                    return Err(Error::input(format!(
                        "`{label}`: `{}` has {n} degrees per period, so the degree within a period runs 0 to {}",
                        self.name,
                        n - 1
                    )));
                }
                let k = i64::checked_mul(*period, n)
                    .and_then(|base| base.checked_add(*step))
                    .ok_or_else(|| Error::input(format!("`{label}` is out of range")))?;
                Ok(self.degree(k)?.resolved(label))
            }
            PitchSpec::Note {
                note,
                offset_cents,
                has_offset,
                snap,
            } => {
                let hz = note.hz(self.concert_a4_hz()) * ratio_from_cents(*offset_cents);
                let nearest = self.nearest_degree(hz).ok_or_else(|| {
                    Error::input(format!("`{label}` is out of this tuning's range"))
                })?;
                let distance = cents(hz / nearest.hz);
                if *snap || distance.abs() <= LANDING_TOLERANCE_CENTS {
                    return Ok(nearest.resolved(label));
                }
                if *has_offset {
                    return Ok(self.free_pitch(hz, None, label));
                }
                Err(Error::input(format!(
                    "`{label}` is not a degree of `{}`: the nearest degree, deg{}, is {:+.2} cents away",
                    self.name, nearest.degree, -distance
                ))
                .help(format!(
                    "write `~{label}` for the nearest degree, `deg{}` to name it, or add a cents offset (e.g. `{label}+0c`) for the exact 12-tone pitch",
                    nearest.degree
                )))
            }
            PitchSpec::Cents { cents: offset } => {
                let hz = self.reference.hz * ratio_from_cents(*offset);
                Ok(self.free_pitch(hz, None, label))
            }
            PitchSpec::Ratio { ratio } => {
                let hz = self.reference.hz * ratio_to_f64(ratio);
                Ok(self.free_pitch(hz, Some(*ratio), label))
            }
            PitchSpec::Hz { hz } => Ok(self.free_pitch(*hz, None, label)),
        }
        .and_then(|resolved: ResolvedPitch| {
            if resolved.hz.is_finite() && resolved.hz > 0.0 {
                Ok(resolved)
            } else {
                Err(Error::input(format!(
                    "`{}` is out of range: its frequency is not a finite number",
                    resolved.label
                )))
            }
        })
    }

    /// A pitch given by frequency; it records the degree it lands on, if any.
    fn free_pitch(&self, hz: f64, ratio: Option<ExactRatio>, label: String) -> ResolvedPitch {
        let cents_from_reference = match &ratio {
            Some(ratio) => cents_of_ratio(ratio),
            None => cents(hz / self.reference.hz),
        };
        let degree = self
            .nearest_degree(hz)
            .filter(|d| cents(hz / d.hz).abs() <= LANDING_TOLERANCE_CENTS)
            .map(|d| d.degree);
        ResolvedPitch {
            hz,
            cents_from_reference,
            degree,
            ratio,
            label,
        }
    }
}

impl DegreePitch {
    fn resolved(self, label: String) -> ResolvedPitch {
        ResolvedPitch {
            hz: self.hz,
            cents_from_reference: self.cents_from_reference,
            degree: Some(self.degree),
            ratio: self.ratio,
            label,
        }
    }
}
