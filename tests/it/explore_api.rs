//! `taut explore`'s JSON API through real HTTP on loopback, against the real binary: every
//! call answers what the matching command prints (same library calls, compared field for
//! field), and the guard refuses what another site or machine could send: a missing or wrong
//! token, a foreign `Host` (DNS rebinding) or `Origin`, a cross-site fetch, a body that is
//! not JSON or too large. Bad input gets a JSON error naming file, line and field.

use serde_json::{json, Value};

use crate::common::{example_text, taut, write_file, Explorer};

/// The error of a refused request: `error` for what the guard or the HTTP layer refuses,
/// `refused` for input the library refuses (an answer, status 200).
fn error_of(bytes: &[u8]) -> Value {
    let value: Value = serde_json::from_slice(bytes).unwrap();
    if value["refused"].is_object() {
        return value["refused"].clone();
    }
    value["error"].clone()
}

/// A call whose input the library refuses: status 200 and the refusal.
fn refused(explorer: &Explorer, name: &str, body: &Value) -> Value {
    let (status, bytes) = explorer.call(name, body);
    assert_eq!(status, 200, "a refusal is an answer");
    let value: Value = serde_json::from_slice(&bytes).unwrap();
    assert!(value["refused"].is_object(), "not refused: {value}");
    value["refused"].clone()
}

fn cli_json(args: &[&str]) -> Value {
    crate::common::json(args)
}

#[test]
fn page_and_assets_are_served_and_fetch_nothing_from_elsewhere() {
    let explorer = Explorer::start("guitar-19edo");
    let page = explorer.request("GET", &explorer.path, &[], b"");
    assert_eq!(page.status, 200);
    let html = String::from_utf8(page.body.clone()).unwrap();
    assert!(html.contains("src=\"app.js\"") && html.contains("href=\"style.css\""));
    let policy = page.header("content-security-policy").unwrap();
    assert!(policy.contains("default-src 'none'") && policy.contains("connect-src 'self'"));
    for asset in ["app.js", "style.css", "icon.svg"] {
        let response = explorer.request("GET", &format!("{}{asset}", explorer.path), &[], b"");
        assert_eq!(response.status, 200, "{asset}");
        let text = String::from_utf8(response.body).unwrap();
        // No address of another host: the one `http://` allowed is the SVG namespace name,
        // which is never fetched.
        let outside = text
            .replace("http://www.w3.org/2000/svg", "")
            .matches("://")
            .count();
        assert_eq!(outside, 0, "{asset} names another host");
    }
    let outside = html.matches("://").count();
    assert_eq!(outside, 0, "the page names another host");
}

#[test]
fn a_missing_or_wrong_token_is_refused() {
    let explorer = Explorer::start("guitar-19edo");
    for path in [
        "/".to_string(),
        "/api/plan".to_string(),
        "/0123456789abcdef0123456789abcdef/".to_string(),
        format!("{}x/", &explorer.path[..explorer.path.len() - 1]),
    ] {
        let response = explorer.request("GET", &path, &[], b"");
        assert_eq!(response.status, 404, "{path}");
        assert!(error_of(&response.body)["message"]
            .as_str()
            .unwrap()
            .contains("token"));
    }
    let wrong = explorer.request(
        "POST",
        "/0123456789abcdef0123456789abcdef/api/start",
        &[("Content-Type", "application/json")],
        b"{}",
    );
    assert_eq!(wrong.status, 404);
    // The same call with the token passes, so the refusals above are the token's.
    let right = explorer.request(
        "POST",
        &format!("{}api/start", explorer.path),
        &[("Content-Type", "application/json")],
        b"{}",
    );
    assert_eq!(right.status, 200);
}

