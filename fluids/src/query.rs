//! What a component name in the user's input means: a built-in component first
//! ([`crate::lookup`]), then one the user registered ([`crate::user`]).

use crate::error::LookupError;
use crate::lookup::find_built_in;
use crate::record::ComponentRecord;
use crate::user;

/// The one component that `query` names.
///
/// Tried in order: id, name, alias or CAS number; then the formula, which must belong to a
/// single component (C4H10 is both butanes and gives [`LookupError::Ambiguous`]). Nothing
/// found among the built-in ones, the user's registered names are tried; still nothing gives
/// [`LookupError::Unknown`] with up to five close ids.
pub fn find(query: &str) -> Result<&'static ComponentRecord, LookupError> {
    match find_built_in(query) {
        Err(LookupError::Unknown { query, suggestions }) => {
            user::find(&query).ok_or(LookupError::Unknown { query, suggestions })
        }
        other => other,
    }
}
