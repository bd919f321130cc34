//! Two-phase states of a pure fluid by quality (vapour mass fraction; for a pure fluid also
//! the vapour mole fraction).
//!
//! In the two-phase region at saturation (T, Psat) every molar volume-based or energy
//! property is the lever-rule average of the saturated phases, m = (1 - q) m_L + q m_V, for
//! m in {v, u, h, s} (an identity of the additive extensive properties of two coexisting
//! phases).

use super::saturation::Saturation;
use crate::error::{Error, Result};

/// A two-phase state of a pure fluid.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TwoPhaseState {
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
    /// Quality (vapour fraction), 0 to 1.
    pub quality: f64,
    /// Molar volume, m3/mol.
    pub v: f64,
    /// Internal energy, J/mol.
    pub u: f64,
    /// Enthalpy, J/mol.
    pub h: f64,
    /// Entropy, J/(mol K).
    pub s: f64,
}

impl TwoPhaseState {
    /// Overall molar density, mol/m3.
    pub fn rho(&self) -> f64 {
        1.0 / self.v
    }
}

/// The two-phase state of quality `q` (0 saturated liquid, 1 saturated vapour) at a
/// saturation state.
pub fn at_quality(sat: &Saturation, q: f64) -> Result<TwoPhaseState> {
    if !(0.0..=1.0).contains(&q) {
        return Err(Error::invalid("quality", q, "a number from 0 to 1"));
    }
    let (l, v) = (&sat.liquid, &sat.vapor);
    let lever = |a: f64, b: f64| (1.0 - q) * a + q * b;
    Ok(TwoPhaseState {
        t: sat.t,
        p: sat.p,
        quality: q,
        v: lever(1.0 / l.rho, 1.0 / v.rho),
        u: lever(l.u, v.u),
        h: lever(l.h, v.h),
        s: lever(l.s, v.s),
    })
}

/// The quality at which the two-phase state at `sat` has molar enthalpy `h` (J/mol);
/// `None` when h is outside [h_L, h_V].
pub fn quality_from_enthalpy(sat: &Saturation, h: f64) -> Option<f64> {
    let q = (h - sat.liquid.h) / sat.h_vap;
    (q.is_finite() && (0.0..=1.0).contains(&q)).then_some(q)
}
