//! The arguments of `zfactor process` (parsed by clap; the command is in `commands::process`).

use crate::cli::shared_args::SharedArgs;
use crate::cli::FluidArgs;
use clap::{Args, ValueEnum};

/// The path.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum PathArg {
    /// Constant volume (end at --to-temperature or --to-pressure).
    Isochoric,
    /// Constant pressure (end at --to-temperature).
    Isobaric,
    /// Constant temperature (end at --to-pressure).
    Isothermal,
    /// Constant entropy (end at --to-pressure).
    Isentropic,
    /// Constant enthalpy, a throttling valve (end at --to-pressure).
    Isenthalpic,
}

/// Arguments of `zfactor process`.
#[derive(Debug, Args)]
pub struct ProcessArgs {
    #[command(flatten)]
    pub fluid: FluidArgs,
    /// The path.
    #[arg(long, value_enum)]
    pub path: PathArg,
    /// Start temperature.
    #[arg(long, short = 't', allow_hyphen_values = true)]
    pub temperature: String,
    /// Start pressure, absolute or gauge.
    #[arg(long, short = 'p', allow_hyphen_values = true)]
    pub pressure: String,
    /// End temperature.
    #[arg(long, allow_hyphen_values = true, conflicts_with = "to_pressure")]
    pub to_temperature: Option<String>,
    /// End pressure, absolute or gauge.
    #[arg(long, allow_hyphen_values = true)]
    pub to_pressure: Option<String>,
    #[command(flatten)]
    pub shared: SharedArgs,
}
