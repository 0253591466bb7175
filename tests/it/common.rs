//! Helpers shared by the CLI tests: run the real `taut` binary and read its output.

use std::path::{Path, PathBuf};

use assert_cmd::Command;
use serde_json::Value;

/// The `taut` binary built for these tests.
pub fn taut() -> Command {
    Command::new(env!("CARGO_BIN_EXE_taut"))
}

/// Runs `taut ARGS --format json`, asserts success and parses standard output.
pub fn json(args: &[&str]) -> Value {
    let output = taut()
        .args(args)
        .args(["--format", "json"])
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "taut {args:?} failed: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    serde_json::from_slice(&output.stdout).unwrap()
}

/// Runs `taut ARGS`, asserts success and returns standard output.
pub fn table(args: &[&str]) -> String {
    let output = taut().args(args).output().unwrap();
    assert!(
        output.status.success(),
        "taut {args:?} failed: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    String::from_utf8(output.stdout).unwrap()
}

/// Runs `taut ARGS`, asserts exit code 2 (bad input), no panic and nothing on standard output,
/// and returns standard error.
pub fn bad_input(args: &[&str]) -> String {
    let output = taut().args(args).output().unwrap();
    let stderr = String::from_utf8_lossy(&output.stderr).to_string();
    assert_eq!(output.status.code(), Some(2), "taut {args:?}: {stderr}");
    assert!(
        !stderr.contains("panicked"),
        "taut {args:?} panicked: {stderr}"
    );
    assert!(output.stdout.is_empty(), "taut {args:?} wrote output");
    stderr
}

/// A number from a JSON value.
pub fn number(value: &Value) -> f64 {
    value
        .as_f64()
        .unwrap_or_else(|| panic!("not a number: {value}"))
}

/// Writes `text` to `name` inside `folder` and returns the path.
pub fn write_file(folder: &Path, name: &str, text: &str) -> PathBuf {
    let path = folder.join(name);
    std::fs::write(&path, text).unwrap();
    path
}

/// Writes an instrument file and a set file into a new folder and returns `taut audit`'s JSON
/// for the set on that instrument in its own tuning.
pub fn audit_of(instrument: &str, set: &str) -> Value {
    let dir = tempfile::tempdir().unwrap();
    let instrument = write_file(dir.path(), "instrument.yaml", instrument);
    let set = write_file(dir.path(), "set.yaml", set);
    json(&[
        "audit",
        instrument.to_str().unwrap(),
        "--set",
        set.to_str().unwrap(),
    ])
}

/// A running `taut explore` (the real binary), stopped when dropped.
pub struct Explorer {
    child: std::process::Child,
    /// The printed address, token included (`http://127.0.0.1:PORT/TOKEN/`).
    pub url: String,
    /// The port.
    pub port: u16,
    /// The path part of the address (`/TOKEN/`).
    pub path: String,
}

impl Explorer {
    /// Starts `taut explore INSTRUMENT` on a free port and reads the address it prints.
    pub fn start(instrument: &str) -> Explorer {
        use std::io::BufRead;
        let mut child = std::process::Command::new(env!("CARGO_BIN_EXE_taut"))
            .args(["explore", instrument])
            .stdout(std::process::Stdio::piped())
            .stderr(std::process::Stdio::piped())
            .spawn()
            .unwrap();
        let mut line = String::new();
        std::io::BufReader::new(child.stdout.take().unwrap())
            .read_line(&mut line)
            .unwrap();
        let url = line
            .split_whitespace()
            .find(|word| word.starts_with("http://127.0.0.1:"))
            .unwrap_or_else(|| panic!("no address in {line:?}"))
            .to_string();
        let rest = url.trim_start_matches("http://127.0.0.1:");
        let (port, path) = rest.split_at(rest.find('/').unwrap());
        Explorer {
            child,
            port: port.parse().unwrap(),
            path: path.to_string(),
            url,
        }
    }

    /// `POST path api/NAME` with a JSON body and the page's own headers: status and body.
    pub fn call(&self, name: &str, body: &Value) -> (u16, Vec<u8>) {
        let origin = format!("http://127.0.0.1:{}", self.port);
        let response = self.request(
            "POST",
            &format!("{}api/{name}", self.path),
            &[
                ("Content-Type", "application/json"),
                ("Origin", &origin),
                ("Sec-Fetch-Site", "same-origin"),
            ],
            &serde_json::to_vec(body).unwrap(),
        );
        (response.status, response.body)
    }

    /// [`Explorer::call`], expecting success, as JSON.
    pub fn ok(&self, name: &str, body: &Value) -> Value {
        let (status, bytes) = self.call(name, body);
        assert_eq!(
            status,
            200,
            "api/{name} failed: {}",
            String::from_utf8_lossy(&bytes)
        );
        serde_json::from_slice(&bytes).unwrap()
    }

    /// One raw HTTP/1.1 request with exactly these headers (plus `Host`, unless given, and
    /// `Content-Length`), read to the end.
    pub fn request(
        &self,
        method: &str,
        path: &str,
        headers: &[(&str, &str)],
        body: &[u8],
    ) -> HttpResponse {
        use std::io::{Read, Write};
        let mut stream = std::net::TcpStream::connect(("127.0.0.1", self.port)).unwrap();
        let mut head = format!("{method} {path} HTTP/1.1\r\n");
        if !headers
            .iter()
            .any(|(name, _)| name.eq_ignore_ascii_case("host"))
        {
            head.push_str(&format!("Host: 127.0.0.1:{}\r\n", self.port));
        }
        for (name, value) in headers {
            head.push_str(&format!("{name}: {value}\r\n"));
        }
        head.push_str(&format!(
            "Content-Length: {}\r\nConnection: close\r\n\r\n",
            body.len()
        ));
        stream.write_all(head.as_bytes()).unwrap();
        // The server may answer (and close) before reading an oversized body.
        let _ = stream.write_all(body);
        let mut raw = Vec::new();
        let _ = stream.read_to_end(&mut raw);
        HttpResponse::parse(&raw)
    }
}

impl Drop for Explorer {
    fn drop(&mut self) {
        let _ = self.child.kill();
        let _ = self.child.wait();
    }
}

/// A parsed HTTP response.
pub struct HttpResponse {
    /// Status code.
    pub status: u16,
    /// Headers, names in lower case.
    pub headers: Vec<(String, String)>,
    /// The body (chunked transfer decoded).
    pub body: Vec<u8>,
}

impl HttpResponse {
    fn parse(raw: &[u8]) -> HttpResponse {
        let split = raw
            .windows(4)
            .position(|w| w == b"\r\n\r\n")
            .unwrap_or_else(|| panic!("no HTTP response: {:?}", String::from_utf8_lossy(raw)));
        let head = String::from_utf8_lossy(&raw[..split]).into_owned();
        let mut lines = head.split("\r\n");
        let status = lines
            .next()
            .and_then(|line| line.split_whitespace().nth(1))
            .and_then(|code| code.parse().ok())
            .unwrap();
        let headers: Vec<(String, String)> = lines
            .filter_map(|line| line.split_once(':'))
            .map(|(n, v)| (n.trim().to_ascii_lowercase(), v.trim().to_string()))
            .collect();
        let mut body = raw[split + 4..].to_vec();
        if headers
            .iter()
            .any(|(n, v)| n == "transfer-encoding" && v.contains("chunked"))
        {
            let mut decoded = Vec::new();
            let mut rest = &body[..];
            while let Some(end) = rest.windows(2).position(|w| w == b"\r\n") {
                let size = usize::from_str_radix(String::from_utf8_lossy(&rest[..end]).trim(), 16)
                    .unwrap_or(0);
                if size == 0 {
                    break;
                }
                decoded.extend_from_slice(&rest[end + 2..end + 2 + size]);
                rest = &rest[end + 2 + size + 2..];
            }
            body = decoded;
        }
        HttpResponse {
            status,
            headers,
            body,
        }
    }

    /// A header's value.
    pub fn header(&self, name: &str) -> Option<&str> {
        self.headers
            .iter()
            .find(|(n, _)| n == name)
            .map(|(_, v)| v.as_str())
    }
}

/// The text of a shipped example file, read from `examples/`.
pub fn example_text(name: &str) -> String {
    std::fs::read_to_string(
        Path::new(env!("CARGO_MANIFEST_DIR")).join(format!("examples/{name}.yaml")),
    )
    .unwrap()
}
