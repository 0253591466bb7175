//! The bad-input catalogue: one test per class of mistake a user (or a hostile file) can make,
//! each run through the real `taut` binary.
//!
//! Every case checks the same promise (see [`refused`]): the run fails with the documented exit
//! code (2 for bad input, 1 for an output that cannot be written), standard error holds one
//! message that names the file and the line, column and field where there is one, nothing
//! panics, nothing goes to standard output, and the working folder is exactly as before: a
//! `--output` report that existed is left untouched and no partial or temporary file appears.

use std::collections::BTreeMap;
use std::path::Path;

use assert_cmd::Command;

// ---------------------------------------------------------------------------------------------
// Helpers: each case is a line or two.
// ---------------------------------------------------------------------------------------------

/// A valid instrument; cases change one thing in it. Line numbers below refer to this text.
const BASE: &str = "\
name: Probe
tuning: 12edo
scale_length: 648mm
defaults:
  kinds: [plain-steel]
  tension: 70N
courses:
  - course: 1
    pitch: E4
  - course: 2
    pitch: B3
";

/// A report from an earlier run, which a failed run must leave as it was.
const EARLIER_REPORT: &str = "an earlier report that a failed run must not touch\n";

/// Every file in `dir` (one level) with its bytes.
fn snapshot(dir: &Path) -> BTreeMap<String, Vec<u8>> {
    std::fs::read_dir(dir)
        .expect("list the scratch folder")
        .map(|entry| {
            let entry = entry.expect("a folder entry");
            let name = entry.file_name().to_string_lossy().to_string();
            let bytes = if entry.path().is_file() {
                std::fs::read(entry.path()).expect("read a scratch file")
            } else {
                b"<folder>".to_vec()
            };
            (name, bytes)
        })
        .collect()
}

/// A scratch folder holding `files` and an earlier `report.txt`.
fn scratch(files: &[(&str, &[u8])]) -> tempfile::TempDir {
    let dir = tempfile::tempdir().expect("a scratch folder");
    for (name, bytes) in files {
        std::fs::write(dir.path().join(name), bytes).expect("write a scratch file");
    }
    std::fs::write(dir.path().join("report.txt"), EARLIER_REPORT).expect("write the report");
    dir
}

/// Runs `taut ARGS` in `dir` and checks the promise every refusal keeps; returns standard error.
fn refused_with_code(dir: &Path, args: &[&str], code: i32) -> String {
    let before = snapshot(dir);
    let output = Command::cargo_bin("taut")
        .expect("the taut binary")
        .current_dir(dir)
        .args(args)
        .output()
        .expect("run taut");
    let stderr = String::from_utf8_lossy(&output.stderr).to_string();
    let short: String = stderr.chars().take(2000).collect();
    assert_eq!(output.status.code(), Some(code), "taut {args:?}: {short}");
    assert!(
        !stderr.contains("panicked"),
        "taut {args:?} panicked: {short}"
    );
    assert!(stderr.starts_with("error: "), "taut {args:?}: {short}");
    assert!(output.stdout.is_empty(), "taut {args:?} printed a report");
    assert!(
        stderr.len() < 4000,
        "taut {args:?}: a message of {} bytes",
        stderr.len()
    );
    assert_eq!(
        snapshot(dir),
        before,
        "taut {args:?} changed the folder: {short}"
    );
    stderr
}

/// Runs `taut ARGS` in a scratch folder holding [`BASE`] as `probe.yaml`; expects exit code 2.
fn cli_refuses(args: &[&str]) -> String {
    let dir = scratch(&[("probe.yaml", BASE.as_bytes())]);
    refused_with_code(dir.path(), args, 2)
}

/// `taut plan probe.yaml -o report.txt` on an instrument file holding `bytes`; expects exit 2.
fn plan_refuses(bytes: impl AsRef<[u8]>) -> String {
    let dir = scratch(&[("probe.yaml", bytes.as_ref())]);
    let stderr = refused_with_code(dir.path(), &["plan", "probe.yaml", "-o", "report.txt"], 2);
    assert!(
        stderr.contains("probe.yaml"),
        "the file is not named: {stderr}"
    );
    stderr
}

/// Like [`plan_refuses`], and the message points at `line` and names `field` (or a field below it).
fn plan_refuses_at(text: &str, line: usize, field: &str) -> String {
    let stderr = plan_refuses(text);
    assert!(
        stderr.starts_with(&format!("error: probe.yaml:{line}:")),
        "expected line {line}: {stderr}"
    );
    assert!(
        stderr.contains(&format!("field `{field}")),
        "expected field `{field}`: {stderr}"
    );
    stderr
}

/// [`BASE`] with one piece of text replaced (which must be there).
fn base_with(from: &str, to: &str) -> String {
    assert!(
        BASE.contains(from),
        "`{from}` is not in the base instrument"
    );
    BASE.replacen(from, to, 1)
}

/// [`BASE`] up to and including `courses:`, for cases that write their own courses.
fn base_without_courses() -> String {
    let end = BASE.find("courses:\n").expect("the base has courses") + "courses:\n".len();
    BASE[..end].to_string()
}

/// `taut tuning show scale.yaml -o report.txt` on a tuning file holding `bytes`; expects exit 2.
fn tuning_file_refuses(bytes: impl AsRef<[u8]>) -> String {
    let dir = scratch(&[("scale.yaml", bytes.as_ref())]);
    let stderr = refused_with_code(
        dir.path(),
        &["tuning", "show", "scale.yaml", "-o", "report.txt"],
        2,
    );
    assert!(
        stderr.contains("scale.yaml"),
        "the file is not named: {stderr}"
    );
    stderr
}

/// `taut tuning show SPEC -o report.txt` on an inline spec; expects exit 2 and the spec named.
fn inline_tuning_refuses(spec: &str) -> String {
    let stderr = cli_refuses(&["tuning", "show", spec, "-o", "report.txt"]);
    assert!(stderr.contains(&format!("tuning `{spec}`")), "{stderr}");
    stderr
}

/// `taut tuning find TUNING PITCH`; expects exit 2 and the pitch named.
fn pitch_refuses(tuning: &str, pitch: &str) -> String {
    let stderr = cli_refuses(&["tuning", "find", tuning, pitch, "-o", "report.txt"]);
    assert!(stderr.contains(&format!("`{pitch}`")), "{stderr}");
    stderr
}

// ---------------------------------------------------------------------------------------------
// Malformed YAML
// ---------------------------------------------------------------------------------------------

#[test]
fn yaml_tab_indentation() {
    let stderr = plan_refuses(base_with("  - course: 2", "\t- course: 2"));
    assert!(stderr.starts_with("error: probe.yaml:10:"), "{stderr}");
    assert!(stderr.contains("replace tabs with spaces"), "{stderr}");
}

#[test]
fn yaml_bad_indentation() {
    let stderr = plan_refuses(base_with("tuning: 12edo", "  tuning: 12edo"));
    assert!(stderr.starts_with("error: probe.yaml:2:"), "{stderr}");
}

