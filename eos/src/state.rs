//! A single-phase state from two intensive properties: (T, P), (T, rho) or (P, rho).
//!
//! For (T, P) the model may have up to three density roots; the caller chooses the one of
//! lowest Gibbs energy (the stable one when the state is one phase), or the liquid-like
//! (densest) or vapour-like (least dense) root. Whether a mixture splits into two phases is
//! decided by the stability test of the phase-equilibrium layer, not here.

use crate::composition;
use crate::constants::R;
use crate::error::{positive, Error, Result};
use crate::model::{DensityRoots, Model};
use crate::need::Need;
use crate::phase::Phase;
use crate::properties::{evaluate, evaluate_need, Properties};

/// Which density root of (T, P) to report.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum RootChoice {
    /// The root of lowest Gibbs energy: the stable one.
    #[default]
    LowestGibbs,
    /// The densest root.
    Liquid,
    /// The least dense root.
    Vapor,
}

/// A single-phase state with its phase name.
#[derive(Debug, Clone, PartialEq)]
pub struct State {
    /// Every property of the state.
    pub props: Properties,
    /// Phase name (from the pseudo-critical point and the position among the roots).
    pub phase: Phase,
    /// How many density roots the model has at this (T, P).
    pub roots: usize,
}

/// Residual Gibbs energy over RT at fixed T and P of a root; composition terms are the same
/// for every root and left out.
fn g_res_rt(model: &dyn Model, t: f64, rho: f64, x: &[f64]) -> f64 {
    let r = model.residual(t, rho, x);
    let z = r.z();
    r.a + z - 1.0 - z.ln()
}

/// Names the phase of a single-phase state at (T, P, rho).
pub(crate) fn phase_of(model: &dyn Model, t: f64, p: f64, rho: f64, x: &[f64]) -> (Phase, usize) {
    phase_among(model, t, p, rho, x, &refined_densities(model, t, p, x))
}

/// [`phase_of`] with the refined density roots at (T, P) already found.
fn phase_among(
    model: &dyn Model,
    t: f64,
    p: f64,
    rho: f64,
    x: &[f64],
    roots: &DensityRoots,
) -> (Phase, usize) {
    let n = roots.as_slice().len();
    let (tc, pc) = model.pseudo_critical(x);
    if t >= tc {
        let phase = if p >= pc {
            Phase::Supercritical
        } else {
            Phase::Gas
        };
        return (phase, n);
    }
    let r = roots.as_slice();
    let phase = if r.len() > 1 {
        let densest = r[r.len() - 1];
        if (rho - densest).abs() <= 1e-9 * densest {
            Phase::Liquid
        } else {
            Phase::Vapor
        }
    } else {
        let rho_c = pc / (model.critical_z() * R * tc);
        if rho > rho_c {
            Phase::Liquid
        } else {
            Phase::Vapor
        }
    };
    (phase, n)
}

impl State {
    /// The state at temperature `t` (K) and pressure `p` (Pa).
    pub fn at_tp(model: &dyn Model, t: f64, p: f64, x: &[f64], root: RootChoice) -> Result<Self> {
        Self::at_tp_need(model, t, p, x, root, Need::All)
    }

    /// [`State::at_tp`] computing what `need` asks for (the root and the phase are the same).
    pub fn at_tp_need(
        model: &dyn Model,
        t: f64,
        p: f64,
        x: &[f64],
        root: RootChoice,
        need: Need,
    ) -> Result<Self> {
        check_tp(model, t, p, x)?;
        let known = match root {
            RootChoice::LowestGibbs => known_stable(model, t, p, x),
            RootChoice::Vapor | RootChoice::Liquid => None,
        };
        Self::among_roots(model, t, p, x, root, known, need)
    }

    /// The stable state at (T, P): [`State::at_tp_need`] with [`RootChoice::LowestGibbs`],
    /// except that where the model knows the stable branch in advance
    /// ([`Model::stable_density`]) only that branch is searched, and `roots` then counts that
    /// one root. The root, and so every value and the phase, are those of `at_tp_need`.
    pub fn stable_at_tp_need(
        model: &dyn Model,
        t: f64,
        p: f64,
        x: &[f64],
        need: Need,
    ) -> Result<Self> {
        check_tp(model, t, p, x)?;
        match known_stable(model, t, p, x) {
            Some(rho) => Ok(Self::assemble(
                model,
                t,
                p,
                x,
                rho,
                &DensityRoots::from_slice(&[rho]),
                need,
            )),
            None => Self::among_roots(model, t, p, x, RootChoice::LowestGibbs, None, need),
        }
    }

