//! `taut explore` in a real headless Chromium, driven over WebDriver (chromedriver) by a small
//! client written here: WebDriver is JSON over HTTP, and chromedriver's browser-log call, which
//! these tests need for console errors, is outside what the WebDriver crates wrap.
//!
//! These tests are never skipped: without Chromium and chromedriver they fail and say how to
//! install them (`.ci/run` installs both with the system's package manager). Screenshots of the
//! main views are written to `target/explorer-screenshots/` for people to look at.

use std::io::{Read, Write};
use std::net::TcpStream;
use std::path::{Path, PathBuf};
use std::process::{Child, Command, Stdio};
use std::time::{Duration, Instant};

use serde_json::{json, Value};

use crate::common::{json as cli_json, taut, Explorer};

/// Where a program is: the variable's path when set, else the first of `names` found in PATH.
fn program(variable: &str, names: &[&str]) -> PathBuf {
    if let Some(path) = std::env::var_os(variable) {
        return PathBuf::from(path);
    }
    let path = std::env::var_os("PATH").unwrap_or_default();
    for folder in std::env::split_paths(&path) {
        for name in names {
            let candidate = folder.join(name);
            if candidate.is_file() {
                return candidate;
            }
        }
    }
    panic!(
        "the explorer's browser tests need {} and could not find it (looked for {names:?} in \
         PATH; set {variable} to its path). Install Chromium and its driver: \
         `apt-get install -y chromium chromium-driver` (what .ci/run does).",
        names[0]
    );
}

fn free_port() -> u16 {
    std::net::TcpListener::bind("127.0.0.1:0")
        .unwrap()
        .local_addr()
        .unwrap()
        .port()
}

/// The folder for screenshots: beside the build's other artefacts.
fn artefacts() -> PathBuf {
    let target = std::env::var_os("CARGO_TARGET_DIR")
        .map(PathBuf::from)
        .unwrap_or_else(|| Path::new(env!("CARGO_MANIFEST_DIR")).join("target"));
    let folder = target.join("explorer-screenshots");
    std::fs::create_dir_all(&folder).unwrap();
    folder
}

/// Base64 (RFC 4648, standard alphabet) to bytes, for WebDriver's screenshots.
fn from_base64(text: &str) -> Vec<u8> {
    let value = |c: u8| match c {
        b'A'..=b'Z' => c - b'A',
        b'a'..=b'z' => c - b'a' + 26,
        b'0'..=b'9' => c - b'0' + 52,
        b'+' => 62,
        b'/' => 63,
        _ => panic!("not base64: {c}"),
    };
    let digits: Vec<u8> = text
        .bytes()
        .filter(|c| *c != b'=' && !c.is_ascii_whitespace())
        .collect();
    let mut out = Vec::with_capacity(digits.len() * 3 / 4);
    for chunk in digits.chunks(4) {
        let mut bits = 0u32;
        for (i, c) in chunk.iter().enumerate() {
            bits |= u32::from(value(*c)) << (18 - 6 * i);
        }
        let bytes = bits.to_be_bytes();
        out.extend_from_slice(&bytes[1..chunk.len()]);
    }
    out
}

/// One headless Chromium under chromedriver, closed when dropped.
struct Browser {
    driver: Child,
    port: u16,
    session: String,
    downloads: tempfile::TempDir,
    _profile: tempfile::TempDir,
}

