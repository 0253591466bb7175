//! Flat records of any result, for spreadsheets: the CSV export of every report.
//!
//! The rule, the same for every report: one row per item of the report's main list (its first
//! top-level field that is a list of objects: `courses`, `rows`, `intervals`, …); where those
//! items hold a list of strings (`strings`), one row per string, the course's fields repeated.
//! Columns are the JSON field names; a nested object's fields are joined to its name with a dot
//! (`before.tension_n`); a list of plain values is joined with `;`, a list of objects
//! (`warnings`) gives the count and the `kind`s joined with `;`; `null` is an empty cell. Object
//! fields come in alphabetical order (the JSON document's order).

use serde::Serialize;
use serde_json::{Map, Value};

use crate::error::{Error, Result};

fn fail(err: impl std::fmt::Display) -> Error {
    Error::input(format!("cannot render the report as CSV: {err}"))
}

/// The report as CSV text, by the rule in the module documentation.
pub fn csv<T: Serialize>(report: &T) -> Result<String> {
    let value = serde_json::to_value(report).map_err(fail)?;
    let rows = rows(&value);
    let mut header: Vec<String> = Vec::new();
    for row in &rows {
        for (name, _) in row {
            if !header.contains(name) {
                header.push(name.clone());
            }
        }
    }
    // A field that is null (or an empty list) in one row and an object (or a list of objects) in
    // another gets the nested columns only; its empty cells say "missing" there.
    let nested: Vec<String> = header
        .iter()
        .filter(|name| {
            let prefix = format!("{name}.");
            header.iter().any(|other| other.starts_with(&prefix))
        })
        .cloned()
        .collect();
    header.retain(|name| !nested.contains(name));
    let mut writer = csv::Writer::from_writer(Vec::new());
    writer.write_record(&header).map_err(fail)?;
    for row in &rows {
        let record = header.iter().map(|name| {
            row.iter()
                .find(|(column, _)| column == name)
                .map_or("", |(_, cell)| cell.as_str())
        });
        writer.write_record(record).map_err(fail)?;
    }
    let bytes = writer.into_inner().map_err(fail)?;
    String::from_utf8(bytes).map_err(fail)
}

type Row = Vec<(String, String)>;

/// The rows of a report's main list, or the report itself as one row when it has none.
pub fn rows(value: &Value) -> Vec<Row> {
    let Value::Object(fields) = value else {
        return vec![vec![("value".to_string(), cell(value))]];
    };
    let main = fields.iter().find(|(_, v)| is_object_list(v));
    match main {
        Some((_, Value::Array(items))) => items.iter().flat_map(item_rows).collect(),
        _ => {
            let mut row = Row::new();
            flatten("", fields, &mut row);
            vec![row]
        }
    }
}

fn is_object_list(value: &Value) -> bool {
    matches!(value, Value::Array(items) if items.first().is_some_and(Value::is_object))
}

fn item_rows(item: &Value) -> Vec<Row> {
    let Value::Object(fields) = item else {
        return vec![vec![("value".to_string(), cell(item))]];
    };
    let mut own = Row::new();
    let mut strings: Option<&Vec<Value>> = None;
    for (name, value) in fields {
        match value {
            Value::Array(items) if name == "strings" && is_object_list(value) => {
                strings = Some(items);
            }
            _ => flatten_field(name, value, &mut own),
        }
    }
    match strings {
        None => vec![own],
        Some(items) => items
            .iter()
            .enumerate()
            .map(|(index, string)| {
                let mut row = own.clone();
                row.push(("string_number".to_string(), (index + 1).to_string()));
                if let Value::Object(string_fields) = string {
                    flatten("string", string_fields, &mut row);
                }
                row
            })
            .collect(),
    }
}

fn flatten(prefix: &str, fields: &Map<String, Value>, row: &mut Row) {
    for (name, value) in fields {
        let full = if prefix.is_empty() {
            name.clone()
        } else {
            format!("{prefix}.{name}")
        };
        flatten_field(&full, value, row);
    }
}