#[test]
fn a_foreign_host_or_origin_is_refused() {
    let explorer = Explorer::start("guitar-19edo");
    let start = format!("{}api/start", explorer.path);
    let json_type = ("Content-Type", "application/json");
    let other_port = format!("127.0.0.1:{}", explorer.port.wrapping_add(1));
    let rebound = format!("attacker.example:{}", explorer.port);
    for host in [rebound.as_str(), other_port.as_str(), "attacker.example"] {
        let response = explorer.request("POST", &start, &[("Host", host), json_type], b"{}");
        assert_eq!(response.status, 403, "Host {host}");
        assert!(error_of(&response.body)["message"]
            .as_str()
            .unwrap()
            .contains("Host"));
        let page = explorer.request("GET", &explorer.path, &[("Host", host)], b"");
        assert_eq!(page.status, 403, "page with Host {host}");
    }
    for origin in ["http://attacker.example", "null", "http://127.0.0.1:1"] {
        let response = explorer.request("POST", &start, &[("Origin", origin), json_type], b"{}");
        assert_eq!(response.status, 403, "Origin {origin}");
    }
    let cross = explorer.request(
        "POST",
        &start,
        &[("Sec-Fetch-Site", "cross-site"), json_type],
        b"{}",
    );
    assert_eq!(cross.status, 403);
    // `localhost` with our port is the same machine and passes.
    let local = format!("localhost:{}", explorer.port);
    let response = explorer.request("POST", &start, &[("Host", &local), json_type], b"{}");
    assert_eq!(response.status, 200);
}

#[test]
fn an_oversized_or_non_json_body_is_refused() {
    let explorer = Explorer::start("guitar-19edo");
    let plan = format!("{}api/plan", explorer.path);
    let huge = format!("{{\"instrument\": \"{}\"}}", "#".repeat(2 * 1024 * 1024));
    let response = explorer.request(
        "POST",
        &plan,
        &[("Content-Type", "application/json")],
        huge.as_bytes(),
    );
    assert_eq!(response.status, 413);
    assert!(error_of(&response.body)["message"]
        .as_str()
        .unwrap()
        .contains("larger than"));
    let form = explorer.request(
        "POST",
        &plan,
        &[("Content-Type", "application/x-www-form-urlencoded")],
        b"instrument=x",
    );
    assert_eq!(form.status, 415);
    let (status, body) = explorer.call("plan", &json!("not an object"));
    assert_eq!(status, 400);
    let error = error_of(&body);
    assert_eq!(error["origin"], "request");
    assert_eq!(error["line"], 1);
    let (status, body) = explorer.call("plan", &json!({"instrument": "name: x", "colour": 1}));
    assert_eq!(status, 400);
    assert!(error_of(&body)["message"]
        .as_str()
        .unwrap()
        .contains("colour"));
    let (status, _) = explorer.call("nothing-here", &json!({}));
    assert_eq!(status, 404);
}

#[test]
fn plan_answers_what_taut_plan_prints() {
    let explorer = Explorer::start("guitar-19edo");
    for (example, tuning) in [("guitar-19edo", "22edo"), ("lever-harp-34", "12edo@A4=432")] {
        let reply = explorer.ok(
            "plan",
            &json!({"instrument": example_text(example), "origin": format!("{example}.yaml"),
                    "tuning": tuning, "charts": true}),
        );
        let cli = cli_json(&["plan", example, "--tuning", tuning]);
        assert_eq!(reply["plan"], cli, "{example} in {tuning}");
        assert_eq!(
            reply["command"],
            format!("taut plan {example}.yaml --tuning {tuning}")
        );
        let names: Vec<&str> = reply["charts"]
            .as_array()
            .unwrap()
            .iter()
            .map(|c| c["name"].as_str().unwrap())
            .collect();
        assert_eq!(names, ["tension", "stress", "diameter"]);
        for chart in reply["charts"].as_array().unwrap() {
            roxmltree::Document::parse(chart["svg"].as_str().unwrap()).unwrap();
        }
        let needs = cli["warnings"]
            .as_array()
            .unwrap()
            .iter()
            .any(|w| w["severity"] == "caution" || w["severity"] == "danger");
        assert_eq!(!reply["cautions"].as_array().unwrap().is_empty(), needs);
    }
}

