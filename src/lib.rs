//! `taut`: plan the strings for any tuning on any multi-course instrument.
//!
//! The library is laid out in the order data flows through it, one folder per stage:
//!
//! | stage | module | holds |
//! |---|---|---|
//! | 1. read input | [`input`] | the one YAML reader ([`input::yaml`]), quantities with units ([`input::units`]), checked ids, the shared registry |
//! | 2. pitch | [`tuning`] | tuning definitions, the shipped library, analysis, and pitch addressing ([`tuning::pitch`]) |
//! | 3. strings | [`strings`] | physics, materials, constructions, gauge catalogs, kinds, the selector, the user's stock, feel |
//! | 4. instrument | [`instrument`] | instrument definitions: courses, lengths, tension targets, templates |
//! | 5. plan | [`plan`] | the plan model, the per-course solve ([`plan::solve`]), warnings ([`plan::warning`]) and one set for several tunings ([`plan::several`]) |
//! | 6. sets | [`sets`] | string-set files, auditing a set (in one tuning or several, [`sets::several`]), converting a set to a new tuning or scale |
//! | 6. lengths | [`lengths`] | vibrating lengths for builders from a tension profile |
//! | 6. frets | [`frets`] | fret positions for any tuning, straight or fanned, per course; the board drawing |
//! | 7. survey | [`survey`] | search tunings, offsets and course patterns for stringable settings, ranked |
//! | 8. charts | [`charts`] | pictures and exports of any result: chart data, SVG/PNG drawing, the builder's string chart, flat CSV records |
//! | 8. sound | [`sound`] | a plan's strings as sound: stiff partials, pluck amplitudes, damping, notes rendered to samples, WAV bytes |
//! | 8. MIDI | [`midi`] | tunings as MIDI Tuning Standard messages and Standard MIDI Files |
//! | 9. explorer | [`explore`] | the local page's JSON API and server (`taut explore`): every other stage behind one HTTP call each |
//!
//! A module only uses modules of its own or an earlier stage. Errors are [`error::Error`]; every
//! bad input names its file, line and field.
#![cfg_attr(
    not(test),
    deny(clippy::unwrap_used, clippy::expect_used, clippy::panic)
)]

pub mod charts;
pub mod error;
pub mod explore;
pub mod frets;
pub mod input;
pub mod instrument;
pub mod lengths;
pub mod midi;
pub mod plan;
/// The published sources behind the physics and data, cited in the tree as `REFERENCES §x.y`.
pub mod references;
pub mod sets;
pub mod sound;
pub mod strings;
pub mod survey;
pub mod tuning;

pub use error::{Error, Result};
