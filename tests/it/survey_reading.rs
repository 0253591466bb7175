//! The survey's size check counts the work of reading its tuning files as well as its
//! candidates: each file is read once however often the list names it, and a list that would
//! read too much is refused before any reading, at the settings file's line and field.

use crate::common::{bad_input, json, number, write_file};

/// A valid tuning file padded with comments to just under 4 MiB, the most a definition file
/// may hold.
fn big_tuning(folder: &std::path::Path, name: &str) -> u64 {
    let mut text = String::from("name: padded\ndescription: padded to 4 MiB\nratios: [1/1, 9/8, 5/4, 4/3, 3/2, 5/3, 15/8]\n");
    let pad = format!("# {}\n", "x".repeat(97));
    while text.len() + pad.len() < 4 * 1024 * 1024 - 16 {
        text.push_str(&pad);
    }
    write_file(folder, name, &text);
    text.len() as u64
}

fn settings(list: &[String]) -> String {
    let mut text = String::from("tunings:\n  list:\n");
    for entry in list {
        text.push_str(&format!("    - {entry}\n"));
    }
    text.push_str(
        "course_1: E2\noffset_cents: {from: -10, to: 10, step: 10}\ncourses: {nearest_to: 4/3}\n",
    );
    text
}

#[test]
fn two_thousand_references_to_one_big_file_read_it_once() {
    let folder = tempfile::tempdir().unwrap();
    big_tuning(folder.path(), "big.yaml");
    // Before: the file was read and parsed 2,000 times (8 GB of YAML, minutes).
    let list: Vec<String> = (0..2000)
        .map(|i| {
            if i % 2 == 0 {
                "big.yaml".to_string()
            } else {
                "./big.yaml".to_string()
            }
        })
        .collect();
    let path = write_file(folder.path(), "s.yaml", &settings(&list));
    let report = json(&[
        "survey",
        "examples/fanned-8-fourths.yaml",
        path.to_str().unwrap(),
    ]);
    assert_eq!(number(&report["candidates"]), 2000.0 * 3.0);
}

#[test]
fn too_many_bytes_of_tuning_files_are_refused_before_reading_with_file_line_and_field() {
    let folder = tempfile::tempdir().unwrap();
    let mut size = 0;
    for i in 0..10 {
        size = big_tuning(folder.path(), &format!("big{i}.yaml"));
    }
    let list: Vec<String> = (0..2000).map(|i| format!("big{}.yaml", i % 10)).collect();
    let path = write_file(folder.path(), "s.yaml", &settings(&list));
    let stderr = bad_input(&[
        "survey",
        "examples/fanned-8-fourths.yaml",
        path.to_str().unwrap(),
    ]);
    assert!(stderr.contains("s.yaml:2"), "{stderr}");
    assert!(stderr.contains("tunings.list"), "{stderr}");
    // Ten distinct files, each counted once, not 2,000 times.
    assert!(stderr.contains(&format!("{} bytes", 10 * size)), "{stderr}");
    assert!(stderr.contains("each file counted once"), "{stderr}");
}
