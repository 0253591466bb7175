//! Stage 3, strings: what a string is made of and how it behaves under tension.
//!
//! | module | holds |
//! |---|---|
//! | [`physics`] | pure formulas in SI units (Mersenne, wound μ, stress, break pitch, Fletcher B, bend) |
//! | [`material`] | densities, moduli and strength curves, each with its source |
//! | [`construction`] | plain, wound and measured strings: μ and breaking tension from geometry |
//! | [`gauge`] | gauge catalogs (the diameters a kind comes in) |
//! | [`kind`] | selectable string kinds: a material, a construction and a catalog |
//! | [`select`] | the allocation-free per-string selector and its choice rule |
//! | [`stock`] | the user's own materials, catalogs and kinds over the shipped ones |
//! | [`feel`] | stiffness (inharmonicity) and bend feel of one string on its course |
//!
//! The shipped data lives in `src/strings/data/*.yaml` and is compiled in as JSON, converted at
//! build time by `src/build.rs` and read through [`crate::input::shipped`].

pub mod construction;
pub mod feel;
pub mod gauge;
pub mod kind;
pub mod material;
pub mod physics;
pub mod select;
pub mod stock;
