//! Command-line definitions (clap derive). Raw strings only: units and compositions are
//! read by [`crate::units`] and [`crate::feed`], so their messages can quote the input.

use clap::{Args, Parser, Subcommand, ValueEnum};
use shared_args::SharedArgs;

pub mod audit_args;
pub mod compress_args;
pub mod equilibrium_args;
pub mod flow_args;
pub mod gravity_args;
pub mod grid_args;
pub mod process_args;
pub mod relief_args;
pub mod saturation_args;
pub mod serve_args;
pub mod shared_args;
pub mod vessel_args;
pub use equilibrium_args::{EnvelopeArgs, FlashArgs};
pub use grid_args::{ChartFormat, CompareArgs, TableArgs, TableFormat};

/// Real-gas Z, density and energy properties, with every model side by side.
#[derive(Debug, Parser)]
#[command(name = "zfactor", version, about, long_about = None)]
pub struct Cli {
    #[command(subcommand)]
    pub command: Command,
    /// A CSV file of your own components (name, molar mass, Tc, Pc, acentric factor, ideal-gas
    /// cp and its range, source; units in the header), usable wherever a component name is.
    #[arg(long, global = true)]
    pub components: Option<String>,
}

/// The commands.
#[derive(Debug, Subcommand)]
pub enum Command {
    /// Properties of one state of a fluid or mixture, for one model or several side by side.
    State(StateArgs),
    /// List, search or show component data with their sources.
    Fluids(FluidsArgs),
    /// The built-in interaction parameters (k_ij) with their sources, by component.
    Kij(KijArgs),
    /// Saturation pressure or temperature of a pure fluid, with both saturated phases.
    Saturation(saturation_args::SaturationArgs),
    /// Run the built-in demonstration (a fuel-gas skid of a fictional compressor station).
    Demo(DemoArgs),
    /// Compare models over a T-P grid or a list of states, against a reference model, the
    /// ISO 6976 data set or your own reference data; ideal-gas map and model advice.
    Compare(CompareArgs),
    /// A design-basis table of one model over a T-P grid, with its basis printed.
    Table(TableArgs),
    /// The model catalogue: every model with its source, range, strengths and weaknesses.
    Models(ModelsArgs),
    /// A vessel or cylinder: inventory, heating or cooling, usable gas, fill pressure, mass to
    /// a target, adiabatic venting.
    Vessel(Box<vessel_args::VesselArgs>),
    /// One compressor stage: discharge temperature, heads (isentropic, polytropic by Schultz
    /// and by path integration), work and power.
    Compress(Box<compress_args::CompressArgs>),
    /// A gas flow as mass, amount, and volume at every named base condition and at flowing
    /// conditions.
    Flow(Box<flow_args::FlowArgs>),
    /// A change of state along an isochoric, isobaric, isothermal, isentropic or isenthalpic
    /// path: end state, heat, work and changes of u, h, s.
    Process(Box<process_args::ProcessArgs>),
    /// Z, real-gas isentropic exponent and molar mass at relieving conditions.
    Relief(Box<relief_args::ReliefArgs>),
    /// Audit a spreadsheet (CSV or .xlsx) of gas calculations: recompute each row, flag and
    /// explain deviations, write an annotated copy.
    Audit(Box<audit_args::AuditArgs>),
    /// Phase equilibrium of a mixture: flash at (T, P), (P, h) or (P, s), or a bubble or dew
    /// point, for one model or several.
    Flash(FlashArgs),
    /// The phase envelope of a mixture (or the vapour-pressure curve of a pure fluid) with
    /// its critical point, cricondenbar and cricondentherm, and a chart.
    Envelope(EnvelopeArgs),
    /// A local web page (and its JSON API) for states, model comparisons, envelopes and
    /// tables, served on this machine at the address printed.
    Serve(serve_args::ServeArgs),
}

/// Arguments of `zfactor models`.
#[derive(Debug, Args)]
pub struct ModelsArgs {
    /// One model id to show; all are listed when omitted.
    pub id: Option<String>,
    /// Output format.
    #[arg(long, short = 'f', value_enum, default_value = "table")]
    pub format: Format,
}

/// Output formats.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum Format {
    /// A table for the terminal.
    Table,
    /// Comma-separated values, one row per result, SI units.
    Csv,
    /// One JSON object, SI units.
    Json,
}

/// Basis of the entered fractions.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum Basis {
    /// Mole (molar, volume for ideal gases) fractions.
    Mole,
    /// Mass fractions.
    Mass,
}

/// Which density root to report when a model has several at (T, P).
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum RootArg {
    /// The stable root (lowest Gibbs energy).
    Stable,
    /// The liquid-like (densest) root.
    Liquid,
    /// The vapour-like (least dense) root.
    Vapor,
}

