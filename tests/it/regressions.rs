//! Inputs that once made `taut` panic, hang, accept nonsense or say something unhelpful; each test
//! names the input and what happened before the fix.

use taut::error::EXIT_BAD_INPUT;
use taut::input::units::{Force, Length, Pressure};

/// Found by reading `units.rs`: `1e308kN` is a finite number, but times 1000 it overflowed to
/// infinity and was accepted as `Force(inf)`; a plan built on it would be all NaN.
#[test]
fn quantity_overflowing_on_conversion_is_refused() {
    for text in ["1e308kN", "1.7e308 kN", "1e305 GPa", "1e307 lb/in3"] {
        let refused = match text.split_whitespace().last() {
            Some("GPa") => text.parse::<Pressure>().err(),
            Some("lb/in3") => text.parse::<taut::input::units::Density>().err(),
            _ => text.parse::<Force>().err(),
        };
        let err = refused.unwrap_or_else(|| panic!("{text} was accepted"));
        assert_eq!(err.exit_code(), EXIT_BAD_INPUT);
        assert!(err.to_string().contains("too large"), "{err}");
    }
    // Finite values that convert are now refused too, by their plausible range (issue 8).
    for (text, refused) in [
        ("1e300kN", "1e300kN".parse::<Force>().err()),
        ("1e-300mm", "1e-300mm".parse::<Length>().err()),
    ] {
        let err = refused.unwrap_or_else(|| panic!("{text} was accepted"));
        assert!(err.to_string().contains("outside the range"), "{err}");
    }
}

/// Found by measuring the reader: a document of unclosed `[` (2 million of them, under the
/// 4 MiB limit) kept the YAML scanner busy for hours, because its work grows with the nesting
/// depth times the length (40,000 levels took 3.8 s in a release build). Now the reader refuses
/// at the 129th level, naming the line and column, before the scanner runs.
#[test]
fn unclosed_flow_brackets_are_refused_at_the_limit() {
    let text = format!("name: {}\n", "[".repeat(2_000_000));
    let err =
        taut::input::yaml::parse::<serde_yaml::Value>(&text, "deep.yaml").expect_err("accepted");
    let shown = err.to_string();
    // Column 7 is the first `[`; the 129th sits 128 columns further.
    assert!(shown.starts_with("deep.yaml:1:135:"), "{shown}");
    assert!(shown.contains("more than 128 levels"), "{shown}");
}

/// The same scan must not be fooled into a shallow count by `]` inside quoted scalars that
/// follow an anchor (`[&x "]", [&x "]", …` nests one level per item).
#[test]
fn quoted_brackets_after_anchors_do_not_hide_nesting() {
    let text = format!("a: {}\n", "[&x \"]\", ".repeat(200));
    let shown = taut::input::yaml::parse::<serde_yaml::Value>(&text, "q.yaml")
        .expect_err("accepted")
        .to_string();
    assert!(shown.contains("more than 128 levels"), "{shown}");
}

/// ... nor into refusing real files: brackets in quotes, comments and plain text, and a long
/// flow-style list of shallow items, are fine.
#[test]
fn brackets_in_text_and_long_flat_lists_are_accepted() {
    let text = format!(
        "a: \"{open}\"\nb: '{brace}'\n# {open}\nc: x[y\nd: [{items}]\ne: {nest}1{close}\n",
        open = "[".repeat(300),
        brace = "{".repeat(300),
        items = "{l: 1, p: \"]\"}, ".repeat(300),
        nest = "[".repeat(100),
        close = "]".repeat(100),
    );
    taut::input::yaml::parse::<serde_yaml::Value>(&text, "ok.yaml").expect("a real document");
}

/// An unclosed quote was reported as "found unexpected end of stream" at the end of the file,
/// with no word of the quote or where it opened.
#[test]
fn unclosed_quote_says_where_it_opened() {
    let shown = taut::input::yaml::parse::<serde_yaml::Value>("name: 'x\nload: 70N\n", "q.yaml")
        .expect_err("accepted")
        .to_string();
    assert!(
        shown.contains("quoted scalar that starts at line 1, column 7"),
        "{shown}"
    );
    assert!(shown.contains("help:"), "{shown}");
}

/// `a: b: c` was reported with "field `?`", which tells the user nothing.
#[test]
fn unnamed_place_is_not_shown_as_a_question_mark() {
    let shown = taut::input::yaml::parse::<serde_yaml::Value>("a: b: c\n", "m.yaml")
        .expect_err("accepted")
        .to_string();
    assert!(shown.starts_with("m.yaml:1:5: mapping values"), "{shown}");
    assert!(!shown.contains('?'), "{shown}");
}

