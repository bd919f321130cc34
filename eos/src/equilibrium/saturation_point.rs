//! Bubble and dew points of a mixture at a given temperature or pressure.
//!
//! The point solves the system of [`super::sat_system`] with ln T (or ln P) specified, by
//! Newton's method. Starting values:
//! 1. Wilson's K-values (see [`super::wilson`]) at the Wilson estimate of the point, improved
//!    by up to eight substitutions ln K_i <- ln phi_i(x) - ln phi_i(y) with the pressure (or
//!    temperature) moved so that sum w = 1;
//! 2. if Newton's method fails or reaches the trivial solution (K = 1, which satisfies every
//!    equation but the specification's intent), a stability test of the feed
//!    ([`super::stability`]) at pressures (or temperatures) around the estimate; an unstable
//!    trial phase of the right kind (lighter than the feed for a bubble point, heavier for a
//!    dew point) gives K and the state to start from;
//! 3. if neither converges, [`super::envelope_start`] tries the phase envelope of the feed
//!    ([`super::envelope`], M. L. Michelsen, Fluid Phase Equilib. 4 (1980) 1-10): the
//!    unknowns interpolated between the two points of the wanted branch that bracket the
//!    given T or P (the first such pair in trace order: of two dew points at one pressure,
//!    the one on the rising dew curve).
//!
//! A solution of the equations is accepted only if a stability test of the feed there finds
//! no trial phase clearly below its tangent plane (tm < -1e-6): Newton's method can also
//! converge to a stationary point of the tangent-plane distance inside the two-phase region,
//! which satisfies the same equations.
//!
//! No solution from any start is reported as [`Error::NoSolution`]: at T above the
//! cricondentherm, at P above the cricondenbar, or for a feed that is too close to a pure
//! component (one component present: use [`super::saturation`]).

use super::phase_eval::{ln_phi_tp, MAX_COMPONENTS};
use super::sat_system::{is_trivial, Densities, Side, System, MAX_VARS};
use super::{saturation, stability, wilson};
use crate::error::{Error, Result};
use crate::model::Model;

/// A bubble or dew point.
#[derive(Debug, Clone, PartialEq)]
pub struct SaturationPoint {
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
    /// Bubble (feed is the liquid) or dew (feed is the vapour).
    pub side: Side,
    /// Liquid mole fractions (the feed at a bubble point).
    pub x: Vec<f64>,
    /// Vapour mole fractions (the feed at a dew point).
    pub y: Vec<f64>,
    /// Liquid molar density, mol/m3.
    pub rho_l: f64,
    /// Vapour molar density, mol/m3.
    pub rho_v: f64,
    /// Newton iterations.
    pub iterations: usize,
}

/// What is specified.
#[derive(Debug, Clone, Copy)]
pub(crate) enum Given {
    T(f64),
    P(f64),
}

fn build(sys: &System, x: &[f64], d: Densities, iterations: usize) -> SaturationPoint {
    let n = sys.z.len();
    let mut w = vec![0.0; n];
    sys.incipient(x, &mut w);
    let s: f64 = w.iter().sum();
    w.iter_mut().for_each(|v| *v /= s);
    let (t, p) = (x[n].exp(), x[n + 1].exp());
    match sys.side {
        Side::Bubble => SaturationPoint {
            t,
            p,
            side: Side::Bubble,
            x: sys.z.to_vec(),
            y: w,
            rho_l: d.feed,
            rho_v: d.incipient,
            iterations,
        },
        Side::Dew => SaturationPoint {
            t,
            p,
            side: Side::Dew,
            x: w,
            y: sys.z.to_vec(),
            rho_l: d.incipient,
            rho_v: d.feed,
            iterations,
        },
    }
}

/// Pure fluid (one-component model): the saturation state as a bubble or dew point.
fn pure(model: &dyn Model, side: Side, given: Given) -> Result<SaturationPoint> {
    let s = match given {
        Given::T(t) => saturation::pressure(model, t)?,
        Given::P(p) => saturation::temperature(model, p)?,
    };
    Ok(SaturationPoint {
        t: s.t,
        p: s.p,
        side,
        x: vec![1.0],
        y: vec![1.0],
        rho_l: s.rho_l(),
        rho_v: s.rho_v(),
        iterations: s.iterations,
    })
}

