//! One function per command: typed request in, report out; then the chosen renderer.

pub mod audit;
pub mod audit_io;
pub mod audit_row;
pub mod compare;
pub mod compress;
pub mod cp_range;
pub mod demo;
pub mod each_model;
pub mod envelope;
pub mod flash;
pub mod flow;
pub mod fluids;
pub mod jobs_common;
pub mod kij;
pub mod models;
pub mod process;
pub mod relief;
pub mod saturation;
pub mod state;
pub mod table;
pub mod vessel;

use crate::cli::{Cli, Command, Format};
use crate::error::CliError;
use crate::exit::Exit;
use crate::render::output::{render, Output};

/// Runs the parsed command and prints its report.
pub fn dispatch(cli: &Cli) -> Result<Exit, CliError> {
    match &cli.command {
        Command::State(args) => {
            let report = state::run(args)?;
            render(&report, args.shared.format)?;
            Ok(exit_for(&report.warnings))
        }
        Command::Fluids(args) => {
            let report = fluids::run(args)?;
            crate::render::fluids(&report, args.format)?;
            Ok(Exit::Success)
        }
        Command::Kij(args) => {
            let report = kij::run(args)?;
            crate::render::kij::render(&report, args.format)?;
            Ok(Exit::Success)
        }
        Command::Demo(args) => demo::run(args),
        Command::Compare(args) => compare::dispatch(args),
        Command::Table(args) => table::run(args),
        Command::Models(args) => {
            let report = models::run(args)?;
            crate::render::models(&report, args.format)?;
            Ok(Exit::Success)
        }
        Command::Saturation(args) => saturation::run_and_render(args),
        Command::Audit(args) => {
            let report = audit::run(args)?;
            render(&report, args.format)?;
            Ok(exit_for(&report.warnings))
        }
        Command::Compress(args) => job(&compress::run(args)?, args.shared.format),
        Command::Flow(args) => job(&flow::run(args)?, args.shared.format),
        Command::Process(args) => job(&process::run(args)?, args.shared.format),
        Command::Relief(args) => job(&relief::run(args)?, args.shared.format),
        Command::Vessel(args) => job(&vessel::run(args)?, args.shared.format),
        Command::Flash(args) => flash::dispatch(args),
        Command::Envelope(args) => envelope::dispatch(args),
        // Started by `crate::run` before any command (it serves the commands).
        Command::Serve(_) => Err(CliError::BadInput(
            "serve is started by zfactor::run".to_string(),
        )),
    }
}

/// Renders a job's report; success, or success with warnings.
fn job<R: Output>(report: &R, format: Format) -> Result<Exit, CliError> {
    render(report, format)?;
    Ok(exit_for(report.warnings()))
}

/// Success, or success with warnings.
pub fn exit_for(warnings: &[String]) -> Exit {
    if warnings.is_empty() {
        Exit::Success
    } else {
        Exit::SuccessWithWarnings
    }
}
