//! Phase envelopes of mixtures by continuation.
//!
//! Method of M. L. Michelsen, *Calculation of phase envelopes and critical points for
//! multicomponent mixtures*, Fluid Phase Equilib. 4 (1980) 1-10: the saturation-point
//! equations of [`super::sat_system`] in X = (ln K_1 .. ln K_n, ln T, ln P) with vapour
//! fraction 1 (the feed is one phase, an incipient phase in equilibrium with it) are traced
//! from a low-pressure dew point:
//!
//! 1. at a converged point, the sensitivities dX/dS solve J dX/dS = e_(n+2) (S the value of
//!    the specified variable);
//! 2. the next specified variable is the one with the largest |dX_i/dS| (the most sensitive;
//!    ln K much smaller than the largest one are not candidates),
//!    its step is at most `max_step` in the log variables, grown by 1.5 after a point that
//!    took at most 3 Newton iterations and shrunk by 0.6 after one that took 6 or more;
//! 3. the next point is predicted linearly, X + dS dX/dS, and corrected by Newton's method;
//!    a failed correction halves the step.
//!
//! Near the critical point the ln K become the most sensitive variables. When the step in
//! a specified ln K would bring it close to or across zero, the step is set to land at -ln K
//! (the mirror point on the other side), so the critical point is passed without landing on
//! the trivial solution. After the ln K change sign the incipient phase is the lighter one:
//! the feed is then a saturated liquid and the points are bubble points (the feed takes the
//! liquid root, the incipient phase the vapour root). The critical point is estimated by
//! linear interpolation of ln T and ln P in the ln K that changed sign.
//!
//! The trace ends when the bubble curve falls below the starting pressure, or at the point
//! limit. The cricondenbar and cricondentherm are located on a parabola through the
//! highest-pressure (highest-temperature) point and its neighbours and then solved for
//! exactly, with ln T (ln P) specified at the vertex.

use super::phase_eval::RootSel;
use super::sat_system::{is_trivial, Side, System, MAX_VARS};
use super::{saturation_point, stability, wilson};
use crate::error::{Error, Result};
use crate::model::Model;

/// Options of the trace.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct EnvelopeOptions {
    /// Pressure of the first dew point and the end of the bubble curve, Pa.
    pub p_start: f64,
    /// Most points traced.
    pub max_points: usize,
    /// Largest step in the specified log variable.
    pub max_step: f64,
}

impl Default for EnvelopeOptions {
    fn default() -> Self {
        EnvelopeOptions {
            p_start: 1e5,
            max_points: 2000,
            max_step: 0.15,
        }
    }
}

/// One point of the envelope.
#[derive(Debug, Clone, PartialEq)]
pub struct EnvelopePoint {
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
    /// Vapour fraction of the feed at the point: 1 on the dew side, 0 on the bubble side.
    pub vapor_fraction: f64,
    /// Mole fractions of the incipient phase.
    pub incipient: Vec<f64>,
    /// Molar density of the feed phase, mol/m3.
    pub rho_feed: f64,
    /// Molar density of the incipient phase, mol/m3.
    pub rho_incipient: f64,
}

/// A (T, P) pair.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TP {
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
}

/// Why the trace ended.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum EnvelopeStop {
    /// The bubble curve reached the starting pressure: the envelope is complete.
    Complete,
    /// The point limit was reached.
    MaxPoints,
    /// No step could be corrected, even after halving, at this point.
    StepFailed(TP),
    /// The branch left the physical range (above [`P_PHYSICAL_MAX`]) at this point: it
    /// describes no real fluid there (a methane-water envelope of a cubic climbs to 100 GPa).
    LeftPhysicalRange(TP),
}

/// The highest pressure a traced branch may reach, Pa: 1000 MPa, the top of the reference
/// formulations' ranges (IAPWS R6-95(2018); Setzmann & Wagner 1991); beyond it no model here
/// describes a fluid, and an envelope that climbs there follows an artefact of its model.
pub const P_PHYSICAL_MAX: f64 = 1e9;

/// A traced phase envelope.
#[derive(Debug, Clone, PartialEq)]
pub struct Envelope {
    /// Points in tracing order: dew curve from the starting pressure, then bubble curve.
    pub points: Vec<EnvelopePoint>,
    /// Critical point (where the ln K change sign), when passed.
    pub critical: Option<TP>,
    /// Highest pressure on the envelope.
    pub cricondenbar: TP,
    /// Highest temperature on the envelope.
    pub cricondentherm: TP,
    /// Why the trace ended.
    pub stop: EnvelopeStop,
    /// Newton iterations over all points.
    pub iterations: usize,
}

