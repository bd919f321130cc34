//! The parts of `zfactor table`'s output: a design-basis table of one model over a T-P grid,
//! with everything needed to trace it (the basis). The table is written as it is computed
//! ([`crate::render::grid_table::TableWriter`]); its JSON is one object with `basis`,
//! `columns`, `rows` (one object per (T, P), temperature outer) and `warnings`.

use crate::report::state::CompositionRow;
use serde::Serialize;

/// The basis of a table.
#[derive(Debug, Clone, Serialize)]
pub struct TableBasis {
    /// Tool name and version.
    pub tool: String,
    /// Model id.
    pub model: String,
    /// Model name.
    pub model_name: String,
    /// The paper or standard of the model.
    pub citation: String,
    /// k_ij used or missing.
    pub kij: Vec<String>,
    /// The fluid.
    pub fluid: String,
    /// Basis of the entered fractions ("mole" or "mass").
    pub entered_basis: &'static str,
    /// True when the entered values were percentages.
    pub entered_in_percent: bool,
    /// Sum of the entered values when they were normalised.
    pub normalized_from: Option<f64>,
    /// The composition as entered and normalised on both bases.
    pub composition: Vec<CompositionRow>,
    /// Data sources of each component.
    pub component_sources: Vec<ComponentSource>,
    /// Temperatures as entered.
    pub temperatures_entered: String,
    /// Pressures as entered.
    pub pressures_entered: String,
    /// Ambient pressure that gauge readings are referred to, Pa.
    pub ambient_pressure_pa: f64,
    /// Root choice.
    pub root: &'static str,
    /// How the values were computed.
    pub method: String,
    /// Units of the columns (this output's units).
    pub units: Vec<UnitNote>,
    /// The caution for pressure equipment.
    pub caution: &'static str,
}

/// The sources of one component's data.
#[derive(Debug, Clone, Serialize)]
pub struct ComponentSource {
    pub id: String,
    pub name: String,
    /// Critical constants and acentric factor.
    pub constants_source: String,
    /// Confidence mark of the constants.
    pub confidence: String,
    /// Ideal-gas heat capacity.
    pub cp_source: String,
}

/// A column's quantity and unit.
#[derive(Debug, Clone, Serialize)]
pub struct UnitNote {
    pub quantity: String,
    pub unit: String,
}

/// One column.
#[derive(Debug, Clone, Serialize)]
pub struct TableColumn {
    /// Key (SI name, as in CSV and JSON).
    pub key: &'static str,
    /// Name for people.
    pub name: &'static str,
    /// SI unit.
    pub unit_si: &'static str,
}

/// One row.
#[derive(Debug, Clone, Serialize)]
pub struct TableRow {
    pub temperature_k: f64,
    pub pressure_pa: f64,
    /// Phase name (when asked for, and computed).
    pub phase: Option<&'static str>,
    /// Values in the order of `columns`, SI (null where not defined or not computed).
    pub values: Vec<Option<f64>>,
    /// Where the state stands against the model's range and the solid region: "outside
    /// range", "solid", "solid may form" (joined by "; "); null inside.
    pub flag: Option<String>,
    /// Why this state has no values.
    pub error: Option<String>,
}
