//! `--output` writes whole files; a closed pipe ends the run quietly.

use crate::common::taut;

#[test]
fn output_file_holds_the_whole_report_and_nothing_else_is_left() {
    let folder = tempfile::tempdir().unwrap();
    let path = folder.path().join("degrees.json");
    std::fs::write(&path, "old").unwrap();
    let output = taut()
        .args(["tuning", "show", "31edo", "--format", "json", "-o"])
        .arg(&path)
        .output()
        .unwrap();
    assert!(output.status.success());
    assert!(output.stdout.is_empty());
    let report: serde_json::Value =
        serde_json::from_str(&std::fs::read_to_string(&path).unwrap()).unwrap();
    assert_eq!(report["rows"].as_array().unwrap().len(), 32);
    assert_eq!(std::fs::read_dir(folder.path()).unwrap().count(), 1);
}

#[test]
fn an_unwritable_output_fails_with_code_1_and_leaves_nothing() {
    let folder = tempfile::tempdir().unwrap();
    let path = folder.path().join("missing-folder").join("out.txt");
    let output = taut()
        .args(["tuning", "show", "12edo", "--output"])
        .arg(&path)
        .output()
        .unwrap();
    assert_eq!(output.status.code(), Some(1));
    assert!(String::from_utf8_lossy(&output.stderr).contains("cannot write"));
    assert_eq!(std::fs::read_dir(folder.path()).unwrap().count(), 0);
}

#[test]
fn a_closed_pipe_is_a_quiet_success() {
    // About a megabyte of rows into `head -n 1`, which closes the pipe early.
    let script = format!(
        "set -o pipefail; '{}' tuning show 53edo --from -5000 --to 4999 | head -n 1 >/dev/null",
        env!("CARGO_BIN_EXE_taut")
    );
    let output = std::process::Command::new("bash")
        .args(["-c", &script])
        .output()
        .unwrap();
    let stderr = String::from_utf8_lossy(&output.stderr);
    assert!(output.status.success(), "{stderr}");
    assert!(stderr.is_empty(), "{stderr}");
}
