//! The design-basis table in five formats: terminal text, CSV (SI), JSON (SI), Markdown and
//! an Excel workbook (display units; the basis on its own sheet). Every format carries the
//! basis: CSV as `#` comment lines above the header, JSON as the `basis` object.
//!
//! Every format is written as the rows are computed, a chunk at a time ([`TableWriter`]),
//! so memory does not grow with the grid. A table of one chunk is laid out from its own
//! cells (the flag column only when a row is flagged); a longer one has fixed column widths
//! that fit any number printed, and always the flag column.

use crate::cli::TableFormat;
use crate::error::CliError;
use crate::render::number::sig;
use crate::report::table::{TableBasis, TableColumn, TableRow};
use crate::table_property::ALL;
use crate::units::PA_PER_BAR;
use serde::Serialize;
use std::io::Write;
use std::path::Path;

/// Significant figures shown for people.
const SIG: usize = 6;

/// Display unit and factor of a column key.
fn display(key: &str) -> (&'static str, f64) {
    ALL.iter()
        .find(|p| p.key == key)
        .map_or(("", 1.0), |p| (p.unit_display, p.display_factor))
}

/// The basis as (label, text) lines.
fn basis_lines(b: &TableBasis) -> Vec<(String, String)> {
    let mut l = vec![
        ("tool".to_string(), b.tool.clone()),
        (
            "model".to_string(),
            format!("{} ({})", b.model_name, b.model),
        ),
        ("model source".to_string(), b.citation.clone()),
        ("k_ij".to_string(), b.kij.join("; ")),
        ("fluid".to_string(), b.fluid.clone()),
    ];
    let entered = b
        .composition
        .iter()
        .map(|c| {
            format!(
                "{}={}{}",
                c.id,
                c.as_entered,
                if b.entered_in_percent { "%" } else { "" }
            )
        })
        .collect::<Vec<_>>()
        .join(", ");
    l.push((
        "composition as entered".to_string(),
        format!("{entered} ({} basis)", b.entered_basis),
    ));
    if let Some(s) = b.normalized_from {
        l.push((
            "normalisation".to_string(),
            format!("the entered values summed to {s} and were scaled to 1"),
        ));
    }
    l.push((
        "mole fractions (normalised)".to_string(),
        b.composition
            .iter()
            .map(|c| format!("{}={:.6}", c.id, c.mole_fraction))
            .collect::<Vec<_>>()
            .join(", "),
    ));
    l.push((
        "mass fractions (normalised)".to_string(),
        b.composition
            .iter()
            .map(|c| format!("{}={:.6}", c.id, c.mass_fraction))
            .collect::<Vec<_>>()
            .join(", "),
    ));
    for c in &b.component_sources {
        l.push((
            format!("data of {}", c.name),
            format!(
                "constants: {} (confidence {}); ideal-gas cp: {}",
                c.constants_source, c.confidence, c.cp_source
            ),
        ));
    }
    l.push((
        "temperatures entered".to_string(),
        b.temperatures_entered.clone(),
    ));
    l.push(("pressures entered".to_string(), b.pressures_entered.clone()));
    l.push((
        "ambient pressure (gauge readings)".to_string(),
        format!("{} Pa", b.ambient_pressure_pa),
    ));
    l.push(("root".to_string(), b.root.to_string()));
    l.push(("method".to_string(), b.method.clone()));
    l.push((
        "units".to_string(),
        b.units
            .iter()
            .map(|u| format!("{} [{}]", u.quantity, u.unit))
            .collect::<Vec<_>>()
            .join(", "),
    ));
    l.push(("caution".to_string(), b.caution.to_string()));
    l
}

/// The basis as `#` comment lines and the header row of the CSV table; `phase` when the rows
/// carry a phase column.
pub fn csv_head(
    basis: &TableBasis,
    columns: &[TableColumn],
    phase: bool,
) -> Result<String, CliError> {
    let mut out = Vec::with_capacity(2048);
    for (k, v) in basis_lines(basis) {
        out.extend_from_slice(format!("# {k}: {}\n", v.replace('\n', " ")).as_bytes());
    }
    let mut w = csv::Writer::from_writer(out);
    let e = |e: csv::Error| CliError::Output(e.to_string());
    let mut header = vec!["temperature_k".to_string(), "pressure_pa".to_string()];
    if phase {
        header.push("phase".to_string());
    }
    header.extend(columns.iter().map(|c| c.key.to_string()));
    header.push("flag".to_string());
    header.push("error".to_string());
    w.write_record(&header).map_err(e)?;
    let bytes = w
        .into_inner()
        .map_err(|e| CliError::Output(e.to_string()))?;
    String::from_utf8(bytes).map_err(|e| CliError::Output(e.to_string()))
}

