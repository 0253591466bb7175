//! Where reports and set files go: through symlinks, into FIFOs and devices, keeping modes,
//! both or neither, `-` for standard input and output, and a reader that stops early. The
//! refusals (onto an input, a read-only file, a closed standard output) are in the bad-input
//! catalogue (`tests/it/bad_input.rs`); these are the writes that must succeed, and how.

use std::fs;
use std::os::unix::fs::{FileTypeExt, PermissionsExt};
use std::path::Path;
use std::process::{Command, Stdio};

use crate::common::taut;

const GUITAR: &str = include_str!("../../examples/steel-guitar-12edo.yaml");

fn folder_with_guitar() -> tempfile::TempDir {
    let dir = tempfile::tempdir().unwrap();
    fs::write(dir.path().join("guitar.yaml"), GUITAR).unwrap();
    dir
}

fn run_in(dir: &Path, args: &[&str]) -> std::process::Output {
    taut().current_dir(dir).args(args).output().unwrap()
}

fn ok_in(dir: &Path, args: &[&str]) {
    let output = run_in(dir, args);
    assert!(
        output.status.success(),
        "taut {args:?}: {}",
        String::from_utf8_lossy(&output.stderr)
    );
}

fn names(dir: &Path) -> Vec<String> {
    let mut names: Vec<String> = fs::read_dir(dir)
        .unwrap()
        .map(|e| e.unwrap().file_name().to_string_lossy().to_string())
        .collect();
    names.sort();
    names
}

#[test]
fn a_symlink_is_written_through_and_kept() {
    let dir = folder_with_guitar();
    fs::write(dir.path().join("target.txt"), "old").unwrap();
    std::os::unix::fs::symlink("target.txt", dir.path().join("link.txt")).unwrap();
    ok_in(dir.path(), &["plan", "guitar.yaml", "-o", "link.txt"]);
    let link = fs::symlink_metadata(dir.path().join("link.txt")).unwrap();
    assert!(link.file_type().is_symlink(), "the link was replaced");
    let report = fs::read_to_string(dir.path().join("target.txt")).unwrap();
    assert!(report.starts_with("Steel-string guitar"), "{report}");
    // A link to a file not made yet: the file is made, the link stays.
    std::os::unix::fs::symlink("later.txt", dir.path().join("ahead.txt")).unwrap();
    ok_in(dir.path(), &["plan", "guitar.yaml", "-o", "ahead.txt"]);
    assert!(fs::symlink_metadata(dir.path().join("ahead.txt"))
        .unwrap()
        .file_type()
        .is_symlink());
    assert!(fs::read_to_string(dir.path().join("later.txt"))
        .unwrap()
        .starts_with("Steel-string guitar"));
}

#[test]
fn the_mode_of_a_replaced_file_is_kept() {
    let dir = folder_with_guitar();
    for mode in [0o600, 0o640, 0o664] {
        let path = dir.path().join("report.txt");
        fs::write(&path, "old").unwrap();
        fs::set_permissions(&path, fs::Permissions::from_mode(mode)).unwrap();
        ok_in(dir.path(), &["plan", "guitar.yaml", "-o", "report.txt"]);
        let now = fs::metadata(&path).unwrap().permissions().mode() & 0o777;
        assert_eq!(now, mode, "mode {mode:o} became {now:o}");
        assert!(fs::read_to_string(&path).unwrap().contains("Total tension"));
    }
    assert_eq!(names(dir.path()), ["guitar.yaml", "report.txt"]);
}

#[test]
fn a_fifo_is_written_through_not_replaced() {
    let dir = folder_with_guitar();
    let fifo = dir.path().join("pipe");
    let made = Command::new("mkfifo").arg(&fifo).status().unwrap();
    assert!(made.success());
    // A reader on the other end, as a shell's `cat pipe` would be.
    let reader = Command::new("cat")
        .arg(&fifo)
        .stdout(Stdio::piped())
        .spawn()
        .unwrap();
    ok_in(
        dir.path(),
        &["plan", "guitar.yaml", "--format", "csv", "-o", "pipe"],
    );
    let read = reader.wait_with_output().unwrap();
    assert!(String::from_utf8_lossy(&read.stdout).starts_with("course,string"));
    assert!(fs::symlink_metadata(&fifo).unwrap().file_type().is_fifo());
}

#[test]
fn a_character_device_is_written_through_not_replaced() {
    // /dev/zero takes any write and stays a device; run as root, the old writer replaced device
    // nodes with regular files.
    let dir = folder_with_guitar();
    ok_in(dir.path(), &["plan", "guitar.yaml", "-o", "/dev/zero"]);
    assert!(fs::metadata("/dev/zero")
        .unwrap()
        .file_type()
        .is_char_device());
}

#[test]
fn dev_stdout_and_dash_go_to_standard_output() {
    let dir = folder_with_guitar();
    for target in ["-", "/dev/stdout"] {
        let output = run_in(dir.path(), &["plan", "guitar.yaml", "-o", target]);
        assert!(output.status.success());
        assert!(String::from_utf8_lossy(&output.stdout).starts_with("Steel-string guitar"));
    }
    assert_eq!(names(dir.path()), ["guitar.yaml"]);
}

#[test]
fn dash_reads_the_instrument_from_standard_input() {
    let output = taut()
        .args(["plan", "-", "--format", "json"])
        .write_stdin(GUITAR)
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    let plan: serde_json::Value = serde_json::from_slice(&output.stdout).unwrap();
    assert_eq!(plan["instrument"], "Steel-string guitar");
    // An error names standard input, not a file called `-`.
    let output = taut()
        .args(["plan", "-"])
        .write_stdin("name: x\n")
        .output()
        .unwrap();
    assert_eq!(output.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&output.stderr).starts_with("error: standard input"));
}

#[test]
fn save_set_and_report_are_both_written() {
    let dir = folder_with_guitar();
    fs::write(dir.path().join("set.yaml"), "old set").unwrap();
    ok_in(
        dir.path(),
        &[
            "plan",
            "guitar.yaml",
            "--save-set",
            "set.yaml",
            "-o",
            "report.txt",
        ],
    );
    let set = fs::read_to_string(dir.path().join("set.yaml")).unwrap();
    assert!(set.contains("tuning: \"12edo\""), "{set}");
    assert!(fs::read_to_string(dir.path().join("report.txt"))
        .unwrap()
        .contains("Total tension"));
    assert_eq!(names(dir.path()), ["guitar.yaml", "report.txt", "set.yaml"]);
    // The saved set reads back, with its tuning.
    ok_in(dir.path(), &["audit", "guitar.yaml", "--set", "set.yaml"]);
}

#[test]
fn a_reader_that_stops_early_is_not_an_error() {
    // README: "A closed pipe (`taut … | head`) ends quietly".
    // The reader closes its end before taut writes the 10,001-row listing.
    let dir = folder_with_guitar();
    let mut child = Command::new(env!("CARGO_BIN_EXE_taut"))
        .current_dir(dir.path())
        .args(["tuning", "show", "10000edo"])
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .unwrap();
    drop(child.stdout.take());
    let status = child.wait().unwrap();
    let mut stderr = String::new();
    std::io::Read::read_to_string(&mut child.stderr.take().unwrap(), &mut stderr).unwrap();
    assert_eq!(status.code(), Some(0), "{stderr}");
    assert!(stderr.is_empty(), "{stderr}");
}
