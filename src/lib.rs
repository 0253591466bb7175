//! `taut`: plan the strings for any tuning on any multi-course instrument.
//!
//! The library is laid out in the order data flows through it:
//!
//! | stage | module |
//! |---|---|
//! | read input | [`yaml`] (the one YAML reader), [`units`] (quantities with units) |
//! | pitch | [`pitch`] (pitch addressing), [`tuning`] (tuning definitions, library, analysis) |
//! | strings | [`physics`], [`material`], [`construction`], [`gauge`], [`kind`], [`select`] |
//! | plan | [`instrument`] (instrument definitions), [`solve`] (the per-course solve), [`plan`] (the result), [`warning`] |
//! | beyond one plan | [`set`] (string-set files), [`audit`] (an installed set under a tuning), [`convert`] (a set to a new tuning or scale), [`feel`] (stiffness and bend), [`layout`] (lengths for builders) |
//!
//! Errors are [`error::Error`]; every bad input names its file, line and field.
#![cfg_attr(
    not(test),
    deny(clippy::unwrap_used, clippy::expect_used, clippy::panic)
)]

pub mod audit;
pub mod construction;
pub mod convert;
pub mod error;
pub mod feel;
pub mod gauge;
pub mod id;
pub mod instrument;
pub mod kind;
pub mod layout;
pub mod material;
pub mod physics;
pub mod pitch;
pub mod plan;
pub mod registry;
pub mod select;
pub mod set;
pub mod solve;
pub mod stock;
pub mod tuning;
pub mod units;
pub mod warning;
pub mod yaml;

pub use error::{Error, Result};
