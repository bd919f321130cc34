//! [`PureFluid`] for the Helmholtz formulations: saturation from the formulation's own
//! equal-pressure, equal-Gibbs-energy solver ([`crate::helmholtz::saturation`], Akasaka's
//! Newton scheme), properties from the formulation ([`HelmholtzFluid::properties`])
//! with h and s on the fluid's zero (the one every model of the fluid reports: the steam-table
//! zero for water, the ideal gas at 298.15 K and 101.325 kPa otherwise), density roots from
//! [`crate::helmholtz::density`].
//!
//! The generic trait path (ln phi of [`crate::Model`]) is not used: the trait residual is
//! rescaled by R_f/R and carries an extra (k - 1) ln delta term, see
//! [`crate::helmholtz::fluid`].

use super::error::{positive, PureError, PureResult};
use super::fluid::{Branch, Critical, FluidRange, PureFluid, SatState};
use crate::helmholtz::branch_hint::ancillary_pressure;
use crate::helmholtz::density as hd;
use crate::helmholtz::{HelmholtzFluid, Saturation};
use crate::properties::Properties;

/// The formulation's properties on the fluid's zero of h and s (the one every model of the
/// fluid reports, [`HelmholtzFluid::zero_shift`]).
fn on_fluid_zero(fluid: &HelmholtzFluid, p: Properties) -> Properties {
    let (dh, ds) = fluid.zero_shift();
    p.shifted(dh, ds)
}

fn sat_state(fluid: &HelmholtzFluid, s: &Saturation) -> PureResult<SatState> {
    let liquid = on_fluid_zero(fluid, fluid.properties(s.t, s.rho_liq)?);
    let mut vapor = on_fluid_zero(fluid, fluid.properties(s.t, s.rho_vap)?);
    // Both phases at the converged pressure (taken from the vapour side by the solver).
    let mut liquid = liquid;
    liquid.p = s.p;
    vapor.p = s.p;
    Ok(SatState {
        t: s.t,
        p: s.p,
        liquid,
        vapor,
    })
}

impl PureFluid for HelmholtzFluid {
    fn fluid_name(&self) -> &str {
        self.formulation().fluid
    }

    fn model_title(&self) -> String {
        self.formulation().title.to_string()
    }

    fn molar_mass(&self) -> f64 {
        self.formulation().molar_mass
    }

    fn critical(&self) -> Critical {
        let f = self.formulation();
        Critical {
            t: f.tc,
            p: f.pc,
            rho: f.rhoc,
        }
    }

    fn triple_point(&self) -> Option<(f64, f64)> {
        let f = self.formulation();
        Some((f.t_triple, f.p_triple))
    }

    fn range(&self) -> FluidRange {
        let v = self.validity();
        FluidRange {
            t_min: v.t_min,
            t_max: v.t_max,
            p_max: v.p_max,
            stated: true,
        }
    }

    fn saturation_t(&self, t: f64) -> PureResult<SatState> {
        positive("temperature (K)", t)?;
        let f = self.formulation();
        if t >= f.tc || t < f.t_triple {
            return Err(PureError::NoSaturation {
                model: self.model_title(),
                what: format!("T = {t} K"),
                why: format!(
                    "saturation exists from the triple point {} K to the critical point {} K",
                    f.t_triple, f.tc
                ),
            });
        }
        sat_state(self, &HelmholtzFluid::saturation_t(self, t)?)
    }

    /// The paper's vapour-pressure ancillary with the margin it is trusted to
    /// ([`crate::helmholtz::branch_hint`]).
    fn saturation_estimate(&self, t: f64) -> Option<(f64, f64)> {
        ancillary_pressure(self.formulation(), t)
    }

    fn saturation_p(&self, p: f64) -> PureResult<SatState> {
        positive("pressure (Pa)", p)?;
        let f = self.formulation();
        if p >= f.pc {
            return Err(PureError::NoSaturation {
                model: self.model_title(),
                what: format!("p = {p} Pa"),
                why: format!("at or above the critical pressure {} Pa", f.pc),
            });
        }
        match HelmholtzFluid::saturation_p(self, p) {
            Ok(s) => sat_state(self, &s),
            Err(crate::Error::OutOfRange { detail, .. }) => Err(PureError::NoSaturation {
                model: self.model_title(),
                what: format!("p = {p} Pa"),
                why: detail,
            }),
            Err(e) => Err(e.into()),
        }
    }

    fn props(&self, t: f64, rho: f64) -> PureResult<Properties> {
        Ok(on_fluid_zero(self, self.properties(t, rho)?))
    }

    fn pressure(&self, t: f64, rho: f64) -> PureResult<f64> {
        Ok(HelmholtzFluid::pressure(self, t, rho)?)
    }

    fn density(&self, t: f64, p: f64, branch: Branch) -> PureResult<f64> {
        positive("temperature (K)", t)?;
        positive("pressure (Pa)", p)?;
        let f = self.formulation();
        let found = if t >= f.tc || branch == Branch::Vapour {
            hd::vapour_root(f, t, p)
        } else {
            hd::liquid_root(f, t, p)
        };
        found.ok_or_else(|| {
            PureError::Model(crate::Error::NoSolution(format!(
                "{} has no {} density root at T = {t} K, p = {p} Pa",
                f.title,
                match branch {
                    Branch::Vapour => "vapour-like",
                    Branch::Liquid => "liquid-like",
                }
            )))
        })
    }
}
