//! Every citation of the project's list of sources resolves: `REFERENCES §x.y` in any text file
//! that can cite (src, tests, tunings, examples, README.md, DEVELOPERS.md) names a section
//! heading of `src/references.rs`, every section there carries a provenance tag, and no older
//! form (a file name with an extension, a second sheet, a citation split across lines) remains.

use std::collections::BTreeSet;
use std::fs;
use std::path::{Path, PathBuf};

/// The citation word, spelt in two halves so that this file's own examples are not citations.
const WORD: &str = concat!("REFER", "ENCES");

/// The provenance tags of the page (see its head).
const TAGS: [&str; 4] = [
    "**read**",
    "**derived**",
    "**common practice**",
    "**from memory**",
];

/// Folders and files that may cite, relative to the crate root.
const CITING: [&str; 6] = [
    "src",
    "tests",
    "tunings",
    "examples",
    "README.md",
    "DEVELOPERS.md",
];

fn root() -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR"))
}

fn page() -> String {
    fs::read_to_string(root().join("src/references.rs")).unwrap()
}

/// A numbered heading of the page, `//! ## 6 …` or `//! ### 6.2 …`: its number and line index.
fn heading(line: &str) -> Option<String> {
    let text = line.strip_prefix("//!")?.trim_start();
    let rest = text.trim_start_matches('#');
    if rest.len() == text.len() || !rest.starts_with(' ') {
        return None;
    }
    let number = rest.trim_start().split(' ').next()?;
    let well_formed = !number.is_empty()
        && number
            .split('.')
            .all(|part| !part.is_empty() && part.bytes().all(|b| b.is_ascii_digit()));
    well_formed.then(|| number.to_string())
}

/// The section numbers of the page.
fn sections(page: &str) -> BTreeSet<String> {
    page.lines().filter_map(heading).collect()
}

/// Reads a section number (`6`, `6.2`) at the start of `text`; a trailing full stop is not part
/// of it. Returns the number and its length in bytes.
fn section_number(text: &str) -> Option<(&str, usize)> {
    let bytes = text.as_bytes();
    let mut end = 0;
    loop {
        let start = end;
        while end < bytes.len() && bytes[end].is_ascii_digit() {
            end += 1;
        }
        if end == start {
            return None;
        }
        if end + 1 < bytes.len() && bytes[end] == b'.' && bytes[end + 1].is_ascii_digit() {
            end += 1;
        } else {
            return Some((&text[..end], end));
        }
    }
}

/// The sections one citation names: `§6.1`, then any `, §6.2`, ` and §6.3`, ` to §7` that
/// follow. `None` when `after` (the text just after the citation word) is not ` §<number>`.
fn cited_sections(after: &str) -> Option<Vec<&str>> {
    let mut rest = after.strip_prefix(" §")?;
    // The form itself, as documentation spells it out.
    if rest.starts_with("x.y") {
        return Some(Vec::new());
    }
    let (first, len) = section_number(rest)?;
    let mut found = vec![first];
    rest = &rest[len..];
    loop {
        let Some(next) = [", §", " and §", " to §", "–§"]
            .iter()
            .find_map(|separator| rest.strip_prefix(separator))
        else {
            return Some(found);
        };
        let Some((number, len)) = section_number(next) else {
            return Some(found);
        };
        found.push(number);
        rest = &next[len..];
    }
}

/// Every citation problem in one file's text, as `name:line: message`.
fn check_text(name: &str, text: &str, known: &BTreeSet<String>) -> Vec<String> {
    let mut problems = Vec::new();
    for (index, line) in text.lines().enumerate() {
        let mut from = 0;
        while let Some(at) = line[from..].find(WORD) {
            let start = from + at;
            let end = start + WORD.len();
            from = end;
            let glued = |c: Option<char>| c.is_some_and(|c| c.is_alphanumeric() || c == '_');
            if glued(line[..start].chars().next_back()) || glued(line[end..].chars().next()) {
                continue;
            }
            let place = format!("{name}:{}", index + 1);
            match cited_sections(&line[end..]) {
                None => problems.push(format!(
                    "{place}: `{}` is not a citation of the form `{WORD} §x.y` \
                     (section number on the same line, src/references.rs the only list)",
                    line[start..].chars().take(24).collect::<String>()
                )),
                Some(numbers) => {
                    for number in numbers {
                        if !known.contains(number) {
                            problems.push(format!(
                                "{place}: {WORD} §{number} has no heading in src/references.rs"
                            ));
                        }
                    }
                }
            }
        }
    }
    problems
}

