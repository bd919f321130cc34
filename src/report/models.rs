//! The report of `zfactor models`: the model catalogue as data.

use serde::Serialize;

/// Catalogue entries.
#[derive(Debug, Clone, Serialize)]
pub struct ModelsReport {
    pub models: Vec<ModelEntry>,
}

/// One model.
#[derive(Debug, Clone, Serialize)]
pub struct ModelEntry {
    pub id: &'static str,
    pub name: &'static str,
    pub citation: &'static str,
    pub validity: &'static str,
    /// Lowest temperature, K (or reduced when `range_reduced`).
    pub t_min: Option<f64>,
    /// Highest temperature, K (or reduced).
    pub t_max: Option<f64>,
    /// Highest pressure, Pa (or reduced).
    pub p_max: Option<f64>,
    /// True when the range is in reduced units (T/Tc, P/Pc).
    pub range_reduced: bool,
    pub good_at: Vec<&'static str>,
    pub poor_at: Vec<&'static str>,
}
