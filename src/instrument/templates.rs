//! Instruments compiled into the binary: the shipped examples, found by name from anywhere.

/// Built-in instruments as (name, YAML text); the texts are the files in `examples/`.
pub const TEMPLATES: &[(&str, &str)] = &[
    (
        "guitar-19edo",
        include_str!("../../examples/guitar-19edo.yaml"),
    ),
    (
        "lever-harp-34",
        include_str!("../../examples/lever-harp-34.yaml"),
    ),
    (
        "psaltery-26",
        include_str!("../../examples/psaltery-26.yaml"),
    ),
    (
        "fanned-8-just",
        include_str!("../../examples/fanned-8-just.yaml"),
    ),
];

/// The YAML text of the built-in instrument `name`.
pub fn template(name: &str) -> Option<&'static str> {
    TEMPLATES
        .iter()
        .find(|(candidate, _)| *candidate == name)
        .map(|(_, text)| *text)
}