/// A document nested 128 levels deep in block style was reported with a field path of 128
/// segments (`a.k.k.k…`, 260 characters); the path is now cut. (Deeper than 128 levels is now
/// refused before parsing; a mistake 110 levels down still has a long path.)
#[test]
fn deep_field_path_is_shortened() {
    let mut text = String::from("a:\n");
    for depth in 1..110 {
        text.push_str(&" ".repeat(depth));
        text.push_str("k:\n");
    }
    text.push_str(&" ".repeat(110));
    text.push_str("k: 1\n");
    text.push_str(&" ".repeat(110));
    text.push_str("k: 2\n");
    let shown = taut::input::yaml::parse::<serde_yaml::Value>(&text, "d.yaml")
        .expect_err("accepted")
        .to_string();
    assert!(shown.contains("…`"), "{shown}");
    assert!(
        shown.lines().next().is_some_and(|l| l.len() < 250),
        "{shown}"
    );
}

// ---------------------------------------------------------------------------------------------
// Found by the bad-input catalogue, through the real binary
// ---------------------------------------------------------------------------------------------

fn taut_in(dir: &std::path::Path, args: &[&str]) -> std::process::Output {
    assert_cmd::Command::cargo_bin("taut")
        .expect("the taut binary")
        .current_dir(dir)
        .args(args)
        .output()
        .expect("run taut")
}

fn instrument(tuning: &str, second_pitch: &str) -> String {
    format!(
        "name: Probe\ntuning: {tuning}\nscale_length: 648mm\ndefaults:\n  kinds: [plain-steel]\n  tension: 70N\ncourses:\n  - course: 1\n    pitch: E4\n  - course: 2\n    pitch: {second_pitch}\n"
    )
}

/// `taut plan /dev/zero` read until the machine ran out of memory: a device reports a length
/// of 0, so the size check passed and the read never ended.
#[test]
fn endless_device_is_cut_at_the_size_limit() {
    if !std::path::Path::new("/dev/zero").exists() {
        return;
    }
    let dir = tempfile::tempdir().expect("a scratch folder");
    let output = taut_in(dir.path(), &["plan", "/dev/zero"]);
    let stderr = String::from_utf8_lossy(&output.stderr);
    assert_eq!(output.status.code(), Some(2), "{stderr}");
    assert!(stderr.contains("goes on past 4194304 bytes"), "{stderr}");
}

/// A 3 MiB pitch on one line came back in the message whole, twice (6 MiB of standard error).
#[test]
fn a_huge_value_is_not_echoed_whole() {
    let dir = tempfile::tempdir().expect("a scratch folder");
    let text = instrument("12edo", &"B".repeat(3 << 20));
    std::fs::write(dir.path().join("long.yaml"), text).expect("write");
    let output = taut_in(dir.path(), &["plan", "long.yaml"]);
    let stderr = String::from_utf8_lossy(&output.stderr);
    assert_eq!(output.status.code(), Some(2));
    assert!(stderr.len() < 2000, "{} bytes of message", stderr.len());
    assert!(stderr.contains("characters)"), "{stderr}");
}

/// `tuning: 0edo` in an instrument file was reported as "tuning `0edo`:2:1: …": the line of the
/// file under the spec's label, and no file name.
#[test]
fn a_bad_inline_tuning_in_a_file_names_the_file() {
    let dir = tempfile::tempdir().expect("a scratch folder");
    std::fs::write(dir.path().join("i.yaml"), instrument("0edo", "B3")).expect("write");
    let output = taut_in(dir.path(), &["plan", "i.yaml"]);
    let stderr = String::from_utf8_lossy(&output.stderr);
    assert_eq!(output.status.code(), Some(2));
    assert!(
        stderr.starts_with("error: i.yaml:2:1: field `tuning`: tuning `0edo`"),
        "{stderr}"
    );
}

/// A key written twice was reported at line 1, column 1, without the field.
#[test]
fn a_duplicate_key_points_at_its_second_line() {
    let text = instrument("12edo", "B3").replace("tension: 70N", "tension: 70N\n  tension: 80N");
    let dir = tempfile::tempdir().expect("a scratch folder");
    std::fs::write(dir.path().join("d.yaml"), text).expect("write");
    let output = taut_in(dir.path(), &["plan", "d.yaml"]);
    let stderr = String::from_utf8_lossy(&output.stderr);
    assert!(
        stderr.starts_with("error: d.yaml:7:3: field `defaults.tension`: duplicate field"),
        "{stderr}"
    );
}

/// `taut tuning show 10000edo` refused its own default range (10,001 rows against a limit of
/// 10,000), blaming a `--to` the user never wrote.
#[test]
fn the_largest_tuning_lists_by_default() {
    let dir = tempfile::tempdir().expect("a scratch folder");
    let output = taut_in(
        dir.path(),
        &["tuning", "show", "10000edo", "--format", "json"],
    );
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
}

