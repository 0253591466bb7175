//! The tunings a player moves between on one set of strings, listed in the instrument file:
//!
//! ```yaml
//! variants:
//!   - name: standard                 # the file's own tuning and course pitches
//!   - name: dropped
//!     pitches: {6: D2}               # course number: its pitch in this variant
//!   - name: nineteen
//!     tuning: 19edo                  # another tuning; course pitches re-read in it
//! ```
//!
//! A variant without `tuning` uses the instrument's (or the one given on the command line). The
//! checks that need only this file (names present and unique, course numbers known, at most
//! [`MAX_VARIANTS`]) run while the instrument is read; pitches and tunings are resolved by the
//! plan, which points any error back at the variant's line.

use std::collections::BTreeMap;

use serde::Deserialize;

use super::*;

/// The most tunings or variants one plan or audit compares: enough for every tuning a player
/// keeps, and few enough that the pairwise conflict search and the side-by-side report stay
/// small.
pub const MAX_VARIANTS: usize = 16;

/// One way of tuning the instrument: a tuning and/or some courses at other pitches.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Variant {
    /// A short name shown in reports, e.g. `dropped`.
    pub name: String,
    /// A tuning (shipped name, inline spec or file) instead of the instrument's.
    pub tuning: Option<String>,
    /// Course pitches that differ from the instrument's, by course number; a course given
    /// twice is refused (YAML would otherwise keep the last silently).
    #[serde(default, deserialize_with = "pitches_once_each")]
    pub pitches: BTreeMap<u32, String>,
}

/// Reads a variant's `pitches`, refusing a course number given twice.
fn pitches_once_each<'de, D>(
    deserializer: D,
) -> std::result::Result<BTreeMap<u32, String>, D::Error>
where
    D: serde::Deserializer<'de>,
{
    struct Once;
    impl<'de> serde::de::Visitor<'de> for Once {
        type Value = BTreeMap<u32, String>;
        fn expecting(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
            f.write_str("a mapping of course numbers to pitches, e.g. `{6: D2}`")
        }
        fn visit_map<A>(self, mut map: A) -> std::result::Result<Self::Value, A::Error>
        where
            A: serde::de::MapAccess<'de>,
        {
            let mut pitches = BTreeMap::new();
            while let Some((course, pitch)) = map.next_entry::<u32, String>()? {
                if pitches.insert(course, pitch).is_some() {
                    return Err(serde::de::Error::custom(format!(
                        "course {course} is retuned twice in this variant; give each course one pitch"
                    )));
                }
            }
            Ok(pitches)
        }
    }
    deserializer.deserialize_map(Once)
}

impl Instrument {
    /// Checks the `variants` list against the rest of the file.
    pub(super) fn check_variants(&self) -> Result<()> {
        if self.variants.len() > MAX_VARIANTS {
            return Err(self.point(
                Error::input(format!(
                    "{} variants are listed; taut compares at most {MAX_VARIANTS}",
                    self.variants.len()
                )),
                &[PathStep::Key("variants")],
            ));
        }
        for (index, variant) in self.variants.iter().enumerate() {
            let at = |key: &'static str| {
                [
                    PathStep::Key("variants"),
                    PathStep::Index(index),
                    PathStep::Key(key),
                ]
            };
            if variant.name.trim().is_empty() {
                return Err(self.point(Error::input("the variant's name is empty"), &at("name")));
            }
            if let Some(first) = self.variants[..index]
                .iter()
                .position(|other| other.name.trim() == variant.name.trim())
            {
                return Err(self.point(
                    Error::input(format!(
                        "the variant name `{}` is used twice (also by variant {})",
                        variant.name.trim(),
                        first + 1
                    ))
                    .help("give every variant its own name"),
                    &at("name"),
                ));
            }
            for (number, pitch) in &variant.pitches {
                let key = number.to_string();
                let path = [
                    PathStep::Key("variants"),
                    PathStep::Index(index),
                    PathStep::Key("pitches"),
                    PathStep::Key(&key),
                ];
                if !(0..self.courses.len()).any(|i| self.course_number(i) == *number) {
                    return Err(self.point(
                        Error::input(format!(
                            "course {number} is not a course of this instrument"
                        ))
                        .help("key `pitches` by the course numbers listed under `courses`"),
                        &path,
                    ));
                }
                if pitch.trim().is_empty() {
                    return Err(self.point(Error::input("the pitch is empty"), &path));
                }
            }
        }
        Ok(())
    }
}
