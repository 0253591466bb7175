//! `taut plan`: solve a string for every course of an instrument in a tuning.

pub(crate) mod render;
mod several;

use std::path::PathBuf;

use clap::{Args, ValueEnum};

use taut::error::Result;
use taut::instrument::{Instrument, TensionSpec};
use taut::plan::remedy;
use taut::plan::several::SeveralOptions;
use taut::plan::solve::{self, SolveOptions};
use taut::plan::Plan;
use taut::strings::select::several::Balance;

use taut::charts::build;
use taut::charts::draw::DEFAULT_SIZE;

use super::order::OrderArgs;
use super::output::{self, Format, OutputArgs, Render, UnitArgs, View};
use super::parse_flag;
use super::pictures::{self, PlotArgs};
use super::sound::{self, SoundArgs};
use super::stock::StockArgs;

/// How a string shared by several tunings is balanced among them.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum BalanceChoice {
    /// The smallest worst-case relative deviation of tension from the target.
    Target,
    /// The lowest worst-case stress (share of breaking strength).
    Stress,
}

/// Arguments of `taut plan`.
#[derive(Debug, Args)]
#[command(
    about = "Choose a string for every course of an instrument in a tuning, with tension, stress and warnings",
    after_help = "INSTRUMENT is a YAML file or a built-in template: guitar-19edo, lever-harp-34, psaltery-26, fanned-8-just.\n\nCourse pitches are written in the tuning's own addressing: a note (`E2`, `F#3`), the nearest degree to a note (`~E2`), a degree (`deg7`, `deg3p1`), cents (`386.3c`), a ratio (`3/2`) or a frequency (`82.41hz`); `taut tuning --help` has the details and the tuning forms.\n\nCharts for --plot CHART=FILE: tension (window shaded, warnings ringed), stress (caution and danger lines), diameter (by construction).\n\n--sound FILE.wav plays the planned strings with their own stiffness (`taut help sound`).\n\nStrings break and instruments fail under too much load: wear eye protection, bring tension up gradually, respect the maker's load rating and defer to the maker's specifications."
)]
pub struct PlanArgs {
    /// Instrument definition (a YAML file) or the name of a built-in template.
    #[arg(value_name = "INSTRUMENT")]
    pub instrument: String,
    /// Tuning to use instead of the instrument's own: a shipped name (e.g. `19edo`), an inline
    /// spec, or a YAML file, optionally with `@reference`. Give it more than once to plan one
    /// set that serves every tuning listed.
    #[arg(long, value_name = "TUNING")]
    pub tuning: Vec<String>,
    /// Plan one of the instrument file's `variants` alone (by name): its tuning and course
    /// pitches, with pictures and a string chart like any one-tuning plan.
    #[arg(long, value_name = "NAME")]
    pub variant: Option<String>,
    /// With several tunings (or the instrument's `variants`), how the shared string is balanced
    /// among them: the smallest worst-case deviation from the target tension, or the lowest
    /// worst-case stress.
    #[arg(long, value_enum, default_value = "target", value_name = "RULE")]
    pub balance: BalanceChoice,
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
    /// Under the table, show why each string was chosen: its target, the next thinner and
    /// thicker gauge, and the best string of each other allowed kind (JSON always has them).
    #[arg(long)]
    pub alternatives: bool,
    /// Also save the chosen strings as a string-set file, for `taut audit` and `taut convert`
    /// (written together with the report: all or none).
    #[arg(long, value_name = "FILE")]
    pub save_set: Option<output::Target>,
    /// Also write the builder's string chart: a printable table per string with the charts,
    /// as a self-contained `.html` page or a `.csv` table.
    #[arg(long, value_name = "FILE")]
    pub string_chart: Option<PathBuf>,
    #[command(flatten)]
    pub order: OrderArgs,
    #[command(flatten)]
    pub plots: PlotArgs,
    #[command(flatten)]
    pub sound: SoundArgs,
}

/// The charts of a plan, for `--plot CHART=FILE`.
pub const PLAN_CHARTS: [&str; 3] = ["tension", "stress", "diameter"];

