//! Phase equilibrium for every [`crate::Model`]: pure-fluid saturation, stability analysis,
//! flashes, bubble and dew points and phase envelopes.
//!
//! Every solver works through the model trait only (residual Helmholtz energy, ln phi at
//! (T, rho, x), density roots at (T, P, x)), so it applies to each member of the cubic family
//! and to any future model. Composition derivatives are taken numerically on one density
//! branch ([`phase_eval`]).
//!
//! - [`saturation`]: saturation pressure at T and temperature at P of a pure fluid, with the
//!   saturated phases and the enthalpy of vaporisation; [`quality`] for two-phase states.
//! - [`critical_point`], [`spinodal`]: where the model itself puts the critical point and
//!   the ends of the van der Waals loop.
//! - [`stability`]: Michelsen's tangent-plane stability test.
//! - [`flash`]: (T, P), (P, h) and (P, s) flashes; [`rachford_rice`] and [`gdem`] are its
//!   parts.
//! - [`bubble`], [`dew`]: bubble and dew points at T or P ([`saturation_point`] on the
//!   equations of [`sat_system`]).
//! - [`envelope`]: phase envelopes by continuation, with critical point, cricondenbar and
//!   cricondentherm; [`screen`]: the envelope as a screen for grids of states.
//! - [`wilson`]: corresponding-states starting values; [`dense`], [`brent`]: numerical parts.
//!
//! All results are plain structs; every failure is a typed [`crate::Error`].

pub mod brent;
pub mod bubble;
pub mod critical_point;
pub mod dense;
pub mod dew;
pub mod envelope;
pub mod envelope_start;
pub mod flash;
pub mod gdem;
pub mod phase_eval;
pub mod quality;
pub mod rachford_rice;
pub mod sat_system;
pub mod saturation;
pub mod saturation_point;
pub mod screen;
pub mod spinodal;
pub mod stability;
pub mod wilson;

pub use critical_point::CriticalPoint;
pub use envelope::{Envelope, EnvelopeOptions, EnvelopePoint, EnvelopeStop};
pub use flash::{EnergyFlash, FlashResult, SinglePhase, TwoPhase};
pub use quality::TwoPhaseState;
pub use sat_system::Side;
pub use saturation::Saturation;
pub use saturation_point::SaturationPoint;
pub use screen::{EnvelopeScreen, TestRegion};
pub use stability::Stability;
