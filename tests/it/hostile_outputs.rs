//! Hostile input, third round (issue 25), the outputs: every file a run reads is one of its
//! inputs, CSV exports are safe to open in a spreadsheet and keep 6 significant digits, a
//! stopped run takes back its half-written files, messages fit the command and the folder, and
//! every shipped example works by its name.

use std::fs;
use std::path::Path;
use std::process::{Command, Stdio};

use crate::common::taut;

/// A tuning file: 12 equal steps under a name of our choosing.
fn tuning_file(name: &str) -> String {
    format!(
        "name: {}\ndescription: {}\ndivisions: 12\n",
        quoted(name),
        quoted(name)
    )
}

/// `text` as a YAML double-quoted scalar (JSON's string syntax is YAML's).
fn quoted(text: &str) -> String {
    serde_json::to_string(text).unwrap()
}

/// An instrument of two courses whose own tuning is the file `tuning`.
fn instrument(name: &str, tuning: &str, pitch_1: &str, extra: &str) -> String {
    format!(
        "name: {}\ntuning: {tuning}\nscale_length: 648mm\ndefaults:\n  tension: {{target: 70N, min: 40N, max: 110N}}\n  kinds: [plain-steel, phosphor-bronze-wound]\ncourses:\n  - {{course: 1, pitch: {}}}\n  - {{course: 2, pitch: ~B3}}\n{extra}",
        quoted(name),
        quoted(pitch_1)
    )
}

const STOCK: &str = "catalogs:\n  - id: bench-steel\n    name: Steel on the bench\n    diameters: [0.25mm, 0.30mm]\n    source: measured\n";

/// Writes `set.yaml` in `dir`: the strings `taut plan` chooses for the folder's `one.yaml`.
fn save_set_of_one(dir: &Path) {
    let saved = taut()
        .current_dir(dir)
        .args([
            "plan",
            "one.yaml",
            "--save-set",
            "set.yaml",
            "-o",
            "/dev/null",
        ])
        .output()
        .unwrap();
    assert!(
        saved.status.success(),
        "{}",
        String::from_utf8_lossy(&saved.stderr)
    );
}

/// A folder holding every kind of file the commands read, each file naming the next:
/// instruments whose tunings and variants' tunings are files, a set, a layout with a tuning
/// file, survey settings listing a tuning file, a stock file.
fn folder_of_inputs() -> tempfile::TempDir {
    let dir = tempfile::tempdir().unwrap();
    let put = |name: &str, text: &str| fs::write(dir.path().join(name), text).unwrap();
    put("own.yaml", &tuning_file("own"));
    put("variant.yaml", &tuning_file("variant"));
    put("listed.yaml", &tuning_file("listed"));
    put("after.yaml", &tuning_file("after"));
    put("layout-tuning.yaml", &tuning_file("layout tuning"));
    put("chart.csv", &tuning_file("chart tuning"));
    put("picture.svg", &tuning_file("picture tuning"));
    put("one.yaml", &instrument("one", "own.yaml", "~E4", ""));
    put(
        "variants.yaml",
        &instrument(
            "variants",
            "own.yaml",
            "~E4",
            "variants:\n  - name: first\n  - name: second\n    tuning: variant.yaml\n",
        ),
    );
    put("to.yaml", &instrument("to", "after.yaml", "~E4", ""));
    put("sheet.yaml", &instrument("sheet", "chart.csv", "~E4", ""));
    put(
        "picture.yaml",
        &instrument("picture", "picture.svg", "~E4", ""),
    );
    put("stock.yaml", STOCK);
    put(
        "settings.yaml",
        "tunings:\n  list: [listed.yaml, 19edo]\ncourse_1: E4\noffset_cents: {from: 0, to: 0, step: 1}\ncourses:\n  steps: [-5]\n",
    );
    put(
        "layout.yaml",
        "name: layout\ntuning: layout-tuning.yaml\ntension: {first: 60N, last: 60N, min: 40N, max: 80N}\ncourses:\n  - {pitch: E4, string: {kind: plain-steel, diameter: 0.010in}}\n  - {pitch: B3, string: {kind: plain-steel, diameter: 0.013in}}\n",
    );
    save_set_of_one(dir.path());
    dir
}

