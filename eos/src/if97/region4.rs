//! IF97 region 4: the saturation line, both directions (IAPWS R7-97(2012) Eqs. 30 and 31,
//! Table 34). With T in K and ps in MPa:
//!
//! - theta = T + n9/(T - n10), A = theta^2 + n1 theta + n2, B = n3 theta^2 + n4 theta + n5,
//!   C = n6 theta^2 + n7 theta + n8, ps = [2C / (-B + sqrt(B^2 - 4AC))]^4
//! - beta = ps^(1/4), E = beta^2 + n3 beta + n6, F = n1 beta^2 + n4 beta + n7,
//!   G = n2 beta^2 + n5 beta + n8, D = 2G / (-F - sqrt(F^2 - 4EG)),
//!   Ts = [n10 + D - sqrt((n10 + D)^2 - 4(n9 + n10 D))] / 2
//!
//! Valid from 273.15 K to the critical temperature 647.096 K.

use super::data::Tables;
use super::{TC, T_MIN};
use crate::error::{Error, Result};

/// ps(T) in Pa; the caller has checked T_MIN <= T <= TC.
pub fn psat_unchecked(tables: &Tables, t: f64) -> f64 {
    let n = &tables.region4;
    let theta = t + n[8] / (t - n[9]);
    let a = theta * theta + n[0] * theta + n[1];
    let b = n[2] * theta * theta + n[3] * theta + n[4];
    let c = n[5] * theta * theta + n[6] * theta + n[7];
    (2.0 * c / (-b + (b * b - 4.0 * a * c).sqrt())).powi(4) * 1e6
}

/// Ts(p) in K; the caller has checked the pressure range.
pub fn tsat_unchecked(tables: &Tables, p: f64) -> f64 {
    let n = &tables.region4;
    let beta = (p / 1e6).powf(0.25);
    let e = beta * beta + n[2] * beta + n[5];
    let f = n[0] * beta * beta + n[3] * beta + n[6];
    let g = n[1] * beta * beta + n[4] * beta + n[7];
    let d = 2.0 * g / (-f - (f * f - 4.0 * e * g).sqrt());
    let s = n[9] + d;
    0.5 * (s - (s * s - 4.0 * (n[8] + n[9] * d)).sqrt())
}

/// Saturation pressure (Pa) at temperature `t` (K), 273.15 K <= t <= 647.096 K.
pub fn psat(t: f64) -> Result<f64> {
    let tables = super::data::tables()?;
    if !(t.is_finite() && (T_MIN..=TC).contains(&t)) {
        return Err(Error::OutOfRange {
            model: "if97".into(),
            what: "temperature",
            detail: format!(
                "T = {t} K: the saturation line of region 4 runs from {T_MIN} K to {TC} K"
            ),
        });
    }
    Ok(psat_unchecked(tables, t))
}

/// Saturation temperature (K) at pressure `p` (Pa), from ps(273.15 K) = 611.213 Pa to the
/// critical pressure 22.064 MPa.
pub fn tsat(p: f64) -> Result<f64> {
    let tables = super::data::tables()?;
    let p_min = psat_unchecked(tables, T_MIN);
    let p_max = super::PC;
    if !(p.is_finite() && p >= p_min * (1.0 - 1e-12) && p <= p_max) {
        return Err(Error::OutOfRange {
            model: "if97".into(),
            what: "pressure",
            detail: format!(
                "p = {p} Pa: the saturation line of region 4 runs from {p_min:.6} Pa to {p_max} Pa"
            ),
        });
    }
    Ok(tsat_unchecked(tables, p))
}
