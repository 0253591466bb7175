//! Solving one course: every string of it against the kinds it may take, then its warnings.

#[allow(unused_imports)]
use super::*;

/// Every kind list of the instrument resolved to kinds, in one flat list; each string of each
/// course (in order) gets a range into it.
pub(crate) struct KindLists<'k> {
    pub(crate) arena: Vec<&'k StringKind>,
    pub(crate) per_string: Vec<Range<usize>>,
    pub(crate) longest: usize,
}

impl<'k> KindLists<'k> {
    pub(crate) fn resolve(instrument: &Instrument, kinds: &'k StringKinds) -> Result<Self> {
        let mut lists = KindLists {
            arena: Vec::new(),
            per_string: Vec::new(),
            longest: 0,
        };
        let defaults = match &instrument.defaults.kinds {
            Some(ids) => Some(lists.push(
                instrument,
                kinds,
                ids,
                &[PathStep::Key("defaults"), PathStep::Key("kinds")],
            )?),
            None => None,
        };
        for (index, course) in instrument.courses.iter().enumerate() {
            let course_range = match &course.kinds {
                Some(ids) => Some(lists.push(
                    instrument,
                    kinds,
                    ids,
                    &[
                        PathStep::Key("courses"),
                        PathStep::Index(index),
                        PathStep::Key("kinds"),
                    ],
                )?),
                None => defaults.clone(),
            };
            for (string_index, string) in course.strings.iter().enumerate() {
                if string.string.is_some() || course.string.is_some() {
                    // A fixed string is checked, not chosen: it needs no kinds.
                    lists.per_string.push(0..0);
                    continue;
                }
                let range = match &string.kinds {
                    Some(ids) => Some(lists.push(
                        instrument,
                        kinds,
                        ids,
                        &[
                            PathStep::Key("courses"),
                            PathStep::Index(index),
                            PathStep::Key("strings"),
                            PathStep::Index(string_index),
                            PathStep::Key("kinds"),
                        ],
                    )?),
                    None => course_range.clone(),
                };
                let range = range.ok_or_else(|| {
                    instrument.point(
                        Error::input(format!(
                            "course {} allows no string kinds",
                            instrument.course_number(index)
                        ))
                        .field(format!("courses[{index}].kinds"))
                        .help(format!(
                            "list `kinds` in `defaults` or in the course; known kinds: {}",
                            kinds
                                .all()
                                .iter()
                                .map(|kind| kind.id.as_str())
                                .collect::<Vec<_>>()
                                .join(", ")
                        )),
                        &[PathStep::Key("courses"), PathStep::Index(index)],
                    )
                })?;
                lists.per_string.push(range);
            }
        }
        Ok(lists)
    }

    fn push(
        &mut self,
        instrument: &Instrument,
        kinds: &'k StringKinds,
        ids: &[String],
        path: &[PathStep<'_>],
    ) -> Result<Range<usize>> {
        if ids.len() > MAX_KINDS_PER_LIST {
            return Err(instrument.point(
                Error::input(format!(
                    "{} kinds are listed; at most {MAX_KINDS_PER_LIST} are allowed",
                    ids.len()
                )),
                path,
            ));
        }
        let start = self.arena.len();
        for (position, id) in ids.iter().enumerate() {
            let kind = kinds.get(id.trim()).map_err(|err| {
                // Flow lists (`[a, b]`) cannot be located item by item: point at the key's line.
                instrument.point(err.field(format!("{}[{position}]", field_name(path))), path)
            })?;
            self.arena.push(kind);
        }
        self.longest = self.longest.max(ids.len());
        Ok(start..self.arena.len())
    }
}

/// Everything one course's solve reads.
pub(crate) struct CourseContext<'a> {
    pub(crate) instrument: &'a Instrument,
    pub(crate) tuning: &'a Tuning,
    pub(crate) course: CourseInput<'a>,
    pub(crate) limits: StressLimits,
    pub(crate) tolerance: f64,
    pub(crate) stock: &'a Stock,
    /// The kind and gauge words of this solve, shared by its strings.
    pub(crate) words: &'a PlanWords,
}

