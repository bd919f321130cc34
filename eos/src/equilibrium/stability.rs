//! Phase stability by the tangent-plane criterion.
//!
//! A feed z at (T, P) is stable when no trial phase W lies below the tangent plane of the
//! Gibbs energy at z (M. L. Michelsen, *The isothermal flash problem. Part I. Stability*,
//! Fluid Phase Equilib. 9 (1982) 1-19). With d_i = ln z_i + ln phi_i(z) and W in mole numbers,
//! the modified tangent-plane distance is
//!
//! tm(W) = 1 + sum_i W_i (ln W_i + ln phi_i(W) - d_i - 1),
//!
//! and the feed is unstable if and only if tm < 0 for some W. Stationary points satisfy
//! ln W_i + ln phi_i(W) = d_i, where tm = 1 - sum W_i.
//!
//! Each trial is started from
//! - Wilson K-values (see [`super::wilson`]): a vapour-like W_i = z_i K_i and a liquid-like
//!   W_i = z_i / K_i;
//! - pure-component-like phases W = (almost) one component: every component for up to four
//!   components, otherwise the lightest and the heaviest (lowest and highest Tc);
//!
//! and improved by successive substitution, ln W_i <- d_i - ln phi_i(W). Any iterate with tm <
//! 0 proves instability and ends the test. A trial that does not settle after 20
//! substitutions switches to Newton's method in Michelsen's variables alpha_i = 2 sqrt(W_i),
//! where the Hessian of tm is H_ij = delta_ij (1 + s_i / 2) + sqrt(W_i W_j) d ln phi_i / d n_j
//! with s_i = ln W_i + ln phi_i - d_i, with a halving line search on tm (twelve halvings for
//! a step that points downhill, three for one that does not). A trial that
//! approaches the feed composition (the trivial solution) is dropped.

use super::phase_eval::{dlnphi_dn, ln_phi_tp, RootSel, MAX_COMPONENTS, SMALL_COMPONENTS};
use super::{dense, wilson};
use crate::composition;
use crate::error::{positive, Error, Result};
use crate::model::Model;

/// tm below this proves instability.
pub const TM_TOLERANCE: f64 = 1e-10;
const MAX_SS: usize = 20;
const MAX_NEWTON: usize = 30;

/// The result of a stability test.
#[derive(Debug, Clone, PartialEq)]
pub struct Stability {
    /// True when no trial phase lies below the tangent plane.
    pub stable: bool,
    /// The lowest tm found: negative when unstable; for a stable feed the lowest tm of the
    /// non-trivial stationary points (`f64::INFINITY` when every trial went trivial).
    pub tm: f64,
    /// Normalised composition of the trial phase with that tm (empty when none).
    pub trial: Vec<f64>,
    /// Molar density of that trial phase, mol/m3 (NaN when none).
    pub trial_rho: f64,
    /// Molar density of the feed phase (its root of lowest Gibbs energy), mol/m3.
    pub feed_rho: f64,
    /// Trial phases run.
    pub trials: usize,
    /// Substitution and Newton iterations over all trials.
    pub iterations: usize,
}

impl Stability {
    /// True when the trial phase found is lighter than the feed (an incipient vapour).
    pub fn trial_is_vapor_like(&self) -> bool {
        self.trial_rho < self.feed_rho
    }
}

/// Internal outcome, with the trial composition left in the caller's buffer.
#[derive(Debug, Clone, Copy)]
pub(crate) struct Core {
    pub stable: bool,
    pub tm: f64,
    pub trial_rho: f64,
    pub feed_rho: f64,
    pub trials: usize,
    pub iterations: usize,
    pub found: bool,
}

/// Tests the stability of feed `z` at temperature `t` (K) and pressure `p` (Pa).
pub fn test(model: &dyn Model, t: f64, p: f64, z: &[f64]) -> Result<Stability> {
    let n = check(model, t, p, z)?;
    let mut w = [0.0; MAX_COMPONENTS];
    let c = analyse(model, t, p, z, &mut w[..n])?;
    let trial = if c.found {
        let s: f64 = w[..n].iter().sum();
        w[..n].iter().map(|v| v / s).collect()
    } else {
        Vec::new()
    };
    Ok(Stability {
        stable: c.stable,
        tm: c.tm,
        trial,
        trial_rho: if c.found { c.trial_rho } else { f64::NAN },
        feed_rho: c.feed_rho,
        trials: c.trials,
        iterations: c.iterations,
    })
}

