//! Survey speed on the workload of examples/fanned-8-fourths.yaml with
//! examples/survey-fourths.yaml: 8 single-string courses fanned 660 mm (course 1, lowest) to
//! 620 mm (course 8); N-EDO for N = 5..72; neighbouring courses round(N·log2(4/3)) steps apart;
//! course 1 at E2 (82.4069 Hz) shifted -600..+600 cents in 0.1-cent steps (68 × 12 001
//! candidates, 6 528 544 course checks); kinds plain-steel then nickel-wound, target 75 N,
//! window 55-100 N, caution at 75 %. Throughput is in course checks.
//!
//! Groups: `survey/fourths` on one thread and on every core; `survey/scaling` at more sizes
//! (courses × candidates), on every core.

use criterion::{criterion_group, criterion_main, Criterion, Throughput};
use taut::instrument::Instrument;
use taut::strings::stock::Stock;
use taut::survey::{Settings, Survey};

const INSTRUMENT: &str = include_str!("../../examples/fanned-8-fourths.yaml");
const SETTINGS: &str = include_str!("../../examples/survey-fourths.yaml");

fn instrument(courses: usize) -> Instrument {
    // The example's courses, repeated (pitches do not matter: the survey sets them).
    let mut text = INSTRUMENT
        .split("courses:\n")
        .next()
        .unwrap_or_default()
        .to_string();
    text.push_str("courses:\n");
    for _ in 0..courses {
        text.push_str("  - pitch: E2\n");
    }
    match Instrument::from_text(text, "bench instrument") {
        Ok(instrument) => instrument,
        Err(err) => panic!("{err}"),
    }
}

fn settings(step: &str) -> Settings {
    let text = SETTINGS.replace("step: 0.1}", &format!("step: {step}}}"));
    match Settings::from_text(text, "bench settings") {
        Ok(settings) => settings,
        Err(err) => panic!("{err}"),
    }
}

fn pool(threads: usize) -> rayon::ThreadPool {
    match rayon::ThreadPoolBuilder::new().num_threads(threads).build() {
        Ok(pool) => pool,
        Err(err) => panic!("{err}"),
    }
}

fn bench_survey(c: &mut Criterion) {
    let kinds = match Stock::builtin() {
        Ok(kinds) => kinds,
        Err(err) => panic!("{err}"),
    };
    let eight = instrument(8);
    let tenth = settings("0.1");
    let survey = match Survey::prepare(&eight, &tenth, kinds) {
        Ok(survey) => survey,
        Err(err) => panic!("{err}"),
    };
    assert_eq!(survey.size().course_checks, 6_528_544);
    let cores = std::thread::available_parallelism().map_or(2, |n| n.get());
    let mut group = c.benchmark_group("survey/fourths");
    group.sample_size(20);
    group.throughput(Throughput::Elements(survey.size().course_checks));
    for threads in [1, cores] {
        let pool = pool(threads);
        group.bench_function(format!("{threads}-thread"), |b| {
            b.iter(|| pool.install(|| survey.search(&|_| {})))
        });
    }
    group.bench_function("set-up", |b| {
        b.iter(|| Survey::prepare(&eight, &tenth, kinds).map(|s| s.size()))
    });
    group.finish();

    let mut group = c.benchmark_group("survey/scaling");
    group.sample_size(10);
    for (courses, step) in [(8, "1"), (8, "0.01"), (16, "0.1"), (4, "0.1")] {
        let instrument = instrument(courses);
        let settings = settings(step);
        let survey = match Survey::prepare(&instrument, &settings, kinds) {
            Ok(survey) => survey,
            Err(err) => panic!("{err}"),
        };
        let size = survey.size();
        group.throughput(Throughput::Elements(size.course_checks));
        group.bench_function(format!("{courses}x{}", size.candidates), |b| {
            b.iter(|| survey.search(&|_| {}))
        });
    }
    group.finish();
}

criterion_group!(benches, bench_survey);
criterion_main!(benches);