fn flatten_field(name: &str, value: &Value, row: &mut Row) {
    match value {
        Value::Object(fields) => flatten(name, fields, row),
        Value::Array(items) if items.iter().any(Value::is_object) => {
            row.push((format!("{name}.count"), items.len().to_string()));
            let kinds: Vec<String> = items
                .iter()
                .filter_map(|item| item.get("kind").map(cell))
                .collect();
            if !kinds.is_empty() {
                row.push((format!("{name}.kind"), kinds.join(";")));
            }
        }
        Value::Array(items) => {
            row.push((
                name.to_string(),
                items.iter().map(cell).collect::<Vec<_>>().join(";"),
            ));
        }
        other => row.push((name.to_string(), cell(other))),
    }
}

fn cell(value: &Value) -> String {
    match value {
        Value::Null => String::new(),
        Value::String(text) => text.clone(),
        Value::Bool(flag) => flag.to_string(),
        Value::Number(number) => match (number.is_f64(), number.as_f64()) {
            (true, Some(float)) => serde_json::Number::from_f64(significant(float))
                .map_or_else(|| number.to_string(), |rounded| rounded.to_string()),
            _ => number.to_string(),
        },
        Value::Array(_) | Value::Object(_) => value.to_string(),
    }
}

/// Rounds to 6 significant digits, the precision of every CSV export (`0.6477`, not
/// `0.6476999999999999`); zero and non-finite values are returned as they are.
pub fn significant(value: f64) -> f64 {
    if value == 0.0 || !value.is_finite() {
        return value;
    }
    format!("{value:.5e}").parse().unwrap_or(value)
}

/// The characters that make a spreadsheet read a cell as a formula when they start it: `=`, `+`,
/// `-`, `@`, tab and carriage return (the list in OWASP's "CSV Injection" page).
const FORMULA_STARTS: [char; 6] = ['=', '+', '-', '@', '\t', '\r'];

/// Whether `text` is a plain decimal number as taut writes numbers (`-12`, `0.5`, `-1.5e-7`):
/// such a cell is read as a number, never as a formula, so it is left as it is.
fn is_plain_number(text: &str) -> bool {
    let unsigned = text.strip_prefix('-').unwrap_or(text);
    let (mantissa, exponent) = match unsigned.split_once(['e', 'E']) {
        Some((mantissa, exponent)) => (mantissa, Some(exponent)),
        None => (unsigned, None),
    };
    let (whole, fraction) = match mantissa.split_once('.') {
        Some((whole, fraction)) => (whole, Some(fraction)),
        None => (mantissa, None),
    };
    let digits = |part: &str| !part.is_empty() && part.bytes().all(|b| b.is_ascii_digit());
    digits(whole)
        && fraction.is_none_or(digits)
        && exponent.is_none_or(|e| digits(e.strip_prefix(['+', '-']).unwrap_or(e)))
}

fn at_risk(piece: &str) -> bool {
    piece.starts_with(FORMULA_STARTS) && !is_plain_number(piece)
}

/// One CSV cell made safe to open in a spreadsheet, following OWASP's "CSV Injection" guidance:
/// text that starts with `=`, `+`, `-`, `@`, tab or carriage return gets a single quote (`'`) in
/// front, so it is shown as text and never run as a formula. The same goes for each piece after
/// a `;` (the field separator in many spreadsheet locales; taut also joins lists with it). Plain
/// numbers (`-3.5`) are left as they are: they are read as numbers.
pub fn safe_cell(text: &str) -> std::borrow::Cow<'_, str> {
    let pieces_at_risk = at_risk(text) || text.split(';').skip(1).any(at_risk);
    if !pieces_at_risk {
        return std::borrow::Cow::Borrowed(text);
    }
    let mut out = String::with_capacity(text.len() + 4);
    for (index, piece) in text.split(';').enumerate() {
        if index > 0 {
            out.push(';');
        }
        if at_risk(piece) {
            out.push('\'');
        }
        out.push_str(piece);
    }
    std::borrow::Cow::Owned(out)
}

