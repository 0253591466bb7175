use super::*;
use approx::assert_relative_eq;

#[test]
fn parses_practitioners_units() {
    // Exact conversion factors: NIST SP 811 (international inch and pound, standard gravity).
    assert_relative_eq!("648mm".parse::<Length>().unwrap().si(), 0.648);
    assert_relative_eq!(
        "25.5 in".parse::<Length>().unwrap().si(),
        0.6477,
        epsilon = 1e-12
    );
    assert_relative_eq!(
        "16lbf".parse::<Force>().unwrap().si(),
        71.171_545_844_168,
        epsilon = 1e-9
    );
    assert_relative_eq!(
        "7 kgf".parse::<Force>().unwrap().si(),
        68.646_55,
        epsilon = 1e-9
    );
    assert_relative_eq!("82.41Hz".parse::<Frequency>().unwrap().si(), 82.41);
    assert_relative_eq!(
        "0.284lb/in3".parse::<Density>().unwrap().si(),
        7861.093,
        epsilon = 0.01
    );
    assert_relative_eq!(
        "1ksi".parse::<Pressure>().unwrap().si(),
        6.894_757_293_168e6,
        epsilon = 1e-3
    );
    assert_relative_eq!("1e3N".parse::<Force>().unwrap().si(), 1000.0);
    // `lb` and `lbs` are pound-force where a force is asked for, pounds where a mass is.
    assert_relative_eq!(
        "16 lb".parse::<Force>().unwrap().si(),
        16.0 * NEWTONS_PER_LBF
    );
    assert_relative_eq!(
        "16lbs".parse::<Force>().unwrap().si(),
        16.0 * NEWTONS_PER_LBF
    );
    assert_relative_eq!("2 lbs".parse::<Mass>().unwrap().si(), 2.0 * KG_PER_POUND);
}

#[test]
fn refuses_wrong_dimension_missing_unit_and_non_positive() {
    let err = "70N".parse::<Length>().unwrap_err().to_string();
    assert!(
        err.contains("is a force") && err.contains("needs a length"),
        "{err}"
    );
    assert!("648"
        .parse::<Length>()
        .unwrap_err()
        .to_string()
        .contains("no unit"));
    assert!("0mm".parse::<Length>().is_err());
    assert!("-3mm".parse::<Length>().is_err());
    assert!("NaNmm".parse::<Length>().is_err());
    assert!("infmm".parse::<Length>().is_err());
    let err = "648 milimetres".parse::<Length>().unwrap_err().to_string();
    assert!(err.contains("unknown unit"), "{err}");
    assert!(Length::new(f64::NAN).is_err());
}

#[test]
fn deserialize_names_the_problem() {
    #[derive(Debug, Deserialize)]
    #[allow(dead_code)]
    struct Probe {
        length: Length,
    }
    let err = crate::input::yaml::parse::<Probe>("length: 648\n", "p.yaml")
        .unwrap_err()
        .to_string();
    assert!(
        err.contains("p.yaml:1:") && err.contains("no unit"),
        "{err}"
    );
    let ok: Probe = crate::input::yaml::parse("length: 25.5in\n", "p.yaml").unwrap();
    assert_relative_eq!(ok.length.si(), 0.6477, epsilon = 1e-12);
    // A value of the wrong type is told what a length looks like, at its line.
    for wrong in [
        "length: [648mm]\n",
        "length: {a: 1}\n",
        "length: true\n",
        "length: ~\n",
    ] {
        let err = crate::input::yaml::parse::<Probe>(wrong, "p.yaml")
            .unwrap_err()
            .to_string();
        assert!(
            err.contains("p.yaml:1:") && err.contains("a length with its unit, e.g. `648mm`"),
            "{wrong}: {err}"
        );
    }
}

#[test]
fn output_units_convert_back() {
    assert_relative_eq!(ForceUnit::Lbf.from_newtons(NEWTONS_PER_LBF), 1.0);
    assert_relative_eq!(LengthUnit::In.from_metres(0.0254), 1.0);
}
