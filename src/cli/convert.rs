//! `taut convert`: from the installed set in one tuning to the set for another tuning, scale
//! length or instrument layout.

use clap::Args;
use serde::Serialize;

use taut::error::{Error, Result};
use taut::input::units::{Diameter, Length};
use taut::instrument::{Instrument, Percent, TensionSpec};
use taut::sets::convert::{self, Conversion, ConvertOptions, FeelRule};
use taut::strings::feel;

use super::audit::FeelArgs;
use taut::plan::remedy::{self, Build};
use taut::strings::select::{DEFAULT_CAUTION, DEFAULT_DANGER};
use taut::strings::stock::Stock;

use super::layout::{hidden_note, paragraph, Column, Give, Grid};
use super::output::{self, csv_text, sig, sig_opt, OutputArgs, Render, UnitArgs, View};
use super::parse_flag;
use super::pictures::{self, PlotArgs};
use super::stock::StockArgs;
use super::text::{
    build_of_kind, change, diameter, diameter_symbol, feel_legend, force, force_with_unit,
    gauge_line, length, maybe, pitch_with_note, status, stress_bar, user, warnings_and_cautions,
};
use taut::plan::solve::tuning_for;

/// Arguments of `taut convert`.
#[derive(Debug, Args)]
#[command(
    about = "Plan the strings for a new tuning or scale length from the set installed now: keep each string's feel, check the nut slots and the total load",
    after_help = "Charts for --plot CHART=FILE: tension and stress, before and after on one chart each.\n\nStrings break and necks move under a changed load: wear eye protection, change one course at a time and bring tension up gradually, respect the maker's load rating, and leave truss-rod and setup work to a qualified person."
)]
pub struct ConvertArgs {
    /// The instrument as it is now (a YAML file or a built-in template).
    #[arg(value_name = "INSTRUMENT")]
    pub instrument: String,
    /// The installed strings: a string-set file or a shipped example's name.
    #[arg(long, value_name = "SET")]
    pub set: String,
    /// The tuning the strings are in now (default: the instrument's own).
    #[arg(long, value_name = "TUNING")]
    pub from: Option<String>,
    /// The tuning to convert to (default: the same tuning, e.g. for a new scale length).
    #[arg(long, value_name = "TUNING")]
    pub to: Option<String>,
    /// Transpose every course: semitones (`-5`), cents (`-498c`), a ratio (`3/4`) or EDO steps
    /// (`-8\\19`); the new pitches are named in the report.
    #[arg(long, value_name = "SHIFT", allow_hyphen_values = true)]
    pub transpose: Option<String>,
    /// What keeping the feel keeps: each string's tension, or the push its bend takes.
    #[arg(long, value_enum, default_value = "tension", value_name = "RULE")]
    pub keep_feel: KeepFeel,
    /// The instrument after conversion, when courses change (e.g. an added low course);
    /// courses are matched by number.
    #[arg(long, value_name = "INSTRUMENT")]
    pub to_instrument: Option<String>,
    /// A new vibrating length for every course, e.g. `27in`.
    #[arg(long, value_name = "LENGTH")]
    pub scale_length: Option<String>,
    /// A new tension for every course instead of keeping each string's own: `70N` or
    /// `60N..90N`.
    #[arg(long, value_name = "TENSION", allow_hyphen_values = true)]
    pub tension: Option<String>,
    /// How far from the target tension a string may land, e.g. `10%`.
    #[arg(long, value_name = "PERCENT")]
    pub tolerance: Option<String>,
    /// Nut-slot width to check the new strings against, e.g. `1.4mm` (default: the instrument's
    /// `max_diameter`, else each old string's width).
    #[arg(long, value_name = "LENGTH")]
    pub slot: Option<String>,
    /// Choose every string afresh, even those that would still do.
    #[arg(long)]
    pub reselect_all: bool,
    /// Also write the new set as a string-set file (written together with the report: both or
    /// neither).
    #[arg(long, value_name = "FILE")]
    pub save_set: Option<output::Target>,
    #[command(flatten)]
    pub stock: StockArgs,
    #[command(flatten)]
    pub feel: FeelArgs,
    #[command(flatten)]
    pub units: UnitArgs,
    #[command(flatten)]
    pub output: OutputArgs,
    #[command(flatten)]
    pub plots: PlotArgs,
}

