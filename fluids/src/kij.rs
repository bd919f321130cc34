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

pub use crate::kij_entry::KijFamily;
use crate::query::find;
use crate::record::Confidence;

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

/// A k_ij the user sets for a pair: for one model family, or for every family that takes
/// k_ij (`family` None). User values override built-in ones.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct UserKij {
    /// Component ids as [`crate::find`] resolves them.
    pub a: String,
    pub b: String,
    /// The family the value is for; None: every family.
    pub family: Option<KijFamily>,
    pub value: f64,
    /// Where the user gave it ("--kij", or a file and its line).
    pub origin: String,
    /// Precedence of where it was given: a higher layer wins (a file 0, the command line 1).
    pub layer: u8,
}

/// Where a k_ij in use comes from.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub enum KijOrigin {
    /// The built-in table: its source key, and whether another family's value stands in.
    BuiltIn {
        source_key: String,
        fitted_for: KijFamily,
        substituted: bool,
    },
    /// Set by the user (the origin text of [`UserKij`]).
    User(String),
    /// No value known: zero.
    Unknown,
}

/// One pair's k_ij as used, with its origin.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct KijUse {
    pub a: String,
    pub b: String,
    pub value: f64,
    pub origin: KijOrigin,
}

/// The k_ij matrix of `ids` for `family`, with the user's values over the built-in ones,
/// and every pair's value and origin. Among the user's values for one pair, the highest
/// layer wins (the command line over a file); within a layer, one set for the family beats
/// one set for every family, and a later one an earlier one. For [`KijFamily::None`] the matrix is zero
/// and no pair is listed.
pub fn resolve(ids: &[&str], family: KijFamily, user: &[UserKij]) -> (Vec<f64>, Vec<KijUse>) {
    let n = ids.len();
    let mut values = vec![0.0; n * n];
    let mut uses = Vec::new();
    if family == KijFamily::None {
        return (values, uses);
    }
    let id_of = |q: &str| find(q).map_or_else(|_| q.to_string(), |r| r.id.clone());
    let resolved: Vec<String> = ids.iter().map(|q| id_of(q)).collect();
    for i in 0..n {
        for j in (i + 1)..n {
            let (a, b) = (&resolved[i], &resolved[j]);
            if a == b {
                continue;
            }
            // The highest layer first, then a value for this family over one for every
            // family, then the later one.
            let mine = user
                .iter()
                .enumerate()
                .filter(|(_, u)| (&u.a == a && &u.b == b) || (&u.a == b && &u.b == a))
                .filter(|(_, u)| u.family.is_none() || u.family == Some(family))
                .max_by_key(|(k, u)| (u.layer, u.family.is_some(), *k))
                .map(|(_, u)| u);
            let (value, origin) = match (mine, kij(a, b, family)) {
                (Some(u), _) => (u.value, KijOrigin::User(u.origin.clone())),
                (None, Some(k)) => (
                    k.value,
                    KijOrigin::BuiltIn {
                        source_key: k.source_key,
                        fitted_for: k.fitted_for,
                        substituted: k.substituted,
                    },
                ),
                (None, None) => (0.0, KijOrigin::Unknown),
            };
            values[i * n + j] = value;
            values[j * n + i] = value;
            uses.push(KijUse {
                a: a.clone(),
                b: b.clone(),
                value,
                origin,
            });
        }
    }
    (values, uses)
}

/// Every k_ij of the built-in table, in its order, with its source.
pub fn table() -> Vec<KijRecord> {
    let Ok(db) = crate::data::db() else {
        return Vec::new();
    };
    db.kij
        .iter()
        .map(|e| KijRecord {
            a: e.a.clone(),
            b: e.b.clone(),
            value: e.value,
            requested: e.family,
            fitted_for: e.family,
            substituted: false,
            source_key: e.source_key.clone(),
            source: e.source.clone(),
            confidence: e.confidence,
            plausible_range: e.plausible_range.clone(),
            notes: e.notes.clone(),
        })
        .collect()
}

#[cfg(test)]
mod resolve_tests {
    use super::*;

    fn user(a: &str, b: &str, family: Option<KijFamily>, value: f64, origin: &str) -> UserKij {
        UserKij {
            a: a.to_string(),
            b: b.to_string(),
            family,
            value,
            origin: origin.to_string(),
            layer: u8::from(origin == "--kij"),
        }
    }

    #[test]
    fn user_values_override_pair_by_pair_and_family_by_family() {
        let ids = ["methane", "co2", "ethane"];
        let users = [
            user("co2", "methane", None, 0.10, "file line 2"),
            user(
                "methane",
                "co2",
                Some(KijFamily::Soave),
                0.11,
                "file line 3",
            ),
            user("methane", "co2", None, 0.12, "--kij"),
        ];
        let (m, uses) = resolve(&ids, KijFamily::PengRobinson, &users);
        // PR: the command line's value wins over the file's and the built-in 0.0919.
        assert!((m[1] - 0.12_f64).abs() < 1e-15);
        assert!((m[3] - 0.12_f64).abs() < 1e-15);
        assert_eq!(uses[0].origin, KijOrigin::User("--kij".to_string()));
        // methane-ethane stays built-in (Knapp et al. 1982 as in the table), ethane-co2 too.
        assert!(matches!(uses[1].origin, KijOrigin::BuiltIn { .. }));
        // SRK: the command line's family-less value still beats the file's SRK value; within
        // the file, the SRK value beats the family-less one.
        let (m, _) = resolve(&ids, KijFamily::Soave, &users);
        assert!((m[1] - 0.12_f64).abs() < 1e-15);
        let (m, _) = resolve(&ids, KijFamily::Soave, &users[..2]);
        assert!((m[1] - 0.11_f64).abs() < 1e-15);
        // A pair with no value anywhere is zero and says so.
        let (m, uses) = resolve(&["methane", "n-decane"], KijFamily::PengRobinson, &[]);
        assert!(m.iter().all(|v| v.abs() < 1e-300));
        assert_eq!(uses[0].origin, KijOrigin::Unknown);
        // Families without k_ij list nothing.
        assert!(resolve(&ids, KijFamily::None, &users).1.is_empty());
    }
}
