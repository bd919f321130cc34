//! The isothermal (T, P) flash.
//!
//! 1. Stability test of the feed ([`crate::equilibrium::stability`]). A stable feed is one
//!    phase (its root of lowest Gibbs energy).
//! 2. Otherwise K-values from the unstable trial phase W (K_i = W_i / z_i for a trial lighter
//!    than the feed, z_i / W_i for a heavier one) start successive substitution (M. L.
//!    Michelsen, *The isothermal flash problem. Part II. Phase-split calculation*, Fluid Phase
//!    Equilib. 9 (1982) 21-40):
//!    beta from Rachford-Rice ([`crate::equilibrium::rachford_rice`]), x_i = z_i / (1 + beta
//!    (K_i - 1)), y_i = K_i x_i, then ln K_i <- ln phi_i(L, x) - ln phi_i(V, y); every fifth
//!    substitution is accelerated ([`crate::equilibrium::gdem`]) when that lowers the
//!    fugacity residual.
//! 3. Newton's method on the vapour mole numbers v_i (l_i = z_i - v_i; for each component
//!    the smaller of v_i and l_i is updated and the other follows, so that small amounts
//!    carry no cancellation) solves
//!    g_i = ln f_i(V) - ln f_i(L) = 0, with the symmetric Jacobian (the Hessian of the Gibbs
//!    energy of the split)
//!    dg_i/dv_j = delta_ij / v_i - 1/V + d ln phi_i^V / d n_j + delta_ij / l_i - 1/L +
//!    d ln phi_i^L / d n_j,
//!    a step kept inside 0 < v_i < z_i and a halving line search on
//!    G/RT = sum v_i ln f_i^V + l_i ln f_i^L. The K-values are ln K_i = ln(y_i / x_i).
//! 4. Converged when max |g_i| <= 1e-12 (or <= 1e-10 once rounding stops progress); the
//!    material balance z_i = (1 - beta) x_i + beta y_i holds to rounding because l_i = z_i -
//!    v_i. A split that collapses to the trivial solution (x = y) is retried from Wilson's
//!    K-values and otherwise reported as [`Error::NotConverged`]; it is never reported as
//!    one phase, since the stability test showed the feed unstable.

use super::result::{FlashResult, SinglePhase, TwoPhase};
use crate::equilibrium::phase_eval::{
    dlnphi_dn, ln_phi_tp, RootSel, MAX_COMPONENTS, SMALL_COMPONENTS,
};
use crate::equilibrium::rachford_rice::{self, RrOutcome};
use crate::equilibrium::{dense, gdem, stability, wilson};
use crate::error::{Error, Result};
use crate::model::Model;
use crate::state::phase_of;

const MAX_SS: usize = 60;
const MAX_NEWTON: usize = 40;
/// Fugacity residual at which substitution hands over to Newton's method.
const SWITCH: f64 = 1e-6;

/// Flash of feed `z` at temperature `t` (K) and pressure `p` (Pa).
pub fn tp(model: &dyn Model, t: f64, p: f64, z: &[f64]) -> Result<FlashResult> {
    let n = stability::check(model, t, p, z)?;
    let mut zz = [0.0; MAX_COMPONENTS];
    let s: f64 = z.iter().sum();
    for i in 0..n {
        zz[i] = z[i] / s;
    }
    let z = &zz[..n];
    let mut w = [0.0; MAX_COMPONENTS];
    let st = stability::analyse(model, t, p, z, &mut w[..n])?;
    if st.stable {
        let (phase, roots) = phase_of(model, t, p, st.feed_rho, z);
        return Ok(FlashResult::SinglePhase(SinglePhase {
            t,
            p,
            rho: st.feed_rho,
            phase,
            roots,
            tm_min: st.tm,
        }));
    }
    let comps = model.components();
    let mut lnk = [0.0; MAX_COMPONENTS];
    let ws: f64 = w[..n].iter().sum();
    let vapor_like = st.trial_rho < st.feed_rho;
    for i in 0..n {
        lnk[i] = if z[i] > 0.0 && w[i] > 0.0 {
            let r = (w[i] / ws / z[i]).ln();
            if vapor_like {
                r
            } else {
                -r
            }
        } else {
            wilson::ln_k(&comps[i], t, p)
        };
    }
    match split(model, t, p, z, &mut lnk[..n]) {
        Ok(r) => Ok(FlashResult::TwoPhase(r)),
        Err(first) => {
            for i in 0..n {
                lnk[i] = wilson::ln_k(&comps[i], t, p);
            }
            match split(model, t, p, z, &mut lnk[..n]) {
                Ok(r) => Ok(FlashResult::TwoPhase(r)),
                // On the edge of the two-phase region (near the critical point, or on a
                // bubble or dew line) the stability test can find the feed unstable by a
                // margin below anything a model resolves, and no split converges: the
                // substitution and Newton's method drive the amount of one phase to zero.
                // The feed is then one phase on the phase boundary.
                Err(_) if st.tm > -TM_EDGE => {
                    let (phase, roots) = phase_of(model, t, p, st.feed_rho, z);
                    Ok(FlashResult::SinglePhase(SinglePhase {
                        t,
                        p,
                        rho: st.feed_rho,
                        phase,
                        roots,
                        tm_min: st.tm,
                    }))
                }
                Err(_) => Err(first),
            }
        }
    }
}

