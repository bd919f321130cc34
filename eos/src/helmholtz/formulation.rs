//! One equation of state explicit in the reduced Helmholtz energy, as data: reducing
//! constants, gas constant, ideal and residual parts, ancillary equations and the range of
//! validity stated by its paper.
//!
//! phi(tau, delta) = A/(R T) = phi0(tau, delta) + phi_r(tau, delta), tau = Tc/T,
//! delta = rho/rhoc (Span (2000), *Multiparameter Equations of State*, Springer, chapter 3).

use super::ancillary::Ancillary;
use super::derivs::Derivs;
use super::ideal_part::IdealPart;
use super::residual_part::ResidualPart;

/// Reference formulation of a fluid, or the faster technical equation.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Tier {
    /// The fluid's reference equation of state.
    Reference,
    /// A Span & Wagner (2003) 12-term technical equation.
    Technical,
}

/// The range of validity stated by a formulation's paper (recalled from memory; see each data
/// file's header).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Validity {
    /// Lowest temperature, K.
    pub t_min: f64,
    /// Highest temperature, K.
    pub t_max: f64,
    /// Highest pressure, Pa.
    pub p_max: f64,
}

/// A formulation with its constants in SI molar units.
#[derive(Debug, Clone, PartialEq)]
pub struct Formulation {
    /// Key of the formulation, e.g. `water-iapws95`.
    pub key: &'static str,
    /// Fluid name, e.g. `water`.
    pub fluid: &'static str,
    /// Short name of the equation and its source, e.g. `IAPWS-95`.
    pub title: &'static str,
    /// The full citation of the equation, from the first comment lines of its data file.
    pub citation: String,
    /// Reference or technical.
    pub tier: Tier,
    /// Critical (reducing) temperature, K.
    pub tc: f64,
    /// Critical (reducing) molar density, mol/m3.
    pub rhoc: f64,
    /// Critical pressure as published, Pa.
    pub pc: f64,
    /// Molar mass, kg/mol.
    pub molar_mass: f64,
    /// Molar gas constant used by the formulation, J/(mol K).
    pub r: f64,
    /// Triple-point temperature, K.
    pub t_triple: f64,
    /// Triple-point pressure as published, Pa.
    pub p_triple: f64,
    /// Range of validity.
    pub validity: Validity,
    /// Ideal part phi0.
    pub ideal: IdealPart,
    /// Residual part phi_r.
    pub residual: ResidualPart,
    /// Vapour-pressure ancillary (reduced by pc).
    pub ps_anc: Option<Ancillary>,
    /// Saturated-liquid density ancillary (reduced by rhoc).
    pub rhol_anc: Option<Ancillary>,
    /// Saturated-vapour density ancillary (reduced by rhoc).
    pub rhov_anc: Option<Ancillary>,
}

impl Formulation {
    /// (tau, delta) of T (K) and molar density rho (mol/m3).
    #[inline]
    pub fn reduce(&self, t: f64, rho: f64) -> (f64, f64) {
        (self.tc / t, rho / self.rhoc)
    }

    /// phi0 and its partial derivatives at (tau, delta).
    pub fn ideal(&self, tau: f64, delta: f64) -> Derivs {
        self.ideal.evaluate(tau, delta)
    }

    /// phi_r and its partial derivatives at (tau, delta).
    pub fn residual(&self, tau: f64, delta: f64) -> Derivs {
        self.residual.evaluate(tau, delta)
    }

    /// Pressure (Pa) at T (K) and molar density (mol/m3): p = rho R T (1 + delta phi_r_delta).
    pub fn pressure(&self, t: f64, rho: f64) -> f64 {
        let (tau, delta) = self.reduce(t, rho);
        rho * self.r * t * (1.0 + delta * self.residual(tau, delta).d)
    }
}
