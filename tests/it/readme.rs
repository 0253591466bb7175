//! README.md stays true: every `$ taut …` line in its console blocks runs, succeeding unless the
//! README shows an error right after it; the outputs it shows in full are current; and the two
//! start-here commands are the ones CI runs.

use crate::common;

use std::path::Path;

fn root() -> &'static Path {
    Path::new(env!("CARGO_MANIFEST_DIR"))
}

fn readme() -> String {
    std::fs::read_to_string(root().join("README.md")).unwrap()
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

/// Splits a command line into words, keeping single-quoted words whole (as a shell would).
fn words(command: &str) -> Vec<String> {
    let mut words = Vec::new();
    let mut current = String::new();
    let mut quoted = false;
    for c in command.chars() {
        match c {
            '\'' => quoted = !quoted,
            ' ' if !quoted => {
                if !current.is_empty() {
                    words.push(std::mem::take(&mut current));
                }
            }
            _ => current.push(c),
        }
    }
    if !current.is_empty() {
        words.push(current);
    }
    words
}

#[test]
fn every_readme_command_behaves_as_shown() {
    let text = readme();
    let commands = console_commands(&text);
    assert!(
        commands.len() >= 10,
        "README lost its examples: {commands:?}"
    );
    // Commands run in a scratch folder holding a copy of examples/, so files they write
    // (`--output`, `--save-set`) land there and not in the repository.
    let scratch = tempfile::tempdir().unwrap();
    std::fs::create_dir(scratch.path().join("examples")).unwrap();
    for entry in std::fs::read_dir(root().join("examples")).unwrap() {
        let entry = entry.unwrap();
        if entry.file_type().unwrap().is_dir() {
            continue; // examples/pictures: README's images, not inputs
        }
        let copy = scratch.path().join("examples").join(entry.file_name());
        std::fs::copy(entry.path(), copy).unwrap();
    }
    for (command, shows_error) in commands {
        let output = common::taut()
            .args(words(&command))
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

/// The outputs README shows in full match what the binary prints today.
#[test]
fn readme_outputs_are_current() {
    let text = readme();
    for command in [
        "plan guitar-19edo",
        "plan examples/guitar-three-tunings.yaml",
        "audit examples/guitar-22edo-mode.yaml --set examples/steel-guitar-set.yaml --from-instrument examples/steel-guitar-12edo.yaml",
        "lengths examples/psaltery-layout.yaml",
        "frets guitar-19edo --up-to 200mm",
    ] {
        let marker = format!("$ taut {command}\n");
        let start = text
            .find(&marker)
            .unwrap_or_else(|| panic!("README lost `{marker}`"))
            + marker.len();
        let end = start + text[start..].find("```").unwrap();
        let output = common::taut()
            .args(words(command))
            .current_dir(root())
            .output()
            .unwrap();
        assert!(output.status.success(), "taut {command}");
        assert_eq!(
            &text[start..end],
            String::from_utf8_lossy(&output.stdout),
            "README's output of `taut {command}` is out of date"
        );
    }
}

#[test]
fn start_here_commands_match_ci() {
    let text = readme();
    assert!(text.contains("\ncargo run --release -- plan examples/guitar-19edo.yaml "));
    assert!(text.contains("\ncargo test --locked "));
    let ci = std::fs::read_to_string(root().join(".ci/run")).unwrap();
    assert!(
        ci.lines().any(|line| line.trim() == "cargo test --locked"),
        "{ci}"
    );
    assert!(root().join("examples/guitar-19edo.yaml").is_file());
}

/// The YAML examples README shows are files `taut` reads: an instrument, a stock file, an
/// instrument with fixed strings, an instrument with variants, a string set and a layout, in
/// that order.
#[test]
fn readme_yaml_examples_are_valid_files() {
    let text = readme();
    let blocks: Vec<&str> = text
        .split("```yaml\n")
        .skip(1)
        .filter_map(|rest| rest.split("```").next())
        .collect();
    assert_eq!(
        blocks.len(),
        6,
        "README's YAML examples changed: update this test"
    );
    let instrument =
        taut::instrument::Instrument::from_text(blocks[0].to_string(), "README instrument")
            .unwrap();
    let stock = taut::strings::stock::Stock::builtin().unwrap();
    taut::plan::solve::plan(
        &instrument,
        stock,
        &taut::plan::solve::SolveOptions::default(),
    )
    .unwrap();
    let mut own = stock.clone();
    own.add_text(blocks[1], "README stock").unwrap();
    let kept =
        taut::instrument::Instrument::from_text(blocks[2].to_string(), "README kept").unwrap();
    let plan =
        taut::plan::solve::plan(&kept, stock, &taut::plan::solve::SolveOptions::default()).unwrap();
    assert_eq!(
        plan.courses[0].strings[0].choice.standing,
        taut::plan::Standing::Fixed
    );
    let several =
        taut::instrument::Instrument::from_text(blocks[3].to_string(), "README variants").unwrap();
    let plan = taut::plan::several::plan(
        &several,
        stock,
        &taut::plan::several::SeveralOptions::default(),
    )
    .unwrap();
    assert_eq!(plan.tunings.len(), 3);
    taut::sets::set::StringSet::from_text(blocks[4].to_string(), "README set", &own).unwrap();
    let layout =
        taut::lengths::LayoutInput::from_text(blocks[5].to_string(), "README layout", stock)
            .unwrap();
    let laid = taut::lengths::lay_out(&layout, stock, &Default::default()).unwrap();
    assert_eq!(laid.string_count, 4);
}
