//! # Pure-fluid states from any two properties
//!
//! A state of a pure fluid is fixed by two properties: (T, P), (T, v), (P, v), (P, h),
//! (P, s), (T, x) or (P, x), with x the vapour quality. The answer names its phase
//! (compressed liquid, saturated liquid, two-phase with its quality, saturated vapour,
//! superheated vapour, gas above Tc, supercritical fluid). Inside the dome every molar
//! property m of v, u, h, s follows the lever rule
//!
//! ```text
//! m = (1 - x) m' + x m''        (' saturated liquid, '' saturated vapour)
//! ```
//!
//! and T and P are not independent there: a (T, P) request on the saturation line is refused
//! with [`PureError::OnSaturationLine`].
//!
//! - [`fluid`]: the [`PureFluid`] trait (critical point, range, the model's own saturation
//!   solver, properties at (T, rho), density roots), implemented in [`helmholtz`] for
//!   [`crate::helmholtz::HelmholtzFluid`] and in [`cubic`] for [`crate::cubic::Cubic`].
//! - [`state`]: the request [`Spec`] and the answer [`PureState`].
//! - [`solve`]: [`state()`] for every pair.
//! - [`ice`]: sublimation and melting pressures of water below its triple point
//!   (IAPWS R14-08(2011)).
//! - [`error`]: the typed refusals, [`PureError`].
//!
//! ## Example
//! ```
//! use eos::helmholtz::reference_for;
//! use eos::pure::{state, Spec};
//! use eos::phase::Phase;
//! let water = reference_for("water").unwrap();
//! // 1 bar, quality 0.5
//! let wet = state(&water, Spec::Px { p: 1e5, x: 0.5 }).unwrap();
//! assert_eq!(wet.phase, Phase::TwoPhase);
//! // the same enthalpy at 1 bar gives the same quality back
//! let back = state(&water, Spec::Ph { p: 1e5, h: wet.h }).unwrap();
//! assert!((back.quality.unwrap() - 0.5).abs() < 1e-9);
//! ```

pub mod cubic;
pub mod error;
pub mod fluid;
pub mod helmholtz;
pub mod ice;
pub mod solve;
pub mod state;

pub use error::{PureError, PureResult};
pub use fluid::{Branch, Critical, FluidRange, PureFluid, SatState};
pub use solve::{state, SATURATION_TOLERANCE};
pub use state::{PureState, Quantity, Spec};
