//! `zfactor models`: the model catalogue (eos::catalogue), so that a choice of model can cite
//! its source, its range and what it is known to be poor at.

use crate::cli::ModelsArgs;
use crate::error::CliError;
use crate::report::models::{FluidRangeEntry, ModelEntry, ModelsReport};

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
        density_uncertainty_pct: 100.0 * m.density_uncertainty,
        fluid_ranges: fluid_ranges(m.id),
        good_at: m.good_at.to_vec(),
        poor_at: m.poor_at.to_vec(),
    }
}

/// The published range of each formulation of a Helmholtz model id (reference, sw12), the one
/// every command checks states against.
fn fluid_ranges(id: &str) -> Vec<FluidRangeEntry> {
    use eos::helmholtz::{formulation, keys, Tier};
    let tier = match id {
        "reference" => Tier::Reference,
        "sw12" => Tier::Technical,
        _ => return Vec::new(),
    };
    keys()
        .filter_map(|k| formulation(k).ok())
        .filter(|f| f.tier == tier)
        .map(|f| FluidRangeEntry {
            fluid: f.fluid,
            formulation: f.title,
            t_min_k: f.validity.t_min,
            t_max_k: f.validity.t_max,
            p_max_pa: f.validity.p_max,
        })
        .collect()
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
