//! Fret layouts for any tuning: where each fret goes on each course, straight or fanned, with
//! per-course ("partial") frets where the tuning's steps differ from course to course.
//!
//! # The formula
//!
//! A string stopped at distance x from the nut vibrates over L − x; at fixed tension and linear
//! density its frequency is inversely proportional to the vibrating length (Mersenne's first law,
//! *Harmonie universelle*, 1636; REFERENCES §8.1). To sound the ratio r above the open string the
//! stop must leave L/r, so the fret sits at
//!
//! ```text
//! x(r) = L · (1 − 1/r)        spacing from the previous fret: x(r_n) − x(r_{n−1})
//! ```
//!
//! For N equal divisions of the octave this is the familiar `x_n = L·(1 − 2^(−n/N))` (the 12-EDO
//! case: fret 12 at L/2, fret 1 at about 0.05613·L). r is the fretted degree's frequency over the
//! open pitch, kept exact (`p/q`) where the tuning and the open pitch both have exact ratios.
//!
//! # What is assumed
//!
//! No compensation: positions are the ideal ones for the stated vibrating length. A real string
//! sounds sharp when fretted (it is stretched and stiff), which makers correct by moving the
//! saddle (and sometimes the nut); that is not applied here ([`COMPENSATION`]).
//!
//! # Which frets
//!
//! Each course gets a fret at every degree of the tuning above its open pitch, or at the steps
//! listed in `frets.degrees` (counted from the open string or from the tuning's degree 0), up to
//! `count` frets or `up_to` from the nut; by default up to the board's end when it is given,
//! else two octaves above the open string (the 24-fret board; common practice).
//!
//! Fanned boards are handled in [`geometry`]; near-coincident frets of neighbouring courses in
//! [`merge`]; the drawing in [`drawing`].

pub mod drawing;
pub mod geometry;
pub mod merge;
mod select;

use serde::Serialize;

use crate::error::{Error, Result};
use crate::input::yaml::PathStep;
use crate::instrument::frets::{Cents, DegreesFrom, FretSettings};
use crate::instrument::Instrument;
use crate::tuning::course_pitch::CoursePitch;
use crate::tuning::pitch::{serialize_optional_ratio, ExactRatio};
use crate::tuning::Tuning;

pub use geometry::{Fan, FanInput};
pub use merge::Mergeable;

/// The statement every report carries about compensation.
pub const COMPENSATION: &str = "no compensation: positions are the ideal L·(1 − 1/r) for each course's stated length; saddle and nut compensation are not applied";

/// Default smallest spacing between neighbouring frets: 5 mm. Our own default from common
/// practice (from memory): fret wire crowns are about 2–3 mm wide, so below about 5 mm centre to
/// centre little more than the wire is left for a fingertip, and slots start to crowd each other.
pub const DEFAULT_MIN_SPACING_M: f64 = 0.005;

/// Default tolerance for reporting mergeable frets: 5 cents, about the smallest pitch difference
/// most listeners notice between successive tones in the middle range (from memory).
pub const DEFAULT_MERGE_CENTS: f64 = 5.0;

/// Without `count`, `up_to` or a board end, frets go to two octaves above each open string.
pub const DEFAULT_SPAN_CENTS: f64 = 2400.0;

/// Default distance from the board's edge to the outer course: 3.5 mm (common practice, from
/// memory).
pub const DEFAULT_EDGE_MARGIN_M: f64 = 0.0035;

/// Default distance between neighbouring courses at the nut (7.2 mm) and at the last fret
/// (9.8 mm), used when the file gives no `board_width`: a six-course board 43 mm wide at the nut
/// and 56 mm at the last fret with 3.5 mm edges (common practice, from memory).
pub const DEFAULT_COURSE_SPACING_M: (f64, f64) = (0.0072, 0.0098);

/// Frets stop when the next would be closer than this (1 µm) to the previous: no saw cuts finer.
pub const MIN_RESOLVABLE_SPACING_M: f64 = 1e-6;

/// One fret of one course.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Fret {
    /// Its number from the nut (1 is the first fret).
    pub fret: u32,
    /// The tuning's degree it sounds.
    pub degree: i64,
    /// Cents above the open string.
    pub cents: f64,
    /// Exact ratio to the open string, as `p/q`, or null when the tuning has none.
    #[serde(serialize_with = "serialize_optional_ratio")]
    pub ratio: Option<ExactRatio>,
    /// Distance from the nut along the course, in metres.
    pub distance_from_nut_m: f64,
    /// Distance from the previous fret (or the nut), in metres.
    pub spacing_m: f64,
    /// On a fanned board, the fret's angle from square in degrees (see [`geometry`]).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub angle_deg: Option<f64>,
}

