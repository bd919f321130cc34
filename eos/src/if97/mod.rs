//! IAPWS-IF97: the industrial formulation for water and steam.
//!
//! IAPWS R7-97(2012), *Revised Release on the IAPWS Industrial Formulation 1997 for the
//! Thermodynamic Properties of Water and Steam* (region 5 as revised in 2007, to 50 MPa).
//!
//! | region | form | variables | module |
//! |---|---|---|---|
//! | 1 (liquid) | Gibbs gamma = sum n (7.1 - pi)^I (tau - 1.222)^J | pi = p/16.53 MPa, tau = 1386 K/T | [`region1`] |
//! | 2 (vapour) | gamma = ln pi + sum n0 tau^J0 + sum n pi^I (tau - 0.5)^J | pi = p/1 MPa, tau = 540 K/T | [`region2`] |
//! | 3 (near-critical) | Helmholtz phi = n1 ln delta + sum n delta^I tau^J | delta = rho/322, tau = 647.096 K/T | [`region3`] |
//! | 4 (saturation) | ps(T) and Ts(p), Eqs. 30-31 | | [`region4`] |
//! | 5 (hot gas) | gamma = ln pi + sum n0 tau^J0 + sum n pi^I tau^J | pi = p/1 MPa, tau = 1000 K/T | [`region5`] |
//! | B23 | p = n1 + n2 T + n3 T^2 | | [`b23`] |
//!
//! The specific gas constant of IF97 is R = 461.526 J/(kg K) (not the IAPWS-95 value).
//! IF97 is a set of (T, p) equations, not a Helmholtz function of (T, rho) over its whole
//! range, so it stands beside [`crate::Model`] with its own API: [`props_tp`], [`psat`],
//! [`tsat`]. Model id `if97`. Results are on a mass basis (J/kg, m3/kg).
//!
//! The coefficients are embedded from `eos/data/if97/*.csv`, each file naming its table.

pub mod data;
mod gibbs;

pub mod b23;
pub mod ph_ps;
pub mod region1;
pub mod region2;
pub mod region3;
pub mod region4;
pub mod region5;
pub mod state;

pub use b23::{p_b23, t_b23};
pub use region4::{psat, tsat};
pub use state::{props_region3_trho, props_tp, region_tp, If97State, Region};

/// Model id of the formulation.
pub const ID: &str = "if97";
/// Specific gas constant of IF97, J/(kg K) (R7-97(2012) Eq. 1).
pub const R: f64 = 461.526;
/// Critical temperature, K.
pub const TC: f64 = 647.096;
/// Critical pressure, Pa.
pub const PC: f64 = 22.064e6;
/// Lowest temperature of the formulation, K.
pub const T_MIN: f64 = 273.15;
