//! README's promises, each backed by a test (issue 19, "Done when"). The table below names, for
//! each promise in README's prose, the tests that hold it; the first test checks that every
//! promise is still in README word for word and that every test named exists, so neither side can
//! drift unnoticed. Promises no other file tested are tested here.

use crate::common::{json, table, write_file};

/// (words README says, tests that back them as `file::function`).
const PROMISES: &[(&str, &[&str])] = &[
    (
        "shipped tunings, materials, gauge catalogs, string kinds and example instruments are compiled in",
        &["hostile_outputs::every_file_in_examples_works_by_its_name"],
    ),
    (
        "`taut` prints these cautions in full whenever a report reaches its caution or danger limits",
        &[
            "plan_cli::safety_cautions_appear_only_with_cautions_or_dangers",
            "readme_promises::every_plan_audit_conversion_layout_and_survey_ends_with_a_caution",
        ],
    ),
    (
        "with the same field names everywhere and SI units",
        &["charts_exports::every_report_exports_as_csv_and_yaml_with_the_json_field_names"],
    ),
    (
        "which writes the whole file or nothing and never over one of the command's own inputs",
        &[
            "charts_exports::output_files_are_replaced_whole_and_left_alone_on_refusal",
            "hostile_outputs::no_output_lands_on_a_file_the_run_reads",
        ],
    ),
    (
        "`-` as an input file is standard input",
        &["output_safety::dash_reads_the_instrument_from_standard_input"],
    ),
    (
        "every file there works by its name",
        &["hostile_outputs::every_file_in_examples_works_by_its_name"],
    ),
    (
        "`--alternatives` shows why each string was chosen and what else was close",
        &["plan_choice::an_on_target_kind_beats_one_at_the_end_of_its_catalog"],
    ),
    (
        "or says which tunings cannot share a string and what the closest compromise costs",
        &["plan_several::a_fifth_apart_near_the_breaking_pitch_is_a_named_conflict"],
    ),
    (
        "`--variant dropped` plans (or audits) that variant alone",
        &["plan_variant_pick::a_picked_variant_gets_its_pictures_and_string_chart"],
    ),
    (
        "`plan --save-set` writes one",
        &["charts_exports::a_plan_exported_as_json_or_yaml_reads_back_as_the_same_string_set"],
    ),
    (
        "`--format svg` draws a true-size template",
        &["frets_cli::every_format_renders_and_the_drawing_is_at_true_scale"],
    ),
    (
        "courses whose steps differ get partial frets",
        &[
            "frets_cli::just_courses_get_partial_frets_and_comma_pairs_are_mergeable",
            "frets_partial_labels::every_run_of_frets_on_a_fanned_just_board_is_numbered",
        ],
    ),
    (
        "`plan` reads it back with the\nsame strings and tensions",
        &[
            "lengths_joint::a_solved_harp_round_trips_through_plan",
            "lengths_joint::a_solved_double_psaltery_round_trips_through_plan",
        ],
    ),
    (
        "checks every course open and with its lever engaged",
        &[
            "plan_raises::a_semitone_lever_stops_where_the_first_fret_sits",
            "plan_raises::a_course_safe_open_but_breaking_when_pulled_up_is_flagged_at_that_position",
            "plan_raises::the_total_at_the_worst_setting_counts_every_pedal_at_its_heaviest",
        ],
    ),
    (
        "the sheet of every string's core, wraps, lengths and tension",
        &["order_sheet::core_and_wraps_give_back_each_strings_unit_mass_within_a_tenth_of_a_percent"],
    ),
    (
        "weighs the same strings\non a longer neck against the plan",
        &[
            "compare_plans::a_plan_compared_with_itself_shows_no_change",
            "compare_plans::a_set_moved_to_a_longer_scale_gains_the_square_of_the_length_ratio",
        ],
    ),
    (
        "checks every candidate instead, with the same answer",
        &["survey_sweep::the_crossings_sweep_gives_the_exhaustive_report"],
    ),
    (
        "(36.8 million candidates)",
        &["readme_promises::the_survey_example_tries_the_candidates_readme_counts"],
    ),
    (
        "writes it and one page per subcommand",
        &["charts_exports::completions_and_manual_pages_come_from_the_command_line"],
    ),
    (
        "a run that fails or is stopped with Ctrl-C replaces nothing",
        &["hostile_outputs::a_stopped_run_leaves_no_partial_file"],
    ),
    (
        "gets a leading `'`",
        &["hostile_outputs::no_csv_cell_can_run_as_a_formula"],
    ),
    (
        "numbers stay numbers",
        &["hostile_outputs::negative_numbers_stay_numbers_in_csv"],
    ),
    (
        "(65 % and 85 % of breaking strength by default)",
        &["readme_promises::stress_is_a_caution_above_65_and_a_danger_above_85_percent"],
    ),
    (
        "Every problem with a file or an option is reported with its file, line, column and field",
        &[
            "tuning_bad_input::malformed_yaml_names_file_and_line",
            "plan_cli::negative_and_nan_values",
        ],
    ),
    (
        "`0` success (also with warnings), `2` bad input and `1` any other failure",
        &["help_topics::exit_codes_topic_matches_the_binary"],
    ),
    (
        "Fletcher's partials, an\nideal pluck, a published damping model",
        &["sound_partials::the_first_eight_partials_sit_at_fletchers_frequencies_and_give_back_b"],
    ),
    (
        "a\nStandard MIDI File that plays the scale or chords in tune",
        &["midi_tuning::a_midi_file_reads_back_with_its_tuning_first_then_the_scale"],
    ),
];

