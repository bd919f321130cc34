//! The critical point of a pure fluid as the model itself places it.
//!
//! At the critical temperature the van der Waals loop of the isotherm shrinks to an
//! inflection point: min over rho of dP/drho is zero (and d2P/drho2 = 0 there). Below Tc the
//! minimum is negative, above it positive. Tc is found by bisection on that sign, the
//! critical density is the location of the minimum and Pc = P(Tc, rho_c). For a cubic
//! equation of state whose constants come from the critical conditions this reproduces the
//! component's Tc and Pc; for any other model it gives the model's own critical point.

use super::spinodal::min_slope;
use crate::constants::R;
use crate::error::{Error, Result};
use crate::model::Model;

/// A critical point (T, P, rho).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CriticalPoint {
    /// Critical temperature, K.
    pub t: f64,
    /// Critical pressure, Pa.
    pub p: f64,
    /// Critical molar density, mol/m3.
    pub rho: f64,
}

/// The critical point of the pure fluid of a one-component model.
pub fn pure(model: &dyn Model) -> Result<CriticalPoint> {
    let comps = model.components();
    if comps.len() != 1 {
        return Err(Error::invalid(
            "number of components",
            comps.len() as f64,
            "1 (the critical point of a pure fluid)",
        ));
    }
    let x = [1.0];
    let guess = comps[0].tc;
    let has_loop = |t: f64| min_slope(model, t, &x).1 < 0.0;
    let (mut lo, mut hi) = (guess, guess);
    let mut k = 0;
    while !has_loop(lo) {
        lo *= 0.9;
        k += 1;
        if k > 40 {
            return Err(Error::NoSolution(format!(
                "{} shows no vapour-liquid loop at any temperature down to {lo:.4e} K",
                model.id()
            )));
        }
    }
    k = 0;
    while has_loop(hi) {
        hi *= 1.1;
        k += 1;
        if k > 40 {
            return Err(Error::NoSolution(format!(
                "{} shows a vapour-liquid loop at every temperature up to {hi:.4e} K",
                model.id()
            )));
        }
    }
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if has_loop(mid) {
            lo = mid;
        } else {
            hi = mid;
        }
        if hi - lo <= 1e-14 * hi {
            break;
        }
    }
    let t = 0.5 * (lo + hi);
    let (rho, _) = min_slope(model, t, &x);
    let p = rho * R * t * model.residual(t, rho, &x).z();
    Ok(CriticalPoint { t, p, rho })
}
