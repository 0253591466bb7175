//! Build script: converts the shipped string data (`src/strings/data/*.yaml`) to JSON in
//! `OUT_DIR`, where `src/strings/` embeds it with `include_str!`.
//!
//! Why: the YAML files are the source people read and edit, but parsing them with serde_yaml on
//! every run cost about 1.6 ms of an 18 ms `taut plan` (serde_yaml reads about 10 MB/s), while
//! serde_json reads the same data in tens of microseconds. Converting once here keeps the YAML
//! as the one source and makes loading the shipped stock nearly free. The runtime side is
//! `src/input/shipped.rs`; it runs the same validation as for user files, and a test
//! (`tests/it/strings_data.rs`) checks that reading the YAML and reading this JSON give identical
//! materials, catalogs and kinds.
//!
//! Only the syntax is converted here (YAML values to the same JSON values); every check of the
//! contents stays in the library, so a broken entry is reported with its line in the YAML file.

use std::path::{Path, PathBuf};
use std::process::ExitCode;

/// The shipped data files, by name without extension, under `src/strings/data/`.
const SHIPPED: [&str; 3] = ["materials", "gauges", "kinds"];

fn main() -> ExitCode {
    let (Some(manifest_dir), Some(out_dir)) = (
        std::env::var_os("CARGO_MANIFEST_DIR"),
        std::env::var_os("OUT_DIR"),
    ) else {
        eprintln!("taut's build script: cargo did not set CARGO_MANIFEST_DIR and OUT_DIR");
        return ExitCode::FAILURE;
    };
    let data_dir = Path::new(&manifest_dir).join("src/strings/data");
    for name in SHIPPED {
        let source = data_dir.join(format!("{name}.yaml"));
        println!("cargo:rerun-if-changed={}", source.display());
        let target = PathBuf::from(&out_dir).join(format!("{name}.json"));
        if let Err(message) = convert(&source, &target) {
            // Fail loudly and name the file: a shipped file that is not valid YAML cannot ship.
            eprintln!("taut's build script: {}: {message}", source.display());
            return ExitCode::FAILURE;
        }
    }
    ExitCode::SUCCESS
}

/// Reads one YAML document from `source` and writes the same value as compact JSON to `target`.
fn convert(source: &Path, target: &Path) -> Result<(), String> {
    let text = std::fs::read_to_string(source).map_err(|err| format!("cannot read it: {err}"))?;
    let value: serde_yaml::Value =
        serde_yaml::from_str(&text).map_err(|err| format!("not valid YAML: {err}"))?;
    // JSON has no non-string keys or tags; a file that uses them fails here rather than changing
    // meaning on the way.
    let json =
        serde_json::to_string(&value).map_err(|err| format!("cannot be written as JSON: {err}"))?;
    std::fs::write(target, json).map_err(|err| format!("cannot write {}: {err}", target.display()))
}
