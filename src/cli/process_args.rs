//! The arguments of `zfactor process` (parsed by clap; the command is in `commands::process`).

use crate::cli::{FluidArgs, Format};
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
    /// Ambient pressure that gauge readings are referred to.
    #[arg(long, default_value = "101.325 kPa")]
    pub ambient: String,
    /// Model id, a comma-separated list, or "all" (the models that apply to the fluid): ideal,
    /// vdw, rk, srk, pr, pr78, srk-pen, pr-pen, pr78-pen, virial, lk, dak, hy, if97, sw12,
    /// reference (`zfactor models` says what each is).
    #[arg(long, short = 'm', default_value = "all")]
    pub model: String,
    /// Output format.
    #[arg(long, short = 'f', value_enum, default_value = "table")]
    pub format: Format,
}