/// The frets of one course.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CourseFrets {
    /// The course number.
    pub course: u32,
    /// The open pitch.
    #[serde(flatten)]
    pub pitch: CoursePitch,
    /// Vibrating length in metres.
    pub length_m: f64,
    /// Frets from the nut outwards.
    pub frets: Vec<Fret>,
}

/// What a warning is about.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum FretWarningKind {
    /// Frets closer together than the minimum spacing.
    CloseSpacing,
    /// Frets past the body joint.
    PastBodyJoint,
    /// Frets past the end of the board.
    PastBoardEnd,
    /// The fret list was cut short (the per-course limit, or frets too close to resolve).
    FretLimit,
    /// A course has no fret at all.
    NoFrets,
}

impl FretWarningKind {
    /// The kind as shown in tables, e.g. `close-spacing`.
    pub fn name(self) -> &'static str {
        match self {
            FretWarningKind::CloseSpacing => "close-spacing",
            FretWarningKind::PastBodyJoint => "past-body-joint",
            FretWarningKind::PastBoardEnd => "past-board-end",
            FretWarningKind::FretLimit => "fret-limit",
            FretWarningKind::NoFrets => "no-frets",
        }
    }
}

/// A problem with one course's frets.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct FretWarning {
    /// What it is about.
    pub kind: FretWarningKind,
    /// The course number.
    pub course: u32,
    /// A sentence for people.
    pub message: String,
}

/// The board the frets sit on, with every default applied.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Board {
    /// Width at the nut, in metres.
    pub nut_width_m: f64,
    /// Width at the last fret, in metres.
    pub last_fret_width_m: f64,
    /// From the edge to the outer course, in metres.
    pub edge_margin_m: f64,
    /// Fraction of each length where frets are square (fanned boards).
    pub square_at: f64,
    /// Distance from the nut to the body joint, when given.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub body_joint_m: Option<f64>,
    /// Distance from the nut to the board's end, when given.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub board_end_m: Option<f64>,
    /// The outer courses placed on the board (not serialized).
    #[serde(skip)]
    pub fan: Option<Fan>,
}

/// A whole fret layout: plain data for the renderers (the JSON form is documented in `taut help formats`).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct FretLayout {
    /// The instrument's name.
    pub instrument: String,
    /// The tuning's name.
    pub tuning: String,
    /// What the positions assume ([`COMPENSATION`]).
    pub compensation: String,
    /// Whether the courses have different lengths (frets fan out).
    pub fanned: bool,
    /// Spacing below which a warning is given, in metres.
    pub min_spacing_m: f64,
    /// Cents within which neighbouring courses' frets are reported as mergeable.
    pub merge_within_cents: f64,
    /// The board.
    pub board: Board,
    /// Every course in the order written.
    pub courses: Vec<CourseFrets>,
    /// Frets of neighbouring courses that nearly coincide.
    pub mergeable: Vec<Mergeable>,
    /// Close frets, frets past the body joint or board end, cut-short lists.
    pub warnings: Vec<FretWarning>,
}

/// Lays out the frets of every course of `instrument` in `tuning`; `overrides` (e.g. from the
/// command line) replace the file's `frets:` settings field by field.
pub fn lay_out(
    instrument: &Instrument,
    tuning: &Tuning,
    overrides: &FretSettings,
) -> Result<FretLayout> {
    let file = instrument.frets.clone().unwrap_or_default();
    let settings = file.overridden_by(overrides);
    let allowed = select::allowed_steps(instrument, tuning, &settings, overrides)?;
    let from = settings.degrees_from.unwrap_or(DegreesFrom::Open);
    let mut courses = Vec::with_capacity(instrument.courses.len());
    let mut warnings = Vec::new();
    for index in 0..instrument.courses.len() {
        let input = instrument
            .course_input(index, None)
            .ok_or_else(|| Error::input("a course has no vibrating length"))?;
        let pitch = instrument.course_pitch(&input, tuning)?;
        let limits = select::Limits {
            count: settings.count.map(|c| c.0),
            up_to_m: settings.up_to.map(|l| l.si()),
            board_end_m: settings.board_end.map(|l| l.si()),
        };
        let (frets, cut_short) = select::frets_of_course(
            tuning,
            input.pitch,
            input.length_m,
            allowed.as_deref(),
            from,
            &limits,
        )
        .map_err(|err| {
            instrument.point(
                err,
                &[
                    PathStep::Key("courses"),
                    PathStep::Index(index),
                    PathStep::Key("pitch"),
                ],
            )
        })?;
        if let Some(reason) = cut_short {
            warnings.push(FretWarning {
                kind: FretWarningKind::FretLimit,
                course: input.number,
                message: format!("course {}: {reason}", input.number),
            });
        }
        courses.push(CourseFrets {
            course: input.number,
            pitch,
            length_m: input.length_m,
            frets,
        });
    }
    let board = board_for(instrument, &settings, &courses)?;
    let fanned = is_fanned(&courses);
    if let (true, Some(fan)) = (fanned, &board.fan) {
        for course in &mut courses {
            for fret in &mut course.frets {
                fret.angle_deg = Some(fan.angle_deg(fret.distance_from_nut_m / course.length_m));
            }
        }
    }
    let min_spacing_m = settings
        .min_spacing
        .map_or(DEFAULT_MIN_SPACING_M, |l| l.si());
    for course in &courses {
        warnings.extend(merge::course_warnings(course, min_spacing_m, &board));
    }
    let merge_within_cents = settings
        .merge_within
        .map_or(DEFAULT_MERGE_CENTS, |Cents(c)| c);
    let mergeable = merge::near_coincidences(&courses, merge_within_cents);
    Ok(FretLayout {
        instrument: instrument.name.clone(),
        tuning: tuning.name().to_string(),
        compensation: COMPENSATION.to_string(),
        fanned,
        min_spacing_m,
        merge_within_cents,
        board,
        courses,
        mergeable,
        warnings,
    })
}

