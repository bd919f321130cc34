//! Evaluating every model (and a reference model) at a list of (T, P) states.
//!
//! Each state is computed with `eos::state::State::at_tp` and the lowest-Gibbs-energy root,
//! independently of every other state, so the points are spread over the cores with rayon and
//! collected in their original order: the results are identical to a single-threaded run.
//! A model that cannot compute a state gives an error for that state only.

use super::data_file::RefValue;
use super::region::{self, Region};
use super::stats::density_dev_pct;
use crate::models::BuiltModel;
use crate::phase_screen::PhaseScreen;
use eos::phase::Phase;
use eos::state::RootChoice;
use rayon::prelude::*;

/// One state to evaluate.
#[derive(Debug, Clone, PartialEq)]
pub struct PointInput {
    /// Temperature, K.
    pub t: f64,
    /// Absolute pressure, Pa.
    pub p: f64,
    /// Reference value from data, when the reference is data.
    pub data: Option<RefValue>,
    /// True when the data call the state two-phase.
    pub two_phase: bool,
}

/// One model's answer at one state.
#[derive(Debug, Clone, PartialEq)]
pub enum Answer {
    /// Z, molar density (mol/m3) and phase name.
    Ok { z: f64, rho: f64, phase: Phase },
    /// Why the model has no answer.
    Failed(String),
}

impl Answer {
    /// Molar density when computed.
    pub fn rho(&self) -> Option<f64> {
        match self {
            Answer::Ok { rho, .. } => Some(*rho),
            Answer::Failed(_) => None,
        }
    }

    /// Z when computed.
    pub fn z(&self) -> Option<f64> {
        match self {
            Answer::Ok { z, .. } => Some(*z),
            Answer::Failed(_) => None,
        }
    }
}

/// Every answer at one state, with the reference and the region.
#[derive(Debug, Clone, PartialEq)]
pub struct PointResult {
    /// The answer of each model, in the order given.
    pub answers: Vec<Answer>,
    /// Reference molar density, mol/m3, when there is a reference and it has an answer.
    pub ref_rho: Option<f64>,
    /// Why the reference has no answer here (a reference model that failed).
    pub ref_error: Option<String>,
    /// The region of the state.
    pub region: Region,
    /// Density deviation of each model from the reference, percent (None without one).
    pub dev_pct: Vec<Option<f64>>,
}

/// What a comparison is made against.
pub enum Against<'a> {
    /// A model, evaluated at every state.
    Model(&'a BuiltModel),
    /// The data of each point.
    Data,
    /// Nothing: only the spread between models is reported.
    Nothing,
}

/// The answer of `model` at (t, p).
/// A mixture is flashed first (with models that have a Helmholtz energy) where `screen`
/// says the state needs the phase check: a feed that splits is answered as two-phase, with
/// its bulk density.
pub fn answer(model: &BuiltModel, t: f64, p: f64, x: &[f64], screen: &PhaseScreen) -> Answer {
    if let Some(m) = model
        .helmholtz()
        .filter(|_| x.len() > 1 && model.id != "ideal" && screen.needs_test(t, p))
    {
        match eos::equilibrium::flash::tp(m, t, p, x) {
            Ok(eos::equilibrium::flash::FlashResult::TwoPhase(s)) => {
                let b = s.vapor_fraction;
                let rho = 1.0 / (b / s.rho_v + (1.0 - b) / s.rho_l);
                return Answer::Ok {
                    z: p / (rho * eos::constants::R * t),
                    rho,
                    phase: Phase::TwoPhase,
                };
            }
            Ok(_) => {}
            Err(e) => return Answer::Failed(format!("model {}: {e}", model.id)),
        }
    }
    match model.at_tp(t, p, x, RootChoice::LowestGibbs) {
        Ok(s) if s.props.z.is_finite() && s.props.rho.is_finite() && s.props.z > 0.0 => {
            Answer::Ok {
                z: s.props.z,
                rho: s.props.rho,
                phase: s.phase,
            }
        }
        Ok(s) => Answer::Failed(format!(
            "model {} gave a non-finite Z ({}) at this state",
            model.id, s.props.z
        )),
        Err(e) => Answer::Failed(format!("model {}: {e}", model.id)),
    }
}

/// The phase screens of one grid: one per compared model, the reference model's and the
/// naming model's. Made once per grid ([`Screens::new`]) and shared by every chunk of it.
pub struct Screens {
    models: Vec<PhaseScreen>,
    reference: PhaseScreen,
    namer: PhaseScreen,
}

impl Screens {
    /// The screens for states at `temperatures` (K, repeats allowed), `states` states in all,
    /// the lowest pressure `p_low` (Pa).
    pub fn new(
        models: &[&BuiltModel],
        against: &Against<'_>,
        namer: &BuiltModel,
        x: &[f64],
        temperatures: &[f64],
        states: usize,
        p_low: f64,
    ) -> Self {
        let screen = |m: &BuiltModel| PhaseScreen::new(m, x, temperatures, states, p_low);
        Self {
            models: models.iter().map(|m| screen(m)).collect(),
            reference: match against {
                Against::Model(m) => screen(m),
                _ => PhaseScreen::default(),
            },
            // The naming model is asked only where it is not among the compared ones.
            namer: if models.iter().any(|m| m.id == namer.id) {
                PhaseScreen::default()
            } else {
                screen(namer)
            },
        }
    }

