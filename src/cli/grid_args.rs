//! Arguments of the grid commands `zfactor compare` and `zfactor table` (clap derive, raw
//! strings; read by [`crate::compare::grid`], [`crate::units`] and [`crate::feed`]).

use super::{FluidArgs, Format};
use clap::{Args, ValueEnum};

/// Arguments of `zfactor compare`.
#[derive(Debug, Clone, Args)]
pub struct CompareArgs {
    #[command(flatten)]
    pub fluid: FluidArgs,
    /// Temperatures: values with units and ranges, e.g. "250 K,300 K" or "250..350 K step 25"
    /// or "0..40 degC n 5".
    #[arg(
        long,
        short = 't',
        visible_alias = "temperature",
        allow_hyphen_values = true
    )]
    pub temperatures: Option<String>,
    /// Pressures: values with units and ranges, e.g. "10 bar,50 bar" or "1..200 bar n 20 log".
    #[arg(
        long,
        short = 'p',
        visible_alias = "pressure",
        allow_hyphen_values = true
    )]
    pub pressures: Option<String>,
    /// A CSV list of states instead of a grid: columns "T [unit]" and "P [unit]".
    #[arg(long, conflicts_with_all = ["temperatures", "pressures"])]
    pub states: Option<String>,
    /// Ambient pressure that gauge readings are referred to.
    #[arg(long, default_value = "101.325 kPa")]
    pub ambient: String,
    /// Models to compare: an id, a comma-separated list, or "all".
    #[arg(long, short = 'm', default_value = "all")]
    pub model: String,
    /// What to compare against: a model id (e.g. pr) or the built-in data set "iso6976".
    /// Default: the fluid's reference formulation where it has one (IAPWS-95 for water, the
    /// reference equations of methane, nitrogen, carbon dioxide, argon and hydrogen).
    #[arg(long, conflicts_with = "reference_file")]
    pub reference: Option<String>,
    /// A CSV file of reference values: "T [unit]", "P [unit]", "Z" or "density [unit]",
    /// "source" (and optionally "phase").
    #[arg(long)]
    pub reference_file: Option<String>,
    /// Skip rows of a states or reference file that cannot be read or computed, and report
    /// how many were skipped.
    #[arg(long)]
    pub skip_bad_rows: bool,
    /// Tolerances in percent for the ideal-gas map and the model advice, e.g. "1,2,5".
    #[arg(long, default_value = "1,2,5")]
    pub tolerance: String,
    /// Write charts (isotherms, deviation maps, ideal-gas map) into this folder.
    #[arg(long)]
    pub charts: Option<String>,
    /// File type of the charts.
    #[arg(long, value_enum, default_value = "svg")]
    pub chart_format: ChartFormat,
    /// Overwrite chart files that exist already.
    #[arg(long)]
    pub force: bool,
    /// Output format.
    #[arg(long, short = 'f', value_enum, default_value = "table")]
    pub format: Format,
}

/// File types of charts.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum ChartFormat {
    /// Scalable vector graphics.
    Svg,
    /// Portable network graphics (bitmap).
    Png,
}

impl ChartFormat {
    /// The file extension.
    pub fn extension(self) -> &'static str {
        match self {
            ChartFormat::Svg => "svg",
            ChartFormat::Png => "png",
        }
    }
}

/// Output formats of `zfactor table`.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum TableFormat {
    /// A table for the terminal.
    Table,
    /// Comma-separated values, SI units.
    Csv,
    /// One JSON object, SI units.
    Json,
    /// A Markdown document: the basis, then the table.
    Markdown,
    /// An Excel workbook (needs --output): the table and the basis on its own sheet.
    Xlsx,
}

/// Arguments of `zfactor table`.
#[derive(Debug, Args)]
pub struct TableArgs {
    #[command(flatten)]
    pub fluid: FluidArgs,
    #[command(flatten)]
    pub gravity: crate::cli::gravity_args::GravityArgs,
    /// Temperatures: values with units and ranges, e.g. "250 K,300 K" or "250..350 K step 25".
    #[arg(
        long,
        short = 't',
        visible_alias = "temperature",
        allow_hyphen_values = true
    )]
    pub temperatures: String,
    /// Pressures: values with units and ranges, e.g. "10 bar,50 bar" or "1..200 bar n 20".
    #[arg(
        long,
        short = 'p',
        visible_alias = "pressure",
        allow_hyphen_values = true
    )]
    pub pressures: String,
    /// Ambient pressure that gauge readings are referred to.
    #[arg(long, default_value = "101.325 kPa")]
    pub ambient: String,
    /// The one model of the table.
    #[arg(long, short = 'm', default_value = "pr")]
    pub model: String,
    /// Properties, comma-separated: z, density, molar-density, volume, phase, ideal-error,
    /// h, s, cp, cv, w, jt, kappa; or "all".
    #[arg(long, default_value = "z,density,phase")]
    pub properties: String,
    /// Output format.
    #[arg(long, short = 'f', value_enum, default_value = "table")]
    pub format: TableFormat,
    /// Write to this file instead of stdout (written atomically; needed for xlsx).
    #[arg(long, short = 'o')]
    pub output: Option<String>,
    /// Overwrite the output file if it exists.
    #[arg(long)]
    pub force: bool,
}
