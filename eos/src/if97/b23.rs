//! The boundary between IF97 regions 2 and 3 (B23), IAPWS R7-97(2012) Eqs. 5 and 6, Table 1:
//! p = n1 + n2 T + n3 T^2 and its inverse T = n4 + sqrt((p - n5)/n3), with p in MPa, T in K.
//! Defined from 623.15 K (16.529 MPa) to 863.15 K (100 MPa).

use super::data::Tables;
use crate::error::{Error, Result};

/// Lowest temperature of the B23 line, K.
pub const T_LOW: f64 = 623.15;
/// Highest temperature of the B23 line, K.
pub const T_HIGH: f64 = 863.15;

/// p_B23(T) in Pa, no range check.
pub fn p_b23_unchecked(tables: &Tables, t: f64) -> f64 {
    let n = &tables.b23;
    (n[0] + n[1] * t + n[2] * t * t) * 1e6
}

/// T_B23(p) in K, no range check.
pub fn t_b23_unchecked(tables: &Tables, p: f64) -> f64 {
    let n = &tables.b23;
    n[3] + ((p / 1e6 - n[4]) / n[2]).sqrt()
}

fn range(what: &'static str, detail: String) -> Error {
    Error::OutOfRange {
        model: "if97".into(),
        what,
        detail,
    }
}

/// Pressure (Pa) of the region 2-3 boundary at temperature `t` (K), 623.15-863.15 K.
pub fn p_b23(t: f64) -> Result<f64> {
    let tables = super::data::tables()?;
    if !(t.is_finite() && (T_LOW..=T_HIGH).contains(&t)) {
        return Err(range(
            "temperature",
            format!("T = {t} K: the B23 boundary is defined from {T_LOW} K to {T_HIGH} K"),
        ));
    }
    Ok(p_b23_unchecked(tables, t))
}

/// Temperature (K) of the region 2-3 boundary at pressure `p` (Pa), from p_B23(623.15 K) to
/// 100 MPa.
pub fn t_b23(p: f64) -> Result<f64> {
    let tables = super::data::tables()?;
    let lo = p_b23_unchecked(tables, T_LOW);
    let hi = p_b23_unchecked(tables, T_HIGH);
    if !(p.is_finite() && p >= lo * (1.0 - 1e-12) && p <= hi * (1.0 + 1e-12)) {
        return Err(range(
            "pressure",
            format!("p = {p} Pa: the B23 boundary is defined from {lo:.6e} Pa to {hi:.6e} Pa"),
        ));
    }
    Ok(t_b23_unchecked(tables, p))
}
