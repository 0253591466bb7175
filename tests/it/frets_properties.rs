//! Property tests of fret layouts over random tunings, lengths, open pitches and fretted steps:
//! positions strictly increase and stay below the vibrating length; a degree an octave above
//! the open string lands at half the length (x(2) = L·(1 − 1/2), Mersenne's first law,
//! REFERENCES §8.1); the spacing is the difference of neighbouring positions.

use proptest::prelude::*;

use taut::frets::{lay_out, FretLayout};
use taut::instrument::{FretSettings, Instrument};

fn layout(tuning: &str, length_mm: f64, pitches: &[i64], frets: &str) -> FretLayout {
    let courses: String = pitches
        .iter()
        .map(|k| format!("  - pitch: deg{k}\n"))
        .collect();
    let text = format!(
        "name: Random\ntuning: '{tuning}'\nscale_length: {length_mm}mm\n{frets}courses:\n{courses}"
    );
    let instrument = Instrument::from_text(text, "random").unwrap();
    let tuning = taut::tuning::load(tuning).unwrap();
    lay_out(&instrument, &tuning, &FretSettings::default()).unwrap()
}

fn check(layout: &FretLayout) -> Result<(), TestCaseError> {
    for course in &layout.courses {
        let length = course.length_m;
        let mut previous = 0.0;
        for fret in &course.frets {
            let x = fret.distance_from_nut_m;
            prop_assert!(x > previous, "fret {} at {x} after {previous}", fret.fret);
            prop_assert!(x < length, "fret {} at {x} beyond {length}", fret.fret);
            prop_assert!((fret.spacing_m - (x - previous)).abs() <= 1e-12);
            prop_assert!(fret.cents.is_finite() && fret.cents > 0.0);
            if (fret.cents - 1200.0).abs() < 1e-6 {
                prop_assert!(
                    (x - length / 2.0).abs() <= 1e-12 * length,
                    "octave at {x}, length {length}"
                );
            }
            previous = x;
        }
    }
    Ok(())
}

fn octave_count(layout: &FretLayout) -> usize {
    layout
        .courses
        .iter()
        .flat_map(|c| &c.frets)
        .filter(|f| (f.cents - 1200.0).abs() < 1e-6)
        .count()
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(64))]

    #[test]
    fn equal_divisions(
        n in 1usize..80,
        length in 200.0f64..1500.0,
        pitches in prop::collection::vec(-60i64..60, 1..6),
    ) {
        // Open strings within three octaves of the reference: pitches outside 1 Hz to 30 kHz are
        // refused as no string sounds there.
        let pitches: Vec<i64> = pitches.iter().map(|k| k % (3 * n as i64 + 1)).collect();
        let layout = layout(&format!("{n}edo"), length, &pitches, "");
        check(&layout)?;
        // Every course has an octave fret (every degree is fretted, two octaves by default).
        prop_assert_eq!(octave_count(&layout), pitches.len());
    }

    #[test]
    fn just_ratio_lists_and_subsets(
        mut ratios in prop::collection::btree_set((2u32..60, 2u32..60), 1..10),
        length in 200.0f64..1500.0,
        pitch in -20i64..20,
        keep in prop::collection::vec(any::<bool>(), 10),
    ) {
        // Ratios p/q strictly between 1 and 2, made distinct by their value.
        ratios.retain(|(p, q)| p > q && p < &(2 * q));
        let mut values: Vec<(u32, u32)> = ratios.into_iter().collect();
        values.sort_by(|a, b| (f64::from(a.0) / f64::from(a.1)).total_cmp(&(f64::from(b.0) / f64::from(b.1))));
        values.dedup_by(|a, b| u64::from(a.0) * u64::from(b.1) == u64::from(b.0) * u64::from(a.1));
        let list: Vec<String> = std::iter::once("1/1".to_string())
            .chain(values.iter().map(|(p, q)| format!("{p}/{q}")))
            .collect();
        let steps: Vec<String> = (0..list.len())
            .filter(|&i| i == 0 || keep[i % keep.len()])
            .map(|i| i.to_string())
            .collect();
        let frets = format!("frets: {{degrees: [{}], count: 40}}\n", steps.join(", "));
        // Within three periods of the reference (pitches outside 1 Hz to 30 kHz are refused).
        let pitch = pitch % (3 * list.len() as i64 + 1);
        let layout = layout(&format!("ratios:{}", list.join(",")), length, &[pitch], &frets);
        check(&layout)?;
        // Step 0 is kept, so the octave of the open string is fretted.
        prop_assert_eq!(octave_count(&layout), 1);
        // Exact ratios survive: the octave's is 2/1.
        let octave = layout.courses[0].frets.iter().find(|f| (f.cents - 1200.0).abs() < 1e-6);
        prop_assert_eq!(
            octave.and_then(|f| f.ratio.as_ref()).map(taut::tuning::pitch::format_ratio),
            Some("2/1".to_string())
        );
    }
}
