//! Arguments of the phase-equilibrium commands `zfactor flash` and `zfactor envelope`
//! (clap derive, raw strings; read by [`crate::units`], [`crate::energy_units`] and
//! [`crate::feed`]).

use super::{FluidArgs, Format};
use clap::{ArgGroup, Args};

/// Arguments of `zfactor flash`.
#[derive(Debug, Args)]
#[command(group(ArgGroup::new("saturation").multiple(false).args([
    "bubble_pressure", "dew_pressure", "bubble_temperature", "dew_temperature"
])))]
pub struct FlashArgs {
    #[command(flatten)]
    pub fluid: FluidArgs,
    /// Temperature with its unit: "250 K", "-20 degC".
    #[arg(long, short = 't', allow_hyphen_values = true)]
    pub temperature: Option<String>,
    /// Pressure with its unit, absolute or gauge: "50 bar", "700 psig".
    #[arg(long, short = 'p', allow_hyphen_values = true)]
    pub pressure: Option<String>,
    /// Specific enthalpy for a (P, h) flash: "-5 kJ/mol", "350 kJ/kg" (ideal-gas h = 0 for
    /// each pure component at 298.15 K and 101.325 kPa; water on the steam-table zero).
    #[arg(long, allow_hyphen_values = true, conflicts_with_all = ["temperature", "entropy"])]
    pub enthalpy: Option<String>,
    /// Specific entropy for a (P, s) flash: "-20 J/(mol K)", "-0.5 kJ/(kg K)" (ideal-gas
    /// s = 0 for each pure component at 298.15 K and 101.325 kPa; water on the steam-table zero).
    #[arg(long, allow_hyphen_values = true, conflicts_with = "temperature")]
    pub entropy: Option<String>,
    /// Bubble-point pressure at the given --temperature.
    #[arg(long, requires = "temperature", conflicts_with_all = ["pressure", "enthalpy", "entropy"])]
    pub bubble_pressure: bool,
    /// Dew-point pressure at the given --temperature.
    #[arg(long, requires = "temperature", conflicts_with_all = ["pressure", "enthalpy", "entropy"])]
    pub dew_pressure: bool,
    /// Bubble-point temperature at the given --pressure.
    #[arg(long, requires = "pressure", conflicts_with_all = ["temperature", "enthalpy", "entropy"])]
    pub bubble_temperature: bool,
    /// Dew-point temperature at the given --pressure.
    #[arg(long, requires = "pressure", conflicts_with_all = ["temperature", "enthalpy", "entropy"])]
    pub dew_temperature: bool,
    /// Ambient pressure that gauge readings are referred to.
    #[arg(long, default_value = "101.325 kPa")]
    pub ambient: String,
    /// Model id or a comma-separated list (models with a Helmholtz energy: ideal, vdw, rk,
    /// srk, pr, pr78, srk-pen, pr-pen, pr78-pen, virial), or "all".
    #[arg(long, short = 'm', default_value = "pr")]
    pub model: String,
    /// Output format.
    #[arg(long, short = 'f', value_enum, default_value = "table")]
    pub format: Format,
}

/// Arguments of `zfactor envelope`.
#[derive(Debug, Args)]
pub struct EnvelopeArgs {
    #[command(flatten)]
    pub fluid: FluidArgs,
    /// The one model (with a Helmholtz energy); for a pure fluid also "reference".
    #[arg(long, short = 'm', default_value = "pr")]
    pub model: String,
    /// Pressure where the trace starts on the dew curve and ends on the bubble curve.
    #[arg(long, default_value = "1 bar")]
    pub start_pressure: String,
    /// Ambient pressure that a gauge --start-pressure is referred to.
    #[arg(long, default_value = "101.325 kPa")]
    pub ambient: String,
    /// Write the P-T chart to this file; SVG or PNG by the extension (.svg, .png).
    #[arg(long)]
    pub chart: Option<String>,
    /// Pure fluids: write a P-v chart of the saturation dome with isotherms below, at and
    /// above the critical temperature to this file (.svg or .png).
    #[arg(long)]
    pub pv: Option<String>,
    /// Overwrite chart files that exist already.
    #[arg(long)]
    pub force: bool,
    /// Output format.
    #[arg(long, short = 'f', value_enum, default_value = "table")]
    pub format: Format,
}
