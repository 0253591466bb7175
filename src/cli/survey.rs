//! `taut survey`: search tunings, offsets and course patterns for stringable settings.

use std::io::IsTerminal;

use clap::{Args, ValueEnum};
use indicatif::{ProgressBar, ProgressStyle};
use serde::Serialize;

use taut::error::{Error, Result};
use taut::instrument::Instrument;
use taut::plan::warning::SAFETY_REMINDER;
use taut::survey::{CourseDiagnosis, Limit, Method, RankRule, Report, Settings, Survey, Verdict};

use super::layout::{hidden_note, paragraph, wrap, Column, Give, Grid};
use super::output::View;
use super::output::{self, OutputArgs, Render};
use super::plan::render;
use super::stock::StockArgs;
use super::text::user;

/// Ranking rules as the command line names them.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum RankChoice {
    /// Smallest tension spread, then worst stress, then total load.
    Spread,
    /// Lowest worst stress ratio, then spread, then total load.
    Stress,
    /// Lowest total load, then spread, then worst stress.
    Load,
    /// Smallest worst distance from the target tension, then spread, then worst stress.
    Target,
}

/// Search methods as the command line names them.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum MethodChoice {
    /// Visit only the offsets where some string's choice or verdict changes (the default).
    Crossings,
    /// Check every candidate, string by string (the reference; slower by the offsets).
    Exhaustive,
}

/// Arguments of `taut survey`.
#[derive(Debug, Args)]
#[command(
    about = "Search tunings, pitch offsets and course patterns for the settings an instrument can be strung in, ranked",
    after_help = "SETTINGS is a YAML file naming the tunings (`edos: {from: 5, to: 72}` or `list: [...]`), course 1's pitch (`course_1: E2`), the offsets to sweep (`offset_cents: {from: -600, to: 600, step: 0.1}`) and the course pattern (`nearest_to: 4/3`, `steps: [...]` or `modes_of: [...]`); `taut help survey-file` has the details.\n\nThe instrument's own tuning and course pitches are replaced by each candidate's; its lengths, kinds, tensions and limits apply.\n\nStrings break and instruments fail under too much load: wear eye protection, bring tension up gradually, respect the maker's load rating and defer to the maker's specifications."
)]
pub struct SurveyArgs {
    /// Instrument definition (a YAML file) or the name of a built-in template.
    #[arg(value_name = "INSTRUMENT")]
    pub instrument: String,
    /// Survey settings (a YAML file) or the name of a shipped example (`survey-fourths`).
    #[arg(value_name = "SETTINGS")]
    pub settings: String,
    /// List this many results instead of the settings' `top`.
    #[arg(long, value_name = "N")]
    pub top: Option<usize>,
    /// Rank by this rule instead of the settings' `rank_by`.
    #[arg(long, value_enum, value_name = "RULE")]
    pub rank_by: Option<RankChoice>,
    /// List every stringable offset, not each tuning and course pattern once at its best offset.
    #[arg(long)]
    pub every_offset: bool,
    /// Use at most this many threads (default and most: one per core, and no more than the
    /// search has parts).
    #[arg(long, value_name = "N")]
    pub threads: Option<usize>,
    /// How to search: `crossings` (default) or `exhaustive`, which checks every candidate
    /// and gives the same report, slowly; for checking.
    #[arg(long, value_enum, value_name = "METHOD", default_value = "crossings")]
    pub method: MethodChoice,
    #[command(flatten)]
    pub stock: StockArgs,
    #[command(flatten)]
    pub output: OutputArgs,
}

