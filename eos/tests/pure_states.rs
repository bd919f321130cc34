//! Pure-fluid states from any two properties (eos::pure), for every Helmholtz formulation and
//! every cubic: IAPWS-95 saturation (IAPWS R6-95(2018) Table 8), the lever rule, round trips
//! through (P, h), (P, s), (P, v) and (T, v), and the typed refusals.

mod common;

use common::comp;
use eos::cubic::{Cubic, CubicKind};
use eos::helmholtz::{formulation, keys, HelmholtzFluid};
use eos::phase::Phase;
use eos::pure::{state, PureError, PureFluid, Quantity, Spec};

fn rel(a: f64, b: f64) -> f64 {
    (a / b - 1.0).abs()
}

/// Every Helmholtz formulation shipped, and the five cubics for methane, nitrogen and carbon
/// dioxide (constants from memory of Poling et al. (2001), see tests/common).
fn every_model() -> Vec<Box<dyn PureFluid>> {
    let mut out: Vec<Box<dyn PureFluid>> = keys()
        .map(|k| Box::new(HelmholtzFluid::new(formulation(k).unwrap())) as Box<dyn PureFluid>)
        .collect();
    for name in ["methane", "nitrogen", "carbon dioxide"] {
        for kind in CubicKind::ALL {
            out.push(Box::new(Cubic::new(kind, &[comp(name)], None).unwrap()));
        }
    }
    out
}

fn water() -> HelmholtzFluid {
    HelmholtzFluid::new(formulation("water-iapws95").unwrap())
}

#[test]
fn iapws95_table8_through_the_pure_api() {
    // IAPWS R6-95(2018) Table 8 (saturation at 275, 450, 625 K), printed to 9 significant
    // digits; values copied in tests/data/iapws95_check_values.csv. Held to half a unit of the
    // last printed digit.
    let text = include_str!("data/iapws95_check_values.csv");
    let w = water();
    let m = 0.018015268;
    let mut n = 0;
    for line in text.lines().filter(|l| !l.starts_with('#')).skip(1) {
        let f: Vec<&str> = line.split(',').collect();
        if f[1] != "8" {
            continue;
        }
        let t: f64 = f[2].parse().unwrap();
        let printed = f[5];
        let value: f64 = printed.parse().unwrap();
        let liq = state(&w, Spec::Tx { t, x: 0.0 }).unwrap();
        let vap = state(&w, Spec::Tx { t, x: 1.0 }).unwrap();
        assert_eq!(liq.phase, Phase::SaturatedLiquid);
        assert_eq!(vap.phase, Phase::SaturatedVapor);
        let got = match f[4] {
            "p_sat" => liq.p / 1e6,
            "rho_liq" => liq.rho * m,
            "rho_vap" => vap.rho * m,
            "h_liq" => liq.h / m / 1e3,
            "h_vap" => vap.h / m / 1e3,
            "s_liq" => liq.s / m / 1e3,
            "s_vap" => vap.s / m / 1e3,
            q => panic!("unexpected {q}"),
        };
        let (mant, exp) = printed.split_once('e').unwrap_or((printed, "0"));
        let decimals = mant.split_once('.').map_or(0, |(_, d)| d.len() as i32);
        let unit = 10f64.powi(exp.parse::<i32>().unwrap() - decimals);
        assert!(
            (got - value).abs() <= 0.5 * unit,
            "{} at {t} K: {got:.10e} vs {printed}",
            f[4]
        );
        n += 1;
        // The printed saturation pressure gives the temperature back through (P, x): the
        // 9-digit pressure fixes T to about 1e-9 relative (d ln p / d ln T < 30 here).
        if f[4] == "p_sat" {
            let back = state(
                &w,
                Spec::Px {
                    p: value * 1e6,
                    x: 0.5,
                },
            )
            .unwrap();
            assert!(rel(back.t, t) < 3e-8, "{} vs {t}", back.t);
        }
    }
    assert_eq!(n, 21);
}

#[test]
fn quality_ends_are_the_saturated_states() {
    // Identity: x = 0 is the saturated liquid, x = 1 the saturated vapour.
    for f in every_model() {
        let t = 0.8 * f.critical().t;
        let sat = f.saturation_t(t).unwrap();
        let l = state(f.as_ref(), Spec::Tx { t, x: 0.0 }).unwrap();
        let v = state(f.as_ref(), Spec::Tx { t, x: 1.0 }).unwrap();
        for (s, ph) in [(&l, &sat.liquid), (&v, &sat.vapor)] {
            assert!(rel(s.v, ph.molar_volume()) < 1e-15, "{}", f.model_title());
            assert!((s.h - ph.h).abs() <= 1e-12 * ph.h.abs().max(1.0));
            assert!((s.s - ph.s).abs() <= 1e-12 * ph.s.abs().max(1.0));
        }
        assert_eq!(l.phase, Phase::SaturatedLiquid);
        assert_eq!(v.phase, Phase::SaturatedVapor);
    }
}

