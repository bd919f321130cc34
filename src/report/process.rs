//! The report of `zfactor process`.

use super::jobs_common::{Compared, FluidReport, StateReport};
use serde::Serialize;

/// One change of state per model.
#[derive(Debug, Clone, Serialize)]
pub struct ProcessReport {
    pub tool: String,
    pub fluid: FluidReport,
    pub input: ProcessInput,
    pub results: Vec<ProcessResult>,
    pub warnings: Vec<String>,
    pub caution: &'static str,
}

/// The process as given.
#[derive(Debug, Clone, Serialize)]
pub struct ProcessInput {
    pub path: &'static str,
    /// The start state and the end condition as typed.
    pub temperature: String,
    pub pressure: String,
    pub to_temperature: Option<String>,
    pub to_pressure: Option<String>,
    pub temperature_k: f64,
    pub pressure_pa: f64,
    pub end_temperature_k: Option<f64>,
    pub end_pressure_pa: Option<f64>,
    pub ambient_pressure_pa: f64,
    /// Sign convention of heat and work.
    pub convention: &'static str,
}

/// One model's process.
#[derive(Debug, Clone, Serialize)]
pub struct ProcessResult {
    pub model: String,
    pub model_name: String,
    pub start: StateReport,
    pub end: StateReport,
    pub end_temperature_k: Compared,
    pub end_pressure_pa: Compared,
    /// Heat into the fluid, J/kg.
    pub heat_j_kg: Compared,
    /// Work done by the fluid, closed system, J/kg.
    pub work_j_kg: Compared,
    /// Steady-flow work done by the fluid, q - dh, J/kg.
    pub flow_work_j_kg: Compared,
    pub delta_u_j_kg: Compared,
    pub delta_h_j_kg: Compared,
    pub delta_s_j_kg_k: Compared,
    pub delta_t_k: Compared,
    pub notes: Vec<String>,
}