/// Solves from start `x` (ln K, ln T, ln P); checks the result is not trivial.
fn attempt(sys: &System, x: &mut [f64], spec: usize, value: f64) -> Result<SaturationPoint> {
    let (it, d) = sys.solve(x, spec, value)?;
    if is_trivial(sys.z, x) {
        return Err(Error::NoSolution(
            "the saturation point solve reached the trivial solution".into(),
        ));
    }
    // The incipient phase must be lighter (bubble) or heavier (dew) than the feed.
    let ok = match sys.side {
        Side::Bubble => d.incipient < d.feed,
        Side::Dew => d.incipient > d.feed,
    };
    if !ok {
        return Err(Error::NoSolution(
            "the point found has the incipient phase on the wrong side of the feed".into(),
        ));
    }
    // The equations also hold where the incipient phase is only a stationary point of the
    // tangent-plane distance inside the two-phase region; at a true saturation point the feed
    // is on the edge of stability, so no trial phase lies clearly below its tangent plane.
    let n = sys.z.len();
    let (t, p) = (x[n].exp(), x[n + 1].exp());
    let mut w = [0.0; MAX_COMPONENTS];
    if let Ok(st) = stability::analyse(sys.model, t, p, sys.z, &mut w[..n]) {
        if st.tm < SPURIOUS_TM {
            return Err(Error::NoSolution(format!(
                "the point found at T = {t} K, P = {p} Pa lies inside the two-phase region \
                 (tangent-plane distance {:.3e})",
                st.tm
            )));
        }
    }
    Ok(build(sys, x, d, it))
}

/// A stability test of the feed at a solution of the saturation equations that finds a trial
/// phase this far below the tangent plane shows the solution is not on the phase boundary
/// (at the boundary the lowest tm is zero; rounding and the test's own tolerance keep it
/// within about 1e-10).
const SPURIOUS_TM: f64 = -1e-6;

/// Substitution on K with the free variable moved so that sum w -> 1.
fn substitute(sys: &System, x: &mut [f64], spec_t: bool) -> Option<()> {
    let n = sys.z.len();
    let mut w = [0.0; MAX_COMPONENTS];
    let mut lf = [0.0; MAX_COMPONENTS];
    let mut lw = [0.0; MAX_COMPONENTS];
    for _ in 0..8 {
        let (t, p) = (x[n].exp(), x[n + 1].exp());
        sys.incipient(x, &mut w[..n]);
        let s: f64 = w[..n].iter().sum();
        if !(s.is_finite() && s > 0.0) {
            return None;
        }
        ln_phi_tp(sys.model, t, p, sys.z, sys.feed_root, &mut lf[..n])?;
        ln_phi_tp(sys.model, t, p, &w[..n], sys.incipient_root, &mut lw[..n])?;
        let sign = match sys.side {
            Side::Bubble => 1.0,
            Side::Dew => -1.0,
        };
        for i in 0..n {
            x[i] = -sign * (lw[i] - lf[i]);
        }
        // Bubble: sum z K = 1 at the right P (sum ~ 1/P): P <- P * sum. Dew: sum z/K ~ P:
        // P <- P / sum. At fixed P the temperature is moved by a damped ln step.
        let lns = s.ln();
        if spec_t {
            x[n + 1] += sign * lns;
        } else {
            x[n] -= sign * (0.1 * lns).clamp(-0.05, 0.05);
        }
        if is_trivial(sys.z, x) {
            return None;
        }
    }
    Some(())
}

/// A bubble or dew point from the direct starts (Wilson's K-values, then stability-based
/// starts): the envelope's own first point, and the first try of [`super::envelope_start`].
pub(crate) fn point_direct(
    model: &dyn Model,
    z: &[f64],
    side: Side,
    given: Given,
) -> Result<SaturationPoint> {
    direct(model, z, side, given).and_then(|d| match d {
        Direct::Found(r) => Ok(r),
        Direct::NotFound(u) => Err(u.error()),
    })
}

/// What the direct starts gave.
pub(crate) enum Direct<'a> {
    /// A converged, stable point.
    Found(SaturationPoint),
    /// No start converged: the system, for further starts, and what to report.
    NotFound(Unsolved<'a>),
}

/// A bubble or dew point that no direct start solved.
pub(crate) struct Unsolved<'a> {
    /// The equations.
    pub sys: System<'a>,
    /// The point's specification: T or P.
    pub given: Given,
    spec: usize,
    value: f64,
    first_err: Option<Error>,
}

impl<'a> Unsolved<'a> {
    /// The equations of a bubble or dew point, with no start tried yet.
    pub fn new(model: &'a dyn Model, z: &'a [f64], side: Side, given: Given) -> Unsolved<'a> {
        let n = z.len();
        let (spec, value) = match given {
            Given::T(t) => (n, t.ln()),
            Given::P(p) => (n + 1, p.ln()),
        };
        Unsolved {
            sys: System::new(model, z, side),
            given,
            spec,
            value,
            first_err: None,
        }
    }

    /// Newton's method from the unknowns `x` (ln K, ln T, ln P).
    pub fn attempt(&self, x: &mut [f64]) -> Option<SaturationPoint> {
        attempt(&self.sys, x, self.spec, self.value).ok()
    }

    /// The specified variable as the solver sees it: ln T or ln P.
    pub fn value(&self) -> f64 {
        self.value
    }

    /// The error that says no start converged.
    pub fn error(self) -> Error {
        let (side, given, model) = (self.sys.side, self.given, self.sys.model);
        let what = match (side, given) {
            (Side::Bubble, Given::T(t)) => format!("no bubble point at T = {t} K"),
            (Side::Dew, Given::T(t)) => format!("no dew point at T = {t} K"),
            (Side::Bubble, Given::P(p)) => format!("no bubble point at P = {p} Pa"),
            (Side::Dew, Given::P(p)) => format!("no dew point at P = {p} Pa"),
        };
        Error::NoSolution(format!(
            "{what} for this feed with {} (beyond the cricondentherm or cricondenbar, or no \
             start converged; first attempt: {})",
            model.id(),
            self.first_err
                .map(|e| e.to_string())
                .unwrap_or_else(|| "none".into())
        ))
    }
}

