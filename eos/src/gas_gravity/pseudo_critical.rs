//! Pseudo-critical temperature and pressure of a natural gas from its gas gravity
//! (gamma = M / M_air).
//!
//! - Sutton (1985), SPE 14265 (hydrocarbon gases), in degrees Rankine and psia:
//!   Tpc = 169.2 + 349.5 gamma - 74.0 gamma^2, Ppc = 756.8 - 131.0 gamma - 3.6 gamma^2;
//!   fitted for 0.57 <= gamma <= 1.68.
//! - Standing (1977), *Volumetric and Phase Behavior of Oil Field Hydrocarbon Systems*, SPE:
//!   natural gas Tpc = 168 + 325 gamma - 12.5 gamma^2, Ppc = 677 + 15 gamma - 37.5 gamma^2;
//!   condensate Tpc = 187 + 330 gamma - 71.5 gamma^2, Ppc = 706 - 51.7 gamma - 11.1 gamma^2.
//!   No fitted range is recalled with confidence for Standing's equations, so only the general
//!   gravity limits apply.
//!
//! All coefficients from memory of the cited sources. A gravity below that of methane
//! (16.043/28.9647 = 0.5539; the limit is that value less rounding, 0.553) or above 2 is no
//! natural gas and is refused.

use super::units::{K_PER_RANKINE, PA_PER_PSI};
use super::warning::{check, RangeWarning};
use crate::error::{Error, Result};

/// Lowest gas gravity accepted: methane's.
pub const GRAVITY_MIN: f64 = 0.553;
/// Highest gas gravity accepted.
pub const GRAVITY_MAX: f64 = 2.0;

/// Which gravity correlation.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum GravityCorrelation {
    /// Sutton (1985).
    #[default]
    Sutton,
    /// Standing (1977), natural (dry) gas.
    StandingGas,
    /// Standing (1977), gas condensate.
    StandingCondensate,
}

/// Pseudo-critical point in SI units.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PseudoCriticalPoint {
    /// K.
    pub tpc: f64,
    /// Pa.
    pub ppc: f64,
}

/// Tpc and Ppc of a gas of gravity `gamma`; warnings go to `warnings`.
pub fn pseudo_critical(
    gamma: f64,
    correlation: GravityCorrelation,
    warnings: &mut Vec<RangeWarning>,
) -> Result<PseudoCriticalPoint> {
    if !(gamma.is_finite() && (GRAVITY_MIN..=GRAVITY_MAX).contains(&gamma)) {
        return Err(Error::invalid(
            "gas gravity",
            gamma,
            format!("{GRAVITY_MIN} (methane) to {GRAVITY_MAX}"),
        ));
    }
    let g2 = gamma * gamma;
    let (t_r, p_psi) = match correlation {
        GravityCorrelation::Sutton => {
            check(warnings, "Sutton (1985)", "gas gravity", gamma, 0.57, 1.68);
            (
                169.2 + 349.5 * gamma - 74.0 * g2,
                756.8 - 131.0 * gamma - 3.6 * g2,
            )
        }
        GravityCorrelation::StandingGas => (
            168.0 + 325.0 * gamma - 12.5 * g2,
            677.0 + 15.0 * gamma - 37.5 * g2,
        ),
        GravityCorrelation::StandingCondensate => (
            187.0 + 330.0 * gamma - 71.5 * g2,
            706.0 - 51.7 * gamma - 11.1 * g2,
        ),
    };
    Ok(PseudoCriticalPoint {
        tpc: t_r * K_PER_RANKINE,
        ppc: p_psi * PA_PER_PSI,
    })
}
