//! `taut generate`: shell completions and manual pages, made from the command-line definition
//! itself so they never drift from it.

use std::path::PathBuf;

use clap::{Args, CommandFactory, Subcommand, ValueEnum};
use clap_complete::Shell;

use taut::error::{Error, Result};

use super::output;

/// Arguments of `taut generate`.
#[derive(Debug, Args)]
pub struct GenerateArgs {
    #[command(subcommand)]
    what: What,
}

#[derive(Debug, Subcommand)]
enum What {
    /// Print a completion script for SHELL, e.g. `taut generate completions bash >
    /// ~/.local/share/bash-completion/completions/taut`.
    Completions {
        /// The shell.
        #[arg(value_enum)]
        shell: ShellChoice,
    },
    /// Print the manual page (roff) of taut, with every reference topic of `taut help topics` as
    /// a section, or with --dir write it and one page per subcommand (`taut.1`, `taut-plan.1`,
    /// …) into a folder, e.g. `taut generate man | man -l -`.
    Man {
        /// Write every page into this existing folder instead of printing the main page.
        #[arg(long, value_name = "FOLDER")]
        dir: Option<PathBuf>,
    },
}

/// Shells with completion scripts.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
enum ShellChoice {
    /// Bash.
    Bash,
    /// Zsh.
    Zsh,
    /// Fish.
    Fish,
    /// Elvish.
    Elvish,
    /// PowerShell.
    Powershell,
}

impl ShellChoice {
    fn shell(self) -> Shell {
        match self {
            ShellChoice::Bash => Shell::Bash,
            ShellChoice::Zsh => Shell::Zsh,
            ShellChoice::Fish => Shell::Fish,
            ShellChoice::Elvish => Shell::Elvish,
            ShellChoice::Powershell => Shell::PowerShell,
        }
    }
}

fn roff(command: clap::Command, title: &str) -> Result<Vec<u8>> {
    let mut page = Vec::new();
    clap_mangen::Man::new(command)
        .title(title.to_string())
        .render(&mut page)
        .map_err(|source| Error::Write {
            path: PathBuf::from("manual page"),
            source,
        })?;
    Ok(page)
}

/// The main page: the command line, then every reference topic as a section of its own.
fn main_page(command: clap::Command) -> Result<Vec<u8>> {
    let mut page = roff(command, "taut")?;
    page.extend_from_slice(super::topics::roff_sections().as_bytes());
    Ok(page)
}

/// Runs `taut generate`.
pub fn run(args: GenerateArgs) -> Result<()> {
    let mut command = super::Cli::command();
    command.build();
    match args.what {
        What::Completions { shell } => {
            let mut script = Vec::new();
            clap_complete::generate(shell.shell(), &mut command, "taut", &mut script);
            output::write_bytes(
                output::STANDARD_OUTPUT_ONLY,
                None,
                script,
                &output::Inputs::new(),
            )
        }
        What::Man { dir: None } => {
            output::write_bytes("--dir", None, main_page(command)?, &output::Inputs::new())
        }
        What::Man { dir: Some(dir) } => {
            if !dir.is_dir() {
                return Err(Error::input(format!("`{}` is not a folder", dir.display()))
                    .in_origin("--dir")
                    .help("create the folder first"));
            }
            let none = output::Inputs::new();
            let mut pages = output::Outputs::new(&none);
            pages.add(
                "--dir",
                Some(output::Target::Path(dir.join("taut.1"))),
                main_page(command.clone())?,
            );
            for sub in command
                .get_subcommands()
                .filter(|sub| sub.get_name() != "help")
            {
                let title = format!("taut-{}", sub.get_name());
                let page = sub.clone().bin_name(format!("taut {}", sub.get_name()));
                pages.add(
                    "--dir",
                    Some(output::Target::Path(dir.join(format!("{title}.1")))),
                    roff(page, &title)?,
                );
            }
            pages.write()
        }
    }
}
