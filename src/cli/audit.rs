//! `taut audit`: an installed string set under a tuning, with a yes or no per course.

mod several;

use clap::Args;
use serde::Serialize;

use taut::error::{Error, Result};
use taut::input::units::{Force, Length};
use taut::input::yaml::PathStep;
use taut::instrument::{Instrument, Percent};
use taut::sets::audit::{self, Audit, AuditOptions, Verdict, DEFAULT_MAX_CHANGE};
use taut::sets::set::StringSet;
use taut::strings::feel::{self, FeelOptions, DEFAULT_BEND_CENTS, DEFAULT_PUSH_N};
use taut::strings::physics::{DEFAULT_BRIDGE_AFTERLENGTH, DEFAULT_NUT_AFTERLENGTH};
use taut::tuning;

use taut::strings::select::{DEFAULT_CAUTION, DEFAULT_DANGER};
use taut::strings::stock::Stock;

use super::layout::{paragraph, wrap, Column, Give};
use super::output::{self, csv_text, sig, sig_opt, OutputArgs, Render, UnitArgs, View};
use super::parse_flag;
use super::pictures::{self, PlotArgs};
use super::sound::{self, SoundArgs};
use super::stock::StockArgs;
use super::text::{
    change, course_pitch_text, diameter, diameter_symbol, force, force_with_unit, maybe,
    stress_bar, user,
};
use taut::plan::solve::tuning_for;

mod render;
#[allow(unused_imports)]
use render::*;

/// Inputs of the stiffness and bend figures, shared by `audit`, `convert` and `lengths`.
#[derive(Debug, Clone, Args)]
pub struct FeelArgs {
    /// String beyond the nut (or top anchor) that stretches with a bend, e.g. `80mm`.
    #[arg(long, value_name = "LENGTH")]
    pub nut_afterlength: Option<String>,
    /// String beyond the bridge (or bottom anchor) that stretches with a bend, e.g. `40mm`.
    #[arg(long, value_name = "LENGTH")]
    pub bridge_afterlength: Option<String>,
    /// Bend, in cents, for which the sideways force at mid-length is reported.
    #[arg(long, value_name = "CENTS", default_value_t = DEFAULT_BEND_CENTS)]
    pub bend: f64,
    /// Sideways push at mid-length, e.g. `1N`, for which the pitch rise is reported.
    #[arg(long, value_name = "FORCE")]
    pub push: Option<String>,
}

impl FeelArgs {
    /// The checked feel options (defaults: 80 mm and 40 mm afterlengths, 100 cents, 1 N).
    pub fn options(&self) -> Result<FeelOptions> {
        let length = |text: &Option<String>, flag: &str, default: f64| -> Result<f64> {
            match text {
                Some(text) => text
                    .parse::<Length>()
                    .map(Length::si)
                    .map_err(|err| err.in_origin(flag.to_string())),
                None => Ok(default),
            }
        };
        if !(self.bend.is_finite() && self.bend > 0.0 && self.bend <= 1200.0) {
            return Err(Error::input(format!(
                "the bend must be above 0 and at most 1200 cents, not {}",
                self.bend
            ))
            .in_origin("--bend"));
        }
        Ok(FeelOptions {
            nut_afterlength: length(
                &self.nut_afterlength,
                "--nut-afterlength",
                DEFAULT_NUT_AFTERLENGTH,
            )?,
            bridge_afterlength: length(
                &self.bridge_afterlength,
                "--bridge-afterlength",
                DEFAULT_BRIDGE_AFTERLENGTH,
            )?,
            bend_cents: self.bend,
            push_n: match &self.push {
                Some(text) => text
                    .parse::<Force>()
                    .map(Force::si)
                    .map_err(|err| err.in_origin("--push"))?,
                None => DEFAULT_PUSH_N,
            },
        })
    }
}

