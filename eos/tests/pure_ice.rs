//! Water below its triple point: the sublimation and melting pressures of IAPWS R14-08(2011)
//! (Wagner, Riethmann, Feistel & Harvey, J. Phys. Chem. Ref. Data 40 (2011) 043103) and the
//! refusal of states where ice is stable.

use eos::helmholtz::reference_for;
use eos::phase::Phase;
use eos::pure::ice::{melting_pressure_ih, sublimation_pressure};
use eos::pure::{state, PureError, Spec};

fn rel(a: f64, b: f64) -> f64 {
    (a / b - 1.0).abs()
}

#[test]
fn both_curves_meet_at_the_triple_point() {
    // IAPWS R14-08: T_t = 273.16 K, p_t = 611.657 Pa; each equation reduces to p_t at theta = 1
    // (the sublimation coefficients a_i sum to zero).
    let s = sublimation_pressure(273.16).unwrap();
    let m = melting_pressure_ih(273.16).unwrap();
    assert!(rel(s, 611.657) < 1e-12, "{s}");
    assert!(rel(m, 611.657) < 1e-12, "{m}");
}

#[test]
fn check_values_of_the_release() {
    // From memory of IAPWS R14-08 Table 3 (check values): p_subl(230 K) = 8.94735e-6 MPa,
    // p_melt,Ih(260 K) = 138.268 MPa; printed to 6 digits, so held to half a unit of the last.
    let s = sublimation_pressure(230.0).unwrap();
    assert!((s - 8.94735).abs() <= 0.5e-5, "{s}");
    let m = melting_pressure_ih(260.0).unwrap();
    assert!((m / 1e6 - 138.268).abs() <= 0.5e-3, "{m}");
    // From memory of IAPWS R14-08: the ice Ih - ice III - liquid triple point is at
    // 251.165 K, 208.566 MPa, the lower end of the ice Ih melting curve.
    let m = melting_pressure_ih(251.165).unwrap();
    assert!((m / 1e6 - 208.566).abs() <= 2e-3, "{m}");
}

#[test]
fn rough_facts() {
    // From memory of the release's check table as quoted in the task: about 76 Pa at 250 K.
    let s = sublimation_pressure(250.0).unwrap();
    assert!((s - 76.0).abs() < 0.5, "{s}");
    // Melting pressure of the order of 100 MPa a little below 265 K (from memory: ice Ih melts
    // near -9 degC under 100 MPa): 100 MPa is crossed between 262 K and 266 K.
    assert!(melting_pressure_ih(262.0).unwrap() > 100e6);
    assert!(melting_pressure_ih(266.0).unwrap() < 100e6);
}

#[test]
fn out_of_range_is_refused() {
    assert!(matches!(
        sublimation_pressure(40.0),
        Err(PureError::OutOfRange { .. })
    ));
    assert!(matches!(
        melting_pressure_ih(250.0),
        Err(PureError::OutOfRange { .. })
    ));
    assert!(matches!(
        melting_pressure_ih(274.0),
        Err(PureError::OutOfRange { .. })
    ));
    assert!(sublimation_pressure(f64::NAN).is_err());
}

#[test]
fn iapws95_below_the_triple_point() {
    let water = reference_for("water").unwrap();
    // 260 K, 1 bar: between the sublimation (~196 Pa) and melting (~138 MPa) pressures: ice.
    match state(&water, Spec::Tp { t: 260.0, p: 1e5 }) {
        Err(PureError::BelowTriplePoint {
            sublimation_pa,
            melting_pa: Some(m),
            ..
        }) => {
            assert!(rel(sublimation_pa, sublimation_pressure(260.0).unwrap()) < 1e-15);
            assert!(rel(m, 138.268e6) < 1e-5);
        }
        other => panic!("expected the ice refusal, got {other:?}"),
    }
    // Above the melting pressure the liquid is stable, below the sublimation pressure the
    // vapour: both are fluid states of IAPWS-95 (valid from the melting line, R6-95(2018)).
    let liq = state(&water, Spec::Tp { t: 260.0, p: 150e6 }).unwrap();
    assert_eq!(liq.phase, Phase::Liquid);
    let vap = state(&water, Spec::Tp { t: 260.0, p: 100.0 }).unwrap();
    assert_eq!(vap.phase, Phase::Vapor);
    // A quality below the triple point has no saturation state to refer to.
    assert!(matches!(
        state(&water, Spec::Tx { t: 260.0, x: 0.5 }),
        Err(PureError::NoSaturation { .. })
    ));
}
