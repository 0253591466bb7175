//! The last guard before any report is written: no number in it is infinite or NaN.
//!
//! Inputs are bounded where they are read and derived values where they are formed; this walks
//! the serde data every format (table, JSON, CSV, YAML) is rendered from, so a number that slipped
//! through becomes an error (exit 1, nothing written) instead of `inf`, `NaN` or a JSON `null`.

use std::fmt;
use std::path::PathBuf;

use serde::ser::{self, Serialize};

use crate::error::{Error, Result};

/// Fails with the field's name if any number in `value` is infinite or NaN.
pub fn check_finite<T: Serialize + ?Sized>(value: &T) -> Result<()> {
    let mut checker = Checker { field: "" };
    value.serialize(&mut checker).map_err(|err| Error::Write {
        path: PathBuf::from("the report"),
        source: std::io::Error::other(format!(
            "{}; nothing was written (this is a bug in taut, please report it with the input)",
            err.0
        )),
    })
}

#[derive(Debug)]
struct NotFinite(String);

impl fmt::Display for NotFinite {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.0)
    }
}

impl std::error::Error for NotFinite {}

impl ser::Error for NotFinite {
    fn custom<T: fmt::Display>(msg: T) -> Self {
        NotFinite(msg.to_string())
    }
}

struct Checker {
    field: &'static str,
}

impl Checker {
    fn number(&self, value: f64) -> Result<(), NotFinite> {
        if value.is_finite() {
            Ok(())
        } else {
            Err(NotFinite(format!(
                "the number in field `{}` is {value}, not a finite number",
                self.field
            )))
        }
    }
}

type Done = Result<(), NotFinite>;

impl ser::Serializer for &mut Checker {
    type Ok = ();
    type Error = NotFinite;
    type SerializeSeq = Self;
    type SerializeTuple = Self;
    type SerializeTupleStruct = Self;
    type SerializeTupleVariant = Self;
    type SerializeMap = Self;
    type SerializeStruct = Self;
    type SerializeStructVariant = Self;

    fn serialize_bool(self, _: bool) -> Done {
        Ok(())
    }
    fn serialize_i8(self, _: i8) -> Done {
        Ok(())
    }
    fn serialize_i16(self, _: i16) -> Done {
        Ok(())
    }
    fn serialize_i32(self, _: i32) -> Done {
        Ok(())
    }
    fn serialize_i64(self, _: i64) -> Done {
        Ok(())
    }
    fn serialize_u8(self, _: u8) -> Done {
        Ok(())
    }
    fn serialize_u16(self, _: u16) -> Done {
        Ok(())
    }
    fn serialize_u32(self, _: u32) -> Done {
        Ok(())
    }
    fn serialize_u64(self, _: u64) -> Done {
        Ok(())
    }
    fn serialize_f32(self, v: f32) -> Done {
        self.number(f64::from(v))
    }
    fn serialize_f64(self, v: f64) -> Done {
        self.number(v)
    }
    fn serialize_char(self, _: char) -> Done {
        Ok(())
    }
    fn serialize_str(self, _: &str) -> Done {
        Ok(())
    }
    fn serialize_bytes(self, _: &[u8]) -> Done {
        Ok(())
    }
    fn serialize_none(self) -> Done {
        Ok(())
    }
    fn serialize_some<T: Serialize + ?Sized>(self, value: &T) -> Done {
        value.serialize(self)
    }
    fn serialize_unit(self) -> Done {
        Ok(())
    }
    fn serialize_unit_struct(self, _: &'static str) -> Done {
        Ok(())
    }
    fn serialize_unit_variant(self, _: &'static str, _: u32, _: &'static str) -> Done {
        Ok(())
    }
    fn serialize_newtype_struct<T: Serialize + ?Sized>(self, _: &'static str, v: &T) -> Done {
        v.serialize(self)
    }
    fn serialize_newtype_variant<T: Serialize + ?Sized>(
        self,
        _: &'static str,
        _: u32,
        _: &'static str,
        v: &T,
    ) -> Done {
        v.serialize(self)
    }
    fn serialize_seq(self, _: Option<usize>) -> Result<Self, NotFinite> {
        Ok(self)
    }
    fn serialize_tuple(self, _: usize) -> Result<Self, NotFinite> {
        Ok(self)
    }
    fn serialize_tuple_struct(self, _: &'static str, _: usize) -> Result<Self, NotFinite> {
        Ok(self)
    }
    fn serialize_tuple_variant(
        self,
        _: &'static str,
        _: u32,
        _: &'static str,
        _: usize,
    ) -> Result<Self, NotFinite> {
        Ok(self)
    }
    fn serialize_map(self, _: Option<usize>) -> Result<Self, NotFinite> {
        Ok(self)
    }
    fn serialize_struct(self, _: &'static str, _: usize) -> Result<Self, NotFinite> {
        Ok(self)
    }
    fn serialize_struct_variant(
        self,
        _: &'static str,
        _: u32,
        _: &'static str,
        _: usize,
    ) -> Result<Self, NotFinite> {
        Ok(self)
    }
}

