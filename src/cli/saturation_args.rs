//! The arguments of `zfactor saturation` (parsed by clap; the command is in `commands::saturation`).

use crate::cli::{FluidArgs, Format};
use clap::Args;

/// Arguments of `zfactor saturation`.
#[derive(Debug, Args)]
pub struct SaturationArgs {
    #[command(flatten)]
    pub fluid: FluidArgs,
    /// Temperature with its unit ("300 K", "25 degC"): gives the saturation pressure.
    #[arg(long, short = 't', allow_hyphen_values = true)]
    pub temperature: Option<String>,
    /// Pressure with its unit ("1 atm", "5 barg"): gives the saturation temperature.
    #[arg(long, short = 'p', allow_hyphen_values = true)]
    pub pressure: Option<String>,
    /// Ambient pressure that gauge readings are referred to.
    #[arg(long, default_value = "101.325 kPa")]
    pub ambient: String,
    /// Model id, a comma-separated list, or "all": vdw, rk, srk, pr, pr78, and reference or
    /// sw12 where the fluid has that formulation.
    #[arg(long, short = 'm', default_value = "all")]
    pub model: String,
    /// Output format.
    #[arg(long, short = 'f', value_enum, default_value = "table")]
    pub format: Format,
}