/// Runs `taut plan`.
pub fn run(args: &PlanArgs) -> Result<()> {
    let tension: Option<TensionSpec> = parse_flag(args.tension.as_deref(), "--tension")?;
    let (plots, size) = args.plots.requests(&PLAN_CHARTS)?;
    let sheet = args.string_chart.as_deref().map(sheet_format).transpose()?;
    let sound = args.sound.request()?;
    let order = args.order.request()?;
    let instrument = Instrument::load(&args.instrument)?;
    let stock = args.stock.load()?;
    let mut inputs = output::Inputs::new();
    inputs
        .spec(&args.instrument)
        .maybe_spec(instrument.tuning.as_deref());
    for variant in &instrument.variants {
        inputs.maybe_spec(variant.tuning.as_deref());
    }
    // One variant picked: planned alone, as a one-tuning instrument.
    let (instrument, one_tuning): (Instrument, Option<String>) = match &args.variant {
        Some(name) => {
            if args.tuning.len() > 1 {
                return Err(taut::Error::input(
                    "--variant plans one variant; give --tuning at most once beside it",
                )
                .in_origin("--variant"));
            }
            let tuning = args.tuning.first().map(String::as_str);
            taut::plan::several::variants::pick(&instrument, name, tuning, "--variant")?
        }
        None => (instrument, args.tuning.first().cloned()),
    };
    let one_tuning_spec = one_tuning;
    for spec in &args.tuning {
        inputs.spec(spec);
    }
    for file in &args.stock.files {
        inputs.file(file);
    }
    if args.tuning.len() > 1 || !instrument.variants.is_empty() {
        if !plots.is_empty() || sheet.is_some() || order.is_some() {
            let flag = if !plots.is_empty() {
                "--plot"
            } else if sheet.is_some() {
                "--string-chart"
            } else {
                "--order-sheet"
            };
            let help = if instrument.variants.is_empty() {
                "plan one tuning at a time for its pictures (`--tuning NAME` once)".to_string()
            } else {
                let names: Vec<&str> = instrument.variants.iter().map(|v| v.name.trim()).collect();
                format!(
                    "pick one variant with `--variant NAME` ({}); run once per variant to draw them all",
                    names.join(", ")
                )
            };
            return Err(taut::Error::input(format!(
                "{flag} draws one tuning, and this plan has several"
            ))
            .in_origin(flag)
            .help(help));
        }
        if sound.is_some() {
            return Err(taut::Error::input(
                "--sound plays one tuning; it does not take several tunings yet",
            )
            .in_origin("--sound")
            .help("plan one tuning at a time to hear it (`--tuning NAME` once)"));
        }
        return run_several(args, &instrument, &stock, tension, &inputs);
    }
    let mut plan = solve::plan(
        &instrument,
        &stock,
        &SolveOptions {
            tuning: one_tuning_spec.clone(),
            tension: tension.clone(),
        },
    )?;
    output::check_finite(&plan)?;
    attach_fixes(&mut plan);
    let mut text = output::render(&plan, &args.output, Some(&args.units))?;
    if args.alternatives && args.output.format == Format::Table {
        let view = View::new(&args.output, Some(&args.units));
        text.push_str(&output::terminal_text(render::alternatives(&plan, &view)));
    }
    if args.output.output.is_none() && args.output.format == Format::Table {
        text = super::text::for_terminal(text);
    }
    // The shared writer: every file or none, never over an input, a closed pipe ends
    // quietly, a file appears whole or not at all.
    let mut outputs = output::Outputs::new(&inputs);
    if !plots.is_empty() || sheet == Some(SheetFormat::Html) {
        let windows = build::tension_windows(&instrument, tension.as_ref());
        let charts = build::plan(&plan, &windows);
        pictures::add(&mut outputs, &plots, size, &charts)?;
        if let (Some(path), Some(SheetFormat::Html)) = (&args.string_chart, sheet) {
            let page = taut::charts::sheet::html(&plan, &charts, DEFAULT_SIZE)?;
            outputs.add(
                "--string-chart",
                Some(output::Target::Path(path.clone())),
                page.into_bytes(),
            );
        }
    }
    if let (Some(path), Some(SheetFormat::Csv)) = (&args.string_chart, sheet) {
        outputs.add(
            "--string-chart",
            Some(output::Target::Path(path.clone())),
            output::safe_csv(&taut::charts::sheet::csv(&plan)?)?.into_bytes(),
        );
    }
    if order.is_some() {
        let view = View::new(&args.output, Some(&args.units));
        let rows = order_rows(&plan, &instrument, &stock, args.order.marking)?;
        let title = format!("{} in {}", plan.instrument, plan.tuning);
        args.order.add(&mut outputs, &title, &rows, &view)?;
    }
    if let Some(request) = &sound {
        let tuning = solve::tuning_for(
            &instrument,
            args.tuning.first().map(String::as_str),
            "--tuning",
        )?;
        sound::add(&mut outputs, request, &plan, &tuning)?;
    }
    if let Some(target) = &args.save_set {
        let set = taut::sets::set::StringSet::from_plan(&plan);
        outputs.add(
            "--save-set",
            Some(target.clone()),
            set.to_yaml().into_bytes(),
        );
    }
    outputs.add("--output", args.output.output.clone(), text.into_bytes());
    outputs.write()
}