#[test]
fn yaml_unclosed_quote() {
    let stderr = plan_refuses(base_with("name: Probe", "name: \"Probe"));
    assert!(stderr.contains("starts at line 1, column 7"), "{stderr}");
    assert!(stderr.contains("never closed"), "{stderr}");
}

#[test]
fn yaml_unclosed_flow_collection() {
    let stderr = plan_refuses(base_with("[plain-steel]", "[plain-steel"));
    assert!(stderr.contains("starts at line 5, column 10"), "{stderr}");
}

#[test]
fn yaml_more_than_one_document() {
    let stderr = plan_refuses(format!("{BASE}---\n{BASE}"));
    assert!(stderr.starts_with("error: probe.yaml:12:1:"), "{stderr}");
    assert!(stderr.contains("more than one YAML document"), "{stderr}");
}

#[test]
fn yaml_duplicate_key() {
    let stderr = plan_refuses_at(
        &base_with("tuning: 12edo", "tuning: 12edo\ntuning: 19edo"),
        3,
        "tuning",
    );
    assert!(stderr.contains("duplicate"), "{stderr}");
}

#[test]
fn yaml_top_level_is_not_a_mapping() {
    let stderr = plan_refuses("- course: 1\n- course: 2\n");
    assert!(stderr.starts_with("error: probe.yaml:1:"), "{stderr}");
}

#[test]
fn yaml_unknown_alias() {
    let stderr = plan_refuses(base_with("tuning: 12edo", "tuning: *chosen"));
    assert!(stderr.starts_with("error: probe.yaml:2:"), "{stderr}");
    assert!(stderr.contains("unknown anchor"), "{stderr}");
}

// ---------------------------------------------------------------------------------------------
// Schema: types, keys, required fields
// ---------------------------------------------------------------------------------------------

#[test]
fn wrong_type_text_for_a_number() {
    plan_refuses_at(
        &base_with("course: 2", "course: two"),
        10,
        "courses[1].course",
    );
}

#[test]
fn wrong_type_mapping_for_a_list() {
    plan_refuses_at(
        &base_with("  kinds: [plain-steel]", "  kinds: {plain-steel: yes}"),
        5,
        "defaults.kinds",
    );
}

#[test]
fn wrong_type_list_for_a_quantity() {
    plan_refuses_at(
        &base_with("scale_length: 648mm", "scale_length: [648mm]"),
        3,
        "scale_length",
    );
}

#[test]
fn unknown_key_suggests_the_right_one() {
    let stderr = plan_refuses_at(
        &base_with("scale_length:", "scale_lenght:"),
        3,
        "scale_lenght",
    );
    assert!(stderr.contains("did you mean `scale_length`?"), "{stderr}");
}

#[test]
fn unknown_key_in_a_course_lists_the_allowed() {
    let stderr = plan_refuses_at(
        &base_with("    pitch: B3", "    pitch: B3\n    varnish: red"),
        12,
        "courses[1].varnish",
    );
    assert!(
        stderr.contains("allowed:") && stderr.contains("pitch"),
        "{stderr}"
    );
}

#[test]
fn missing_required_field() {
    let stderr = plan_refuses_at(&base_with("    pitch: B3\n", ""), 10, "courses[1]");
    assert!(stderr.contains("pitch"), "{stderr}");
}

#[test]
fn no_courses() {
    let text = base_without_courses().replace("courses:\n", "courses: []\n");
    plan_refuses_at(&text, 7, "courses");
}

#[test]
fn empty_file() {
    assert!(plan_refuses("").contains("empty"));
}

#[test]
fn comments_only_file() {
    assert!(plan_refuses("# an instrument, one day\n\n   \n# nothing yet\n").contains("empty"));
}

#[test]
fn negative_count() {
    plan_refuses_at(
        &base_with("course: 2", "course: -2"),
        10,
        "courses[1].course",
    );
}

#[test]
fn count_too_large_for_its_type() {
    plan_refuses_at(
        &base_with("course: 2", "course: 99999999999999999999999"),
        10,
        "courses[1].course",
    );
}

#[test]
fn duplicate_course_numbers() {
    let stderr = plan_refuses_at(
        &base_with("course: 2", "course: 1"),
        10,
        "courses[1].course",
    );
    assert!(
        stderr.contains("used twice") && stderr.contains("line 8"),
        "{stderr}"
    );
}

#[test]
fn unknown_string_kind_suggests_the_closest() {
    let stderr = plan_refuses_at(
        &base_with("[plain-steel]", "[plain-stel]"),
        5,
        "defaults.kinds",
    );
    assert!(stderr.contains("plain-steel"), "{stderr}");
}

// ---------------------------------------------------------------------------------------------
// Numbers and quantities with units
// ---------------------------------------------------------------------------------------------

#[test]
fn quantity_without_unit() {
    let stderr = plan_refuses_at(&base_with("648mm", "648"), 3, "scale_length");
    assert!(stderr.contains("no unit"), "{stderr}");
}

#[test]
fn length_given_in_newtons() {
    let stderr = plan_refuses_at(&base_with("648mm", "70N"), 3, "scale_length");
    assert!(
        stderr.contains("is a force") && stderr.contains("needs a length"),
        "{stderr}"
    );
}

#[test]
fn tension_given_as_a_length() {
    let stderr = plan_refuses_at(
        &base_with("tension: 70N", "tension: 70mm"),
        6,
        "defaults.tension",
    );
    assert!(stderr.contains("is a length"), "{stderr}");
}

#[test]
fn unknown_unit_suggests_a_close_one() {
    let stderr = plan_refuses_at(&base_with("648mm", "648 mn"), 3, "scale_length");
    assert!(
        stderr.contains("unknown unit `mn`") && stderr.contains("did you mean"),
        "{stderr}"
    );
}

#[test]
fn negative_quantity() {
    plan_refuses_at(&base_with("648mm", "-648mm"), 3, "scale_length");
}

#[test]
fn zero_quantity() {
    plan_refuses_at(
        &base_with("tension: 70N", "tension: 0N"),
        6,
        "defaults.tension",
    );
}

#[test]
fn nan_quantity() {
    plan_refuses_at(&base_with("648mm", "NaN mm"), 3, "scale_length");
}

#[test]
fn infinite_quantity() {
    plan_refuses_at(&base_with("648mm", "inf mm"), 3, "scale_length");
    plan_refuses_at(&base_with("648mm", "1e999mm"), 3, "scale_length");
}

#[test]
fn quantity_that_overflows_when_converted() {
    let stderr = plan_refuses_at(
        &base_with("tension: 70N", "tension: 1e308kN"),
        6,
        "defaults.tension",
    );
    assert!(stderr.contains("too large"), "{stderr}");
}

#[test]
fn quantity_without_a_number() {
    let stderr = plan_refuses_at(&base_with("648mm", "mm"), 3, "scale_length");
    assert!(stderr.contains("no number"), "{stderr}");
}

