//! `taut help TOPIC`: every reference topic prints and fits 100 columns, an unknown one is bad
//! input with a suggestion, clap's help for subcommands still works, and the facts moved out of
//! README stay true: the exit codes are the ones the binary uses, each file topic names every
//! field its file may hold (as the parser lists them), and each file topic's examples are files
//! `taut` reads.

use std::path::Path;

use crate::common;

fn topic_folder() -> std::path::PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("src/cli/topics")
}

/// The topic names `taut help topics` lists.
fn topic_names() -> Vec<String> {
    common::table(&["help", "topics"])
        .lines()
        .skip(1)
        .filter_map(|line| line.split_whitespace().next())
        .map(str::to_string)
        .collect()
}

fn topic(name: &str) -> String {
    common::table(&["help", name])
}

#[test]
fn every_topic_prints_its_file_and_every_file_is_a_topic() {
    let names = topic_names();
    assert!(names.len() >= 10, "{names:?}");
    let mut files: Vec<String> = std::fs::read_dir(topic_folder())
        .unwrap()
        .map(|entry| {
            let name = entry.unwrap().file_name().into_string().unwrap();
            name.strip_suffix(".txt").unwrap().to_string()
        })
        .collect();
    files.sort();
    let mut sorted = names.clone();
    sorted.sort();
    assert_eq!(
        files, sorted,
        "src/cli/topics/ and `taut help topics` differ"
    );
    for name in &names {
        let text = std::fs::read_to_string(topic_folder().join(format!("{name}.txt"))).unwrap();
        assert_eq!(topic(name), text, "taut help {name}");
    }
}

#[test]
fn topics_fit_100_columns() {
    for name in topic_names() {
        for (n, line) in topic(&name).lines().enumerate() {
            assert!(
                line.chars().count() <= 100,
                "topic {name}, line {}: {} columns",
                n + 1,
                line.chars().count()
            );
            assert!(
                !line.ends_with(' '),
                "topic {name}, line {}: trailing space",
                n + 1
            );
        }
    }
    for line in common::table(&["help", "topics"]).lines() {
        assert!(line.chars().count() <= 100, "{line}");
    }
}

#[test]
fn unknown_topics_are_bad_input_with_a_suggestion() {
    let stderr = common::bad_input(&["help", "exit-code"]);
    assert!(
        stderr.contains("`exit-code` is neither a subcommand nor a help topic"),
        "{stderr}"
    );
    assert!(stderr.contains("did you mean `exit-codes`?"), "{stderr}");
    assert!(stderr.contains("taut help topics"), "{stderr}");
    let stderr = common::bad_input(&["help", "instrument-fiel"]);
    assert!(
        stderr.contains("did you mean `instrument-file`?"),
        "{stderr}"
    );
    let stderr = common::bad_input(&["help", "zzzz"]);
    assert!(!stderr.contains("did you mean"), "{stderr}");
    let stderr = common::bad_input(&["help", "tuning", "shwo"]);
    assert!(stderr.contains("did you mean `show`?"), "{stderr}");
    common::bad_input(&["help", "exit-codes", "plan"]);
}

#[test]
fn help_for_subcommands_is_clap_s_own() {
    for path in [
        vec!["plan"],
        vec!["tuning", "show"],
        vec!["generate", "man"],
    ] {
        let mut args = vec!["help"];
        args.extend(&path);
        let via_help = common::table(&args);
        let mut args = path.clone();
        args.push("--help");
        assert_eq!(via_help, common::table(&args), "taut help {path:?}");
    }
    let main = common::table(&["help"]);
    assert_eq!(main, common::table(&["--help"]));
    assert!(main.contains("taut help topics"), "{main}");
}

/// The manual page carries every topic.
#[test]
fn the_manual_page_carries_every_topic() {
    let page = common::table(&["generate", "man"]);
    for name in topic_names() {
        let heading = format!(".SH \"TOPIC: {}\"", name.to_uppercase());
        assert!(page.contains(&heading), "no {heading}");
    }
    assert!(page.contains("bad input: a file, an inline spec or an option value"));
}

