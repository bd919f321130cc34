//! The state of a pure fluid from any supported pair of properties ([`state`]).
//!
//! - (T, P): below the critical temperature the model's own saturation pressure p_s(T)
//!   decides the phase: p > p_s compressed liquid (the liquid-like root), p < p_s
//!   superheated vapour (the vapour-like root). Within a relative [`SATURATION_TOLERANCE`] of
//!   p_s the pair does not fix the state: [`PureError::OnSaturationLine`]. A model may offer a
//!   cheap estimate of p_s ([`PureFluid::saturation_estimate`]); when p is clear of it by more
//!   than the estimate's stated uncertainty the full saturation solve is skipped.
//! - (T, v): below Tc, v between the saturated volumes v' and v'' is two-phase with
//!   x = (v - v') / (v'' - v'); outside, the single-phase state at (T, 1/v).
//! - (P, v), (P, h), (P, s): below pc the saturation state at p splits the line: inside
//!   [m', m''] the quality follows from the lever rule x = (m - m') / (m'' - m'); outside,
//!   T is found by a bracketed one-dimensional solve on the isobar (p(T, rho) = p on the
//!   isochore for v, h(T, p) = h or s(T, p) = s on the liquid or vapour branch). The bracket
//!   starts at T_s(p) (at Tc above pc), where the sign of the residual is known, and widens by
//!   doubling steps towards the root (the residual is monotone there: (dp/dT)_rho > 0,
//!   (dh/dT)_p = cp > 0, (ds/dT)_p = cp/T > 0); Brent's method (R. P. Brent, *Algorithms for
//!   Minimization without Derivatives*, 1973, ch. 4) then converges to rounding.
//! - (T, x), (P, x): the saturation state and the lever rule; x outside 0..1 is refused.
//!
//! Water below its triple point (273.16 K): the vapour below the sublimation pressure and the
//! liquid above the ice Ih melting pressure are fluid states; between them ice is stable and
//! the request is refused with both pressures ([`PureError::BelowTriplePoint`],
//! IAPWS R14-08, see [`super::ice`]).

use super::error::{finite, positive, PureError, PureResult};
use super::fluid::{Branch, PureFluid, SatState};
use super::ice;
use super::state::{PureState, Spec};
use crate::equilibrium::brent;
use crate::phase::Phase;
use crate::properties::Properties;

/// Relative distance |p / p_s(T) - 1| within which a (T, P) request counts as on the
/// saturation line.
pub const SATURATION_TOLERANCE: f64 = 1e-6;

/// Doubling steps allowed while bracketing T.
const MAX_BRACKET_STEPS: usize = 80;

/// The state of `fluid` fixed by `spec`.
pub fn state(fluid: &dyn PureFluid, spec: Spec) -> PureResult<PureState> {
    match spec {
        Spec::Tp { t, p } => at_tp(fluid, t, p),
        Spec::Tv { t, v } => at_tv(fluid, t, v),
        Spec::Pv { p, v } => at_pv(fluid, p, v),
        Spec::Ph { p, h } => at_p_energy(fluid, p, finite("enthalpy (J/mol)", h)?, Energy::H),
        Spec::Ps { p, s } => at_p_energy(fluid, p, finite("entropy (J/(mol K))", s)?, Energy::S),
        Spec::Tx { t, x } => at_tx(fluid, t, x),
        Spec::Px { p, x } => at_px(fluid, p, x),
    }
}

fn check_t(fluid: &dyn PureFluid, t: f64) -> PureResult<()> {
    positive("temperature (K)", t)?;
    let r = fluid.range();
    if t < r.t_min || t > r.t_max {
        return Err(PureError::OutOfRange {
            model: fluid.model_title(),
            what: format!("T = {t} K"),
            range: r.describe(),
        });
    }
    Ok(())
}

fn check_p(fluid: &dyn PureFluid, p: f64) -> PureResult<()> {
    positive("pressure (Pa)", p)?;
    let r = fluid.range();
    if p > r.p_max {
        return Err(PureError::OutOfRange {
            model: fluid.model_title(),
            what: format!("p = {p} Pa"),
            range: r.describe(),
        });
    }
    Ok(())
}

fn check_x(x: f64) -> PureResult<()> {
    if (0.0..=1.0).contains(&x) {
        Ok(())
    } else {
        Err(PureError::QualityOutOfRange { x })
    }
}

