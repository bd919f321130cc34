//! Gas properties at relieving conditions for relief-device sizing: Z, the real-gas
//! isentropic exponent k = -(v/P)(dP/dv)_s (see [`crate::properties`]), the ideal-gas
//! cp0/cv0 and the molar mass.
//!
//! Ideal-gas sizing formulas for gas and vapour relief take Z as a correction factor and k
//! from cp/cv; common practice holds them reliable for 0.8 <= Z <= 1.1 and advises a
//! real-gas (e.g. isentropic nozzle-flow) method outside that range, which
//! [`Relief::z_outside_range`] flags.

use crate::constants::R;
use crate::error::{Error, Result};
use crate::jobs::equilibrium_state::{at_tp, EqState};
use crate::model::Model;
use crate::phase::Phase;

/// The range of Z in which ideal-gas sizing formulas are commonly accepted.
pub const Z_RANGE: (f64, f64) = (0.8, 1.1);

/// Relief inputs at one state.
#[derive(Debug, Clone, PartialEq)]
pub struct Relief {
    /// The state at relieving conditions.
    pub state: EqState,
    /// Compressibility factor.
    pub z: f64,
    /// Real-gas isentropic exponent.
    pub k_real: f64,
    /// Ideal-gas cp0/cv0 at the relieving temperature.
    pub k_ideal: f64,
    /// Molar mass, kg/mol.
    pub molar_mass: f64,
    /// True when Z lies outside [`Z_RANGE`].
    pub z_outside_range: bool,
}

/// Relief inputs at (t, p); two-phase or liquid relieving conditions are refused (the gas
/// formulas do not apply).
pub fn at(model: &dyn Model, t: f64, p: f64, x: &[f64]) -> Result<Relief> {
    let s = at_tp(model, t, p, x)?;
    let refuse = |what: String| Error::OutOfRange {
        model: model.id().to_string(),
        what: "relieving conditions",
        detail: what,
    };
    if matches!(s.phase, Phase::TwoPhase | Phase::Liquid) {
        return Err(refuse(format!(
            "the fluid is {} at {t} K, {p} Pa: gas relief inputs do not apply",
            s.phase
        )));
    }
    let props = s
        .props
        .as_ref()
        .ok_or_else(|| refuse("no single-phase properties".to_string()))?;
    let k_real = props
        .isentropic_exponent
        .ok_or_else(|| refuse("the state is mechanically unstable".to_string()))?;
    let cp0 = model.ideal_gas(t, x).cp_r * R;
    Ok(Relief {
        z: s.z,
        k_real,
        k_ideal: cp0 / (cp0 - R),
        molar_mass: s.molar_mass,
        z_outside_range: s.z < Z_RANGE.0 || s.z > Z_RANGE.1,
        state: s,
    })
}
