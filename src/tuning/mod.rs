//! Tunings: equal divisions of any interval, just ratios, cents lists, fixed frequency lists and
//! generator chains, placed in absolute pitch by a reference.
//!
//! Formulas (REFERENCES §7.2): N equal divisions of a period P give degree k at
//! `f = f_ref · P^(k/N)`; a just ratio p/q gives `f = f_ref · p/q`; cents c give
//! `f = f_ref · 2^(c/1200)` (Ellis 1885). Degree k of a periodic tuning with N degrees per period
//! is step `k mod N` of period `⌊k/N⌋`: its interval above degree 0 is
//! `⌊k/N⌋ · P + step[k mod N]`.
//!
//! Exact ratios use checked 128-bit arithmetic: a ratio that would overflow becomes `None` and
//! the degree keeps its cents and frequency.
//!
//! [`load`] finds a tuning by, in this order: a shipped library name (see [`library`]), an
//! inline spec (see [`inline`]), or the path of a YAML file (see [`definition`]). Any of the
//! three may end in `@reference` (e.g. `31edo@A4=415`) to move it in pitch.

pub mod analysis;
pub mod compare;
pub mod course_pitch;
pub mod definition;
pub mod inline;
pub mod interval;
pub mod library;
pub mod listing;
pub mod pitch;
pub mod reference;
pub mod shape;

use num_rational::Ratio;
use num_traits::CheckedMul;
use serde::Serialize;

use crate::error::{did_you_mean, Error, Result};
use crate::tuning::pitch::{
    cents, cents_of_ratio, checked_ratio_pow, ratio_from_cents, ratio_to_f64,
    serialize_optional_ratio, ExactRatio, PitchSpec,
};
pub use interval::Interval;
pub use reference::{Reference, ReferenceSpec};

/// Most degrees per period (or entries in a list) a tuning may have. Real tunings stay far below;
/// the bound keeps a typo (`1000000edo`) from allocating gigabytes.
pub const MAX_DEGREES_PER_PERIOD: usize = 10_000;

/// A note name or other free pitch "lands" on a degree when it is this close, in cents.
pub const LANDING_TOLERANCE_CENTS: f64 = 0.01;

/// How a tuning's degrees are laid out.
#[derive(Debug, Clone, PartialEq)]
pub enum Layout {
    /// Degrees repeat every `period`; `steps` hold one period, starting with the unison.
    Periodic {
        /// The repeating interval.
        period: Interval,
        /// Intervals of degrees 0 … N−1 above degree 0, ascending, starting at the unison.
        steps: Vec<Interval>,
    },
    /// A fixed set of frequencies; degree k is entry k.
    Absolute {
        /// Frequencies in ascending order.
        hz: Vec<f64>,
    },
}

/// A tuning placed in absolute pitch.
#[derive(Debug, Clone, PartialEq)]
pub struct Tuning {
    name: String,
    description: String,
    source: Option<String>,
    layout: Layout,
    reference: Reference,
}

/// One degree of a tuning.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct DegreePitch {
    /// The degree (degree 0 starts period 0).
    pub degree: i64,
    /// The period the degree is in, for periodic tunings.
    pub period: Option<i64>,
    /// The degree's step within its period (0 … N−1), for periodic tunings.
    pub step: Option<usize>,
    /// Frequency in hertz.
    pub hz: f64,
    /// Cents above (negative: below) the reference pitch.
    pub cents_from_reference: f64,
    /// Exact ratio to the reference pitch, when there is one and it fits in 128 bits.
    #[serde(serialize_with = "serialize_optional_ratio")]
    pub ratio: Option<ExactRatio>,
}

/// A [`PitchSpec`] resolved against a tuning.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ResolvedPitch {
    /// Frequency in hertz.
    pub hz: f64,
    /// Cents above (negative: below) the reference pitch.
    pub cents_from_reference: f64,
    /// The degree the pitch lands on, if it lands on one.
    pub degree: Option<i64>,
    /// Exact ratio to the reference pitch, when known.
    #[serde(serialize_with = "serialize_optional_ratio")]
    pub ratio: Option<Ratio<i128>>,
    /// How to show the pitch, e.g. `E2` or `deg7`.
    pub label: String,
}

/// What a tuning is, as plain data for reports.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct TuningSummary {
    /// Name.
    pub name: String,
    /// One-line description.
    pub description: String,
    /// Where the system is published.
    pub source: Option<String>,
    /// Degrees per period (None for a fixed frequency list).
    pub degrees_per_period: Option<usize>,
    /// The period, for periodic tunings.
    pub period: Option<Interval>,
    /// The reference degree, frequency and concert A4.
    pub reference: Reference,
}

