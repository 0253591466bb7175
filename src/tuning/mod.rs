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
mod resolve;
pub mod shape;
pub mod transpose;

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

#[cfg(test)]
mod tests;

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

    /// The same tuning with another one-line description.
    pub fn described(mut self, description: impl Into<String>) -> Self {
        self.description = description.into();
        self
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

    /// Cents of degree k above degree 0, or `None` when k does not exist: the figure of
    /// [`Tuning::absolute_cents`] without its exact ratio, whose powers cost far more than the
    /// cents (nearest-degree searches compare cents only).
    fn absolute_cents_only(&self, k: i64) -> Option<f64> {
        match &self.layout {
            Layout::Periodic { period, steps } => {
                let n = steps.len() as i64;
                let step = &steps[k.rem_euclid(n) as usize];
                Some(k.div_euclid(n) as f64 * period.cents + step.cents)
            }
            Layout::Absolute { hz } => {
                let index = usize::try_from(k).ok()?;
                let first = *hz.first()?;
                Some(cents(*hz.get(index)? / first))
            }
        }
    }

    /// Cents of degree k above degree 0 and its exact ratio to degree 0, or `None` when k does
    /// not exist.
    fn absolute_cents(&self, k: i64) -> Option<(f64, Option<ExactRatio>)> {
        let cents = self.absolute_cents_only(k)?;
        let ratio = match &self.layout {
            Layout::Periodic { period, steps } => {
                let n = steps.len() as i64;
                match (&period.ratio, &steps[k.rem_euclid(n) as usize].ratio) {
                    (Some(period), Some(step)) => {
                        checked_ratio_pow(period, k.div_euclid(n)).and_then(|p| p.checked_mul(step))
                    }
                    _ => None,
                }
            }
            Layout::Absolute { .. } => (k == 0).then(|| Ratio::from_integer(1)),
        };
        Some((cents, ratio))
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
        let reference_cents = self.absolute_cents_only(self.reference.degree)?;
        let target = cents(hz / self.reference.hz) + reference_cents;
        let k = self.nearest_by_absolute_cents(target)?;
        self.degree(k).ok()
    }

    /// The degree whose interval above degree 0 is nearest to `target` cents.
    fn nearest_by_absolute_cents(&self, target: f64) -> Option<i64> {
        if !target.is_finite() {
            return None;
        }
        // Two or four degrees around the target; `None` marks an unused place.
        let candidates: [Option<i64>; 4] = match &self.layout {
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
                [base + index - 1, base + index, base - 1, base].map(Some)
            }
            Layout::Absolute { hz } => {
                let first = *hz.first()?;
                let index = hz.partition_point(|&f| cents(f / first) < target) as i64;
                [Some(index - 1), Some(index), None, None]
            }
        };
        candidates
            .into_iter()
            .flatten()
            .filter_map(|k| self.absolute_cents_only(k).map(|c| (k, (c - target).abs())))
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
        self.absolute_cents_only(k)
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
    let path = std::path::Path::new(body);
    // An inline spec that does not parse gets the shipped name or `Nedo` nearest to it.
    let parse_inline = |spec: &str| {
        inline::parse(spec).map_err(|err| match inline::suggestion(spec) {
            Some(meant) if !meant.eq_ignore_ascii_case(spec) => err.help(format!(
                "did you mean `{meant}`? ({})",
                inline::INLINE_SYNTAX_HELP
            )),
            _ => err,
        })
    };
    if !path.exists() {
        if let Some((inline, note)) = inline::read_spelling(body) {
            // The spelling read, looked up as if written so (a shipped `19edo` first).
            let tuning = load_body(&inline)?;
            let description = format!("{} ({note})", tuning.description());
            return Ok(tuning.described(description));
        }
    }
    if inline::looks_inline(body) {
        return parse_inline(body);
    }
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
