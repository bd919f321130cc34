//! Newton's method for a trial phase of the stability test that substitution did not
//! settle: second order in Michelsen's variables alpha_i = 2 sqrt(W_i), with a halving line
//! search on tm (see the parent module).

use super::plane::{TangentPlane, TrialResult};
use super::TM_TOLERANCE;
use crate::equilibrium::dense;
use crate::equilibrium::phase_eval::{dlnphi_dn, MAX_COMPONENTS};

/// Newton iterations at most.
const MAX_NEWTON: usize = 30;

/// Newton's method on tm in alpha_i = 2 sqrt(W_i), with a halving line search; `NN` >= n^2
/// is the size of the matrix work arrays.
pub(super) fn newton<const NN: usize>(
    plane: &TangentPlane,
    w: &mut [f64],
    mut its: usize,
) -> TrialResult {
    let (model, t, p, z, d) = (plane.model, plane.t, plane.p, plane.z, plane.d);
    let n = plane.n();
    let mut idx = [0usize; MAX_COMPONENTS];
    let mut m = 0;
    for (i, &zi) in z.iter().enumerate() {
        if zi > 0.0 {
            idx[m] = i;
            m += 1;
        }
    }
    let mut lnphi = [0.0; MAX_COMPONENTS];
    let mut jac = [0.0; NN];
    let mut h = [0.0; NN];
    let mut g = [0.0; MAX_COMPONENTS];
    let mut gt = [0.0; MAX_COMPONENTS];
    let mut wt = [0.0; MAX_COMPONENTS];
    let mut lt = [0.0; MAX_COMPONENTS];
    let fail = |its| TrialResult::none(f64::NAN, its);
    let mut lnw = [0.0; MAX_COMPONENTS];
    let mut lwt = [0.0; MAX_COMPONENTS];
    for i in 0..n {
        lnw[i] = w[i].ln();
    }
    let Some((mut tm, mut rho)) = plane.tm_at(w, &lnw[..n], &mut lnphi[..n]) else {
        return fail(its);
    };
    for _ in 0..MAX_NEWTON {
        its += 1;
        if !dlnphi_dn(model, t, p, w, rho, &lnphi[..n], &mut jac[..n * n]) {
            return fail(its);
        }
        let mut gmax = 0.0_f64;
        for a in 0..m {
            let i = idx[a];
            let s = lnw[i] + lnphi[i] - d[i];
            let sq = w[i].sqrt();
            g[a] = -sq * s;
            gmax = gmax.max((sq * s).abs());
            for b in 0..m {
                let j = idx[b];
                h[a * m + b] = (w[i] * w[j]).sqrt() * jac[i * n + j];
            }
            h[a * m + a] += 1.0 + 0.5 * s;
        }
        if gmax < 1e-11 {
            return TrialResult {
                tm: (!plane.is_trivial(w, &lnw[..n], w.iter().sum::<f64>().ln())).then_some(tm),
                rho,
                iterations: its,
            };
        }
        gt[..m].copy_from_slice(&g[..m]);
        if !dense::solve(&mut h[..m * m], &mut g[..m], m) {
            return fail(its);
        }
        // Where the Hessian is not positive definite along the gradient the Newton step does
        // not point downhill, and small steps only raise tm: a few long ones are tried, not
        // twelve halvings.
        let slope: f64 = (0..m).map(|a| -gt[a] * g[a]).sum();
        let halvings = if slope < 0.0 { 12 } else { 3 };
        let mut step = 1.0;
        let mut accepted = false;
        for _ in 0..halvings {
            wt[..n].copy_from_slice(w);
            lwt[..n].copy_from_slice(&lnw[..n]);
            for a in 0..m {
                let i = idx[a];
                let alpha = 2.0 * w[i].sqrt() + step * g[a];
                wt[i] = (0.5 * alpha).powi(2).max(1e-300);
                lwt[i] = wt[i].ln();
            }
            if let Some((tn, rn)) = plane.tm_at(&wt[..n], &lwt[..n], &mut lt[..n]) {
                if tn <= tm + 1e-14 * tm.abs().max(1.0) {
                    w.copy_from_slice(&wt[..n]);
                    lnw[..n].copy_from_slice(&lwt[..n]);
                    lnphi[..n].copy_from_slice(&lt[..n]);
                    tm = tn;
                    rho = rn;
                    accepted = true;
                    break;
                }
            }
            step *= 0.5;
        }
        if tm < -TM_TOLERANCE {
            return TrialResult::at(tm, rho, its);
        }
        let trivial = plane.is_trivial(w, &lnw[..n], w.iter().sum::<f64>().ln());
        if !accepted || trivial {
            // No further decrease of tm: a stationary point to working precision (or the
            // trivial solution, which is dropped).
            return TrialResult {
                tm: (!trivial).then_some(tm),
                rho,
                iterations: its,
            };
        }
    }
    fail(its)
}
