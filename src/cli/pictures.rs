//! The `--plot` and `--plot-size` options every result-making subcommand shares: parse them before
//! any work, then draw each asked-for chart and write it through the shared atomic writer.

use std::path::{Path, PathBuf};

use clap::Args;

use taut::charts::draw::{self, Size, DEFAULT_SIZE};
use taut::charts::Named;
use taut::error::{Error, Result};

use super::output;

/// Chart options.
#[derive(Debug, Clone, Default, Args)]
pub struct PlotArgs {
    /// Draw a chart into FILE, an `.svg` or `.png` picture; `CHART=FILE` picks which chart (the
    /// subcommand's help lists them; without it, the first). Repeat for more charts. An
    /// existing FILE is replaced whole.
    #[arg(long = "plot", value_name = "[CHART=]FILE")]
    pub plot: Vec<String>,
    /// Picture size in pixels, `WIDTHxHEIGHT` (default 1000x600).
    #[arg(long, value_name = "WxH")]
    pub plot_size: Option<String>,
}

/// Picture formats, chosen by the file name's extension.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Picture {
    /// Scalable vector graphics (text).
    Svg,
    /// A bitmap, drawn with the bundled font.
    Png,
}

/// One parsed `--plot`: which chart, where, in what format.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct PlotRequest {
    /// The chart's short name, or `None` for the subcommand's first chart.
    pub chart: Option<String>,
    /// The file to write.
    pub path: PathBuf,
    /// Picture format from the extension.
    pub format: Picture,
}

/// The picture format a path's extension names.
pub fn picture_format(path: &Path, flag: &str) -> Result<Picture> {
    match path
        .extension()
        .and_then(|e| e.to_str())
        .map(str::to_ascii_lowercase)
        .as_deref()
    {
        Some("svg") => Ok(Picture::Svg),
        Some("png") => Ok(Picture::Png),
        _ => Err(
            Error::input(format!("`{}` names no picture format", path.display()))
                .in_origin(flag)
                .help("end the file name in `.svg` or `.png`"),
        ),
    }
}

impl PlotArgs {
    /// Checks every `--plot` against the chart names `available` and parses `--plot-size`,
    /// before any work is done, so a mistake costs nothing and writes nothing.
    pub fn requests(&self, available: &[&str]) -> Result<(Vec<PlotRequest>, Size)> {
        let mut requests = Vec::with_capacity(self.plot.len());
        for text in &self.plot {
            let (chart, file) = match text.split_once('=') {
                Some((name, file)) if is_chart_name(name) => (Some(name.to_string()), file),
                _ => (None, text.as_str()),
            };
            if let Some(name) = &chart {
                if !available.contains(&name.as_str()) {
                    return Err(Error::input(format!("there is no `{name}` chart here"))
                        .in_origin("--plot")
                        .help(format!(
                            "charts of this subcommand: {}",
                            available.join(", ")
                        )));
                }
            }
            if file.is_empty() {
                return Err(Error::input("the file name is empty").in_origin("--plot"));
            }
            let path = PathBuf::from(file);
            // `-` is standard output, as SVG text (a PNG's bytes do not belong on a terminal).
            let format = if file == "-" {
                Picture::Svg
            } else {
                picture_format(&path, "--plot")?
            };
            requests.push(PlotRequest {
                chart,
                path,
                format,
            });
        }
        let size = match &self.plot_size {
            None => DEFAULT_SIZE,
            Some(text) => parse_size(text)?,
        };
        Ok((requests, size))
    }
}

fn is_chart_name(text: &str) -> bool {
    !text.is_empty() && text.chars().all(|c| c.is_ascii_lowercase() || c == '-')
}

/// Smallest and largest accepted picture side, in pixels.
const SIDE_PX: std::ops::RangeInclusive<u32> = 300..=8000;

