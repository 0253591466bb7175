use super::*;
use approx::assert_abs_diff_eq;

fn twelve() -> Tuning {
    load("12edo").unwrap()
}

#[test]
fn twelve_edo_places_e2_and_e4_by_iso_16() {
    // ISO 16:1975 (A4 = 440 Hz) and f = 440 · 2^((m − 69)/12), REFERENCES §7.2:
    // E2 = 82.4069 Hz, E4 = 329.6276 Hz (DERIVED).
    let tuning = twelve();
    let e2 = tuning.resolve(&"E2".parse().unwrap()).unwrap();
    assert_eq!(e2.degree, Some(-29));
    assert_abs_diff_eq!(e2.hz, 82.4069, epsilon = 5e-5);
    let e4 = tuning.resolve(&"E4".parse().unwrap()).unwrap();
    assert_abs_diff_eq!(e4.hz, 329.6276, epsilon = 5e-5);
    assert_eq!(
        tuning.degree(12).unwrap().ratio,
        Some(Ratio::from_integer(2))
    );
}

#[test]
fn note_names_must_land_unless_snapped_or_offset() {
    let tuning = load("19edo").unwrap();
    let err = tuning
        .resolve(&"E2".parse().unwrap())
        .unwrap_err()
        .to_string();
    assert!(err.contains("~E2"), "{err}");
    let snapped = tuning.resolve(&"~E2".parse().unwrap()).unwrap();
    assert!(snapped.degree.is_some());
    let free = tuning.resolve(&"E2+0c".parse().unwrap()).unwrap();
    assert_eq!(free.degree, None);
    assert_abs_diff_eq!(free.hz, 82.4069, epsilon = 5e-5);
    // A4 is degree 0 of 19-EDO at the default reference, so it lands.
    assert_eq!(
        tuning.resolve(&"A4".parse().unwrap()).unwrap().degree,
        Some(0)
    );
}

#[test]
fn period_steps_and_free_pitches_resolve() {
    let tuning = twelve();
    let p = tuning.resolve(&"deg3p-1".parse().unwrap()).unwrap();
    assert_eq!(p.degree, Some(-9));
    let fifth = tuning.resolve(&"3/2".parse().unwrap()).unwrap();
    assert_eq!(fifth.ratio, Some(Ratio::new(3, 2)));
    assert_eq!(fifth.degree, None);
    assert_abs_diff_eq!(fifth.hz, 660.0, epsilon = 1e-9);
    let octave = tuning.resolve(&"1200c".parse().unwrap()).unwrap();
    assert_eq!(octave.degree, Some(12));
    assert!(tuning.resolve(&"deg12p0".parse().unwrap()).is_err());
}

#[test]
fn nearest_degree_handles_both_layouts_and_bad_input() {
    let tuning = twelve();
    assert_eq!(tuning.nearest_degree(445.0).unwrap().degree, 0);
    assert_eq!(tuning.nearest_degree(430.0).unwrap().degree, 0);
    assert_eq!(tuning.nearest_degree(415.0).unwrap().degree, -1);
    assert!(tuning.nearest_degree(0.0).is_none());
    assert!(tuning.nearest_degree(f64::NAN).is_none());
    let list = load("hertz:100,200,300").unwrap();
    assert_eq!(list.nearest_degree(260.0).unwrap().degree, 2);
    assert_eq!(list.nearest_degree(10.0).unwrap().degree, 0);
    assert!(list.degree(3).is_err());
    assert!(list.degree(-1).is_err());
    assert_eq!(list.degrees_per_period(), None);
}

#[test]
fn huge_degrees_do_not_panic() {
    let tuning = twelve();
    for k in [i64::MAX, i64::MIN, 1 << 40] {
        assert!(tuning.degree(k).is_err(), "{k}");
    }
    let just = load("ratios:1/1,9/8,5/4:2/1").unwrap();
    // Degree 378 is 2^126 (fits in i128); degree 381 is 2^127, which does not: the ratio is
    // gone but the frequency stays. Degree 3100 is 2^1033 · 440 Hz, beyond f64.
    assert_eq!(
        just.degree(378).unwrap().ratio,
        Some(Ratio::from_integer(1i128 << 126))
    );
    let high = just.degree(381).unwrap();
    assert_eq!(high.ratio, None);
    assert!(high.hz.is_finite());
    assert!(just.degree(3100).is_err());
}
