//! The arguments of `zfactor flow` (parsed by clap; the command is in `commands::flow`).

use crate::cli::{FluidArgs, Format};
use clap::Args;

/// Arguments of `zfactor flow`.
#[derive(Debug, Args)]
pub struct FlowArgs {
    #[command(flatten)]
    pub fluid: FluidArgs,
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
