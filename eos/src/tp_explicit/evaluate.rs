//! Every property of a (T, P)-explicit model's state, and states from (T, rho) or (P, rho).

use super::{departure, TpModel};
use crate::composition;
use crate::constants::{P_REF, R};
use crate::error::{positive, Error, Result};
use crate::ideal_cp::IdealGasValues;
use crate::need::Need;
use crate::phase::Phase;
use crate::properties::Properties;
use crate::state::RootChoice;

/// A state of a (T, P)-explicit model.
#[derive(Debug, Clone, PartialEq)]
pub struct TpState {
    /// Every property.
    pub props: Properties,
    /// Phase name (from the pseudo-critical point and the density).
    pub phase: Phase,
    /// Inputs outside the model's published range.
    pub warnings: Vec<String>,
}

/// Relative step of the central differences.
const STEP: f64 = 1e-5;

fn ideal_part(
    model: &dyn TpModel,
    t: f64,
    x: &[f64],
    own: Option<IdealGasValues>,
) -> IdealGasValues {
    own.unwrap_or_else(|| {
        crate::ideal_cp::mixture_values(model.components().iter().map(|c| &c.cp), x, t)
    })
}

/// df/dx at x by a central difference of step `step`; where one side lies outside the
/// model's range (a state on its boundary, such as IF97 at 100 MPa or 273.15 K), by a
/// one-sided difference from `fx` = f(x) towards the side that is inside; and where the two
/// one-sided quotients disagree by more than a factor of two (x on a boundary between two
/// of the model's equations, such as IF97's regions 2 and 5 at 1073.15 K, where f jumps),
/// by the smaller one, which stays on one equation.
fn derivative(f: &dyn Fn(f64) -> Result<f64>, x: f64, step: f64, fx: f64) -> Result<f64> {
    match (f(x + step), f(x - step)) {
        (Ok(a), Ok(b)) => {
            let (fwd, bwd) = ((a - fx) / step, (fx - b) / step);
            let agree = fwd * bwd > 0.0 && (fwd / bwd).abs() <= 2.0 && (bwd / fwd).abs() <= 2.0;
            Ok(if agree {
                (a - b) / (2.0 * step)
            } else if fwd.abs() < bwd.abs() {
                fwd
            } else {
                bwd
            })
        }
        (Ok(a), Err(_)) => Ok((a - fx) / step),
        (Err(_), Ok(b)) => Ok((fx - b) / step),
        (Err(e), Err(_)) => Err(e),
    }
}

/// (h_dep, s_dep, ln phi of the mixture) at one state.
fn departures(
    model: &dyn TpModel,
    t: f64,
    p: f64,
    x: &[f64],
    root: RootChoice,
) -> Result<(f64, f64, f64)> {
    if model.has_departures() {
        let pt = model.point(t, p, x, root)?;
        let (h, s) = (pt.h_dep, pt.s_dep);
        match (h, s) {
            (Some(h), Some(s)) => {
                let rt = R * t;
                // ln phi of the mixture = g_dep/(RT) = h_dep/(RT) - s_dep/R.
                Ok((h, s, h / rt - s / R))
            }
            _ => departure::integrate(model, t, p, x, root),
        }
    } else {
        departure::integrate(model, t, p, x, root)
    }
}

/// Every property at (T, P, x) on branch `root`.
pub fn evaluate(
    model: &dyn TpModel,
    t: f64,
    p: f64,
    x: &[f64],
    root: RootChoice,
) -> Result<TpState> {
    evaluate_need(model, t, p, x, root, Need::All)
}