#[test]
fn bad_instruments_get_file_line_and_field() {
    let explorer = Explorer::start("guitar-19edo");
    let text = "name: x\nscale_length: 648mm\nsize: 3\ncourses: [{pitch: E4}]\n";
    let refusal = refused(
        &explorer,
        "plan",
        &json!({"instrument": text, "origin": "mine.yaml"}),
    );
    let error = refusal;
    assert_eq!(error["origin"], "mine.yaml");
    assert_eq!(error["line"], 3);
    assert_eq!(error["field"], "size");
    // The command line says the same of the same file.
    let folder = tempfile::tempdir().unwrap();
    let file = write_file(folder.path(), "mine.yaml", text);
    let output = taut().arg("plan").arg(&file).output().unwrap();
    assert_eq!(output.status.code(), Some(2));
    let stderr = String::from_utf8_lossy(&output.stderr);
    assert!(stderr.contains(":3:") && stderr.contains(error["message"].as_str().unwrap()));
    let read = explorer.ok("read", &json!({"yaml": text}));
    assert_eq!(read["error"]["line"], 3);
    assert!(read["document"].is_array());
    let broken = explorer.ok("read", &json!({"yaml": "name: [x\ncourses: 1\n"}));
    assert!(broken["document"].is_null());
    assert!(broken["error"]["line"].as_u64().is_some());
    // A tension option that does not read names its option.
    let refusal = refused(
        &explorer,
        "plan",
        &json!({"instrument": example_text("guitar-19edo"), "tension": "70"}),
    );
    assert_eq!(refusal["origin"], "--tension");
}

#[test]
fn the_form_round_trip_keeps_the_instrument() {
    let explorer = Explorer::start("guitar-19edo");
    let original = example_text("fanned-8-just");
    let read = explorer.ok("read", &json!({"yaml": original}));
    assert!(read["error"].is_null());
    let keys: Vec<&str> = read["document"]
        .as_array()
        .unwrap()
        .iter()
        .map(|e| e["k"].as_str().unwrap())
        .collect();
    assert_eq!(keys.first(), Some(&"name"), "key order kept");
    let written = explorer.ok("write", &json!({"document": read["document"]}));
    assert!(written["error"].is_null());
    let again = written["yaml"].as_str().unwrap();
    let before = explorer.ok("plan", &json!({"instrument": original}));
    let after = explorer.ok("plan", &json!({"instrument": again}));
    assert_eq!(before["plan"], after["plan"]);
    let refusal = refused(&explorer, "write", &json!({"document": {"name": "x"}}));
    assert_eq!(refusal["origin"], "document");
}

#[test]
fn tuning_frets_and_audit_answer_what_their_commands_print() {
    let explorer = Explorer::start("guitar-19edo");
    let listing = explorer.ok("tuning", &json!({"tuning": "19edo"}));
    assert_eq!(listing, cli_json(&["tuning", "show", "19edo"]));
    let refusal = refused(&explorer, "tuning", &json!({"tuning": "0edo"}));
    assert!(refusal["text"].as_str().unwrap().contains("0edo"));
    let frets = explorer.ok(
        "frets",
        &json!({"instrument": example_text("guitar-19edo")}),
    );
    assert_eq!(frets["layout"], cli_json(&["frets", "guitar-19edo"]));
    assert!(frets["drawing"]["frets"].as_array().unwrap().len() > 6);
    let folder = tempfile::tempdir().unwrap();
    for (what, name) in [("set-yaml", "set.yaml"), ("plan-json", "plan.json")] {
        let (status, bytes) = explorer.call(
            "export",
            &json!({"what": what, "plan": {"instrument": example_text("lever-harp-34"),
                    "origin": "lever-harp-34.yaml"}}),
        );
        assert_eq!(status, 200, "{what}");
        let set = String::from_utf8(bytes).unwrap();
        let file = write_file(folder.path(), name, &set);
        let audit = explorer.ok(
            "audit",
            &json!({"instrument": example_text("lever-harp-34"), "set": set, "set_origin": name}),
        );
        let cli = cli_json(&["audit", "lever-harp-34", "--set", file.to_str().unwrap()]);
        assert_eq!(audit, cli, "{what}");
        assert_eq!(audit["courses_ok"], 34);
    }
    let refusal = refused(
        &explorer,
        "audit",
        &json!({"instrument": example_text("lever-harp-34"), "set": "name: s\ncourses: 3\n",
                "set_origin": "strings.yaml"}),
    );
    let error = refusal;
    assert_eq!(error["origin"], "strings.yaml");
    assert_eq!(error["line"], 2);
}

