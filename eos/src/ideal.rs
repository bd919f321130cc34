//! The ideal gas, P v = R T, as a model with zero residual Helmholtz energy. It is the
//! baseline every other model's answer is compared with.

use crate::component::Component;
use crate::constants::R;
use crate::model::{DensityRoots, Model};
use crate::residual::Residual;

/// The ideal-gas model for given components.
#[derive(Debug, Clone)]
pub struct IdealGas {
    comps: Vec<Component>,
}

impl IdealGas {
    /// The ideal gas of these components (their heat capacities give the caloric properties).
    pub fn new(comps: &[Component]) -> Self {
        IdealGas {
            comps: comps.to_vec(),
        }
    }
}

impl Model for IdealGas {
    fn id(&self) -> &str {
        "ideal"
    }

    fn components(&self) -> &[Component] {
        &self.comps
    }

    fn residual(&self, _t: f64, _rho: f64, _x: &[f64]) -> Residual {
        Residual::default()
    }

    fn ln_phi(&self, _t: f64, _rho: f64, _x: &[f64], out: &mut [f64]) {
        out.fill(0.0);
    }

    fn densities(&self, t: f64, p: f64, _x: &[f64]) -> DensityRoots {
        DensityRoots::from_slice(&[p / (R * t)])
    }

    fn max_density(&self, _x: &[f64]) -> f64 {
        f64::INFINITY
    }
}
