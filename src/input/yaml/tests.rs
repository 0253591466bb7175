use super::*;
use serde::Deserialize;

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
#[allow(dead_code)]
struct Course {
    length: f64,
    pitch: String,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
#[allow(dead_code)]
struct Doc {
    name: String,
    courses: Vec<Course>,
}

#[test]
fn unknown_key_names_line_field_and_suggestion() {
    let text = "name: x\ncourses:\n  - length: 1\n    pitch: E2\n  - lenght: 2\n    pitch: A2\n";
    let err = parse::<Doc>(text, "i.yaml").unwrap_err().to_string();
    assert!(err.starts_with("i.yaml:5:"), "{err}");
    assert!(err.contains("courses[1]"), "{err}");
    assert!(err.contains("did you mean `length`?"), "{err}");
}

#[test]
fn wrong_type_names_field() {
    let text = "name: x\ncourses:\n  - length: long\n    pitch: E2\n";
    let err = parse::<Doc>(text, "i.yaml").unwrap_err().to_string();
    assert!(err.contains("i.yaml:3:"), "{err}");
    assert!(err.contains("courses[0].length"), "{err}");
}

#[test]
fn empty_and_binary_and_non_utf8_are_refused() {
    assert!(parse::<Doc>("  \n# only a comment\n", "e.yaml")
        .unwrap_err()
        .to_string()
        .contains("empty"));
    let err = text_from_bytes(b"name: x\n\0\0".to_vec(), "b.yaml")
        .unwrap_err()
        .to_string();
    assert!(
        err.starts_with("b.yaml:2:1:") && err.contains("binary"),
        "{err}"
    );
    let err = text_from_bytes(b"name: \xff\n".to_vec(), "u.yaml")
        .unwrap_err()
        .to_string();
    assert!(
        err.starts_with("u.yaml:1:7:") && err.contains("UTF-8"),
        "{err}"
    );
}

#[test]
fn alias_bomb_is_refused() {
    let mut text = String::from("a0: &a0 [x, x, x, x, x, x, x, x, x, x]\n");
    for i in 1..10 {
        let p = i - 1;
        text.push_str(&format!(
            "a{i}: &a{i} [*a{p}, *a{p}, *a{p}, *a{p}, *a{p}, *a{p}, *a{p}, *a{p}, *a{p}, *a{p}]\n"
        ));
    }
    let result = parse::<serde_yaml::Value>(&text, "bomb.yaml");
    assert!(result.is_err());
}

#[test]
fn locate_finds_nested_fields() {
    let text = "name: x\ncourses:\n  - length: 1\n    pitch: E2\n  - length: 2\n    pitch: A2\n";
    assert_eq!(locate(text, &[PathStep::Key("name")]), Some((1, 1)));
    assert_eq!(
        locate(text, &[PathStep::Key("courses"), PathStep::Index(1)]),
        Some((5, 5))
    );
    assert_eq!(
        locate(
            text,
            &[
                PathStep::Key("courses"),
                PathStep::Index(1),
                PathStep::Key("pitch")
            ]
        ),
        Some((6, 5))
    );
    assert_eq!(
        locate(
            text,
            &[
                PathStep::Key("courses"),
                PathStep::Index(0),
                PathStep::Key("length")
            ]
        ),
        Some((3, 5))
    );
    assert_eq!(locate(text, &[PathStep::Key("missing")]), None);
    // Flow style below a block key: the deepest block-style ancestor is reported.
    let flow = "name: x\ncourses:\n  - course: 1\n    strings: [{kind: a}]\n";
    assert_eq!(
        locate(
            flow,
            &[
                PathStep::Key("courses"),
                PathStep::Index(0),
                PathStep::Key("strings"),
                PathStep::Index(0),
                PathStep::Key("kind")
            ]
        ),
        Some((4, 5))
    );
}

#[test]
fn quoted_text_reads_back_as_itself() {
    // Every character YAML will not hold raw, and the ones it quotes, round-trip.
    let hostile = "n\0\u{7}\u{b}\u{1b}\u{7f}\u{85}\u{9f}\u{2028}\u{2029}\u{feff}\u{fffe}\u{ffff}\"\\\n\t'<&> 名前";
    let text = format!("name: {}\n", quoted(hostile));
    let value: serde_yaml::Value = parse(&text, "test").unwrap();
    assert_eq!(value["name"].as_str(), Some(hostile));
}
