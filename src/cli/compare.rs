//! `taut compare`: two plans, two sets, or a plan and a set, side by side.

mod render;

use clap::Args;

use taut::error::{Error, Result};
use taut::instrument::Instrument;
use taut::sets::audit::{self, AuditOptions, DEFAULT_MAX_CHANGE};
use taut::sets::compare::{self, Comparison, Listing};
use taut::strings::feel::FeelOptions;
use taut::strings::stock::Stock;

use super::output::{self, OutputArgs, Render, UnitArgs, View};
use super::stock::StockArgs;

/// Arguments of `taut compare`.
#[derive(Debug, Args)]
#[command(
    about = "Put two plans, two sets, or a plan and a set side by side: per string the change in gauge, tension, stress and feel, and the change of the total load",
    after_help = "BEFORE and AFTER are each a plan's JSON or YAML export (`taut plan INSTRUMENT --format json -o FILE`) or a string-set file (`--save-set FILE`, or a shipped example's name). A plan brings its own figures; a set is checked on the instrument given with --on (or --after-on for AFTER) in the tuning given with --tuning (default: the instrument's own). `taut help comparisons` has the fields and the rules.\n\nStrings break and instruments fail under too much load: wear eye protection, bring tension up gradually, respect the maker's load rating and defer to the maker's specifications."
)]
pub struct CompareArgs {
    /// The stringing changed from: a plan's export or a string-set file.
    #[arg(value_name = "BEFORE")]
    pub before: String,
    /// The stringing changed to: a plan's export or a string-set file.
    #[arg(value_name = "AFTER")]
    pub after: String,
    /// The instrument a set is strung on (a YAML file or a built-in template); needed when
    /// either side is a set.
    #[arg(long, value_name = "INSTRUMENT")]
    pub on: Option<String>,
    /// The instrument AFTER is strung on, when it is a set on another instrument than BEFORE's
    /// (a longer neck, a new frame).
    #[arg(long, value_name = "INSTRUMENT")]
    pub after_on: Option<String>,
    /// Tuning for the sets instead of their instrument's own.
    #[arg(long, value_name = "TUNING")]
    pub tuning: Option<String>,
    #[command(flatten)]
    pub stock: StockArgs,
    #[command(flatten)]
    pub units: UnitArgs,
    #[command(flatten)]
    pub output: OutputArgs,
}

/// Runs `taut compare`.
pub fn run(args: &CompareArgs) -> Result<()> {
    let stock = args.stock.load()?;
    let mut inputs = output::Inputs::new();
    inputs
        .spec(&args.before)
        .spec(&args.after)
        .maybe_spec(args.on.as_deref())
        .maybe_spec(args.after_on.as_deref())
        .maybe_spec(args.tuning.as_deref());
    for file in &args.stock.files {
        inputs.file(file);
    }
    let before = side(args, &args.before, "BEFORE", args.on.as_deref(), &stock)?;
    let after = side(
        args,
        &args.after,
        "AFTER",
        args.after_on.as_deref().or(args.on.as_deref()),
        &stock,
    )?;
    let report = compare::compare(&before, &args.before, &after, &args.after);
    output::emit_in(&report, &args.output, Some(&args.units), &inputs)
}

/// One side: a plan's own figures, or a set checked on `on`.
fn side(
    args: &CompareArgs,
    spec: &str,
    name: &str,
    on: Option<&str>,
    stock: &Stock,
) -> Result<Listing> {
    let (text, origin) = taut::input::examples::read(spec, name)?;
    if let Some(plan) = compare::plan_export(&text, &origin)? {
        return Ok(Listing::from_plan(&plan));
    }
    let set = super::audit::load_set(spec, stock)?;
    let Some(on) = on else {
        return Err(Error::input(format!(
            "{name} is a string set, and a set has no tensions until it is on an instrument"
        ))
        .in_origin(origin)
        .help("name the instrument it is strung on with `--on INSTRUMENT` (and `--after-on` for AFTER on another)"));
    };
    let flag = if name == "AFTER" && args.after_on.is_some() {
        "--after-on"
    } else {
        "--on"
    };
    let instrument = Instrument::load(on).map_err(|err| err.in_origin(flag))?;
    let tuning = taut::plan::solve::tuning_for(&instrument, args.tuning.as_deref(), "--tuning")?;
    let report = audit::audit(
        &instrument,
        &set,
        &tuning,
        None,
        stock,
        &AuditOptions {
            max_change: DEFAULT_MAX_CHANGE,
            feel: FeelOptions::default(),
        },
    )?;
    Ok(Listing::from_audit(&report))
}

impl Render for Comparison {
    fn table(&self, view: &View) -> String {
        render::table(self, view)
    }
}
