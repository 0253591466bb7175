//! `taut lengths`: the vibrating lengths that give each course its tension, for builders.

use clap::Args;
use serde::Serialize;

use taut::error::{Error, Result};
use taut::input::units::Force;
use taut::instrument::{Percent, TensionSpec};
use taut::lengths::JumpKind;
use taut::lengths::{self, Layout, LayoutInput, LayoutOptions};
use taut::strings::feel;

use super::audit::FeelArgs;
use taut::plan::remedy::{self, Build};
use taut::strings::select::{DEFAULT_CAUTION, DEFAULT_DANGER};

use super::layout::{paragraph, wrap, Column, Give};
use super::output::{self, csv_text, sig, sig_opt, OutputArgs, Render, UnitArgs, View};
use super::parse_flag;
use super::pictures::{self, PlotArgs};
use super::stock::StockArgs;
use super::text::{
    build_of_kind, change, course_pitch_text, diameter, diameter_symbol, feel_columns, force,
    force_with_unit, gauge_line, length, maybe, push_closing, status, stress_bar, total_sentence,
    user, warning_kinds, Lead, LeadRanks, StringReport,
};

/// Arguments of `taut lengths`.
#[derive(Debug, Args)]
#[command(
    about = "Solve vibrating lengths from pitch, string and tension: one course, or a whole layout with a smooth tension profile",
    after_help = "Either give a LAYOUT file, or one course with --pitch, --string and --tension, e.g.\n  taut lengths --pitch A3 --string '{kind: plain-steel, diameter: 0.016in}' --tension 60N\n\nChart for --plot: lengths (the bridge line, with the tension profile on the right axis).\n\nStrings break: wear eye protection, bring tension up gradually and keep within the maker's load rating."
)]
pub struct LengthsArgs {
    /// A layout file (courses with pitch, string and tension) or a shipped example's name.
    #[arg(value_name = "LAYOUT", required_unless_present = "pitch", conflicts_with_all = ["pitch", "string"])]
    pub layout: Option<String>,
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
    /// Also save the solved layout as an instrument file (each course's length and strings),
    /// for `taut plan` (written together with the report: all or none).
    #[arg(long, value_name = "FILE", requires = "layout")]
    pub save_instrument: Option<output::Target>,
    #[command(flatten)]
    pub stock: StockArgs,
    #[command(flatten)]
    pub feel: FeelArgs,
    #[command(flatten)]
    pub units: UnitArgs,
    #[command(flatten)]
    pub output: OutputArgs,
    #[command(flatten)]
    pub order: super::order::OrderArgs,
    #[command(flatten)]
    pub plots: PlotArgs,
}

