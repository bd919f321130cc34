//! Vapour-liquid saturation of a pure fluid from its formulation.
//!
//! At T the two densities satisfy equal pressure and equal Gibbs energy:
//!
//! ```text
//! F1 = delta'(1 + delta' phir_d(delta')) - delta''(1 + delta'' phir_d(delta''))   = 0   (p/(rhoc R T))
//! F2 = [ln delta' + phir(delta') + delta' phir_d(delta')] - [same at delta'']      = 0   (g/(R T))
//! ```
//!
//! solved by Newton's method in (ln delta', ln delta''), with K = 1 + 2 delta phir_d +
//! delta^2 phir_dd and dg/d(delta) = K/delta (the scheme of Akasaka (2008), J. Therm. Sci.
//! Tech. 3:442):
//!
//! ```text
//! d ln delta'  = (delta'' F2 - F1) / ((delta' - delta'') K')
//! d ln delta'' = (delta'  F2 - F1) / ((delta' - delta'') K'')
//! ```
//!
//! Starting values come from the paper's ancillary equations (or density solves at the
//! ancillary vapour pressure). If Newton fails (near the critical point), the fallback is the
//! Maxwell construction as a bisection in pressure between the spinodal pressures, with both
//! density roots solved at each trial pressure and the sign of g'' - g' deciding the side. The
//! pressure is taken from the vapour side, where p = rho R T Z does not cancel.
//!
//! The saturation temperature at p is found by Newton's method on T with the Clapeyron slope
//! dp/dT = (h'' - h') / (T (v'' - v')), inside a bracket kept from the signs.

use super::density::{p_dp, solve_branch, solve_branch_split, Branch};
use super::formulation::Formulation;
use crate::error::{Error, Result};

/// How a saturation state was found.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum SaturationMethod {
    /// Newton on the two densities.
    Newton,
    /// Bisection in pressure on g'' - g' (near-critical fallback).
    PressureBisection,
}

/// A saturation state.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Saturation {
    /// Temperature, K.
    pub t: f64,
    /// Vapour pressure, Pa.
    pub p: f64,
    /// Saturated-liquid molar density, mol/m3.
    pub rho_liq: f64,
    /// Saturated-vapour molar density, mol/m3.
    pub rho_vap: f64,
    /// Iterations used (of the last inner solve for saturation at p).
    pub iterations: usize,
    /// The method that converged.
    pub method: SaturationMethod,
}

/// Newton iterations allowed for the two densities.
pub const MAX_NEWTON: usize = 60;
/// Iterations allowed for the outer temperature solve of saturation at p.
pub const MAX_OUTER: usize = 60;

/// Reduced pressure delta(1 + delta phir_d), reduced Gibbs energy (without the temperature-only
/// part) and K at (tau, delta).
fn reduced(f: &Formulation, tau: f64, delta: f64) -> (f64, f64, f64) {
    let r = f.residual(tau, delta);
    let dd = delta * r.d;
    (
        delta * (1.0 + dd),
        delta.ln() + r.a + dd,
        1.0 + 2.0 * dd + delta * delta * r.dd,
    )
}

fn check_t(f: &Formulation, t: f64) -> Result<()> {
    if !t.is_finite() || t < f.t_triple * (1.0 - 1e-12) || t >= f.tc {
        return Err(Error::OutOfRange {
            model: f.title.to_string(),
            what: "saturation temperature",
            detail: format!(
                "{t} K is outside the triple point {} K to the critical point {} K",
                f.t_triple, f.tc
            ),
        });
    }
    Ok(())
}

/// Starting densities at T from the ancillaries.
fn start(f: &Formulation, t: f64) -> (f64, f64) {
    let ps = f
        .ps_anc
        .as_ref()
        .map(|a| f.pc * a.reduced(t, f.tc))
        .unwrap_or(f.p_triple);
    let rl = match &f.rhol_anc {
        Some(a) => f.rhoc * a.reduced(t, f.tc),
        None => solve_branch(f, t, ps, Branch::Liquid, 2.5 * f.rhoc).unwrap_or(2.5 * f.rhoc),
    };
    let rv = match &f.rhov_anc {
        Some(a) => f.rhoc * a.reduced(t, f.tc),
        None => solve_branch(f, t, ps, Branch::Vapour, ps / (f.r * t)).unwrap_or(ps / (f.r * t)),
    };
    (rl, rv)
}

