//! Peng-Robinson (1976): P = RT/(v - b) - a/(v^2 + 2bv - b^2), Soave-type alpha with
//! kappa = 0.37464 + 1.54226 omega - 0.26992 omega^2.
//! D.-Y. Peng, D. B. Robinson, Ind. Eng. Chem. Fundam. 15 (1976) 59-64.

use super::{Alpha, CubicSpec};
use std::f64::consts::SQRT_2;

/// kappa(omega) of the 1976 paper.
pub fn kappa(omega: f64) -> f64 {
    0.37464 + 1.54226 * omega - 0.26992 * omega * omega
}

pub const SPEC: CubicSpec = CubicSpec {
    id: "pr",
    name: "Peng-Robinson (1976)",
    citation: "D.-Y. Peng, D. B. Robinson, Ind. Eng. Chem. Fundam. 15 (1976) 59-64",
    d1: 1.0 + SQRT_2,
    d2: 1.0 - SQRT_2,
    alpha: Alpha::Soave(kappa),
};