/// Validates (T, P, z) for the equilibrium solvers; returns the number of components.
pub(crate) fn check(model: &dyn Model, t: f64, p: f64, z: &[f64]) -> Result<usize> {
    positive("temperature (K)", t)?;
    positive("pressure (Pa)", p)?;
    let n = model.components().len();
    if n > MAX_COMPONENTS {
        return Err(Error::invalid(
            "number of components",
            n as f64,
            format!("at most {MAX_COMPONENTS} for the equilibrium solvers"),
        ));
    }
    composition::check(z, n)?;
    Ok(n)
}

/// The stability analysis; on instability (or the lowest stationary point when stable) the
/// trial mole numbers are left in `w_out`.
pub(crate) fn analyse(
    model: &dyn Model,
    t: f64,
    p: f64,
    z: &[f64],
    w_out: &mut [f64],
) -> Result<Core> {
    let n = z.len();
    let mut lnphi = [0.0; MAX_COMPONENTS];
    let feed =
        ln_phi_tp(model, t, p, z, RootSel::LowestGibbs, &mut lnphi[..n]).ok_or_else(|| {
            Error::NoSolution(format!(
                "{} has no density root for the feed at T = {t} K, P = {p} Pa",
                model.id()
            ))
        })?;
    let mut d = [0.0; MAX_COMPONENTS];
    let mut lnk = [0.0; MAX_COMPONENTS];
    let comps = model.components();
    for i in 0..n {
        d[i] = if z[i] > 0.0 {
            z[i].ln() + lnphi[i]
        } else {
            f64::NEG_INFINITY
        };
        lnk[i] = wilson::ln_k(&comps[i], t, p);
    }
    let mut core = Core {
        stable: true,
        tm: f64::INFINITY,
        trial_rho: f64::NAN,
        feed_rho: feed.rho,
        trials: 0,
        iterations: 0,
        found: false,
    };
    let active = z.iter().filter(|&&v| v > 0.0).count();
    // Trial list: 0 vapour-like, 1 liquid-like, then pure-component-like.
    let (mut light, mut heavy) = (usize::MAX, usize::MAX);
    for i in 0..n {
        if z[i] > 0.0 {
            if light == usize::MAX || comps[i].tc < comps[light].tc {
                light = i;
            }
            if heavy == usize::MAX || comps[i].tc > comps[heavy].tc {
                heavy = i;
            }
        }
    }
    let mut pure = [usize::MAX; 4];
    if active <= 4 {
        let mut k = 0;
        for (i, &zi) in z.iter().enumerate() {
            if zi > 0.0 && k < 4 {
                pure[k] = i;
                k += 1;
            }
        }
    } else {
        pure[0] = heavy;
        pure[1] = light;
    }
    let mut w = [0.0; MAX_COMPONENTS];
    for trial in 0..6 {
        let ok = match trial {
            0 | 1 => {
                let sign = if trial == 0 { 1.0 } else { -1.0 };
                for i in 0..n {
                    w[i] = if z[i] > 0.0 {
                        z[i] * (sign * lnk[i]).exp()
                    } else {
                        0.0
                    };
                }
                true
            }
            _ => {
                let j = pure[trial - 2];
                if j == usize::MAX || active < 2 {
                    false
                } else {
                    let rest = 1e-3 / (active - 1) as f64;
                    for i in 0..n {
                        w[i] = if i == j {
                            0.999
                        } else if z[i] > 0.0 {
                            rest
                        } else {
                            0.0
                        };
                    }
                    true
                }
            }
        };
        if !ok {
            continue;
        }
        core.trials += 1;
        let r = run_trial(model, t, p, z, &d[..n], &mut w[..n]);
        core.iterations += r.iterations;
        if let Some(tm) = r.tm {
            if tm < core.tm {
                core.tm = tm;
                core.trial_rho = r.rho;
                core.found = true;
                w_out.copy_from_slice(&w[..n]);
            }
            if tm < -TM_TOLERANCE {
                core.stable = false;
                return Ok(core);
            }
        }
    }
    Ok(core)
}

struct TrialResult {
    /// tm at a non-trivial stationary point or at an iterate proving instability.
    tm: Option<f64>,
    rho: f64,
    iterations: usize,
}