impl Browser {
    fn start() -> Browser {
        let chromium = program(
            "TAUT_CHROMIUM",
            &["chromium", "chromium-browser", "google-chrome"],
        );
        let chromedriver = program("TAUT_CHROMEDRIVER", &["chromedriver"]);
        let port = free_port();
        let driver = Command::new(&chromedriver)
            .arg(format!("--port={port}"))
            .stdout(Stdio::null())
            .stderr(Stdio::null())
            .spawn()
            .unwrap_or_else(|err| panic!("cannot start {}: {err}", chromedriver.display()));
        let downloads = tempfile::tempdir().unwrap();
        let profile = tempfile::tempdir().unwrap();
        let mut browser = Browser {
            driver,
            port,
            session: String::new(),
            downloads,
            _profile: profile,
        };
        // chromedriver takes a moment to listen; this waits for it, it times nothing.
        let started = Instant::now();
        while TcpStream::connect(("127.0.0.1", port)).is_err() {
            assert!(
                started.elapsed() < Duration::from_secs(30),
                "chromedriver did not start"
            );
            std::thread::sleep(Duration::from_millis(50));
        }
        // As root in a container Chromium needs --no-sandbox; the rest keep it off the
        // network (no updates, sync or background fetches) with a fresh, empty profile.
        let capabilities = json!({"capabilities": {"alwaysMatch": {
            "browserName": "chrome",
            "goog:loggingPrefs": {"browser": "ALL"},
            "goog:chromeOptions": {
                "binary": chromium,
                "args": ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic",
                    "--no-first-run", "--disable-background-networking",
                    "--disable-component-update", "--disable-sync",
                    "--disable-dev-shm-usage", "--window-size=1400,1000",
                    "--autoplay-policy=no-user-gesture-required",
                    format!("--user-data-dir={}", browser._profile.path().display())],
                "prefs": {"download.default_directory": browser.downloads.path(),
                          "download.prompt_for_download": false},
            },
        }}});
        let reply = browser.send("POST", "/session", &capabilities);
        browser.session = reply["sessionId"]
            .as_str()
            .unwrap_or_else(|| panic!("no WebDriver session: {reply}"))
            .to_string();
        browser
    }

    /// One WebDriver call; the reply's `value`.
    fn send(&self, method: &str, path: &str, body: &Value) -> Value {
        let body = if method == "GET" {
            Vec::new()
        } else {
            serde_json::to_vec(body).unwrap()
        };
        let mut stream = TcpStream::connect(("127.0.0.1", self.port)).unwrap();
        let head = format!(
            "{method} {path} HTTP/1.1\r\nHost: 127.0.0.1:{}\r\nContent-Type: application/json\r\nContent-Length: {}\r\nConnection: close\r\n\r\n",
            self.port,
            body.len()
        );
        stream.write_all(head.as_bytes()).unwrap();
        stream.write_all(&body).unwrap();
        // chromedriver keeps the connection open whatever the request says, so the reply is
        // read by its length (or its chunks), not to the end of the stream.
        let mut raw = Vec::new();
        let mut buffer = [0u8; 65536];
        let text = loop {
            let count = stream.read(&mut buffer).unwrap();
            raw.extend_from_slice(&buffer[..count]);
            let Some(split) = raw.windows(4).position(|w| w == b"\r\n\r\n") else {
                assert!(count > 0, "chromedriver closed the connection");
                continue;
            };
            let head = String::from_utf8_lossy(&raw[..split]).to_ascii_lowercase();
            let body = &raw[split + 4..];
            let length = head
                .lines()
                .find_map(|line| line.strip_prefix("content-length:"))
                .and_then(|value| value.trim().parse::<usize>().ok());
            let complete = match length {
                Some(length) => body.len() >= length,
                None => body.ends_with(b"0\r\n\r\n"),
            };
            if complete || count == 0 {
                break String::from_utf8_lossy(body).into_owned();
            }
        };
        // A chunked body: the JSON is the part between the outer braces.
        let start = text.find('{').unwrap_or(0);
        let end = text.rfind('}').map_or(text.len(), |end| end + 1);
        let value: Value = serde_json::from_str(&text[start..end])
            .unwrap_or_else(|err| panic!("bad WebDriver reply ({err}): {text}"));
        let value = value.get("value").cloned().unwrap_or(value);
        if let Some(error) = value.get("error") {
            panic!("WebDriver {method} {path}: {error}: {}", value["message"]);
        }
        value
    }

    fn at(&self, path: &str) -> String {
        format!("/session/{}{path}", self.session)
    }

    fn open(&self, url: &str) {
        self.send("POST", &self.at("/url"), &json!({"url": url}));
    }

    fn script(&self, script: &str) -> Value {
        self.send(
            "POST",
            &self.at("/execute/sync"),
            &json!({"script": script, "args": []}),
        )
    }

    /// Waits until `condition` (a JavaScript expression) is true; a failure names it.
    fn wait_for(&self, condition: &str) {
        let started = Instant::now();
        loop {
            if self.script(&format!("return !!({condition});")) == json!(true) {
                return;
            }
            if started.elapsed() > Duration::from_secs(30) {
                let status = self.script(
                    "return [document.getElementById('plan-error').textContent, \
                     document.getElementById('yaml-error').textContent].join(' | ');",
                );
                panic!("the page never showed `{condition}` (errors shown: {status})");
            }
            std::thread::sleep(Duration::from_millis(40));
        }
    }

    fn element(&self, css: &str) -> String {
        let found = self.send(
            "POST",
            &self.at("/element"),
            &json!({"using": "css selector", "value": css}),
        );
        found
            .as_object()
            .and_then(|o| o.values().next())
            .and_then(Value::as_str)
            .unwrap_or_else(|| panic!("no element {css}"))
            .to_string()
    }

    fn click(&self, css: &str) {
        let id = self.element(css);
        self.send(
            "POST",
            &self.at(&format!("/element/{id}/click")),
            &json!({}),
        );
    }

    /// Types into an element as a person would (select all, then the text).
    fn type_over(&self, css: &str, text: &str) {
        let id = self.element(css);
        self.send(
            "POST",
            &self.at(&format!("/element/{id}/click")),
            &json!({}),
        );
        // U+E009 is Control, U+E000 releases it.
        let keys = format!("\u{e009}a\u{e000}{text}");
        self.send(
            "POST",
            &self.at(&format!("/element/{id}/value")),
            &json!({"text": keys}),
        );
    }

    fn screenshot(&self, css: &str, name: &str) -> PathBuf {
        let id = self.element(css);
        self.script(&format!(
            "document.querySelector({}).scrollIntoView();",
            serde_json::to_string(css).unwrap()
        ));
        let data = self.send(
            "GET",
            &self.at(&format!("/element/{id}/screenshot")),
            &json!({}),
        );
        let bytes = from_base64(data.as_str().unwrap());
        assert!(bytes.starts_with(b"\x89PNG"), "a screenshot is a PNG");
        let path = artefacts().join(name);
        std::fs::write(&path, bytes).unwrap();
        path
    }

    /// Every console message of level SEVERE since the last call.
    fn console_errors(&self) -> Vec<String> {
        let logs = self.send("POST", &self.at("/se/log"), &json!({"type": "browser"}));
        logs.as_array()
            .unwrap()
            .iter()
            .filter(|entry| entry["level"] == "SEVERE")
            .map(|entry| entry["message"].as_str().unwrap_or_default().to_string())
            .collect()
    }

    fn text(&self, css: &str) -> String {
        self.script(&format!(
            "return document.querySelector({}).textContent;",
            serde_json::to_string(css).unwrap()
        ))
        .as_str()
        .unwrap()
        .to_string()
    }
}

