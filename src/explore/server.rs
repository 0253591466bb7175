//! The HTTP side of the explorer: one listener on the loopback address, a guard on every
//! request, and a router to [`super::api`]. axum (on a current-thread tokio runtime) does the
//! HTTP; each API call runs on tokio's blocking pool, so a survey does not hold up the page.
//!
//! What keeps another web page (or another machine) out, in the order checked:
//! - the listener is bound to 127.0.0.1 only;
//! - `Host` must name that address or `localhost` with our port, so a hostile name pointed at
//!   127.0.0.1 (DNS rebinding) is refused;
//! - `Origin`, when sent, must be this server, and `Sec-Fetch-Site`, when sent, same-origin or
//!   none, so no cross-site request reaches the API;
//! - every path starts with a random 128-bit token printed with the address, which another
//!   site cannot know;
//! - API calls are `POST` with `Content-Type: application/json` (a cross-site form cannot send
//!   it without a preflight, which is refused), bodies are bounded, and so is each call's work.

use std::net::{Ipv4Addr, SocketAddr, TcpListener};
use std::sync::Arc;

use axum::body::{Body, Bytes};
use axum::extract::Request;
use axum::http::{header, HeaderMap, HeaderValue, Method, StatusCode};
use axum::response::Response;
use axum::Router;
use serde::Serialize;

use super::api::{self, ErrorReply};
use super::{page, LIMITS};
use crate::error::{Error, Result};

/// How to start the explorer.
#[derive(Debug, Clone)]
pub struct Options {
    /// The port; `None` takes a free one.
    pub port: Option<u16>,
    /// The instrument to open with, as YAML.
    pub instrument: String,
    /// Its file name, for messages and downloads.
    pub origin: String,
}

/// A listener bound and its token, before serving: the address can be printed (and a test can
/// connect) before the server runs.
#[derive(Debug)]
pub struct Bound {
    listener: TcpListener,
    shared: Arc<Shared>,
}

#[derive(Debug)]
struct Shared {
    token: String,
    port: u16,
    instrument: String,
    origin: String,
}

/// 128 random bits as 32 hexadecimal digits.
fn new_token() -> Result<String> {
    let mut bytes = [0u8; 16];
    getrandom::fill(&mut bytes)
        .map_err(|err| Error::input(format!("cannot make a random token: {err}")))?;
    Ok(bytes.iter().map(|b| format!("{b:02x}")).collect())
}

impl Bound {
    /// Binds 127.0.0.1 on the given port (or a free one) and makes the token.
    pub fn bind(options: Options) -> Result<Bound> {
        let port = options.port.unwrap_or(0);
        let listener =
            TcpListener::bind(SocketAddr::from((Ipv4Addr::LOCALHOST, port))).map_err(|err| {
                Error::input(format!("cannot listen on 127.0.0.1:{port}: {err}"))
                    .in_origin("--port")
                    .help("leave out --port to take a free port")
            })?;
        let port = listener
            .local_addr()
            .map_err(|err| Error::input(format!("cannot read the listening port: {err}")))?
            .port();
        Ok(Bound {
            listener,
            shared: Arc::new(Shared {
                token: new_token()?,
                port,
                instrument: options.instrument,
                origin: options.origin,
            }),
        })
    }

    /// The page's address, token included.
    pub fn url(&self) -> String {
        format!(
            "http://127.0.0.1:{}/{}/",
            self.shared.port, self.shared.token
        )
    }

    /// The port listened on.
    pub fn port(&self) -> u16 {
        self.shared.port
    }

    /// Serves until the process ends.
    pub fn serve(self) -> Result<()> {
        let failed = |err: std::io::Error| Error::input(format!("the explorer stopped: {err}"));
        let runtime = tokio::runtime::Builder::new_current_thread()
            .enable_io()
            .build()
            .map_err(failed)?;
        let shared = self.shared;
        self.listener.set_nonblocking(true).map_err(failed)?;
        runtime
            .block_on(async move {
                let listener = tokio::net::TcpListener::from_std(self.listener)?;
                let app = Router::new().fallback(move |request: Request| {
                    let shared = Arc::clone(&shared);
                    async move { handle(&shared, request).await }
                });
                axum::serve(listener, app).await
            })
            .map_err(failed)
    }
}

/// An error reply: `{"error": {...}}`.
#[derive(Serialize)]
struct Refusal<'a> {
    error: &'a ErrorReply,
}

fn with_headers(mut response: Response) -> Response {
    let headers = response.headers_mut();
    // The page may use only what this server sends: no other origin, no frames, no plugins.
    headers.insert(
        header::CONTENT_SECURITY_POLICY,
        HeaderValue::from_static(
            "default-src 'none'; script-src 'self'; style-src 'self' 'unsafe-inline'; \
             img-src 'self' data: blob:; connect-src 'self'; media-src 'self' blob:; \
             font-src 'self'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'",
        ),
    );
    headers.insert(
        header::X_CONTENT_TYPE_OPTIONS,
        HeaderValue::from_static("nosniff"),
    );
    headers.insert(
        header::REFERRER_POLICY,
        HeaderValue::from_static("no-referrer"),
    );
    headers.insert(header::CACHE_CONTROL, HeaderValue::from_static("no-store"));
    headers.insert(
        header::HeaderName::from_static("cross-origin-resource-policy"),
        HeaderValue::from_static("same-origin"),
    );
    response
}

