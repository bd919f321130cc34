//! The report of `zfactor flash`: the equilibrium state of a mixture (one phase or a split),
//! or a bubble or dew point, for each requested model. SI units throughout.

use super::state::{ComponentFraction, CompositionRow};
use serde::Serialize;

/// A flash of one feed with one or several models.
#[derive(Debug, Clone, Serialize)]
pub struct FlashReport {
    /// Tool name and version.
    pub tool: String,
    /// The mixture.
    pub fluid: String,
    /// What was specified and what was asked.
    pub input: FlashInput,
    /// The feed composition as entered and on both bases.
    pub composition: Vec<CompositionRow>,
    /// One result per model.
    pub results: Vec<FlashResultReport>,
    /// Things the user must read.
    pub warnings: Vec<String>,
    /// The caution for pressure equipment.
    pub caution: &'static str,
}

/// The specification of the flash.
#[derive(Debug, Clone, Serialize)]
pub struct FlashInput {
    /// "T,P", "P,h", "P,s", "bubble-pressure", "dew-pressure", "bubble-temperature" or
    /// "dew-temperature".
    pub mode: &'static str,
    /// Temperature as entered.
    pub temperature: Option<String>,
    /// Pressure as entered.
    pub pressure: Option<String>,
    /// Enthalpy as entered.
    pub enthalpy: Option<String>,
    /// Entropy as entered.
    pub entropy: Option<String>,
    /// Temperature, K (when given).
    pub temperature_k: Option<f64>,
    /// Absolute pressure, Pa (when given).
    pub pressure_pa: Option<f64>,
    /// Molar enthalpy, J/mol (when given).
    pub enthalpy_j_mol: Option<f64>,
    /// Molar entropy, J/(mol K) (when given).
    pub entropy_j_mol_k: Option<f64>,
    /// Ambient pressure that gauge readings are referred to, Pa.
    pub ambient_pressure_pa: f64,
    /// Basis of the entered fractions ("mole" or "mass").
    pub basis: &'static str,
    /// Sum of the entered fractions when they were normalised.
    pub normalized_from: Option<f64>,
}

/// The answer of one model.
#[derive(Debug, Clone, Serialize)]
pub struct FlashResultReport {
    /// Model id.
    pub model: String,
    /// Model name.
    pub model_name: String,
    /// Where the model comes from.
    pub citation: String,
    /// "two-phase", a single-phase name ("gas", "liquid", "vapor", "supercritical"),
    /// "bubble-point" or "dew-point".
    pub phase: String,
    /// Of two bubble or dew points at the given T or P (both branches of a retrograde
    /// curve): "lower" or "upper" in the pressure (or temperature) found; null for one.
    pub branch: Option<String>,
    /// Temperature, K (found by the (P, h), (P, s) and bubble/dew-temperature modes).
    pub temperature_k: f64,
    /// Pressure, Pa (found by the bubble/dew-pressure modes).
    pub pressure_pa: f64,
    /// Molar vapour fraction: between 0 and 1 for a split, 0 at a bubble point, 1 at a dew
    /// point, null for one phase.
    pub vapor_fraction: Option<f64>,
    /// Mass vapour fraction, likewise.
    pub vapor_mass_fraction: Option<f64>,
    /// Compressibility factor of the feed as a whole, P v / (R T) with v the molar volume of
    /// all phases together.
    pub z: f64,
    /// Molar density of the feed as a whole, mol/m3.
    pub molar_density_mol_m3: f64,
    /// Mass density of the feed as a whole, kg/m3.
    pub mass_density_kg_m3: f64,
    /// Molar mass of the feed, kg/mol.
    pub molar_mass_kg_mol: f64,
    /// Molar enthalpy of the feed, J/mol.
    pub enthalpy_j_mol: f64,
    /// Molar entropy of the feed, J/(mol K).
    pub entropy_j_mol_k: f64,
    /// The phases: two for a split; one for a single phase; the feed phase and the incipient
    /// phase (amount 0) at a bubble or dew point.
    pub phases: Vec<FlashPhase>,
    /// Solver iterations (flash or saturation-point Newton).
    pub iterations: usize,
    /// Largest |ln f_i(vapour) - ln f_i(liquid)| at convergence (null for one phase).
    pub fugacity_residual: Option<f64>,
    /// Basis notes (k_ij used or missing).
    pub notes: Vec<String>,
}

/// One phase.
#[derive(Debug, Clone, Serialize)]
pub struct FlashPhase {
    /// "vapor" or "liquid" in a split or at a saturation point, else the single-phase name.
    pub phase: String,
    /// Moles of this phase per mole of feed.
    pub amount: f64,
    /// Mass of this phase per mass of feed.
    pub mass_amount: f64,
    pub z: f64,
    pub molar_density_mol_m3: f64,
    pub mass_density_kg_m3: f64,
    pub molar_mass_kg_mol: f64,
    /// Mole fractions of the phase.
    pub composition: Vec<ComponentFraction>,
}