/// Newton on (ln delta', ln delta'') from (rl, rv); `None` when it fails.
fn newton(f: &Formulation, t: f64, rl: f64, rv: f64) -> Option<(f64, f64, usize)> {
    let tau = f.tc / t;
    let (mut dl, mut dv) = (rl / f.rhoc, rv / f.rhoc);
    for it in 1..=MAX_NEWTON {
        let (pl, gl, kl) = reduced(f, tau, dl);
        let (pv, gv, kv) = reduced(f, tau, dv);
        let usable = kl > 0.0 && kv > 0.0 && dl > dv && pl.is_finite() && pv.is_finite();
        if !usable {
            return None;
        }
        let (f1, f2) = (pl - pv, gl - gv);
        // Converged when both residuals are at rounding level (near the critical point the
        // Jacobian is nearly singular and the steps stay noisy at that level).
        if f1.abs() <= 1e-14 * pv && f2.abs() <= 1e-14 && it > 1 {
            return ((dl - dv) > 1e-6 * dl).then_some((dl * f.rhoc, dv * f.rhoc, it));
        }
        let den = dl - dv;
        let mut x = (dv * f2 - f1) / (den * kl);
        let mut y = (dl * f2 - f1) / (den * kv);
        let big = x.abs().max(y.abs());
        if big > 0.5 {
            x *= 0.5 / big;
            y *= 0.5 / big;
        }
        dl *= x.exp();
        dv *= y.exp();
        if big < 1e-13 {
            // Equal densities would also satisfy both equations: reject the trivial solution.
            return ((dl - dv) > 1e-6 * dl).then_some((dl * f.rhoc, dv * f.rhoc, it));
        }
    }
    None
}

/// Why the pressure bisection stopped without a result.
enum BisectionFailure {
    /// The isotherm has no unstable region: T is at or above the equation's own critical
    /// temperature.
    NoLoop,
    /// A density solve failed.
    Solve,
}

/// Maxwell construction by bisection in pressure (near-critical fallback).
fn bisection(f: &Formulation, t: f64) -> std::result::Result<(f64, f64, usize), BisectionFailure> {
    let tau = f.tc / t;
    let k = |rho: f64| p_dp(f, t, rho).1;
    // Least stable density of the isotherm by golden-section search on dp/drho.
    let (mut a, mut b) = (0.5 * f.rhoc, 2.0 * f.rhoc);
    let g = 0.5 * (5f64.sqrt() - 1.0);
    let (mut c, mut d) = (b - g * (b - a), a + g * (b - a));
    let (mut kc, mut kd) = (k(c), k(d));
    for _ in 0..80 {
        if kc < kd {
            b = d;
            (d, kd) = (c, kc);
            c = b - g * (b - a);
            kc = k(c);
        } else {
            a = c;
            (c, kc) = (d, kd);
            d = a + g * (b - a);
            kd = k(d);
        }
    }
    let split = 0.5 * (a + b);
    if k(split) > 0.0 {
        return Err(BisectionFailure::NoLoop);
    }
    let bis = |mut s: f64, mut u: f64| {
        for _ in 0..200 {
            let m = 0.5 * (s + u);
            if (u - s).abs() <= 1e-15 * m {
                break;
            }
            if k(m) > 0.0 {
                s = m
            } else {
                u = m
            }
        }
        s
    };
    let rv_s = bis(1e-9 * f.rhoc, split);
    let mut rl_hi = 1.2 * split;
    for _ in 0..40 {
        if k(rl_hi) > 0.0 {
            break;
        }
        rl_hi *= 1.2;
    }
    let rl_s = bis(rl_hi, split);
    let p_hi = p_dp(f, t, rv_s).0;
    let p_lo = p_dp(f, t, rl_s).0.max(1e-12 * p_hi);
    let bracket = p_hi > p_lo;
    if !bracket {
        return Err(BisectionFailure::Solve);
    }
    let (mut lo, mut hi) = (p_lo, p_hi);
    let (mut rl, mut rv) = (rl_s, rv_s);
    for it in 1..=200 {
        let p = 0.5 * (lo + hi);
        let v = solve_branch_split(f, t, p, Branch::Vapour, rv.min(rv_s), split)
            .ok_or(BisectionFailure::Solve)?;
        let l = solve_branch_split(f, t, p, Branch::Liquid, rl.max(rl_s), split)
            .ok_or(BisectionFailure::Solve)?;
        let gv = reduced(f, tau, v / f.rhoc).1;
        let gl = reduced(f, tau, l / f.rhoc).1;
        (rl, rv) = (l, v);
        if gv > gl {
            hi = p; // liquid more stable: p above saturation
        } else {
            lo = p;
        }
        if hi - lo <= 1e-15 * hi {
            return Ok((rl, rv, it));
        }
    }
    Ok((rl, rv, 200))
}

/// Saturation at temperature `t` (K), from the triple point to below the critical point.
pub fn at_t(f: &Formulation, t: f64) -> Result<Saturation> {
    check_t(f, t)?;
    let (rl0, rv0) = start(f, t);
    at_t_from(f, t, rl0, rv0)
}

