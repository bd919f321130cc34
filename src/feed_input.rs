//! The fluid a command is asked about, from its fluid options: `--fluid NAME`, `--mix
//! "name=fraction,..."` or `--mix-file FILE`, with `--basis`, `--normalize` and the user's
//! k_ij (`--kij`, `--kij-file`).

use crate::cli::FluidArgs;
use crate::error::CliError;
use crate::feed::{self, Feed};

/// Reads `--fluid` or `--mix` with `--basis`, `--normalize` and the user's k_ij.
pub fn read(args: &FluidArgs) -> Result<Feed, CliError> {
    let mut feed = read_fluid(args)?;
    if args.kij.is_some() || args.kij_file.is_some() {
        let ids = feed.ids();
        feed.kij =
            crate::kij_input::read(args.kij.as_deref(), args.kij_file.as_deref(), Some(&ids))?;
    }
    Ok(feed)
}

fn read_fluid(args: &FluidArgs) -> Result<Feed, CliError> {
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
            })
        }
        (None, Some(mix)) => feed::parse_mix(mix, args.basis, args.normalize),
        (None, None) if args.mix_file.is_some() => {
            let path = args.mix_file.as_deref().unwrap_or_default();
            crate::mix_file::read(path, args.normalize)
        }
        _ => Err(CliError::BadInput(
            "give one of --fluid NAME, --mix \"name=fraction,...\" or --mix-file FILE".to_string(),
        )),
    }
}
