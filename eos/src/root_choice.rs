//! Which density root a phase takes at (T, P), and what the chosen root gives: the types of
//! [`crate::model::Model::ln_phi_at_tp`] and the root choice that every model shares.
//!
//! Where a model has more than one root, a phase takes the root of lowest Gibbs energy
//! (g_res/RT = alpha + Z - 1 - ln Z, the composition terms being equal for every root), as
//! recommended by M. L. Michelsen, Fluid Phase Equilib. 9 (1982) 1-19.

use crate::constants::R;

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
