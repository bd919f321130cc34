//! The options that the property commands and the jobs share: the gauge reference, the
//! models and the output format.

use crate::cli::Format;
use clap::Args;

/// Shared by `state`, `vessel`, `compress`, `flow`, `process` and `relief`.
#[derive(Debug, Args)]
pub struct SharedArgs {
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