fn parse_size(text: &str) -> Result<Size> {
    let bad = || {
        Error::input(format!("`{text}` is not a picture size"))
            .in_origin("--plot-size")
            .help(format!(
                "write WIDTHxHEIGHT in pixels, each {} to {}, e.g. `1200x700`",
                SIDE_PX.start(),
                SIDE_PX.end()
            ))
    };
    let (width, height) = text.split_once(['x', 'X']).ok_or_else(bad)?;
    let width: u32 = width.trim().parse().map_err(|_| bad())?;
    let height: u32 = height.trim().parse().map_err(|_| bad())?;
    if SIDE_PX.contains(&width) && SIDE_PX.contains(&height) {
        Ok(Size { width, height })
    } else {
        Err(bad())
    }
}

/// Draws each requested chart of `charts` and adds it to `outputs`, to be written with the
/// run's other files.
pub fn add(
    outputs: &mut output::Outputs<'_>,
    requests: &[PlotRequest],
    size: Size,
    charts: &[Named],
) -> Result<()> {
    for request in requests {
        let named = match &request.chart {
            Some(name) => charts.iter().find(|c| c.name == name),
            None => charts.first(),
        }
        .ok_or_else(|| Error::input("this result has no chart to draw").in_origin("--plot"))?;
        let bytes = match request.format {
            Picture::Svg => draw::svg(&named.chart, size)?.into_bytes(),
            Picture::Png => draw::png(&named.chart, size)?,
        };
        let target = if request.path.as_os_str() == "-" {
            output::Target::Stdout
        } else {
            output::Target::Path(request.path.clone())
        };
        outputs.add("--plot", Some(target), bytes);
    }
    Ok(())
}

/// Refuses a chart sent to standard output (`--plot -`) when the report goes there too
/// (`report`: where the report goes, `None` for standard output).
pub fn check_places(requests: &[PlotRequest], report: Option<&output::Target>) -> Result<()> {
    let report_on_stdout = matches!(report, None | Some(output::Target::Stdout));
    if report_on_stdout && requests.iter().any(|r| r.path.as_os_str() == "-") {
        return Err(Error::input(
            "--plot - and the report both go to standard output; give each its own place",
        )
        .in_origin("--plot")
        .help("write the report with `-o FILE`, or the chart to a file"));
    }
    Ok(())
}

/// Draws the requested charts and writes them under the rules of every output (never over one
/// of `inputs`, each file whole or not at all, all of them or none). `report` is where the
/// report itself goes (`None`: standard output), so that a chart and the report never both
/// claim standard output.
pub fn write(
    requests: &[PlotRequest],
    size: Size,
    charts: &[Named],
    inputs: &output::Inputs,
    report: Option<&output::Target>,
) -> Result<()> {
    check_places(requests, report)?;
    let mut outputs = output::Outputs::new(inputs);
    add(&mut outputs, requests, size, charts)?;
    outputs.write()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn args(plots: &[&str], size: Option<&str>) -> PlotArgs {
        PlotArgs {
            plot: plots.iter().map(|p| p.to_string()).collect(),
            plot_size: size.map(str::to_string),
        }
    }

    #[test]
    fn plot_specs_pick_a_chart_or_the_first() {
        let (requests, size) = args(&["stress=out/s.PNG", "t.svg", "a=b.svg"], Some("800x500"))
            .requests(&["tension", "stress", "a"])
            .unwrap();
        assert_eq!(requests[0].chart.as_deref(), Some("stress"));
        assert_eq!(requests[0].format, Picture::Png);
        assert_eq!(requests[1].chart, None);
        assert_eq!(requests[1].format, Picture::Svg);
        assert_eq!(requests[2].path, PathBuf::from("b.svg"));
        assert_eq!((size.width, size.height), (800, 500));
    }

    #[test]
    fn bad_plot_specs_are_refused_with_the_option_named() {
        for (plots, size) in [
            (vec!["nope=x.svg"], None),
            (vec!["x.pdf"], None),
            (vec!["tension="], None),
            (vec!["x.svg"], Some("10x10")),
            (vec!["x.svg"], Some("wide")),
        ] {
            let err = args(&plots, size).requests(&["tension"]).unwrap_err();
            assert_eq!(err.exit_code(), taut::error::EXIT_BAD_INPUT, "{err}");
            assert!(err.to_string().contains("--plot"), "{err}");
        }
    }
}
