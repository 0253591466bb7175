//! Stage 1, reading input: the one YAML reader, quantities with units, checked ids and the
//! registry that the shipped and user string data share.
//!
//! Nothing here knows about strings or tunings; every later stage reads its files through
//! [`yaml`] and its quantities through [`units`]. The shipped string data alone reaches the
//! binary converted to JSON at build time and is read through [`shipped`].

pub mod examples;
pub mod id;
pub mod opened;
pub mod registry;
pub mod shipped;
pub mod units;
pub mod yaml;
