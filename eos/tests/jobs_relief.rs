//! Relief inputs: the isentropic exponent against a finite difference along the model's own
//! isentrope, the ideal-gas limit, and the Z-range flag.

mod common;

use approx::assert_relative_eq;
use common::comp;
use eos::cubic::{Cubic, CubicKind};
use eos::ideal::IdealGas;
use eos::jobs::equilibrium_state::at_ps;
use eos::jobs::relief;

#[test]
fn real_gas_exponent_is_minus_v_over_p_dp_dv_along_the_isentrope() {
    // k = -(v/P)(dP/dv)_s = (d ln P / d ln rho)_s (definition), by a central difference of
    // ln P over ln rho between two states of equal entropy found by (P, s) solves.
    let m = Cubic::new(CubicKind::Pr76, &[comp("ethylene")], None).unwrap();
    let (t, p) = (320.0, 60e5);
    let r = relief::at(&m, t, p, &[1.0]).unwrap();
    let s = r.state.s;
    let h = 1e-4;
    let a = at_ps(&m, p * (1.0 + h), s, &[1.0]).unwrap();
    let b = at_ps(&m, p * (1.0 - h), s, &[1.0]).unwrap();
    let k = ((1.0 + h) / (1.0 - h)).ln() / (a.rho / b.rho).ln();
    assert_relative_eq!(r.k_real, k, max_relative = 1e-6);
    assert!(r.z_outside_range, "Z = {}", r.z);
}

#[test]
fn ideal_gas_exponent_is_cp_over_cv() {
    // Constant cp = 3.5 R: k = cp/cv = 1.4 exactly, Z = 1.
    let m = IdealGas::new(&[comp("nitrogen")]);
    let r = relief::at(&m, 300.0, 10e5, &[1.0]).unwrap();
    assert_relative_eq!(r.k_real, 1.4, max_relative = 1e-12);
    assert_relative_eq!(r.k_ideal, 1.4, max_relative = 1e-12);
    assert_relative_eq!(r.z, 1.0, max_relative = 1e-15);
    assert!(!r.z_outside_range);
}

#[test]
fn liquid_relieving_conditions_are_refused() {
    let m = Cubic::new(CubicKind::Pr76, &[comp("propane")], None).unwrap();
    assert!(relief::at(&m, 293.15, 20e5, &[1.0]).is_err());
}
