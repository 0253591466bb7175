//! README.md stays true: every `$ taut …` line in its console blocks runs, succeeding unless the
//! README shows an error right after it; the outputs and errors it shows are current; its YAML
//! example is an instrument that plans; each `taut help TOPIC` it names exists; and the two
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

/// What README shows after each `$ taut` line: the lines up to the next `$ ` line or the end of
/// the block (empty when it shows nothing).
fn shown_outputs(text: &str) -> Vec<(String, String)> {
    let mut found = Vec::new();
    let mut current: Option<(String, String)> = None;
    for line in text.lines() {
        if line.starts_with("$ ") || line.starts_with("```") {
            found.extend(current.take());
            if let Some(command) = line.strip_prefix("$ taut ") {
                current = Some((command.to_string(), String::new()));
            }
        } else if let Some((_, shown)) = current.as_mut() {
            shown.push_str(line);
            shown.push('\n');
        }
    }
    found.extend(current);
    found
}

/// Every `$ taut …` line runs as README shows: it succeeds, or fails with exit code 2 when an
/// error follows it, and whatever output README shows after it is exactly what `taut` prints
/// today (standard output, or standard error for an error).
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
    let shown = shown_outputs(&text);
    assert_eq!(shown.len(), commands.len());
    let mut compared = Vec::new();
    for ((command, shows_error), (_, output_shown)) in commands.into_iter().zip(shown) {
        let output = common::taut()
            .args(words(&command))
            .env_remove("COLUMNS")
            .env_remove("NO_COLOR")
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
            assert_eq!(stderr, output_shown, "README's error of `taut {command}`");
        } else {
            assert!(output.status.success(), "taut {command} failed: {stderr}");
            if !output_shown.is_empty() {
                assert_eq!(
                    output_shown,
                    String::from_utf8_lossy(&output.stdout),
                    "README's output of `taut {command}` is out of date"
                );
                compared.push(command);
            }
        }
    }
    // The first screen's report is among the outputs checked in full.
    assert!(
        compared.first().map(String::as_str) == Some("plan guitar-19edo"),
        "{compared:?}"
    );
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

/// The YAML examples README shows are instrument files `taut` reads and plans. (The other
/// files' examples live in the reference topics: `help_topics.rs` checks them.)
#[test]
fn readme_yaml_examples_are_valid_instruments() {
    let text = readme();
    let blocks: Vec<&str> = text
        .split("```yaml\n")
        .skip(1)
        .filter_map(|rest| rest.split("```").next())
        .collect();
    assert!(!blocks.is_empty(), "README lost its instrument example");
    let stock = taut::strings::stock::Stock::builtin().unwrap();
    for block in blocks {
        let instrument =
            taut::instrument::Instrument::from_text(block.to_string(), "README instrument")
                .unwrap();
        let plan = taut::plan::solve::plan(
            &instrument,
            stock,
            &taut::plan::solve::SolveOptions::default(),
        )
        .unwrap();
        assert!(
            plan.warnings.is_empty(),
            "README's instrument plans with warnings"
        );
    }
}

/// Each `taut help NAME` README names is a topic or a subcommand, and every topic is named.
#[test]
fn readme_links_to_topics_that_exist() {
    let text = readme();
    let listed = common::table(&["help", "topics"]);
    let topics: Vec<&str> = listed
        .lines()
        .skip(1)
        .filter_map(|line| line.split_whitespace().next())
        .collect();
    assert!(topics.len() >= 10, "{listed}");
    let subcommands = [
        "plan", "tuning", "audit", "convert", "lengths", "frets", "survey", "generate", "help",
    ];
    let mut linked = 0;
    for (n, _) in text.match_indices("taut help ") {
        let rest = &text[n + "taut help ".len()..];
        let name: String = rest
            .chars()
            .take_while(|c| c.is_ascii_alphanumeric() || *c == '-')
            .collect();
        if ["TOPIC", "SUBCOMMAND", "topics", ""].contains(&name.as_str()) {
            continue;
        }
        assert!(
            topics.contains(&name.as_str()) || subcommands.contains(&name.as_str()),
            "README names `taut help {name}`, which is neither a topic nor a subcommand"
        );
        linked += 1;
    }
    assert!(linked >= 10, "README links to {linked} topics");
    for topic in topics {
        assert!(
            text.contains(&format!("`{topic}`")) || text.contains(&format!("taut help {topic}")),
            "README does not name the topic `{topic}`"
        );
    }
}
