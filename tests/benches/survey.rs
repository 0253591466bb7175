//! Survey speed, the crossings sweep beside the exhaustive search, on the workload of
//! examples/fanned-8-fourths.yaml: 8 single-string courses fanned 660 mm (course 1, lowest) to
//! 620 mm (course 8); neighbouring courses round(N·log2(4/3)) steps of N-EDO apart; course 1 at
//! E2 (82.4069 Hz) shifted from -600 to +600 cents; kinds plain-steel then nickel-wound, target
//! 75 N, window 55-100 N, caution at 75 %.
//!
//! Groups (every core; throughput in candidates):
//! - `survey/readme`: the README's survey before it grew, EDO 5-72, 0.1-cent steps (816,068
//!   candidates), both ways;
//! - `survey/edo-311`: EDO 5-311 in 0.01-cent steps (36.8 million candidates; the README's
//!   survey now, examples/survey-fourths.yaml), both ways;
//! - `survey/done-when`: EDO 5-311 in 0.001-cent steps (368 million candidates, 2.9e9 course
//!   checks), both ways (the exhaustive search with few samples: it takes seconds);
//! - `survey/offsets`: the sweep alone, EDO 5-311, offset steps 1, 0.1, 0.01 and 0.001 cents:
//!   1,000 times the offsets, the same crossings;
//! - `survey/crossings`: the sweep alone, 0.01-cent steps, EDO 5-80, 5-160 and 5-311: the
//!   crossings grow with the tunings;
//! - `survey/set-up`: loading the tunings and building the tables for EDO 5-311.

use criterion::{criterion_group, criterion_main, Criterion, Throughput};
use taut::instrument::Instrument;
use taut::strings::stock::Stock;
use taut::survey::{Method, Settings, Survey};

const INSTRUMENT: &str = include_str!("../../examples/fanned-8-fourths.yaml");

fn instrument() -> Instrument {
    match Instrument::from_text(INSTRUMENT.to_string(), "bench instrument") {
        Ok(instrument) => instrument,
        Err(err) => panic!("{err}"),
    }
}

/// The example's settings (examples/survey-fourths.yaml) with EDOs 5 to `last_edo` and the
/// offset step `step`.
fn settings(last_edo: u32, step: &str) -> Settings {
    let text = format!(
        "tunings: {{edos: {{from: 5, to: {last_edo}}}}}\ncourse_1: E2\noffset_cents: {{from: -600, to: 600, step: {step}}}\ncourses: {{nearest_to: 4/3}}\nrank_by: spread\ntop: 10\n"
    );
    match Settings::from_text(text, "bench settings") {
        Ok(settings) => settings,
        Err(err) => panic!("{err}"),
    }
}

fn prepared<'a>(instrument: &'a Instrument, settings: &'a Settings) -> Survey<'a> {
    let kinds = match Stock::builtin() {
        Ok(kinds) => kinds,
        Err(err) => panic!("{err}"),
    };
    match Survey::prepare(instrument, settings, kinds) {
        Ok(survey) => survey,
        Err(err) => panic!("{err}"),
    }
}

fn both_ways(c: &mut Criterion, group: &str, settings: &Settings, exhaustive_samples: usize) {
    let instrument = instrument();
    let survey = prepared(&instrument, settings);
    println!(
        "{group}: {} candidates, {} course checks, {} crossings",
        survey.size().candidates,
        survey.size().course_checks,
        survey.crossings()
    );
    let mut group = c.benchmark_group(group);
    group.throughput(Throughput::Elements(survey.size().candidates));
    group.sample_size(20);
    group.bench_function("crossings", |b| {
        b.iter(|| survey.search_with(Method::Crossings, &|_| {}))
    });
    group.sample_size(exhaustive_samples);
    group.bench_function("exhaustive", |b| {
        b.iter(|| survey.search_with(Method::Exhaustive, &|_| {}))
    });
    group.finish();
}

fn bench_survey(c: &mut Criterion) {
    let readme = settings(72, "0.1");
    assert_eq!(readme.offsets.len(), 12_001);
    both_ways(c, "survey/readme", &readme, 20);
    both_ways(c, "survey/edo-311", &settings(311, "0.01"), 10);
    both_ways(c, "survey/done-when", &settings(311, "0.001"), 10);

    let instrument = instrument();
    let mut group = c.benchmark_group("survey/offsets");
    group.sample_size(20);
    for step in ["1", "0.1", "0.01", "0.001"] {
        let settings = settings(311, step);
        let survey = prepared(&instrument, &settings);
        group.throughput(Throughput::Elements(survey.crossings()));
        group.bench_function(
            format!("step-{step}-{}-crossings", survey.crossings()),
            |b| b.iter(|| survey.search_with(Method::Crossings, &|_| {})),
        );
    }
    group.finish();

    let mut group = c.benchmark_group("survey/crossings");
    group.sample_size(20);
    for last_edo in [80, 160, 311] {
        let settings = settings(last_edo, "0.01");
        let survey = prepared(&instrument, &settings);
        group.throughput(Throughput::Elements(survey.crossings()));
        group.bench_function(
            format!("edo-5-{last_edo}-{}-crossings", survey.crossings()),
            |b| b.iter(|| survey.search_with(Method::Crossings, &|_| {})),
        );
    }
    group.finish();

    let settings = settings(311, "0.01");
    let mut group = c.benchmark_group("survey/set-up");
    group.sample_size(10);
    group.bench_function("edo-5-311", |b| {
        b.iter(|| prepared(&instrument, &settings).size())
    });
    group.finish();
}

criterion_group!(benches, bench_survey);
criterion_main!(benches);
