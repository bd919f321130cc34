//! Gaussian bell-shaped term of a residual Helmholtz energy:
//! n delta^d tau^t exp(-alpha (delta - epsilon)^2 - beta (tau - gamma)^2).
//!
//! With f that term: delta d(ln f)/d(delta) = d - 2 alpha delta (delta - epsilon),
//! delta^2 d2(ln f)/d(delta)2 = -d - 2 alpha delta^2, and the same in tau with beta, gamma
//! (IAPWS R6-95(2018), Table 5; Span (2000), *Multiparameter Equations of State*, table 3.3).

use super::derivs::{Point, Scaled};

/// n delta^d tau^t exp(-alpha (delta - epsilon)^2 - beta (tau - gamma)^2).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct GaussianTerm {
    /// Coefficient n.
    pub n: f64,
    /// Density exponent d.
    pub d: f64,
    /// Temperature exponent t.
    pub t: f64,
    /// Width parameter in delta.
    pub alpha: f64,
    /// Width parameter in tau.
    pub beta: f64,
    /// Centre in tau.
    pub gamma: f64,
    /// Centre in delta.
    pub epsilon: f64,
}

impl GaussianTerm {
    /// Adds the term and its scaled derivatives at `p`.
    #[inline(always)]
    pub fn accumulate(&self, p: &Point, acc: &mut Scaled) {
        let de = p.delta - self.epsilon;
        let tg = p.tau - self.gamma;
        let f = self.n
            * (self.d * p.ln_delta + self.t * p.ln_tau
                - self.alpha * de * de
                - self.beta * tg * tg)
                .exp();
        acc.add_separable(
            f,
            self.d - 2.0 * self.alpha * p.delta * de,
            -self.d - 2.0 * self.alpha * p.delta * p.delta,
            self.t - 2.0 * self.beta * p.tau * tg,
            -self.t - 2.0 * self.beta * p.tau * p.tau,
        );
    }
}
