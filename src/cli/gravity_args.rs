//! A natural gas known by its specific gravity, for the gas-gravity Z correlations (`dak`,
//! `hy`), in the commands where Z and density suffice (`state`, `table`, `vessel`, `flow`).

use clap::Args;

/// `--gravity` with the gas's nitrogen, carbon dioxide and hydrogen sulfide.
#[derive(Debug, Clone, Default, Args)]
pub struct GravityArgs {
    /// A natural gas by its specific gravity (molar mass over air's, 28.9647 g/mol) instead of
    /// --fluid or --mix: Z and density from the gas-gravity correlations dak and hy; energy
    /// properties need a composition.
    #[arg(long, conflicts_with_all = ["fluid", "mix", "mix_file"])]
    pub gravity: Option<String>,
    /// Nitrogen in the --gravity gas, mole fraction or percent ("0.02", "2%").
    #[arg(long)]
    pub n2: Option<String>,
    /// Carbon dioxide in the --gravity gas, mole fraction or percent (Wichert-Aziz correction).
    #[arg(long)]
    pub co2: Option<String>,
    /// Hydrogen sulfide in the --gravity gas, mole fraction or percent (Wichert-Aziz
    /// correction).
    #[arg(long)]
    pub h2s: Option<String>,
}