macro_rules! elements {
    ($($trait:ident :: $method:ident),*) => {$(
        impl ser::$trait for &mut Checker {
            type Ok = ();
            type Error = NotFinite;
            fn $method<T: Serialize + ?Sized>(&mut self, value: &T) -> Done {
                value.serialize(&mut **self)
            }
            fn end(self) -> Done {
                Ok(())
            }
        }
    )*};
}

elements!(
    SerializeSeq::serialize_element,
    SerializeTuple::serialize_element,
    SerializeTupleStruct::serialize_field,
    SerializeTupleVariant::serialize_field
);

impl ser::SerializeMap for &mut Checker {
    type Ok = ();
    type Error = NotFinite;
    fn serialize_key<T: Serialize + ?Sized>(&mut self, key: &T) -> Done {
        key.serialize(&mut **self)
    }
    fn serialize_value<T: Serialize + ?Sized>(&mut self, value: &T) -> Done {
        value.serialize(&mut **self)
    }
    fn end(self) -> Done {
        Ok(())
    }
}

macro_rules! fields {
    ($($trait:ident),*) => {$(
        impl ser::$trait for &mut Checker {
            type Ok = ();
            type Error = NotFinite;
            fn serialize_field<T: Serialize + ?Sized>(&mut self, key: &'static str, value: &T) -> Done {
                let outer = std::mem::replace(&mut self.field, key);
                let result = value.serialize(&mut **self);
                self.field = outer;
                result
            }
            fn end(self) -> Done {
                Ok(())
            }
        }
    )*};
}

fields!(SerializeStruct, SerializeStructVariant);

#[cfg(test)]
mod tests {
    use super::*;

    #[derive(serde::Serialize)]
    struct Row {
        name: &'static str,
        hz: f64,
        load: Option<f64>,
        list: Vec<f64>,
    }

    #[test]
    fn finds_infinite_and_nan_numbers_anywhere_and_names_the_field() {
        let good = Row {
            name: "x",
            hz: 440.0,
            load: None,
            list: vec![1.0, 2.0],
        };
        assert!(check_finite(&good).is_ok());
        for (hz, load, list) in [
            (f64::INFINITY, None, vec![]),
            (1.0, Some(f64::NAN), vec![]),
            (1.0, None, vec![2.0, f64::NEG_INFINITY]),
        ] {
            let bad = Row {
                name: "x",
                hz,
                load,
                list,
            };
            let err = check_finite(&bad).unwrap_err();
            assert_eq!(err.exit_code(), crate::error::EXIT_FAILURE);
            assert!(err.to_string().contains("not a finite number"), "{err}");
        }
        let err = check_finite(&Row {
            name: "x",
            hz: f64::NAN,
            load: None,
            list: vec![],
        })
        .unwrap_err();
        assert!(err.to_string().contains("field `hz`"), "{err}");
    }
}