/// The smallest tangent-plane distance (a reduced Gibbs energy, per mole of the trial phase)
/// taken as a real instability when no split converges: a split that would lower G by less
/// than 1e-6 RT per mole lies far below the accuracy of any model here (a cubic's ln phi
/// errors are of order 1e-2 against measured data, common practice), and is the rounding of
/// a state on the phase boundary. Found on a natural gas 0.1 K from its critical point, where
/// tm = -5.8e-8 and the split's vapour fraction went to zero.
pub const TM_EDGE: f64 = 1e-6;

/// Work state of the split at one set of K-values.
struct Eval {
    beta: f64,
    x: [f64; MAX_COMPONENTS],
    y: [f64; MAX_COMPONENTS],
    lpl: [f64; MAX_COMPONENTS],
    lpv: [f64; MAX_COMPONENTS],
    rho_l: f64,
    rho_v: f64,
    residual: f64,
}

impl Eval {
    fn new() -> Self {
        Eval {
            beta: 0.5,
            x: [0.0; MAX_COMPONENTS],
            y: [0.0; MAX_COMPONENTS],
            lpl: [0.0; MAX_COMPONENTS],
            lpv: [0.0; MAX_COMPONENTS],
            rho_l: f64::NAN,
            rho_v: f64::NAN,
            residual: f64::INFINITY,
        }
    }

    /// Rachford-Rice and both phases at ln K; None when no split exists for these K.
    fn at(&mut self, model: &dyn Model, t: f64, p: f64, z: &[f64], lnk: &[f64]) -> Option<()> {
        let n = z.len();
        let mut k = [0.0; MAX_COMPONENTS];
        for i in 0..n {
            k[i] = lnk[i].exp();
        }
        let RrOutcome::Root { beta, .. } = rachford_rice::solve(z, &k[..n]) else {
            return None;
        };
        self.beta = beta;
        rachford_rice::compositions(z, &k[..n], beta, &mut self.x[..n], &mut self.y[..n]);
        let l = ln_phi_tp(
            model,
            t,
            p,
            &self.x[..n],
            RootSel::LowestGibbs,
            &mut self.lpl[..n],
        )?;
        let v = ln_phi_tp(
            model,
            t,
            p,
            &self.y[..n],
            RootSel::LowestGibbs,
            &mut self.lpv[..n],
        )?;
        self.rho_l = l.rho;
        self.rho_v = v.rho;
        let mut r = 0.0_f64;
        for i in 0..n {
            if z[i] > 0.0 {
                r = r.max((lnk[i] + self.lpv[i] - self.lpl[i]).abs());
            }
        }
        self.residual = r;
        Some(())
    }
}

fn not_converged(iterations: usize, residual: f64) -> Error {
    Error::NotConverged {
        solver: "two-phase (T, P) flash",
        iterations,
        residual,
    }
}

fn trivial(z: &[f64], lnk: &[f64]) -> bool {
    z.iter()
        .zip(lnk)
        .filter(|(z, _)| **z > 0.0)
        .all(|(_, k)| k.abs() < 1e-5)
}

