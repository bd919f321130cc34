//! The ideal-gas part phi0(tau, delta) of a formulation, a sum of the forms used by the
//! reference equations:
//!
//! ```text
//! phi0 = n ln(delta)                       (log_delta; n = 1 in every formulation)
//!      + n                                 (constant)
//!      + n tau                             (tau)
//!      + n ln(tau)                         (log_tau)
//!      + sum n tau^t                       (power; Span et al. (2000) use t = -1, -2, -3)
//!      + sum n ln(1 - exp(-gamma tau))     (planck; Planck-Einstein terms)
//! ```
//!
//! (IAPWS R6-95(2018) Eq. 5; Span et al. (2000) Eq. 4.1; Span & Wagner (1996) Eq. 6.3;
//! Leachman et al. (2009) Eq. 31.)

use super::derivs::Derivs;

/// One term of an ideal part.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum IdealTerm {
    /// n ln(delta).
    LogDelta(f64),
    /// n.
    Constant(f64),
    /// n tau.
    Tau(f64),
    /// n ln(tau).
    LogTau(f64),
    /// n tau^t.
    Power { n: f64, t: f64 },
    /// n ln(1 - exp(-gamma tau)).
    Planck { n: f64, gamma: f64 },
}

impl IdealTerm {
    /// The term and its plain partial derivatives at (tau, delta).
    #[inline]
    pub fn evaluate(&self, tau: f64, delta: f64) -> Derivs {
        let zero = Derivs::default();
        match *self {
            IdealTerm::LogDelta(n) => Derivs {
                a: n * delta.ln(),
                d: n / delta,
                dd: -n / (delta * delta),
                ..zero
            },
            IdealTerm::Constant(n) => Derivs { a: n, ..zero },
            IdealTerm::Tau(n) => Derivs {
                a: n * tau,
                t: n,
                ..zero
            },
            IdealTerm::LogTau(n) => Derivs {
                a: n * tau.ln(),
                t: n / tau,
                tt: -n / (tau * tau),
                ..zero
            },
            IdealTerm::Power { n, t } => {
                let v = n * tau.powf(t);
                Derivs {
                    a: v,
                    t: t * v / tau,
                    tt: t * (t - 1.0) * v / (tau * tau),
                    ..zero
                }
            }
            IdealTerm::Planck { n, gamma } => {
                let e = (-gamma * tau).exp();
                let one_e = 1.0 - e;
                Derivs {
                    a: n * (-e).ln_1p(),
                    t: n * gamma * e / one_e,
                    tt: -n * gamma * gamma * e / (one_e * one_e),
                    ..zero
                }
            }
        }
    }
}

/// The ideal part of one formulation.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct IdealPart {
    /// The terms, in file order.
    pub terms: Vec<IdealTerm>,
}

impl IdealPart {
    /// phi0 and its plain partial derivatives at (tau, delta), both positive.
    pub fn evaluate(&self, tau: f64, delta: f64) -> Derivs {
        self.terms.iter().fold(Derivs::default(), |acc, term| {
            acc + term.evaluate(tau, delta)
        })
    }
}
