//! `taut frets`: fret positions for an instrument in a tuning, straight or fanned, per course.

mod render;
mod svg;

use clap::{Args, ValueEnum};

use taut::error::Result;
use taut::frets;
use taut::instrument::frets::{parse_degree_list, FretSettings};
use taut::instrument::Instrument;
use taut::plan::solve::tuning_for;

use super::output;
use super::parse_flag;

/// Output formats of a fret layout.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum FretsFormat {
    /// Tables for the terminal, with mergeable frets and warnings.
    Table,
    /// One JSON document (documented in `taut help formats`).
    Json,
    /// One row per fret of every course.
    Csv,
    /// A drawing of the board at true size (millimetres), to print at 100 % as a template.
    Svg,
}

/// Arguments of `taut frets`.
#[derive(Debug, Args)]
#[command(
    about = "Lay out frets for any tuning: distances from the nut, spacing, cents and ratios, straight or fanned, per course",
    after_help = "INSTRUMENT is a YAML file or a built-in template (e.g. guitar-19edo, fanned-8-just). Its optional `frets:` block holds the settings below and the board (`board_width`, `edge_margin`, `body_joint`, `board_end`); options given here replace the file's.\n\nPositions are L·(1 − 1/r) from the nut for a degree at ratio r above the open string, with no compensation. `--format svg -o board.svg` draws the board at true size: print at 100 % and check the 100 mm scale bar."
)]
pub struct FretsArgs {
    /// Instrument definition (a YAML file) or the name of a built-in template.
    #[arg(value_name = "INSTRUMENT")]
    pub instrument: String,
    /// Tuning to use instead of the instrument's own (a shipped name, inline spec or file).
    #[arg(long, value_name = "TUNING")]
    pub tuning: Option<String>,
    /// At most this many frets per course.
    #[arg(long, value_name = "N")]
    pub count: Option<String>,
    /// No fret further than this from the nut, e.g. `480mm`.
    #[arg(long, value_name = "LENGTH")]
    pub up_to: Option<String>,
    /// Only these steps of each period get a fret, e.g. `0,4,9,13,18` (default: every step).
    #[arg(long, value_name = "STEPS")]
    pub degrees: Option<String>,
    /// Count `--degrees` from each open string (`open`, the same intervals on every course) or
    /// from the tuning's degree 0 (`tuning`, the same pitches on every course).
    #[arg(long, value_name = "FROM")]
    pub degrees_from: Option<String>,
    /// Warn about frets closer than this to the previous one (default 5mm).
    #[arg(long, value_name = "LENGTH")]
    pub min_spacing: Option<String>,
    /// Report frets of neighbouring courses this close in pitch as mergeable (default 5c).
    #[arg(long, value_name = "CENTS")]
    pub merge_within: Option<String>,
    /// Fanned boards: the fraction of each course's length where frets are square (0 the nut,
    /// 0.5 the octave; default 0).
    #[arg(long, value_name = "FRACTION")]
    pub square_at: Option<String>,
    /// Output format.
    #[arg(long, value_enum, default_value = "table")]
    pub format: FretsFormat,
    /// Show distances and lengths in this unit in the table (JSON and CSV stay in metres, the
    /// SVG in true-size millimetres).
    #[arg(long, value_enum, default_value = "mm", value_name = "UNIT")]
    pub length_unit: output::LengthChoice,
    /// Write to this file instead of standard output (written whole, or not at all).
    #[arg(long, short = 'o', value_name = "FILE")]
    pub output: Option<output::Target>,
}

impl FretsArgs {
    /// The settings the options give, each parsed as in the file and named by its option.
    fn overrides(&self) -> Result<FretSettings> {
        Ok(FretSettings {
            count: parse_flag(self.count.as_deref(), "--count")?,
            up_to: parse_flag(self.up_to.as_deref(), "--up-to")?,
            degrees: self
                .degrees
                .as_deref()
                .map(|text| parse_degree_list(text).map_err(|err| err.in_origin("--degrees")))
                .transpose()?,
            degrees_from: parse_flag(self.degrees_from.as_deref(), "--degrees-from")?,
            min_spacing: parse_flag(self.min_spacing.as_deref(), "--min-spacing")?,
            merge_within: parse_flag(self.merge_within.as_deref(), "--merge-within")?,
            square_at: parse_flag(self.square_at.as_deref(), "--square-at")?,
            ..FretSettings::default()
        })
    }
}

/// Runs `taut frets`.
pub fn run(args: &FretsArgs) -> Result<()> {
    let overrides = args.overrides()?;
    let instrument = Instrument::load(&args.instrument)?;
    let tuning = tuning_for(&instrument, args.tuning.as_deref(), "--tuning")?;
    let layout = frets::lay_out(&instrument, &tuning, &overrides)?;
    let text = match args.format {
        FretsFormat::Table => render::table(&layout, args.length_unit.unit()),
        FretsFormat::Json => render::json(&layout)?,
        FretsFormat::Csv => output::safe_csv(&render::csv(&layout)?)?,
        FretsFormat::Svg => svg::svg(&layout),
    };
    let text = match args.format {
        FretsFormat::Table => output::terminal_text(text),
        _ => text,
    };
    let mut inputs = output::Inputs::new();
    inputs
        .spec(&args.instrument)
        .maybe_spec(args.tuning.as_deref())
        .maybe_spec(instrument.tuning.as_deref());
    // The shared writer: never over an input, a closed pipe ends quietly, a file appears whole
    // or not at all.
    output::write_bytes("--output", args.output.as_ref(), text.into_bytes(), &inputs)
}