/// Runs `taut survey`.
pub fn run(args: &SurveyArgs) -> Result<()> {
    let instrument = Instrument::load(&args.instrument)?;
    let mut settings = Settings::load(&args.settings)?;
    if let Some(top) = args.top {
        if top == 0 || top > taut::survey::settings::MAX_TOP {
            return Err(Error::input(format!(
                "--top lists 1 to {} results",
                taut::survey::settings::MAX_TOP
            ))
            .in_origin("--top"));
        }
        settings.top = top;
    }
    if args.every_offset {
        settings.every_offset = true;
    }
    if let Some(rule) = args.rank_by {
        settings.rank_by = match rule {
            RankChoice::Spread => RankRule::Spread,
            RankChoice::Stress => RankRule::Stress,
            RankChoice::Load => RankRule::Load,
            RankChoice::Target => RankRule::Target,
        };
    }
    let stock = args.stock.load()?;
    if args.threads == Some(0) {
        return Err(Error::input("--threads must be at least 1").in_origin("--threads"));
    }
    let method = match args.method {
        MethodChoice::Crossings => Method::Crossings,
        MethodChoice::Exhaustive => Method::Exhaustive,
    };
    let survey = Survey::prepare(&instrument, &settings, &stock)?;
    // More threads than cores or than the search has parts only cost their start-up.
    let cores = std::thread::available_parallelism().map_or(1, |n| n.get());
    let threads = args
        .threads
        .unwrap_or(cores)
        .min(cores)
        .min(survey.useful_threads(method))
        .max(1);
    let pool = rayon::ThreadPoolBuilder::new()
        .num_threads(threads)
        .build()
        .map_err(|err| Error::input(format!("cannot start {threads} threads: {err}")))?;
    let report = pool.install(|| search_with_progress(&survey, method))?;
    let mut inputs = output::Inputs::new();
    inputs.spec(&args.instrument).file(&args.settings);
    for file in &args.stock.files {
        inputs.file(file);
    }
    output::emit(&SurveyOutput { report: &report }, &args.output, &inputs)
}

/// Expected seconds above which a progress bar is worth drawing.
const PROGRESS_FROM_SECONDS: f64 = 0.25;

fn search_with_progress(survey: &Survey<'_>, method: Method) -> Result<Report> {
    // The bar counts the method's own work: crossings for the sweep, candidates for the
    // exhaustive search.
    let unit = match method {
        Method::Crossings => "crossings",
        Method::Exhaustive => "candidates",
    };
    let bar = if std::io::stderr().is_terminal()
        && survey.estimated_seconds(method) >= PROGRESS_FROM_SECONDS
    {
        let bar = ProgressBar::new(survey.work(method));
        if let Ok(style) = ProgressStyle::with_template(&format!(
            "{{bar:40}} {{percent:>3}}% {{pos}}/{{len}} {unit}, {{eta}} left"
        )) {
            bar.set_style(style);
        }
        bar
    } else {
        ProgressBar::hidden()
    };
    let report = survey.run_with(method, &|done| bar.inc(done));
    bar.finish_and_clear();
    report
}

/// A report as the shared writer takes it: JSON is the report itself.
#[derive(Serialize)]
#[serde(transparent)]
struct SurveyOutput<'a> {
    report: &'a Report,
}

