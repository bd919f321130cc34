//! The one error type of the `eos` crate.

use thiserror::Error;

/// Result with the crate's [`Error`].
pub type Result<T> = std::result::Result<T, Error>;

/// Why a computation could not give an answer. Callers can tell bad input from a model's
/// limits from a solver that did not converge.
#[derive(Debug, Clone, PartialEq, Error)]
#[non_exhaustive]
pub enum Error {
    /// An input value that no model accepts (T <= 0, P <= 0, NaN, fractions that do not sum
    /// to one, ...). `what` names the quantity, `value` quotes it, `accepted` says what would do.
    #[error("{what} = {value} is not accepted: {accepted}")]
    InvalidInput {
        what: &'static str,
        value: String,
        accepted: String,
    },
    /// The input is valid in general but outside what this model can represent.
    #[error("{what} is outside the range of {model}: {detail}")]
    OutOfRange {
        model: String,
        what: &'static str,
        detail: String,
    },
    /// An iteration stopped without meeting its tolerance.
    #[error("{solver} did not converge after {iterations} iterations (residual {residual:.3e})")]
    NotConverged {
        solver: &'static str,
        iterations: usize,
        residual: f64,
    },
    /// The model has no physical solution for the request.
    #[error("no solution: {0}")]
    NoSolution(String),
}

impl Error {
    /// An [`Error::InvalidInput`] for a number.
    pub fn invalid(what: &'static str, value: f64, accepted: impl Into<String>) -> Self {
        Error::InvalidInput {
            what,
            value: format!("{value}"),
            accepted: accepted.into(),
        }
    }
}

/// Checks that `value` is finite and strictly positive.
pub fn positive(what: &'static str, value: f64) -> Result<f64> {
    if value.is_finite() && value > 0.0 {
        Ok(value)
    } else {
        Err(Error::invalid(what, value, "a finite number above zero"))
    }
}
