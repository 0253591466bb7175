//! Plane geometry of a board, straight or fanned, from its two outermost courses.
//!
//! Coordinates are in metres: x runs along the board from the nut towards the saddle, y across
//! it, with the first listed course at +y. The outer courses are straight lines. Each is
//! `spread/2` from the middle at the nut and widens (or narrows) by `(spread_last − spread_nut)/2`
//! by the time it reaches the last fret, measured along itself; so its direction makes an angle
//! α with the x axis where `sin α = (spread_last − spread_nut) / (2·d_last)` and `d_last` is the
//! last fret's distance from the nut along that course (plain right-triangle trigonometry).
//! Widths are measured square to the x axis.
//!
//! A fan line joins the points at the same fraction `f` of each outer course's length, which is
//! where a degree at ratio r falls on both (x = L·(1 − 1/r), so f = 1 − 1/r). The nut ends are
//! placed so that the fan line at `square_at` is square to the x axis. A fret's angle is the fan
//! line's angle from square, `atan2(x_last − x_first, y_first − y_last)`, in degrees: positive
//! when the fret's end at the last listed course lies further from the nut.

use serde::Serialize;

use crate::error::{Error, Result};

/// A point on the board, in metres (x along, y across).
pub type Point = [f64; 2];

/// What the fan is built from.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FanInput {
    /// Vibrating length of the first listed course, in metres.
    pub length_first_m: f64,
    /// Vibrating length of the last listed course, in metres.
    pub length_last_m: f64,
    /// Distance across between the outer courses at the nut, in metres.
    pub spread_nut_m: f64,
    /// Distance across between the outer courses at the last fret, in metres.
    pub spread_last_fret_m: f64,
    /// The last fret's position as a fraction of each course's length (0 < f ≤ 1).
    pub last_fret_fraction: f64,
    /// The fraction of each length at which frets are square to the board.
    pub square_at: f64,
}

/// The two outer courses placed on the board.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Fan {
    first_nut: Point,
    first_direction: Point,
    length_first_m: f64,
    last_nut: Point,
    last_direction: Point,
    length_last_m: f64,
}

impl Fan {
    /// Places the outer courses; errors when the board widens faster than the courses run.
    pub fn new(input: &FanInput) -> Result<Fan> {
        let half_change = (input.spread_last_fret_m - input.spread_nut_m) / 2.0;
        let direction = |length: f64| -> Result<Point> {
            let run = input.last_fret_fraction * length;
            let sine = half_change / run;
            if sine.is_nan() || sine.abs() >= 1.0 {
                return Err(Error::input(format!(
                    "the board widens by {:.1} mm on each side over {:.1} mm of course, which no straight course can follow",
                    half_change * 1000.0,
                    run * 1000.0
                ))
                .help("check `board_width` against the scale length"));
            }
            Ok([(1.0 - sine * sine).sqrt(), sine])
        };
        let first = direction(input.length_first_m)?;
        let last = direction(input.length_last_m)?;
        let last = [last[0], -last[1]];
        // Square at fraction p: the x of both courses' points at p must agree.
        let p = input.square_at;
        let offset = p * (input.length_first_m * first[0] - input.length_last_m * last[0]);
        let shift = offset.min(0.0);
        Ok(Fan {
            first_nut: [-shift, input.spread_nut_m / 2.0],
            first_direction: first,
            length_first_m: input.length_first_m,
            last_nut: [offset - shift, -input.spread_nut_m / 2.0],
            last_direction: last,
            length_last_m: input.length_last_m,
        })
    }

    /// The point `distance` metres from the nut along the first listed course.
    pub fn on_first(&self, distance: f64) -> Point {
        along(self.first_nut, self.first_direction, distance)
    }

    /// The point `distance` metres from the nut along the last listed course.
    pub fn on_last(&self, distance: f64) -> Point {
        along(self.last_nut, self.last_direction, distance)
    }

    /// The two ends of the fan line at fraction `f` of each outer course's length.
    pub fn fan_line(&self, f: f64) -> (Point, Point) {
        (
            self.on_first(f * self.length_first_m),
            self.on_last(f * self.length_last_m),
        )
    }

