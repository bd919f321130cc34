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
//! Above 251.165 K (the ice Ih - ice III - liquid triple point) the liquid borders ice III, V,
//! VI and VII at higher pressures; their melting curves, from the same release (coefficients
//! from memory; checked in the tests below: each curve ends at the next one's triple point,
//! 350.1 MPa at 256.164 K, 632.4 MPa at 273.31 K, 2216 MPa at 355 K, to 1e-5 relative):
//!
//! ```text
//! ice III (251.165-256.164 K): p/p* = 1 - 0.299948 (1 - theta^60),   T* 251.165 K, p* 208.566 MPa
//! ice V   (256.164-273.31 K):  p/p* = 1 - 1.18721 (1 - theta^8),     T* 256.164 K, p* 350.1 MPa
//! ice VI  (273.31-355 K):      p/p* = 1 - 1.07476 (1 - theta^4.6),   T* 273.31 K,  p* 632.4 MPa
//! ice VII (355-715 K):         ln(p/p*) = 1.73683 (1 - 1/theta) - 0.0544606 (1 - theta^5)
//!                                         + 0.806106e-7 (1 - theta^22), T* 355 K, p* 2216 MPa
//! ```

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

/// Highest temperature of the ice VII melting equation, K (IAPWS R14-08).
pub const T_MELTING_MAX: f64 = 715.0;

/// The pressure (Pa) above which liquid water freezes into one of the high-pressure ices at
/// T (K), from the ice Ih - III - liquid triple point (251.165 K) to 715 K; `None` outside.
pub fn melting_pressure_high(t: f64) -> Option<f64> {
    let simple = |t_star: f64, p_star: f64, a: f64, b: f64| {
        p_star * (1.0 - a * (1.0 - (t / t_star).powf(b)))
    };
    match t {
        t if t < T_MELTING_IH_MIN => None,
        t if t <= 256.164 => Some(simple(251.165, 208.566e6, 0.299_948, 60.0)),
        t if t <= 273.31 => Some(simple(256.164, 350.1e6, 1.187_21, 8.0)),
        t if t <= 355.0 => Some(simple(273.31, 632.4e6, 1.074_76, 4.6)),
        t if t <= T_MELTING_MAX => {
            let th = t / 355.0;
            let ln = 1.736_83 * (1.0 - 1.0 / th) - 0.054_460_6 * (1.0 - th.powi(5))
                + 0.806_106e-7 * (1.0 - th.powi(22));
            Some(2216e6 * ln.exp())
        }
        _ => None,
    }
}

/// True when a fluid name means ordinary water.
pub fn is_water(name: &str) -> bool {
    let n = name.trim().to_ascii_lowercase();
    n == "water" || n == "h2o" || n == "steam"
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_high_pressure_melting_curves_meet_at_their_triple_points() {
        // IAPWS R14-08 Table 3 (from memory): the ice III, V, VI and VII triple points with
        // liquid water; each curve must end where the next begins.
        let at = |t: f64| melting_pressure_high(t).unwrap();
        for (t, p) in [
            (256.164, 350.1e6),
            (273.31, 632.4e6),
            (355.0, 2216e6),
            (251.165, 208.566e6),
        ] {
            assert!((at(t) / p - 1.0).abs() < 1e-5, "{t} K: {}", at(t));
        }
        // Ice Ih's curve (its own equation) ends at the ice III triple point too.
        let ih = melting_pressure_ih(T_MELTING_IH_MIN).unwrap();
        assert!((ih / 208.566e6 - 1.0).abs() < 1e-4, "{ih}");
    }
}
