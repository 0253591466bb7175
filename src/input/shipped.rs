//! Reading the string data shipped with `taut` (`src/strings/data/*.yaml`), which reaches the
//! binary as JSON.
//!
//! Why JSON: the shipped files are about 16 KB of YAML, and serde_yaml parsed them at about
//! 10 MB/s, 1.6 ms of every run. The build script (`src/build.rs`) converts each file to the same
//! value in JSON once, at build time; [`parse`] reads that JSON with serde_json in tens of
//! microseconds into the very structs a user's YAML file is read into, and the callers then run
//! the same checks as for a user's file. The YAML stays the one source people edit, and
//! `tests/it/strings_data.rs` checks that both readings give identical data.
//!
//! Every user file is still read as YAML through [`crate::input::yaml`]; this module is the only
//! other reader of definition data, so the JSON crate, like the YAML one, is named in one place.

use serde::de::DeserializeOwned;

use crate::error::{Error, Result};

/// Reads one shipped file from its build-time JSON copy `json` into `T`.
///
/// If the JSON does not fit `T` (an entry in the shipped data is broken), the error comes from
/// reading the YAML it was converted from, `yaml`, through [`crate::input::yaml::parse`], so it
/// names `origin`, the line and the field exactly as for a user's file.
pub fn parse<T: DeserializeOwned>(json: &str, yaml: &str, origin: &str) -> Result<T> {
    let json_error = match serde_json::from_str(json) {
        Ok(value) => return Ok(value),
        Err(err) => err,
    };
    // The slow reading runs only on this failure path, to place the problem in the YAML.
    match crate::input::yaml::parse::<T>(yaml, origin) {
        Err(yaml_error) => Err(yaml_error),
        Ok(_) => Err(Error::input(format!(
            "the build-time JSON copy cannot be read although the YAML can ({json_error})"
        ))
        .in_origin(origin)
        .help("rebuild taut so that src/build.rs converts the YAML again")),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use serde::Deserialize;

    #[derive(Debug, PartialEq, Deserialize)]
    #[serde(deny_unknown_fields)]
    struct Entry {
        id: String,
        ratio: f64,
    }

    #[derive(Debug, PartialEq, Deserialize)]
    #[serde(deny_unknown_fields)]
    struct File {
        entries: Vec<Entry>,
    }

    #[test]
    fn good_json_is_read_without_the_yaml() {
        let json = r#"{"entries":[{"id":"a","ratio":0.4}]}"#;
        let file: File = parse(json, "not: [valid", "built-in x.yaml").unwrap();
        assert_eq!(
            file,
            File {
                entries: vec![Entry {
                    id: "a".into(),
                    ratio: 0.4
                }]
            }
        );
    }

    #[test]
    fn a_broken_entry_is_reported_at_its_line_in_the_yaml() {
        let yaml = "entries:\n  - id: a\n    ratio: 0.4\n  - id: b\n    ration: 0.5\n";
        let json = r#"{"entries":[{"id":"a","ratio":0.4},{"id":"b","ration":0.5}]}"#;
        let err = parse::<File>(json, yaml, "built-in x.yaml")
            .unwrap_err()
            .to_string();
        assert!(err.starts_with("built-in x.yaml:5:"), "{err}");
        assert!(err.contains("entries[1]"), "{err}");
    }

    #[test]
    fn a_json_copy_that_disagrees_with_good_yaml_says_so() {
        let yaml = "entries:\n  - id: a\n    ratio: 0.4\n";
        let json = r#"{"entries":[{"id":"a"}]}"#;
        let err = parse::<File>(json, yaml, "built-in x.yaml")
            .unwrap_err()
            .to_string();
        assert!(err.contains("built-in x.yaml"), "{err}");
        assert!(err.contains("build-time JSON copy"), "{err}");
        assert!(err.contains("ratio"), "{err}");
    }
}