/// What `--keep-feel` keeps.
#[derive(Debug, Clone, Copy, PartialEq, Eq, clap::ValueEnum)]
pub enum KeepFeel {
    /// Each string aims for the tension it had.
    Tension,
    /// Each string aims for the tension at which its bend takes the same push as before.
    Bend,
}

fn positive_length(text: &Option<String>, flag: &str) -> Result<Option<f64>> {
    Ok(parse_flag::<Length>(text.as_deref(), flag)?.map(Length::si))
}

/// Runs `taut convert`.
pub fn run(args: ConvertArgs) -> Result<()> {
    let (plots, size) = args.plots.requests(&["tension", "stress"])?;
    let before = Instrument::load(&args.instrument)?;
    let after = match &args.to_instrument {
        Some(spec) => Instrument::load(spec).map_err(|err| err.in_origin("--to-instrument"))?,
        None => before.clone(),
    };
    let stock = args.stock.load()?;
    let set = super::audit::load_set(&args.set, &stock)?;
    // The tuning the strings are in now: --from, else the set file's `tuning:`, else the
    // instrument's own.
    let tuning_before = match (&args.from, &set.tuning) {
        (None, Some(spec)) => taut::tuning::load(spec)
            .map_err(|err| set.point(err, &[taut::input::yaml::PathStep::Key("tuning")]))?,
        _ => tuning_for(&before, args.from.as_deref(), "--from")?,
    };
    // Without --to, the strings stay in the tuning they are in now unless a new instrument file
    // names its own.
    let keeps_tuning =
        args.to.is_none() && (args.to_instrument.is_none() || after.tuning.is_none());
    let tuning_after = if keeps_tuning {
        tuning_before.clone()
    } else {
        tuning_for(&after, args.to.as_deref(), "--to")?
    };
    let target: Option<TensionSpec> = parse_flag(args.tension.as_deref(), "--tension")?;
    let tolerance = parse_flag::<Percent>(args.tolerance.as_deref(), "--tolerance")?
        .map_or(taut::strings::select::DEFAULT_TOLERANCE, Percent::fraction);
    if tolerance >= 1.0 {
        return Err(Error::input("the tolerance must be below 100%").in_origin("--tolerance"));
    }
    if target.is_some() && args.keep_feel == KeepFeel::Bend {
        return Err(
            Error::input("--tension sets every target, so there is no old feel to keep")
                .help("leave out --keep-feel, or leave out --tension")
                .in_origin("--keep-feel"),
        );
    }
    let options = ConvertOptions {
        transpose: parse_flag(args.transpose.as_deref(), "--transpose")?,
        rule: match args.keep_feel {
            KeepFeel::Tension => FeelRule::EqualTension,
            KeepFeel::Bend => FeelRule::EqualBend,
        },
        tolerance,
        target,
        scale_length: positive_length(&args.scale_length, "--scale-length")?,
        slot_width: parse_flag::<Diameter>(args.slot.as_deref(), "--slot")?.map(Diameter::si),
        reselect_all: args.reselect_all,
        feel: args.feel.options()?,
        ..ConvertOptions::default()
    };
    let mut conversion = convert::convert(
        &before,
        &set,
        &tuning_before,
        &after,
        &tuning_after,
        &stock,
        &options,
    )?;
    let mut inputs = output::Inputs::new();
    inputs
        .spec(&args.instrument)
        .file(&args.set)
        .maybe_spec(args.from.as_deref())
        .maybe_spec(args.to.as_deref())
        .maybe_spec(args.to_instrument.as_deref())
        .maybe_spec(before.tuning.as_deref())
        .maybe_spec(after.tuning.as_deref())
        .maybe_spec(set.tuning.as_deref());
    for file in &args.stock.files {
        inputs.file(file);
    }
    attach_fixes(&mut conversion, &stock);
    let report = output::report_text(&conversion, &args.output, Some(&args.units))?;
    let mut outputs = output::Outputs::new(&inputs);
    if !plots.is_empty() {
        let charts = taut::charts::build::conversion(&conversion, &after);
        pictures::add(&mut outputs, &plots, size, &charts)?;
    }
    if let Some(target) = &args.save_set {
        let mut new_set = conversion.new_set();
        // The spec that loads, not the tuning's display name.
        let spec = match (keeps_tuning, &args.from, &args.to) {
            (false, _, Some(to)) => Some(to.clone()),
            (false, _, None) => after.tuning.clone(),
            (true, Some(from), _) => Some(from.clone()),
            (true, None, _) => set.tuning.clone().or_else(|| before.tuning.clone()),
        };
        new_set.tuning = Some(spec.unwrap_or_else(|| taut::plan::solve::DEFAULT_TUNING.into()));
        outputs.add(
            "--save-set",
            Some(target.clone()),
            new_set.to_yaml().into_bytes(),
        );
    }
    outputs.add("--output", args.output.output.clone(), report.into_bytes());
    outputs.write()
}

