//! The 200-course instruments the `plan` benches solve, written as a builder would write them:
//! one `pitch` and one `scale_length` per course. Invented for the benches.

/// The head of an instrument file: two kinds per course and a tension profile from 40 N at
/// the top to 160 N in the bass.
fn head(name: &str) -> String {
    format!(
        "name: {name}\ndefaults:\n  kinds: [plain-steel, phosphor-bronze-wound]\n  tension: {{first: 40N, last: 160N, shape: geometric}}\ncourses:\n"
    )
}

/// Course `index`'s pitch: steps of 1/40 octave down from 2 kHz, five octaves in 200 courses.
fn pitch_hz(index: usize) -> f64 {
    2000.0 * (-(index as f64) / 40.0).exp2()
}

/// A zither-like layout a builder could string: lengths foreshortened towards the bass (75 mm
/// at 2 kHz, 1.2 m at 62.5 Hz, length ∝ f^-0.8), so every plain top string stays below a
/// third of its breaking stress and the plan is clean.
pub fn zither() -> String {
    let mut text = head("bench zither");
    for index in 0..200 {
        let hz = pitch_hz(index);
        let length_mm = 75.0 * (2000.0 / hz).powf(0.8);
        text.push_str(&format!(
            "  - pitch: {hz:.4}hz\n    scale_length: {length_mm:.1}mm\n"
        ));
    }
    text
}

/// The same pitches on lengths that grow by 6 mm a course from 120 mm, far too long for the
/// treble: about a hundred courses are over their stress limits, so the plan carries a
/// warning, a fix and the safety cautions for each. The heavy case for the renderers.
pub fn overstressed_harp() -> String {
    let mut text = head("bench");
    for index in 0..200 {
        let hz = pitch_hz(index);
        let length_mm = 120.0 + 6.0 * index as f64;
        text.push_str(&format!(
            "  - pitch: {hz:.4}hz\n    scale_length: {length_mm}mm\n"
        ));
    }
    text
}
