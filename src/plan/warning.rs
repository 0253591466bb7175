//! Warnings a plan can raise: each has a kind, a severity, the course (and string) it concerns,
//! the figure that set it off with its limit, and a plain sentence.
//!
//! The wording lives here, in one place, so every renderer says the same thing.

use crate::input::units::fixed;
use serde::{Deserialize, Serialize};

// The stress limits and the tension tolerance are the selector's (`crate::strings::select`), where their
// sources are given: caution above 65 %, danger above 85 % of breaking strength, ±10 % tolerance.

/// How far a string's tension may fall from its target (as a fraction of the target) before a
/// miss is a caution rather than a note: 30 %. Our own rule of thumb, not a published figure,
/// and the same as the audit's largest accepted change: tension goes with the square of the
/// pitch, so 30 % short feels like the string tuned down three semitones. Such a string buzzes,
/// flaps against the frets or its neighbours and will not hold its pitch; 30 % over loads the
/// instrument well beyond what was planned.
pub const FAR_FROM_TARGET: f64 = 0.30;

/// The sentence a window warning ends with when the heaviest gauge of the kind is already used
/// (the fix then cannot be "a heavier gauge").
pub const NONE_HEAVY_ENOUGH: &str =
    "No catalog string of this kind is heavy enough to reach the window.";

/// The sentence a window warning ends with when the lightest gauge of the kind is already used.
pub const NONE_LIGHT_ENOUGH: &str =
    "No catalog string of this kind is light enough to stay inside the window.";

/// What a warning is about. Serialized in snake_case (`stress_danger`).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum WarningKind {
    /// Stress above the caution fraction of breaking strength.
    StressCaution,
    /// Stress above the danger fraction of breaking strength.
    StressDanger,
    /// The tension asks for a string lighter than the thinnest practical one.
    ThinnerThanPractical,
    /// The tension asks for a string heavier than the heaviest in the catalog.
    ThickerThanCatalog,
    /// The chosen string is wider than the slot, hole or tuner takes.
    WiderThanSlot,
    /// Tension below the stated window: floppy, buzzing.
    TensionBelowWindow,
    /// Tension above the stated window.
    TensionAboveWindow,
    /// No catalog string lands within the tolerance of the target tension.
    OffTarget,
    /// The instrument's total tension exceeds its rated load.
    OverRatedLoad,
    /// A plain monofilament thicker than its material's thickest plain string in common
    /// practice: it sounds dull, and makers change to a wound string before it.
    ThickMonofilament,
}

impl WarningKind {
    /// Every kind, for documentation and tests.
    pub const ALL: [WarningKind; 10] = [
        WarningKind::StressCaution,
        WarningKind::StressDanger,
        WarningKind::ThinnerThanPractical,
        WarningKind::ThickerThanCatalog,
        WarningKind::WiderThanSlot,
        WarningKind::TensionBelowWindow,
        WarningKind::TensionAboveWindow,
        WarningKind::OffTarget,
        WarningKind::OverRatedLoad,
        WarningKind::ThickMonofilament,
    ];

    /// The name used in JSON, CSV and tables.
    pub fn name(self) -> &'static str {
        match self {
            WarningKind::StressCaution => "stress_caution",
            WarningKind::StressDanger => "stress_danger",
            WarningKind::ThinnerThanPractical => "thinner_than_practical",
            WarningKind::ThickerThanCatalog => "thicker_than_catalog",
            WarningKind::WiderThanSlot => "wider_than_slot",
            WarningKind::TensionBelowWindow => "tension_below_window",
            WarningKind::TensionAboveWindow => "tension_above_window",
            WarningKind::OffTarget => "off_target",
            WarningKind::OverRatedLoad => "over_rated_load",
            WarningKind::ThickMonofilament => "thick_monofilament",
        }
    }

    /// How serious this kind is at least. `thicker_than_catalog` and `off_target` rise to a
    /// caution when the tension misses its target by more than [`FAR_FROM_TARGET`].
    pub fn severity(self) -> Severity {
        match self {
            WarningKind::StressDanger | WarningKind::OverRatedLoad => Severity::Danger,
            WarningKind::StressCaution
            | WarningKind::ThinnerThanPractical
            | WarningKind::WiderThanSlot
            | WarningKind::TensionBelowWindow
            | WarningKind::TensionAboveWindow => Severity::Caution,
            WarningKind::ThickerThanCatalog
            | WarningKind::OffTarget
            | WarningKind::ThickMonofilament => Severity::Note,
        }
    }
}

/// How serious a warning is.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum Severity {
    /// Worth knowing; nothing breaks.
    Note,
    /// Risky: check before stringing.
    Caution,
    /// Likely to break a string or damage the instrument.
    Danger,
}