#[test]
fn quantity_with_a_garbled_number() {
    let stderr = plan_refuses_at(&base_with("648mm", "6.4.8mm"), 3, "scale_length");
    assert!(stderr.contains("not a number"), "{stderr}");
}

#[test]
fn tension_window_upside_down() {
    plan_refuses_at(
        &base_with("tension: 70N", "tension: {min: 90N, max: 60N}"),
        6,
        "defaults.tension",
    );
}

// ---------------------------------------------------------------------------------------------
// Files that are not definition files
// ---------------------------------------------------------------------------------------------

#[test]
fn missing_instrument_file() {
    let stderr = cli_refuses(&["plan", "no-such.yaml", "-o", "report.txt"]);
    assert!(
        stderr.contains("`no-such.yaml` is neither a file nor a shipped example"),
        "{stderr}"
    );
}

#[test]
fn missing_tuning_file() {
    let stderr = cli_refuses(&["tuning", "show", "no-such.yaml", "-o", "report.txt"]);
    assert!(stderr.contains("no-such.yaml"), "{stderr}");
}

#[test]
fn folder_given_as_a_file() {
    let stderr = cli_refuses(&["plan", ".", "-o", "report.txt"]);
    assert!(stderr.contains("folder"), "{stderr}");
    let stderr = cli_refuses(&["tuning", "show", ".", "-o", "report.txt"]);
    assert!(stderr.contains("folder"), "{stderr}");
}

#[test]
fn path_through_a_regular_file() {
    // A path whose "folder" is a file fails reliably, even for root.
    let stderr = cli_refuses(&["plan", "probe.yaml/inner.yaml", "-o", "report.txt"]);
    assert!(stderr.contains("probe.yaml/inner.yaml"), "{stderr}");
}

#[test]
fn binary_file() {
    let stderr = plan_refuses(b"name: x\n\x89PNG\r\n\x1a\n\0\0\0\rIHDR");
    assert!(
        stderr.starts_with("error: probe.yaml:4:1:") && stderr.contains("binary"),
        "{stderr}"
    );
}

#[test]
fn non_utf8_text() {
    // "Saitenstärke" in Latin-1: the ä is the byte 0xE4.
    let stderr = plan_refuses(b"name: Saitenst\xe4rke\n");
    assert!(
        stderr.starts_with("error: probe.yaml:1:15:") && stderr.contains("UTF-8"),
        "{stderr}"
    );
}

#[test]
fn file_over_the_size_limit() {
    let padding = "# padding\n".repeat((taut::input::yaml::MAX_INPUT_BYTES as usize) / 10 + 1);
    let stderr = plan_refuses(format!("{BASE}{padding}"));
    assert!(stderr.contains("at most 4194304 bytes"), "{stderr}");
}

#[test]
fn endless_device_as_input() {
    if !Path::new("/dev/zero").exists() {
        return;
    }
    let stderr = cli_refuses(&["plan", "/dev/zero", "-o", "report.txt"]);
    assert!(
        stderr.contains("/dev/zero") && stderr.contains("at most"),
        "{stderr}"
    );
}

// ---------------------------------------------------------------------------------------------
// Documents built (or mistaken) to eat the machine
// ---------------------------------------------------------------------------------------------

#[test]
fn alias_bomb() {
    let mut text = String::from("a0: &a0 [x, x, x, x, x, x, x, x, x, x]\n");
    for level in 1..12 {
        let previous = format!("*a{}", level - 1);
        let row = [previous.as_str(); 10].join(", ");
        text.push_str(&format!("a{level}: &a{level} [{row}]\n"));
    }
    let stderr = plan_refuses(format!("{BASE}{text}"));
    assert!(stderr.contains("help:"), "{stderr}");
}

#[test]
fn deeply_nested_flow_document() {
    let stderr = plan_refuses(base_with("Probe", &"[".repeat(1_000_000)));
    assert!(stderr.starts_with("error: probe.yaml:1:135:"), "{stderr}");
    assert!(stderr.contains("more than 128 levels"), "{stderr}");
}

#[test]
fn deeply_nested_block_document() {
    let mut nested = String::from("about:\n");
    for depth in 1..1000 {
        nested.push_str(&" ".repeat(depth));
        nested.push_str("k:\n");
    }
    let stderr = plan_refuses(format!("{BASE}{nested}"));
    assert!(stderr.contains("probe.yaml:"), "{stderr}");
}

#[test]
fn very_long_line() {
    // A 3 MiB pitch on one line: under the size limit, so it reaches the pitch reader, whose
    // message must not echo it whole.
    let stderr = plan_refuses_at(
        &base_with("pitch: B3", &format!("pitch: {}", "B".repeat(3 << 20))),
        11,
        "courses[1].pitch",
    );
    assert!(stderr.len() < 4000);
}

#[test]
fn more_courses_than_the_limit() {
    let mut text = base_without_courses();
    for number in 1..=1001 {
        text.push_str(&format!("  - {{course: {number}, pitch: E4}}\n"));
    }
    let stderr = plan_refuses_at(&text, 7, "courses");
    assert!(stderr.contains("at most 1000"), "{stderr}");
}

#[test]
fn a_million_courses() {
    // Ten bytes a course is the least YAML allows, so a million courses cannot fit the size limit.
    let mut text = base_without_courses();
    text.push_str(&"- {pitch: E4}\n".repeat(1_000_000));
    let stderr = plan_refuses(text);
    assert!(stderr.contains("at most 4194304 bytes"), "{stderr}");
}

#[test]
fn edo_of_a_billion() {
    let stderr = inline_tuning_refuses("1000000000edo");
    assert!(stderr.contains("at most 10000"), "{stderr}");
}

#[test]
fn edo_too_large_for_any_integer() {
    let stderr = inline_tuning_refuses("1000000000000000000000000000000edo");
    assert!(stderr.contains("at most 10000"), "{stderr}");
}

#[test]
fn tuning_file_with_a_billion_divisions() {
    let stderr = tuning_file_refuses("name: wide\ndivisions: 1000000000\n");
    assert!(
        stderr.starts_with("error: scale.yaml:2:") && stderr.contains("at most 10000"),
        "{stderr}"
    );
}

#[test]
fn largest_accepted_tuning_lists_with_defaults() {
    // Not a refusal: the largest tuning taut accepts must list without options (it once asked
    // for `--to` because one period and its closing degree came to 10,001 rows).
    let dir = scratch(&[]);
    Command::cargo_bin("taut")
        .expect("the taut binary")
        .current_dir(dir.path())
        .args([
            "tuning", "show", "10000edo", "--format", "json", "-o", "all.json",
        ])
        .assert()
        .success();
    let listing: serde_json::Value = serde_json::from_slice(
        &std::fs::read(dir.path().join("all.json")).expect("the listing was written"),
    )
    .expect("JSON");
    assert_eq!(listing["rows"].as_array().map(Vec::len), Some(10_001));
}

