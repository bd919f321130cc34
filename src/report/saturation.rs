//! The report of `zfactor saturation`.

use serde::Serialize;

/// Saturation of one pure fluid, for one model or several side by side.
#[derive(Debug, Clone, Serialize)]
pub struct SaturationReport {
    /// Tool name and version.
    pub tool: String,
    /// The fluid's name.
    pub fluid: String,
    /// The request as entered and in SI.
    pub input: SaturationInput,
    /// One result per model.
    pub results: Vec<SaturationResult>,
    /// Things the user must read.
    pub warnings: Vec<String>,
    /// The caution for pressure equipment.
    pub caution: &'static str,
}

/// The request.
#[derive(Debug, Clone, Serialize)]
pub struct SaturationInput {
    /// "T" (saturation pressure at T) or "P" (saturation temperature at P).
    pub given: &'static str,
    /// Temperature as entered.
    pub temperature: Option<String>,
    /// Pressure as entered.
    pub pressure: Option<String>,
    /// Temperature, K (when given).
    pub temperature_k: Option<f64>,
    /// Absolute pressure, Pa (when given).
    pub pressure_pa: Option<f64>,
    /// True when the pressure was entered as gauge.
    pub pressure_is_gauge: bool,
    /// Ambient pressure that gauge readings are referred to, Pa.
    pub ambient_pressure_pa: f64,
}

/// One saturated phase.
#[derive(Debug, Clone, Serialize)]
pub struct SaturatedPhase {
    pub molar_density_mol_m3: f64,
    pub mass_density_kg_m3: f64,
    pub specific_volume_m3_kg: f64,
    pub z: f64,
    pub enthalpy_j_mol: f64,
    pub enthalpy_j_kg: f64,
    pub entropy_j_mol_k: f64,
    pub entropy_j_kg_k: f64,
}

/// One model's saturation state.
#[derive(Debug, Clone, Serialize)]
pub struct SaturationResult {
    /// Model id.
    pub model: String,
    /// Model name.
    pub model_name: String,
    /// Where the model comes from.
    pub citation: String,
    /// Saturation temperature, K.
    pub temperature_k: f64,
    /// Saturation pressure, Pa.
    pub pressure_pa: f64,
    /// Saturated liquid.
    pub liquid: SaturatedPhase,
    /// Saturated vapour.
    pub vapor: SaturatedPhase,
    /// Enthalpy of vaporisation h'' - h', J/mol.
    pub latent_heat_j_mol: f64,
    /// Enthalpy of vaporisation, J/kg.
    pub latent_heat_j_kg: f64,
    /// Zero of enthalpy and entropy used by this model.
    pub reference_state: String,
}
