//! `taut`: plan the strings for any tuning on any multi-course instrument.
//!
//! The library is laid out in the order data flows through it:
//!
//! | stage | module |
//! |---|---|
//! | read input | [`yaml`] (the one YAML reader), [`units`] (quantities with units) |
//! | pitch | [`pitch`] (pitch addressing), [`tuning`] (tuning definitions, library, analysis) |
//! | strings | [`physics`], [`material`], [`construction`], [`gauge`], [`kind`], [`select`] |
//!
//! Errors are [`error::Error`]; every bad input names its file, line and field.
#![cfg_attr(
    not(test),
    deny(clippy::unwrap_used, clippy::expect_used, clippy::panic)
)]

pub mod construction;
pub mod error;
pub mod gauge;
pub mod id;
pub mod kind;
pub mod material;
pub mod physics;
pub mod pitch;
pub mod select;
pub mod tuning;
pub mod units;
pub mod yaml;

pub use error::{Error, Result};
