//! Planning allocates per course only for the course's own output: the words every string of a
//! kind or gauge repeats are written once per plan and shared. dhat's heap profiler, in testing
//! mode, counts every allocation.

/// A zither-like instrument of `courses` single-string courses, two kinds to choose from.
fn zither(courses: usize) -> String {
    let mut text = String::from(
        "name: allocation count\ndefaults:\n  kinds: [plain-steel, phosphor-bronze-wound]\n  tension: 80N\ncourses:\n",
    );
    for index in 0..courses {
        // The same 20 pitches and lengths over and over: later courses meet no new gauge.
        let step = (index % 20) as f64;
        let hz = 1000.0 * (-step / 8.0).exp2();
        let length_mm = 150.0 * (step / 10.0).exp2();
        text.push_str(&format!(
            "  - pitch: {hz:.3}hz\n    scale_length: {length_mm:.1}mm\n"
        ));
    }
    text
}

/// Heap blocks taken by solving `courses` courses (reading the file is not counted).
fn blocks_to_solve(courses: usize) -> u64 {
    use taut::instrument::Instrument;
    use taut::plan::solve::{plan, SolveOptions};
    let instrument = Instrument::from_text(zither(courses), "zither.yaml").unwrap();
    let stock = taut::strings::stock::Stock::builtin().unwrap();
    let tuning_loaded = plan(&instrument, stock, &SolveOptions::default()).unwrap();
    drop(tuning_loaded);
    let before = dhat::HeapStats::get().total_blocks;
    let solved = plan(&instrument, stock, &SolveOptions::default()).unwrap();
    let blocks = dhat::HeapStats::get().total_blocks - before;
    assert_eq!(solved.courses.len(), courses);
    blocks
}

/// The check, run by `main` (no other thread is running).
pub fn describing_a_planned_string_shares_its_words() {
    let _profiler = dhat::Profiler::builder().testing().build();
    let per_course = (blocks_to_solve(60) - blocks_to_solve(40)) as f64 / 20.0;
    // A course's own output: its pitch as written, labelled and named (3 blocks), its list of
    // strings (1), each string's interval (1) and its list of other kinds (1); about two more
    // are taken and freed while its pitch is read. The kind, construction, materials, gauge
    // and flags of the chosen string and its three alternatives are shared words or bits: they
    // took 4 to 6 blocks per description (28.6 per course here) before they were.
    assert!(per_course <= 8.0, "{per_course} heap blocks per course");
}
