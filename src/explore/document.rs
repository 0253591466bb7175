//! An instrument file as a plain tree, for the page's form: the YAML pane and the form are two
//! views of one document. Mappings keep the order their keys were written in, so a file read
//! and written back keeps its shape (comments are the one thing a rewrite loses).

use std::fmt;

use serde::de::{self, MapAccess, SeqAccess, Visitor};
use serde::ser::{SerializeMap, SerializeSeq};
use serde::{Deserialize, Deserializer, Serialize, Serializer};

use crate::error::Result;
use crate::input::yaml;

/// One node of a YAML or JSON document.
#[derive(Debug, Clone, PartialEq)]
pub enum Document {
    /// `null` or an empty value.
    Null,
    /// `true` or `false`.
    Bool(bool),
    /// A whole number.
    Integer(i64),
    /// A finite number with a fraction (quantities with units are text).
    Float(f64),
    /// Text.
    Text(String),
    /// A list.
    List(Vec<Document>),
    /// A mapping, keys in the order written. A key is kept as a node so that a course number
    /// (`pitches: {3: D3}`) stays a number when written back as YAML.
    Map(Vec<(Document, Document)>),
}

impl Document {
    /// Reads YAML text through the project's one YAML reader; `origin` names it in messages.
    pub fn from_yaml(text: &str, origin: &str) -> Result<Document> {
        yaml::parse(text, origin)
    }

    /// Writes the document as YAML through the project's one YAML writer.
    pub fn to_yaml(&self) -> Result<String> {
        yaml::to_text(self)
    }
}

/// JSON keys are text; YAML keys written as whole numbers are course numbers, so a key made of
/// digits becomes a number again when the page sends the document back.
fn key_from_text(text: String) -> Document {
    match text.parse::<i64>() {
        Ok(number) if number.to_string() == text => Document::Integer(number),
        _ => Document::Text(text),
    }
}

struct KeyText<'a>(&'a Document);

impl Serialize for KeyText<'_> {
    fn serialize<S: Serializer>(&self, serializer: S) -> std::result::Result<S::Ok, S::Error> {
        match self.0 {
            Document::Text(text) => serializer.serialize_str(text),
            Document::Integer(number) => serializer.serialize_i64(*number),
            other => other.serialize(serializer),
        }
    }
}

impl Serialize for Document {
    fn serialize<S: Serializer>(&self, serializer: S) -> std::result::Result<S::Ok, S::Error> {
        match self {
            Document::Null => serializer.serialize_unit(),
            Document::Bool(value) => serializer.serialize_bool(*value),
            Document::Integer(value) => serializer.serialize_i64(*value),
            Document::Float(value) => serializer.serialize_f64(*value),
            Document::Text(value) => serializer.serialize_str(value),
            Document::List(items) => {
                let mut seq = serializer.serialize_seq(Some(items.len()))?;
                for item in items {
                    seq.serialize_element(item)?;
                }
                seq.end()
            }
            Document::Map(entries) => {
                let mut map = serializer.serialize_map(Some(entries.len()))?;
                for (key, value) in entries {
                    map.serialize_entry(&KeyText(key), value)?;
                }
                map.end()
            }
        }
    }
}

/// The document as JSON for the page: every key as text.
pub fn to_json(document: &Document) -> serde_json::Value {
    match document {
        Document::Null => serde_json::Value::Null,
        Document::Bool(value) => serde_json::Value::Bool(*value),
        Document::Integer(value) => serde_json::Value::from(*value),
        Document::Float(value) => serde_json::Number::from_f64(*value)
            .map_or(serde_json::Value::Null, serde_json::Value::Number),
        Document::Text(value) => serde_json::Value::String(value.clone()),
        Document::List(items) => serde_json::Value::Array(items.iter().map(to_json).collect()),
        Document::Map(entries) => {
            // serde_json's map sorts its keys; the page needs the written order, so the map is
            // sent as a list of [key, value] pairs.
            serde_json::Value::Array(
                entries
                    .iter()
                    .map(|(key, value)| {
                        let key = match key {
                            Document::Text(text) => text.clone(),
                            Document::Integer(number) => number.to_string(),
                            other => serde_json::to_string(&to_json(other)).unwrap_or_default(),
                        };
                        serde_json::json!({ "k": key, "v": to_json(value) })
                    })
                    .collect(),
            )
        }
    }
}