/// Sections of the page without a provenance tag. A section with subsections carries its tags
/// in them; every other section must name at least one tag in its text.
fn untagged_sections(page: &str) -> Vec<String> {
    let lines: Vec<&str> = page.lines().collect();
    let headings: Vec<(usize, String)> = lines
        .iter()
        .enumerate()
        .filter_map(|(index, line)| heading(line).map(|number| (index, number)))
        .collect();
    let mut untagged = Vec::new();
    for (position, (index, number)) in headings.iter().enumerate() {
        let next = headings.get(position + 1);
        if next.is_some_and(|(_, child)| child.starts_with(&format!("{number}."))) {
            continue;
        }
        let end = next.map_or(lines.len(), |(next_index, _)| *next_index);
        let body = lines[index + 1..end].join("\n");
        if !TAGS.iter().any(|tag| body.contains(tag)) {
            untagged.push(format!("§{number} (src/references.rs:{})", index + 1));
        }
    }
    untagged
}

fn text_files(path: &Path, files: &mut Vec<PathBuf>) {
    if path.is_dir() {
        let mut entries: Vec<PathBuf> = fs::read_dir(path)
            .unwrap()
            .map(|entry| entry.unwrap().path())
            .collect();
        entries.sort();
        for entry in entries {
            text_files(&entry, files);
        }
    } else if path.is_file() {
        files.push(path.to_path_buf());
    }
}

#[test]
fn every_citation_names_a_section_of_the_page() {
    let known = sections(&page());
    let root = root();
    let mut files = Vec::new();
    for place in CITING {
        text_files(&root.join(place), &mut files);
    }
    let mut problems = Vec::new();
    let mut citations = 0;
    for file in &files {
        // Pictures and other binary files cannot cite.
        let Ok(text) = fs::read_to_string(file) else {
            continue;
        };
        let name = file.strip_prefix(&root).unwrap().display().to_string();
        citations += text.matches(WORD).count();
        problems.extend(check_text(&name, &text, &known));
    }
    assert!(
        problems.is_empty(),
        "{} citation problem(s):\n{}",
        problems.len(),
        problems.join("\n")
    );
    // The walk really reached the cited files (over a hundred citations at the time of writing).
    assert!(citations > 100, "only {citations} citations found");
}

#[test]
fn every_section_of_the_page_has_a_provenance_tag() {
    let untagged = untagged_sections(&page());
    assert!(
        untagged.is_empty(),
        "sections without a provenance tag: {}",
        untagged.join(", ")
    );
}

#[test]
fn every_subsection_of_the_page_has_its_parent() {
    let known = sections(&page());
    assert!(known.contains("1") && known.contains("1.1"), "{known:?}");
    for number in &known {
        if let Some((parent, _)) = number.rsplit_once('.') {
            assert!(known.contains(parent), "§{number} has no §{parent}");
        }
    }
}

#[test]
fn a_made_up_section_is_reported_missing() {
    let known = sections(&page());
    let text = format!("ok\n// Tension (T = μ(2Lf)², {WORD} §1.2, DERIVED; {WORD} §99.9).\n");
    let problems = check_text("made-up.rs", &text, &known);
    assert_eq!(problems.len(), 1, "{problems:?}");
    assert!(problems[0].starts_with("made-up.rs:2: "), "{problems:?}");
    assert!(problems[0].contains("§99.9"), "{problems:?}");
}

#[test]
fn every_section_of_a_list_is_checked() {
    let known = sections(&page());
    let good =
        format!("{WORD} §6.1 and §6.2, DERIVED from §1.1; {WORD} §2, §3 and §4; `{WORD} §x.y`.\n");
    assert!(check_text("good.rs", &good, &known).is_empty());
    let bad = format!("{WORD} §6.1, §6.9 and §1.2 to §42.\n");
    let problems = check_text("bad.rs", &bad, &known);
    assert_eq!(problems.len(), 2, "{problems:?}");
    assert!(problems[0].contains("§6.9") && problems[1].contains("§42"));
}

#[test]
fn older_citation_forms_are_reported() {
    let known = sections(&page());
    for stale in [
        format!("(`{WORD}.md` §1.2)"),
        format!("({WORD}.md §1)"),
        format!("({WORD}-2 §6.1, READ-R)"),
        format!("the section of {WORD} that collects them"),
        format!("measured by Woodhouse ({WORD}\n/// §6.1)"),
    ] {
        let problems = check_text("stale.rs", &stale, &known);
        assert_eq!(problems.len(), 1, "{stale}: {problems:?}");
        assert!(problems[0].starts_with("stale.rs:1: "), "{problems:?}");
    }
}

#[test]
fn a_section_without_a_tag_is_reported() {
    let page = "//! ## 1 One\n//!\n//! ### 1.1 Tagged\n//! - *Provenance:* **read**.\n\
                //! ### 1.2 Untagged\n//! - *Provenance:* none.\n//! ## 2 Alone\n//! **derived**\n";
    assert_eq!(untagged_sections(page), ["§1.2 (src/references.rs:5)"]);
}
