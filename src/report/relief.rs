//! The report of `zfactor relief`.

use super::jobs_common::{Compared, FluidReport, StateReport};
use serde::Serialize;

/// Relief-sizing inputs per model.
#[derive(Debug, Clone, Serialize)]
pub struct ReliefReport {
    pub tool: String,
    pub fluid: FluidReport,
    pub input: ReliefInput,
    pub results: Vec<ReliefResult>,
    pub warnings: Vec<String>,
    pub caution: &'static str,
}

/// Relieving conditions as given.
#[derive(Debug, Clone, Serialize)]
pub struct ReliefInput {
    /// The relieving temperature and pressure as typed.
    pub temperature: String,
    pub pressure: String,
    pub temperature_k: f64,
    pub pressure_pa: f64,
    pub ambient_pressure_pa: f64,
    /// The Z range outside which a warning is given.
    pub z_range: (f64, f64),
}

/// One model's relief inputs.
#[derive(Debug, Clone, Serialize)]
pub struct ReliefResult {
    pub model: String,
    pub model_name: String,
    /// Compressibility factor (ideal gas: 1).
    pub z: Compared,
    /// Real-gas isentropic exponent -(v/P)(dP/dv)_s, beside the ideal-gas cp0/cv0.
    pub isentropic_exponent: Compared,
    /// Critical (choked-flow) pressure ratio (2/(k+1))^(k/(k-1)) from each k.
    pub critical_pressure_ratio: Compared,
    /// Gas coefficient C of the SI critical-flow sizing equation of API 520 Part I from
    /// each k (A in mm2, W in kg/h, P1 in kPa abs, T in K, M in kg/kmol).
    pub sizing_coefficient_c: Compared,
    pub molar_mass_kg_mol: f64,
    pub z_outside_range: bool,
    pub state: StateReport,
    pub notes: Vec<String>,
}
