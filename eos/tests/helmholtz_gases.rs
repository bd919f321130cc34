//! The gas formulations against facts that do not depend on their coefficients: the published
//! critical point, the papers' ancillary equations for the saturation curve, literature second
//! virial coefficients, and the agreement of the Span & Wagner (2003) 12-term equations with the
//! reference equations that the 2003 papers claim.
//!
//! Where a figure comes from the shared reference set's independent high-precision check of
//! the same coefficients (`reference/gases/eos/README.md` and the file headers), the test says
//! so; those figures are the largest residuals or deviations that check found.

use eos::helmholtz::{reference_for, technical_for, HelmholtzFluid};

fn fluid(name: &str) -> HelmholtzFluid {
    reference_for(name).unwrap_or_else(|| panic!("no reference formulation for {name}"))
}

#[test]
fn critical_point_reproduces_published_pc_with_zero_slope() {
    // p(Tc, rhoc) = pc (the published critical pressure) and (rhoc/pc) dp/drho = 0 there, to the
    // residuals found by the independent check (reference/gases/eos/README.md, column (a));
    // limits are those residuals plus half a unit of their last printed digit.
    let cases = [
        ("nitrogen", 6.5e-12, 1.5e-11),
        ("carbon dioxide", 1.5e-14, 2.5e-12),
        ("methane", 3.5e-9, 5.5e-8),
        ("argon", 2.55e-6, 5.5e-6),
        ("hydrogen", 6.55e-5, 1.15e-4),
        ("parahydrogen", 2.85e-6, 2.35e-5),
    ];
    for (name, tol_p, tol_dp) in cases {
        let fl = fluid(name);
        let f = fl.formulation();
        let p = fl.properties(f.tc, f.rhoc).unwrap();
        let dp_star = p.dp_drho * f.rhoc / f.pc;
        assert!(
            (p.p / f.pc - 1.0).abs() <= tol_p,
            "{name}: p/pc - 1 = {:e}",
            p.p / f.pc - 1.0
        );
        assert!(dp_star.abs() <= tol_dp, "{name}: dp* = {dp_star:e}");
        // The slope is not zero away from the critical point (the check can fail).
        let q = fl.properties(1.1 * f.tc, f.rhoc).unwrap();
        assert!(q.dp_drho * f.rhoc / f.pc > 0.1, "{name}");
    }
}

#[test]
fn water_critical_pressure() {
    // IAPWS R6-95(2018): pc = 22.064 MPa at Tc = 647.096 K, rhoc = 322 kg/m3; the shared set's
    // recomputation gives 22.0640000000021 MPa.
    let fl = fluid("water");
    let f = fl.formulation();
    let p = fl.pressure(f.tc, f.rhoc).unwrap();
    assert!((p / 22.064e6 - 1.0).abs() < 1e-12, "{p}");
}

/// Largest relative deviation of the EOS's saturation from the ancillaries on `n` temperatures
/// from the triple point to `t_top`: (ps, rho', rho'').
fn ancillary_deviation(fl: &HelmholtzFluid, t_top: f64, n: usize) -> (f64, f64, f64) {
    let f = fl.formulation();
    let mut dev = (0.0f64, 0.0f64, 0.0f64);
    for i in 0..n {
        let t = f.t_triple + (t_top - f.t_triple) * i as f64 / (n - 1) as f64;
        let s = fl.saturation_t(t).unwrap();
        let rel = |x: f64, y: f64| (x / y - 1.0).abs();
        if let Some(a) = &f.ps_anc {
            dev.0 = dev.0.max(rel(s.p, f.pc * a.reduced(t, f.tc)));
        }
        if let Some(a) = &f.rhol_anc {
            dev.1 = dev.1.max(rel(s.rho_liq, f.rhoc * a.reduced(t, f.tc)));
        }
        if let Some(a) = &f.rhov_anc {
            dev.2 = dev.2.max(rel(s.rho_vap, f.rhoc * a.reduced(t, f.tc)));
        }
    }
    dev
}

#[test]
fn saturation_matches_the_papers_ancillary_equations() {
    // Ancillary equations of each paper (recalled; in eos/data/helmholtz/*.csv), over the
    // range of the shared set's independent check. That check found the largest deviations
    // listed below (file headers of reference/gases/eos/*.csv) on only 9-14 temperatures, and
    // the deviation curves oscillate between such points, so the limit is 1.5 times each listed
    // figure (for every fluid alike); here 12 temperatures are used.
    // (fluid, top temperature K, listed ps, rho', rho'' deviations as fractions; 0 = no ancillary)
    let cases = [
        ("nitrogen", 125.0, 1.6e-4, 6e-5, 2.2e-4),
        ("carbon dioxide", 303.5, 4e-5, 8e-5, 5e-4),
        ("methane", 190.3, 5.4e-5, 2.0e-4, 4.8e-4),
        ("argon", 150.0, 5.7e-5, 7.2e-5, 0.0),
        ("hydrogen", 32.5, 1.0e-4, 0.0, 0.0),
        ("parahydrogen", 32.5, 2e-5, 0.0, 0.0),
    ];
    for (name, top, tp, tl, tv) in cases {
        let fl = fluid(name);
        let (dp, dl, dv) = ancillary_deviation(&fl, top, 12);
        assert!(dp <= 1.5 * tp, "{name}: ps deviation {dp:e}");
        assert!(dl <= 1.5 * tl, "{name}: rho' deviation {dl:e}");
        assert!(dv <= 1.5 * tv, "{name}: rho'' deviation {dv:e}");
    }
}

