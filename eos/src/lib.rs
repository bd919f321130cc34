//! # eos: equations of state for real gases
//!
//! The physics of zfactor: models, solvers and properties, in SI units only (K, Pa, mol, m3,
//! J). No I/O and no printing happen here; every function returns plain data or a typed
//! [`Error`].
//!
//! ## Layout
//! - [`component`], [`ideal_cp`]: what a model needs to know of one component.
//! - [`model`]: the [`Model`] trait. Every model gives its reduced residual Helmholtz energy
//!   and its derivatives at (T, rho, x); every property is derived from those once, in
//!   [`properties`].
//! - [`cubic`]: the generic two-parameter cubic and its members (van der Waals,
//!   Redlich-Kwong, Soave-Redlich-Kwong, Peng-Robinson 1976 and 1978) over one root solver.
//! - [`ideal`]: the ideal gas, as a model with zero residual.
//! - [`state`]: a state from (T, P), (T, rho) or (P, rho), with the root choice.
//!
//! ## Example
//! ```
//! use eos::{Component, IdealGasCp, cubic::{Cubic, CubicKind}, state::{State, RootChoice}};
//! // methane, constants from Poling et al. (2001), constant cp of 4.3 R for the example
//! let ch4 = Component::new("methane", 0.016043, 190.56, 45.99e5, 0.011)
//!     .with_cp(IdealGasCp::constant(4.3));
//! let pr = Cubic::new(CubicKind::Pr76, &[ch4], None).unwrap();
//! let s = State::at_tp(&pr, 300.0, 70e5, &[1.0], RootChoice::LowestGibbs).unwrap();
//! assert!(s.props.z > 0.85 && s.props.z < 0.95);
//! ```

// User input must never panic: no unwrap or expect outside tests.
#![cfg_attr(not(test), deny(clippy::unwrap_used, clippy::expect_used))]

pub mod batch;
pub mod catalogue;
pub mod component;
pub(crate) mod component_check;
pub mod composition;
pub mod constants;
pub mod cpu;
pub mod cubic;
pub mod equilibrium;
pub mod error;
pub mod gas_gravity;
pub mod helmholtz;
pub mod ideal;
pub mod ideal_cp;
pub mod if97;
pub mod jobs;
pub mod lee_kesler;
pub mod model;
pub mod need;
pub mod pair_matrix;
pub mod phase;
pub mod properties;
pub mod pure;
pub mod residual;
pub mod root_choice;
pub mod solid;
pub mod state;
pub mod tp_explicit;
pub mod translated;
pub mod virial;

pub use component::Component;
pub use error::{Error, Result};
pub use ideal_cp::IdealGasCp;
pub use model::Model;
pub use residual::Residual;