/// What `need` asks for at (T, P, x) on branch `root` (see
/// [`crate::properties::Properties::computed`]): Z and density take one evaluation of the
/// model, every property also the departures and the numerical derivatives. The values
/// computed are those of [`evaluate`], bit for bit.
pub fn evaluate_need(
    model: &dyn TpModel,
    t: f64,
    p: f64,
    x: &[f64],
    root: RootChoice,
    need: Need,
) -> Result<TpState> {
    positive("temperature (K)", t)?;
    positive("pressure (Pa)", p)?;
    composition::check(x, model.components().len())?;
    let pt = model.point(t, p, x, root)?;
    let z = pt.z;
    let rho = p / (z * R * t);
    let m: f64 = model
        .components()
        .iter()
        .zip(x)
        .map(|(c, xi)| xi * c.molar_mass)
        .sum();
    if need == Need::Volumetric {
        if !(z.is_finite() && rho.is_finite()) {
            return Err(Error::NoSolution(format!(
                "{} gives no finite properties at T = {t} K, P = {p} Pa",
                model.id()
            )));
        }
        return Ok(TpState {
            props: Properties::volumetric(t, p, rho, z, m, f64::NAN),
            phase: name_phase(model, t, p, rho, x),
            warnings: pt.warnings,
        });
    }
    let (h_dep, s_dep, ln_phi_mix) = departures(model, t, p, x, root)?;
    let ig = ideal_part(model, t, x, pt.ideal);
    let mixing: f64 = x.iter().filter(|&&v| v > 0.0).map(|&v| v * v.ln()).sum();
    let h = R * ig.h_r + h_dep;
    let s = R * (ig.s_r - (p / P_REF).ln() - mixing) + s_dep;

    let (dt, dp) = (STEP * t, STEP * p);
    let vol = 1.0 / rho;
    let v = |t: f64, p: f64| -> Result<f64> { Ok(model.point(t, p, x, root)?.z * R * t / p) };
    let dvdt_num = derivative(&|t| v(t, p), t, dt, vol)?;
    let (cp_num, cv, dvdp, dvdt) = match pt.caloric {
        // The model's own heat capacities and speed of sound (IF97's region equations):
        // (dv/dP)_T from w^2 = -(cp/cv) v^2 / (M (dv/dP)_T), and |(dv/dT)_P| from
        // cp - cv = -T (dv/dT)^2 / (dv/dP)_T, its sign from the difference quotient (which
        // may straddle a region boundary, where its size would be wrong).
        Some(c) => {
            let dvdp = -(c.cp / c.cv) * vol * vol / (m * c.w * c.w);
            let size = (-(c.cp - c.cv) * dvdp / t).max(0.0).sqrt();
            (c.cp, c.cv, dvdp, size.copysign(dvdt_num))
        }
        None => {
            let dvdt = dvdt_num;
            let dvdp = derivative(&|p| v(t, p), p, dp, vol)?;
            let hd = |t: f64| -> Result<f64> {
                let ig = ideal_part(model, t, x, model.point(t, p, x, root)?.ideal);
                Ok(R * ig.h_r + departures(model, t, p, x, root)?.0)
            };
            let cp = derivative(&hd, t, dt, h)?;
            (cp, cp + t * dvdt * dvdt / dvdp, dvdp, dvdt)
        }
    };
    let stable = dvdp < 0.0;
    let cp = stable.then_some(cp_num);
    let w = cp.and_then(|cp| {
        let w2 = -(cp / cv) * vol * vol / (m * dvdp);
        (w2 > 0.0).then(|| w2.sqrt())
    });
    let jt = cp.map(|cp| (t * dvdt - vol) / cp);
    let k = cp.map(|cp| (cp / cv) * (-vol / (p * dvdp)));
    let ln_phi = if let Some(l) = model.component_ln_phi(t, p, x, root)? {
        l
    } else if x.len() == 1 {
        vec![ln_phi_mix]
    } else {
        Vec::new()
    };
    let props = Properties {
        t,
        p,
        rho,
        z,
        molar_mass: m,
        h_res: h_dep,
        s_res: s_dep,
        g_res: R * t * ln_phi_mix,
        h,
        s,
        u: h - p * vol,
        g: h - t * s,
        cv,
        cp,
        w,
        jt,
        isentropic_exponent: k,
        dp_drho: -1.0 / (rho * rho * dvdp),
        dp_dt: -dvdt / dvdp,
        ln_phi,
        computed: Need::All,
    };
    let finite = [props.h, props.s, props.cv, props.z, props.rho]
        .iter()
        .all(|v| v.is_finite());
    if !finite {
        return Err(Error::NoSolution(format!(
            "{} gives no finite properties at T = {t} K, P = {p} Pa",
            model.id()
        )));
    }
    let phase = name_phase(model, t, p, rho, x);
    Ok(TpState {
        props,
        phase,
        warnings: pt.warnings,
    })
}

