//! Reference topics: the long lists (every file field, option rule, exit code and range) kept in
//! one place, printed by `taut help TOPIC` and appended to the manual page. Each text is a file in
//! `src/cli/topics/`, plain text wrapped at 100 columns; README links to them by name.

/// One reference topic.
#[derive(Debug, Clone, Copy)]
pub struct Topic {
    /// The name `taut help` takes.
    pub name: &'static str,
    /// One line for the list of topics.
    pub summary: &'static str,
    /// The text, ending in a line break.
    pub text: &'static str,
}

macro_rules! topic {
    ($name:literal, $summary:literal) => {
        Topic {
            name: $name,
            summary: $summary,
            text: include_str!(concat!("topics/", $name, ".txt")),
        }
    };
}

/// Every topic, in the order `taut help topics` lists them.
pub const TOPICS: &[Topic] = &[
    topic!(
        "instrument-file",
        "every field of an instrument file, with an example"
    ),
    topic!(
        "stock-file",
        "your own materials, gauge catalogs and string kinds (--stock)"
    ),
    topic!(
        "set-file",
        "string-set files: the strings on an instrument now"
    ),
    topic!(
        "layout-file",
        "layout files for `taut lengths`, and how lengths are smoothed"
    ),
    topic!(
        "survey-file",
        "settings files for `taut survey`, and how candidates are ranked"
    ),
    topic!(
        "tunings",
        "tuning specs, references, tuning files and the forms of a pitch"
    ),
    topic!(
        "choice",
        "how a string is chosen, for one tuning or several"
    ),
    topic!(
        "warnings",
        "every warning kind: when it fires, its severity and its fix"
    ),
    topic!(
        "feel",
        "stiffness, partials, bends, and what a conversion keeps"
    ),
    topic!(
        "fretboards",
        "which frets, partial frets, fanned boards, the SVG template"
    ),
    topic!(
        "reports",
        "reading a table: status words, columns, width and colour"
    ),
    topic!(
        "formats",
        "JSON, YAML and CSV: field names and each report's document"
    ),
    topic!(
        "charts",
        "the charts each command draws (--plot) and the builder's string chart"
    ),
    topic!(
        "order-sheet",
        "the sheet a string maker makes the strings from (--order-sheet)"
    ),
    topic!(
        "comparisons",
        "`taut compare`: two plans or sets side by side, and its fields"
    ),
    topic!(
        "sound",
        "hearing the strings (--sound) and tunings out through MIDI"
    ),
    topic!(
        "output-files",
        "where output goes: --output, --save-set and standard output"
    ),
    topic!(
        "input-files",
        "how files are read: units, YAML features, text shown escaped"
    ),
    topic!(
        "explorer",
        "the local page of `taut explore`: what it shows, its API and its guard"
    ),
    topic!("ranges", "the plausible range of every quantity, and why"),
    topic!("exit-codes", "what each exit code means"),
];

/// The topic called `name`.
pub fn find(name: &str) -> Option<&'static Topic> {
    TOPICS.iter().find(|topic| topic.name == name)
}

/// The list `taut help topics` prints.
pub fn list() -> String {
    let width = TOPICS.iter().map(|t| t.name.len()).max().unwrap_or(0);
    let mut text = String::from("Reference topics (`taut help TOPIC` prints one):\n");
    for topic in TOPICS {
        text.push_str(&format!("  {:width$}  {}\n", topic.name, topic.summary));
    }
    text
}

/// Every topic as sections of a manual page (roff), each kept as written (no filling).
pub fn roff_sections() -> String {
    let mut roff = String::new();
    for topic in TOPICS {
        roff.push_str(&format!(".SH \"TOPIC: {}\"\n", topic.name.to_uppercase()));
        roff.push_str(&format!(
            "{}\n(`taut help {}`)\n.PP\n.nf\n",
            topic.summary, topic.name
        ));
        for line in topic.text.lines() {
            roff.push_str(&roff_line(line));
            roff.push('\n');
        }
        roff.push_str(".fi\n");
    }
    roff
}

/// One line of text as roff: backslashes escaped, minus signs kept, and a leading `.` or `'`
/// (which roff would read as a request) guarded.
fn roff_line(line: &str) -> String {
    let escaped = line.replace('\\', "\\e").replace('-', "\\-");
    if escaped.starts_with('.') || escaped.starts_with('\'') {
        format!("\\&{escaped}")
    } else {
        escaped
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn names_are_unique_and_texts_end_in_a_line_break() {
        for (n, topic) in TOPICS.iter().enumerate() {
            assert!(
                TOPICS[..n].iter().all(|t| t.name != topic.name),
                "{}",
                topic.name
            );
            assert!(topic.text.ends_with('\n'), "{}", topic.name);
        }
    }

    #[test]
    fn no_topic_is_named_like_a_subcommand() {
        use clap::CommandFactory;
        let command = super::super::Cli::command();
        for topic in TOPICS {
            assert!(
                command.find_subcommand(topic.name).is_none(),
                "{}",
                topic.name
            );
        }
    }

    #[test]
    fn roff_guards_requests_and_backslashes() {
        assert_eq!(roff_line(".x"), "\\&.x");
        assert_eq!(roff_line("a\\b"), "a\\eb");
        assert_eq!(roff_line("'q"), "\\&'q");
    }
}