fn bytes_response(status: StatusCode, content_type: &str, body: Vec<u8>) -> Response {
    let mut response = Response::new(Body::from(body));
    *response.status_mut() = status;
    if let Ok(value) = HeaderValue::from_str(content_type) {
        response.headers_mut().insert(header::CONTENT_TYPE, value);
    }
    with_headers(response)
}

fn json_response<T: Serialize>(status: StatusCode, value: &T) -> Response {
    match serde_json::to_vec(value) {
        Ok(body) => bytes_response(status, "application/json", body),
        Err(err) => refuse(
            StatusCode::INTERNAL_SERVER_ERROR,
            &Error::input(format!("cannot write the reply as JSON: {err}")),
        ),
    }
}

fn refuse(status: StatusCode, error: &Error) -> Response {
    let reply = ErrorReply::from_error(error);
    match serde_json::to_vec(&Refusal { error: &reply }) {
        Ok(body) => bytes_response(status, "application/json", body),
        Err(_) => bytes_response(status, "text/plain", reply.text.into_bytes()),
    }
}

fn refuse_with(status: StatusCode, message: &str, help: &str) -> Response {
    refuse(
        status,
        &Error::input(message).in_origin("request").help(help),
    )
}

/// Whether two texts are equal, in time that does not depend on where they differ.
fn same_secret(a: &str, b: &str) -> bool {
    a.len() == b.len()
        && a.bytes()
            .zip(b.bytes())
            .fold(0u8, |acc, (x, y)| acc | (x ^ y))
            == 0
}

/// The guard: `Some(refusal)` when the request must not reach the page or the API.
fn guard(shared: &Shared, headers: &HeaderMap) -> Option<Response> {
    let port = shared.port;
    let header_text = |name: header::HeaderName| {
        headers
            .get(name)
            .map(|value| value.to_str().unwrap_or("\u{fffd}"))
    };
    let hosts = [format!("127.0.0.1:{port}"), format!("localhost:{port}")];
    match header_text(header::HOST) {
        Some(host)
            if hosts
                .iter()
                .any(|allowed| allowed.eq_ignore_ascii_case(host)) => {}
        _ => {
            return Some(refuse_with(
                StatusCode::FORBIDDEN,
                "the Host header does not name this explorer",
                "open the address `taut explore` printed (127.0.0.1 or localhost)",
            ))
        }
    }
    if let Some(origin) = header_text(header::ORIGIN) {
        let allowed = hosts
            .iter()
            .any(|host| origin.eq_ignore_ascii_case(&format!("http://{host}")));
        if !allowed {
            return Some(refuse_with(
                StatusCode::FORBIDDEN,
                "requests from another site are refused",
                "use the explorer's own page",
            ));
        }
    }
    if let Some(site) = header_text(header::HeaderName::from_static("sec-fetch-site")) {
        if !matches!(site, "same-origin" | "none") {
            return Some(refuse_with(
                StatusCode::FORBIDDEN,
                "requests from another site are refused",
                "use the explorer's own page",
            ));
        }
    }
    None
}

async fn handle(shared: &Arc<Shared>, request: Request) -> Response {
    let (parts, body) = request.into_parts();
    if let Some(refusal) = guard(shared, &parts.headers) {
        return refusal;
    }
    let path = parts.uri.path();
    let rest = path
        .strip_prefix('/')
        .and_then(|p| p.split_once('/'))
        .filter(|(token, _)| same_secret(token, &shared.token))
        .map(|(_, rest)| rest);
    let Some(rest) = rest else {
        return refuse_with(
            StatusCode::NOT_FOUND,
            "this address needs the explorer's token",
            "open the whole address `taut explore` printed, token included",
        );
    };
    match (&parts.method, rest) {
        (&Method::GET, "" | "index.html") => bytes_response(
            StatusCode::OK,
            "text/html; charset=utf-8",
            page::INDEX_HTML.as_bytes().to_vec(),
        ),
        (&Method::GET, "style.css") => bytes_response(
            StatusCode::OK,
            "text/css; charset=utf-8",
            page::STYLE_CSS.as_bytes().to_vec(),
        ),
        (&Method::GET, "app.js") => bytes_response(
            StatusCode::OK,
            "text/javascript; charset=utf-8",
            page::APP_JS.as_bytes().to_vec(),
        ),
        (&Method::GET, "icon.svg") => bytes_response(
            StatusCode::OK,
            "image/svg+xml",
            page::ICON_SVG.as_bytes().to_vec(),
        ),
        (&Method::POST, rest) if rest.starts_with("api/") => {
            let name = rest.trim_start_matches("api/").to_string();
            let json = parts
                .headers
                .get(header::CONTENT_TYPE)
                .and_then(|v| v.to_str().ok())
                .is_some_and(|v| v.trim().starts_with("application/json"));
            if !json {
                return refuse_with(
                    StatusCode::UNSUPPORTED_MEDIA_TYPE,
                    "the API takes JSON bodies only",
                    "send `Content-Type: application/json`",
                );
            }
            let declared = parts
                .headers
                .get(header::CONTENT_LENGTH)
                .and_then(|v| v.to_str().ok())
                .and_then(|v| v.parse::<u64>().ok());
            if declared.is_some_and(|length| length > LIMITS.body_bytes as u64) {
                return too_large();
            }
            let Ok(bytes) = axum::body::to_bytes(body, LIMITS.body_bytes).await else {
                return too_large();
            };
            let shared = Arc::clone(shared);
            tokio::task::spawn_blocking(move || call(&shared, &name, &bytes))
                .await
                .unwrap_or_else(|_| {
                    refuse(
                        StatusCode::INTERNAL_SERVER_ERROR,
                        &Error::input("the request stopped unexpectedly"),
                    )
                })
        }
        (&Method::GET | &Method::POST, _) => refuse_with(
            StatusCode::NOT_FOUND,
            "the explorer has no such page or API call",
            "API calls: start, example, read, write, plan, export, tuning, frets, audit, survey, sound",
        ),
        _ => refuse_with(
            StatusCode::METHOD_NOT_ALLOWED,
            "the explorer answers GET for the page and POST for the API",
            "use the explorer's own page",
        ),
    }
}

