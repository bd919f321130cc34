//! Hall-Yarborough (1973) fit of the Standing-Katz Z chart (model id `hy`).
//!
//! K. R. Hall, L. Yarborough, *A new equation of state for Z-factor calculations*, Oil Gas J.
//! 71 (June 18, 1973) 82-92 (from memory of the paper). With t = 1/Tpr and y the reduced
//! density of the Carnahan-Starling hard-sphere term:
//!
//! -A Ppr + (y + y^2 + y^3 - y^4)/(1 - y)^3 - B y^2 + C y^D = 0, Z = A Ppr / y,
//! A = 0.06125 t exp(-1.2 (1 - t)^2), B = t (14.76 - 9.76 t + 4.58 t^2),
//! C = t (90.7 - 242.2 t + 42.4 t^2), D = 2.18 + 2.82 t.
//!
//! Range: from memory of secondary sources 1.2 <= Tpr <= 3.0 and 0.1 <= Ppr <= 24 (the
//! authors advise against Tpr < 1); outside, the value comes with a warning. Solved for y in
//! (0, 1) by Newton's method inside a sign-change bracket.

use super::warning::{check, RangeWarning};
use crate::error::{Error, Result};

/// Model id.
pub const ID: &str = "hy";
const NAME: &str = "Hall-Yarborough (1973)";
const MAX_ITER: usize = 100;

/// Z at (Tpr, Ppr), with warnings outside the published range.
pub fn z(tpr: f64, ppr: f64, warnings: &mut Vec<RangeWarning>) -> Result<f64> {
    for (what, v) in [("Tpr", tpr), ("Ppr", ppr)] {
        if !(v.is_finite() && v > 0.0) {
            return Err(Error::invalid(what, v, "a finite number above zero"));
        }
    }
    check(warnings, NAME, "Tpr", tpr, 1.2, 3.0);
    check(warnings, NAME, "Ppr", ppr, 0.1, 24.0);
    let t = 1.0 / tpr;
    let a = 0.06125 * t * (-1.2 * (1.0 - t).powi(2)).exp();
    let b = t * (14.76 - 9.76 * t + 4.58 * t * t);
    let c = t * (90.7 - 242.2 * t + 42.4 * t * t);
    let d = 2.18 + 2.82 * t;
    let ap = a * ppr;
    let f = |y: f64| {
        let om = 1.0 - y;
        let num = y + y * y + y.powi(3) - y.powi(4);
        let f = -ap + num / om.powi(3) - b * y * y + c * y.powf(d);
        let df = (1.0 + 4.0 * y + 4.0 * y * y - 4.0 * y.powi(3) + y.powi(4)) / om.powi(4)
            - 2.0 * b * y
            + c * d * y.powf(d - 1.0);
        (f, df)
    };
    let (mut lo, mut hi) = (0.0, 1.0);
    let mut y = (ap).min(0.5);
    let mut last = f64::INFINITY;
    for _ in 0..MAX_ITER {
        let (fy, dfy) = f(y);
        last = fy;
        if fy.abs() <= 1e-14 * ap.max(1e-300) || hi - lo <= 4.0 * f64::EPSILON {
            let z = ap / y;
            return if z.is_finite() && z > 0.0 {
                Ok(z)
            } else {
                Err(Error::NoSolution(format!(
                    "{NAME}: Z = {z} at Tpr = {tpr}, Ppr = {ppr}"
                )))
            };
        }
        if fy < 0.0 {
            lo = y;
        } else {
            hi = y;
        }
        let newton = y - fy / dfy;
        y = if newton > lo && newton < hi {
            newton
        } else {
            0.5 * (lo + hi)
        };
    }
    Err(Error::NotConverged {
        solver: "Hall-Yarborough reduced density",
        iterations: MAX_ITER,
        residual: last,
    })
}
