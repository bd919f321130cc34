//! Report structs: plain data, SI units, serialisable. Renderers in [`crate::render`] turn
//! them into tables, CSV or JSON; nothing here formats numbers for display.

pub mod audit;
pub mod compare;
pub mod compare_points;
pub mod compress;
pub mod envelope;
pub mod flash;
pub mod flow;
pub mod fluids;
pub mod jobs_common;
pub mod kij;
pub mod models;
pub mod process;
pub mod relief;
pub mod saturation;
pub mod state;
pub mod table;
pub mod vessel;
