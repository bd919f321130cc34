//! Processes between states against the constant-cp ideal gas (exact first-law results),
//! an independent integration of the Joule-Thomson coefficient, and IAPWS-95 steam through
//! its own (T, P) properties.

mod common;

use approx::assert_relative_eq;
use common::comp;
use eos::constants::R;
use eos::cubic::{Cubic, CubicKind};
use eos::ideal::IdealGas;
use eos::jobs::process::{run, End, Path};
use eos::phase::Phase;
use eos::state::{RootChoice, State};

/// Nitrogen as a constant-cp ideal gas (cp = 3.5 R, cv = 2.5 R).
fn n2() -> (IdealGas, f64) {
    (IdealGas::new(&[comp("nitrogen")]), 0.028_013_4)
}

#[test]
fn ideal_gas_paths_give_the_textbook_heat_and_work() {
    // First law for the constant-cp ideal gas (any thermodynamics text):
    // isothermal q = w = R T ln(P1/P2); isochoric q = cv dT, w = 0; isobaric q = cp dT,
    // w = R dT; isentropic q = 0, w = -cv dT with T2 = T1 (P2/P1)^((k-1)/k);
    // isenthalpic dT = 0.
    let (m, mm) = n2();
    let x = [1.0];
    let p = run(&m, 300.0, 10e5, &x, Path::Isothermal, End::Pressure(2e5)).unwrap();
    let q = R * 300.0 * 5f64.ln() / mm;
    assert_relative_eq!(p.heat, q, max_relative = 1e-10);
    assert_relative_eq!(p.work, q, max_relative = 1e-10);
    assert!(p.du.abs() < 1e-9 * q);
    let p = run(
        &m,
        300.0,
        10e5,
        &x,
        Path::Isochoric,
        End::Temperature(400.0),
    )
    .unwrap();
    assert_relative_eq!(p.heat, 2.5 * R * 100.0 / mm, max_relative = 1e-10);
    assert_relative_eq!(p.end.p, 10e5 * 400.0 / 300.0, max_relative = 1e-12);
    let p = run(&m, 300.0, 10e5, &x, Path::Isochoric, End::Pressure(5e5)).unwrap();
    assert_relative_eq!(p.end.t, 150.0, max_relative = 1e-10);
    let p = run(&m, 300.0, 10e5, &x, Path::Isobaric, End::Temperature(350.0)).unwrap();
    assert_relative_eq!(p.heat, 3.5 * R * 50.0 / mm, max_relative = 1e-10);
    assert_relative_eq!(p.work, R * 50.0 / mm, max_relative = 1e-10);
    let p = run(&m, 300.0, 10e5, &x, Path::Isentropic, End::Pressure(1e5)).unwrap();
    let t2 = 300.0 * 0.1f64.powf(0.4 / 1.4);
    assert_relative_eq!(p.end.t, t2, max_relative = 1e-10);
    assert_relative_eq!(p.work, -2.5 * R * (t2 - 300.0) / mm, max_relative = 1e-9);
    assert!(p.ds.abs() < 1e-9);
    let p = run(&m, 300.0, 10e5, &x, Path::Isenthalpic, End::Pressure(1e5)).unwrap();
    assert!(p.dt.abs() < 1e-9);
}

#[test]
fn throttling_matches_an_integration_of_the_joule_thomson_coefficient() {
    // dT/dP at constant h is mu_JT; integrated by Runge-Kutta from the model's own mu_JT
    // (an identity of the property layer); the library solves h(T2, P2) = h1 instead.
    let m = Cubic::new(CubicKind::Pr76, &[comp("methane")], None).unwrap();
    let (t1, p1, p2) = (300.0, 100e5, 10e5);
    let r = run(&m, t1, p1, &[1.0], Path::Isenthalpic, End::Pressure(p2)).unwrap();
    assert!(r.dh.abs() < 1e-9 * R * t1);
    let mu = |p: f64, t: f64| {
        State::at_tp(&m, t, p, &[1.0], RootChoice::Vapor)
            .unwrap()
            .props
            .jt
            .unwrap()
    };
    let n = 400;
    let dp = (p2 - p1) / n as f64;
    let (mut p, mut t) = (p1, t1);
    for _ in 0..n {
        let k1 = mu(p, t);
        let k2 = mu(p + dp / 2.0, t + dp / 2.0 * k1);
        let k3 = mu(p + dp / 2.0, t + dp / 2.0 * k2);
        let k4 = mu(p + dp, t + dp * k3);
        t += dp / 6.0 * (k1 + 2.0 * k2 + 2.0 * k3 + k4);
        p += dp;
    }
    assert_relative_eq!(r.end.t, t, max_relative = 1e-8);
    assert!(
        r.dt < -20.0,
        "methane cools on throttling from 100 bar: {}",
        r.dt
    );
}

#[test]
fn steam_throttle_and_expansion_match_iapws95_computed_independently() {
    // IAPWS-95 (Wagner and Pruss 2002): throttle steam from 30 bar, 300 degC to 1 bar. The
    // end temperature from bisection on the formulation's own h(T, 1 bar).
    let w = eos::helmholtz::reference_for("water").unwrap();
    let a = w.properties_tp(573.15, 30e5).unwrap();
    let (mut lo, mut hi) = (380.0, 573.15);
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if w.properties_tp(mid, 1e5).unwrap().h < a.h {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    let r = run(
        &w,
        573.15,
        30e5,
        &[1.0],
        Path::Isenthalpic,
        End::Pressure(1e5),
    )
    .unwrap();
    assert_relative_eq!(r.end.t, 0.5 * (lo + hi), max_relative = 1e-9);
    // Isentropic expansion of the same steam to 0.5 bar ends wet (in the dome): the quality
    // from the formulation's saturation states and the lever rule on entropy.
    let r = run(
        &w,
        573.15,
        30e5,
        &[1.0],
        Path::Isentropic,
        End::Pressure(0.5e5),
    )
    .unwrap();
    assert_eq!(r.end.phase, Phase::TwoPhase);
    let sat = w.saturation_p(0.5e5).unwrap();
    let sl = w.properties(sat.t, sat.rho_liq).unwrap().s;
    let sv = w.properties(sat.t, sat.rho_vap).unwrap().s;
    let q = (a.s - sl) / (sv - sl);
    let got = r.end.split.as_ref().unwrap().vapor_fraction;
    assert_relative_eq!(got, q, max_relative = 1e-7);
    assert!(r.ds.abs() < 1e-9);
}

#[test]
fn an_end_condition_that_does_not_fit_the_path_is_refused() {
    let (m, _) = n2();
    assert!(run(&m, 300.0, 1e5, &[1.0], Path::Isobaric, End::Pressure(2e5)).is_err());
    assert!(run(
        &m,
        300.0,
        1e5,
        &[1.0],
        Path::Isentropic,
        End::Temperature(200.0)
    )
    .is_err());
    assert!(run(
        &m,
        300.0,
        1e5,
        &[1.0],
        Path::Isothermal,
        End::Pressure(-1.0)
    )
    .is_err());
}