/// One warning in a plan.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Warning {
    /// What it is about.
    pub kind: WarningKind,
    /// How serious it is.
    pub severity: Severity,
    /// The course number, or `None` for the whole instrument.
    pub course: Option<u32>,
    /// The string within the course, from 1, when it concerns one string.
    pub string: Option<usize>,
    /// The figure that set it off (unit given by the kind: a fraction for stress, newtons for
    /// tension and load, metres for diameters, a relative distance for `off_target`).
    pub value: f64,
    /// The limit it was measured against, in the same unit.
    pub limit: f64,
    /// A plain sentence with the figure.
    pub message: String,
}

/// Where a string-level warning points.
#[derive(Debug, Clone, Copy)]
pub struct StringRef {
    /// Course number.
    pub course: u32,
    /// String within the course, from 1.
    pub string: usize,
}

impl StringRef {
    fn named(self) -> String {
        format!("Course {} string {}", self.course, self.string)
    }

    fn warning(self, kind: WarningKind, value: f64, limit: f64, message: String) -> Warning {
        self.warning_at(kind, kind.severity(), value, limit, message)
    }

    fn warning_at(
        self,
        kind: WarningKind,
        severity: Severity,
        value: f64,
        limit: f64,
        message: String,
    ) -> Warning {
        Warning {
            kind,
            severity,
            course: Some(self.course),
            string: Some(self.string),
            value,
            limit,
            message,
        }
    }

    /// Stress above the danger or caution fraction; `break_pitch_hz` is where it would break.
    pub fn stress(
        self,
        kind: WarningKind,
        stress_ratio: f64,
        limit: f64,
        break_pitch_hz: f64,
        pitch_hz: f64,
    ) -> Warning {
        let semitones = 12.0 * (break_pitch_hz / pitch_hz).log2();
        let message = if stress_ratio >= 1.0 {
            format!(
                "{} can never reach its pitch: it would need {} of its breaking strength (limit {:.0}%) and breaks near {:.1} Hz, {:.1} semitones below it.",
                self.named(),
                percent_beside(stress_ratio, [limit]),
                limit * 100.0,
                break_pitch_hz,
                -semitones
            )
        } else {
            format!(
                "{} runs at {} of its breaking strength (limit {:.0}%); it would break near {:.1} Hz, {:.1} semitones above its pitch.",
                self.named(),
                percent_beside(stress_ratio, [limit]),
                limit * 100.0,
                break_pitch_hz,
                semitones
            )
        };
        self.warning(kind, stress_ratio, limit, message)
    }

    /// A stress caution or danger where the tension is given and the length solved (`taut
    /// lengths`): the stress T/A holds no length, so it is the tension the string cannot take,
    /// not the pitch it cannot reach.
    pub fn stress_at_tension(
        self,
        kind: WarningKind,
        stress_ratio: f64,
        limit: f64,
        tension_n: f64,
    ) -> Warning {
        let message = if stress_ratio >= 1.0 {
            format!(
                "{} cannot hold {:.1} N on any length: that is {} of its breaking strength (limit {:.0}%).",
                self.named(),
                tension_n,
                percent_beside(stress_ratio, [limit]),
                limit * 100.0,
            )
        } else {
            format!(
                "{} runs at {} of its breaking strength at {:.1} N, on any length (limit {:.0}%).",
                self.named(),
                percent_beside(stress_ratio, [limit]),
                tension_n,
                limit * 100.0,
            )
        };
        self.warning(kind, stress_ratio, limit, message)
    }

    /// The target asks for a lighter string than the thinnest available: the target cannot be
    /// reached with this kind. At a fixed pitch and length tension goes with μ (REFERENCES §1.2),
    /// so the thinnest pulls `lightest / required` times the target.
    pub fn thinner_than_practical(self, required_unit_mass: f64, lightest: f64) -> Warning {
        let message = format!(
            "{} cannot come down to its target tension with this kind: it would need {:.3} g/m, lighter than the thinnest practical string ({:.3} g/m), which is used and pulls {:.0}% more than the target.",
            self.named(),
            required_unit_mass * 1000.0,
            lightest * 1000.0,
            (lightest / required_unit_mass - 1.0) * 100.0
        );
        self.warning(
            WarningKind::ThinnerThanPractical,
            required_unit_mass,
            lightest,
            message,
        )
    }

