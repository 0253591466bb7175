//! The explorer's JSON API as plain functions: each takes a request read from JSON and returns
//! a reply that is plain serde data, or an [`Error`] that names file, line and field as the
//! command line does. The HTTP layer ([`super::server`]) only routes to these, so they are
//! what the benchmark times and what the page and the command line share: every figure comes
//! from the same library calls `taut plan`, `tuning`, `frets`, `audit` and `survey` make.

mod more;
mod plan;

pub use more::{
    audit, frets, sound, survey, tuning, AuditRequest, FretsRequest, SoundRequest, SurveyRequest,
    TuningRequest,
};
pub use plan::{export, plan, ExportRequest, Exported, PlanReply, PlanRequest};

use serde::{Deserialize, Serialize};

use crate::error::{Error, Location, Result};
use crate::input::examples::{self, FileKind};
use crate::instrument::Instrument;
use crate::plan::warning::{SAFETY_CAUTIONS, SAFETY_REMINDER};
use crate::strings::stock::Stock;

use super::document::{self, Document};

/// The name messages give the page's instrument when the page names no file.
pub const DEFAULT_ORIGIN: &str = "instrument.yaml";

/// The longest file name a request may give for its messages.
const MAX_ORIGIN_CHARS: usize = 120;

/// The name a request gives its text for messages, made safe: no path, no control characters,
/// at most [`MAX_ORIGIN_CHARS`] characters; the default when empty.
pub fn origin_name(given: Option<&str>, default: &str) -> String {
    let name = given
        .map(|text| text.rsplit(['/', '\\']).next().unwrap_or(text))
        .map(|text| {
            text.chars()
                .filter(|c| !c.is_control())
                .take(MAX_ORIGIN_CHARS)
                .collect::<String>()
        })
        .unwrap_or_default();
    if name.trim().is_empty() {
        default.to_string()
    } else {
        name
    }
}

/// Reads the instrument the page sends, as `taut plan FILE` reads a file of that name.
pub fn load_instrument(text: &str, origin: Option<&str>) -> Result<Instrument> {
    let origin = origin_name(origin, DEFAULT_ORIGIN);
    Instrument::from_text(text.to_string(), &origin)
        .map_err(|err| examples::wrong_kind(text, &origin, FileKind::Instrument).unwrap_or(err))
}

/// The shipped string data: the explorer takes no stock files, since it reads no file.
pub fn stock() -> Result<&'static Stock> {
    Stock::builtin()
}

/// A bad request as the page shows it: where, what, and how to fix it.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ErrorReply {
    /// The whole message as the command line prints it (after `error: `).
    pub text: String,
    /// What is wrong, without the place.
    pub message: String,
    /// The file (or option) it is in.
    pub origin: Option<String>,
    /// 1-based line.
    pub line: Option<usize>,
    /// 1-based column.
    pub column: Option<usize>,
    /// Dotted path of the field.
    pub field: Option<String>,
    /// What to write instead, when known.
    pub help: Option<String>,
}

impl ErrorReply {
    /// The reply for `error`.
    pub fn from_error(error: &Error) -> ErrorReply {
        let (location, message, help) = match error {
            Error::Input {
                location,
                message,
                help,
            } => (location.clone(), message.clone(), help.clone()),
            other => (Location::default(), other.to_string(), None),
        };
        ErrorReply {
            text: error.to_string(),
            message: crate::error::shown(&message).into_owned(),
            origin: location.origin,
            line: location.line,
            column: location.column,
            field: location.field,
            help,
        }
    }
}

/// What the page needs to start: the shipped instruments and tunings, the string kinds a form
/// may allow, the safety texts, and the instrument given on the command line.
#[derive(Debug, Clone, Serialize)]
pub struct StartReply {
    /// The instrument to open with, as YAML.
    pub instrument: String,
    /// Its file name, for messages and downloads.
    pub origin: String,
    /// Shipped example instruments, by name.
    pub examples: Vec<&'static str>,
    /// Shipped tunings, by name.
    pub tunings: Vec<&'static str>,
    /// The string kinds of the shipped data, by id.
    pub kinds: Vec<String>,
    /// The cautions shown with any caution or danger.
    pub cautions: Vec<&'static str>,
    /// The reminder shown under results without any.
    pub reminder: &'static str,
    /// The server's limits, so the page can say them.
    pub limits: super::Limits,
}