fn roots(sys: &mut System, bubble_side: bool) {
    if bubble_side {
        sys.feed_root = RootSel::Liquid;
        sys.incipient_root = RootSel::Vapor;
    } else {
        sys.feed_root = RootSel::Vapor;
        sys.incipient_root = RootSel::Liquid;
    }
}

fn make_point(sys: &System, x: &[f64], bubble_side: bool, rf: f64, ri: f64) -> EnvelopePoint {
    let n = sys.z.len();
    let mut w = vec![0.0; n];
    sys.incipient(x, &mut w);
    let s: f64 = w.iter().sum();
    w.iter_mut().for_each(|v| *v /= s);
    EnvelopePoint {
        t: x[n].exp(),
        p: x[n + 1].exp(),
        vapor_fraction: if bubble_side { 0.0 } else { 1.0 },
        incipient: w,
        rho_feed: rf,
        rho_incipient: ri,
    }
}

/// Vertex abscissa of the parabola through three points (a, fa), (b, fb), (c, fc).
fn vertex(a: f64, fa: f64, b: f64, fb: f64, c: f64, fc: f64) -> Option<f64> {
    let num = (b - a).powi(2) * (fb - fc) - (b - c).powi(2) * (fb - fa);
    let den = (b - a) * (fb - fc) - (b - c) * (fb - fa);
    let v = b - 0.5 * num / den;
    (v.is_finite() && v >= a.min(c) && v <= a.max(c)).then_some(v)
}