/// Phase name from Kay's pseudo-critical point and a critical density estimate (Zc = 0.29).
fn name_phase(model: &dyn TpModel, t: f64, p: f64, rho: f64, x: &[f64]) -> Phase {
    let (tc, pc) = model
        .components()
        .iter()
        .zip(x)
        .fold((0.0, 0.0), |(a, b), (c, &xi)| {
            (a + xi * c.tc, b + xi * c.pc)
        });
    if t >= tc {
        if p >= pc {
            Phase::Supercritical
        } else {
            Phase::Gas
        }
    } else if rho > pc / (0.29 * R * tc) {
        Phase::Liquid
    } else {
        Phase::Vapor
    }
}

/// The state at (T, P).
pub fn state_tp(
    model: &dyn TpModel,
    t: f64,
    p: f64,
    x: &[f64],
    root: RootChoice,
) -> Result<TpState> {
    evaluate(model, t, p, x, root)
}

/// Solves f(u) = 0 for u = ln(value) on a bracket grown from `start` by factors of two.
fn solve_log(
    start: f64,
    f: impl Fn(f64) -> Result<f64>,
    what: &'static str,
    id: &str,
) -> Result<f64> {
    let g = |lu: f64| f(lu.exp());
    let (mut lo, mut hi) = (start.ln(), start.ln());
    let f0 = g(lo)?;
    let (mut flo, mut fhi) = (f0, f0);
    // Each end moves out by a factor of two while the model answers there; an end where it
    // does not (outside its range) stays at its last good value, so a root between the other
    // end and it is still bracketed.
    let (mut lo_open, mut hi_open) = (true, true);
    for _ in 0..60 {
        if flo < 0.0 && fhi > 0.0 || flo > 0.0 && fhi < 0.0 || !(lo_open || hi_open) {
            break;
        }
        if lo_open {
            match g(lo - std::f64::consts::LN_2) {
                Ok(v) if v.is_finite() => {
                    lo -= std::f64::consts::LN_2;
                    flo = v;
                }
                _ => lo_open = false,
            }
        }
        if hi_open {
            match g(hi + std::f64::consts::LN_2) {
                Ok(v) if v.is_finite() => {
                    hi += std::f64::consts::LN_2;
                    fhi = v;
                }
                _ => hi_open = false,
            }
        }
    }
    if flo.is_nan() || fhi.is_nan() || flo * fhi >= 0.0 {
        return Err(Error::NoSolution(format!(
            "{id} reaches no {what} for this state"
        )));
    }
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        let fm = g(mid)?;
        if (fm < 0.0) == (flo < 0.0) {
            lo = mid;
            flo = fm;
        } else {
            hi = mid;
        }
        if hi - lo < 1e-14 {
            return Ok((0.5 * (lo + hi)).exp());
        }
    }
    Err(Error::NotConverged {
        solver: "bisection on ln P or ln T",
        iterations: 200,
        residual: hi - lo,
    })
}

/// The state at (T, rho): the pressure whose density is rho.
pub fn state_trho(
    model: &dyn TpModel,
    t: f64,
    rho: f64,
    x: &[f64],
    root: RootChoice,
) -> Result<TpState> {
    positive("temperature (K)", t)?;
    positive("molar density (mol/m3)", rho)?;
    let f = |p: f64| -> Result<f64> { Ok(p / (model.point(t, p, x, root)?.z * R * t) / rho - 1.0) };
    let p = solve_log(rho * R * t, f, "pressure", model.id())?;
    evaluate(model, t, p, x, root)
}

/// The state at (P, rho): the temperature whose density is rho.
pub fn state_prho(
    model: &dyn TpModel,
    p: f64,
    rho: f64,
    x: &[f64],
    root: RootChoice,
) -> Result<TpState> {
    positive("pressure (Pa)", p)?;
    positive("molar density (mol/m3)", rho)?;
    let f = |t: f64| -> Result<f64> { Ok(1.0 - p / (model.point(t, p, x, root)?.z * R * t) / rho) };
    let t = solve_log(p / (rho * R), f, "temperature", model.id())?;
    evaluate(model, t, p, x, root)
}