/// Every file in `dir` with its bytes.
fn contents(dir: &Path) -> Vec<(String, Vec<u8>)> {
    let mut all: Vec<(String, Vec<u8>)> = fs::read_dir(dir)
        .unwrap()
        .map(|entry| {
            let entry = entry.unwrap();
            (
                entry.file_name().to_string_lossy().to_string(),
                fs::read(entry.path()).unwrap_or_default(),
            )
        })
        .collect();
    all.sort();
    all
}

#[test]
fn no_output_lands_on_a_file_the_run_reads() {
    // (the command, the file it must not replace). Each of these files is read by the run:
    // on the command line, named by a file (an instrument's tuning, a variant's tuning, a
    // layout's tuning, a tuning listed in survey settings), or as stock.
    let cases: &[(&[&str], &str)] = &[
        // plan: the report, the saved set, the string chart and a plot.
        (&["plan", "one.yaml", "-o", "one.yaml"], "one.yaml"),
        (&["plan", "one.yaml", "-o", "own.yaml"], "own.yaml"),
        (
            &["plan", "variants.yaml", "-o", "variant.yaml"],
            "variant.yaml",
        ),
        (
            &["plan", "variants.yaml", "--save-set", "variant.yaml"],
            "variant.yaml",
        ),
        (
            &["plan", "variants.yaml", "--save-set", "own.yaml"],
            "own.yaml",
        ),
        (
            &[
                "plan",
                "one.yaml",
                "--stock",
                "stock.yaml",
                "-o",
                "stock.yaml",
            ],
            "stock.yaml",
        ),
        (
            &["plan", "sheet.yaml", "--string-chart", "chart.csv"],
            "chart.csv",
        ),
        (
            &["plan", "picture.yaml", "--plot", "tension=picture.svg"],
            "picture.svg",
        ),
        // audit: the instrument's tunings (own and variants), the set, stock.
        (
            &["audit", "one.yaml", "--set", "set.yaml", "-o", "set.yaml"],
            "set.yaml",
        ),
        (
            &["audit", "one.yaml", "--set", "set.yaml", "-o", "own.yaml"],
            "own.yaml",
        ),
        (
            &[
                "audit",
                "variants.yaml",
                "--set",
                "set.yaml",
                "-o",
                "variant.yaml",
            ],
            "variant.yaml",
        ),
        (
            &[
                "audit",
                "one.yaml",
                "--set",
                "set.yaml",
                "--stock",
                "stock.yaml",
                "-o",
                "stock.yaml",
            ],
            "stock.yaml",
        ),
        // convert: the instrument after conversion and its tuning.
        (
            &[
                "convert",
                "one.yaml",
                "--set",
                "set.yaml",
                "--to-instrument",
                "to.yaml",
                "-o",
                "after.yaml",
            ],
            "after.yaml",
        ),
        (
            &[
                "convert",
                "one.yaml",
                "--set",
                "set.yaml",
                "--to-instrument",
                "to.yaml",
                "-o",
                "to.yaml",
            ],
            "to.yaml",
        ),
        (
            &[
                "convert",
                "one.yaml",
                "--set",
                "set.yaml",
                "--save-set",
                "own.yaml",
                "-o",
                "/dev/null",
            ],
            "own.yaml",
        ),
        // lengths: the layout and its tuning.
        (
            &["lengths", "layout.yaml", "-o", "layout-tuning.yaml"],
            "layout-tuning.yaml",
        ),
        (
            &["lengths", "layout.yaml", "-o", "layout.yaml"],
            "layout.yaml",
        ),
        // frets: the instrument's tuning.
        (&["frets", "one.yaml", "-o", "own.yaml"], "own.yaml"),
        // survey: the settings and the tunings they list.
        (
            &["survey", "one.yaml", "settings.yaml", "-o", "listed.yaml"],
            "listed.yaml",
        ),
        (
            &["survey", "one.yaml", "settings.yaml", "-o", "settings.yaml"],
            "settings.yaml",
        ),
        // tuning: the file it shows or fits.
        (
            &["tuning", "show", "own.yaml", "-o", "own.yaml"],
            "own.yaml",
        ),
        (
            &[
                "tuning",
                "fit",
                "picture.svg",
                "--plot",
                "errors=picture.svg",
            ],
            "picture.svg",
        ),
    ];
    let dir = folder_of_inputs();
    for (args, victim) in cases {
        let before = contents(dir.path());
        let output = taut().current_dir(dir.path()).args(*args).output().unwrap();
        let stderr = String::from_utf8_lossy(&output.stderr);
        assert_eq!(output.status.code(), Some(2), "taut {args:?}: {stderr}");
        assert!(
            stderr.contains("one of this command's inputs") && stderr.contains(victim),
            "taut {args:?}: {stderr}"
        );
        assert!(!stderr.contains("panicked"), "{stderr}");
        assert_eq!(
            contents(dir.path()),
            before,
            "taut {args:?} changed the folder"
        );
    }
}

