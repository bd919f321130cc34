//! # fluids: component data for zfactor
//!
//! Critical constants, acentric factors, normal boiling points, ideal-gas heat capacities and
//! Peng-Robinson binary interaction parameters for the gases and light liquids that process,
//! pipeline and compressor engineers meet, each value with its source and a confidence mark.
//! This crate holds data and look-up only; the physics is in [`eos`].
//!
//! ## Finding a component
//! [`find`] accepts an id (`n-butane`), a name, an alias (`nC4`, `R-600`), a CAS number
//! (`106-97-8`) or a formula when only one component has it. Case, surrounding blanks and the
//! separators `-`, `_` and space do not matter. An unknown name gives close suggestions; a
//! formula shared by isomers lists them:
//!
//! ```
//! let c1 = fluids::find("Methane").unwrap();
//! assert_eq!(c1.id, "methane");
//! assert_eq!(fluids::find("C1").unwrap().id, "methane");
//! assert_eq!(fluids::find(" n butane ").unwrap().id, "n-butane");
//!
//! // Constants come in SI units with their source.
//! assert!((c1.tc_k - 190.56).abs() < 1e-9);
//! assert!((c1.pc_pa - 45.99e5).abs() < 1e-6);
//! assert!(c1.source.contains("Poling"));
//!
//! // A typo gets suggestions; an isomer formula names the candidates.
//! match fluids::find("methan") {
//!     Err(fluids::LookupError::Unknown { suggestions, .. }) => {
//!         assert_eq!(suggestions[0], "methane")
//!     }
//!     other => panic!("unexpected {other:?}"),
//! }
//! let err = fluids::find("C4H10").unwrap_err();
//! assert!(err.to_string().contains("isobutane"));
//!
//! // The model-ready component, with its ideal-gas heat capacity (cp0/R).
//! let comp = fluids::find("CO2").unwrap().to_component();
//! assert!((comp.molar_mass - 0.0440095).abs() < 1e-9);
//! let cp = comp.cp.cp_r(298.15) * eos::constants::R;
//! assert!((cp - 37.13).abs() < 0.05); // J/(mol K); NIST-JANAF gives 37.129
//!
//! // k_ij for Peng-Robinson, with the missing pairs listed rather than silently zero.
//! let k = fluids::kij_matrix(&["methane", "co2", "hydrogen"], fluids::KijFamily::PengRobinson);
//! assert!((k.values[1] - 0.0919).abs() < 1e-12);
//! assert_eq!(k.missing.len(), 2);
//! ```
//!
//! [`search()`] returns every component whose names contain a text (e.g. `"butane"`), and
//! [`all`] the whole table.
//!
//! ## Data and sources
//! The tables are CSV files in `data/`, compiled in and parsed once on first use;
//! [`data_status`] reports a fault instead of panicking. Every row names its source keys,
//! resolved by [`source()`] to full citations. The main source of the constants is Poling,
//! Prausnitz & O'Connell, *The Properties of Gases and Liquids*, 5th ed. (2001), App. A; water,
//! carbon dioxide, air and the refrigerants take their critical points from their reference
//! equations of state. Most values were recalled from memory of those sources and are marked
//! so, with a confidence mark (`high`, `medium`, `low`) and notes on the cross-checks made.
//!
//! Ideal-gas heat capacities, cp0/R = a0 + a1 T + a2 T^2 + a3 T^3 + a4 T^4 per segment:
//! - GRI-Mech 3.0 NASA 7-coefficient polynomials (two ranges joined at 1000 K) where the
//!   species is in that set;
//! - otherwise Poling et al. App. A single-range polynomials (typically 50 or 200 to 1000 K);
//! - exactly 5/2 for the monatomic gases;
//! - derived fits where neither is at hand: air as the mole-fraction average of N2, O2 and Ar;
//!   SO2 and SF6 from harmonic vibrational fundamentals; the refrigerants from the ideal-gas
//!   parts of their reference equations of state; n-decane, isopentane and neopentane by group
//!   additivity. Each record's `cp_notes` says which, and `cp_range_k` where it holds.
//!
//! ## Modules
//! One concept per file, each using only those above it in this list: [`error`] (typed
//! errors), [`name`] (the canonical form of a name), [`record`] (the record types),
//! [`kij_entry`] (a k_ij row and its family), [`gravity_gas`] (the hydrocarbon part of a gas
//! known by its gravity), [`data`] (loading), [`source`](mod@source)
//! (citations), [`suggest`] (suggestions), [`lookup`] (find a built-in component), [`user`]
//! (the user's components), [`query`] (find any component), [`search`](mod@search) (substring
//! search), [`kij`](mod@kij) (interaction parameters).

// User input must never panic: no unwrap or expect outside tests.
#![cfg_attr(not(test), deny(clippy::unwrap_used, clippy::expect_used))]

pub mod data;
pub mod error;
pub mod gravity_gas;
pub mod kij;
pub mod kij_entry;
pub mod lookup;
pub mod name;
pub mod query;
pub mod record;
pub mod search;
pub mod source;
pub mod suggest;
pub mod user;

pub use data::data_status;
pub use error::{DataError, LookupError};
pub use kij::{kij, kij_matrix, KijFamily, KijMatrix, KijOrigin, KijRecord, KijUse, UserKij};
pub use lookup::all;
pub use name::normalize;
pub use query::find;
pub use record::{ComponentRecord, Confidence, CpSegmentRecord, Source};
pub use search::search;
pub use source::{source, sources};
pub use suggest::suggestions;
