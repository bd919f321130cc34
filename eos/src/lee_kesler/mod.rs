//! The Lee-Kesler corresponding-states correlation (model id `lk`).
//!
//! B. I. Lee, M. G. Kesler, *A generalized thermodynamic correlation based on three-parameter
//! corresponding states*, AIChE J. 21 (1975) 510-527. Two fluids obey reduced BWR-type
//! equations ([`fluid`]) with twelve constants each ([`constants`]): the simple fluid
//! (omega = 0) and the reference fluid n-octane (omega_r = 0.3978). A fluid of acentric
//! factor omega interpolates at the same (Tr, Pr):
//!
//! Z = Z0 + (omega / omega_r)(Z_r - Z0), and likewise the departure functions and ln(f/P).
//!
//! Each fluid's reduced pressure along an isotherm, with its density derivatives and a
//! curvature bound, is in [`isotherm`]; the density roots at (Tr, Pr) in [`roots`].
//!
//! Mixtures use the Plocker-Knapp-Prausnitz rules ([`mixing`]). Because the interpolation is
//! at fixed (Tr, Pr), the model is a (T, P) API ([`LeeKesler::state_tp`]) and not a
//! [`crate::Model`].

pub mod constants;
pub mod fluid;
pub mod isotherm;
pub mod mixing;
mod model;
pub mod roots;
#[cfg(test)]
mod scan_reference;

pub use constants::{FluidConstants, OMEGA_R, REFERENCE, SIMPLE};
pub use fluid::{Branch, FluidPoint};
pub use mixing::PseudoCritical;
pub use model::{LeeKesler, LkState, ID, MAX_COMPONENTS, PR_MAX, TR_MAX, TR_MIN};
