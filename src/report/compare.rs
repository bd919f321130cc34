//! The report of `zfactor compare`. Field names of the JSON are fixed (see README): a
//! `models` array with `model`, `mean_abs_dev_pct`, `max_abs_dev_pct`, `bias_pct`, and a
//! `points` array with each point's `temperature_k`, `pressure_pa`, `phase` and `values`.

use crate::compare::advice::{Advice, Weakness};
use crate::compare::ideal_map::ToleranceMap;
use crate::report::compare_points::PointStore;
use crate::report::state::CompositionRow;
use serde::Serialize;

/// A comparison of models over a set of states.
#[derive(Debug, Serialize)]
pub struct CompareReport {
    /// Tool name and version.
    pub tool: String,
    /// The fluid.
    pub fluid: String,
    /// The composition as entered and on both bases.
    pub composition: Vec<CompositionRow>,
    /// What the models are compared against.
    pub reference: ReferenceInfo,
    /// Where the states come from: "grid", "states file" or "reference data".
    pub states_from: String,
    /// How mixture states were phase-checked (every state flashed, or the envelope screen).
    pub phase_check: &'static str,
    /// The grid axes, when the states are a grid (K and Pa).
    pub grid: Option<GridAxes>,
    /// Statistics per model (density deviation from the reference, percent).
    pub models: Vec<ModelStats>,
    /// Points left out of the statistics as two-phase.
    pub excluded_two_phase: usize,
    /// Every point (held in memory, or spilled to a temporary file in the output's format:
    /// see [`PointStore`]).
    pub points: PointStore,
    /// The spread between the models where there is no reference.
    pub band: Option<Band>,
    /// The ideal-gas map (grids only).
    pub ideal_gas_map: Option<IdealGasMap>,
    /// The simplest model within each tolerance (when there is a reference).
    pub advice: Vec<Advice>,
    /// Known weaknesses of the compared models for this fluid and these states.
    pub weaknesses: Vec<Weakness>,
    /// Rows of a states or reference file skipped with --skip-bad-rows.
    pub skipped_rows: usize,
    /// Why each was skipped.
    pub skipped: Vec<String>,
    /// Charts written.
    pub charts: Vec<String>,
    /// Things the user must read.
    pub warnings: Vec<String>,
    /// The caution for pressure equipment.
    pub caution: &'static str,
}

/// The reference.
#[derive(Debug, Clone, Serialize)]
pub struct ReferenceInfo {
    /// "model", "data" or "none".
    pub kind: &'static str,
    /// Model id, data set id or file path.
    pub id: Option<String>,
    /// Where its values come from.
    pub citation: Option<String>,
    /// A reference model's name, short enough for a chart legend.
    pub name: Option<String>,
}

/// The axes of a grid.
#[derive(Debug, Clone, Serialize)]
pub struct GridAxes {
    pub temperatures_k: Vec<f64>,
    pub pressures_pa: Vec<f64>,
}

/// Where a maximum occurs.
#[derive(Debug, Clone, Copy, Serialize)]
pub struct StateAt {
    pub temperature_k: f64,
    pub pressure_pa: f64,
}

/// Statistics of one region.
#[derive(Debug, Clone, Serialize)]
pub struct RegionStats {
    pub region: &'static str,
    pub points: usize,
    pub mean_abs_dev_pct: f64,
    pub max_abs_dev_pct: f64,
    pub bias_pct: f64,
    pub max_at: StateAt,
}

/// Statistics of one model.
#[derive(Debug, Clone, Serialize)]
pub struct ModelStats {
    /// Model id.
    pub model: String,
    /// Model name.
    pub model_name: String,
    /// Where the model comes from.
    pub citation: String,
    /// Mean absolute density deviation from the reference, percent (null without one).
    pub mean_abs_dev_pct: Option<f64>,
    /// Maximum absolute density deviation, percent.
    pub max_abs_dev_pct: Option<f64>,
    /// Mean signed density deviation, percent.
    pub bias_pct: Option<f64>,
    /// Where the maximum occurs.
    pub max_at: Option<StateAt>,
    /// Points in the statistics.
    pub points_used: usize,
    /// Points the model could not compute.
    pub points_failed: usize,
    /// The same statistics per region.
    pub regions: Vec<RegionStats>,
    /// Basis notes (k_ij).
    pub notes: Vec<String>,
}

/// The spread between models.
#[derive(Debug, Clone, Serialize)]
pub struct Band {
    /// The models in the band (the ideal gas is left out).
    pub models: Vec<String>,
    pub mean_spread_pct: f64,
    pub max_spread_pct: f64,
    pub max_at: StateAt,
}

/// The ideal-gas map.
#[derive(Debug, Clone, Serialize)]
pub struct IdealGasMap {
    /// The model whose Z the map uses.
    pub basis_model: String,
    /// |Z - 1| in percent, [temperature][pressure] (null where no value).
    pub error_pct: Vec<Vec<Option<f64>>>,
    /// One map per tolerance.
    pub tolerances: Vec<ToleranceMap>,
}
