//! Fugacity coefficients of one phase at given temperature, pressure and composition, and
//! their derivatives, for any [`Model`].
//!
//! The equilibrium solvers work at fixed (T, P): for a phase of composition x the density is
//! a root of P(T, rho, x) = P and ln phi_i follows from the model. Where the model has more
//! than one root, the phase takes the root of lowest Gibbs energy (g_res/RT = alpha + Z - 1 -
//! ln Z, the composition terms being equal for every root), as recommended by M. L.
//! Michelsen, Fluid Phase Equilib. 9 (1982) 1-19.
//!
//! Derivatives with respect to mole numbers, temperature and pressure are taken by finite
//! differences on the same density branch (the root nearest the unperturbed density), so
//! that every solver works with every model. Mole-number derivatives use forward differences
//! with step 1e-7 N (the Jacobian only steers Newton's method; the residuals are exact),
//! unless the model gives them analytically ([`Model::dlnphi_dn_tp`]: the cubics); T and P
//! derivatives use central differences with relative step 1e-5.
//!
//! ln phi_i = mu_res_i/(RT) - ln Z: at a density root of the given pressure the exact Z is
//! P/(rho R T), and the model's ln Z (a small difference of large terms for a dense liquid at
//! low pressure) is replaced by it, which keeps ln phi accurate down to very low reduced
//! temperatures.
//!
//! Nothing here allocates: work vectors are stack arrays of [`MAX_COMPONENTS`].

use crate::model::Model;
pub use crate::root_choice::{select_root, PhaseAt, RootSel};

/// Most components the equilibrium solvers accept (the size of their stack work arrays).
pub const MAX_COMPONENTS: usize = 64;

/// Up to this many components the Newton solvers keep their n x n matrices in stack arrays
/// of SMALL_COMPONENTS^2 entries (zeroing a 64 x 64 array costs as much as a few fugacity
/// evaluations); larger mixtures use MAX_COMPONENTS^2.
pub const SMALL_COMPONENTS: usize = 16;

/// Normalises non-negative mole numbers `n` into `x`; returns the total, or `None` when the
/// total is not a finite positive number.
#[inline]
pub fn normalise(n: &[f64], x: &mut [f64]) -> Option<f64> {
    let total: f64 = n.iter().sum();
    if !(total.is_finite() && total > 0.0) {
        return None;
    }
    let inv = 1.0 / total;
    for (xi, ni) in x.iter_mut().zip(n) {
        *xi = ni.max(0.0) * inv;
    }
    Some(total)
}

/// ln phi of every component of a phase with mole numbers (or fractions) `n` at (T, P), into
/// `out`. Returns `None` when the model has no density root or the amounts are not usable.
/// The work is done by [`Model::ln_phi_at_tp`] (by default [`ln_phi_at_tp_generic`]).
pub fn ln_phi_tp(
    model: &dyn Model,
    t: f64,
    p: f64,
    n: &[f64],
    sel: RootSel,
    out: &mut [f64],
) -> Option<PhaseAt> {
    let nc = n.len();
    let mut xb = [0.0; MAX_COMPONENTS];
    let x = &mut xb[..nc];
    normalise(n, x)?;
    model.ln_phi_at_tp(t, p, x, sel, out)
}

/// d ln phi_i / d n_j at fixed (T, P) for a phase with mole numbers `n` (any total), on the
/// branch of density `rho`; `base` holds ln phi at `n`. Row-major into `jac[i * nc + j]`.
/// The model's analytic form ([`Model::dlnphi_dn_tp`]) where it has one, otherwise
/// [`dlnphi_dn_fd`]. Returns false if the derivative cannot be formed.
pub fn dlnphi_dn(
    model: &dyn Model,
    t: f64,
    p: f64,
    n: &[f64],
    rho: f64,
    base: &[f64],
    jac: &mut [f64],
) -> bool {
    let nc = n.len();
    let mut xb = [0.0; MAX_COMPONENTS];
    let Some(total) = normalise(n, &mut xb[..nc]) else {
        return false;
    };
    if model.dlnphi_dn_tp(t, rho, &xb[..nc], &mut jac[..nc * nc]) {
        // The model's derivative is for one mole; for `total` moles it is 1/total of it.
        let inv = 1.0 / total;
        for v in jac[..nc * nc].iter_mut() {
            *v *= inv;
        }
        return jac[..nc * nc].iter().all(|v| v.is_finite());
    }
    dlnphi_dn_fd(model, t, p, n, rho, base, jac)
}

/// [`dlnphi_dn`] by forward differences (step 1e-7 of the total amount) on the branch of
/// density `rho`, for models without an analytic form.
pub fn dlnphi_dn_fd(
    model: &dyn Model,
    t: f64,
    p: f64,
    n: &[f64],
    rho: f64,
    base: &[f64],
    jac: &mut [f64],
) -> bool {
    let nc = n.len();
    let total: f64 = n.iter().sum();
    let h = 1e-7 * total;
    let mut np = [0.0; MAX_COMPONENTS];
    let mut lp = [0.0; MAX_COMPONENTS];
    np[..nc].copy_from_slice(n);
    for j in 0..nc {
        np[j] = n[j] + h;
        if ln_phi_tp(model, t, p, &np[..nc], RootSel::Near(rho), &mut lp[..nc]).is_none() {
            return false;
        }
        np[j] = n[j];
        for i in 0..nc {
            jac[i * nc + j] = (lp[i] - base[i]) / h;
        }
    }
    true
}

/// Which state variable a derivative is taken in.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum StateVar {
    /// Temperature.
    T,
    /// Pressure.
    P,
}

/// d ln phi_i / d ln T or d ln phi_i / d ln P at fixed composition, on the branch of density
/// `rho`, into `out`. Returns false if a perturbed state has no root.
pub fn dlnphi_dlnstate(
    model: &dyn Model,
    t: f64,
    p: f64,
    n: &[f64],
    rho: f64,
    var: StateVar,
    out: &mut [f64],
) -> bool {
    let nc = n.len();
    let h: f64 = 1e-5;
    let (up, dn) = (h.exp(), (-h).exp());
    let mut a = [0.0; MAX_COMPONENTS];
    let mut b = [0.0; MAX_COMPONENTS];
    let (s1, s2) = match var {
        StateVar::T => ((t * up, p), (t * dn, p)),
        StateVar::P => ((t, p * up), (t, p * dn)),
    };
    if ln_phi_tp(model, s1.0, s1.1, n, RootSel::Near(rho), &mut a[..nc]).is_none()
        || ln_phi_tp(model, s2.0, s2.1, n, RootSel::Near(rho), &mut b[..nc]).is_none()
    {
        return false;
    }
    for i in 0..nc {
        out[i] = (a[i] - b[i]) / (2.0 * h);
    }
    true
}
