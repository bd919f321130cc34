//! The design-basis table in five formats: terminal text, CSV (SI), JSON (SI), Markdown and
//! an Excel workbook (display units; the basis on its own sheet). Every format carries the
//! basis: CSV as `#` comment lines above the header, JSON as the `basis` object.

use crate::cli::TableFormat;
use crate::error::CliError;
use crate::render::number::sig;
use crate::report::table::{TableBasis, TableColumn, TableReport, TableRow};
use crate::table_property::ALL;
use crate::units::PA_PER_BAR;
use comfy_table::{CellAlignment, ContentArrangement, LineStyle, Table, TableStyle};

/// Significant figures shown for people.
const SIG: usize = 6;

/// Renders the report into bytes.
pub fn render(r: &TableReport, format: TableFormat) -> Result<Vec<u8>, CliError> {
    Ok(match format {
        TableFormat::Table => text(r).into_bytes(),
        TableFormat::Csv => csv(r)?.into_bytes(),
        TableFormat::Json => crate::render::json::to_string(r)?.into_bytes(),
        TableFormat::Markdown => markdown(r).into_bytes(),
        TableFormat::Xlsx => xlsx(r)?,
    })
}

/// Display unit and factor of a column key.
fn display(key: &str) -> (&'static str, f64) {
    ALL.iter()
        .find(|p| p.key == key)
        .map_or(("", 1.0), |p| (p.unit_display, p.display_factor))
}

/// Header cells in display units.
fn display_header(r: &TableReport) -> Vec<String> {
    let mut h = vec!["T [K]".to_string(), "P [bar]".to_string()];
    if r.rows.iter().any(|row| row.phase.is_some()) {
        h.push("phase".to_string());
    }
    for c in &r.columns {
        h.push(format!("{} [{}]", c.name, display(c.key).0));
    }
    if flags(r) {
        h.push("flag".to_string());
    }
    h
}

/// True when any row carries a flag (the display formats then show the flag column).
fn flags(r: &TableReport) -> bool {
    r.rows.iter().any(|row| row.flag.is_some())
}

