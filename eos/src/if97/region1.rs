//! IF97 region 1 (compressed liquid, 273.15-623.15 K, ps(T) to 100 MPa).
//!
//! gamma(pi, tau) = g/(RT) = sum_{i=1..34} n_i (7.1 - pi)^I_i (tau - 1.222)^J_i,
//! pi = p / 16.53 MPa, tau = 1386 K / T (IAPWS R7-97(2012) Eq. 7, Table 2).

use super::data::Tables;
use super::gibbs::Gibbs;
use super::{If97State, Region, R};

/// Reducing pressure p* of region 1, Pa.
pub const P_STAR: f64 = 16.53e6;
/// Reducing temperature T* of region 1, K.
pub const T_STAR: f64 = 1386.0;

/// gamma and its derivatives at (pi, tau).
pub fn gibbs(tables: &Tables, pi: f64, tau: f64) -> Gibbs {
    let a = 7.1 - pi;
    let b = tau - 1.222;
    let s = tables.region1.sums(a, b);
    Gibbs {
        g: s[0],
        g_p: -s[1] / a,
        g_pp: s[2] / (a * a),
        g_t: s[3] / b,
        g_tt: s[4] / (b * b),
        g_pt: -s[5] / (a * b),
    }
}

/// Properties at T (K) and p (Pa); the caller has checked that the state is in region 1.
pub fn properties(tables: &Tables, t: f64, p: f64) -> If97State {
    let (pi, tau) = (p / P_STAR, T_STAR / t);
    gibbs(tables, pi, tau).properties(Region::One, t, p, pi, tau, R)
}
