//! Test-only: the point-by-point density scan that [`super::roots`] replaces, kept as the
//! reference its results must reproduce, and the comparison on a dense (Tr, Pr) grid.
//!
//! The reference evaluates f(d) = Pr(Tr, d) - Pr at every grid point d_k = 0.02 k up to
//! d = 25, polishes a root in each cell where f changes sign (at most five, as the root
//! finder keeps) and, above Tr = 1.001, brackets the single root by doubling from the
//! ideal-gas density. The branch
//! rule is applied to its roots exactly as before: vapour = first root, liquid = last root,
//! stable = first root of lowest ln(f/P).

use super::constants::{FluidConstants, REFERENCE, SIMPLE};
use super::fluid::Branch;
use crate::error::{Error, Result};

const D_MAX: f64 = 25.0;
const D_STEP: f64 = 0.02;
const MONOTONIC_TR: f64 = 1.001;
const MAX_ITER: usize = 100;

fn bcd(f: &FluidConstants, tr: f64) -> (f64, f64, f64) {
    let b = f.b1 - f.b2 / tr - f.b3 / (tr * tr) - f.b4 / tr.powi(3);
    let c = f.c1 - f.c2 / tr + f.c3 / tr.powi(3);
    let d = f.d1 + f.d2 / tr;
    (b, c, d)
}

fn z(f: &FluidConstants, tr: f64, d: f64) -> (f64, f64) {
    let (b, c, dd) = bcd(f, tr);
    let k = f.c4 / tr.powi(3);
    let g = f.gamma;
    let e = (-g * d * d).exp();
    let d2 = d * d;
    let z = 1.0 + b * d + c * d2 + dd * d2 * d2 * d + k * d2 * (f.beta + g * d2) * e;
    let dz = b
        + 2.0 * c * d
        + 5.0 * dd * d2 * d2
        + k * e * (2.0 * f.beta * d + 4.0 * g * d2 * d - 2.0 * g * d * (f.beta * d2 + g * d2 * d2));
    (z, dz)
}

fn pr_of(f: &FluidConstants, tr: f64, d: f64) -> (f64, f64) {
    let (z, dz) = z(f, tr, d);
    (tr * d * z, tr * (z + d * dz))
}

fn polish(
    f: &FluidConstants,
    tr: f64,
    pr: f64,
    mut lo: f64,
    mut hi: f64,
    rising: bool,
) -> Result<f64> {
    let mut d = 0.5 * (lo + hi);
    let mut last = f64::INFINITY;
    for _ in 0..MAX_ITER {
        let (p, dp) = pr_of(f, tr, d);
        let r = p - pr;
        last = r;
        if r.abs() <= 1e-14 * pr.max(1e-300) || hi - lo <= 4.0 * f64::EPSILON * hi {
            return Ok(d);
        }
        if (r < 0.0) == rising {
            lo = d;
        } else {
            hi = d;
        }
        let newton = d - r / dp;
        d = if newton > lo && newton < hi {
            newton
        } else {
            0.5 * (lo + hi)
        };
    }
    Err(Error::NotConverged {
        solver: "reference scan",
        iterations: MAX_ITER,
        residual: last,
    })
}

/// The previous root finder: every root (at most five), ascending.
pub fn scan_roots(fl: &FluidConstants, tr: f64, pr: f64) -> Result<Vec<f64>> {
    let mut out = Vec::new();
    let f = |d: f64| pr_of(fl, tr, d).0 - pr;
    if tr > MONOTONIC_TR {
        let mut hi = (pr / tr).clamp(1e-6, D_MAX);
        let mut k = 0;
        while f(hi) < 0.0 {
            hi = (2.0 * hi).min(D_MAX);
            k += 1;
            if hi >= D_MAX || k > 60 {
                break;
            }
        }
        if f(hi) >= 0.0 {
            out.push(polish(fl, tr, pr, 0.0, hi, true)?);
            return Ok(out);
        }
    }
    let mut lo = 0.0;
    let mut f_lo = -pr;
    let mut k = 1;
    while out.len() < super::roots::MAX_ROOTS {
        let hi = k as f64 * D_STEP;
        if hi > D_MAX {
            break;
        }
        let f_hi = f(hi);
        if f_lo.is_nan() || f_hi.is_nan() {
            break;
        }
        if (f_lo < 0.0) != (f_hi < 0.0) {
            out.push(polish(fl, tr, pr, lo, hi, f_lo < 0.0)?);
        }
        lo = hi;
        f_lo = f_hi;
        k += 1;
    }
    if out.is_empty() {
        return Err(Error::NoSolution("no root".into()));
    }
    Ok(out)
}

