//! # Equations of state explicit in the reduced Helmholtz energy
//!
//! One engine for the multiparameter formulations of pure fluids,
//!
//! ```text
//! A/(R T) = phi(tau, delta) = phi0(tau, delta) + phi_r(tau, delta),   tau = Tc/T, delta = rho/rhoc
//! ```
//!
//! (Span (2000), *Multiparameter Equations of State*, Springer). The residual part is a sum of
//! terms of four kinds, each written once with its derivatives up to second order:
//! polynomial ([`power`]), exponential ([`exponential`]), Gaussian bell-shaped ([`gaussian`]) and
//! the non-analytic terms of IAPWS-95 ([`nonanalytic`]); the ideal part is in [`ideal_part`].
//! Coefficients are data (`eos/data/helmholtz/*.csv`, with sources), read once ([`registry`]).
//!
//! Formulations shipped: water IAPWS-95 (IAPWS R6-95(2018)); nitrogen, Span et al. (2000);
//! carbon dioxide, Span & Wagner (1996); methane, Setzmann & Wagner (1991); argon, Tegeler et
//! al. (1999); normal and para hydrogen, Leachman et al. (2009); and the 12-term technical
//! equations of Span & Wagner (2003) for nitrogen, carbon dioxide, methane and argon.
//!
//! [`HelmholtzFluid`] implements [`crate::Model`] (id `reference` or `sw12`) and also gives
//! direct (T, rho) properties in the formulation's own convention ([`crate::properties::Properties`]),
//! densities from (T, p) ([`density`]) and saturation ([`saturation`]).
//!
//! ## Example
//! ```
//! use eos::helmholtz::reference_for;
//! let water = reference_for("water").unwrap();
//! let sat = water.saturation_t(373.124).unwrap();
//! assert!((sat.p - 101_325.0).abs() < 5.0);
//! ```

pub mod ancillary;
pub mod branch_hint;
pub mod data;
pub mod density;
pub mod derivs;
pub mod exponential;
pub mod fluid;
pub mod formulation;
pub mod gaussian;
pub mod ideal_part;
pub mod nonanalytic;
pub mod power;
pub mod properties;
pub mod registry;
pub mod residual_part;
pub mod saturation;

pub use derivs::Derivs;
pub use fluid::HelmholtzFluid;
pub use formulation::{Formulation, Tier, Validity};
pub use registry::{
    formulation, keys, reference_for, reference_formulation, steam_table_zero, technical_for,
};
pub use saturation::{Saturation, SaturationMethod};