impl Render for SurveyOutput<'_> {
    fn table(&self, view: &View) -> String {
        let report = self.report;
        let mut out = paragraph(&format!(
            "Survey of {}: {} candidates, {} course checks in {:.3} s; {} stringable. Ranked by {}.",
            user(&report.instrument),
            report.candidates,
            report.course_checks,
            report.elapsed_s,
            report.stringable,
            report.ranking_rule
        ), view.width);
        let rejected = report.rejected;
        let reasons: Vec<String> = [
            (rejected.stress_danger, "a string in danger"),
            (rejected.outside_catalog, "a string outside its catalog"),
            (rejected.outside_window, "a tension outside the window"),
            (rejected.wider_than_slot, "a string wider than its slot"),
            (rejected.strength_unknown, "a string of unknown strength"),
            (rejected.over_rated_load, "total load above the rated load"),
            (
                rejected.outside_pitch_range,
                "a pitch outside 1 Hz to 30 kHz",
            ),
        ]
        .iter()
        .filter(|(count, _)| *count > 0)
        .map(|(count, reason)| format!("{count} with {reason}"))
        .collect();
        if !reasons.is_empty() {
            out.push_str(&paragraph(
                &format!("Refused: {}.", reasons.join(", ")),
                view.width,
            ));
        }
        for note in &report.notes {
            out.push_str(&paragraph(&user(note), view.width));
        }
        if report.results.is_empty() {
            out.push_str("\nNo candidate is stringable.\n");
            out.push_str(&diagnosis_text(report, view));
            out.push_str(&paragraph(SAFETY_REMINDER, view.width));
            return out;
        }
        let mut table = Grid::new(vec![
            Column::figure("rank"),
            Column::text("verdict"),
            // Order of giving way (see `taut help reports`): long tuning names shorten, then
            // the pattern's name, the aim, course 1's Hz and the spread go.
            Column::text("tuning").give(Give::Shorten(10, 6)),
            Column::figure("offset"),
            Column::figure("course 1 Hz").give(Give::Drop(3)),
            Column::text("pattern").give(Give::Drop(5)),
            // Figures: never shortened.
            Column::text("steps"),
            Column::figure("spread N").give(Give::Drop(2)),
            Column::figure("stress"),
            Column::figure("load N"),
            Column::figure("off aim").give(Give::Drop(4)),
        ]);
        for result in &report.results {
            let steps: Vec<String> = result
                .course_pattern
                .steps
                .iter()
                .map(i64::to_string)
                .collect();
            table.row(vec![
                result.rank.to_string(),
                match result.verdict {
                    Verdict::Stringable => "ok",
                    Verdict::StringableWithCaution => "caution",
                }
                .to_string(),
                user(&result.tuning).into_owned(),
                format!("{:+}c", result.offset_cents),
                format!("{:.2}", result.course_1_hz),
                user(&result.course_pattern.rule).into_owned(),
                steps.join(" "),
                format!("{:.1}", result.tension_spread_n),
                format!("{:.0}%", result.worst_stress_ratio * 100.0),
                format!("{:.0}", result.total_load_n),
                format!("{:.1}%", result.worst_target_error * 100.0),
            ]);
        }
        let (grid, hidden) = table.render(view.width);
        out.push('\n');
        out.push_str(&grid);
        out.push_str(&hidden_note(&hidden, view.wide, view.width));
        out.push_str(&paragraph(
            "Verdict: ok (stringable) or caution (stringable, with care). Offset: cents course 1 moves from the tuning's own pitch.",
            view.width,
        ));
        if let (Some(best), Some(plan)) = (report.results.first(), &report.best_plan) {
            out.push('\n');
            out.push_str(&paragraph(
                &format!(
                    "The best candidate in full: {} with course 1 at {:+} cents ({:.2} Hz)",
                    user(&best.tuning),
                    best.offset_cents,
                    best.course_1_hz
                ),
                view.width,
            ));
            out.push_str(&render::table(plan, view));
        }
        out
    }
}

/// Why nothing passes, course by course: which limit refuses each string and how far the
/// candidates are from a pitch it passes at.
fn diagnosis_text(report: &Report, view: &View) -> String {
    let mut out = String::new();
    if report.diagnosis.is_empty() {
        return out;
    }
    let several_strings = report.diagnosis.iter().any(|d| d.string > 1);
    let refused_everywhere = report
        .diagnosis
        .iter()
        .any(|d| d.refused_candidates == d.candidates);
    out.push_str(&paragraph(
        if refused_everywhere {
            "Why, course by course (each string alone, over every candidate):"
        } else {
            "Every string passes in some candidates, but no candidate passes them all at once (or the total load is above the rated load). Course by course:"
        },
        view.width,
    ));
    for diagnosis in &report.diagnosis {
        let mut line = if several_strings {
            format!("course {} string {}: ", diagnosis.course, diagnosis.string)
        } else {
            format!("course {}: ", diagnosis.course)
        };
        line.push_str(&course_reason(diagnosis));
        out.push_str(&wrap(&line, view.width, "  ", "    "));
    }
    out
}

