//! How far IAPWS-IF97 departs from IAPWS-95 over IF97's range (regions 1, 2 and 5, with
//! region 3 near the critical point): density and enthalpy on a grid, both through the same
//! property layer so that h and s share one zero. The release (IAPWS R7-97(2012), from memory
//! of its section on consistency with IAPWS-95) states IF97 deviations from IAPWS-95 of the
//! order of 0.01-0.1 % in specific volume over most of its range, larger close to the critical
//! point; the bounds below are those orders, and the figures are printed with --nocapture.

use eos::state::{RootChoice, State};
use eos::tp_explicit::{self, If97Model};
use eos::Component;

#[test]
fn if97_against_iapws95_over_the_if97_range() {
    let water = Component::new("water", 0.018_015_268, 647.096, 220.64e5, 0.344);
    let if97 = If97Model::new(water);
    let reference = eos::helmholtz::reference_for("water").unwrap();
    let mut worst = [(0.0f64, 0.0, 0.0); 2]; // (|drho/rho| %, T, P) away from / near critical
    let mut worst_h = 0.0f64;
    let mut n = 0;
    for i in 0..=40 {
        let t = 273.16 + (1073.15 - 273.16) * i as f64 / 40.0;
        for j in 0..=40 {
            let p = 10f64.powf(3.0 + (8.0 - 3.0) * j as f64 / 40.0); // 1 kPa .. 100 MPa
                                                                     // Skip states within 0.5 % of the saturation pressure (phase change between
                                                                     // neighbouring formulations' saturation lines).
            if let Ok(ps) = eos::if97::psat(t) {
                if (p / ps - 1.0).abs() < 5e-3 {
                    continue;
                }
            }
            let (Ok(a), Ok(b)) = (
                tp_explicit::state_tp(&if97, t, p, &[1.0], RootChoice::LowestGibbs),
                State::at_tp(&reference, t, p, &[1.0], RootChoice::LowestGibbs),
            ) else {
                continue;
            };
            n += 1;
            let d = 100.0 * (a.props.rho / b.props.rho - 1.0).abs();
            let near = (t / 647.096 - 1.0).abs() < 0.05 && (p / 22.064e6 - 1.0).abs() < 0.3;
            let k = usize::from(near);
            if d > worst[k].0 {
                worst[k] = (d, t, p);
            }
            worst_h = worst_h.max((a.props.h - b.props.h).abs() / 0.018_015_268 / 1e3);
        }
    }
    println!(
        "IF97 vs IAPWS-95 over {n} states: max |drho/rho| {:.4} % at {:.1} K, {:.4e} Pa \
         (away from the critical point), {:.3} % at {:.1} K, {:.4e} Pa (near it); \
         max |dh| {worst_h:.3} kJ/kg",
        worst[0].0, worst[0].1, worst[0].2, worst[1].0, worst[1].1, worst[1].2
    );
    assert!(n > 1000);
    assert!(
        worst[0].0 < 0.1,
        "away from the critical point: {:?}",
        worst[0]
    );
    assert!(worst[1].0 < 2.0, "near the critical point: {:?}", worst[1]);
}
