//! Departure functions of a Z(T, P) model by the exact integrals from zero pressure along the
//! isotherm (see the module docs of [`super`]), with 24-point Gauss-Legendre quadrature on
//! [0, P]: the integrands (Z - 1)/P and (dZ/dT)/P stay finite as P -> 0 (they tend to the
//! second virial coefficient and its derivative).

use super::TpModel;
use crate::constants::R;
use crate::error::Result;
use crate::state::RootChoice;

/// Nodes and weights of the 24-point Gauss-Legendre rule mapped from [-1, 1] to [0, 1]. The
/// nodes are the roots of the Legendre polynomial P_24 (Abramowitz & Stegun, section 25.4.29),
/// found here by Newton's method from the usual cosine estimates.
fn gauss_legendre_24() -> [(f64, f64); 24] {
    const N: usize = 24;
    let mut out = [(0.0, 0.0); N];
    for (i, o) in out.iter_mut().enumerate() {
        let mut x = (std::f64::consts::PI * (i as f64 + 0.75) / (N as f64 + 0.5)).cos();
        let mut dp = 1.0;
        for _ in 0..100 {
            let (mut p0, mut p1) = (1.0, x);
            for k in 2..=N {
                let kf = k as f64;
                let p2 = ((2.0 * kf - 1.0) * x * p1 - (kf - 1.0) * p0) / kf;
                p0 = p1;
                p1 = p2;
            }
            dp = N as f64 * (x * p1 - p0) / (x * x - 1.0);
            let dx = p1 / dp;
            x -= dx;
            if dx.abs() < 1e-16 {
                break;
            }
        }
        let w = 2.0 / ((1.0 - x * x) * dp * dp);
        // map [-1, 1] -> [0, 1]
        *o = (0.5 * (x + 1.0), 0.5 * w);
    }
    out
}

/// (h_dep in J/mol, s_dep in J/(mol K), ln phi of the mixture) at (T, P, x).
pub fn integrate(
    model: &dyn TpModel,
    t: f64,
    p: f64,
    x: &[f64],
    root: RootChoice,
) -> Result<(f64, f64, f64)> {
    let dt = 1e-4 * t;
    let (mut i_dzdt, mut i_zm1) = (0.0, 0.0);
    for (u, w) in gauss_legendre_24() {
        let pk = u * p;
        let z = model.point(t, pk, x, root)?.z;
        let zp = model.point(t + dt, pk, x, root)?.z;
        let zm = model.point(t - dt, pk, x, root)?.z;
        // dP/P = du/u over [0, 1].
        i_zm1 += w * (z - 1.0) / u;
        i_dzdt += w * t * (zp - zm) / (2.0 * dt) / u;
    }
    let h_dep = -R * t * i_dzdt;
    let s_dep = -R * (i_zm1 + i_dzdt);
    Ok((h_dep, s_dep, i_zm1))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn quadrature_is_exact_for_polynomials() {
        // Gauss-Legendre with 24 points integrates degree <= 47 exactly.
        let q: f64 = gauss_legendre_24().iter().map(|(u, w)| w * u.powi(7)).sum();
        assert!((q - 1.0 / 8.0).abs() < 1e-15);
        let s: f64 = gauss_legendre_24().iter().map(|(_, w)| w).sum();
        assert!((s - 1.0).abs() < 1e-15);
    }
}
