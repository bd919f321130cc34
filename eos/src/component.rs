//! One component as the models see it: critical constants, acentric factor, molar mass and
//! the ideal-gas heat capacity. SI units throughout.

use crate::ideal_cp::IdealGasCp;

/// Pure-component constants a model needs. Data and their sources live in the `fluids` crate;
/// this is the model-ready, unit-checked form.
#[derive(Debug, Clone, PartialEq)]
pub struct Component {
    /// Display name.
    pub name: String,
    /// Molar mass in kg/mol.
    pub molar_mass: f64,
    /// Critical temperature in K.
    pub tc: f64,
    /// Critical pressure in Pa.
    pub pc: f64,
    /// Pitzer's acentric factor.
    pub omega: f64,
    /// Critical molar volume in m3/mol, where known.
    pub vc: Option<f64>,
    /// Ideal-gas isobaric heat capacity.
    pub cp: IdealGasCp,
}

impl Component {
    /// A component with a placeholder heat capacity of 3.5 R (a diatomic ideal gas); call
    /// [`Component::with_cp`] for caloric properties that mean something.
    pub fn new(name: &str, molar_mass: f64, tc: f64, pc: f64, omega: f64) -> Self {
        Component {
            name: name.to_string(),
            molar_mass,
            tc,
            pc,
            omega,
            vc: None,
            cp: IdealGasCp::constant(3.5),
        }
    }

    /// Sets the ideal-gas heat capacity.
    pub fn with_cp(mut self, cp: IdealGasCp) -> Self {
        self.cp = cp;
        self
    }

    /// Sets the critical molar volume (m3/mol).
    pub fn with_vc(mut self, vc: f64) -> Self {
        self.vc = Some(vc);
        self
    }
}
