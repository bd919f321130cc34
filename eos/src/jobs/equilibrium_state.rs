//! The equilibrium state of a feed, one phase or two, from (T, P), (T, rho), (P, h) or (P, s).
//!
//! A pure fluid below its critical temperature is two-phase when its overall molar volume lies
//! between the saturated volumes (at T) or its enthalpy or entropy between the saturated values
//! (at P); the state then follows from the lever rule on the saturated phases
//! ([`crate::equilibrium::saturation`], [`crate::equilibrium::quality`]):
//!
//! ```text
//! m = (1 - q) m_L + q m_V,  m in {v, u, h, s},  q = (v - v_L) / (v_V - v_L)
//! ```
//!
//! A mixture goes through the flashes of [`crate::equilibrium::flash`]: (T, P) directly,
//! (P, h) and (P, s) by their own solvers, and (T, v) by a bracketed Brent search on ln P of
//! v(T, P) = (1 - beta) / rho_L + beta / rho_V, which decreases strictly with P at fixed T in
//! every stable equilibrium state (positive isothermal compressibility of a stable system,
//! e.g. H. B. Callen, *Thermodynamics*, 2nd ed., Wiley 1985, section 8.2).
//!
//! [`single_phase_t`] finds the temperature of one phase at P with a given h or s by Newton's
//! method (dh/dT = cp, ds/dT = cp/T at fixed P) kept inside a bracket, for the many-step
//! paths of the compressor and venting calculations where a flash per step would be costly.

use crate::constants::R;
use crate::equilibrium::{flash, quality, saturation, FlashResult};
use crate::error::{positive, Error, Result};
use crate::model::Model;
use crate::phase::Phase;
use crate::properties::{evaluate, Properties};
use crate::state::{RootChoice, State};

/// Liquid and vapour of a two-phase state.
#[derive(Debug, Clone, PartialEq)]
pub struct PhaseSplit {
    /// Molar vapour fraction, 0 to 1.
    pub vapor_fraction: f64,
    /// Vapour mass fraction, 0 to 1.
    pub vapor_mass_fraction: f64,
    /// Liquid mole fractions.
    pub x: Vec<f64>,
    /// Vapour mole fractions.
    pub y: Vec<f64>,
    /// Liquid molar density, mol/m3.
    pub rho_l: f64,
    /// Vapour molar density, mol/m3.
    pub rho_v: f64,
}

/// An equilibrium state. Molar quantities are per mole of the whole feed.
#[derive(Debug, Clone, PartialEq)]
pub struct EqState {
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
    /// Overall molar density, mol/m3.
    pub rho: f64,
    /// Overall compressibility factor P / (rho R T).
    pub z: f64,
    /// Enthalpy, J/mol.
    pub h: f64,
    /// Entropy, J/(mol K).
    pub s: f64,
    /// Internal energy, J/mol.
    pub u: f64,
    /// Molar mass of the feed, kg/mol.
    pub molar_mass: f64,
    /// Phase name (two-phase when split).
    pub phase: Phase,
    /// The split, for a two-phase state.
    pub split: Option<PhaseSplit>,
    /// Every property of a single-phase state (None when two-phase).
    pub props: Option<Properties>,
}

impl EqState {
    /// Mass density, kg/m3.
    pub fn mass_density(&self) -> f64 {
        self.rho * self.molar_mass
    }

    fn single(props: Properties, phase: Phase) -> Self {
        EqState {
            t: props.t,
            p: props.p,
            rho: props.rho,
            z: props.z,
            h: props.h,
            s: props.s,
            u: props.u,
            molar_mass: props.molar_mass,
            phase,
            split: None,
            props: Some(props),
        }
    }
}

fn from_state(s: State) -> EqState {
    EqState::single(s.props, s.phase)
}

/// A two-phase state of a pure fluid at saturation `sat` with molar quality `q`.
fn pure_two_phase(sat: &saturation::Saturation, q: f64) -> Result<EqState> {
    let tp = quality::at_quality(sat, q)?;
    let m = sat.liquid.molar_mass;
    Ok(EqState {
        t: tp.t,
        p: tp.p,
        rho: tp.rho(),
        z: tp.p * tp.v / (R * tp.t),
        h: tp.h,
        s: tp.s,
        u: tp.u,
        molar_mass: m,
        phase: Phase::TwoPhase,
        split: Some(PhaseSplit {
            vapor_fraction: q,
            vapor_mass_fraction: q,
            x: vec![1.0],
            y: vec![1.0],
            rho_l: sat.rho_l(),
            rho_v: sat.rho_v(),
        }),
        props: None,
    })
}

