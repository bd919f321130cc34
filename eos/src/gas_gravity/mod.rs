//! Natural-gas Z from gas gravity: pseudo-critical correlations (Sutton 1985, Standing 1977),
//! the Wichert-Aziz (1972) acid-gas correction, and two fits of the Standing-Katz chart,
//! Dranchuk-Abou-Kassem (1975, id `dak`) and Hall-Yarborough (1973, id `hy`).
//!
//! Field-unit equations are converted at the boundary; inputs and outputs are SI. Each
//! correlation's fitted range is enforced by a [`RangeWarning`] in the result (the authors
//! published ranges, not hard limits); inputs that no correlation accepts (a gravity below
//! methane's or above 2, negative fractions, T or P <= 0) are typed errors.

pub mod dak;
mod gas;
pub mod hall_yarborough;
pub mod inerts;
pub mod pseudo_critical;
mod units;
pub mod warning;
pub mod wichert_aziz;

pub use gas::{z_tp, GasSpec, GasZ, ZCorrelation};
pub use inerts::{InertFractions, M_AIR};
pub use pseudo_critical::{pseudo_critical, GravityCorrelation, PseudoCriticalPoint};
pub use units::{K_PER_RANKINE, PA_PER_PSI};
pub use warning::RangeWarning;