/// Arguments of `taut audit`.
#[derive(Debug, Args)]
#[command(
    about = "Check an installed string set under a tuning: tension, stress, feel and a yes or no per course",
    after_help = "SET is a string-set file (write one with `taut plan … --save-set FILE`).\n\nCharts for --plot CHART=FILE: tension (the instrument's windows shaded, warnings ringed), stress (caution and danger lines).\n\nStrings break and instruments fail under too much load: wear eye protection, bring tension up gradually, respect the maker's load rating and defer to the maker's specifications."
)]
pub struct AuditArgs {
    /// Instrument definition (a YAML file) or the name of a built-in template.
    #[arg(value_name = "INSTRUMENT")]
    pub instrument: String,
    /// The installed strings: a string-set file or a shipped example's name.
    #[arg(long, value_name = "SET")]
    pub set: String,
    /// Tuning to audit instead of the instrument's own. Give it more than once to audit the set
    /// in every tuning listed, side by side.
    #[arg(long, value_name = "TUNING")]
    pub tuning: Vec<String>,
    /// Audit the set in one of the instrument file's `variants` alone (by name): its tuning and
    /// course pitches, with pictures like any one-tuning audit.
    #[arg(long, value_name = "NAME")]
    pub variant: Option<String>,
    /// Tuning the strings are in now, for the tension changes (default: the own tuning of the
    /// instrument they are on now, when that differs from what is audited).
    #[arg(long, value_name = "TUNING")]
    pub from: Option<String>,
    /// The instrument as strung now, when its course pitches differ from INSTRUMENT's (e.g. the
    /// standard tuning before a retune); courses are matched by number.
    #[arg(long, value_name = "INSTRUMENT")]
    pub from_instrument: Option<String>,
    /// Largest tension change from the current tuning before a course gets "no", e.g. `30%`.
    #[arg(long, value_name = "PERCENT")]
    pub max_change: Option<String>,
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
    #[command(flatten)]
    pub sound: SoundArgs,
}

