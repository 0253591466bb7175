//! Reading, checking and writing whole set files.

#[allow(unused_imports)]
use super::*;

impl StringSet {
    /// Reads a set file.
    pub fn load(path: &Path, stock: &Stock) -> Result<Self> {
        let text = yaml::read_text(path)?;
        StringSet::from_text(text, &yaml::origin_of(path), stock)
    }

    /// Parses and checks a set; `origin` names it in messages. Kind and material ids are checked
    /// against the shipped kinds and materials.
    pub fn from_text(text: String, origin: &str, stock: &Stock) -> Result<Self> {
        // A plan's JSON or YAML export holds each string's kind and diameter: read it as the
        // set `--save-set` would have written.
        let file: SetFile = match plan_as_set_file(&text, origin, stock)? {
            Some(file) => file,
            None => yaml::parse(&text, origin)?,
        };
        let mut set = StringSet {
            name: file.name,
            about: file.about,
            instrument: file.instrument,
            tuning: file.tuning,
            courses: Vec::with_capacity(file.courses.len()),
            origin: origin.to_string(),
            text,
        };
        // The tuning the strings are in: `audit` and `convert` use it when no option names one,
        // so it must be a tuning taut can load (checked here, where its line is known).
        if let Some(spec) = &set.tuning {
            if let Err(err) = crate::tuning::load(spec) {
                return Err(set.point(err, &[PathStep::Key("tuning")]));
            }
        }
        if file.courses.is_empty() {
            return Err(set.point(
                Error::input("the set has no courses; list at least one"),
                &[PathStep::Key("courses")],
            ));
        }
        if file.courses.len() > MAX_SET_COURSES {
            return Err(set.point(
                Error::input(format!(
                    "the set lists {} courses; taut reads at most {MAX_SET_COURSES}",
                    file.courses.len()
                )),
                &[PathStep::Key("courses")],
            ));
        }
        let (kinds, materials) = (stock.kinds(), stock.materials());
        for (index, course) in file.courses.into_iter().enumerate() {
            let number = match course.course {
                Some(0) => {
                    return Err(set.point(
                        Error::input("course numbers start at 1"),
                        &[
                            PathStep::Key("courses"),
                            PathStep::Index(index),
                            PathStep::Key("course"),
                        ],
                    ))
                }
                Some(number) => number,
                None => u32::try_from(index + 1).unwrap_or(u32::MAX),
            };
            if let Some(earlier) = set.courses.iter().position(|c| c.course == number) {
                return Err(set.point(
                    Error::input(format!(
                        "course number {number} is used twice; the course at position {} has it already",
                        earlier + 1
                    )),
                    &[
                        PathStep::Key("courses"),
                        PathStep::Index(index),
                        PathStep::Key("course"),
                    ],
                ));
            }
            if course.strings.is_empty()
                || course.strings.len() > crate::instrument::MAX_STRINGS_PER_COURSE
            {
                return Err(set.point(
                    Error::input(format!(
                        "course {number} lists {} strings; a course holds 1 to {}",
                        course.strings.len(),
                        crate::instrument::MAX_STRINGS_PER_COURSE
                    )),
                    &[
                        PathStep::Key("courses"),
                        PathStep::Index(index),
                        PathStep::Key("strings"),
                    ],
                ));
            }
            let mut strings = Vec::with_capacity(course.strings.len());
            for (string_index, entry) in course.strings.into_iter().enumerate() {
                let at = |key: &'static str| {
                    vec![
                        PathStep::Key("courses"),
                        PathStep::Index(index),
                        PathStep::Key("strings"),
                        PathStep::Index(string_index),
                        PathStep::Key(key),
                    ]
                };
                let string = check_entry(entry, kinds, materials)
                    .map_err(|(err, key)| set.point(err, &at(key)))?;
                strings.push(string);
            }
            set.courses.push(SetCourse {
                course: number,
                strings,
            });
        }
        Ok(set)
    }

    /// Where this set came from (a path or a label).
    pub fn origin(&self) -> &str {
        &self.origin
    }

    /// Attaches this file's name, the field and, where found, its line to an error.
    pub fn point(&self, error: Error, path: &[PathStep<'_>]) -> Error {
        yaml::point(error, &self.text, &self.origin, path)
    }

    /// The course with this number.
    pub fn course(&self, number: u32) -> Option<(usize, &SetCourse)> {
        self.courses
            .iter()
            .enumerate()
            .find(|(_, course)| course.course == number)
    }

    /// A set chosen by `taut` for `instrument` in `tuning`, named after both; `label` names it
    /// in messages. It has no file behind it.
    pub fn chosen_for(
        instrument: &str,
        tuning: &str,
        about: String,
        courses: Vec<SetCourse>,
        label: &str,
    ) -> Self {
        StringSet {
            name: format!("{instrument} in {tuning}"),
            about: Some(about),
            instrument: Some(instrument.to_string()),
            tuning: Some(tuning.to_string()),
            courses,
            origin: label.to_string(),
            text: String::new(),
        }
    }

    /// The strings a plan chose, as a set (kinds and diameters), recording the instrument and
    /// tuning it was planned for: the tuning as given where the plan knows it, so the set loads
    /// it back with its reference (a display name alone may not load).
    pub fn from_plan(plan: &Plan) -> Self {
        let courses = plan
            .courses
            .iter()
            .map(|course| SetCourse {
                course: course.course,
                strings: course
                    .strings
                    .iter()
                    .map(|string| {
                        string.fixed.clone().unwrap_or_else(|| SetString::Kind {
                            kind: string.choice.kind.to_string(),
                            diameter: string.choice.diameter_mm / 1000.0,
                            core_diameter: None,
                        })
                    })
                    .collect(),
            })
            .collect();
        let mut set = StringSet::chosen_for(
            &plan.instrument,
            &plan.tuning,
            "Strings chosen by `taut plan`.".to_string(),
            courses,
            "the plan",
        );
        if let Some(spec) = &plan.tuning_spec {
            set.tuning = Some(spec.clone());
        }
        set
    }

    /// The set as a YAML file in the schema [`StringSet::from_text`] reads.
    pub fn to_yaml(&self) -> String {
        let mut out = String::from(
            "# A string set written by taut: the strings of each course, in the order the\n\
             # instrument lists them. Read it back with `taut audit` or `taut convert`.\n",
        );
        let quoted = crate::input::yaml::quoted;
        let _ = writeln!(out, "name: {}", quoted(&self.name));
        if let Some(about) = &self.about {
            let _ = writeln!(out, "description: {}", quoted(about));
        }
        if let Some(instrument) = &self.instrument {
            let _ = writeln!(out, "instrument: {}", quoted(instrument));
        }
        if let Some(tuning) = &self.tuning {
            let _ = writeln!(out, "tuning: {}", quoted(tuning));
        }
        out.push_str("courses:\n");
        for course in &self.courses {
            let _ = writeln!(out, "  - course: {}", course.course);
            out.push_str("    strings:\n");
            for string in &course.strings {
                let _ = writeln!(out, "      - {}", string.to_yaml_flow());
            }
        }
        out
    }
}