/// The state of a (T, P) flash result of feed `z`.
pub fn from_flash(model: &dyn Model, f: &FlashResult, z: &[f64]) -> EqState {
    match f {
        FlashResult::SinglePhase(s) => EqState::single(evaluate(model, s.t, s.rho, z), s.phase),
        FlashResult::TwoPhase(s) => {
            let l = evaluate(model, s.t, s.rho_l, &s.x);
            let v = evaluate(model, s.t, s.rho_v, &s.y);
            let b = s.vapor_fraction;
            let lever = |a: f64, c: f64| (1.0 - b) * a + b * c;
            let vol = lever(1.0 / s.rho_l, 1.0 / s.rho_v);
            let h = lever(l.h, v.h);
            let mass_v = b * v.molar_mass;
            let mass = (1.0 - b) * l.molar_mass + mass_v;
            EqState {
                t: s.t,
                p: s.p,
                rho: 1.0 / vol,
                z: s.p * vol / (R * s.t),
                h,
                s: lever(l.s, v.s),
                u: h - s.p * vol,
                molar_mass: mass,
                phase: Phase::TwoPhase,
                split: Some(PhaseSplit {
                    vapor_fraction: b,
                    vapor_mass_fraction: mass_v / mass,
                    x: s.x.clone(),
                    y: s.y.clone(),
                    rho_l: s.rho_l,
                    rho_v: s.rho_v,
                }),
                props: None,
            }
        }
    }
}

fn is_pure(model: &dyn Model) -> bool {
    model.components().len() == 1
}

/// Saturation of a pure fluid at T, or None where the model has none (T at or above its
/// critical temperature, or a model without a two-phase region such as the ideal gas).
fn saturation_at_t(model: &dyn Model, t: f64) -> Result<Option<saturation::Saturation>> {
    match saturation::pressure(model, t) {
        Ok(s) => Ok(Some(s)),
        Err(Error::OutOfRange { .. } | Error::NoSolution(_) | Error::InvalidInput { .. }) => {
            Ok(None)
        }
        Err(e) => Err(e),
    }
}

/// Saturation of a pure fluid at P, or None where the model has none.
fn saturation_at_p(model: &dyn Model, p: f64) -> Result<Option<saturation::Saturation>> {
    match saturation::temperature(model, p) {
        Ok(s) => Ok(Some(s)),
        Err(Error::OutOfRange { .. } | Error::NoSolution(_) | Error::InvalidInput { .. }) => {
            Ok(None)
        }
        Err(e) => Err(e),
    }
}

/// The equilibrium state at temperature `t` (K) and pressure `p` (Pa).
pub fn at_tp(model: &dyn Model, t: f64, p: f64, x: &[f64]) -> Result<EqState> {
    positive("temperature (K)", t)?;
    positive("pressure (Pa)", p)?;
    if is_pure(model) {
        return State::at_tp(model, t, p, x, RootChoice::LowestGibbs).map(from_state);
    }
    let f = flash::tp(model, t, p, x)?;
    Ok(from_flash(model, &f, x))
}

