//! `taut tuning midi`: a tuning laid on the 128 MIDI notes, written as MIDI Tuning Standard
//! messages (a bulk dump, single-note changes) and as a Standard MIDI File that plays its scale
//! or chords in tune. The bytes come from the library (`taut::midi`); this file parses the
//! options, renders the note table and hands every file to the shared writer.

use std::path::{Path, PathBuf};

use clap::Args;
use serde::Serialize;

use taut::error::{Error, Result};
use taut::midi::{self, smf, Keyboard, PlaceOptions};
use taut::tuning::{load, TuningSummary};

use super::super::layout::{paragraph, Column, Grid};
use super::super::output::{self, csv_text, sig, OutputArgs, Render, Target, View};
use super::render::{finish, heading};

/// Longest a note or chord of --midi-file may last, in seconds.
const MAX_STEP_SECONDS: f64 = 60.0;

/// Most chords in one --midi-file.
const MAX_CHORDS: usize = 128;

#[derive(Debug, Args)]
pub(super) struct MidiArgs {
    /// Shipped name, inline spec or YAML file, optionally `@REFERENCE`: the tuning is sent at
    /// its reference pitch.
    tuning: String,
    /// Write a bulk tuning dump of all 128 notes (MIDI Tuning Standard) into FILE, a `.syx` file.
    #[arg(long, value_name = "FILE")]
    bulk: Option<PathBuf>,
    /// Write real-time single-note tuning changes for every note that carries a degree into
    /// FILE, a `.syx` file (one message per 127 notes).
    #[arg(long, value_name = "FILE")]
    note_changes: Option<PathBuf>,
    /// Write a Standard MIDI File into FILE (`.mid`): the single-note tuning changes at its
    /// start, then the scale (one period up from the reference degree) or the --chord chords.
    #[arg(long, value_name = "FILE")]
    midi_file: Option<PathBuf>,
    /// The MIDI note (0 to 127) that carries the reference degree (default: the 12-tone note
    /// nearest the reference frequency, A4 = 69 at 440 Hz).
    #[arg(long, value_name = "NOTE", allow_negative_numbers = true)]
    anchor_note: Option<i64>,
    /// Only these degrees, `FROM..TO` (at most 128; each must land on a note and within the
    /// standard's range of pitch). Default: every note whose degree exists and fits.
    #[arg(long, value_name = "FROM..TO", allow_hyphen_values = true)]
    degrees: Option<String>,
    /// A chord of degrees for --midi-file, e.g. `0,4,7`; repeat for a sequence of chords.
    #[arg(long, value_name = "DEGREES", allow_hyphen_values = true)]
    chord: Vec<String>,
    /// How long each note or chord of --midi-file lasts, in seconds (default 0.5 for the scale,
    /// 2 for chords).
    #[arg(long, value_name = "SECONDS")]
    seconds: Option<f64>,
    /// The tuning program number the messages address (0 to 127).
    #[arg(long, value_name = "N", default_value_t = 0, value_parser = clap::value_parser!(u8).range(0..=127))]
    program: u8,
    /// The device ID the messages address (0 to 127; 127 means every device).
    #[arg(long, value_name = "ID", default_value_t = 127, value_parser = clap::value_parser!(u8).range(0..=127))]
    device: u8,
    #[command(flatten)]
    output: OutputArgs,
}

/// The note table: which MIDI note carries which degree, and the bytes sent for it.
#[derive(Debug, Serialize)]
struct MidiReport {
    tuning: TuningSummary,
    /// The note that carries the reference degree.
    anchor_note: i64,
    /// Notes carrying a degree, ascending.
    notes: Vec<NoteRow>,
}

#[derive(Debug, Serialize)]
struct NoteRow {
    note: u8,
    /// The note's name in 12-tone equal temperament at A4 = 440 Hz (MIDI's own numbering).
    note_name: String,
    degree: i64,
    hz: f64,
    /// The three bytes of frequency data, in hexadecimal.
    frequency_data: String,
    /// The frequency those bytes stand for.
    sent_hz: f64,
    /// `sent_hz` against `hz`, in cents.
    error_cents: f64,
}

fn note_name(note: u8) -> String {
    const NAMES: [&str; 12] = [
        "C", "C#", "D", "D#", "E", "F", "F#", "G", "G#", "A", "A#", "B",
    ];
    format!(
        "{}{}",
        NAMES[usize::from(note % 12)],
        i32::from(note / 12) - 1
    )
}