/// Whether a CSV cell would be run as a formula by a spreadsheet: it starts with `=`, `+`, `-`,
/// `@`, tab or carriage return and is not a plain number (the characters OWASP's "CSV Injection"
/// page lists). Each piece after a `;` counts too: `;` separates fields in many locales.
fn formula_risk(cell: &str) -> bool {
    let number = |piece: &str| piece.parse::<f64>().is_ok() && !piece.contains(['i', 'n', 'N']);
    std::iter::once(cell)
        .chain(cell.split(';').skip(1))
        .any(|piece| piece.starts_with(['=', '+', '-', '@', '\t', '\r']) && !number(piece))
}

/// The cells of a CSV document.
fn cells(text: &str) -> Vec<Vec<String>> {
    csv::ReaderBuilder::new()
        .has_headers(false)
        .flexible(true)
        .from_reader(text.as_bytes())
        .records()
        .map(|record| record.unwrap().iter().map(str::to_string).collect())
        .collect()
}

/// A folder whose names are all formulas: instrument, tunings, variants, set, layout, and a
/// pitch that starts with `-`.
fn hostile_folder() -> tempfile::TempDir {
    let dir = tempfile::tempdir().unwrap();
    let put = |name: &str, text: &str| fs::write(dir.path().join(name), text).unwrap();
    put(
        "t.yaml",
        &tuning_file("=HYPERLINK(\"http://example.invalid\",\"tuning\")"),
    );
    put(
        "one.yaml",
        &instrument(
            "=HYPERLINK(\"http://example.invalid\",\"instrument\")",
            "t.yaml",
            "-100c",
            "",
        ),
    );
    put(
        "variants.yaml",
        &instrument(
            "+instrument",
            "t.yaml",
            "~E4",
            "variants:\n  - name: \"-first\"\n  - name: \"@second\"\n    pitches: {2: ~A3}\n",
        ),
    );
    put(
        "settings.yaml",
        "tunings:\n  list: [t.yaml]\ncourse_1: E4\noffset_cents: {from: 0, to: 0, step: 1}\ncourses:\n  steps: [-5]\n",
    );
    put(
        "layout.yaml",
        "name: \"=layout\"\ntuning: t.yaml\ntension: {first: 60N, last: 60N, min: 40N, max: 80N}\ncourses:\n  - {pitch: \"-100c\", string: {kind: plain-steel, diameter: 0.010in}}\n  - {pitch: B3, string: {kind: plain-steel, diameter: 0.013in}}\n",
    );
    save_set_of_one(dir.path());
    dir
}

/// Every CSV the tool writes, from the hostile folder: (what, the CSV text).
fn every_csv(dir: &Path) -> Vec<(String, String)> {
    let runs: &[&[&str]] = &[
        &["plan", "one.yaml"],
        &["plan", "variants.yaml"],
        &["audit", "one.yaml", "--set", "set.yaml"],
        &["audit", "variants.yaml", "--set", "set.yaml"],
        &["convert", "one.yaml", "--set", "set.yaml", "--to", "19edo"],
        &["lengths", "layout.yaml"],
        &["frets", "one.yaml"],
        &["survey", "variants.yaml", "settings.yaml"],
        &["tuning", "show", "t.yaml"],
        &["tuning", "fit", "t.yaml"],
        &["tuning", "compare", "t.yaml", "19edo"],
        &["tuning", "find", "t.yaml", "440hz"],
        &["tuning", "list"],
    ];
    let mut all = Vec::new();
    for args in runs {
        let output = taut()
            .current_dir(dir)
            .args(*args)
            .args(["--format", "csv"])
            .output()
            .unwrap();
        assert!(
            output.status.success(),
            "taut {args:?}: {}",
            String::from_utf8_lossy(&output.stderr)
        );
        all.push((
            format!("{args:?}"),
            String::from_utf8(output.stdout).unwrap(),
        ));
    }
    // The string chart as CSV.
    let chart = taut()
        .current_dir(dir)
        .args([
            "plan",
            "one.yaml",
            "--string-chart",
            "chart.csv",
            "-o",
            "/dev/null",
        ])
        .output()
        .unwrap();
    assert!(
        chart.status.success(),
        "{}",
        String::from_utf8_lossy(&chart.stderr)
    );
    all.push((
        "string chart".to_string(),
        fs::read_to_string(dir.join("chart.csv")).unwrap(),
    ));
    all
}

