//! The summary of `zfactor audit`.

use serde::Serialize;
use std::collections::BTreeMap;

/// What an audit found.
#[derive(Debug, Clone, Serialize)]
pub struct AuditReport {
    pub tool: String,
    pub input: String,
    pub sheet: Option<String>,
    /// The annotated copy written.
    pub output: String,
    pub model: String,
    /// Relative tolerance (0.01 = 1 %).
    pub tolerance: f64,
    pub ambient_pressure_pa: f64,
    pub default_base: String,
    pub rows_read: usize,
    pub rows_audited: usize,
    pub rows_within_tolerance: usize,
    pub rows_flagged: usize,
    pub rows_bad: usize,
    pub largest_deviation_pct: Option<f64>,
    /// Flagged rows reconciled by each cause.
    pub causes: BTreeMap<String, usize>,
    /// Flagged rows no cause reconciles.
    pub flagged_unexplained: usize,
    /// The first flagged rows (at most 200).
    pub flagged: Vec<FlaggedRow>,
    /// The first bad rows (at most 200), with row and column.
    pub bad: Vec<BadRow>,
    pub elapsed_s: f64,
    pub warnings: Vec<String>,
    pub caution: &'static str,
}

/// A row over the tolerance.
#[derive(Debug, Clone, Serialize)]
pub struct FlaggedRow {
    pub row: usize,
    pub sheet_value: String,
    pub recomputed: f64,
    pub deviation_pct: f64,
    pub reconciling_causes: Vec<String>,
    /// The model that recomputed the row.
    pub model: String,
    /// Why no cause is named, where that is known (the deviation is within the model's own
    /// uncertainty).
    pub note: Option<String>,
}

/// A row that could not be audited.
#[derive(Debug, Clone, Serialize)]
pub struct BadRow {
    pub row: usize,
    pub column: String,
    pub message: String,
}
