//! The reduced Helmholtz energy of a formulation and its partial derivatives at one (tau, delta).
//!
//! With tau = Tc/T and delta = rho/rhoc, a formulation gives phi(tau, delta) = phi0 + phi_r (the
//! ideal and residual parts of A/(RT)). [`Derivs`] holds phi and its partial derivatives up to
//! second order in the form printed by the IAPWS-95 release (R6-95(2018), Table 6):
//! phi, phi_delta, phi_deltadelta, phi_tau, phi_tautau, phi_deltatau.
//!
//! [`Scaled`] is the accumulator the term kinds add to: each derivative multiplied by the
//! matching powers of delta and tau (delta phi_delta, delta^2 phi_deltadelta, tau phi_tau,
//! tau^2 phi_tautau, delta tau phi_deltatau), which is what the terms n delta^d tau^t exp(...)
//! produce without divisions.

/// phi and its plain partial derivatives with respect to delta (`d`) and tau (`t`).
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Derivs {
    /// phi.
    pub a: f64,
    /// d(phi)/d(delta).
    pub d: f64,
    /// d2(phi)/d(delta)2.
    pub dd: f64,
    /// d(phi)/d(tau).
    pub t: f64,
    /// d2(phi)/d(tau)2.
    pub tt: f64,
    /// d2(phi)/(d(delta) d(tau)).
    pub dt: f64,
}

impl std::ops::Add for Derivs {
    type Output = Derivs;
    fn add(self, o: Derivs) -> Derivs {
        Derivs {
            a: self.a + o.a,
            d: self.d + o.d,
            dd: self.dd + o.dd,
            t: self.t + o.t,
            tt: self.tt + o.tt,
            dt: self.dt + o.dt,
        }
    }
}

/// Scaled sums: phi, delta phi_d, delta^2 phi_dd, tau phi_t, tau^2 phi_tt, delta tau phi_dt.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Scaled {
    /// phi.
    pub a: f64,
    /// delta d(phi)/d(delta).
    pub d: f64,
    /// delta^2 d2(phi)/d(delta)2.
    pub dd: f64,
    /// tau d(phi)/d(tau).
    pub t: f64,
    /// tau^2 d2(phi)/d(tau)2.
    pub tt: f64,
    /// delta tau d2(phi)/(d(delta) d(tau)).
    pub dt: f64,
}

impl Scaled {
    /// Adds a term f = n exp(E(delta) + F(tau)) given f and the scaled derivatives of its
    /// exponent: d1 = delta E', d2 = delta^2 E'', t1 = tau F', t2 = tau^2 F''.
    #[inline(always)]
    pub fn add_separable(&mut self, f: f64, d1: f64, d2: f64, t1: f64, t2: f64) {
        self.a += f;
        self.d += f * d1;
        self.dd += f * (d1 * d1 + d2);
        self.t += f * t1;
        self.tt += f * (t1 * t1 + t2);
        self.dt += f * d1 * t1;
    }

    /// The plain partial derivatives at (tau, delta).
    pub fn to_plain(self, tau: f64, delta: f64) -> Derivs {
        let (id, it) = (1.0 / delta, 1.0 / tau);
        Derivs {
            a: self.a,
            d: self.d * id,
            dd: self.dd * id * id,
            t: self.t * it,
            tt: self.tt * it * it,
            dt: self.dt * id * it,
        }
    }
}

/// delta, tau and the quantities every term kind shares at one evaluation.
#[derive(Debug, Clone, Copy)]
pub struct Point {
    /// Reduced density rho/rhoc (> 0).
    pub delta: f64,
    /// Inverse reduced temperature Tc/T (> 0).
    pub tau: f64,
    /// ln delta.
    pub ln_delta: f64,
    /// ln tau.
    pub ln_tau: f64,
    /// delta^k for k = 0..=MAX_L, shared by the exponential terms exp(-delta^l).
    pub delta_pow: [f64; MAX_L + 1],
}

/// Largest density exponent l of an exponential term exp(-delta^l) accepted in data files.
pub const MAX_L: usize = 8;

impl Point {
    /// The shared quantities at (tau, delta); both must be positive and finite.
    #[inline]
    pub fn new(tau: f64, delta: f64) -> Self {
        let mut delta_pow = [1.0; MAX_L + 1];
        for k in 1..=MAX_L {
            delta_pow[k] = delta_pow[k - 1] * delta;
        }
        Point {
            delta,
            tau,
            ln_delta: delta.ln(),
            ln_tau: tau.ln(),
            delta_pow,
        }
    }
}
