//! Selector speed on an invented 200-course harp-like set: pitches spaced evenly in log frequency
//! from C1 to about A7, lengths shrinking from 1.55 m to 6 cm, seven allowed kinds per course.

use std::hint::black_box;

use criterion::{criterion_group, criterion_main, Criterion, Throughput};
use taut::strings::kind::{StringKind, StringKinds};
use taut::strings::select::{select, Choice, Request};

const COURSES: usize = 200;
const KIND_IDS: [&str; 7] = [
    "gut",
    "nylon",
    "fluorocarbon",
    "plain-steel",
    "silver-wound-nylon",
    "copper-wound-steel",
    "copper-double-wound-steel",
];

fn harp_requests() -> Vec<Request> {
    (0..COURSES)
        .map(|i| {
            let step = i as f64 / (COURSES - 1) as f64;
            let frequency = 32.703 * 2f64.powf(6.6 * step);
            let length = (1.55 * (frequency / 32.703).powf(-0.75)).max(0.06);
            let target_tension = 120.0 - 80.0 * step;
            Request::new(frequency, length, target_tension)
        })
        .collect()
}

fn bench_select(c: &mut Criterion) {
    let Ok(all) = StringKinds::builtin() else {
        return;
    };
    let kinds: Vec<&StringKind> = KIND_IDS.iter().filter_map(|id| all.get(id).ok()).collect();
    let requests = harp_requests();
    let mut best: [Option<Choice>; KIND_IDS.len()] = [None; KIND_IDS.len()];
    let mut group = c.benchmark_group("select");
    group.throughput(Throughput::Elements(COURSES as u64));
    group.bench_function("harp_200_courses_7_kinds", |b| {
        b.iter(|| {
            for request in &requests {
                black_box(select(black_box(request), &kinds, &mut best));
            }
        })
    });
    group.finish();
}

criterion_group!(benches, bench_select);
criterion_main!(benches);