/// The start reply for the instrument text `instrument` named `origin`.
pub fn start(instrument: &str, origin: &str) -> Result<StartReply> {
    let examples = examples::EXAMPLES
        .iter()
        .filter(|(_, text)| examples::sniff(text) == Some(FileKind::Instrument))
        .map(|(name, _)| *name)
        .collect();
    let kinds: Vec<String> = stock()?
        .kinds()
        .all()
        .iter()
        .map(|kind| kind.id.to_string())
        .collect();
    Ok(StartReply {
        instrument: instrument.to_string(),
        origin: origin.to_string(),
        examples,
        tunings: crate::tuning::library::names().collect(),
        kinds,
        cautions: SAFETY_CAUTIONS.to_vec(),
        reminder: SAFETY_REMINDER,
        limits: super::LIMITS,
    })
}

/// The text of a shipped example, by name.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct ExampleRequest {
    /// The example's name (`lever-harp-34`).
    pub name: String,
}

/// A shipped example's YAML and file name.
pub fn example(request: &ExampleRequest) -> Result<StartReply> {
    let text = examples::EXAMPLES
        .iter()
        .find(|(name, _)| *name == request.name)
        .map(|(_, text)| *text)
        .ok_or_else(|| {
            Error::input(format!("there is no shipped example `{}`", request.name))
                .in_origin("example")
        })?;
    start(text, &format!("{}.yaml", request.name))
}

/// YAML text to read into the form.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct ReadRequest {
    /// The instrument as YAML.
    pub yaml: String,
    /// Its file name, for messages.
    #[serde(default)]
    pub origin: Option<String>,
}

/// The form's view of an instrument file, and what is wrong with it.
#[derive(Debug, Clone, Serialize)]
pub struct ReadReply {
    /// The document (maps as ordered `{k, v}` lists); absent when the YAML does not parse.
    pub document: Option<serde_json::Value>,
    /// The first problem, as the command line reports it; absent when the instrument is good.
    pub error: Option<ErrorReply>,
}

/// Reads YAML for the form, and checks it as an instrument.
pub fn read(request: &ReadRequest) -> ReadReply {
    let origin = origin_name(request.origin.as_deref(), DEFAULT_ORIGIN);
    match Document::from_yaml(&request.yaml, &origin) {
        Err(error) => ReadReply {
            document: None,
            error: Some(ErrorReply::from_error(&error)),
        },
        Ok(doc) => ReadReply {
            document: Some(document::to_json(&doc)),
            error: load_instrument(&request.yaml, Some(&origin))
                .err()
                .map(|error| ErrorReply::from_error(&error)),
        },
    }
}

/// The form's document to write as YAML.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct WriteRequest {
    /// The document, as [`read`] gives it.
    pub document: serde_json::Value,
    /// The file name, for messages.
    #[serde(default)]
    pub origin: Option<String>,
}

/// The YAML of a form, and what is wrong with it as an instrument.
#[derive(Debug, Clone, Serialize)]
pub struct WriteReply {
    /// The instrument as YAML.
    pub yaml: String,
    /// The first problem, as the command line reports it; absent when the instrument is good.
    pub error: Option<ErrorReply>,
}

/// Writes the form's document as YAML, and checks it as an instrument.
pub fn write(request: &WriteRequest) -> Result<WriteReply> {
    let doc = document::from_json(&request.document, 0)
        .map_err(|why| Error::input(why).in_origin("document"))?;
    let yaml = doc.to_yaml()?;
    let error = load_instrument(&yaml, request.origin.as_deref())
        .err()
        .map(|error| ErrorReply::from_error(&error));
    Ok(WriteReply { yaml, error })
}