/// Rows in display units as text.
fn display_rows(r: &TableReport) -> Vec<Vec<String>> {
    let phase = r.rows.iter().any(|row| row.phase.is_some());
    let flagged = flags(r);
    r.rows
        .iter()
        .map(|row| {
            let mut cells = vec![
                sig(row.temperature_k, SIG),
                sig(row.pressure_pa / PA_PER_BAR, SIG),
            ];
            if phase {
                cells.push(row.phase.unwrap_or("-").to_string());
            }
            for (c, v) in r.columns.iter().zip(&row.values) {
                cells.push(v.map_or_else(|| "-".to_string(), |v| sig(v * display(c.key).1, SIG)));
            }
            if flagged {
                cells.push(row.flag.clone().unwrap_or_default());
            }
            cells
        })
        .collect()
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

/// Terminal text: the basis, then the table.
pub fn text(r: &TableReport) -> String {
    let mut out = String::new();
    for (k, v) in basis_lines(&r.basis) {
        out.push_str(&format!("{k}: {v}\n"));
    }
    let mut t = Table::new();
    t.load_style(
        TableStyle::new()
            .top_border(LineStyle::none().fill('-').junction('-'))
            .header_separator(LineStyle::none().fill('-').junction('-'))
            .bottom_border(LineStyle::none().fill('-').junction('-')),
    )
    .set_content_arrangement(ContentArrangement::Disabled)
    .set_header(display_header(r));
    for row in display_rows(r) {
        t.add_row(row);
    }
    for i in 0..t.column_count() {
        if let Some(c) = t.column_mut(i) {
            c.set_cell_alignment(CellAlignment::Right);
        }
    }
    out.push_str(&format!("\n{t}\n"));
    out
}

/// Markdown: the basis as a list, then the table.
pub fn markdown(r: &TableReport) -> String {
    let esc = |s: &str| s.replace('|', "\\|");
    let mut out = format!(
        "# Design-basis table: {} with {}\n\n## Basis\n\n",
        esc(&r.basis.fluid),
        esc(&r.basis.model_name)
    );
    for (k, v) in basis_lines(&r.basis) {
        out.push_str(&format!("- **{}**: {}\n", esc(&k), esc(&v)));
    }
    out.push_str("\n## Table\n\n");
    let header = display_header(r);
    out.push_str(&format!("| {} |\n", header.join(" | ")));
    out.push_str(&format!(
        "|{}\n",
        header.iter().map(|_| "---:|").collect::<String>()
    ));
    for row in display_rows(r) {
        out.push_str(&format!("| {} |\n", row.join(" | ")));
    }
    for w in &r.warnings {
        out.push_str(&format!("\n**Warning:** {}\n", esc(w)));
    }
    out
}

/// CSV in SI units, the basis as `#` comment lines first.
pub fn csv(r: &TableReport) -> Result<String, CliError> {
    let phase = r.rows.iter().any(|row| row.phase.is_some());
    let mut out = csv_head(&r.basis, &r.columns, phase)?;
    let rows = csv_rows(&r.rows, phase)?;
    out.push_str(&String::from_utf8(rows).map_err(|e| CliError::Output(e.to_string()))?);
    Ok(out)
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

/// An Excel workbook: sheet "table" (display units, numbers as numbers) and sheet "basis".
pub fn xlsx(r: &TableReport) -> Result<Vec<u8>, CliError> {
    use rust_xlsxwriter::{Format, Workbook};
    let x = |e: rust_xlsxwriter::XlsxError| CliError::Output(format!("xlsx: {e}"));
    let mut wb = Workbook::new();
    let bold = Format::new().set_bold();
    {
        let ws = wb.add_worksheet();
        ws.set_name("table").map_err(x)?;
        let header = display_header(r);
        for (c, h) in header.iter().enumerate() {
            ws.write_string_with_format(0, c as u16, h, &bold)
                .map_err(x)?;
            ws.set_column_width(c as u16, 16).map_err(x)?;
        }
        ws.set_freeze_panes(1, 0).map_err(x)?;
        let phase = r.rows.iter().any(|row| row.phase.is_some());
        let flagged = flags(r);
        for (i, row) in r.rows.iter().enumerate() {
            let rr = (i + 1) as u32;
            ws.write_number(rr, 0, row.temperature_k).map_err(x)?;
            ws.write_number(rr, 1, row.pressure_pa / PA_PER_BAR)
                .map_err(x)?;
            let mut c = 2u16;
            if phase {
                ws.write_string(rr, c, row.phase.unwrap_or("-"))
                    .map_err(x)?;
                c += 1;
            }
            for (col, v) in r.columns.iter().zip(&row.values) {
                match v {
                    Some(v) => ws.write_number(rr, c, v * display(col.key).1).map_err(x)?,
                    None => ws.write_string(rr, c, "-").map_err(x)?,
                };
                c += 1;
            }
            if let Some(f) = row.flag.as_deref().filter(|_| flagged) {
                ws.write_string(rr, c, f).map_err(x)?;
            }
        }
    }
    {
        let ws = wb.add_worksheet();
        ws.set_name("basis").map_err(x)?;
        ws.set_column_width(0, 34).map_err(x)?;
        ws.set_column_width(1, 120).map_err(x)?;
        for (i, (k, v)) in basis_lines(&r.basis).iter().enumerate() {
            ws.write_string_with_format(i as u32, 0, k, &bold)
                .map_err(x)?;
            ws.write_string(i as u32, 1, v).map_err(x)?;
        }
        let n = basis_lines(&r.basis).len();
        for (i, w) in r.warnings.iter().enumerate() {
            let rr = (n + 1 + i) as u32;
            ws.write_string_with_format(rr, 0, "warning", &bold)
                .map_err(x)?;
            ws.write_string(rr, 1, w).map_err(x)?;
        }
    }
    wb.save_to_buffer().map_err(x)
}
