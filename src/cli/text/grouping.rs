//! Warnings that say the same thing, gathered into one line of the terminal text ("Courses 1–6,
//! string 1: …"). Only the terminal text groups: JSON, CSV and YAML keep one warning per course
//! or string.
//!
//! The rule: two warnings group when they are of the same kind and severity, name a course (and
//! perhaps a string) at the start of their sentence, and the rest of their sentences read the
//! same once their figures are set aside. Where the figures differ, the grouped line gives each
//! figure's range (`0.076–0.330 mm`). A danger groups only with dangers whose sentences are
//! identical, figures and all, so grouping never hides a danger's figure, and never changes a
//! severity.

use std::collections::HashMap;

/// One warning as the grouping sees it.
#[derive(Debug, Clone)]
pub struct Item<'a> {
    /// What must be equal for two warnings to group besides their sentence: kind and severity.
    pub key: &'a str,
    /// Whether differing figures may be shown as ranges (false for dangers).
    pub ranges: bool,
    /// The whole sentence, shown as it is when the warning stays alone.
    pub message: &'a str,
    /// The course the warning is about, when its sentence starts by naming it.
    pub course: Option<u32>,
    /// The string within the course, when the sentence names one.
    pub string: Option<usize>,
}

/// A line of the grouped list: its text and the warnings it stands for (indices into the items).
#[derive(Debug, Clone, PartialEq)]
pub struct Line {
    /// The sentence to show.
    pub text: String,
    /// The items it stands for.
    pub members: Vec<usize>,
}

/// The subject a sentence starts with (`[A] Course 3 string 2`, `course 3:`), split from the
/// rest: the tag before it, and the rest after it.
fn split_subject<'m>(item: &Item<'m>) -> Option<(&'m str, &'m str)> {
    let course = item.course?;
    let message = item.message;
    // A tag such as `[A] ` (the tuning of a several-tuning report) stays in front.
    let (tag, rest) = match message.strip_prefix('[') {
        Some(after) => {
            let end = after.find("] ")?;
            message.split_at(end + 3)
        }
        None => ("", message),
    };
    let rest = rest
        .strip_prefix("Course ")
        .or_else(|| rest.strip_prefix("course "))?;
    let number = course.to_string();
    let mut rest = rest.strip_prefix(number.as_str())?;
    if let Some(string) = item.string {
        let named = format!(" string {string}");
        rest = rest.strip_prefix(named.as_str())?;
    }
    if rest.starts_with(|c: char| c.is_ascii_digit()) {
        return None;
    }
    let rest = rest.strip_prefix(':').unwrap_or(rest).trim_start();
    (!rest.is_empty()).then_some((tag, rest))
}

/// A sentence cut into text and figures: `0.076 mm wider` → `["", " mm wider"]`, `["0.076"]`.
fn figures(text: &str) -> (Vec<&str>, Vec<&str>) {
    let bytes = text.as_bytes();
    let mut words = Vec::new();
    let mut numbers = Vec::new();
    let mut start = 0;
    let mut at = 0;
    while at < bytes.len() {
        let signed = matches!(bytes[at], b'+' | b'-')
            && bytes.get(at + 1).is_some_and(u8::is_ascii_digit)
            && (at == 0 || !bytes[at - 1].is_ascii_alphanumeric());
        let begins = bytes[at].is_ascii_digit() || signed;
        // A digit inside a word (`12edo`, `A4`) is part of the word.
        let inside_word = at > 0 && (bytes[at - 1].is_ascii_alphabetic() || bytes[at - 1] == b'_');
        if begins && !inside_word {
            let number_start = at;
            at += 1;
            while at < bytes.len()
                && (bytes[at].is_ascii_digit()
                    || (bytes[at] == b'.' && bytes.get(at + 1).is_some_and(u8::is_ascii_digit)))
            {
                at += 1;
            }
            words.push(&text[start..number_start]);
            numbers.push(&text[number_start..at]);
            start = at;
        } else {
            at += 1;
        }
    }
    words.push(&text[start..]);
    (words, numbers)
}

/// Numbers as a list a person reads: `1–3, 5, 7–8`.
pub fn number_ranges(numbers: &[u64]) -> String {
    let mut sorted = numbers.to_vec();
    sorted.sort_unstable();
    sorted.dedup();
    let mut parts: Vec<String> = Vec::new();
    let mut index = 0;
    while index < sorted.len() {
        let first = sorted[index];
        let mut last = first;
        while index + 1 < sorted.len() && sorted[index + 1] == last + 1 {
            index += 1;
            last = sorted[index];
        }
        parts.push(match last - first {
            0 => first.to_string(),
            1 => format!("{first}, {last}"),
            _ => format!("{first}–{last}"),
        });
        index += 1;
    }
    parts.join(", ")
}