#[test]
fn listing_range_too_long() {
    let stderr = cli_refuses(&[
        "tuning",
        "show",
        "12edo",
        "--from=-1000000000",
        "--to=1000000000",
        "-o",
        "report.txt",
    ]);
    assert!(stderr.contains("at most 10001"), "{stderr}");
}

// ---------------------------------------------------------------------------------------------
// Tunings: inline specs, files, references
// ---------------------------------------------------------------------------------------------

#[test]
fn zero_divisions() {
    inline_tuning_refuses("0edo");
}

#[test]
fn period_not_wider_than_a_unison() {
    assert!(inline_tuning_refuses("12ed1/1").contains("wider than a unison"));
    assert!(inline_tuning_refuses("12ed-1200c").contains("wider than a unison"));
}

#[test]
fn ratio_with_zero_denominator() {
    assert!(inline_tuning_refuses("12ed3/0").contains("zero denominator"));
}

#[test]
fn cents_not_ascending() {
    assert!(inline_tuning_refuses("cents:0,700,400").contains("ascending"));
}

#[test]
fn frequency_list_with_nan_or_negative() {
    inline_tuning_refuses("hertz:100,nan");
    inline_tuning_refuses("hertz:-100,200");
}

#[test]
fn empty_inline_list() {
    inline_tuning_refuses("ratios:");
}

#[test]
fn unknown_tuning_name() {
    let stderr = cli_refuses(&["tuning", "show", "pythagorian-12", "-o", "report.txt"]);
    assert!(stderr.contains("pythagorean-12"), "{stderr}");
}

#[test]
fn bad_reference() {
    inline_tuning_refuses("12edo@A4=0");
    inline_tuning_refuses("12edo@Z9");
}

#[test]
fn tuning_file_unknown_key() {
    let stderr = tuning_file_refuses("name: x\ndivisons: 19\n");
    assert!(
        stderr.starts_with("error: scale.yaml:2:") && stderr.contains("did you mean `divisions`?"),
        "{stderr}"
    );
}

#[test]
fn tuning_file_with_two_layouts() {
    let stderr = tuning_file_refuses("name: x\ndivisions: 19\ncents: [0, 100]\n");
    assert!(stderr.contains("scale.yaml"), "{stderr}");
}

#[test]
fn instrument_naming_an_unknown_tuning() {
    plan_refuses_at(
        &base_with("tuning: 12edo", "tuning: 19-edo-ish"),
        2,
        "tuning",
    );
}

// ---------------------------------------------------------------------------------------------
// Pitches
// ---------------------------------------------------------------------------------------------

#[test]
fn pitch_the_tuning_cannot_address_on_the_command_line() {
    let stderr = pitch_refuses("19edo", "E2");
    assert!(stderr.contains("~E2"), "{stderr}");
    pitch_refuses("hertz:98,110,123.47", "deg5");
}

#[test]
fn pitch_the_tuning_cannot_address_in_a_file() {
    let stderr = plan_refuses_at(
        &base_with("tuning: 12edo", "tuning: 19edo"),
        9,
        "courses[0].pitch",
    );
    assert!(stderr.contains("~E4"), "{stderr}");
}

#[test]
fn pitch_that_is_not_a_pitch() {
    pitch_refuses("12edo", "H7");
    pitch_refuses("12edo", "E2+abc");
    plan_refuses_at(
        &base_with("pitch: B3", "pitch: B-flat"),
        11,
        "courses[1].pitch",
    );
}

#[test]
fn degree_too_large_for_any_integer() {
    pitch_refuses("12edo", "deg99999999999999999999");
}

#[test]
fn degree_too_far_to_have_a_frequency() {
    assert!(pitch_refuses("12edo", "deg9223372036854775807").contains("too far"));
}

// ---------------------------------------------------------------------------------------------
// Options and arguments
// ---------------------------------------------------------------------------------------------

#[test]
fn option_value_outside_its_choices() {
    let stderr = cli_refuses(&["plan", "probe.yaml", "--format", "xml", "-o", "report.txt"]);
    assert!(stderr.contains("possible values"), "{stderr}");
}

#[test]
fn tension_option_with_the_wrong_dimension() {
    let stderr = cli_refuses(&[
        "plan",
        "probe.yaml",
        "--tension",
        "70mm",
        "-o",
        "report.txt",
    ]);
    assert!(
        stderr.contains("--tension") && stderr.contains("is a length"),
        "{stderr}"
    );
}

#[test]
fn tension_option_window_upside_down() {
    let stderr = cli_refuses(&[
        "plan",
        "probe.yaml",
        "--tension",
        "90N..60N",
        "-o",
        "report.txt",
    ]);
    assert!(stderr.contains("--tension"), "{stderr}");
}

#[test]
fn tuning_option_that_is_not_a_tuning() {
    let stderr = cli_refuses(&[
        "plan",
        "probe.yaml",
        "--tuning",
        "1e9edo",
        "-o",
        "report.txt",
    ]);
    assert!(stderr.contains("--tuning"), "{stderr}");
}

#[test]
fn number_option_too_large() {
    cli_refuses(&[
        "tuning",
        "show",
        "12edo",
        "--from",
        "99999999999999999999",
        "-o",
        "report.txt",
    ]);
}

#[test]
fn range_option_backwards() {
    let stderr = cli_refuses(&[
        "tuning",
        "show",
        "12edo",
        "--from",
        "10",
        "--to",
        "5",
        "-o",
        "report.txt",
    ]);
    assert!(stderr.contains("backwards"), "{stderr}");
}

#[test]
fn odd_limit_not_offered() {
    let stderr = cli_refuses(&["tuning", "fit", "12edo", "--limit", "4", "-o", "report.txt"]);
    assert!(stderr.contains("--limit"), "{stderr}");
}

#[test]
fn missing_argument_and_unknown_option() {
    cli_refuses(&["plan"]);
    cli_refuses(&["plan", "probe.yaml", "--gauge-everything"]);
}

// ---------------------------------------------------------------------------------------------
// Output files (exit code 1: the input was fine, the report could not be written)
// ---------------------------------------------------------------------------------------------

fn output_refused(target: &str) -> String {
    let dir = scratch(&[("probe.yaml", BASE.as_bytes())]);
    let stderr = refused_with_code(dir.path(), &["plan", "probe.yaml", "-o", target], 1);
    assert!(
        stderr.contains(target),
        "the output path is not named: {stderr}"
    );
    stderr
}

#[test]
fn output_in_a_missing_folder() {
    output_refused("no-such-folder/report.txt");
}

#[test]
fn output_under_a_regular_file() {
    // The "folder" is a file: fails reliably, even for root.
    output_refused("probe.yaml/report.txt");
}

#[test]
fn output_onto_a_folder() {
    let dir = scratch(&[("probe.yaml", BASE.as_bytes())]);
    std::fs::create_dir(dir.path().join("reports")).expect("a folder");
    refused_with_code(dir.path(), &["plan", "probe.yaml", "-o", "reports"], 1);
}