/// Successive substitution with acceleration, then Newton.
fn split(model: &dyn Model, t: f64, p: f64, z: &[f64], lnk: &mut [f64]) -> Result<TwoPhase> {
    let n = z.len();
    let mut e = Eval::new();
    let mut g = [[0.0; MAX_COMPONENTS]; 3];
    let mut prev = [0.0; MAX_COMPONENTS];
    let mut its = 0;
    let mut since_accel = 0;
    let mut fresh = false;
    loop {
        if !fresh {
            its += 1;
            if e.at(model, t, p, z, lnk).is_none() {
                return Err(not_converged(its, e.residual));
            }
        }
        fresh = false;
        if e.residual <= 1e-12 && e.beta > 0.0 && e.beta < 1.0 {
            break;
        }
        if trivial(z, lnk) {
            return Err(not_converged(its, e.residual));
        }
        if (e.residual < SWITCH && e.beta > 0.0 && e.beta < 1.0) || its >= MAX_SS {
            break;
        }
        // Substitution.
        prev[..n].copy_from_slice(lnk);
        g.rotate_left(1);
        for i in 0..n {
            lnk[i] = e.lpl[i] - e.lpv[i];
            g[2][i] = lnk[i] - prev[i];
        }
        since_accel += 1;
        if since_accel >= 5 {
            since_accel = 0;
            let mut trial = [0.0; MAX_COMPONENTS];
            trial[..n].copy_from_slice(lnk);
            if gdem::extrapolate(&mut trial[..n], &g[0][..n], &g[1][..n], &g[2][..n]) {
                // Keep the accelerated point only if it lowers the residual of the plain one.
                let mut ea = Eval::new();
                its += 2;
                if e.at(model, t, p, z, lnk).is_some() {
                    fresh = true;
                    if ea.at(model, t, p, z, &trial[..n]).is_some() && ea.residual < e.residual {
                        lnk.copy_from_slice(&trial[..n]);
                        e = ea;
                    }
                }
            }
        }
    }
    if !(e.beta > 0.0 && e.beta < 1.0) {
        return Err(not_converged(its, e.residual));
    }
    if n <= SMALL_COMPONENTS {
        newton::<{ SMALL_COMPONENTS * SMALL_COMPONENTS }>(model, t, p, z, &e, its)
    } else {
        newton::<{ MAX_COMPONENTS * MAX_COMPONENTS }>(model, t, p, z, &e, its)
    }
}

/// G/RT of the split and the fugacity residual, from mole numbers v (vapour) and l (liquid).
struct Point {
    gibbs: f64,
    resid: f64,
    rho_l: f64,
    rho_v: f64,
}

#[allow(clippy::too_many_arguments)]
fn point(
    model: &dyn Model,
    t: f64,
    p: f64,
    z: &[f64],
    v: &[f64],
    l: &[f64],
    lpv: &mut [f64],
    lpl: &mut [f64],
    gvec: &mut [f64],
) -> Option<Point> {
    let n = z.len();
    let pv = ln_phi_tp(model, t, p, v, RootSel::LowestGibbs, lpv)?;
    let pl = ln_phi_tp(model, t, p, l, RootSel::LowestGibbs, lpl)?;
    let (vt, lt): (f64, f64) = (v.iter().sum(), l.iter().sum());
    let (mut gibbs, mut resid) = (0.0, 0.0_f64);
    for i in 0..n {
        if z[i] > 0.0 {
            let fv = (v[i] / vt).ln() + lpv[i];
            let fl = (l[i] / lt).ln() + lpl[i];
            gibbs += v[i] * fv + l[i] * fl;
            gvec[i] = fv - fl;
            resid = resid.max(gvec[i].abs());
        } else {
            gvec[i] = 0.0;
        }
    }
    Some(Point {
        gibbs,
        resid,
        rho_l: pl.rho,
        rho_v: pv.rho,
    })
}