/// `taut plan` with several tunings or the instrument's variants: one set for all of them.
fn run_several(
    args: &PlanArgs,
    instrument: &Instrument,
    stock: &taut::strings::stock::Stock,
    tension: Option<TensionSpec>,
    inputs: &output::Inputs,
) -> Result<()> {
    let mut plan = taut::plan::several::plan(
        instrument,
        stock,
        &SeveralOptions {
            tunings: args.tuning.clone(),
            tension,
            balance: match args.balance {
                BalanceChoice::Target => Balance::Target,
                BalanceChoice::Stress => Balance::Stress,
            },
        },
    )?;
    for block in &mut plan.tunings {
        attach_fixes(&mut block.plan);
    }
    output::check_finite(&plan)?;
    let mut outputs = output::Outputs::new(inputs);
    if let Some(target) = &args.save_set {
        if let Some(first) = plan.tunings.first() {
            let mut set = taut::sets::set::StringSet::from_plan(&first.plan);
            let names: Vec<&str> = plan.tunings.iter().map(|b| b.variant.as_str()).collect();
            set.name = format!("{} for {}", plan.instrument, names.join(", "));
            set.tuning = None;
            set.about = Some(format!(
                "Strings chosen by `taut plan` to serve every one of: {}.",
                names.join(", ")
            ));
            outputs.add(
                "--save-set",
                Some(target.clone()),
                set.to_yaml().into_bytes(),
            );
        }
    }
    let view = View::new(&args.output, Some(&args.units));
    let mut text = match args.output.format {
        Format::Table => output::terminal_text(several::table(&plan, &view)),
        Format::Json => several::json(&plan)?,
        Format::Csv => output::safe_csv(&several::csv(&plan)?)?,
        Format::Yaml => several::yaml(&plan)?,
    };
    if args.output.output.is_none() && args.output.format == Format::Table {
        text = super::text::for_terminal(text);
    }
    outputs.add("--output", args.output.output.clone(), text.into_bytes());
    outputs.write()
}

/// The order sheet's rows of a one-tuning plan: each string's construction as the plan chose
/// it (a catalog string of its kind at its diameter) or as the file fixed it, with the course's
/// anchor and post lengths where the instrument states them.
fn order_rows(
    plan: &Plan,
    instrument: &Instrument,
    stock: &taut::strings::stock::Stock,
    marking: bool,
) -> Result<Vec<taut::charts::order::OrderRow>> {
    use taut::charts::order::{self, OrderString};
    let (kinds, materials) = (stock.kinds(), stock.materials());
    let mut strings = Vec::with_capacity(plan.string_count());
    for (index, course) in plan.courses.iter().enumerate() {
        let input = instrument.course_input(index, None);
        for (number, string) in course.strings.iter().enumerate() {
            let construction = match &string.fixed {
                Some(fixed) => fixed.resolve(kinds, materials)?.construction,
                None => kinds
                    .get(&string.choice.kind)?
                    .construction(string.choice.diameter_mm / 1000.0),
            };
            strings.push(OrderString {
                course: course.course,
                string: number + 1,
                pitch: if number == 0 {
                    &course.pitch.label
                } else {
                    &string.interval
                },
                note_name: &course.pitch.note_name,
                pitch_hz: string.pitch_hz,
                kind: &string.choice.kind,
                construction,
                length_m: course.length_m,
                anchor_m: input.and_then(|c| c.anchor_m),
                post_m: input.and_then(|c| c.post_m),
                tension_n: string.choice.tension_n,
            });
        }
    }
    Ok(order::rows(strings, marking))
}

/// What `--string-chart` writes.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum SheetFormat {
    Html,
    Csv,
}

fn sheet_format(path: &std::path::Path) -> Result<SheetFormat> {
    match path
        .extension()
        .and_then(|e| e.to_str())
        .map(str::to_ascii_lowercase)
        .as_deref()
    {
        Some("html" | "htm") => Ok(SheetFormat::Html),
        Some("csv") => Ok(SheetFormat::Csv),
        _ => Err(taut::Error::input(format!(
            "`{}` names neither an HTML page nor a CSV table",
            path.display()
        ))
        .in_origin("--string-chart")
        .help("end the file name in `.html` or `.csv`")),
    }
}

/// Ends every warning of the plan with what would fix it (shared with the explorer).
fn attach_fixes(plan: &mut Plan) {
    remedy::attach_to_plan(plan);
}

impl Render for Plan {
    fn table(&self, view: &View) -> String {
        render::table(self, view)
    }

    fn csv(&self) -> Result<String> {
        render::csv(self)
    }
}