/// Rows of the CSV table, SI units (about 64 bytes a row).
pub fn csv_rows(rows: &[TableRow], phase: bool) -> Result<Vec<u8>, CliError> {
    use std::fmt::Write as _;
    let mut w = csv::WriterBuilder::new()
        .has_headers(false)
        .from_writer(Vec::with_capacity(64 * rows.len()));
    let e = |e: csv::Error| CliError::Output(e.to_string());
    // One formatting buffer for every cell (a million-row table formats millions of
    // numbers).
    let mut cell = String::new();
    let mut number = |w: &mut csv::Writer<Vec<u8>>, v: f64| {
        cell.clear();
        let _ = write!(cell, "{v:e}");
        w.write_field(&cell)
    };
    for row in rows {
        number(&mut w, row.temperature_k).map_err(e)?;
        number(&mut w, row.pressure_pa).map_err(e)?;
        if phase {
            w.write_field(row.phase.unwrap_or_default()).map_err(e)?;
        }
        for v in &row.values {
            match v {
                Some(v) => number(&mut w, *v).map_err(e)?,
                None => w.write_field("").map_err(e)?,
            }
        }
        w.write_field(row.flag.as_deref().unwrap_or_default())
            .map_err(e)?;
        w.write_field(row.error.as_deref().unwrap_or_default())
            .map_err(e)?;
        w.write_record(None::<&[u8]>).map_err(e)?;
    }
    w.into_inner().map_err(|e| CliError::Output(e.to_string()))
}

/// Widest text of a number printed with [`SIG`] significant figures ("-1.23457e-10").
const NUMBER_WIDTH: usize = SIG + 6;

/// The layout of the display formats: which columns, and (for the terminal) their widths.
struct Layout {
    header: Vec<String>,
    phase: bool,
    flag: bool,
    widths: Vec<usize>,
}

impl Layout {
    /// The layout for `first`, the first chunk of rows; `only` when it is the whole table.
    fn new(columns: &[TableColumn], phase: bool, first: &[TableRow], only: bool) -> Self {
        let flag = !only || first.iter().any(|r| r.flag.is_some());
        let mut header = vec!["T [K]".to_string(), "P [bar]".to_string()];
        if phase {
            header.push("phase".to_string());
        }
        for c in columns {
            header.push(format!("{} [{}]", c.name, display(c.key).0));
        }
        if flag {
            header.push("flag".to_string());
        }
        let mut layout = Self {
            widths: header.iter().map(String::len).collect(),
            header,
            phase,
            flag,
        };
        if only {
            for row in first {
                let cells = layout.cells(columns, row);
                for (w, c) in layout.widths.iter_mut().zip(cells) {
                    *w = (*w).max(c.len());
                }
            }
        } else {
            let numbers = columns.len() + 2;
            let text = |k: usize| k >= 2 && (phase && k == 2 || flag && k == numbers + 1);
            let phase_width = ["supercritical", "two-phase"]
                .map(str::len)
                .into_iter()
                .max();
            for (k, w) in layout.widths.iter_mut().enumerate() {
                *w = (*w).max(if text(k) {
                    phase_width.unwrap_or(0).max(14)
                } else {
                    NUMBER_WIDTH
                });
            }
        }
        layout
    }

    /// One row in display units as text.
    fn cells(&self, columns: &[TableColumn], row: &TableRow) -> Vec<String> {
        let mut cells = vec![
            sig(row.temperature_k, SIG),
            sig(row.pressure_pa / PA_PER_BAR, SIG),
        ];
        if self.phase {
            cells.push(row.phase.unwrap_or("-").to_string());
        }
        for (c, v) in columns.iter().zip(&row.values) {
            cells.push(v.map_or_else(|| "-".to_string(), |v| sig(v * display(c.key).1, SIG)));
        }
        if self.flag {
            cells.push(row.flag.clone().unwrap_or_default());
        }
        cells
    }

    /// One terminal line: each cell right-aligned in its width, one space either side, a
    /// blank between columns.
    fn line(&self, cells: &[String], out: &mut String) {
        for (k, (c, w)) in cells.iter().zip(&self.widths).enumerate() {
            out.push_str(if k == 0 { " " } else { "  " });
            for _ in c.len()..*w {
                out.push(' ');
            }
            out.push_str(c);
            out.push(' ');
        }
        out.push('\n');
    }