/// tm and its pieces at W; fills `lnphi`. Returns (tm, rho) or None.
fn tm_at(
    model: &dyn Model,
    t: f64,
    p: f64,
    d: &[f64],
    w: &[f64],
    lnphi: &mut [f64],
) -> Option<(f64, f64)> {
    let ph = ln_phi_tp(model, t, p, w, RootSel::LowestGibbs, lnphi)?;
    let mut tm = 1.0;
    for i in 0..w.len() {
        if w[i] > 0.0 {
            tm += w[i] * (w[i].ln() + lnphi[i] - d[i] - 1.0);
        }
    }
    Some((tm, ph.rho))
}

/// True when normalised W is within the trivial-solution distance of z.
fn is_trivial(z: &[f64], w: &[f64]) -> bool {
    let s: f64 = w.iter().sum();
    let mut dist = 0.0;
    for i in 0..z.len() {
        if z[i] > 0.0 && w[i] > 0.0 {
            let r = (w[i] / s / z[i]).ln();
            dist += r * r;
        }
    }
    dist < 1e-8
}

fn run_trial(
    model: &dyn Model,
    t: f64,
    p: f64,
    z: &[f64],
    d: &[f64],
    w: &mut [f64],
) -> TrialResult {
    let n = z.len();
    let mut lnphi = [0.0; MAX_COMPONENTS];
    let mut its = 0;
    for _ in 0..MAX_SS {
        its += 1;
        let Some((tm, rho)) = tm_at(model, t, p, d, w, &mut lnphi[..n]) else {
            return TrialResult {
                tm: None,
                rho: f64::NAN,
                iterations: its,
            };
        };
        if tm < -TM_TOLERANCE {
            return TrialResult {
                tm: Some(tm),
                rho,
                iterations: its,
            };
        }
        let mut dmax = 0.0_f64;
        for i in 0..n {
            if z[i] > 0.0 {
                let lw = d[i] - lnphi[i];
                dmax = dmax.max((lw - w[i].ln()).abs());
                w[i] = lw.exp();
            }
        }
        if is_trivial(z, w) {
            return TrialResult {
                tm: None,
                rho,
                iterations: its,
            };
        }
        if dmax < 1e-10 {
            let (tm, rho) = tm_at(model, t, p, d, w, &mut lnphi[..n]).unwrap_or((tm, rho));
            return TrialResult {
                tm: Some(tm),
                rho,
                iterations: its,
            };
        }
    }
    if n <= SMALL_COMPONENTS {
        newton::<{ SMALL_COMPONENTS * SMALL_COMPONENTS }>(model, t, p, z, d, w, its)
    } else {
        newton::<{ MAX_COMPONENTS * MAX_COMPONENTS }>(model, t, p, z, d, w, its)
    }
}

/// Newton's method on tm in alpha_i = 2 sqrt(W_i), with a halving line search; `NN` >= n^2
/// is the size of the matrix work arrays.
fn newton<const NN: usize>(
    model: &dyn Model,
    t: f64,
    p: f64,
    z: &[f64],
    d: &[f64],
    w: &mut [f64],
    mut its: usize,
) -> TrialResult {
    let n = z.len();
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
    let fail = |its| TrialResult {
        tm: None,
        rho: f64::NAN,
        iterations: its,
    };
    let Some((mut tm, mut rho)) = tm_at(model, t, p, d, w, &mut lnphi[..n]) else {
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
            let s = w[i].ln() + lnphi[i] - d[i];
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
                tm: (!is_trivial(z, w)).then_some(tm),
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
            for a in 0..m {
                let i = idx[a];
                let alpha = 2.0 * w[i].sqrt() + step * g[a];
                wt[i] = (0.5 * alpha).powi(2).max(1e-300);
            }
            if let Some((tn, rn)) = tm_at(model, t, p, d, &wt[..n], &mut lt[..n]) {
                if tn <= tm + 1e-14 * tm.abs().max(1.0) {
                    w.copy_from_slice(&wt[..n]);
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
            return TrialResult {
                tm: Some(tm),
                rho,
                iterations: its,
            };
        }
        if !accepted || is_trivial(z, w) {
            // No further decrease of tm: a stationary point to working precision (or the
            // trivial solution, which is dropped).
            return TrialResult {
                tm: (!is_trivial(z, w)).then_some(tm),
                rho,
                iterations: its,
            };
        }
    }
    fail(its)
}