/// Runs `taut audit`.
pub fn run(args: AuditArgs) -> Result<()> {
    let (plots, size) = args.plots.requests(&["tension", "stress"])?;
    let sound = args.sound.request()?;
    let instrument = Instrument::load(&args.instrument)?;
    let variant_tunings: Vec<String> = instrument
        .variants
        .iter()
        .filter_map(|v| v.tuning.clone())
        .collect();
    // One variant picked: audited alone, as a one-tuning instrument.
    let (instrument, given): (Instrument, Option<String>) = match &args.variant {
        Some(name) => {
            if args.tuning.len() > 1 {
                return Err(taut::Error::input(
                    "--variant audits one variant; give --tuning at most once beside it",
                )
                .in_origin("--variant"));
            }
            let tuning = args.tuning.first().map(String::as_str);
            taut::plan::several::variants::pick(&instrument, name, tuning, "--variant")?
        }
        None => (instrument, args.tuning.first().cloned()),
    };
    let given = given.as_ref();
    let stock = args.stock.load()?;
    let set = load_set(&args.set, &stock)?;
    let now_instrument = match &args.from_instrument {
        Some(spec) => {
            Some(Instrument::load(spec).map_err(|err| err.in_origin("--from-instrument"))?)
        }
        None => None,
    };
    let now = now_instrument.as_ref().unwrap_or(&instrument);
    // The tuning the strings are in now: --from, else the --from-instrument's own, else the
    // set file's `tuning:` (when it differs from what is audited), else the instrument's own.
    let audited_spec = given
        .map(String::as_str)
        .or(instrument.tuning.as_deref())
        .unwrap_or(taut::plan::solve::DEFAULT_TUNING)
        .trim();
    let set_tuning = set
        .tuning
        .as_deref()
        .filter(|spec| given.is_some() || spec.trim() != audited_spec);
    let reference_tuning = match (&args.from, &now_instrument, given, &now.tuning) {
        (Some(spec), _, _, _) => Some(tuning::load(spec).map_err(|err| err.in_origin("--from"))?),
        (None, Some(_), _, None) => Some(tuning::load(taut::plan::solve::DEFAULT_TUNING)?),
        (None, Some(_), _, Some(spec)) => {
            Some(tuning::load(spec).map_err(|err| err.in_origin(now.origin().to_string()))?)
        }
        (None, None, _, _) if set_tuning.is_some() => Some(
            tuning::load(set_tuning.unwrap_or_default())
                .map_err(|err| set.point(err, &[PathStep::Key("tuning")]))?,
        ),
        (None, None, Some(_), Some(spec)) => {
            Some(tuning::load(spec).map_err(|err| err.in_origin(now.origin().to_string()))?)
        }
        _ => None,
    };
    // What says where the strings are, so a refusal can name it.
    let source = match (&args.from, &now_instrument) {
        (Some(_), None) => audit::ReferenceSource::TuningOption("--from"),
        (_, Some(_)) => audit::ReferenceSource::Instrument,
        (None, None) if set_tuning.is_some() => {
            audit::ReferenceSource::SetTuning(set_tuning.unwrap_or_default())
        }
        (None, None) => audit::ReferenceSource::OwnTuning,
    };
    let reference = reference_tuning.as_ref().map(|tuning| audit::Reference {
        instrument: now,
        tuning,
        source,
    });
    let max_change = parse_flag::<Percent>(args.max_change.as_deref(), "--max-change")?
        .map_or(DEFAULT_MAX_CHANGE, Percent::fraction);
    let options = AuditOptions {
        max_change,
        feel: args.feel.options()?,
    };
    let mut inputs = output::Inputs::new();
    inputs
        .spec(&args.instrument)
        .spec(&args.set)
        .maybe_spec(args.from.as_deref())
        .maybe_spec(args.from_instrument.as_deref())
        .maybe_spec(instrument.tuning.as_deref())
        .maybe_spec(now.tuning.as_deref())
        .maybe_spec(set.tuning.as_deref());
    for spec in args.tuning.iter().chain(&variant_tunings) {
        inputs.spec(spec);
    }
    for file in &args.stock.files {
        inputs.file(file);
    }
    if args.tuning.len() > 1 || !instrument.variants.is_empty() {
        if !plots.is_empty() {
            let help = if instrument.variants.is_empty() {
                "audit one tuning at a time for its pictures (`--tuning NAME` once)".to_string()
            } else {
                let names: Vec<&str> = instrument.variants.iter().map(|v| v.name.trim()).collect();
                format!(
                    "pick one variant with `--variant NAME` ({}); run once per variant to draw them all",
                    names.join(", ")
                )
            };
            return Err(
                taut::Error::input("--plot draws one tuning, and this audit has several")
                    .in_origin("--plot")
                    .help(help),
            );
        }
        if sound.is_some() {
            return Err(taut::Error::input(
                "--sound plays one tuning, and this audit has several",
            )
            .in_origin("--sound")
            .help("audit one tuning or variant at a time to hear it (`--tuning NAME` once or `--variant NAME`)"));
        }
        let list = taut::plan::several::variants::resolve(&instrument, &args.tuning, "--tuning")?;
        let report = taut::sets::several::audit(&set, &list, reference, &stock, &options)?;
        return output::emit_in(&report, &args.output, Some(&args.units), &inputs);
    }
    let tuning = tuning_for(&instrument, given.map(String::as_str), "--tuning")?;
    let mut report = audit::audit(&instrument, &set, &tuning, reference, &stock, &options)?;
    attach_fixes(&mut report, &stock);
    pictures::check_places(&plots, args.output.output.as_ref())?;
    let text = output::report_text(&report, &args.output, Some(&args.units))?;
    // Pictures, sound and the report are written together: all of them or none.
    let mut outputs = output::Outputs::new(&inputs);
    if !plots.is_empty() {
        let charts = taut::charts::build::audit(&report, &instrument);
        pictures::add(&mut outputs, &plots, size, &charts)?;
    }
    if let Some(request) = &sound {
        let sources = taut::sound::score::sources_of_audit(&report);
        sound::add_sources(&mut outputs, request, &sources, &tuning)?;
    }
    outputs.add("--output", args.output.output.clone(), text.into_bytes());
    outputs.write()
}

/// Reads a string-set file, or the shipped example of that name; another kind of file is named
/// as such.
pub fn load_set(spec: &str, stock: &Stock) -> Result<StringSet> {
    use taut::input::examples::{self, FileKind};
    let (text, origin) = examples::read(spec, "--set")?;
    StringSet::from_text(text.clone(), &origin, stock)
        .map_err(|err| examples::wrong_kind(&text, &origin, FileKind::StringSet).unwrap_or(err))
}
