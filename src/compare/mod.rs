//! Comparing models with each other and with reference values, physics-free.
//!
//! - [`grid`]: lists and ranges of quantities for T-P grids ("250..350 K step 25").
//! - [`data_file`]: a user's states or reference data from CSV, units in the header.
//! - [`iso6976`]: the built-in data set of compression factors (ISO 6976).
//! - [`iso6976_sum`]: a mixture's compression factor by the ISO 6976 summation method.
//! - [`engine`]: every model at every state, on all cores, in order.
//! - [`region`]: gas, liquid, supercritical, near-critical, two-phase.
//! - [`stats`]: mean absolute, maximum and mean signed deviation.
//! - [`ideal_map`]: where the ideal gas law holds within a tolerance.
//! - [`advice`]: the simplest model within a tolerance; known weaknesses.

pub mod advice;
pub mod data_file;
pub mod engine;
pub mod grid;
pub mod ideal_map;
pub mod iso6976;
pub mod iso6976_sum;
pub mod region;
pub mod stats;
