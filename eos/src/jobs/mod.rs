//! Engineering jobs on top of the models: vessels and cylinders, compressor stages, processes
//! between states, base conditions and flows, relief inputs and the checks behind a
//! spreadsheet audit.
//!
//! Every function takes any [`crate::Model`] (the ideal gas included, so that the ideal-gas
//! answer is the same function with another model), works in SI units (K, Pa, m3, kg, mol,
//! J) and returns plain data or a typed [`crate::Error`]. Nothing here reads files or prints.
//!
//! - [`equilibrium_state`]: the equilibrium state of a feed at (T, P), (T, rho), (P, h) or
//!   (P, s), one phase or two (saturation for a pure fluid, the flashes of
//!   [`crate::equilibrium`] for a mixture), and a fast single-phase temperature search.
//! - [`vessel`]: inventory, usable gas, heating at fixed volume and mass, fill pressure for a
//!   rated settled pressure, mass to a target, isentropic venting.
//! - [`compressor`]: one compression stage, isentropic or polytropic, with the Schultz (1962)
//!   polytropic head and a path-integrated polytropic head.
//! - [`base_conditions`]: named reference conditions and conversions between standard,
//!   normal and actual volume flows and mass flow.
//! - [`process`]: isochoric, isobaric, isothermal, isentropic and isenthalpic changes of
//!   state with heat, work and the changes in u, h, s.
//! - [`relief`]: Z, the real-gas isentropic exponent and the molar mass at relieving
//!   conditions.
//! - [`audit`]: the recomputation of one spreadsheet row and the tests of the usual causes
//!   of a wrong number.

pub mod audit;
pub mod base_conditions;
pub mod compressor;
pub mod equilibrium_state;
pub mod process;
pub mod relief;
pub mod vessel;

pub use base_conditions::BaseConditions;
pub use equilibrium_state::{EqState, PhaseSplit};
