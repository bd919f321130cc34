//! Finding one component by what an engineer types: id, name, alias, CAS number, or formula
//! when only one component has it.
//!
//! Matching ignores case and surrounding whitespace and drops the separators `-`, `_` and
//! space, so "n butane", "N-Butane", "n_butane" and "nbutane" are the same query.

use crate::data::db;
use crate::error::LookupError;
use crate::record::ComponentRecord;

/// The canonical form used for matching: trimmed, lowercase, without `-`, `_` or spaces.
pub fn normalize(s: &str) -> String {
    s.trim()
        .chars()
        .filter(|c| !matches!(c, '-' | '_' | ' ' | '\t'))
        .flat_map(char::to_lowercase)
        .collect()
}

/// Every component, in table order; empty if the data failed to load (see
/// [`crate::data_status`]).
pub fn all() -> &'static [ComponentRecord] {
    db().map_or(&[], |d| d.components.as_slice())
}

/// The one component that `query` names.
///
/// Tried in order: id, name, alias or CAS number; then the formula, which must belong to a
/// single component (C4H10 is both butanes and gives [`LookupError::Ambiguous`]). Nothing
/// found gives [`LookupError::Unknown`] with up to five close ids.
pub fn find(query: &str) -> Result<&'static ComponentRecord, LookupError> {
    match find_built_in(query) {
        Err(LookupError::Unknown { query, suggestions }) => {
            crate::user::find(&query).ok_or(LookupError::Unknown { query, suggestions })
        }
        other => other,
    }
}

/// [`find`] among the built-in components only; the user's ([`crate::user`]) are tried
/// after these.
pub(crate) fn find_built_in(query: &str) -> Result<&'static ComponentRecord, LookupError> {
    let d = db().map_err(|e| LookupError::Data(e.clone()))?;
    let q = normalize(query);
    if let Some(&i) = d.names.get(&q) {
        return Ok(&d.components[i]);
    }
    match d.formulas.get(&q).map(Vec::as_slice) {
        Some([i]) => Ok(&d.components[*i]),
        Some(many) if !many.is_empty() => Err(LookupError::Ambiguous {
            query: query.to_string(),
            candidates: many.iter().map(|&i| d.components[i].id.clone()).collect(),
        }),
        _ => Err(LookupError::Unknown {
            query: query.to_string(),
            suggestions: crate::suggest::suggestions(query, 5),
        }),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn separators_and_case_are_ignored() {
        assert_eq!(normalize("  N-Butane "), "nbutane");
        assert_eq!(normalize("n butane"), "nbutane");
        assert_eq!(normalize("n_BUTANE"), "nbutane");
        assert_eq!(normalize("R-134a"), normalize("r134a"));
    }
}