/// `taut lengths --string plain-steel:0.010in` answered "expected struct StringEntryFile": a Rust
/// type name instead of what to write.
#[test]
fn a_scalar_where_a_mapping_belongs_says_mapping() {
    let dir = tempfile::tempdir().expect("a scratch folder");
    let output = taut_in(
        dir.path(),
        &[
            "lengths",
            "--pitch",
            "E4",
            "--string",
            "plain-steel:0.010in",
            "--tension",
            "70N",
        ],
    );
    let stderr = String::from_utf8_lossy(&output.stderr);
    assert_eq!(output.status.code(), Some(2), "{stderr}");
    assert!(
        stderr.contains("expected a mapping of `key: value` pairs"),
        "{stderr}"
    );
    assert!(!stderr.contains("struct"), "{stderr}");
}

// ---------------------------------------------------------------------------------------------
// Found by fuzzing (tests/fuzz)
// ---------------------------------------------------------------------------------------------

/// Fuzz target `layout_file`, crash-7530d63f…: a list item indented by U+0085 (NEL) and two
/// spaces. `yaml::locate` took the NEL for indentation when finding the dash but not when
/// counting columns, then cut the line inside the two-byte NEL: "end of range should be a
/// character boundary" (a panic, exit 101).
const NEL_INDENTED_ITEM: &[u8] =
    b"# Lengthse psaltery, tep: 14%\ncourses:\n\xc2\x85  - {pitc\xc2\x85";

#[test]
fn list_item_indented_by_a_unicode_blank_does_not_panic() {
    let text = std::str::from_utf8(NEL_INDENTED_ITEM).expect("UTF-8");
    let steps = [
        taut::input::yaml::PathStep::Key("courses"),
        taut::input::yaml::PathStep::Index(0),
        taut::input::yaml::PathStep::Key("pitch"),
    ];
    let _ = taut::input::yaml::locate(text, &steps);
    let dir = tempfile::tempdir().expect("a scratch folder");
    std::fs::write(dir.path().join("nel.yaml"), NEL_INDENTED_ITEM).expect("write");
    let output = taut_in(dir.path(), &["lengths", "nel.yaml"]);
    let stderr = String::from_utf8_lossy(&output.stderr);
    assert_eq!(output.status.code(), Some(2), "{stderr}");
    assert!(!stderr.contains("panicked"), "{stderr}");
    assert!(stderr.starts_with("error: nel.yaml:"), "{stderr}");
}

// ---------------------------------------------------------------------------------------------
// Issue 8: tried as a new user would, with hostile input
// ---------------------------------------------------------------------------------------------

const GUITAR: &str = include_str!("../../examples/steel-guitar-12edo.yaml");
const GUITAR_SET: &str = include_str!("../../examples/steel-guitar-set.yaml");

fn scratch_with(files: &[(&str, &str)]) -> tempfile::TempDir {
    let dir = tempfile::tempdir().expect("a scratch folder");
    for (name, text) in files {
        std::fs::write(dir.path().join(name), text).expect("a scratch file");
    }
    dir
}

