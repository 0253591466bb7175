//! `tuning`, `frets`, `audit`, `survey` and `sound`: each the library call its command makes.

use serde::{Deserialize, Serialize};

use crate::error::{Error, Result};
use crate::frets::{self, drawing, FretLayout};
use crate::input::yaml::PathStep;
use crate::instrument::frets::FretSettings;
use crate::plan::solve::{self, SolveOptions};
use crate::sets::audit::{self, Audit, AuditOptions, ReferenceSource};
use crate::sets::set::StringSet;
use crate::sound::score::{self, Partials, Play, ScoreOptions};
use crate::sound::{self as sound_model, Damping};
use crate::survey::settings::{Settings, MAX_TOP};
use crate::survey::Size;
use crate::survey::{Survey, Verdict};
use crate::tuning::listing::{self, DegreeListing};

use super::{load_instrument, origin_name, stock};
use crate::explore::LIMITS;

/// A tuning to list, as `taut tuning show SPEC --from A --to B` takes it.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct TuningRequest {
    /// The tuning in any form `--tuning` takes.
    pub tuning: String,
    /// First degree listed (default: one period from degree 0).
    #[serde(default)]
    pub from: Option<i64>,
    /// Last degree listed.
    #[serde(default)]
    pub to: Option<i64>,
}

/// Lists a tuning's degrees, as `taut tuning show` does.
pub fn tuning(request: &TuningRequest) -> Result<DegreeListing> {
    let tuning = crate::tuning::load(&request.tuning).map_err(|e| e.in_origin("--tuning"))?;
    let (from, to) = listing::default_range(&tuning);
    let (from, to) = (request.from.unwrap_or(from), request.to.unwrap_or(to));
    listing::check_range(from, to)?;
    listing::list(&tuning, from, to)
}

/// An instrument in a tuning, for the commands that need nothing more.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct FretsRequest {
    /// The instrument as YAML.
    pub instrument: String,
    /// Its file name, for messages.
    #[serde(default)]
    pub origin: Option<String>,
    /// A tuning in any form `--tuning` takes; absent: the instrument's own.
    #[serde(default)]
    pub tuning: Option<String>,
}

/// The fret layout and its drawing.
#[derive(Debug, Clone, Serialize)]
pub struct FretsReply {
    /// The layout, as `taut frets --format json` gives it.
    pub layout: FretLayout,
    /// The board as lines in metres, when the layout places one.
    pub drawing: Option<drawing::Drawing>,
}

fn given(spec: Option<&str>) -> Option<&str> {
    spec.filter(|spec| !spec.trim().is_empty())
}

/// Lays out the frets as `taut frets FILE --tuning SPEC` does.
pub fn frets(request: &FretsRequest) -> Result<FretsReply> {
    let instrument = load_instrument(&request.instrument, request.origin.as_deref())?;
    let tuning = solve::tuning_for(&instrument, given(request.tuning.as_deref()), "--tuning")?;
    let layout = frets::lay_out(&instrument, &tuning, &FretSettings::default())?;
    crate::error::check_finite(&layout)?;
    let drawing = drawing::draw(&layout);
    Ok(FretsReply { layout, drawing })
}

/// A set loaded in the page, audited on the instrument.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct AuditRequest {
    /// The instrument as YAML.
    pub instrument: String,
    /// Its file name, for messages.
    #[serde(default)]
    pub origin: Option<String>,
    /// A tuning in any form `--tuning` takes; absent: the instrument's own.
    #[serde(default)]
    pub tuning: Option<String>,
    /// The string set as YAML (or a plan's JSON export, as `--set` reads it).
    pub set: String,
    /// The set's file name, for messages.
    #[serde(default)]
    pub set_origin: Option<String>,
}