    /// True when an envelope screen spares states of the phase check.
    pub fn is_active(&self) -> bool {
        self.models.iter().any(PhaseScreen::is_active)
    }
}

/// Evaluates one state.
fn evaluate_one(
    models: &[&BuiltModel],
    against: &Against<'_>,
    namer: &BuiltModel,
    x: &[f64],
    pt: &PointInput,
    screens: &Screens,
) -> PointResult {
    let answers: Vec<Answer> = models
        .iter()
        .zip(&screens.models)
        .map(|(m, s)| answer(m, pt.t, pt.p, x, s))
        .collect();
    let (ref_answer, ref_rho, ref_error) = match against {
        Against::Model(m) => {
            let a = answer(m, pt.t, pt.p, x, &screens.reference);
            let rho = a.rho();
            let err = match &a {
                Answer::Failed(e) => Some(e.clone()),
                Answer::Ok { .. } => None,
            };
            (Some(a), rho, err)
        }
        Against::Data => {
            let rho = pt.data.map(|v| match v {
                RefValue::Z(z) => pt.p / (z * eos::constants::R * pt.t),
                RefValue::MolarDensity(r) => r,
            });
            (None, rho, None)
        }
        Against::Nothing => (None, None, None),
    };
    // The phase is named by the reference model, or by the naming model (whose answer is
    // already there when it is one of the compared models).
    let phase_of = |a: &Answer| match a {
        Answer::Ok { phase, .. } => Some(*phase),
        Answer::Failed(_) => None,
    };
    let named = match &ref_answer {
        Some(Answer::Ok { phase, .. }) => Some(*phase),
        _ => match models.iter().position(|m| m.id == namer.id) {
            Some(k) => phase_of(&answers[k]),
            None => phase_of(&answer(namer, pt.t, pt.p, x, &screens.namer)),
        },
    };
    let mut phases: Vec<Phase> = models
        .iter()
        .zip(&answers)
        .filter(|(m, _)| m.id != "ideal")
        .filter_map(|(_, a)| match a {
            Answer::Ok { phase, .. } => Some(*phase),
            Answer::Failed(_) => None,
        })
        .collect();
    if let Some(Answer::Ok { phase, .. }) = &ref_answer {
        phases.push(*phase);
    }
    let (tc, pc) = namer.pseudo_critical(x);
    let region = if pt.two_phase {
        Region::TwoPhase
    } else {
        region::classify(pt.t, pt.p, tc, pc, named.unwrap_or(Phase::Gas), &phases)
    };
    let dev_pct = answers
        .iter()
        .map(|a| match (a.rho(), ref_rho) {
            (Some(r), Some(rr)) => Some(density_dev_pct(r, rr)).filter(|d| d.is_finite()),
            _ => None,
        })
        .collect();
    PointResult {
        answers,
        ref_rho,
        ref_error,
        region,
        dev_pct,
    }
}

/// Evaluates every state on all cores; `tick` is called once per finished state (for a
/// progress bar) and must be cheap and thread-safe. The results are in the order of
/// `points` and identical to a single-threaded evaluation. The flag is true when an
/// envelope screen spared states of the phase check ([`PhaseScreen`]).
pub fn evaluate<F>(
    models: &[&BuiltModel],
    against: &Against<'_>,
    namer: &BuiltModel,
    x: &[f64],
    points: &[PointInput],
    tick: F,
) -> (Vec<PointResult>, bool)
where
    F: Fn() + Sync,
{
    let ts: Vec<f64> = points.iter().map(|pt| pt.t).collect();
    let p_low = points.iter().map(|pt| pt.p).fold(f64::INFINITY, f64::min);
    let screens = Screens::new(models, against, namer, x, &ts, points.len(), p_low);
    let results = evaluate_screened(models, against, namer, x, points, &screens, tick);
    (results, screens.is_active())
}

/// [`evaluate`] with screens made beforehand (for a grid evaluated in chunks).
pub fn evaluate_screened<F>(
    models: &[&BuiltModel],
    against: &Against<'_>,
    namer: &BuiltModel,
    x: &[f64],
    points: &[PointInput],
    screens: &Screens,
    tick: F,
) -> Vec<PointResult>
where
    F: Fn() + Sync,
{
    points
        .par_iter()
        .map(|pt| {
            let r = evaluate_one(models, against, namer, x, pt, screens);
            tick();
            r
        })
        .collect()
}

/// Spread of the real-gas models' densities at one state, percent of their mean:
/// 100 (max - min)/mean over the models with an answer (the ideal gas left out); `None` with
/// fewer than two answers.
pub fn spread_pct(models: &[&BuiltModel], answers: &[Answer]) -> Option<f64> {
    let rhos: Vec<f64> = models
        .iter()
        .zip(answers)
        .filter(|(m, _)| m.id != "ideal")
        .filter_map(|(_, a)| a.rho())
        .collect();
    if rhos.len() < 2 {
        return None;
    }
    let max = rhos.iter().copied().fold(f64::MIN, f64::max);
    let min = rhos.iter().copied().fold(f64::MAX, f64::min);
    let mean = rhos.iter().sum::<f64>() / rhos.len() as f64;
    let s = 100.0 * (max - min) / mean;
    s.is_finite().then_some(s)
}