fn succeeds(dir: &std::path::Path, args: &[&str]) -> String {
    let output = taut_in(dir, args);
    assert!(
        output.status.success(),
        "taut {args:?}: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    String::from_utf8(output.stdout).expect("UTF-8 output")
}

/// A UTF-8 byte-order mark before the first key made that key unknown (`missing field
/// courses` when the first key was `courses`); it is now dropped.
#[test]
fn byte_order_mark_before_the_first_key_is_accepted() {
    let text = format!("\u{feff}{}", instrument("12edo", "B3"));
    let dir = scratch_with(&[("bom.yaml", &text)]);
    let out = succeeds(dir.path(), &["plan", "bom.yaml"]);
    assert!(out.starts_with("Probe · tuning 12edo"), "{out}");
}

/// `%YAML 1.1`, `---` and one document was refused as two documents.
#[test]
fn yaml_directive_then_one_document_is_accepted() {
    let text = format!("%YAML 1.1\n---\n{}", instrument("12edo", "B3"));
    let dir = scratch_with(&[("dir.yaml", &text)]);
    let out = succeeds(dir.path(), &["plan", "dir.yaml"]);
    assert!(out.starts_with("Probe · tuning 12edo"), "{out}");
}

/// Escape sequences in a name (`ESC ] 0 ; … BEL` retitles a terminal, `ESC [ 31 m` recolours
/// it) and a line break (which faked a line of the report) reached the terminal raw.
#[test]
fn control_characters_in_names_are_shown_escaped_in_tables() {
    let text = instrument("12edo", "B3").replace(
        "name: Probe",
        "name: \"Probe\\e]0;owned\\a\\e[31m\\nNo warnings.\"",
    );
    let dir = scratch_with(&[("esc.yaml", &text)]);
    let out = succeeds(dir.path(), &["plan", "esc.yaml"]);
    assert!(!out.contains('\u{1b}') && !out.contains('\u{7}'), "{out:?}");
    let first = out.lines().next().unwrap_or_default();
    assert_eq!(
        first,
        "Probe\\u{1b}]0;owned\\u{7}\\u{1b}[31m\\nNo warnings. · tuning 12edo · 648.0 mm scale"
    );
    // JSON keeps the name exactly (its own escapes make it safe).
    let json = succeeds(dir.path(), &["plan", "esc.yaml", "--format", "json"]);
    let value: serde_json::Value = serde_json::from_str(&json).expect("JSON");
    assert_eq!(
        value["instrument"],
        "Probe\u{1b}]0;owned\u{7}\u{1b}[31m\nNo warnings."
    );
}

/// A set file's `tuning:` was read and silently ignored (`tuning: 1e9edo` passed). It is now
/// checked where it is read (see the bad-input catalogue) and used as the tuning the strings
/// are in when no option names one.
#[test]
fn set_file_tuning_is_the_tuning_the_strings_are_in() {
    let set = GUITAR_SET.replace("tuning: 12edo", "tuning: 12edo@A4=415");
    let dir = scratch_with(&[("guitar.yaml", GUITAR), ("set.yaml", &set)]);
    let json = succeeds(
        dir.path(),
        &[
            "convert",
            "guitar.yaml",
            "--set",
            "set.yaml",
            "--format",
            "json",
        ],
    );
    let value: serde_json::Value = serde_json::from_str(&json).expect("JSON");
    // E4 at A4 = 415 Hz: 329.6276 · 415/440 = 310.899 Hz (ISO 16 E4, DERIVED).
    let before = value["courses"][0]["pitch_before_hz"]
        .as_f64()
        .expect("a frequency before");
    assert!((before - 310.899).abs() < 0.01, "{json}");
    let audit = succeeds(
        dir.path(),
        &[
            "audit",
            "guitar.yaml",
            "--set",
            "set.yaml",
            "--format",
            "json",
        ],
    );
    let value: serde_json::Value = serde_json::from_str(&audit).expect("JSON");
    // Audited in the instrument's own 12edo at A4 = 440 Hz, from the set's A4 = 415 Hz: tension
    // goes with f², so (440/415)² − 1 = 12.4% more (Mersenne's law, DERIVED).
    let change = value["courses"][0]["strings"][0]["tension_change_pct"]
        .as_f64()
        .expect("a tension change");
    assert!((change - 12.4).abs() < 0.2, "{change}");
}

/// Every format at the edges of the accepted ranges: no `inf`, no `NaN`, and no `null` where a
/// computed number belongs (fields named with a unit); only the documented optional figures
/// (no rated load given) may be null.
#[test]
fn extreme_accepted_input_gives_only_finite_numbers() {
    let extreme = |length: &str, tension: &str| {
        format!(
            "name: Extremes\nscale_length: {length}\ndefaults:\n  kinds: [plain-steel, nylon, phosphor-bronze-wound]\n  tension: {tension}\ncourses:\n  - pitch: 1hz\n  - pitch: 30000hz\n  - pitch: A0\n"
        )
    };
    let dir = scratch_with(&[
        ("long.yaml", &extreme("100m", "0.001N")),
        ("short.yaml", &extreme("1mm", "1000kN")),
    ]);
    for file in ["long.yaml", "short.yaml"] {
        for format in ["table", "json", "csv", "yaml"] {
            let out = succeeds(dir.path(), &["plan", file, "--format", format]);
            let lower = out.to_lowercase();
            for bad in ["nan", "inf ", "inf\n", "inf%", ".inf"] {
                assert!(!lower.contains(bad), "{file} {format}: `{bad}` in\n{out}");
            }
            if format == "json" {
                let value: serde_json::Value = serde_json::from_str(&out).expect("JSON");
                let mut nulls = Vec::new();
                null_numbers(&value, "", &mut nulls);
                assert!(nulls.is_empty(), "{file}: null numbers {nulls:?}");
            }
        }
    }
}

/// Keys whose value is null and whose name says it holds a quantity.
fn null_numbers(value: &serde_json::Value, key: &str, found: &mut Vec<String>) {
    const UNITS: [&str; 9] = [
        "_n",
        "_hz",
        "_m",
        "_mm",
        "_in",
        "_pct",
        "_ratio",
        "_kg_per_m",
        "_cents",
    ];
    match value {
        serde_json::Value::Null
            if UNITS.iter().any(|unit| key.ends_with(unit)) && key != "rated_load_n" =>
        {
            found.push(key.to_string())
        }
        serde_json::Value::Array(items) => {
            for item in items {
                null_numbers(item, key, found);
            }
        }
        serde_json::Value::Object(map) => {
            for (child, item) in map {
                null_numbers(item, child, found);
            }
        }
        _ => {}
    }
}
