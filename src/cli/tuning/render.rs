//! The tuning reports as tables and CSV rows: one look for listing, fit, comparison, found pitches and the shipped list.

#[allow(unused_imports)]
use super::*;

pub(super) fn heading(summary: &TuningSummary, view: &View) -> String {
    let mut text = paragraph(
        &format!("{} · {}", shown(&summary.name), shown(&summary.description)),
        view.width,
    );
    let reference = &summary.reference;
    let mut line = format!(
        "degree {} = {:.4} Hz, concert A4 = {:.4} Hz",
        reference.degree, reference.hz, reference.concert_a4_hz
    );
    if let (Some(n), Some(period)) = (summary.degrees_per_period, &summary.period) {
        line.push_str(&format!(
            ", {n} degrees in each period of {period} ({:.3} cents)",
            period.cents
        ));
    }
    text.push_str(&paragraph(&line, view.width));
    if let Some(source) = &summary.source {
        text.push_str(&wrap(&shown(source), view.width, "source: ", "        "));
    }
    text
}

pub(super) fn note_with_offset(note: &str, offset: f64) -> String {
    if !offset.is_finite() || offset.abs() < 0.005 {
        note.to_string()
    } else {
        format!("{note} {offset:+.2}c")
    }
}

pub(super) fn ratio_text(ratio: Option<&taut::tuning::pitch::ExactRatio>) -> String {
    ratio.map_or_else(|| "·".to_string(), format_ratio)
}

pub(super) fn finish(grid: &Grid, view: &View) -> String {
    let (table, hidden) = grid.render(view.width);
    format!("{table}{}", hidden_note(&hidden, view.wide, view.width))
}

/// The headers of the two columns measured from the reference degree: cents from it and the
/// exact ratio to it (the JSON and CSV fields `cents_from_reference` and `ratio`).
pub(super) fn from_reference_headers(summary: &TuningSummary) -> (String, String) {
    let degree = summary.reference.degree;
    (
        format!("from deg {degree}"),
        format!("ratio to deg {degree}"),
    )
}

impl Render for DegreeListing {
    fn table(&self, view: &View) -> String {
        let (cents_header, ratio_header) = from_reference_headers(&self.tuning);
        let mut grid = Grid::new(vec![
            Column::figure("deg"),
            Column::figure("Hz"),
            Column::figure(&cents_header),
            Column::figure("gap"),
            Column::text(&ratio_header),
            Column::text("12-tone"),
        ]);
        for row in &self.rows {
            grid.row(vec![
                row.degree.to_string(),
                format!("{:.4}", row.hz),
                format!("{:.3}c", row.cents_from_reference),
                row.step_cents
                    .map_or_else(|| "·".to_string(), |s| format!("{s:.3}c")),
                ratio_text(row.ratio.as_ref()),
                note_with_offset(&row.nearest_note, row.note_offset_cents),
            ]);
        }
        format!("{}{}", heading(&self.tuning, view), finish(&grid, view))
    }

    fn csv(&self) -> Result<String> {
        csv_text(self.rows.iter().map(|row| DegreeCsv {
            degree: row.degree,
            cents_from_reference: sig(row.cents_from_reference),
            step_cents: sig_opt(row.step_cents),
            ratio: row.ratio.as_ref().map(format_ratio),
            hz: sig(row.hz),
            nearest_note: &row.nearest_note,
            note_offset_cents: sig(row.note_offset_cents),
        }))
    }
}

#[derive(Serialize)]
pub(super) struct DegreeCsv<'a> {
    degree: i64,
    cents_from_reference: f64,
    step_cents: Option<f64>,
    ratio: Option<String>,
    hz: f64,
    nearest_note: &'a str,
    note_offset_cents: f64,
}

impl Render for FitReport {
    fn table(&self, view: &View) -> String {
        let mut grid = Grid::new(vec![
            Column::text("just"),
            Column::figure("just c"),
            Column::figure("degrees"),
            Column::figure("steps"),
            Column::figure("tuned c"),
            Column::figure("off by"),
        ]);
        for row in &self.intervals {
            grid.row(vec![
                format_ratio(&row.interval),
                format!("{:.3}", row.just_cents),
                format!("{} → {}", row.from_degree, row.to_degree),
                row.steps.to_string(),
                format!("{:.3}", row.tuning_cents),
                format!("{:+.3}c", row.error_cents),
            ]);
        }
        format!(
            "{}{}{}{}",
            heading(&self.tuning, view),
            paragraph(
                &format!(
                    "Odd limit {}: {} just intervals of the tonality diamond, the best pair of degrees for each.",
                    self.odd_limit,
                    self.intervals.len()
                ),
                view.width
            ),
            finish(&grid, view),
            paragraph(
                &format!(
                    "Mean |off by| {:.3} cents, largest {:.3} cents.",
                    self.mean_abs_error_cents, self.max_abs_error_cents
                ),
                view.width
            )
        )
    }

