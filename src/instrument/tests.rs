use super::*;

fn parse(text: &str) -> Result<Instrument> {
    Instrument::from_text(text.to_string(), "i.yaml")
}

fn message(text: &str) -> String {
    match parse(text) {
        Ok(_) => panic!("accepted:\n{text}"),
        Err(err) => err.to_string(),
    }
}

const GOOD: &str = "\
name: test
scale_length: 648mm
defaults:
  kinds: [a]
  tension: 70N
courses:
  - pitch: E4
  - pitch: B3
    strings: [unison, octave]
";

#[test]
fn reads_a_plain_instrument_with_defaults_applied() {
    let instrument = parse(GOOD).unwrap();
    assert_eq!(instrument.courses.len(), 2);
    let second = instrument.course_input(1, None).unwrap();
    assert_eq!(second.number, 2);
    assert_eq!(second.pitch, "B3");
    assert_eq!(second.length_m, 0.648);
    assert_eq!(second.tension.unwrap().target_n, 70.0);
    assert_eq!(second.strings.len(), 2);
    assert_eq!(second.strings[1].interval.ratio(), 2.0);
    assert_eq!(second.kinds.unwrap(), ["a".to_string()]);
}

#[test]
fn spread_length_and_profile_run_from_first_to_last_course() {
    let text = "\
name: fan
scale_length: {first: 700mm, last: 600mm}
defaults:
  tension: {first: 100N, last: 50N}
courses:
  - pitch: E2
  - pitch: A2
  - pitch: D3
";
    let instrument = parse(text).unwrap();
    let lengths: Vec<f64> = (0..3)
        .map(|i| instrument.course_input(i, None).unwrap().length_m)
        .collect();
    assert!((lengths[0] - 0.7).abs() < 1e-12);
    assert!((lengths[1] - 0.65).abs() < 1e-12);
    assert!((lengths[2] - 0.6).abs() < 1e-12);
    let middle = instrument.course_input(1, None).unwrap().tension.unwrap();
    assert!((middle.target_n - 75.0).abs() < 1e-12);
    let overridden = instrument
        .course_input(1, Some(&"60N".parse().unwrap()))
        .unwrap()
        .tension
        .unwrap();
    assert_eq!(overridden.target_n, 60.0);
}

#[test]
fn course_length_overrides_instrument_length() {
    let text = "name: x\nscale_length: 648mm\ncourses:\n  - pitch: E4\n    scale_length: 25in\n";
    let instrument = parse(text).unwrap();
    assert!((instrument.course_input(0, None).unwrap().length_m - 0.635).abs() < 1e-12);
}

#[test]
fn no_courses_names_the_line() {
    let err = message("name: x\nscale_length: 648mm\ncourses: []\n");
    assert!(err.starts_with("i.yaml:3:"), "{err}");
    assert!(
        err.contains("`courses`") && err.contains("no courses"),
        "{err}"
    );
}

#[test]
fn missing_length_names_the_course() {
    let err = message("name: x\ncourses:\n  - pitch: E4\n  - pitch: B3\n");
    assert!(err.starts_with("i.yaml:3:"), "{err}");
    assert!(err.contains("courses[0].scale_length"), "{err}");
    assert!(err.contains("no vibrating length"), "{err}");
}

#[test]
fn negative_and_nan_values_name_their_line_and_field() {
    let err = message("name: x\nscale_length: -648mm\ncourses:\n  - pitch: E4\n");
    assert!(err.starts_with("i.yaml:2:"), "{err}");
    assert!(err.contains("scale_length"), "{err}");
    let err = message("name: x\nscale_length: 648mm\ncourses:\n  - pitch: E4\n    tension: .nan\n");
    assert!(err.starts_with("i.yaml:5:"), "{err}");
    assert!(err.contains("courses[0].tension"), "{err}");
    let err =
        message("name: x\nscale_length: 648mm\ncourses:\n  - pitch: E4\n    max_diameter: NaNmm\n");
    assert!(err.starts_with("i.yaml:5:"), "{err}");
    assert!(err.contains("courses[0].max_diameter"), "{err}");
}

#[test]
fn duplicate_course_numbers_point_at_the_second() {
    let text = "name: x\nscale_length: 648mm\ncourses:\n  - course: 1\n    pitch: E4\n  - course: 2\n    pitch: B3\n  - course: 1\n    pitch: G3\n";
    let err = message(text);
    assert!(err.starts_with("i.yaml:8:"), "{err}");
    assert!(err.contains("courses[2].course"), "{err}");
    assert!(
        err.contains("used twice") && err.contains("line 4"),
        "{err}"
    );
}

#[test]
fn too_many_strings_or_courses_are_refused() {
    let err = message("name: x\nscale_length: 648mm\ncourses:\n  - pitch: E4\n    strings: [unison, unison, octave, octave]\n");
    assert!(
        err.contains("courses[0].strings") && err.contains("1 to 3"),
        "{err}"
    );
    let mut text = String::from("name: big\nscale_length: 648mm\ncourses:\n");
    for _ in 0..=MAX_COURSES {
        text.push_str("  - pitch: E4\n");
    }
    let err = message(&text);
    assert!(err.contains("at most 1000"), "{err}");
}

#[test]
fn misspelt_keys_and_profiles_in_courses_are_refused() {
    let err = message("name: x\nscale_lenght: 648mm\ncourses:\n  - pitch: E4\n");
    assert!(err.contains("did you mean `scale_length`"), "{err}");
    let err = message("name: x\nscale_length: 648mm\ncourses:\n  - pitch: E4\n    tension: {first: 1N, last: 2N}\n");
    assert!(
        err.contains("courses[0].tension") && err.contains("whole instrument"),
        "{err}"
    );
    let err =
        message("name: x\nscale_length: 648mm\ncourses:\n  - pitch: E4\n    strings: [fifth]\n");
    assert!(
        err.starts_with("i.yaml:5:") && err.contains("courses[0].strings[0]"),
        "{err}"
    );
    let err =
        message("name: x\nscale_length: 648mm\ndefaults:\n  kinds: []\ncourses:\n  - pitch: E4\n");
    assert!(
        err.starts_with("i.yaml:4:") && err.contains("defaults.kinds"),
        "{err}"
    );
}

#[test]
fn per_string_kinds_read_from_the_mapping_form() {
    let text = "name: x\nscale_length: 648mm\ncourses:\n  - pitch: G3\n    strings:\n      - unison\n      - {interval: octave, kinds: [plain]}\n";
    let instrument = parse(text).unwrap();
    let strings = &instrument.courses[0].strings;
    assert_eq!(
        strings[1].kinds.as_deref(),
        Some(&["plain".to_string()][..])
    );
    assert_eq!(strings[0].kinds, None);
}

#[test]
fn every_template_reads() {
    for (name, _) in TEMPLATES {
        let instrument = Instrument::load(name).unwrap();
        assert!(!instrument.courses.is_empty(), "{name}");
    }
    let err = Instrument::load("guitar-19-edo").unwrap_err().to_string();
    assert!(err.contains("did you mean"), "{err}");
}
