//! Bubble points: the feed is a saturated liquid with an incipient vapour. See
//! [`super::saturation_point`] for the method.

use super::envelope_start::{every_point, point};
use super::sat_system::Side;
use super::saturation_point::{Given, SaturationPoint};
use crate::error::Result;
use crate::model::Model;

/// Bubble-point pressure of feed `z` at temperature `t` (K).
pub fn pressure(model: &dyn Model, t: f64, z: &[f64]) -> Result<SaturationPoint> {
    point(model, z, Side::Bubble, Given::T(t))
}

/// Bubble-point temperature of feed `z` at pressure `p` (Pa).
pub fn temperature(model: &dyn Model, p: f64, z: &[f64]) -> Result<SaturationPoint> {
    point(model, z, Side::Bubble, Given::P(p))
}

/// Every bubble-point pressure of feed `z` at temperature `t` (K), lowest first.
pub fn pressures(model: &dyn Model, t: f64, z: &[f64]) -> Result<Vec<SaturationPoint>> {
    every_point(model, z, Side::Bubble, Given::T(t))
}

/// Every bubble-point temperature of feed `z` at pressure `p` (Pa), lowest first: two where
/// the bubble curve turns back between the critical pressure and the cricondenbar.
pub fn temperatures(model: &dyn Model, p: f64, z: &[f64]) -> Result<Vec<SaturationPoint>> {
    every_point(model, z, Side::Bubble, Given::P(p))
}
