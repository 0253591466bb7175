//! Reading and solving the 200-course instruments of `instruments.rs`: per-course lengths, a
//! tension profile and two kinds per course. Reading alone is timed too: it is serde_yaml's
//! share, which no change to `taut` can shrink.

use criterion::{criterion_group, criterion_main, Criterion};
use taut::instrument::Instrument;
use taut::plan::solve;
use taut::strings::stock::Stock;

#[path = "instruments.rs"]
mod instruments;

fn bench_plan(c: &mut Criterion) {
    let tuning = match taut::tuning::load("12edo") {
        Ok(tuning) => tuning,
        Err(err) => panic!("{err}"),
    };
    let stock = match Stock::builtin() {
        Ok(stock) => stock,
        Err(err) => panic!("{err}"),
    };
    for (name, text) in [
        ("zither", instruments::zither()),
        ("overstressed harp", instruments::overstressed_harp()),
    ] {
        let instrument = match Instrument::from_text(text.clone(), "bench.yaml") {
            Ok(instrument) => instrument,
            Err(err) => panic!("{err}"),
        };
        c.bench_function(&format!("solve 200 courses, {name}"), |b| {
            b.iter(|| solve::solve(&instrument, &tuning, stock, None))
        });
        c.bench_function(&format!("read 200 courses, {name}"), |b| {
            b.iter(|| Instrument::from_text(text.clone(), "bench.yaml"))
        });
        c.bench_function(&format!("read and solve 200 courses, {name}"), |b| {
            b.iter(|| {
                Instrument::from_text(text.clone(), "bench.yaml")
                    .and_then(|instrument| solve::solve(&instrument, &tuning, stock, None))
            })
        });
    }
}

criterion_group!(benches, bench_plan);
criterion_main!(benches);