fn hex(data: [u8; 3]) -> String {
    format!("{:02X} {:02X} {:02X}", data[0], data[1], data[2])
}

fn file_with(path: &Path, extensions: &[&str], flag: &str, what: &str) -> Result<Target> {
    let fits = path
        .extension()
        .and_then(|e| e.to_str())
        .is_some_and(|e| extensions.iter().any(|x| e.eq_ignore_ascii_case(x)));
    if fits {
        Ok(Target::Path(path.to_path_buf()))
    } else {
        Err(
            Error::input(format!("`{}` names no {what}", path.display()))
                .in_origin(flag)
                .help(format!("end the file name in `.{}`", extensions[0])),
        )
    }
}

fn parse_range(text: &str) -> Result<(i64, i64)> {
    let bad = || {
        Error::input(format!("`{text}` is not a range of degrees"))
            .in_origin("--degrees")
            .help("write FROM..TO, e.g. `-12..24`")
    };
    let (low, high) = text.split_once("..").ok_or_else(bad)?;
    let low: i64 = low.trim().parse().map_err(|_| bad())?;
    let high: i64 = high.trim().parse().map_err(|_| bad())?;
    Ok((low, high))
}

fn parse_chord(text: &str) -> Result<Vec<i64>> {
    let degrees = text
        .split(',')
        .map(|item| {
            let item = item.trim();
            item.strip_prefix("deg")
                .unwrap_or(item)
                .parse::<i64>()
                .map_err(|_| {
                    Error::input(format!("`{item}` is not a degree"))
                        .in_origin("--chord")
                        .help("write degrees separated by commas, e.g. `0,4,7`")
                })
        })
        .collect::<Result<Vec<_>>>()?;
    if degrees.len() > midi::NOTES {
        return Err(Error::input(format!(
            "a chord of {} degrees has more notes than MIDI's 128",
            degrees.len()
        ))
        .in_origin("--chord"));
    }
    Ok(degrees)
}

/// Runs `taut tuning midi`.
pub(super) fn run(args: &MidiArgs) -> Result<()> {
    // Every option is checked before any work.
    let bulk = args
        .bulk
        .as_deref()
        .map(|p| file_with(p, &["syx"], "--bulk", "system-exclusive file"))
        .transpose()?;
    let changes = args
        .note_changes
        .as_deref()
        .map(|p| file_with(p, &["syx"], "--note-changes", "system-exclusive file"))
        .transpose()?;
    let song = args
        .midi_file
        .as_deref()
        .map(|p| file_with(p, &["mid", "midi"], "--midi-file", "Standard MIDI File"))
        .transpose()?;
    let degrees = args.degrees.as_deref().map(parse_range).transpose()?;
    let chords = args
        .chord
        .iter()
        .map(|c| parse_chord(c))
        .collect::<Result<Vec<_>>>()?;
    if chords.len() > MAX_CHORDS {
        return Err(Error::input(format!(
            "{} chords are too many: taut writes at most {MAX_CHORDS}",
            chords.len()
        ))
        .in_origin("--chord"));
    }
    if (!chords.is_empty() || args.seconds.is_some()) && song.is_none() {
        return Err(Error::input("--chord and --seconds shape the --midi-file")
            .in_origin("--midi-file")
            .help("add `--midi-file FILE.mid`"));
    }
    let seconds = args
        .seconds
        .unwrap_or(if chords.is_empty() { 0.5 } else { 2.0 });
    if !(seconds.is_finite() && seconds > 0.0 && seconds <= MAX_STEP_SECONDS) {
        return Err(Error::input(format!(
            "{seconds} s is not a length for a note: give more than 0 and at most \
             {MAX_STEP_SECONDS} seconds"
        ))
        .in_origin("--seconds"));
    }
    if let Some(note) = args.anchor_note {
        if !(0..=127).contains(&note) {
            return Err(
                Error::input(format!("{note} is not a MIDI note: notes are 0 to 127"))
                    .in_origin("--anchor-note"),
            );
        }
    }

    let tuning = load(&args.tuning)?;
    let keyboard = midi::place(
        &tuning,
        &PlaceOptions {
            anchor_note: args.anchor_note,
            degrees,
        },
    )
    .map_err(|e| {
        e.in_origin(if degrees.is_some() {
            "--degrees"
        } else {
            "--anchor-note"
        })
    })?;

    let mut inputs = output::Inputs::new();
    inputs.spec(&args.tuning);
    let mut outputs = output::Outputs::new(&inputs);
    if let Some(target) = bulk {
        outputs.add(
            "--bulk",
            Some(target),
            keyboard.bulk_dump(args.device, args.program),
        );
    }
    let messages = keyboard.note_changes(args.device, args.program);
    if let Some(target) = changes {
        outputs.add("--note-changes", Some(target), messages.concat());
    }
    if let Some(target) = song {
        let steps = steps(&keyboard, &tuning, &chords)?;
        let bytes = smf::midi_file(&messages, &steps, smf::ticks(seconds));
        outputs.add("--midi-file", Some(target), bytes);
    }
    let report = report(&tuning, &keyboard);
    output::check_finite(&report)?;
    let text = output::report_text(&report, &args.output, None)?;
    outputs.add("--output", args.output.output.clone(), text.into_bytes());
    outputs.write()
}