fn squeeze(text: &str) -> String {
    text.split_whitespace().collect::<Vec<_>>().join(" ")
}

#[test]
fn every_promise_is_in_readme_and_every_test_behind_it_exists() {
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
    let readme = squeeze(&std::fs::read_to_string(root.join("README.md")).unwrap());
    for (promise, tests) in PROMISES {
        assert!(
            readme.contains(&squeeze(promise)),
            "README no longer says: {promise}"
        );
        assert!(!tests.is_empty(), "no test backs: {promise}");
        for test in *tests {
            let (file, function) = test.split_once("::").unwrap();
            let source = std::fs::read_to_string(root.join("tests/it").join(format!("{file}.rs")))
                .unwrap_or_else(|_| panic!("{test}: no file tests/it/{file}.rs"));
            assert!(
                source.contains(&format!("fn {function}(")),
                "{test}: no such test (backing: {promise})"
            );
        }
    }
}

/// The survey example's settings: EDOs 5 to 311 and offsets from -600 to +600 cents in 0.01-cent
/// steps, so 307 EDOs × 120,001 offsets = 36,840,307 candidates: README's "36.8 million".
#[test]
fn the_survey_example_tries_the_candidates_readme_counts() {
    let report = json(&[
        "survey",
        "examples/fanned-8-fourths.yaml",
        "examples/survey-fourths.yaml",
    ]);
    let edos = 311 - 5 + 1;
    let offsets = (1200.0_f64 / 0.01).round() as u64 + 1;
    assert_eq!(report["candidates"].as_u64(), Some(edos * offsets));
    assert_eq!((edos * offsets + 50_000) / 100_000, 368); // 36.8 million
}

/// A plain string's stress depends only on its length, pitch and material (σ = ρ(2Lf)²), so one
/// course swept in pitch walks through both limits. Below 65 % of the breaking strength no stress
/// warning; above it a caution; above 85 % a danger, whatever the status of the neighbours.
#[test]
fn stress_is_a_caution_above_65_and_a_danger_above_85_percent() {
    let folder = tempfile::tempdir().unwrap();
    let mut seen = [false; 3];
    for hz in (300..=520).step_by(10) {
        let file = write_file(
            folder.path(),
            "one.yaml",
            &format!(
                "name: One course\ntuning: 12edo\nscale_length: 648mm\ndefaults:\n  kinds: [plain-steel]\n  tension: {{target: 70N}}\ncourses:\n  - pitch: {hz}hz\n"
            ),
        );
        let plan = json(&["plan", file.to_str().unwrap()]);
        let ratio = plan["courses"][0]["strings"][0]["stress_ratio"]
            .as_f64()
            .unwrap();
        let severities: Vec<&str> = plan["warnings"]
            .as_array()
            .unwrap()
            .iter()
            .filter(|w| w["kind"].as_str().unwrap().starts_with("stress"))
            .map(|w| w["severity"].as_str().unwrap())
            .collect();
        let expected: &[&str] = if ratio > 0.85 {
            seen[2] = true;
            &["danger"]
        } else if ratio > 0.65 {
            seen[1] = true;
            &["caution"]
        } else {
            seen[0] = true;
            &[]
        };
        assert_eq!(severities, expected, "{hz} Hz at {ratio:.3} of breaking");
    }
    assert_eq!(seen, [true; 3], "the sweep must cross both limits");
}

/// The full cautions under any report with a caution or danger, the one-line reminder under
/// every other plan, audit, conversion, layout and survey.
#[test]
fn every_plan_audit_conversion_layout_and_survey_ends_with_a_caution() {
    const FULL: &str = "wear eye protection while tuning up";
    const REMINDER: &str = "Strings can break: wear eye protection";
    let runs: &[&[&str]] = &[
        &["plan", "guitar-19edo"],
        &["plan", "lever-harp-34"],
        &[
            "audit",
            "examples/guitar-22edo-mode.yaml",
            "--set",
            "steel-guitar-set",
            "--from-instrument",
            "steel-guitar-12edo",
        ],
        &[
            "convert",
            "steel-guitar-12edo",
            "--set",
            "steel-guitar-set",
            "--to-instrument",
            "baritone-guitar",
        ],
        &["lengths", "psaltery-layout"],
        &["lengths", "zither-pairs-layout"],
        &[
            "survey",
            "examples/fanned-8-fourths.yaml",
            "examples/survey-fourths.yaml",
        ],
    ];
    for args in runs {
        let text = table(args);
        let report = json(args);
        let alarmed = report.to_string().contains("\"severity\":\"caution\"")
            || report.to_string().contains("\"severity\":\"danger\"");
        let flat = squeeze(&text);
        if alarmed {
            assert!(
                flat.contains(FULL),
                "{args:?} lacks the full cautions:\n{text}"
            );
        } else {
            assert!(
                flat.contains(REMINDER) || flat.contains(FULL),
                "{args:?} lacks the reminder:\n{text}"
            );
        }
    }
}
