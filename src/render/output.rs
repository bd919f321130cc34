//! One way to print a report: its terminal text, CSV or JSON on stdout; its warnings, and
//! beside CSV or JSON the caution, on stderr (the table carries the caution in its text).

use crate::cli::Format;
use crate::error::CliError;
use crate::render::{emit, json, side_notes};
use serde::Serialize;

/// A report as the renderers see it ([`crate::render::outputs`] says which renderer draws
/// each report).
pub trait Output: Serialize {
    /// The terminal text.
    fn text(&self) -> String;
    /// The CSV text, SI units.
    fn csv(&self) -> Result<String, CliError>;
    /// The warnings of the run.
    fn warnings(&self) -> &[String];
    /// The caution for the equipment the results are for.
    fn caution(&self) -> &str;
}

/// Prints `report` in `format`.
pub fn render<R: Output>(report: &R, format: Format) -> Result<(), CliError> {
    let text = match format {
        Format::Table => crate::render::wrap::fold(&report.text()),
        Format::Csv => report.csv()?,
        Format::Json => json::to_string(report)?,
    };
    emit(&text)?;
    match format {
        Format::Table => side_notes(report.warnings(), None),
        _ => side_notes(report.warnings(), Some(report.caution())),
    }
    Ok(())
}