/// Audits the set as `taut audit FILE --set SET --tuning SPEC` does: tension changes are
/// measured from the set's own `tuning:` when it names one.
pub fn audit(request: &AuditRequest) -> Result<Audit> {
    let instrument = load_instrument(&request.instrument, request.origin.as_deref())?;
    let stock = stock()?;
    let set_origin = origin_name(request.set_origin.as_deref(), "set.yaml");
    let set = StringSet::from_text(request.set.clone(), &set_origin, stock)?;
    let given = given(request.tuning.as_deref());
    let tuning = solve::tuning_for(&instrument, given, "--tuning")?;
    let audited_spec = given
        .or(instrument.tuning.as_deref())
        .unwrap_or(solve::DEFAULT_TUNING)
        .trim();
    let set_tuning = set
        .tuning
        .as_deref()
        .filter(|spec| given.is_some() || spec.trim() != audited_spec);
    let reference_tuning = set_tuning
        .map(|spec| {
            crate::tuning::load(spec).map_err(|err| set.point(err, &[PathStep::Key("tuning")]))
        })
        .transpose()?;
    let reference = match (&reference_tuning, set_tuning) {
        (Some(tuning), Some(spec)) => Some(audit::Reference {
            instrument: &instrument,
            tuning,
            source: ReferenceSource::SetTuning(spec),
        }),
        _ => None,
    };
    let mut report = audit::audit(
        &instrument,
        &set,
        &tuning,
        reference,
        stock,
        &AuditOptions::default(),
    )?;
    crate::error::check_finite(&report)?;
    audit::attach_fixes(&mut report, stock);
    Ok(report)
}

/// A range of whole numbers.
#[derive(Debug, Clone, Copy, Deserialize, Serialize)]
#[serde(deny_unknown_fields)]
pub struct WholeRange {
    /// First.
    pub from: u32,
    /// Last.
    pub to: u32,
}

/// Offsets in cents.
#[derive(Debug, Clone, Copy, Deserialize, Serialize)]
#[serde(deny_unknown_fields)]
pub struct CentsSteps {
    /// First offset.
    pub from: f64,
    /// Last offset.
    pub to: f64,
    /// Step.
    pub step: f64,
}

/// The course pattern of a survey, as the settings file writes it.
#[derive(Debug, Clone, Default, Deserialize, Serialize)]
#[serde(deny_unknown_fields)]
pub struct PatternText {
    /// Each course the degree nearest this interval from the one before.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub nearest_to: Option<String>,
    /// Degree steps between neighbouring courses.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub steps: Option<Vec<i64>>,
}

/// The survey map's space: EDOs × offsets for one course pattern.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SurveyRequest {
    /// The instrument as YAML.
    pub instrument: String,
    /// Its file name, for messages.
    #[serde(default)]
    pub origin: Option<String>,
    /// The equal divisions of the octave to try.
    pub edos: WholeRange,
    /// The offsets of course 1 to try.
    pub offsets: CentsSteps,
    /// Course 1's pitch at offset 0.
    pub course_1: String,
    /// How the courses follow course 1.
    pub courses: PatternText,
}

/// One row of the map: a tuning and, per offset, the verdict.
#[derive(Debug, Clone, Serialize)]
pub struct SurveyRow {
    /// The tuning's name.
    pub tuning: String,
    /// The spec that loads it (`19edo`).
    pub spec: String,
    /// Per offset: 2 stringable, 1 stringable with caution, 0 refused.
    pub verdicts: Vec<u8>,
}

/// The survey map.
#[derive(Debug, Clone, Serialize)]
pub struct SurveyReply {
    /// The settings file the map was made from: `taut survey FILE settings.yaml` gives the
    /// same ranking.
    pub settings: String,
    /// The offsets, cents, one per column.
    pub offsets: Vec<f64>,
    /// One row per tuning.
    pub rows: Vec<SurveyRow>,
    /// Candidates tried and how many passed.
    pub candidates: u64,
    /// Candidates that passed.
    pub stringable: u64,
    /// The best candidates, as `taut survey` lists them.
    pub best: Vec<crate::survey::Ranked>,
    /// Notes about course order and the settings.
    pub notes: Vec<String>,
}

