//! One compression stage of a gas: discharge state, heads, specific work and exponents.
//!
//! With suction state 1 (P1, T1), discharge pressure P2 and molar mass M (all per kg below):
//!
//! - isentropic discharge 2s: s(2s) = s1 at P2; isentropic head H_s = h2s - h1;
//! - with an isentropic efficiency eta_s: h2 = h1 + H_s / eta_s; specific work w = h2 - h1;
//! - with a polytropic efficiency eta_p: the polytropic path dh = v dP / eta_p, integrated
//!   from P1 to P2 in ln P by the classical fourth-order Runge-Kutta method in many small
//!   steps of constant polytropic efficiency (dh/d ln P = P v(P, h) / eta_p, v from the
//!   single-phase state at (P, h)); the polytropic head is H_p = integral of v dP along the
//!   path = eta_p (h2 - h1);
//! - the Schultz method (J. M. Schultz, "The polytropic analysis of centrifugal
//!   compressors", J. Eng. Power 84 (1962) 69-82): with the volume exponents
//!   n = ln(P2/P1) / ln(v1/v2) of the actual path and n_s = ln(P2/P1) / ln(v1/v2s) of the
//!   isentropic one, the correction factor
//!
//!   ```text
//!   f = (h2s - h1) / [ n_s/(n_s - 1) (P2 v2s - P1 v1) ]
//!   H_p = f n/(n - 1) (P2 v2 - P1 v1)
//!   ```
//!
//!   Given eta_p, the Schultz discharge state solves h2 - h1 = H_p(T2) / eta_p at P2; given
//!   eta_s, its polytropic efficiency is H_p / (h2 - h1).
//!
//! Exponents reported: the ideal-gas cp0/cv0 = cp0/(cp0 - R), the real-gas isentropic volume
//! exponent k_v = -(v/P)(dP/dv)_s and the isentropic temperature exponent k_T from
//! (k_T - 1)/k_T = (P/T)(dT/dP)_s = P (dv/dT)_P / cp (the definitions of e.g. R. Kurz and
//! K. Brun, or of the gas-dynamics literature; for an ideal gas both equal cp/cv).
//! For a constant-cp ideal gas the stage gives T2s = T1 (P2/P1)^((k-1)/k) and the polytropic
//! path T2 = T1 (P2/P1)^((k-1)/(k eta_p)).

use crate::constants::R;
use crate::error::{positive, Error, Result};
use crate::jobs::equilibrium_state::{at_tp, single_phase_t, EnergySpec, EqState};
use crate::model::Model;
use crate::phase::Phase;
use crate::state::State;

/// The efficiency given for the stage.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Efficiency {
    /// Isentropic efficiency, 0 < eta <= 1.
    Isentropic(f64),
    /// Polytropic efficiency, 0 < eta <= 1.
    Polytropic(f64),
}

/// Exponents of the gas at one state.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Exponents {
    /// Ideal-gas cp0/cv0.
    pub ideal_k: f64,
    /// Real-gas isentropic volume exponent -(v/P)(dP/dv)_s.
    pub volume_k: f64,
    /// Real-gas isentropic temperature exponent.
    pub temperature_k: f64,
}

/// The Schultz (1962) analysis of the stage.
#[derive(Debug, Clone, PartialEq)]
pub struct Schultz {
    /// Correction factor f.
    pub f: f64,
    /// Isentropic volume exponent n_s.
    pub n_s: f64,
    /// Polytropic volume exponent n of the discharge found.
    pub n: f64,
    /// Polytropic head, J/kg.
    pub head: f64,
    /// Discharge state by the method.
    pub discharge: EqState,
    /// Polytropic efficiency H_p / (h2 - h1).
    pub efficiency: f64,
}

