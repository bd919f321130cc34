//! One fluid and model at many (T, P) states: each state of a mixture flashed where the
//! phase screen says so (a split has no single-phase values), the model's stable root
//! computed for what is asked, and a flag where the state lies outside the model's range or
//! in the solid region. The table command and the array front end (Python) both use it.

use crate::feed::Feed;
use crate::models::BuiltModel;
use crate::phase_screen::PhaseScreen;
use crate::range::StateCheck;
use eos::need::Need;
use eos::properties::Properties;
use rayon::prelude::*;

/// What one state gave.
#[derive(Debug, Clone)]
pub struct StateOutcome {
    /// The single-phase properties; `None` where the mixture splits or the model failed.
    pub props: Option<Properties>,
    /// The phase name: "vapor", "liquid", "supercritical", "gas", or "two-phase".
    pub phase: Option<&'static str>,
    /// "outside range", "solid", "solid may form" (joined by "; "); `None` inside.
    pub flag: Option<String>,
    /// Why the state has no values.
    pub error: Option<String>,
}

/// What the states of one model and feed need, prepared once for a set of states.
pub struct StatePlan {
    /// Range and solid checks.
    pub check: StateCheck,
    /// Which states of a mixture are flashed.
    pub screen: PhaseScreen,
    /// What is computed.
    pub need: Need,
}

impl StatePlan {
    /// The plan for states at `temperatures` (K, repeats allowed) and pressures down to
    /// `p_low` (Pa), `states` in all.
    pub fn new(
        built: &BuiltModel,
        feed: &Feed,
        temperatures: &[f64],
        states: usize,
        p_low: f64,
        need: Need,
    ) -> Self {
        let screen = if feed.is_pure() {
            PhaseScreen::default()
        } else {
            PhaseScreen::new(built, &feed.mole, temperatures, states, p_low)
        };
        StatePlan {
            check: StateCheck::new(built, feed),
            screen,
            need,
        }
    }

    /// One state.
    pub fn at(&self, built: &BuiltModel, feed: &Feed, t: f64, p: f64) -> StateOutcome {
        let split = self
            .screen
            .needs_test(t, p)
            .then(|| split_fraction(built, feed, t, p))
            .flatten();
        if let Some(beta) = split {
            return StateOutcome {
                props: None,
                phase: Some("two-phase"),
                flag: None,
                error: Some(format!(
                    "model {}: the mixture splits into vapour ({beta:.4} mol/mol) and liquid \
                     here; single-phase values would be meaningless (see `zfactor state` for the \
                     phases)",
                    built.id
                )),
            };
        }
        match built.stable_at_tp_need(t, p, &feed.mole, self.need) {
            Ok(s) => StateOutcome {
                flag: if s.warnings.is_empty() {
                    self.check.flag(t, p, s.props.rho)
                } else {
                    Some("outside range".to_string())
                },
                phase: Some(s.phase.as_str()),
                props: Some(s.props),
                error: None,
            },
            Err(e) => StateOutcome {
                props: None,
                phase: None,
                flag: None,
                error: Some(format!("model {}: {e}", built.id)),
            },
        }
    }

    /// Every state (T[i], P[i]) on all cores, in order.
    pub fn all(&self, built: &BuiltModel, feed: &Feed, t: &[f64], p: &[f64]) -> Vec<StateOutcome> {
        t.par_iter()
            .zip(p.par_iter())
            .map(|(&t, &p)| self.at(built, feed, t, p))
            .collect()
    }
}

/// The vapour fraction when a mixture splits at (T, P) with this model (flash with models
/// that have a Helmholtz energy); `None` for one phase, a pure fluid or a failed flash (the
/// single-phase evaluation then reports what it finds).
fn split_fraction(built: &BuiltModel, feed: &Feed, t: f64, p: f64) -> Option<f64> {
    let m = built
        .helmholtz()
        .filter(|_| !feed.is_pure() && built.id != "ideal")?;
    match eos::equilibrium::flash::tp(m, t, p, &feed.mole) {
        Ok(eos::equilibrium::flash::FlashResult::TwoPhase(s)) => Some(s.vapor_fraction),
        _ => None,
    }
}
