//! The binary's error: what went wrong, with the library error behind it kept as its source,
//! and the exit code of each kind chosen in one place ([`CliError::exit_code`]).

use crate::exit::Exit;
use crate::units::UnitError;
use eos::pure::PureError;
use thiserror::Error;

/// A failed run.
#[derive(Debug, Error)]
pub enum CliError {
    /// The input was refused; the message quotes it and says what is accepted.
    #[error("{0}")]
    BadInput(String),
    /// A quantity could not be read (number, unit, gauge or absolute).
    #[error(transparent)]
    Unit(#[from] UnitError),
    /// A component name found nothing, or more than one component.
    #[error(transparent)]
    Lookup(#[from] fluids::LookupError),
    /// A model refused the state or failed on it; `context` names the model and the job.
    #[error("{context}: {source}")]
    Model {
        context: String,
        #[source]
        source: eos::Error,
    },
    /// The pure-fluid layer could not fix the state; `context` names the model.
    #[error("{context}: {source}")]
    Pure {
        context: String,
        #[source]
        source: PureError,
    },
    /// A computation failed for a reason the tool found itself (no library error behind it).
    #[error("{0}")]
    Computation(String),
    /// Writing the output failed.
    #[error("cannot write the output: {0}")]
    Output(String),
    /// Every model of a run of several failed; `first` is the first failure.
    #[error("no model could answer: {summary}")]
    NoModel {
        summary: String,
        #[source]
        first: Box<CliError>,
    },
}

impl CliError {
    /// The exit code for this error: refused input 2, a failed computation or output 1.
    pub fn exit_code(&self) -> Exit {
        let refused = match self {
            CliError::BadInput(_) | CliError::Unit(_) | CliError::Lookup(_) => true,
            CliError::Model { source, .. } => refuses(source),
            CliError::Pure { source, .. } => match source {
                PureError::Model(inner) => refuses(inner),
                _ => true,
            },
            CliError::Computation(_) | CliError::Output(_) => false,
            CliError::NoModel { first, .. } => return first.exit_code(),
        };
        if refused {
            Exit::BadInput
        } else {
            Exit::ComputationFailed
        }
    }
}

/// Whether a library error refuses the input (bad input, or a state outside the model's
/// range) rather than reporting a failed computation.
fn refuses(e: &eos::Error) -> bool {
    matches!(
        e,
        eos::Error::InvalidInput { .. } | eos::Error::OutOfRange { .. }
    )
}

/// A library error with its context (which model, which job).
pub fn from_eos(context: &str, e: eos::Error) -> CliError {
    CliError::Model {
        context: context.to_string(),
        source: e,
    }
}

/// A pure-fluid error with its context (which model). Every refusal of the pure-fluid layer
/// is about the input (a state it cannot have or a pair that does not fix it); a model error
/// inside it keeps the model's kind.
pub fn from_pure(context: &str, e: PureError) -> CliError {
    CliError::Pure {
        context: context.to_string(),
        source: e,
    }
}