/// The label of a group: its tag, then the courses and strings it covers.
fn label(tag: &str, courses: &[u64], strings: &[u64]) -> String {
    let mut courses = courses.to_vec();
    courses.sort_unstable();
    courses.dedup();
    let mut text = String::from(tag);
    text.push_str(if courses.len() == 1 {
        "Course "
    } else {
        "Courses "
    });
    text.push_str(&number_ranges(&courses));
    let mut strings = strings.to_vec();
    strings.sort_unstable();
    strings.dedup();
    if !strings.is_empty() {
        text.push_str(if strings.len() == 1 {
            ", string "
        } else {
            ", strings "
        });
        text.push_str(&number_ranges(&strings));
    }
    text
}

/// The figure at one place of a group's sentence: the one value, or the range from the least
/// to the greatest as each member wrote it.
fn merged_figure(values: &[&str]) -> String {
    let parsed: Vec<(f64, &str)> = values
        .iter()
        .map(|text| (text.parse::<f64>().unwrap_or(0.0), *text))
        .collect();
    let least = parsed.iter().min_by(|a, b| a.0.total_cmp(&b.0));
    let most = parsed.iter().max_by(|a, b| a.0.total_cmp(&b.0));
    match (least, most) {
        (Some(least), Some(most)) if least.1 != most.1 => format!("{} to {}", least.1, most.1),
        (Some(least), _) => least.1.to_string(),
        _ => String::new(),
    }
}