impl Render for Conversion {
    fn table(&self, view: &View) -> String {
        let lengths_vary = self
            .courses
            .windows(2)
            .any(|pair| (pair[0].length_after_m - pair[1].length_after_m).abs() > 1e-9);
        let show_length = view.wide || lengths_vary;
        let mut columns = vec![
            Column::figure("#"),
            Column::text("status"),
            Column::text("pitch").give(Give::Shorten(8)),
            Column::figure("Hz").give(Give::Drop(3)),
        ];
        if show_length {
            columns.push(
                Column::figure(&format!("length {}", view.length.symbol())).give(Give::Drop(2)),
            );
        }
        if view.wide {
            columns.extend([
                Column::text("string before").give(Give::Shorten(10)),
                Column::figure("⌀").give(Give::Drop(4)),
                Column::figure(&format!("{} before", view.force.symbol())).give(Give::Drop(5)),
            ]);
        }
        columns.extend([
            Column::text("string after").give(Give::Shorten(10)),
            Column::figure(&format!("⌀ {}", diameter_symbol(view.length))),
            Column::figure(view.force.symbol()),
            Column::figure("change"),
            Column::text("stress"),
            Column::text("slot").give(Give::Drop(1)),
        ]);
        if view.wide {
            columns.extend([
                Column::figure("B").give(Give::Drop(6)),
                Column::figure("partials c").give(Give::Drop(7)),
                Column::figure("bend N").give(Give::Drop(8)),
            ]);
        }
        let mut grid = Grid::new(columns);
        for course in &self.courses {
            for (index, string) in course.strings.iter().enumerate() {
                let first = index == 0;
                let before = string.before.as_ref();
                let string_warnings = course
                    .warnings
                    .iter()
                    .filter(|w| w.string == Some(index + 1));
                let state = match (before, string.kept, status(string_warnings)) {
                    (_, _, "ok" | "note") if string.kept => "kept",
                    (None, _, "ok" | "note") => "new",
                    (Some(_), _, "ok" | "note") => "replace",
                    (_, _, other) => other,
                };
                let pitch = pitch_with_note(
                    &course.pitch_label,
                    &course.note_name,
                    course.note_offset_cents,
                );
                let mut row = vec![
                    if first {
                        course.course.to_string()
                    } else {
                        String::new()
                    },
                    state.to_string(),
                    if !first {
                        format!("  {}", string.interval)
                    } else {
                        match &course.pitch_before {
                            Some(old) if *old != course.pitch_after => format!("{old} → {pitch}"),
                            _ => pitch,
                        }
                    },
                    format!("{:.2}", string.after.pitch_hz),
                ];
                if show_length {
                    row.push(if first {
                        length(course.length_after_m, view.length)
                    } else {
                        String::new()
                    });
                }
                if view.wide {
                    row.extend([
                        before.map_or("(new course)".to_string(), |b| user(&b.string).into_owned()),
                        maybe(before.and_then(|b| b.diameter_mm), |d| {
                            diameter(d, view.length)
                        }),
                        maybe(before.map(|b| b.tension_n), |t| force(t, view.force)),
                    ]);
                }
                row.extend([
                    user(&string.after.string).into_owned(),
                    maybe(string.after.diameter_mm, |d| diameter(d, view.length)),
                    force(string.after.tension_n, view.force),
                    maybe(string.tension_change_pct, |c| change(c, 1)),
                    stress_bar(string.after.stress_ratio, DEFAULT_CAUTION, DEFAULT_DANGER),
                    match &string.slot {
                        Some(fit) if !fit.fits => format!("+{:.2} mm", fit.wider_by_mm),
                        Some(_) => "fits".to_string(),
                        None => "-".to_string(),
                    },
                ]);
                if view.wide {
                    row.extend(feel::cells(&string.feel_after));
                }
                grid.row(row);
            }
        }
        let mut out = paragraph(
            &format!(
                "{} ({}) → {} ({}) · set now {}",
                user(&self.instrument_before),
                user(&self.tuning_before),
                user(&self.instrument_after),
                user(&self.tuning_after),
                user(&self.set)
            ),
            view.width,
        );
        let (table, hidden) = grid.render(view.width);
        out.push_str(&table);
        out.push_str(&hidden_note(&hidden, view.wide, view.width));
        if let Some(first) = self.courses.first() {
            if let Some(before) = first.length_before_m {
                if (before - first.length_after_m).abs() > 1e-9 {
                    out.push_str(&format!(
                        "Scale length {} → {} {}.\n",
                        length(before, view.length),
                        length(first.length_after_m, view.length),
                        view.length.symbol()
                    ));
                }
            }
        }
        let strings = self.courses.iter().flat_map(|c| &c.strings);
        let added = strings.clone().filter(|s| s.before.is_none()).count();
        let kept = strings.clone().filter(|s| s.kept).count();
        let replaced = strings.filter(|s| !s.kept && s.before.is_some()).count();
        let mut counts = vec![
            format!(
                "{replaced} {} replaced",
                plural(replaced, "string", "strings")
            ),
            format!("{kept} kept"),
        ];
        if added > 0 {
            counts.push(format!("{added} new on added courses"));
        }
        out.push_str(&paragraph(&format!("{}.", counts.join(", ")), view.width));
        if let Some(shift) = &self.transpose {
            out.push_str(&paragraph(
                &format!(
                    "Transposed by {}: the pitches after are named anew.",
                    shift.describe()
                ),
                view.width,
            ));
        }
        out.push_str(&paragraph(
            &self.rule.sentence(
                self.courses
                    .first()
                    .and_then(|c| c.strings.first())
                    .map_or(feel::DEFAULT_BEND_CENTS, |s| s.feel_after.bend_cents),
            ),
            view.width,
        ));
        for change in &self.kept_tension_changes {
            out.push_str(&crate::cli::layout::wrap(
                &user(&change.message),
                view.width,
                "  ",
                "    ",
            ));
        }
        if !self.removed_courses.is_empty() {
            out.push_str(&paragraph(
                &format!(
                    "Courses no longer on the instrument: {}.",
                    self.removed_courses
                        .iter()
                        .map(u32::to_string)
                        .collect::<Vec<_>>()
                        .join(", ")
                ),
                view.width,
            ));
        }
        let gauges: Vec<Vec<(f64, bool)>> = self
            .courses
            .iter()
            .map(|course| {
                course
                    .strings
                    .iter()
                    .filter_map(|s| {
                        s.after
                            .diameter_mm
                            .map(|d| (d, s.after.string.contains("wound")))
                    })
                    .collect()
            })
            .collect();
        out.push_str(&paragraph(&gauge_line(&gauges, view.length), view.width));
        let mut total = format!(
            "Total load {} → {} ({})",
            force_with_unit(self.total_before_n, view.force),
            force_with_unit(self.total_after_n, view.force),
            change(self.total_change_pct, 1)
        );
        if let Some(rated) = self.rated_load_n {
            total.push_str(&format!(
                ", {:.0}% of the rated {}",
                self.total_after_n / rated * 100.0,
                force_with_unit(rated, view.force)
            ));
        }
        total.push('.');
        out.push_str(&paragraph(&total, view.width));
        if view.wide {
            out.push_str(&feel_legend(
                self.courses
                    .first()
                    .and_then(|c| c.strings.first())
                    .map_or(feel::DEFAULT_BEND_CENTS, |s| s.feel_after.bend_cents),
                view,
            ));
        }
        let load: Vec<String> = self
            .load_caution
            .iter()
            .map(|c| user(c).into_owned())
            .collect();
        out.push_str(&warnings_and_cautions(
            &self.warnings,
            &load,
            &self.cautions,
            view,
        ));
        out
    }

