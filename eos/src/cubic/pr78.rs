//! Peng-Robinson (1978): the 1976 equation with kappa revised for omega > 0.491,
//! kappa = 0.379642 + 1.48503 omega - 0.164423 omega^2 + 0.016666 omega^3.
//! D. B. Robinson, D.-Y. Peng, *The characterization of the heptanes and heavier fractions for
//! the GPA Peng-Robinson programs*, GPA Research Report RR-28 (1978).

use super::{pr76, Alpha, CubicSpec};
use std::f64::consts::SQRT_2;

fn kappa(omega: f64) -> f64 {
    if omega <= 0.491 {
        pr76::kappa(omega)
    } else {
        0.379642 + 1.48503 * omega - 0.164423 * omega * omega + 0.016666 * omega.powi(3)
    }
}

pub const SPEC: CubicSpec = CubicSpec {
    id: "pr78",
    name: "Peng-Robinson (1978)",
    citation: "D. B. Robinson, D.-Y. Peng, GPA Research Report RR-28 (1978)",
    d1: 1.0 + SQRT_2,
    d2: 1.0 - SQRT_2,
    alpha: Alpha::Soave(kappa),
};
