//! JSON output: the report structs as they are, SI units, pretty-printed.

use crate::error::CliError;
use serde::Serialize;

/// Serialises a report.
pub fn to_string<T: Serialize + ?Sized>(report: &T) -> Result<String, CliError> {
    let mut s =
        serde_json::to_string_pretty(report).map_err(|e| CliError::Output(e.to_string()))?;
    s.push('\n');
    Ok(s)
}

/// Serialises a report straight to stdout, pretty-printed, without building the whole text
/// in memory first (a comparison over a large grid is hundreds of megabytes of JSON).
pub fn to_stdout<T: Serialize + ?Sized>(report: &T) -> Result<(), CliError> {
    use std::io::Write;
    let out = std::io::stdout();
    let mut w = std::io::BufWriter::with_capacity(1 << 20, out.lock());
    serde_json::to_writer_pretty(&mut w, report).map_err(|e| CliError::Output(e.to_string()))?;
    w.write_all(b"\n")
        .and_then(|_| w.flush())
        .map_err(|e| CliError::Output(e.to_string()))
}
