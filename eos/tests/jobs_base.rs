//! Base conditions and volume conversions against exact arithmetic and the CODATA molar
//! volume of the ideal gas.

mod common;

use approx::assert_relative_eq;
use common::comp;
use eos::cubic::{Cubic, CubicKind};
use eos::ideal::IdealGas;
use eos::jobs::base_conditions::{equivalents, molar_volume, BaseConditions, NAMED};
use eos::state::{RootChoice, State};

#[test]
fn named_conditions_are_the_stated_values() {
    // 60 degF = 519.67 R x 5/9 K; 1 psi = 6894.757293168 Pa (NIST SP 811, appendix B).
    let b = BaseConditions::named("60degF-14.73psia").unwrap();
    assert_relative_eq!(b.t, 288.705_555_555_555_5, max_relative = 1e-15);
    assert_relative_eq!(b.p, 14.73 * 6_894.757_293_168, max_relative = 1e-12);
    assert_eq!(BaseConditions::named("normal").unwrap().id, "0degC");
    assert_eq!(BaseConditions::named("ISO").unwrap().id, "15degC");
    assert!(BaseConditions::named("25degC").is_none());
    assert_eq!(NAMED.len(), 5);
}

#[test]
fn ideal_gas_molar_volume_is_the_codata_value() {
    // CODATA 2018: molar volume of the ideal gas at 273.15 K, 101.325 kPa,
    // V_m = 22.413 969 54... L/mol (exact digits of R T / p with the exact R).
    let m = IdealGas::new(&[comp("methane")]);
    let (v, _) = molar_volume(&m, 273.15, 101_325.0, &[1.0]).unwrap();
    assert_relative_eq!(v, 22.413_969_54e-3, max_relative = 1e-9);
}

#[test]
fn ideal_gas_conversions_between_bases_are_exact_ratios() {
    // V2/V1 = (T2/P2)/(T1/P1) for the ideal gas (exact arithmetic).
    let m = IdealGas::new(&[comp("methane")]);
    let conds: Vec<(f64, f64)> = NAMED.iter().map(|b| (b.t, b.p)).collect();
    let e = equivalents(&m, 1000.0, &[1.0], &conds).unwrap();
    for (i, a) in NAMED.iter().enumerate() {
        for (j, b) in NAMED.iter().enumerate() {
            let ratio = (b.t / b.p) / (a.t / a.p);
            assert_relative_eq!(e.volumes[j] / e.volumes[i], ratio, max_relative = 1e-14);
        }
    }
    // 0 degC against 15 degC at one pressure: 273.15/288.15.
    assert_relative_eq!(
        e.volumes[0] / e.volumes[1],
        273.15 / 288.15,
        max_relative = 1e-15
    );
}

#[test]
fn real_gas_volumes_use_z_at_each_condition() {
    // V = n Z R T / P with Z from the single-phase state at that condition.
    let m = Cubic::new(CubicKind::Pr76, &[comp("ethane")], None).unwrap();
    let conds = [(288.15, 101_325.0), (300.0, 50e5)];
    let e = equivalents(&m, 10.0, &[1.0], &conds).unwrap();
    for (k, &(t, p)) in conds.iter().enumerate() {
        let z = State::at_tp(&m, t, p, &[1.0], RootChoice::LowestGibbs)
            .unwrap()
            .props
            .z;
        assert_relative_eq!(e.z[k], z, max_relative = 1e-14);
        assert_relative_eq!(
            e.volumes[k],
            10.0 * z * eos::constants::R * t / p,
            max_relative = 1e-12
        );
    }
    assert!(equivalents(&m, -1.0, &[1.0], &conds).is_err());
}
