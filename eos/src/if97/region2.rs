//! IF97 region 2 (vapour and gas up to 1073.15 K and 100 MPa, below ps(T) and the B23 line).
//!
//! gamma = gamma0 + gammar, pi = p / 1 MPa, tau = 540 K / T (IAPWS R7-97(2012) Eqs. 15-17):
//! - gamma0 = ln pi + sum_{i=1..9} n0_i tau^J0_i (Table 10)
//! - gammar = sum_{i=1..43} n_i pi^I_i (tau - 0.5)^J_i (Table 11)

use super::data::Tables;
use super::gibbs::Gibbs;
use super::{If97State, Region, R};

/// Reducing pressure of region 2, Pa.
pub const P_STAR: f64 = 1.0e6;
/// Reducing temperature of region 2, K.
pub const T_STAR: f64 = 540.0;

/// gamma and its derivatives at (pi, tau).
pub fn gibbs(tables: &Tables, pi: f64, tau: f64) -> Gibbs {
    let i0 = tables.region2_ideal.sums(1.0, tau);
    let b = tau - 0.5;
    let r = tables.region2_residual.sums(pi, b);
    Gibbs {
        g: pi.ln() + i0[0] + r[0],
        g_p: (1.0 + r[1]) / pi,
        g_pp: (-1.0 + r[2]) / (pi * pi),
        g_t: i0[3] / tau + r[3] / b,
        g_tt: i0[4] / (tau * tau) + r[4] / (b * b),
        g_pt: r[5] / (pi * b),
    }
}

/// Properties at T (K) and p (Pa); the caller has checked that the state is in region 2.
pub fn properties(tables: &Tables, t: f64, p: f64) -> If97State {
    let (pi, tau) = (p / P_STAR, T_STAR / t);
    gibbs(tables, pi, tau).properties(Region::Two, t, p, pi, tau, R)
}
