//! Report parts shared by the engineering-job commands (vessel, compress, flow, process,
//! relief): a model's value beside the ideal-gas answer, base conditions, states.

use serde::Serialize;

/// A value from a model beside the ideal-gas answer to the same question.
#[derive(Debug, Clone, Copy, Serialize)]
pub struct Compared {
    /// The model's value.
    pub value: f64,
    /// The ideal-gas value.
    pub ideal: f64,
    /// (ideal - value) / value, percent; null where the model's value is within 1e-6 (SI
    /// units) of zero, where a relative error means nothing; exactly 0 where the two agree
    /// to round-off.
    pub ideal_error_pct: Option<f64>,
}

/// Relative differences below this are round-off of the arithmetic that led to the two
/// values (about 1e4 machine epsilons), not a difference between models: shown as 0.
pub const ROUND_OFF: f64 = 1e-12;

impl Compared {
    /// Pairs a model value with the ideal-gas value.
    pub fn new(value: f64, ideal: f64) -> Self {
        let rel = (ideal - value) / value;
        let pct = if rel.abs() < ROUND_OFF {
            0.0
        } else {
            100.0 * rel
        };
        let ideal_error_pct = (value.abs() > 1e-6 && pct.is_finite()).then_some(pct);
        Compared {
            value,
            ideal,
            ideal_error_pct,
        }
    }
}

/// Base (reference) conditions of standard volumes.
#[derive(Debug, Clone, Serialize)]
pub struct BaseReport {
    /// Identifier (`15degC`, ...) or "custom".
    pub id: String,
    /// Temperature, K.
    pub temperature_k: f64,
    /// Pressure, Pa.
    pub pressure_pa: f64,
}

impl From<eos::jobs::BaseConditions> for BaseReport {
    fn from(b: eos::jobs::BaseConditions) -> Self {
        BaseReport {
            id: b.id.to_string(),
            temperature_k: b.t,
            pressure_pa: b.p,
        }
    }
}

/// A state in a job report.
#[derive(Debug, Clone, Serialize)]
pub struct StateReport {
    /// Temperature, K.
    pub temperature_k: f64,
    /// Pressure, Pa.
    pub pressure_pa: f64,
    /// Phase.
    pub phase: String,
    /// Overall compressibility factor P/(rho R T).
    pub z: f64,
    /// Overall mass density, kg/m3.
    pub mass_density_kg_m3: f64,
    /// Specific enthalpy, J/kg (null with the energies below for a gas known by its gravity
    /// only, which has no ideal-gas heat capacity).
    pub enthalpy_j_kg: Option<f64>,
    /// Specific entropy, J/(kg K).
    pub entropy_j_kg_k: Option<f64>,
    /// Specific internal energy, J/kg.
    pub internal_energy_j_kg: Option<f64>,
    /// Vapour mass fraction of a two-phase state.
    pub vapor_mass_fraction: Option<f64>,
    /// Vapour mole fraction of a two-phase state.
    pub vapor_mole_fraction: Option<f64>,
    /// Liquid mole fractions of a two-phase state.
    pub liquid_composition: Option<Vec<f64>>,
    /// Vapour mole fractions of a two-phase state.
    pub vapor_composition: Option<Vec<f64>>,
}

impl From<&eos::jobs::EqState> for StateReport {
    fn from(s: &eos::jobs::EqState) -> Self {
        let m = s.molar_mass;
        StateReport {
            temperature_k: s.t,
            pressure_pa: s.p,
            phase: s.phase.to_string(),
            z: s.z,
            mass_density_kg_m3: s.mass_density(),
            enthalpy_j_kg: Some(s.h / m),
            entropy_j_kg_k: Some(s.s / m),
            internal_energy_j_kg: Some(s.u / m),
            vapor_mass_fraction: s.split.as_ref().map(|p| p.vapor_mass_fraction),
            vapor_mole_fraction: s.split.as_ref().map(|p| p.vapor_fraction),
            liquid_composition: s.split.as_ref().map(|p| p.x.clone()),
            vapor_composition: s.split.as_ref().map(|p| p.y.clone()),
        }
    }
}

/// The fluid of a job: label and composition.
#[derive(Debug, Clone, Serialize)]
pub struct FluidReport {
    /// The component name, or the mixture.
    pub label: String,
    /// Components with mole and mass fractions.
    pub composition: Vec<crate::report::state::CompositionRow>,
}