impl CourseContext<'_> {
    fn path(&self, key: &'static str) -> [PathStep<'static>; 3] {
        [
            PathStep::Key("courses"),
            PathStep::Index(self.course.index),
            PathStep::Key(key),
        ]
    }

    pub(super) fn solve(
        &self,
        arena: &[&StringKind],
        ranges: &[Range<usize>],
        best_per_kind: &mut [Option<Choice>],
    ) -> Result<CoursePlan> {
        let resolved = self.instrument.course_pitch(&self.course, self.tuning)?;
        let mut strings = Vec::with_capacity(self.course.strings.len());
        let mut warnings = Vec::new();
        for (string_index, range) in ranges.iter().enumerate() {
            let kinds = &arena[range.clone()];
            let request = self.request(&resolved, string_index)?;
            if let Some(entry) = self.course.fixed(string_index) {
                let at = StringRef {
                    course: self.course.number,
                    string: string_index + 1,
                };
                let plan = self.fixed(entry, string_index, &request, at, &mut warnings)?;
                strings.push(StringPlan {
                    interval: self.course.strings[string_index]
                        .interval
                        .written()
                        .to_string(),
                    ..plan
                });
                continue;
            }
            let scratch = &mut best_per_kind[..kinds.len()];
            let selection = select::select(&request, kinds, scratch);
            strings.push(self.string_plan(
                string_index,
                kinds,
                &request,
                &selection,
                scratch,
                &mut warnings,
            )?);
        }
        Ok(self.course_plan(resolved, strings, warnings))
    }

    /// What string `string_index` of the course asks of the selector at the course pitch
    /// `resolved`.
    pub(crate) fn request(&self, resolved: &CoursePitch, string_index: usize) -> Result<Request> {
        let course = self.course;
        let goal = course.tension.ok_or_else(|| {
            self.instrument.point(
                Error::input(format!("course {} has no tension target", course.number))
                    .field(format!("courses[{}].tension", course.index))
                    .help("give `tension` in `defaults` or in the course (e.g. `tension: 70N`), or pass --tension"),
                &[PathStep::Key("courses"), PathStep::Index(course.index)],
            )
        })?;
        let interval = course
            .strings
            .get(string_index)
            .map_or(1.0, |string| string.interval.ratio());
        Ok(Request {
            frequency: resolved.hz * interval,
            length: course.length_m,
            target_tension: goal.target_n,
            tolerance: self.tolerance,
            checks: Checks {
                min_tension: goal.min_n,
                max_tension: goal.max_n,
                widest: course.max_diameter_m,
                limits: self.limits,
            },
        })
    }

    /// The plan of one string from the selector's answer; its warnings go to `warnings`.
    /// `others` holds each allowed kind's best, for the alternatives.
    pub(crate) fn string_plan(
        &self,
        string_index: usize,
        kinds: &[&StringKind],
        request: &Request,
        selection: &Selection,
        others: &[Option<Choice>],
        warnings: &mut Vec<Warning>,
    ) -> Result<StringPlan> {
        let course = self.course;
        let chosen = selection.chosen.ok_or_else(|| self.no_gauge_error())?;
        let at = StringRef {
            course: course.number,
            string: string_index + 1,
        };
        let kind = kinds[chosen.kind];
        let pitch_hz = request.frequency;
        self.flag(
            warnings,
            at,
            request,
            &selection.warnings,
            &chosen,
            selection.required_unit_mass,
            kind,
            pitch_hz,
        );
        let choice_of = |choice: &Choice| self.words.describe(kinds[choice.kind], choice, request);
        let feel = crate::strings::feel::feel(
            &kind.construction(chosen.diameter),
            chosen.tension,
            course.length_m,
            &crate::strings::feel::FeelOptions::default(),
        );
        Ok(StringPlan {
            interval: course
                .strings
                .get(string_index)
                .map_or_else(String::new, |string| string.interval.written().to_string()),
            pitch_hz,
            target_tension_n: request.target_tension,
            required_unit_mass_kg_per_m: selection.required_unit_mass,
            choice: choice_of(&chosen),
            alternatives: Alternatives {
                thinner: selection.thinner.as_ref().map(choice_of),
                thicker: selection.thicker.as_ref().map(choice_of),
                other_kinds: others
                    .iter()
                    .flatten()
                    .filter(|other| other.kind != chosen.kind)
                    .map(choice_of)
                    .collect(),
            },
            feel: Some(feel),
            fixed: None,
        })
    }

    /// The error for a course whose allowed kinds hold no gauge at all.
    pub(crate) fn no_gauge_error(&self) -> Error {
        self.instrument.point(
            Error::input(format!(
                "course {}: none of the allowed kinds has any gauge to choose from",
                self.course.number
            )),
            &self.path("kinds"),
        )
    }

    /// The course's plan from its strings' plans.
    pub(crate) fn course_plan(
        &self,
        resolved: CoursePitch,
        strings: Vec<StringPlan>,
        warnings: Vec<Warning>,
    ) -> CoursePlan {
        CoursePlan {
            course: self.course.number,
            pitch: resolved,
            length_m: self.course.length_m,
            strings,
            warnings,
            positions: Vec::new(),
        }
    }

    /// Turns the selector's flags for one string into warnings with figures.
    #[allow(clippy::too_many_arguments)]
    fn flag(
        &self,
        warnings: &mut Vec<Warning>,
        at: StringRef,
        request: &Request,
        flags: &Warnings,
        chosen: &Choice,
        required_unit_mass: f64,
        kind: &StringKind,
        pitch_hz: f64,
    ) {
        let limits = request.checks.limits;
        if flags.contains(Warnings::STRESS_DANGER) {
            warnings.push(at.stress(
                WarningKind::StressDanger,
                chosen.stress_ratio,
                limits.danger,
                chosen.break_frequency,
                pitch_hz,
            ));
        } else if flags.contains(Warnings::STRESS_CAUTION) {
            warnings.push(at.stress(
                WarningKind::StressCaution,
                chosen.stress_ratio,
                limits.caution,
                chosen.break_frequency,
                pitch_hz,
            ));
        }
        let gauges = kind.gauges();
        if flags.contains(Warnings::THINNER_THAN_CATALOG) {
            if let Some(lightest) = gauges.first() {
                warnings.push(at.thinner_than_practical(required_unit_mass, lightest.unit_mass));
            }
        }
        if flags.contains(Warnings::THICKER_THAN_CATALOG) {
            if let Some(heaviest) = gauges.last() {
                warnings.push(at.thicker_than_catalog(required_unit_mass, heaviest.unit_mass));
            }
        }
        if flags.contains(Warnings::THICK_MONOFILAMENT) {
            if let KindBuild::Plain { material } = &kind.build {
                if let Some(thickest) = material.thickest_plain() {
                    warnings.push(at.thick_monofilament(
                        chosen.diameter,
                        thickest,
                        material.id.as_str(),
                    ));
                }
            }
        }
        if flags.contains(Warnings::WIDER_THAN_SLOT) {
            if let Some(widest) = request.checks.widest {
                warnings.push(at.wider_than_slot(chosen.diameter, widest));
            }
        }
        if let Some(window) = at.outside_window_of_catalog(
            chosen.tension,
            request.checks.min_tension,
            request.checks.max_tension,
            gauges.last().is_some_and(|g| g.diameter == chosen.diameter),
            gauges
                .first()
                .is_some_and(|g| g.diameter == chosen.diameter),
        ) {
            warnings.push(window);
        }
        if flags.contains(Warnings::NONE_WITHIN_TOLERANCE) {
            warnings.push(at.off_target(chosen.tension, request.target_tension, self.tolerance));
        }
    }
}
