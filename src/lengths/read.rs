//! Reading and checking layout files (and the one-string form of `taut lengths --string`).

#[allow(unused_imports)]
use super::*;

impl LayoutInput {
    /// Reads a layout file.
    pub fn load(path: &Path, stock: &Stock) -> Result<Self> {
        let text = yaml::read_text(path)?;
        LayoutInput::from_text(text, &yaml::origin_of(path), stock)
    }

    /// Parses and checks a layout; `origin` names it in messages.
    pub fn from_text(text: String, origin: &str, stock: &Stock) -> Result<Self> {
        let file: LayoutFile = yaml::parse(&text, origin)?;
        let mut input = LayoutInput {
            name: file.name,
            about: file.about,
            tuning: file.tuning,
            tension: file.tension,
            max_step: file
                .max_step
                .map_or(DEFAULT_MAX_STEP, |percent| percent.fraction()),
            rated_load: file.rated_load.map(Force::si),
            prefer: file.prefer,
            length_window: file.length_window.map_or((None, None), |w| {
                (w.min.map(Length::si), w.max.map(Length::si))
            }),
            working_stress: file
                .working_stress
                .map_or(choose::DEFAULT_WORKING_STRESS, |p| p.fraction()),
            courses: Vec::with_capacity(file.courses.len()),
            origin: origin.to_string(),
            text,
        };
        if !(input.working_stress > 0.0 && input.working_stress < 1.0) {
            return Err(input.point(
                Error::input(
                    "the working stress is a share of the breaking stress, above 0% and below 100%",
                ),
                &[PathStep::Key("working_stress")],
            ));
        }
        if let (Some(min), Some(max)) = input.length_window {
            if min > max {
                return Err(input.point(
                    Error::input("the length window's `min` is above its `max`"),
                    &[PathStep::Key("length_window")],
                ));
            }
        }
        let check_kinds =
            |input: &LayoutInput, ids: &[String], path: &[PathStep<'_>]| -> Result<()> {
                if ids.is_empty() || ids.len() > crate::plan::solve::MAX_KINDS_PER_LIST {
                    return Err(input.point(
                        Error::input(format!(
                            "a kind list holds 1 to {} kinds; this one has {}",
                            crate::plan::solve::MAX_KINDS_PER_LIST,
                            ids.len()
                        )),
                        path,
                    ));
                }
                for (index, id) in ids.iter().enumerate() {
                    let mut at = path.to_vec();
                    at.push(PathStep::Index(index));
                    stock.kinds().get(id).map_err(|err| input.point(err, &at))?;
                }
                Ok(())
            };
        if let Some(ids) = &file.kinds {
            check_kinds(&input, ids, &[PathStep::Key("kinds")])?;
        }
        for (index, rule) in input.prefer.iter().enumerate() {
            let at = |key: &'static str| {
                [
                    PathStep::Key("prefer"),
                    PathStep::Index(index),
                    PathStep::Key(key),
                ]
            };
            match (&rule.below, &rule.above) {
                (Some(_), Some(_)) | (None, None) => {
                    return Err(input.point(
                        Error::input("a `prefer` rule names one pitch, `below` or `above`")
                            .help("e.g. `{below: G2, kinds: [harp-wound-nylon]}`"),
                        &[PathStep::Key("prefer"), PathStep::Index(index)],
                    ))
                }
                (Some(pitch), None) | (None, Some(pitch)) if pitch.trim().is_empty() => {
                    let key = if rule.below.is_some() {
                        "below"
                    } else {
                        "above"
                    };
                    return Err(input.point(Error::input("the pitch is empty"), &at(key)));
                }
                _ => {}
            }
            check_kinds(&input, &rule.kinds, &at("kinds"))?;
        }
        if file.courses.is_empty() {
            return Err(input.point(
                Error::input("the layout has no courses; list at least one"),
                &[PathStep::Key("courses")],
            ));
        }
        if file.courses.len() > crate::instrument::MAX_COURSES {
            return Err(input.point(
                Error::input(format!(
                    "the layout lists {} courses; taut lays out at most {}",
                    file.courses.len(),
                    crate::instrument::MAX_COURSES
                )),
                &[PathStep::Key("courses")],
            ));
        }
        let (kinds, materials) = (stock.kinds(), stock.materials());
        for (index, course) in file.courses.into_iter().enumerate() {
            let at = |key: &'static str| {
                [
                    PathStep::Key("courses"),
                    PathStep::Index(index),
                    PathStep::Key(key),
                ]
            };
            let number = match course.course {
                Some(0) => {
                    return Err(
                        input.point(Error::input("course numbers start at 1"), &at("course"))
                    )
                }
                Some(number) => number,
                None => u32::try_from(index + 1).unwrap_or(u32::MAX),
            };
            if input.courses.iter().any(|c| c.course == number) {
                return Err(input.point(
                    Error::input(format!("course number {number} is used twice")),
                    &at("course"),
                ));
            }
            if course.pitch.trim().is_empty() {
                return Err(input.point(Error::input("the pitch is empty"), &at("pitch")));
            }
            if course.tension.as_ref().is_some_and(TensionSpec::is_profile) {
                return Err(input.point(
                    Error::input("a tension profile (`first`/`last`) spans the whole layout")
                        .help("put the profile in the top-level `tension`"),
                    &at("tension"),
                ));
            }
            let check = |entry: StringEntryFile, path: &[PathStep<'_>]| {
                check_entry(entry, kinds, materials).map_err(|(err, key)| {
                    let mut at_key = path.to_vec();
                    at_key.push(PathStep::Key(key));
                    input.point(err, &at_key)
                })
            };
            let course_path = [PathStep::Key("courses"), PathStep::Index(index)];
            if let Some(ids) = &course.kinds {
                check_kinds(&input, ids, &at("kinds"))?;
            }
            let course_kinds = course.kinds.or_else(|| file.kinds.clone());
            let shared = match course.string {
                Some(entry) => {
                    let mut path = course_path.to_vec();
                    path.push(PathStep::Key("string"));
                    Some(check(entry, &path)?)
                }
                None => None,
            };
            let layout_strings = course.strings.unwrap_or_else(|| {
                vec![CourseString {
                    interval: Interval::unison(),
                    kinds: None,
                    string: None,
                }]
            });
            if layout_strings.is_empty()
                || layout_strings.len() > crate::instrument::MAX_STRINGS_PER_COURSE
            {
                return Err(input.point(
                    Error::input(format!(
                        "course {number} lists {} strings; a course holds 1 to {}",
                        layout_strings.len(),
                        crate::instrument::MAX_STRINGS_PER_COURSE
                    )),
                    &at("strings"),
                ));
            }
            let mut strings = Vec::with_capacity(layout_strings.len());
            for (string_index, layout_string) in layout_strings.into_iter().enumerate() {
                let mut path = course_path.to_vec();
                path.extend([PathStep::Key("strings"), PathStep::Index(string_index)]);
                if layout_string.kinds.is_some() {
                    path.push(PathStep::Key("kinds"));
                    return Err(input.point(
                        Error::input("in a layout, the kinds to choose from belong to the course")
                            .help("give the course `kinds: [...]`, or the string `string: {kind: …, diameter: …}`"),
                        &path,
                    ));
                }
                let string = match (layout_string.string, &shared) {
                    (Some(entry), _) => {
                        path.push(PathStep::Key("string"));
                        Some(check(entry, &path)?)
                    }
                    (None, Some(shared)) => Some(shared.clone()),
                    (None, None) if course_kinds.is_some() => None,
                    (None, None) => {
                        return Err(input.point(
                            Error::input(format!("course {number} does not say its string"))
                                .help("give the course a `string: {kind: plain-steel, diameter: 0.012in}`, each of its strings one, or `kinds: [...]` to choose from"),
                            &course_path,
                        ))
                    }
                };
                strings.push((layout_string.interval, string));
            }
            let (first_interval, string) = strings.remove(0);
            input.courses.push(LayoutCourseInput {
                course: number,
                pitch: course.pitch.trim().to_string(),
                string,
                kinds: course_kinds.unwrap_or_default(),
                others: strings,
                first_interval,
                tension: course.tension,
                raises: course.raises.or_else(|| file.raises.clone()),
            });
        }
        if input.tension.as_ref().is_some_and(TensionSpec::is_profile) && input.courses.len() < 2 {
            return Err(input.point(
                Error::input("a tension profile runs from the first course to the last; it needs at least two courses"),
                &[PathStep::Key("tension")],
            ));
        }
        Ok(input)
    }

    /// A one-course layout from command-line values: `string` is a set-file string entry such as
    /// `{kind: plain-steel, diameter: 0.016in}`.
    pub fn single(pitch: &str, string: &str, tension: TensionSpec, stock: &Stock) -> Result<Self> {
        let entry: StringEntryFile = yaml::parse(string, "--string")?;
        let (kinds, materials) = (stock.kinds(), stock.materials());
        let string = check_entry(entry, kinds, materials)
            .map_err(|(err, key)| err.field(key).in_origin("--string"))?;
        if tension.is_profile() {
            return Err(
                Error::input("a profile needs several courses; give one tension")
                    .in_origin("--tension"),
            );
        }
        Ok(LayoutInput {
            name: format!("{pitch} on one course"),
            about: None,
            tuning: None,
            tension: Some(tension),
            max_step: DEFAULT_MAX_STEP,
            rated_load: None,
            prefer: Vec::new(),
            length_window: (None, None),
            working_stress: choose::DEFAULT_WORKING_STRESS,
            courses: vec![LayoutCourseInput {
                course: 1,
                pitch: pitch.trim().to_string(),
                string: Some(string),
                kinds: Vec::new(),
                others: Vec::new(),
                first_interval: Interval::unison(),
                tension: None,
                raises: None,
            }],
            origin: "--pitch".to_string(),
            text: String::new(),
        })
    }

    /// Attaches this file's name, the field and, where found, its line to an error.
    pub fn point(&self, error: Error, path: &[PathStep<'_>]) -> Error {
        yaml::point(error, &self.text, &self.origin, path)
    }
}
