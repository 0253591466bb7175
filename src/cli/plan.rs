//! `taut plan`: solve a string for every course of an instrument in a tuning.

mod render;

use clap::{Args, ValueEnum};

use taut::error::Result;
use taut::input::units::{ForceUnit, LengthUnit};
use taut::instrument::{Instrument, TensionSpec};
use taut::plan::solve::{self, SolveOptions};

pub use render::DisplayUnits;

use super::output;
use super::parse_flag;
use super::stock::StockArgs;

/// Output formats of a plan.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum PlanFormat {
    /// A table for the terminal, with totals, warnings and safety cautions.
    Table,
    /// One JSON document (documented in README).
    Json,
    /// One row per string.
    Csv,
    /// The JSON document's fields as YAML.
    Yaml,
}

/// Units a tension can be shown in besides newtons.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum ForceChoice {
    /// Newtons only.
    N,
    /// Pound-force.
    Lbf,
    /// Kilogram-force.
    Kgf,
}

/// Units a vibrating length can be shown in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum LengthChoice {
    /// Millimetres.
    Mm,
    /// Inches.
    In,
    /// Metres.
    M,
}

/// Arguments of `taut plan`.
#[derive(Debug, Args)]
#[command(
    about = "Choose a string for every course of an instrument in a tuning, with tension, stress and warnings",
    after_help = "INSTRUMENT is a YAML file or a built-in template: guitar-19edo, lever-harp-34, psaltery-26, fanned-8-just.\n\nCourse pitches are written in the tuning's own addressing: a note (`E2`, `F#3`), the nearest degree to a note (`~E2`), a degree (`deg7`, `deg3p1`), cents (`386.3c`), a ratio (`3/2`) or a frequency (`82.41hz`); `taut tuning --help` has the details and the tuning forms.\n\nStrings break and instruments fail under too much load: wear eye protection, bring tension up gradually, respect the maker's load rating and defer to the maker's specifications."
)]
pub struct PlanArgs {
    /// Instrument definition (a YAML file) or the name of a built-in template.
    #[arg(value_name = "INSTRUMENT")]
    pub instrument: String,
    /// Tuning to use instead of the instrument's own: a shipped name (e.g. `19edo`), an inline
    /// spec, or a YAML file, optionally with `@reference`.
    #[arg(long, value_name = "TUNING")]
    pub tuning: Option<String>,
    /// Tension for every course instead of the file's: a target such as `70N`, `16lbf`, `7kgf`,
    /// or a window such as `60N..90N`.
    #[arg(long, value_name = "TENSION", allow_hyphen_values = true)]
    pub tension: Option<String>,
    #[command(flatten)]
    pub stock: StockArgs,
    /// Show tensions in newtons and this unit.
    #[arg(long, value_enum, default_value = "lbf", value_name = "UNIT")]
    pub force_unit: ForceChoice,
    /// Show vibrating lengths in this unit (diameters are always shown in inches and mm).
    #[arg(long, value_enum, default_value = "mm", value_name = "UNIT")]
    pub length_unit: LengthChoice,
    /// Output format (plans add CSV and YAML to the shared table and JSON).
    #[arg(long, value_enum, default_value = "table")]
    pub format: PlanFormat,
    /// Write to this file instead of standard output (`-` is standard output; a file is written
    /// whole or not at all, never over one of the command's inputs).
    #[arg(long, short = 'o', value_name = "FILE")]
    pub output: Option<output::Target>,
    /// Also save the chosen strings as a string-set file, for `taut audit` and `taut convert`
    /// (written together with the report: both or neither).
    #[arg(long, value_name = "FILE")]
    pub save_set: Option<output::Target>,
}

/// Runs `taut plan`.
pub fn run(args: &PlanArgs) -> Result<()> {
    let tension: Option<TensionSpec> = parse_flag(args.tension.as_deref(), "--tension")?;
    let instrument = Instrument::load(&args.instrument)?;
    let stock = args.stock.load()?;
    let plan = solve::plan(
        &instrument,
        &stock,
        &SolveOptions {
            tuning: args.tuning.clone(),
            tension,
        },
    )?;
    let mut inputs = output::Inputs::new();
    inputs
        .spec(&args.instrument)
        .maybe_spec(args.tuning.as_deref())
        .maybe_spec(instrument.tuning.as_deref());
    for file in &args.stock.files {
        inputs.file(file);
    }
    output::check_finite(&plan)?;
    let units = DisplayUnits {
        force: match args.force_unit {
            ForceChoice::N => ForceUnit::N,
            ForceChoice::Lbf => ForceUnit::Lbf,
            ForceChoice::Kgf => ForceUnit::Kgf,
        },
        length: match args.length_unit {
            LengthChoice::Mm => LengthUnit::Mm,
            LengthChoice::In => LengthUnit::In,
            LengthChoice::M => LengthUnit::M,
        },
    };
    let text = match args.format {
        PlanFormat::Table => render::table(&plan, units),
        PlanFormat::Json => render::json(&plan)?,
        PlanFormat::Csv => render::csv(&plan)?,
        PlanFormat::Yaml => render::yaml(&plan)?,
    };
    let text = match args.format {
        PlanFormat::Table => output::terminal_text(text),
        _ => text,
    };
    // The shared writer: both files or neither, never over an input, a closed pipe ends
    // quietly, a file appears whole or not at all.
    let mut outputs = output::Outputs::new(&inputs);
    if let Some(target) = &args.save_set {
        let mut set = taut::sets::set::StringSet::from_plan(&plan);
        // The spec that loaded, so `audit` and `convert` can load it back (a file tuning's
        // display name would not load).
        set.tuning = Some(
            args.tuning
                .clone()
                .or_else(|| instrument.tuning.clone())
                .unwrap_or_else(|| solve::DEFAULT_TUNING.to_string()),
        );
        outputs.add(
            "--save-set",
            Some(target.clone()),
            set.to_yaml().into_bytes(),
        );
    }
    outputs.add("--output", args.output.clone(), text.into_bytes());
    outputs.write()
}
