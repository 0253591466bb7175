//! [`StringFlags`]: what is amiss with one planned string, held as bits and read, printed and
//! serialized as the list of their snake_case names, so that a plan carries them without
//! allocating.

use serde::de::{self, Deserializer, SeqAccess, Visitor};
use serde::ser::{SerializeSeq, Serializer};
use serde::{Deserialize, Serialize};

use crate::strings::select::Warnings;

/// The selector's flags for one string on its course, plus `off_target` when its tension is
/// outside the tolerance of the target.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub struct StringFlags {
    warnings: Warnings,
    off_target: bool,
}

/// The name of the flag that is not the selector's.
const OFF_TARGET: &str = "off_target";

impl StringFlags {
    /// The selector's `warnings`, and whether the tension is off target.
    pub fn new(warnings: Warnings, off_target: bool) -> Self {
        StringFlags {
            warnings,
            off_target,
        }
    }

    /// Whether nothing is amiss.
    pub fn is_empty(&self) -> bool {
        self.warnings.is_empty() && !self.off_target
    }

    /// The names of the set flags (`stress_caution`, …, `off_target` last), in a fixed order.
    pub fn names(&self) -> impl Iterator<Item = &'static str> + '_ {
        self.warnings
            .plan_names()
            .chain(self.off_target.then_some(OFF_TARGET))
    }

    /// The names joined with `separator`.
    pub fn join(&self, separator: &str) -> String {
        self.names().collect::<Vec<_>>().join(separator)
    }
}

impl Serialize for StringFlags {
    fn serialize<S: Serializer>(&self, serializer: S) -> Result<S::Ok, S::Error> {
        let mut list = serializer.serialize_seq(Some(self.names().count()))?;
        for name in self.names() {
            list.serialize_element(name)?;
        }
        list.end()
    }
}

impl<'de> Deserialize<'de> for StringFlags {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> Result<Self, D::Error> {
        struct Names;
        impl<'de> Visitor<'de> for Names {
            type Value = StringFlags;

            fn expecting(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
                f.write_str("a list of flag names, e.g. [stress_caution, off_target]")
            }

            fn visit_seq<A: SeqAccess<'de>>(self, mut list: A) -> Result<StringFlags, A::Error> {
                let mut flags = StringFlags::default();
                while let Some(name) = list.next_element::<std::borrow::Cow<'de, str>>()? {
                    if name == OFF_TARGET {
                        flags.off_target = true;
                    } else if let Some(flag) = Warnings::from_plan_name(&name) {
                        flags.warnings.insert(flag);
                    } else {
                        let known: Vec<&str> =
                            Warnings::every_plan_name().chain([OFF_TARGET]).collect();
                        return Err(de::Error::custom(format!(
                            "unknown flag `{name}`; known flags: {}",
                            known.join(", ")
                        )));
                    }
                }
                Ok(flags)
            }
        }
        deserializer.deserialize_seq(Names)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn names_follow_the_selector_and_read_back() {
        // Each plan name is the selector's own name in snake_case, in the selector's order.
        let every = Warnings::every_plan_name()
            .filter_map(Warnings::from_plan_name)
            .fold(Warnings::NONE, Warnings::union);
        assert_eq!(every.names().count(), 10);
        let selector: Vec<String> = every.names().map(|name| name.replace('-', "_")).collect();
        let flags = StringFlags::new(every, true);
        let ours: Vec<&str> = flags.names().collect();
        assert_eq!(ours[..ours.len() - 1], selector);
        assert_eq!(ours.last(), Some(&"off_target"));
        let some = StringFlags::new(Warnings::STRESS_DANGER.union(Warnings::ABOVE_WINDOW), true);
        let json = serde_json::to_string(&some).unwrap_or_default();
        assert_eq!(json, r#"["stress_danger","above_window","off_target"]"#);
        let back: StringFlags = serde_json::from_str(&json).unwrap_or_default();
        assert_eq!(back, some);
        assert_eq!(some.join(", "), "stress_danger, above_window, off_target");
        assert!(StringFlags::default().is_empty());
        assert_eq!(
            serde_json::to_string(&StringFlags::default()).unwrap_or_default(),
            "[]"
        );
        let unknown = serde_json::from_str::<StringFlags>(r#"["too_loud"]"#);
        assert!(unknown.is_err_and(|err| err.to_string().contains("unknown flag `too_loud`")));
    }
}
