//! `taut lengths`: the vibrating lengths that give each course its tension, for builders.

use std::path::PathBuf;

use clap::Args;

use taut::error::{Error, Result};
use taut::input::units::Force;
use taut::instrument::{Percent, TensionSpec};
use taut::lengths::JumpKind;
use taut::lengths::{self, Layout, LayoutInput, LayoutOptions};
use taut::strings::feel;

use super::audit::FeelArgs;
use super::output::{self, OutputArgs, Render};
use super::parse_flag;
use super::pictures::{self, PlotArgs};
use super::stock::StockArgs;
use super::text::{
    cell, course_pitch_text, feel_legend, maybe, new_table, right, user, warnings_and_cautions,
};

/// Arguments of `taut lengths`.
#[derive(Debug, Args)]
#[command(
    about = "Solve vibrating lengths from pitch, string and tension: one course, or a whole layout with a smooth tension profile",
    after_help = "Either give a LAYOUT file, or one course with --pitch, --string and --tension, e.g.\n  taut lengths --pitch A3 --string '{kind: plain-steel, diameter: 0.016in}' --tension 60N\n\nChart for --plot: lengths (the bridge line, with the tension profile on the right axis).\n\nStrings break: wear eye protection, bring tension up gradually and keep within the maker's load rating."
)]
pub struct LengthsArgs {
    /// A layout file: courses with pitch, string and tension.
    #[arg(value_name = "LAYOUT", required_unless_present = "pitch", conflicts_with_all = ["pitch", "string"])]
    pub layout: Option<PathBuf>,
    /// The pitch of a single course, in the tuning's addressing (e.g. `A3`).
    #[arg(long, value_name = "PITCH", requires_all = ["string", "tension"])]
    pub pitch: Option<String>,
    /// The string of a single course, written as in a string-set file, e.g.
    /// `{kind: plain-steel, diameter: 0.016in}`.
    #[arg(long, value_name = "STRING", requires = "pitch")]
    pub string: Option<String>,
    /// Tension for every course instead of the file's: `60N`, `14lbf`, or a window `50N..70N`.
    #[arg(long, value_name = "TENSION", allow_hyphen_values = true)]
    pub tension: Option<String>,
    /// Tuning instead of the layout's own (default 12edo).
    #[arg(long, value_name = "TUNING")]
    pub tuning: Option<String>,
    /// Largest change of √(T/μ) between neighbouring courses before a jump is reported, e.g.
    /// `15%`.
    #[arg(long, value_name = "PERCENT")]
    pub max_step: Option<String>,
    /// The most total tension the frame is rated for, e.g. `2500N` (instead of the layout's
    /// `rated_load`).
    #[arg(long, value_name = "FORCE")]
    pub rated_load: Option<String>,
    #[command(flatten)]
    pub stock: StockArgs,
    #[command(flatten)]
    pub feel: FeelArgs,
    #[command(flatten)]
    pub output: OutputArgs,
    #[command(flatten)]
    pub plots: PlotArgs,
}

/// Runs `taut lengths`.
pub fn run(args: LengthsArgs) -> Result<()> {
    let (plots, size) = args.plots.requests(&["lengths"])?;
    let tension: Option<TensionSpec> = parse_flag(args.tension.as_deref(), "--tension")?;
    let stock = args.stock.load()?;
    let input = match (&args.layout, &args.pitch, &args.string) {
        (Some(path), _, _) => LayoutInput::load(path, &stock)?,
        (None, Some(pitch), Some(string)) => {
            let tension = tension.clone().ok_or_else(|| {
                Error::input("one course needs its tension").in_origin("--tension")
            })?;
            LayoutInput::single(pitch, string, tension, &stock)?
        }
        _ => {
            return Err(Error::input(
                "give a LAYOUT file, or --pitch, --string and --tension for one course",
            ))
        }
    };
    let max_step =
        parse_flag::<Percent>(args.max_step.as_deref(), "--max-step")?.map(Percent::fraction);
    let report = lengths::lay_out(
        &input,
        &stock,
        &LayoutOptions {
            tuning: args.tuning.clone(),
            tension,
            max_step,
            rated_load: parse_flag::<Force>(args.rated_load.as_deref(), "--rated-load")?
                .map(Force::si),
            feel: args.feel.options()?,
        },
    )?;
    let mut inputs = output::Inputs::new();
    inputs.maybe_spec(args.tuning.as_deref());
    if let Some(layout) = &args.layout {
        inputs.file(layout);
    }
    if let Some(spec) = &input.tuning {
        inputs.spec(spec);
    }
    for file in &args.stock.files {
        inputs.file(file);
    }
    if !plots.is_empty() {
        let charts = taut::charts::build::layout(&report);
        pictures::write(&plots, size, &charts, &inputs)?;
    }
    output::emit(&report, &args.output, &inputs)
}

