//! Pitch syntax (`E2`, `~E2`, `E2+14c`, `deg3p1`, `386.3c`, `3/2`, `82.41hz`), parsed and then
//! resolved in tunings of each layout: no panic; a resolved pitch is finite and positive.
#![no_main]

use std::sync::OnceLock;

use libfuzzer_sys::fuzz_target;
use taut::tuning::pitch::{NoteName, PitchSpec};
use taut::tuning::{inline, library, Tuning};

fn tunings() -> &'static [Tuning] {
    static TUNINGS: OnceLock<Vec<Tuning>> = OnceLock::new();
    TUNINGS.get_or_init(|| {
        let mut all: Vec<Tuning> = ["12edo", "19edo", "just-5-limit", "meantone-quarter-comma", "harmonics-8-16"]
            .iter()
            .filter_map(|name| library::load(name).and_then(Result::ok))
            .collect();
        all.extend(
            ["13ed3/1", "hertz:98,110,123.47", "cents:0,200,400,500,700", "chain:3/2,6,5"]
                .iter()
                .filter_map(|spec| inline::parse(spec).ok()),
        );
        assert!(all.len() >= 9, "the shipped tunings must load");
        all
    })
}

fuzz_target!(|text: &str| {
    if let Ok(note) = text.parse::<NoteName>() {
        let hz = note.hz(440.0);
        assert!(hz.is_finite() && hz >= 0.0, "{text:?}: {hz} Hz");
    }
    let Ok(spec) = text.parse::<PitchSpec>() else {
        return;
    };
    let _ = spec.to_string();
    for tuning in tunings() {
        if let Ok(pitch) = tuning.resolve(&spec) {
            assert!(
                pitch.hz.is_finite() && pitch.hz > 0.0,
                "{text:?} in {}: {} Hz",
                tuning.name(),
                pitch.hz
            );
        }
    }
});
