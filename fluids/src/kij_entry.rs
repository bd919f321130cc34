//! A row of `data/kij.csv` and the equation-of-state family its k_ij is for.

use serde::Serialize;

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

impl KijFamily {
    /// The key of the family in files and options: "pr", "srk" (None: "none").
    pub fn key(self) -> &'static str {
        match self {
            KijFamily::PengRobinson => "pr",
            KijFamily::Soave => "srk",
            KijFamily::None => "none",
        }
    }

    /// The family of a key ("pr", "srk"; any case).
    pub fn parse(s: &str) -> Option<Self> {
        Self::from_key(&s.trim().to_ascii_lowercase())
    }
}