/// The previous branch rule applied to the previous roots: the chosen density.
pub fn scan_choice(fl: &FluidConstants, tr: f64, pr: f64, branch: Branch) -> Result<f64> {
    let r = scan_roots(fl, tr, pr)?;
    Ok(match branch {
        Branch::Vapor => r[0],
        Branch::Liquid => r[r.len() - 1],
        Branch::Stable => r
            .iter()
            .copied()
            .min_by(|a, b| fl.point(tr, *a).ln_phi.total_cmp(&fl.point(tr, *b).ln_phi))
            .unwrap_or(r[0]),
    })
}

/// Pr where the previous stable choice switches from a vapour-like root (less dense than the
/// critical density 1/Zc) to a liquid-like one: the saturation pressure of the correlation,
/// by bisection in ln Pr; `None` if it does not switch between Pr = 1e-12 and 1.
fn switch_pressure(fl: &FluidConstants, zc: f64, tr: f64) -> Option<f64> {
    let vapour_stable = |pr: f64| {
        let s = scan_choice(fl, tr, pr, Branch::Stable).ok()?;
        Some(s < 1.0 / zc)
    };
    let (mut lo, mut hi) = (1e-12_f64.ln(), 0.0_f64);
    if vapour_stable(lo.exp()) != Some(true) || vapour_stable(hi.exp()) != Some(false) {
        return None;
    }
    for _ in 0..45 {
        let mid = 0.5 * (lo + hi);
        match vapour_stable(mid.exp()) {
            Some(true) => lo = mid,
            Some(false) => hi = mid,
            None => return None,
        }
    }
    Some((0.5 * (lo + hi)).exp())
}

#[test]
fn fast_roots_reproduce_the_scan_and_its_choice_on_a_dense_grid() {
    // The new finder against the previous point-by-point scan: the same number of roots, the
    // same roots (to round-off) and the same root chosen on every branch, over
    // 0.3 <= Tr <= 4 and 1e-4 <= Pr <= 10 with, below Tr = 1, states within 1e-6 to 3 %
    // of the saturation pressure on both sides.
    let mut trs: Vec<f64> = (0..=140).map(|i| 0.3 + 0.005 * i as f64).collect();
    trs.extend([
        0.995, 0.998, 0.999, 0.9995, 0.9999, 1.0, 1.0005, 1.001, 1.0011, 1.002,
    ]);
    trs.extend((0..=57).map(|i| 1.01 + 0.0525 * i as f64));
    let prs: Vec<f64> = (0..=50)
        .map(|i| 1e-4 * 10f64.powf(5.0 * i as f64 / 50.0))
        .collect();
    let (mut states, mut three, mut near_sat, mut worst) = (0, 0, 0, 0.0f64);
    // Zc of the two fluids: derived_eos_facts.csv (shared reference), tested in tests/lee_kesler.rs.
    for (fl, zc) in [(&SIMPLE, 0.2905), (&REFERENCE, 0.2560)] {
        for &tr in &trs {
            let mut ps = prs.clone();
            if tr < 1.0 {
                if let Some(ps_sat) = switch_pressure(fl, zc, tr) {
                    for r in [1e-6, 1e-4, 1e-3, 1e-2, 3e-2] {
                        ps.push(ps_sat * (1.0 - r));
                        ps.push(ps_sat * (1.0 + r));
                        near_sat += 2;
                    }
                }
            }
            for &pr in &ps {
                states += 1;
                let old = scan_roots(fl, tr, pr).unwrap();
                let new = fl.roots(tr, pr).unwrap();
                let new = new.as_slice();
                assert_eq!(old.len(), new.len(), "Tr {tr}, Pr {pr}: {old:?} vs {new:?}");
                if old.len() == 3 {
                    three += 1;
                }
                for (a, b) in old.iter().zip(new) {
                    let rel = (a - b).abs() / a;
                    worst = worst.max(rel);
                    assert!(rel <= 1e-9, "Tr {tr}, Pr {pr}: {old:?} vs {new:?}");
                }
                for branch in [Branch::Vapor, Branch::Liquid, Branch::Stable] {
                    let want = scan_choice(fl, tr, pr, branch).unwrap();
                    let (got, _) = fl.solve(tr, pr, branch).unwrap();
                    let rel = (1.0 / got.vr - want).abs() / want;
                    assert!(
                        rel <= 1e-9,
                        "Tr {tr}, Pr {pr}, {branch:?}: {got:?} vs {want}"
                    );
                }
            }
        }
    }
    println!(
        "{states} states, {three} with three roots, {near_sat} near saturation, worst {worst:e}"
    );
    assert!(three > 1000 && near_sat > 1000, "{three} {near_sat}");
}