impl Drop for Browser {
    fn drop(&mut self) {
        if !self.session.is_empty() {
            let _ = std::panic::catch_unwind(std::panic::AssertUnwindSafe(|| {
                self.send("DELETE", &format!("/session/{}", self.session), &json!({}))
            }));
        }
        let _ = self.driver.kill();
        let _ = self.driver.wait();
    }
}

/// The table's rows as (course, string, tension text) from the page.
fn page_rows(browser: &Browser) -> Vec<Vec<String>> {
    let rows = browser.script(
        "return [...document.querySelectorAll('#plan-table tbody tr')].map(tr => \
         [...tr.children].map(td => td.textContent));",
    );
    serde_json::from_value(rows).unwrap()
}

/// What the CLI's plan says each row should show: string and tension.
fn cli_rows(plan: &Value) -> Vec<(String, String)> {
    let mut rows = Vec::new();
    for course in plan["courses"].as_array().unwrap() {
        for string in course["strings"].as_array().unwrap() {
            rows.push((
                format!(
                    "{} {}",
                    string["kind"].as_str().unwrap(),
                    string["gauge"].as_str().unwrap()
                ),
                format!("{:.1} N", string["tension_n"].as_f64().unwrap()),
            ));
        }
    }
    rows
}

fn texts_of(svg: &str) -> Vec<String> {
    let document = roxmltree::Document::parse(svg).unwrap();
    document
        .descendants()
        .filter(|n| n.is_text())
        .map(|n| n.text().unwrap_or_default().trim().to_string())
        .filter(|t| !t.is_empty())
        .collect()
}

