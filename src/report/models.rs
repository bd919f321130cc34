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
    /// Typical uncertainty of its gas densities inside its range, percent (what the audit
    /// allows for before naming a cause).
    pub density_uncertainty_pct: f64,
    /// The published range of each fluid's formulation (reference, sw12).
    pub fluid_ranges: Vec<FluidRangeEntry>,
    pub good_at: Vec<&'static str>,
    pub poor_at: Vec<&'static str>,
}

/// The published range of one fluid's formulation.
#[derive(Debug, Clone, Serialize)]
pub struct FluidRangeEntry {
    pub fluid: &'static str,
    pub formulation: &'static str,
    pub t_min_k: f64,
    pub t_max_k: f64,
    pub p_max_pa: f64,
}