#[derive(Serialize)]
struct SettingsText<'a> {
    tunings: EdoText,
    course_1: &'a str,
    offset_cents: CentsSteps,
    courses: &'a PatternText,
    every_offset: bool,
    top: usize,
}

#[derive(Serialize)]
struct EdoText {
    edos: WholeRange,
}

/// Surveys EDOs × offsets with the same settings checks and sweep as `taut survey`, bounded
/// for a page that redraws on every change.
pub fn survey(request: &SurveyRequest) -> Result<SurveyReply> {
    let instrument = load_instrument(&request.instrument, request.origin.as_deref())?;
    let mut settings_text = crate::input::yaml::to_text(&SettingsText {
        tunings: EdoText { edos: request.edos },
        course_1: &request.course_1,
        offset_cents: request.offsets,
        courses: &request.courses,
        every_offset: true,
        top: MAX_TOP,
    })?;
    let mut settings = Settings::from_text(settings_text.clone(), "survey settings")?;
    let size = Size::of(&instrument, &settings)?;
    let cells = size.tunings * size.patterns * size.offsets;
    if cells > LIMITS.survey_cells || size.course_checks > LIMITS.survey_course_checks {
        return Err(Error::input(format!(
            "the map would have {cells} cells and {} course checks; the explorer draws at most \
             {} cells and {} checks",
            size.course_checks, LIMITS.survey_cells, LIMITS.survey_course_checks
        ))
        .in_origin("survey")
        .help(
            "narrow the EDO range or take a larger offset step; `taut survey` takes larger spaces",
        ));
    }
    settings.top = MAX_TOP;
    let stock = stock()?;
    let survey = Survey::prepare(&instrument, &settings, stock)?;
    let report = survey.run(&|_| {})?;
    let offsets_count = size.offsets as usize;
    let per_tuning = size.patterns * size.offsets;
    let mut rows: Vec<SurveyRow> = (0..size.tunings as usize)
        .map(|index| {
            let spec = settings.tuning_spec(index);
            SurveyRow {
                tuning: spec.clone(),
                spec,
                verdicts: vec![0; offsets_count],
            }
        })
        .collect();
    for ranked in &report.results {
        let row = (ranked.candidate / per_tuning) as usize;
        let column = (ranked.candidate % size.offsets) as usize;
        let value = match ranked.verdict {
            Verdict::Stringable => 2,
            Verdict::StringableWithCaution => 1,
        };
        if let Some(cell) = rows.get_mut(row).and_then(|r| r.verdicts.get_mut(column)) {
            *cell = (*cell).max(value);
        }
        if let Some(row) = rows.get_mut(row) {
            row.tuning.clone_from(&ranked.tuning);
        }
    }
    let offsets = (0..size.offsets)
        .map(|k| request.offsets.from + k as f64 * request.offsets.step)
        .collect();
    let mut best = report.results.clone();
    best.sort_by_key(|ranked| ranked.rank);
    best.truncate(10);
    settings_text.insert_str(
        0,
        "# Survey settings from the explorer's map; `every_offset` lists every stringable cell.\n",
    );
    Ok(SurveyReply {
        settings: settings_text,
        offsets,
        rows,
        candidates: report.candidates,
        stringable: report.stringable,
        best,
        notes: report.notes.clone(),
    })
}

/// What to play, as `taut plan --sound --play` takes it.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SoundRequest {
    /// The instrument as YAML.
    pub instrument: String,
    /// Its file name, for messages.
    #[serde(default)]
    pub origin: Option<String>,
    /// A tuning in any form `--tuning` takes; absent: the instrument's own.
    #[serde(default)]
    pub tuning: Option<String>,
    /// `strum`, `strings`, `scale`, `courses:1,3,5` or `degrees:0,4,7`.
    pub play: String,
    /// How long each note rings, in seconds.
    pub seconds: f64,
    /// Pluck position as a fraction of the length.
    pub pluck: f64,
    /// `false`: ideal harmonic partials, for comparison.
    #[serde(default = "stiff_by_default")]
    pub stiff: bool,
    /// The page's audio sample rate (partials above 0.45 of it are left out).
    pub sample_rate_hz: f64,
}