impl Tuning {
    /// Builds a tuning from a checked layout and reference.
    pub fn new(
        name: impl Into<String>,
        description: impl Into<String>,
        source: Option<String>,
        layout: Layout,
        reference: Reference,
    ) -> Result<Self> {
        let tuning = Tuning {
            name: name.into(),
            description: description.into(),
            source,
            layout,
            reference,
        };
        // The reference degree must exist, or no degree has a frequency.
        tuning.absolute_cents(reference.degree).ok_or_else(|| {
            Error::input(format!(
                "the reference degree {} is not a degree of this tuning",
                reference.degree
            ))
            .field("reference.degree")
        })?;
        Ok(tuning)
    }

    /// The tuning's name.
    pub fn name(&self) -> &str {
        &self.name
    }

    /// The tuning's one-line description.
    pub fn description(&self) -> &str {
        &self.description
    }

    /// Where the system is published, if stated.
    pub fn source(&self) -> Option<&str> {
        self.source.as_deref()
    }

    /// The layout of degrees.
    pub fn layout(&self) -> &Layout {
        &self.layout
    }

    /// The reference (degree, frequency, concert A4).
    pub fn reference(&self) -> Reference {
        self.reference
    }

    /// A copy placed at another reference.
    pub fn with_reference(mut self, reference: Reference) -> Result<Self> {
        if matches!(self.layout, Layout::Absolute { .. }) {
            return Err(Error::input(
                "a list of frequencies fixes its own pitch, so it takes no reference",
            )
            .field("reference"));
        }
        self.reference = reference;
        Tuning::new(
            self.name,
            self.description,
            self.source,
            self.layout,
            reference,
        )
    }

    /// Plain-data summary for reports.
    pub fn summary(&self) -> TuningSummary {
        TuningSummary {
            name: self.name.clone(),
            description: self.description.clone(),
            source: self.source.clone(),
            degrees_per_period: self.degrees_per_period(),
            period: match &self.layout {
                Layout::Periodic { period, .. } => Some(period.clone()),
                Layout::Absolute { .. } => None,
            },
            reference: self.reference,
        }
    }

    /// Concert A4 in hertz, which note names use.
    pub fn concert_a4_hz(&self) -> f64 {
        self.reference.concert_a4_hz
    }

    /// Degrees per period, or `None` for a fixed list of frequencies.
    pub fn degrees_per_period(&self) -> Option<usize> {
        match &self.layout {
            Layout::Periodic { steps, .. } => Some(steps.len()),
            Layout::Absolute { .. } => None,
        }
    }

    /// The range of degrees that exist, for a fixed frequency list.
    pub fn degree_bounds(&self) -> Option<(i64, i64)> {
        match &self.layout {
            Layout::Periodic { .. } => None,
            Layout::Absolute { hz } => Some((0, hz.len() as i64 - 1)),
        }
    }

    /// Cents of degree k above degree 0 and its exact ratio to degree 0, or `None` when k does
    /// not exist.
    fn absolute_cents(&self, k: i64) -> Option<(f64, Option<ExactRatio>)> {
        match &self.layout {
            Layout::Periodic { period, steps } => {
                let n = steps.len() as i64;
                let periods = k.div_euclid(n);
                let step = &steps[k.rem_euclid(n) as usize];
                let cents = periods as f64 * period.cents + step.cents;
                let ratio = match (&period.ratio, &step.ratio) {
                    (Some(period), Some(step)) => {
                        checked_ratio_pow(period, periods).and_then(|p| p.checked_mul(step))
                    }
                    _ => None,
                };
                Some((cents, ratio))
            }
            Layout::Absolute { hz } => {
                let index = usize::try_from(k).ok()?;
                let first = *hz.first()?;
                let value = *hz.get(index)?;
                let ratio = (index == 0).then(|| Ratio::from_integer(1));
                Some((cents(value / first), ratio))
            }
        }
    }

    /// Frequency, cents from the reference and exact ratio of degree k (negative too, in any
    /// period). Errors for a degree the tuning does not have (outside a frequency list) or whose
    /// frequency is out of floating-point range.
    pub fn degree(&self, k: i64) -> Result<DegreePitch> {
        let (absolute, ratio) = self.absolute_cents(k).ok_or_else(|| {
            let (low, high) = self.degree_bounds().unwrap_or((0, 0));
            Error::input(format!(
                "degree {k} is a pitch the tuning cannot address: `{}` has degrees {low} to {high} only",
                self.name
            ))
        })?;
        let (reference_cents, reference_ratio) = self
            .absolute_cents(self.reference.degree)
            .unwrap_or((0.0, None));
        let cents_from_reference = absolute - reference_cents;
        let ratio = match (ratio, reference_ratio) {
            (Some(ratio), Some(reference)) => {
                checked_ratio_pow(&reference, -1).and_then(|inverse| ratio.checked_mul(&inverse))
            }
            _ => None,
        };
        let hz = match (&self.layout, &ratio) {
            (Layout::Absolute { hz }, _) => hz[k as usize],
            (_, Some(ratio)) => self.reference.hz * ratio_to_f64(ratio),
            _ => self.reference.hz * ratio_from_cents(cents_from_reference),
        };
        if !hz.is_finite() || hz <= 0.0 {
            return Err(Error::input(format!(
                "degree {k} of `{}` is too far from the reference to have a frequency",
                self.name
            )));
        }
        let (period, step) = match &self.layout {
            Layout::Periodic { steps, .. } => {
                let n = steps.len() as i64;
                (Some(k.div_euclid(n)), Some(k.rem_euclid(n) as usize))
            }
            Layout::Absolute { .. } => (None, None),
        };
        Ok(DegreePitch {
            degree: k,
            period,
            step,
            hz,
            cents_from_reference,
            ratio,
        })
    }

