//! One Lee-Kesler fluid: its reduced equation, the density roots at (Tr, Pr) and the
//! departure functions, all in closed form.
//!
//! With Vr = Pc V / (R Tc) (the pseudo-reduced volume) and d = 1/Vr (Lee & Kesler 1975,
//! Eqs. 4-9):
//!
//! Z = Pr Vr / Tr = 1 + B/Vr + C/Vr^2 + D/Vr^5 + c4/(Tr^3 Vr^2) (beta + gamma/Vr^2) exp(-gamma/Vr^2)
//!
//! B = b1 - b2/Tr - b3/Tr^2 - b4/Tr^3, C = c1 - c2/Tr + c3/Tr^3, D = d1 + d2/Tr, and
//! E = c4/(2 Tr^3 gamma) [beta + 1 - (beta + 1 + gamma/Vr^2) exp(-gamma/Vr^2)]:
//!
//! - (H - H_ig)/(R Tc) = Tr [Z - 1 - (b2 + 2 b3/Tr + 3 b4/Tr^2)/(Tr Vr) - (c2 - 3 c3/Tr^2)/(2 Tr Vr^2)
//!   + d2/(5 Tr Vr^5) + 3E]
//! - (S - S_ig)/R = ln Z - (b1 + b3/Tr^2 + 2 b4/Tr^3)/Vr - (c1 - 2 c3/Tr^3)/(2 Vr^2) - d1/(5 Vr^5) + 2E
//! - ln(f/P) = Z - 1 - ln Z + B/Vr + C/(2 Vr^2) + D/(5 Vr^5) + E
//!
//! The departures are at the same T and P; the ideal-gas entropy is at the same P.

use super::constants::FluidConstants;
use crate::error::{Error, Result};

/// One fluid's solution at (Tr, Pr).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FluidPoint {
    /// Reduced volume Vr = Pc V/(R Tc).
    pub vr: f64,
    /// Compressibility factor.
    pub z: f64,
    /// (H - H_ig)/(R Tc).
    pub h_dep: f64,
    /// (S - S_ig)/R.
    pub s_dep: f64,
    /// ln(f/P).
    pub ln_phi: f64,
}

/// Up to three reduced densities d = 1/Vr with Pr(Tr, d) = Pr, ascending.
#[derive(Debug, Clone, Copy, Default)]
pub struct Roots {
    pub len: usize,
    pub d: [f64; 3],
}

/// Which root of one fluid to use.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Branch {
    /// Least dense root.
    Vapor,
    /// Densest root.
    Liquid,
    /// Root of lowest Gibbs energy (lowest ln f/P).
    Stable,
}

/// Highest reduced density scanned (Vr = 0.04, denser than any liquid of either fluid).
const D_MAX: f64 = 25.0;
/// Scan step in reduced density.
const D_STEP: f64 = 0.02;
/// Reduced temperature above which the isotherms are monotonic (a margin above Tr = 1).
const MONOTONIC_TR: f64 = 1.001;
/// Iteration cap of the root polish.
const MAX_ITER: usize = 100;

impl FluidConstants {
    fn bcd(&self, tr: f64) -> (f64, f64, f64) {
        let b = self.b1 - self.b2 / tr - self.b3 / (tr * tr) - self.b4 / tr.powi(3);
        let c = self.c1 - self.c2 / tr + self.c3 / tr.powi(3);
        let d = self.d1 + self.d2 / tr;
        (b, c, d)
    }

    /// Z and dZ/dd at (Tr, d = 1/Vr).
    pub fn z(&self, tr: f64, d: f64) -> (f64, f64) {
        let (b, c, dd) = self.bcd(tr);
        let k = self.c4 / tr.powi(3);
        let g = self.gamma;
        let e = (-g * d * d).exp();
        let d2 = d * d;
        let z = 1.0 + b * d + c * d2 + dd * d2 * d2 * d + k * d2 * (self.beta + g * d2) * e;
        let dz = b
            + 2.0 * c * d
            + 5.0 * dd * d2 * d2
            + k * e
                * (2.0 * self.beta * d + 4.0 * g * d2 * d
                    - 2.0 * g * d * (self.beta * d2 + g * d2 * d2));
        (z, dz)
    }

    /// Pr and dPr/dd at (Tr, d).
    fn pr(&self, tr: f64, d: f64) -> (f64, f64) {
        let (z, dz) = self.z(tr, d);
        (tr * d * z, tr * (z + d * dz))
    }

