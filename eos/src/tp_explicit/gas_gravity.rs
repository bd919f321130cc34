//! The gas-gravity Z correlations (Dranchuk-Abou-Kassem, Hall-Yarborough) as a (T, P)-explicit
//! model of a mixture: the gravity is the mixture's molar mass over that of dry air, the acid
//! gases are the mixture's carbon dioxide and hydrogen sulfide, and the pseudo-critical point
//! comes from Sutton's correlation for the hydrocarbon part, mixed with the nitrogen, carbon
//! dioxide and hydrogen sulfide by Kay's rule, with the Wichert-Aziz correction (see
//! [`crate::gas_gravity`]). Energy properties follow from Z by the departure integrals.

use super::{TpModel, TpPoint};
use crate::component::Component;
use crate::error::Result;
use crate::gas_gravity::{z_tp, GasSpec, GravityCorrelation, ZCorrelation, M_AIR};
use crate::state::RootChoice;

/// A Z correlation of the Standing-Katz chart for given components.
#[derive(Debug, Clone)]
pub struct GravityModel {
    comps: Vec<Component>,
    z: ZCorrelation,
    co2: Option<usize>,
    h2s: Option<usize>,
    n2: Option<usize>,
}

impl GravityModel {
    /// The correlation `z` for these components; nitrogen, carbon dioxide and hydrogen
    /// sulfide are recognised by name (taken out of the hydrocarbon part, and the acid gases
    /// corrected for).
    pub fn new(comps: &[Component], z: ZCorrelation) -> Self {
        let find = |names: &[&str]| {
            comps
                .iter()
                .position(|c| names.contains(&c.name.to_ascii_lowercase().as_str()))
        };
        GravityModel {
            comps: comps.to_vec(),
            z,
            co2: find(&["carbon dioxide", "co2"]),
            h2s: find(&["hydrogen sulfide", "hydrogen sulphide", "h2s"]),
            n2: find(&["nitrogen", "n2"]),
        }
    }
}

impl TpModel for GravityModel {
    fn id(&self) -> &str {
        self.z.id()
    }

    fn components(&self) -> &[Component] {
        &self.comps
    }

    fn point(&self, t: f64, p: f64, x: &[f64], _root: RootChoice) -> Result<TpPoint> {
        let m: f64 = self
            .comps
            .iter()
            .zip(x)
            .map(|(c, xi)| xi * c.molar_mass)
            .sum();
        let spec = GasSpec {
            gravity: m / M_AIR,
            y_co2: self.co2.map_or(0.0, |i| x[i]),
            y_h2s: self.h2s.map_or(0.0, |i| x[i]),
            y_n2: self.n2.map_or(0.0, |i| x[i]),
            pseudo_critical: GravityCorrelation::Sutton,
            z: self.z,
        };
        let g = z_tp(&spec, t, p)?;
        Ok(TpPoint {
            z: g.z,
            h_dep: None,
            s_dep: None,
            ideal: None,
            warnings: g.warnings.iter().map(|w| w.to_string()).collect(),
            caloric: None,
        })
    }

    fn has_departures(&self) -> bool {
        false
    }
}
