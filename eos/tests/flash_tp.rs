//! (T, P) flash and stability test, checked by the conditions of equilibrium themselves.

mod common;

use common::{demo_gas, pr_model};
use eos::equilibrium::{flash, stability, FlashResult};
use eos::{Error, Model};

/// Equilibrium conditions (M. L. Michelsen, Fluid Phase Equilib. 9 (1982) 21): equal
/// fugacity of every component in both phases, recomputed here with the model's own ln phi
/// at the reported densities (not by the solver); both densities are roots of the same
/// pressure; material balance.
fn check_equilibrium(model: &dyn Model, z: &[f64], r: &flash::TwoPhase) {
    let n = z.len();
    let (mut ll, mut lv) = (vec![0.0; n], vec![0.0; n]);
    common::ln_phi_at(model, r.t, r.p, r.rho_l, &r.x, &mut ll);
    common::ln_phi_at(model, r.t, r.p, r.rho_v, &r.y, &mut lv);
    let pl = r.rho_l * eos::constants::R * r.t * model.residual(r.t, r.rho_l, &r.x).z();
    let pv = r.rho_v * eos::constants::R * r.t * model.residual(r.t, r.rho_v, &r.y).z();
    assert!((pl / r.p - 1.0).abs() < 1e-9, "liquid pressure {pl}");
    assert!((pv / r.p - 1.0).abs() < 1e-9, "vapour pressure {pv}");
    for i in 0..n {
        if z[i] > 0.0 {
            // ln f = ln x + ln phi + ln P; ln P cancels.
            let fl = r.x[i].ln() + ll[i];
            let fv = r.y[i].ln() + lv[i];
            assert!(
                (fl - fv).abs() < 1e-10,
                "component {i}: ln f differ by {:e}",
                fl - fv
            );
        }
        let mb = z[i] - (1.0 - r.vapor_fraction) * r.x[i] - r.vapor_fraction * r.y[i];
        assert!(mb.abs() < 1e-12, "material balance of {i}: {mb:e}");
    }
    assert!((r.x.iter().sum::<f64>() - 1.0).abs() < 1e-12);
    assert!((r.y.iter().sum::<f64>() - 1.0).abs() < 1e-12);
    assert!(r.rho_l > r.rho_v);
}

#[test]
fn demo_gas_two_phase_points_satisfy_equilibrium() {
    let (names, z) = demo_gas();
    let m = pr_model(&names);
    let mut seen = 0;
    for &(t, p) in &[
        (250.0, 50e5),
        (220.0, 30e5),
        (200.0, 20e5),
        (270.0, 60e5),
        (190.0, 60e5),
    ] {
        match flash::tp(&m, t, p, &z).unwrap() {
            FlashResult::TwoPhase(r) => {
                check_equilibrium(&m, &z, &r);
                // The tangent-plane condition at equilibrium: each phase is itself stable
                // (Michelsen 1982, part I).
                for ph in [&r.x, &r.y] {
                    let s = stability::test(&m, t, p, ph).unwrap();
                    assert!(s.stable, "phase at {t} K {p} Pa unstable, tm {}", s.tm);
                }
                seen += 1;
            }
            FlashResult::SinglePhase(s) => {
                let st = stability::test(&m, t, p, &z).unwrap();
                assert!(st.stable, "single phase {s:?} but unstable");
            }
        }
    }
    assert!(seen >= 3, "only {seen} two-phase points");
}

/// A binary well inside its two-phase region, and the Gibbs energy of the split below that
/// of the homogeneous feed (the definition of instability).
#[test]
fn binary_split_lowers_gibbs_energy() {
    let names = ["methane", "n-butane"];
    let m = pr_model(&names);
    let z = [0.5, 0.5];
    let (t, p) = (300.0, 50e5);
    let FlashResult::TwoPhase(r) = flash::tp(&m, t, p, &z).unwrap() else {
        panic!("expected two phases");
    };
    check_equilibrium(&m, &z, &r);
    let g = |x: &[f64], rho: f64| {
        let mut lp = [0.0; 2];
        m.ln_phi(t, rho, x, &mut lp);
        x.iter()
            .zip(lp)
            .filter(|(xi, _)| **xi > 0.0)
            .map(|(xi, l)| xi * (xi.ln() + l))
            .sum::<f64>()
    };
    let feed = stability::test(&m, t, p, &z).unwrap();
    assert!(!feed.stable && feed.tm < 0.0);
    let g_split = (1.0 - r.vapor_fraction) * g(&r.x, r.rho_l) + r.vapor_fraction * g(&r.y, r.rho_v);
    let g_feed = g(&z, feed.feed_rho);
    assert!(g_split < g_feed - 1e-6, "{g_split} vs {g_feed}");
}

#[test]
fn supercritical_and_low_pressure_feeds_are_single_phase() {
    let (names, z) = demo_gas();
    let m = pr_model(&names);
    for &(t, p) in &[(400.0, 100e5), (300.0, 1e5), (350.0, 200e5)] {
        let r = flash::tp(&m, t, p, &z).unwrap();
        assert!(!r.is_two_phase(), "{t} K {p} Pa: {r:?}");
        assert!(stability::test(&m, t, p, &z).unwrap().stable);
    }
}

/// A component absent from the feed changes nothing: the flash of the three-component model
/// with z3 = 0 equals the flash of the binary (model consistency).
#[test]
fn absent_component_is_harmless() {
    let m3 = pr_model(&["methane", "n-butane", "n-octane"]);
    let m2 = pr_model(&["methane", "n-butane"]);
    let (t, p) = (300.0, 50e5);
    let (FlashResult::TwoPhase(a), FlashResult::TwoPhase(b)) = (
        flash::tp(&m3, t, p, &[0.5, 0.5, 0.0]).unwrap(),
        flash::tp(&m2, t, p, &[0.5, 0.5]).unwrap(),
    ) else {
        panic!("expected two phases");
    };
    assert!((a.vapor_fraction - b.vapor_fraction).abs() < 1e-9);
    assert!((a.x[0] - b.x[0]).abs() < 1e-9 && a.x[2] == 0.0 && a.y[2] == 0.0);
}

#[test]
fn bad_input_is_refused() {
    let m = pr_model(&["methane", "n-butane"]);
    for (t, p, z) in [
        (300.0, 50e5, vec![0.5, 0.6]),
        (-1.0, 50e5, vec![0.5, 0.5]),
        (300.0, f64::NAN, vec![0.5, 0.5]),
        (300.0, 50e5, vec![1.0]),
        (300.0, 50e5, vec![1.5, -0.5]),
    ] {
        assert!(matches!(
            flash::tp(&m, t, p, &z),
            Err(Error::InvalidInput { .. })
        ));
        assert!(matches!(
            stability::test(&m, t, p, &z),
            Err(Error::InvalidInput { .. })
        ));
    }
}

/// A pure fluid through the mixture path: below Psat the vapour root, above it the liquid
/// root, always one phase (a pure fluid splits only at P = Psat exactly).
#[test]
fn pure_fluid_flash_picks_the_stable_root() {
    let m = pr_model(&["propane"]);
    let s = eos::equilibrium::saturation::pressure(&m, 300.0).unwrap();
    for (p, want) in [(0.9 * s.p, s.rho_v()), (1.1 * s.p, s.rho_l())] {
        let FlashResult::SinglePhase(r) = flash::tp(&m, 300.0, p, &[1.0]).unwrap() else {
            panic!("pure fluid split");
        };
        assert!((r.rho / want - 1.0).abs() < 0.2, "{} vs {want}", r.rho);
    }
}