/// Whether any two courses differ in length (by more than a micrometre).
fn is_fanned(courses: &[CourseFrets]) -> bool {
    let lengths = courses.iter().map(|c| c.length_m);
    let longest = lengths.clone().fold(f64::MIN, f64::max);
    let shortest = lengths.fold(f64::MAX, f64::min);
    longest - shortest > 1e-6
}

/// The board with defaults applied and the outer courses placed; widths that leave no room for
/// the courses are refused, pointing at `frets.board_width` or `frets.edge_margin`.
fn board_for(
    instrument: &Instrument,
    settings: &FretSettings,
    courses: &[CourseFrets],
) -> Result<Board> {
    let gaps = courses.len().saturating_sub(1) as f64;
    let edge_margin_m = settings
        .edge_margin
        .map_or(DEFAULT_EDGE_MARGIN_M, |l| l.si());
    let (nut_width_m, last_fret_width_m) = match settings.board_width {
        Some(width) => (width.nut.si(), width.last_fret.si()),
        None => (
            2.0 * edge_margin_m + gaps * DEFAULT_COURSE_SPACING_M.0,
            2.0 * edge_margin_m + gaps * DEFAULT_COURSE_SPACING_M.1,
        ),
    };
    let point = |message: String| {
        let key = if settings.board_width.is_some() {
            "board_width"
        } else {
            "edge_margin"
        };
        instrument.point(
            Error::input(message),
            &[PathStep::Key("frets"), PathStep::Key(key)],
        )
    };
    for (width, place) in [(nut_width_m, "nut"), (last_fret_width_m, "last fret")] {
        if width <= 2.0 * edge_margin_m && courses.len() > 1 {
            return Err(point(format!(
                "the board is {:.1} mm wide at the {place}, which leaves no room between two edge margins of {:.1} mm",
                width * 1000.0,
                edge_margin_m * 1000.0
            )));
        }
    }
    let last_fret_fraction = courses
        .iter()
        .filter_map(|c| c.frets.last().map(|f| f.distance_from_nut_m / c.length_m))
        .fold(0.0, f64::max);
    let square_at = settings.square_at.map_or(0.0, |f| f.0);
    let (first, last) = match (courses.first(), courses.last()) {
        (Some(first), Some(last)) => (first, last),
        _ => return Err(Error::input("the instrument has no courses")),
    };
    let fan = Fan::new(&FanInput {
        length_first_m: first.length_m,
        length_last_m: last.length_m,
        spread_nut_m: (nut_width_m - 2.0 * edge_margin_m).max(0.0),
        spread_last_fret_m: (last_fret_width_m - 2.0 * edge_margin_m).max(0.0),
        last_fret_fraction: if last_fret_fraction > 0.0 {
            last_fret_fraction
        } else {
            1.0
        },
        square_at,
    })
    .map_err(|err| {
        instrument.point(err, &[PathStep::Key("frets"), PathStep::Key("board_width")])
    })?;
    Ok(Board {
        nut_width_m,
        last_fret_width_m,
        edge_margin_m,
        square_at,
        body_joint_m: settings.body_joint.map(|l| l.si()),
        board_end_m: settings.board_end.map(|l| l.si()),
        fan: Some(fan),
    })
}
