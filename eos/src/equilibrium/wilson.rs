//! Initial estimates from corresponding states: Wilson's K-values and the vapour pressure
//! implied by the definition of the acentric factor.
//!
//! Wilson's correlation (G. M. Wilson, *A modified Redlich-Kwong equation of state,
//! application to general physical data calculations*, AIChE National Meeting, Cleveland,
//! 1969, paper 15C):
//!
//! ln K_i = ln(Pc_i / P) + 5.373 (1 + omega_i) (1 - Tc_i / T)
//!
//! 5.373 = (7/3) ln 10, so that at P = Pc_i 10^(7/3 (1 + omega_i)(1 - Tc_i/T)), the vapour
//! pressure line through the critical point and through Tr = 0.7 with Pitzer's definition of
//! omega (K. S. Pitzer et al., J. Am. Chem. Soc. 77 (1955) 3433), K_i = 1.

use crate::component::Component;

/// (7/3) ln 10.
const WILSON: f64 = 7.0 / 3.0 * std::f64::consts::LN_10;

/// ln of Wilson's K-value of a component at (T, P).
#[inline]
pub fn ln_k(c: &Component, t: f64, p: f64) -> f64 {
    (c.pc / p).ln() + WILSON * (1.0 + c.omega) * (1.0 - c.tc / t)
}

/// Estimated vapour pressure of a pure component, P = Pc 10^(7/3 (1 + omega)(1 - Tc/T)), Pa.
#[inline]
pub fn vapour_pressure(c: &Component, t: f64) -> f64 {
    c.pc * (WILSON * (1.0 + c.omega) * (1.0 - c.tc / t)).exp()
}

/// Inverse of [`vapour_pressure`]: the temperature (K) at which the estimate equals `p`.
#[inline]
pub fn vapour_temperature(c: &Component, p: f64) -> f64 {
    c.tc / (1.0 - (p / c.pc).ln() / (WILSON * (1.0 + c.omega)))
}

/// Bubble-point pressure of feed z at T from Wilson's K-values: sum z_i K_i = 1 gives
/// P = sum z_i Pc_i exp(5.373 (1 + omega_i)(1 - Tc_i/T)).
pub fn bubble_pressure(comps: &[Component], z: &[f64], t: f64) -> f64 {
    comps
        .iter()
        .zip(z)
        .map(|(c, zi)| zi * vapour_pressure(c, t))
        .sum()
}

/// Dew-point pressure of feed z at T from Wilson's K-values: sum z_i / K_i = 1.
pub fn dew_pressure(comps: &[Component], z: &[f64], t: f64) -> f64 {
    1.0 / comps
        .iter()
        .zip(z)
        .map(|(c, zi)| zi / vapour_pressure(c, t))
        .sum::<f64>()
}

/// Temperature at which `f(T)` (increasing in T) equals `p`, by bisection on ln T over
/// [1, 1e5] K; used to invert the Wilson bubble and dew pressures.
fn invert(f: impl Fn(f64) -> f64, p: f64) -> Option<f64> {
    let (mut lo, mut hi) = (1.0_f64.ln(), 1e5_f64.ln());
    if !(f(lo.exp()) < p && f(hi.exp()) > p) {
        return None;
    }
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if f(mid.exp()) < p {
            lo = mid;
        } else {
            hi = mid;
        }
        if hi - lo < 1e-12 {
            break;
        }
    }
    Some((0.5 * (lo + hi)).exp())
}

/// Bubble-point temperature of feed z at P from Wilson's K-values.
pub fn bubble_temperature(comps: &[Component], z: &[f64], p: f64) -> Option<f64> {
    invert(|t| bubble_pressure(comps, z, t), p)
}

/// Dew-point temperature of feed z at P from Wilson's K-values.
pub fn dew_temperature(comps: &[Component], z: &[f64], p: f64) -> Option<f64> {
    invert(|t| dew_pressure(comps, z, t), p)
}
