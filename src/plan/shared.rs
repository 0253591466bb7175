//! [`SharedText`]: text that many records of a plan repeat (a kind's id, its materials in words,
//! a gauge's label), held once and shared, so that describing a string copies pointers instead
//! of allocating. It reads, compares, prints and serializes as the plain string it holds.

use std::fmt;
use std::ops::Deref;
use std::sync::Arc;

use serde::{Deserialize, Deserializer, Serialize, Serializer};

/// An immutable string shared between the records that repeat it; cloning it copies a pointer.
#[derive(Clone, Default, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub struct SharedText(Arc<str>);

impl SharedText {
    /// The text.
    pub fn as_str(&self) -> &str {
        &self.0
    }
}

impl Deref for SharedText {
    type Target = str;

    fn deref(&self) -> &str {
        &self.0
    }
}

impl AsRef<str> for SharedText {
    fn as_ref(&self) -> &str {
        &self.0
    }
}

impl From<&str> for SharedText {
    fn from(text: &str) -> Self {
        SharedText(Arc::from(text))
    }
}

impl From<String> for SharedText {
    fn from(text: String) -> Self {
        SharedText(Arc::from(text))
    }
}

impl PartialEq<str> for SharedText {
    fn eq(&self, other: &str) -> bool {
        &*self.0 == other
    }
}

impl PartialEq<&str> for SharedText {
    fn eq(&self, other: &&str) -> bool {
        &*self.0 == *other
    }
}

impl fmt::Display for SharedText {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.0)
    }
}

impl fmt::Debug for SharedText {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        fmt::Debug::fmt(&*self.0, f)
    }
}

impl Serialize for SharedText {
    fn serialize<S: Serializer>(&self, serializer: S) -> Result<S::Ok, S::Error> {
        serializer.serialize_str(&self.0)
    }
}

impl<'de> Deserialize<'de> for SharedText {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> Result<Self, D::Error> {
        String::deserialize(deserializer).map(SharedText::from)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn it_reads_prints_and_serializes_as_its_string() {
        let text = SharedText::from("phosphor bronze on steel");
        let copy = text.clone();
        assert!(Arc::ptr_eq(&text.0, &copy.0), "a clone shares the text");
        assert_eq!(copy, "phosphor bronze on steel");
        assert_eq!(
            format!("{copy}|{copy:?}"),
            "phosphor bronze on steel|\"phosphor bronze on steel\""
        );
        let json = serde_json::to_string(&copy).unwrap_or_default();
        assert_eq!(json, "\"phosphor bronze on steel\"");
        let back: SharedText = serde_json::from_str(&json).unwrap_or_default();
        assert_eq!(back, text);
    }
}
