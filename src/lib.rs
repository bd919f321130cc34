//! # zfactor (the command-line tool)
//!
//! Parses the command line into typed requests, runs the computation in the `eos` library
//! with data from `fluids`, and renders plain report structs as a terminal table, CSV or
//! JSON. Nothing here does physics.
//!
//! - [`cli`]: the clap definitions of every command and option.
//! - [`units`], [`feed`], [`feed_input`]: quantities with units and compositions, read once
//!   into SI; [`mix_file`], [`sheet_rows`], [`xlsx_rows`]: gas analyses and sheets from files.
//! - [`models`]: model ids to models; [`phase_screen`]: which states of a grid are flashed;
//!   [`state_arrays`]: one model at many states (the table's per-state path and the Python
//!   binding's).
//! - [`commands`]: one function per command, returning a report.
//! - [`report`]: the report structs; [`render`]: one file per output format.
//! - [`error`]: the typed error and its exit code.
//! - [`json_call`]: a command run from a JSON object of its options (the web API and Python);
//!   [`serve`]: `zfactor serve`, the local web page and its JSON API.
//!
//! The library is also what the Python binding (`python/`) calls; see DEVELOPERS.md for the
//! map of the house.

// User input must never panic: no unwrap or expect outside tests.
#![cfg_attr(not(test), deny(clippy::unwrap_used, clippy::expect_used))]

pub mod cli;
pub mod commands;
pub mod compare;
pub mod components_file;
pub mod energy_units;
pub mod error;
pub mod exit;
pub mod feed;
pub mod feed_input;
pub mod file_header;
pub mod gravity_feed;
pub mod input_notes;
pub mod json_call;
pub mod kij_input;
pub mod mix_file;
pub mod models;
pub mod output_file;
pub mod phase_screen;
pub mod progress;
pub mod range;
pub mod render;
pub mod report;
pub mod serve;
pub mod sheet_rows;
pub mod shown_units;
pub mod solid_check;
pub mod state_arrays;
pub mod table_property;
pub mod units;
pub mod xlsx_rows;
pub mod zgrid;

use clap::Parser;
use error::CliError;
use exit::Exit;
use std::ffi::OsString;

/// The caution printed with every result that may be used for pressure equipment.
pub const CAUTION: &str = "zfactor is a screening and design-support tool. Pressure equipment, \
cylinders and relief systems must be designed to the applicable local codes and checked by a \
licensed engineer.";

/// Runs the program with command-line arguments `args` (the first is the program name),
/// printing results to stdout. Returns the exit status to report.
pub fn run<I>(args: I) -> Result<Exit, CliError>
where
    I: IntoIterator<Item = OsString>,
{
    let cli = match cli::Cli::try_parse_from(args) {
        Ok(c) => c,
        Err(e) => {
            use clap::error::ErrorKind;
            if matches!(e.kind(), ErrorKind::DisplayHelp | ErrorKind::DisplayVersion) {
                print!("{e}");
                return Ok(Exit::Success);
            }
            return Err(CliError::BadInput(e.to_string().trim_end().to_string()));
        }
    };
    output_file::clean_up_on_interrupt();
    if let Some(path) = &cli.components {
        components_file::load(path)?;
    }
    if let cli::Command::Serve(args) = &cli.command {
        return serve::server::run(args);
    }
    let code = commands::dispatch(&cli)?;
    let notes = input_notes::take();
    for n in &notes {
        render::warn(n);
    }
    Ok(match code {
        Exit::Success if !notes.is_empty() => Exit::SuccessWithWarnings,
        other => other,
    })
}
