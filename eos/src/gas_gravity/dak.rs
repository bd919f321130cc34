//! Dranchuk-Abou-Kassem (1975) fit of the Standing-Katz Z chart (model id `dak`).
//!
//! P. M. Dranchuk, J. H. Abou-Kassem, *Calculation of Z factors for natural gases using
//! equations of state*, J. Can. Pet. Technol. 14 (1975) 34-36 (constants from memory of the
//! paper). With rho_r = 0.27 Ppr / (Z Tpr):
//!
//! Z = 1 + (A1 + A2/Tpr + A3/Tpr^3 + A4/Tpr^4 + A5/Tpr^5) rho_r + (A6 + A7/Tpr + A8/Tpr^2) rho_r^2
//!     - A9 (A7/Tpr + A8/Tpr^2) rho_r^5 + A10 (1 + A11 rho_r^2)(rho_r^2/Tpr^3) exp(-A11 rho_r^2)
//!
//! A1..A11 = 0.3265, -1.0700, -0.5339, 0.01569, -0.05165, 0.5475, -0.7361, 0.1844, 0.1056,
//! 0.6134, 0.7210. Published range: 1.0 <= Tpr <= 3.0 with 0.2 <= Ppr <= 30 (and
//! 0.7 <= Tpr < 1.0 for Ppr < 1.0); outside, the value comes with a warning.
//! Solved for rho_r by a Newton iteration safeguarded by a sign-change bracket.

use super::warning::{check, RangeWarning};
use crate::error::{Error, Result};

/// Model id.
pub const ID: &str = "dak";
const NAME: &str = "Dranchuk-Abou-Kassem (1975)";
const A: [f64; 11] = [
    0.3265, -1.0700, -0.5339, 0.01569, -0.05165, 0.5475, -0.7361, 0.1844, 0.1056, 0.6134, 0.7210,
];
const MAX_ITER: usize = 100;

/// Z as a function of reduced density at Tpr, with dZ/d(rho_r).
fn z_of_rho(tpr: f64, r: f64) -> (f64, f64) {
    let t = tpr;
    let c1 = A[0] + A[1] / t + A[2] / t.powi(3) + A[3] / t.powi(4) + A[4] / t.powi(5);
    let c2 = A[5] + A[6] / t + A[7] / (t * t);
    let c3 = A[8] * (A[6] / t + A[7] / (t * t));
    let c4 = A[9] / t.powi(3);
    let r2 = r * r;
    let e = (-A[10] * r2).exp();
    let z = 1.0 + c1 * r + c2 * r2 - c3 * r2 * r2 * r + c4 * (1.0 + A[10] * r2) * r2 * e;
    let dz = c1 + 2.0 * c2 * r - 5.0 * c3 * r2 * r2
        + c4 * e * (2.0 * r + 4.0 * A[10] * r2 * r - 2.0 * A[10] * r * (1.0 + A[10] * r2) * r2);
    (z, dz)
}

/// Z at (Tpr, Ppr), with warnings outside the published range.
pub fn z(tpr: f64, ppr: f64, warnings: &mut Vec<RangeWarning>) -> Result<f64> {
    for (what, v) in [("Tpr", tpr), ("Ppr", ppr)] {
        if !(v.is_finite() && v > 0.0) {
            return Err(Error::invalid(what, v, "a finite number above zero"));
        }
    }
    if tpr < 1.0 && ppr < 1.0 {
        check(warnings, NAME, "Tpr", tpr, 0.7, 3.0);
    } else {
        check(warnings, NAME, "Tpr", tpr, 1.0, 3.0);
        check(warnings, NAME, "Ppr", ppr, 0.2, 30.0);
    }
    // g(r) = r Z(r) - 0.27 Ppr/Tpr = 0
    let target = 0.27 * ppr / tpr;
    let g = |r: f64| {
        let (z, dz) = z_of_rho(tpr, r);
        (r * z - target, z + r * dz)
    };
    let (mut lo, mut hi) = (0.0, target.max(1e-3));
    let mut k = 0;
    while g(hi).0 <= 0.0 {
        hi *= 2.0;
        k += 1;
        if k > 60 {
            return Err(Error::NoSolution(format!(
                "{NAME}: no reduced density for Tpr = {tpr}, Ppr = {ppr}"
            )));
        }
    }
    let mut r = target.min(0.5 * (lo + hi));
    let mut last = f64::INFINITY;
    for _ in 0..MAX_ITER {
        let (f, df) = g(r);
        last = f;
        if f.abs() <= 1e-14 * target.max(1e-300) {
            return finish(tpr, r, ppr);
        }
        if f < 0.0 {
            lo = r;
        } else {
            hi = r;
        }
        let newton = r - f / df;
        r = if df > 0.0 && newton > lo && newton < hi {
            newton
        } else {
            0.5 * (lo + hi)
        };
        if hi - lo <= 4.0 * f64::EPSILON * hi {
            return finish(tpr, r, ppr);
        }
    }
    Err(Error::NotConverged {
        solver: "Dranchuk-Abou-Kassem reduced density",
        iterations: MAX_ITER,
        residual: last,
    })
}

fn finish(tpr: f64, r: f64, ppr: f64) -> Result<f64> {
    let z = z_of_rho(tpr, r).0;
    if z.is_finite() && z > 0.0 {
        Ok(z)
    } else {
        Err(Error::NoSolution(format!(
            "{NAME}: Z = {z} at Tpr = {tpr}, Ppr = {ppr}"
        )))
    }
}
