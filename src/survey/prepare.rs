//! Preparing a survey: the size check, the tunings loaded and each string's table built.

#[allow(unused_imports)]
use super::*;

impl<'a> Survey<'a> {
    /// Checks the size of the space first (see [`Size::of`]), then loads the tunings and
    /// builds the per-string tables.
    pub fn prepare(
        instrument: &'a Instrument,
        settings: &'a Settings,
        stock: &'a Stock,
    ) -> Result<Survey<'a>> {
        let started = std::time::Instant::now();
        let kinds = stock.kinds();
        let size = Size::of(instrument, settings)?;
        let order = order::CourseOrder::of(instrument, settings)?;
        let limits = solve::stress_limits(instrument)?;
        let tolerance = instrument
            .tolerance
            .map_or(select::DEFAULT_TOLERANCE, |percent| percent.fraction());
        let mut strings = Vec::new();
        let mut string_checks = Vec::new();
        for index in 0..instrument.courses.len() {
            let course = instrument
                .course_input(index, None)
                .ok_or_else(|| Error::input("a course has no vibrating length"))?;
            let at = [PathStep::Key("courses"), PathStep::Index(index)];
            let goal = course.tension.ok_or_else(|| {
                instrument.point(
                    Error::input(format!("course {} has no tension target", course.number))
                        .help("give `tension` in `defaults` or in the course"),
                    &at,
                )
            })?;
            for (string_index, string) in course.strings.iter().enumerate() {
                if course.fixed(string_index).is_some() {
                    return Err(instrument.point(
                        Error::input(format!(
                            "course {}: a fixed string (`string:`) cannot be surveyed yet",
                            course.number
                        ))
                        .help("let taut choose this string for the survey"),
                        &at,
                    ));
                }
                let ids = string.kinds.as_deref().or(course.kinds).ok_or_else(|| {
                    instrument.point(
                        Error::input(format!("course {} allows no string kinds", course.number))
                            .help("list `kinds` in `defaults` or in the course"),
                        &at,
                    )
                })?;
                if ids.len() > solve::MAX_KINDS_PER_LIST {
                    return Err(instrument.point(
                        Error::input(format!(
                            "{} kinds are listed; at most {} are allowed",
                            ids.len(),
                            solve::MAX_KINDS_PER_LIST
                        )),
                        &at,
                    ));
                }
                let mut kind_list: Vec<&StringKind> = Vec::with_capacity(ids.len());
                for id in ids {
                    kind_list.push(
                        kinds
                            .get(id.trim())
                            .map_err(|err| instrument.point(err, &at))?,
                    );
                }
                let spec = StringSpec {
                    length: course.length_m,
                    target: goal.target_n,
                    tolerance,
                    checks: Checks {
                        min_tension: goal.min_n,
                        max_tension: goal.max_n,
                        widest: course.max_diameter_m,
                        limits,
                    },
                    kinds: &kind_list,
                };
                let table = StringTable::build(&spec);
                string_checks.push(spec.checks);
                strings.push(StringSlot {
                    course: index,
                    two_length: 2.0 * course.length_m,
                    interval_ratio: string.interval.ratio(),
                    table,
                    kinds: kind_list,
                });
            }
        }
        let offset_ratios: Vec<f64> = (0..size.offsets)
            .map(|k| ratio_from_cents(settings.offsets.cents(k)))
            .collect();
        let mut survey = Survey {
            instrument,
            settings,
            stock,
            size,
            strings,
            pairs: Vec::new(),
            offset_ratios,
            rated_load_n: instrument.rated_load.map(|load| load.si()),
            order,
            checks: string_checks,
            offsets_ascend: true,
            crossings: 0,
            prepared_s: 0.0,
        };
        survey.offsets_ascend = survey.offset_ratios.windows(2).all(|w| w[0] <= w[1]);
        // Each file is read once, however often the list names it (the size check counted it
        // so).
        let mut loaded: std::collections::HashMap<String, std::rc::Rc<Tuning>> =
            std::collections::HashMap::new();
        for tuning_index in 0..size.tunings as usize {
            let spec = settings.tuning_spec(tuning_index);
            let at = match settings.tunings {
                TuningChoice::List(_) => vec![
                    PathStep::Key("tunings"),
                    PathStep::Key("list"),
                    PathStep::Index(tuning_index),
                ],
                TuningChoice::Edos { .. } => vec![PathStep::Key("tunings")],
            };
            let (key, _) = settings.tuning_source(tuning_index);
            let tuning = match loaded.get(&key) {
                Some(tuning) => std::rc::Rc::clone(tuning),
                None => {
                    let tuning = std::rc::Rc::new(
                        tuning::load(&spec).map_err(|err| settings.point(err, &at))?,
                    );
                    loaded.insert(key, std::rc::Rc::clone(&tuning));
                    tuning
                }
            };
            if matches!(tuning.layout(), Layout::Absolute { .. }) {
                return Err(settings.point(
                    Error::input(format!(
                        "`{spec}` is a fixed list of frequencies; a survey moves tunings in pitch, so it needs a tuning with degrees"
                    )),
                    &at,
                ));
            }
            for pattern in 0..size.patterns as usize {
                let pair = survey.pair(&tuning, tuning_index, pattern)?;
                survey.pairs.push(pair);
            }
        }
        survey.crossings = survey.count_crossings();
        survey.prepared_s = started.elapsed().as_secs_f64();
        Ok(survey)
    }

    /// Table bounds crossed over the whole space: per pair and string, the bounds between the
    /// segments at the lowest and the highest offset (two binary searches each).
    fn count_crossings(&self) -> u64 {
        let (Some(&lowest), Some(&highest)) =
            (self.offset_ratios.first(), self.offset_ratios.last())
        else {
            return 0;
        };
        let mut crossings = 0u64;
        for pair in &self.pairs {
            for (slot, factor) in self.strings.iter().zip(&pair.factors) {
                let s = |ratio: f64| {
                    let two_l_f = factor * ratio;
                    two_l_f * two_l_f
                };
                let low = slot.table.find(s(lowest));
                let high = slot.table.find(s(highest));
                crossings += high.saturating_sub(low) as u64;
            }
        }
        crossings
    }

    pub(super) fn pair(
        &self,
        tuning: &Tuning,
        tuning_index: usize,
        pattern: usize,
    ) -> Result<Pair> {
        let courses = self.instrument.courses.len();
        let cents = |k: i64| {
            tuning.cents_above_degree_zero(k).ok_or_else(|| {
                self.settings.point(
                    Error::input(format!("degree {k} of `{}` does not exist", tuning.name())),
                    &[PathStep::Key("courses")],
                )
            })
        };
        let mut degrees = Vec::with_capacity(courses);
        // A scale's modes walk its steps; a named scale's steps are its notes placed in this
        // tuning.
        let placed;
        let modes: Option<&[i64]> = match &self.settings.pattern {
            PatternRule::ModesOf(scale) => Some(scale),
            PatternRule::ScaleModes(scale) => {
                placed = scale.steps_in(tuning).ok_or_else(|| {
                    self.settings.point(
                        Error::input(format!(
                            "`{}` cannot place the notes of {}",
                            tuning.name(),
                            scale.name
                        )),
                        &[PathStep::Key("courses"), PathStep::Key("modes_of_scale")],
                    )
                })?;
                Some(&placed)
            }
            _ => None,
        };
        let start = modes.map_or(0, |scale| scale[..pattern].iter().sum());
        // Intervals and steps are taken in the direction the courses run (down when course 1
        // is the highest).
        let sign = self.order.direction.sign();
        degrees.push(0);
        for course in 1..courses {
            let previous = degrees[course - 1];
            let next = match &self.settings.pattern {
                PatternRule::NearestTo(interval) => {
                    let target = cents(start + previous)? + sign as f64 * interval.cents;
                    let nearest = tuning
                        .nearest_to_cents_above_degree_zero(target)
                        .ok_or_else(|| {
                            self.settings.point(
                                Error::input(format!(
                                    "course {} would lie outside the range of `{}`",
                                    course + 1,
                                    tuning.name()
                                )),
                                &[PathStep::Key("courses")],
                            )
                        })?;
                    nearest.degree - start
                }
                PatternRule::Steps(steps) => previous + sign * steps[course - 1],
                // Up, mode p climbs from scale note p by steps p, p+1, …; down, it falls from
                // the same note by the steps below it: p−1, p−2, …
                PatternRule::ModesOf(_) | PatternRule::ScaleModes(_) => {
                    let scale = modes.unwrap_or_default();
                    match self.order.direction {
                        Direction::Up => previous + scale[(pattern + course - 1) % scale.len()],
                        Direction::Down => {
                            let len = scale.len() as i64;
                            let below = (pattern as i64 - course as i64).rem_euclid(len);
                            previous - scale[below as usize]
                        }
                    }
                }
            };
            degrees.push(next);
        }
        let base = cents(start)?;
        let mut course_ratio = Vec::with_capacity(courses);
        for &degree in &degrees {
            course_ratio.push(ratio_from_cents(cents(start + degree)? - base));
        }
        let factors: Vec<f64> = self
            .strings
            .iter()
            .map(|slot| {
                slot.two_length
                    * (self.settings.course_1_hz * course_ratio[slot.course] * slot.interval_ratio)
            })
            .collect();
        // The sweep's extremes must give finite squares, or tensions would print as infinity.
        let lowest = self.offset_ratios.first().copied().unwrap_or(1.0);
        let highest = self.offset_ratios.last().copied().unwrap_or(1.0);
        for (slot, factor) in self.strings.iter().zip(&factors) {
            for extreme in [factor * lowest, factor * highest] {
                if !(extreme * extreme).is_finite() || extreme <= 0.0 {
                    return Err(self.settings.point(
                        Error::input(format!(
                            "in `{}`, course {} would sound at a pitch out of any range",
                            tuning.name(),
                            slot.course + 1
                        )),
                        &[PathStep::Key("courses")],
                    ));
                }
            }
        }
        Ok(Pair {
            tuning: tuning_index,
            tuning_name: tuning.name().to_string(),
            pattern,
            start,
            degrees,
            factors,
        })
    }
}