    fn rule(&self) -> String {
        let n: usize = self.widths.iter().map(|w| w + 3).sum::<usize>() - 1;
        format!("{}\n", "-".repeat(n))
    }
}

/// The basis and columns of the JSON object, written before its rows.
#[derive(Serialize)]
struct JsonHead<'a> {
    basis: &'a TableBasis,
    columns: &'a [TableColumn],
}

/// What each format needs while it is written.
enum Sink {
    Text(Layout),
    Markdown(Layout),
    Csv,
    Json {
        first: bool,
    },
    Xlsx {
        book: Box<rust_xlsxwriter::Workbook>,
        layout: Layout,
        row: u32,
    },
}

/// A table being written: [`TableWriter::new`] with the first chunk, then
/// [`TableWriter::rows`] for each chunk in order (the first one too), then
/// [`TableWriter::finish`].
pub struct TableWriter<'a> {
    basis: &'a TableBasis,
    columns: &'a [TableColumn],
    phase: bool,
    sink: Sink,
}

fn out_err(e: impl std::fmt::Display) -> CliError {
    CliError::Output(e.to_string())
}

fn xlsx_err(e: rust_xlsxwriter::XlsxError) -> CliError {
    CliError::Output(format!("xlsx: {e}"))
}

impl<'a> TableWriter<'a> {
    /// Starts the table in `format`, laid out from `first` (the first chunk; `only` when it
    /// is the whole table), and writes what comes before the rows.
    pub fn new(
        format: TableFormat,
        basis: &'a TableBasis,
        columns: &'a [TableColumn],
        phase: bool,
        first: &[TableRow],
        only: bool,
        out: &mut dyn Write,
    ) -> Result<Self, CliError> {
        let layout = || Layout::new(columns, phase, first, only);
        let sink = match format {
            TableFormat::Table => {
                let l = layout();
                let mut head = String::new();
                for (k, v) in basis_lines(basis) {
                    head.push_str(&crate::render::wrap::fold(&format!("{k}: {v}\n")));
                }
                head.push('\n');
                head.push_str(&l.rule());
                l.line(&l.header, &mut head);
                head.push_str(&l.rule());
                out.write_all(head.as_bytes()).map_err(out_err)?;
                Sink::Text(l)
            }
            TableFormat::Markdown => {
                let l = layout();
                let esc = |s: &str| s.replace('|', "\\|");
                let mut head = format!(
                    "# Design-basis table: {} with {}\n\n## Basis\n\n",
                    esc(&basis.fluid),
                    esc(&basis.model_name)
                );
                for (k, v) in basis_lines(basis) {
                    head.push_str(&format!("- **{}**: {}\n", esc(&k), esc(&v)));
                }
                head.push_str("\n## Table\n\n");
                head.push_str(&format!("| {} |\n", l.header.join(" | ")));
                head.push_str(&format!(
                    "|{}\n",
                    l.header.iter().map(|_| "---:|").collect::<String>()
                ));
                out.write_all(head.as_bytes()).map_err(out_err)?;
                Sink::Markdown(l)
            }
            TableFormat::Csv => {
                out.write_all(csv_head(basis, columns, phase)?.as_bytes())
                    .map_err(out_err)?;
                Sink::Csv
            }
            TableFormat::Json => {
                let head =
                    serde_json::to_string_pretty(&JsonHead { basis, columns }).map_err(out_err)?;
                // The object without its closing brace, then the rows array.
                let open = head.trim_end().trim_end_matches('}').trim_end();
                out.write_all(open.as_bytes()).map_err(out_err)?;
                out.write_all(b",\n  \"rows\": [").map_err(out_err)?;
                Sink::Json { first: true }
            }
            TableFormat::Xlsx => {
                let l = layout();
                let mut book = rust_xlsxwriter::Workbook::new();
                let ws = book.add_worksheet_with_constant_memory();
                ws.set_name("table").map_err(xlsx_err)?;
                let bold = rust_xlsxwriter::Format::new().set_bold();
                for (c, h) in l.header.iter().enumerate() {
                    ws.set_column_width(c as u16, 16).map_err(xlsx_err)?;
                    ws.write_string_with_format(0, c as u16, h, &bold)
                        .map_err(xlsx_err)?;
                }
                ws.set_freeze_panes(1, 0).map_err(xlsx_err)?;
                Sink::Xlsx {
                    book: Box::new(book),
                    layout: l,
                    row: 1,
                }
            }
        };
        Ok(Self {
            basis,
            columns,
            phase,
            sink,
        })
    }