#[test]
fn failed_run_keeps_the_input_it_would_overwrite() {
    // Writing the report over its own (bad) input must leave the input as it was.
    let bad = base_with("648mm", "648");
    let dir = scratch(&[("probe.yaml", bad.as_bytes())]);
    refused_with_code(dir.path(), &["plan", "probe.yaml", "-o", "probe.yaml"], 2);
}

// ---------------------------------------------------------------------------------------------
// String sets, stock files and layouts (audit, convert, plan --stock, lengths)
// ---------------------------------------------------------------------------------------------

const GUITAR: &str = include_str!("../../examples/steel-guitar-12edo.yaml");
const GUITAR_SET: &str = include_str!("../../examples/steel-guitar-set.yaml");
const LAYOUT: &str = include_str!("../../examples/psaltery-layout.yaml");

/// `taut ARGS` in a scratch folder holding the guitar as `guitar.yaml` and `files`; expects 2.
fn with_guitar_refuses(files: &[(&str, &str)], args: &[&str]) -> String {
    let mut all: Vec<(&str, &[u8])> = vec![("guitar.yaml", GUITAR.as_bytes())];
    all.extend(files.iter().map(|(name, text)| (*name, text.as_bytes())));
    let dir = scratch(&all);
    refused_with_code(dir.path(), args, 2)
}

fn changed(text: &str, from: &str, to: &str) -> String {
    assert!(text.contains(from), "`{from}` is not in the example");
    text.replacen(from, to, 1)
}

#[test]
fn set_file_quantity_without_unit() {
    let set = changed(GUITAR_SET, "diameter: 0.016in", "diameter: 0.016");
    let stderr = with_guitar_refuses(
        &[("set.yaml", &set)],
        &[
            "audit",
            "guitar.yaml",
            "--set",
            "set.yaml",
            "-o",
            "report.txt",
        ],
    );
    assert!(
        stderr.contains("set.yaml:") && stderr.contains("field `courses[1].strings[0].diameter`"),
        "{stderr}"
    );
}

#[test]
fn set_file_unknown_kind() {
    let set = changed(
        GUITAR_SET,
        "kind: plain-steel, diameter: 0.012in",
        "kind: plain-steal, diameter: 0.012in",
    );
    let stderr = with_guitar_refuses(
        &[("set.yaml", &set)],
        &[
            "audit",
            "guitar.yaml",
            "--set",
            "set.yaml",
            "-o",
            "report.txt",
        ],
    );
    assert!(
        stderr.contains("set.yaml:") && stderr.contains("did you mean `plain-steel`?"),
        "{stderr}"
    );
}

#[test]
fn set_file_missing() {
    let stderr = with_guitar_refuses(
        &[],
        &[
            "audit",
            "guitar.yaml",
            "--set",
            "no-such-set.yaml",
            "-o",
            "report.txt",
        ],
    );
    assert!(stderr.contains("no-such-set.yaml"), "{stderr}");
}

#[test]
fn stock_file_with_a_bare_density() {
    let stock = "materials:\n  - id: shelf-wire\n    density: 7850\n";
    let stderr = with_guitar_refuses(
        &[("stock.yaml", stock)],
        &[
            "plan",
            "guitar.yaml",
            "--stock",
            "stock.yaml",
            "-o",
            "report.txt",
        ],
    );
    assert!(
        stderr.starts_with("error: stock.yaml:3:") && stderr.contains("materials[0].density"),
        "{stderr}"
    );
}

#[test]
fn convert_with_a_scale_length_in_newtons() {
    let stderr = with_guitar_refuses(
        &[("set.yaml", GUITAR_SET)],
        &[
            "convert",
            "guitar.yaml",
            "--set",
            "set.yaml",
            "--scale-length",
            "70N",
            "-o",
            "report.txt",
        ],
    );
    assert!(
        stderr.contains("--scale-length") && stderr.contains("is a force"),
        "{stderr}"
    );
}

#[test]
fn convert_with_a_nan_bend() {
    let stderr = with_guitar_refuses(
        &[("set.yaml", GUITAR_SET)],
        &[
            "convert",
            "guitar.yaml",
            "--set",
            "set.yaml",
            "--bend",
            "nan",
            "-o",
            "report.txt",
        ],
    );
    assert!(stderr.contains("--bend"), "{stderr}");
}

#[test]
fn layout_file_negative_percentage() {
    let layout = changed(LAYOUT, "max_step: 15%", "max_step: -15%");
    let stderr = with_guitar_refuses(
        &[("layout.yaml", &layout)],
        &["lengths", "layout.yaml", "-o", "report.txt"],
    );
    assert!(
        stderr.contains("layout.yaml:") && stderr.contains("field `max_step`"),
        "{stderr}"
    );
}

#[test]
fn layout_file_pitch_out_of_range() {
    let layout = changed(LAYOUT, "{pitch: G3,", "{pitch: G99999,");
    let stderr = with_guitar_refuses(
        &[("layout.yaml", &layout)],
        &["lengths", "layout.yaml", "-o", "report.txt"],
    );
    assert!(
        stderr.contains("field `courses[0].pitch`") && stderr.contains("octave 99999"),
        "{stderr}"
    );
}

const HARP_LAYOUT: &str = include_str!("../../examples/lever-harp-36-layout.yaml");

/// The harp layout with one change, through `taut lengths … --save-instrument`: refused with
/// file, line and field, neither the report nor the instrument file written.
fn harp_layout_refuses(from: &str, to: &str, field: &str) -> String {
    let layout = changed(HARP_LAYOUT, from, to);
    let stderr = with_guitar_refuses(
        &[("layout.yaml", &layout)],
        &[
            "lengths",
            "layout.yaml",
            "--save-instrument",
            "harp.yaml",
            "-o",
            "report.txt",
        ],
    );
    assert!(
        stderr.contains("layout.yaml:") && stderr.contains(&format!("field `{field}`")),
        "{stderr}"
    );
    stderr
}

#[test]
fn layout_file_unknown_kind_to_choose_from() {
    let stderr = harp_layout_refuses(
        "kinds: [nylon, copper-wound-steel]",
        "kinds: [nylom, copper-wound-steel]",
        "kinds[0]",
    );
    assert!(stderr.contains("did you mean `nylon`?"), "{stderr}");
}

#[test]
fn layout_file_prefer_rule_with_two_pitches() {
    harp_layout_refuses(
        "{below: G2, kinds:",
        "{below: G2, above: C6, kinds:",
        "prefer[0]",
    );
}

#[test]
fn layout_file_prefer_rule_pitch_the_tuning_cannot_address() {
    harp_layout_refuses("{below: G2,", "{below: Q2,", "prefer[0].below");
}

#[test]
fn layout_file_length_window_upside_down() {
    harp_layout_refuses(
        "length_window: {min: 60mm, max: 1450mm}",
        "length_window: {min: 1450mm, max: 60mm}",
        "length_window",
    );
}