#[test]
fn lever_rule_round_trips_inside_the_dome() {
    // The lever rule m = (1 - x) m' + x m'' on v, h and s: each of (T, v), (P, v), (P, h),
    // (P, s) gives back the quality it was built from, and T at p gives T back.
    for f in every_model() {
        let name = f.model_title();
        let t = 0.85 * f.critical().t;
        for x in [0.1, 0.5, 0.9] {
            let s = state(f.as_ref(), Spec::Tx { t, x }).unwrap();
            assert_eq!(s.phase, Phase::TwoPhase);
            let sat = s.saturation.unwrap();
            // v, h, s of the mixture are the lever averages
            let lever = |a: f64, b: f64| (1.0 - x) * a + x * b;
            assert!(
                rel(
                    s.v,
                    lever(sat.liquid.molar_volume(), sat.vapor.molar_volume())
                ) < 1e-15
            );
            let specs = [
                Spec::Tv { t, v: s.v },
                Spec::Pv { p: s.p, v: s.v },
                Spec::Ph { p: s.p, h: s.h },
                Spec::Ps { p: s.p, s: s.s },
            ];
            for spec in specs {
                let b = state(f.as_ref(), spec).unwrap();
                assert_eq!(b.phase, Phase::TwoPhase, "{name} {spec:?}");
                let q = b.quality.unwrap();
                assert!((q - x).abs() < 1e-9, "{name} {spec:?}: x = {q} vs {x}");
                assert!(rel(b.t, t) < 1e-9, "{name} {spec:?}: T = {} vs {t}", b.t);
            }
        }
    }
}

/// A liquid, a vapour and a supercritical (T, P) for a model, from its own critical point and
/// vapour pressure.
fn test_states(f: &dyn PureFluid) -> [(f64, f64, Phase); 3] {
    let c = f.critical();
    let tl = (0.7 * c.t).max(f.triple_point().map_or(0.0, |tp| 1.02 * tp.0));
    let tv = 0.8 * c.t;
    let pl = f.saturation_t(tl).unwrap().p;
    let pv = f.saturation_t(tv).unwrap().p;
    [
        (tl, (3.0 * pl).max(pl + 0.3 * c.p), Phase::Liquid),
        (tv, 0.5 * pv, Phase::Vapor),
        (1.5 * c.t, 2.0 * c.p, Phase::Supercritical),
    ]
}

#[test]
fn round_trips_through_h_s_and_v() {
    // (T, P) -> h, s, v -> (P, h), (P, s), (P, v), (T, v): T (and P) come back to 1e-9.
    for f in every_model() {
        let name = f.model_title();
        for (t, p, phase) in test_states(f.as_ref()) {
            let s = state(f.as_ref(), Spec::Tp { t, p }).unwrap();
            assert_eq!(s.phase, phase, "{name} at {t} K, {p} Pa");
            for spec in [
                Spec::Ph { p, h: s.h },
                Spec::Ps { p, s: s.s },
                Spec::Pv { p, v: s.v },
            ] {
                let b = state(f.as_ref(), spec).unwrap();
                assert!(rel(b.t, t) < 1e-9, "{name} {spec:?}: T = {} vs {t}", b.t);
                assert_eq!(b.phase, phase, "{name} {spec:?}");
            }
            let b = state(f.as_ref(), Spec::Tv { t, v: s.v }).unwrap();
            assert!(rel(b.p, p) < 1e-9, "{name} (T, v): p = {} vs {p}", b.p);
            assert_eq!(b.phase, phase);
        }
    }
}

#[test]
fn tp_on_the_saturation_line_is_refused() {
    for f in every_model() {
        let t = 0.75 * f.critical().t;
        let ps = f.saturation_t(t).unwrap().p;
        match state(
            f.as_ref(),
            Spec::Tp {
                t,
                p: ps * (1.0 + 1e-8),
            },
        ) {
            Err(PureError::OnSaturationLine { p_sat, .. }) => assert!(rel(p_sat, ps) < 1e-12),
            other => panic!("{}: {other:?}", f.model_title()),
        }
        let above = state(f.as_ref(), Spec::Tp { t, p: ps * 1.001 }).unwrap();
        let below = state(f.as_ref(), Spec::Tp { t, p: ps * 0.999 }).unwrap();
        assert_eq!(above.phase, Phase::Liquid);
        assert_eq!(below.phase, Phase::Vapor);
    }
}

