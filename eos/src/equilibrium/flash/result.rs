//! What a flash returns: one phase, or two phases in equilibrium.

use crate::phase::Phase;

/// A feed that is one stable phase at the flash conditions.
#[derive(Debug, Clone, PartialEq)]
pub struct SinglePhase {
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
    /// Molar density (the root of lowest Gibbs energy), mol/m3.
    pub rho: f64,
    /// Phase name, as for single-phase states.
    pub phase: Phase,
    /// Number of density roots the model has for the feed at (T, P).
    pub roots: usize,
    /// Lowest tangent-plane distance of the non-trivial stationary points found by the
    /// stability test (`f64::INFINITY` when every trial went to the trivial solution).
    pub tm_min: f64,
}

/// Vapour and liquid in equilibrium.
#[derive(Debug, Clone, PartialEq)]
pub struct TwoPhase {
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
    /// Molar vapour fraction, 0 < beta < 1.
    pub vapor_fraction: f64,
    /// Liquid mole fractions.
    pub x: Vec<f64>,
    /// Vapour mole fractions.
    pub y: Vec<f64>,
    /// Liquid molar density, mol/m3.
    pub rho_l: f64,
    /// Vapour molar density, mol/m3.
    pub rho_v: f64,
    /// Phase-split iterations (substitution plus Newton).
    pub iterations: usize,
    /// Largest |ln f_i(vapour) - ln f_i(liquid)| at convergence.
    pub fugacity_residual: f64,
}

/// The outcome of a flash.
#[derive(Debug, Clone, PartialEq)]
pub enum FlashResult {
    /// The feed is one stable phase.
    SinglePhase(SinglePhase),
    /// The feed splits into vapour and liquid.
    TwoPhase(TwoPhase),
}

impl FlashResult {
    /// Temperature, K.
    pub fn t(&self) -> f64 {
        match self {
            FlashResult::SinglePhase(s) => s.t,
            FlashResult::TwoPhase(s) => s.t,
        }
    }
    /// Pressure, Pa.
    pub fn p(&self) -> f64 {
        match self {
            FlashResult::SinglePhase(s) => s.p,
            FlashResult::TwoPhase(s) => s.p,
        }
    }
    /// True for a two-phase result.
    pub fn is_two_phase(&self) -> bool {
        matches!(self, FlashResult::TwoPhase(_))
    }
}
