//! Flashes at specified pressure and enthalpy (P, h) or entropy (P, s).
//!
//! At fixed P and feed, h(T) and s(T) of the equilibrium state increase strictly with T
//! (cp > 0 in one phase, and latent heat across the two-phase region), also across phase
//! boundaries where they are continuous. The temperature is therefore found by bracketing
//! and Brent's method (see [`crate::equilibrium::brent`]), each evaluation being a (T, P)
//! flash ([`super::tp()`]). The molar properties of a two-phase state are the phase-fraction
//! averages, m = (1 - beta) m_L + beta m_V, each phase evaluated with the relations of
//! [`crate::properties`] (Span 2000, table 3.9): h = h0(T) + RT (a_d - a_t) and s = s0(T, P)
//! - R sum x ln x + R (-alpha - a_t + ln Z).

use super::result::FlashResult;
use super::tp::tp;
use crate::constants::{P_REF, R};
use crate::equilibrium::brent;
use crate::error::{positive, Error, Result};
use crate::model::Model;

/// The result of a (P, h) or (P, s) flash: the temperature and the (T, P) flash there.
#[derive(Debug, Clone, PartialEq)]
pub struct EnergyFlash {
    /// Temperature found, K.
    pub t: f64,
    /// The equilibrium state at (T, P).
    pub flash: FlashResult,
    /// (T, P) flashes evaluated.
    pub evaluations: usize,
}

#[derive(Clone, Copy)]
enum Spec {
    H,
    S,
}

fn phase_value(model: &dyn Model, t: f64, p: f64, rho: f64, x: &[f64], spec: Spec) -> f64 {
    let r = model.residual(t, rho, x);
    let ig = model.ideal_gas(t, x);
    match spec {
        Spec::H => R * ig.h_r + R * t * (r.a_d - r.a_t),
        Spec::S => {
            let z = p / (rho * R * t);
            let mixing: f64 = x
                .iter()
                .filter(|&&xi| xi > 0.0)
                .map(|&xi| xi * xi.ln())
                .sum();
            R * (ig.s_r - (p / P_REF).ln() - mixing) + R * (-r.a - r.a_t + z.ln())
        }
    }
}

/// Molar enthalpy (J/mol) or entropy (J/(mol K)) of a flash result for feed z.
fn value(model: &dyn Model, f: &FlashResult, z: &[f64], spec: Spec) -> f64 {
    match f {
        FlashResult::SinglePhase(s) => phase_value(model, s.t, s.p, s.rho, z, spec),
        FlashResult::TwoPhase(s) => {
            let l = phase_value(model, s.t, s.p, s.rho_l, &s.x, spec);
            let v = phase_value(model, s.t, s.p, s.rho_v, &s.y, spec);
            (1.0 - s.vapor_fraction) * l + s.vapor_fraction * v
        }
    }
}

/// Molar enthalpy of a flash result, J/mol.
pub fn enthalpy(model: &dyn Model, f: &FlashResult, z: &[f64]) -> f64 {
    value(model, f, z, Spec::H)
}

/// Molar entropy of a flash result, J/(mol K).
pub fn entropy(model: &dyn Model, f: &FlashResult, z: &[f64]) -> f64 {
    value(model, f, z, Spec::S)
}

fn solve(model: &dyn Model, p: f64, target: f64, z: &[f64], spec: Spec) -> Result<EnergyFlash> {
    positive("pressure (Pa)", p)?;
    if !target.is_finite() {
        return Err(Error::invalid(
            match spec {
                Spec::H => "enthalpy (J/mol)",
                Spec::S => "entropy (J/(mol K))",
            },
            target,
            "a finite number",
        ));
    }
    let mut evaluations = 0;
    let mut err: Option<Error> = None;
    let mut f = |t: f64| -> f64 {
        evaluations += 1;
        match tp(model, t, p, z) {
            Ok(fl) => value(model, &fl, z, spec) - target,
            Err(e) => {
                err.get_or_insert(e);
                f64::NAN
            }
        }
    };
    let (tc, _) = model.pseudo_critical(z);
    let t0 = if tc.is_finite() && tc > 0.0 {
        tc
    } else {
        300.0
    };
    let f0 = f(t0);
    if f0.is_nan() {
        return Err(err.unwrap_or(Error::NoSolution("flash failed".into())));
    }
    let fail = |side: &str, t: f64| {
        Error::NoSolution(format!(
            "no temperature {side} {t:.3} K reaches the specified value at P = {p} Pa"
        ))
    };
    // Walk away from t0 by factors of 1.25 until the sign changes.
    let (a, b) = if f0 > 0.0 {
        let (mut lo, mut hi) = (t0 / 1.25, t0);
        let mut k = 0;
        loop {
            let v = f(lo);
            if v.is_nan() || k > 40 || lo < 1.0 {
                return Err(err.unwrap_or_else(|| fail("above", lo)));
            }
            if v <= 0.0 {
                break (lo, hi);
            }
            hi = lo;
            lo /= 1.25;
            k += 1;
        }
    } else {
        let (mut lo, mut hi) = (t0, t0 * 1.25);
        let mut k = 0;
        loop {
            let v = f(hi);
            if v.is_nan() || k > 40 {
                return Err(err.unwrap_or_else(|| fail("below", hi)));
            }
            if v >= 0.0 {
                break (lo, hi);
            }
            lo = hi;
            hi *= 1.25;
            k += 1;
        }
    };
    let t = brent::solve(
        "temperature of a (P, h) or (P, s) flash",
        a,
        b,
        1e-13,
        0.0,
        &mut f,
    );
    if let Some(e) = err {
        return Err(e);
    }
    let t = t?;
    let flash = tp(model, t, p, z)?;
    Ok(EnergyFlash {
        t,
        flash,
        evaluations: evaluations + 1,
    })
}

/// Flash of feed `z` at pressure `p` (Pa) and molar enthalpy `h` (J/mol).
pub fn ph(model: &dyn Model, p: f64, h: f64, z: &[f64]) -> Result<EnergyFlash> {
    solve(model, p, h, z, Spec::H)
}

/// Flash of feed `z` at pressure `p` (Pa) and molar entropy `s` (J/(mol K)).
pub fn ps(model: &dyn Model, p: f64, s: f64, z: &[f64]) -> Result<EnergyFlash> {
    solve(model, p, s, z, Spec::S)
}
