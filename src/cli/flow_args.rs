//! The arguments of `zfactor flow` (parsed by clap; the command is in `commands::flow`).

use crate::cli::shared_args::SharedArgs;
use crate::cli::FluidArgs;
use clap::Args;

/// Arguments of `zfactor flow`.
#[derive(Debug, Args)]
pub struct FlowArgs {
    #[command(flatten)]
    pub fluid: FluidArgs,
    #[command(flatten)]
    pub gravity: crate::cli::gravity_args::GravityArgs,
    /// The flow with its unit: "12 kg/s", "50000 Sm3/h", "20 MMscfd", "1500 m3/h" (actual
    /// volume flows need --temperature and --pressure).
    #[arg(long)]
    pub flow: String,
    /// Base conditions of a standard volume flow (overrides the one its unit implies).
    #[arg(long)]
    pub base: Option<String>,
    /// Flowing temperature (for actual volume flows).
    #[arg(long, short = 't', allow_hyphen_values = true, requires = "pressure")]
    pub temperature: Option<String>,
    /// Flowing pressure (for actual volume flows).
    #[arg(
        long,
        short = 'p',
        allow_hyphen_values = true,
        requires = "temperature"
    )]
    pub pressure: Option<String>,
    #[command(flatten)]
    pub shared: SharedArgs,
}