/// A computed stage. Heads and works per kg of gas.
#[derive(Debug, Clone, PartialEq)]
pub struct Stage {
    /// Suction state.
    pub suction: EqState,
    /// Discharge state (the path-integrated one when a polytropic efficiency is given).
    pub discharge: EqState,
    /// Isentropic discharge state (P2, s1).
    pub isentropic_discharge: EqState,
    /// Isentropic head h2s - h1, J/kg.
    pub isentropic_head: f64,
    /// Specific work h2 - h1, J/kg.
    pub specific_work: f64,
    /// Isentropic efficiency (given or derived).
    pub isentropic_efficiency: f64,
    /// Polytropic efficiency of the path-integrated method (given or derived).
    pub polytropic_efficiency: f64,
    /// Polytropic head of the path-integrated method, J/kg.
    pub polytropic_head_path: f64,
    /// The integral of v dP along the path by Simpson's rule over the path points, J/kg: an
    /// independent check of the head.
    pub polytropic_head_quadrature: f64,
    /// The Schultz analysis.
    pub schultz: Schultz,
    /// (H_p,Schultz - H_p,path) / H_p,path.
    pub head_difference: f64,
    /// Exponents at suction.
    pub exponents_suction: Exponents,
    /// Exponents at discharge.
    pub exponents_discharge: Exponents,
    /// Runge-Kutta steps of the path.
    pub path_steps: usize,
}

/// Runge-Kutta steps in ln P of the polytropic path.
pub const PATH_STEPS: usize = 40;

fn exponents(model: &dyn Model, s: &State, x: &[f64]) -> Result<Exponents> {
    let p = &s.props;
    let cp0 = model.ideal_gas(p.t, x).cp_r * R;
    let (Some(cp), Some(kv)) = (p.cp, p.isentropic_exponent) else {
        return Err(Error::NoSolution(format!(
            "{} gives a mechanically unstable state at T = {} K, P = {} Pa",
            model.id(),
            p.t,
            p.p
        )));
    };
    let m_t = p.p * p.dp_dt / (cp * p.rho * p.rho * p.dp_drho);
    Ok(Exponents {
        ideal_k: cp0 / (cp0 - R),
        volume_k: kv,
        temperature_k: 1.0 / (1.0 - m_t),
    })
}

fn gas(model: &dyn Model, t: f64, p: f64, x: &[f64]) -> Result<State> {
    State::at_tp(model, t, p, x, crate::state::RootChoice::LowestGibbs)
}

fn state_ph(model: &dyn Model, p: f64, h: f64, x: &[f64], guess: f64) -> Result<State> {
    single_phase_t(
        model,
        p,
        h,
        x,
        EnergySpec::Enthalpy,
        Some((guess, f64::NAN)),
    )
}

fn state_ps(model: &dyn Model, p: f64, s: f64, x: &[f64], guess: f64) -> Result<State> {
    single_phase_t(model, p, s, x, EnergySpec::Entropy, Some((guess, f64::NAN)))
}

/// The polytropic path from `s1` to `p2` with efficiency `eta`: the end state and the path
/// points (ln P, P v) for the quadrature.
fn polytropic_path(
    model: &dyn Model,
    s1: &State,
    p2: f64,
    eta: f64,
    steps: usize,
    x: &[f64],
) -> Result<(State, Vec<(f64, f64)>)> {
    let dl = (p2 / s1.props.p).ln() / steps as f64;
    let mut h = s1.props.h;
    let mut t = s1.props.t;
    let mut lnp = s1.props.p.ln();
    let mut pts = Vec::with_capacity(steps + 1);
    pts.push((lnp, s1.props.p / s1.props.rho));
    // dh/d ln P = P v / eta, with v from the state at (P, h).
    let rate = |lnp: f64, h: f64, guess: f64| -> Result<(f64, f64)> {
        let p = lnp.exp();
        let st = state_ph(model, p, h, x, guess)?;
        Ok((p / st.props.rho / eta, st.props.t))
    };
    let mut end = s1.clone();
    for _ in 0..steps {
        let (k1, t1) = rate(lnp, h, t)?;
        let (k2, t2) = rate(lnp + 0.5 * dl, h + 0.5 * dl * k1, t1)?;
        let (k3, _) = rate(lnp + 0.5 * dl, h + 0.5 * dl * k2, t2)?;
        let (k4, _) = rate(lnp + dl, h + dl * k3, t2)?;
        h += dl / 6.0 * (k1 + 2.0 * k2 + 2.0 * k3 + k4);
        lnp += dl;
        end = state_ph(model, lnp.exp(), h, x, t2)?;
        t = end.props.t;
        pts.push((lnp, end.props.p / end.props.rho));
    }
    Ok((end, pts))
}

