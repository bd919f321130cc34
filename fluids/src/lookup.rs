//! Finding one built-in component by what an engineer types: id, name, alias, CAS number, or
//! formula when only one component has it (matching as in [`crate::name`]).

use crate::data::db;
use crate::error::LookupError;
use crate::name::normalize;
use crate::record::ComponentRecord;

/// Every component, in table order; empty if the data failed to load (see
/// [`crate::data_status`]).
pub fn all() -> &'static [ComponentRecord] {
    db().map_or(&[], |d| d.components.as_slice())
}

/// [`crate::find`] among the built-in components only; the user's ([`crate::user`]) are
/// tried after these.
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