impl Render for Layout {
    fn table(&self) -> String {
        let mut table = new_table(vec![
            "Course",
            "Pitch",
            "Hz",
            "String",
            "Diameter",
            "Tension N",
            "Length mm",
            "Length in",
            "Step",
            "Stress",
            "B",
            "Partials c",
            "Bend N",
        ]);
        for course in &self.courses {
            let [b, partials, bend] = feel::cells(&course.feel);
            let marked = |kind: JumpKind| {
                self.jumps
                    .iter()
                    .any(|j| j.to_course == course.course && j.kind == kind)
            };
            table.add_row(vec![
                right(course.course.to_string()),
                cell(course_pitch_text(&course.pitch)),
                right(format!("{:.2}", course.pitch.hz)),
                cell(&course.string),
                right(maybe(course.diameter_mm, |d| format!("{d:.3} mm"))),
                right(format!("{:.1}", course.tension_n)),
                right(format!(
                    "{:.1}{}",
                    course.length_m * 1000.0,
                    if marked(JumpKind::FoldBack) {
                        " ↶"
                    } else {
                        ""
                    }
                )),
                right(format!(
                    "{:.2}",
                    course.length_m / taut::input::units::METRES_PER_INCH
                )),
                right(format!(
                    "{}{}",
                    maybe(course.step_pct, |s| format!("{s:+.1}%")),
                    if marked(JumpKind::Step) { " !" } else { "" }
                )),
                right(maybe(course.stress_ratio, |s| format!("{:.0}%", s * 100.0))),
                right(b),
                right(partials),
                right(bend),
            ]);
            for other in &course.other_strings {
                table.add_row(vec![
                    right(String::new()),
                    cell(format!("  {}", other.interval)),
                    right(format!("{:.2}", other.pitch_hz)),
                    cell(&other.string),
                    right(maybe(other.diameter_mm, |d| format!("{d:.3} mm"))),
                    right(format!("{:.1}", other.tension_n)),
                    right(String::new()),
                    right(String::new()),
                    right(String::new()),
                    right(maybe(other.stress_ratio, |s| format!("{:.0}%", s * 100.0))),
                    right(String::new()),
                    right(String::new()),
                    right(String::new()),
                ]);
            }
        }
        let mut out = format!(
            "{} — tuning {}\n{table}\n",
            user(&self.name),
            user(&self.tuning)
        );
        out.push_str(&format!(
            "Total tension: {:.1} N over {} string(s) on {} course(s)",
            self.total_tension_n,
            self.string_count,
            self.courses.len(),
        ));
        if let Some(rated) = self.rated_load_n {
            out.push_str(&format!(
                " ({:.0}% of the rated {rated:.0} N)",
                self.total_tension_n / rated * 100.0
            ));
        }
        out.push_str(&format!(
            ".\nStep: change of √(T/μ) from the previous course (limit ±{:.0}%; ! marks a step over it). ↶ marks a fold-back: the length moves against the pitch.\n",
            self.max_step * 100.0
        ));
        if self.jumps.is_empty() {
            out.push_str("No impractical jumps between neighbouring courses.\n");
        } else {
            out.push_str(&format!("\nImpractical jumps ({}):\n", self.jumps.len()));
            for jump in &self.jumps {
                out.push_str(&format!("  {}\n", user(&jump.message)));
            }
        }
        out.push_str(&feel_legend(
            self.courses
                .first()
                .map_or(feel::DEFAULT_BEND_CENTS, |c| c.feel.bend_cents),
        ));
        out.push_str(&warnings_and_cautions(&self.warnings, &self.cautions));
        out
    }
}