    /// Writes a chunk of rows.
    pub fn rows(&mut self, rows: &[TableRow], out: &mut dyn Write) -> Result<(), CliError> {
        let columns = self.columns;
        match &mut self.sink {
            Sink::Text(l) => {
                let mut text = String::with_capacity(rows.len() * 80);
                for row in rows {
                    l.line(&l.cells(columns, row), &mut text);
                }
                out.write_all(text.as_bytes()).map_err(out_err)
            }
            Sink::Markdown(l) => {
                let mut text = String::with_capacity(rows.len() * 80);
                for row in rows {
                    text.push_str(&format!("| {} |\n", l.cells(columns, row).join(" | ")));
                }
                out.write_all(text.as_bytes()).map_err(out_err)
            }
            Sink::Csv => out.write_all(&csv_rows(rows, self.phase)?).map_err(out_err),
            Sink::Json { first } => {
                let mut buf = Vec::with_capacity(rows.len() * 160);
                for row in rows {
                    buf.extend_from_slice(if *first { b"\n    " } else { b",\n    " });
                    *first = false;
                    serde_json::to_writer(&mut buf, row).map_err(out_err)?;
                }
                out.write_all(&buf).map_err(out_err)
            }
            Sink::Xlsx { book, layout, row } => {
                let ws = book.worksheet_from_index(0).map_err(xlsx_err)?;
                for r in rows {
                    let rr = *row;
                    ws.write_number(rr, 0, r.temperature_k).map_err(xlsx_err)?;
                    ws.write_number(rr, 1, r.pressure_pa / PA_PER_BAR)
                        .map_err(xlsx_err)?;
                    let mut c = 2u16;
                    if layout.phase {
                        ws.write_string(rr, c, r.phase.unwrap_or("-"))
                            .map_err(xlsx_err)?;
                        c += 1;
                    }
                    for (col, v) in columns.iter().zip(&r.values) {
                        match v {
                            Some(v) => ws.write_number(rr, c, v * display(col.key).1),
                            None => ws.write_string(rr, c, "-"),
                        }
                        .map_err(xlsx_err)?;
                        c += 1;
                    }
                    if let Some(f) = r.flag.as_deref().filter(|_| layout.flag) {
                        ws.write_string(rr, c, f).map_err(xlsx_err)?;
                    }
                    *row += 1;
                }
                Ok(())
            }
        }
    }

    /// Writes what comes after the rows (the warnings, where the format carries them); a
    /// workbook is saved to `xlsx_path`.
    pub fn finish(
        self,
        warnings: &[String],
        out: &mut dyn Write,
        xlsx_path: Option<&Path>,
    ) -> Result<(), CliError> {
        match self.sink {
            Sink::Text(l) => out.write_all(l.rule().as_bytes()),
            Sink::Markdown(_) => {
                let mut text = String::new();
                for w in warnings {
                    text.push_str(&format!("\n**Warning:** {}\n", w.replace('|', "\\|")));
                }
                out.write_all(text.as_bytes())
            }
            Sink::Csv => Ok(()),
            Sink::Json { .. } => {
                let w = serde_json::to_string(warnings).map_err(out_err)?;
                out.write_all(format!("\n  ],\n  \"warnings\": {w}\n}}\n").as_bytes())
            }
            Sink::Xlsx { mut book, .. } => {
                let bold = rust_xlsxwriter::Format::new().set_bold();
                let ws = book.add_worksheet();
                ws.set_name("basis").map_err(xlsx_err)?;
                ws.set_column_width(0, 34).map_err(xlsx_err)?;
                ws.set_column_width(1, 120).map_err(xlsx_err)?;
                let lines = basis_lines(self.basis);
                for (i, (k, v)) in lines.iter().enumerate() {
                    ws.write_string_with_format(i as u32, 0, k, &bold)
                        .map_err(xlsx_err)?;
                    ws.write_string(i as u32, 1, v).map_err(xlsx_err)?;
                }
                for (i, w) in warnings.iter().enumerate() {
                    let rr = (lines.len() + 1 + i) as u32;
                    ws.write_string_with_format(rr, 0, "warning", &bold)
                        .map_err(xlsx_err)?;
                    ws.write_string(rr, 1, w).map_err(xlsx_err)?;
                }
                let path = xlsx_path.ok_or_else(|| {
                    CliError::BadInput(
                        "--format xlsx writes a workbook: give --output FILE.xlsx".to_string(),
                    )
                })?;
                return book.save(path).map_err(xlsx_err);
            }
        }
        .map_err(out_err)
    }
}
