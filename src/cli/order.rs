//! `--order-sheet FILE`, shared by `plan`, `lengths` and `convert`: the sheet a string maker
//! makes the strings from, as a text table, CSV or an HTML page (chosen by the file's ending),
//! written through the one output writer with the command's other outputs.

use std::path::PathBuf;

use clap::Args;

use taut::charts::order::{self, OrderRow};
use taut::error::{Error, Result};

use super::layout::{paragraph, Column, Give, Grid};
use super::output::{self, Outputs, View};
use super::text::{diameter, diameter_symbol, force, length, user};

/// The order-sheet options.
#[derive(Debug, Clone, Args)]
pub struct OrderArgs {
    /// Also write an order sheet for a string maker: every string's construction (core and
    /// wraps), vibrating and cut length, and target tension in the --force-unit. `.csv` writes
    /// CSV, `.html` a printable page, any other name a text table (`taut help order-sheet`).
    #[arg(long, value_name = "FILE")]
    pub order_sheet: Option<PathBuf>,
    /// Add the colour marking column to the order sheet: C strings red, F strings dark blue, as
    /// harp strings usually carry them.
    #[arg(long, requires = "order_sheet")]
    pub marking: bool,
}

/// What the sheet's file name asks for.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Form {
    Table,
    Csv,
    Html,
}

impl OrderArgs {
    /// Checks the file name before any work; `None` when no sheet is asked for.
    pub fn request(&self) -> Result<Option<()>> {
        match &self.order_sheet {
            None => Ok(None),
            Some(path) if path.as_os_str().is_empty() => {
                Err(Error::input("the order sheet needs a file name").in_origin("--order-sheet"))
            }
            Some(_) => Ok(Some(())),
        }
    }

    fn form(&self) -> Form {
        match self
            .order_sheet
            .as_deref()
            .and_then(|p| p.extension())
            .and_then(|e| e.to_str())
            .map(str::to_ascii_lowercase)
            .as_deref()
        {
            Some("csv") => Form::Csv,
            Some("html" | "htm") => Form::Html,
            _ => Form::Table,
        }
    }

    /// Adds the sheet of `rows` (titled `title`) to `outputs`, when one is asked for.
    pub fn add(
        &self,
        outputs: &mut Outputs<'_>,
        title: &str,
        rows: &[OrderRow],
        view: &View,
    ) -> Result<()> {
        let Some(path) = &self.order_sheet else {
            return Ok(());
        };
        output::check_finite(&rows)?;
        let bytes = match self.form() {
            Form::Csv => output::safe_csv(&order::csv(rows, view.force)?)?,
            Form::Html => order::html(title, rows, view.force),
            Form::Table => table(title, rows, view),
        };
        outputs.add(
            "--order-sheet",
            Some(output::Target::Path(path.clone())),
            bytes.into_bytes(),
        );
        Ok(())
    }
}

/// The order sheet as a text table: figures in the chosen units, each kind's materials and core
/// section in a legend under it, then the notes and the cautions.
pub fn table(title: &str, rows: &[OrderRow], view: &View) -> String {
    let d = diameter_symbol(view.length);
    let l = view.length.symbol();
    let two_wraps = rows.iter().any(|r| r.outer_wrap.is_some());
    let cut = rows.iter().any(|r| r.cut_length_m.is_some());
    let marking = rows.iter().any(|r| r.marking.is_some());
    let mut columns = vec![
        Column::figure("#"),
        Column::figure("str"),
        Column::text("pitch"),
        Column::text("note").give(Give::Drop(2)),
        Column::text("kind").give(Give::Shorten(10, 1)),
        Column::figure(&format!("core {d}")),
        Column::figure(&format!("wrap {d}")),
    ];
    if two_wraps {
        columns.push(Column::figure(&format!("wrap 2 {d}")));
    }
    columns.extend([
        Column::figure(&format!("outer {d}")),
        Column::figure("g/m").give(Give::Drop(3)),
        Column::figure(&format!("length {l}")),
    ]);
    if cut {
        columns.push(Column::figure(&format!("cut {l}")));
    }
    columns.push(Column::figure(view.force.symbol()));
    if marking {
        columns.push(Column::text("mark"));
    }
    let mut grid = Grid::new(columns);
    let dia = |m: Option<f64>| m.map_or("-".to_string(), |m| diameter(m * 1000.0, view.length));
    for row in rows {
        let mut cells = vec![
            if row.string == 1 {
                row.course.to_string()
            } else {
                String::new()
            },
            row.string.to_string(),
            user(&row.pitch).into_owned(),
            user(&row.note).into_owned(),
            user(&row.kind).into_owned(),
            dia(row.core_diameter_m.filter(|_| row.build == "wound")),
            dia(row.inner_wrap.as_ref().map(|w| w.wire_diameter_m)),
        ];
        if two_wraps {
            cells.push(dia(row.outer_wrap.as_ref().map(|w| w.wire_diameter_m)));
        }
        cells.extend([
            dia(row.outer_diameter_m),
            format!("{:.3}", row.unit_mass_kg_per_m * 1000.0),
            length(row.vibrating_length_m, view.length),
        ]);
        if cut {
            cells.push(
                row.cut_length_m
                    .map_or("-".to_string(), |m| length(m, view.length)),
            );
        }
        cells.push(force(row.target_tension_n, view.force));
        if marking {
            cells.push(row.marking.unwrap_or_default().to_string());
        }
        grid.row(cells);
    }
    let mut out = paragraph(&format!("Order sheet: {}", user(title)), view.width);
    let _hidden = grid.render_into(&mut out, view.width);
    // Each kind once: what its core and wraps are made of.
    let mut seen: Vec<&str> = Vec::new();
    for row in rows {
        if seen.contains(&row.kind.as_str()) {
            continue;
        }
        seen.push(&row.kind);
        let mut words = format!("{}: {}", user(&row.kind), row.build);
        if let Some(core) = &row.core_material {
            let part = if row.build == "wound" { "core" } else { "of" };
            words.push_str(&format!(", {part} {}", user(core)));
            if let (Some(shape), "wound") = (row.core_shape, row.build) {
                words.push_str(&format!(" ({})", order::shape_word(shape)));
            }
        }
        if let Some(inner) = &row.inner_wrap {
            words.push_str(&format!(", wrap {}", user(&inner.material)));
        }
        if let Some(outer) = &row.outer_wrap {
            words.push_str(&format!(", outer wrap {}", user(&outer.material)));
        }
        words.push('.');
        out.push_str(&super::layout::wrap(&words, view.width, "  ", "    "));
    }
    for note in order::notes(view.force) {
        out.push_str(&paragraph(&note, view.width));
    }
    out.push_str("\nBefore you string this up:\n");
    for caution in taut::plan::warning::SAFETY_CAUTIONS {
        out.push_str(&super::layout::wrap(caution, view.width, "  - ", "    "));
    }
    out
}
