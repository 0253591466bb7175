//! Command-line layer: argument parsing (clap), rendering and exit codes. Nothing below this
//! layer sees clap.

use std::process::ExitCode;

mod plan;

use clap::{Parser, Subcommand};

/// Plan strings for any tuning on any instrument.
#[derive(Debug, Parser)]
#[command(name = "taut", version, about, long_about = None)]
pub struct Cli {
    #[command(subcommand)]
    command: Command,
}

#[derive(Debug, Subcommand)]
enum Command {
    /// Choose a string for every course of an instrument in a tuning.
    Plan(plan::PlanArgs),
}

/// Runs the command line and returns the process exit code.
pub fn main() -> ExitCode {
    let cli = Cli::parse();
    let result = match &cli.command {
        Command::Plan(args) => plan::run(args),
    };
    match result {
        Ok(()) => ExitCode::SUCCESS,
        Err(err) => {
            eprintln!("error: {err}");
            ExitCode::from(err.exit_code())
        }
    }
}
