//! `taut tuning`: list a tuning's degrees, fit just intervals, compare two tunings, resolve
//! pitches, list the shipped tunings.

use clap::{Args, Subcommand};
use serde::Serialize;

use super::layout::{hidden_note, paragraph, wrap, Column, Give, Grid};
use super::output::{csv_text, emit, sig, sig_opt, Inputs, OutputArgs, Render, View};
use super::pictures::{self, PlotArgs};
use taut::error::{shown, Result};
use taut::tuning::analysis::{fit, FitReport};
use taut::tuning::compare::{compare, Comparison};
use taut::tuning::listing::{default_range, list, DegreeListing};
use taut::tuning::pitch::{format_ratio, nearest_note_as_written, PitchSpec};
use taut::tuning::{library, load, ResolvedPitch, TuningSummary};

mod midi;
mod render;
#[allow(unused_imports)]
use render::*;

const TUNING_HELP: &str = "\
TUNING is looked up in this order:
  1. a shipped tuning by name (see `taut tuning list`), e.g. `31edo`, `just-5-limit`
  2. an inline spec:
       19edo                            19 equal divisions of the octave
       13ed3/1, 88ed1950c               N equal divisions of any interval
       17-TET, 17tet, 13edt, 13ed3      other spellings (13ed3: of the tritave 3/1)
       ratios:1/1,9/8,5/4,4/3,3/2[:2/1] exact ratios of one period, from 1/1
       cents:0,200,400,500,700[:1200c]  cents of one period, from 0
       hertz:98,110,123.47              a fixed list of frequencies
       chain:3/2,6,5[:2/1]              generator, steps up, steps down
  3. a YAML definition file, e.g. `my-scale.yaml`
Any of them may end in `@REFERENCE` to place it in pitch:
  @A4=415  (degree 0 is A4 at 415 Hz; concert A4 for note names follows)
  @C4      (degree 0 is C4 at concert A4 = 440 Hz)
  @261.6256 (degree 0 at 261.6256 Hz; concert A4 stays 440 Hz)
  @deg9=A4=440 (degree 9 is A4 at 440 Hz)
Default: degree 0 = A4 = 440 Hz (ISO 16).
Intervals are written 3/2 (ratio), 701.955c (cents) or 5^(1/4) (power of a ratio).

PITCH forms (for `find`):
  E2  F#3  Bb4  C-1   12-tone note name; must land on a degree of the tuning
  E2+14c  A4-3.5c     note moved by cents (a free pitch)
  ~E2                 the degree nearest to the note
  deg7  deg-12        degree k (degree 0 starts period 0)
  deg3p1  deg0p-2     degree 3 of period 1
  386.3c  -700c       cents from the reference pitch
  3/2  5/4            exact ratio to the reference pitch
  82.41hz             absolute frequency";

/// Work with tunings: list degrees, fit just intervals, compare, resolve pitches.
#[derive(Debug, Args)]
#[command(after_long_help = TUNING_HELP)]
pub struct TuningArgs {
    #[command(subcommand)]
    command: TuningCommand,
}

#[derive(Debug, Subcommand)]
enum TuningCommand {
    /// List degrees: cents, step, exact ratio, Hz and the nearest 12-tone note.
    #[command(after_long_help = TUNING_HELP)]
    Show(ShowArgs),
    /// Measure how closely a tuning approximates the just intervals of an odd limit
    /// (`--plot errors=FILE` draws each interval's error in cents).
    #[command(after_long_help = TUNING_HELP)]
    Fit(FitArgs),
    /// Set two tunings side by side: each degree of the first against the nearest of the second.
    #[command(after_long_help = TUNING_HELP)]
    Compare(CompareArgs),
    /// Resolve pitches (notes, degrees, cents, ratios, Hz) in a tuning.
    #[command(after_long_help = TUNING_HELP)]
    Find(FindArgs),
    /// List the tunings shipped with taut.
    List(ListArgs),
    /// Send a tuning to synthesizers: MIDI Tuning Standard messages (a bulk dump, single-note
    /// changes) and a Standard MIDI File of its scale or chords; lists which note carries
    /// which degree.
    #[command(after_long_help = TUNING_HELP)]
    Midi(midi::MidiArgs),
}

#[derive(Debug, Args)]
struct ShowArgs {
    /// Shipped name, inline spec or YAML file, optionally `@REFERENCE` (see below).
    tuning: String,
    /// First degree to list (default 0).
    #[arg(long, allow_negative_numbers = true)]
    from: Option<i64>,
    /// Last degree to list (default: one period up, or the end of a frequency list).
    #[arg(long, allow_negative_numbers = true)]
    to: Option<i64>,
    #[command(flatten)]
    output: OutputArgs,
}

#[derive(Debug, Args)]
struct FitArgs {
    /// Shipped name, inline spec or YAML file, optionally `@REFERENCE` (see below).
    tuning: String,
    /// Odd limit of the just intervals: 3, 5, 7, 9, 11 or 13.
    #[arg(long, default_value_t = 7)]
    limit: u32,
    #[command(flatten)]
    output: OutputArgs,
    #[command(flatten)]
    plots: PlotArgs,
}

