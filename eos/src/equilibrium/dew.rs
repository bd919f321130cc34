//! Dew points: the feed is a saturated vapour with an incipient liquid. See
//! [`super::saturation_point`] for the method. Where the dew curve is retrograde there are
//! two dew pressures at one temperature; [`pressure`] returns the one reached from the
//! Wilson estimate (usually the lower), [`pressures`] every one; [`super::envelope`] gives
//! the whole curve.

use super::envelope_start::{every_point, point};
use super::sat_system::Side;
use super::saturation_point::{Given, SaturationPoint};
use crate::error::Result;
use crate::model::Model;

/// Dew-point pressure of feed `z` at temperature `t` (K).
pub fn pressure(model: &dyn Model, t: f64, z: &[f64]) -> Result<SaturationPoint> {
    point(model, z, Side::Dew, Given::T(t))
}

/// Dew-point temperature of feed `z` at pressure `p` (Pa).
pub fn temperature(model: &dyn Model, p: f64, z: &[f64]) -> Result<SaturationPoint> {
    point(model, z, Side::Dew, Given::P(p))
}

/// Every dew-point pressure of feed `z` at temperature `t` (K), lowest first: two where the
/// dew curve is retrograde (between the critical temperature and the cricondentherm).
pub fn pressures(model: &dyn Model, t: f64, z: &[f64]) -> Result<Vec<SaturationPoint>> {
    every_point(model, z, Side::Dew, Given::T(t))
}

/// Every dew-point temperature of feed `z` at pressure `p` (Pa), lowest first.
pub fn temperatures(model: &dyn Model, p: f64, z: &[f64]) -> Result<Vec<SaturationPoint>> {
    every_point(model, z, Side::Dew, Given::P(p))
}
