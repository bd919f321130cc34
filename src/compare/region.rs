//! Regions of the T-P plane used to split comparison statistics.
//!
//! - `near-critical`: 0.95 <= T/Tc <= 1.05 and 0.8 <= P/Pc <= 1.2 with (Tc, Pc) the
//!   (pseudo-)critical point of the fluid (Kay's rule for mixtures). This window is a
//!   convention of this tool, not a published definition; it is where the density of every
//!   fluid changes fastest with T and P and where the cubic models, with their fixed critical
//!   compressibility factor, err most (common practice).
//! - `two-phase`: the models that computed the point do not agree on the side of the
//!   saturation line (one gives a liquid-like root, another a vapour-like one), or the
//!   reference data say so. Such a point is excluded from the statistics and counted: a liquid
//!   density compared with a vapour density says nothing about either model.
//! - otherwise the phase name of the state decides: `liquid`; `supercritical` (T >= Tc and
//!   P >= Pc); `gas` (vapour below Tc, or gas above Tc below Pc).

use eos::phase::Phase;
use serde::Serialize;

/// Half-width of the near-critical window in reduced temperature.
pub const NEAR_CRITICAL_TR: f64 = 0.05;
/// Half-width of the near-critical window in reduced pressure.
pub const NEAR_CRITICAL_PR: f64 = 0.2;

/// A region of the comparison.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Region {
    /// Vapour or gas.
    Gas,
    /// Liquid.
    Liquid,
    /// Above the critical temperature and pressure.
    Supercritical,
    /// Close to the critical point.
    NearCritical,
    /// The models disagree on the phase, or the reference says two-phase: excluded.
    TwoPhase,
}

impl Region {
    /// Every region, in report order.
    pub const ALL: [Region; 5] = [
        Region::Gas,
        Region::Liquid,
        Region::Supercritical,
        Region::NearCritical,
        Region::TwoPhase,
    ];

    /// The name used in every output.
    pub fn as_str(self) -> &'static str {
        match self {
            Region::Gas => "gas",
            Region::Liquid => "liquid",
            Region::Supercritical => "supercritical",
            Region::NearCritical => "near-critical",
            Region::TwoPhase => "two-phase",
        }
    }

    /// True for points that enter the statistics.
    pub fn is_used(self) -> bool {
        self != Region::TwoPhase
    }
}

impl std::fmt::Display for Region {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(self.as_str())
    }
}

/// True when (T, P) lies in the near-critical window of critical point (tc, pc).
pub fn is_near_critical(t: f64, p: f64, tc: f64, pc: f64) -> bool {
    let tr = t / tc;
    let pr = p / pc;
    (tr - 1.0).abs() <= NEAR_CRITICAL_TR && (pr - 1.0).abs() <= NEAR_CRITICAL_PR
}

/// Which side of the saturation line a phase name is on: Some(true) liquid-like,
/// Some(false) vapour-like, None above the critical temperature.
pub fn liquid_side(phase: Phase) -> Option<bool> {
    match phase {
        Phase::Liquid | Phase::SaturatedLiquid | Phase::Solid => Some(true),
        Phase::Vapor | Phase::SaturatedVapor => Some(false),
        Phase::Gas | Phase::Supercritical | Phase::TwoPhase => None,
    }
}

/// The region of a point: `phase` is the phase named by the phase-naming model, `phases`
/// those of every real-gas model that computed the point (the ideal gas has no liquid and
/// is left out by the caller), (tc, pc) the pseudo-critical point.
pub fn classify(t: f64, p: f64, tc: f64, pc: f64, phase: Phase, phases: &[Phase]) -> Region {
    let sides: Vec<bool> = phases.iter().filter_map(|&ph| liquid_side(ph)).collect();
    let disagree = sides.iter().any(|&s| s) && sides.iter().any(|&s| !s);
    if disagree || phase == Phase::TwoPhase {
        return Region::TwoPhase;
    }
    if is_near_critical(t, p, tc, pc) {
        return Region::NearCritical;
    }
    match phase {
        Phase::Liquid | Phase::SaturatedLiquid => Region::Liquid,
        Phase::Supercritical => Region::Supercritical,
        _ => Region::Gas,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn regions_follow_the_stated_rules() {
        // Methane-like critical point (190.56 K, 45.99 bar, from memory of Poling et al. 2001).
        let (tc, pc) = (190.56, 45.99e5);
        let c = |t, p, ph, all: &[Phase]| classify(t, p, tc, pc, ph, all);
        assert_eq!(c(300.0, 1e5, Phase::Gas, &[Phase::Gas]), Region::Gas);
        assert_eq!(
            c(300.0, 100e5, Phase::Supercritical, &[]),
            Region::Supercritical
        );
        assert_eq!(c(120.0, 10e5, Phase::Liquid, &[]), Region::Liquid);
        assert_eq!(
            c(190.0, 46e5, Phase::Vapor, &[Phase::Vapor]),
            Region::NearCritical
        );
        // Just outside the window in pressure.
        assert_eq!(c(190.0, 56e5, Phase::Liquid, &[]), Region::Liquid);
        assert_eq!(
            c(150.0, 10e5, Phase::Vapor, &[Phase::Vapor, Phase::Liquid]),
            Region::TwoPhase
        );
        assert!(!Region::TwoPhase.is_used());
        assert!(Region::NearCritical.is_used());
    }
}