#[derive(Debug, Args)]
struct CompareArgs {
    /// The tuning whose degrees are listed.
    first: String,
    /// The tuning searched for the nearest degree.
    second: String,
    /// First degree of the first tuning (default 0).
    #[arg(long, allow_negative_numbers = true)]
    from: Option<i64>,
    /// Last degree of the first tuning (default: one period up).
    #[arg(long, allow_negative_numbers = true)]
    to: Option<i64>,
    #[command(flatten)]
    output: OutputArgs,
}

#[derive(Debug, Args)]
struct FindArgs {
    /// Shipped name, inline spec or YAML file, optionally `@REFERENCE` (see below).
    tuning: String,
    /// Pitches to resolve (see PITCH forms below). Put `--` before pitches that start with a
    /// minus sign: `taut tuning find 12edo -- -700c`.
    #[arg(required = true)]
    pitches: Vec<String>,
    #[command(flatten)]
    output: OutputArgs,
}

#[derive(Debug, Args)]
struct ListArgs {
    #[command(flatten)]
    output: OutputArgs,
}

/// The tuning specs a command reads, as inputs no output may overwrite.
fn inputs(specs: &[&str]) -> Inputs {
    let mut inputs = Inputs::new();
    for spec in specs {
        inputs.spec(spec);
    }
    inputs
}

/// Runs `taut tuning …`.
pub fn run(args: TuningArgs) -> Result<()> {
    match args.command {
        TuningCommand::Show(args) => {
            let tuning = load(&args.tuning)?;
            let (default_from, default_to) = default_range(&tuning);
            let from = args.from.unwrap_or(default_from);
            let to = args.to.unwrap_or(match args.from {
                Some(from) if tuning.degrees_per_period().is_some() => {
                    from.saturating_add(default_to - default_from)
                }
                _ => default_to,
            });
            emit(
                &list(&tuning, from, to)?,
                &args.output,
                &inputs(&[&args.tuning]),
            )
        }
        TuningCommand::Fit(args) => {
            let (plots, size) = args.plots.requests(&["errors"])?;
            let tuning = load(&args.tuning)?;
            let report = fit(&tuning, args.limit)?;
            let inputs = inputs(&[&args.tuning]);
            if !plots.is_empty() {
                let charts = taut::charts::build::fit(&report);
                pictures::write(&plots, size, &charts, &inputs, args.output.output.as_ref())?;
            }
            emit(&report, &args.output, &inputs)
        }
        TuningCommand::Compare(args) => {
            let first = load(&args.first)?;
            let second = load(&args.second)?;
            let (default_from, default_to) = default_range(&first);
            let from = args.from.unwrap_or(default_from);
            let to = args.to.unwrap_or(match args.from {
                Some(from) if first.degrees_per_period().is_some() => {
                    from.saturating_add(default_to - default_from)
                }
                _ => default_to,
            });
            emit(
                &compare(&first, &second, from, to)?,
                &args.output,
                &inputs(&[&args.first, &args.second]),
            )
        }
        TuningCommand::Find(args) => {
            let tuning = load(&args.tuning)?;
            let mut pitches = Vec::new();
            for written in &args.pitches {
                let origin = format!("pitch `{written}`");
                let spec: PitchSpec = written
                    .parse()
                    .map_err(|e: taut::Error| e.in_origin(&origin))?;
                let resolved = tuning.resolve(&spec).map_err(|e| e.in_origin(&origin))?;
                let (nearest_note, note_offset_cents) =
                    nearest_note_as_written(&spec, resolved.hz, tuning.concert_a4_hz());
                pitches.push(FoundPitch {
                    written: written.clone(),
                    pitch: resolved,
                    nearest_note,
                    note_offset_cents,
                });
            }
            let report = FoundPitches {
                tuning: tuning.summary(),
                pitches,
            };
            emit(&report, &args.output, &inputs(&[&args.tuning]))
        }
        TuningCommand::Midi(args) => midi::run(&args),
        TuningCommand::List(args) => {
            let mut tunings = Vec::new();
            for (_, loaded) in library::load_all() {
                tunings.push(loaded?.summary());
            }
            emit(&ShippedTunings { tunings }, &args.output, &Inputs::new())
        }
    }
}

/// Pitches resolved in one tuning.
#[derive(Debug, Serialize)]
struct FoundPitches {
    tuning: TuningSummary,
    pitches: Vec<FoundPitch>,
}

#[derive(Debug, Serialize)]
struct FoundPitch {
    written: String,
    #[serde(flatten)]
    pitch: ResolvedPitch,
    nearest_note: String,
    note_offset_cents: f64,
}

/// The shipped tunings.
#[derive(Debug, Serialize)]
struct ShippedTunings {
    tunings: Vec<TuningSummary>,
}
