//! What distinguishes one member of the cubic family, and the critical constants that follow.

use super::alpha::Alpha;

/// A member of the cubic family: the two volume constants of its attractive term and its
/// alpha function.
#[derive(Debug, Clone, Copy)]
pub struct CubicSpec {
    /// Identifier used on the command line and in JSON.
    pub id: &'static str,
    /// Display name.
    pub name: &'static str,
    /// The paper the member comes from.
    pub citation: &'static str,
    /// d1 in (v + d1 b)(v + d2 b).
    pub d1: f64,
    /// d2 in (v + d1 b)(v + d2 b).
    pub d2: f64,
    /// Temperature dependence of the attraction parameter.
    pub alpha: Alpha,
}

/// Omega_a, Omega_b and the critical compressibility factor Zc that the critical conditions
/// (dP/dv = d2P/dv2 = 0 at Tc, Pc) impose on a cubic with given d1, d2.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CriticalConstants {
    /// a_c = Omega_a (R Tc)^2 / Pc.
    pub omega_a: f64,
    /// b = Omega_b R Tc / Pc.
    pub omega_b: f64,
    /// Zc = Pc vc / (R Tc) of the equation of state.
    pub zc: f64,
}

impl CriticalConstants {
    /// Derives the constants from d1 and d2.
    ///
    /// At the critical point the cubic in Z, Z^3 + ((u-1)B - 1) Z^2 + (A + (w-u)B^2 - uB) Z -
    /// (AB + wB^2 + wB^3) = 0 with u = d1 + d2 and w = d1 d2, must equal (Z - Zc)^3. Matching
    /// the Z^2 and Z terms gives Zc and A as functions of B; the constant term leaves one
    /// equation in B, solved here by bisection to machine precision.
    pub fn from_deltas(d1: f64, d2: f64) -> Self {
        let (u, w) = (d1 + d2, d1 * d2);
        let zc = |b: f64| (1.0 - (u - 1.0) * b) / 3.0;
        let a = |b: f64| 3.0 * zc(b).powi(2) - (w - u) * b * b + u * b;
        let g = |b: f64| a(b) * b + w * b * b + w * b * b * b - zc(b).powi(3);
        // g < 0 at B -> 0 (g -> -1/27) and g > 0 at B = 0.3 for every member of the family.
        let (mut lo, mut hi) = (0.0_f64, 0.3_f64);
        for _ in 0..200 {
            let mid = 0.5 * (lo + hi);
            if g(mid) < 0.0 {
                lo = mid;
            } else {
                hi = mid;
            }
            if hi - lo <= f64::EPSILON * hi {
                break;
            }
        }
        let b = 0.5 * (lo + hi);
        CriticalConstants {
            omega_a: a(b),
            omega_b: b,
            zc: zc(b),
        }
    }
}
