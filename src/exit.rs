//! Exit codes, documented in the README.

use std::process::ExitCode;

/// How a run ended.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Exit {
    /// Everything asked was computed.
    Success = 0,
    /// A computation failed (no root, a solver that did not converge, a state outside a
    /// model's range): the message says which.
    ComputationFailed = 1,
    /// The input was refused (unknown fluid, missing unit, bad composition, bad option).
    BadInput = 2,
    /// Results were printed, but with warnings (on stderr) that the user should read.
    SuccessWithWarnings = 3,
}

impl From<Exit> for ExitCode {
    fn from(e: Exit) -> Self {
        ExitCode::from(e as u8)
    }
}
