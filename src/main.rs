//! The `taut` command: parses arguments, runs the library, renders the result.

mod cli;

fn main() -> std::process::ExitCode {
    cli::main()
}