#[test]
fn no_csv_cell_can_run_as_a_formula() {
    // OWASP, "CSV Injection": a cell starting with = + - @ tab or CR is run as a formula; the
    // guidance is to put a single quote in front. The names of the instrument, tunings and
    // variants, and a pitch written `-100c`, all reach some CSV.
    let dir = hostile_folder();
    let mut quoted_cells = 0;
    for (what, text) in every_csv(dir.path()) {
        for row in cells(&text) {
            for cell in row {
                assert!(!formula_risk(&cell), "{what}: cell {cell:?} in\n{text}");
                if cell.starts_with("'=")
                    || cell.starts_with("'-")
                    || cell.starts_with("'@")
                    || cell.starts_with("'+")
                {
                    quoted_cells += 1;
                }
            }
        }
    }
    // The hostile text did reach the exports, neutralised (not dropped).
    assert!(quoted_cells > 10, "only {quoted_cells} neutralised cells");
}

#[test]
fn negative_numbers_stay_numbers_in_csv() {
    // A negative figure is no formula: `tuning compare` and the fret table write negative
    // cents and degrees as plain numbers.
    let dir = hostile_folder();
    let text = every_csv(dir.path())
        .into_iter()
        .find(|(what, _)| what.contains("frets"))
        .unwrap()
        .1;
    let rows = cells(&text);
    let degree = rows[0].iter().position(|h| h == "degree").unwrap();
    assert!(
        rows[1..]
            .iter()
            .any(|row| row[degree].starts_with('-') && row[degree].parse::<f64>().is_ok()),
        "{text}"
    );
}

/// The significant digits of a plain decimal number as written (`0.000397765` has 6).
fn significant_digits(number: &str) -> usize {
    let mantissa = number
        .trim_start_matches('-')
        .split(['e', 'E'])
        .next()
        .unwrap_or_default();
    let digits: String = mantissa.chars().filter(char::is_ascii_digit).collect();
    let digits = digits.trim_start_matches('0');
    // Trailing zeros of a fraction (`70.0`) carry no digit; those of a whole number do not
    // matter here, as whole numbers are counts.
    let digits = if mantissa.contains('.') {
        digits.trim_end_matches('0')
    } else {
        digits
    };
    digits.len()
}

#[test]
fn every_csv_rounds_to_six_significant_digits() {
    // README: "CSV rounds to 6 significant digits". Every fractional figure in every CSV.
    let dir = hostile_folder();
    let mut checked = 0;
    for (what, text) in every_csv(dir.path()) {
        for row in cells(&text) {
            for cell in row {
                if cell.contains('.') && cell.parse::<f64>().is_ok() {
                    assert!(
                        significant_digits(&cell) <= 6,
                        "{what}: {cell} has more than 6 significant digits"
                    );
                    checked += 1;
                }
            }
        }
    }
    assert!(checked > 100, "only {checked} figures checked");
    // The two cells the issue found, in survey and frets CSV.
    let survey = taut()
        .args([
            "survey",
            "fanned-8-fourths",
            "survey-fourths",
            "--format",
            "csv",
            "--top",
            "3",
        ])
        .output()
        .unwrap();
    assert!(
        survey.status.success(),
        "{}",
        String::from_utf8_lossy(&survey.stderr)
    );
    for cell in cells(&String::from_utf8(survey.stdout).unwrap()).concat() {
        if cell.contains('.') && cell.parse::<f64>().is_ok() {
            assert!(significant_digits(&cell) <= 6, "survey: {cell}");
        }
    }
}