#[test]
fn the_survey_map_agrees_with_taut_survey() {
    let explorer = Explorer::start("guitar-19edo");
    let request = json!({
        "instrument": example_text("fanned-8-fourths"), "origin": "fanned-8-fourths.yaml",
        "edos": {"from": 5, "to": 31}, "offsets": {"from": -100, "to": 100, "step": 25},
        "course_1": "E2", "courses": {"nearest_to": "4/3"},
    });
    let map = explorer.ok("survey", &request);
    let rows = map["rows"].as_array().unwrap();
    assert_eq!(rows.len(), 27);
    assert_eq!(map["offsets"].as_array().unwrap().len(), 9);
    let folder = tempfile::tempdir().unwrap();
    let settings = write_file(
        folder.path(),
        "settings.yaml",
        map["settings"].as_str().unwrap(),
    );
    let cli = cli_json(&["survey", "fanned-8-fourths", settings.to_str().unwrap()]);
    assert_eq!(cli["stringable"], map["stringable"]);
    let marked: usize = rows
        .iter()
        .map(|row| {
            row["verdicts"]
                .as_array()
                .unwrap()
                .iter()
                .filter(|v| v.as_u64() != Some(0))
                .count()
        })
        .sum();
    assert_eq!(marked as u64, cli["stringable"].as_u64().unwrap());
    for result in cli["results"].as_array().unwrap() {
        let offsets = map["offsets"].as_array().unwrap();
        let column = offsets
            .iter()
            .position(|o| {
                (o.as_f64().unwrap() - result["offset_cents"].as_f64().unwrap()).abs() < 1e-9
            })
            .unwrap();
        let row = rows
            .iter()
            .find(|row| row["tuning"] == result["tuning"])
            .unwrap();
        let expected = if result["verdict"] == "stringable" {
            2
        } else {
            1
        };
        assert_eq!(row["verdicts"][column], expected);
    }
    let mut too_big = request.clone();
    too_big["edos"] = json!({"from": 5, "to": 200});
    too_big["offsets"] = json!({"from": -600, "to": 600, "step": 1});
    let refusal = refused(&explorer, "survey", &too_big);
    assert!(refusal["message"].as_str().unwrap().contains("cells"));
}