    /// The degree nearest in pitch (in cents) to a frequency; `None` for a frequency that is not
    /// positive and finite or whose nearest degree is out of range.
    pub fn nearest_degree(&self, hz: f64) -> Option<DegreePitch> {
        if !hz.is_finite() || hz <= 0.0 {
            return None;
        }
        let (reference_cents, _) = self.absolute_cents(self.reference.degree)?;
        let target = cents(hz / self.reference.hz) + reference_cents;
        let k = self.nearest_by_absolute_cents(target)?;
        self.degree(k).ok()
    }

    /// The degree whose interval above degree 0 is nearest to `target` cents.
    fn nearest_by_absolute_cents(&self, target: f64) -> Option<i64> {
        if !target.is_finite() {
            return None;
        }
        let candidates: Vec<i64> = match &self.layout {
            Layout::Periodic { period, steps } => {
                let periods = (target / period.cents).floor();
                // Beyond 2^53 periods, degrees no longer have distinct float positions.
                if periods.abs() > 9.0e15 / steps.len() as f64 {
                    return None;
                }
                let periods = periods as i64;
                let within = target - periods as f64 * period.cents;
                let index = steps.partition_point(|s| s.cents < within) as i64;
                let base = periods * steps.len() as i64;
                vec![base + index - 1, base + index, base - 1, base]
            }
            Layout::Absolute { hz } => {
                let first = *hz.first()?;
                let index = hz.partition_point(|&f| cents(f / first) < target) as i64;
                vec![index - 1, index]
            }
        };
        candidates
            .into_iter()
            .filter_map(|k| self.absolute_cents(k).map(|(c, _)| (k, (c - target).abs())))
            .min_by(|a, b| a.1.total_cmp(&b.1).then(a.0.cmp(&b.0)))
            .map(|(k, _)| k)
    }

    /// The degree (as a [`DegreePitch`]) whose interval above degree 0 is nearest to `target`
    /// cents above degree 0. Used by the analysis, which measures intervals between degrees.
    pub fn nearest_to_cents_above_degree_zero(&self, target: f64) -> Option<DegreePitch> {
        self.nearest_by_absolute_cents(target)
            .and_then(|k| self.degree(k).ok())
    }

