//! `taut explore`: a page in the browser over a small JSON API on this library, served from
//! the loopback address only.
//!
//! Why a server at all: the page needs the library's own solve (the page and `taut plan` must
//! never disagree), and the library is Rust. Why this shape: the server keeps no state and
//! writes no file (downloads are made in the browser from bytes the API returns); every asset
//! is compiled into the binary ([`page`]), so nothing is fetched from the network; and nothing
//! another web page could trigger gets through ([`server`]: a random token in every path, the
//! `Host` and `Origin` headers checked, bodies and work bounded).
//!
//! | file | holds |
//! |---|---|
//! | `server.rs` | binding, the guard on every request, routing to the API, JSON errors |
//! | `api/` | one function per command: plain requests in, plain serde replies out |
//! | `document.rs` | an instrument file as an ordered tree, for the page's form |
//! | `page/` | the page: hand-written HTML, CSS and JavaScript, no build step |

pub mod api;
pub mod document;
pub mod server;

use serde::Serialize;

pub use server::{Bound, Options};

/// The bounds on every request, so a page (or anything else holding the token) cannot make the
/// server run for long or hold much memory.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Limits {
    /// Largest request body, bytes. An instrument of the largest accepted size (1000 courses)
    /// is about 60 kB of YAML; the page never sends more than a few of those.
    pub body_bytes: usize,
    /// Most cells (tunings × patterns × offsets) of one survey map.
    pub survey_cells: u64,
    /// Most course checks of one survey map: about a quarter of a second at the sweep's
    /// measured 2e8 checks per second (DEVELOPERS.md, survey figures).
    pub survey_course_checks: u64,
    /// Most notes in one sound request.
    pub sound_notes: usize,
    /// Longest note, seconds.
    pub sound_seconds: f64,
}

/// The explorer's bounds.
pub const LIMITS: Limits = Limits {
    body_bytes: 1024 * 1024,
    survey_cells: 10_000,
    survey_course_checks: 50_000_000,
    sound_notes: 400,
    sound_seconds: 10.0,
};

/// The page and its assets, compiled in: no file is read and nothing fetched at run time.
pub mod page {
    /// The page.
    pub const INDEX_HTML: &str = include_str!("page/index.html");
    /// Its style sheet.
    pub const STYLE_CSS: &str = include_str!("page/style.css");
    /// Its script: plain JavaScript, written by hand, no build step.
    pub const APP_JS: &str = include_str!("page/app.js");
    /// The tab icon, drawn as SVG.
    pub const ICON_SVG: &str = include_str!("page/icon.svg");
}
