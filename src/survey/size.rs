//! How big a survey is, and the bounds it is checked against before any work.

#[allow(unused_imports)]
use super::*;

/// Most course checks (candidates × courses) one survey may ask for, so that the exhaustive
/// search, the reference of the crossings sweep, can check any survey taut accepts (about 4 s
/// on two cores at [`CHECKS_RATE`]).
pub const MAX_COURSE_CHECKS: u64 = 4_000_000_000;
/// Most (tuning, course pattern) pairs × strings, the per-pair factors kept in memory.
pub const MAX_PAIR_STRINGS: u64 = 5_000_000;
/// The exhaustive search's speed per thread, course checks per second, as measured
/// (`cargo bench --bench survey`, DEVELOPERS.md): most candidates are refused for their
/// strings and cost a table walk each.
pub const CHECKS_RATE: f64 = 5e8;
/// The crossings sweep's speed per thread, in crossings (and strings of each pair) per second,
/// as measured on the same benchmarks.
pub const CROSSINGS_RATE: f64 = 2e7;

/// How big a survey is, known before any work.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub struct Size {
    /// Tunings tried.
    pub tunings: u64,
    /// Course patterns per tuning.
    pub patterns: u64,
    /// Offsets per tuning and pattern.
    pub offsets: u64,
    /// Courses of the instrument.
    pub courses: u64,
    /// Candidates: tunings × patterns × offsets.
    pub candidates: u64,
    /// Candidates × courses.
    pub course_checks: u64,
    /// Bytes of tuning files to read, each file once.
    pub tuning_bytes: u64,
}

impl Size {
    /// The size of the space `settings` describe on `instrument`; refuses an empty or
    /// oversized space with an estimate, pointing at the settings.
    pub fn of(instrument: &Instrument, settings: &Settings) -> Result<Size> {
        let courses = instrument.courses.len() as u64;
        let tunings = settings.tunings.count();
        let patterns = settings.pattern.count();
        let offsets = settings.offsets.len();
        let candidates = u128::from(tunings) * u128::from(patterns) * u128::from(offsets);
        let checks = candidates * u128::from(courses);
        let cores = std::thread::available_parallelism().map_or(1, |n| n.get()) as f64;
        let estimate = format!(
            "{tunings} tuning{} × {patterns} course pattern{} × {offsets} offset{} = {candidates} candidates, {checks} course checks (about {:.1} s to check every candidate at {:.0e} checks/s per core)",
            plural(tunings),
            plural(patterns),
            plural(offsets),
            checks as f64 / (CHECKS_RATE * cores),
            CHECKS_RATE
        );
        if let PatternRule::Steps(steps) = &settings.pattern {
            if steps.len() as u64 + 1 != courses {
                return Err(settings.point(
                    Error::input(format!(
                        "{} steps are listed, but the instrument's {courses} courses need {}",
                        steps.len(),
                        courses.saturating_sub(1)
                    ))
                    .help("list one step between each pair of neighbouring courses"),
                    &[PathStep::Key("courses"), PathStep::Key("steps")],
                ));
            }
        }
        let too_big = |what: String, path: &[PathStep<'_>]| {
            settings.point(
                Error::input(format!(
                    "the search space is too large: {what}; the survey would try {estimate}"
                ))
                .help(
                    "narrow the range of tunings, use a coarser offset step, or split the survey",
                ),
                path,
            )
        };
        if tunings > settings::MAX_TUNINGS as u64 {
            return Err(too_big(
                format!("{tunings} tunings (at most {})", settings::MAX_TUNINGS),
                &[PathStep::Key("tunings")],
            ));
        }
        // The work of reading: each tuning file once, however often the list names it.
        let mut tuning_bytes = 0u64;
        if let TuningChoice::List(_) = settings.tunings {
            let mut seen = std::collections::HashSet::new();
            for index in 0..tunings.min(settings::MAX_TUNINGS as u64) as usize {
                let (key, bytes) = settings.tuning_source(index);
                if seen.insert(key) {
                    tuning_bytes = tuning_bytes.saturating_add(bytes);
                }
            }
        }
        if tuning_bytes > settings::MAX_TUNING_BYTES {
            return Err(settings.point(
                Error::input(format!(
                    "the tunings listed are too much to read: {tuning_bytes} bytes of tuning files (each file counted once; at most {}, about 3 s of reading)",
                    settings::MAX_TUNING_BYTES
                ))
                .help("list fewer or smaller tuning files, or split the survey"),
                &[PathStep::Key("tunings"), PathStep::Key("list")],
            ));
        }
        if offsets > settings::MAX_OFFSETS {
            return Err(too_big(
                format!("{offsets} offsets (at most {})", settings::MAX_OFFSETS),
                &[PathStep::Key("offset_cents"), PathStep::Key("step")],
            ));
        }
        let strings: u64 = instrument
            .courses
            .iter()
            .map(|course| course.strings.len() as u64)
            .sum();
        if u128::from(tunings * patterns) * u128::from(strings) > u128::from(MAX_PAIR_STRINGS) {
            return Err(too_big(
                format!(
                    "{} tuning and pattern pairs of {strings} strings (at most {MAX_PAIR_STRINGS} in all)",
                    tunings * patterns
                ),
                &[PathStep::Key("courses")],
            ));
        }
        if checks > u128::from(MAX_COURSE_CHECKS) {
            return Err(too_big(
                format!("{checks} course checks (at most {MAX_COURSE_CHECKS})"),
                &[PathStep::Key("offset_cents")],
            ));
        }
        Ok(Size {
            tunings,
            patterns,
            offsets,
            courses,
            candidates: candidates as u64,
            course_checks: checks as u64,
            tuning_bytes,
        })
    }
}

pub(super) fn plural(count: u64) -> &'static str {
    if count == 1 {
        ""
    } else {
        "s"
    }
}
