//! Model ids of the command line and JSON, and how each model is built for a fluid.

use crate::error::{from_eos, CliError};
use crate::feed::Feed;
use eos::cubic::{Cubic, CubicKind};
use eos::ideal::IdealGas;
use eos::Model;

/// A model ready for a feed, with the notes that belong to its basis (k_ij used or missing).
pub struct BuiltModel {
    /// The model.
    pub model: Box<dyn Model>,
    /// Its id.
    pub id: String,
    /// Its display name.
    pub name: String,
    /// The paper or standard it comes from.
    pub citation: String,
    /// Basis notes: which k_ij were used, which pairs had none.
    pub notes: Vec<String>,
}

/// Every model id the tool knows, simplest first.
pub const ALL_IDS: [&str; 6] = ["ideal", "vdw", "rk", "srk", "pr", "pr78"];

/// Expands a `--model` value ("all", one id, or a comma-separated list) into ids, refusing
/// unknown ones with the list of known ids.
pub fn resolve_ids(spec: &str) -> Result<Vec<String>, CliError> {
    let spec = spec.trim();
    if spec.eq_ignore_ascii_case("all") {
        return Ok(ALL_IDS.iter().map(|s| s.to_string()).collect());
    }
    let mut ids = Vec::new();
    for part in spec.split(',').map(str::trim).filter(|s| !s.is_empty()) {
        let id = part.to_ascii_lowercase();
        if !ALL_IDS.contains(&id.as_str()) {
            return Err(CliError::BadInput(format!(
                "unknown model \"{part}\"; known models: {}, or all",
                ALL_IDS.join(", ")
            )));
        }
        if !ids.contains(&id) {
            ids.push(id);
        }
    }
    if ids.is_empty() {
        return Err(CliError::BadInput(format!(
            "--model \"{spec}\" names no model; known models: {}, or all",
            ALL_IDS.join(", ")
        )));
    }
    Ok(ids)
}

/// Builds model `id` for `feed`.
pub fn build(id: &str, feed: &Feed) -> Result<BuiltModel, CliError> {
    let comps = feed.components();
    if id == "ideal" {
        return Ok(BuiltModel {
            model: Box::new(IdealGas::new(&comps)),
            id: id.to_string(),
            name: "ideal gas".to_string(),
            citation: "P v = R T".to_string(),
            notes: Vec::new(),
        });
    }
    let kind = CubicKind::from_id(id).ok_or_else(|| {
        CliError::BadInput(format!(
            "unknown model \"{id}\"; known models: {}",
            ALL_IDS.join(", ")
        ))
    })?;
    let family = match kind {
        CubicKind::Pr76 | CubicKind::Pr78 => Some(fluids::KijFamily::PengRobinson),
        CubicKind::Srk => Some(fluids::KijFamily::Soave),
        CubicKind::Vdw | CubicKind::Rk => None,
    };
    let mut notes = Vec::new();
    let kij = match family {
        Some(f) if !feed.is_pure() => {
            let ids = feed.ids();
            let m = fluids::kij_matrix(&ids, f);
            let used = (ids.len() * (ids.len() - 1)) / 2 - m.missing.len();
            if used > 0 {
                notes.push(format!("k_ij from the fluids data for {used} pair(s)"));
                if f == fluids::KijFamily::Soave {
                    notes.push(
                        "no SRK-specific k_ij at hand: the Peng-Robinson values are used"
                            .to_string(),
                    );
                }
            }
            if !m.missing.is_empty() {
                let pairs: Vec<String> =
                    m.missing.iter().map(|(a, b)| format!("{a}-{b}")).collect();
                notes.push(format!(
                    "k_ij = 0 (no value known) for {}",
                    pairs.join(", ")
                ));
            }
            Some(m.values)
        }
        _ => {
            if !feed.is_pure() {
                notes.push(format!(
                    "k_ij = 0 for every pair ({id} is used without k_ij)"
                ));
            }
            None
        }
    };
    let cubic = Cubic::new(kind, &comps, kij.as_deref())
        .map_err(|e| from_eos(&format!("building model {id}"), e))?;
    let spec = kind.spec();
    Ok(BuiltModel {
        model: Box::new(cubic),
        id: id.to_string(),
        name: spec.name.to_string(),
        citation: spec.citation.to_string(),
        notes,
    })
}