    fn csv(&self) -> Result<String> {
        let mut rows = Vec::new();
        for course in &self.courses {
            for (index, string) in course.strings.iter().enumerate() {
                let before = string.before.as_ref();
                rows.push(ConvertRow {
                    course: course.course,
                    string: index + 1,
                    interval: &string.interval,
                    pitch_before: course.pitch_before.as_deref(),
                    pitch: &course.pitch_after,
                    note_name: &course.note_name,
                    pitch_hz: sig(string.after.pitch_hz),
                    length_before_m: sig_opt(course.length_before_m),
                    length_m: sig(course.length_after_m),
                    kind_before: before.map(|b| b.string.as_str()),
                    diameter_mm_before: sig_opt(before.and_then(|b| b.diameter_mm)),
                    tension_n_before: sig_opt(before.map(|b| b.tension_n)),
                    kind: &string.after.string,
                    gauge: string.after.gauge.as_deref(),
                    diameter_mm: sig_opt(string.after.diameter_mm),
                    diameter_in: sig_opt(string.after.diameter_in),
                    unit_mass_kg_per_m: sig(string.after.unit_mass_kg_per_m),
                    target_tension_n: sig(string.target_tension_n),
                    tension_n: sig(string.after.tension_n),
                    tension_change_pct: sig_opt(string.tension_change_pct),
                    stress_ratio: sig_opt(string.after.stress_ratio),
                    break_pitch_hz: sig_opt(string.after.break_pitch_hz),
                    kept: string.kept,
                    slot_fits: string.slot.as_ref().map(|fit| fit.fits),
                    warnings: course
                        .warnings
                        .iter()
                        .filter(|w| w.string == Some(index + 1))
                        .map(|w| w.kind.name())
                        .collect::<Vec<_>>()
                        .join(";"),
                });
            }
        }
        csv_text(rows)
    }
}