/// The codes `exit-codes` lists are the ones `taut` uses (`src/error.rs`), each with its
/// meaning, and the binary exits with them.
#[test]
fn exit_codes_topic_matches_the_binary() {
    let text = topic("exit-codes");
    let listed: Vec<(u8, &str)> = text
        .lines()
        .filter_map(|line| {
            let rest = line.strip_prefix("  ")?;
            let (code, meaning) = rest.split_once("  ")?;
            Some((code.parse().ok()?, meaning))
        })
        .collect();
    let codes: Vec<u8> = listed.iter().map(|(code, _)| *code).collect();
    assert_eq!(
        codes,
        [0, taut::error::EXIT_FAILURE, taut::error::EXIT_BAD_INPUT],
        "{text}"
    );
    assert!(listed[0].1.starts_with("success"));
    assert!(listed[1].1.starts_with("any other failure"));
    assert!(listed[2].1.starts_with("bad input"));
    // Bad input, a bad option and an unknown topic: the bad-input code.
    common::bad_input(&["tuning", "show", "pythagorian"]);
    common::bad_input(&["plan", "guitar-19edo", "--no-such-option"]);
    common::bad_input(&["help", "no-such-topic"]);
    // A report that cannot be written: the failure code.
    let output = common::taut()
        .args(["plan", "guitar-19edo", "-o", "/proc/version"])
        .output()
        .unwrap();
    assert_eq!(
        output.status.code(),
        Some(i32::from(taut::error::EXIT_FAILURE)),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
}

/// The fields the parser allows at one place in a file, from the message a misspelt key gets:
/// writes `text` (holding the key `zzz`) to a file, runs `args` with the file's path for
/// `FILE`, and reads the `help: allowed: …` line.
fn allowed_fields(args: &[&str], text: &str) -> Vec<String> {
    let folder = tempfile::tempdir().unwrap();
    let path = common::write_file(folder.path(), "probe.yaml", text);
    let path = path.to_str().unwrap();
    let args: Vec<&str> = args
        .iter()
        .map(|arg| if *arg == "FILE" { path } else { arg })
        .collect();
    let stderr = common::bad_input(&args);
    let allowed = stderr
        .lines()
        .find_map(|line| line.trim().strip_prefix("help: allowed: "))
        .unwrap_or_else(|| panic!("no list of fields for {text:?}: {stderr}"));
    allowed.split(", ").map(str::to_string).collect()
}

/// Each file topic names every field the parser allows, at every level probed.
#[test]
fn file_topics_name_every_field() {
    let instrument = ["plan", "FILE"];
    let stock = ["plan", "guitar-19edo", "--stock", "FILE"];
    let set = ["audit", "guitar-19edo", "--set", "FILE"];
    let layout = ["lengths", "FILE"];
    let survey = ["survey", "guitar-19edo", "FILE"];
    let tuning = ["tuning", "show", "FILE"];
    let one = "scale_length: 600mm\ncourses: [{pitch: A4}]\n";
    let probes: Vec<(&str, &[&str], String)> = vec![
        (
            "instrument-file",
            &instrument,
            format!("name: x\nzzz: 1\n{one}"),
        ),
        (
            "instrument-file",
            &instrument,
            format!("name: x\ndefaults: {{zzz: 1}}\n{one}"),
        ),
        (
            "instrument-file",
            &instrument,
            "name: x\nscale_length: 1m\ncourses: [{pitch: A4, zzz: 1}]\n".into(),
        ),
        (
            "instrument-file",
            &instrument,
            "name: x\nscale_length: 1m\ncourses: [{pitch: A4, strings: [{zzz: 1}]}]\n".into(),
        ),
        (
            "instrument-file",
            &instrument,
            "name: x\nscale_length: 1m\ncourses: [{pitch: A4, string: {zzz: 1}}]\n".into(),
        ),
        (
            "instrument-file",
            &instrument,
            format!("name: x\nfrets: {{zzz: 1}}\n{one}"),
        ),
        (
            "instrument-file",
            &instrument,
            format!("name: x\nfrets: {{board_width: {{zzz: 1}}}}\n{one}"),
        ),
        (
            "instrument-file",
            &instrument,
            format!("name: x\nvariants: [{{name: a, zzz: 1}}]\n{one}"),
        ),
        (
            "instrument-file",
            &instrument,
            format!("name: x\nstress_limits: {{zzz: 1}}\n{one}"),
        ),
        (
            "instrument-file",
            &instrument,
            "name: x\nscale_length: 1m\ncourses: [{pitch: A4, raises: {zzz: 1}}]\n".into(),
        ),
        (
            "instrument-file",
            &instrument,
            "name: x\nscale_length: 1m\ncourses: [{pitch: A4, raises: {pedal: {zzz: 1}}}]\n".into(),
        ),
        (
            "instrument-file",
            &instrument,
            format!("name: x\ndefaults: {{tension: {{min: 1N, zzz: 1}}}}\n{one}"),
        ),
        ("stock-file", &stock, "zzz: 1\n".into()),
        (
            "stock-file",
            &stock,
            "materials: [{id: a, zzz: 1}]\n".into(),
        ),
        ("stock-file", &stock, "catalogs: [{id: a, zzz: 1}]\n".into()),
        ("stock-file", &stock, "kinds: [{id: a, zzz: 1}]\n".into()),
        (
            "stock-file",
            &stock,
            "kinds: [{id: a, name: b, wound: {zzz: 1}}]\n".into(),
        ),
        (
            "stock-file",
            &stock,
            "kinds: [{id: a, name: b, measured: {zzz: 1}}]\n".into(),
        ),
        ("set-file", &set, "name: a\nzzz: 1\ncourses: []\n".into()),
        (
            "set-file",
            &set,
            "name: a\ncourses: [{course: 1, zzz: 1}]\n".into(),
        ),
        (
            "set-file",
            &set,
            "name: a\ncourses: [{course: 1, strings: [{zzz: 1}]}]\n".into(),
        ),
        (
            "layout-file",
            &layout,
            "name: a\nzzz: 1\ncourses: []\n".into(),
        ),
        (
            "layout-file",
            &layout,
            "name: a\ncourses: [{pitch: A3, zzz: 1}]\n".into(),
        ),
        (
            "layout-file",
            &layout,
            "name: a\nprefer: [{zzz: 1}]\ncourses: []\n".into(),
        ),
        (
            "layout-file",
            &layout,
            "name: a\nlength_window: {zzz: 1}\ncourses: []\n".into(),
        ),
        ("survey-file", &survey, "zzz: 1\n".into()),
        ("survey-file", &survey, "tunings: {zzz: 1}\n".into()),
        ("survey-file", &survey, "courses: {zzz: 1}\n".into()),
        ("survey-file", &survey, "offset_cents: {zzz: 1}\n".into()),
        ("tunings", &tuning, "name: a\nzzz: 1\n".into()),
        (
            "tunings",
            &tuning,
            "name: a\ndivisions: 12\nreference: {zzz: 1}\n".into(),
        ),
    ];
    for (name, args, text) in probes {
        let topic = topic(name);
        for field in allowed_fields(args, &text) {
            assert!(
                topic.contains(&format!("`{field}`"))
                    || topic.contains(&format!("{field}:"))
                    || topic.contains(&format!("  {field} ")),
                "`taut help {name}` does not name the field `{field}` (probe {text:?})"
            );
        }
    }
}

/// The example files a topic shows: blocks indented by four spaces after a blank line (the
/// continuation lines of a field list follow their field, never a blank line).
fn examples(text: &str) -> Vec<String> {
    let mut blocks = Vec::new();
    let mut current: Option<String> = None;
    let mut previous_blank = true;
    for line in text.lines() {
        match (line.strip_prefix("    "), current.as_mut()) {
            (Some(rest), Some(block)) => {
                block.push_str(rest);
                block.push('\n');
            }
            (Some(rest), None) if previous_blank => current = Some(format!("{rest}\n")),
            (_, _) => blocks.extend(current.take()),
        }
        previous_blank = line.is_empty();
    }
    blocks.extend(current);
    blocks
}

/// The examples in the file topics are files `taut` reads as they say.
#[test]
fn file_topic_examples_are_valid_files() {
    let stock = taut::strings::stock::Stock::builtin().unwrap();
    let options = taut::plan::solve::SolveOptions::default();
    let instruments = examples(&topic("instrument-file"));
    assert_eq!(instruments.len(), 4, "{instruments:?}");
    for block in &instruments {
        let instrument =
            taut::instrument::Instrument::from_text(block.clone(), "topic instrument").unwrap();
        taut::plan::solve::plan(&instrument, stock, &options).unwrap();
    }
    let kept = taut::instrument::Instrument::from_text(instruments[1].clone(), "kept").unwrap();
    let plan = taut::plan::solve::plan(&kept, stock, &options).unwrap();
    assert_eq!(
        plan.courses[0].strings[0].choice.standing,
        taut::plan::Standing::Fixed
    );
    let several =
        taut::instrument::Instrument::from_text(instruments[2].clone(), "variants").unwrap();
    let plan = taut::plan::several::plan(
        &several,
        stock,
        &taut::plan::several::SeveralOptions::default(),
    )
    .unwrap();
    assert_eq!(plan.tunings.len(), 3);

    let stocks = examples(&topic("stock-file"));
    assert_eq!(stocks.len(), 1);
    let mut own = stock.clone();
    own.add_text(&stocks[0], "topic stock").unwrap();

    for block in examples(&topic("set-file")) {
        taut::sets::set::StringSet::from_text(block, "topic set", &own).unwrap();
    }
    let layouts = examples(&topic("layout-file"));
    assert_eq!(layouts.len(), 2);
    let layout =
        taut::lengths::LayoutInput::from_text(layouts[0].clone(), "topic layout", stock).unwrap();
    let laid = taut::lengths::lay_out(&layout, stock, &Default::default()).unwrap();
    assert_eq!(laid.string_count, 4);
    // The second chooses every string: eight courses, each with a string of its kinds.
    let layout =
        taut::lengths::LayoutInput::from_text(layouts[1].clone(), "topic layout", stock).unwrap();
    let laid = taut::lengths::lay_out(&layout, stock, &Default::default()).unwrap();
    assert_eq!(laid.courses.len(), 8);
    assert!(laid.courses.iter().all(|c| c.chosen));
    assert!(laid.jumps.is_empty(), "{:?}", laid.jumps);

    let surveys = examples(&topic("survey-file"));
    assert_eq!(surveys.len(), 1);
    taut::survey::Settings::from_text(surveys[0].clone(), "topic survey").unwrap();

    let tunings = examples(&topic("tunings"));
    assert_eq!(tunings.len(), 1);
    let folder = tempfile::tempdir().unwrap();
    let path = common::write_file(folder.path(), "meantone.yaml", &tunings[0]);
    let shown = common::table(&["tuning", "show", path.to_str().unwrap(), "--to", "9"]);
    assert!(shown.contains("440.0000"), "{shown}");
}
