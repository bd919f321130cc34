//! What a request needs of a state: a model computes that much and no more, and says so in
//! [`crate::properties::Properties::computed`].

/// The parts of a [`crate::properties::Properties`] a request needs.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord)]
pub enum Need {
    /// T, P, molar density, Z, molar mass and (where the model has it at no extra cost)
    /// (dP/drho)_T: what Z, density and volume need.
    Volumetric,
    /// Every property: energies, heat capacities, speed of sound, fugacity coefficients.
    All,
}