/// Simpson's rule over points at equal spacing in ln P (odd count, an even number of
/// steps), of P v d ln P = v dP.
fn simpson(pts: &[(f64, f64)]) -> f64 {
    let n = pts.len();
    if n < 3 {
        return 0.0;
    }
    let h = (pts[n - 1].0 - pts[0].0) / (n - 1) as f64;
    let mut sum = pts[0].1 + pts[n - 1].1;
    for (i, p) in pts.iter().enumerate().take(n - 1).skip(1) {
        sum += if i % 2 == 1 { 4.0 * p.1 } else { 2.0 * p.1 };
    }
    sum * h / 3.0
}

fn as_eq(s: State) -> EqState {
    EqState {
        t: s.props.t,
        p: s.props.p,
        rho: s.props.rho,
        z: s.props.z,
        h: s.props.h,
        s: s.props.s,
        u: s.props.u,
        molar_mass: s.props.molar_mass,
        phase: s.phase,
        split: None,
        props: Some(s.props),
    }
}

/// Computes a stage from suction (p1, t1) to discharge pressure `p2`.
pub fn stage(
    model: &dyn Model,
    p1: f64,
    t1: f64,
    p2: f64,
    x: &[f64],
    eff: Efficiency,
) -> Result<Stage> {
    positive("suction pressure (Pa)", p1)?;
    positive("suction temperature (K)", t1)?;
    positive("discharge pressure (Pa)", p2)?;
    if p2 <= p1 {
        return Err(Error::InvalidInput {
            what: "discharge pressure (Pa)",
            value: format!("{p2}"),
            accepted: format!("a pressure above the suction pressure of {p1} Pa"),
        });
    }
    let eta = match eff {
        Efficiency::Isentropic(e) | Efficiency::Polytropic(e) => e,
    };
    if !(eta > 0.0 && eta <= 1.0) {
        return Err(Error::invalid(
            "compressor efficiency",
            eta,
            "a number above 0 and at most 1",
        ));
    }
    // The suction must be one phase: a compressor takes gas.
    let eq1 = at_tp(model, t1, p1, x)?;
    if eq1.phase == Phase::TwoPhase || eq1.phase == Phase::Liquid {
        return Err(Error::OutOfRange {
            model: model.id().to_string(),
            what: "suction state",
            detail: format!(
                "the feed is {} at {t1} K, {p1} Pa; a compressor stage takes gas",
                eq1.phase
            ),
        });
    }
    let s1 = gas(model, t1, p1, x)?;
    let m = s1.props.molar_mass;
    let (h1, v1) = (s1.props.h, 1.0 / s1.props.rho);
    let k0 = exponents(model, &s1, x)?;
    let guess = t1 * (p2 / p1).powf((k0.ideal_k - 1.0) / k0.ideal_k);
    let s2s = state_ps(model, p2, s1.props.s, x, guess)?;
    let (h2s, v2s) = (s2s.props.h, 1.0 / s2s.props.rho);
    let dh_s = h2s - h1;
    let ln_r = (p2 / p1).ln();
    let n_s = ln_r / (v1 / v2s).ln();
    let f = dh_s / (n_s / (n_s - 1.0) * (p2 * v2s - p1 * v1));
    let schultz_head = |s2: &State| {
        let v2 = 1.0 / s2.props.rho;
        let n = ln_r / (v1 / v2).ln();
        (f * n / (n - 1.0) * (p2 * v2 - p1 * v1), n)
    };

    let (discharge, eta_s, eta_p, path_end, pts) = match eff {
        Efficiency::Isentropic(e) => {
            let h2 = h1 + dh_s / e;
            let s2 = state_ph(model, p2, h2, x, s2s.props.t)?;
            // The polytropic efficiency whose path ends at h2: h_end(eta_p) decreases with
            // eta_p, from above h2 at eta_p = eta_s (the reheat of a polytropic path) to
            // h2s < h2 at eta_p = 1.
            let (eta_p, end, pts) = if e >= 1.0 {
                let (end, pts) = polytropic_path(model, &s1, p2, 1.0, PATH_STEPS, x)?;
                (1.0, end, pts)
            } else {
                let mut err = None;
                let mut g = |ep: f64| match polytropic_path(model, &s1, p2, ep, PATH_STEPS, x) {
                    Ok((end, _)) => (end.props.h - h2) / (h2 - h1),
                    Err(er) => {
                        err.get_or_insert(er);
                        f64::NAN
                    }
                };
                let root = crate::equilibrium::brent::solve(
                    "polytropic efficiency of the path through the discharge state",
                    e,
                    1.0,
                    1e-12,
                    1e-13,
                    &mut g,
                );
                if let Some(er) = err {
                    return Err(er);
                }
                let ep = root?;
                let (end, pts) = polytropic_path(model, &s1, p2, ep, PATH_STEPS, x)?;
                (ep, end, pts)
            };
            (s2, e, eta_p, end, pts)
        }
        Efficiency::Polytropic(e) => {
            let (end, pts) = polytropic_path(model, &s1, p2, e, PATH_STEPS, x)?;
            let eta_s = dh_s / (end.props.h - h1);
            (end.clone(), eta_s, e, end, pts)
        }
    };
    let h_path = eta_p * (path_end.props.h - h1);
    let quad = simpson(&pts);

    // Schultz: discharge from the given efficiency.
    let (sch_state, sch_eff) = match eff {
        Efficiency::Isentropic(_) => {
            let (hp, _) = schultz_head(&discharge);
            (discharge.clone(), hp / (discharge.props.h - h1))
        }
        Efficiency::Polytropic(e) => {
            let mut err = None;
            let mut g = |t2: f64| match gas(model, t2, p2, x) {
                Ok(s2) => {
                    let (hp, _) = schultz_head(&s2);
                    (s2.props.h - h1 - hp / e) / (R * t1)
                }
                Err(er) => {
                    err.get_or_insert(er);
                    f64::NAN
                }
            };
            let lo = s2s.props.t;
            let mut hi = path_end.props.t.max(lo) * 1.05;
            let mut k = 0;
            while g(hi) < 0.0 && k < 60 {
                hi *= 1.2;
                k += 1;
            }
            let t2 = crate::equilibrium::brent::solve(
                "Schultz discharge temperature",
                lo,
                hi,
                1e-13,
                0.0,
                &mut g,
            );
            if let Some(er) = err {
                return Err(er);
            }
            (gas(model, t2?, p2, x)?, e)
        }
    };
    let (sch_head, n) = schultz_head(&sch_state);
    let k2 = exponents(model, &discharge, x)?;
    let isentropic_discharge = as_eq(s2s);
    let dis_eq = at_tp(model, discharge.props.t, p2, x)?;
    let result = Stage {
        suction: eq1,
        discharge: dis_eq,
        isentropic_discharge,
        isentropic_head: dh_s / m,
        specific_work: (discharge.props.h - h1) / m,
        isentropic_efficiency: eta_s,
        polytropic_efficiency: eta_p,
        polytropic_head_path: h_path / m,
        polytropic_head_quadrature: quad / m,
        head_difference: (sch_head - h_path) / h_path,
        schultz: Schultz {
            f,
            n_s,
            n,
            head: sch_head / m,
            discharge: as_eq(sch_state),
            efficiency: sch_eff,
        },
        exponents_suction: k0,
        exponents_discharge: k2,
        path_steps: PATH_STEPS,
    };
    let nums = [
        result.isentropic_head,
        result.specific_work,
        result.polytropic_head_path,
        result.schultz.head,
        result.discharge.t,
    ];
    if nums.iter().all(|v| v.is_finite()) {
        Ok(result)
    } else {
        Err(Error::NoSolution(format!(
            "{} gives a non-finite head or discharge temperature for this stage",
            model.id()
        )))
    }
}