/// The equilibrium state at temperature `t` (K) and overall molar density `rho` (mol/m3).
pub fn at_trho(model: &dyn Model, t: f64, rho: f64, x: &[f64]) -> Result<EqState> {
    positive("temperature (K)", t)?;
    positive("molar density (mol/m3)", rho)?;
    if is_pure(model) {
        if let Some(sat) = saturation_at_t(model, t)? {
            let (rl, rv) = (sat.rho_l(), sat.rho_v());
            if rho > rv && rho < rl {
                let q = (1.0 / rho - 1.0 / rl) / (1.0 / rv - 1.0 / rl);
                return pure_two_phase(&sat, q);
            }
        }
        return State::at_trho(model, t, rho, x).map(from_state);
    }
    // A single-phase answer that the flash confirms is the answer.
    let first = State::at_trho(model, t, rho, x).ok();
    if let Some(s) = &first {
        let f = flash::tp(model, t, s.props.p, x)?;
        if let FlashResult::SinglePhase(sp) = &f {
            if (sp.rho - rho).abs() <= 1e-9 * rho {
                return Ok(from_state(s.clone()));
            }
        }
    }
    // Otherwise search ln P for the overall volume.
    let target = 1.0 / rho;
    let mut last_err: Option<Error> = None;
    let mut g = |lnp: f64| -> f64 {
        match at_tp(model, t, lnp.exp(), x) {
            Ok(s) => (1.0 / s.rho / target).ln(),
            Err(e) => {
                last_err.get_or_insert(e);
                f64::NAN
            }
        }
    };
    let p0 = first
        .as_ref()
        .map(|s| s.props.p)
        .filter(|p| *p > 0.0)
        .unwrap_or(rho * R * t);
    let (mut lo, mut hi) = (p0.ln(), p0.ln());
    let mut glo = g(lo);
    let mut ghi = glo;
    let mut k = 0;
    // v decreases with P: g > 0 below the answer, g < 0 above it.
    while glo.is_nan() || glo <= 0.0 {
        lo -= std::f64::consts::LN_2;
        glo = g(lo);
        k += 1;
        if k > 80 || glo.is_nan() {
            return Err(last_err.unwrap_or_else(|| no_tv(model, t, rho)));
        }
    }
    k = 0;
    while ghi.is_nan() || ghi >= 0.0 {
        hi += std::f64::consts::LN_2;
        ghi = g(hi);
        k += 1;
        if k > 80 || ghi.is_nan() {
            return Err(last_err.unwrap_or_else(|| no_tv(model, t, rho)));
        }
    }
    let lnp = crate::equilibrium::brent::solve(
        "pressure of a (T, v) state",
        lo,
        hi,
        1e-15,
        1e-14,
        &mut g,
    )?;
    let s = at_tp(model, t, lnp.exp(), x)?;
    // The result's density is the one asked for (to the search's tolerance).
    if ((1.0 / s.rho) / target - 1.0).abs() > 1e-8 {
        return Err(no_tv(model, t, rho));
    }
    Ok(s)
}

fn no_tv(model: &dyn Model, t: f64, rho: f64) -> Error {
    Error::NoSolution(format!(
        "{} has no equilibrium state at T = {t} K with an overall density of {rho} mol/m3",
        model.id()
    ))
}

/// Which energy property is specified with P.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum EnergySpec {
    /// Molar enthalpy, J/mol.
    Enthalpy,
    /// Molar entropy, J/(mol K).
    Entropy,
}

/// The equilibrium state at pressure `p` (Pa) and molar enthalpy `h` (J/mol).
pub fn at_ph(model: &dyn Model, p: f64, h: f64, x: &[f64]) -> Result<EqState> {
    at_p_energy(model, p, h, x, EnergySpec::Enthalpy)
}

/// The equilibrium state at pressure `p` (Pa) and molar entropy `s` (J/(mol K)).
pub fn at_ps(model: &dyn Model, p: f64, s: f64, x: &[f64]) -> Result<EqState> {
    at_p_energy(model, p, s, x, EnergySpec::Entropy)
}

fn at_p_energy(
    model: &dyn Model,
    p: f64,
    target: f64,
    x: &[f64],
    spec: EnergySpec,
) -> Result<EqState> {
    positive("pressure (Pa)", p)?;
    if !target.is_finite() {
        return Err(Error::invalid(
            "enthalpy or entropy",
            target,
            "a finite number",
        ));
    }
    if !is_pure(model) {
        let f = match spec {
            EnergySpec::Enthalpy => flash::ph(model, p, target, x)?,
            EnergySpec::Entropy => flash::ps(model, p, target, x)?,
        };
        return Ok(from_flash(model, &f.flash, x));
    }
    let pick = |pr: &Properties| match spec {
        EnergySpec::Enthalpy => pr.h,
        EnergySpec::Entropy => pr.s,
    };
    let mut guess = None;
    if let Some(sat) = saturation_at_p(model, p)? {
        let (lo, hi) = (pick(&sat.liquid), pick(&sat.vapor));
        if target >= lo && target <= hi {
            let q = ((target - lo) / (hi - lo)).clamp(0.0, 1.0);
            return pure_two_phase(&sat, q);
        }
        guess = Some(if target > hi {
            (sat.t * 1.01, sat.t)
        } else {
            (sat.t * 0.99, sat.t)
        });
    }
    let st = single_phase_t(model, p, target, x, spec, guess)?;
    Ok(from_state(st))
}

