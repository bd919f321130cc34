//! Phase envelopes: equilibrium at every point, extremes consistent with the flash, and the
//! pure-fluid limit of a binary.

mod common;
#[path = "support/yardstick.rs"]
mod yardstick;

use common::{demo_gas, pr_model};
use eos::equilibrium::{envelope, flash, saturation, EnvelopeOptions, EnvelopeStop};

#[test]
fn demo_gas_envelope() {
    let (names, z) = demo_gas();
    let m = pr_model(&names);
    let e = envelope::trace(&m, &z, EnvelopeOptions::default()).unwrap();
    assert_eq!(e.stop, EnvelopeStop::Complete);
    let crit = e.critical.expect("critical point passed");
    let (ccb, cct) = (e.cricondenbar, e.cricondentherm);
    println!(
        "demo gas envelope: {} points, {} Newton iterations; critical {:.2} K {:.3} bar; \
         cricondenbar {:.2} K {:.3} bar; cricondentherm {:.2} K {:.3} bar",
        e.points.len(),
        e.iterations,
        crit.t,
        crit.p / 1e5,
        ccb.t,
        ccb.p / 1e5,
        cct.t,
        cct.p / 1e5
    );
    // Equal fugacity at every point (Michelsen 1980 conditions), with the model's ln phi.
    let n = z.len();
    let (mut lf, mut lw) = (vec![0.0; n], vec![0.0; n]);
    for pt in &e.points {
        common::ln_phi_at(&m, pt.t, pt.p, pt.rho_feed, &z, &mut lf);
        common::ln_phi_at(&m, pt.t, pt.p, pt.rho_incipient, &pt.incipient, &mut lw);
        for i in 0..n {
            let d = z[i].ln() + lf[i] - pt.incipient[i].ln() - lw[i];
            assert!(d.abs() < 1e-9, "{} K {} Pa comp {i}: {d:e}", pt.t, pt.p);
        }
        assert!(pt.p <= ccb.p * (1.0 + 1e-9) && pt.t <= cct.t * (1.0 + 1e-9));
    }
    // Dew side first, bubble side after the critical point.
    assert!(e.points[0].vapor_fraction > 0.5);
    assert!(e.points.last().unwrap().vapor_fraction < 0.5);
    assert!(crit.p < ccb.p && crit.t < cct.t);
    // The flash agrees on the extremes: beyond them one phase, just inside two.
    let two = |t: f64, p: f64| flash::tp(&m, t, p, &z).unwrap().is_two_phase();
    assert!(!two(cct.t + 1.0, cct.p));
    assert!(two(cct.t - 2.0, cct.p));
    assert!(!two(ccb.t, ccb.p + 1e5));
    assert!(two(ccb.t, ccb.p - 2e5));
}

/// A binary's envelope closes onto the vapour-pressure curve of the major component as the
/// other vanishes: the bubble curve approaches Psat(T) and the critical point the pure
/// fluid's (pure-fluid limit of the equilibrium conditions).
#[test]
fn binary_envelope_collapses_onto_the_pure_curve() {
    let m = pr_model(&["methane", "ethane"]);
    let pure = pr_model(&["methane"]);
    let tc = 190.56;
    let pc = 45.99e5;
    let (mut last_dev, mut last_crit) = (f64::INFINITY, f64::INFINITY);
    for eps in [0.1, 0.03, 0.01] {
        let e = envelope::trace(&m, &[1.0 - eps, eps], EnvelopeOptions::default()).unwrap();
        assert_eq!(e.stop, EnvelopeStop::Complete, "eps {eps}");
        let c = e.critical.unwrap();
        let crit = (c.t / tc - 1.0).abs().max((c.p / pc - 1.0).abs());
        let mut dev = 0.0_f64;
        for pt in e
            .points
            .iter()
            .filter(|p| p.vapor_fraction < 0.5 && p.t < 0.95 * tc)
        {
            let ps = saturation::pressure(&pure, pt.t).unwrap().p;
            dev = dev.max((pt.p / ps - 1.0).abs());
        }
        println!(
            "eps {eps}: bubble curve within {dev:.2e} of Psat, critical point off by {crit:.2e}"
        );
        // Each step divides eps by about 3; a first-order collapse divides both distances
        // by about as much, so each must at least fall below 0.6 of the previous one.
        assert!(dev < 0.6 * last_dev && crit < 0.6 * last_crit, "eps {eps}");
        (last_dev, last_crit) = (dev, crit);
    }
}

/// The stability test agrees with the envelope, which is found by a different method
/// (Newton continuation of the saturation equations, Michelsen 1980): along isotherms
/// across the envelope of the demo gas and of the yardstick's 10-component gas, a feed 4 %
/// in pressure outside the envelope is stable and 4 % inside is unstable. States within 10 %
/// of the critical pressure or 3 K of the cricondentherm are skipped (there the envelope's
/// straight-line interpolation between traced points is not that accurate).
#[test]
fn stability_test_agrees_with_the_envelope() {
    use eos::equilibrium::stability;
    let (names, z) = demo_gas();
    let cases = [(pr_model(&names), z), yardstick::mix()];
    let mut checked = 0;
    for (m, z) in &cases {
        let e = envelope::trace(m, z, EnvelopeOptions::default()).unwrap();
        assert_eq!(e.stop, EnvelopeStop::Complete);
        let crit = e.critical.expect("critical point passed");
        // Above both ends of the trace, every isotherm crosses it an even number of times.
        let ends = [&e.points[0], &e.points[e.points.len() - 1]];
        let t_min = ends[0].t.max(ends[1].t);
        let t_max = e.cricondentherm.t - 3.0;
        for k in 0..25 {
            let t = t_min + 5.0 + (t_max - t_min - 5.0) * k as f64 / 24.0;
            // Every crossing of the traced envelope with this isotherm, in ln P.
            let mut ps: Vec<f64> = e
                .points
                .windows(2)
                .filter(|w| (w[0].t - t) * (w[1].t - t) <= 0.0 && (w[1].t - w[0].t).abs() > 1e-9)
                .map(|w| {
                    let f = (t - w[0].t) / (w[1].t - w[0].t);
                    (w[0].p.ln() + f * (w[1].p.ln() - w[0].p.ln())).exp()
                })
                .collect();
            ps.sort_by(f64::total_cmp);
            ps.dedup_by(|a, b| (*a / *b - 1.0).abs() < 1e-6);
            assert_eq!(ps.len() % 2, 0, "{t} K: {ps:?}");
            for pair in ps.chunks(2) {
                let (lo, hi) = (pair[0], pair[1]);
                for (p, inside) in [
                    (lo * 0.96, false),
                    (lo * 1.04, true),
                    (hi * 0.96, true),
                    (hi * 1.04, false),
                ] {
                    if (p / crit.p - 1.0).abs() < 0.1 || (inside && lo * 1.04 >= hi * 0.96) {
                        continue;
                    }
                    let s = stability::test(m, t, p, z).unwrap();
                    assert_eq!(s.stable, !inside, "{t} K, {} bar: tm {}", p / 1e5, s.tm);
                    checked += 1;
                }
            }
        }
    }
    println!("stability against the envelope: {checked} states");
    assert!(checked >= 60, "{checked}");
}
