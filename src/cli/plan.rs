//! `taut plan`: solve a string for every course of an instrument in a tuning.

mod render;

use std::path::PathBuf;

use clap::Args;

use taut::error::Result;
use taut::instrument::{Instrument, TensionSpec};
use taut::plan::remedy::{self, Build};
use taut::plan::solve::{self, SolveOptions};
use taut::plan::Plan;

use super::output::{self, OutputArgs, Render, UnitArgs, View};
use super::parse_flag;
use super::stock::StockArgs;

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
    #[command(flatten)]
    pub units: UnitArgs,
    #[command(flatten)]
    pub output: OutputArgs,
    /// Also save the chosen strings as a string-set file, for `taut audit` and `taut convert`.
    #[arg(long, value_name = "FILE")]
    pub save_set: Option<PathBuf>,
}

/// Runs `taut plan`.
pub fn run(args: &PlanArgs) -> Result<()> {
    let tension: Option<TensionSpec> = parse_flag(args.tension.as_deref(), "--tension")?;
    let instrument = Instrument::load(&args.instrument)?;
    let stock = args.stock.load()?;
    let mut plan = solve::plan(
        &instrument,
        &stock,
        &SolveOptions {
            tuning: args.tuning.clone(),
            tension,
        },
    )?;
    attach_fixes(&mut plan);
    if let Some(path) = &args.save_set {
        let set = taut::sets::set::StringSet::from_plan(&plan).to_yaml();
        output::write_atomically(path, set.as_bytes())?;
    }
    output::emit(&plan, &args.output, Some(&args.units))
}

/// Ends every warning of the plan with what would fix it.
fn attach_fixes(plan: &mut Plan) {
    let builds: Vec<(u32, usize, Build)> = plan
        .courses
        .iter()
        .flat_map(|course| {
            course.strings.iter().enumerate().map(|(index, string)| {
                let build = match string.choice.construction.as_str() {
                    "plain" => Build::Plain,
                    "wound" => Build::Wound,
                    _ => Build::Unknown,
                };
                (course.course, index + 1, build)
            })
        })
        .collect();
    let build_of = |warning: &taut::plan::warning::Warning| {
        builds
            .iter()
            .find(|(course, string, _)| {
                Some(*course) == warning.course && Some(*string) == warning.string
            })
            .map_or(Build::Unknown, |(_, _, build)| *build)
    };
    for course in &mut plan.courses {
        remedy::attach(&mut course.warnings, build_of);
    }
    remedy::attach(&mut plan.warnings, build_of);
}

impl Render for Plan {
    fn table(&self, view: &View) -> String {
        render::table(self, view)
    }

    fn csv(&self) -> Result<String> {
        render::csv(self)
    }
}
