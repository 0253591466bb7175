//! String sets: the strings actually on an instrument (or planned for it), course by course.
//!
//! A set file is YAML read through [`crate::input::yaml::parse`] with unknown keys refused. Each string
//! is written in one of three ways:
//!
//! ```yaml
//! name: Steel-string guitar, as strung in March
//! courses:
//!   - course: 1                                  # optional; defaults to the position from 1
//!     strings:
//!       - {kind: plain-steel, diameter: 0.012in}          # a shipped (or user) string kind
//!   - strings:
//!       - {kind: phosphor-bronze-wound, diameter: 0.053in, core_diameter: 0.021in}
//!   - strings:
//!       - {unit_mass: 6.2g/m, diameter: 0.046in, material: music-wire}   # a known μ
//!   - strings:
//!       - {mass: 1.43g, length: 900mm, diameter: 1.1mm}  # a weighed piece of the string
//! ```
//!
//! - `kind` + `diameter`: the construction and materials of the kind (see `src/data/kinds.yaml`)
//!   at that outer diameter; for wound kinds `core_diameter` replaces the kind's default
//!   core-to-outer ratio when the maker states the core.
//! - `unit_mass` (μ) or `mass` over `length` (μ = m/l): a measured string. `diameter` lets the
//!   slot checks run; `material` names what carries the load, so strength, stress and stiffness
//!   can be estimated (the string is then treated as a solid wire of that material).
//!
//! The strings of a course are matched, in order, with the strings the instrument lists for that
//! course; courses are matched by number. [`StringSet::from_plan`] turns a plan into a set, and
//! [`StringSet::to_yaml`] writes one back, so plan → save → audit is one flow.

use std::fmt::Write as _;
use std::path::Path;

use serde::{Deserialize, Deserializer};

use crate::error::{Error, Result};
use crate::input::units::{Length, Mass, UnitMass, METRES_PER_INCH};
use crate::input::yaml::{self, PathStep};
use crate::instrument::{Expecting, NoDetail, ScalarOrMap};
use crate::plan::Plan;
use crate::strings::construction::{Construction, Measured, WoundRecipe};
use crate::strings::kind::{KindBuild, StringKind, StringKinds};
use crate::strings::material::{Material, Materials};
use crate::strings::stock::Stock;

/// The most courses a set may list (the same bound as instruments).
pub const MAX_SET_COURSES: usize = crate::instrument::MAX_COURSES;

impl Expecting for UnitMass {
    const EXPECTING: &'static str = "a mass per length such as `0.4g/m`";
}

impl Expecting for Mass {
    const EXPECTING: &'static str = "a mass such as `1.2g`";
}

/// A quantity read through the located scalar reader, so a bad value names its line.
#[derive(Debug, Clone, Copy, PartialEq)]
struct Located<S>(S);

impl<'de, S> Deserialize<'de> for Located<S>
where
    S: std::str::FromStr<Err = Error> + Expecting,
{
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> std::result::Result<Self, D::Error> {
        match ScalarOrMap::<S, NoDetail>::deserialize(deserializer)? {
            ScalarOrMap::Scalar(value) => Ok(Located(value)),
            ScalarOrMap::Map(never) => match never {},
        }
    }
}

/// One string as written: every key optional here, the valid combinations checked in
/// [`StringSet::from_text`] where the line can still be found.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub(crate) struct StringEntryFile {
    kind: Option<String>,
    diameter: Option<Located<Length>>,
    core_diameter: Option<Located<Length>>,
    unit_mass: Option<Located<UnitMass>>,
    mass: Option<Located<Mass>>,
    length: Option<Located<Length>>,
    material: Option<String>,
}

#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
struct SetCourseFile {
    course: Option<u32>,
    strings: Vec<StringEntryFile>,
}

#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
struct SetFile {
    name: String,
    about: Option<String>,
    instrument: Option<String>,
    tuning: Option<String>,
    courses: Vec<SetCourseFile>,
}