/// Gathers the warnings that say the same thing into one line each, in the order each group's
/// first warning came. A warning that names no course, or whose sentence is unlike any other,
/// keeps its own line and its own words.
pub fn group(items: &[Item<'_>]) -> Vec<Line> {
    // Groups by kind, severity, tag, strings-or-not and the sentence with its figures set
    // aside (or the whole sentence, figures and all, where ranges are not allowed).
    let mut groups: Vec<(Vec<usize>, Option<&str>)> = Vec::new();
    let mut index_of: HashMap<(String, String), usize> = HashMap::new();
    for (index, item) in items.iter().enumerate() {
        let Some((tag, rest)) = split_subject(item) else {
            groups.push((vec![index], None));
            continue;
        };
        let shape = if item.ranges {
            figures(rest).0.join("#")
        } else {
            rest.to_string()
        };
        let key = (
            format!("{}\u{0}{tag}\u{0}{}", item.key, item.string.is_some()),
            shape,
        );
        match index_of.get(&key) {
            Some(&at) => groups[at].0.push(index),
            None => {
                index_of.insert(key, groups.len());
                groups.push((vec![index], Some(tag)));
            }
        }
    }
    let mut lines = Vec::with_capacity(groups.len());
    for (members, tag) in groups {
        let (Some(tag), true) = (tag, members.len() > 1) else {
            for &member in &members {
                lines.push(Line {
                    text: items[member].message.to_string(),
                    members: vec![member],
                });
            }
            continue;
        };
        // A group whose courses and strings are not every pairing of each other is split by
        // string, so a label never claims a string that has no warning.
        let courses: Vec<u64> = members
            .iter()
            .filter_map(|&m| items[m].course.map(u64::from))
            .collect();
        let strings: Vec<u64> = members
            .iter()
            .filter_map(|&m| items[m].string.map(|s| s as u64))
            .collect();
        let mut distinct_courses = courses.clone();
        distinct_courses.sort_unstable();
        distinct_courses.dedup();
        let mut distinct_strings = strings.clone();
        distinct_strings.sort_unstable();
        distinct_strings.dedup();
        let every_pairing =
            strings.is_empty() || distinct_courses.len() * distinct_strings.len() == members.len();
        let parts: Vec<Vec<usize>> = if every_pairing {
            vec![members]
        } else {
            distinct_strings
                .iter()
                .map(|&s| {
                    members
                        .iter()
                        .copied()
                        .filter(|&m| items[m].string.map(|x| x as u64) == Some(s))
                        .collect()
                })
                .collect()
        };
        for part in parts {
            if part.len() == 1 {
                lines.push(Line {
                    text: items[part[0]].message.to_string(),
                    members: part,
                });
                continue;
            }
            let courses: Vec<u64> = part
                .iter()
                .filter_map(|&m| items[m].course.map(u64::from))
                .collect();
            let strings: Vec<u64> = part
                .iter()
                .filter_map(|&m| items[m].string.map(|s| s as u64))
                .collect();
            let rests: Vec<&str> = part
                .iter()
                .filter_map(|&m| split_subject(&items[m]).map(|(_, rest)| rest))
                .collect();
            let cut: Vec<(Vec<&str>, Vec<&str>)> = rests.iter().map(|rest| figures(rest)).collect();
            let mut text = label(tag, &courses, &strings);
            // Follow the sentence's own case (`course 3:` in the fret warnings).
            let lower = items[part[0]].message[tag.len()..].starts_with('c');
            if lower {
                text.replace_range(tag.len()..tag.len() + 1, "c");
            }
            text.push_str(": ");
            if let Some((words, numbers)) = cut.first() {
                for (place, word) in words.iter().enumerate() {
                    text.push_str(word);
                    if place < numbers.len() {
                        let values: Vec<&str> = cut
                            .iter()
                            .filter_map(|(_, numbers)| numbers.get(place).copied())
                            .collect();
                        text.push_str(&merged_figure(&values));
                    }
                }
            }
            lines.push(Line {
                text,
                members: part,
            });
        }
    }
    lines
}

#[cfg(test)]
mod tests {
    use super::*;

    fn item<'a>(message: &'a str, course: u32, string: Option<usize>) -> Item<'a> {
        Item {
            key: "wider_than_slot note",
            ranges: true,
            message,
            course: Some(course),
            string,
        }
    }

    #[test]
    fn same_sentences_with_other_figures_become_one_line_with_ranges() {
        let a = "Course 1 string 1: the new string is 0.076 mm wider than the old one (0.305 mm).";
        let b = "Course 2 string 1: the new string is 0.330 mm wider than the old one (1.346 mm).";
        let c = "Course 3 string 1: the new string is 0.102 mm wider than the old one (0.406 mm).";
        let lines = group(&[
            item(a, 1, Some(1)),
            item(b, 2, Some(1)),
            item(c, 3, Some(1)),
        ]);
        assert_eq!(lines.len(), 1, "{lines:?}");
        assert_eq!(
            lines[0].text,
            "Courses 1–3, string 1: the new string is 0.076 to 0.330 mm wider than the old one (0.305 to 1.346 mm)."
        );
        assert_eq!(lines[0].members, vec![0, 1, 2]);
    }

    #[test]
    fn dangers_group_only_when_identical_and_others_stay_alone() {
        let danger = |message, course| Item {
            key: "stress danger",
            ranges: false,
            message,
            course: Some(course),
            string: Some(1),
        };
        let lines = group(&[
            danger("Course 1 string 1 runs at 95% of its breaking strength.", 1),
            danger("Course 2 string 1 runs at 97% of its breaking strength.", 2),
            danger("Course 3 string 1 runs at 97% of its breaking strength.", 3),
        ]);
        assert_eq!(lines.len(), 2, "{lines:?}");
        assert_eq!(
            lines[0].text,
            "Course 1 string 1 runs at 95% of its breaking strength."
        );
        assert_eq!(
            lines[1].text,
            "Courses 2, 3, string 1: runs at 97% of its breaking strength."
        );
        let whole = Item {
            key: "load",
            ranges: true,
            message: "The total load is 900 N.",
            course: None,
            string: None,
        };
        assert_eq!(group(std::slice::from_ref(&whole))[0].text, whole.message);
    }

    #[test]
    fn both_strings_of_a_pair_read_as_one_line_and_tags_stay_in_front() {
        let a = "[A] Course 2 string 1 runs at 69% of its breaking strength.";
        let b = "[A] Course 2 string 2 runs at 69% of its breaking strength.";
        let c = "[B] Course 2 string 1 runs at 69% of its breaking strength.";
        let lines = group(&[
            item(a, 2, Some(1)),
            item(b, 2, Some(2)),
            item(c, 2, Some(1)),
        ]);
        assert_eq!(lines.len(), 2, "{lines:?}");
        assert_eq!(
            lines[0].text,
            "[A] Course 2, strings 1, 2: runs at 69% of its breaking strength."
        );
        assert_eq!(lines[1].text, c);
        assert_eq!(number_ranges(&[7, 1, 2, 3, 5, 9, 10]), "1–3, 5, 7, 9, 10");
    }
}
