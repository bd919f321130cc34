//! Z of a natural gas from its gravity, temperature and pressure, in one call.

use super::inerts::{pseudo_critical_with_inerts, InertFractions};
use super::pseudo_critical::{GravityCorrelation, PseudoCriticalPoint};
use super::warning::RangeWarning;
use super::{dak, hall_yarborough, wichert_aziz};
use crate::error::{positive, Result};

/// Which Z correlation.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum ZCorrelation {
    /// Dranchuk-Abou-Kassem (1975), id `dak`.
    #[default]
    Dak,
    /// Hall-Yarborough (1973), id `hy`.
    HallYarborough,
}

impl ZCorrelation {
    /// Model id.
    pub fn id(self) -> &'static str {
        match self {
            ZCorrelation::Dak => dak::ID,
            ZCorrelation::HallYarborough => hall_yarborough::ID,
        }
    }
}

/// A gas described by its gravity and acid-gas content.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct GasSpec {
    /// Gas gravity M / M_air.
    pub gravity: f64,
    /// CO2 mole fraction (Wichert-Aziz correction applied when either fraction is non-zero).
    pub y_co2: f64,
    /// H2S mole fraction.
    pub y_h2s: f64,
    /// N2 mole fraction (with CO2 and H2S, taken out of the gravity before the correlation:
    /// see [`super::inerts`]).
    pub y_n2: f64,
    /// Pseudo-critical correlation.
    pub pseudo_critical: GravityCorrelation,
    /// Z correlation.
    pub z: ZCorrelation,
}

/// The result with every warning raised on the way.
#[derive(Debug, Clone, PartialEq)]
pub struct GasZ {
    /// Compressibility factor.
    pub z: f64,
    /// Pseudo-critical point used (after any acid-gas correction).
    pub pseudo_critical: PseudoCriticalPoint,
    /// Pseudo-reduced temperature and pressure.
    pub tpr: f64,
    pub ppr: f64,
    /// Inputs outside the correlations' published ranges (empty when all are inside).
    pub warnings: Vec<RangeWarning>,
}

/// Z of the gas at `t` (K) and `p` (Pa).
pub fn z_tp(gas: &GasSpec, t: f64, p: f64) -> Result<GasZ> {
    positive("temperature (K)", t)?;
    positive("pressure (Pa)", p)?;
    let mut warnings = Vec::new();
    let inerts = InertFractions {
        n2: gas.y_n2,
        co2: gas.y_co2,
        h2s: gas.y_h2s,
    };
    let mut pc =
        pseudo_critical_with_inerts(gas.gravity, &inerts, gas.pseudo_critical, &mut warnings)?;
    if gas.y_co2 != 0.0 || gas.y_h2s != 0.0 {
        pc = wichert_aziz::correct(pc, gas.y_co2, gas.y_h2s, &mut warnings)?;
    }
    let (tpr, ppr) = (t / pc.tpc, p / pc.ppc);
    let z = match gas.z {
        ZCorrelation::Dak => dak::z(tpr, ppr, &mut warnings)?,
        ZCorrelation::HallYarborough => hall_yarborough::z(tpr, ppr, &mut warnings)?,
    };
    Ok(GasZ {
        z,
        pseudo_critical: pc,
        tpr,
        ppr,
        warnings,
    })
}
