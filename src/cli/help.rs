//! `taut help`: clap's help for a subcommand (`taut help plan`, `taut help tuning show`), or a
//! reference topic (`taut help instrument-file`; `taut help topics` lists them). It replaces
//! clap's own help subcommand, forwarding to it for subcommand names.

use clap::{Args, CommandFactory};

use taut::error::{did_you_mean, Error, Result};

use super::{output, topics};

/// Arguments of `taut help`.
#[derive(Debug, Args)]
#[command(
    about = "Print the help of a subcommand, or a reference topic (`taut help topics` lists them)",
    after_help = "Examples: `taut help plan`, `taut help tuning show`, `taut help topics`, `taut help instrument-file`, `taut help exit-codes`."
)]
pub struct HelpArgs {
    /// A subcommand (and its subcommands), `topics`, or a topic's name.
    #[arg(value_name = "SUBCOMMAND|TOPIC")]
    names: Vec<String>,
}

/// The word that lists the topics.
const TOPICS_WORD: &str = "topics";

/// Runs `taut help`.
pub fn run(args: &HelpArgs) -> Result<()> {
    let text = text_for(&args.names)?;
    output::write_bytes(
        output::STANDARD_OUTPUT_ONLY,
        None,
        text.into_bytes(),
        &output::Inputs::new(),
    )
}

/// What `taut help NAMES…` prints.
fn text_for(names: &[String]) -> Result<String> {
    let mut command = super::Cli::command();
    command.build();
    let Some((first, rest)) = names.split_first() else {
        return subcommand_help(&command, names);
    };
    if command.find_subcommand(first).is_some() {
        return subcommand_help(&command, names);
    }
    if !rest.is_empty() {
        return Err(unknown(first, &command).help(format!(
            "a topic takes no further words; `taut help {TOPICS_WORD}` lists the topics"
        )));
    }
    if first == TOPICS_WORD {
        return Ok(topics::list());
    }
    match topics::find(first) {
        Some(topic) => Ok(topic.text.to_string()),
        None => Err(unknown(first, &command)),
    }
}

/// The help of the subcommand `names` leads to, exactly as `taut NAMES… --help` prints it.
fn subcommand_help(root: &clap::Command, names: &[String]) -> Result<String> {
    let mut command = root;
    let mut path = String::from("taut");
    for name in names {
        let Some(sub) = command.find_subcommand(name) else {
            let known: Vec<&str> = command.get_subcommands().map(|s| s.get_name()).collect();
            let error =
                Error::input(format!("`{path}` has no subcommand `{name}`")).in_origin("taut help");
            return Err(match did_you_mean(name, known.iter().copied()) {
                Some(near) => error.help(format!("did you mean `{near}`?")),
                None => error.help(format!("its subcommands: {}", known.join(", "))),
            });
        };
        path = format!("{path} {}", sub.get_name());
        command = sub;
    }
    // Clap decides between its short and long layout; ask it the way `--help` does.
    let args = std::iter::once("taut")
        .chain(names.iter().map(String::as_str))
        .chain(["--help"]);
    match root.clone().try_get_matches_from(args) {
        Err(help) => Ok(help.render().to_string()),
        Ok(_) => Ok(command.clone().render_long_help().to_string()),
    }
}

/// The error for a word that names neither a subcommand nor a topic.
fn unknown(word: &str, root: &clap::Command) -> Error {
    let subcommands = root.get_subcommands().map(|s| s.get_name());
    let names: Vec<&str> = subcommands
        .chain(topics::TOPICS.iter().map(|t| t.name))
        .chain([TOPICS_WORD])
        .collect();
    let error = Error::input(format!("`{word}` is neither a subcommand nor a help topic"))
        .in_origin("taut help");
    match did_you_mean(word, names.iter().copied()) {
        Some(near) => error.help(format!(
            "did you mean `{near}`? `taut help {TOPICS_WORD}` lists the topics"
        )),
        None => error.help(format!("`taut help {TOPICS_WORD}` lists the topics")),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn words(text: &str) -> Vec<String> {
        text.split_whitespace().map(str::to_string).collect()
    }

    #[test]
    fn subcommands_topics_and_the_list() {
        assert!(text_for(&words("plan")).unwrap().contains("--tuning"));
        assert!(text_for(&words("tuning show"))
            .unwrap()
            .contains("Usage: taut tuning show"));
        assert!(text_for(&words("topics")).unwrap().contains("exit-codes"));
        assert!(text_for(&words("exit-codes"))
            .unwrap()
            .contains("bad input"));
        assert!(text_for(&[]).unwrap().contains("Usage: taut"));
    }

    #[test]
    fn unknown_words_are_bad_input_with_a_suggestion() {
        let error = text_for(&words("exit-code")).unwrap_err();
        assert_eq!(error.exit_code(), taut::error::EXIT_BAD_INPUT);
        assert!(error.to_string().contains("`exit-codes`"), "{error}");
        let error = text_for(&words("tuning shwo")).unwrap_err();
        assert!(error.to_string().contains("`show`"), "{error}");
        assert!(text_for(&words("exit-codes plan")).is_err());
    }
}
