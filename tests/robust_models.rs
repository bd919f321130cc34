//! Property-based tests (proptest) over every model and every state input pair: across wide
//! ranges of temperature, pressure, density and composition (trace components, 20-component
//! mixtures, near-critical and out-of-range states) no call panics, every returned number is
//! finite, and every failure is a typed error. Failing cases are kept by proptest in
//! `proptest-regressions/` and committed.

use eos::cubic::{Cubic, CubicKind};
use eos::ideal::IdealGas;
use eos::state::{RootChoice, State};
use eos::Model;
use proptest::prelude::*;

fn all_models(ids: &[&str]) -> Vec<Box<dyn Model>> {
    let comps: Vec<eos::Component> = ids
        .iter()
        .map(|id| fluids::find(id).unwrap().to_component())
        .collect();
    let mut out: Vec<Box<dyn Model>> = vec![Box::new(IdealGas::new(&comps))];
    for kind in CubicKind::ALL {
        let k = fluids::kij_matrix(ids, fluids::KijFamily::PengRobinson);
        out.push(Box::new(Cubic::new(kind, &comps, Some(&k.values)).unwrap()));
    }
    out
}

fn check(s: &State) {
    let p = &s.props;
    for v in [
        p.t, p.p, p.rho, p.z, p.h, p.s, p.u, p.cv, p.h_res, p.s_res, p.g_res,
    ] {
        assert!(v.is_finite(), "non-finite property in {s:?}");
    }
    for v in [p.cp, p.w, p.jt, p.isentropic_exponent]
        .into_iter()
        .flatten()
    {
        assert!(v.is_finite(), "non-finite optional property in {s:?}");
    }
    assert!(
        p.ln_phi.iter().all(|v| v.is_finite()),
        "non-finite ln phi in {s:?}"
    );
    assert!(p.z > 0.0 && p.rho > 0.0);
}

/// Ids with no missing heat-capacity data and a spread of sizes and polarities.
const POOL: [&str; 20] = [
    "methane",
    "ethane",
    "propane",
    "n-butane",
    "isobutane",
    "n-pentane",
    "n-hexane",
    "n-heptane",
    "n-octane",
    "n-decane",
    "nitrogen",
    "co2",
    "h2s",
    "water",
    "hydrogen",
    "helium-4",
    "oxygen",
    "argon",
    "ammonia",
    "methanol",
];

fn fractions(n: usize, raw: &[f64]) -> Vec<f64> {
    // Positive weights spanning nine decades, so trace components appear.
    let w: Vec<f64> = raw[..n].iter().map(|r| 10f64.powf(-9.0 * r)).collect();
    let s: f64 = w.iter().sum();
    w.iter().map(|v| v / s).collect()
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 300, .. ProptestConfig::default() })]

    #[test]
    fn tp_states_never_panic_and_are_finite(
        n in 1usize..=20,
        start in 0usize..20,
        raw in prop::collection::vec(0.0f64..1.0, 20),
        log_t in 0.0f64..4.0,      // 1 K to 10,000 K
        log_p in -3.0f64..9.5,     // 1 mPa to 3 GPa
        root in 0u8..3,
    ) {
        let ids: Vec<&str> = (0..n).map(|k| POOL[(start + k) % 20]).collect();
        let x = fractions(n, &raw);
        let (t, p) = (10f64.powf(log_t), 10f64.powf(log_p));
        let root = [RootChoice::LowestGibbs, RootChoice::Liquid, RootChoice::Vapor][root as usize];
        for m in all_models(&ids) {
            match State::at_tp(m.as_ref(), t, p, &x, root) {
                Ok(s) => check(&s),
                Err(e) => prop_assert!(!e.to_string().is_empty()),
            }
        }
    }

    #[test]
    fn density_pairs_never_panic_and_are_finite(
        n in 1usize..=6,
        start in 0usize..20,
        raw in prop::collection::vec(0.0f64..1.0, 20),
        log_t in 0.5f64..3.7,
        log_p in 2.0f64..9.0,
        frac in 1e-6f64..1.2,      // density as a fraction of the co-volume limit
    ) {
        let ids: Vec<&str> = (0..n).map(|k| POOL[(start + k) % 20]).collect();
        let x = fractions(n, &raw);
        let (t, p) = (10f64.powf(log_t), 10f64.powf(log_p));
        for m in all_models(&ids) {
            let limit = m.max_density(&x);
            let rho = if limit.is_finite() { frac * limit } else { frac * 5e4 };
            for r in [State::at_trho(m.as_ref(), t, rho, &x), State::at_prho(m.as_ref(), p, rho, &x)] {
                match r {
                    Ok(s) => check(&s),
                    Err(e) => prop_assert!(!e.to_string().is_empty()),
                }
            }
        }
    }

    #[test]
    fn near_critical_states_of_pure_fluids(
        k in 0usize..20,
        tr in 0.98f64..1.02,
        pr in 0.95f64..1.05,
    ) {
        let id = POOL[k];
        let c = fluids::find(id).unwrap();
        for m in all_models(&[id]) {
            match State::at_tp(m.as_ref(), tr * c.tc_k, pr * c.pc_pa, &[1.0], RootChoice::LowestGibbs) {
                Ok(s) => check(&s),
                Err(e) => prop_assert!(!e.to_string().is_empty()),
            }
        }
    }
}

/// Every model id through the command layer's model registry, pure and mixed.
fn registry_models(ids: &[&str], fractions: &[f64]) -> Vec<zfactor::models::BuiltModel> {
    let text: Vec<String> = ids
        .iter()
        .zip(fractions)
        .map(|(id, x)| format!("{id}={x}"))
        .collect();
    let feed = zfactor::feed::parse_mix(&text.join(","), zfactor::cli::Basis::Mole, true)
        .expect("pool components");
    zfactor::models::ALL_IDS
        .iter()
        .filter(|id| zfactor::models::applies(id, &feed))
        .filter_map(|id| zfactor::models::build(id, &feed).ok())
        .collect()
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 150, .. ProptestConfig::default() })]

    #[test]
    fn every_registered_model_answers_or_fails_cleanly(
        n in 1usize..=4,
        start in 0usize..20,
        raw in prop::collection::vec(0.0f64..1.0, 20),
        log_t in 1.5f64..3.4,
        log_p in 2.0f64..8.5,
    ) {
        let ids: Vec<&str> = (0..n).map(|k| POOL[(start + k) % 20]).collect();
        let x = fractions(n, &raw);
        let (t, p) = (10f64.powf(log_t), 10f64.powf(log_p));
        for m in registry_models(&ids, &x) {
            let feed_x: Vec<f64> = {
                let s: f64 = x.iter().sum();
                x.iter().map(|v| v / s).collect()
            };
            match m.at_tp(t, p, &feed_x, RootChoice::LowestGibbs) {
                Ok(s) => check(&State { props: s.props, phase: s.phase, roots: s.roots }),
                Err(e) => prop_assert!(!e.to_string().is_empty(), "{}", m.id),
            }
        }
    }
}
