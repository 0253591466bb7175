//! The `--sound` options of `taut plan`: check them before any work, then render the planned
//! strings with the library's sound module and hand the WAV bytes to the shared writer.

use std::path::PathBuf;

use clap::{Args, ValueEnum};

use taut::error::{Error, Result};
use taut::plan::Plan;
use taut::sound::render::{self, RenderOptions};
use taut::sound::score::{self, Partials, Play, ScoreOptions};
use taut::sound::wav;
use taut::tuning::Tuning;

use super::output;

/// Longest a single note or chord may ring, in seconds.
pub const MAX_NOTE_SECONDS: f64 = 60.0;

/// Which partials to hear.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum PartialsChoice {
    /// The planned strings' own stiffness (Fletcher's B).
    Stiff,
    /// Ideal harmonic partials, as if the strings had no stiffness.
    Harmonic,
    /// The stiff rendering, half a second of silence, then the same notes harmonic.
    Both,
}

/// Sound options.
#[derive(Debug, Clone, Default, Args)]
pub struct SoundArgs {
    /// Also write the planned strings as sound into FILE, a `.wav` file (16-bit mono), with
    /// the report: all or none. `taut help sound` has the model and its sources.
    #[arg(long, value_name = "FILE")]
    pub sound: Option<PathBuf>,
    /// What --sound plays: `strum` (every open string; the default), `strings` (one after
    /// another), `scale` (one period of the tuning upward from the lowest string),
    /// `courses:1,3,5` or `degrees:0,4,7` (a chord).
    #[arg(long, value_name = "WHAT", requires = "sound")]
    pub play: Option<String>,
    /// How long each note or chord of --sound rings, in seconds (default 3 for a chord, 1 for
    /// each note of `strings` and `scale`; at most 60).
    #[arg(long, value_name = "SECONDS", requires = "sound")]
    pub seconds: Option<f64>,
    /// Where the strings of --sound are plucked, as a fraction of the vibrating length
    /// measured from one end (default 0.15; 0.5 is the middle).
    #[arg(long, value_name = "FRACTION", requires = "sound")]
    pub pluck: Option<f64>,
    /// Partials of --sound: the strings' own stiffness, ideal harmonics, or both in turn.
    #[arg(long, value_enum, value_name = "KIND", requires = "sound")]
    pub partials: Option<PartialsChoice>,
    /// Sample rate of --sound, 44100 or 48000 Hz (default 44100).
    #[arg(long, value_name = "HZ", requires = "sound")]
    pub sample_rate: Option<u32>,
}

/// The checked sound request.
#[derive(Debug, Clone, PartialEq)]
pub struct SoundRequest {
    path: PathBuf,
    play: Play,
    score: ScoreOptions,
    render: RenderOptions,
}

impl SoundArgs {
    /// Checks the options before any work; `None` without --sound.
    pub fn request(&self) -> Result<Option<SoundRequest>> {
        let Some(path) = &self.sound else {
            return Ok(None);
        };
        let is_wav = path
            .extension()
            .and_then(|e| e.to_str())
            .is_some_and(|e| e.eq_ignore_ascii_case("wav"));
        if !is_wav {
            return Err(
                Error::input(format!("`{}` names no WAV file", path.display()))
                    .in_origin("--sound")
                    .help("end the file name in `.wav`"),
            );
        }
        let play: Play = match &self.play {
            Some(text) => text.parse().map_err(|e: Error| e.in_origin("--play"))?,
            None => Play::Strum,
        };
        let chord = matches!(play, Play::Strum | Play::Courses(_) | Play::Degrees(_));
        let seconds = self.seconds.unwrap_or(if chord { 3.0 } else { 1.0 });
        if !(seconds.is_finite() && seconds > 0.0 && seconds <= MAX_NOTE_SECONDS) {
            return Err(Error::input(format!(
                "{seconds} s is not a length for a note: give more than 0 and at most \
                 {MAX_NOTE_SECONDS} seconds"
            ))
            .in_origin("--seconds"));
        }
        let pluck = self.pluck.unwrap_or(0.15);
        if !(pluck > 0.0 && pluck < 1.0) {
            return Err(Error::input(format!(
                "{pluck} is not a place on the string: give a fraction of the length above 0 \
                 and below 1"
            ))
            .in_origin("--pluck")
            .help("0.5 plucks at the middle, 0.15 near one end"));
        }
        let sample_rate_hz = self.sample_rate.unwrap_or(44_100);
        if !render::SAMPLE_RATES.contains(&sample_rate_hz) {
            return Err(Error::input(format!(
                "{sample_rate_hz} Hz is not a sample rate taut writes"
            ))
            .in_origin("--sample-rate")
            .help("use 44100 or 48000"));
        }
        Ok(Some(SoundRequest {
            path: path.clone(),
            play,
            score: ScoreOptions {
                seconds,
                pluck,
                partials: match self.partials.unwrap_or(PartialsChoice::Stiff) {
                    PartialsChoice::Stiff => Partials::Stiff,
                    PartialsChoice::Harmonic => Partials::Harmonic,
                    PartialsChoice::Both => Partials::Both,
                },
            },
            render: RenderOptions {
                sample_rate_hz,
                ..RenderOptions::default()
            },
        }))
    }
}

/// Renders `plan` (in `tuning`) as the request asks and adds the WAV file to `outputs`.
pub fn add(
    outputs: &mut output::Outputs<'_>,
    request: &SoundRequest,
    plan: &Plan,
    tuning: &Tuning,
) -> Result<()> {
    add_sources(outputs, request, &score::sources_of_plan(plan), tuning)
}

/// Renders the strings `sources` (in `tuning`) as the request asks and adds the WAV file to
/// `outputs`: what `audit` and `convert` play.
pub fn add_sources(
    outputs: &mut output::Outputs<'_>,
    request: &SoundRequest,
    sources: &[score::Source],
    tuning: &Tuning,
) -> Result<()> {
    let notes = score::score_sources(sources, Some(tuning), &request.play, &request.score)
        .map_err(|e| e.in_origin("--play"))?;
    let samples = render::render(&notes, &request.render).map_err(|e| e.in_origin("--seconds"))?;
    let bytes = wav::wav_bytes(&samples, request.render.sample_rate_hz)?;
    outputs.add(
        "--sound",
        Some(output::Target::Path(request.path.clone())),
        bytes,
    );
    Ok(())
}
