//! The report of `zfactor flow`.

use super::jobs_common::{BaseReport, Compared, FluidReport};
use serde::Serialize;

/// One flow stated in every base, per model.
#[derive(Debug, Clone, Serialize)]
pub struct FlowReport {
    pub tool: String,
    pub fluid: FluidReport,
    pub input: FlowInput,
    pub results: Vec<FlowResult>,
    /// Z at the ISO 6976 reference conditions by its summation method, beside the models'.
    pub iso6976_summation: Summation,
    pub warnings: Vec<String>,
    pub caution: &'static str,
}

/// The ISO 6976 summation values of the fluid, or why there are none.
#[derive(Debug, Clone, Serialize)]
pub struct Summation {
    /// The method and its data.
    pub method: &'static str,
    /// Z at 101.325 kPa and 0, 15 and 20 degC (empty when not available).
    pub values: Vec<SummationZ>,
    /// Why there are no values (a component without a summation factor).
    pub unavailable: Option<String>,
}

/// One summation value.
#[derive(Debug, Clone, Serialize)]
pub struct SummationZ {
    pub temperature_k: f64,
    pub pressure_pa: f64,
    pub z: f64,
    /// The lowest confidence mark among the factors used.
    pub confidence: String,
}

/// The flow as given.
#[derive(Debug, Clone, Serialize)]
pub struct FlowInput {
    pub flow: String,
    /// The flowing temperature and pressure as typed.
    pub temperature: Option<String>,
    pub pressure: Option<String>,
    /// "mass", "molar", "standard volume" or "actual volume".
    pub kind: &'static str,
    /// The flow in SI per second (kg/s, mol/s or m3/s).
    pub value_si: f64,
    /// The base of a standard volume flow.
    pub base: Option<BaseReport>,
    /// Flowing conditions, when given.
    pub actual_temperature_k: Option<f64>,
    pub actual_pressure_pa: Option<f64>,
    pub ambient_pressure_pa: f64,
}

/// The volume flow at one condition.
#[derive(Debug, Clone, Serialize)]
pub struct VolumeAt {
    /// Base id, or "actual".
    pub base: String,
    pub temperature_k: f64,
    pub pressure_pa: f64,
    /// The model's Z there (bulk, for a split state).
    pub z: f64,
    /// The model's phase there ("two-phase" for a feed that splits: the flow is then not
    /// a gas flow, and the run warns).
    pub phase: String,
    pub volume_flow_m3_s: Compared,
}

/// One model's equivalents.
#[derive(Debug, Clone, Serialize)]
pub struct FlowResult {
    pub model: String,
    pub model_name: String,
    pub mass_flow_kg_s: f64,
    pub mass_flow: Compared,
    pub molar_flow_mol_s: Compared,
    pub volumes: Vec<VolumeAt>,
    pub notes: Vec<String>,
}
