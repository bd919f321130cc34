//! Typed errors of the crate: a failed look-up, and a fault in the embedded data tables.

use thiserror::Error;

/// Why [`crate::find`] could not return exactly one component.
#[derive(Debug, Clone, PartialEq, Eq, Error)]
pub enum LookupError {
    /// Nothing matched; `suggestions` holds up to five close ids (best first), possibly none.
    #[error("unknown component \"{query}\"{}", suggestion_text(.suggestions))]
    Unknown {
        /// The text as given.
        query: String,
        /// Ids of close matches, best first.
        suggestions: Vec<String>,
    },
    /// The text is a formula shared by several components (e.g. C4H10).
    #[error("\"{query}\" is ambiguous: it matches {}; give one of these ids", .candidates.join(", "))]
    Ambiguous {
        /// The text as given.
        query: String,
        /// Ids of every matching component.
        candidates: Vec<String>,
    },
    /// The embedded data tables failed to load (a defect of the build, reported, not panicked).
    #[error("component data unavailable: {0}")]
    Data(#[from] DataError),
}

fn suggestion_text(s: &[String]) -> String {
    if s.is_empty() {
        " (no close match)".to_string()
    } else {
        format!("; did you mean: {}?", s.join(", "))
    }
}

/// A fault found while parsing or cross-checking the embedded CSV tables.
#[derive(Debug, Clone, PartialEq, Eq, Error)]
#[error("{file}: {message}")]
pub struct DataError {
    /// The data file concerned.
    pub file: &'static str,
    /// What is wrong, with the row where known.
    pub message: String,
}
