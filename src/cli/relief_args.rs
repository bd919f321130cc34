//! The arguments of `zfactor relief` (parsed by clap; the command is in `commands::relief`).

use crate::cli::shared_args::SharedArgs;
use crate::cli::FluidArgs;
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
    #[command(flatten)]
    pub shared: SharedArgs,
}