#[test]
fn a_new_edo_shows_what_the_cli_gives() {
    let explorer = Explorer::start("guitar-19edo");
    let browser = Browser::start();
    browser.open(&explorer.url);
    browser.wait_for("document.body.dataset.planned && document.querySelectorAll('#plan-table tbody tr').length === 6");
    let before: Vec<(String, String)> = page_rows(&browser)
        .iter()
        .map(|r| (r[4].clone(), r[5].clone()))
        .collect();
    assert_eq!(before, cli_rows(&cli_json(&["plan", "guitar-19edo"])));
    browser.script("document.getElementById('tuning-mode').value = 'edo'; document.getElementById('tuning-mode').dispatchEvent(new Event('change'));");
    browser.type_over("#edo", "22");
    browser.wait_for("document.getElementById('spec').textContent === '22edo'");
    browser.wait_for("document.querySelector('#charts figure[data-chart=tension] svg') && document.querySelector('#charts figure[data-chart=tension] svg').textContent.includes('22edo')");
    let after: Vec<(String, String)> = page_rows(&browser)
        .iter()
        .map(|r| (r[4].clone(), r[5].clone()))
        .collect();
    let cli = cli_json(&["plan", "guitar-19edo", "--tuning", "22edo"]);
    assert_eq!(after, cli_rows(&cli));
    assert_ne!(after, before, "22-EDO moves some string");
    // The chart: the same labels and figures as `--plot tension=FILE` draws.
    let folder = tempfile::tempdir().unwrap();
    let file = folder.path().join("tension.svg");
    taut()
        .args(["plan", "guitar-19edo", "--tuning", "22edo", "--plot"])
        .arg(format!("tension={}", file.display()))
        .assert()
        .success();
    let page_svg = browser.script(
        "return new XMLSerializer().serializeToString(document.querySelector('#charts figure[data-chart=tension] svg'));",
    );
    assert_eq!(
        texts_of(page_svg.as_str().unwrap()),
        texts_of(&std::fs::read_to_string(&file).unwrap())
    );
    assert_eq!(
        browser.text("#command"),
        "taut plan guitar-19edo.yaml --tuning 22edo"
    );
    let shot = browser.screenshot("#results-card", "strings-22edo.png");
    println!("screenshot: {}", shot.display());
    browser.wait_for("document.querySelector('#survey-map svg')");
    browser.wait_for("document.querySelector('#frets-drawing svg')");
    println!(
        "screenshot: {}",
        browser
            .screenshot("#survey-card", "tuning-map.png")
            .display()
    );
    println!(
        "screenshot: {}",
        browser.screenshot("#frets-card", "frets.png").display()
    );
    let errors = browser.console_errors();
    assert!(errors.is_empty(), "console errors: {errors:?}");
}