#[test]
fn argon_triple_point_vapour_density() {
    // Tegeler et al. (1999): saturated vapour at the triple point 83.8058 K, 4.0546 kg/m3
    // (from memory of the paper; one unit of the last printed digit).
    let fl = fluid("argon");
    let f = fl.formulation();
    let s = fl.saturation_t(f.t_triple).unwrap();
    assert!(
        (s.rho_vap * f.molar_mass - 4.0546).abs() <= 1e-4,
        "{}",
        s.rho_vap * f.molar_mass
    );
}

#[test]
fn second_virial_coefficients_at_300_k() {
    // Literature B(300 K) in cm3/mol from reference/gases/second_virial_300K.csv (from memory of
    // Dymond & Smith (1980) and Dymond et al. (2002)), compared within the test tolerances that
    // file's README suggests (1.5 cm3/mol; 3 for CO2); and the EOS values found by the shared
    // set's independent implementation (file headers), to 0.01 cm3/mol.
    let cases = [
        ("nitrogen", -4.5, 1.5, -4.55),
        ("methane", -42.8, 1.5, -42.21),
        ("carbon dioxide", -122.0, 3.0, -121.3),
        ("argon", -15.8, 1.5, -15.18),
    ];
    for (name, lit, tol, independent) in cases {
        let b = fluid(name).second_virial(300.0).unwrap() * 1e6;
        assert!((b - lit).abs() <= tol, "{name}: B = {b}");
        // The independent figures are printed to 0.01 (0.1 for CO2).
        let step = if name == "carbon dioxide" {
            0.05
        } else {
            0.005
        };
        assert!(
            (b - independent).abs() <= step,
            "{name}: B = {b} vs {independent}"
        );
    }
    // Normal and para hydrogen, independent implementation: 14.58 and 14.57 cm3/mol.
    let bn = fluid("hydrogen").second_virial(300.0).unwrap() * 1e6;
    let bp = fluid("parahydrogen").second_virial(300.0).unwrap() * 1e6;
    assert!(
        (bn - 14.58).abs() <= 0.005 && (bp - 14.57).abs() <= 0.005,
        "{bn} {bp}"
    );
}

#[test]
fn technical_equations_agree_with_reference_equations() {
    // Span & Wagner (2003) claim agreement with the reference equations within about
    // 0.2-0.5 % in density and vapour pressure (from memory of the papers, as summarised in
    // reference/gases/eos/README.md); checked at 0.5 %: single phase 1.2-3 Tc, 0.1-30 MPa;
    // vapour pressure and saturated liquid density from the triple point to 0.98 Tc.
    let cases = [
        ("nitrogen", 5e-3, 5e-3, 5e-3),
        ("carbon dioxide", 5e-3, 5e-3, 5e-3),
        ("methane", 5e-3, 5e-3, 5e-3),
        ("argon", 5e-3, 5e-3, 5e-3),
    ];
    for (name, tol_rho, tol_ps, tol_rl) in cases {
        let reference = fluid(name);
        let technical = technical_for(name).unwrap();
        let f = reference.formulation();
        let mut worst = 0.0f64;
        for i in 0..=6 {
            let t = f.tc * (1.2 + 1.8 * i as f64 / 6.0);
            for p in [0.1e6, 1e6, 3e6, 10e6, 20e6, 30e6] {
                let a = reference.density(t, p).unwrap();
                let b = technical.density(t, p).unwrap();
                worst = worst.max((b / a - 1.0).abs());
            }
        }
        assert!(worst <= tol_rho, "{name}: density deviation {worst:e}");
        let (mut wp, mut wl) = (0.0f64, 0.0f64);
        for i in 0..10 {
            let t = f.t_triple + (0.98 * f.tc - f.t_triple) * i as f64 / 9.0;
            let a = reference.saturation_t(t).unwrap();
            let b = technical.saturation_t(t).unwrap();
            wp = wp.max((b.p / a.p - 1.0).abs());
            wl = wl.max((b.rho_liq / a.rho_liq - 1.0).abs());
        }
        assert!(wp <= tol_ps, "{name}: ps deviation {wp:e}");
        assert!(wl <= tol_rl, "{name}: rho' deviation {wl:e}");
    }
}

/// A start far below the density bracket (here 4.5e-9 mol/m3 for methane's vapour branch
/// above Tc) is raised into it instead of stopping the solve: found by the command-line
/// property tests (a vessel heated from 474 K, 1.75 bar to 569 K with the reference model).
#[test]
fn a_start_density_below_the_bracket_is_raised_into_it() {
    use eos::helmholtz::density::{p_dp, solve_branch_split, Branch};
    let fl = fluid("methane");
    let f = fl.formulation();
    let (t, p) = (474.4281055176834, 174_795.702_390_998_98);
    let rho = solve_branch_split(f, t, p, Branch::Vapour, 4.499710759010746e-9, f.rhoc)
        .expect("a vapour root");
    let (pc, _) = p_dp(f, t, rho);
    assert!((pc / p - 1.0).abs() < 1e-10, "p = {pc}");
    // Ideal-gas limit: Z within 1 % of one at 1.75 bar and 474 K (common practice).
    let z = p / (rho * eos::constants::R * t);
    assert!((z - 1.0).abs() < 0.01, "Z = {z}");
}