/// Phase name of a single-phase state on `side` of the dome.
fn single_phase(fluid: &dyn PureFluid, t: f64, p: f64, side: Branch) -> Phase {
    let c = fluid.critical();
    if t >= c.t {
        if p >= c.p {
            Phase::Supercritical
        } else {
            Phase::Gas
        }
    } else {
        match side {
            Branch::Liquid => Phase::Liquid,
            Branch::Vapour => Phase::Vapor,
        }
    }
}

/// For water below 273.16 K: the fluid branch that is stable at (T, p), or the refusal when
/// ice is stable. `None` for other fluids or temperatures.
fn ice_check(fluid: &dyn PureFluid, t: f64, p: f64) -> PureResult<Option<Branch>> {
    if !ice::is_water(fluid.fluid_name()) || t >= ice::T_TRIPLE {
        return Ok(None);
    }
    let sub = ice::sublimation_pressure(t)?;
    let melt = ice::melting_pressure_ih(t).ok();
    if p < sub {
        return Ok(Some(Branch::Vapour));
    }
    if let Some(m) = melt {
        if p > m {
            return Ok(Some(Branch::Liquid));
        }
    }
    Err(PureError::BelowTriplePoint {
        t,
        p,
        sublimation_pa: sub,
        melting_pa: melt,
    })
}

/// Refuses saturation requests for water below its triple point, naming the ice pressures.
fn ice_no_saturation(fluid: &dyn PureFluid, t: Option<f64>, p: Option<f64>) -> PureResult<()> {
    if !ice::is_water(fluid.fluid_name()) {
        return Ok(());
    }
    if let Some(t) = t.filter(|&t| t < ice::T_TRIPLE) {
        let sub = ice::sublimation_pressure(t)
            .map(|s| format!("the sublimation pressure of ice Ih there is {s:.6e} Pa"))
            .unwrap_or_else(|e| e.to_string());
        let melt = ice::melting_pressure_ih(t)
            .map(|m| format!(", its melting pressure {m:.6e} Pa"))
            .unwrap_or_default();
        return Err(PureError::NoSaturation {
            model: fluid.model_title(),
            what: format!("T = {t} K"),
            why: format!(
                "water is below its triple point (273.16 K): vapour and liquid do not coexist; \
                 {sub}{melt} (IAPWS R14-08)"
            ),
        });
    }
    if let Some(p) = p.filter(|&p| p < ice::P_TRIPLE) {
        return Err(PureError::NoSaturation {
            model: fluid.model_title(),
            what: format!("p = {p} Pa"),
            why: "below the triple-point pressure of water (611.657 Pa): vapour meets ice, not \
                  liquid (IAPWS R14-08)"
                .to_string(),
        });
    }
    Ok(())
}

fn at_tp(fluid: &dyn PureFluid, t: f64, p: f64) -> PureResult<PureState> {
    check_t(fluid, t)?;
    check_p(fluid, p)?;
    let crit = fluid.critical();
    let side = if let Some(side) = ice_check(fluid, t, p)? {
        side
    } else if t >= crit.t {
        Branch::Vapour
    } else {
        let clear = fluid
            .saturation_estimate(t)
            .filter(|(est, unc)| (p / est - 1.0).abs() > *unc);
        match clear {
            Some((est, _)) if p > est => Branch::Liquid,
            Some(_) => Branch::Vapour,
            None => {
                let sat = fluid.saturation_t(t)?;
                if (p / sat.p - 1.0).abs() <= SATURATION_TOLERANCE {
                    return Err(PureError::OnSaturationLine {
                        model: fluid.model_title(),
                        t,
                        p,
                        p_sat: sat.p,
                        tolerance: SATURATION_TOLERANCE,
                    });
                }
                if p > sat.p {
                    Branch::Liquid
                } else {
                    Branch::Vapour
                }
            }
        }
    };
    let rho = fluid.density(t, p, side)?;
    let mut props = fluid.props(t, rho)?;
    props.p = p;
    Ok(PureState::single(props, single_phase(fluid, t, p, side)))
}

