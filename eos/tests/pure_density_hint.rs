//! The (T, p) density of every Helmholtz formulation with the ancillary branch hint
//! (eos::helmholtz::branch_hint) is the stable root: the root of lowest Gibbs energy among all
//! roots of the isotherm (the equilibrium criterion at fixed T and p), on a grid from the
//! triple point to Tc, on both sides of the saturation line, near it and far from it.

use eos::helmholtz::{formulation, keys, HelmholtzFluid};

#[test]
fn hinted_density_is_the_lowest_gibbs_root() {
    for k in keys() {
        let fluid = HelmholtzFluid::new(formulation(k).unwrap());
        let f = fluid.formulation();
        let tau_g = |t: f64, rho: f64| {
            let tau = f.tc / t;
            let delta = rho / f.rhoc;
            let r = f.residual(tau, delta);
            delta.ln() + r.a + delta * r.d
        };
        let mut n = 0;
        for i in 0..=20 {
            let t = f.t_triple + (0.999 * f.tc - f.t_triple) * i as f64 / 20.0;
            let ps = fluid.saturation_t(t).unwrap().p;
            for m in [0.01, 0.5, 0.97, 0.995, 1.005, 1.03, 2.0, 10.0] {
                let p = ps * m;
                if p > f.validity.p_max {
                    continue;
                }
                let got = fluid.density(t, p).unwrap();
                let roots = fluid.density_roots(t, p).unwrap();
                let best = roots
                    .as_slice()
                    .iter()
                    .copied()
                    .min_by(|a, b| tau_g(t, *a).total_cmp(&tau_g(t, *b)))
                    .unwrap();
                assert!(
                    (got / best - 1.0).abs() < 1e-9,
                    "{k} at {t} K, {p} Pa: {got} vs {best}"
                );
                n += 1;
            }
        }
        assert!(n > 100);
    }
}