/// The single-phase state (root of lowest Gibbs energy) at pressure `p` whose enthalpy or
/// entropy is `target`. `start` is (first guess, a bound the answer lies beyond: the
/// saturation temperature when known). Newton's method with dh/dT = cp or ds/dT = cp/T, kept
/// inside a bracket once one is found; at most 200 steps.
pub fn single_phase_t(
    model: &dyn Model,
    p: f64,
    target: f64,
    x: &[f64],
    spec: EnergySpec,
    start: Option<(f64, f64)>,
) -> Result<State> {
    let value = |s: &State| match spec {
        EnergySpec::Enthalpy => s.props.h,
        EnergySpec::Entropy => s.props.s,
    };
    let slope = |s: &State| {
        s.props.cp.map(|cp| match spec {
            EnergySpec::Enthalpy => cp,
            EnergySpec::Entropy => cp / s.props.t,
        })
    };
    let eval = |t: f64| State::at_tp(model, t, p, x, RootChoice::LowestGibbs);
    let (mut t, bound) = match start {
        Some((g, b)) => (g, Some(b)),
        None => {
            let (tc, _) = model.pseudo_critical(x);
            (if tc > 0.0 { tc.max(300.0) } else { 300.0 }, None)
        }
    };
    // Bracket: f(lo) < 0 < f(hi) (h and s increase with T at fixed P).
    let (mut lo, mut hi) = (f64::NAN, f64::NAN);
    if let Some(b) = bound {
        if t > b {
            lo = b;
        } else {
            hi = b;
        }
    }
    let mut last = f64::NAN;
    for _ in 0..200 {
        let s = eval(t)?;
        let f = value(&s) - target;
        last = f;
        if f < 0.0 {
            lo = if lo.is_nan() { t } else { lo.max(t) };
        } else {
            hi = if hi.is_nan() { t } else { hi.min(t) };
        }
        let scale = match spec {
            EnergySpec::Enthalpy => R * t,
            EnergySpec::Entropy => R,
        };
        if f.abs() <= 1e-14 * scale.max(target.abs()) {
            return Ok(s);
        }
        let newton = slope(&s).filter(|d| *d > 0.0).map(|d| t - f / d);
        let mut next = match newton {
            Some(n) if n.is_finite() => n.clamp(0.5 * t, 2.0 * t),
            _ => {
                if f < 0.0 {
                    t * 1.5
                } else {
                    t / 1.5
                }
            }
        };
        if lo.is_finite() && hi.is_finite() && !(next > lo && next < hi) {
            next = 0.5 * (lo + hi);
        } else if lo.is_finite() && next <= lo {
            next = 0.5 * (lo + t.max(lo) * 1.5);
        } else if hi.is_finite() && next >= hi {
            next = 0.5 * (hi + t.min(hi) / 1.5);
        }
        if (next - t).abs() <= 1e-14 * t {
            // No further change of T is representable: converged if the residual is at
            // rounding level of the property, otherwise the target is in a jump of h(T) or
            // s(T) (a phase change of the root of lowest Gibbs energy).
            let tol = 1e-9 * scale.max(target.abs());
            if f.abs() <= tol {
                return Ok(s);
            }
            break;
        }
        if next < 1.0 {
            return Err(Error::NoSolution(format!(
                "{} reaches the specified {} at P = {p} Pa at no temperature above 1 K",
                model.id(),
                spec_name(spec)
            )));
        }
        t = next;
    }
    Err(Error::NotConverged {
        solver: "temperature at (P, h) or (P, s) in one phase",
        iterations: 200,
        residual: last.abs(),
    })
}

fn spec_name(s: EnergySpec) -> &'static str {
    match s {
        EnergySpec::Enthalpy => "enthalpy",
        EnergySpec::Entropy => "entropy",
    }
}
