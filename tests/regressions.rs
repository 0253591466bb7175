//! Inputs that once made `taut` panic, hang, accept nonsense or say something unhelpful; each test
//! names the input and what happened before the fix.

use taut::error::EXIT_BAD_INPUT;
use taut::units::{Force, Length, Pressure};

/// Found by reading `units.rs`: `1e308kN` is a finite number, but times 1000 it overflowed to
/// infinity and was accepted as `Force(inf)`; a plan built on it would be all NaN.
#[test]
fn quantity_overflowing_on_conversion_is_refused() {
    for text in ["1e308kN", "1.7e308 kN", "1e305 GPa", "1e307 lb/in3"] {
        let refused = match text.split_whitespace().last() {
            Some("GPa") => text.parse::<Pressure>().err(),
            Some("lb/in3") => text.parse::<taut::units::Density>().err(),
            _ => text.parse::<Force>().err(),
        };
        let err = refused.unwrap_or_else(|| panic!("{text} was accepted"));
        assert_eq!(err.exit_code(), EXIT_BAD_INPUT);
        assert!(err.to_string().contains("too large"), "{err}");
    }
    // The largest finite values still convert.
    assert!("1e300kN".parse::<Force>().is_ok());
    assert!("1e-300mm".parse::<Length>().is_ok());
}

/// Found by measuring the reader: a document of unclosed `[` (2 million of them, under the
/// 4 MiB limit) kept the YAML scanner busy for hours, because its work grows with the nesting
/// depth times the length (40,000 levels took 3.8 s in a release build). Now the reader refuses
/// at the 129th level, naming the line and column, before the scanner runs.
#[test]
fn unclosed_flow_brackets_are_refused_at_the_limit() {
    let text = format!("name: {}\n", "[".repeat(2_000_000));
    let err = taut::yaml::parse::<serde_yaml::Value>(&text, "deep.yaml").expect_err("accepted");
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
    let shown = taut::yaml::parse::<serde_yaml::Value>(&text, "q.yaml")
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
    taut::yaml::parse::<serde_yaml::Value>(&text, "ok.yaml").expect("a real document");
}

/// An unclosed quote was reported as "found unexpected end of stream" at the end of the file,
/// with no word of the quote or where it opened.
#[test]
fn unclosed_quote_says_where_it_opened() {
    let shown = taut::yaml::parse::<serde_yaml::Value>("name: 'x\nload: 70N\n", "q.yaml")
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
    let shown = taut::yaml::parse::<serde_yaml::Value>("a: b: c\n", "m.yaml")
        .expect_err("accepted")
        .to_string();
    assert!(shown.starts_with("m.yaml:1:5: mapping values"), "{shown}");
    assert!(!shown.contains('?'), "{shown}");
}

/// A document nested 128 levels deep in block style was reported with a field path of 128
/// segments (`a.k.k.k…`, 260 characters); the path is now cut.
#[test]
fn deep_field_path_is_shortened() {
    let mut text = String::from("a:\n");
    for depth in 1..200 {
        text.push_str(&" ".repeat(depth));
        text.push_str("k:\n");
    }
    let shown = taut::yaml::parse::<serde_yaml::Value>(&text, "d.yaml")
        .expect_err("accepted")
        .to_string();
    assert!(shown.contains("…`"), "{shown}");
    assert!(
        shown.lines().next().is_some_and(|l| l.len() < 250),
        "{shown}"
    );
}
