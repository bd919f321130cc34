//! The built-in k_ij table for the terminal, as CSV, or as JSON.

use crate::cli::Format;
use crate::error::CliError;
use crate::report::kij::KijReport;
use comfy_table::{CellAlignment, ContentArrangement, Table};

/// The rows with their source keys, then each source in full.
pub fn text(r: &KijReport) -> String {
    let mut t = Table::new();
    t.load_style(crate::render::house_table::STYLE)
        .set_content_arrangement(ContentArrangement::Disabled)
        .set_header(vec![
            "pair",
            "family",
            "k_ij",
            "confidence",
            "published range",
            "source",
        ]);
    for k in &r.rows {
        t.add_row(vec![
            format!("{}-{}", k.a, k.b),
            k.family.to_string(),
            format!("{:.4}", k.value),
            k.confidence.clone(),
            k.plausible_range.clone(),
            k.source_key.clone(),
        ]);
    }
    if let Some(c) = t.column_mut(2) {
        c.set_cell_alignment(CellAlignment::Right);
    }
    let mut out = format!("{t}\n");
    let mut keys: Vec<(&str, &str)> = r
        .rows
        .iter()
        .map(|k| (k.source_key.as_str(), k.source.as_str()))
        .collect();
    keys.sort_unstable();
    keys.dedup();
    for (key, source) in keys {
        out.push_str(&format!("{key}: {source}\n"));
    }
    for k in r.rows.iter().filter(|k| !k.notes.is_empty()) {
        out.push_str(&format!("note on {}-{}: {}\n", k.a, k.b, k.notes));
    }
    out.push_str(&format!("{}\n", r.note));
    out
}

/// One row per pair.
pub fn csv(r: &KijReport) -> Result<String, CliError> {
    let e = |e: csv::Error| CliError::Output(e.to_string());
    let mut w = csv::Writer::from_writer(Vec::new());
    w.write_record([
        "component 1",
        "component 2",
        "family",
        "value",
        "confidence",
        "plausible_range",
        "source_key",
        "source",
        "notes",
    ])
    .map_err(e)?;
    for k in &r.rows {
        w.write_record([
            k.a.as_str(),
            k.b.as_str(),
            k.family,
            &format!("{}", k.value),
            &k.confidence,
            &k.plausible_range,
            &k.source_key,
            &k.source,
            &k.notes,
        ])
        .map_err(e)?;
    }
    let bytes = w
        .into_inner()
        .map_err(|e| CliError::Output(e.to_string()))?;
    String::from_utf8(bytes).map_err(|e| CliError::Output(e.to_string()))
}

/// Prints the report.
pub fn render(r: &KijReport, format: Format) -> Result<(), CliError> {
    let text = match format {
        Format::Table => crate::render::wrap::fold(&text(r)),
        Format::Csv => csv(r)?,
        Format::Json => crate::render::json::to_string(r)?,
    };
    crate::render::emit(&text)
}