fn at_tv(fluid: &dyn PureFluid, t: f64, v: f64) -> PureResult<PureState> {
    check_t(fluid, t)?;
    positive("molar volume (m3/mol)", v)?;
    let rho = 1.0 / v;
    let crit = fluid.critical();
    let below_triple = fluid.triple_point().is_some_and(|(tt, _)| t < tt)
        || (ice::is_water(fluid.fluid_name()) && t < ice::T_TRIPLE);
    let side = if t >= crit.t || below_triple {
        // No dome: the single-phase state; for water below 273.16 K checked against ice.
        let props = fluid.props(t, rho)?;
        let side = if rho > crit.rho {
            Branch::Liquid
        } else {
            Branch::Vapour
        };
        if let Some(s) = ice_check(fluid, t, props.p)? {
            if s != side {
                return Err(PureError::BelowTriplePoint {
                    t,
                    p: props.p,
                    sublimation_pa: ice::sublimation_pressure(t)?,
                    melting_pa: ice::melting_pressure_ih(t).ok(),
                });
            }
        }
        side
    } else {
        let sat = fluid.saturation_t(t)?;
        let (vl, vv) = (sat.liquid.molar_volume(), sat.vapor.molar_volume());
        if v < vl {
            Branch::Liquid
        } else if v > vv {
            Branch::Vapour
        } else {
            return PureState::two_phase(sat, ((v - vl) / (vv - vl)).clamp(0.0, 1.0));
        }
    };
    let props = fluid.props(t, rho)?;
    check_p(fluid, props.p)?;
    let phase = single_phase(fluid, t, props.p, side);
    Ok(PureState::single(props, phase))
}

/// The saturation state at p, or `None` where the isobar crosses no dome (at or above pc,
/// or below the model's triple-point pressure, where only vapour is fluid).
fn dome_at(fluid: &dyn PureFluid, p: f64) -> PureResult<Option<SatState>> {
    let crit = fluid.critical();
    if p >= crit.p {
        return Ok(None);
    }
    if let Some((_, pt)) = fluid.triple_point() {
        if p < pt {
            return Ok(None);
        }
    }
    ice_no_saturation(fluid, None, Some(p)).map_or(Ok(None), |_| fluid.saturation_p(p).map(Some))
}

/// A temperature with f(T) = 0, f increasing in T, starting from (t0, f(t0)) and widening
/// towards the root by doubling steps within the search range; then Brent's method.
fn solve_t(
    fluid: &dyn PureFluid,
    what: &str,
    t0: f64,
    f0: f64,
    f: &dyn Fn(f64) -> PureResult<f64>,
) -> PureResult<f64> {
    if f0.abs() < f64::MIN_POSITIVE {
        return Ok(t0);
    }
    let r = fluid.range();
    let up = f0 < 0.0;
    let mut step = (1e-3 * t0).max(1e-2);
    let (mut a, mut fa) = (t0, f0);
    for _ in 0..MAX_BRACKET_STEPS {
        let b = if up {
            (a + step).min(r.t_max)
        } else {
            (a - step).max(r.t_min)
        };
        let fb = f(b)?;
        if !fb.is_finite() {
            break;
        }
        if (fb > 0.0) == up || fb.abs() < f64::MIN_POSITIVE {
            let (lo, hi) = if up { (a, b) } else { (b, a) };
            let mut failure = None;
            let root = brent::solve(what_static(up), lo, hi, 1e-15, 0.0, |t| match f(t) {
                Ok(v) => v,
                Err(e) => {
                    failure.get_or_insert(e);
                    f64::NAN
                }
            });
            if let Some(e) = failure {
                return Err(e);
            }
            return Ok(root?);
        }
        if (up && b >= r.t_max) || (!up && b <= r.t_min) {
            break;
        }
        (a, fa) = (b, fb);
        step *= 2.0;
    }
    let _ = fa;
    Err(PureError::OutOfRange {
        model: fluid.model_title(),
        what: format!("the state with {what}"),
        range: r.describe(),
    })
}

fn what_static(up: bool) -> &'static str {
    if up {
        "temperature on the isobar (above the start)"
    } else {
        "temperature on the isobar (below the start)"
    }
}

/// Which side of the dome a single-phase temperature on an isobar lies, for the density root.
fn branch_at(fluid: &dyn PureFluid, t: f64, side: Branch) -> Branch {
    if t >= fluid.critical().t {
        Branch::Vapour
    } else {
        side
    }
}

