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

use super::layout::{paragraph, Column, Give};
use super::output::{self, csv_text, sig, sig_opt, OutputArgs, Render, UnitArgs, View};
use super::parse_flag;
use super::pictures::{self, PlotArgs};
use super::sound::{self, SoundArgs};
use super::stock::StockArgs;
use super::text::{
    build_of_kind, change, diameter, diameter_symbol, force, force_with_unit, gauge_line, length,
    maybe, pitch_with_note, status, stress_bar, user,
};
use taut::plan::solve::tuning_for;

mod render;
#[allow(unused_imports)]
use render::*;

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
    pub order: super::order::OrderArgs,
    #[command(flatten)]
    pub plots: PlotArgs,
    #[command(flatten)]
    pub sound: SoundArgs,
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
    let sound = args.sound.request()?;
    let order = args.order.request()?;
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
    if let Some(request) = &sound {
        let sources = taut::sound::score::sources_of_conversion(&conversion);
        sound::add_sources(&mut outputs, request, &sources, &tuning_after)?;
    }
    if order.is_some() {
        let rows = order_rows(&conversion, &after, &stock, args.order.marking)?;
        let view = output::View::new(&args.output, Some(&args.units));
        let title = format!(
            "{} in {}",
            conversion.instrument_after, conversion.tuning_after
        );
        args.order.add(&mut outputs, &title, &rows, &view)?;
    }
    outputs.add("--output", args.output.output.clone(), report.into_bytes());
    outputs.write()
}

/// The order sheet's rows of a conversion: the strings after, on the new instrument's lengths,
/// with its anchor and post lengths where it states them.
fn order_rows(
    conversion: &Conversion,
    after: &Instrument,
    stock: &Stock,
    marking: bool,
) -> Result<Vec<taut::charts::order::OrderRow>> {
    use taut::charts::order::{self, OrderString};
    let (kinds, materials) = (stock.kinds(), stock.materials());
    let mut strings = Vec::new();
    for course in &conversion.courses {
        let input = (0..after.courses.len())
            .find(|&i| after.course_number(i) == course.course)
            .and_then(|i| after.course_input(i, None));
        for (index, string) in course.strings.iter().enumerate() {
            strings.push(OrderString {
                course: course.course,
                string: index + 1,
                pitch: if index == 0 {
                    &course.pitch_label
                } else {
                    &string.interval
                },
                note_name: &course.note_name,
                pitch_hz: string.after.pitch_hz,
                kind: &string.after.string,
                construction: string.set_string.resolve(kinds, materials)?.construction,
                length_m: course.length_after_m,
                anchor_m: input.and_then(|c| c.anchor_m),
                post_m: input.and_then(|c| c.post_m),
                tension_n: string.after.tension_n,
            });
        }
    }
    Ok(order::rows(strings, marking))
}