    /// Cents of degree k above degree 0 (not above the reference), when k exists.
    pub fn cents_above_degree_zero(&self, k: i64) -> Option<f64> {
        self.absolute_cents(k).map(|(c, _)| c)
    }

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

/// Loads a tuning by shipped name, inline spec or YAML file path (in that order), each
/// optionally followed by `@reference`.
pub fn load(spec: &str) -> Result<Tuning> {
    let spec = spec.trim();
    let (body, reference) = match spec.rsplit_once('@') {
        Some((body, reference)) if !std::path::Path::new(spec).exists() => {
            (body.trim(), Some(reference))
        }
        _ => (spec, None),
    };
    let tuning = load_body(body)?;
    match reference {
        Some(text) => {
            let reference = ReferenceSpec::parse(text)
                .and_then(|r| r.resolve())
                .map_err(|e| e.in_origin(format!("tuning `{spec}`")))?;
            tuning
                .with_reference(reference)
                .map_err(|e| e.in_origin(format!("tuning `{spec}`")))
        }
        None => Ok(tuning),
    }
}

fn load_body(body: &str) -> Result<Tuning> {
    if body.is_empty() {
        return Err(Error::input("the tuning is empty").help(inline::INLINE_SYNTAX_HELP));
    }
    if let Some(tuning) = library::load(body) {
        return tuning;
    }
    if inline::looks_inline(body) {
        return inline::parse(body);
    }
    let path = std::path::Path::new(body);
    if body == "-" || path.exists() || body.ends_with(".yaml") || body.ends_with(".yml") {
        return definition::load_file(path);
    }
    let mut error = Error::input(format!(
        "`{body}` is not a shipped tuning, an inline tuning or a file"
    ));
    error = match did_you_mean(body, library::names()) {
        Some(name) => error.help(format!("did you mean `{name}`?")),
        None => error.help(format!(
            "shipped tunings: {}; {}",
            library::names().collect::<Vec<_>>().join(", "),
            inline::INLINE_SYNTAX_HELP
        )),
    };
    Err(error)
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_abs_diff_eq;

    fn twelve() -> Tuning {
        load("12edo").unwrap()
    }

    #[test]
    fn twelve_edo_places_e2_and_e4_by_iso_16() {
        // ISO 16:1975 (A4 = 440 Hz) and f = 440 · 2^((m − 69)/12), REFERENCES §7.2:
        // E2 = 82.4069 Hz, E4 = 329.6276 Hz (DERIVED).
        let tuning = twelve();
        let e2 = tuning.resolve(&"E2".parse().unwrap()).unwrap();
        assert_eq!(e2.degree, Some(-29));
        assert_abs_diff_eq!(e2.hz, 82.4069, epsilon = 5e-5);
        let e4 = tuning.resolve(&"E4".parse().unwrap()).unwrap();
        assert_abs_diff_eq!(e4.hz, 329.6276, epsilon = 5e-5);
        assert_eq!(
            tuning.degree(12).unwrap().ratio,
            Some(Ratio::from_integer(2))
        );
    }

    #[test]
    fn note_names_must_land_unless_snapped_or_offset() {
        let tuning = load("19edo").unwrap();
        let err = tuning
            .resolve(&"E2".parse().unwrap())
            .unwrap_err()
            .to_string();
        assert!(err.contains("~E2"), "{err}");
        let snapped = tuning.resolve(&"~E2".parse().unwrap()).unwrap();
        assert!(snapped.degree.is_some());
        let free = tuning.resolve(&"E2+0c".parse().unwrap()).unwrap();
        assert_eq!(free.degree, None);
        assert_abs_diff_eq!(free.hz, 82.4069, epsilon = 5e-5);
        // A4 is degree 0 of 19-EDO at the default reference, so it lands.
        assert_eq!(
            tuning.resolve(&"A4".parse().unwrap()).unwrap().degree,
            Some(0)
        );
    }

    #[test]
    fn period_steps_and_free_pitches_resolve() {
        let tuning = twelve();
        let p = tuning.resolve(&"deg3p-1".parse().unwrap()).unwrap();
        assert_eq!(p.degree, Some(-9));
        let fifth = tuning.resolve(&"3/2".parse().unwrap()).unwrap();
        assert_eq!(fifth.ratio, Some(Ratio::new(3, 2)));
        assert_eq!(fifth.degree, None);
        assert_abs_diff_eq!(fifth.hz, 660.0, epsilon = 1e-9);
        let octave = tuning.resolve(&"1200c".parse().unwrap()).unwrap();
        assert_eq!(octave.degree, Some(12));
        assert!(tuning.resolve(&"deg12p0".parse().unwrap()).is_err());
    }

    #[test]
    fn nearest_degree_handles_both_layouts_and_bad_input() {
        let tuning = twelve();
        assert_eq!(tuning.nearest_degree(445.0).unwrap().degree, 0);
        assert_eq!(tuning.nearest_degree(430.0).unwrap().degree, 0);
        assert_eq!(tuning.nearest_degree(415.0).unwrap().degree, -1);
        assert!(tuning.nearest_degree(0.0).is_none());
        assert!(tuning.nearest_degree(f64::NAN).is_none());
        let list = load("hertz:100,200,300").unwrap();
        assert_eq!(list.nearest_degree(260.0).unwrap().degree, 2);
        assert_eq!(list.nearest_degree(10.0).unwrap().degree, 0);
        assert!(list.degree(3).is_err());
        assert!(list.degree(-1).is_err());
        assert_eq!(list.degrees_per_period(), None);
    }

    #[test]
    fn huge_degrees_do_not_panic() {
        let tuning = twelve();
        for k in [i64::MAX, i64::MIN, 1 << 40] {
            assert!(tuning.degree(k).is_err(), "{k}");
        }
        let just = load("ratios:1/1,9/8,5/4:2/1").unwrap();
        // Degree 378 is 2^126 (fits in i128); degree 381 is 2^127, which does not: the ratio is
        // gone but the frequency stays. Degree 3100 is 2^1033 · 440 Hz, beyond f64.
        assert_eq!(
            just.degree(378).unwrap().ratio,
            Some(Ratio::from_integer(1i128 << 126))
        );
        let high = just.degree(381).unwrap();
        assert_eq!(high.ratio, None);
        assert!(high.hz.is_finite());
        assert!(just.degree(3100).is_err());
    }
}
