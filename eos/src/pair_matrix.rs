//! Validation of the symmetric n x n matrices of binary parameters (k_ij of the cubic and
//! virial mixing rules, k*_jk of the Lee-Kesler rules), given row-major.

use crate::error::{Error, Result};

/// What a matrix must satisfy.
pub struct PairRule {
    /// Name in messages ("k_ij").
    pub name: &'static str,
    /// The required diagonal value.
    pub diagonal: f64,
    /// True when every entry must be above zero.
    pub positive: bool,
    /// An exclusive upper bound of every entry.
    pub below: f64,
    /// What is accepted, for the message.
    pub accepted: &'static str,
}

/// Checks `k` (n x n, row-major): its size, finite entries within the rule, symmetry to 1e-12
/// and the diagonal.
pub fn check(k: &[f64], n: usize, rule: &PairRule) -> Result<()> {
    if k.len() != n * n {
        return Err(Error::invalid(
            "binary parameter matrix size",
            k.len() as f64,
            format!("{} entries of {} for {n} components", n * n, rule.name),
        ));
    }
    for i in 0..n {
        for j in 0..n {
            let (a, b) = (k[i * n + j], k[j * n + i]);
            let ok = a.is_finite()
                && (!rule.positive || a > 0.0)
                && a < rule.below
                && (a - b).abs() <= 1e-12
                && (i != j || (a - rule.diagonal).abs() <= 1e-12);
            if !ok {
                return Err(Error::invalid(rule.name, a, rule.accepted));
            }
        }
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    const KIJ: PairRule = PairRule {
        name: "k_ij",
        diagonal: 0.0,
        positive: false,
        below: f64::INFINITY,
        accepted: "finite, symmetric, zero on the diagonal",
    };

    #[test]
    fn size_symmetry_diagonal_and_finiteness_are_checked() {
        assert!(check(&[0.0, 0.1, 0.1, 0.0], 2, &KIJ).is_ok());
        assert!(check(&[0.0, 0.1, 0.2, 0.0], 2, &KIJ).is_err());
        assert!(check(&[0.1, 0.1, 0.1, 0.0], 2, &KIJ).is_err());
        assert!(check(&[0.0, f64::NAN, f64::NAN, 0.0], 2, &KIJ).is_err());
        assert!(check(&[0.0, 0.1, 0.1], 2, &KIJ).is_err());
    }
}
