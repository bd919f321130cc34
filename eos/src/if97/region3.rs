//! IF97 region 3 (around the critical point, 623.15 K to T_B23(p), p_B23(T) to 100 MPa).
//!
//! A Helmholtz free energy in (T, rho) (IAPWS R7-97(2012) Eq. 28, Table 30):
//!
//! phi(delta, tau) = f/(RT) = n1 ln(delta) + sum_{i=2..40} n_i delta^I_i tau^J_i,
//! delta = rho / 322 kg/m3, tau = 647.096 K / T.
//!
//! Properties (Table 31): p = rho R T delta phi_delta, u = RT tau phi_tau,
//! s = R (tau phi_tau - phi), h = RT (tau phi_tau + delta phi_delta), cv = -R tau^2 phi_tautau,
//! cp = cv + R (delta phi_delta - delta tau phi_deltatau)^2 / (2 delta phi_delta + delta^2 phi_deltadelta),
//! w^2 = RT [2 delta phi_delta + delta^2 phi_deltadelta
//!           - (delta phi_delta - delta tau phi_deltatau)^2 / (tau^2 phi_tautau)].
//!
//! From (T, p) the density is found by a scan for a sign change of p(rho) - p on the branch the
//! saturation pressure selects (liquid-like above ps(T), vapour-like below it, single-valued
//! above the critical temperature), then a safeguarded Newton iteration inside that bracket.

use super::data::Tables;
use super::{If97State, Region, R, TC};
use crate::error::{Error, Result};

/// Critical density, kg/m3 (reducing density of region 3).
pub const RHO_C: f64 = 322.0;

/// delta phi_d, delta^2 phi_dd, tau phi_t, tau^2 phi_tt, delta tau phi_dt and phi.
#[derive(Debug, Clone, Copy)]
struct Helmholtz {
    phi: f64,
    d: f64,
    dd: f64,
    t: f64,
    tt: f64,
    dt: f64,
}

fn helmholtz(tables: &Tables, t: f64, rho: f64) -> Helmholtz {
    let delta = rho / RHO_C;
    let tau = TC / t;
    let n1 = tables.region3_n1;
    let s = tables.region3.sums(delta, tau);
    Helmholtz {
        phi: n1 * delta.ln() + s[0],
        d: n1 + s[1],
        dd: -n1 + s[2],
        t: s[3],
        tt: s[4],
        dt: s[5],
    }
}

/// Pressure (Pa) and dp/drho (Pa m3/kg) at T (K) and rho (kg/m3).
fn pressure(tables: &Tables, t: f64, rho: f64) -> (f64, f64) {
    let f = helmholtz(tables, t, rho);
    (rho * R * t * f.d, R * t * (2.0 * f.d + f.dd))
}

/// Properties at T (K) and rho (kg/m3).
pub fn properties(tables: &Tables, t: f64, rho: f64) -> If97State {
    let f = helmholtz(tables, t, rho);
    let rt = R * t;
    let cv = -R * f.tt;
    let x = f.d - f.dt;
    let cp = cv + R * x * x / (2.0 * f.d + f.dd);
    let w2 = rt * (2.0 * f.d + f.dd - x * x / f.tt);
    If97State {
        region: Region::Three,
        t,
        p: rho * rt * f.d,
        rho,
        v: 1.0 / rho,
        h: rt * (f.t + f.d),
        u: rt * f.t,
        s: R * (f.t - f.phi),
        cp,
        cv,
        w: w2.sqrt(),
        z: f.d,
    }
}

/// Scan step for the bracket search, kg/m3.
const SCAN_STEP: f64 = 2.0;
/// Highest density scanned, kg/m3: region 3 reaches about 760 kg/m3 (623.15 K, 100 MPa), and
/// p(800 kg/m3) exceeds 100 MPa at every region-3 temperature, while the polynomial turns
/// unphysical (p falling, then negative) above about 850 kg/m3.
pub const RHO_SCAN_MAX: f64 = 800.0;
/// Newton/bisection iteration cap.
const MAX_ITER: usize = 100;

/// Density (kg/m3) at T (K) and p (Pa) in region 3. `liquid_side` selects the branch for
/// T < Tc (true when p >= ps(T)); above Tc either choice finds the single root.
pub fn density(tables: &Tables, t: f64, p: f64, liquid_side: bool) -> Result<f64> {
    let f = |rho: f64| pressure(tables, t, rho).0 - p;
    // Bracket [lo, hi] with f(lo) < 0 < f(hi).
    let (mut lo, mut hi);
    if liquid_side || t >= TC {
        hi = RHO_SCAN_MAX;
        if f(hi).is_nan() || f(hi) <= 0.0 {
            return Err(no_bracket(t, p));
        }
        loop {
            lo = hi - SCAN_STEP;
            if lo <= 0.0 {
                return Err(no_bracket(t, p));
            }
            if f(lo) < 0.0 {
                break;
            }
            hi = lo;
        }
    } else {
        // Vapour side: p(rho) rises from zero; start well below the ideal-gas density.
        lo = 0.25 * p / (R * t);
        if f(lo).is_nan() || f(lo) >= 0.0 {
            return Err(no_bracket(t, p));
        }
        loop {
            hi = lo + SCAN_STEP;
            if hi > RHO_SCAN_MAX {
                return Err(no_bracket(t, p));
            }
            if f(hi) > 0.0 {
                break;
            }
            lo = hi;
        }
    }
    let mut rho = 0.5 * (lo + hi);
    let mut last = f64::INFINITY;
    for _ in 0..MAX_ITER {
        let (pr, dp) = pressure(tables, t, rho);
        let r = pr - p;
        last = r;
        if r.abs() <= 1e-13 * p {
            return stable(tables, t, p, rho);
        }
        if r < 0.0 {
            lo = rho;
        } else {
            hi = rho;
        }
        let newton = rho - r / dp;
        rho = if dp > 0.0 && newton > lo && newton < hi {
            newton
        } else {
            0.5 * (lo + hi)
        };
        if hi - lo <= 4.0 * f64::EPSILON * hi {
            return stable(tables, t, p, rho);
        }
    }
    Err(Error::NotConverged {
        solver: "IF97 region 3 density from (T, p)",
        iterations: MAX_ITER,
        residual: last / p,
    })
}

/// Accepts a root only on a mechanically stable branch (dp/drho > 0).
fn stable(tables: &Tables, t: f64, p: f64, rho: f64) -> Result<f64> {
    if pressure(tables, t, rho).1 > 0.0 {
        Ok(rho)
    } else {
        Err(Error::NoSolution(format!(
            "IF97 region 3: the density found at T = {t} K, p = {p} Pa ({rho} kg/m3) is on the \
             unstable branch (dp/drho <= 0)"
        )))
    }
}

fn no_bracket(t: f64, p: f64) -> Error {
    Error::NoSolution(format!(
        "IF97 region 3: no density between 0 and {RHO_SCAN_MAX} kg/m3 gives p = {p} Pa at T = {t} K"
    ))
}
