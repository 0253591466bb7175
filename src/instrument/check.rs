//! The checks across values that reading alone cannot do (duplicate course numbers, a course
//! with no length, empty kind lists), each pointed back at its line.

use super::*;

impl Instrument {
    pub(super) fn check(&self) -> Result<()> {
        if self.courses.is_empty() {
            return Err(self.point(
                Error::input("the instrument has no courses; list at least one")
                    .help("write e.g. `courses: [{pitch: E4}]`"),
                &[PathStep::Key("courses")],
            ));
        }
        if self.courses.len() > MAX_COURSES {
            return Err(self.point(
                Error::input(format!(
                    "the instrument has {} courses; taut plans at most {MAX_COURSES}",
                    self.courses.len()
                )),
                &[PathStep::Key("courses")],
            ));
        }
        if self
            .defaults
            .tension
            .as_ref()
            .is_some_and(|t| t.is_profile())
            && self.courses.len() < 2
        {
            return Err(self.point(
                Error::input("a tension profile runs from the first course to the last; it needs at least two courses"),
                &[PathStep::Key("defaults"), PathStep::Key("tension")],
            ));
        }
        self.check_kind_list(
            self.defaults.kinds.as_deref(),
            &[PathStep::Key("defaults"), PathStep::Key("kinds")],
        )?;
        let mut numbers: Vec<(u32, usize)> = Vec::with_capacity(self.courses.len());
        for (index, course) in self.courses.iter().enumerate() {
            let at = |key: &'static str| {
                [
                    PathStep::Key("courses"),
                    PathStep::Index(index),
                    PathStep::Key(key),
                ]
            };
            let number = self.course_number(index);
            if number == 0 {
                return Err(self.point(Error::input("course numbers start at 1"), &at("course")));
            }
            numbers.push((number, index));
            if course.pitch.trim().is_empty() {
                return Err(self.point(Error::input("the pitch is empty"), &at("pitch")));
            }
            if course.scale_length.is_none() && self.scale_length.is_none() {
                return Err(self.point(
                    Error::input(format!("course {number} has no vibrating length"))
                        .field(format!("courses[{index}].scale_length"))
                        .help("give the course a `scale_length`, or give the instrument one for all courses"),
                    &[PathStep::Key("courses"), PathStep::Index(index)],
                ));
            }
            if course.tension.as_ref().is_some_and(|t| t.is_profile()) {
                return Err(self.point(
                    Error::input("a tension profile (`first`/`last`) spans the whole instrument")
                        .help("put the profile in `defaults.tension`, or give this course a target or window"),
                    &at("tension"),
                ));
            }
            if course.strings.is_empty() || course.strings.len() > MAX_STRINGS_PER_COURSE {
                return Err(self.point(
                    Error::input(format!(
                        "course {number} lists {} strings; a course holds 1 to {MAX_STRINGS_PER_COURSE}",
                        course.strings.len()
                    )),
                    &at("strings"),
                ));
            }
            self.check_kind_list(course.kinds.as_deref(), &at("kinds"))?;
            self.check_fixed_string(
                course.string.as_ref(),
                course.kinds.is_some(),
                &[PathStep::Key("courses"), PathStep::Index(index)],
            )?;
            for (string_index, string) in course.strings.iter().enumerate() {
                let path = [
                    PathStep::Key("courses"),
                    PathStep::Index(index),
                    PathStep::Key("strings"),
                    PathStep::Index(string_index),
                ];
                self.check_kind_list(
                    string.kinds.as_deref(),
                    &[
                        PathStep::Key("courses"),
                        PathStep::Index(index),
                        PathStep::Key("strings"),
                        PathStep::Index(string_index),
                        PathStep::Key("kinds"),
                    ],
                )?;
                self.check_fixed_string(string.string.as_ref(), string.kinds.is_some(), &path)?;
            }
        }
        numbers.sort_unstable();
        if let Some(pair) = numbers.windows(2).find(|pair| pair[0].0 == pair[1].0) {
            let (number, first_index) = pair[0];
            let second_index = pair[1].1;
            let first_line = yaml::locate(
                &self.text,
                &[PathStep::Key("courses"), PathStep::Index(first_index)],
            )
            .map(|(line, _)| format!(" (line {line})"))
            .unwrap_or_default();
            return Err(self.point(
                Error::input(format!(
                    "course number {number} is used twice; it was already given to the course at position {}{first_line}",
                    first_index + 1
                )),
                &[
                    PathStep::Key("courses"),
                    PathStep::Index(second_index),
                    PathStep::Key("course"),
                ],
            ));
        }
        Ok(())
    }

    /// A fixed string (`string:` under `parent`) must be complete enough to report, and is not
    /// chosen, so `kinds` beside it would go unused.
    fn check_fixed_string(
        &self,
        string: Option<&StringEntryFile>,
        with_kinds: bool,
        parent: &[PathStep<'_>],
    ) -> Result<()> {
        let Some(string) = string else {
            return Ok(());
        };
        let mut path = parent.to_vec();
        path.push(PathStep::Key("string"));
        if with_kinds {
            return Err(self.point(
                Error::input("a fixed `string` is not chosen, so `kinds` beside it has no use")
                    .help("leave out `kinds` here, or leave out `string` to let taut choose"),
                &path,
            ));
        }
        entry::check_fixed(string).map_err(|(err, key)| {
            path.push(PathStep::Key(key));
            self.point(err, &path)
        })
    }

    pub(super) fn check_kind_list(
        &self,
        kinds: Option<&[String]>,
        path: &[PathStep<'_>],
    ) -> Result<()> {
        if kinds.is_some_and(|k| k.is_empty()) {
            return Err(self.point(
                Error::input(
                    "the list of allowed kinds is empty; name at least one, or leave the key out",
                ),
                path,
            ));
        }
        Ok(())
    }
}
