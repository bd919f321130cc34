//! A water or steam state from (T, p): range check, region selection and evaluation.
//!
//! Regions from IAPWS R7-97(2012), Fig. 1 and Sec. 4:
//! - 273.15 K <= T <= 623.15 K: region 1 when p >= ps(T), region 2 below (a state exactly on
//!   the saturation line is reported as saturated liquid, region 1);
//! - 623.15 K < T <= 863.15 K: region 3 when p > p_B23(T), region 2 otherwise;
//! - 863.15 K < T <= 1073.15 K: region 2;
//! - 1073.15 K < T <= 2273.15 K: region 5, to 50 MPa.
//!
//! The formulation is defined for 273.15-1073.15 K up to 100 MPa and 1073.15-2273.15 K up
//! to 50 MPa; any other (T, p) is refused with [`Error::OutOfRange`] naming that range.

use super::{b23, data, region1, region2, region3, region4, region5, TC, T_MIN};
use crate::error::{Error, Result};

/// The IF97 region a state belongs to.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Region {
    /// Region 1: compressed liquid.
    One,
    /// Region 2: vapour and gas.
    Two,
    /// Region 3: near-critical, (T, rho) formulation.
    Three,
    /// Region 5: high-temperature gas.
    Five,
}

impl Region {
    /// The region number of the release.
    pub fn number(self) -> u8 {
        match self {
            Region::One => 1,
            Region::Two => 2,
            Region::Three => 3,
            Region::Five => 5,
        }
    }
}

/// Properties of one IF97 state, mass basis, SI units.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct If97State {
    /// The region whose equation gave the values.
    pub region: Region,
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
    /// Density, kg/m3.
    pub rho: f64,
    /// Specific volume, m3/kg.
    pub v: f64,
    /// Specific enthalpy, J/kg.
    pub h: f64,
    /// Specific internal energy, J/kg.
    pub u: f64,
    /// Specific entropy, J/(kg K).
    pub s: f64,
    /// Specific isobaric heat capacity, J/(kg K).
    pub cp: f64,
    /// Specific isochoric heat capacity, J/(kg K).
    pub cv: f64,
    /// Speed of sound, m/s.
    pub w: f64,
    /// Compression factor p v / (R T) with the IF97 gas constant.
    pub z: f64,
}

/// Upper temperature of regions 1-3 and 2, K.
pub const T_MAX_LOW: f64 = 1073.15;
/// Upper temperature of region 5, K.
pub const T_MAX_HIGH: f64 = 2273.15;
/// Upper pressure up to 1073.15 K, Pa.
pub const P_MAX_LOW: f64 = 100e6;
/// Upper pressure of region 5, Pa.
pub const P_MAX_HIGH: f64 = 50e6;

fn out_of_range(t: f64, p: f64) -> Error {
    Error::OutOfRange {
        model: "if97".into(),
        what: "(T, p)",
        detail: format!(
            "T = {t} K, p = {p} Pa: IAPWS-IF97 covers 273.15-1073.15 K up to 100 MPa and \
             1073.15-2273.15 K up to 50 MPa"
        ),
    }
}

/// The region of (T, p), after the range check.
pub fn region_tp(t: f64, p: f64) -> Result<Region> {
    let tables = data::tables()?;
    region_with(tables, t, p)
}

fn region_with(tables: &data::Tables, t: f64, p: f64) -> Result<Region> {
    if !(t.is_finite() && p.is_finite() && p > 0.0) {
        return Err(Error::InvalidInput {
            what: "(T, p)",
            value: format!("({t}, {p})"),
            accepted: "finite temperature and a finite pressure above zero".into(),
        });
    }
    if !(T_MIN..=T_MAX_HIGH).contains(&t) {
        return Err(out_of_range(t, p));
    }
    if t <= T_MAX_LOW {
        if p > P_MAX_LOW {
            return Err(out_of_range(t, p));
        }
        if t <= b23::T_LOW {
            if p >= region4::psat_unchecked(tables, t) {
                Ok(Region::One)
            } else {
                Ok(Region::Two)
            }
        } else if t <= b23::T_HIGH && p > b23::p_b23_unchecked(tables, t) {
            Ok(Region::Three)
        } else {
            Ok(Region::Two)
        }
    } else if p > P_MAX_HIGH {
        Err(out_of_range(t, p))
    } else {
        Ok(Region::Five)
    }
}

/// Every property of water or steam at temperature `t_k` (K) and pressure `p_pa` (Pa).
pub fn props_tp(t_k: f64, p_pa: f64) -> Result<If97State> {
    let tables = data::tables()?;
    let state = match region_with(tables, t_k, p_pa)? {
        Region::One => region1::properties(tables, t_k, p_pa),
        Region::Two => region2::properties(tables, t_k, p_pa),
        Region::Five => region5::properties(tables, t_k, p_pa),
        Region::Three => {
            let liquid = t_k >= TC || p_pa >= region4::psat_unchecked(tables, t_k);
            let rho = region3::density(tables, t_k, p_pa, liquid)?;
            let mut s = region3::properties(tables, t_k, rho);
            s.p = p_pa;
            s
        }
    };
    finite(state)
}

/// Region-3 properties at temperature `t_k` (K) and density `rho` (kg/m3), the native form
/// of region 3. Accepted for 623.15 K <= T <= 863.15 K and 0 < rho <= 800 kg/m3; whether the
/// point lies inside region 3 proper (p between p_B23 and 100 MPa) is the caller's concern.
pub fn props_region3_trho(t_k: f64, rho: f64) -> Result<If97State> {
    let tables = data::tables()?;
    if !(t_k.is_finite() && (b23::T_LOW..=b23::T_HIGH).contains(&t_k)) {
        return Err(Error::OutOfRange {
            model: "if97".into(),
            what: "temperature",
            detail: format!("T = {t_k} K: region 3 spans 623.15-863.15 K"),
        });
    }
    if !(rho.is_finite() && rho > 0.0 && rho <= region3::RHO_SCAN_MAX) {
        return Err(Error::invalid(
            "density (kg/m3)",
            rho,
            "a density above zero and at most 800 kg/m3",
        ));
    }
    finite(region3::properties(tables, t_k, rho))
}

/// Refuses a state with a non-finite property (for example w inside the spinodal of region 3).
fn finite(s: If97State) -> Result<If97State> {
    let all = [s.rho, s.v, s.h, s.u, s.s, s.cp, s.cv, s.w, s.z];
    if all.iter().all(|v| v.is_finite()) {
        Ok(s)
    } else {
        Err(Error::NoSolution(format!(
            "IF97 region {} gives a non-finite property at T = {} K, p = {} Pa",
            s.region.number(),
            s.t,
            s.p
        )))
    }
}
