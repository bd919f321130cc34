//! The report of `zfactor envelope`: the traced phase envelope of a mixture (or the
//! vapour-pressure curve of a pure fluid) with its critical point and extremes, SI units.

use super::state::CompositionRow;
use serde::Serialize;

/// A phase envelope or a vapour-pressure curve.
#[derive(Debug, Clone, Serialize)]
pub struct EnvelopeReport {
    /// Tool name and version.
    pub tool: String,
    /// The fluid.
    pub fluid: String,
    /// "mixture" (a phase envelope) or "pure" (a vapour-pressure curve).
    pub kind: &'static str,
    /// Model id.
    pub model: String,
    /// Model name.
    pub model_name: String,
    /// Where the model comes from.
    pub citation: String,
    /// The composition as entered and on both bases.
    pub composition: Vec<CompositionRow>,
    /// Points in tracing order: for a mixture the dew curve from the starting pressure, then
    /// the bubble curve; for a pure fluid from the lowest temperature up to the critical point.
    pub points: Vec<EnvelopeRow>,
    /// The critical point (for a mixture: where the trace passed from dew to bubble points;
    /// null when it was not passed).
    pub critical_point: Option<TpPoint>,
    /// Highest pressure on the envelope (null for a pure fluid: it is the critical point).
    pub cricondenbar: Option<TpPoint>,
    /// Highest temperature on the envelope (null for a pure fluid).
    pub cricondentherm: Option<TpPoint>,
    /// Why the trace ended: "complete", "point limit", "step failed" or "critical point".
    pub stop: String,
    /// Isotherms of the P-v chart (pure fluids with --pv; empty otherwise).
    pub isotherms: Vec<Isotherm>,
    /// Chart files written.
    pub charts: Vec<String>,
    /// Basis notes.
    pub notes: Vec<String>,
    /// Things the user must read.
    pub warnings: Vec<String>,
    /// The caution for pressure equipment.
    pub caution: &'static str,
}

/// A (T, P) point.
#[derive(Debug, Clone, Copy, Serialize)]
pub struct TpPoint {
    pub temperature_k: f64,
    pub pressure_pa: f64,
}

/// One point of the envelope or curve.
#[derive(Debug, Clone, Serialize)]
pub struct EnvelopeRow {
    pub temperature_k: f64,
    pub pressure_pa: f64,
    /// "dew" (the feed is a saturated vapour), "bubble" (a saturated liquid) or
    /// "saturation" (a pure fluid).
    pub branch: &'static str,
    /// Molar density of the liquid (the feed on the bubble branch, the incipient phase on
    /// the dew branch), mol/m3.
    pub liquid_molar_density_mol_m3: f64,
    /// Molar density of the vapour, mol/m3.
    pub vapor_molar_density_mol_m3: f64,
    pub liquid_mass_density_kg_m3: f64,
    pub vapor_mass_density_kg_m3: f64,
}

/// One isotherm of the P-v chart: the model's stable isotherm (horizontal across the dome).
#[derive(Debug, Clone, Serialize)]
pub struct Isotherm {
    pub temperature_k: f64,
    /// Molar volumes, m3/mol.
    pub molar_volume_m3_mol: Vec<f64>,
    /// Pressures, Pa.
    pub pressure_pa: Vec<f64>,
}

/// The P-v chart shows the dome from this fraction of the critical pressure up.
const DOME_FROM_PR: f64 = 0.05;

/// Molar-volume range of the P-v chart: the dome from DOME_FROM_PR * Pc upwards, widened a
/// little on both sides.
pub fn pv_range(points: &[EnvelopeRow], pc: f64) -> (f64, f64) {
    let shown: Vec<&EnvelopeRow> = points
        .iter()
        .filter(|r| r.pressure_pa >= DOME_FROM_PR * pc)
        .collect();
    let rows: Vec<&EnvelopeRow> = if shown.len() >= 2 {
        shown
    } else {
        points.iter().collect()
    };
    let v_lo = rows
        .iter()
        .map(|r| 1.0 / r.liquid_molar_density_mol_m3)
        .fold(f64::INFINITY, f64::min);
    let v_hi = rows
        .iter()
        .map(|r| 1.0 / r.vapor_molar_density_mol_m3)
        .fold(0.0, f64::max);
    (0.8 * v_lo, 1.25 * v_hi)
}
