//! `plan` and the downloads made from a plan: the same solve, fixes and charts as `taut plan`.

use serde::{Deserialize, Serialize};

use crate::charts::draw::{self, Size};
use crate::charts::{build, sheet, Named};
use crate::error::{Error, Result};
use crate::instrument::{Instrument, TensionSpec};
use crate::plan::solve::{self, SolveOptions};
use crate::plan::warning::{SAFETY_CAUTIONS, SAFETY_REMINDER};
use crate::plan::{remedy, Plan};
use crate::sets::set::StringSet;

use super::{load_instrument, origin_name, stock, DEFAULT_ORIGIN};

/// The size the page draws its charts at: the chart builder's default, scaled by the page.
const PAGE_CHART_SIZE: Size = draw::DEFAULT_SIZE;

/// An instrument and how to tune it, as `taut plan FILE --tuning SPEC --tension T` takes them.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct PlanRequest {
    /// The instrument as YAML.
    pub instrument: String,
    /// Its file name, for messages.
    #[serde(default)]
    pub origin: Option<String>,
    /// A tuning in any form `--tuning` takes; absent: the instrument's own.
    #[serde(default)]
    pub tuning: Option<String>,
    /// A tension for every course, as `--tension` takes it.
    #[serde(default)]
    pub tension: Option<String>,
    /// Whether to draw the tension, stress and diameter charts as SVG.
    #[serde(default)]
    pub charts: bool,
}

/// A chart drawn as SVG.
#[derive(Debug, Clone, Serialize)]
pub struct DrawnChart {
    /// `tension`, `stress` or `diameter`, as `--plot` names them.
    pub name: &'static str,
    /// The picture.
    pub svg: String,
}

/// The plan and everything the page shows beside it.
#[derive(Debug, Clone, Serialize)]
pub struct PlanReply {
    /// The plan, with the fixes at the end of its warnings: `taut plan --format json`.
    pub plan: Plan,
    /// The tuning spec planned in (the request's, the instrument's own, or the default).
    pub tuning_spec: String,
    /// The same plan from the command line.
    pub command: String,
    /// The cautions to show: all of them when a warning reaches caution or danger, else none.
    pub cautions: Vec<&'static str>,
    /// The one-line reminder shown when no caution fired.
    pub reminder: &'static str,
    /// The charts, when asked for.
    pub charts: Vec<DrawnChart>,
}

/// The tuning spec a request plans in, as `taut plan` would choose it (an empty field is no
/// tuning given).
fn spec_of(instrument: &Instrument, given: Option<&str>) -> String {
    let given = given.filter(|spec| !spec.trim().is_empty());
    solve::tuning_spec_for(instrument, given).to_string()
}

/// A word for a shell command line, quoted when it needs it.
fn shell_word(word: &str) -> String {
    if !word.is_empty()
        && word
            .chars()
            .all(|c| c.is_ascii_alphanumeric() || "-_./@=~+:,".contains(c))
    {
        word.to_string()
    } else {
        format!("'{}'", word.replace('\'', r"'\''"))
    }
}

/// What a plan request solves: the instrument, the spec and the tension override.
struct Solved {
    instrument: Instrument,
    spec: String,
    tension: Option<TensionSpec>,
    plan: Plan,
}

fn solve_request(request: &PlanRequest) -> Result<Solved> {
    let tension: Option<TensionSpec> = request
        .tension
        .as_deref()
        .filter(|text| !text.trim().is_empty())
        .map(|text| {
            text.parse::<TensionSpec>()
                .map_err(|err: Error| err.in_origin("--tension"))
        })
        .transpose()?;
    let instrument = load_instrument(&request.instrument, request.origin.as_deref())?;
    let spec = spec_of(&instrument, request.tuning.as_deref());
    let mut plan = solve::plan(
        &instrument,
        stock()?,
        &SolveOptions {
            tuning: Some(spec.clone()),
            tension: tension.clone(),
        },
    )?;
    crate::error::check_finite(&plan)?;
    remedy::attach_to_plan(&mut plan);
    Ok(Solved {
        instrument,
        spec,
        tension,
        plan,
    })
}

fn charts_of(solved: &Solved) -> Vec<Named> {
    let windows = build::tension_windows(&solved.instrument, solved.tension.as_ref());
    build::plan(&solved.plan, &windows)
}

