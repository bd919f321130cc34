//! Exponential term of a residual Helmholtz energy: n delta^d tau^t exp(-delta^l).
//!
//! With f = n exp(d ln delta + t ln tau - delta^l):
//! delta d(ln f)/d(delta) = d - l delta^l, delta^2 d2(ln f)/d(delta)2 = -d - l (l-1) delta^l
//! (Span (2000), *Multiparameter Equations of State*, Springer, table 3.3). delta^l is shared
//! by all terms through [`Point::delta_pow`].

use super::derivs::{Point, Scaled};

/// n delta^d tau^t exp(-delta^l), l a positive integer.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ExponentialTerm {
    /// Coefficient n.
    pub n: f64,
    /// Density exponent d.
    pub d: f64,
    /// Temperature exponent t.
    pub t: f64,
    /// Exponent l of delta inside exp(-delta^l), 1..=[`super::derivs::MAX_L`].
    pub l: usize,
}

impl ExponentialTerm {
    /// Adds the term and its scaled derivatives at `p`.
    #[inline(always)]
    pub fn accumulate(&self, p: &Point, acc: &mut Scaled) {
        let dl = p.delta_pow[self.l];
        let lf = self.l as f64;
        let f = self.n * (self.d * p.ln_delta + self.t * p.ln_tau - dl).exp();
        let ldl = lf * dl;
        acc.add_separable(f, self.d - ldl, -self.d - (lf - 1.0) * ldl, self.t, -self.t);
    }
}
