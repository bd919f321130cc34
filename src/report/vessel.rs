//! The report of `zfactor vessel`.

use super::jobs_common::{BaseReport, Compared, FluidReport, StateReport};
use serde::Serialize;

/// A vessel or cylinder and the operations asked for, per model.
#[derive(Debug, Clone, Serialize)]
pub struct VesselReport {
    /// Tool name and version.
    pub tool: String,
    /// The fluid.
    pub fluid: FluidReport,
    /// The vessel and its state as given, SI.
    pub input: VesselInput,
    /// Base conditions of the standard volumes.
    pub base: BaseReport,
    /// One result per model.
    pub results: Vec<VesselResult>,
    /// Things to read.
    pub warnings: Vec<String>,
    /// The caution for pressure equipment.
    pub caution: &'static str,
}

/// The vessel as given.
#[derive(Debug, Clone, Serialize)]
pub struct VesselInput {
    /// The volume, temperature and pressure as typed.
    pub volume: String,
    pub temperature: String,
    pub pressure: String,
    pub volume_m3: f64,
    pub temperature_k: f64,
    pub pressure_pa: f64,
    pub ambient_pressure_pa: f64,
}

/// One model's answers.
#[derive(Debug, Clone, Serialize)]
pub struct VesselResult {
    pub model: String,
    pub model_name: String,
    /// The contents at the given state.
    pub state: StateReport,
    pub mass_kg: f64,
    pub mass_ideal_kg: f64,
    pub mass_ideal_error_pct: Option<f64>,
    pub moles_mol: f64,
    pub moles_ideal_mol: f64,
    /// Volume of the contents at the base conditions (with the model's Z there), m3.
    pub standard_volume_m3: f64,
    pub standard_volume_ideal_m3: f64,
    pub standard_volume_ideal_error_pct: Option<f64>,
    pub heating: Option<Heating>,
    pub usable: Option<UsableGas>,
    pub fill: Option<Fill>,
    pub target: Option<TargetReport>,
    pub venting: Option<VentingReport>,
    pub notes: Vec<String>,
}

/// Heating or cooling at fixed volume and mass.
#[derive(Debug, Clone, Serialize)]
pub struct Heating {
    pub temperature_k: f64,
    /// End pressure, Pa.
    pub pressure_pa: Compared,
    pub end_state: StateReport,
    /// (m_end - m_start)/m_start of the computed states.
    pub mass_balance: f64,
}

/// Gas drawn down to an end state.
#[derive(Debug, Clone, Serialize)]
pub struct UsableGas {
    pub end_temperature_k: f64,
    pub end_pressure_pa: f64,
    pub mass_kg: Compared,
    pub standard_volume_m3: Compared,
    pub end_state: StateReport,
}

/// Fill pressure for a rated settled pressure.
#[derive(Debug, Clone, Serialize)]
pub struct Fill {
    pub rated_pressure_pa: f64,
    pub reference_temperature_k: f64,
    pub fill_temperature_k: f64,
    pub fill_pressure_pa: Compared,
    pub fill_state: StateReport,
}

/// Mass to add or vent to a target.
#[derive(Debug, Clone, Serialize)]
pub struct TargetReport {
    /// "pressure" or "mass".
    pub target: &'static str,
    pub target_value: f64,
    /// "add" or "vent".
    pub action: &'static str,
    /// Mass to add (> 0) or vent (< 0), kg.
    pub delta_mass_kg: Compared,
    pub end_pressure_pa: Compared,
    pub end_state: StateReport,
}

/// Isentropic venting.
#[derive(Debug, Clone, Serialize)]
pub struct VentingReport {
    pub final_pressure_pa: f64,
    pub final_temperature_k: Compared,
    pub min_temperature_k: Compared,
    pub mass_left_kg: Compared,
    pub mass_vented_kg: Compared,
    /// Largest |s - s1| along the path, J/(mol K).
    pub entropy_drift_j_mol_k: f64,
    pub mdmt_k: Option<f64>,
    pub below_mdmt: Option<bool>,
    pub end_state: StateReport,
    pub path: Vec<VentPointReport>,
}

/// One point of the venting path.
#[derive(Debug, Clone, Serialize)]
pub struct VentPointReport {
    pub pressure_pa: f64,
    pub temperature_k: f64,
    pub mass_kg: f64,
    pub phase: String,
}
