//! The `taut` command: parses arguments, runs the library, renders the result.
#![cfg_attr(
    not(test),
    deny(clippy::unwrap_used, clippy::expect_used, clippy::panic)
)]

mod cli;

fn main() -> std::process::ExitCode {
    cli::main()
}
