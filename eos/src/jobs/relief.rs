//! Gas properties at relieving conditions for relief-device sizing: Z, the real-gas
//! isentropic exponent k = -(v/P)(dP/dv)_s (see [`crate::properties`]), the ideal-gas
//! cp0/cv0 and the molar mass.
//!
//! Ideal-gas sizing formulas for gas and vapour relief take Z as a correction factor and k
//! from cp/cv; common practice holds them reliable for 0.8 <= Z <= 1.1 and advises a
//! real-gas (e.g. isentropic nozzle-flow) method outside that range, which
//! [`Relief::z_outside_range`] flags.
//!
//! For those formulas, [`critical_pressure_ratio`] and [`sizing_coefficient`] give the choked
//! (critical) pressure ratio of an ideal-gas isentropic nozzle and the gas coefficient C of
//! the critical-flow sizing equation of API Standard 520 Part I (SI form).

use crate::constants::R;
use crate::error::{Error, Result};
use crate::jobs::equilibrium_state::{at_tp, EqState};
use crate::model::Model;
use crate::phase::Phase;

/// The range of Z in which ideal-gas sizing formulas are commonly accepted.
pub const Z_RANGE: (f64, f64) = (0.8, 1.1);

/// Relief inputs at one state.
#[derive(Debug, Clone, PartialEq)]
pub struct Relief {
    /// The state at relieving conditions.
    pub state: EqState,
    /// Compressibility factor.
    pub z: f64,
    /// Real-gas isentropic exponent.
    pub k_real: f64,
    /// Ideal-gas cp0/cv0 at the relieving temperature.
    pub k_ideal: f64,
    /// Molar mass, kg/mol.
    pub molar_mass: f64,
    /// True when Z lies outside [`Z_RANGE`].
    pub z_outside_range: bool,
}

/// Relief inputs at (t, p); two-phase or liquid relieving conditions are refused (the gas
/// formulas do not apply).
pub fn at(model: &dyn Model, t: f64, p: f64, x: &[f64]) -> Result<Relief> {
    let s = at_tp(model, t, p, x)?;
    let refuse = |what: String| Error::OutOfRange {
        model: model.id().to_string(),
        what: "relieving conditions",
        detail: what,
    };
    if matches!(s.phase, Phase::TwoPhase | Phase::Liquid) {
        return Err(refuse(format!(
            "the fluid is {} at {t} K, {p} Pa: gas relief inputs do not apply",
            s.phase
        )));
    }
    let props = s
        .props
        .as_ref()
        .ok_or_else(|| refuse("no single-phase properties".to_string()))?;
    let k_real = props
        .isentropic_exponent
        .ok_or_else(|| refuse("the state is mechanically unstable".to_string()))?;
    let cp0 = model.ideal_gas(t, x).cp_r * R;
    Ok(Relief {
        z: s.z,
        k_real,
        k_ideal: cp0 / (cp0 - R),
        molar_mass: s.molar_mass,
        z_outside_range: s.z < Z_RANGE.0 || s.z > Z_RANGE.1,
        state: s,
    })
}

/// Below this distance from k = 1 the k -> 1 limits are used (the closed forms divide by
/// k - 1; the limits are continuous, so the switch is invisible at printed precision).
const NEAR_ONE: f64 = 1e-6;

/// The flow function psi(k) = sqrt(k (2/(k+1))^((k+1)/(k-1))) of choked ideal-gas isentropic
/// nozzle flow, G = P1 sqrt(M/(Z R T)) psi; at k = 1 its limit e^(-1/2).
fn flow_function(k: f64) -> f64 {
    if (k - 1.0).abs() < NEAR_ONE {
        (-0.5f64).exp()
    } else {
        (k * (2.0 / (k + 1.0)).powf((k + 1.0) / (k - 1.0))).sqrt()
    }
}

/// Critical (choked-flow) pressure ratio P*/P1 = (2/(k+1))^(k/(k-1)) of an ideal-gas
/// isentropic nozzle (API Standard 520 Part I; any gas-dynamics text); at k = 1 its limit
/// e^(-1/2). Below it the flow through the nozzle is critical.
pub fn critical_pressure_ratio(k: f64) -> Result<f64> {
    if !(k.is_finite() && k > 0.0) {
        return Err(Error::invalid(
            "isentropic exponent",
            k,
            "a finite number above zero",
        ));
    }
    Ok(if (k - 1.0).abs() < NEAR_ONE {
        (-0.5f64).exp()
    } else {
        (2.0 / (k + 1.0)).powf(k / (k - 1.0))
    })
}