#[test]
fn a_stopped_run_leaves_no_partial_file() {
    // The report goes to a FIFO (written through, after every file is ready): the run waits
    // there for a reader with the saved set's temporary file made, and is stopped then.
    for signal in ["TERM", "INT"] {
        let dir = tempfile::tempdir().unwrap();
        fs::write(dir.path().join("set.yaml"), "the user's own set\n").unwrap();
        let made = Command::new("mkfifo")
            .arg(dir.path().join("pipe"))
            .status()
            .unwrap();
        assert!(made.success());
        let mut child = Command::new(env!("CARGO_BIN_EXE_taut"))
            .current_dir(dir.path())
            .args([
                "plan",
                "guitar-19edo",
                "--save-set",
                "set.yaml",
                "-o",
                "pipe",
            ])
            .stdout(Stdio::null())
            .stderr(Stdio::null())
            .spawn()
            .unwrap();
        let partial = || {
            fs::read_dir(dir.path())
                .unwrap()
                .filter_map(|e| e.ok())
                .any(|e| e.file_name().to_string_lossy().ends_with(".taut-partial"))
        };
        // Wait (a bounded number of looks) until the temporary file is there.
        let mut looks = 0;
        while !partial() {
            looks += 1;
            assert!(looks < 3000, "the temporary file never appeared");
            std::thread::sleep(std::time::Duration::from_millis(10));
        }
        let sent = Command::new("kill")
            .args([format!("-{signal}"), child.id().to_string()])
            .status()
            .unwrap();
        assert!(sent.success());
        let status = child.wait().unwrap();
        assert!(!status.success(), "SIG{signal}: {status:?}");
        let mut left: Vec<String> = fs::read_dir(dir.path())
            .unwrap()
            .map(|e| e.unwrap().file_name().to_string_lossy().to_string())
            .collect();
        left.sort();
        assert_eq!(left, ["pipe", "set.yaml"], "SIG{signal} left files behind");
        assert_eq!(
            fs::read_to_string(dir.path().join("set.yaml")).unwrap(),
            "the user's own set\n"
        );
    }
}

#[test]
fn a_folder_that_refuses_new_files_is_explained() {
    // A writable file in a folder the user cannot write: the writer makes a new file beside it
    // and renames it over, so the message says the folder must be writable, and why. Tests run
    // as root, who may write anywhere, so the run drops to the `nobody` user (uid 65534) with
    // `setpriv` (util-linux) when it is root.
    let dir = tempfile::tempdir().unwrap();
    let folder = dir.path().join("locked");
    fs::create_dir(&folder).unwrap();
    let report = folder.join("report.txt");
    fs::write(&report, "old report\n").unwrap();
    use std::os::unix::fs::PermissionsExt;
    fs::set_permissions(&report, fs::Permissions::from_mode(0o666)).unwrap();
    fs::set_permissions(&folder, fs::Permissions::from_mode(0o555)).unwrap();
    fs::set_permissions(dir.path(), fs::Permissions::from_mode(0o755)).unwrap();
    let root = Command::new("id").arg("-u").output().unwrap().stdout == b"0\n";
    let mut command = if root {
        let mut command = Command::new("setpriv");
        command.args(["--reuid=65534", "--regid=65534", "--clear-groups"]);
        command.arg(env!("CARGO_BIN_EXE_taut"));
        command
    } else {
        Command::new(env!("CARGO_BIN_EXE_taut"))
    };
    let output = command
        .args(["plan", "guitar-19edo", "-o"])
        .arg(&report)
        .output()
        .unwrap();
    let stderr = String::from_utf8_lossy(&output.stderr);
    fs::set_permissions(&folder, fs::Permissions::from_mode(0o755)).unwrap();
    assert_eq!(output.status.code(), Some(1), "{stderr}");
    assert!(stderr.contains("Permission denied"), "{stderr}");
    assert!(
        stderr.contains("renames") && stderr.contains("folder") && stderr.contains("writable"),
        "{stderr}"
    );
    assert_eq!(fs::read_to_string(&report).unwrap(), "old report\n");
    assert_eq!(fs::read_dir(&folder).unwrap().count(), 1);
}

