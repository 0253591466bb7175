//! The tunings shipped inside the binary (the files in `tunings/`), found by name from any
//! folder.

use super::{definition, Tuning};
use crate::error::Result;

/// Name and YAML text of every shipped tuning; the name is the file's stem.
pub const SHIPPED: [(&str, &str); 13] = [
    ("12edo", include_str!("../../tunings/12edo.yaml")),
    ("19edo", include_str!("../../tunings/19edo.yaml")),
    ("22edo", include_str!("../../tunings/22edo.yaml")),
    ("24edo", include_str!("../../tunings/24edo.yaml")),
    ("31edo", include_str!("../../tunings/31edo.yaml")),
    ("41edo", include_str!("../../tunings/41edo.yaml")),
    ("53edo", include_str!("../../tunings/53edo.yaml")),
    ("tritave-13", include_str!("../../tunings/tritave-13.yaml")),
    (
        "meantone-quarter-comma",
        include_str!("../../tunings/meantone-quarter-comma.yaml"),
    ),
    (
        "pythagorean-12",
        include_str!("../../tunings/pythagorean-12.yaml"),
    ),
    (
        "just-5-limit",
        include_str!("../../tunings/just-5-limit.yaml"),
    ),
    (
        "diamond-7-limit",
        include_str!("../../tunings/diamond-7-limit.yaml"),
    ),
    (
        "harmonics-8-16",
        include_str!("../../tunings/harmonics-8-16.yaml"),
    ),
];

/// Names of the shipped tunings.
pub fn names() -> impl Iterator<Item = &'static str> {
    SHIPPED.iter().map(|(name, _)| *name)
}

/// Loads a shipped tuning by name (case-insensitive); `None` when no shipped tuning has that name.
pub fn load(name: &str) -> Option<Result<Tuning>> {
    SHIPPED
        .iter()
        .find(|(shipped, _)| shipped.eq_ignore_ascii_case(name.trim()))
        .map(|(shipped, text)| definition::parse(text, &format!("tunings/{shipped}.yaml")))
}

/// Loads every shipped tuning, in order.
pub fn load_all() -> Vec<(&'static str, Result<Tuning>)> {
    SHIPPED
        .iter()
        .map(|(name, text)| {
            (
                *name,
                definition::parse(text, &format!("tunings/{name}.yaml")),
            )
        })
        .collect()
}