/// Runs `taut lengths`.
pub fn run(args: LengthsArgs) -> Result<()> {
    let (plots, size) = args.plots.requests(&["lengths"])?;
    let order = args.order.request()?;
    let tension: Option<TensionSpec> = parse_flag(args.tension.as_deref(), "--tension")?;
    let stock = args.stock.load()?;
    let input = match (&args.layout, &args.pitch, &args.string) {
        (Some(spec), _, _) => {
            use taut::input::examples::{self, FileKind};
            let (text, origin) = examples::read(spec, "LAYOUT")?;
            LayoutInput::from_text(text.clone(), &origin, &stock).map_err(|err| {
                examples::wrong_kind(&text, &origin, FileKind::Layout).unwrap_or(err)
            })?
        }
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
    let mut report = lengths::lay_out(
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
    let builds: Vec<(u32, Build)> = report
        .courses
        .iter()
        .map(|course| (course.course, build_of_kind(&stock, &course.string)))
        .collect();
    // `lengths` holds the tension and solves the length, so its fixes are the ones for that.
    remedy::attach_in(remedy::Solving::Lengths, &mut report.warnings, |warning| {
        builds
            .iter()
            .find(|(course, _)| Some(*course) == warning.course)
            .map_or(Build::Unknown, |(_, build)| *build)
    });
    let mut inputs = output::Inputs::new();
    inputs.maybe_spec(args.tuning.as_deref());
    if let Some(layout) = &args.layout {
        inputs.spec(layout);
    }
    if let Some(spec) = &input.tuning {
        inputs.spec(spec);
    }
    for file in &args.stock.files {
        inputs.file(file);
    }
    let text = output::report_text(&report, &args.output, Some(&args.units))?;
    let mut outputs = output::Outputs::new(&inputs);
    if !plots.is_empty() {
        let charts = taut::charts::build::layout(&report);
        pictures::add(&mut outputs, &plots, size, &charts)?;
    }
    if order.is_some() {
        let rows = order_rows(&report, &stock, args.order.marking)?;
        let view = View::new(&args.output, Some(&args.units));
        args.order.add(&mut outputs, &report.name, &rows, &view)?;
    }
    if let Some(target) = &args.save_instrument {
        // The spec that loaded, so `plan` can load it back.
        let tuning = args
            .tuning
            .clone()
            .or_else(|| input.tuning.clone())
            .unwrap_or_else(|| lengths::DEFAULT_TUNING.to_string());
        outputs.add(
            "--save-instrument",
            Some(target.clone()),
            report.instrument_text(&input, &tuning).into_bytes(),
        );
    }
    outputs.add("--output", args.output.output.clone(), text.into_bytes());
    outputs.write()
}

/// The order sheet's rows of a layout: each course's strings as solved (named by the layout or
/// chosen from its kinds), on the solved length (a layout states no anchor or post lengths, so no cut length).
fn order_rows(
    report: &Layout,
    stock: &taut::strings::stock::Stock,
    marking: bool,
) -> Result<Vec<taut::charts::order::OrderRow>> {
    use taut::charts::order::{self, OrderString};
    let (kinds, materials) = (stock.kinds(), stock.materials());
    let mut strings = Vec::new();
    for course in &report.courses {
        let first = OrderString {
            course: course.course,
            string: 1,
            pitch: &course.pitch.label,
            note_name: &course.pitch.note_name,
            pitch_hz: course.pitch.hz,
            kind: &course.string,
            construction: course.entry.resolve(kinds, materials)?.construction,
            length_m: course.length_m,
            anchor_m: None,
            post_m: None,
            tension_n: course.tension_n,
        };
        strings.push(first);
        for (index, other) in course.other_strings.iter().enumerate() {
            strings.push(OrderString {
                string: index + 2,
                pitch: &other.interval,
                pitch_hz: other.pitch_hz,
                kind: &other.string,
                construction: other.entry.resolve(kinds, materials)?.construction,
                tension_n: other.tension_n,
                ..first
            });
        }
    }
    Ok(order::rows(strings, marking))
}

impl Render for Layout {
    fn table(&self, view: &View) -> String {
        let mut columns = vec![
            Column::text("string").give(Give::Shorten(10, 3)),
            Column::figure(&format!("⌀ {}", diameter_symbol(view.length))),
            Column::figure(view.force.symbol()),
            Column::figure(&format!("length {}", view.length.symbol())),
            Column::figure("step"),
            Column::text("stress"),
        ];
        if view.wide {
            columns.extend(feel_columns());
        }
        // The solved length is this report's own column, beside the step it makes.
        let mut report = StringReport::new(
            view,
            "status",
            false,
            LeadRanks { hz: 5, length: 1 },
            columns,
        );
        for course in &self.courses {
            let marked = |kind: JumpKind| {
                self.jumps
                    .iter()
                    .any(|j| j.to_course == course.course && j.kind == kind)
            };
            let course_warnings = self
                .warnings
                .iter()
                .filter(|w| w.course == Some(course.course));
            let pitch = course_pitch_text(&course.pitch);
            let mut own = vec![
                user(&course.string).into_owned(),
                maybe(course.diameter_mm, |d| diameter(d, view.length)),
                force(course.tension_n, view.force),
                format!(
                    "{}{}",
                    length(course.length_m, view.length),
                    if marked(JumpKind::FoldBack) {
                        " ↶"
                    } else {
                        ""
                    }
                ),
                format!(
                    "{}{}",
                    maybe(course.step_pct, |s| change(s, 1)),
                    if marked(JumpKind::Step) { " !" } else { "" }
                ),
                stress_bar(course.stress_ratio, DEFAULT_CAUTION, DEFAULT_DANGER),
            ];
            if view.wide {
                own.extend(feel::cells(&course.feel));
            }
            let lead = Lead {
                course: course.course,
                first: true,
                status: status(course_warnings),
                pitch: &pitch,
                interval: "",
                hz: course.pitch.hz,
                length_m: course.length_m,
            };
            report.row(lead, own);
            for other in &course.other_strings {
                let lead = Lead {
                    first: false,
                    status: "",
                    interval: &other.interval,
                    hz: other.pitch_hz,
                    ..lead
                };
                report.row(
                    lead,
                    [
                        user(&other.string).into_owned(),
                        maybe(other.diameter_mm, |d| diameter(d, view.length)),
                        force(other.tension_n, view.force),
                        String::new(),
                        String::new(),
                        stress_bar(other.stress_ratio, DEFAULT_CAUTION, DEFAULT_DANGER),
                    ],
                );
            }
        }
        let mut out = String::new();
        report.write(
            &mut out,
            &format!("{} · tuning {}", user(&self.name), user(&self.tuning)),
            None,
        );
        let gauges: Vec<Vec<(f64, bool)>> = self
            .courses
            .iter()
            .map(|course| {
                course
                    .diameter_mm
                    .map(|d| vec![(d, course.string.contains("wound"))])
                    .unwrap_or_default()
            })
            .collect();
        out.push_str(&paragraph(&gauge_line(&gauges, view.length), view.width));
        let total = total_sentence(
            format!(
                "Total tension {} over {} {} on {} {}",
                force_with_unit(self.total_tension_n, view.force),
                self.string_count,
                if self.string_count == 1 {
                    "string"
                } else {
                    "strings"
                },
                self.courses.len(),
                if self.courses.len() == 1 {
                    "course"
                } else {
                    "courses"
                },
            ),
            self.total_tension_n,
            self.rated_load_n,
            view,
        );
        out.push_str(&paragraph(
            &format!(
                "{total} Step: change of √(T/μ) from the previous course (limit ±{:.0}%; ! marks a step over it). ↶ marks a fold-back: the length moves against the pitch.",
                self.max_step * 100.0
            ),
            view.width,
        ));
        if self.jumps.is_empty() {
            out.push_str("No impractical jumps between neighbouring courses.\n");
        } else {
            out.push_str(&format!("\nImpractical jumps ({}):\n", self.jumps.len()));
            for jump in &self.jumps {
                out.push_str(&wrap(&user(&jump.message), view.width, "  ", "  "));
            }
        }
        let bend_cents = self
            .courses
            .first()
            .map_or(feel::DEFAULT_BEND_CENTS, |c| c.feel.bend_cents);
        push_closing(
            &mut out,
            Some(bend_cents),
            &self.warnings,
            &[],
            &self.cautions,
            view,
        );
        out
    }

    fn csv(&self) -> Result<String> {
        let rows = self.courses.iter().map(|course| LayoutRow {
            course: course.course,
            pitch: &course.pitch.written,
            note_name: &course.pitch.note_name,
            pitch_hz: sig(course.pitch.hz),
            kind: &course.string,
            diameter_mm: sig_opt(course.diameter_mm),
            diameter_in: sig_opt(course.diameter_in),
            unit_mass_kg_per_m: sig(course.unit_mass_kg_per_m),
            tension_n: sig(course.tension_n),
            length_m: sig(course.length_m),
            step_pct: sig_opt(course.step_pct),
            stress_ratio: sig_opt(course.stress_ratio),
            break_pitch_hz: sig_opt(course.break_pitch_hz),
            inharmonicity: sig_opt(course.feel.inharmonicity_b),
            warnings: warning_kinds(
                self.warnings
                    .iter()
                    .filter(|w| w.course == Some(course.course)),
            ),
        });
        csv_text(rows)
    }
}

/// One CSV row of a layout: the plan's field names where they mean the same.
#[derive(Serialize)]
struct LayoutRow<'a> {
    course: u32,
    pitch: &'a str,
    note_name: &'a str,
    pitch_hz: f64,
    kind: &'a str,
    diameter_mm: Option<f64>,
    diameter_in: Option<f64>,
    unit_mass_kg_per_m: f64,
    tension_n: f64,
    length_m: f64,
    step_pct: Option<f64>,
    stress_ratio: Option<f64>,
    break_pitch_hz: Option<f64>,
    inharmonicity: Option<f64>,
    warnings: String,
}
