//! The equations of a saturation point (bubble or dew) of a mixture, in the form used for
//! phase-envelope construction by M. L. Michelsen, *Calculation of phase envelopes and
//! critical points for multicomponent mixtures*, Fluid Phase Equilib. 4 (1980) 1-10.
//!
//! The feed z is one phase; an incipient phase of mole numbers w is in equilibrium with it.
//! With K_i = y_i / x_i and the variables X = (ln K_1 .. ln K_n, ln T, ln P):
//!
//! - dew side (feed is the vapour, y = z): w_i = x_i = z_i / K_i;
//! - bubble side (feed is the liquid, x = z): w_i = y_i = z_i K_i;
//!
//! F_i = ln K_i + ln phi_i(T, P, y) - ln phi_i(T, P, x) = 0 (i = 1..n),
//! F_(n+1) = sum_i w_i - 1 = 0,
//! F_(n+2) = X_s - S = 0 (the specification: one variable fixed at a value).
//!
//! The Jacobian is dF_i/d ln K_j = delta_ij + w_j d ln phi_i(w)/d n_j on both sides, dF_(n+1)/d
//! ln K_j = +w_j (bubble) or -w_j (dew), and the T and P columns come from d ln phi/d ln T
//! and d ln phi/d ln P of both phases (all by the differences of [`super::phase_eval`]).
//! Each phase takes the density root of its kind (liquid: densest, vapour: least dense).
//! Components absent from the feed have w_i = 0 and an equation that just fixes their K at
//! infinite dilution.

use super::dense;
use super::phase_eval::{dlnphi_dlnstate, dlnphi_dn, ln_phi_tp, RootSel, StateVar};
use super::phase_eval::{MAX_COMPONENTS, SMALL_COMPONENTS};
use crate::error::{Error, Result};
use crate::model::Model;

/// Size of the largest system: n ln K plus ln T and ln P.
pub const MAX_VARS: usize = MAX_COMPONENTS + 2;

/// Which phase the feed is.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Side {
    /// The feed is liquid; the incipient phase is a vapour (vapour fraction 0).
    Bubble,
    /// The feed is vapour; the incipient phase is a liquid (vapour fraction 1).
    Dew,
}

/// Densities of the two phases at a point: (feed, incipient).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Densities {
    /// Feed phase, mol/m3.
    pub feed: f64,
    /// Incipient phase, mol/m3.
    pub incipient: f64,
}

/// The system for one model, feed and side.
pub struct System<'a> {
    pub model: &'a dyn Model,
    pub z: &'a [f64],
    pub side: Side,
    /// Density root of the feed phase.
    pub feed_root: RootSel,
    /// Density root of the incipient phase.
    pub incipient_root: RootSel,
}

impl<'a> System<'a> {
    /// The system with the roots of each phase's kind: at a bubble point the feed takes the
    /// liquid (densest) root and the incipient phase the vapour root, at a dew point the
    /// reverse. (The root of lowest Gibbs energy would not do: near a pure component the two
    /// compositions almost coincide and would take the same root.)
    pub fn new(model: &'a dyn Model, z: &'a [f64], side: Side) -> Self {
        let (feed_root, incipient_root) = match side {
            Side::Bubble => (RootSel::Liquid, RootSel::Vapor),
            Side::Dew => (RootSel::Vapor, RootSel::Liquid),
        };
        System {
            model,
            z,
            side,
            feed_root,
            incipient_root,
        }
    }

    /// Number of unknowns, n + 2.
    pub fn size(&self) -> usize {
        self.z.len() + 2
    }

    /// Incipient-phase mole numbers at ln K.
    pub fn incipient(&self, x: &[f64], w: &mut [f64]) {
        for i in 0..self.z.len() {
            w[i] = match self.side {
                Side::Bubble => self.z[i] * x[i].exp(),
                Side::Dew => self.z[i] * (-x[i]).exp(),
            };
        }
    }

    /// Residuals F (n + 1 of them; the specification row is the caller's) and, when `jac` is
    /// given, the (n + 2) x (n + 2) Jacobian without its specification row (row n + 1 left
    /// zero). Returns the densities, or None where a phase has no density root.
    pub fn eval(&self, x: &[f64], f: &mut [f64], jac: Option<&mut [f64]>) -> Option<Densities> {
        let n = self.z.len();
        let m = n + 2;
        let (t, p) = (x[n].exp(), x[n + 1].exp());
        if !(t.is_finite() && p.is_finite()) {
            return None;
        }
        let mut w = [0.0; MAX_COMPONENTS];
        self.incipient(x, &mut w[..n]);
        let mut lf = [0.0; MAX_COMPONENTS];
        let mut lw = [0.0; MAX_COMPONENTS];
        let pf = ln_phi_tp(self.model, t, p, self.z, self.feed_root, &mut lf[..n])?;
        let pw = ln_phi_tp(self.model, t, p, &w[..n], self.incipient_root, &mut lw[..n])?;
        let sign = match self.side {
            Side::Bubble => 1.0,
            Side::Dew => -1.0,
        };
        // ln phi(y) - ln phi(x) = sign (ln phi(w) - ln phi(z)).
        for i in 0..n {
            f[i] = x[i] + sign * (lw[i] - lf[i]);
        }
        f[n] = w[..n].iter().sum::<f64>() - 1.0;
        if let Some(jac) = jac {
            jac[..m * m].fill(0.0);
            // d ln phi / d n into the first n * n entries (row stride n), then spread to row
            // stride m in place: from the last entry back, each moves to an index at least
            // as large as its own, past every entry still to be read.
            if !dlnphi_dn(
                self.model,
                t,
                p,
                &w[..n],
                pw.rho,
                &lw[..n],
                &mut jac[..n * n],
            ) {
                return None;
            }
            for i in (0..n).rev() {
                for j in (0..n).rev() {
                    let v = jac[i * n + j];
                    jac[i * n + j] = 0.0;
                    jac[i * m + j] = v * w[j];
                }
            }
            for i in 0..n {
                jac[i * m + i] += 1.0;
                jac[n * m + i] = sign * w[i];
            }
            let mut a = [0.0; MAX_COMPONENTS];
            let mut b = [0.0; MAX_COMPONENTS];
            for (col, var) in [(n, StateVar::T), (n + 1, StateVar::P)] {
                if !dlnphi_dlnstate(self.model, t, p, &w[..n], pw.rho, var, &mut a[..n])
                    || !dlnphi_dlnstate(self.model, t, p, self.z, pf.rho, var, &mut b[..n])
                {
                    return None;
                }
                for i in 0..n {
                    jac[i * m + col] = sign * (a[i] - b[i]);
                }
            }
        }
        Some(Densities {
            feed: pf.rho,
            incipient: pw.rho,
        })
    }