#[test]
fn sound_gives_each_string_its_stiff_partials() {
    let explorer = Explorer::start("guitar-19edo");
    let instrument = example_text("guitar-19edo");
    let plan = cli_json(&["plan", "guitar-19edo"]);
    let reply = explorer.ok(
        "sound",
        &json!({"instrument": instrument, "play": "strum", "seconds": 2.0, "pluck": 0.2,
                "sample_rate_hz": 48000.0}),
    );
    let notes = reply["notes"].as_array().unwrap();
    assert_eq!(notes.len(), 6);
    let pitches: Vec<f64> = plan["courses"]
        .as_array()
        .unwrap()
        .iter()
        .map(|c| c["strings"][0]["pitch_hz"].as_f64().unwrap())
        .collect();
    for note in notes {
        let f1 = note["pitch_hz"].as_f64().unwrap();
        assert!(pitches.iter().any(|p| (p - f1).abs() < 1e-9 * p));
        let b = note["inharmonicity"].as_f64().unwrap();
        assert!(b > 0.0);
        let partials = note["partials"].as_array().unwrap();
        let first = &partials[0];
        assert!((first["hz"].as_f64().unwrap() - f1).abs() < 1e-9 * f1);
        for partial in partials {
            let n = partial["n"].as_f64().unwrap();
            // Fletcher's stiff string, f_n = n f0 sqrt(1 + B n^2) with f0 = f1 / sqrt(1 + B)
            // (REFERENCES §5.1).
            let expected = n * f1 / (1.0 + b).sqrt() * (1.0 + b * n * n).sqrt();
            approx::assert_relative_eq!(
                partial["hz"].as_f64().unwrap(),
                expected,
                max_relative = 1e-12
            );
            // The ideal pluck at beta: sin(n pi beta) / n^2 (Fletcher & Rossing, REFERENCES §11.1).
            let amplitude = (n * std::f64::consts::PI * 0.2).sin() / (n * n);
            approx::assert_relative_eq!(
                partial["amplitude"].as_f64().unwrap(),
                amplitude,
                max_relative = 1e-12
            );
            assert!(partial["hz"].as_f64().unwrap() < 0.45 * 48000.0);
        }
    }
    let refusal = refused(
        &explorer,
        "sound",
        &json!({"instrument": instrument, "play": "hum", "seconds": 2.0, "pluck": 0.2,
                "sample_rate_hz": 48000.0}),
    );
    assert_eq!(refusal["origin"], "--play");
}

#[test]
fn downloads_read_back_in_the_cli() {
    let explorer = Explorer::start("guitar-19edo");
    let plan = json!({"instrument": example_text("guitar-19edo"), "origin": "guitar-19edo.yaml",
                      "tuning": "22edo"});
    let folder = tempfile::tempdir().unwrap();
    for what in [
        "chart-png:stress",
        "chart-svg:tension",
        "string-chart-html",
        "string-chart-csv",
        "plan-csv",
    ] {
        let response = explorer.request(
            "POST",
            &format!("{}api/export", explorer.path),
            &[("Content-Type", "application/json")],
            &serde_json::to_vec(&json!({"what": what, "plan": plan})).unwrap(),
        );
        assert_eq!(response.status, 200, "{what}");
        assert!(response
            .header("content-disposition")
            .unwrap()
            .contains("guitar-19edo"));
        match what {
            "chart-png:stress" => assert!(response.body.starts_with(b"\x89PNG\r\n\x1a\n")),
            "chart-svg:tension" => {
                roxmltree::Document::parse(std::str::from_utf8(&response.body).unwrap()).unwrap();
            }
            "string-chart-html" => {
                let html = String::from_utf8(response.body.clone()).unwrap();
                assert!(html.contains("<svg") && !html.contains("<script"));
            }
            _ => {
                let text = String::from_utf8(response.body.clone()).unwrap();
                assert!(
                    text.lines().count() > 6,
                    "{what}: a header and a row per string"
                );
            }
        }
    }
    let (_, set) = explorer.call("export", &json!({"what": "set-yaml", "plan": plan}));
    let file = write_file(
        folder.path(),
        "set.yaml",
        std::str::from_utf8(&set).unwrap(),
    );
    let audit = cli_json(&[
        "audit",
        "guitar-19edo",
        "--set",
        file.to_str().unwrap(),
        "--tuning",
        "22edo",
    ]);
    assert_eq!(audit["courses"].as_array().unwrap().len(), 6);
    let refusal = refused(
        &explorer,
        "export",
        &json!({"what": "chart-png:pitch", "plan": plan}),
    );
    assert_eq!(refusal["origin"], "what");
}

#[test]
fn a_bad_instrument_on_the_command_line_stops_before_serving() {
    let folder = tempfile::tempdir().unwrap();
    let file = write_file(folder.path(), "bad.yaml", "name: x\ncourses: []\nsize: 1\n");
    let output = taut().arg("explore").arg(&file).output().unwrap();
    assert_eq!(output.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&output.stderr).contains("bad.yaml:"));
    assert!(output.stdout.is_empty());
}