fn stiff_by_default() -> bool {
    true
}

/// One partial, as the page's oscillators play it.
#[derive(Debug, Clone, Serialize)]
pub struct PartialReply {
    /// Partial number n.
    pub n: u32,
    /// Frequency, Hz.
    pub hz: f64,
    /// Initial amplitude, relative.
    pub amplitude: f64,
    /// Decay rate σ, 1/s.
    pub decay_per_s: f64,
}

/// One note and its partials.
#[derive(Debug, Clone, Serialize)]
pub struct NoteReply {
    /// When it is plucked, s.
    pub start_s: f64,
    /// How long it rings, s.
    pub duration_s: f64,
    /// Its fundamental, Hz.
    pub pitch_hz: f64,
    /// Fletcher's B.
    pub inharmonicity: f64,
    /// Its partials.
    pub partials: Vec<PartialReply>,
}

/// The notes to play.
#[derive(Debug, Clone, Serialize)]
pub struct SoundReply {
    /// The notes in order of onset.
    pub notes: Vec<NoteReply>,
}

/// The notes and partials `taut plan --sound FILE --play PLAY` renders, for the page to play.
pub fn sound(request: &SoundRequest) -> Result<SoundReply> {
    if !(request.seconds > 0.0 && request.seconds <= LIMITS.sound_seconds) {
        return Err(Error::input(format!(
            "a note rings for more than 0 and at most {} s",
            LIMITS.sound_seconds
        ))
        .in_origin("seconds"));
    }
    if !(request.pluck > 0.0 && request.pluck < 1.0) {
        return Err(
            Error::input("give the pluck as a fraction of the length above 0 and below 1")
                .in_origin("pluck"),
        );
    }
    if !(8_000.0..=384_000.0).contains(&request.sample_rate_hz) {
        return Err(
            Error::input("the sample rate lies between 8000 and 384000 Hz")
                .in_origin("sample_rate_hz"),
        );
    }
    let play: Play = request
        .play
        .parse()
        .map_err(|e: Error| e.in_origin("--play"))?;
    let instrument = load_instrument(&request.instrument, request.origin.as_deref())?;
    let given = given(request.tuning.as_deref());
    let tuning = solve::tuning_for(&instrument, given, "--tuning")?;
    let plan = solve::plan(
        &instrument,
        stock()?,
        &SolveOptions {
            tuning: given.map(str::to_string),
            tension: None,
        },
    )?;
    let notes = score::score(
        &plan,
        Some(&tuning),
        &play,
        &ScoreOptions {
            seconds: request.seconds,
            pluck: request.pluck,
            partials: if request.stiff {
                Partials::Stiff
            } else {
                Partials::Harmonic
            },
        },
    )
    .map_err(|e| e.in_origin("--play"))?;
    if notes.len() > LIMITS.sound_notes {
        return Err(Error::input(format!(
            "that is {} notes; the explorer plays at most {}",
            notes.len(),
            LIMITS.sound_notes
        ))
        .in_origin("--play"));
    }
    let damping = Damping::default();
    let mut partials = Vec::new();
    let notes = notes
        .iter()
        .map(|note| {
            sound_model::partials(note, &damping, request.sample_rate_hz, &mut partials);
            NoteReply {
                start_s: note.start_s,
                duration_s: note.duration_s,
                pitch_hz: note.pitch_hz,
                inharmonicity: note.inharmonicity,
                partials: partials
                    .iter()
                    .map(|p| PartialReply {
                        n: p.number,
                        hz: p.hz,
                        amplitude: p.amplitude,
                        decay_per_s: p.decay_per_s,
                    })
                    .collect(),
            }
        })
        .collect();
    let reply = SoundReply { notes };
    crate::error::check_finite(&reply)?;
    Ok(reply)
}