/// The page's JSON form of a document (see [`to_json`]) read back: a map is a list of
/// `{k, v}` objects, so an array whose every item is such an object is a map.
pub fn from_json(value: &serde_json::Value, depth: usize) -> std::result::Result<Document, String> {
    if depth > yaml::MAX_BLOCK_DEPTH {
        return Err(format!(
            "the document nests more than {} levels deep",
            yaml::MAX_BLOCK_DEPTH
        ));
    }
    Ok(match value {
        serde_json::Value::Null => Document::Null,
        serde_json::Value::Bool(value) => Document::Bool(*value),
        serde_json::Value::Number(number) => match number.as_i64() {
            Some(whole) => Document::Integer(whole),
            None => Document::Float(
                number
                    .as_f64()
                    .filter(|value| value.is_finite())
                    .ok_or_else(|| format!("{number} is not a number taut reads"))?,
            ),
        },
        serde_json::Value::String(text) => Document::Text(text.clone()),
        serde_json::Value::Array(items) => {
            let is_map = !items.is_empty()
                && items.iter().all(|item| {
                    item.as_object().is_some_and(|object| {
                        object.len() == 2
                            && object.get("k").is_some_and(serde_json::Value::is_string)
                            && object.contains_key("v")
                    })
                });
            if is_map {
                let mut entries = Vec::with_capacity(items.len());
                for item in items {
                    let key = item["k"].as_str().unwrap_or_default().to_string();
                    entries.push((key_from_text(key), from_json(&item["v"], depth + 1)?));
                }
                Document::Map(entries)
            } else {
                Document::List(
                    items
                        .iter()
                        .map(|item| from_json(item, depth + 1))
                        .collect::<std::result::Result<_, _>>()?,
                )
            }
        }
        serde_json::Value::Object(_) => {
            return Err(
                "a mapping is sent as a list of {k, v} pairs, to keep its order".to_string(),
            )
        }
    })
}

impl<'de> Deserialize<'de> for Document {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> std::result::Result<Self, D::Error> {
        deserializer.deserialize_any(DocumentVisitor)
    }
}

struct DocumentVisitor;

impl<'de> Visitor<'de> for DocumentVisitor {
    type Value = Document;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a YAML value")
    }

    fn visit_unit<E>(self) -> std::result::Result<Document, E> {
        Ok(Document::Null)
    }

    fn visit_none<E>(self) -> std::result::Result<Document, E> {
        Ok(Document::Null)
    }

    fn visit_some<D: Deserializer<'de>>(self, d: D) -> std::result::Result<Document, D::Error> {
        Document::deserialize(d)
    }

    fn visit_bool<E>(self, value: bool) -> std::result::Result<Document, E> {
        Ok(Document::Bool(value))
    }

    fn visit_i64<E>(self, value: i64) -> std::result::Result<Document, E> {
        Ok(Document::Integer(value))
    }

    fn visit_u64<E: de::Error>(self, value: u64) -> std::result::Result<Document, E> {
        i64::try_from(value)
            .map(Document::Integer)
            .map_err(|_| E::custom(format!("{value} is too large a number")))
    }

    fn visit_f64<E: de::Error>(self, value: f64) -> std::result::Result<Document, E> {
        if value.is_finite() {
            Ok(Document::Float(value))
        } else {
            Err(E::custom("a number must be finite (not .nan or .inf)"))
        }
    }

    fn visit_str<E>(self, value: &str) -> std::result::Result<Document, E> {
        Ok(Document::Text(value.to_string()))
    }

    fn visit_string<E>(self, value: String) -> std::result::Result<Document, E> {
        Ok(Document::Text(value))
    }

    fn visit_seq<A: SeqAccess<'de>>(self, mut seq: A) -> std::result::Result<Document, A::Error> {
        let mut items = Vec::new();
        while let Some(item) = seq.next_element()? {
            items.push(item);
        }
        Ok(Document::List(items))
    }

    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> std::result::Result<Document, A::Error> {
        let mut entries: Vec<(Document, Document)> = Vec::new();
        while let Some((key, value)) = map.next_entry::<Document, Document>()? {
            if entries.iter().any(|(seen, _)| *seen == key) {
                return Err(de::Error::custom("a key is written twice in one mapping"));
            }
            entries.push((key, value));
        }
        Ok(Document::Map(entries))
    }
}
