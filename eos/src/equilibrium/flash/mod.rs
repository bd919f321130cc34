//! Flash calculations: the equilibrium state of a feed at two specified properties.
//!
//! - [`tp()`]: isothermal flash at (T, P), stability test first (M. L. Michelsen, Fluid Phase
//!   Equilib. 9 (1982) 1-19), then the phase split (same author, ibid. 21-40).
//! - [`ph()`] and [`ps()`]: flashes at (P, h) and (P, s), an outer bracketed solve on T around
//!   the (T, P) flash.

mod energy;
mod result;
mod tp;

pub use energy::{enthalpy, entropy, ph, ps, EnergyFlash};
pub use result::{FlashResult, SinglePhase, TwoPhase};
pub use tp::tp;