/// The notes of each step of the MIDI file: each chord, or one note per degree of the scale.
fn steps(
    keyboard: &Keyboard,
    tuning: &taut::tuning::Tuning,
    chords: &[Vec<i64>],
) -> Result<Vec<Vec<u8>>> {
    if chords.is_empty() {
        return Ok(keyboard
            .scale_degrees(tuning)
            .into_iter()
            .filter_map(|k| keyboard.note_of(k).map(|n| vec![n]))
            .collect());
    }
    chords
        .iter()
        .map(|chord| {
            chord
                .iter()
                .map(|&k| {
                    keyboard.note_of(k).ok_or_else(|| {
                        Error::input(format!("degree {k} is on no MIDI note"))
                            .in_origin("--chord")
                            .help("choose degrees the note table lists, or widen --degrees")
                    })
                })
                .collect()
        })
        .collect()
}

fn report(tuning: &taut::tuning::Tuning, keyboard: &Keyboard) -> MidiReport {
    MidiReport {
        tuning: tuning.summary(),
        anchor_note: keyboard.anchor_note,
        notes: keyboard
            .placements
            .iter()
            .map(|p| NoteRow {
                note: p.note,
                note_name: note_name(p.note),
                degree: p.degree,
                hz: p.hz,
                frequency_data: hex(p.data),
                sent_hz: p.sent_hz,
                error_cents: 1200.0 * (p.sent_hz / p.hz).log2(),
            })
            .collect(),
    }
}

impl Render for MidiReport {
    fn table(&self, view: &View) -> String {
        let mut text = heading(&self.tuning, view);
        let (first, last) = match (self.notes.first(), self.notes.last()) {
            (Some(a), Some(b)) => (a, b),
            _ => return text,
        };
        text.push_str(&paragraph(
            &format!(
                "MIDI note {} carries degree {} (the reference); each note up or down carries \
                 the next degree up or down. Notes {} to {} carry degrees {} to {}; any other \
                 note keeps its 12-tone pitch in a bulk dump. Frequency data: semitone, then a \
                 14-bit fraction of 100 cents (MIDI Tuning Standard).",
                self.anchor_note,
                self.tuning.reference.degree,
                first.note,
                last.note,
                first.degree,
                last.degree
            ),
            view.width,
        ));
        let mut grid = Grid::new(vec![
            Column::figure("note"),
            Column::text("12-tone"),
            Column::figure("deg"),
            Column::figure("Hz"),
            Column::text("data"),
            Column::figure("sent Hz"),
            Column::figure("off"),
        ]);
        for row in &self.notes {
            grid.row(vec![
                row.note.to_string(),
                row.note_name.clone(),
                row.degree.to_string(),
                format!("{:.4}", row.hz),
                row.frequency_data.clone(),
                format!("{:.4}", row.sent_hz),
                format!("{:+.4}c", row.error_cents),
            ]);
        }
        format!("{text}{}", finish(&grid, view))
    }

    fn csv(&self) -> Result<String> {
        csv_text(self.notes.iter().map(|row| NoteRow {
            note: row.note,
            note_name: row.note_name.clone(),
            degree: row.degree,
            hz: sig(row.hz),
            frequency_data: row.frequency_data.clone(),
            sent_hz: sig(row.sent_hz),
            error_cents: sig(row.error_cents),
        }))
    }
}

/// The frequency data of `hz` as text, for tests of this file.
#[cfg(test)]
fn data_text(hz: f64) -> String {
    hex(taut::midi::mts::frequency_data(hz).unwrap())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn note_names_follow_midi_numbering() {
        assert_eq!(note_name(60), "C4");
        assert_eq!(note_name(69), "A4");
        assert_eq!(note_name(0), "C-1");
        assert_eq!(data_text(440.0), "45 00 00");
    }
}
