//! The arguments of `zfactor relief` (parsed by clap; the command is in `commands::relief`).

use crate::cli::{FluidArgs, Format};
use clap::Args;

/// Arguments of `zfactor relief`.
#[derive(Debug, Args)]
pub struct ReliefArgs {
    #[command(flatten)]
    pub fluid: FluidArgs,
    /// Relieving temperature.
    #[arg(long, short = 't', allow_hyphen_values = true)]
    pub temperature: String,
    /// Relieving pressure (set pressure plus overpressure), absolute or gauge.
    #[arg(long, short = 'p', allow_hyphen_values = true)]
    pub pressure: String,
    /// Ambient pressure that gauge readings are referred to.
    #[arg(long, default_value = "101.325 kPa")]
    pub ambient: String,
    /// Model id, a comma-separated list, or "all".
    #[arg(long, short = 'm', default_value = "all")]
    pub model: String,
    /// Output format.
    #[arg(long, short = 'f', value_enum, default_value = "table")]
    pub format: Format,
}
