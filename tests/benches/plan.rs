//! Solving a 200-course instrument: a harp-like layout with per-course lengths, a tension
//! profile and two kinds per course.

use criterion::{criterion_group, criterion_main, Criterion};
use taut::instrument::Instrument;
use taut::plan::solve;
use taut::strings::stock::Stock;

fn two_hundred_courses() -> String {
    let mut text = String::from(
        "name: bench\ndefaults:\n  kinds: [plain-steel, phosphor-bronze-wound]\n  tension: {first: 40N, last: 160N, shape: geometric}\ncourses:\n",
    );
    for index in 0..200 {
        // Equal-tempered steps of 1/40 octave down from 2 kHz, lengths growing towards the bass.
        let hz = 2000.0 * (-(index as f64) / 40.0).exp2();
        let length_mm = 120.0 + 6.0 * index as f64;
        text.push_str(&format!(
            "  - pitch: {hz:.4}hz\n    scale_length: {length_mm}mm\n"
        ));
    }
    text
}

fn bench_plan(c: &mut Criterion) {
    let instrument = match Instrument::from_text(two_hundred_courses(), "bench.yaml") {
        Ok(instrument) => instrument,
        Err(err) => panic!("{err}"),
    };
    let tuning = match taut::tuning::load("12edo") {
        Ok(tuning) => tuning,
        Err(err) => panic!("{err}"),
    };
    let stock = match Stock::builtin() {
        Ok(stock) => stock,
        Err(err) => panic!("{err}"),
    };
    c.bench_function("solve 200 courses", |b| {
        b.iter(|| solve::solve(&instrument, &tuning, stock, None))
    });
    c.bench_function("read and solve 200 courses", |b| {
        let text = two_hundred_courses();
        b.iter(|| {
            Instrument::from_text(text.clone(), "bench.yaml")
                .and_then(|instrument| solve::solve(&instrument, &tuning, stock, None))
        })
    });
}

criterion_group!(benches, bench_plan);
criterion_main!(benches);
