//! Command-line layer: argument parsing (clap), rendering and exit codes. Nothing below this
//! layer sees clap.

use std::process::ExitCode;

use clap::{Parser, Subcommand};

/// Plan strings for any tuning on any instrument.
#[derive(Debug, Parser)]
#[command(name = "taut", version, about, long_about = None)]
pub struct Cli {
    #[command(subcommand)]
    command: Command,
}

#[derive(Debug, Subcommand)]
enum Command {}

/// Runs the command line and returns the process exit code.
pub fn main() -> ExitCode {
    let cli = Cli::parse();
    match cli.command {}
}
