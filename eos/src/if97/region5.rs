//! IF97 region 5 (high-temperature gas, 1073.15-2273.15 K, up to 50 MPa; the 2007 revision).
//!
//! gamma = gamma0 + gammar, pi = p / 1 MPa, tau = 1000 K / T (IAPWS R7-97(2012) Eqs. 32-34):
//! - gamma0 = ln pi + sum_{i=1..6} n0_i tau^J0_i (Table 37)
//! - gammar = sum_{i=1..6} n_i pi^I_i tau^J_i (Table 38)

use super::data::Tables;
use super::gibbs::Gibbs;
use super::{If97State, Region, R};

/// Reducing pressure of region 5, Pa.
pub const P_STAR: f64 = 1.0e6;
/// Reducing temperature of region 5, K.
pub const T_STAR: f64 = 1000.0;

/// gamma and its derivatives at (pi, tau).
pub fn gibbs(tables: &Tables, pi: f64, tau: f64) -> Gibbs {
    let i0 = tables.region5_ideal.sums(1.0, tau);
    let r = tables.region5_residual.sums(pi, tau);
    Gibbs {
        g: pi.ln() + i0[0] + r[0],
        g_p: (1.0 + r[1]) / pi,
        g_pp: (-1.0 + r[2]) / (pi * pi),
        g_t: (i0[3] + r[3]) / tau,
        g_tt: (i0[4] + r[4]) / (tau * tau),
        g_pt: r[5] / (pi * tau),
    }
}

/// Properties at T (K) and p (Pa); the caller has checked that the state is in region 5.
pub fn properties(tables: &Tables, t: f64, p: f64) -> If97State {
    let (pi, tau) = (p / P_STAR, T_STAR / t);
    gibbs(tables, pi, tau).properties(Region::Five, t, p, pi, tau, R)
}
