//! Wichert-Aziz correction of pseudo-critical constants for sour gas.
//!
//! E. Wichert, K. Aziz, *Calculate Z's for sour gases*, Hydrocarbon Processing 51 (May 1972)
//! 119-122 (from memory of the paper). With A = y_CO2 + y_H2S and B = y_H2S (mole fractions):
//!
//! epsilon = 120 (A^0.9 - A^1.6) + 15 (B^0.5 - B^4) (degrees Rankine),
//! T'pc = Tpc - epsilon, P'pc = Ppc T'pc / (Tpc + B (1 - B) epsilon).
//!
//! The data behind the correction reached about 54.4 mol % CO2 and 73.8 mol % H2S (from memory
//! of the paper); beyond that a warning is returned.

use super::pseudo_critical::PseudoCriticalPoint;
use super::units::K_PER_RANKINE;
use super::warning::{check, RangeWarning};
use crate::error::{Error, Result};

const NAME: &str = "Wichert-Aziz (1972)";

/// The correction epsilon in K for CO2 and H2S mole fractions.
pub fn epsilon(y_co2: f64, y_h2s: f64) -> f64 {
    let a = y_co2 + y_h2s;
    let b = y_h2s;
    (120.0 * (a.powf(0.9) - a.powf(1.6)) + 15.0 * (b.sqrt() - b.powi(4))) * K_PER_RANKINE
}

/// Applies the correction to a pseudo-critical point.
pub fn correct(
    pc: PseudoCriticalPoint,
    y_co2: f64,
    y_h2s: f64,
    warnings: &mut Vec<RangeWarning>,
) -> Result<PseudoCriticalPoint> {
    for (what, y) in [("CO2 mole fraction", y_co2), ("H2S mole fraction", y_h2s)] {
        if !(y.is_finite() && (0.0..=1.0).contains(&y)) {
            return Err(Error::invalid(what, y, "a mole fraction from 0 to 1"));
        }
    }
    if y_co2 + y_h2s > 1.0 {
        return Err(Error::invalid(
            "CO2 + H2S mole fraction",
            y_co2 + y_h2s,
            "at most 1",
        ));
    }
    check(warnings, NAME, "CO2 mole fraction", y_co2, 0.0, 0.544);
    check(warnings, NAME, "H2S mole fraction", y_h2s, 0.0, 0.738);
    let e = epsilon(y_co2, y_h2s);
    let t = pc.tpc - e;
    let b = y_h2s;
    Ok(PseudoCriticalPoint {
        tpc: t,
        ppc: pc.ppc * t / (pc.tpc + b * (1.0 - b) * e),
    })
}