fn at_t_from(f: &Formulation, t: f64, rl0: f64, rv0: f64) -> Result<Saturation> {
    let newton_result = newton(f, t, rl0, rv0).or_else(|| {
        // Second start: both densities solved at the ancillary vapour pressure.
        let ps = f.ps_anc.as_ref()?.reduced(t, f.tc) * f.pc;
        let l = solve_branch(f, t, ps, Branch::Liquid, rl0.max(1.01 * f.rhoc))?;
        let v = solve_branch(f, t, ps, Branch::Vapour, rv0.min(f.rhoc))?;
        newton(f, t, l, v)
    });
    let (rl, rv, iterations, method) = match newton_result {
        Some((l, v, n)) => (l, v, n, SaturationMethod::Newton),
        None => match bisection(f, t) {
            Ok((l, v, n)) => (l, v, n, SaturationMethod::PressureBisection),
            Err(BisectionFailure::NoLoop) => {
                return Err(Error::NoSolution(format!(
                    "{}: the isotherm at {t} K has no two-phase loop (at or above the \
                     equation's own critical temperature)",
                    f.title
                )))
            }
            Err(BisectionFailure::Solve) => {
                return Err(Error::NotConverged {
                    solver: "saturation at T (Newton, then pressure bisection)",
                    iterations: MAX_NEWTON,
                    residual: f64::NAN,
                })
            }
        },
    };
    let p = p_dp(f, t, rv).0;
    if !(p > 0.0 && p.is_finite()) {
        return Err(Error::NoSolution(format!(
            "{}: no positive vapour pressure at {t} K",
            f.title
        )));
    }
    Ok(Saturation {
        t,
        p,
        rho_liq: rl,
        rho_vap: rv,
        iterations,
        method,
    })
}

/// Clapeyron slope dp/dT of a saturation state, Pa/K.
fn clapeyron(f: &Formulation, s: &Saturation) -> f64 {
    let tau = f.tc / s.t;
    let (dl, dv) = (s.rho_liq / f.rhoc, s.rho_vap / f.rhoc);
    let rl = f.residual(tau, dl);
    let rv = f.residual(tau, dv);
    let dh = f.r * s.t * (tau * (rv.t - rl.t) + dv * rv.d - dl * rl.d);
    dh / (s.t * (1.0 / s.rho_vap - 1.0 / s.rho_liq))
}

/// Saturation at pressure `p` (Pa), from the formulation's own triple-point pressure to below
/// the critical pressure.
pub fn at_p(f: &Formulation, p: f64) -> Result<Saturation> {
    let bottom = at_t(f, f.t_triple)?;
    // Highest temperature with a saturation state: just below Tc, or below the equation's own
    // critical temperature where that is lower.
    let mut top = None;
    for gap in [1e-6, 1e-5, 1e-4, 1e-3] {
        if let Ok(s) = at_t(f, f.tc * (1.0 - gap)) {
            top = Some(s);
            break;
        }
    }
    let top =
        top.ok_or_else(|| Error::NoSolution(format!("{}: no saturation state near Tc", f.title)))?;
    let top_t = top.t;
    if !p.is_finite() || p < bottom.p || p > top.p {
        return Err(Error::OutOfRange {
            model: f.title.to_string(),
            what: "saturation pressure",
            detail: format!(
                "{p} Pa is outside {:.6e} Pa (triple point) to {:.6e} Pa (near critical)",
                bottom.p, top.p
            ),
        });
    }
    // Starting temperature from the vapour-pressure ancillary, inverted by bisection.
    let (mut lo, mut hi) = (f.t_triple, top_t);
    let mut t = match &f.ps_anc {
        Some(a) => {
            let (mut a_lo, mut a_hi) = (lo, hi);
            for _ in 0..60 {
                let m = 0.5 * (a_lo + a_hi);
                if f.pc * a.reduced(m, f.tc) < p {
                    a_lo = m
                } else {
                    a_hi = m
                }
            }
            0.5 * (a_lo + a_hi)
        }
        None => 0.5 * (lo + hi),
    };
    let mut sat = at_t(f, t)?;
    for _ in 0..MAX_OUTER {
        if sat.p < p {
            lo = lo.max(t);
        } else {
            hi = hi.min(t);
        }
        let slope = clapeyron(f, &sat);
        let mut next = t - (sat.p - p) / slope;
        let inside = next > lo && next < hi && next.is_finite();
        if !inside {
            next = 0.5 * (lo + hi);
        }
        if (next - t).abs() <= 1e-13 * t {
            return at_t_from(f, next, sat.rho_liq, sat.rho_vap);
        }
        t = next;
        sat = at_t_from(f, t, sat.rho_liq, sat.rho_vap).or_else(|_| at_t(f, t))?;
        if ((sat.p - p) / p).abs() < 1e-15 {
            return Ok(sat);
        }
    }
    Err(Error::NotConverged {
        solver: "saturation temperature at p (Newton with Clapeyron slope)",
        iterations: MAX_OUTER,
        residual: (sat.p - p) / p,
    })
}
