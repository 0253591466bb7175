//! Helpers shared by the CLI tests: run the real `taut` binary and read its output.

use std::path::{Path, PathBuf};

use assert_cmd::Command;
use serde_json::Value;

/// The `taut` binary built for these tests.
pub fn taut() -> Command {
    Command::new(env!("CARGO_BIN_EXE_taut"))
}

/// Runs `taut ARGS --format json`, asserts success and parses standard output.
pub fn json(args: &[&str]) -> Value {
    let output = taut()
        .args(args)
        .args(["--format", "json"])
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "taut {args:?} failed: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    serde_json::from_slice(&output.stdout).unwrap()
}

/// Runs `taut ARGS`, asserts success and returns standard output.
pub fn table(args: &[&str]) -> String {
    let output = taut().args(args).output().unwrap();
    assert!(
        output.status.success(),
        "taut {args:?} failed: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    String::from_utf8(output.stdout).unwrap()
}

/// Runs `taut ARGS`, asserts exit code 2 (bad input), no panic and nothing on standard output,
/// and returns standard error.
pub fn bad_input(args: &[&str]) -> String {
    let output = taut().args(args).output().unwrap();
    let stderr = String::from_utf8_lossy(&output.stderr).to_string();
    assert_eq!(output.status.code(), Some(2), "taut {args:?}: {stderr}");
    assert!(
        !stderr.contains("panicked"),
        "taut {args:?} panicked: {stderr}"
    );
    assert!(output.stdout.is_empty(), "taut {args:?} wrote output");
    stderr
}

/// A number from a JSON value.
pub fn number(value: &Value) -> f64 {
    value
        .as_f64()
        .unwrap_or_else(|| panic!("not a number: {value}"))
}

/// Writes `text` to `name` inside `folder` and returns the path.
pub fn write_file(folder: &Path, name: &str, text: &str) -> PathBuf {
    let path = folder.join(name);
    std::fs::write(&path, text).unwrap();
    path
}
