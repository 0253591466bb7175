//! The warning flags the selector raises: a small bit set, so a choice carries them without allocating.

#[allow(unused_imports)]
use super::*;

/// A small set of warning flags.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Hash)]
pub struct Warnings(u16);

impl Warnings {
    /// No warnings.
    pub const NONE: Warnings = Warnings(0);
    /// Stress ratio above the caution limit (but not above the danger limit).
    pub const STRESS_CAUTION: Warnings = Warnings(1 << 0);
    /// Stress ratio above the danger limit.
    pub const STRESS_DANGER: Warnings = Warnings(1 << 1);
    /// The course needs a lighter string than the kind's thinnest gauge.
    pub const THINNER_THAN_CATALOG: Warnings = Warnings(1 << 2);
    /// The course needs a heavier string than the kind's thickest gauge.
    pub const THICKER_THAN_CATALOG: Warnings = Warnings(1 << 3);
    /// The string is wider than the slot or hole takes.
    pub const WIDER_THAN_SLOT: Warnings = Warnings(1 << 4);
    /// Tension below the window's minimum.
    pub const BELOW_WINDOW: Warnings = Warnings(1 << 5);
    /// Tension above the window's maximum.
    pub const ABOVE_WINDOW: Warnings = Warnings(1 << 6);
    /// No gauge of any allowed kind is within the tolerance of the target tension.
    pub const NONE_WITHIN_TOLERANCE: Warnings = Warnings(1 << 7);
    /// The breaking strength is unknown (a measured string without a material).
    pub const STRENGTH_UNKNOWN: Warnings = Warnings(1 << 8);
    /// A plain monofilament thicker than its material's thickest plain string in common
    /// practice (dull; makers change to a wound string first).
    pub const THICK_MONOFILAMENT: Warnings = Warnings(1 << 9);

    /// Each flag with its stable name and the name plans give it (snake_case, as their other
    /// field names), in the order reports list them.
    const NAMES: [(Warnings, &'static str, &'static str); 10] = [
        (Warnings::STRESS_CAUTION, "stress-caution", "stress_caution"),
        (Warnings::STRESS_DANGER, "stress-danger", "stress_danger"),
        (
            Warnings::THINNER_THAN_CATALOG,
            "thinner-than-catalog",
            "thinner_than_catalog",
        ),
        (
            Warnings::THICKER_THAN_CATALOG,
            "thicker-than-catalog",
            "thicker_than_catalog",
        ),
        (
            Warnings::WIDER_THAN_SLOT,
            "wider-than-slot",
            "wider_than_slot",
        ),
        (Warnings::BELOW_WINDOW, "below-window", "below_window"),
        (Warnings::ABOVE_WINDOW, "above-window", "above_window"),
        (
            Warnings::NONE_WITHIN_TOLERANCE,
            "none-within-tolerance",
            "none_within_tolerance",
        ),
        (
            Warnings::STRENGTH_UNKNOWN,
            "strength-unknown",
            "strength_unknown",
        ),
        (
            Warnings::THICK_MONOFILAMENT,
            "thick-monofilament",
            "thick_monofilament",
        ),
    ];

    /// Whether every flag of `other` is set.
    pub fn contains(self, other: Warnings) -> bool {
        self.0 & other.0 == other.0
    }

    /// Whether any flag of `other` is set.
    pub fn intersects(self, other: Warnings) -> bool {
        self.0 & other.0 != 0
    }

    /// Sets the flags of `other`.
    pub fn insert(&mut self, other: Warnings) {
        self.0 |= other.0;
    }

    /// Both sets of flags.
    pub fn union(self, other: Warnings) -> Warnings {
        Warnings(self.0 | other.0)
    }

    /// Whether no flag is set.
    pub fn is_empty(self) -> bool {
        self.0 == 0
    }

    /// The raw bits.
    pub const fn bits(self) -> u16 {
        self.0
    }

    /// The table's entries of the set flags, in order.
    fn set_entries(self) -> impl Iterator<Item = (Warnings, &'static str, &'static str)> {
        Warnings::NAMES
            .into_iter()
            .filter(move |(flag, _, _)| self.contains(*flag))
    }

    /// Stable names of the set flags, e.g. `stress-caution`, in a fixed order.
    pub fn names(self) -> impl Iterator<Item = &'static str> {
        self.set_entries().map(|(_, name, _)| name)
    }

    /// The names plans give the set flags, e.g. `stress_caution`, in the same order.
    pub fn plan_names(self) -> impl Iterator<Item = &'static str> {
        self.set_entries().map(|(_, _, name)| name)
    }

    /// The flag a plan names `name` (`stress_caution`, …), if any.
    pub fn from_plan_name(name: &str) -> Option<Warnings> {
        Warnings::NAMES
            .into_iter()
            .find(|(_, _, plan_name)| *plan_name == name)
            .map(|(flag, _, _)| flag)
    }

    /// Every plan name, in order.
    pub fn every_plan_name() -> impl Iterator<Item = &'static str> {
        Warnings::NAMES.into_iter().map(|(_, _, name)| name)
    }
}