/// Traces the phase envelope of feed `z`.
pub fn trace(model: &dyn Model, z: &[f64], options: EnvelopeOptions) -> Result<Envelope> {
    let n = stability::check(model, 300.0, options.p_start, z)?;
    if z.iter().filter(|&&v| v > 0.0).count() < 2 {
        return Err(Error::InvalidInput {
            what: "feed composition",
            value: format!("{z:?}"),
            accepted: "at least two components present (a pure fluid has a vapour-pressure \
                       curve, not an envelope)"
                .into(),
        });
    }
    if options.max_points < 3 || !(options.max_step > 0.0 && options.max_step.is_finite()) {
        return Err(Error::invalid(
            "envelope options",
            options.max_step,
            "max_points >= 3 and a finite positive max_step",
        ));
    }
    let m = n + 2;
    let first = saturation_point::point_direct(
        model,
        z,
        Side::Dew,
        saturation_point::Given::P(options.p_start),
    )?;
    let mut x = [0.0; MAX_VARS];
    for i in 0..n {
        x[i] = if z[i] > 0.0 && first.x[i] > 0.0 {
            (z[i] / first.x[i]).ln()
        } else {
            wilson::ln_k(&model.components()[i], first.t, first.p)
        };
    }
    x[n] = first.t.ln();
    x[n + 1] = first.p.ln();
    let mut sys = System::new(model, z, Side::Dew);
    let (mut iterations, d) = sys.solve(&mut x[..m], n + 1, options.p_start.ln())?;
    let mut points = vec![make_point(&sys, &x[..m], false, d.feed, d.incipient)];
    let mut xs: Vec<[f64; MAX_VARS]> = vec![x];
    let mut bubble_side = false;
    let mut critical = None;
    let mut spec = n + 1;
    let mut ds = 0.05_f64;
    let mut dx = [0.0; MAX_VARS];
    let stop;
    loop {
        if points.len() >= options.max_points {
            stop = EnvelopeStop::MaxPoints;
            break;
        }
        let here = TP {
            t: x[n].exp(),
            p: x[n + 1].exp(),
        };
        if !sys.sensitivity(&x[..m], spec, &mut dx[..m]) {
            stop = EnvelopeStop::StepFailed(here);
            break;
        }
        // Candidates: ln T, ln P and the ln K that are not small beside the largest (a
        // component whose K stays near 1 everywhere, as a trace solvent's does, must not be
        // taken for one approaching the critical point).
        let kmax = (0..n)
            .filter(|&i| z[i] > 0.0)
            .fold(0.0_f64, |a, i| a.max(x[i].abs()));
        let k = (0..m)
            .filter(|&i| i >= n || (z[i] > 0.0 && x[i].abs() >= 0.1 * kmax))
            .max_by(|&a, &b| dx[a].abs().total_cmp(&dx[b].abs()))
            .unwrap_or(spec);
        if k != spec && dx[k] != 0.0 {
            ds *= dx[k];
            let s = dx[k];
            dx[..m].iter_mut().for_each(|v| *v /= s);
            spec = k;
        }
        ds = ds.clamp(-options.max_step, options.max_step);
        if spec < n {
            let s0 = x[spec];
            let s1 = s0 + ds;
            if s0 * s1 <= 0.0 || s1.abs() < 0.5 * ds.abs() {
                ds = -2.0 * s0;
            }
        }
        let mut done = None;
        for _ in 0..12 {
            let mut xn = x;
            for i in 0..m {
                xn[i] = x[i] + ds * dx[i];
            }
            let target = x[spec] + ds;
            if let Ok((it, d)) = sys.solve(&mut xn[..m], spec, target) {
                if !is_trivial(z, &xn[..m]) {
                    done = Some((xn, it, d));
                    break;
                }
            }
            ds *= 0.5;
        }
        // A step that had to shrink to nothing is a stall, not progress.
        let Some((mut xn, it, mut d)) = done.filter(|_| ds.abs() > 1e-8) else {
            stop = EnvelopeStop::StepFailed(here);
            break;
        };
        iterations += it;
        // Sign change of the ln K: the critical point was passed.
        let c = (0..n)
            .filter(|&i| z[i] > 0.0)
            .max_by(|&a, &b| x[a].abs().total_cmp(&x[b].abs()))
            .unwrap_or(0);
        if x[c] * xn[c] < 0.0 {
            let th = x[c] / (x[c] - xn[c]);
            critical = Some(TP {
                t: (x[n] + th * (xn[n] - x[n])).exp(),
                p: (x[n + 1] + th * (xn[n + 1] - x[n + 1])).exp(),
            });
            bubble_side = !bubble_side;
            roots(&mut sys, bubble_side);
            let mut xr = xn;
            if let Ok((it2, d2)) = sys.solve(&mut xr[..m], spec, xn[spec]) {
                if !is_trivial(z, &xr[..m]) {
                    xn = xr;
                    d = d2;
                    iterations += it2;
                }
            }
        }
        if it <= 3 {
            ds *= 1.5;
        } else if it >= 6 {
            ds *= 0.6;
        }
        x = xn;
        points.push(make_point(&sys, &x[..m], bubble_side, d.feed, d.incipient));
        xs.push(x);
        let p = x[n + 1].exp();
        if p < options.p_start && (bubble_side || p < 0.5 * options.p_start) {
            stop = EnvelopeStop::Complete;
            break;
        }
        if !(x[n].exp() > 1.0 && x[n].exp() < 1e5) {
            stop = EnvelopeStop::StepFailed(here);
            break;
        }
        if p > P_PHYSICAL_MAX {
            stop = EnvelopeStop::LeftPhysicalRange(TP { t: x[n].exp(), p });
            break;
        }
    }
    // Extremes, refined on a parabola and solved for exactly.
    let extreme = |var: usize, by: usize, sys: &mut System| -> (TP, usize) {
        let i = (0..points.len())
            .max_by(|&a, &b| xs[a][var].total_cmp(&xs[b][var]))
            .unwrap_or(0);
        let best = TP {
            t: points[i].t,
            p: points[i].p,
        };
        if i == 0 || i + 1 >= points.len() {
            return (best, 0);
        }
        let (a, b, c) = (&xs[i - 1], &xs[i], &xs[i + 1]);
        let Some(v) = vertex(a[by], a[var], b[by], b[var], c[by], c[var]) else {
            return (best, 0);
        };
        roots(sys, points[i].vapor_fraction < 0.5);
        let mut xr = xs[i];
        match sys.solve(&mut xr[..m], by, v) {
            Ok((it, _)) if !is_trivial(z, &xr[..m]) && xr[var] >= b[var] => (
                TP {
                    t: xr[n].exp(),
                    p: xr[n + 1].exp(),
                },
                it,
            ),
            _ => (best, 0),
        }
    };
    let (cricondenbar, i1) = extreme(n + 1, n, &mut sys);
    let (cricondentherm, i2) = extreme(n, n + 1, &mut sys);
    Ok(Envelope {
        points,
        critical,
        cricondenbar,
        cricondentherm,
        stop,
        iterations: iterations + i1 + i2,
    })
}
