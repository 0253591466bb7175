//! Command-line layer: argument parsing (clap), rendering and exit codes. Nothing below this
//! layer sees clap.

mod audit;
mod compare;
mod convert;
mod explore;
mod frets;
mod generate;
mod help;
mod layout;
mod lengths;
mod order;
mod output;
mod pictures;
mod plan;
mod sound;
mod stock;
mod survey;
mod text;
mod topics;
mod tuning;

use std::process::ExitCode;

use clap::{Parser, Subcommand};

/// Plan strings for any tuning on any instrument.
#[derive(Debug, Parser)]
#[command(
    name = "taut",
    version,
    about,
    long_about = None,
    disable_help_subcommand = true,
    after_help = "Reference: `taut help topics` lists the topics (every field of each file, the warnings, \
                  the output formats, the exit codes, …); `taut help TOPIC` prints one."
)]
pub struct Cli {
    #[command(subcommand)]
    command: Command,
}

#[derive(Debug, Subcommand)]
enum Command {
    /// Choose a string for every course of an instrument in a tuning.
    Plan(plan::PlanArgs),
    /// Work with tunings: list degrees, fit just intervals, compare, resolve pitches.
    Tuning(tuning::TuningArgs),
    /// Check an installed string set under a tuning, with a yes or no per course.
    Audit(audit::AuditArgs),
    /// Plan the strings for a new tuning or scale length from the set installed now.
    Convert(convert::ConvertArgs),
    /// Put two plans, two sets, or a plan and a set side by side, string by string.
    Compare(compare::CompareArgs),
    /// Solve vibrating lengths from pitch, string and tension, for builders.
    Lengths(lengths::LengthsArgs),
    /// Lay out frets for any tuning, straight or fanned, per course; table, JSON, CSV or SVG.
    Frets(frets::FretsArgs),
    /// Search tunings, offsets and course patterns for stringable settings, ranked.
    Survey(survey::SurveyArgs),
    /// Try tunings, strings and lengths live in a local page in your browser.
    Explore(explore::ExploreArgs),
    /// Make shell completions or the manual pages from this command line.
    Generate(generate::GenerateArgs),
    /// Print the help of a subcommand, or a reference topic (`taut help topics` lists them).
    Help(help::HelpArgs),
}

/// Parses an optional option value, naming the option in errors.
pub(crate) fn parse_flag<T>(value: Option<&str>, flag: &str) -> taut::Result<Option<T>>
where
    T: std::str::FromStr<Err = taut::Error>,
{
    value
        .map(|text| text.parse::<T>().map_err(|err| err.in_origin(flag)))
        .transpose()
}

/// Runs the command line and returns the process exit code.
pub fn main() -> ExitCode {
    // Before anything opens a file, which could take over a closed descriptor 1.
    output::note_standard_output();
    // A run stopped by SIGINT or SIGTERM takes back its half-written files.
    output::watch_signals();
    let cli = Cli::parse();
    let result = match cli.command {
        Command::Plan(args) => plan::run(&args),
        Command::Tuning(args) => tuning::run(args),
        Command::Audit(args) => audit::run(args),
        Command::Convert(args) => convert::run(args),
        Command::Compare(args) => compare::run(&args),
        Command::Lengths(args) => lengths::run(args),
        Command::Frets(args) => frets::run(&args),
        Command::Survey(args) => survey::run(&args),
        Command::Explore(args) => explore::run(&args),
        Command::Generate(args) => generate::run(args),
        Command::Help(args) => help::run(&args),
    };
    output::finish(result)
}

#[cfg(test)]
mod tests {
    use clap::CommandFactory;

    #[test]
    fn command_line_definition_is_consistent() {
        super::Cli::command().debug_assert();
    }
}