fn plural(count: usize, one: &'static str, many: &'static str) -> &'static str {
    if count == 1 {
        one
    } else {
        many
    }
}

/// One CSV row of a conversion: the plan's field names for the new string, `_before` for the
/// old one.
#[derive(Serialize)]
struct ConvertRow<'a> {
    course: u32,
    string: usize,
    interval: &'a str,
    pitch_before: Option<&'a str>,
    pitch: &'a str,
    note_name: &'a str,
    pitch_hz: f64,
    length_before_m: Option<f64>,
    length_m: f64,
    kind_before: Option<&'a str>,
    diameter_mm_before: Option<f64>,
    tension_n_before: Option<f64>,
    kind: &'a str,
    gauge: Option<&'a str>,
    diameter_mm: Option<f64>,
    diameter_in: Option<f64>,
    unit_mass_kg_per_m: f64,
    target_tension_n: f64,
    tension_n: f64,
    tension_change_pct: Option<f64>,
    stress_ratio: Option<f64>,
    break_pitch_hz: Option<f64>,
    kept: bool,
    slot_fits: Option<bool>,
    warnings: String,
}

/// Ends every warning of a conversion with what would fix it.
fn attach_fixes(report: &mut Conversion, stock: &Stock) {
    let builds: Vec<(u32, usize, Build)> = report
        .courses
        .iter()
        .flat_map(|course| {
            course.strings.iter().enumerate().map(|(index, string)| {
                (
                    course.course,
                    index + 1,
                    build_of_kind(stock, &string.after.string),
                )
            })
        })
        .collect();
    remedy::attach_by_string(
        report
            .courses
            .iter_mut()
            .map(|course| &mut course.warnings)
            .chain(std::iter::once(&mut report.warnings)),
        &builds,
    );
}