    /// Newton's method with variable `spec` fixed at `value` (x[spec] is set to it first).
    /// Returns the iterations and the densities at convergence.
    pub fn solve(&self, x: &mut [f64], spec: usize, value: f64) -> Result<(usize, Densities)> {
        if self.z.len() <= SMALL_COMPONENTS {
            self.solve_in::<{ (SMALL_COMPONENTS + 2) * (SMALL_COMPONENTS + 2) }>(x, spec, value)
        } else {
            self.solve_in::<{ MAX_VARS * MAX_VARS }>(x, spec, value)
        }
    }

    /// [`System::solve`] with a Jacobian array of `NN` >= (n + 2)^2 entries.
    fn solve_in<const NN: usize>(
        &self,
        x: &mut [f64],
        spec: usize,
        value: f64,
    ) -> Result<(usize, Densities)> {
        let n = self.z.len();
        let m = n + 2;
        x[spec] = value;
        let mut f = [0.0; MAX_VARS];
        let mut jac = [0.0; NN];
        let mut best = f64::INFINITY;
        for it in 1..=60 {
            let Some(d) = self.eval(x, &mut f[..m], Some(&mut jac[..m * m])) else {
                return Err(Error::NotConverged {
                    solver: "saturation point (no density root on the way)",
                    iterations: it,
                    residual: best,
                });
            };
            let r = f[..=n].iter().fold(0.0_f64, |a, v| a.max(v.abs()));
            best = best.min(r);
            if r <= 1e-11 {
                return Ok((it, d));
            }
            f[n + 1] = 0.0;
            jac[(n + 1) * m + spec] = 1.0;
            for v in f[..m].iter_mut() {
                *v = -*v;
            }
            if !dense::solve(&mut jac[..m * m], &mut f[..m], m) {
                return Err(Error::NotConverged {
                    solver: "saturation point (singular Jacobian)",
                    iterations: it,
                    residual: r,
                });
            }
            // Limit the step: ln T by 0.1, ln P by 0.5, ln K by 1.
            let mut scale = 1.0_f64;
            for (i, dx) in f[..m].iter().enumerate() {
                let lim = if i == n {
                    0.1
                } else if i == n + 1 {
                    0.5
                } else {
                    1.0
                };
                if dx.abs() > lim {
                    scale = scale.min(lim / dx.abs());
                }
            }
            for i in 0..m {
                x[i] += scale * f[i];
            }
        }
        Err(Error::NotConverged {
            solver: "saturation point",
            iterations: 60,
            residual: best,
        })
    }

    /// Sensitivities dX/dS at a converged point for specification `spec`: J dX/dS = e_(n+2).
    pub fn sensitivity(&self, x: &[f64], spec: usize, out: &mut [f64]) -> bool {
        if self.z.len() <= SMALL_COMPONENTS {
            self.sensitivity_in::<{ (SMALL_COMPONENTS + 2) * (SMALL_COMPONENTS + 2) }>(x, spec, out)
        } else {
            self.sensitivity_in::<{ MAX_VARS * MAX_VARS }>(x, spec, out)
        }
    }

    /// [`System::sensitivity`] with a Jacobian array of `NN` >= (n + 2)^2 entries.
    fn sensitivity_in<const NN: usize>(&self, x: &[f64], spec: usize, out: &mut [f64]) -> bool {
        let n = self.z.len();
        let m = n + 2;
        let mut f = [0.0; MAX_VARS];
        let mut jac = [0.0; NN];
        if self.eval(x, &mut f[..m], Some(&mut jac[..m * m])).is_none() {
            return false;
        }
        jac[(n + 1) * m + spec] = 1.0;
        out[..m].fill(0.0);
        out[n + 1] = 1.0;
        dense::solve(&mut jac[..m * m], &mut out[..m], m)
    }
}

/// True when every ln K of a component present in the feed is within 1e-6 of zero (the
/// incipient phase equals the feed: the trivial solution).
pub fn is_trivial(z: &[f64], x: &[f64]) -> bool {
    z.iter()
        .zip(x)
        .filter(|(z, _)| **z > 0.0)
        .all(|(_, k)| k.abs() < 1e-6)
}
