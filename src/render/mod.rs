//! Renderers: one file per output format. Only here are display units and significant
//! figures chosen; JSON and CSV stay in SI.

pub mod chart;
pub mod compare;
pub mod csv;
pub mod envelope;
pub mod envelope_chart;
pub mod flash;
pub mod grid_table;
pub mod json;
pub mod number;
pub mod table;

use crate::cli::Format;
use crate::error::CliError;
use crate::report::fluids::FluidsReport;
use crate::report::state::StateReport;
use std::io::Write;

/// Writes `text` to stdout in one piece.
pub fn emit(text: &str) -> Result<(), CliError> {
    let mut out = std::io::stdout().lock();
    out.write_all(text.as_bytes())
        .and_then(|_| out.flush())
        .map_err(|e| CliError::Output(e.to_string()))
}

/// Prints warnings and the caution on stderr (for formats whose stdout must stay data only).
pub fn side_notes(warnings: &[String], caution: Option<&str>) {
    for w in warnings {
        eprintln!("warning: {w}");
    }
    if let Some(c) = caution {
        eprintln!("caution: {c}");
    }
}

/// Renders a state report.
pub fn state(report: &StateReport, format: Format) -> Result<(), CliError> {
    let text = match format {
        Format::Table => table::state(report),
        Format::Csv => csv::state(report)?,
        Format::Json => json::to_string(report)?,
    };
    emit(&text)?;
    match format {
        Format::Table => side_notes(&report.warnings, None),
        _ => side_notes(&report.warnings, Some(report.caution)),
    }
    Ok(())
}

/// Renders a fluids report.
pub fn fluids(report: &FluidsReport, format: Format) -> Result<(), CliError> {
    let text = match format {
        Format::Table => table::fluids(report),
        Format::Csv => csv::fluids(report)?,
        Format::Json => {
            if report.components.len() == 1 && report.query.is_some() {
                json::to_string(report.components[0])?
            } else {
                json::to_string(report)?
            }
        }
    };
    emit(&text)
}
