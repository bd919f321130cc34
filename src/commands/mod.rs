//! One function per command: typed request in, report out; then the chosen renderer.

pub mod compare;
pub mod demo;
pub mod envelope;
pub mod flash;
pub mod fluids;
pub mod state;
pub mod table;

use crate::cli::{Cli, Command};
use crate::error::CliError;
use crate::exit::Exit;

/// Runs the parsed command and prints its report.
pub fn dispatch(cli: &Cli) -> Result<Exit, CliError> {
    match &cli.command {
        Command::State(args) => {
            let report = state::run(args)?;
            crate::render::state(&report, args.format)?;
            Ok(exit_for(&report.warnings))
        }
        Command::Fluids(args) => {
            let report = fluids::run(args)?;
            crate::render::fluids(&report, args.format)?;
            Ok(Exit::Success)
        }
        Command::Demo(args) => demo::run(args),
        Command::Compare(args) => compare::dispatch(args),
        Command::Table(args) => table::run(args),
        Command::Flash(args) => flash::dispatch(args),
        Command::Envelope(args) => envelope::dispatch(args),
    }
}

/// Success, or success with warnings.
pub fn exit_for(warnings: &[String]) -> Exit {
    if warnings.is_empty() {
        Exit::Success
    } else {
        Exit::SuccessWithWarnings
    }
}
