//! Validation of mole-fraction vectors.

use crate::error::{Error, Result};

/// How far from one the sum of fractions may be before it is refused.
pub const SUM_TOLERANCE: f64 = 1e-9;

/// Checks that `x` has `n` finite, non-negative fractions summing to one.
pub fn check(x: &[f64], n: usize) -> Result<()> {
    if x.len() != n {
        return Err(Error::invalid(
            "number of mole fractions",
            x.len() as f64,
            format!("one per component ({n})"),
        ));
    }
    for &xi in x {
        if !xi.is_finite() || xi < 0.0 {
            return Err(Error::invalid(
                "mole fraction",
                xi,
                "a finite number from 0 to 1",
            ));
        }
    }
    let sum: f64 = x.iter().sum();
    if (sum - 1.0).abs() > SUM_TOLERANCE {
        return Err(Error::invalid(
            "sum of mole fractions",
            sum,
            "fractions that sum to 1 (normalise them explicitly if intended)",
        ));
    }
    Ok(())
}
