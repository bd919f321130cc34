//! The arguments of `zfactor vessel` (parsed by clap; the command is in `commands::vessel`).

use crate::cli::shared_args::SharedArgs;
use crate::cli::FluidArgs;
use clap::Args;

/// Arguments of `zfactor vessel`.
#[derive(Debug, Args)]
pub struct VesselArgs {
    #[command(flatten)]
    pub fluid: FluidArgs,
    #[command(flatten)]
    pub gravity: crate::cli::gravity_args::GravityArgs,
    /// Internal volume with its unit: "1 m3", "50 L", "1.5 ft3".
    #[arg(long)]
    pub volume: String,
    /// Temperature of the contents: "15 degC", "300 K".
    #[arg(long, short = 't', allow_hyphen_values = true)]
    pub temperature: String,
    /// Pressure of the contents, absolute or gauge: "200 barg", "3000 psig".
    #[arg(long, short = 'p', allow_hyphen_values = true)]
    pub pressure: String,
    /// Heat or cool the closed vessel to this temperature (fixed volume and mass).
    #[arg(long, allow_hyphen_values = true)]
    pub to_temperature: Option<String>,
    /// Draw gas down to this pressure: the usable gas between the two states.
    #[arg(long, allow_hyphen_values = true)]
    pub draw_to_pressure: Option<String>,
    /// Temperature at the end of the draw-down (default: the starting temperature).
    #[arg(long, allow_hyphen_values = true)]
    pub draw_to_temperature: Option<String>,
    /// Rated (settled) pressure: the fill pressure at --temperature that settles to it.
    #[arg(long, allow_hyphen_values = true, requires = "rated_temperature")]
    pub rated_pressure: Option<String>,
    /// Reference temperature of the rated pressure, e.g. "15 degC".
    #[arg(long, allow_hyphen_values = true)]
    pub rated_temperature: Option<String>,
    /// Target pressure at --temperature: the mass to add or vent to reach it.
    #[arg(long, allow_hyphen_values = true, conflicts_with = "target_mass")]
    pub target_pressure: Option<String>,
    /// Target mass of contents: the mass to add or vent to reach it, e.g. "120 kg".
    #[arg(long)]
    pub target_mass: Option<String>,
    /// Pressure the vessel vents into (default: the ambient pressure).
    #[arg(long, allow_hyphen_values = true)]
    pub back_pressure: Option<String>,
    /// Vent adiabatically and reversibly to this pressure: final gas temperature.
    #[arg(long, allow_hyphen_values = true)]
    pub vent_to: Option<String>,
    /// Minimum design metal temperature to flag the venting temperature against.
    #[arg(long, allow_hyphen_values = true)]
    pub mdmt: Option<String>,
    /// Steps of the venting path (equal steps of ln P).
    #[arg(long, default_value_t = 50)]
    pub vent_steps: usize,
    /// Base conditions of the standard volume: 15degC, 0degC, 20degC, 60degF-14.696psia,
    /// 60degF-14.73psia, or "T,P".
    #[arg(long, default_value = "15degC")]
    pub base: String,
    #[command(flatten)]
    pub shared: SharedArgs,
}
