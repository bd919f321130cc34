//! Models that answer at (T, P) directly: corresponding-states correlations (Lee-Kesler),
//! fits of the Standing-Katz chart (Dranchuk-Abou-Kassem, Hall-Yarborough) and the Gibbs-energy
//! formulation IAPWS-IF97. They have no residual Helmholtz energy in (T, rho), so they do not
//! implement [`crate::Model`]; [`TpModel`] is their common form and [`evaluate`] derives the
//! same [`crate::properties::Properties`] every other model gives:
//!
//! - departure functions from the model where it has them, otherwise from Z(T, P) by the
//!   exact integrals along the isotherm (Smith, Van Ness & Abbott, *Introduction to Chemical
//!   Engineering Thermodynamics*, 7th ed., eqs. 6.46-6.49):
//!   h_dep/(RT) = -T int_0^P (dZ/dT)_P dP/P, s_dep/R = -int_0^P (Z - 1 + T (dZ/dT)_P) dP/P,
//!   ln phi = int_0^P (Z - 1) dP/P;
//! - cp = (dh/dT)_P, and cv, speed of sound, Joule-Thomson coefficient and isentropic exponent
//!   from (dv/dT)_P and (dv/dP)_T by central differences (the standard relations
//!   cp - cv = -T (dv/dT)_P^2 / (dv/dP)_T, w^2 = -(cp/cv) v^2 / (M (dv/dP)_T),
//!   mu_JT = (T (dv/dT)_P - v)/cp).
//!
//! States at (T, rho) or (P, rho) are found by a bracketed search on P or T.

mod departure;
mod evaluate;
mod gas_gravity;
pub mod if97;
mod lee_kesler;

pub use evaluate::{evaluate, evaluate_need, state_prho, state_tp, state_trho, TpState};
pub use gas_gravity::GravityModel;
pub use if97::If97Model;
pub use lee_kesler::LeeKeslerModel;

use crate::component::Component;
use crate::error::Result;
use crate::ideal_cp::IdealGasValues;
use crate::state::RootChoice;

/// What a (T, P)-explicit model gives at one state.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct TpPoint {
    /// Compressibility factor.
    pub z: f64,
    /// Departure enthalpy H - H_ig at the same T and P, J/mol, where the model gives it.
    pub h_dep: Option<f64>,
    /// Departure entropy S - S_ig at the same T and P, J/(mol K), where the model gives it.
    pub s_dep: Option<f64>,
    /// The model's own ideal-gas part (zero at T_REF, P_REF), where it has one.
    pub ideal: Option<IdealGasValues>,
    /// Inputs outside the model's published range (the value is still returned).
    pub warnings: Vec<String>,
    /// The model's own cp, cv and speed of sound, where it has analytic ones (IF97); else
    /// they come from numerical derivatives.
    pub caloric: Option<Caloric>,
}

/// Heat capacities (J/(mol K)) and speed of sound (m/s) of a state, from a model's own
/// equations.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Caloric {
    pub cp: f64,
    pub cv: f64,
    pub w: f64,
}

/// A model that gives Z (and possibly departure functions) at (T, P).
pub trait TpModel: Send + Sync {
    /// Model id.
    fn id(&self) -> &str;
    /// The components.
    fn components(&self) -> &[Component];
    /// The state at (T, P, x) on the branch `root` asks for.
    fn point(&self, t: f64, p: f64, x: &[f64], root: RootChoice) -> Result<TpPoint>;
    /// ln phi of each component at (T, P, x), where the model gives them.
    fn component_ln_phi(
        &self,
        t: f64,
        p: f64,
        x: &[f64],
        root: RootChoice,
    ) -> Result<Option<Vec<f64>>> {
        let _ = (t, p, x, root);
        Ok(None)
    }
    /// True when the model gives departure functions itself (otherwise they are integrated
    /// from Z, which needs the model to hold along the isotherm down to zero pressure).
    fn has_departures(&self) -> bool;
}