fn finish_single(
    fluid: &dyn PureFluid,
    props: Properties,
    side: Branch,
    p: f64,
) -> PureResult<PureState> {
    let t = props.t;
    if let Some(s) = ice_check(fluid, t, p)? {
        if s != side {
            return Err(PureError::BelowTriplePoint {
                t,
                p,
                sublimation_pa: ice::sublimation_pressure(t)?,
                melting_pa: ice::melting_pressure_ih(t).ok(),
            });
        }
    }
    let mut props = props;
    props.p = p;
    Ok(PureState::single(props, single_phase(fluid, t, p, side)))
}

fn at_pv(fluid: &dyn PureFluid, p: f64, v: f64) -> PureResult<PureState> {
    check_p(fluid, p)?;
    positive("molar volume (m3/mol)", v)?;
    let rho = 1.0 / v;
    let crit = fluid.critical();
    let (t0, side) = match dome_at(fluid, p)? {
        Some(sat) => {
            let (vl, vv) = (sat.liquid.molar_volume(), sat.vapor.molar_volume());
            if v < vl {
                (sat.t, Branch::Liquid)
            } else if v > vv {
                (sat.t, Branch::Vapour)
            } else {
                return PureState::two_phase(sat, ((v - vl) / (vv - vl)).clamp(0.0, 1.0));
            }
        }
        None if p >= crit.p => (
            crit.t,
            if rho > crit.rho {
                Branch::Liquid
            } else {
                Branch::Vapour
            },
        ),
        None => (
            fluid.triple_point().map_or(fluid.range().t_min, |tp| tp.0),
            Branch::Vapour,
        ),
    };
    let f = |t: f64| -> PureResult<f64> { Ok(fluid.pressure(t, rho)? / p - 1.0) };
    let f0 = f(t0)?;
    let t = solve_t(fluid, &format!("p = {p} Pa, v = {v} m3/mol"), t0, f0, &f)?;
    let props = fluid.props(t, rho)?;
    finish_single(fluid, props, side, p)
}

/// Enthalpy or entropy.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Energy {
    H,
    S,
}

impl Energy {
    fn of(self, p: &Properties) -> f64 {
        match self {
            Energy::H => p.h,
            Energy::S => p.s,
        }
    }
    fn name(self) -> &'static str {
        match self {
            Energy::H => "h",
            Energy::S => "s",
        }
    }
}

fn at_p_energy(fluid: &dyn PureFluid, p: f64, target: f64, e: Energy) -> PureResult<PureState> {
    check_p(fluid, p)?;
    let crit = fluid.critical();
    let (t0, side, m0) = match dome_at(fluid, p)? {
        Some(sat) => {
            let (ml, mv) = (e.of(&sat.liquid), e.of(&sat.vapor));
            if target < ml {
                (sat.t, Branch::Liquid, ml)
            } else if target > mv {
                (sat.t, Branch::Vapour, mv)
            } else {
                return PureState::two_phase(sat, ((target - ml) / (mv - ml)).clamp(0.0, 1.0));
            }
        }
        None => {
            let (t0, side) = if p >= crit.p {
                (crit.t, Branch::Liquid)
            } else {
                let t0 = fluid.triple_point().map_or(fluid.range().t_min, |tp| tp.0);
                (t0.max(fluid.range().t_min), Branch::Vapour)
            };
            let rho = fluid.density(t0, p, branch_at(fluid, t0, side))?;
            (t0, side, e.of(&fluid.props(t0, rho)?))
        }
    };
    let at = |t: f64| -> PureResult<Properties> {
        let rho = fluid.density(t, p, branch_at(fluid, t, side))?;
        fluid.props(t, rho)
    };
    let scale = target.abs().max(1.0);
    let f = |t: f64| -> PureResult<f64> { Ok((e.of(&at(t)?) - target) / scale) };
    let what = format!("p = {p} Pa, {} = {target}", e.name());
    let t = solve_t(fluid, &what, t0, (m0 - target) / scale, &f)?;
    finish_single(fluid, at(t)?, side, p)
}

fn at_tx(fluid: &dyn PureFluid, t: f64, x: f64) -> PureResult<PureState> {
    check_x(x)?;
    check_t(fluid, t)?;
    ice_no_saturation(fluid, Some(t), None)?;
    PureState::two_phase(fluid.saturation_t(t)?, x)
}

fn at_px(fluid: &dyn PureFluid, p: f64, x: f64) -> PureResult<PureState> {
    check_x(x)?;
    check_p(fluid, p)?;
    ice_no_saturation(fluid, None, Some(p))?;
    PureState::two_phase(fluid.saturation_p(p)?, x)
}
