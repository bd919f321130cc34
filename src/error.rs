//! The binary's error: one message and the exit code it maps to.

use crate::exit::Exit;
use std::fmt;

/// A failed run.
#[derive(Debug)]
pub enum CliError {
    /// The input was refused; the message quotes it and says what is accepted.
    BadInput(String),
    /// A computation failed.
    Computation(String),
    /// Writing the output failed.
    Output(String),
}

impl CliError {
    /// The exit code for this error.
    pub fn exit_code(&self) -> Exit {
        match self {
            CliError::BadInput(_) => Exit::BadInput,
            CliError::Computation(_) | CliError::Output(_) => Exit::ComputationFailed,
        }
    }
}

impl CliError {
    /// The same kind of error with another message.
    pub fn with_message(&self, message: String) -> CliError {
        match self {
            CliError::BadInput(_) => CliError::BadInput(message),
            CliError::Computation(_) => CliError::Computation(message),
            CliError::Output(_) => CliError::Output(message),
        }
    }
}

impl fmt::Display for CliError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            CliError::BadInput(m) | CliError::Computation(m) => f.write_str(m),
            CliError::Output(m) => write!(f, "cannot write the output: {m}"),
        }
    }
}

impl std::error::Error for CliError {}

impl From<crate::units::UnitError> for CliError {
    fn from(e: crate::units::UnitError) -> Self {
        CliError::BadInput(e.to_string())
    }
}

impl From<fluids::LookupError> for CliError {
    fn from(e: fluids::LookupError) -> Self {
        CliError::BadInput(e.to_string())
    }
}

/// Maps a library error: bad input and input outside a model's range are bad input; the
/// rest is a failed computation.
pub fn from_eos(context: &str, e: eos::Error) -> CliError {
    match e {
        eos::Error::InvalidInput { .. } | eos::Error::OutOfRange { .. } => {
            CliError::BadInput(format!("{context}: {e}"))
        }
        _ => CliError::Computation(format!("{context}: {e}")),
    }
}
