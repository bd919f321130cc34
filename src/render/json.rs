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
