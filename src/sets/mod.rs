//! Stage 5, sets: the strings actually on an instrument, and what can be asked of them.
//!
//! | module | holds |
//! |---|---|
//! | [`set`] | string-set files: kind + diameter, a measured μ, or a weighed string, per course |
//! | [`audit`] | an installed set under a tuning, with a verdict per course |
//! | [`matching`] | a set's courses matched to an instrument's, shared by audit and conversion |
//! | [`several`] | an installed set under several tunings or variants, side by side, with verdicts |
//! | [`convert`] | a set moved to a new tuning or scale length, keeping each string's feel |
//! | [`compare`] | two plans, two sets, or a plan and a set side by side, per string and in total |

pub mod audit;
pub mod compare;
pub mod convert;
pub mod matching;
pub mod set;
pub mod several;
