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

/// Mole fractions from mass fractions `w` and molar masses `m`: x_i = (w_i/M_i) / sum(w_j/M_j).
pub fn mass_to_mole(w: &[f64], m: &[f64]) -> Vec<f64> {
    let moles: Vec<f64> = w.iter().zip(m).map(|(w, m)| w / m).collect();
    let total: f64 = moles.iter().sum();
    moles.iter().map(|n| n / total).collect()
}

/// Mass fractions from mole fractions `x` and molar masses `m`: w_i = x_i M_i / sum(x_j M_j).
pub fn mole_to_mass(x: &[f64], m: &[f64]) -> Vec<f64> {
    let masses: Vec<f64> = x.iter().zip(m).map(|(x, m)| x * m).collect();
    let total: f64 = masses.iter().sum();
    masses.iter().map(|g| g / total).collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn mass_and_mole_bases_round_trip() {
        // Definitions of mole and mass fraction; the round trip returns the input to rounding.
        let m = [
            0.016_042_46,
            0.030_069_04,
            0.044_095_62,
            0.028_013_4,
            0.044_009_5,
        ];
        let x = [0.85, 0.07, 0.03, 0.02, 0.03];
        let w = mole_to_mass(&x, &m);
        let back = mass_to_mole(&w, &m);
        for (a, b) in x.iter().zip(&back) {
            assert!((a - b).abs() <= 4.0 * f64::EPSILON * a, "{a} {b}");
        }
        // A hand check: equal masses of methane and ethane are 65.2 % methane by moles.
        let x = mass_to_mole(&[0.5, 0.5], &m[..2]);
        let want = (1.0 / m[0]) / (1.0 / m[0] + 1.0 / m[1]);
        assert!((x[0] - want).abs() < 1e-15);
        assert!((x[0] - 0.652_1).abs() < 1e-3);
    }

    #[test]
    fn fractions_are_checked() {
        assert!(check(&[0.5, 0.5], 2).is_ok());
        assert!(check(&[0.5, 0.4], 2).is_err());
        assert!(check(&[1.2, -0.2], 2).is_err());
        assert!(check(&[f64::NAN, 1.0], 2).is_err());
        assert!(check(&[1.0], 2).is_err());
    }
}
