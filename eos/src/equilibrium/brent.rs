//! Bracketed one-dimensional root finding (R. P. Brent, *Algorithms for Minimization without
//! Derivatives*, Prentice-Hall 1973, chapter 4), through the `roots` crate, with a relative
//! tolerance on the argument and an iteration cap.

use crate::error::{Error, Result};

struct Tol {
    rel: f64,
    abs_y: f64,
    max_iter: usize,
}

impl roots::Convergency<f64> for Tol {
    fn is_root_found(&mut self, y: f64) -> bool {
        y.abs() <= self.abs_y
    }
    fn is_converged(&mut self, x1: f64, x2: f64) -> bool {
        (x1 - x2).abs() <= self.rel * x1.abs().max(x2.abs()).max(1e-300)
    }
    fn is_iteration_limit_reached(&mut self, iter: usize) -> bool {
        iter >= self.max_iter
    }
}

/// A root of `f` in [lo, hi], where f(lo) and f(hi) differ in sign, to relative tolerance
/// `rel` in x (or |f| <= `abs_y`), in at most 200 iterations.
pub fn solve(
    solver: &'static str,
    lo: f64,
    hi: f64,
    rel: f64,
    abs_y: f64,
    f: impl FnMut(f64) -> f64,
) -> Result<f64> {
    let mut tol = Tol {
        rel,
        abs_y,
        max_iter: 200,
    };
    roots::find_root_brent(lo, hi, f, &mut tol).map_err(|e| match e {
        roots::SearchError::NoBracketing => Error::NoSolution(format!(
            "{solver}: the interval [{lo:.6e}, {hi:.6e}] does not bracket a root"
        )),
        _ => Error::NotConverged {
            solver,
            iterations: 200,
            residual: f64::NAN,
        },
    })
}