/// A fluid or a mixture.
#[derive(Debug, Clone, Args)]
pub struct FluidArgs {
    /// A pure fluid by name, alias, formula or CAS number (e.g. methane, CO2, 124-38-9).
    #[arg(long, conflicts_with_all = ["mix", "mix_file"])]
    pub fluid: Option<String>,
    /// A mixture as name=fraction pairs, e.g. "methane=0.9,ethane=0.1" or "CH4=90%,C2H6=10%".
    #[arg(long, conflicts_with = "mix_file")]
    pub mix: Option<String>,
    /// A gas analysis in a CSV or .xlsx file: a "component" column (names or C1, iC4, N2,
    /// ...) and an amount column whose header gives the unit ("mol %", "mass %", "mole
    /// fraction").
    #[arg(long)]
    pub mix_file: Option<String>,
    /// Basis of the fractions in --mix.
    #[arg(long, value_enum, default_value = "mole")]
    pub basis: Basis,
    /// Scale fractions that do not sum to one (or percentages to 100) instead of refusing them.
    #[arg(long)]
    pub normalize: bool,
    /// Interaction parameters over the built-in ones: "methane-co2=0.10,ethane-co2@srk=0.13"
    /// (@pr or @srk for one model family; without, for both).
    #[arg(long)]
    pub kij: Option<String>,
    /// A CSV file of interaction parameters: columns "component 1", "component 2", "value",
    /// and optional "family" (pr, srk) and "source". --kij values win over the file's.
    #[arg(long)]
    pub kij_file: Option<String>,
}

/// Arguments of `zfactor state`.
#[derive(Debug, Args)]
pub struct StateArgs {
    #[command(flatten)]
    pub fluid: FluidArgs,
    #[command(flatten)]
    pub gravity: crate::cli::gravity_args::GravityArgs,
    /// Temperature with its unit: "300 K", "25 degC", "77 degF", "540 R".
    #[arg(long, short = 't', allow_hyphen_values = true)]
    pub temperature: Option<String>,
    /// Pressure with its unit, absolute or gauge: "5 MPa", "70 barg", "1000 psig", "1 atm".
    #[arg(long, short = 'p', allow_hyphen_values = true)]
    pub pressure: Option<String>,
    /// Mass or molar density with its unit: "50 kg/m3", "2.5 mol/L".
    #[arg(long, short = 'd', allow_hyphen_values = true)]
    pub density: Option<String>,
    /// Pure fluids: enthalpy with its unit ("2800 kJ/kg", "-5 kJ/mol"), on the zero the
    /// output prints (water: the steam-table zero; other fluids: the ideal gas at 298.15 K).
    #[arg(long, allow_hyphen_values = true)]
    pub enthalpy: Option<String>,
    /// Pure fluids: entropy with its unit ("6.5 kJ/(kg K)"), on the zero the output prints.
    #[arg(long, allow_hyphen_values = true)]
    pub entropy: Option<String>,
    /// Pure fluids: vapour quality, 0 (saturated liquid) to 1 (saturated vapour), or percent.
    #[arg(long, short = 'x')]
    pub quality: Option<String>,
    #[command(flatten)]
    pub shared: SharedArgs,
    /// Which density root to report when a model has several.
    #[arg(long, value_enum, default_value = "stable")]
    pub root: RootArg,
}

/// Arguments of `zfactor fluids`.
#[derive(Debug, Args)]
pub struct FluidsArgs {
    /// A component to show (name, alias, formula or CAS); all are listed when omitted.
    pub name: Option<String>,
    /// List the components whose name, alias, formula or CAS contains this text.
    #[arg(long, conflicts_with = "name")]
    pub search: Option<String>,
    /// Output format.
    #[arg(long, short = 'f', value_enum, default_value = "table")]
    pub format: Format,
}

/// Arguments of `zfactor kij`.
#[derive(Debug, Args)]
pub struct KijArgs {
    /// Components: the pairs of one component, or the pair of two; every pair when omitted.
    #[arg(value_name = "COMPONENT")]
    pub names: Vec<String>,
    /// Only the values fitted for one model family: pr or srk.
    #[arg(long)]
    pub family: Option<String>,
    /// Output format.
    #[arg(long, short = 'f', value_enum, default_value = "table")]
    pub format: Format,
}

/// Arguments of `zfactor demo`.
#[derive(Debug, Args)]
pub struct DemoArgs {
    /// Output format.
    #[arg(long, short = 'f', value_enum, default_value = "table")]
    pub format: Format,
}

#[cfg(test)]
mod tests {
    use super::*;
    use clap::CommandFactory;

    #[test]
    fn the_command_line_definition_is_consistent() {
        Cli::command().debug_assert();
    }
}
