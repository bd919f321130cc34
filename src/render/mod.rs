//! Renderers: one file per output format. Only here are display units and significant
//! figures chosen; JSON and CSV stay in SI.

pub mod audit;
pub mod chart;
pub mod compare;
pub mod compress;
pub mod csv;
pub mod envelope;
pub mod envelope_chart;
pub mod flash;
pub mod flow;
pub mod grid_table;
pub mod house_table;
pub mod jobs;
pub mod json;
pub mod kij;
pub mod model_grid;
pub mod notes;
pub mod number;
pub mod output;
pub mod outputs;
pub mod process;
pub mod saturation_csv;
pub mod saturation_table;
pub mod table;
pub mod vessel;
pub mod wrap;

use crate::cli::Format;
use crate::error::CliError;
use crate::report::fluids::FluidsReport;
use std::io::Write;

/// Writes `text` to stdout in one piece.
pub fn emit(text: &str) -> Result<(), CliError> {
    let mut out = std::io::stdout().lock();
    out.write_all(text.as_bytes())
        .and_then(|_| out.flush())
        .map_err(|e| CliError::Output(e.to_string()))
}

/// Prints one warning on stderr, folded at the terminal width like every prose line.
pub fn warn(w: &str) {
    eprint!("{}", wrap::fold(&format!("warning: {w}\n")));
}

/// Prints warnings and the caution on stderr (for formats whose stdout must stay data only).
pub fn side_notes(warnings: &[String], caution: Option<&str>) {
    for w in warnings {
        warn(w);
    }
    if let Some(c) = caution {
        eprintln!("caution: {c}");
    }
}

/// Renders the model catalogue.
pub fn models(
    report: &crate::report::models::ModelsReport,
    format: Format,
) -> Result<(), CliError> {
    let text = match format {
        Format::Table => wrap::fold(&table::models(report)),
        Format::Csv => csv::models(report)?,
        Format::Json => json::to_string(report)?,
    };
    emit(&text)
}

/// Renders a fluids report.
pub fn fluids(report: &FluidsReport, format: Format) -> Result<(), CliError> {
    let text = match format {
        Format::Table => wrap::fold(&table::fluids(report)),
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
