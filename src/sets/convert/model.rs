//! The conversion's options and its result: plain data that the renderers read.

#[allow(unused_imports)]
use super::*;

/// Choices for a conversion.
#[derive(Debug, Clone, PartialEq)]
pub struct ConvertOptions {
    /// A shift of every course's pitch (a baritone conversion a fourth down: `-5`).
    pub transpose: Option<Shift>,
    /// What keeping the feel keeps, when no new target is given.
    pub rule: FeelRule,
    /// Accepted relative distance from the target tension.
    pub tolerance: f64,
    /// A new tension target (or window, or profile) instead of each string's old tension.
    pub target: Option<TensionSpec>,
    /// A new vibrating length for every course, m.
    pub scale_length: Option<f64>,
    /// The nut-slot width to check every new string against, m (overrides the instrument's).
    pub slot_width: Option<f64>,
    /// Choose every string afresh, even those that would still do.
    pub reselect_all: bool,
    /// Fraction of total-load change beyond which the setup caution is shown.
    pub load_change_caution: f64,
    /// Inputs of the feel figures.
    pub feel: FeelOptions,
}

impl Default for ConvertOptions {
    fn default() -> Self {
        ConvertOptions {
            transpose: None,
            rule: FeelRule::default(),
            tolerance: select::DEFAULT_TOLERANCE,
            target: None,
            scale_length: None,
            slot_width: None,
            reselect_all: false,
            load_change_caution: DEFAULT_LOAD_CHANGE,
            feel: FeelOptions::default(),
        }
    }
}

/// A conversion plan.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Conversion {
    /// The instrument before.
    pub instrument_before: String,
    /// The instrument after (the same name when only the tuning or scale changes).
    pub instrument_after: String,
    /// The installed set's name.
    pub set: String,
    /// The tuning before.
    pub tuning_before: String,
    /// The tuning after.
    pub tuning_after: String,
    /// The shift applied to every course, when transposed; the pitches after are named anew.
    pub transpose: Option<Shift>,
    /// Where each string's target tension came from.
    pub rule: TargetRule,
    /// The tolerance used, as a fraction.
    pub tolerance: f64,
    /// One entry per course of the instrument after.
    pub courses: Vec<ConvertCourse>,
    /// Courses of the set that the instrument after no longer has.
    pub removed_courses: Vec<u32>,
    /// Sum of all tensions before, N.
    pub total_before_n: f64,
    /// Sum of all tensions after, N.
    pub total_after_n: f64,
    /// Change of the total, %.
    pub total_change_pct: f64,
    /// The setup caution, when the total changes by more than the threshold.
    pub load_caution: Option<String>,
    /// The instrument's rated load, N, if stated.
    pub rated_load_n: Option<f64>,
    /// Number of strings replaced.
    pub strings_replaced: usize,
    /// Kept strings whose tension changes by more than the tolerance.
    pub kept_tension_changes: Vec<KeptChange>,
    /// Every warning, course by course, then the instrument's.
    pub warnings: Vec<Warning>,
    /// Safety cautions, present when a caution, a danger or a large load change came up.
    pub cautions: Vec<String>,
}

/// One course of a conversion.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ConvertCourse {
    /// The course number.
    pub course: u32,
    /// The pitch before, as written in the old instrument (absent for a new course).
    pub pitch_before: Option<String>,
    /// The pitch after, as written in the new instrument.
    pub pitch_after: String,
    /// The tuning's label for the pitch after.
    pub pitch_label: String,
    /// Nearest 12-tone note name of the pitch after.
    pub note_name: String,
    /// Cents from that note to the pitch after.
    pub note_offset_cents: f64,
    /// Frequency before, Hz.
    pub pitch_before_hz: Option<f64>,
    /// Frequency after, Hz.
    pub pitch_after_hz: f64,
    /// Vibrating length before, m.
    pub length_before_m: Option<f64>,
    /// Vibrating length after, m.
    pub length_after_m: f64,
    /// The strings.
    pub strings: Vec<ConvertString>,
    /// Warnings about the course after conversion.
    pub warnings: Vec<Warning>,
}

/// A string's figures on one side of the conversion.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Side {
    /// The string (kind id, or measured).
    pub string: String,
    /// The trade's name for its diameter, e.g. `0.012 in`, if known.
    pub gauge: Option<String>,
    /// Outer diameter, mm.
    pub diameter_mm: Option<f64>,
    /// Outer diameter, in.
    pub diameter_in: Option<f64>,
    /// Linear density, kg/m.
    pub unit_mass_kg_per_m: f64,
    /// Frequency, Hz.
    pub pitch_hz: f64,
    /// Tension, N.
    pub tension_n: f64,
    /// Stress over breaking strength, if known.
    pub stress_ratio: Option<f64>,
    /// Pitch at which it breaks on this length, Hz, if known.
    pub break_pitch_hz: Option<f64>,
}

/// How a new string fits the nut slot.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SlotFit {
    /// The width it was measured against, mm.
    pub width_mm: f64,
    /// `stated` (instrument or --slot) or `old string` (no width stated).
    pub against: String,
    /// How much wider the new string is, mm (negative: narrower).
    pub wider_by_mm: f64,
    /// Whether it fits.
    pub fits: bool,
}

/// One string of a conversion.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ConvertString {
    /// Interval from the course pitch (after).
    pub interval: String,
    /// The installed string before (absent on a new course).
    pub before: Option<Side>,
    /// The string after.
    pub after: Side,
    /// Whether the installed string is kept.
    pub kept: bool,
    /// The tension aimed for, N.
    pub target_tension_n: f64,
    /// Tension change, % (absent on a new course).
    pub tension_change_pct: Option<f64>,
    /// Stress change, % of the stress before (absent when unknown).
    pub stress_change_pct: Option<f64>,
    /// Fit in the nut slot, when a width is known.
    pub slot: Option<SlotFit>,
    /// Stiffness and feel after.
    pub feel_after: Feel,
    /// Stiffness and feel before, on the old pitch and length (absent on a new course).
    pub feel_before: Option<Feel>,
    /// The string after as a set entry.
    #[serde(skip)]
    pub set_string: SetString,
}

impl Conversion {
    /// The set after conversion, named after the tuning it is for.
    pub fn new_set(&self) -> StringSet {
        let courses = self
            .courses
            .iter()
            .map(|course| SetCourse {
                course: course.course,
                strings: course
                    .strings
                    .iter()
                    .map(|s| s.set_string.clone())
                    .collect(),
            })
            .collect();
        StringSet::chosen_for(
            &self.instrument_after,
            &self.tuning_after,
            format!(
                "Converted by taut from `{}` in {}.",
                self.set, self.tuning_before
            ),
            courses,
            "the conversion",
        )
    }
}
