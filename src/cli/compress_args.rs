//! The arguments of `zfactor compress` (parsed by clap; the command is in `commands::compress`).

use crate::cli::shared_args::SharedArgs;
use crate::cli::FluidArgs;
use clap::Args;

/// Arguments of `zfactor compress`.
#[derive(Debug, Args)]
#[command(group(
    clap::ArgGroup::new("efficiency")
        .required(true)
        .args(["isentropic_efficiency", "polytropic_efficiency"])
))]
pub struct CompressArgs {
    #[command(flatten)]
    pub fluid: FluidArgs,
    /// Suction pressure, absolute or gauge: "30 barg" (also -p, --pressure).
    #[arg(
        long,
        short = 'p',
        visible_alias = "pressure",
        allow_hyphen_values = true
    )]
    pub suction_pressure: String,
    /// Suction temperature: "25 degC" (also -t, --temperature).
    #[arg(
        long,
        short = 't',
        visible_alias = "temperature",
        allow_hyphen_values = true
    )]
    pub suction_temperature: String,
    /// Discharge pressure, absolute or gauge: "90 barg".
    #[arg(long, allow_hyphen_values = true)]
    pub discharge_pressure: String,
    /// Isentropic efficiency: a fraction or a percentage, "0.78" or "78%" (give this or
    /// --polytropic-efficiency).
    #[arg(long, allow_hyphen_values = true, value_parser = crate::units::efficiency)]
    pub isentropic_efficiency: Option<f64>,
    /// Polytropic efficiency: a fraction or a percentage, "0.80" or "80%" (give this or
    /// --isentropic-efficiency).
    #[arg(long, allow_hyphen_values = true, value_parser = crate::units::efficiency)]
    pub polytropic_efficiency: Option<f64>,
    /// Mass, molar, standard or actual (suction) volume flow: "12 kg/s", "50000 Sm3/h",
    /// "20 MMscfd", "1500 m3/h".
    #[arg(long)]
    pub flow: Option<String>,
    /// Base conditions of a standard volume flow (overrides the one its unit implies).
    #[arg(long)]
    pub base: Option<String>,
    #[command(flatten)]
    pub shared: SharedArgs,
}
