//! The [`PureFluid`] trait: what the pure-fluid state solver needs of a model, implemented for
//! the Helmholtz formulations ([`crate::helmholtz::HelmholtzFluid`]) and the cubic family
//! ([`crate::cubic::Cubic`]) with one component.
//!
//! A pure fluid gives its critical point, its range, its own saturation solver (equal pressure
//! and equal Gibbs energy of the two phases) and every property at (T, rho) ([`Properties`], as
//! every model gives them). Properties are in
//! the fluid's zero, the same for every model: the steam-table zero for water (IAPWS-95: u = s =
//! 0 for the saturated liquid at the triple point), h = s = 0 for the ideal gas at 298.15 K and
//! 101.325 kPa for every other fluid. An enthalpy or entropy entered is read on the same zero.

use super::error::PureResult;
use crate::properties::Properties;

/// Which density root of an isotherm.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Branch {
    /// The low-density (vapour-like) root; above the critical temperature the single root.
    Vapour,
    /// The high-density (liquid-like) root; above the critical temperature the single root.
    Liquid,
}

/// A critical point.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Critical {
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
    /// Molar density, mol/m3.
    pub rho: f64,
}

/// Where a model may be used, and where the solvers search.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FluidRange {
    /// Lowest temperature, K.
    pub t_min: f64,
    /// Highest temperature, K.
    pub t_max: f64,
    /// Highest pressure, Pa.
    pub p_max: f64,
    /// True when the range is the one stated by the model's paper; false when it is only the
    /// search range of the solvers (the cubics state none).
    pub stated: bool,
}

impl FluidRange {
    /// The range in words, for error messages.
    pub fn describe(&self) -> String {
        let kind = if self.stated {
            "range of validity"
        } else {
            "search range (the model states no range)"
        };
        format!(
            "{kind}: {} K to {} K, up to {:.6e} Pa",
            self.t_min, self.t_max, self.p_max
        )
    }
}

/// A saturation state: both coexisting phases at one (T, p).
#[derive(Debug, Clone, PartialEq)]
pub struct SatState {
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
    /// Saturated liquid.
    pub liquid: Properties,
    /// Saturated vapour.
    pub vapor: Properties,
}

impl SatState {
    /// Enthalpy of vaporisation h'' - h', J/mol.
    pub fn latent_heat(&self) -> f64 {
        self.vapor.h - self.liquid.h
    }
}

/// A pure fluid as described by one model.
pub trait PureFluid {
    /// The fluid's name (as the model knows it).
    fn fluid_name(&self) -> &str;
    /// The model's short id and title, for messages.
    fn model_title(&self) -> String;
    /// Molar mass, kg/mol.
    fn molar_mass(&self) -> f64;
    /// The model's own critical point.
    fn critical(&self) -> Critical;
    /// The triple point (T, p) when the model states one.
    fn triple_point(&self) -> Option<(f64, f64)>;
    /// Where the model is valid (or searched).
    fn range(&self) -> FluidRange;
    /// Saturation at temperature `t` (K), from the model's own equal-Gibbs solver.
    fn saturation_t(&self, t: f64) -> PureResult<SatState>;
    /// A cheap estimate of the saturation pressure at T (Pa) with its relative uncertainty,
    /// when the model has one (an ancillary equation); `None` by default.
    fn saturation_estimate(&self, _t: f64) -> Option<(f64, f64)> {
        None
    }
    /// Saturation at pressure `p` (Pa), from the model's own equal-Gibbs solver.
    fn saturation_p(&self, p: f64) -> PureResult<SatState>;
    /// Every property at T (K) and molar density rho (mol/m3).
    fn props(&self, t: f64, rho: f64) -> PureResult<Properties>;
    /// The model's pressure (Pa) at T (K) and rho (mol/m3), as the equation gives it (it may be
    /// negative inside the dome).
    fn pressure(&self, t: f64, rho: f64) -> PureResult<f64>;
    /// The density root (mol/m3) at (T, p) on `branch`; an error when that branch has none.
    fn density(&self, t: f64, p: f64, branch: Branch) -> PureResult<f64>;
}
