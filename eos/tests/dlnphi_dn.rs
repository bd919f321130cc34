//! The analytic composition derivatives of ln phi at fixed T and P of the cubic family
//! (`Model::dlnphi_dn_tp`, used by the flash, stability and envelope Newton steps) against
//! thermodynamic identities and central finite differences of the model's own ln phi:
//!
//! - Gibbs-Duhem at fixed T and P: sum_i n_i d ln phi_i / d n_j = 0;
//! - symmetry: d ln phi_i / d n_j = d ln phi_j / d n_i (both are d2 G_res / d n_i d n_j);
//! - agreement with central differences of ln phi on the same density root.
//!
//! (M. L. Michelsen, J. M. Mollerup, *Thermodynamic Models: Fundamentals and Computational
//! Aspects*, 2nd ed., 2007, chapter 2, for the identities.)

mod common;

use common::{comp, demo_gas, kij};
use eos::cubic::{Cubic, CubicKind};
use eos::Model;

/// ln phi at (T, P) for composition x on the density root nearest `rho`; returns that root.
fn ln_phi_near(m: &Cubic, t: f64, p: f64, x: &[f64], rho: f64, out: &mut [f64]) -> f64 {
    let roots = m.densities(t, p, x);
    let r = roots
        .as_slice()
        .iter()
        .copied()
        .min_by(|a, b| (a - rho).abs().total_cmp(&(b - rho).abs()))
        .unwrap();
    common::ln_phi_at(m, t, p, r, x, out);
    r
}

#[test]
fn analytic_composition_derivatives_obey_the_identities_and_match_differences() {
    let (names, z) = demo_gas();
    let comps: Vec<_> = names.iter().map(|n| comp(n)).collect();
    let k = kij(&names);
    let n = z.len();
    let mut checked = 0;
    for kind in [
        CubicKind::Vdw,
        CubicKind::Rk,
        CubicKind::Srk,
        CubicKind::Pr76,
        CubicKind::Pr78,
    ] {
        let m = Cubic::new(kind, &comps, Some(&k)).unwrap();
        // A gas, a dense gas and cold states with liquid-like roots.
        for (t, p) in [(300.0, 70e5), (250.0, 150e5), (200.0, 20e5), (150.0, 5e5)] {
            let roots = m.densities(t, p, &z);
            for &rho in roots.as_slice() {
                let mut jac = vec![0.0; n * n];
                assert!(m.dlnphi_dn_tp(t, rho, &z, &mut jac), "{kind:?} {t} {p}");
                let scale = jac.iter().fold(0.0_f64, |a, v| a.max(v.abs()));
                for j in 0..n {
                    let gd: f64 = (0..n).map(|i| z[i] * jac[i * n + j]).sum();
                    assert!(gd.abs() <= 1e-11 * scale, "{kind:?} Gibbs-Duhem {gd:e}");
                    for i in 0..n {
                        let (a, b) = (jac[i * n + j], jac[j * n + i]);
                        assert!((a - b).abs() <= 1e-12 * scale, "{kind:?} symmetry");
                    }
                }
                // Central differences in n_j (one mole in all): step 1e-6 mol, truncation
                // ~1e-12 relative, rounding ~1e-16/1e-6 = 1e-10 of ln phi.
                let h = 1e-6;
                let (mut up, mut dn) = (vec![0.0; n], vec![0.0; n]);
                for j in 0..n {
                    let mut xp = z.clone();
                    let mut xm = z.clone();
                    xp[j] += h;
                    xm[j] -= h;
                    let (sp, sm): (f64, f64) = (xp.iter().sum(), xm.iter().sum());
                    xp.iter_mut().for_each(|v| *v /= sp);
                    xm.iter_mut().for_each(|v| *v /= sm);
                    ln_phi_near(&m, t, p, &xp, rho, &mut up);
                    ln_phi_near(&m, t, p, &xm, rho, &mut dn);
                    for i in 0..n {
                        let fd = (up[i] - dn[i]) / (2.0 * h);
                        let an = jac[i * n + j];
                        assert!(
                            (fd - an).abs() <= 1e-6 * scale,
                            "{kind:?} {t} K {p} Pa rho {rho}: d ln phi_{i}/d n_{j} {an} vs {fd}"
                        );
                    }
                }
                checked += 1;
            }
        }
    }
    assert!(checked >= 20, "{checked} states");
}
