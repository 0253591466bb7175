//! `taut explore`: starts the local explorer page and prints its address.

use clap::Args;

use taut::error::{Error, Result};
use taut::explore::{Bound, Options};
use taut::input::examples;
use taut::instrument::Instrument;

use super::output;

/// The instrument the page opens with when none is given.
const DEFAULT_INSTRUMENT: &str = "guitar-19edo";

/// Arguments of `taut explore`.
#[derive(Debug, Args)]
#[command(
    about = "Open a page in your browser to try tunings, strings and lengths live, on this machine only",
    after_help = "The page is served from 127.0.0.1 only, at an address with a random token; it fetches nothing from the network and the server writes no file (downloads are saved by the browser). Stop it with Ctrl-C. `taut help explorer` has the details.\n\nStrings break and instruments fail under too much load: wear eye protection, bring tension up gradually, respect the maker's load rating and defer to the maker's specifications."
)]
pub struct ExploreArgs {
    /// Instrument to open with: a YAML file or a shipped example (default: guitar-19edo).
    #[arg(value_name = "INSTRUMENT")]
    pub instrument: Option<String>,
    /// Port on 127.0.0.1 to listen on (default: a free one).
    #[arg(long, value_name = "PORT")]
    pub port: Option<u16>,
    /// Also open the page in the system's web browser.
    #[arg(long)]
    pub open: bool,
}

/// Runs `taut explore` until the process is stopped.
pub fn run(args: &ExploreArgs) -> Result<()> {
    let spec = args.instrument.as_deref().unwrap_or(DEFAULT_INSTRUMENT);
    let (text, origin) = examples::read(spec, "INSTRUMENT")?;
    // Checked before serving, so a bad file gets the command line's message and exit code.
    Instrument::from_text(text.clone(), &origin).map_err(|err| {
        examples::wrong_kind(&text, &origin, examples::FileKind::Instrument).unwrap_or(err)
    })?;
    let page_origin = if examples::EXAMPLES.iter().any(|(name, _)| *name == spec)
        && !std::path::Path::new(spec).exists()
    {
        format!("{spec}.yaml")
    } else {
        taut::explore::api::origin_name(Some(spec), taut::explore::api::DEFAULT_ORIGIN)
    };
    let bound = Bound::bind(Options {
        port: args.port,
        instrument: text,
        origin: page_origin,
    })?;
    let url = bound.url();
    let line = format!(
        "taut explore: {url}\nServing {spec} on this machine only; nothing is fetched from the network and no file is written. Ctrl-C stops it.\n"
    );
    output::write_bytes("--output", None, line.into_bytes(), &output::Inputs::new())?;
    if args.open {
        open_browser(&url)?;
    }
    bound.serve()
}

/// Asks the system to open `url` in the default browser (only with `--open`).
fn open_browser(url: &str) -> Result<()> {
    let program = if cfg!(target_os = "macos") {
        "open"
    } else if cfg!(target_os = "windows") {
        "explorer"
    } else {
        "xdg-open"
    };
    std::process::Command::new(program)
        .arg(url)
        .spawn()
        .map(drop)
        .map_err(|err| {
            Error::input(format!("cannot start `{program}` to open the page: {err}"))
                .in_origin("--open")
                .help("open the address printed above in a browser yourself")
        })
}
