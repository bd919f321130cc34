//! Names of phases, as reported with every state.

/// The phase of a state.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Phase {
    /// Below the critical temperature, on the vapour side (superheated vapour).
    Vapor,
    /// Below the critical temperature, on the liquid side (compressed liquid).
    Liquid,
    /// Above the critical temperature but below the critical pressure.
    Gas,
    /// Above both the critical temperature and the critical pressure.
    Supercritical,
    /// Liquid on the saturation line.
    SaturatedLiquid,
    /// Vapour on the saturation line.
    SaturatedVapor,
    /// Liquid and vapour together in equilibrium.
    TwoPhase,
    /// The stable phase is a solid (below the triple point above the sublimation pressure, or
    /// above the melting pressure, [`crate::solid`]); no model here describes it.
    Solid,
}

impl Phase {
    /// The name used in every output format.
    pub fn as_str(self) -> &'static str {
        match self {
            Phase::Vapor => "vapor",
            Phase::Liquid => "liquid",
            Phase::Gas => "gas",
            Phase::Supercritical => "supercritical",
            Phase::SaturatedLiquid => "saturated-liquid",
            Phase::SaturatedVapor => "saturated-vapor",
            Phase::TwoPhase => "two-phase",
            Phase::Solid => "solid",
        }
    }
}

impl std::fmt::Display for Phase {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(self.as_str())
    }
}
