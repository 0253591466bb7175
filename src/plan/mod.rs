//! The result of planning an instrument: plain data that the table, JSON, CSV and YAML renderers
//! read. Every quantity is SI and says its unit in its field name.
//!
//! The JSON layout is documented in `taut help formats` (src/cli/topics/formats.txt); field
//! names are a stable interface for scripts.

mod flags;
pub mod raises;
pub mod remedy;
pub mod several;
pub mod solve;
pub mod warning;

use std::sync::Arc;

use serde::{Deserialize, Serialize};

use crate::plan::warning::{Severity, Warning};
pub use crate::tuning::course_pitch::CoursePitch;
pub use flags::StringFlags;

/// A solved instrument.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Plan {
    /// The instrument's name.
    pub instrument: String,
    /// The tuning's name.
    pub tuning: String,
    /// The tuning as it was given (`just-5-limit@E2`, `31edo@A4=415`, a file's path), so that
    /// the export reads back in the same tuning; absent where the plan was solved from a tuning
    /// alone. The name above drops the reference, which a ratio or degree pitch depends on.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub tuning_spec: Option<String>,
    /// One entry per course, in the order the instrument lists them.
    pub courses: Vec<CoursePlan>,
    /// Sum of the tensions of every string, in newtons.
    pub total_tension_n: f64,
    /// The maker's rated total load, in newtons, when the instrument states one.
    pub rated_load_n: Option<f64>,
    /// Stress fraction above which a caution fires.
    pub caution_stress_ratio: f64,
    /// Stress fraction above which a danger fires.
    pub danger_stress_ratio: f64,
    /// Every warning of the plan: those of each course (repeated from the course) and those of
    /// the whole instrument (with `course` null), in course order.
    pub warnings: Vec<Warning>,
    /// The total tension with every lever and pedal at its heaviest setting, N (present when a
    /// course has raises).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub worst_setting_total_n: Option<f64>,
    /// The keys the levers and pedals reach (present when a course has raises).
    #[serde(default, skip_serializing_if = "Vec::is_empty")]
    pub reachable_keys: Vec<String>,
}

/// One course of the plan.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct CoursePlan {
    /// The course number.
    pub course: u32,
    /// The course's pitch, written and resolved (flattened: `pitch`, `pitch_label`,
    /// `note_name`, `note_offset_cents`, `pitch_hz`).
    #[serde(flatten)]
    pub pitch: CoursePitch,
    /// Vibrating length in metres.
    pub length_m: f64,
    /// The strings of the course, in the order the file lists them.
    pub strings: Vec<StringPlan>,
    /// Warnings about this course.
    pub warnings: Vec<Warning>,
    /// The positions of the course's lever or pedal, lowest written first (absent without one).
    #[serde(default, skip_serializing_if = "Vec::is_empty")]
    pub positions: Vec<raises::PositionPlan>,
}

/// One planned string.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct StringPlan {
    /// Interval from the course pitch, as written (`unison`, `octave`, `3/2`, …).
    pub interval: String,
    /// This string's frequency in hertz.
    pub pitch_hz: f64,
    /// The tension aimed for, in newtons.
    pub target_tension_n: f64,
    /// The exact linear density the target asks for, before the catalog rounds it, in kg/m.
    pub required_unit_mass_kg_per_m: f64,
    /// The chosen string. Its figures are flattened into this object.
    #[serde(flatten)]
    pub choice: StringChoice,
    /// Nearby choices.
    pub alternatives: Alternatives,
    /// Stiffness and feel of the chosen string (partial offsets, bend force), with the default
    /// afterlengths of [`crate::strings::feel::FeelOptions`].
    #[serde(default)]
    pub feel: Option<crate::strings::feel::Feel>,
    /// The string as the instrument file fixed it (`string:`), so a saved set writes it back
    /// as written; `None` for a chosen string.
    #[serde(skip)]
    pub fixed: Option<crate::instrument::entry::SetString>,
}

/// A catalog string at this string's pitch and length: what it is and how it behaves there.
/// Its words (kind, construction, material, gauge) are shared with every other string of the
/// plan that repeats them, so describing a string copies pointers instead of allocating.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct StringChoice {
    /// Id of the string kind (construction, materials and catalog).
    pub kind: Arc<str>,
    /// `plain` or `wound` (or the kind's own construction name).
    pub construction: Arc<str>,
    /// Material in words, e.g. `carbon steel` or `phosphor bronze on steel`.
    pub material: Arc<str>,
    /// The catalog's name for this gauge, e.g. `0.010 in` or `0.80 mm`.
    pub gauge: Arc<str>,
    /// Outer diameter in millimetres.
    pub diameter_mm: f64,
    /// Outer diameter in inches.
    pub diameter_in: f64,
    /// Linear density in kg/m.
    pub unit_mass_kg_per_m: f64,
    /// The tension at this pitch and length, in newtons.
    pub tension_n: f64,
    /// Stress in the load-bearing cross-section over breaking strength.
    pub stress_ratio: f64,
    /// The pitch at which this string, at this length, would break, in hertz.
    pub break_pitch_hz: f64,
    /// Fletcher's inharmonicity coefficient B, when the kind gives a modulus.
    pub inharmonicity: Option<f64>,
    /// How this string stands against the choice rule: why it was (or was not) chosen.
    #[serde(default)]
    pub standing: Standing,
    /// The selector's flags for this string on this course (`stress_caution`,
    /// `thicker_than_catalog`, …), in a fixed order; empty when nothing is amiss.
    #[serde(default)]
    pub flags: StringFlags,
}

/// How a string stands against the choice rule (`taut help choice`, src/cli/topics/choice.txt).
/// Serialized in snake_case (`on_target`).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum Standing {
    /// Within the tolerance and the window, fitting, below the caution stress, inside its
    /// kind's catalog.
    #[default]
    OnTarget,
    /// Acceptable, but in the caution zone, at the end of its catalog, or of unknown strength.
    WithReservations,
    /// Nothing allowed was acceptable: the string that goes wrong least.
    Closest,
    /// Named outright in the instrument file; not chosen.
    Fixed,
}

impl Standing {
    /// The standing in words, for tables.
    pub fn words(self) -> &'static str {
        match self {
            Standing::OnTarget => "on target",
            Standing::WithReservations => "with reservations",
            Standing::Closest => "not acceptable",
            Standing::Fixed => "fixed in the instrument file",
        }
    }
}

impl From<crate::strings::select::Standing> for Standing {
    fn from(standing: crate::strings::select::Standing) -> Self {
        use crate::strings::select::Standing as Rank;
        match standing {
            Rank::OnTarget => Standing::OnTarget,
            Rank::WithReservations => Standing::WithReservations,
            Rank::Closest => Standing::Closest,
        }
    }
}

/// The choices around the chosen string.
#[derive(Debug, Clone, Default, PartialEq, Serialize, Deserialize)]
pub struct Alternatives {
    /// The next thinner catalog step of the chosen kind.
    pub thinner: Option<StringChoice>,
    /// The next thicker catalog step of the chosen kind.
    pub thicker: Option<StringChoice>,
    /// The best string of each other allowed kind.
    pub other_kinds: Vec<StringChoice>,
}

impl Plan {
    /// Whether any warning is a caution or a danger (then the safety cautions are shown).
    pub fn needs_safety_cautions(&self) -> bool {
        self.warnings
            .iter()
            .any(|warning| warning.severity >= Severity::Caution)
    }

    /// Number of strings over all courses.
    pub fn string_count(&self) -> usize {
        self.courses.iter().map(|course| course.strings.len()).sum()
    }
}
