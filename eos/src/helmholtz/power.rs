//! Polynomial (power) term of a residual Helmholtz energy: n delta^d tau^t.
//!
//! Written as f = n exp(d ln delta + t ln tau), so that delta d(ln f)/d(delta) = d,
//! delta^2 d2(ln f)/d(delta)2 = -d, tau d(ln f)/d(tau) = t, tau^2 d2(ln f)/d(tau)2 = -t
//! (Span (2000), *Multiparameter Equations of State*, Springer, table 3.3).

use super::derivs::{Point, Scaled};

/// n delta^d tau^t.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PowerTerm {
    /// Coefficient n.
    pub n: f64,
    /// Density exponent d.
    pub d: f64,
    /// Temperature exponent t.
    pub t: f64,
}

impl PowerTerm {
    /// Adds the term and its scaled derivatives at `p`.
    #[inline(always)]
    pub fn accumulate(&self, p: &Point, acc: &mut Scaled) {
        let f = self.n * (self.d * p.ln_delta + self.t * p.ln_tau).exp();
        acc.add_separable(f, self.d, -self.d, self.t, -self.t);
    }
}
