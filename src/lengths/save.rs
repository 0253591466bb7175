//! A solved layout written as an instrument file (`taut lengths … --save-instrument FILE`):
//! every course's pitch, vibrating length and strings as solved, so `taut plan` reads it back
//! and finds the same strings at the same tensions (within the rounding of the lengths, written
//! to a nanometre, and of the tensions).

use std::fmt::Write as _;

use super::*;
use crate::input::yaml::quoted;

/// A figure with at most `decimals` decimals, trailing zeros dropped.
fn trimmed(value: f64, decimals: usize) -> String {
    let text = format!("{value:.decimals$}");
    if text.contains('.') {
        text.trim_end_matches('0').trim_end_matches('.').to_string()
    } else {
        text
    }
}

/// A force in newtons as an instrument file writes it, e.g. `52.25N`.
fn newtons(value: f64) -> String {
    format!("{}N", trimmed(value, 6))
}

impl Layout {
    /// The layout as an instrument file in `tuning` (the spec that loaded, so `plan` can load it
    /// back), with a header naming where it came from.
    pub fn instrument_text(&self, input: &LayoutInput, tuning: &str) -> String {
        let mut out = String::from(
            "# An instrument written by `taut lengths` from a layout: each course's vibrating\n\
             # length and strings as solved. Check it with `taut plan FILE`. Strings break:\n\
             # wear eye protection, bring tension up gradually and keep within the maker's\n\
             # load rating; the maker's specifications come first.\n",
        );
        let _ = writeln!(out, "name: {}", quoted(&self.name));
        if let Some(about) = &input.about {
            let _ = writeln!(out, "description: {}", quoted(about));
        }
        let _ = writeln!(out, "tuning: {}", quoted(tuning));
        if let Some(load) = self.rated_load_n {
            let _ = writeln!(out, "rated_load: {}", newtons(load));
        }
        out.push_str("courses:\n");
        for (course, written) in self.courses.iter().zip(&input.courses) {
            let _ = writeln!(out, "  - course: {}", course.course);
            let _ = writeln!(out, "    pitch: {}", quoted(&course.pitch.written));
            let _ = writeln!(
                out,
                "    scale_length: {}mm",
                trimmed(course.length_m * 1000.0, 6)
            );
            let mut tension = format!("{{target: {}", newtons(course.tension_n));
            if let Some(min) = course.window_n.0 {
                let _ = write!(tension, ", min: {}", newtons(min));
            }
            if let Some(max) = course.window_n.1 {
                let _ = write!(tension, ", max: {}", newtons(max));
            }
            tension.push('}');
            let _ = writeln!(out, "    tension: {tension}");
            if course.other_strings.is_empty() && written.first_interval.ratio() == 1.0 {
                let _ = writeln!(out, "    string: {}", course.entry.to_yaml_flow());
            } else {
                out.push_str("    strings:\n");
                let _ = writeln!(
                    out,
                    "      - {{interval: {}, string: {}}}",
                    quoted(written.first_interval.written()),
                    course.entry.to_yaml_flow()
                );
                for other in &course.other_strings {
                    let _ = writeln!(
                        out,
                        "      - {{interval: {}, string: {}}}",
                        quoted(&other.interval),
                        other.entry.to_yaml_flow()
                    );
                }
            }
            if let Some(raises) = &written.raises {
                let _ = writeln!(out, "    raises: {}", raises.to_yaml_flow());
            }
        }
        out
    }
}
