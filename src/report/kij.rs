//! The report of `zfactor kij`: rows of the built-in k_ij table with their sources.

use serde::Serialize;

/// The built-in k_ij asked for.
#[derive(Debug, Clone, Serialize)]
pub struct KijReport {
    /// The components asked for (ids), empty for every pair.
    pub components: Vec<String>,
    /// The family asked for, when one was.
    pub family: Option<&'static str>,
    /// The rows, in the table's order.
    pub rows: Vec<KijRow>,
    /// How to set one's own values.
    pub note: &'static str,
}

/// One built-in k_ij.
#[derive(Debug, Clone, Serialize)]
pub struct KijRow {
    pub a: String,
    pub b: String,
    /// The model family the value was fitted for: "pr" or "srk".
    pub family: &'static str,
    pub value: f64,
    /// Confidence in the value: high, medium or low.
    pub confidence: String,
    /// The range of published values, as the table states it.
    pub plausible_range: String,
    /// Source key and full reference.
    pub source_key: String,
    pub source: String,
    pub notes: String,
}
