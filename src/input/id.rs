//! Identifiers that data files use to refer to each other (materials, gauge catalogs, string kinds).

use std::fmt;

use serde::{Deserialize, Serialize};

use crate::error::{Error, Result};

/// A lowercase identifier such as `music-wire`: letters a–z, digits and single hyphens, starting
/// with a letter, at most 64 characters. Checked when read, so a typo is caught at its line.
#[derive(Debug, Clone, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize, Deserialize)]
#[serde(try_from = "String", into = "String")]
pub struct Id(String);

impl Id {
    /// Checks `text` and wraps it.
    pub fn new(text: &str) -> Result<Self> {
        let valid = !text.is_empty()
            && text.len() <= 64
            && text.starts_with(|c: char| c.is_ascii_lowercase())
            && !text.ends_with('-')
            && !text.contains("--")
            && text
                .chars()
                .all(|c| c.is_ascii_lowercase() || c.is_ascii_digit() || c == '-');
        if valid {
            Ok(Id(text.to_string()))
        } else {
            Err(Error::input(format!(
                "`{text}` is not a valid id: use lowercase letters, digits and single hyphens, starting with a letter"
            ))
            .help("write e.g. `music-wire`"))
        }
    }

    /// The id as text.
    pub fn as_str(&self) -> &str {
        &self.0
    }
}

impl TryFrom<String> for Id {
    type Error = String;

    fn try_from(text: String) -> std::result::Result<Self, String> {
        Id::new(&text).map_err(|err| match err {
            Error::Input { message, .. } => message,
            other => other.to_string(),
        })
    }
}

impl From<Id> for String {
    fn from(id: Id) -> String {
        id.0
    }
}

impl fmt::Display for Id {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.0)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn accepts_kebab_case_and_refuses_the_rest() {
        assert!(Id::new("music-wire").is_ok());
        assert!(Id::new("brass-80-20").is_ok());
        for bad in ["", "Music", "9wire", "a--b", "a-", "a_b", "a b"] {
            assert!(Id::new(bad).is_err(), "{bad:?} should be refused");
        }
    }
}