/// The gas coefficient C = 0.03948 psi(k) of the SI critical-flow sizing equation of API
/// Standard 520 Part I, A = W / (C K_d P1 K_b K_c) sqrt(T Z / M), with A in mm2, W in kg/h,
/// P1 in kPa abs, T in K and M in kg/kmol (0.03948 = 1e3 * 3600 / 1e6 / sqrt(8314.46), the
/// unit conversions with R in J/(kmol K)); the US-unit form is 520 psi(k).
pub fn sizing_coefficient(k: f64) -> Result<f64> {
    critical_pressure_ratio(k)?;
    Ok(0.03948 * flow_function(k))
}

#[cfg(test)]
mod sizing_tests {
    use super::*;

    /// The choked mass flux of an ideal-gas isentropic nozzle found by maximising over the
    /// throat pressure (energy balance, no closed form): G(r) = sqrt(2 k/(k-1) P1 rho1
    /// (r^(2/k) - r^((k+1)/k))), r = P/P1. Returns (r at the maximum, G_max / sqrt(P1 rho1)).
    fn choked_by_search(k: f64) -> (f64, f64) {
        let g = |r: f64| (2.0 * k / (k - 1.0) * (r.powf(2.0 / k) - r.powf((k + 1.0) / k))).sqrt();
        let (mut lo, mut hi) = (1e-6, 1.0 - 1e-9);
        for _ in 0..200 {
            let (a, b) = (lo + (hi - lo) / 3.0, hi - (hi - lo) / 3.0);
            if g(a) < g(b) {
                lo = a;
            } else {
                hi = b;
            }
        }
        let r = 0.5 * (lo + hi);
        (r, g(r))
    }

    #[test]
    fn the_closed_forms_are_the_maximum_of_the_nozzle_flux() {
        // With rho1 = P1 M/(Z R T), G_max = P1 sqrt(M/(Z R T)) psi = sqrt(P1 rho1) psi(k).
        for k in [1.05, 1.1, 1.2, 1.3, 1.4, 1.667, 2.0] {
            let (r, g) = choked_by_search(k);
            assert!(
                (r - critical_pressure_ratio(k).unwrap()).abs() < 1e-6,
                "k = {k}"
            );
            assert!((g - flow_function(k)).abs() < 1e-9, "k = {k}");
        }
    }

    #[test]
    fn textbook_and_standard_values() {
        // Air, k = 1.4: critical ratio 0.5283 (common practice, every gas-dynamics table).
        assert!((critical_pressure_ratio(1.4).unwrap() - 0.528282).abs() < 1e-6);
        // API 520 Part I tabulates C = 356 at k = 1.40 and 315 at k = 1.00 in US units
        // (recalled from memory): C_SI = C_US * 0.03948 / 520.
        assert!((520.0 * flow_function(1.4) - 356.0).abs() < 0.5);
        assert!((520.0 * flow_function(1.0) - 315.0).abs() < 0.5);
        assert!((sizing_coefficient(1.4).unwrap() - 356.0 * 0.03948 / 520.0).abs() < 2e-5);
    }

    #[test]
    fn k_near_one_is_continuous_and_bad_k_is_refused() {
        for k in [1.0 - 2e-6, 1.0 + 2e-6] {
            assert!((critical_pressure_ratio(k).unwrap() - (-0.5f64).exp()).abs() < 1e-6);
            assert!((flow_function(k) - (-0.5f64).exp()).abs() < 1e-6);
        }
        for k in [0.0, -1.0, f64::NAN, f64::INFINITY] {
            assert!(critical_pressure_ratio(k).is_err());
            assert!(sizing_coefficient(k).is_err());
        }
    }

    #[test]
    fn the_si_constant_is_the_unit_conversion() {
        // A [mm2] = 1e6 A [m2]; W [kg/h] = 3600 W [kg/s]; P1 [kPa] = P1 [Pa] / 1e3;
        // R = 8314.46 J/(kmol K) (CODATA 2018 molar gas constant times 1000).
        let c = 1e3 * 3600.0 / 1e6 / 8314.46f64.sqrt();
        assert!((c - 0.03948).abs() < 1e-5, "{c}");
    }
}
