//! Robustness of the (T, P) flash over a dense grid around the envelope of a demo natural
//! gas with heavy ends (a composition of our own, see `common::demo_gas`).

mod common;

use common::{demo_gas, pr_model};
use eos::equilibrium::{envelope, flash, stability, EnvelopeOptions, FlashResult};
use eos::Error;

#[test]
fn flash_grid_around_the_demo_gas_envelope() {
    let (names, z) = demo_gas();
    let m = pr_model(&names);
    let n = z.len();
    let env = envelope::trace(&m, &z, EnvelopeOptions::default()).unwrap();
    let (ccb, cct) = (env.cricondenbar, env.cricondentherm);
    let (nt, np) = (100, 100);
    let (mut two, mut one, mut failed, mut one_checked) = (0, 0, 0, 0);
    let (mut ll, mut lv) = (vec![0.0; n], vec![0.0; n]);
    let start = std::time::Instant::now();
    for i in 0..nt {
        // 90 K to 420 K: below the bubble curve's end to above the cricondentherm.
        let t = 90.0 + 330.0 * i as f64 / (nt - 1) as f64;
        for j in 0..np {
            // 0.5 bar to 200 bar, geometric.
            let p = 0.5e5 * (400.0_f64).powf(j as f64 / (np - 1) as f64);
            match flash::tp(&m, t, p, &z) {
                Ok(FlashResult::TwoPhase(r)) => {
                    two += 1;
                    // Equilibrium conditions and material balance at every two-phase answer.
                    common::ln_phi_at(&m, t, p, r.rho_l, &r.x, &mut ll);
                    common::ln_phi_at(&m, t, p, r.rho_v, &r.y, &mut lv);
                    for k in 0..n {
                        let d = r.x[k].ln() + ll[k] - r.y[k].ln() - lv[k];
                        assert!(d.abs() < 1e-10, "{t} K {p} Pa: ln f differ by {d:e}");
                        let mb =
                            z[k] - (1.0 - r.vapor_fraction) * r.x[k] - r.vapor_fraction * r.y[k];
                        assert!(mb.abs() < 1e-12);
                    }
                    // Two phases only inside the envelope's bounding box.
                    assert!(
                        t <= cct.t + 1e-6 && p <= ccb.p * (1.0 + 1e-9),
                        "{t} K {p} Pa"
                    );
                }
                Ok(FlashResult::SinglePhase(_)) => {
                    one += 1;
                    // Never one phase where the stability test finds the feed unstable.
                    if (i + j) % 4 == 0 {
                        let s = stability::test(&m, t, p, &z).unwrap();
                        assert!(s.stable, "{t} K {p} Pa: single phase but tm = {}", s.tm);
                        one_checked += 1;
                    }
                }
                Err(e) => {
                    assert!(
                        matches!(e, Error::NotConverged { .. } | Error::NoSolution(_)),
                        "{t} K {p} Pa: {e}"
                    );
                    failed += 1;
                }
            }
        }
    }
    println!(
        "flash grid {}x{} ({} points) in {:.2?}: two-phase {two}, single-phase {one} \
         (stability re-checked on {one_checked}), typed failures {failed}",
        nt,
        np,
        nt * np,
        start.elapsed()
    );
    assert_eq!(two + one + failed, nt * np);
    assert!(two > 1000 && one > 1000);
    assert_eq!(failed, 0, "every flash of the grid converges");
}