    /// The target asks for a heavier string than the catalog holds: the target cannot be reached
    /// with this kind. A caution when the heaviest falls more than [`FAR_FROM_TARGET`] short
    /// (tension goes with μ at a fixed pitch and length, REFERENCES §1.2).
    pub fn thicker_than_catalog(self, required_unit_mass: f64, heaviest: f64) -> Warning {
        let shortfall = 1.0 - heaviest / required_unit_mass;
        let far = shortfall > FAR_FROM_TARGET;
        let message = format!(
            "{} cannot reach its target tension with this kind: it would need {:.3} g/m, heavier than any catalog string ({:.3} g/m); the heaviest is used and pulls {:.0}% less than the target{}",
            self.named(),
            required_unit_mass * 1000.0,
            heaviest * 1000.0,
            shortfall * 100.0,
            if far { SLACK } else { "." }
        );
        self.warning_at(
            WarningKind::ThickerThanCatalog,
            if far {
                Severity::Caution
            } else {
                Severity::Note
            },
            required_unit_mass,
            heaviest,
            message,
        )
    }

    /// A plain monofilament thicker than its material's `thickest_plain` (common practice).
    pub fn thick_monofilament(self, diameter_m: f64, thickest_m: f64, material: &str) -> Warning {
        let message = format!(
            "{} is a {:.2} mm plain {} string, thicker than plain strings of it usually run (about {:.2} mm at most): so thick a monofilament sounds dull, and makers change to a wound string before this point.",
            self.named(),
            diameter_m * 1000.0,
            material,
            thickest_m * 1000.0
        );
        self.warning(
            WarningKind::ThickMonofilament,
            diameter_m,
            thickest_m,
            message,
        )
    }

    /// The chosen string does not fit its slot.
    pub fn wider_than_slot(self, diameter_m: f64, slot_m: f64) -> Warning {
        let message = format!(
            "{} is {:.3} mm ({:.4} in) across, wider than the {:.3} mm its slot or hole takes.",
            self.named(),
            diameter_m * 1000.0,
            diameter_m / crate::input::units::METRES_PER_INCH,
            slot_m * 1000.0
        );
        self.warning(WarningKind::WiderThanSlot, diameter_m, slot_m, message)
    }

    /// Tension outside the stated window for a string chosen from a catalog: the same warning,
    /// and when no gauge of the kind could bring it inside (it is already the heaviest of its
    /// catalog and still below, or the thinnest and still above), a sentence saying that the
    /// window is out of reach.
    pub fn outside_window_of_catalog(
        self,
        tension_n: f64,
        min_n: Option<f64>,
        max_n: Option<f64>,
        heaviest: bool,
        thinnest: bool,
    ) -> Option<Warning> {
        let mut warning = self.outside_window(tension_n, min_n, max_n)?;
        let below = warning.kind == WarningKind::TensionBelowWindow;
        if below && heaviest {
            warning.message.push(' ');
            warning.message.push_str(NONE_HEAVY_ENOUGH);
        } else if !below && thinnest {
            warning.message.push(' ');
            warning.message.push_str(NONE_LIGHT_ENOUGH);
        }
        Some(warning)
    }

    /// Tension outside the stated window.
    pub fn outside_window(
        self,
        tension_n: f64,
        min_n: Option<f64>,
        max_n: Option<f64>,
    ) -> Option<Warning> {
        if let Some(min) = min_n.filter(|&min| tension_n < min) {
            let message = format!(
                "{} carries {:.1} N, below the window's {:.1} N: it will feel slack, may buzz and may not hold its pitch.",
                self.named(),
                tension_n,
                min
            );
            return Some(self.warning(WarningKind::TensionBelowWindow, tension_n, min, message));
        }
        if let Some(max) = max_n.filter(|&max| tension_n > max) {
            let message = format!(
                "{} carries {:.1} N, above the window's {:.1} N.",
                self.named(),
                tension_n,
                max
            );
            return Some(self.warning(WarningKind::TensionAboveWindow, tension_n, max, message));
        }
        None
    }

    /// No catalog string near the target. A caution when the closest misses by more than
    /// [`FAR_FROM_TARGET`].
    pub fn off_target(self, tension_n: f64, target_n: f64, tolerance: f64) -> Warning {
        let change = tension_n / target_n - 1.0;
        let distance = change.abs();
        let far = distance > FAR_FROM_TARGET;
        let consequence = match (far, change < 0.0) {
            (false, _) => ".",
            (true, true) => SLACK,
            (true, false) => {
                ": it loads the instrument far more than planned and feels much stiffer."
            }
        };
        let message = format!(
            "{}: the closest catalog string gives {:.1} N against a target of {:.1} N ({:+.0}%, tolerance {:.0}%){}",
            self.named(),
            tension_n,
            target_n,
            change * 100.0,
            tolerance * 100.0,
            consequence
        );
        let severity = if far {
            Severity::Caution
        } else {
            Severity::Note
        };
        self.warning_at(
            WarningKind::OffTarget,
            severity,
            distance,
            tolerance,
            message,
        )
    }
}

