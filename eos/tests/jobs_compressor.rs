//! Compressor stage against the constant-cp ideal gas (exact closed forms), the energy
//! balance along the computed path, Schultz's f = 1 for the ideal gas, and IAPWS-95 steam
//! computed independently through the formulation's own (T, P) properties.

mod common;

use approx::assert_relative_eq;
use common::comp;
use eos::cubic::{Cubic, CubicKind};
use eos::ideal::IdealGas;
use eos::jobs::compressor::{stage, Efficiency};

/// Nitrogen as a constant-cp ideal gas, cp = 3.5 R, k = 1.4 (the default cp of a test
/// component).
fn n2_ideal() -> IdealGas {
    IdealGas::new(&[comp("nitrogen")])
}

#[test]
fn isentropic_discharge_of_a_constant_cp_ideal_gas() {
    // T2s = T1 (P2/P1)^((k-1)/k); with eta_s, T2 = T1 + (T2s - T1)/eta_s since dh = cp dT
    // (exact for the constant-cp ideal gas).
    let m = n2_ideal();
    let (t1, p1, p2) = (300.0, 1e5, 4e5);
    let t2s = t1 * 4f64.powf(0.4 / 1.4);
    let s = stage(&m, p1, t1, p2, &[1.0], Efficiency::Isentropic(1.0)).unwrap();
    assert_relative_eq!(s.discharge.t, t2s, max_relative = 1e-10);
    let s = stage(&m, p1, t1, p2, &[1.0], Efficiency::Isentropic(0.8)).unwrap();
    assert_relative_eq!(s.discharge.t, t1 + (t2s - t1) / 0.8, max_relative = 1e-10);
    // Specific work = cp (T2 - T1) with cp = 3.5 R / M.
    let cp = 3.5 * eos::constants::R / 0.028_013_4;
    assert_relative_eq!(s.specific_work, cp * (t2s - t1) / 0.8, max_relative = 1e-4);
    // The ideal-gas exponent is cp/cv = 1.4 and both real-gas exponents equal it.
    assert_relative_eq!(s.exponents_suction.ideal_k, 1.4, max_relative = 1e-12);
    assert_relative_eq!(s.exponents_suction.volume_k, 1.4, max_relative = 1e-12);
    assert_relative_eq!(s.exponents_suction.temperature_k, 1.4, max_relative = 1e-12);
}

#[test]
fn polytropic_path_of_a_constant_cp_ideal_gas() {
    // dh = v dP / eta_p with h = cp T, v = R T / P: T2 = T1 (P2/P1)^(R/(cp eta_p))
    // = T1 (P2/P1)^((k-1)/(k eta_p)); the path is P v^n = const, so Schultz's f = 1 and his
    // head n/(n-1) (P2 v2 - P1 v1) is the exact integral of v dP.
    let m = n2_ideal();
    let (t1, p1, p2, e) = (300.0, 1e5, 6e5, 0.78);
    let s = stage(&m, p1, t1, p2, &[1.0], Efficiency::Polytropic(e)).unwrap();
    let t2 = t1 * 6f64.powf(0.4 / 1.4 / e);
    assert_relative_eq!(s.discharge.t, t2, max_relative = 1e-9);
    assert_relative_eq!(s.schultz.f, 1.0, max_relative = 1e-12);
    assert_relative_eq!(s.schultz.discharge.t, t2, max_relative = 1e-9);
    assert!(s.head_difference.abs() < 1e-8, "{}", s.head_difference);
}

#[test]
fn head_equals_the_enthalpy_rise_along_the_real_gas_path() {
    // First law along the polytropic path: integral v dP = eta_p (h2 - h1). The quadrature
    // (Simpson over the path points) is independent of the Runge-Kutta integration of h.
    let comps = [comp("methane"), comp("ethane"), comp("propane")];
    let m = Cubic::new(CubicKind::Pr76, &comps, None).unwrap();
    let x = [0.88, 0.08, 0.04];
    let s = stage(&m, 30e5, 300.0, 90e5, &x, Efficiency::Polytropic(0.8)).unwrap();
    let dh = s.specific_work;
    assert_relative_eq!(s.polytropic_head_path, 0.8 * dh, max_relative = 1e-12);
    assert_relative_eq!(s.polytropic_head_quadrature, 0.8 * dh, max_relative = 1e-6);
    // The isentropic discharge state holds the suction entropy.
    assert!((s.isentropic_discharge.s - s.suction.s).abs() < 1e-9);
    // Schultz and the path differ little for a gas like this (his correction exists for
    // exactly this), but not by nothing.
    assert!(s.head_difference.abs() < 0.01, "{}", s.head_difference);
}

#[test]
fn isentropic_efficiency_input_derives_the_polytropic_efficiency_through_the_same_end() {
    // With eta_s given, the path-integrated polytropic efficiency is the one whose path ends
    // at h2; it exceeds eta_s for compression (the reheat effect).
    let m = Cubic::new(CubicKind::Pr76, &[comp("methane")], None).unwrap();
    let s = stage(&m, 20e5, 290.0, 60e5, &[1.0], Efficiency::Isentropic(0.75)).unwrap();
    assert!(s.polytropic_efficiency > 0.75 && s.polytropic_efficiency < 1.0);
    assert_relative_eq!(
        s.polytropic_head_path,
        s.polytropic_efficiency * s.specific_work,
        max_relative = 1e-9
    );
    assert_relative_eq!(
        s.polytropic_head_quadrature,
        s.polytropic_head_path,
        max_relative = 1e-6
    );
}

#[test]
fn steam_isentropic_discharge_matches_iapws95_computed_independently() {
    // IAPWS-95 (Wagner and Pruss 2002): superheated steam 2 bar, 200 degC compressed
    // isentropically to 8 bar. Independently: bisection on T of the formulation's own
    // s(T, 8 bar) = s(473.15 K, 2 bar), through HelmholtzFluid::properties_tp (its own
    // conventions; only differences are compared).
    let w = eos::helmholtz::reference_for("water").unwrap();
    let s1 = w.properties_tp(473.15, 2e5).unwrap();
    let (mut lo, mut hi) = (473.15, 900.0);
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if w.properties_tp(mid, 8e5).unwrap().s < s1.s {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    let t2s = 0.5 * (lo + hi);
    let h2s = w.properties_tp(t2s, 8e5).unwrap().h;
    let st = stage(&w, 2e5, 473.15, 8e5, &[1.0], Efficiency::Isentropic(1.0)).unwrap();
    assert_relative_eq!(st.isentropic_discharge.t, t2s, max_relative = 1e-9);
    let m = s1.molar_mass;
    assert_relative_eq!(st.isentropic_head, (h2s - s1.h) / m, max_relative = 1e-8);
}

#[test]
fn bad_input_is_refused() {
    let m = n2_ideal();
    assert!(stage(&m, 5e5, 300.0, 4e5, &[1.0], Efficiency::Isentropic(0.8)).is_err());
    assert!(stage(&m, 5e5, 300.0, 5e5, &[1.0], Efficiency::Isentropic(0.8)).is_err());
    for e in [0.0, -0.2, 1.01, f64::NAN] {
        assert!(stage(&m, 1e5, 300.0, 4e5, &[1.0], Efficiency::Polytropic(e)).is_err());
        assert!(stage(&m, 1e5, 300.0, 4e5, &[1.0], Efficiency::Isentropic(e)).is_err());
    }
}
