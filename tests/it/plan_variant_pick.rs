//! One variant of an instrument file, picked by name (`--variant`): pictures and string charts
//! for it, its audit; and the silent cases of several tunings made errors (a course retuned twice
//! in a variant, a `--tuning` that no variant would use), each with file, line and field.

use std::path::Path;

use crate::common;

const INSTRUMENT: &str = "name: Two courses\ntuning: 12edo\nscale_length: 648mm\n\
defaults:\n  tension: {target: 70N}\n  kinds: [plain-steel, phosphor-bronze-wound]\n\
courses:\n  - {course: 1, pitch: E4}\n  - {course: 2, pitch: A2}\n\
variants:\n  - name: standard\n  - name: dropped\n    pitches: {2: G2}\n\
\x20 - name: high\n    tuning: 12edo@A4=452hz\n";

fn run_in(folder: &Path, args: &[&str]) -> std::process::Output {
    common::taut()
        .args(args)
        .current_dir(folder)
        .output()
        .unwrap()
}

fn refused_in(folder: &Path, args: &[&str]) -> String {
    let output = run_in(folder, args);
    let stderr = String::from_utf8_lossy(&output.stderr).to_string();
    assert_eq!(output.status.code(), Some(2), "taut {args:?}: {stderr}");
    assert!(!stderr.contains("panicked"), "{stderr}");
    assert!(output.stdout.is_empty(), "taut {args:?} wrote output");
    stderr
}

#[test]
fn a_picked_variant_gets_its_pictures_and_string_chart() {
    let folder = tempfile::tempdir().unwrap();
    let dir = folder.path();
    common::write_file(dir, "two.yaml", INSTRUMENT);
    // Without a pick, the refusal names the option given and says how to pick.
    let stderr = refused_in(
        dir,
        &[
            "plan",
            "two.yaml",
            "--string-chart",
            "c.html",
            "-o",
            "p.txt",
        ],
    );
    assert!(stderr.starts_with("error: --string-chart:"), "{stderr}");
    assert!(stderr.contains("--variant NAME"), "{stderr}");
    assert!(stderr.contains("standard, dropped, high"), "{stderr}");
    assert!(!dir.join("p.txt").exists());
    let output = run_in(
        dir,
        &[
            "plan",
            "two.yaml",
            "--variant",
            "dropped",
            "--string-chart",
            "c.html",
            "--plot",
            "tension=t.svg",
            "-o",
            "p.txt",
        ],
    );
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    let report = std::fs::read_to_string(dir.join("p.txt")).unwrap();
    assert!(
        report.starts_with("Two courses (variant dropped)"),
        "{report}"
    );
    // Course 2 at the variant's pitch: G2, 98.00 Hz.
    assert!(report.contains("G2"), "{report}");
    assert!(report.contains("98.00"), "{report}");
    let page = std::fs::read_to_string(dir.join("c.html")).unwrap();
    assert!(page.contains("variant dropped"), "{page}");
    assert!(std::fs::read_to_string(dir.join("t.svg"))
        .unwrap()
        .contains("<svg"));
    // The variant's own tuning is used: A4 = 452 Hz puts E4 at 452·2^(-5/12) = 338.62 Hz.
    let high = run_in(dir, &["plan", "two.yaml", "--variant", "high"]);
    let text = String::from_utf8(high.stdout).unwrap();
    assert!(text.contains("338.62"), "{text}");
    // An audit of one variant draws its pictures too.
    common::write_file(
        dir,
        "set.yaml",
        "name: Set\ntuning: 12edo\ncourses:\n\
         \x20 - {course: 1, strings: [{kind: plain-steel, diameter: 0.010in}]}\n\
         \x20 - {course: 2, strings: [{kind: phosphor-bronze-wound, diameter: 0.035in}]}\n",
    );
    let stderr = refused_in(
        dir,
        &[
            "audit",
            "two.yaml",
            "--set",
            "set.yaml",
            "--plot",
            "stress=s.svg",
            "-o",
            "a.txt",
        ],
    );
    assert!(stderr.contains("--variant NAME"), "{stderr}");
    let audit = run_in(
        dir,
        &[
            "audit",
            "two.yaml",
            "--set",
            "set.yaml",
            "--variant",
            "dropped",
            "--plot",
            "stress=s.svg",
            "-o",
            "a.txt",
        ],
    );
    assert!(
        audit.status.success(),
        "{}",
        String::from_utf8_lossy(&audit.stderr)
    );
    assert!(dir.join("s.svg").exists());
}

#[test]
fn a_variant_name_that_is_not_there_is_bad_input() {
    let folder = tempfile::tempdir().unwrap();
    let dir = folder.path();
    common::write_file(dir, "two.yaml", INSTRUMENT);
    let stderr = refused_in(dir, &["plan", "two.yaml", "--variant", "hgh"]);
    assert!(stderr.contains("--variant"), "{stderr}");
    assert!(stderr.contains("did you mean `high`?"), "{stderr}");
    // A variant with its own tuning beside --tuning: the option would not apply.
    let stderr = refused_in(
        dir,
        &["plan", "two.yaml", "--variant", "high", "--tuning", "19edo"],
    );
    assert!(stderr.contains("two.yaml:15:"), "{stderr}");
    assert!(stderr.contains("field `variants[2].tuning`"), "{stderr}");
}

#[test]
fn a_course_retuned_twice_in_one_variant_is_refused() {
    let folder = tempfile::tempdir().unwrap();
    let dir = folder.path();
    common::write_file(
        dir,
        "twice.yaml",
        &INSTRUMENT.replace("pitches: {2: G2}", "pitches: {2: G2, 2: F2}"),
    );
    let stderr = refused_in(dir, &["plan", "twice.yaml"]);
    assert!(stderr.contains("twice.yaml:13:"), "{stderr}");
    assert!(stderr.contains("field `variants[1].pitches`"), "{stderr}");
    assert!(stderr.contains("course 2 is retuned twice"), "{stderr}");
}

#[test]
fn a_tuning_that_no_variant_would_use_is_refused() {
    let folder = tempfile::tempdir().unwrap();
    let dir = folder.path();
    common::write_file(
        dir,
        "own.yaml",
        &INSTRUMENT
            .replace(
                "  - name: standard\n",
                "  - name: standard\n    tuning: 12edo\n",
            )
            .replace(
                "  - name: dropped\n    pitches: {2: G2}\n",
                "  - name: dropped\n    tuning: 12edo\n    pitches: {2: G2}\n",
            ),
    );
    for command in [
        vec!["plan", "own.yaml", "--tuning", "19edo"],
        vec![
            "audit",
            "own.yaml",
            "--set",
            "steel-guitar-set",
            "--tuning",
            "19edo",
        ],
    ] {
        let stderr = refused_in(dir, &command);
        assert!(stderr.contains("own.yaml:10:"), "{stderr}");
        assert!(stderr.contains("field `variants`"), "{stderr}");
        assert!(stderr.contains("would apply to none of them"), "{stderr}");
    }
}
