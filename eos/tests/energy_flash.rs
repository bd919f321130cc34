//! (P, h) and (P, s) flashes invert the (T, P) flash: an identity of the state function.

mod common;

use common::{demo_gas, pr_model};
use eos::equilibrium::flash;

#[test]
fn ph_and_ps_recover_the_temperature() {
    let (names, z) = demo_gas();
    let m = pr_model(&names);
    // One two-phase and two single-phase states.
    for &(t, p) in &[(230.0, 40e5), (320.0, 80e5), (180.0, 5e5)] {
        let f = flash::tp(&m, t, p, &z).unwrap();
        let h = flash::enthalpy(&m, &f, &z);
        let s = flash::entropy(&m, &f, &z);
        let a = flash::ph(&m, p, h, &z).unwrap();
        let b = flash::ps(&m, p, s, &z).unwrap();
        assert!((a.t / t - 1.0).abs() < 1e-9, "ph at {t} K: {}", a.t);
        assert!((b.t / t - 1.0).abs() < 1e-9, "ps at {t} K: {}", b.t);
        assert_eq!(a.flash.is_two_phase(), f.is_two_phase());
    }
}
