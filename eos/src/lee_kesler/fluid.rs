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
use super::isotherm::{Isotherm, Sample};
pub use super::roots::Roots;
use super::roots::{monotonic_root, roots, MONOTONIC_TR};
use crate::error::Result;

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

impl FluidConstants {
    /// Z and dZ/dd at (Tr, d = 1/Vr).
    pub fn z(&self, tr: f64, d: f64) -> (f64, f64) {
        Isotherm::new(self, tr).z(d)
    }

    /// Every reduced density with Pr(Tr, d) = pr (at most five, ascending; see
    /// [`super::roots`] for how they are found).
    pub fn roots(&self, tr: f64, pr: f64) -> Result<Roots> {
        roots(&Isotherm::new(self, tr), pr)
    }

    /// Z, departures and ln(f/P) at (Tr, d).
    pub fn point(&self, tr: f64, d: f64) -> FluidPoint {
        let iso = Isotherm::new(self, tr);
        point(&iso, d, &iso.sample(d))
    }

    /// The fluid's state at (Tr, Pr) on the chosen branch, with the number of roots.
    pub fn solve(&self, tr: f64, pr: f64, branch: Branch) -> Result<(FluidPoint, usize)> {
        let iso = Isotherm::new(self, tr);
        // Above the critical temperature the one root, without the list of every root.
        if tr > MONOTONIC_TR {
            if let Some((d, s)) = monotonic_root(&iso, pr)? {
                return Ok((point(&iso, d, &s), 1));
            }
        }
        let found = roots(&iso, pr)?;
        let r = found.as_slice();
        let at = |i: usize| point(&iso, r[i], &found.sample(i).unwrap_or_default());
        let chosen = match branch {
            Branch::Vapor => at(0),
            Branch::Liquid => at(r.len() - 1),
            Branch::Stable => {
                // the first root of lowest ln(f/P), each root evaluated once
                let mut best = at(0);
                for i in 1..r.len() {
                    let p = at(i);
                    if p.ln_phi.total_cmp(&best.ln_phi).is_lt() {
                        best = p;
                    }
                }
                best
            }
        };
        Ok((chosen, found.len))
    }
}

/// Z, departures and ln(f/P) at density `d` on the isotherm `iso`, sampled there as `s`
/// (module docs).
fn point(iso: &Isotherm, d: f64, s: &Sample) -> FluidPoint {
    let f = iso.fluid;
    let tr = iso.tr;
    let (b, c, dd) = (iso.b, iso.c, iso.d);
    let z = s.z;
    let g = f.gamma;
    let it = 1.0 / tr;
    let (it2, it3) = (it * it, it * it * it);
    let (d2, d5) = (d * d, d.powi(5));
    let e = 0.5 * iso.k / g * (f.beta + 1.0 - (f.beta + 1.0 + g * d2) * s.e);
    let ln_z = z.ln();
    let h_dep = tr
        * (z - 1.0
            - (f.b2 + 2.0 * f.b3 * it + 3.0 * f.b4 * it2) * d * it
            - (f.c2 - 3.0 * f.c3 * it2) * d2 * (0.5 * it)
            + f.d2 * d5 * (0.2 * it)
            + 3.0 * e);
    let s_dep = ln_z
        - (f.b1 + f.b3 * it2 + 2.0 * f.b4 * it3) * d
        - (f.c1 - 2.0 * f.c3 * it3) * d2 * 0.5
        - f.d1 * d5 * 0.2
        + 2.0 * e;
    let ln_phi = z - 1.0 - ln_z + b * d + c * d2 * 0.5 + dd * d5 * 0.2 + e;
    FluidPoint {
        vr: 1.0 / d,
        z,
        h_dep,
        s_dep,
        ln_phi,
    }
}

#[cfg(test)]
mod monotonic_tests {
    use super::*;
    use crate::lee_kesler::constants::{REFERENCE, SIMPLE};
    use crate::lee_kesler::roots::{D_MAX, MONOTONIC_TR};

    #[test]
    fn isotherms_above_the_critical_temperature_rise_monotonically() {
        // The fast path of `roots` rests on this: dPr/dd > 0 for Tr > MONOTONIC_TR and
        // 0 < d <= D_MAX, for both the simple and the reference fluid (dense scan).
        for fluid in [&SIMPLE, &REFERENCE] {
            for i in 0..=600 {
                let tr = MONOTONIC_TR + (4.0 - MONOTONIC_TR) * i as f64 / 600.0;
                for k in 1..=5000 {
                    let d = D_MAX * k as f64 / 5000.0;
                    let (_, dp) = Isotherm::new(fluid, tr).pr(d);
                    assert!(dp > 0.0, "Tr {tr}, d {d}: dPr/dd = {dp}");
                }
            }
        }
    }
}
