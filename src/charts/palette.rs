//! taut's own chart palette. Every look differs from the others in lightness *and* in marker
//! shape or line pattern, so a chart printed in greyscale still tells its series apart.

use serde::Serialize;

/// A colour as red, green, blue.
pub type Rgb = (u8, u8, u8);

/// Text, axes and frame.
pub const INK: Rgb = (34, 34, 40);
/// Grid lines: light enough not to compete with data.
pub const GRID: Rgb = (226, 228, 232);
/// The page behind the plot.
pub const PAPER: Rgb = (255, 255, 255);
/// Fill of a shaded window band (a pale blue-grey that prints as light grey).
pub const BAND: Rgb = (214, 226, 236);

/// Marker drawn at each point.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Marker {
    /// A filled disc.
    Disc,
    /// A filled square.
    Square,
    /// A filled triangle, point up.
    Triangle,
    /// A diagonal cross.
    Cross,
    /// No marker (a line only).
    None,
}

/// Line pattern between points.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Pattern {
    /// Unbroken.
    Solid,
    /// Long dashes.
    Dashed,
    /// Short dashes, close together.
    Dotted,
}

/// The named looks a chart may use.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Look {
    /// The main data: deep indigo discs, solid line (darkest).
    Main,
    /// Second data series: rust squares, dashed line (mid-dark).
    Second,
    /// Third: moss triangles, dotted line (mid-light).
    Third,
    /// Fourth: ochre crosses, solid line (lightest).
    Fourth,
    /// A target or reference: grey, dashed, no marker.
    Reference,
    /// The caution threshold: amber, dashed.
    Caution,
    /// The danger threshold: dark red, solid and thicker.
    Danger,
}

impl Look {
    /// The data looks in the order series take them.
    pub const DATA: [Look; 4] = [Look::Main, Look::Second, Look::Third, Look::Fourth];

    /// The look's colour.
    pub fn colour(self) -> Rgb {
        match self {
            Look::Main => (38, 52, 110),
            Look::Second => (178, 78, 40),
            Look::Third => (96, 170, 90),
            Look::Fourth => (214, 168, 50),
            Look::Reference => (110, 110, 118),
            Look::Caution => (204, 128, 0),
            Look::Danger => (150, 20, 30),
        }
    }

    /// The marker at each point.
    pub fn marker(self) -> Marker {
        match self {
            Look::Main => Marker::Disc,
            Look::Second => Marker::Square,
            Look::Third => Marker::Triangle,
            Look::Fourth => Marker::Cross,
            Look::Reference | Look::Caution | Look::Danger => Marker::None,
        }
    }

    /// The pattern of the joining line.
    pub fn pattern(self) -> Pattern {
        match self {
            Look::Main | Look::Fourth | Look::Danger => Pattern::Solid,
            Look::Second | Look::Reference | Look::Caution => Pattern::Dashed,
            Look::Third => Pattern::Dotted,
        }
    }

    /// Line width in pixels at the chart's base size.
    pub fn width(self) -> u32 {
        match self {
            Look::Danger => 3,
            Look::Reference => 1,
            _ => 2,
        }
    }

    /// The colour as `#rrggbb`, for HTML and CSS.
    pub fn hex(self) -> String {
        hex(self.colour())
    }
}

/// A colour as `#rrggbb`.
pub fn hex((r, g, b): Rgb) -> String {
    format!("#{r:02x}{g:02x}{b:02x}")
}

/// Relative lightness of a colour, 0 (black) to 1 (white), with the luma weights of
/// ITU-R BT.601 (the usual greyscale conversion).
pub fn lightness((r, g, b): Rgb) -> f64 {
    (0.299 * f64::from(r) + 0.587 * f64::from(g) + 0.114 * f64::from(b)) / 255.0
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn data_looks_differ_in_greyscale_and_in_shape() {
        // Neighbouring data looks must differ by at least 0.1 in BT.601 luma to stay apart on a
        // greyscale print (our own margin).
        let mut greys: Vec<f64> = Look::DATA.iter().map(|l| lightness(l.colour())).collect();
        greys.sort_by(f64::total_cmp);
        for pair in greys.windows(2) {
            assert!(pair[1] - pair[0] >= 0.1, "{greys:?}");
        }
        let markers: std::collections::HashSet<_> = Look::DATA
            .iter()
            .map(|l| format!("{:?}", l.marker()))
            .collect();
        assert_eq!(markers.len(), Look::DATA.len());
        assert_ne!(Look::Caution.pattern(), Look::Danger.pattern());
    }
}