/// Solves the request's instrument as `taut plan` does.
pub fn plan(request: &PlanRequest) -> Result<PlanReply> {
    let solved = solve_request(request)?;
    let charts = if request.charts {
        charts_of(&solved)
            .iter()
            .map(|named| {
                Ok(DrawnChart {
                    name: named.name,
                    svg: draw::svg(&named.chart, PAGE_CHART_SIZE)?,
                })
            })
            .collect::<Result<Vec<_>>>()?
    } else {
        Vec::new()
    };
    let origin = origin_name(request.origin.as_deref(), DEFAULT_ORIGIN);
    let mut command = format!(
        "taut plan {} --tuning {}",
        shell_word(&origin),
        shell_word(&solved.spec)
    );
    if let Some(tension) = request.tension.as_deref().filter(|t| !t.trim().is_empty()) {
        command.push_str(" --tension ");
        command.push_str(&shell_word(tension));
    }
    Ok(PlanReply {
        cautions: if solved.plan.needs_safety_cautions() {
            SAFETY_CAUTIONS.to_vec()
        } else {
            Vec::new()
        },
        reminder: SAFETY_REMINDER,
        tuning_spec: solved.spec,
        command,
        charts,
        plan: solved.plan,
    })
}

/// A download made from a plan.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct ExportRequest {
    /// What to make: `plan-json`, `plan-csv`, `set-yaml`, `string-chart-html`,
    /// `string-chart-csv`, or `chart-svg:NAME` / `chart-png:NAME` (`tension`, `stress`,
    /// `diameter`).
    pub what: String,
    /// The plan to make it from.
    pub plan: PlanRequest,
}

/// A file for the page to download; the server writes nothing.
#[derive(Debug, Clone, PartialEq)]
pub struct Exported {
    /// Its media type.
    pub content_type: &'static str,
    /// The file name offered.
    pub file_name: String,
    /// Its bytes.
    pub bytes: Vec<u8>,
}

/// Makes the download the request names, with the same library calls as `taut plan`'s
/// `--format json`, `--save-set`, `--string-chart` and `--plot`.
pub fn export(request: &ExportRequest) -> Result<Exported> {
    let solved = solve_request(&request.plan)?;
    let stem = origin_name(request.plan.origin.as_deref(), DEFAULT_ORIGIN)
        .trim_end_matches(".yaml")
        .trim_end_matches(".yml")
        .to_string();
    let text = |content_type, suffix: &str, text: String| Exported {
        content_type,
        file_name: format!("{stem}{suffix}"),
        bytes: text.into_bytes(),
    };
    let what = request.what.as_str();
    if let Some(name) = what
        .strip_prefix("chart-svg:")
        .or_else(|| what.strip_prefix("chart-png:"))
    {
        let charts = charts_of(&solved);
        let named = charts
            .iter()
            .find(|named| named.name == name)
            .ok_or_else(|| {
                Error::input(format!("a plan has no chart `{name}`"))
                    .in_origin("what")
                    .help("tension, stress or diameter")
            })?;
        return Ok(if what.starts_with("chart-svg:") {
            text(
                "image/svg+xml",
                &format!("-{name}.svg"),
                draw::svg(&named.chart, draw::DEFAULT_SIZE)?,
            )
        } else {
            Exported {
                content_type: "image/png",
                file_name: format!("{stem}-{name}.png"),
                bytes: draw::png(&named.chart, draw::DEFAULT_SIZE)?,
            }
        });
    }
    Ok(match what {
        "plan-json" => {
            let mut json = serde_json::to_string_pretty(&solved.plan)
                .map_err(|err| Error::input(format!("cannot write the plan as JSON: {err}")))?;
            json.push('\n');
            text("application/json", "-plan.json", json)
        }
        "plan-csv" => text(
            "text/csv",
            "-plan.csv",
            crate::charts::records::guarded(&crate::charts::records::csv(&solved.plan)?)?,
        ),
        "set-yaml" => {
            let set = StringSet::from_plan(&solved.plan);
            text("application/yaml", "-set.yaml", set.to_yaml())
        }
        "string-chart-html" => {
            let charts = charts_of(&solved);
            text(
                "text/html",
                "-string-chart.html",
                sheet::html(&solved.plan, &charts, draw::DEFAULT_SIZE)?,
            )
        }
        "string-chart-csv" => text(
            "text/csv",
            "-string-chart.csv",
            crate::charts::records::guarded(&sheet::csv(&solved.plan)?)?,
        ),
        other => {
            return Err(
                Error::input(format!("`{other}` is no download the explorer makes"))
                    .in_origin("what")
                    .help(
                        "plan-json, plan-csv, set-yaml, string-chart-html, string-chart-csv, \
                     chart-svg:NAME or chart-png:NAME",
                    ),
            )
        }
    })
}