    /// The state on the root `root` asks for among every refined root; `known` is the stable
    /// root where the model named it ([`known_stable`]), taken for [`RootChoice::LowestGibbs`]
    /// in place of the comparison of Gibbs energies: a multiparameter equation can have a
    /// root on a spurious loop inside the dome with a lower Gibbs energy (methane by Setzmann
    /// & Wagner at 93 K and 79 bar: 10 061 mol/m3 beside the liquid's 28 236), which no
    /// comparison of roots can tell from a phase.
    fn among_roots(
        model: &dyn Model,
        t: f64,
        p: f64,
        x: &[f64],
        root: RootChoice,
        known: Option<f64>,
        need: Need,
    ) -> Result<Self> {
        let roots = refined_densities(model, t, p, x);
        let r = roots.as_slice();
        if r.is_empty() {
            return Err(Error::NoSolution(format!(
                "{} has no density root at T = {t} K, P = {p} Pa",
                model.id()
            )));
        }
        let rho = match root {
            RootChoice::Vapor => r[0],
            RootChoice::Liquid => r[r.len() - 1],
            RootChoice::LowestGibbs => known.unwrap_or_else(|| {
                r.iter()
                    .copied()
                    .min_by(|a, b| g_res_rt(model, t, *a, x).total_cmp(&g_res_rt(model, t, *b, x)))
                    .unwrap_or(r[0])
            }),
        };
        Ok(Self::assemble(model, t, p, x, rho, &roots, need))
    }

    /// The state at root `rho` of (T, P), one of `roots`.
    fn assemble(
        model: &dyn Model,
        t: f64,
        p: f64,
        x: &[f64],
        rho: f64,
        roots: &DensityRoots,
        need: Need,
    ) -> Self {
        let props = evaluate_need(model, t, rho, x, need);
        let (phase, n) = phase_among(model, t, p, rho, x, roots);
        State {
            props,
            phase,
            roots: n,
        }
    }

    /// The state at temperature `t` (K) and molar density `rho` (mol/m3).
    pub fn at_trho(model: &dyn Model, t: f64, rho: f64, x: &[f64]) -> Result<Self> {
        positive("temperature (K)", t)?;
        positive("molar density (mol/m3)", rho)?;
        composition::check(x, model.components().len())?;
        check_density(model, rho, x)?;
        let props = evaluate(model, t, rho, x);
        if props.p.is_nan() || props.p <= 0.0 || !props.p.is_finite() {
            return Err(Error::NoSolution(format!(
                "{} gives a pressure of {:.6e} Pa at T = {t} K, rho = {rho} mol/m3: \
                 the state is inside the two-phase region and has no single-phase answer",
                model.id(),
                props.p
            )));
        }
        let (phase, n) = phase_of(model, t, props.p, rho, x);
        Ok(State {
            props,
            phase,
            roots: n,
        })
    }

    /// The state at pressure `p` (Pa) and molar density `rho` (mol/m3): the temperature is
    /// found by a bracketed Brent search on P(T, rho) = p.
    pub fn at_prho(model: &dyn Model, p: f64, rho: f64, x: &[f64]) -> Result<Self> {
        positive("pressure (Pa)", p)?;
        positive("molar density (mol/m3)", rho)?;
        composition::check(x, model.components().len())?;
        check_density(model, rho, x)?;
        let f = |t: f64| rho * R * t * model.residual(t, rho, x).z() / p - 1.0;
        let t_ideal = p / (rho * R);
        let (mut lo, mut hi) = (t_ideal, t_ideal);
        let mut k = 0;
        while f(hi).is_nan() || f(hi) <= 0.0 {
            hi *= 2.0;
            k += 1;
            if k > 60 {
                return Err(Error::NoSolution(format!(
                    "{} reaches no pressure of {p} Pa at rho = {rho} mol/m3 at any temperature",
                    model.id()
                )));
            }
        }
        k = 0;
        while f(lo).is_nan() || f(lo) >= 0.0 {
            lo *= 0.5;
            k += 1;
            if k > 60 || lo < 1e-6 {
                return Err(Error::NoSolution(format!(
                    "{} has no temperature with P = {p} Pa at rho = {rho} mol/m3",
                    model.id()
                )));
            }
        }
        let mut conv = RelTol {
            rel: 1e-14,
            max_iter: 200,
        };
        let t = roots::find_root_brent(lo, hi, f, &mut conv).map_err(|_| Error::NotConverged {
            solver: "temperature from (P, rho)",
            iterations: 200,
            residual: f(0.5 * (lo + hi)).abs(),
        })?;
        let mut s = Self::at_trho(model, t, rho, x)?;
        s.props.p = p;
        Ok(s)
    }
}

