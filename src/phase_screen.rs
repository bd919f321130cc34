//! Which states of a large grid get the phase check (a flash, which starts with the stability
//! test).
//!
//! A mixture state is one phase only after the stability test says so. On a grid of at least
//! [`SCREEN_MIN_STATES`] states, with a model that has a Helmholtz energy, the feed's phase
//! envelope is traced once and states clearly outside it (beyond 5 % in pressure and 3 K,
//! see [`eos::equilibrium::screen`]) are taken as one phase without the test; every other
//! state, and every state of a smaller grid, is tested. Where the envelope cannot be traced
//! to its end, every state is tested.

use crate::models::BuiltModel;
use eos::equilibrium::{EnvelopeScreen, TestRegion};
use std::collections::HashMap;

/// Grids of at least this many states use the envelope screen.
pub const SCREEN_MIN_STATES: usize = 2_500;

/// Grids with more distinct temperatures than this test every state (the screen is made
/// per isotherm).
const MAX_ISOTHERMS: usize = 20_000;

/// The states of one grid that need the phase check, for one model.
#[derive(Debug, Clone, Default)]
pub struct PhaseScreen {
    /// The test region of each temperature of the grid (by its bits); `None`: test all.
    regions: Option<HashMap<u64, TestRegion>>,
}

impl PhaseScreen {
    /// The screen of `model` for feed `x` over states at `temperatures` (K, repeats
    /// allowed) with `states` states in all, the lowest pressure `p_low` (Pa).
    pub fn new(
        model: &BuiltModel,
        x: &[f64],
        temperatures: &[f64],
        states: usize,
        p_low: f64,
    ) -> Self {
        let mixture = x.iter().filter(|&&v| v > 0.0).count() >= 2;
        if states < SCREEN_MIN_STATES || !mixture || model.id == "ideal" {
            return Self::default();
        }
        let Some(m) = model.helmholtz() else {
            return Self::default();
        };
        let mut ts = temperatures.to_vec();
        ts.sort_by(f64::total_cmp);
        ts.dedup_by(|a, b| a.to_bits() == b.to_bits());
        if ts.len() > MAX_ISOTHERMS {
            return Self::default();
        }
        let Some(screen) = EnvelopeScreen::trace(m, x, p_low) else {
            return Self::default();
        };
        Self {
            regions: Some(
                ts.iter()
                    .map(|&t| (t.to_bits(), screen.region(t)))
                    .collect(),
            ),
        }
    }

    /// True when the state (T, P) needs the phase check.
    pub fn needs_test(&self, t: f64, p: f64) -> bool {
        match &self.regions {
            None => true,
            Some(r) => r
                .get(&t.to_bits())
                .map_or(true, |region| region.contains(p)),
        }
    }

    /// True when the envelope screen is in use.
    pub fn is_active(&self) -> bool {
        self.regions.is_some()
    }
}

/// The sentence that says how the states were phase-checked, for a report's basis.
pub fn method_note(screened: bool) -> &'static str {
    if screened {
        "a mixture state is flashed (stability test first) where it lies inside or near the \
         feed's traced phase envelope; states clearly outside it (beyond 5 % in pressure and \
         3 K) are one phase without the test"
    } else {
        "every mixture state is flashed (stability test first)"
    }
}
