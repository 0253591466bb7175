//! The board as lines, in metres, for a renderer to draw at true scale.
//!
//! The outer courses are placed by [`super::geometry::Fan`]; inner courses are drawn evenly
//! spaced between them, and each fret at its own fraction of its course's length. Each course's
//! fret is drawn across that course's lane (half way to each neighbour, or out to the board's
//! edge for an outer course), so a fret that several courses share reads as one line and a
//! partial fret as a short one.

use serde::Serialize;

use super::geometry::{extend_across, Fan, Point};
use super::FretLayout;

/// How far the drawn board runs past the last fret when no board end is given (15 mm).
pub const RUN_PAST_LAST_FRET_M: f64 = 0.015;

/// A straight line from one point to another.
pub type Line = [Point; 2];

/// One fret of one course as drawn.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct DrawnFret {
    /// The course number.
    pub course: u32,
    /// The fret number on that course.
    pub fret: u32,
    /// Across the course's lane.
    pub line: Line,
    /// Closer than the minimum spacing to the fret before.
    pub close: bool,
}

/// Everything to draw.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Drawing {
    /// The board's outline, corner by corner: nut at the first course's edge, end there, end at
    /// the last course's edge, nut there.
    pub outline: [Point; 4],
    /// The nut, edge to edge.
    pub nut: Line,
    /// Each course's string, nut to the board's drawn end, with its number.
    pub strings: Vec<(u32, Line)>,
    /// Every fret of every course.
    pub frets: Vec<DrawnFret>,
    /// The body joint, edge to edge, when given.
    pub body_joint: Option<Line>,
}

/// The drawing of `layout`, or `None` when the layout has no placed board.
pub fn draw(layout: &FretLayout) -> Option<Drawing> {
    let fan: &Fan = layout.board.fan.as_ref()?;
    let margin = layout.board.edge_margin_m;
    let first = layout.courses.first()?;
    let last = layout.courses.last()?;
    let count = layout.courses.len();
    let position = |index: usize| {
        if count > 1 {
            index as f64 / (count - 1) as f64
        } else {
            0.5
        }
    };
    // A line across the board between distances along the first and last courses.
    let across = |from_first: f64, from_last: f64| -> Line {
        let (a, b) = extend_across(fan.on_first(from_first), fan.on_last(from_last), margin);
        [a, b]
    };
    let last_fraction = layout
        .courses
        .iter()
        .filter_map(|c| c.frets.last().map(|f| f.distance_from_nut_m / c.length_m))
        .fold(0.0, f64::max);
    let (end_first, end_last) = match layout.board.board_end_m {
        Some(end) => (end, end),
        None => (
            last_fraction * first.length_m + RUN_PAST_LAST_FRET_M,
            last_fraction * last.length_m + RUN_PAST_LAST_FRET_M,
        ),
    };
    let nut = across(0.0, 0.0);
    let end = across(end_first, end_last);
    let (end_fraction_first, end_fraction_last) =
        (end_first / first.length_m, end_last / last.length_m);
    let mut strings = Vec::with_capacity(count);
    let mut frets = Vec::new();
    for (index, course) in layout.courses.iter().enumerate() {
        let t = position(index);
        let end_fraction = end_fraction_first + t * (end_fraction_last - end_fraction_first);
        strings.push((
            course.course,
            [fan.across(t, 0.0), fan.across(t, end_fraction)],
        ));
        let low = (index > 0).then(|| (position(index - 1) + t) / 2.0);
        let high = (index + 1 < count).then(|| (position(index + 1) + t) / 2.0);
        for fret in &course.frets {
            let f = fret.distance_from_nut_m / course.length_m;
            let (edge_first, edge_last) =
                extend_across(fan.across(0.0, f), fan.across(1.0, f), margin);
            let from = low.map_or(edge_first, |low| fan.across(low, f));
            let to = high.map_or(edge_last, |high| fan.across(high, f));
            frets.push(DrawnFret {
                course: course.course,
                fret: fret.fret,
                line: [from, to],
                close: fret.spacing_m < layout.min_spacing_m,
            });
        }
    }
    Some(Drawing {
        outline: [nut[0], end[0], end[1], nut[1]],
        nut,
        strings,
        frets,
        body_joint: layout.board.body_joint_m.map(|joint| across(joint, joint)),
    })
}

/// Two fret ends closer than this, in metres, meet: they are one fret drawn across two lanes.
const ENDS_MEET_M: f64 = 1e-5;

/// The frets that need a number of their own in a drawing: one segment for each run of frets
/// (a fret drawn across neighbouring lanes) that reaches neither outer course, whose numbers a
/// renderer shows beside the board. Each is the run's segment nearest the first course.
pub fn inner_fret_runs(drawing: &Drawing) -> Vec<&DrawnFret> {
    let order: Vec<u32> = drawing.strings.iter().map(|(course, _)| *course).collect();
    if order.len() < 3 {
        return Vec::new();
    }
    let lane = |course: u32| order.iter().position(|&c| c == course);
    let meets = |a: &DrawnFret, b: &DrawnFret| {
        a.line.iter().any(|p| {
            b.line
                .iter()
                .any(|q| (p[0] - q[0]).hypot(p[1] - q[1]) < ENDS_MEET_M)
        })
    };
    let in_lane = |index: usize| {
        let course = order[index];
        drawing.frets.iter().filter(move |f| f.course == course)
    };
    // Follows a run from `fret` (in lane `index`) one lane at a time in `step`'s direction and
    // gives the lane it ends in.
    let run_end = |fret: &DrawnFret, index: usize, toward_first: bool| {
        let (mut current, mut index) = (fret, index);
        loop {
            let next = if toward_first {
                index.checked_sub(1)
            } else {
                Some(index + 1).filter(|&i| i < order.len())
            };
            let Some(next) = next else { return index };
            match in_lane(next).find(|other| meets(current, other)) {
                Some(other) => (current, index) = (other, next),
                None => return index,
            }
        }
    };
    let last = order.len() - 1;
    drawing
        .frets
        .iter()
        .filter(|fret| {
            let Some(index) = lane(fret.course) else {
                return false;
            };
            if index == 0 || index == last {
                return false;
            }
            // The run's segment nearest the first course speaks for the run.
            let starts_here = run_end(fret, index, true) == index;
            starts_here && run_end(fret, index, false) != last
        })
        .collect()
}
