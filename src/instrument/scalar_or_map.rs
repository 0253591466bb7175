//! Fields that take either a short scalar (`648mm`) or a mapping with more detail
//! (`{first: 686mm, last: 635mm}`).
//!
//! An untagged enum would lose the line and the field of a mistake inside the mapping; this
//! visitor hands the mapping straight to the detailed type's own deserializer, so errors keep
//! both.

use std::fmt;
use std::marker::PhantomData;
use std::str::FromStr;

use serde::de::{self, MapAccess, Visitor};
use serde::{Deserialize, Deserializer};

use crate::error::Error;

/// What a scalar-or-map field held.
#[derive(Debug, Clone, PartialEq)]
pub enum ScalarOrMap<S, M> {
    /// The short form, parsed from text.
    Scalar(S),
    /// The detailed form.
    Map(M),
}

/// Describes the short form in messages, e.g. "a length such as `648mm`".
pub trait Expecting {
    /// A noun phrase with an example.
    const EXPECTING: &'static str;
}

impl<'de, S, M> Deserialize<'de> for ScalarOrMap<S, M>
where
    S: FromStr<Err = Error> + Expecting,
    M: Deserialize<'de>,
{
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> Result<Self, D::Error> {
        deserializer.deserialize_any(ScalarOrMapVisitor(PhantomData))
    }
}

struct ScalarOrMapVisitor<S, M>(PhantomData<(S, M)>);

impl<'de, S, M> Visitor<'de> for ScalarOrMapVisitor<S, M>
where
    S: FromStr<Err = Error> + Expecting,
    M: Deserialize<'de>,
{
    type Value = ScalarOrMap<S, M>;

    fn expecting(&self, formatter: &mut fmt::Formatter) -> fmt::Result {
        write!(formatter, "{} or a mapping", S::EXPECTING)
    }

    fn visit_str<E: de::Error>(self, text: &str) -> Result<Self::Value, E> {
        text.parse()
            .map(ScalarOrMap::Scalar)
            .map_err(|err: Error| E::custom(err.plain_message()))
    }

    fn visit_i64<E: de::Error>(self, number: i64) -> Result<Self::Value, E> {
        Err(E::custom(format!(
            "`{number}` has no unit; write {}",
            S::EXPECTING
        )))
    }

    fn visit_u64<E: de::Error>(self, number: u64) -> Result<Self::Value, E> {
        Err(E::custom(format!(
            "`{number}` has no unit; write {}",
            S::EXPECTING
        )))
    }

    fn visit_f64<E: de::Error>(self, number: f64) -> Result<Self::Value, E> {
        Err(E::custom(format!(
            "`{number}` has no unit; write {}",
            S::EXPECTING
        )))
    }

    fn visit_map<A: MapAccess<'de>>(self, map: A) -> Result<Self::Value, A::Error> {
        M::deserialize(de::value::MapAccessDeserializer::new(map)).map(ScalarOrMap::Map)
    }
}

/// Placeholder for scalar-only fields: no mapping form exists.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum NoDetail {}

impl<'de> Deserialize<'de> for NoDetail {
    fn deserialize<D: Deserializer<'de>>(_: D) -> Result<Self, D::Error> {
        Err(de::Error::custom(
            "expected a single value here, not a mapping",
        ))
    }
}

/// Reads a scalar-only field through the visitor above, which keeps the line and column of a
/// bad value (the units' own reader buffers the value and loses them).
pub fn scalar<'de, D, S>(deserializer: D) -> Result<S, D::Error>
where
    D: Deserializer<'de>,
    S: FromStr<Err = Error> + Expecting,
{
    match ScalarOrMap::<S, NoDetail>::deserialize(deserializer)? {
        ScalarOrMap::Scalar(value) => Ok(value),
        ScalarOrMap::Map(never) => match never {},
    }
}

struct Wrapped<S>(S);

impl<'de, S: FromStr<Err = Error> + Expecting> Deserialize<'de> for Wrapped<S> {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> Result<Self, D::Error> {
        scalar(deserializer).map(Wrapped)
    }
}

/// `scalar` for an optional field (use with `#[serde(default)]`).
pub fn optional_scalar<'de, D, S>(deserializer: D) -> Result<Option<S>, D::Error>
where
    D: Deserializer<'de>,
    S: FromStr<Err = Error> + Expecting,
{
    Option::<Wrapped<S>>::deserialize(deserializer).map(|value| value.map(|wrapped| wrapped.0))
}
