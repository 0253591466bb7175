//! The explorer's plan round trip for a 200-course instrument (`instruments.rs`): the server's
//! own work (read the JSON request, solve, attach fixes, write the JSON reply), with and without
//! the three SVG charts the page shows, and the same call through real HTTP on loopback (a new
//! connection per request, as a browser may make). Target: at most 5 ms of server time.

use std::io::{Read, Write};
use std::net::TcpStream;

use criterion::{criterion_group, criterion_main, Criterion};
use taut::explore::api::{self, PlanRequest};
use taut::explore::{Bound, Options};

#[path = "instruments.rs"]
mod instruments;

fn request_body(text: &str, charts: bool) -> Vec<u8> {
    serde_json::to_vec(&serde_json::json!({
        "instrument": text,
        "origin": "bench.yaml",
        "tuning": "12edo",
        "charts": charts,
    }))
    .unwrap_or_default()
}

fn server_time(body: &[u8]) -> usize {
    let request: PlanRequest = match serde_json::from_slice(body) {
        Ok(request) => request,
        Err(err) => panic!("{err}"),
    };
    let reply = match api::plan(&request) {
        Ok(reply) => reply,
        Err(err) => panic!("{err}"),
    };
    serde_json::to_vec(&reply).map_or(0, |bytes| bytes.len())
}

fn http_round_trip(port: u16, path: &str, body: &[u8]) -> usize {
    let mut stream = match TcpStream::connect(("127.0.0.1", port)) {
        Ok(stream) => stream,
        Err(err) => panic!("{err}"),
    };
    let head = format!(
        "POST {path}api/plan HTTP/1.1\r\nHost: 127.0.0.1:{port}\r\nContent-Type: application/json\r\nContent-Length: {}\r\nConnection: close\r\n\r\n",
        body.len()
    );
    let mut reply = Vec::new();
    let sent = stream
        .write_all(head.as_bytes())
        .and_then(|()| stream.write_all(body))
        .and_then(|()| stream.read_to_end(&mut reply));
    if let Err(err) = sent {
        panic!("{err}");
    }
    assert!(reply.starts_with(b"HTTP/1.1 200"), "the plan call failed");
    reply.len()
}

fn bench_explore(c: &mut Criterion) {
    let bound = match Bound::bind(Options {
        port: None,
        instrument: instruments::zither(),
        origin: "bench.yaml".to_string(),
    }) {
        Ok(bound) => bound,
        Err(err) => panic!("{err}"),
    };
    let port = bound.port();
    let url = bound.url();
    let path = url
        .split_once(&format!(":{port}"))
        .map(|(_, path)| path.to_string())
        .unwrap_or_default();
    std::thread::spawn(move || bound.serve());
    for (name, text) in [
        ("zither", instruments::zither()),
        ("overstressed harp", instruments::overstressed_harp()),
    ] {
        let plain = request_body(&text, false);
        let with_charts = request_body(&text, true);
        c.bench_function(
            &format!("explore plan, server time, 200 courses, {name}"),
            |b| b.iter(|| server_time(&plain)),
        );
        c.bench_function(
            &format!("explore plan with charts, server time, 200 courses, {name}"),
            |b| b.iter(|| server_time(&with_charts)),
        );
        c.bench_function(
            &format!("explore plan over HTTP, 200 courses, {name}"),
            |b| b.iter(|| http_round_trip(port, &path, &plain)),
        );
    }
}

criterion_group!(benches, bench_explore);
criterion_main!(benches);
