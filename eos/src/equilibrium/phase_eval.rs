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

use crate::constants::R;
use crate::model::Model;

/// Most components the equilibrium solvers accept (the size of their stack work arrays).
pub const MAX_COMPONENTS: usize = 64;

/// Up to this many components the Newton solvers keep their n x n matrices in stack arrays
/// of SMALL_COMPONENTS^2 entries (zeroing a 64 x 64 array costs as much as a few fugacity
/// evaluations); larger mixtures use MAX_COMPONENTS^2.
pub const SMALL_COMPONENTS: usize = 16;

/// Which density root a phase takes.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum RootSel {
    /// The root of lowest Gibbs energy.
    LowestGibbs,
    /// The densest root.
    Liquid,
    /// The least dense root.
    Vapor,
    /// The root nearest a reference density (mol/m3), for derivatives on one branch.
    Near(f64),
}

/// Density and compressibility factor of an evaluated phase.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PhaseAt {
    /// Molar density, mol/m3.
    pub rho: f64,
    /// Compressibility factor.
    pub z: f64,
    /// Reduced residual Gibbs energy g_res/(RT) = sum x_i ln phi_i.
    pub g_res: f64,
    /// Number of density roots the model has at this (T, P, x).
    pub roots: usize,
}

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

/// ln phi at (T, P) and mole fractions `x` through the model's density roots, alpha and Z
/// ([`Model::alpha_z`]) and ln phi at (T, rho): the default of [`Model::ln_phi_at_tp`].
pub fn ln_phi_at_tp_generic<M: Model + ?Sized>(
    model: &M,
    t: f64,
    p: f64,
    x: &[f64],
    sel: RootSel,
    out: &mut [f64],
) -> Option<PhaseAt> {
    let roots = model.densities(t, p, x);
    select_root(
        t,
        p,
        roots.as_slice(),
        sel,
        |rho| {
            let (alpha, z_model) = model.alpha_z(t, rho, x);
            (alpha, z_model, ())
        },
        |rho, _, z_model, ln_z, out| {
            model.ln_phi(t, rho, x, out);
            // ln phi_i = mu_res_i/RT - ln Z: replace the model's ln Z by ln(P/(rho R T)).
            let corr = z_model.ln() - ln_z;
            for o in out.iter_mut() {
                *o += corr;
            }
        },
        out,
    )
}

/// Chooses the root `sel` among the density roots `r` at (T, P), then fills `out` with ln
/// phi there.
///
/// `eval(rho)` gives the model's alpha and Z at (T, rho) and whatever pieces of that work
/// ln phi can reuse; `ln_phi(rho, pieces, z_model, ln_z, out)` gives ln phi_i = mu_res_i/RT -
/// ln Z with ln Z = `ln_z` = ln(P/(rho R T)) taken from the given pressure (not from the
/// model's Z, which for a dense liquid at low pressure is a small difference of large
/// terms). The Gibbs energy of a root is g_res/RT = alpha + Z - 1 - ln Z with that Z.
pub fn select_root<P>(
    t: f64,
    p: f64,
    r: &[f64],
    sel: RootSel,
    eval: impl Fn(f64) -> (f64, f64, P),
    ln_phi: impl FnOnce(f64, &P, f64, f64, &mut [f64]),
    out: &mut [f64],
) -> Option<PhaseAt> {
    if r.is_empty() {
        return None;
    }
    let pick = |rho: f64| {
        let (a, z_model, pieces) = eval(rho);
        let z = p / (rho * R * t);
        let ln_z = z.ln();
        (rho, z, ln_z, a + z - 1.0 - ln_z, z_model, pieces)
    };
    let (rho, z, ln_z, g, z_model, pieces) = match sel {
        RootSel::Vapor => pick(r[0]),
        RootSel::Liquid => pick(r[r.len() - 1]),
        RootSel::LowestGibbs => {
            let mut best = pick(r[0]);
            for &rho in &r[1..] {
                let c = pick(rho);
                if c.3 < best.3 {
                    best = c;
                }
            }
            best
        }
        RootSel::Near(rho_ref) => pick(
            r.iter()
                .copied()
                .min_by(|a, b| (a - rho_ref).abs().total_cmp(&(b - rho_ref).abs()))
                .unwrap_or(r[0]),
        ),
    };
    if !(rho.is_finite() && z.is_finite() && z > 0.0 && z_model > 0.0 && g.is_finite()) {
        return None;
    }
    ln_phi(rho, &pieces, z_model, ln_z, out);
    if out.iter().any(|v| !v.is_finite()) {
        return None;
    }
    Some(PhaseAt {
        rho,
        z,
        g_res: g,
        roots: r.len(),
    })
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
