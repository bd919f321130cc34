//! Natural-gas Z from gravity: Sutton/Standing, Wichert-Aziz, Dranchuk-Abou-Kassem,
//! Hall-Yarborough.

use eos::gas_gravity::{
    dak, hall_yarborough, pseudo_critical, wichert_aziz, z_tp, GasSpec, GravityCorrelation,
    PseudoCriticalPoint, ZCorrelation,
};
use eos::Error;

#[test]
fn dak_and_hall_yarborough_agree_over_their_common_range() {
    // Both fit the Standing-Katz chart; each is published with an average absolute error
    // of about half a percent (from memory of the two papers). Expectation set beforehand:
    // the two agree within 2 % everywhere on 1.2 <= Tpr <= 3, 0.2 <= Ppr <= 15.
    let mut worst: f64 = 0.0;
    for tpr in [1.2, 1.3, 1.4, 1.6, 1.8, 2.0, 2.5, 3.0] {
        for ppr in [0.2, 0.5, 1.0, 2.0, 3.0, 4.0, 6.0, 8.0, 10.0, 15.0] {
            let mut w = Vec::new();
            let a = dak::z(tpr, ppr, &mut w).unwrap();
            let b = hall_yarborough::z(tpr, ppr, &mut w).unwrap();
            assert!(w.is_empty(), "inside both ranges: {w:?}");
            let rel = (a - b).abs() / a;
            worst = worst.max(rel);
            assert!(rel <= 0.02, "Tpr {tpr}, Ppr {ppr}: DAK {a:.4}, HY {b:.4}");
        }
    }
    assert!(worst > 0.0);
}

#[test]
fn dilute_gas_tends_to_the_ideal_gas() {
    let mut w = Vec::new();
    for tpr in [1.2, 2.0, 3.0] {
        let a = dak::z(tpr, 1e-6, &mut w).unwrap();
        let b = hall_yarborough::z(tpr, 1e-6, &mut w).unwrap();
        assert!((a - 1.0).abs() < 1e-5 && (b - 1.0).abs() < 1e-5, "{a} {b}");
    }
    // both warn: Ppr is below the fitted range
    assert!(w.iter().any(|w| w.quantity == "Ppr"));
}

#[test]
fn gravity_of_methane_gives_a_pseudo_critical_point_near_methane_critical_point() {
    // Methane (gravity 0.554): Tc = 190.56 K, Pc = 4.599 MPa (from memory of Poling et al.
    // 2001, App. A). A gravity correlation fitted to natural gases should land within 5 %.
    for corr in [GravityCorrelation::Sutton, GravityCorrelation::StandingGas] {
        let mut w = Vec::new();
        let pc = pseudo_critical(0.554, corr, &mut w).unwrap();
        assert!((pc.tpc / 190.56 - 1.0).abs() < 0.05, "{corr:?} {}", pc.tpc);
        assert!((pc.ppc / 45.99e5 - 1.0).abs() < 0.05, "{corr:?} {}", pc.ppc);
    }
}

#[test]
fn published_ranges_raise_warnings_and_impossible_inputs_errors() {
    let mut w = Vec::new();
    // Sutton was fitted from gravity 0.57
    pseudo_critical(0.56, GravityCorrelation::Sutton, &mut w).unwrap();
    assert_eq!(w.len(), 1);
    assert_eq!(w[0].quantity, "gas gravity");
    // below methane or above 2: refused
    for g in [0.5, 2.1, f64::NAN] {
        assert!(matches!(
            pseudo_critical(g, GravityCorrelation::Sutton, &mut w),
            Err(Error::InvalidInput { .. })
        ));
    }
    // DAK below Tpr = 1 at Ppr >= 1
    let mut w = Vec::new();
    dak::z(0.95, 2.0, &mut w).unwrap_or(0.0);
    assert!(w.iter().any(|w| w.quantity == "Tpr"));
    // Wichert-Aziz beyond 54.4 % CO2
    let mut w = Vec::new();
    let pc = PseudoCriticalPoint {
        tpc: 200.0,
        ppc: 4.6e6,
    };
    wichert_aziz::correct(pc, 0.6, 0.0, &mut w).unwrap();
    assert_eq!(w[0].quantity, "CO2 mole fraction");
    assert!(wichert_aziz::correct(pc, 0.7, 0.4, &mut w).is_err());
}

#[test]
fn wichert_aziz_correction_behaves_as_its_formula_requires() {
    // epsilon = 0 without acid gas; with CO2 only (B = 0) P'pc/Ppc = T'pc/Tpc.
    assert!(wichert_aziz::epsilon(0.0, 0.0).abs() < 1e-15);
    let pc = PseudoCriticalPoint {
        tpc: 210.0,
        ppc: 4.6e6,
    };
    let mut w = Vec::new();
    let c = wichert_aziz::correct(pc, 0.2, 0.0, &mut w).unwrap();
    assert!(c.tpc < pc.tpc);
    approx::assert_relative_eq!(c.ppc / pc.ppc, c.tpc / pc.tpc, max_relative = 1e-14);
    // epsilon at A = 0.2, B = 0: 120 (0.2^0.9 - 0.2^1.6) R = 120 (0.23492 - 0.07614) R
    // = 19.05 R = 10.59 K
    approx::assert_abs_diff_eq!(wichert_aziz::epsilon(0.2, 0.0), 10.585, epsilon = 0.01);
}

#[test]
fn one_call_api_reports_its_warnings() {
    let gas = GasSpec {
        gravity: 0.65,
        y_co2: 0.02,
        y_h2s: 0.0,
        y_n2: 0.0,
        pseudo_critical: GravityCorrelation::Sutton,
        z: ZCorrelation::Dak,
    };
    let r = z_tp(&gas, 320.0, 10e6).unwrap();
    assert!(r.warnings.is_empty());
    assert!(r.z > 0.8 && r.z < 0.95, "{}", r.z);
    // a cold state: Tpr below 1 raises a warning, never silently
    let r = z_tp(&gas, 190.0, 10e6);
    match r {
        Ok(r) => assert!(!r.warnings.is_empty()),
        Err(e) => assert!(matches!(
            e,
            Error::NoSolution(_) | Error::NotConverged { .. }
        )),
    }
    assert_eq!(ZCorrelation::HallYarborough.id(), "hy");
}
