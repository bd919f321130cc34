//! IAPWS-IF97 as a (T, P)-explicit model of water. Departure functions are taken against the
//! formulation's own ideal-gas part (gamma0 of region 2, or of region 5 above 1073.15 K), so
//! h and s keep IF97's internal consistency. They are IF97's own, on the steam-table zero
//! (u = 0 and s = 0 for the saturated liquid at the triple point), water's zero in every model
//! of the crate. The molar mass and gas constant are the release's
//! (M R_IF97 = 8.314510 J/(mol K) against the CODATA 8.314463): the entropy carries a
//! difference of 4.7e-5 ln(P/P_REF) J/(mol K) from that, far below the formulation's accuracy.
//!
//! Departure from IAPWS-95 over IF97's range, measured on a 41 x 41 grid from 273.16 K to
//! 1073.15 K and 1 kPa to 100 MPa (eos/tests/if97_vs_iapws95.rs): density within 0.057 %
//! away from the critical point and within 0.86 % within 5 % of Tc and 30 % of Pc; enthalpy
//! within 3.9 kJ/kg (the largest near the critical point).

use super::{Caloric, TpModel, TpPoint};
use crate::component::Component;
use crate::constants::{P_REF, R};
use crate::error::Result;
use crate::ideal_cp::IdealGasValues;
use crate::if97::{self, data::tables, region2, region5};
use crate::state::RootChoice;

/// Molar mass of water in IAPWS-IF97, kg/mol (R7-97(2012): M = 18.015 257 g/mol with
/// R = 0.461 526 kJ/(kg K), from memory of the release).
pub const M_WATER: f64 = 0.018_015_257;

/// IF97 for water.
#[derive(Debug, Clone)]
pub struct If97Model {
    comps: Vec<Component>,
}

impl If97Model {
    /// The model for a water component (its constants name the phase; IF97 gives the values).
    pub fn new(water: Component) -> Self {
        If97Model { comps: vec![water] }
    }
}

/// Ideal-gas h (J/kg), s at p (J/(kg K)) and cp (J/(kg K)) of IF97 at T.
fn ideal(t: f64, p: f64) -> Result<(f64, f64, f64)> {
    let tab = tables()?;
    let (series, t_star) = if t <= if97::state::T_MAX_LOW {
        (&tab.region2_ideal, region2::T_STAR)
    } else {
        (&tab.region5_ideal, region5::T_STAR)
    };
    let tau = t_star / t;
    let s = series.sums(1.0, tau);
    let g0 = (p / region2::P_STAR).ln() + s[0];
    let tg_t = s[3];
    let rt = if97::R * t;
    Ok((rt * tg_t, if97::R * (tg_t - g0), -if97::R * s[4]))
}

/// Whether (T, p) lies on IF97's saturation line, below the critical pressure.
fn on_saturation(t: f64, p: f64) -> bool {
    p < if97::PC && if97::tsat(p).is_ok_and(|ts| (t - ts).abs() <= 1e-9 * ts)
}

impl TpModel for If97Model {
    fn id(&self) -> &str {
        if97::ID
    }

    fn components(&self) -> &[Component] {
        &self.comps
    }

    /// The state at (T, p); on the saturation line (T within 1e-9 of Ts(p)) a liquid or
    /// vapour root choice picks that saturated phase (IF97 gives one value of each property
    /// per (T, p) elsewhere).
    fn point(&self, t: f64, p: f64, _x: &[f64], root: RootChoice) -> Result<TpPoint> {
        let st = match root {
            RootChoice::Liquid | RootChoice::Vapor if on_saturation(t, p) => {
                let (liquid, vapor) = if97::ph_ps::saturated(p)?;
                if root == RootChoice::Liquid {
                    liquid
                } else {
                    vapor
                }
            }
            _ => if97::props_tp(t, p)?,
        };
        let (h_ig, s_ig, cp_ig) = ideal(t, p)?;
        let (_, s_ig_ref_p, _) = ideal(t, P_REF)?;
        Ok(TpPoint {
            z: p * st.v * M_WATER / (R * t),
            h_dep: Some(M_WATER * (st.h - h_ig)),
            s_dep: Some(M_WATER * (st.s - s_ig)),
            ideal: Some(IdealGasValues {
                cp_r: M_WATER * cp_ig / R,
                h_r: M_WATER * h_ig / R,
                s_r: M_WATER * s_ig_ref_p / R,
            }),
            warnings: Vec::new(),
            caloric: Some(Caloric {
                cp: M_WATER * st.cp,
                cv: M_WATER * st.cv,
                w: st.w,
            }),
        })
    }

    fn has_departures(&self) -> bool {
        true
    }
}
