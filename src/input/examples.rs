//! The shipped example files, found by name from anywhere (`taut plan guitar-19edo`), and the
//! kind of a YAML file, so a file given to the wrong command gets told which command takes it.

use std::path::Path;

use crate::error::{did_you_mean, Error, Result};
use crate::input::yaml;

/// Every file in `examples/`, by name (the file name without `.yaml`).
pub const EXAMPLES: &[(&str, &str)] = &[
    (
        "guitar-19edo",
        include_str!("../../examples/guitar-19edo.yaml"),
    ),
    (
        "lever-harp-34",
        include_str!("../../examples/lever-harp-34.yaml"),
    ),
    (
        "psaltery-26",
        include_str!("../../examples/psaltery-26.yaml"),
    ),
    (
        "fanned-8-just",
        include_str!("../../examples/fanned-8-just.yaml"),
    ),
    (
        "steel-guitar-12edo",
        include_str!("../../examples/steel-guitar-12edo.yaml"),
    ),
    (
        "guitar-22edo-mode",
        include_str!("../../examples/guitar-22edo-mode.yaml"),
    ),
    (
        "baritone-guitar",
        include_str!("../../examples/baritone-guitar.yaml"),
    ),
    (
        "steel-guitar-set",
        include_str!("../../examples/steel-guitar-set.yaml"),
    ),
    (
        "lever-harp-36-layout",
        include_str!("../../examples/lever-harp-36-layout.yaml"),
    ),
    (
        "psaltery-44-layout",
        include_str!("../../examples/psaltery-44-layout.yaml"),
    ),
    (
        "psaltery-layout",
        include_str!("../../examples/psaltery-layout.yaml"),
    ),
    (
        "fanned-8-fourths",
        include_str!("../../examples/fanned-8-fourths.yaml"),
    ),
    (
        "guitar-kept-strings",
        include_str!("../../examples/guitar-kept-strings.yaml"),
    ),
    (
        "guitar-three-tunings",
        include_str!("../../examples/guitar-three-tunings.yaml"),
    ),
    (
        "survey-fourths",
        include_str!("../../examples/survey-fourths.yaml"),
    ),
    (
        "zither-pairs-layout",
        include_str!("../../examples/zither-pairs-layout.yaml"),
    ),
];

/// What a YAML file describes.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum FileKind {
    /// An instrument (`taut plan`, and the INSTRUMENT of audit and convert).
    Instrument,
    /// The strings on an instrument (`--set` of audit and convert).
    StringSet,
    /// Courses with their strings, for `taut lengths`.
    Layout,
    /// A tuning definition (`--tuning`, `taut tuning`).
    Tuning,
    /// Extra materials, catalogs and kinds (`--stock`).
    Stock,
    /// What `taut survey` searches (its SETTINGS).
    SurveySettings,
}

impl FileKind {
    /// The file kind in words, with the command that reads it.
    pub fn described(self) -> &'static str {
        match self {
            FileKind::Instrument => "an instrument file: use it with `taut plan FILE` (or as the INSTRUMENT of `taut audit` and `taut convert`)",
            FileKind::StringSet => "a string-set file: use it with `taut audit INSTRUMENT --set FILE` or `taut convert INSTRUMENT --set FILE`",
            FileKind::Layout => "a layout file: use it with `taut lengths FILE`",
            FileKind::Tuning => "a tuning file: use it with `--tuning FILE` or `taut tuning show FILE`",
            FileKind::Stock => "a stock file: add it to any string command with `--stock FILE`",
            FileKind::SurveySettings => "a survey settings file: use it with `taut survey INSTRUMENT FILE`",
        }
    }
}

