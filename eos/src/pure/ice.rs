//! Sublimation and melting pressures of ordinary water (ice Ih) below the triple point, from
//! IAPWS R14-08(2011), *Revised Release on the Pressure along the Melting and Sublimation
//! Curves of Ordinary Water Substance* (W. Wagner, T. Riethmann, R. Feistel, A. H. Harvey,
//! J. Phys. Chem. Ref. Data 40 (2011) 043103). Coefficients from memory of IAPWS R14-08;
//! checked in `eos/tests/pure_ice.rs` against both curves meeting at the triple point and the
//! release's check values as recalled.
//!
//! With the triple point T_t = 273.16 K, p_t = 611.657 Pa and theta = T / T_t:
//!
//! ```text
//! sublimation (50 K <= T <= 273.16 K):
//!     ln(p_subl / p_t) = theta^-1 sum_{i=1..3} a_i theta^b_i
//!     a = -0.212144006e2, 0.273203819e2, -0.610598130e1
//!     b =  0.333333333e-2, 0.120666667e1, 0.170333333e1
//!
//! melting of ice Ih (251.165 K <= T <= 273.16 K):
//!     p_melt / p_t = 1 + sum_{i=1..3} a_i (1 - theta^b_i)
//!     a = 0.119539337e7, 0.808183159e5, 0.333826860e4
//!     b = 0.300000e1, 0.257500e2, 0.103750e3
//! ```
//!
//! Below 251.165 K (the ice Ih - ice III - liquid triple point) the liquid borders ice III
//! and higher ices, whose melting curves are not given here.

use super::error::{PureError, PureResult};

/// Triple-point temperature of water, K (IAPWS R14-08).
pub const T_TRIPLE: f64 = 273.16;
/// Triple-point pressure of water, Pa (IAPWS R14-08).
pub const P_TRIPLE: f64 = 611.657;
/// Lowest temperature of the sublimation equation, K.
pub const T_SUBLIMATION_MIN: f64 = 50.0;
/// Lowest temperature of the ice Ih melting equation (ice Ih - III - liquid triple point), K.
pub const T_MELTING_IH_MIN: f64 = 251.165;

const SUBL_A: [f64; 3] = [-0.212144006e2, 0.273203819e2, -0.610598130e1];
const SUBL_B: [f64; 3] = [0.333333333e-2, 0.120666667e1, 0.170333333e1];
const MELT_A: [f64; 3] = [0.119539337e7, 0.808183159e5, 0.333826860e4];
const MELT_B: [f64; 3] = [0.300000e1, 0.257500e2, 0.103750e3];

fn out_of_range(what: &str, t: f64, lo: f64) -> PureError {
    PureError::OutOfRange {
        model: "IAPWS R14-08".to_string(),
        what: format!("{what} at T = {t} K"),
        range: format!("{lo} K to {T_TRIPLE} K"),
    }
}

/// Sublimation pressure of ice Ih (Pa) at T (K), 50 K to 273.16 K.
pub fn sublimation_pressure(t: f64) -> PureResult<f64> {
    if !(T_SUBLIMATION_MIN..=T_TRIPLE).contains(&t) {
        return Err(out_of_range(
            "the sublimation pressure",
            t,
            T_SUBLIMATION_MIN,
        ));
    }
    let theta = t / T_TRIPLE;
    let sum: f64 = SUBL_A
        .iter()
        .zip(SUBL_B)
        .map(|(a, b)| a * theta.powf(b))
        .sum();
    Ok(P_TRIPLE * (sum / theta).exp())
}

/// Melting pressure of ice Ih (Pa) at T (K), 251.165 K to 273.16 K.
pub fn melting_pressure_ih(t: f64) -> PureResult<f64> {
    if !(T_MELTING_IH_MIN..=T_TRIPLE).contains(&t) {
        return Err(out_of_range(
            "the ice Ih melting pressure",
            t,
            T_MELTING_IH_MIN,
        ));
    }
    let theta = t / T_TRIPLE;
    let sum: f64 = MELT_A
        .iter()
        .zip(MELT_B)
        .map(|(a, b)| a * (1.0 - theta.powf(b)))
        .sum();
    Ok(P_TRIPLE * (1.0 + sum))
}

/// True when a fluid name means ordinary water.
pub fn is_water(name: &str) -> bool {
    let n = name.trim().to_ascii_lowercase();
    n == "water" || n == "h2o" || n == "steam"
}