fn too_large() -> Response {
    refuse(
        StatusCode::PAYLOAD_TOO_LARGE,
        &Error::input(format!(
            "the request is larger than the {} bytes the explorer reads",
            LIMITS.body_bytes
        ))
        .in_origin("request")
        .help("an instrument file of 1000 courses is about 60 kB"),
    )
}

/// Reads a request body as `T`, naming line and column of bad JSON.
fn body<T: serde::de::DeserializeOwned>(bytes: &Bytes) -> Result<T> {
    serde_json::from_slice(bytes).map_err(|err| {
        Error::input(format!(
            "the request is not what this API call takes: {err}"
        ))
        .in_origin("request")
        .at(err.line(), err.column())
    })
}

/// The reply to a request the API read but whose input the library refused (a YAML mistake,
/// an unknown tuning): an answer like any other, status 200 with `{"refused": {...}}`, because
/// the page shows it inline and the browser would log a 4xx status as a fault. Statuses of 400
/// and above are for requests the page never makes: no token, a foreign origin, a body too
/// large or not JSON, an unknown call.
#[derive(Serialize)]
struct Refused<'a> {
    refused: &'a ErrorReply,
}

fn answer<T: Serialize>(result: Result<T>) -> Response {
    match result {
        Ok(value) => json_response(StatusCode::OK, &value),
        Err(error) => json_response(
            StatusCode::OK,
            &Refused {
                refused: &ErrorReply::from_error(&error),
            },
        ),
    }
}

/// Reads the request body as `R` (400 when it is not that JSON), then answers with `work`.
fn with<R, T>(bytes: &Bytes, work: impl FnOnce(&R) -> Result<T>) -> Response
where
    R: serde::de::DeserializeOwned,
    T: Serialize,
{
    match body::<R>(bytes) {
        Ok(request) => answer(work(&request)),
        Err(error) => refuse(StatusCode::BAD_REQUEST, &error),
    }
}

/// Runs one API call and writes its reply.
pub(crate) fn call_api(name: &str, bytes: &Bytes, instrument: &str, origin: &str) -> Response {
    match name {
        "start" => answer(api::start(instrument, origin)),
        "example" => with(bytes, api::example),
        "read" => with(bytes, |r| Ok(api::read(r))),
        "write" => with(bytes, api::write),
        "plan" => with(bytes, api::plan),
        "tuning" => with(bytes, api::tuning),
        "frets" => with(bytes, api::frets),
        "audit" => with(bytes, api::audit),
        "survey" => with(bytes, api::survey),
        "sound" => with(bytes, api::sound),
        "export" => match body::<api::ExportRequest>(bytes) {
            Err(error) => refuse(StatusCode::BAD_REQUEST, &error),
            Ok(request) => match api::export(&request) {
                Ok(file) => {
                    let mut response =
                        bytes_response(StatusCode::OK, file.content_type, file.bytes);
                    let disposition = format!(
                        "attachment; filename=\"{}\"",
                        file.file_name.replace(['"', '\\'], "_")
                    );
                    if let Ok(value) = HeaderValue::from_str(&disposition) {
                        response
                            .headers_mut()
                            .insert(header::CONTENT_DISPOSITION, value);
                    }
                    response
                }
                Err(error) => answer::<()>(Err(error)),
            },
        },
        _ => refuse_with(
            StatusCode::NOT_FOUND,
            "the explorer has no such API call",
            "API calls: start, example, read, write, plan, export, tuning, frets, audit, survey, sound",
        ),
    }
}

fn call(shared: &Shared, name: &str, bytes: &Bytes) -> Response {
    call_api(name, bytes, &shared.instrument, &shared.origin)
}