fn limit_words(limit: Limit) -> &'static str {
    match limit {
        Limit::StressDanger => "stress above the danger limit",
        Limit::ThinnerThanCatalog => "lighter than any string of its kinds",
        Limit::ThickerThanCatalog => "heavier than any string of its kinds",
        Limit::BelowWindow => "tension below the window",
        Limit::AboveWindow => "tension above the window",
        Limit::WiderThanSlot => "wider than its slot",
        Limit::StrengthUnknown => "strength unknown",
        Limit::OutsidePitchRange => "pitch outside 1 Hz to 30 kHz",
    }
}

/// One string's reason in words: the limits, the figures at the candidate nearest to passing
/// against the limit, and the distance in cents.
fn course_reason(d: &CourseDiagnosis) -> String {
    let limits: Vec<&str> = d.limits.iter().map(|&l| limit_words(l)).collect();
    if d.refused_candidates == 0 {
        return "passes in every candidate.".to_string();
    }
    if d.refused_candidates < d.candidates {
        return format!(
            "refused in {} of {} candidates ({}).",
            d.refused_candidates,
            d.candidates,
            limits.join(", ")
        );
    }
    let mut text = format!("refused in all {} candidates", d.candidates);
    if let Some(closest) = &d.closest {
        let mut figures: Vec<String> = Vec::new();
        for limit in &closest.limits {
            match limit {
                Limit::StressDanger => {
                    if let Some(stress) = closest.stress_ratio {
                        figures.push(format!(
                            "stress {:.0}% of breaking, danger from {:.0}%",
                            stress * 100.0,
                            d.danger_ratio * 100.0
                        ));
                    }
                }
                Limit::BelowWindow => {
                    if let (Some(tension), Some(min)) = (closest.tension_n, d.window_n.0) {
                        figures.push(format!("tension {tension:.1} N, window from {min:.1} N"));
                    }
                }
                Limit::AboveWindow => {
                    if let (Some(tension), Some(max)) = (closest.tension_n, d.window_n.1) {
                        figures.push(format!("tension {tension:.1} N, window up to {max:.1} N"));
                    }
                }
                Limit::WiderThanSlot => {
                    if let (Some(diameter), Some(slot)) = (closest.diameter_m, d.slot_m) {
                        figures.push(format!(
                            "{:.3} mm wide, slot {:.3} mm",
                            diameter * 1000.0,
                            slot * 1000.0
                        ));
                    }
                }
                _ => figures.push(limit_words(*limit).to_string()),
            }
        }
        let closest_limits: Vec<&str> = closest.limits.iter().map(|&l| limit_words(l)).collect();
        text.push_str(&format!(
            ": {}; nearest to passing at {:.2} Hz",
            closest_limits.join(", "),
            closest.hz
        ));
        if let (Some(kind), Some(diameter)) = (&closest.kind, closest.diameter_m) {
            text.push_str(&format!(" ({} {:.3} mm)", user(kind), diameter * 1000.0));
        }
        let figures: Vec<&String> = figures
            .iter()
            .filter(|f| !closest_limits.contains(&f.as_str()))
            .collect();
        if !figures.is_empty() {
            let figures: Vec<&str> = figures.iter().map(|f| f.as_str()).collect();
            text.push_str(&format!(", {}", figures.join(", ")));
        }
    } else {
        text.push_str(&format!(" ({})", limits.join(", ")));
    }
    match d.nearest_passing_cents {
        Some(cents) => text.push_str(&format!(
            "; it would pass {:.0} cents {} than the candidates reach.",
            cents.abs().max(1.0),
            if cents > 0.0 { "higher" } else { "lower" }
        )),
        None => text.push_str("; it passes at no pitch with these kinds and limits."),
    }
    text
}