#[test]
fn ancillary_shortcut_is_inside_its_margin() {
    // The (T, P) path trusts each formulation's vapour-pressure ancillary to the margin it
    // states; here each ancillary is held to a quarter of that margin against the
    // formulation's own full equal-Gibbs solve, from the triple point to 0.99 Tc.
    for k in keys() {
        let f = HelmholtzFluid::new(formulation(k).unwrap());
        let form = f.formulation();
        let mut worst: f64 = 0.0;
        let mut margin_used: f64 = 1.0;
        for i in 0..=40 {
            let t = form.t_triple + (0.99 * form.tc - form.t_triple) * i as f64 / 40.0;
            let Some((est, margin)) = PureFluid::saturation_estimate(&f, t) else {
                continue;
            };
            assert!(margin <= 0.015);
            margin_used = margin;
            let p = PureFluid::saturation_t(&f, t).unwrap().p;
            worst = worst.max(rel(est, p));
        }
        assert!(worst < 0.25 * margin_used, "{k}: worst {worst:e}");
    }
}

#[test]
fn quality_outside_zero_to_one_is_refused() {
    let w = water();
    for x in [-0.1, 1.0 + 1e-12, 2.0, f64::NAN] {
        for spec in [Spec::Tx { t: 400.0, x }, Spec::Px { p: 1e5, x }] {
            assert!(
                matches!(state(&w, spec), Err(PureError::QualityOutOfRange { .. })),
                "{spec:?}"
            );
        }
    }
}

#[test]
fn states_outside_the_range_are_refused() {
    // IAPWS R6-95(2018): valid to 1273 K and 1000 MPa.
    let w = water();
    for spec in [
        Spec::Tp { t: 1300.0, p: 1e5 },
        Spec::Tp { t: 500.0, p: 1.1e9 },
        Spec::Ph { p: 1e5, h: 1e7 },
        Spec::Tv { t: 1500.0, v: 1.0 },
    ] {
        let e = state(&w, spec).unwrap_err();
        assert!(matches!(e, PureError::OutOfRange { .. }), "{spec:?}: {e:?}");
        assert!(e.to_string().contains("1273"), "{e}");
    }
    // No saturation at or above the critical point.
    assert!(matches!(
        state(&w, Spec::Tx { t: 700.0, x: 0.5 }),
        Err(PureError::NoSaturation { .. })
    ));
    assert!(matches!(
        state(&w, Spec::Px { p: 30e6, x: 0.5 }),
        Err(PureError::NoSaturation { .. })
    ));
    // Bad numbers.
    assert!(matches!(
        state(
            &w,
            Spec::Tp {
                t: f64::NAN,
                p: 1e5
            }
        ),
        Err(PureError::InvalidInput { .. })
    ));
    assert!(matches!(
        state(&w, Spec::Tp { t: 300.0, p: -1.0 }),
        Err(PureError::InvalidInput { .. })
    ));
}

#[test]
fn pairs_that_do_not_fix_a_state_are_refused() {
    use Quantity::*;
    assert!(matches!(
        Spec::from_pair((H, 1.0), (S, 1.0)),
        Err(PureError::UnsupportedPair { .. })
    ));
    assert!(matches!(
        Spec::from_pair((T, 300.0), (T, 310.0)),
        Err(PureError::UnsupportedPair { .. })
    ));
    assert_eq!(
        Spec::from_pair((P, 1e5), (T, 300.0)).unwrap(),
        Spec::Tp { t: 300.0, p: 1e5 }
    );
}

#[test]
fn phase_names_around_the_critical_point() {
    // IAPWS-95: Tc = 647.096 K, pc = 22.064 MPa (R6-95(2018)).
    let w = water();
    let sc = state(&w, Spec::Tp { t: 700.0, p: 30e6 }).unwrap();
    assert_eq!(sc.phase, Phase::Supercritical);
    let gas = state(&w, Spec::Tp { t: 700.0, p: 10e6 }).unwrap();
    assert_eq!(gas.phase, Phase::Gas);
    let liq = state(&w, Spec::Tp { t: 600.0, p: 30e6 }).unwrap();
    assert_eq!(liq.phase, Phase::Liquid);
    // Normal boiling point 373.1243 K at 101.325 kPa (from memory of the IAPWS-95 release).
    let nb = state(
        &w,
        Spec::Px {
            p: 101_325.0,
            x: 0.0,
        },
    )
    .unwrap();
    assert!((nb.t - 373.1243).abs() < 2e-4, "{}", nb.t);
}
