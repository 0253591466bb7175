use super::*;

#[test]
fn status_marks_are_coloured_only_where_they_are_marks() {
    let table =
        "│ 1   E4   53%   DANGER  │\n│ 2   B3   31%           │\n│ 3  no  yes, with care │\n";
    let coloured = colour_marks(table);
    assert!(
        coloured.contains("\x1b[1;38;5;160mDANGER\x1b[0m  │"),
        "{coloured}"
    );
    assert!(
        coloured.contains("\x1b[38;5;172myes, with care\x1b[0m │"),
        "{coloured}"
    );
    assert!(!coloured.contains("mno"), "{coloured}");
    let plain: String = coloured
        .replace("\x1b[1;38;5;160m", "")
        .replace("\x1b[38;5;172m", "")
        .replace("\x1b[0m", "");
    assert_eq!(plain, table);
    let list = "  caution stress_caution: Course 1 …\nNo warnings.\n  note    x: y\n";
    let coloured = colour_marks(list);
    assert!(coloured.starts_with("  \x1b[38;5;172mcaution\x1b[0m stress_caution"));
    assert!(coloured.contains("No warnings.\n"));
    assert!(coloured.contains("\x1b[38;5;67mnote\x1b[0m    x"));
}

#[test]
fn status_words_leading_a_report_row_are_coloured() {
    let table = "#  status  pitch\n─────\n 1  ok      ~E4 -5.3c  0.25\n12  DANGER  G3\n 3  no fit  C2\n 4  note    ok\nok, then  DANGER\n";
    let coloured = colour_marks(table);
    assert!(
        coloured.contains(" 1  \x1b[38;5;71mok\x1b[0m      ~E4"),
        "{coloured}"
    );
    assert!(
        coloured.contains("12  \x1b[1;38;5;160mDANGER\x1b[0m  G3"),
        "{coloured}"
    );
    assert!(
        coloured.contains(" 3  \x1b[1;38;5;160mno fit\x1b[0m  C2"),
        "{coloured}"
    );
    // Only the status cell: a later `ok` and a line of prose are left alone.
    assert!(
        coloured.contains("\x1b[38;5;67mnote\x1b[0m    ok\n"),
        "{coloured}"
    );
    assert!(coloured.ends_with("ok, then  DANGER\n"), "{coloured}");
    assert!(coloured.starts_with("#  status  pitch\n"), "{coloured}");
}

#[test]
fn pitch_labels_show_the_note_only_when_it_adds_something() {
    assert_eq!(pitch_with_note("A2", "A2", 0.0), "A2");
    assert_eq!(pitch_with_note("~E4", "E4", -5.26), "~E4 -5.3c");
    assert_eq!(pitch_with_note("~A2", "A2", 0.01), "~A2");
    assert_eq!(pitch_with_note("3/4", "E4", 1.96), "3/4 E4+2.0c");
}

#[test]
fn a_change_that_rounds_to_zero_has_no_sign() {
    assert_eq!(change(-0.3, 0), "0%");
    assert_eq!(change(0.04, 1), "0.0%");
    assert_eq!(change(-1.6, 0), "-2%");
    assert_eq!(change(38.2, 0), "+38%");
}

#[test]
fn the_stress_bar_fills_with_the_stress() {
    assert_eq!(stress_bar(Some(0.5), 0.65, 0.85), "▰▰▰▰▱▱▱▱   50%");
    assert!(stress_bar(Some(0.9), 0.65, 0.85).contains('!'));
    assert_eq!(stress_bar(Some(1.4), 0.65, 0.85), "▰▰▰▰▰▰▰▰! 140%");
    // Just above the caution limit reads as above it, not as the limit itself.
    assert!(stress_bar(Some(0.652), 0.65, 0.85).ends_with("65.2%"));
}

#[test]
fn diameters_follow_the_length_unit() {
    assert_eq!(diameter(0.254, LengthUnit::In), "10");
    assert_eq!(diameter(0.3429, LengthUnit::In), "13.5");
    // Millimetres to the micrometre: 0.010 in is 0.254 mm, and a catalog's 0.0005 in steps
    // (12.7 µm) stay apart (common practice).
    assert_eq!(diameter(0.254, LengthUnit::Mm), "0.254");
    assert_eq!(diameter(0.2667, LengthUnit::Mm), "0.267");
}

#[test]
fn signed_offsets_in_pitch_labels_keep_their_sign() {
    assert_eq!(pitch_with_note("~C2", "C2", -48.04), "~C2 -48.0c");
    assert_eq!(
        pitch_with_note("65.8351 Hz", "C2", 11.7),
        "65.8351 Hz C2+11.7c"
    );
    assert_eq!(pitch_with_note("x", "C2", -0.05), "x C2-0.1c");
    assert_eq!(pitch_with_note("x", "C2", f64::NAN), "x C2");
}

#[test]
fn warnings_line_up_under_their_severity() {
    for severity in [Severity::Danger, Severity::Caution, Severity::Note] {
        let lead = warning_lead(severity);
        assert_eq!(lead, format!("  {:<7}  ", severity_flag(severity)));
        assert_eq!(lead.len(), WARNING_INDENT.len());
    }
}

#[test]
fn the_gauge_line_joins_courses_and_marks_wound_strings() {
    let courses = vec![
        vec![(0.254, false)],
        vec![(0.3429, false), (0.3429, false)],
        vec![],
        vec![(1.118, true)],
    ];
    assert_eq!(
        gauge_line(&courses, LengthUnit::Mm),
        "Gauges (mm, w = wound): 0.254 0.343+0.343  1.118w"
    );
    assert_eq!(
        gauge_line(&courses, LengthUnit::In),
        "Gauges (in/1000, w = wound): 10 13.5+13.5  44w"
    );
    assert_eq!(gauge_line(&[], LengthUnit::Mm), "Gauges (mm, w = wound): ");
}
