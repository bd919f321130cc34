//! [`PureFluid`] for a one-component member of the cubic family: saturation from the
//! equal-fugacity solver of [`crate::equilibrium::saturation`] (Newton on ln P with a
//! spinodal bracket), density roots from [`crate::state::refined_densities`], properties at
//! (T, rho) with the relations of [`crate::properties`] (Span (2000), *Multiparameter
//! Equations of State*, table 3.9):
//!
//! ```text
//! Z = 1 + a_d,  p = rho R T Z
//! h = h0(T) + R T (a_d - a_t)
//! s = s0(T) - R ln(p / P_REF) + R (-alpha - a_t + ln Z)
//! u = h - p / rho
//! cv = cv0 - R (a_tt + 2 a_t),  cp = cv + T (dp/dT)^2 / (rho^2 dp/drho),  w^2 = (cp/cv)(dp/drho)/M
//! ```
//!
//! written out here (rather than through [`crate::properties::evaluate`]) so that one state
//! allocates nothing. The cubics state no range of validity: the solvers search
//! 0.1 Tc to 20 Tc and up to 100 pc.

use super::error::{positive, PureError, PureResult};
use super::fluid::{Branch, Critical, FluidRange, PureFluid, SatState};
use crate::constants::R;
use crate::cubic::Cubic;
use crate::equilibrium::saturation;
use crate::model::Model;
use crate::properties::Properties;
use crate::state::refined_densities;

/// Search range of the solvers, in multiples of Tc and pc.
pub const T_MIN_OVER_TC: f64 = 0.1;
/// Highest temperature searched, in multiples of Tc.
pub const T_MAX_OVER_TC: f64 = 20.0;
/// Highest pressure accepted, in multiples of pc.
pub const P_MAX_OVER_PC: f64 = 100.0;

fn check_pure(c: &Cubic) -> PureResult<()> {
    let n = c.components().len();
    if n == 1 {
        Ok(())
    } else {
        Err(PureError::InvalidInput {
            what: "number of components",
            value: n as f64,
            accepted: "1 (a pure fluid)",
        })
    }
}

impl PureFluid for Cubic {
    fn fluid_name(&self) -> &str {
        &self.components()[0].name
    }

    fn model_title(&self) -> String {
        format!("{} ({})", self.spec().name, self.spec().id)
    }

    fn molar_mass(&self) -> f64 {
        self.components()[0].molar_mass
    }

    /// The critical point of a cubic whose constants come from the critical conditions is the
    /// component's (Tc, pc), with rho_c = pc / (Zc R Tc) and the member's Zc.
    fn critical(&self) -> Critical {
        let c = &self.components()[0];
        let zc = self.critical_constants().zc;
        Critical {
            t: c.tc,
            p: c.pc,
            rho: c.pc / (zc * R * c.tc),
        }
    }

    fn triple_point(&self) -> Option<(f64, f64)> {
        None
    }

    fn range(&self) -> FluidRange {
        let c = &self.components()[0];
        FluidRange {
            t_min: T_MIN_OVER_TC * c.tc,
            t_max: T_MAX_OVER_TC * c.tc,
            p_max: P_MAX_OVER_PC * c.pc,
            stated: false,
        }
    }

    fn saturation_t(&self, t: f64) -> PureResult<SatState> {
        check_pure(self)?;
        positive("temperature (K)", t)?;
        let tc = self.components()[0].tc;
        if t >= tc {
            return Err(PureError::NoSaturation {
                model: self.model_title(),
                what: format!("T = {t} K"),
                why: format!("at or above the critical temperature {tc} K"),
            });
        }
        let s = saturation::pressure(self, t)?;
        Ok(SatState {
            t: s.t,
            p: s.p,
            liquid: s.liquid,
            vapor: s.vapor,
        })
    }

    fn saturation_p(&self, p: f64) -> PureResult<SatState> {
        check_pure(self)?;
        positive("pressure (Pa)", p)?;
        let pc = self.components()[0].pc;
        if p >= pc {
            return Err(PureError::NoSaturation {
                model: self.model_title(),
                what: format!("p = {p} Pa"),
                why: format!("at or above the critical pressure {pc} Pa"),
            });
        }
        let s = saturation::temperature(self, p)?;
        Ok(SatState {
            t: s.t,
            p: s.p,
            liquid: s.liquid,
            vapor: s.vapor,
        })
    }

    fn props(&self, t: f64, rho: f64) -> PureResult<Properties> {
        check_pure(self)?;
        positive("temperature (K)", t)?;
        positive("molar density (mol/m3)", rho)?;
        let x = [1.0];
        let max = self.max_density(&x);
        if rho >= max {
            return Err(PureError::OutOfRange {
                model: self.model_title(),
                what: format!("molar density {rho} mol/m3"),
                range: format!("below the co-volume limit 1/b = {max:.6e} mol/m3"),
            });
        }
        let props = crate::properties::evaluate(self, t, rho, &x);
        let p = props.p;
        if !(p > 0.0 && p.is_finite()) {
            return Err(PureError::Model(crate::Error::NoSolution(format!(
                "{} gives p = {p:.6e} Pa at T = {t} K, rho = {rho} mol/m3: inside the \
                 two-phase region, no single-phase state",
                self.model_title()
            ))));
        }
        Ok(props)
    }

    fn pressure(&self, t: f64, rho: f64) -> PureResult<f64> {
        check_pure(self)?;
        positive("temperature (K)", t)?;
        positive("molar density (mol/m3)", rho)?;
        let x = [1.0];
        Ok(rho * R * t * self.residual(t, rho, &x).z())
    }

    fn density(&self, t: f64, p: f64, branch: Branch) -> PureResult<f64> {
        check_pure(self)?;
        positive("temperature (K)", t)?;
        positive("pressure (Pa)", p)?;
        let roots = refined_densities(self, t, p, &[1.0]);
        let r = roots.as_slice();
        let pick = match branch {
            Branch::Vapour => r.first(),
            Branch::Liquid => r.last(),
        };
        pick.copied().ok_or_else(|| {
            PureError::Model(crate::Error::NoSolution(format!(
                "{} has no density root at T = {t} K, p = {p} Pa",
                self.model_title()
            )))
        })
    }
}