    /// The point a fraction `t` of the way across (0 the first course, 1 the last) on the fan
    /// line at fraction `f`; `t` outside 0…1 runs past the outer courses.
    pub fn across(&self, t: f64, f: f64) -> Point {
        let (a, b) = self.fan_line(f);
        [a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])]
    }

    /// The fan line's angle from square at fraction `f`, in degrees (see the module docs).
    pub fn angle_deg(&self, f: f64) -> f64 {
        let (a, b) = self.fan_line(f);
        angle_between(a, b)
    }
}

/// The angle from square of the line from `a` (first course side) to `b`, in degrees.
pub fn angle_between(a: Point, b: Point) -> f64 {
    let across = a[1] - b[1];
    if across.abs() < 1e-12 && (b[0] - a[0]).abs() < 1e-12 {
        return 0.0;
    }
    (b[0] - a[0]).atan2(across).to_degrees()
}

/// The line through `a` and `b` extended past each by `margin` measured across (square to the
/// x axis), e.g. from the outer courses out to the board's edges.
pub fn extend_across(a: Point, b: Point, margin: f64) -> (Point, Point) {
    let (dx, dy) = (b[0] - a[0], b[1] - a[1]);
    if dy.abs() < 1e-12 {
        return ([a[0], a[1] + margin], [b[0], b[1] - margin]);
    }
    let scale = margin / dy.abs();
    (
        [a[0] - dx * scale, a[1] - dy * scale],
        [b[0] + dx * scale, b[1] + dy * scale],
    )
}

fn along(start: Point, direction: Point, distance: f64) -> Point {
    [
        start[0] + direction[0] * distance,
        start[1] + direction[1] * distance,
    ]
}

#[cfg(test)]
mod tests {
    use super::*;

    fn parallel(first: f64, last: f64, spread: f64, square_at: f64) -> Fan {
        Fan::new(&FanInput {
            length_first_m: first,
            length_last_m: last,
            spread_nut_m: spread,
            spread_last_fret_m: spread,
            last_fret_fraction: 0.75,
            square_at,
        })
        .unwrap()
    }

    #[test]
    fn equal_lengths_give_square_frets_even_on_a_tapered_board() {
        let fan = Fan::new(&FanInput {
            length_first_m: 0.648,
            length_last_m: 0.648,
            spread_nut_m: 0.036,
            spread_last_fret_m: 0.049,
            last_fret_fraction: 0.75,
            square_at: 0.0,
        })
        .unwrap();
        for f in [0.0, 0.25, 0.5, 0.75] {
            assert!(fan.angle_deg(f).abs() < 1e-9);
        }
        // The spread at the last fret is the one asked for.
        let (a, b) = fan.fan_line(0.75);
        assert!((a[1] - b[1] - 0.049).abs() < 1e-12);
    }

    #[test]
    fn a_parallel_fan_by_hand() {
        // Parallel courses 50 mm apart, 700 mm and 640 mm, square nut: the octave (f = 1/2)
        // crosses them at 350 mm and 320 mm, so tan θ = (320 − 350)/50 = −0.6.
        let fan = parallel(0.7, 0.64, 0.05, 0.0);
        assert!((fan.angle_deg(0.5) - (-0.6f64).atan().to_degrees()).abs() < 1e-9);
        assert!(fan.angle_deg(0.0).abs() < 1e-12);
        // Square at the octave instead: now the nut leans the other way by the same angle.
        let fan = parallel(0.7, 0.64, 0.05, 0.5);
        assert!(fan.angle_deg(0.5).abs() < 1e-12);
        assert!((fan.angle_deg(0.0) - 0.6f64.atan().to_degrees()).abs() < 1e-9);
    }

    #[test]
    fn extending_a_line_moves_each_end_out_by_the_margin_across() {
        let (a, b) = extend_across([0.0, 0.02], [0.03, -0.02], 0.004);
        assert!((a[1] - 0.024).abs() < 1e-12 && (b[1] + 0.024).abs() < 1e-12);
        // The extension stays on the line: slope −0.04/0.03.
        assert!(((b[1] - a[1]) / (b[0] - a[0]) - (-0.04 / 0.03)).abs() < 1e-9);
    }
}
