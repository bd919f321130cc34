//! The residual part phi_r(tau, delta) of a formulation: a sum of terms of the four kinds of
//! [`super::power`], [`super::exponential`], [`super::gaussian`] and [`super::nonanalytic`].
//!
//! ```text
//! phi_r = sum n_i delta^d_i tau^t_i
//!       + sum n_i delta^d_i tau^t_i exp(-delta^l_i)
//!       + sum n_i delta^d_i tau^t_i exp(-alpha_i (delta - eps_i)^2 - beta_i (tau - gamma_i)^2)
//!       + sum n_i Delta^b_i delta psi
//! ```
//!
//! Evaluation allocates nothing: delta^l is computed once per call for every l and shared.

use super::derivs::{Derivs, Point, Scaled};
use super::exponential::ExponentialTerm;
use super::gaussian::GaussianTerm;
use super::nonanalytic::NonAnalyticTerm;
use super::power::PowerTerm;

/// All residual terms of one formulation, grouped by kind.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct ResidualPart {
    /// Polynomial terms.
    pub power: Vec<PowerTerm>,
    /// Exponential terms.
    pub exponential: Vec<ExponentialTerm>,
    /// Gaussian bell-shaped terms.
    pub gaussian: Vec<GaussianTerm>,
    /// Non-analytic terms.
    pub nonanalytic: Vec<NonAnalyticTerm>,
}

impl ResidualPart {
    /// Number of terms.
    pub fn len(&self) -> usize {
        self.power.len() + self.exponential.len() + self.gaussian.len() + self.nonanalytic.len()
    }

    /// True when there are no terms.
    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }

    /// The scaled sums of the analytic terms (all but the non-analytic ones) at `p`.
    #[inline]
    pub fn scaled_analytic(&self, p: &Point) -> Scaled {
        let mut acc = Scaled::default();
        for term in &self.power {
            term.accumulate(p, &mut acc);
        }
        for term in &self.exponential {
            term.accumulate(p, &mut acc);
        }
        for term in &self.gaussian {
            term.accumulate(p, &mut acc);
        }
        acc
    }

    /// phi_r and its plain partial derivatives at (tau, delta), both positive.
    pub fn evaluate(&self, tau: f64, delta: f64) -> Derivs {
        // delta = 0 would give 0 * ln 0 in terms with d = 0; the smallest positive number keeps
        // every term at its delta -> 0 limit.
        let delta = delta.max(f64::MIN_POSITIVE);
        let p = Point::new(tau, delta);
        let mut out = self.scaled_analytic(&p).to_plain(tau, delta);
        for term in &self.nonanalytic {
            out = out + term.evaluate(tau, delta);
        }
        out
    }
}
