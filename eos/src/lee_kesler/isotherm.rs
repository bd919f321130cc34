//! One Lee-Kesler fluid along one isotherm: the temperature-dependent coefficients computed
//! once, the reduced pressure and its density derivatives, and a bound on the curvature.
//!
//! With d = 1/Vr and the coefficients of Lee & Kesler (1975), Eqs. 4-9, at the reduced
//! temperature Tr: B = b1 - b2/Tr - b3/Tr^2 - b4/Tr^3, C = c1 - c2/Tr + c3/Tr^3,
//! D = d1 + d2/Tr, k = c4/Tr^3, and E(d) = exp(-gamma d^2):
//!
//! Pr(d) = Tr d Z = Tr [d + B d^2 + C d^3 + D d^6 + k (beta d^3 + gamma d^5) E]
//!
//! dPr/dd = Tr (Z + d dZ/dd), and differentiating twice,
//!
//! d2Pr/dd2 / Tr = 2B + 6C d + 30D d^4
//!   + k E [6 beta d + (20 gamma - 14 gamma beta) d^3 + (4 gamma^2 beta - 22 gamma^2) d^5 + 4 gamma^3 d^7].
//!
//! Over an interval a <= d <= b (0 <= a) every power of d is at most its value at b and E at
//! most max(E(a), E(b)), so the sum of the terms' magnitudes taken there bounds
//! |d2Pr/dd2| on the interval ([`Isotherm::curvature_bound`]); the root finder uses it to
//! prove that no root lies in a stretch of densities it skips.

use super::constants::FluidConstants;

/// Z, dZ/dd and E = exp(-gamma d^2) at one density.
#[derive(Debug, Clone, Copy, Default, PartialEq)]
pub struct Sample {
    pub z: f64,
    pub dz: f64,
    pub e: f64,
}

/// One fluid at one reduced temperature.
#[derive(Debug, Clone, Copy)]
pub struct Isotherm<'a> {
    /// The fluid's constants.
    pub fluid: &'a FluidConstants,
    /// Reduced temperature.
    pub tr: f64,
    /// B(Tr).
    pub b: f64,
    /// C(Tr).
    pub c: f64,
    /// D(Tr).
    pub d: f64,
    /// c4/Tr^3.
    pub k: f64,
}

impl<'a> Isotherm<'a> {
    /// The coefficients of `fluid` at `tr`.
    pub fn new(fluid: &'a FluidConstants, tr: f64) -> Self {
        let f = fluid;
        Isotherm {
            fluid,
            tr,
            b: f.b1 - f.b2 / tr - f.b3 / (tr * tr) - f.b4 / tr.powi(3),
            c: f.c1 - f.c2 / tr + f.c3 / tr.powi(3),
            d: f.d1 + f.d2 / tr,
            k: f.c4 / tr.powi(3),
        }
    }

    /// Z and dZ/dd at reduced density `d`.
    #[inline]
    pub fn z(&self, d: f64) -> (f64, f64) {
        let s = self.sample(d);
        (s.z, s.dz)
    }

    /// Z, dZ/dd and E at reduced density `d`.
    #[inline]
    pub fn sample(&self, d: f64) -> Sample {
        let (b, c, dd, k) = (self.b, self.c, self.d, self.k);
        let beta = self.fluid.beta;
        let g = self.fluid.gamma;
        let e = (-g * d * d).exp();
        let d2 = d * d;
        let z = 1.0 + b * d + c * d2 + dd * d2 * d2 * d + k * d2 * (beta + g * d2) * e;
        let dz = b
            + 2.0 * c * d
            + 5.0 * dd * d2 * d2
            + k * e * (2.0 * beta * d + 4.0 * g * d2 * d - 2.0 * g * d * (beta * d2 + g * d2 * d2));
        Sample { z, dz, e }
    }

    /// Pr and dPr/dd at reduced density `d`.
    #[inline]
    pub fn pr(&self, d: f64) -> (f64, f64) {
        self.pr_of(d, &self.sample(d))
    }

    /// Pr and dPr/dd from the sample `s` taken at `d`.
    #[inline]
    pub fn pr_of(&self, d: f64, s: &Sample) -> (f64, f64) {
        (self.tr * d * s.z, self.tr * (s.z + d * s.dz))
    }

    /// d2Pr/dd2 at reduced density `d` (module docs).
    pub fn curvature(&self, d: f64) -> f64 {
        let (beta, g) = (self.fluid.beta, self.fluid.gamma);
        let d2 = d * d;
        let e = (-g * d2).exp();
        let poly = 6.0 * beta * d
            + (20.0 * g - 14.0 * g * beta) * d2 * d
            + (4.0 * g * g * beta - 22.0 * g * g) * d2 * d2 * d
            + 4.0 * g * g * g * d2 * d2 * d2 * d;
        self.tr * (2.0 * self.b + 6.0 * self.c * d + 30.0 * self.d * d2 * d2 + self.k * e * poly)
    }

    /// An upper bound on |d2Pr/dd2| over a <= d <= b, for 0 <= a <= b (module docs).
    pub fn curvature_bound(&self, a: f64, b: f64) -> f64 {
        let (beta, g) = (self.fluid.beta, self.fluid.gamma);
        let b2 = b * b;
        let e = (-g * a * a).exp().max((-g * b2).exp());
        let poly = 6.0 * beta.abs() * b
            + (20.0 * g - 14.0 * g * beta).abs() * b2 * b
            + (4.0 * g * g * beta - 22.0 * g * g).abs() * b2 * b2 * b
            + 4.0 * (g * g * g).abs() * b2 * b2 * b2 * b;
        self.tr.abs()
            * (2.0 * self.b.abs()
                + 6.0 * self.c.abs() * b
                + 30.0 * self.d.abs() * b2 * b2
                + self.k.abs() * e * poly)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::lee_kesler::constants::{REFERENCE, SIMPLE};

    #[test]
    fn curvature_is_the_derivative_of_the_slope() {
        // Calculus: d2Pr/dd2 in closed form against a central difference of dPr/dd.
        for fluid in [&SIMPLE, &REFERENCE] {
            for tr in [0.3, 0.55, 0.8, 1.0, 1.7, 4.0] {
                let iso = Isotherm::new(fluid, tr);
                for k in 1..=250 {
                    let d = 0.1 * k as f64;
                    let h = 1e-5 * d;
                    let fd = (iso.pr(d + h).1 - iso.pr(d - h).1) / (2.0 * h);
                    let c = iso.curvature(d);
                    assert!(
                        (c - fd).abs() <= 1e-6 * (1.0 + c.abs()),
                        "Tr {tr}, d {d}: {c} vs {fd}"
                    );
                }
            }
        }
    }

    #[test]
    fn curvature_bound_holds_on_every_interval() {
        // The bound must not be below |d2Pr/dd2| anywhere in [a, b] (sampled densely).
        for fluid in [&SIMPLE, &REFERENCE] {
            for tr in [0.3, 0.45, 0.7, 0.95, 1.0, 1.3, 4.0] {
                let iso = Isotherm::new(fluid, tr);
                for (a, w) in [(0.0, 0.5), (0.0, 25.0), (1.0, 2.0), (3.3, 0.04), (8.0, 4.0)] {
                    let bound = iso.curvature_bound(a, a + w);
                    for k in 0..=400 {
                        let d = a + w * k as f64 / 400.0;
                        assert!(iso.curvature(d).abs() <= bound, "Tr {tr}, [{a}, {}]", a + w);
                    }
                }
            }
        }
    }
}