    /// Every reduced density with Pr(Tr, d) = pr, by a scan for sign changes and a safeguarded
    /// Newton polish in each bracket.
    pub fn roots(&self, tr: f64, pr: f64) -> Result<Roots> {
        let mut out = Roots::default();
        let f = |d: f64| self.pr(tr, d).0 - pr;
        // Above the critical temperature (Tr = 1 for both fluids) every isotherm rises
        // monotonically with density up to D_MAX (checked over 1 < Tr <= 4 by the test
        // `isotherms_above_the_critical_temperature_rise_monotonically`), so there is one root:
        // bracket it by doubling from the ideal-gas density and polish it.
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
                out.d[0] = self.polish(tr, pr, 0.0, hi, true)?;
                out.len = 1;
                return Ok(out);
            }
        }
        let mut lo = 0.0;
        let mut f_lo = -pr;
        let mut k = 1;
        while out.len < 3 {
            let hi = k as f64 * D_STEP;
            if hi > D_MAX {
                break;
            }
            let f_hi = f(hi);
            if f_lo.is_nan() || f_hi.is_nan() {
                break;
            }
            if (f_lo < 0.0) != (f_hi < 0.0) {
                out.d[out.len] = self.polish(tr, pr, lo, hi, f_lo < 0.0)?;
                out.len += 1;
            }
            lo = hi;
            f_lo = f_hi;
            k += 1;
        }
        if out.len == 0 {
            return Err(Error::NoSolution(format!(
                "Lee-Kesler fluid has no volume root at Tr = {tr}, Pr = {pr}"
            )));
        }
        Ok(out)
    }

    fn polish(&self, tr: f64, pr: f64, mut lo: f64, mut hi: f64, rising: bool) -> Result<f64> {
        let mut d = 0.5 * (lo + hi);
        let mut last = f64::INFINITY;
        for _ in 0..MAX_ITER {
            let (p, dp) = self.pr(tr, d);
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
            solver: "Lee-Kesler reduced volume",
            iterations: MAX_ITER,
            residual: last,
        })
    }

    /// Z, departures and ln(f/P) at (Tr, d).
    pub fn point(&self, tr: f64, d: f64) -> FluidPoint {
        let (b, c, dd) = self.bcd(tr);
        let (z, _) = self.z(tr, d);
        let g = self.gamma;
        let (d2, d5) = (d * d, d.powi(5));
        let e = self.c4 / (2.0 * tr.powi(3) * g)
            * (self.beta + 1.0 - (self.beta + 1.0 + g * d2) * (-g * d2).exp());
        let h_dep = tr
            * (z - 1.0
                - (self.b2 + 2.0 * self.b3 / tr + 3.0 * self.b4 / (tr * tr)) * d / tr
                - (self.c2 - 3.0 * self.c3 / (tr * tr)) * d2 / (2.0 * tr)
                + self.d2 * d5 / (5.0 * tr)
                + 3.0 * e);
        let s_dep = z.ln()
            - (self.b1 + self.b3 / (tr * tr) + 2.0 * self.b4 / tr.powi(3)) * d
            - (self.c1 - 2.0 * self.c3 / tr.powi(3)) * d2 / 2.0
            - self.d1 * d5 / 5.0
            + 2.0 * e;
        let ln_phi = z - 1.0 - z.ln() + b * d + c * d2 / 2.0 + dd * d5 / 5.0 + e;
        FluidPoint {
            vr: 1.0 / d,
            z,
            h_dep,
            s_dep,
            ln_phi,
        }
    }

    /// The fluid's state at (Tr, Pr) on the chosen branch, with the number of roots.
    pub fn solve(&self, tr: f64, pr: f64, branch: Branch) -> Result<(FluidPoint, usize)> {
        let roots = self.roots(tr, pr)?;
        let r = &roots.d[..roots.len];
        let d = match branch {
            Branch::Vapor => r[0],
            Branch::Liquid => r[r.len() - 1],
            Branch::Stable => r
                .iter()
                .copied()
                .min_by(|a, b| {
                    self.point(tr, *a)
                        .ln_phi
                        .total_cmp(&self.point(tr, *b).ln_phi)
                })
                .unwrap_or(r[0]),
        };
        Ok((self.point(tr, d), roots.len))
    }
}

#[cfg(test)]
mod monotonic_tests {
    use super::*;
    use crate::lee_kesler::constants::{REFERENCE, SIMPLE};

    #[test]
    fn isotherms_above_the_critical_temperature_rise_monotonically() {
        // The fast path of `roots` rests on this: dPr/dd > 0 for Tr > MONOTONIC_TR and
        // 0 < d <= D_MAX, for both the simple and the reference fluid (dense scan).
        for fluid in [&SIMPLE, &REFERENCE] {
            for i in 0..=600 {
                let tr = MONOTONIC_TR + (4.0 - MONOTONIC_TR) * i as f64 / 600.0;
                for k in 1..=5000 {
                    let d = D_MAX * k as f64 / 5000.0;
                    let (_, dp) = fluid.pr(tr, d);
                    assert!(dp > 0.0, "Tr {tr}, d {d}: dPr/dd = {dp}");
                }
            }
        }
    }
}
