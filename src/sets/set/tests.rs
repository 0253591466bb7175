use super::*;
use crate::input::units::METRES_PER_INCH;
use crate::strings::construction::Construction;
use crate::strings::kind::StringKinds;
use crate::strings::material::Materials;

fn parse(text: &str) -> Result<StringSet> {
    StringSet::from_text(text.to_string(), "s.yaml", Stock::builtin().unwrap())
}

#[test]
fn reads_each_way_of_writing_a_string() {
    let set = parse(
        "name: t\ncourses:\n  - strings:\n      - {kind: plain-steel, diameter: 0.012in}\n  - strings:\n      - {kind: phosphor-bronze-wound, diameter: 0.053in, core_diameter: 0.021in}\n  - strings:\n      - {unit_mass: 6.2g/m, diameter: 0.046in, material: music-wire}\n  - course: 7\n    strings:\n      - {mass: 1.8g, length: 900mm}\n",
    )
    .unwrap();
    assert_eq!(set.courses.len(), 4);
    assert_eq!(set.courses[3].course, 7);
    match &set.courses[3].strings[0] {
        // μ = m/l (OpenStax University Physics Vol. 1 eq. 16.7): 1.8 g / 0.9 m = 2 g/m.
        SetString::Measured { unit_mass, .. } => assert!((unit_mass - 0.002).abs() < 1e-15),
        other => panic!("{other:?}"),
    }
    let kinds = StringKinds::builtin().unwrap();
    let materials = Materials::builtin().unwrap();
    let wound = set.courses[1].strings[0].resolve(kinds, materials).unwrap();
    match wound.construction {
        Construction::Wound { core, .. } => {
            assert!((core.diameter - 0.021 * METRES_PER_INCH).abs() < 1e-12)
        }
        other => panic!("{other:?}"),
    }
}

#[test]
fn yaml_round_trip_keeps_the_strings() {
    let text = "name: t\ncourses:\n  - strings:\n      - {kind: plain-steel, diameter: 0.0115in}\n      - {kind: nylon, diameter: 0.84mm}\n  - strings:\n      - {kind: phosphor-bronze-wound, diameter: 0.053in, core_diameter: 0.021in}\n  - strings:\n      - {unit_mass: 6.2g/m, diameter: 1.17mm, material: music-wire}\n      - {mass: 1.8g, length: 900mm}\n";
    let set = parse(text).unwrap();
    let again = parse(&set.to_yaml()).unwrap();
    assert_eq!(set.courses.len(), again.courses.len());
    for (a, b) in set.courses.iter().zip(&again.courses) {
        for (x, y) in a.strings.iter().zip(&b.strings) {
            assert_eq!(x.label(), y.label());
            let (dx, dy) = (x.diameter().unwrap_or(0.0), y.diameter().unwrap_or(0.0));
            assert!((dx - dy).abs() <= 1e-9, "{dx} vs {dy}");
        }
    }
}

#[test]
fn length_text_uses_the_trade_units() {
    assert_eq!(length_text(0.010 * METRES_PER_INCH), "0.010in");
    assert_eq!(length_text(0.0115 * METRES_PER_INCH), "0.0115in");
    assert_eq!(length_text(0.00084), "0.84mm");
    assert_eq!(length_text(0.648), "648mm");
}

#[test]
fn bad_entries_name_line_and_field() {
    let err = parse("name: t\ncourses:\n  - strings:\n      - kind: plain-steel\n")
        .unwrap_err()
        .to_string();
    assert!(err.starts_with("s.yaml:4:"), "{err}");
    assert!(err.contains("courses[0].strings[0].kind"), "{err}");
    assert!(err.contains("diameter"), "{err}");
    let err = parse("name: t\ncourses:\n  - strings:\n      - kind: plain-steel\n        diameter: 0.01in\n        core_diameter: 0.005in\n")
        .unwrap_err()
        .to_string();
    assert!(err.starts_with("s.yaml:6:"), "{err}");
    let err = parse(
        "name: t\ncourses:\n  - strings:\n      - kind: plain-stel\n        diameter: 0.01in\n",
    )
    .unwrap_err()
    .to_string();
    assert!(err.contains("did you mean `plain-steel`"), "{err}");
}