#[test]
fn layout_file_negative_length_window() {
    harp_layout_refuses(
        "length_window: {min: 60mm,",
        "length_window: {min: -60mm,",
        "length_window.min",
    );
}

#[test]
fn layout_file_working_stress_out_of_range() {
    harp_layout_refuses(
        "kinds: [nylon, copper-wound-steel]",
        "working_stress: 120%\nkinds: [nylon, copper-wound-steel]",
        "working_stress",
    );
}

#[test]
fn layout_file_course_without_string_or_kinds() {
    let layout = changed(HARP_LAYOUT, "kinds: [nylon, copper-wound-steel]\n", "");
    let stderr = with_guitar_refuses(
        &[("layout.yaml", &layout)],
        &["lengths", "layout.yaml", "-o", "report.txt"],
    );
    assert!(
        stderr.contains("does not say its string") && stderr.contains("kinds"),
        "{stderr}"
    );
}

#[test]
fn inline_string_without_unit() {
    let stderr = with_guitar_refuses(
        &[],
        &[
            "lengths",
            "--pitch",
            "E4",
            "--string",
            "{kind: plain-steel, diameter: 0.010}",
            "--tension",
            "70N",
            "-o",
            "report.txt",
        ],
    );
    assert!(
        stderr.contains("--string") && stderr.contains("no unit"),
        "{stderr}"
    );
}

#[test]
fn a_variant_retuning_a_course_the_instrument_lacks() {
    // BASE has 11 lines; `variants:` is line 12, the course key line 15.
    let text = format!("{BASE}variants:\n  - name: up\n    pitches:\n      9: E5\n");
    let stderr = plan_refuses_at(&text, 15, "variants[0].pitches.9");
    assert!(stderr.contains("course 9 is not a course"), "{stderr}");
}

#[test]
fn a_variant_pitch_its_tuning_cannot_address() {
    let text = format!("{BASE}variants:\n  - name: a\n  - name: b\n    tuning: 19edo\n");
    // Course 1's `E4` is not a degree of 19-EDO: the course's line, naming the variant.
    let stderr = plan_refuses_at(&text, 9, "courses[0].pitch");
    assert!(stderr.contains("variant `b`"), "{stderr}");
}

#[test]
fn several_tunings_beside_the_files_variants() {
    let dir = scratch(&[(
        "probe.yaml",
        format!("{BASE}variants:\n  - name: a\n").as_bytes(),
    )]);
    let stderr = refused_with_code(
        dir.path(),
        &[
            "plan",
            "probe.yaml",
            "--tuning",
            "12edo",
            "--tuning",
            "19edo",
            "-o",
            "report.txt",
        ],
        2,
    );
    assert!(stderr.contains("--tuning"), "{stderr}");
}

// ---------------------------------------------------------------------------------------------
// Quantities outside what a real instrument can have (each names the range it breaks)
// ---------------------------------------------------------------------------------------------

#[test]
fn lengths_outside_their_range() {
    for length in ["1e300m", "1e-300mm", "0.5mm", "101m"] {
        let stderr = plan_refuses_at(&base_with("648mm", length), 3, "scale_length");
        assert!(stderr.contains("1 mm to 100 m"), "{stderr}");
    }
}

#[test]
fn tensions_and_loads_outside_their_range() {
    let stderr = plan_refuses_at(
        &base_with("tension: 70N", "tension: 1e300N"),
        6,
        "defaults.tension",
    );
    assert!(stderr.contains("0.001 N to 1000 kN"), "{stderr}");
    let stderr = plan_refuses_at(
        &base_with(
            "scale_length: 648mm",
            "scale_length: 648mm\nrated_load: 1e-9N",
        ),
        4,
        "rated_load",
    );
    assert!(stderr.contains("outside the range"), "{stderr}");
}

#[test]
fn pitches_outside_the_range_of_any_string() {
    for pitch in ["1e6c", "-1e6c", "1e30hz", "0.001hz", "C-9", "3000000/1"] {
        let stderr = plan_refuses_at(
            &base_with("pitch: E4", &format!("pitch: {pitch}")),
            9,
            "courses[0].pitch",
        );
        assert!(
            stderr.contains("1 Hz to 30 kHz") || stderr.contains("out of"),
            "{pitch}: {stderr}"
        );
    }
    let stderr = pitch_refuses("12edo", "1e6c");
    assert!(stderr.contains("1 Hz to 30 kHz"), "{stderr}");
}

#[test]
fn references_outside_the_range_of_any_string() {
    for tuning in ["12edo@A4=1e30", "12edo@A4=1e-30", "12edo@C-10=440"] {
        let stderr = plan_refuses_at(
            &base_with("tuning: 12edo", &format!("tuning: {tuning}")),
            2,
            "tuning",
        );
        assert!(stderr.contains("1 Hz to 30 kHz"), "{tuning}: {stderr}");
        let stderr = inline_tuning_refuses(tuning);
        assert!(stderr.contains("1 Hz to 30 kHz"), "{tuning}: {stderr}");
    }
}

#[test]
fn tuning_frequencies_and_periods_outside_their_range() {
    let stderr = tuning_file_refuses("name: x\ndescription: y\nhertz: [98, 110, 1e30]\n");
    assert!(
        stderr.contains("hertz[2]") && stderr.contains("1 Hz to 30 kHz"),
        "{stderr}"
    );
    let stderr = inline_tuning_refuses("2ed1e300c");
    assert!(stderr.contains("ten octaves"), "{stderr}");
}

/// `taut plan guitar.yaml --stock stock.yaml -o report.txt` on a stock file holding `stock`.
fn stock_refuses(stock: &str) -> String {
    let stderr = with_guitar_refuses(
        &[("stock.yaml", stock)],
        &[
            "plan",
            "guitar.yaml",
            "--stock",
            "stock.yaml",
            "-o",
            "report.txt",
        ],
    );
    assert!(stderr.starts_with("error: stock.yaml:"), "{stderr}");
    stderr
}

#[test]
fn stock_catalog_diameters_outside_their_range() {
    for diameter in ["1e300m", "1e-300mm"] {
        let stock = format!(
            "catalogs:\n  - id: shelf\n    name: Shelf\n    diameters: [0.5mm, {diameter}]\n    source: demo\n"
        );
        let stderr = stock_refuses(&stock);
        assert!(
            stderr.contains("catalogs[0].diameters") && stderr.contains("0.01 mm to 25 mm"),
            "{stderr}"
        );
    }
}

#[test]
fn stock_densities_and_strengths_outside_their_range() {
    for (density, strength) in [
        ("1e300kg/m3", "2000MPa"),
        ("1e-300kg/m3", "2000MPa"),
        ("7850kg/m3", "1e300MPa"),
    ] {
        let stock = format!(
            "materials:\n  - id: shelf-wire\n    name: Shelf wire\n    density: {density}\n    elastic_modulus: 200GPa\n    breaking_strength: {strength}\n    source: demo\n"
        );
        let stderr = stock_refuses(&stock);
        assert!(stderr.contains("outside the range"), "{stderr}");
    }
}

