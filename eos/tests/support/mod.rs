//! Shared test support.

pub mod yardstick;
