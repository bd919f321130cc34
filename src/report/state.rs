//! The report of `zfactor state`.

use serde::Serialize;

/// One state computed with one or several models.
#[derive(Debug, Clone, Serialize)]
pub struct StateReport {
    /// Tool name and version.
    pub tool: String,
    /// What was computed: the fluid and the given pair.
    pub fluid: String,
    /// The input as entered and in SI.
    pub input: StateInput,
    /// The composition as entered and on both bases.
    pub composition: Vec<CompositionRow>,
    /// One result per model.
    pub results: Vec<ModelResult>,
    /// The zero of enthalpy and entropy (the same for every model; entered values are read
    /// on it too).
    pub enthalpy_entropy_zero: String,
    /// Things the user must read (extrapolations, models dropped, weak models).
    pub warnings: Vec<String>,
    /// The caution for pressure equipment.
    pub caution: &'static str,
}

/// The state as asked.
#[derive(Debug, Clone, Serialize)]
pub struct StateInput {
    /// Which pair fixed the state: "T,P", "T,density" or "P,density".
    pub given: &'static str,
    /// Temperature as entered.
    pub temperature: Option<String>,
    /// Pressure as entered.
    pub pressure: Option<String>,
    /// Density as entered.
    pub density: Option<String>,
    /// Enthalpy as entered (pure fluids; on the fluid's zero, as printed).
    pub enthalpy: Option<String>,
    /// Entropy as entered (pure fluids; on the fluid's zero, as printed).
    pub entropy: Option<String>,
    /// Vapour quality as entered (pure fluids).
    pub quality: Option<String>,
    /// Temperature, K (when given).
    pub temperature_k: Option<f64>,
    /// Absolute pressure, Pa (when given).
    pub pressure_pa: Option<f64>,
    /// True when the pressure was entered as gauge.
    pub pressure_is_gauge: bool,
    /// Ambient pressure that gauge readings are referred to, Pa.
    pub ambient_pressure_pa: f64,
    /// Basis of the entered fractions ("mole" or "mass").
    pub basis: &'static str,
    /// Sum of the entered fractions when they were normalised.
    pub normalized_from: Option<f64>,
    /// Root choice ("stable", "liquid" or "vapor").
    pub root: &'static str,
}

/// One component of the fluid.
#[derive(Debug, Clone, Serialize)]
pub struct CompositionRow {
    pub id: String,
    pub name: String,
    /// The value as entered (fraction or percent on the entered basis).
    pub as_entered: f64,
    pub mole_fraction: f64,
    pub mass_fraction: f64,
}

/// The answer of one model.
#[derive(Debug, Clone, Serialize)]
pub struct ModelResult {
    /// Model id.
    pub model: String,
    /// Model name.
    pub model_name: String,
    /// Where the model comes from.
    pub citation: String,
    /// Phase name.
    pub phase: String,
    /// Number of density roots the model has at this (T, P).
    pub roots: usize,
    pub temperature_k: f64,
    pub pressure_pa: f64,
    pub z: f64,
    pub molar_density_mol_m3: f64,
    pub mass_density_kg_m3: f64,
    pub molar_volume_m3_mol: f64,
    pub specific_volume_m3_kg: f64,
    /// Error of the ideal-gas answer for the dependent variable, percent (see
    /// `ideal_gas_deviation_of`): positive when the ideal gas law gives too much.
    pub ideal_gas_deviation_pct: f64,
    /// Which variable the ideal-gas deviation is for: "density", "pressure" or "temperature".
    /// For a two-phase state the bulk density (both phases together) is used.
    pub ideal_gas_deviation_of: &'static str,
    /// Enthalpy, entropy and internal energy; null for a gas known by its gravity only (it
    /// has no ideal-gas heat capacity), as are the heat capacities, speed of sound and
    /// departures below.
    pub enthalpy_j_mol: Option<f64>,
    pub entropy_j_mol_k: Option<f64>,
    pub internal_energy_j_mol: Option<f64>,
    pub enthalpy_j_kg: Option<f64>,
    pub entropy_j_kg_k: Option<f64>,
    /// Isochoric heat capacity; null for a two-phase state.
    pub cv_j_mol_k: Option<f64>,
    /// Isobaric heat capacity; null where the state is mechanically unstable.
    pub cp_j_mol_k: Option<f64>,
    /// Speed of sound; null where the state is mechanically unstable.
    pub speed_of_sound_m_s: Option<f64>,
    /// Joule-Thomson coefficient; null where the state is mechanically unstable.
    pub joule_thomson_k_pa: Option<f64>,
    /// Real-gas isentropic exponent -(v/P)(dP/dv)_s; null where mechanically unstable.
    pub isentropic_exponent: Option<f64>,
    /// Departure functions at the same T and P; null for a two-phase state.
    pub residual_enthalpy_j_mol: Option<f64>,
    pub residual_entropy_j_mol_k: Option<f64>,
    pub residual_gibbs_j_mol: Option<f64>,
    /// Molar vapour fraction of a two-phase state; null for one phase.
    pub vapor_fraction: Option<f64>,
    /// The phases of a two-phase state (empty for one phase).
    pub phases: Vec<PhaseResult>,
    /// Fugacity coefficient and fugacity of each component (one row per component, always).
    pub fugacity: Vec<FugacityRow>,
    /// Basis notes (k_ij used or missing).
    pub notes: Vec<String>,
    /// What the user must know about this model's values: outside its range, in the solid
    /// region, thermodynamically impossible (each also in the report's warnings).
    pub warnings: Vec<String>,
}

/// One phase of a split state.
#[derive(Debug, Clone, Serialize)]
pub struct PhaseResult {
    /// "vapor" or "liquid".
    pub phase: &'static str,
    /// Moles of this phase per mole of feed.
    pub amount: f64,
    pub z: f64,
    pub molar_density_mol_m3: f64,
    pub mass_density_kg_m3: f64,
    /// Mole fractions of the phase.
    pub composition: Vec<ComponentFraction>,
}

/// A component's mole fraction in a phase.
#[derive(Debug, Clone, Serialize)]
pub struct ComponentFraction {
    pub component: String,
    pub mole_fraction: f64,
}

/// Fugacity of one component in one result; null for a model that gives no component
/// fugacities in a mixture (the gas-gravity correlations answer for the gas as a whole).
#[derive(Debug, Clone, Serialize)]
pub struct FugacityRow {
    pub component: String,
    pub phi: Option<f64>,
    pub fugacity_pa: Option<f64>,
}