/// One installed string, checked.
#[derive(Debug, Clone, PartialEq)]
pub enum SetString {
    /// A string of a named kind at an outer diameter.
    Kind {
        /// The kind's id.
        kind: String,
        /// Outer diameter, m.
        diameter: f64,
        /// Core diameter, m, when stated (wound kinds only).
        core_diameter: Option<f64>,
    },
    /// A string known by its linear density.
    Measured {
        /// Linear density, kg/m.
        unit_mass: f64,
        /// Outer diameter, m, if known.
        diameter: Option<f64>,
        /// Id of the load-bearing material, if known.
        material: Option<String>,
        /// The weighing it came from, (mass kg, length m), if it was weighed.
        weighed: Option<(f64, f64)>,
    },
}

/// One course of a set.
#[derive(Debug, Clone, PartialEq)]
pub struct SetCourse {
    /// The course number (its own, or its position from 1).
    pub course: u32,
    /// Its strings, in the order the instrument lists them.
    pub strings: Vec<SetString>,
}

/// A checked string set, with the text it came from so later errors can point at their line.
#[derive(Debug, Clone)]
pub struct StringSet {
    /// A name for the set.
    pub name: String,
    /// A sentence about it.
    pub about: Option<String>,
    /// The instrument it was planned for, if recorded.
    pub instrument: Option<String>,
    /// The tuning it was planned for, if recorded.
    pub tuning: Option<String>,
    /// The courses, in file order.
    pub courses: Vec<SetCourse>,
    origin: String,
    text: String,
}

impl PartialEq for StringSet {
    /// Two sets are equal when they hold the same strings on the same courses; names, notes and
    /// where they were read from do not count.
    fn eq(&self, other: &Self) -> bool {
        self.courses == other.courses
    }
}

/// A set string resolved to a concrete construction.
#[derive(Debug, Clone, Copy)]
pub struct ResolvedString<'k> {
    /// The physical string.
    pub construction: Construction<'k>,
    /// Its kind, when it was given by kind.
    pub kind: Option<&'k StringKind>,
}

impl StringSet {
    /// Reads a set file.
    pub fn load(path: &Path, stock: &Stock) -> Result<Self> {
        let text = yaml::read_text(path)?;
        StringSet::from_text(text, &path.display().to_string(), stock)
    }

