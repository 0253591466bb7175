//! Tests of error messages, locations and the escaping of user text.

use super::*;

#[test]
fn renders_full_location_field_and_help() {
    let err = Error::input("length must be greater than zero")
        .field("length")
        .within("courses[3]")
        .at(12, 5)
        .in_origin("harp.yaml")
        .help("write a length such as `648mm`");
    assert_eq!(
        err.to_string(),
        "harp.yaml:12:5: field `courses[3].length`: length must be greater than zero\n  help: write a length such as `648mm`"
    );
    assert_eq!(err.exit_code(), EXIT_BAD_INPUT);
}

#[test]
fn inner_location_wins_over_outer() {
    let err = Error::input("bad")
        .at(3, 1)
        .at(9, 9)
        .in_origin("a")
        .in_origin("b");
    assert_eq!(err.to_string(), "a:3:1: bad");
}

#[test]
fn control_characters_are_shown_escaped() {
    assert_eq!(shown("Probe"), "Probe");
    assert_eq!(
        shown("a\u{1b}]0;pwned\u{7}b\u{1b}[31mc\nd\u{202e}"),
        "a\\u{1b}]0;pwned\\u{7}b\\u{1b}[31mc\\nd\\u{202e}"
    );
    let err = Error::input("name `x\u{1b}[2Jy` is odd")
        .in_origin("a\nb.yaml")
        .help("no \u{7}bell");
    assert_eq!(
        err.to_string(),
        "a\\nb.yaml: name `x\\u{1b}[2Jy` is odd\n  help: no \\u{7}bell"
    );
}

#[test]
fn each_character_is_escaped_by_its_own_rule_wherever_it_stands() {
    fn escaped_one_by_one(text: &str) -> String {
        text.chars()
            .map(|c| match c {
                '\n' => "\\n".to_string(),
                '\r' => "\\r".to_string(),
                '\t' => "\\t".to_string(),
                c if c.is_control()
                    || matches!(c, '\u{202a}'..='\u{202e}' | '\u{2066}'..='\u{2069}') =>
                {
                    format!("\\u{{{:x}}}", u32::from(c))
                }
                c => c.to_string(),
            })
            .collect()
    }
    // Every character of the first planes, then a sample of the rest, at every place in a
    // block of the scan, among characters that share their first bytes.
    let characters = (0..0x3000u32)
        .chain((0x3000..=0x10_ffff).step_by(97))
        .filter_map(char::from_u32);
    for c in characters {
        // The scan tests 16 bytes at a time: these put `c` in, across and after a block.
        for lead in [0, 1, 13, 14, 15, 16, 31] {
            let text = format!("{}{c}─▰…·é\u{2060}z", "x".repeat(lead));
            let expected = escaped_one_by_one(&text);
            let got = shown(&text);
            assert_eq!(got, expected, "U+{:04X} after {lead}", u32::from(c));
            assert_eq!(
                matches!(got, std::borrow::Cow::Borrowed(_)),
                expected == text,
                "U+{:04X}",
                u32::from(c)
            );
        }
    }
}

#[test]
fn suggests_close_names_only() {
    assert_eq!(did_you_mean("lenght", ["length", "pitch"]), Some("length"));
    assert_eq!(did_you_mean("zzz", ["length", "pitch"]), None);
}
