//! Why a pure-fluid state could not be fixed: typed, with the numbers that explain it.

use thiserror::Error;

/// Result of the pure-fluid layer.
pub type PureResult<T> = std::result::Result<T, PureError>;

/// A refused or failed pure-fluid state request.
#[derive(Debug, Clone, PartialEq, Error)]
#[non_exhaustive]
pub enum PureError {
    /// (T, P) on the saturation line: T and P are not independent in the two-phase region.
    #[error(
        "T = {t} K and p = {p} Pa lie on the saturation line of {model} (saturation pressure \
         {p_sat} Pa, within a relative {tolerance:e}): in the two-phase region temperature and \
         pressure do not fix the state; give a quality (T, x) or a volume (T, v) instead"
    )]
    OnSaturationLine {
        model: String,
        t: f64,
        p: f64,
        p_sat: f64,
        tolerance: f64,
    },
    /// A vapour quality outside 0..1.
    #[error("quality x = {x} is outside 0 to 1 (0 saturated liquid, 1 saturated vapour)")]
    QualityOutOfRange { x: f64 },
    /// A state outside the range where the model is valid or searched.
    #[error("{what} is outside the range of {model}: {range}")]
    OutOfRange {
        model: String,
        what: String,
        range: String,
    },
    /// No saturation state exists (at or above the critical point, below the triple point).
    #[error("{model} has no saturation state at {what}: {why}")]
    NoSaturation {
        model: String,
        what: String,
        why: String,
    },
    /// Water below its triple point, where ice is the stable phase.
    #[error(
        "water at T = {t} K is below its triple point (273.16 K) and p = {p} Pa lies between \
         the sublimation pressure {sublimation_pa} Pa and the {melting} of ice Ih: ice is the \
         stable phase there and the fluid state would be metastable (IAPWS R14-08)",
        melting = match melting_pa { Some(m) => format!("melting pressure {m} Pa"), None => "melting pressure (not given below 251.165 K, the ice Ih-III-liquid triple point)".to_string() }
    )]
    BelowTriplePoint {
        t: f64,
        p: f64,
        sublimation_pa: f64,
        melting_pa: Option<f64>,
    },
    /// Two properties that do not fix a pure-fluid state with this API.
    #[error(
        "{given} do not fix a pure-fluid state here; give one of the pairs (T, P), (T, v), \
         (P, v), (P, h), (P, s), (T, x), (P, x)"
    )]
    UnsupportedPair { given: String },
    /// An input that no model accepts (NaN, negative temperature, ...).
    #[error("{what} = {value} is not accepted: {accepted}")]
    InvalidInput {
        what: &'static str,
        value: f64,
        accepted: &'static str,
    },
    /// The model or one of its solvers failed.
    #[error(transparent)]
    Model(#[from] crate::error::Error),
}

/// Checks that `value` is finite and above zero.
pub(crate) fn positive(what: &'static str, value: f64) -> PureResult<f64> {
    if value.is_finite() && value > 0.0 {
        Ok(value)
    } else {
        Err(PureError::InvalidInput {
            what,
            value,
            accepted: "a finite number above zero",
        })
    }
}

/// Checks that `value` is finite.
pub(crate) fn finite(what: &'static str, value: f64) -> PureResult<f64> {
    if value.is_finite() {
        Ok(value)
    } else {
        Err(PureError::InvalidInput {
            what,
            value,
            accepted: "a finite number",
        })
    }
}
