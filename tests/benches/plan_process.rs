//! `taut plan` on a 200-course instrument as a whole process (start-up, reading the shipped
//! data, solving, rendering), beside processes that do nothing: `taut --version` (the same
//! binary starting and parsing its arguments) and `true` (the smallest process the system has).
//! The instruments are those of the in-process `plan` bench (`instruments.rs`): a clean
//! zither-like layout and an overstressed one whose report carries a hundred warnings.

use std::path::Path;
use std::process::{Command, Stdio};

use criterion::{criterion_group, criterion_main, Criterion};

#[path = "instruments.rs"]
mod instruments;

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
    let write = |name: &str, text: String| {
        let path = folder.path().join(name);
        if let Err(err) = std::fs::write(&path, text) {
            panic!("{err}");
        }
        path.display().to_string()
    };
    let zither = write("zither-200.yaml", instruments::zither());
    let harp = write("harp-200.yaml", instruments::overstressed_harp());
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
    for (name, file) in [("zither", &zither), ("overstressed harp", &harp)] {
        group.bench_function(format!("taut plan 200 courses, {name}"), |b| {
            b.iter(|| run(taut, &["plan", file]))
        });
        group.bench_function(format!("taut plan 200 courses, {name}, json"), |b| {
            b.iter(|| run(taut, &["plan", file, "--format", "json"]))
        });
    }
    group.finish();
}

criterion_group!(benches, bench_process);
criterion_main!(benches);
