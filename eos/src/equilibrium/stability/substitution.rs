//! Successive substitution for one trial phase of the stability test, with the helps
//! described in the parent module: dominant-eigenvalue extrapolation, long steps along a
//! slide, the extrapolated limit tested for the trivial solution, and the memory of earlier
//! trials' paths. A trial that does not settle in [`MAX_SS`] substitutions goes on by
//! Newton's method ([`super::newton`]).

use super::newton::newton;
use super::paths::TrialPaths;
use super::plane::{TangentPlane, TrialResult};
use super::TM_TOLERANCE;
use crate::equilibrium::gdem;
use crate::equilibrium::phase_eval::{MAX_COMPONENTS, SMALL_COMPONENTS};

/// Substitutions before Newton's method takes over.
const MAX_SS: usize = 20;

/// Every this many substitutions, the last three increments of ln W are extrapolated
/// ([`gdem`]) and the extrapolated point is kept where it lowers tm.
const ACCELERATE_EVERY: usize = 5;

/// A substitution step at least this fraction of the one before, and in the same direction
/// ([`aligned`]), marks a slide along a valley of tm, where longer steps are tried.
const SLIDE_RATIO: f64 = 0.8;

/// Substitution steps shrinking faster than this ratio, one way, are taken as converging
/// linearly, and their limit is extrapolated to test for the trivial solution.
const CONVERGING_RATIO: f64 = 0.5;

/// True when the increments `a` and `b` point the same way (cosine above 0.95).
fn aligned(a: &[f64], b: &[f64]) -> bool {
    let (mut ab, mut aa, mut bb) = (0.0, 0.0, 0.0);
    for (x, y) in a.iter().zip(b) {
        if x.is_finite() && y.is_finite() {
            ab += x * y;
            aa += x * x;
            bb += y * y;
        }
    }
    ab > 0.95 * (aa * bb).sqrt()
}

/// Runs one trial from the mole numbers in `w` (left at its last iterate).
pub(super) fn run_trial(
    plane: &TangentPlane,
    w: &mut [f64],
    paths: &mut TrialPaths,
) -> TrialResult {
    let (z, d) = (plane.z, plane.d);
    let n = plane.n();
    let mut lnw = [0.0; MAX_COMPONENTS];
    for i in 0..n {
        lnw[i] = if z[i] > 0.0 {
            w[i].ln()
        } else {
            f64::NEG_INFINITY
        };
    }
    let mut lnphi = [0.0; MAX_COMPONENTS];
    // The last three increments of ln W, in a ring.
    let mut g = [[0.0; MAX_COMPONENTS]; 3];
    let mut since_extrapolation = 0;
    let mut dmax_prev = f64::INFINITY;
    // An accelerated point (ln W, W, ln phi) that replaces the substitution's where it lowers
    // tm.
    let (mut lx, mut wx, mut lp) = (
        [0.0; MAX_COMPONENTS],
        [0.0; MAX_COMPONENTS],
        [0.0; MAX_COMPONENTS],
    );
    let mut its = 0;
    let Some(mut at) = plane.tm_at(w, &lnw[..n], &mut lnphi[..n]) else {
        return TrialResult::none(f64::NAN, 1);
    };
    while its < MAX_SS {
        its += 1;
        let (tm, rho) = at;
        if tm < -TM_TOLERANCE {
            return TrialResult::at(tm, rho, its);
        }
        // Successive substitution ln W <- d - ln phi(W); its increment goes into the ring
        // `g` (slot its % 3).
        let gk = &mut g[its % 3];
        let mut dmax = 0.0_f64;
        for i in 0..n {
            if z[i] > 0.0 {
                let lw = d[i] - lnphi[i];
                gk[i] = lw - lnw[i];
                dmax = dmax.max(gk[i].abs());
                lnw[i] = lw;
            }
        }
        plane.set_w(&lnw[..n], w);
        if plane.ends_here(w, &lnw[..n], paths) {
            // The trivial solution, or the path of an earlier trial (whose outcome stands).
            return TrialResult::none(rho, its);
        }
        // Where the steps shrink steadily one way, their sum to the limit is the last one
        // times lambda / (1 - lambda); a limit at the trivial solution ends the trial.
        let lambda = dmax / dmax_prev;
        if its >= 2
            && lambda < CONVERGING_RATIO
            && aligned(&g[its % 3][..n], &g[(its + 2) % 3][..n])
        {
            let c = lambda / (1.0 - lambda);
            for i in 0..n {
                lx[i] = lnw[i] + c * g[its % 3][i];
            }
            plane.set_w(&lx[..n], &mut wx[..n]);
            let ln_s = wx[..n].iter().sum::<f64>().ln();
            if plane.is_trivial(&wx[..n], &lx[..n], ln_s) {
                return TrialResult::none(rho, its);
            }
        }
        let Some(next) = plane.tm_at(w, &lnw[..n], &mut lnphi[..n]) else {
            return TrialResult::none(f64::NAN, its);
        };
        if dmax < 1e-10 {
            return TrialResult::at(next.0, next.1, its);
        }
        at = next;
        let gk = &g[its % 3];
        let gp = &g[(its + 2) % 3];
        since_extrapolation += 1;
        let mut moved = false;
        if since_extrapolation >= ACCELERATE_EVERY {
            since_extrapolation = 0;
            lx[..n].copy_from_slice(&lnw[..n]);
            let [g0, g1, g2] = [(its + 1) % 3, (its + 2) % 3, its % 3].map(|k| &g[k][..n]);
            if gdem::extrapolate(&mut lx[..n], g0, g1, g2) {
                its += 1;
                if let Some(ax) = plane.try_point(&lx[..n], &mut wx[..n], &mut lp[..n]) {
                    if ax.0 < at.0 {
                        at = ax;
                        moved = true;
                    }
                }
            }
        } else if its >= 3 && dmax >= SLIDE_RATIO * dmax_prev && aligned(&gk[..n], &gp[..n]) {
            // A slide: steps that do not shrink, all one way. Longer steps along the last one
            // (to 2, 6, 22 and 86 times its length) while tm keeps falling.
            let (mut tx, mut tw, mut tp) = (
                [0.0; MAX_COMPONENTS],
                [0.0; MAX_COMPONENTS],
                [0.0; MAX_COMPONENTS],
            );
            for mult in [1.0, 5.0, 21.0, 85.0] {
                for i in 0..n {
                    tx[i] = lnw[i] + mult * gk[i];
                }
                its += 1;
                match plane.try_point(&tx[..n], &mut tw[..n], &mut tp[..n]) {
                    Some(ax) if ax.0 < at.0 => {
                        at = ax;
                        moved = true;
                        lx[..n].copy_from_slice(&tx[..n]);
                        wx[..n].copy_from_slice(&tw[..n]);
                        lp[..n].copy_from_slice(&tp[..n]);
                    }
                    _ => break,
                }
            }
        }
        if moved {
            lnw[..n].copy_from_slice(&lx[..n]);
            w.copy_from_slice(&wx[..n]);
            lnphi[..n].copy_from_slice(&lp[..n]);
            if plane.ends_here(w, &lnw[..n], paths) {
                return TrialResult::none(at.1, its);
            }
        }
        dmax_prev = dmax;
    }
    if n <= SMALL_COMPONENTS {
        newton::<{ SMALL_COMPONENTS * SMALL_COMPONENTS }>(plane, w, its)
    } else {
        newton::<{ MAX_COMPONENTS * MAX_COMPONENTS }>(plane, w, its)
    }
}
