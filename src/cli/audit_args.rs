//! The arguments of `zfactor audit` (parsed by clap; the command is in `commands::audit`).

use crate::cli::{Basis, Format};
use clap::Args;
use std::path::PathBuf;

/// The `--model` value that picks each fluid's reference formulation where it has one.
pub const AUTO: &str = "auto";

/// Arguments of `zfactor audit`.
#[derive(Debug, Args)]
pub struct AuditArgs {
    /// The spreadsheet: .csv or .xlsx. Never modified.
    pub file: PathBuf,
    /// Worksheet of a workbook (default: the first).
    #[arg(long)]
    pub sheet: Option<String>,
    /// Column mapping overrides: "value=Rho calc,temperature=T1,..." (fields: fluid,
    /// temperature, pressure, value, quantity, volume, mass, basis, base).
    #[arg(long)]
    pub columns: Option<String>,
    /// What the sheet computed, for sheets without a quantity column: density, z, mass,
    /// volume, std_volume.
    #[arg(long)]
    pub quantity: Option<String>,
    /// The model to recompute with: one id, or auto (each fluid's reference formulation
    /// where it has one, otherwise pr); the copy names the model of every row.
    #[arg(long, short = 'm', default_value = AUTO)]
    pub model: String,
    /// Interaction parameters over the built-in ones, for every row's mixture:
    /// "methane-co2=0.10,ethane-co2@srk=0.13".
    #[arg(long)]
    pub kij: Option<String>,
    /// A CSV file of interaction parameters (columns "component 1", "component 2", "value",
    /// optional "family" and "source"); --kij values win over the file's.
    #[arg(long)]
    pub kij_file: Option<String>,
    /// Relative tolerance: "1%", "0.5 %" or a fraction such as 0.01.
    #[arg(long, default_value = "1%")]
    pub tolerance: String,
    /// Basis of mixture fractions in rows without a basis column.
    #[arg(long, value_enum, default_value = "mole")]
    pub basis: Basis,
    /// Base conditions of standard volumes in rows without a base column.
    #[arg(long, default_value = "15degC")]
    pub base: String,
    /// Ambient pressure that gauge readings are referred to.
    #[arg(long, default_value = "101.325 kPa")]
    pub ambient: String,
    /// Path of the annotated copy (default: FILE's name with ".audit" before the extension,
    /// in the same folder).
    #[arg(long, short = 'o')]
    pub output: Option<PathBuf>,
    /// Replace an existing copy (never anything but a regular file).
    #[arg(long)]
    pub force: bool,
    /// Output format of the summary.
    #[arg(long, short = 'f', value_enum, default_value = "table")]
    pub format: Format,
}