#[test]
fn pin_a_string_see_a_yaml_error_download_and_listen() {
    let explorer = Explorer::start("lever-harp-34");
    let browser = Browser::start();
    browser.open(&explorer.url);
    browser.wait_for("document.querySelectorAll('#plan-table tbody tr').length === 34");
    println!(
        "screenshot: {}",
        browser.screenshot("main", "harp-page.png").display()
    );
    // The change-to-update time for the 34-course harp: reported, not asserted.
    for cents in ["10", "-15", "25"] {
        let seen = browser.script("return document.body.dataset.planned;");
        browser.type_over("#offset", cents);
        browser.wait_for(&format!(
            "document.body.dataset.planned !== {seen} && document.getElementById('spec').textContent.includes('@A4=')"
        ));
        let ms = browser.script("return window.tautLastUpdateMs;");
        println!(
            "34-course harp, offset {cents} cents: change to updated table and charts in {ms} ms"
        );
    }
    browser.type_over("#offset", "0");
    browser.wait_for("document.getElementById('spec').textContent === '12edo'");
    // Step course 1 to its next alternative and pin it: the instrument fixes that string.
    browser.click("[data-step='0:0:1']");
    browser
        .wait_for("document.querySelector('#plan-table tbody tr').classList.contains('preview')");
    let shown = page_rows(&browser)[0][4].clone();
    browser.click("[data-pin='0:0']");
    browser.wait_for("document.getElementById('yaml').value.includes('string:') && document.querySelector('#plan-table tbody tr').classList.contains('pinned')");
    assert_eq!(
        page_rows(&browser)[0][4],
        shown,
        "the pinned string is the one stepped to"
    );
    // Download the instrument and read it back with the CLI.
    browser.click("[data-download='instrument']");
    let file = browser.downloads.path().join("lever-harp-34.yaml");
    let started = Instant::now();
    while !file.exists() {
        assert!(
            started.elapsed() < Duration::from_secs(30),
            "no download appeared"
        );
        std::thread::sleep(Duration::from_millis(50));
    }
    std::thread::sleep(Duration::from_millis(200));
    let plan = cli_json(&["plan", file.to_str().unwrap()]);
    let first = &plan["courses"][0]["strings"][0];
    assert_eq!(first["standing"], "fixed");
    assert_eq!(
        format!(
            "{} {}",
            first["kind"].as_str().unwrap(),
            first["gauge"].as_str().unwrap()
        ),
        shown
    );
    // Play the open strings: notes built from the partials, no console error.
    browser.click("#play-strum");
    browser.wait_for("Number(document.body.dataset.played) > 34");
    assert!(browser
        .text("#sound-status")
        .starts_with("Playing 34 notes"));
    browser.click("#play-stop");
    // A YAML mistake shows inline with its line and field.
    let id = browser.element("#yaml");
    browser.send(
        "POST",
        &browser.at(&format!("/element/{id}/click")),
        &json!({}),
    );
    // U+E009 + U+E010: Control+End, to the end of the text.
    browser.send(
        "POST",
        &browser.at(&format!("/element/{id}/value")),
        &json!({"text": "\u{e009}\u{e010}\u{e000}\nbody_wood: spruce\n"}),
    );
    browser.wait_for("!document.getElementById('yaml-error').hidden");
    let message = browser.text("#yaml-error");
    let yaml = browser.script("return document.getElementById('yaml').value;");
    let line = yaml
        .as_str()
        .unwrap()
        .lines()
        .position(|line| line.starts_with("body_wood:"))
        .unwrap()
        + 1;
    assert!(
        message.contains(&format!("line {line},")) && message.contains("field `body_wood`"),
        "{message}"
    );
    println!(
        "screenshot: {}",
        browser.screenshot("#yaml-pane", "yaml-error.png").display()
    );
    let errors = browser.console_errors();
    assert!(errors.is_empty(), "console errors: {errors:?}");
}
