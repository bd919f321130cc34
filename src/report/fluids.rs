//! The report of `zfactor fluids`: component records as the `fluids` crate gives them.

use serde::Serialize;

/// Components listed or shown.
#[derive(Debug, Clone, Serialize)]
pub struct FluidsReport {
    /// The query, when there was one.
    pub query: Option<String>,
    /// The matching records.
    pub components: Vec<&'static fluids::ComponentRecord>,
}