/// What a string far below its target does, ending a warning's sentence.
const SLACK: &str = ": it will be slack, buzz or flap, and will not hold its pitch.";
/// A fraction as a percentage beside limits it is compared with: whole per cent, or one or two
/// decimals when the whole number would read as a limit the value is above. A limit is
/// inclusive (a value at it does not fire), so `65%` beside a 65 % limit would misread.
pub fn percent_beside<const N: usize>(fraction: f64, limits: [f64; N]) -> String {
    // Through `fixed`, not `format!`: every row of a table shows one, and the general float
    // formatter was a visible share of writing a large plan.
    for decimals in 0..3 {
        let mut shown = fixed(fraction * 100.0, decimals);
        let misreads = limits
            .iter()
            .any(|&limit| fraction > limit && shown == fixed(limit * 100.0, decimals));
        if !misreads {
            shown.push('%');
            return shown;
        }
    }
    let mut shown = fixed(fraction * 100.0, 3);
    shown.push('%');
    shown
}

/// A report's warnings: every course's, in course order, then the instrument's own when the
/// total tension exceeds its rated load. Plans, audits and conversions all list them this way.
pub fn with_load_check<'a>(
    course_warnings: impl IntoIterator<Item = &'a Warning>,
    total_n: f64,
    rated_n: Option<f64>,
) -> Vec<Warning> {
    let mut warnings: Vec<Warning> = course_warnings.into_iter().cloned().collect();
    if let Some(rated) = rated_n.filter(|&rated| total_n > rated) {
        warnings.push(over_rated_load(total_n, rated));
    }
    warnings
}

/// The instrument's total tension against its rated load.
pub fn over_rated_load(total_n: f64, rated_n: f64) -> Warning {
    Warning {
        kind: WarningKind::OverRatedLoad,
        severity: WarningKind::OverRatedLoad.severity(),
        course: None,
        string: None,
        value: total_n,
        limit: rated_n,
        message: format!(
            "The strings pull {:.0} N in total, {:.0}% of the {:.0} N the instrument is rated for.",
            total_n,
            total_n / rated_n * 100.0,
            rated_n
        ),
    }
}

/// The cautions shown with any danger or caution, deferring to the maker.
pub const SAFETY_CAUTIONS: [&str; 4] = [
    "Strings can snap and whip: wear eye protection while tuning up, and keep faces away from the strings.",
    "Bring tension up gradually, over several passes across all courses, and listen for creaks.",
    "Respect the maker's load rating for the neck, bridge and soundboard; more tension than it was built for can pull a bridge or bow a neck.",
    "These figures are estimates from published material data: defer to the instrument maker's specifications and to local practice.",
];

/// The one-line reminder shown under every string report that raised no caution: even a
/// plan inside every limit is strung by hand on a real instrument.
pub const SAFETY_REMINDER: &str = "Strings can break: wear eye protection, bring tension up gradually, and keep within the maker's load rating; the maker's specifications come first.";

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_stress_percentage_reads_as_the_general_formatter_would_write_it() {
        // The reference: the same rule written with `format!`, as it was before `fixed`.
        fn by_format<const N: usize>(fraction: f64, limits: [f64; N]) -> String {
            for decimals in 0..3 {
                let shown = format!("{:.decimals$}", fraction * 100.0);
                let misreads = limits.iter().any(|&limit| {
                    fraction > limit && shown == format!("{:.decimals$}", limit * 100.0)
                });
                if !misreads {
                    return format!("{shown}%");
                }
            }
            format!("{:.3}%", fraction * 100.0)
        }
        for limits in [[0.65, 0.85], [0.5, 0.7], [0.333, 0.999]] {
            // Every step of a tenth of a per mille from 0 to 150 %, and around each limit.
            let sweep = (0..15_000).map(|step| f64::from(step) / 10_000.0);
            let near_limits = limits
                .iter()
                .flat_map(|&limit| (-50..50).map(move |step| limit + f64::from(step) * 1e-6));
            for fraction in sweep.chain(near_limits) {
                assert_eq!(
                    percent_beside(fraction, limits),
                    by_format(fraction, limits),
                    "{fraction} beside {limits:?}"
                );
            }
        }
    }

    #[test]
    fn names_match_serde() {
        for kind in WarningKind::ALL {
            let json = serde_json::to_string(&kind).unwrap();
            assert_eq!(json, format!("\"{}\"", kind.name()));
        }
    }

    #[test]
    fn window_fires_only_outside() {
        let at = StringRef {
            course: 3,
            string: 1,
        };
        assert!(at.outside_window(70.0, Some(60.0), Some(90.0)).is_none());
        let low = at.outside_window(50.0, Some(60.0), None).unwrap();
        assert_eq!(low.kind, WarningKind::TensionBelowWindow);
        assert!(low.message.contains("50.0 N"), "{}", low.message);
        let high = at.outside_window(95.0, None, Some(90.0)).unwrap();
        assert_eq!(high.kind, WarningKind::TensionAboveWindow);
    }
}