#[test]
fn a_closed_standard_output_gets_a_hint_the_command_takes() {
    // Every command that writes to standard output, run with it closed: the hint names only
    // options the command has (`generate` and `help` have no `-o`).
    let cases: &[&[&str]] = &[
        &["plan", "guitar-19edo"],
        &["tuning", "show", "12edo"],
        &["generate", "man"],
        &["generate", "completions", "bash"],
        &["help", "formats"],
    ];
    for args in cases {
        let quoted: Vec<String> = args.iter().map(|a| format!("'{a}'")).collect();
        let output = Command::new("sh")
            .arg("-c")
            .arg(format!(
                "'{}' {} >&-",
                env!("CARGO_BIN_EXE_taut"),
                quoted.join(" ")
            ))
            .output()
            .unwrap();
        let stderr = String::from_utf8_lossy(&output.stderr);
        assert_eq!(output.status.code(), Some(1), "{args:?}: {stderr}");
        assert!(stderr.contains("standard output is closed"), "{stderr}");
        // The options the hint names must be options of this command.
        let help = taut()
            .args(args.iter().take_while(|a| !["bash", "formats"].contains(a)))
            .arg("--help")
            .output()
            .unwrap();
        let help = String::from_utf8_lossy(&help.stdout);
        for option in ["-o FILE", "-o /dev/null", "--dir FOLDER"] {
            if stderr.contains(option) {
                let name = option.split(' ').next().unwrap();
                assert!(
                    help.contains(&format!("{name} ")) || help.contains(&format!("{name},")),
                    "{args:?} hints `{option}`, which it does not take: {stderr}"
                );
            }
        }
        if args[0] == "generate" || args[0] == "help" {
            assert!(!stderr.contains("-o "), "{args:?}: {stderr}");
        }
    }
}

/// What each shipped example is, and a command that uses it by name.
fn run_by_name(name: &str, text: &str, instruments: &[String]) -> Result<(), String> {
    use taut::input::examples::{sniff, FileKind};
    let run = |args: &[&str]| {
        let output = taut()
            .current_dir(std::env::temp_dir())
            .args(args)
            .args(["-o", "/dev/null"])
            .output()
            .unwrap();
        if output.status.success() {
            Ok(())
        } else {
            Err(String::from_utf8_lossy(&output.stderr).to_string())
        }
    };
    let any_instrument = |args: &dyn Fn(&str) -> Vec<String>| {
        let mut last = String::from("no instrument example");
        for instrument in instruments {
            let args = args(instrument);
            let args: Vec<&str> = args.iter().map(String::as_str).collect();
            match run(&args) {
                Ok(()) => return Ok(()),
                Err(err) => last = err,
            }
        }
        Err(last)
    };
    match sniff(text) {
        Some(FileKind::Instrument) => run(&["plan", name]),
        Some(FileKind::Layout) => run(&["lengths", name]),
        Some(FileKind::StringSet) => any_instrument(&|instrument| {
            vec![
                "audit".into(),
                instrument.into(),
                "--set".into(),
                name.into(),
            ]
        }),
        Some(FileKind::SurveySettings) => {
            any_instrument(&|instrument| vec!["survey".into(), instrument.into(), name.into()])
        }
        other => Err(format!("{name}: a file of kind {other:?} in examples/")),
    }
}

#[test]
fn every_file_in_examples_works_by_its_name() {
    // README: "Every file in `examples/` works by its name". The folder is walked, so a new
    // example is held to the promise without touching this test.
    let folder = Path::new(env!("CARGO_MANIFEST_DIR")).join("examples");
    let mut found: Vec<(String, String)> = fs::read_dir(&folder)
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|p| p.extension().is_some_and(|e| e == "yaml"))
        .map(|p| {
            (
                p.file_stem().unwrap().to_string_lossy().to_string(),
                fs::read_to_string(&p).unwrap(),
            )
        })
        .collect();
    found.sort();
    assert!(found.len() >= 14, "{found:?}");
    let instruments: Vec<String> = found
        .iter()
        .filter(|(_, text)| {
            taut::input::examples::sniff(text) == Some(taut::input::examples::FileKind::Instrument)
        })
        .map(|(name, _)| name.clone())
        .collect();
    for (name, text) in &found {
        let shipped = taut::input::examples::EXAMPLES
            .iter()
            .find(|(shipped, _)| shipped == name);
        assert_eq!(
            shipped.map(|(_, t)| *t),
            Some(text.as_str()),
            "examples/{name}.yaml is not shipped by name (src/input/examples.rs)"
        );
        // From a folder without the file, so the name is what finds it.
        if let Err(err) = run_by_name(name, text, &instruments) {
            panic!("`{name}` does not work by its name: {err}");
        }
    }
}
