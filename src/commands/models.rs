//! `zfactor models`: the model catalogue (eos::catalogue), so that a choice of model can cite
//! its source, its range and what it is known to be poor at.

use crate::cli::ModelsArgs;
use crate::error::CliError;
use crate::report::models::{ModelEntry, ModelsReport};

fn entry(m: &'static eos::catalogue::ModelInfo) -> ModelEntry {
    ModelEntry {
        id: m.id,
        name: m.name,
        citation: m.citation,
        validity: m.validity,
        t_min: m.range.t_min,
        t_max: m.range.t_max,
        p_max: m.range.p_max,
        range_reduced: m.range.reduced,
        good_at: m.good_at.to_vec(),
        poor_at: m.poor_at.to_vec(),
    }
}

/// The whole catalogue, or one entry.
pub fn run(args: &ModelsArgs) -> Result<ModelsReport, CliError> {
    let models = match &args.id {
        None => eos::catalogue::ALL.iter().map(entry).collect(),
        Some(id) => {
            let m = eos::catalogue::find(&id.trim().to_ascii_lowercase()).ok_or_else(|| {
                CliError::BadInput(format!(
                    "unknown model \"{id}\"; known models: {}",
                    crate::models::ALL_IDS.join(", ")
                ))
            })?;
            vec![entry(m)]
        }
    };
    Ok(ModelsReport { models })
}
