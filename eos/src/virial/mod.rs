//! The truncated (two-term) virial equation of state (model id `virial`).
//!
//! Z = 1 + B rho with B = sum_ij x_i x_j B_ij(T) from a generalized correlation
//! ([`correlation`]: Tsonopoulos 1974, or Pitzer-Curl 1957). See [`model`] for the form used,
//! the combining rules and the validity limit.

pub mod correlation;
pub mod model;

pub use correlation::Correlation;
pub use model::{SecondVirial, Virial, ID, MAX_REDUCED_DENSITY};
