//! Rendering speed: a strum of six guitar-like strings (E2 … E4, plain-steel-like B), 3 s at
//! 44.1 kHz, reported as partial-samples per second (the unit of `sound::render::MAX_WORK`).

use std::hint::black_box;

use criterion::{criterion_group, criterion_main, Criterion, Throughput};
use taut::sound::{self, render, Damping, Note, Partial, RenderOptions};

fn strum() -> Vec<Note> {
    [82.41, 110.0, 146.83, 196.0, 246.94, 329.63]
        .iter()
        .enumerate()
        .map(|(i, &pitch_hz)| Note {
            start_s: 0.03 * i as f64,
            duration_s: 3.0,
            pitch_hz,
            inharmonicity: 1e-4,
            pluck: 0.15,
            gain: 1.0,
        })
        .collect()
}

fn bench(c: &mut Criterion) {
    let notes = strum();
    let options = RenderOptions::default();
    let rate = f64::from(options.sample_rate_hz);
    let mut buffer: Vec<Partial> = Vec::new();
    let work: f64 = notes
        .iter()
        .map(|note| {
            sound::partials(note, &Damping::default(), rate, &mut buffer);
            buffer.len() as f64 * note.duration_s * rate
        })
        .sum();
    let mut group = c.benchmark_group("sound");
    group.throughput(Throughput::Elements(work as u64));
    group.bench_function("strum-6x3s", |b| {
        b.iter(|| render(black_box(&notes), black_box(&options)).unwrap())
    });
    group.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
