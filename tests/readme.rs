//! README.md stays true: every `$ taut …` line in its console blocks runs, succeeding unless the
//! README shows an error right after it, and the two start-here commands are the ones CI runs.

mod common;

use std::path::Path;

fn readme() -> String {
    std::fs::read_to_string(Path::new(env!("CARGO_MANIFEST_DIR")).join("README.md")).unwrap()
}

/// `(command line, the README shows an error after it)` for each `$ taut` line.
fn console_commands(text: &str) -> Vec<(String, bool)> {
    let lines: Vec<&str> = text.lines().collect();
    lines
        .iter()
        .enumerate()
        .filter_map(|(n, line)| {
            let command = line.strip_prefix("$ taut ")?;
            let shows_error = lines
                .get(n + 1)
                .is_some_and(|next| next.starts_with("error:"));
            Some((command.to_string(), shows_error))
        })
        .collect()
}

#[test]
fn every_readme_command_behaves_as_shown() {
    let text = readme();
    let commands = console_commands(&text);
    assert!(
        commands.len() >= 8,
        "README lost its examples: {commands:?}"
    );
    let scratch = tempfile::tempdir().unwrap();
    for (command, shows_error) in commands {
        let args: Vec<&str> = command.split_whitespace().collect();
        let output = common::taut()
            .args(&args)
            .current_dir(scratch.path())
            .output()
            .unwrap();
        let stderr = String::from_utf8_lossy(&output.stderr);
        assert!(!stderr.contains("panicked"), "taut {command}: {stderr}");
        if shows_error {
            assert_eq!(
                output.status.code(),
                Some(2),
                "taut {command} should fail: {stderr}"
            );
        } else {
            assert!(output.status.success(), "taut {command} failed: {stderr}");
        }
    }
}

#[test]
fn readme_main_example_output_is_current() {
    let text = readme();
    let start =
        text.find("$ taut plan guitar-19edo\n").unwrap() + "$ taut plan guitar-19edo\n".len();
    let end = start + text[start..].find("```").unwrap();
    let shown = &text[start..end];
    let actual = common::table(&["plan", "guitar-19edo"]);
    assert_eq!(
        shown, actual,
        "README's first example differs from `taut plan guitar-19edo`"
    );
}

#[test]
fn start_here_commands_match_ci() {
    let text = readme();
    assert!(text.contains("cargo run --release -- plan examples/guitar-19edo.yaml"));
    assert!(text.contains("\ncargo test --locked "));
    let ci =
        std::fs::read_to_string(Path::new(env!("CARGO_MANIFEST_DIR")).join(".ci/run")).unwrap();
    assert!(
        ci.lines().any(|line| line.trim() == "cargo test --locked"),
        "{ci}"
    );
    assert!(Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("examples/guitar-19edo.yaml")
        .is_file());
}
