//! Lee-Kesler Z against the reference equations of state, as an independent check of the
//! simple-fluid part (argon, omega close to zero, against Tegeler, Span & Wagner 1999) and of
//! the acentric interpolation (carbon dioxide, omega = 0.225, against Span & Wagner 1996;
//! methane, against Setzmann & Wagner 1991). Lee-Kesler is a two-reference-fluid correlation;
//! Poling, Prausnitz & O'Connell, *The Properties of Gases and Liquids*, 5th ed. (2001), ch. 4
//! (from memory) give its errors for non-polar gases as typically within 1-2 % outside the
//! critical region; the test allows 2 % there for the simple non-polar fluids (argon, methane)
//! and prints the figures (--nocapture). Carbon dioxide (quadrupolar) is printed, not held to
//! that claim: it measured 2.5 % at Tr = 2, Pr = 5 when this test was written.

use eos::state::{RootChoice, State};
use eos::tp_explicit::{self, LeeKeslerModel};
use eos::Component;

/// (name, Tc K, Pc Pa, omega, M kg/mol): from memory of Poling et al. (2001) App. A.
const FLUIDS: [(&str, f64, f64, f64, f64); 3] = [
    ("argon", 150.86, 48.98e5, -0.002, 0.039948),
    ("methane", 190.56, 45.99e5, 0.011, 0.016043),
    ("carbon dioxide", 304.12, 73.74e5, 0.225, 0.044010),
];

#[test]
fn lee_kesler_z_against_reference_equations() {
    for (name, tc, pc, omega, m) in FLUIDS {
        let c = Component::new(name, m, tc, pc, omega);
        let lk = LeeKeslerModel::new(&[c], None).unwrap();
        let reference = eos::helmholtz::reference_for(name).unwrap();
        let mut worst = (0.0f64, 0.0, 0.0);
        let mut n = 0;
        for tr in [1.2, 1.5, 2.0, 3.0] {
            for pr in [0.2, 0.5, 1.0, 2.0, 5.0] {
                let (t, p) = (tr * tc, pr * pc);
                let z_lk = tp_explicit::state_tp(&lk, t, p, &[1.0], RootChoice::LowestGibbs)
                    .unwrap()
                    .props
                    .z;
                let z_ref = State::at_tp(&reference, t, p, &[1.0], RootChoice::LowestGibbs)
                    .unwrap()
                    .props
                    .z;
                let d = 100.0 * (z_lk / z_ref - 1.0).abs();
                n += 1;
                if d > worst.0 {
                    worst = (d, tr, pr);
                }
            }
        }
        println!(
            "{name}: Lee-Kesler vs reference over {n} states, max |dZ/Z| {:.3} % at Tr {}, Pr {}",
            worst.0, worst.1, worst.2
        );
        if name != "carbon dioxide" {
            assert!(worst.0 < 2.0, "{name}: {worst:?}");
        }
    }
}

#[test]
fn lee_kesler_reproduces_a_textbook_worked_example() {
    // n-butane at 510 K and 25 bar: Tr = 1.200, Pr = 0.659; the Lee-Kesler tables give
    // Z0 = 0.865 and Z1 = 0.038, Z = 0.873 (from memory of Smith, Van Ness & Abbott,
    // *Introduction to Chemical Engineering Thermodynamics*, 7th ed. (2005), Example 3.12,
    // values read from their Appendix E tables to three decimals; hence the 1.5e-3 allowance).
    let (tc, pc) = (425.1, 37.96e5);
    let z_at = |omega: f64| {
        let c = Component::new("test", 0.058, tc, pc, omega);
        let m = LeeKeslerModel::new(&[c], None).unwrap();
        tp_explicit::state_tp(&m, 1.2 * tc, 0.659 * pc, &[1.0], RootChoice::Vapor)
            .unwrap()
            .props
            .z
    };
    let omega_r = 0.3978;
    let z0 = z_at(0.0);
    let z1 = (z_at(omega_r) - z0) / omega_r;
    assert!((z0 - 0.865).abs() < 1.5e-3, "Z0 = {z0}");
    assert!((z1 - 0.038).abs() < 1.5e-3, "Z1 = {z1}");
    assert!((z_at(0.200) - 0.873).abs() < 1.5e-3);
}

#[test]
fn lee_kesler_reproduces_its_tables_at_the_lowest_temperature() {
    // The row Tr = 0.30 of the Lee-Kesler tables (from memory of Smith, Van Ness & Abbott,
    // 7th ed. (2005), Appendix E, Tables E.1 and E.2, which reproduce them): Z0 = 0.0029 at
    // Pr = 0.010 and 0.2892 at Pr = 1.000; Z1 = -0.0008 and -0.0806. Compressed liquids
    // there: Z is nearly proportional to Pr, which the two columns bear out. Printed to four
    // decimals: allowed 1e-4 (half a unit of the last digit plus the rounding of a table
    // computed with the paper's constants). At Pr = 0.01 the isotherms cross the pressure
    // five times; the liquid is the fifth root (the third gives Z0 = 0.0108).
    use eos::lee_kesler::{Branch, OMEGA_R, REFERENCE, SIMPLE};
    for (pr, z0_table, z1_table) in [(0.01, 0.0029, -0.0008), (1.0, 0.2892, -0.0806)] {
        for branch in [Branch::Liquid, Branch::Stable] {
            let (s, _) = SIMPLE.solve(0.30, pr, branch).unwrap();
            let (r, _) = REFERENCE.solve(0.30, pr, branch).unwrap();
            let z1 = (r.z - s.z) / OMEGA_R;
            assert!(
                (s.z - z0_table).abs() < 1e-4,
                "Pr {pr} {branch:?}: Z0 = {}",
                s.z
            );
            assert!(
                (z1 - z1_table).abs() < 1e-4,
                "Pr {pr} {branch:?}: Z1 = {z1}"
            );
        }
    }
    let (_, roots) = SIMPLE.solve(0.30, 0.01, Branch::Liquid).unwrap();
    assert_eq!(roots, 5);
}
