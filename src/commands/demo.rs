//! `zfactor demo`: the built-in demonstration, a scenario of our own invention.
//!
//! The fuel-gas skid of the fictional Ashgrove compressor station takes pipeline gas at
//! 70 barg and 40 degC. The demo computes the state with every model side by side, so the
//! ideal-gas error and the spread between the cubic models are visible at a glance.

use crate::cli::shared_args::SharedArgs;
use crate::cli::{Basis, DemoArgs, FluidArgs, RootArg, StateArgs};
use crate::error::CliError;
use crate::exit::Exit;

/// The demo gas: an invented lean pipeline gas (mole fractions).
pub const DEMO_GAS: &str = "methane=0.889,ethane=0.054,propane=0.016,n-butane=0.004,\
isobutane=0.003,nitrogen=0.018,carbon dioxide=0.016";

/// Runs the demo and prints it.
pub fn run(args: &DemoArgs) -> Result<Exit, CliError> {
    let state = StateArgs {
        fluid: FluidArgs {
            fluid: None,
            mix: Some(DEMO_GAS.to_string()),
            basis: Basis::Mole,
            normalize: false,
            mix_file: None,
            kij: None,
            kij_file: None,
        },
        gravity: Default::default(),
        temperature: Some("40 degC".to_string()),
        pressure: Some("70 barg".to_string()),
        density: None,
        enthalpy: None,
        entropy: None,
        quality: None,
        shared: SharedArgs {
            ambient: "101.325 kPa".to_string(),
            model: "all".to_string(),
            format: args.format,
        },
        root: RootArg::Stable,
    };
    if args.format == crate::cli::Format::Table {
        crate::render::emit(
            "Demo: fuel-gas skid of the fictional Ashgrove compressor station,\n\
             pipeline gas at 70 barg and 40 degC.\n\n",
        )?;
    }
    let report = super::state::run(&state)?;
    crate::render::output::render(&report, args.format)?;
    Ok(super::exit_for(&report.warnings))
}