#[test]
fn stock_core_ratio_outside_its_range() {
    let stock = "kinds:\n  - id: odd-wound\n    name: Odd\n    wound:\n      core: {material: music-wire, shape: round, ratio: 1e-300}\n      wraps: [phosphor-bronze]\n    catalog: wound-inch\n    source: demo\n";
    let stderr = stock_refuses(stock);
    assert!(
        stderr.contains("kinds[0].wound.core.ratio") && stderr.contains("0.05 to 0.95"),
        "{stderr}"
    );
}

#[test]
fn stock_measured_string_implying_an_impossible_density() {
    // 1 mm across and 77.8 g/m: 99,000 kg/m³ through, four times the densest metal.
    let stock = "kinds:\n  - id: drawer\n    name: Drawer\n    measured:\n      material: nylon\n      strings:\n        - {diameter: 1.00mm, unit_mass: 77.8g/m}\n    source: demo\n";
    let stderr = stock_refuses(stock);
    assert!(
        stderr.contains("kinds[0].measured.strings[0]") && stderr.contains("kg/m3 through"),
        "{stderr}"
    );
}

#[test]
fn set_file_diameters_and_measured_strings_outside_their_range() {
    for (from, to, field) in [
        ("diameter: 0.016in", "diameter: 1e-300mm", "diameter"),
        ("diameter: 0.016in", "diameter: 1e300m", "diameter"),
        (
            "{kind: plain-steel, diameter: 0.016in}",
            "{unit_mass: 77.8g/m, diameter: 1mm}",
            "unit_mass",
        ),
        (
            "{kind: plain-steel, diameter: 0.016in}",
            "{mass: 1e-300g, length: 900mm}",
            "mass",
        ),
    ] {
        let set = changed(GUITAR_SET, from, to);
        let stderr = with_guitar_refuses(
            &[("set.yaml", &set)],
            &[
                "audit",
                "guitar.yaml",
                "--set",
                "set.yaml",
                "-o",
                "report.txt",
            ],
        );
        assert!(
            stderr.starts_with("error: set.yaml:13:")
                && stderr.contains(&format!("courses[1].strings[0].{field}")),
            "{to}: {stderr}"
        );
    }
}

#[test]
fn set_file_tuning_that_does_not_load() {
    let set = changed(GUITAR_SET, "tuning: 12edo", "tuning: 1e9edo");
    for command in ["audit", "convert"] {
        let stderr = with_guitar_refuses(
            &[("set.yaml", &set)],
            &[
                command,
                "guitar.yaml",
                "--set",
                "set.yaml",
                "-o",
                "report.txt",
            ],
        );
        assert!(
            stderr.starts_with("error: set.yaml:8:") && stderr.contains("field `tuning`"),
            "{stderr}"
        );
    }
}

#[test]
fn command_line_quantities_outside_their_range() {
    let stderr = with_guitar_refuses(
        &[("set.yaml", GUITAR_SET)],
        &[
            "convert",
            "guitar.yaml",
            "--set",
            "set.yaml",
            "--scale-length",
            "1e300m",
            "-o",
            "report.txt",
        ],
    );
    assert!(
        stderr.contains("--scale-length") && stderr.contains("1 mm to 100 m"),
        "{stderr}"
    );
    let stderr = with_guitar_refuses(
        &[],
        &[
            "lengths",
            "--pitch",
            "E4",
            "--string",
            "{kind: plain-steel, diameter: 1e-300mm}",
            "--tension",
            "70N",
            "-o",
            "report.txt",
        ],
    );
    assert!(
        stderr.contains("--string") && stderr.contains("0.01 mm to 25 mm"),
        "{stderr}"
    );
    let stderr = cli_refuses(&[
        "plan",
        "probe.yaml",
        "--tension",
        "1e300N",
        "-o",
        "report.txt",
    ]);
    assert!(stderr.contains("--tension"), "{stderr}");
}

#[test]
fn laid_out_length_outside_its_range() {
    // A thick wound string at a high pitch and a light tension would need a 0.1 mm length.
    let stderr = with_guitar_refuses(
        &[],
        &[
            "lengths",
            "--pitch",
            "C8",
            "--string",
            "{kind: phosphor-bronze-wound, diameter: 0.056in}",
            "--tension",
            "0.01N",
            "-o",
            "report.txt",
        ],
    );
    assert!(stderr.contains("1 mm to 100 m"), "{stderr}");
}

// ---------------------------------------------------------------------------------------------
// YAML edge cases
// ---------------------------------------------------------------------------------------------

#[test]
fn merge_keys_are_named() {
    let text = base_with(
        "courses:\n  - course: 1\n",
        "courses:\n  - <<: {pitch: E4}\n    course: 1\n",
    );
    let stderr = plan_refuses(text);
    assert!(
        stderr.contains("merge keys (`<<:`) are not supported"),
        "{stderr}"
    );
}

#[test]
fn four_megabytes_of_nested_block_sequences() {
    let text = format!("{}x\n", "- ".repeat(2_000_000));
    let stderr = plan_refuses(text);
    assert!(
        stderr.starts_with("error: probe.yaml:1:257:") && stderr.contains("more than 128 levels"),
        "{stderr}"
    );
}

#[test]
fn control_characters_in_error_messages_are_escaped() {
    let stderr = plan_refuses(base_with(
        "pitch: B3",
        "pitch: \"B3\\e]0;owned\\a\\e[31m\\nerror: fake\"",
    ));
    assert!(
        !stderr.contains('\u{1b}') && !stderr.contains('\u{7}'),
        "{stderr:?}"
    );
    assert!(stderr.contains("\\u{1b}]0;owned\\u{7}"), "{stderr}");
    assert_eq!(
        stderr.lines().filter(|l| l.starts_with("error:")).count(),
        1
    );
}

// ---------------------------------------------------------------------------------------------
// Outputs that would destroy an input or lose a file
// ---------------------------------------------------------------------------------------------

#[test]
fn output_onto_the_instrument_file_itself() {
    for target in ["probe.yaml", "./probe.yaml", "../probe-dir/probe.yaml"] {
        let dir = tempfile::tempdir().expect("a scratch folder");
        let inner = dir.path().join("probe-dir");
        std::fs::create_dir(&inner).expect("a folder");
        std::fs::write(inner.join("probe.yaml"), BASE).expect("the instrument");
        std::fs::write(inner.join("report.txt"), EARLIER_REPORT).expect("the report");
        let stderr = refused_with_code(&inner, &["plan", "probe.yaml", "-o", target], 2);
        assert!(
            stderr.contains("--output") && stderr.contains("one of this command's inputs"),
            "{stderr}"
        );
    }
}

