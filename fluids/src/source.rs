//! Literature sources: every data row carries one or more source keys, each resolved here to a
//! full citation (`data/sources.csv`).

use crate::record::Source;

/// Every source, in the order of `data/sources.csv`; empty if the data failed to load
/// (see [`crate::data_status`]).
pub fn sources() -> &'static [Source] {
    crate::data::db().map_or(&[], |d| d.sources.as_slice())
}

/// The source with this key (exact, case-sensitive), if any.
pub fn source(key: &str) -> Option<&'static Source> {
    sources().iter().find(|s| s.key == key)
}
