//! The `--stock FILE` option every string command shares.

use std::borrow::Cow;
use std::path::PathBuf;

use clap::Args;

use taut::error::Result;
use taut::strings::stock::Stock;

/// Extra materials, gauge catalogs and string kinds from the user's own files.
#[derive(Debug, Args)]
pub struct StockArgs {
    /// A stock file: extra materials, gauge catalogs and string kinds (e.g. the strings on your
    /// shelf, or strings you weighed) that instrument and set files may name. Repeatable.
    #[arg(long = "stock", value_name = "FILE")]
    pub files: Vec<PathBuf>,
}

impl StockArgs {
    /// The shipped data plus the given files.
    pub fn load(&self) -> Result<Cow<'static, Stock>> {
        Stock::with_files(&self.files)
    }
}