#[test]
fn output_onto_an_input_through_a_symlink() {
    let dir = scratch(&[("probe.yaml", BASE.as_bytes())]);
    std::os::unix::fs::symlink("probe.yaml", dir.path().join("link.yaml")).expect("a link");
    refused_with_code(dir.path(), &["plan", "probe.yaml", "-o", "link.yaml"], 2);
    refused_with_code(dir.path(), &["plan", "link.yaml", "-o", "probe.yaml"], 2);
}

#[test]
fn output_onto_every_kind_of_input() {
    let stock = "materials:\n  - id: shelf-wire\n    name: Shelf wire\n    density: 7850kg/m3\n    elastic_modulus: 200GPa\n    breaking_strength: 2000MPa\n    source: demo\n";
    let scale = "name: x\ndescription: y\ndivisions: 12\n";
    let layout = LAYOUT.replace("tuning: 12edo", "tuning: scale.yaml");
    let files: &[(&str, &str)] = &[
        ("set.yaml", GUITAR_SET),
        ("stock.yaml", stock),
        ("scale.yaml", scale),
        ("layout.yaml", &layout),
    ];
    let audit = |target: &'static str, flag: &'static str| {
        let mut args = vec![
            "audit",
            "guitar.yaml",
            "--set",
            "set.yaml",
            "--stock",
            "stock.yaml",
            "--tuning",
            "scale.yaml@A4=440",
        ];
        args.extend([flag, target]);
        args
    };
    for target in ["guitar.yaml", "set.yaml", "stock.yaml", "scale.yaml"] {
        let stderr = with_guitar_refuses(files, &audit(target, "-o"));
        assert!(stderr.contains("one of this command's inputs"), "{stderr}");
    }
    for args in [
        vec!["lengths", "layout.yaml", "-o", "layout.yaml"],
        vec!["lengths", "layout.yaml", "-o", "scale.yaml"],
        vec!["tuning", "show", "scale.yaml", "-o", "scale.yaml"],
        vec!["plan", "guitar.yaml", "--save-set", "guitar.yaml"],
        vec![
            "convert",
            "guitar.yaml",
            "--set",
            "set.yaml",
            "--save-set",
            "set.yaml",
            "-o",
            "report.txt",
        ],
    ] {
        let stderr = with_guitar_refuses(files, &args);
        assert!(stderr.contains("one of this command's inputs"), "{stderr}");
    }
}

#[test]
fn save_set_and_output_onto_the_same_file() {
    let stderr = cli_refuses(&[
        "plan",
        "probe.yaml",
        "--save-set",
        "report.txt",
        "-o",
        "./report.txt",
    ]);
    assert!(stderr.contains("name the same place"), "{stderr}");
    let stderr = cli_refuses(&[
        "plan",
        "probe.yaml",
        "--save-set",
        "new.yaml",
        "-o",
        "new.yaml",
    ]);
    assert!(stderr.contains("name the same place"), "{stderr}");
}

#[test]
fn output_onto_a_read_only_file() {
    use std::os::unix::fs::PermissionsExt;
    let dir = scratch(&[("probe.yaml", BASE.as_bytes())]);
    let report = dir.path().join("report.txt");
    std::fs::set_permissions(&report, std::fs::Permissions::from_mode(0o444)).expect("chmod");
    // Refused even when run as root, who could write it: the mode bits say read-only.
    let stderr = refused_with_code(dir.path(), &["plan", "probe.yaml", "-o", "report.txt"], 1);
    assert!(stderr.contains("read-only (mode 0444)"), "{stderr}");
}

#[test]
fn save_set_is_not_written_when_the_report_cannot_be() {
    // The report's folder is missing: neither file appears.
    let stderr = cli_refuses_with_code(
        &[
            "plan",
            "probe.yaml",
            "--save-set",
            "set.yaml",
            "-o",
            "no-such-folder/report.txt",
        ],
        1,
    );
    assert!(stderr.contains("no-such-folder/report.txt"), "{stderr}");
    // The report is read-only: the set is not written either.
    use std::os::unix::fs::PermissionsExt;
    let dir = scratch(&[("probe.yaml", BASE.as_bytes())]);
    std::fs::set_permissions(
        dir.path().join("report.txt"),
        std::fs::Permissions::from_mode(0o400),
    )
    .expect("chmod");
    refused_with_code(
        dir.path(),
        &[
            "plan",
            "probe.yaml",
            "--save-set",
            "set.yaml",
            "-o",
            "report.txt",
        ],
        1,
    );
}

/// Like [`cli_refuses`] with another exit code.
fn cli_refuses_with_code(args: &[&str], code: i32) -> String {
    let dir = scratch(&[("probe.yaml", BASE.as_bytes())]);
    refused_with_code(dir.path(), args, code)
}

#[test]
fn closed_standard_output() {
    // `taut plan probe.yaml >&-`: the report has nowhere to go, and the set is not written.
    let dir = scratch(&[("probe.yaml", BASE.as_bytes())]);
    let before = snapshot(dir.path());
    let output = std::process::Command::new("sh")
        .current_dir(dir.path())
        .arg("-c")
        .arg(format!(
            "'{}' plan probe.yaml --save-set set.yaml >&-",
            env!("CARGO_BIN_EXE_taut")
        ))
        .output()
        .expect("run sh");
    let stderr = String::from_utf8_lossy(&output.stderr);
    assert_eq!(output.status.code(), Some(1), "{stderr}");
    assert!(
        stderr.starts_with("error: cannot write standard output: standard output is closed"),
        "{stderr}"
    );
    assert_eq!(snapshot(dir.path()), before);
}

#[test]
fn output_thrown_away_by_a_parent_program() {
    // A parent that throws the report away: write-only /dev/null (a shell's `>/dev/null`) is
    // an open standard output; read-write /dev/null (Python's `subprocess.DEVNULL`, Node's
    // `'ignore'`) cannot be told from a closed one, so the message says how to avoid it, and
    // `-o /dev/null` works either way.
    let dir = scratch(&[("probe.yaml", BASE.as_bytes())]);
    let null = |read: bool| {
        std::fs::File::options()
            .read(read)
            .write(true)
            .open("/dev/null")
            .expect("open /dev/null")
    };
    let run = |stdout: std::fs::File, extra: &[&str]| {
        std::process::Command::new(env!("CARGO_BIN_EXE_taut"))
            .current_dir(dir.path())
            .args(["plan", "probe.yaml"])
            .args(extra)
            .stdout(stdout)
            .output()
            .expect("run taut")
    };
    let write_only = run(null(false), &[]);
    assert_eq!(write_only.status.code(), Some(0));
    let read_write = run(null(true), &[]);
    let stderr = String::from_utf8_lossy(&read_write.stderr);
    assert_eq!(read_write.status.code(), Some(1), "{stderr}");
    assert!(stderr.contains("subprocess.DEVNULL"), "{stderr}");
    let named = run(null(true), &["-o", "/dev/null"]);
    assert_eq!(
        named.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&named.stderr)
    );
}