    fn csv(&self) -> Result<String> {
        csv_text(self.intervals.iter().map(|row| FitCsv {
            interval: format_ratio(&row.interval),
            just_cents: sig(row.just_cents),
            from_degree: row.from_degree,
            to_degree: row.to_degree,
            steps: row.steps,
            tuning_cents: sig(row.tuning_cents),
            error_cents: sig(row.error_cents),
        }))
    }
}

#[derive(Serialize)]
pub(super) struct FitCsv {
    interval: String,
    just_cents: f64,
    from_degree: i64,
    to_degree: i64,
    steps: i64,
    tuning_cents: f64,
    error_cents: f64,
}

impl Render for Comparison {
    fn table(&self, view: &View) -> String {
        let left = &self.left.name;
        let right = &self.right.name;
        let mut grid = Grid::new(vec![
            Column::figure(&format!("{left} deg")).give(Give::Shorten(8, 1)),
            Column::figure("Hz"),
            Column::figure(&format!("{right} deg")).give(Give::Shorten(8, 1)),
            Column::figure("Hz"),
            Column::figure("apart"),
        ]);
        for row in &self.rows {
            grid.row(vec![
                row.left_degree.to_string(),
                format!("{:.4}", row.left_hz),
                row.right_degree.to_string(),
                format!("{:.4}", row.right_hz),
                format!("{:+.3}c", row.difference_cents),
            ]);
        }
        format!(
            "{}{}{}{}",
            heading(&self.left, view),
            heading(&self.right, view),
            finish(&grid, view),
            paragraph(
                &format!(
                    "Mean |apart| {:.3} cents, largest {:.3} cents.",
                    self.mean_abs_difference_cents, self.max_abs_difference_cents
                ),
                view.width
            )
        )
    }

    fn csv(&self) -> Result<String> {
        csv_text(self.rows.iter().map(|row| CompareCsv {
            left_degree: row.left_degree,
            left_hz: sig(row.left_hz),
            left_cents: sig(row.left_cents),
            right_degree: row.right_degree,
            right_hz: sig(row.right_hz),
            difference_cents: sig(row.difference_cents),
        }))
    }
}

#[derive(Serialize)]
pub(super) struct CompareCsv {
    left_degree: i64,
    left_hz: f64,
    left_cents: f64,
    right_degree: i64,
    right_hz: f64,
    difference_cents: f64,
}

impl Render for FoundPitches {
    fn table(&self, view: &View) -> String {
        let (cents_header, ratio_header) = from_reference_headers(&self.tuning);
        let mut grid = Grid::new(vec![
            Column::text("written").give(Give::Shorten(8, 1)),
            Column::figure("deg"),
            Column::figure("Hz"),
            Column::figure(&cents_header),
            Column::text(&ratio_header),
            Column::text("12-tone"),
        ]);
        for found in &self.pitches {
            let pitch = &found.pitch;
            grid.row(vec![
                found.written.clone(),
                pitch
                    .degree
                    .map_or_else(|| "·".to_string(), |d| d.to_string()),
                format!("{:.4}", pitch.hz),
                format!("{:.3}c", pitch.cents_from_reference),
                ratio_text(pitch.ratio.as_ref()),
                note_with_offset(&found.nearest_note, found.note_offset_cents),
            ]);
        }
        format!("{}{}", heading(&self.tuning, view), finish(&grid, view))
    }

    fn csv(&self) -> Result<String> {
        csv_text(self.pitches.iter().map(|found| FoundCsv {
            written: &found.written,
            degree: found.pitch.degree,
            hz: sig(found.pitch.hz),
            cents_from_reference: sig(found.pitch.cents_from_reference),
            ratio: found.pitch.ratio.as_ref().map(format_ratio),
            nearest_note: &found.nearest_note,
            note_offset_cents: sig(found.note_offset_cents),
        }))
    }
}

#[derive(Serialize)]
pub(super) struct FoundCsv<'a> {
    written: &'a str,
    degree: Option<i64>,
    hz: f64,
    cents_from_reference: f64,
    ratio: Option<String>,
    nearest_note: &'a str,
    note_offset_cents: f64,
}

impl Render for ShippedTunings {
    fn table(&self, view: &View) -> String {
        let mut grid = Grid::new(vec![
            Column::text("name"),
            Column::figure("degrees"),
            Column::text("period"),
            Column::text("description").give(Give::Shorten(20, 1)),
        ]);
        for tuning in &self.tunings {
            grid.row(vec![
                tuning.name.clone(),
                tuning
                    .degrees_per_period
                    .map_or_else(|| "·".to_string(), |n| n.to_string()),
                tuning
                    .period
                    .as_ref()
                    .map_or_else(|| "·".to_string(), ToString::to_string),
                tuning.description.clone(),
            ]);
        }
        finish(&grid, view)
    }

    fn csv(&self) -> Result<String> {
        csv_text(self.tunings.iter().map(|tuning| ListCsv {
            name: &tuning.name,
            degrees_per_period: tuning.degrees_per_period,
            period: tuning.period.as_ref().map(ToString::to_string),
            description: &tuning.description,
        }))
    }
}

#[derive(Serialize)]
pub(super) struct ListCsv<'a> {
    name: &'a str,
    degrees_per_period: Option<usize>,
    period: Option<String>,
    description: &'a str,
}
