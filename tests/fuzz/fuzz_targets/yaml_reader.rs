//! The one YAML reader: byte checks, document parsing and `locate`. No panic, no hang; every
//! refusal is a bad-input error (exit code 2).
#![no_main]

use libfuzzer_sys::fuzz_target;
use taut::input::yaml::{self, PathStep};

fuzz_target!(|bytes: &[u8]| {
    let text = match yaml::text_from_bytes(bytes.to_vec(), "fuzz.yaml") {
        Ok(text) => text,
        Err(err) => {
            assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT);
            return;
        }
    };
    if let Err(err) = yaml::parse::<serde_yaml::Value>(&text, "fuzz.yaml") {
        assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT);
    }
    // Field paths as the readers build them after deserialization.
    let paths: [&[PathStep<'_>]; 4] = [
        &[PathStep::Key("name")],
        &[PathStep::Key("courses"), PathStep::Index(1)],
        &[PathStep::Key("courses"), PathStep::Index(0), PathStep::Key("pitch")],
        &[PathStep::Key("a"), PathStep::Key("b"), PathStep::Index(2), PathStep::Key("c")],
    ];
    for path in paths {
        if let Some((line, column)) = yaml::locate(&text, path) {
            assert!(line >= 1 && column >= 1);
            assert!(line <= text.lines().count().max(1));
        }
    }
});
