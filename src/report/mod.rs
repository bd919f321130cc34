//! Report structs: plain data, SI units, serialisable. Renderers in [`crate::render`] turn
//! them into tables, CSV or JSON; nothing here formats numbers for display.

pub mod compare;
pub mod envelope;
pub mod flash;
pub mod fluids;
pub mod state;
pub mod table;
