//! The reduced residual Helmholtz energy and the derivatives every property is built from.
//!
//! alpha(T, rho, x) = A_res / (n R T) at fixed temperature, molar density and composition.
//! With rho the molar density, the derivatives are kept in the scaled form of Span (2000),
//! *Multiparameter Equations of State*, chapter 3, which stays well conditioned:
//! `a_d = rho d(alpha)/d(rho)`, `a_t = T d(alpha)/dT`, and so on.

/// alpha and its scaled derivatives at one (T, rho, x).
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Residual {
    /// alpha = A_res/(nRT).
    pub a: f64,
    /// rho d(alpha)/d(rho) = Z - 1.
    pub a_d: f64,
    /// rho^2 d2(alpha)/d(rho)2.
    pub a_dd: f64,
    /// T d(alpha)/dT.
    pub a_t: f64,
    /// T^2 d2(alpha)/dT2.
    pub a_tt: f64,
    /// rho T d2(alpha)/(d(rho) dT).
    pub a_dt: f64,
}

impl Residual {
    /// Compressibility factor Z = 1 + rho d(alpha)/d(rho).
    pub fn z(&self) -> f64 {
        1.0 + self.a_d
    }

    /// (dP/d(rho))_T / (RT), molar density basis.
    pub fn dp_drho_rt(&self) -> f64 {
        1.0 + 2.0 * self.a_d + self.a_dd
    }

    /// (dP/dT)_rho / (rho R).
    pub fn dp_dt_rho_r(&self) -> f64 {
        1.0 + self.a_d + self.a_dt
    }
}
