//! The fluid a command is asked about, from its fluid options: `--fluid NAME`, `--mix
//! "name=fraction,..."` or `--mix-file FILE`, with `--basis`, `--normalize` and the user's
//! k_ij (`--kij`, `--kij-file`).

use crate::cli::gravity_args::GravityArgs;
use crate::cli::FluidArgs;
use crate::error::CliError;
use crate::feed::{self, Feed};

/// Reads `--gravity` (with its non-hydrocarbons) when given, else the fluid options.
pub fn read_gas(args: &FluidArgs, gravity: &GravityArgs) -> Result<Feed, CliError> {
    if (args.kij.is_some() || args.kij_file.is_some()) && gravity.gravity.is_some() {
        return Err(CliError::BadInput(
            "--kij and --kij-file are for the cubic equations of a mixture by components; a \
             gas known by its --gravity takes the gas-gravity correlations (dak, hy)"
                .to_string(),
        ));
    }
    match crate::gravity_feed::read(gravity)? {
        Some(feed) => Ok(feed),
        None => read_one_of(args, "--gravity G"),
    }
}

/// Reads `--fluid` or `--mix` with `--basis`, `--normalize` and the user's k_ij.
pub fn read(args: &FluidArgs) -> Result<Feed, CliError> {
    read_one_of(args, "")
}

/// Reads the fluid options; `more` names another way in the command has ("--gravity G"), for
/// the message when none is given.
fn read_one_of(args: &FluidArgs, more: &str) -> Result<Feed, CliError> {
    let mut feed = read_fluid(args, more)?;
    if args.kij.is_some() || args.kij_file.is_some() {
        let ids = feed.ids();
        feed.kij =
            crate::kij_input::read(args.kij.as_deref(), args.kij_file.as_deref(), Some(&ids))?;
    }
    Ok(feed)
}

fn read_fluid(args: &FluidArgs, more: &str) -> Result<Feed, CliError> {
    match (&args.fluid, &args.mix) {
        (Some(name), None) => {
            let rec = fluids::find(name)?;
            Ok(Feed {
                records: vec![rec],
                as_entered: vec![1.0],
                basis: args.basis,
                percent: false,
                normalized_from: None,
                mole: vec![1.0],
                mass: vec![1.0],
                kij: Vec::new(),
                gravity: None,
            })
        }
        (None, Some(mix)) => feed::parse_mix(mix, args.basis, args.normalize),
        (None, None) if args.mix_file.is_some() => {
            let path = args.mix_file.as_deref().unwrap_or_default();
            crate::mix_file::read(path, args.normalize)
        }
        _ => {
            let ways = if more.is_empty() {
                "--mix \"name=fraction,...\" or --mix-file FILE".to_string()
            } else {
                format!("--mix \"name=fraction,...\", --mix-file FILE or {more}")
            };
            Err(CliError::BadInput(format!(
                "give one of --fluid NAME, {ways}"
            )))
        }
    }
}
