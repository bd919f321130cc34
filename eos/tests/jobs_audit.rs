//! The audit's recomputation and cause tests: Z against the state solver, and each cause
//! against a value planted by exact ideal-gas arithmetic (rho = P M / (R T), CODATA R).

mod common;

use approx::assert_relative_eq;
use common::comp;
use eos::constants::R;
use eos::cubic::{Cubic, CubicKind};
use eos::ideal::IdealGas;
use eos::jobs::audit::{causes, recompute, z_tp, Cause, Quantity, Row};
use eos::jobs::base_conditions::NAMED;
use eos::state::{RootChoice, State};
use eos::Model;

fn row(q: Quantity, t: f64, p: f64) -> Row {
    Row {
        quantity: q,
        t,
        p,
        ambient: 101_325.0,
        entered: vec![1.0],
        mass_basis: false,
        volume: Some(2.0),
        mass: Some(3.0),
        base: NAMED[1],
    }
}

#[test]
fn z_is_the_stable_root_of_the_state_solver() {
    let m = Cubic::new(CubicKind::Pr76, &[comp("propane")], None).unwrap();
    for (t, p) in [(300.0, 5e5), (300.0, 20e5), (400.0, 50e5), (250.0, 1e5)] {
        let z = z_tp(&m, t, p, &[1.0]).unwrap();
        let s = State::at_tp(&m, t, p, &[1.0], RootChoice::LowestGibbs).unwrap();
        assert_relative_eq!(z, s.props.z, max_relative = 1e-12);
    }
}

#[test]
fn ideal_gas_rows_recompute_exactly() {
    let m = IdealGas::new(&[comp("methane")]);
    let mm = m.molar_mass(&[1.0]);
    let (t, p) = (300.0, 40e5);
    let rho = p * mm / (R * t);
    assert_relative_eq!(
        recompute(&m, &row(Quantity::Density, t, p)).unwrap(),
        rho,
        max_relative = 1e-14
    );
    assert_relative_eq!(
        recompute(&m, &row(Quantity::Mass, t, p)).unwrap(),
        2.0 * rho,
        max_relative = 1e-14
    );
    assert_relative_eq!(
        recompute(&m, &row(Quantity::Volume, t, p)).unwrap(),
        3.0 / rho,
        max_relative = 1e-14
    );
    // Standard volume at 15 degC, 1 atm of 2 m3 at (T, P): 2 (P/T)/(Pb/Tb).
    let std = 2.0 * (p / t) / (101_325.0 / 288.15);
    assert_relative_eq!(
        recompute(&m, &row(Quantity::StdVolume, t, p)).unwrap(),
        std,
        max_relative = 1e-14
    );
}

fn reconciling(list: &[eos::jobs::audit::CauseCheck]) -> Vec<Cause> {
    list.iter()
        .filter(|c| c.reconciles)
        .map(|c| c.cause.clone())
        .collect()
}

#[test]
fn each_planted_mistake_is_reconciled_by_its_cause() {
    let m = IdealGas::new(&[comp("methane")]);
    let mm = m.molar_mass(&[1.0]);
    let (t, p) = (288.15, 50e5 + 101_325.0);
    let r = row(Quantity::Density, t, p);
    let tol = 1e-4;
    // Gauge read as absolute: P - P_ambient used.
    let sheet = (p - 101_325.0) * mm / (R * t);
    assert!(reconciling(&causes(&m, &m, &r, sheet, tol)).contains(&Cause::GaugeAsAbsolute));
    // degC read as K.
    let sheet = p * mm / (R * 15.0);
    assert!(reconciling(&causes(&m, &m, &r, sheet, tol)).contains(&Cause::CelsiusAsKelvin));
    // R = 10.731577 (psia ft3/(lbmol R)) used as J/(mol K).
    let sheet = p * mm / (10.731_577 * t);
    let found = reconciling(&causes(&m, &m, &r, sheet, tol));
    assert!(found
        .iter()
        .any(|c| matches!(c, Cause::GasConstant(v, _) if (v - 10.731_577).abs() < 1e-9)));
    // An error of 3 % that no cause explains is left unexplained.
    let sheet = 1.03 * p * mm / (R * t);
    assert!(reconciling(&causes(&m, &m, &r, sheet, tol)).is_empty());
}

#[test]
fn fractions_on_the_wrong_basis_and_a_forced_z_are_found() {
    let comps = [comp("methane"), comp("n-butane")];
    let ig = IdealGas::new(&comps);
    let pr = Cubic::new(CubicKind::Pr76, &comps, None).unwrap();
    let m: Vec<f64> = comps.iter().map(|c| c.molar_mass).collect();
    let (t, p) = (350.0, 10e5);
    let mut r = row(Quantity::Density, t, p);
    r.entered = vec![0.6, 0.4];
    // Declared mass fractions, the sheet used them as mole fractions.
    r.mass_basis = true;
    let sheet = p * (0.6 * m[0] + 0.4 * m[1]) / (R * t);
    assert!(reconciling(&causes(&ig, &ig, &r, sheet, 1e-6)).contains(&Cause::MassAsMoleFractions));
    // Declared mole fractions, the sheet used them as mass fractions.
    r.mass_basis = false;
    let x0 = (0.6 / m[0]) / (0.6 / m[0] + 0.4 / m[1]);
    let sheet = p * (x0 * m[0] + (1.0 - x0) * m[1]) / (R * t);
    assert!(reconciling(&causes(&ig, &ig, &r, sheet, 1e-6)).contains(&Cause::MoleAsMassFractions));
    // A real-gas model against a sheet that assumed Z = 1.
    let sheet = p * (0.6 * m[0] + 0.4 * m[1]) / (R * t);
    assert!(reconciling(&causes(&pr, &ig, &r, sheet, 1e-6)).contains(&Cause::ZForcedToOne));
}

#[test]
fn another_base_is_found_for_standard_volumes() {
    let m = IdealGas::new(&[comp("methane")]);
    let (t, p) = (300.0, 40e5);
    let r = row(Quantity::StdVolume, t, p);
    // Computed at 60 degF and 14.73 psia instead of 15 degC and 1 atm.
    let b = NAMED[4];
    let sheet = 2.0 * (p / t) / (b.p / b.t);
    let found = reconciling(&causes(&m, &m, &r, sheet, 1e-6));
    assert_eq!(found, vec![Cause::BaseCondition("60degF-14.73psia")]);
}
