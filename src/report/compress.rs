//! The report of `zfactor compress`.

use super::jobs_common::{BaseReport, Compared, FluidReport, StateReport};
use serde::Serialize;

/// One compression stage per model.
#[derive(Debug, Clone, Serialize)]
pub struct CompressReport {
    pub tool: String,
    pub fluid: FluidReport,
    pub input: CompressInput,
    pub results: Vec<CompressResult>,
    pub warnings: Vec<String>,
    pub caution: &'static str,
}

/// The stage as given, SI.
#[derive(Debug, Clone, Serialize)]
pub struct CompressInput {
    /// The suction and discharge states as typed.
    pub suction_pressure: String,
    pub suction_temperature: String,
    pub discharge_pressure: String,
    pub suction_pressure_pa: f64,
    pub suction_temperature_k: f64,
    pub discharge_pressure_pa: f64,
    pub pressure_ratio: f64,
    /// "isentropic" or "polytropic".
    pub efficiency_kind: &'static str,
    pub efficiency: f64,
    /// The flow as entered.
    pub flow: Option<String>,
    /// Base of a standard volume flow.
    pub flow_base: Option<BaseReport>,
    pub ambient_pressure_pa: f64,
}

/// Exponents at one state.
#[derive(Debug, Clone, Serialize)]
pub struct ExponentsReport {
    /// Ideal-gas cp0/cv0.
    pub ideal_cp_cv: f64,
    /// Real-gas isentropic volume exponent -(v/P)(dP/dv)_s.
    pub isentropic_volume_exponent: f64,
    /// Real-gas isentropic temperature exponent.
    pub isentropic_temperature_exponent: f64,
}

/// The shortcut T2 = T1 + T1 ((P2/P1)^((k-1)/k) - 1)/eta_s with a stated exponent.
#[derive(Debug, Clone, Serialize)]
pub struct Shortcut {
    /// Which exponent.
    pub exponent_used: &'static str,
    pub k: f64,
    pub discharge_temperature_k: f64,
}

/// One model's stage.
#[derive(Debug, Clone, Serialize)]
pub struct CompressResult {
    pub model: String,
    pub model_name: String,
    /// Discharge temperature (path-integrated for a polytropic efficiency), K.
    pub discharge_temperature_k: f64,
    pub discharge_temperature_ideal_k: f64,
    pub discharge_temperature_ideal_error_pct: Option<f64>,
    /// Specific work h2 - h1, J/kg.
    pub specific_work_j_kg: f64,
    pub specific_work_ideal_j_kg: f64,
    pub specific_work_ideal_error_pct: Option<f64>,
    /// How the discharge state was found.
    pub method: String,
    pub isentropic_head_j_kg: Compared,
    pub polytropic_head_path_j_kg: Compared,
    pub polytropic_head_schultz_j_kg: Compared,
    /// (Schultz - path) / path, percent.
    pub schultz_minus_path_pct: f64,
    pub schultz_f: f64,
    pub schultz_n: f64,
    pub schultz_discharge_temperature_k: f64,
    /// Integral of v dP over the path points (Simpson), J/kg: equals the path head.
    pub head_quadrature_j_kg: f64,
    pub isentropic_efficiency: f64,
    pub polytropic_efficiency: f64,
    pub isentropic_discharge_temperature_k: Compared,
    pub z_suction: f64,
    pub z_discharge: f64,
    pub exponents_suction: ExponentsReport,
    pub exponents_discharge: ExponentsReport,
    pub shortcuts: Vec<Shortcut>,
    pub mass_flow_kg_s: Option<Compared>,
    pub actual_inlet_flow_m3_s: Option<Compared>,
    pub power_w: Option<Compared>,
    pub suction: StateReport,
    pub discharge: StateReport,
    pub notes: Vec<String>,
}
