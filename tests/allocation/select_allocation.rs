//! The per-string selector allocates nothing: a survey over thousands of tunings calls it
//! millions of times. dhat's heap profiler, in testing mode, counts every allocation.

use taut::strings::kind::{StringKind, StringKinds};
use taut::strings::select::{select, Choice, Request};

/// The check, run by `main` (no other thread is running).
pub fn selecting_strings_allocates_nothing() {
    let _profiler = dhat::Profiler::builder().testing().build();
    let all = StringKinds::builtin().unwrap();
    let kinds: Vec<&StringKind> = all.all().iter().collect();
    let mut best: Vec<Option<Choice>> = vec![None; kinds.len()];
    // Pitches from C1 to about C8 on lengths from 1.55 m down to 5 cm, tensions from 20 N to
    // 200 N: every kind, every branch of the choice rule, in- and out-of-catalog requests.
    let requests: Vec<Request> = (0..500)
        .map(|i| {
            let step = f64::from(i) / 499.0;
            let frequency = 32.703 * 2f64.powf(7.0 * step);
            let length = 1.5 * (1.0 - step) + 0.05;
            let tension = 20.0 + 18.0 * f64::from((i * 7) % 11);
            Request::new(frequency, length, tension)
        })
        .collect();
    let before = dhat::HeapStats::get().total_blocks;
    let mut chosen = 0;
    for request in &requests {
        if select(request, &kinds, &mut best).chosen.is_some() {
            chosen += 1;
        }
    }
    let allocated = dhat::HeapStats::get().total_blocks - before;
    assert_eq!(chosen, requests.len(), "every request gets a string");
    assert_eq!(allocated, 0, "select() allocated {allocated} blocks");
}
