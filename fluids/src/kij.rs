//! Binary interaction parameters k_ij of the classical van der Waals one-fluid mixing rule of
//! the cubic equations of state:
//!
//! a_mix = sum_i sum_j x_i x_j sqrt(a_i a_j) (1 - k_ij),   k_ij = k_ji,   k_ii = 0.
//!
//! Values (`data/kij.csv`) are temperature-independent Peng-Robinson (1976) k_ij from
//! Knapp, Doering, Oellrich, Ploecker & Prausnitz (1982), DECHEMA Chemistry Data Series VI, as
//! reproduced in natural-gas engineering references, recalled from memory. No SRK-specific set
//! is at hand: for [`KijFamily::Soave`] the Peng-Robinson value is returned and marked
//! `substituted`. Van der Waals and Redlich-Kwong use k_ij = 0 ([`KijFamily::None`]).
//! Pairs without a value (hydrogen pairs, among others) are absent, never a silent zero:
//! [`kij_matrix`] lists them in [`KijMatrix::missing`].

use serde::Serialize;

use crate::lookup::find;
use crate::record::Confidence;

/// Which equation of state the k_ij are for.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub enum KijFamily {
    /// Peng-Robinson (1976 and 1978).
    PengRobinson,
    /// Soave-Redlich-Kwong (1972).
    Soave,
    /// No interaction parameters (van der Waals, Redlich-Kwong): k_ij = 0.
    None,
}

impl KijFamily {
    pub(crate) fn from_key(s: &str) -> Option<Self> {
        match s {
            "pr" => Some(KijFamily::PengRobinson),
            "srk" => Some(KijFamily::Soave),
            _ => None,
        }
    }
}

/// One row of `data/kij.csv`.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct KijEntry {
    pub a: String,
    pub b: String,
    pub family: KijFamily,
    pub value: f64,
    pub source_key: String,
    pub source: String,
    pub confidence: Confidence,
    pub plausible_range: String,
    pub notes: String,
}

/// A k_ij with its provenance.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct KijRecord {
    /// Id of the first component, as asked.
    pub a: String,
    /// Id of the second component, as asked.
    pub b: String,
    /// The value.
    pub value: f64,
    /// The family asked for.
    pub requested: KijFamily,
    /// The family the value was fitted for.
    pub fitted_for: KijFamily,
    /// True when `fitted_for` differs from `requested` (a PR value used for SRK).
    pub substituted: bool,
    /// Source key(s).
    pub source_key: String,
    /// Citation, resolved.
    pub source: String,
    /// Confidence mark.
    pub confidence: Confidence,
    /// Spread of values found in the literature, as recalled.
    pub plausible_range: String,
    /// Remarks; says so when the value is a substitute.
    pub notes: String,
}

/// The n x n k_ij matrix for a list of components.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct KijMatrix {
    /// Ids in matrix order (the resolved id, or the text as given if it named nothing).
    pub ids: Vec<String>,
    /// Row-major n x n values, symmetric, zero diagonal; zero where missing.
    pub values: Vec<f64>,
    /// Pairs (i < j order) with no tabulated value for the family, set to zero in `values`.
    pub missing: Vec<(String, String)>,
}

const SUBSTITUTE_NOTE: &str = "Peng-Robinson value used for SRK: no SRK-specific value at hand \
                               (k_ij are model-specific; refit for accurate phase equilibria)";

/// k_ij of two components (any name [`crate::find`] accepts), symmetric in `a` and `b`.
/// `None` when either name is unknown, both are the same component, the family is
/// [`KijFamily::None`], or no value is tabulated.
pub fn kij(a: &str, b: &str, family: KijFamily) -> Option<KijRecord> {
    let (ra, rb) = (find(a).ok()?, find(b).ok()?);
    if ra.id == rb.id || family == KijFamily::None {
        return None;
    }
    let table = &crate::data::db().ok()?.kij;
    let lookup = |fam: KijFamily| {
        table.iter().find(|e| {
            e.family == fam && ((e.a == ra.id && e.b == rb.id) || (e.a == rb.id && e.b == ra.id))
        })
    };
    let (entry, substituted) = match (lookup(family), family) {
        (Some(e), _) => (e, false),
        (None, KijFamily::Soave) => (lookup(KijFamily::PengRobinson)?, true),
        (None, _) => return None,
    };
    let notes = match (substituted, entry.notes.is_empty()) {
        (false, _) => entry.notes.clone(),
        (true, true) => SUBSTITUTE_NOTE.to_string(),
        (true, false) => format!("{SUBSTITUTE_NOTE}; {}", entry.notes),
    };
    Some(KijRecord {
        a: ra.id.clone(),
        b: rb.id.clone(),
        value: entry.value,
        requested: family,
        fitted_for: entry.family,
        substituted,
        source_key: entry.source_key.clone(),
        source: entry.source.clone(),
        confidence: entry.confidence,
        plausible_range: entry.plausible_range.clone(),
        notes,
    })
}

/// The k_ij matrix for `ids` (any names [`crate::find`] accepts). Pairs without a value are
/// zero and listed in `missing`; for [`KijFamily::None`] every entry is zero and nothing is
/// missing. A name that resolves to nothing makes all its pairs missing.
pub fn kij_matrix(ids: &[&str], family: KijFamily) -> KijMatrix {
    let n = ids.len();
    let resolved: Vec<Option<String>> = ids
        .iter()
        .map(|q| find(q).ok().map(|r| r.id.clone()))
        .collect();
    let names: Vec<String> = resolved
        .iter()
        .zip(ids)
        .map(|(r, q)| r.clone().unwrap_or_else(|| q.to_string()))
        .collect();
    let mut values = vec![0.0; n * n];
    let mut missing = Vec::new();
    if family != KijFamily::None {
        for i in 0..n {
            for j in (i + 1)..n {
                let same = matches!((&resolved[i], &resolved[j]), (Some(x), Some(y)) if x == y);
                if same {
                    continue;
                }
                match kij(ids[i], ids[j], family) {
                    Some(k) => {
                        values[i * n + j] = k.value;
                        values[j * n + i] = k.value;
                    }
                    None => missing.push((names[i].clone(), names[j].clone())),
                }
            }
        }
    }
    KijMatrix {
        ids: names,
        values,
        missing,
    }
}