/// Refuses a temperature or pressure that is not positive, or a composition that does not
/// fit the model.
fn check_tp(model: &dyn Model, t: f64, p: f64, x: &[f64]) -> Result<()> {
    positive("temperature (K)", t)?;
    positive("pressure (Pa)", p)?;
    composition::check(x, model.components().len())
}

/// The stable root at (T, P) where the model names it ([`Model::stable_density`]), refined
/// as every root is.
fn known_stable(model: &dyn Model, t: f64, p: f64, x: &[f64]) -> Option<f64> {
    model
        .stable_density(t, p, x)
        .and_then(|rho| refine(model, t, p, x, rho))
}

/// The model's density roots at (T, P), each confirmed by Newton steps on P(rho) = p with the
/// model's own dP/drho. A closed-form cubic loses relative precision for a dense liquid at very
/// low pressure (Z of order 1e-9 or less, where P(rho) is extremely steep); the steps restore
/// it. A root whose slope is not positive, or whose pressure cannot be brought to p within
/// rounding, is dropped; roots that meet are kept once.
pub fn refined_densities(model: &dyn Model, t: f64, p: f64, x: &[f64]) -> DensityRoots {
    let raw = model.densities(t, p, x);
    let mut kept = [0.0; 3];
    let mut n = 0;
    for &rho in raw.as_slice() {
        if let Some(r) = refine(model, t, p, x, rho) {
            if kept[..n].iter().all(|k| (k - r).abs() > 1e-9 * r) {
                kept[n] = r;
                n += 1;
            }
        }
    }
    DensityRoots::from_slice(&kept[..n])
}

/// Newton on P(rho) = p from `rho0`; `None` when the root cannot be confirmed. A root that
/// already satisfies P(rho) = p to rounding is kept as it is (at a critical point dP/drho = 0
/// and Newton has no slope to work with).
fn refine(model: &dyn Model, t: f64, p: f64, x: &[f64], rho0: f64) -> Option<f64> {
    let rt = R * t;
    let confirmed = |rho: f64| {
        let r = model.residual(t, rho, x);
        let pc = rho * rt * r.z();
        // Rounding noise of P: the repulsive and attractive terms are each of order
        // rho R T |a_d|.
        let noise = 1e-12 * rho * rt * (1.0 + r.a_d.abs());
        pc > 0.0 && (pc - p).abs() <= 1e-9 * p + noise
    };
    if confirmed(rho0) {
        return Some(rho0);
    }
    let max = model.max_density(x);
    let mut rho = rho0;
    for _ in 0..20 {
        let r = model.residual(t, rho, x);
        let pc = rho * rt * r.z();
        let slope = rt * r.dp_drho_rt();
        if !(slope > 0.0 && pc.is_finite()) {
            return None;
        }
        let step = (pc - p) / slope;
        let next = rho - step;
        if !(next > 0.0 && next < max) {
            return None;
        }
        rho = next;
        if step.abs() <= 1e-13 * rho {
            break;
        }
    }
    confirmed(rho).then_some(rho)
}

fn check_density(model: &dyn Model, rho: f64, x: &[f64]) -> Result<()> {
    let max = model.max_density(x);
    if rho >= max {
        return Err(Error::OutOfRange {
            model: model.id().to_string(),
            what: "density",
            detail: format!(
                "{rho} mol/m3 is at or above the co-volume limit 1/b = {max:.6e} mol/m3"
            ),
        });
    }
    Ok(())
}

/// Brent convergence on a relative step in x and an absolute residual in y.
struct RelTol {
    rel: f64,
    max_iter: usize,
}

impl roots::Convergency<f64> for RelTol {
    fn is_root_found(&mut self, y: f64) -> bool {
        y.abs() < 1e-15
    }
    fn is_converged(&mut self, x1: f64, x2: f64) -> bool {
        (x1 - x2).abs() <= self.rel * x1.abs().max(x2.abs())
    }
    fn is_iteration_limit_reached(&mut self, iter: usize) -> bool {
        iter >= self.max_iter
    }
}