/// A CSV document with every cell passed through [`safe_cell`]: the last step of every CSV
/// export (reports, string charts, fret tables), so no name from a file reaches a spreadsheet
/// as a formula.
pub fn guarded(text: &str) -> Result<String> {
    let mut reader = csv::ReaderBuilder::new()
        .has_headers(false)
        .flexible(true)
        .from_reader(text.as_bytes());
    let mut writer = csv::WriterBuilder::new()
        .flexible(true)
        .from_writer(Vec::new());
    let mut record = csv::StringRecord::new();
    while reader.read_record(&mut record).map_err(fail)? {
        writer
            .write_record(record.iter().map(|cell| safe_cell(cell).into_owned()))
            .map_err(fail)?;
    }
    let bytes = writer.into_inner().map_err(fail)?;
    String::from_utf8(bytes).map_err(fail)
}

#[cfg(test)]
mod tests {
    use super::*;
    use serde_json::json;

    #[test]
    fn one_row_per_string_with_the_course_repeated_and_dotted_names() {
        let report = json!({
            "name": "x",
            "courses": [
                {"course": 1, "pitch": "E4", "strings": [
                    {"interval": "unison", "before": {"tension_n": 70.5}, "gauge": null},
                    {"interval": "octave", "before": {"tension_n": 60.0}, "gauge": "0.010 in"}
                ], "warnings": [{"kind": "stress_caution"}], "tags": ["a", "b"]},
                {"course": 2, "pitch": "B3", "strings": [
                    {"interval": "unison", "before": null, "gauge": "0.013 in"}
                ], "warnings": [], "tags": []}
            ]
        });
        let text = csv(&report).unwrap();
        let lines: Vec<&str> = text.lines().collect();
        assert_eq!(lines.len(), 4, "{text}");
        assert_eq!(
            lines[0],
            "course,pitch,tags,warnings.count,warnings.kind,string_number,string.before.tension_n,string.gauge,string.interval"
        );
        assert_eq!(lines[1], "1,E4,a;b,1,stress_caution,1,70.5,,unison");
        assert_eq!(lines[2], "1,E4,a;b,1,stress_caution,2,60.0,0.010 in,octave");
        assert_eq!(lines[3], "2,B3,,,,1,,0.013 in,unison");
    }

    #[test]
    fn formula_cells_get_a_quote_and_numbers_stay_numbers() {
        // OWASP, "CSV Injection": cells starting with = + - @ tab or CR are prefixed with '.
        for (cell, safe) in [
            ("=HYPERLINK(\"x\")", "'=HYPERLINK(\"x\")"),
            ("+1", "'+1"),
            ("-x", "'-x"),
            ("@SUM(A1)", "'@SUM(A1)"),
            ("\tx", "'\tx"),
            ("\rx", "'\rx"),
            ("a;=cmd", "a;'=cmd"),
            ("-", "'-"),
            ("-1e", "'-1e"),
            ("-3.5", "-3.5"),
            ("-12", "-12"),
            ("-1.5e-7", "-1.5e-7"),
            ("-3;-4.5", "-3;-4.5"),
            ("E4", "E4"),
            ("a=b", "a=b"),
        ] {
            assert_eq!(safe_cell(cell), safe, "{cell:?}");
        }
        let text = guarded("name,x\n=1+2,-3\n\"a,b\",@c\n").unwrap();
        assert_eq!(text, "name,x\n'=1+2,-3\n\"a,b\",'@c\n");
    }

    #[test]
    fn floats_are_written_to_six_significant_digits() {
        let text =
            csv(&json!({"a": 58.270470189761255, "b": 0.7000000000000001, "c": 1234567})).unwrap();
        assert_eq!(text, "a,b,c\n58.2705,0.7,1234567\n");
    }

    #[test]
    fn a_report_without_a_list_is_one_row() {
        let text = csv(&json!({"a": 1, "b": {"c": "d"}})).unwrap();
        assert_eq!(text, "a,b.c\n1,d\n");
    }
}