/// Guesses what a YAML text describes from its top-level keys; `None` when it cannot tell.
pub fn sniff(text: &str) -> Option<FileKind> {
    // Through the project's YAML reader, so its size and depth limits guard this read too.
    let value: serde_yaml::Value = yaml::parse(text, "file").ok()?;
    let map = value.as_mapping()?;
    let has = |key: &str| map.contains_key(key);
    if has("divisions") || has("ratios") || has("cents") || has("hertz") || has("chain") {
        return Some(FileKind::Tuning);
    }
    // A layout's `kinds` is a list of ids; a stock file's is a list of kind definitions.
    let kinds_defined = map
        .get("kinds")
        .and_then(serde_yaml::Value::as_sequence)
        .is_some_and(|list| list.iter().any(serde_yaml::Value::is_mapping));
    if has("materials") || has("catalogs") || kinds_defined {
        return Some(FileKind::Stock);
    }
    if has("course_1") || has("offset_cents") || has("rank_by") {
        return Some(FileKind::SurveySettings);
    }
    if has("instrument") {
        return Some(FileKind::StringSet);
    }
    if has("max_step") || has("tension") {
        return Some(FileKind::Layout);
    }
    if has("scale_length") || has("defaults") || has("rated_load") || has("stress_limits") {
        return Some(FileKind::Instrument);
    }
    let courses = map.get("courses")?.as_sequence()?;
    let course_has = |key: &str| {
        courses
            .iter()
            .any(|course| course.as_mapping().is_some_and(|c| c.contains_key(key)))
    };
    // `string:` holding a list is `strings:` mistyped, not a layout's one string per course.
    let course_has_list_under = |key: &str| {
        courses.iter().any(|course| {
            course
                .as_mapping()
                .and_then(|c| c.get(key))
                .is_some_and(serde_yaml::Value::is_sequence)
        })
    };
    let one_string_lists = course_has_list_under("string");
    if course_has("scale_length") {
        Some(FileKind::Instrument)
    } else if course_has("string") && !one_string_lists {
        Some(FileKind::Layout)
    } else if (course_has("strings") || one_string_lists) && !course_has("pitch") {
        Some(FileKind::StringSet)
    } else {
        None
    }
}

/// The text of a file, or of the shipped example of that name, with the name messages use.
/// `flag` names the argument in messages.
pub fn read(spec: &str, flag: &str) -> Result<(String, String)> {
    let path = Path::new(spec);
    let (text, origin) = if path.exists() || spec == "-" {
        (yaml::read_text(path)?, yaml::origin_of(path))
    } else if let Some((_, text)) = EXAMPLES.iter().find(|(name, _)| *name == spec) {
        ((*text).to_string(), format!("example `{spec}`"))
    } else {
        let names = EXAMPLES.iter().map(|(name, _)| *name);
        let error = Error::input(format!("`{spec}` is neither a file nor a shipped example"));
        let error = match did_you_mean(spec, names.clone()) {
            Some(best) => error.help(format!("did you mean the example `{best}`?")),
            None => error.help(format!(
                "give a path to a YAML file, or one of: {}",
                names.collect::<Vec<_>>().join(", ")
            )),
        };
        return Err(error.in_origin(flag));
    };
    Ok((text, origin))
}

/// An error for a file of the wrong kind, when its kind can be told; `None` otherwise (then the
/// parser's own message, naming the line and field, is the better one).
pub fn wrong_kind(text: &str, origin: &str, expected: FileKind) -> Option<Error> {
    let found = sniff(text)?;
    (found != expected).then(|| {
        Error::input(format!("{origin} is {}", found.described())).help(format!(
            "this command wants {}",
            match expected {
                FileKind::Instrument => "an instrument file",
                FileKind::StringSet => "a string-set file",
                FileKind::Layout => "a layout file",
                FileKind::Tuning => "a tuning file",
                FileKind::Stock => "a stock file",
                FileKind::SurveySettings => "a survey settings file",
            }
        ))
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_example_is_told_apart() {
        for (name, text) in EXAMPLES {
            let kind = sniff(text);
            let expected = match *name {
                "steel-guitar-set" => FileKind::StringSet,
                "psaltery-layout"
                | "zither-pairs-layout"
                | "lever-harp-36-layout"
                | "psaltery-44-layout" => FileKind::Layout,
                "survey-fourths" => FileKind::SurveySettings,
                _ => FileKind::Instrument,
            };
            assert_eq!(kind, Some(expected), "{name}");
        }
    }
}
