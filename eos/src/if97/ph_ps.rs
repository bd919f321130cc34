//! Water and steam states from (p, h) and (p, s), the way steam users work: the temperature
//! that IF97's own forward equations give the enthalpy (or entropy) at that pressure, or the
//! wet-steam state with its quality between the saturated liquid and vapour of region 4.
//!
//! The release's backward equations T(p, h) and T(p, s) (IAPWS R7-97(2012), regions 1 and 2;
//! the supplementary releases for region 3) exist to spare the iteration; they agree with the
//! forward equations to within 25 mK (region 1) and 10 mK (region 2), their stated
//! consistency. Here the forward equations are inverted instead, by Brent's method on T at
//! fixed p (h and s rise with T along an isobar: cp > 0), so the state found reproduces the
//! given h or s to round-off; the tests check it against the backward equations' published
//! check values within that consistency.

use super::data::{tables, Tables};
use super::state::{props_tp, If97State, P_MAX_HIGH, P_MAX_LOW, T_MAX_HIGH, T_MAX_LOW};
use super::{region1, region2, region3, region4, PC, T_MIN};
use crate::equilibrium::brent;
use crate::error::{Error, Result};

/// Upper temperature of region 1 and of the saturated states computed with regions 1 and 2.
const T_13: f64 = 623.15;

/// What a (p, h) or (p, s) state is.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum PhaseState {
    /// One phase at temperature T (K).
    Single(If97State),
    /// Wet steam at the saturation temperature of p: vapour mass fraction `quality` of the
    /// saturated vapour, the rest saturated liquid.
    Wet {
        quality: f64,
        liquid: If97State,
        vapor: If97State,
    },
}

/// Which property is given with p.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Given {
    /// Specific enthalpy, J/kg.
    H,
    /// Specific entropy, J/(kg K).
    S,
}

impl Given {
    fn of(self, st: &If97State) -> f64 {
        match self {
            Given::H => st.h,
            Given::S => st.s,
        }
    }

    fn name(self) -> &'static str {
        match self {
            Given::H => "enthalpy",
            Given::S => "entropy",
        }
    }
}

/// The state of water at pressure `p` (Pa) and specific enthalpy `h` (J/kg, IF97's zero).
pub fn ph(p: f64, h: f64) -> Result<PhaseState> {
    solve(p, h, Given::H)
}

/// The state of water at pressure `p` (Pa) and specific entropy `s` (J/(kg K), IF97's zero).
pub fn ps(p: f64, s: f64) -> Result<PhaseState> {
    solve(p, s, Given::S)
}

/// The saturated liquid and vapour at pressure `p` (Pa, below the critical pressure): regions
/// 1 and 2 up to 623.15 K, region 3 on its liquid and vapour sides above.
pub fn saturated(p: f64) -> Result<(If97State, If97State)> {
    let tab = tables()?;
    let ts = region4::tsat(p)?;
    saturated_at(tab, ts, p)
}

fn saturated_at(tab: &Tables, ts: f64, p: f64) -> Result<(If97State, If97State)> {
    if ts <= T_13 {
        return Ok((
            region1::properties(tab, ts, p),
            region2::properties(tab, ts, p),
        ));
    }
    let rl = region3::density(tab, ts, p, true)?;
    let rv = region3::density(tab, ts, p, false)?;
    Ok((
        region3::properties(tab, ts, rl),
        region3::properties(tab, ts, rv),
    ))
}

fn solve(p: f64, target: f64, given: Given) -> Result<PhaseState> {
    let tab = tables()?;
    let p_min = region4::psat_unchecked(tab, T_MIN);
    if !(p.is_finite() && target.is_finite() && (p_min..=P_MAX_LOW).contains(&p)) {
        return Err(Error::OutOfRange {
            model: "if97".into(),
            what: "(p, h) or (p, s)",
            detail: format!(
                "p = {p} Pa: IAPWS-IF97 states from p and {} need {p_min:.1} Pa (the \
                 saturation pressure at 273.15 K) to 100 MPa",
                given.name()
            ),
        });
    }
    let t_top = if p <= P_MAX_HIGH {
        T_MAX_HIGH
    } else {
        T_MAX_LOW
    };
    let at = |t: f64| props_tp(t, p).map(|st| given.of(&st));
    // The bracket in T and the given property at its ends; at the saturation temperature the
    // end is the saturated state of that side (props_tp there is one side or the other).
    let (lo, hi, at_lo, at_hi) = if p < PC {
        let ts = region4::tsat_unchecked(tab, p);
        let (liquid, vapor) = saturated_at(tab, ts, p)?;
        let (fl, fv) = (given.of(&liquid), given.of(&vapor));
        if (fl..=fv).contains(&target) {
            let quality = ((target - fl) / (fv - fl)).clamp(0.0, 1.0);
            return Ok(PhaseState::Wet {
                quality,
                liquid,
                vapor,
            });
        }
        if target < fl {
            (T_MIN, ts, at(T_MIN)?, fl)
        } else {
            (ts, t_top, fv, at(t_top)?)
        }
    } else {
        (T_MIN, t_top, at(T_MIN)?, at(t_top)?)
    };
    let (f_lo, f_hi) = (at_lo - target, at_hi - target);
    if f_lo > 0.0 || f_hi < 0.0 {
        return Err(Error::OutOfRange {
            model: "if97".into(),
            what: "(p, h) or (p, s)",
            detail: format!(
                "{} {target} at p = {p} Pa lies outside IAPWS-IF97's range at that pressure \
                 ({} to {} between {lo} K and {hi} K)",
                given.name(),
                f_lo + target,
                f_hi + target
            ),
        });
    }
    let t = brent::solve("if97 T(p, h or s)", lo, hi, 1e-13, 0.0, |t| {
        if t <= lo {
            f_lo
        } else if t >= hi {
            f_hi
        } else {
            at(t).map_or(f64::NAN, |v| v - target)
        }
    })?;
    Ok(PhaseState::Single(props_tp(t, p)?))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_forward_state_comes_back() {
        for (t, p) in [(300.0, 1e5), (500.0, 3e6), (700.0, 30e6), (1500.0, 20e6)] {
            let st = props_tp(t, p).unwrap();
            for got in [ph(p, st.h).unwrap(), ps(p, st.s).unwrap()] {
                let PhaseState::Single(back) = got else {
                    panic!("{got:?}");
                };
                assert!((back.t - t).abs() < 1e-8 * t, "{t} {p}: {}", back.t);
            }
        }
    }

    #[test]
    fn wet_steam_between_the_saturated_states() {
        let p = 1e6;
        let (l, v) = saturated(p).unwrap();
        let h = 0.25 * v.h + 0.75 * l.h;
        let PhaseState::Wet { quality, .. } = ph(p, h).unwrap() else {
            panic!("not wet");
        };
        assert!((quality - 0.25).abs() < 1e-12);
        assert!(ph(50.0, 1e6).is_err());
        assert!(ph(1e6, 1e9).is_err());
    }
}