/// Newton's method on the vapour mole numbers; `NN` >= n^2 is the size of the matrix work
/// arrays.
fn newton<const NN: usize>(
    model: &dyn Model,
    t: f64,
    p: f64,
    z: &[f64],
    e: &Eval,
    mut its: usize,
) -> Result<TwoPhase> {
    let n = z.len();
    let mut idx = [0usize; MAX_COMPONENTS];
    let mut m = 0;
    // For each component the smaller of v_i and l_i is updated and the larger follows by
    // difference, so that small amounts carry no cancellation error.
    let mut v = [0.0; MAX_COMPONENTS];
    let mut l = [0.0; MAX_COMPONENTS];
    for i in 0..n {
        if z[i] > 0.0 {
            idx[m] = i;
            m += 1;
            if e.beta * e.y[i] <= (1.0 - e.beta) * e.x[i] {
                v[i] = (e.beta * e.y[i]).clamp(1e-300 * z[i], z[i] * (1.0 - 1e-15));
                l[i] = z[i] - v[i];
            } else {
                l[i] = ((1.0 - e.beta) * e.x[i]).clamp(1e-300 * z[i], z[i] * (1.0 - 1e-15));
                v[i] = z[i] - l[i];
            }
        }
    }
    let mut lpv = [0.0; MAX_COMPONENTS];
    let mut lpl = [0.0; MAX_COMPONENTS];
    let mut gv = [0.0; MAX_COMPONENTS];
    let mut jv = [0.0; NN];
    let mut jl = [0.0; NN];
    let mut a = [0.0; NN];
    let mut b = [0.0; MAX_COMPONENTS];
    let mut vt = [0.0; MAX_COMPONENTS];
    let mut lt = [0.0; MAX_COMPONENTS];
    let mut tpv = [0.0; MAX_COMPONENTS];
    let mut tpl = [0.0; MAX_COMPONENTS];
    let mut tg = [0.0; MAX_COMPONENTS];
    let Some(mut pt) = point(
        model,
        t,
        p,
        z,
        &v[..n],
        &l[..n],
        &mut lpv[..n],
        &mut lpl[..n],
        &mut gv[..n],
    ) else {
        return Err(not_converged(its, e.residual));
    };
    for _ in 0..MAX_NEWTON {
        if pt.resid <= 1e-12 {
            break;
        }
        its += 1;
        if !dlnphi_dn(model, t, p, &v[..n], pt.rho_v, &lpv[..n], &mut jv[..n * n])
            || !dlnphi_dn(model, t, p, &l[..n], pt.rho_l, &lpl[..n], &mut jl[..n * n])
        {
            return Err(not_converged(its, pt.resid));
        }
        let (vs, ls): (f64, f64) = (v[..n].iter().sum(), l[..n].iter().sum());
        for ra in 0..m {
            let i = idx[ra];
            b[ra] = -gv[i];
            for rb in 0..m {
                let j = idx[rb];
                a[ra * m + rb] = jv[i * n + j] + jl[i * n + j] - 1.0 / vs - 1.0 / ls;
            }
            a[ra * m + ra] += 1.0 / v[i] + 1.0 / l[i];
        }
        if !dense::solve(&mut a[..m * m], &mut b[..m], m) {
            return Err(not_converged(its, pt.resid));
        }
        let mut step = 1.0_f64;
        for ra in 0..m {
            let i = idx[ra];
            let dv = b[ra];
            if v[i] + dv <= 0.0 {
                step = step.min(0.9 * v[i] / -dv);
            } else if v[i] + dv >= z[i] {
                step = step.min(0.9 * (z[i] - v[i]) / dv);
            }
        }
        let mut accepted = false;
        for _ in 0..10 {
            vt[..n].copy_from_slice(&v[..n]);
            lt[..n].copy_from_slice(&l[..n]);
            for ra in 0..m {
                let i = idx[ra];
                if v[i] <= l[i] {
                    vt[i] = v[i] + step * b[ra];
                    lt[i] = z[i] - vt[i];
                } else {
                    lt[i] = l[i] - step * b[ra];
                    vt[i] = z[i] - lt[i];
                }
            }
            if let Some(np) = point(
                model,
                t,
                p,
                z,
                &vt[..n],
                &lt[..n],
                &mut tpv[..n],
                &mut tpl[..n],
                &mut tg[..n],
            ) {
                let tol = 1e-13 * pt.gibbs.abs().max(1.0);
                if np.gibbs <= pt.gibbs + tol || np.resid < pt.resid {
                    v[..n].copy_from_slice(&vt[..n]);
                    l[..n].copy_from_slice(&lt[..n]);
                    lpv[..n].copy_from_slice(&tpv[..n]);
                    lpl[..n].copy_from_slice(&tpl[..n]);
                    gv[..n].copy_from_slice(&tg[..n]);
                    pt = np;
                    accepted = true;
                    break;
                }
            }
            step *= 0.5;
        }
        if !accepted {
            break;
        }
    }
    if pt.resid > 1e-10 {
        return Err(not_converged(its, pt.resid));
    }
    let (vs, ls): (f64, f64) = (v[..n].iter().sum(), l[..n].iter().sum());
    let beta = vs / (vs + ls);
    let mut x: Vec<f64> = l[..n].iter().map(|li| li / ls).collect();
    let mut y: Vec<f64> = v[..n].iter().map(|vi| vi / vs).collect();
    let lnk_max = x
        .iter()
        .zip(&y)
        .zip(z)
        .filter(|(_, zi)| **zi > 0.0)
        .map(|((xi, yi), _)| (yi / xi).ln().abs())
        .fold(0.0, f64::max);
    if !(beta > 0.0 && beta < 1.0) || lnk_max < 1e-5 {
        return Err(not_converged(its, pt.resid));
    }
    let (mut rho_l, mut rho_v, mut vf) = (pt.rho_l, pt.rho_v, beta);
    if rho_v > rho_l {
        std::mem::swap(&mut x, &mut y);
        std::mem::swap(&mut rho_l, &mut rho_v);
        vf = 1.0 - beta;
    }
    Ok(TwoPhase {
        t,
        p,
        vapor_fraction: vf,
        x,
        y,
        rho_l,
        rho_v,
        iterations: its,
        fugacity_residual: pt.resid,
    })
}