    /// Parses and checks a set; `origin` names it in messages. Kind and material ids are checked
    /// against the shipped kinds and materials.
    pub fn from_text(text: String, origin: &str, stock: &Stock) -> Result<Self> {
        let file: SetFile = yaml::parse(&text, origin)?;
        let mut set = StringSet {
            name: file.name,
            about: file.about,
            instrument: file.instrument,
            tuning: file.tuning,
            courses: Vec::with_capacity(file.courses.len()),
            origin: origin.to_string(),
            text,
        };
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
        let mut error = error.field(crate::instrument::field_name(path));
        // The key itself may be missing (a required field left out): fall back to its parent.
        let mut search = path;
        while !search.is_empty() {
            if let Some((line, column)) = yaml::locate(&self.text, search) {
                error = error.at(line, column);
                break;
            }
            search = &search[..search.len() - 1];
        }
        error.in_origin(self.origin.clone())
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
    /// tuning it was planned for.
    pub fn from_plan(plan: &Plan) -> Self {
        let courses = plan
            .courses
            .iter()
            .map(|course| SetCourse {
                course: course.course,
                strings: course
                    .strings
                    .iter()
                    .map(|string| SetString::Kind {
                        kind: string.choice.kind.clone(),
                        diameter: string.choice.diameter_mm / 1000.0,
                        core_diameter: None,
                    })
                    .collect(),
            })
            .collect();
        StringSet::chosen_for(
            &plan.instrument,
            &plan.tuning,
            "Strings chosen by `taut plan`.".to_string(),
            courses,
            "the plan",
        )
    }

    /// The set as a YAML file in the schema [`StringSet::from_text`] reads.
    pub fn to_yaml(&self) -> String {
        let mut out = String::from(
            "# A string set written by taut: the strings of each course, in the order the\n\
             # instrument lists them. Read it back with `taut audit` or `taut convert`.\n",
        );
        let quoted = |text: &str| serde_json::to_string(text).unwrap_or_default();
        let _ = writeln!(out, "name: {}", quoted(&self.name));
        if let Some(about) = &self.about {
            let _ = writeln!(out, "about: {}", quoted(about));
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

impl SetString {
    /// The string as one YAML flow mapping, e.g. `{kind: plain-steel, diameter: 0.012in}`.
    pub fn to_yaml_flow(&self) -> String {
        match self {
            SetString::Kind {
                kind,
                diameter,
                core_diameter,
            } => {
                let mut text = format!("{{kind: {kind}, diameter: {}", length_text(*diameter));
                if let Some(core) = core_diameter {
                    let _ = write!(text, ", core_diameter: {}", length_text(*core));
                }
                text.push('}');
                text
            }
            SetString::Measured {
                unit_mass,
                diameter,
                material,
                weighed,
            } => {
                let mut text = match weighed {
                    Some((mass, length)) => format!(
                        "{{mass: {}g, length: {}",
                        trimmed(mass * 1000.0, 6),
                        length_text(*length)
                    ),
                    None => format!("{{unit_mass: {}g/m", trimmed(unit_mass * 1000.0, 9)),
                };
                if let Some(diameter) = diameter {
                    let _ = write!(text, ", diameter: {}", length_text(*diameter));
                }
                if let Some(material) = material {
                    let _ = write!(text, ", material: {material}");
                }
                text.push('}');
                text
            }
        }
    }

    /// Outer diameter, m, if known.
    pub fn diameter(&self) -> Option<f64> {
        match self {
            SetString::Kind { diameter, .. } => Some(*diameter),
            SetString::Measured { diameter, .. } => *diameter,
        }
    }

    /// The concrete string, from the given kinds and materials.
    pub fn resolve<'k>(
        &self,
        kinds: &'k StringKinds,
        materials: &'k Materials,
    ) -> Result<ResolvedString<'k>> {
        match self {
            SetString::Kind {
                kind,
                diameter,
                core_diameter,
            } => {
                let kind = kinds.get(kind)?;
                let construction = match (core_diameter, &kind.build) {
                    (
                        Some(core),
                        KindBuild::Wound {
                            core_material,
                            core_shape,
                            inner,
                            outer,
                            ..
                        },
                    ) => WoundRecipe {
                        core_material,
                        core_shape: *core_shape,
                        core_ratio: crate::strings::construction::CoreRatio::Fixed(core / diameter),
                        inner,
                        outer: outer.as_ref().map(|(m, share)| (m, *share)),
                    }
                    .build(*diameter),
                    _ => kind.construction(*diameter),
                };
                Ok(ResolvedString {
                    construction,
                    kind: Some(kind),
                })
            }
            SetString::Measured {
                unit_mass,
                diameter,
                material,
                ..
            } => {
                let material: Option<&Material> = match material {
                    Some(id) => Some(materials.get(id)?),
                    None => None,
                };
                Ok(ResolvedString {
                    construction: Construction::Measured(Measured {
                        unit_mass: *unit_mass,
                        diameter: *diameter,
                        material,
                    }),
                    kind: None,
                })
            }
        }
    }

    /// A short description: the kind id, or `measured` with the material when known.
    pub fn label(&self) -> String {
        match self {
            SetString::Kind { kind, .. } => kind.clone(),
            SetString::Measured {
                material: Some(material),
                weighed,
                ..
            } => format!(
                "{} ({material})",
                if weighed.is_some() {
                    "weighed"
                } else {
                    "measured"
                }
            ),
            SetString::Measured { weighed, .. } => if weighed.is_some() {
                "weighed"
            } else {
                "measured"
            }
            .to_string(),
        }
    }
}

/// A length as a practitioner writes it: inches on the half-thousandth grid of inch catalogs,
/// millimetres otherwise (six decimals at most, so the value reads back to within 1 nm).
pub fn length_text(metres: f64) -> String {
    let inches = metres / METRES_PER_INCH;
    let half_thousandths = inches * 2000.0;
    if (half_thousandths - half_thousandths.round()).abs() < 1e-6 && inches < 1.0 {
        // The trade writes whole thousandths with three decimals (0.020 in), halves with four.
        let steps = half_thousandths.round();
        let decimals = if steps % 2.0 == 0.0 { 3 } else { 4 };
        format!("{:.*}in", decimals, steps / 2000.0)
    } else {
        format!("{}mm", trimmed(metres * 1000.0, 6))
    }
}

fn trimmed(value: f64, decimals: usize) -> String {
    let text = format!("{value:.decimals$}");
    if text.contains('.') {
        text.trim_end_matches('0').trim_end_matches('.').to_string()
    } else {
        text
    }
}

/// Checks one string entry; on failure returns the error and the key it concerns.
pub(crate) fn check_entry(
    entry: StringEntryFile,
    kinds: &StringKinds,
    materials: &Materials,
) -> std::result::Result<SetString, (Error, &'static str)> {
    let diameter = entry.diameter.map(|d| d.0.si());
    let core_diameter = entry.core_diameter.map(|d| d.0.si());
    let material = match entry.material {
        Some(id) => {
            let found = materials.get(id.trim()).map_err(|err| (err, "material"))?;
            if found.breaking_strength.is_none() {
                return Err((
                    Error::input(format!(
                        "material `{}` has no breaking strength, so it cannot be the load-bearing material",
                        found.id.as_str()
                    ))
                    .help("name the material of the core (or of the whole string)"),
                    "material",
                ));
            }
            Some(found.id.as_str().to_string())
        }
        None => None,
    };
    let ways = [
        entry.kind.is_some(),
        entry.unit_mass.is_some(),
        entry.mass.is_some() || entry.length.is_some(),
    ]
    .iter()
    .filter(|&&given| given)
    .count();
    if ways != 1 {
        let key = if entry.kind.is_some() {
            "kind"
        } else if entry.unit_mass.is_some() {
            "unit_mass"
        } else {
            "diameter"
        };
        return Err((
            Error::input(if ways == 0 {
                "the string says neither its kind nor its linear density"
            } else {
                "give one of `kind`, `unit_mass`, or `mass` with `length`, not several"
            })
            .help("write e.g. `{kind: plain-steel, diameter: 0.012in}`, `{unit_mass: 6.2g/m}` or `{mass: 1.4g, length: 900mm}`"),
            key,
        ));
    }
    if let Some(kind_id) = entry.kind {
        let kind = kinds.get(kind_id.trim()).map_err(|err| (err, "kind"))?;
        if material.is_some() {
            return Err((
                Error::input("a string given by `kind` takes its materials from the kind")
                    .help("leave out `material`"),
                "material",
            ));
        }
        let diameter = diameter.ok_or((
            Error::input(format!(
                "the `{}` string has no `diameter`",
                kind.id.as_str()
            ))
            .help("write its outer diameter, e.g. `diameter: 0.012in`"),
            "kind",
        ))?;
        if let Some(core) = core_diameter {
            if !matches!(kind.build, KindBuild::Wound { .. }) {
                return Err((
                    Error::input(format!(
                        "`{}` is a plain kind; only wound strings have a core",
                        kind.id.as_str()
                    )),
                    "core_diameter",
                ));
            }
            if core >= diameter {
                return Err((
                    Error::input(format!(
                        "the core ({:.3} mm) must be thinner than the whole string ({:.3} mm)",
                        core * 1000.0,
                        diameter * 1000.0
                    )),
                    "core_diameter",
                ));
            }
        }
        return Ok(SetString::Kind {
            kind: kind.id.as_str().to_string(),
            diameter,
            core_diameter,
        });
    }
    if core_diameter.is_some() {
        return Err((
            Error::input("`core_diameter` belongs to strings given by a wound `kind`"),
            "core_diameter",
        ));
    }
    if let Some(unit_mass) = entry.unit_mass {
        return Ok(SetString::Measured {
            unit_mass: unit_mass.0.si(),
            diameter,
            material,
            weighed: None,
        });
    }
    match (entry.mass, entry.length) {
        (Some(mass), Some(length)) => {
            let measured = Measured::from_weighing(mass.0.si(), length.0.si(), None, None);
            Ok(SetString::Measured {
                unit_mass: measured.unit_mass,
                diameter,
                material,
                weighed: Some((mass.0.si(), length.0.si())),
            })
        }
        (Some(_), None) => Err((
            Error::input("a weighed string needs the `length` that was weighed")
                .help("write e.g. `{mass: 1.4g, length: 900mm}`"),
            "mass",
        )),
        _ => Err((
            Error::input("a weighed string needs its `mass`")
                .help("write e.g. `{mass: 1.4g, length: 900mm}`"),
            "length",
        )),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn parse(text: &str) -> Result<StringSet> {
        StringSet::from_text(text.to_string(), "s.yaml", Stock::builtin().unwrap())
    }

    #[test]
    fn reads_each_way_of_writing_a_string() {
        let set = parse(
            "name: t\ncourses:\n  - strings:\n      - {kind: plain-steel, diameter: 0.012in}\n  - strings:\n      - {kind: phosphor-bronze-wound, diameter: 0.053in, core_diameter: 0.021in}\n  - strings:\n      - {unit_mass: 6.2g/m, diameter: 0.046in, material: music-wire}\n  - course: 7\n    strings:\n      - {mass: 1.8g, length: 900mm}\n",
        )
        .unwrap();
        assert_eq!(set.courses.len(), 4);
        assert_eq!(set.courses[3].course, 7);
        match &set.courses[3].strings[0] {
            // μ = m/l (OpenStax University Physics Vol. 1 eq. 16.7): 1.8 g / 0.9 m = 2 g/m.
            SetString::Measured { unit_mass, .. } => assert!((unit_mass - 0.002).abs() < 1e-15),
            other => panic!("{other:?}"),
        }
        let kinds = StringKinds::builtin().unwrap();
        let materials = Materials::builtin().unwrap();
        let wound = set.courses[1].strings[0].resolve(kinds, materials).unwrap();
        match wound.construction {
            Construction::Wound { core, .. } => {
                assert!((core.diameter - 0.021 * METRES_PER_INCH).abs() < 1e-12)
            }
            other => panic!("{other:?}"),
        }
    }

    #[test]
    fn yaml_round_trip_keeps_the_strings() {
        let text = "name: t\ncourses:\n  - strings:\n      - {kind: plain-steel, diameter: 0.0115in}\n      - {kind: nylon, diameter: 0.84mm}\n  - strings:\n      - {kind: phosphor-bronze-wound, diameter: 0.053in, core_diameter: 0.021in}\n  - strings:\n      - {unit_mass: 6.2g/m, diameter: 1.17mm, material: music-wire}\n      - {mass: 1.8g, length: 900mm}\n";
        let set = parse(text).unwrap();
        let again = parse(&set.to_yaml()).unwrap();
        assert_eq!(set.courses.len(), again.courses.len());
        for (a, b) in set.courses.iter().zip(&again.courses) {
            for (x, y) in a.strings.iter().zip(&b.strings) {
                assert_eq!(x.label(), y.label());
                let (dx, dy) = (x.diameter().unwrap_or(0.0), y.diameter().unwrap_or(0.0));
                assert!((dx - dy).abs() <= 1e-9, "{dx} vs {dy}");
            }
        }
    }

    #[test]
    fn length_text_uses_the_trade_units() {
        assert_eq!(length_text(0.010 * METRES_PER_INCH), "0.010in");
        assert_eq!(length_text(0.0115 * METRES_PER_INCH), "0.0115in");
        assert_eq!(length_text(0.00084), "0.84mm");
        assert_eq!(length_text(0.648), "648mm");
    }

    #[test]
    fn bad_entries_name_line_and_field() {
        let err = parse("name: t\ncourses:\n  - strings:\n      - kind: plain-steel\n")
            .unwrap_err()
            .to_string();
        assert!(err.starts_with("s.yaml:4:"), "{err}");
        assert!(err.contains("courses[0].strings[0].kind"), "{err}");
        assert!(err.contains("diameter"), "{err}");
        let err = parse("name: t\ncourses:\n  - strings:\n      - kind: plain-steel\n        diameter: 0.01in\n        core_diameter: 0.005in\n")
            .unwrap_err()
            .to_string();
        assert!(err.starts_with("s.yaml:6:"), "{err}");
        let err = parse(
            "name: t\ncourses:\n  - strings:\n      - kind: plain-stel\n        diameter: 0.01in\n",
        )
        .unwrap_err()
        .to_string();
        assert!(err.contains("did you mean `plain-steel`"), "{err}");
    }
}
