//! `taut plan` on a 200-course instrument as a whole process (start-up, reading the shipped
//! data, solving, rendering), beside processes that do nothing: `taut --version` (the same
//! binary starting and parsing its arguments) and `true` (the smallest process the system has).
//! The instrument is the one of the in-process `plan` bench.

use std::path::Path;
use std::process::{Command, Stdio};

use criterion::{criterion_group, criterion_main, Criterion};

fn two_hundred_courses() -> String {
    let mut text = String::from(
        "name: bench\ndefaults:\n  kinds: [plain-steel, phosphor-bronze-wound]\n  tension: {first: 40N, last: 160N, shape: geometric}\ncourses:\n",
    );
    for index in 0..200 {
        let hz = 2000.0 * (-(index as f64) / 40.0).exp2();
        let length_mm = 120.0 + 6.0 * index as f64;
        text.push_str(&format!(
            "  - pitch: {hz:.4}hz\n    scale_length: {length_mm}mm\n"
        ));
    }
    text
}

fn run(program: &str, args: &[&str]) {
    let status = Command::new(program)
        .args(args)
        .stdout(Stdio::null())
        .stderr(Stdio::null())
        .status();
    match status {
        Ok(status) if status.success() => {}
        other => panic!("{program} {args:?}: {other:?}"),
    }
}

fn bench_process(c: &mut Criterion) {
    let folder = match tempfile::tempdir() {
        Ok(folder) => folder,
        Err(err) => panic!("{err}"),
    };
    let path = folder.path().join("harp-200.yaml");
    if let Err(err) = std::fs::write(&path, two_hundred_courses()) {
        panic!("{err}");
    }
    let file = path.display().to_string();
    let taut = env!("CARGO_BIN_EXE_taut");
    let mut group = c.benchmark_group("process");
    group.sample_size(50);
    for truth in ["/bin/true", "/usr/bin/true"] {
        if Path::new(truth).exists() {
            group.bench_function("true", |b| b.iter(|| run(truth, &[])));
            break;
        }
    }
    group.bench_function("taut --version", |b| b.iter(|| run(taut, &["--version"])));
    group.bench_function("taut plan 200 courses", |b| {
        b.iter(|| run(taut, &["plan", &file]))
    });
    group.bench_function("taut plan 200 courses json", |b| {
        b.iter(|| run(taut, &["plan", &file, "--format", "json"]))
    });
    group.finish();
}

criterion_group!(benches, bench_process);
criterion_main!(benches);