/// Bubble or dew point from the direct starts, or what is left to try.
pub(crate) fn direct<'a>(
    model: &'a dyn Model,
    z: &'a [f64],
    side: Side,
    given: Given,
) -> Result<Direct<'a>> {
    let (t0, p0) = match given {
        Given::T(t) => (t, 1e5),
        Given::P(p) => (300.0, p),
    };
    let n = stability::check(model, t0, p0, z)?;
    if n == 1 {
        return pure(model, side, given).map(Direct::Found);
    }
    if z.iter().filter(|&&v| v > 0.0).count() < 2 {
        return Err(Error::InvalidInput {
            what: "feed composition",
            value: format!("{z:?}"),
            accepted: "at least two components present for a bubble or dew point of a mixture \
                       (for one component use the pure-fluid saturation)"
                .into(),
        });
    }
    let comps = model.components();
    let sys = System::new(model, z, side);
    let m = n + 2;
    let (spec, value) = match given {
        Given::T(t) => (n, t.ln()),
        Given::P(p) => (n + 1, p.ln()),
    };
    // Wilson estimate of the free variable.
    let (t, p) = match (given, side) {
        (Given::T(t), Side::Bubble) => (t, wilson::bubble_pressure(comps, z, t)),
        (Given::T(t), Side::Dew) => (t, wilson::dew_pressure(comps, z, t)),
        (Given::P(p), Side::Bubble) => {
            (wilson::bubble_temperature(comps, z, p).unwrap_or(300.0), p)
        }
        (Given::P(p), Side::Dew) => (wilson::dew_temperature(comps, z, p).unwrap_or(300.0), p),
    };
    let mut x = [0.0; MAX_VARS];
    let mut first_err = None;
    if t.is_finite() && p.is_finite() && t > 0.0 && p > 0.0 {
        x[n] = t.ln();
        x[n + 1] = p.ln();
        for i in 0..n {
            x[i] = wilson::ln_k(&comps[i], t, p);
        }
        let spec_t = matches!(given, Given::T(_));
        let mut xs = x;
        let start = if substitute(&sys, &mut xs[..m], spec_t).is_some() {
            xs
        } else {
            x
        };
        let mut xx = start;
        match attempt(&sys, &mut xx[..m], spec, value) {
            Ok(r) => return Ok(Direct::Found(r)),
            Err(e) => first_err = Some(e),
        }
    }
    // Stability-based starts around the estimate.
    let mut w = [0.0; MAX_COMPONENTS];
    let (tb, pb) = (
        if t.is_finite() && t > 0.0 { t } else { 300.0 },
        if p.is_finite() && p > 0.0 { p } else { 1e6 },
    );
    for k in [0.0, -1.0, 1.0, -2.0, 2.0, -3.0, 3.0, -4.0, 4.0] {
        let (ts, ps) = match given {
            Given::T(t) => (t, pb * 2f64.powf(k)),
            Given::P(p) => (tb * 1.05f64.powf(k), p),
        };
        let Ok(st) = stability::analyse(model, ts, ps, z, &mut w[..n]) else {
            continue;
        };
        if st.stable {
            continue;
        }
        let lighter = st.trial_rho < st.feed_rho;
        let wanted = match side {
            Side::Bubble => lighter,
            Side::Dew => !lighter,
        };
        if !wanted {
            continue;
        }
        let s: f64 = w[..n].iter().sum();
        x[n] = ts.ln();
        x[n + 1] = ps.ln();
        for i in 0..n {
            x[i] = if z[i] > 0.0 && w[i] > 0.0 {
                let r = (w[i] / s / z[i]).ln();
                match side {
                    Side::Bubble => r,
                    Side::Dew => -r,
                }
            } else {
                wilson::ln_k(&comps[i], ts, ps)
            };
        }
        let mut xx = x;
        if let Ok(r) = attempt(&sys, &mut xx[..m], spec, value) {
            return Ok(Direct::Found(r));
        }
    }
    Ok(Direct::NotFound(Unsolved {
        sys,
        given,
        spec,
        value,
        first_err,
    }))
}
