//! Nitrogen, carbon dioxide and hydrogen sulfide in a gas known by its gravity.
//!
//! The gravity correlations were fitted to hydrocarbon gases. When the analysis gives the
//! non-hydrocarbons, the hydrocarbon part is taken on its own: its gravity follows from the
//! gas's by removing the non-hydrocarbons' share of the molar mass,
//!
//! gamma_HC = (gamma - sum y_i M_i / M_air) / (1 - sum y_i),
//!
//! its pseudo-critical point comes from the gravity correlation, and the gas's point is the
//! mole-fraction average of it and the non-hydrocarbons' critical points (Kay's rule: W. B. Kay,
//! Ind. Eng. Chem. 28 (1936) 1014-1019, from memory). The Wichert-Aziz correction for CO2 and
//! H2S is applied afterwards. This is common practice for sour and nitrogen-rich gases; without
//! non-hydrocarbons it is the gravity correlation itself.
//!
//! Critical constants and molar masses: `shared/reference/gases/components.csv` (Poling,
//! Prausnitz and O'Connell, *The Properties of Gases and Liquids*, 5th ed., Appendix A, from
//! memory; molar masses from the formulas with IUPAC 2007 atomic weights).

use super::pseudo_critical::{pseudo_critical, GravityCorrelation, PseudoCriticalPoint};
use super::warning::RangeWarning;
use crate::error::{Error, Result};

/// Molar mass of dry air, kg/mol: 28.9647 g/mol (from memory of the CRC Handbook of Chemistry
/// and Physics; the value customarily used for gas gravity).
pub const M_AIR: f64 = 0.028_964_7;

/// A non-hydrocarbon: molar mass (kg/mol), critical temperature (K), critical pressure (Pa).
#[derive(Debug, Clone, Copy)]
struct Inert {
    molar_mass: f64,
    tc: f64,
    pc: f64,
}

const NITROGEN: Inert = Inert {
    molar_mass: 0.028_013_4,
    tc: 126.2,
    pc: 33.98e5,
};
const CARBON_DIOXIDE: Inert = Inert {
    molar_mass: 0.044_009_5,
    tc: 304.12,
    pc: 73.74e5,
};
const HYDROGEN_SULFIDE: Inert = Inert {
    molar_mass: 0.034_080_88,
    tc: 373.4,
    pc: 89.63e5,
};

/// Mole fractions of the non-hydrocarbons in the gas.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct InertFractions {
    pub n2: f64,
    pub co2: f64,
    pub h2s: f64,
}

impl InertFractions {
    fn each(&self) -> [(&'static str, f64, Inert); 3] {
        [
            ("N2 mole fraction", self.n2, NITROGEN),
            ("CO2 mole fraction", self.co2, CARBON_DIOXIDE),
            ("H2S mole fraction", self.h2s, HYDROGEN_SULFIDE),
        ]
    }
}

/// The gravity of the hydrocarbon part of a gas of gravity `gamma` with these fractions.
pub fn hydrocarbon_gravity(gamma: f64, y: &InertFractions) -> Result<f64> {
    let mut share = 0.0;
    let mut sum = 0.0;
    for (what, yi, inert) in y.each() {
        if !(yi.is_finite() && (0.0..=1.0).contains(&yi)) {
            return Err(Error::invalid(what, yi, "a mole fraction from 0 to 1"));
        }
        share += yi * inert.molar_mass / M_AIR;
        sum += yi;
    }
    if sum >= 1.0 {
        return Err(Error::invalid(
            "N2 + CO2 + H2S mole fraction",
            sum,
            "less than 1 (the gravity correlations need a hydrocarbon part)",
        ));
    }
    Ok((gamma - share) / (1.0 - sum))
}

/// The pseudo-critical point of the gas before the Wichert-Aziz correction.
pub fn pseudo_critical_with_inerts(
    gamma: f64,
    y: &InertFractions,
    correlation: GravityCorrelation,
    warnings: &mut Vec<RangeWarning>,
) -> Result<PseudoCriticalPoint> {
    let g_hc = hydrocarbon_gravity(gamma, y)?;
    let hc = pseudo_critical(g_hc, correlation, warnings).map_err(|_| {
        Error::invalid(
            "gas gravity",
            gamma,
            format!(
                "a gravity that leaves the hydrocarbon part at least methane's (with these \
                 N2, CO2 and H2S fractions the hydrocarbon part would have gravity {g_hc:.4})"
            ),
        )
    })?;
    let mut tpc = 0.0;
    let mut ppc = 0.0;
    let mut hc_share = 1.0;
    for (_, yi, inert) in y.each() {
        tpc += yi * inert.tc;
        ppc += yi * inert.pc;
        hc_share -= yi;
    }
    Ok(PseudoCriticalPoint {
        tpc: hc_share * hc.tpc + tpc,
        ppc: hc_share * hc.ppc + ppc,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn without_inerts_it_is_the_gravity_correlation() {
        let y = InertFractions::default();
        let mut w = Vec::new();
        let a = pseudo_critical_with_inerts(0.7, &y, GravityCorrelation::Sutton, &mut w).unwrap();
        let b = pseudo_critical(0.7, GravityCorrelation::Sutton, &mut w).unwrap();
        assert_eq!(a, b);
    }

    #[test]
    fn nitrogen_alone_is_its_own_critical_point_in_the_limit() {
        // A gas of 99.9 % nitrogen with a methane remainder: gravity from the molar masses
        // (methane 16.043 g/mol); the mixture's point is all but nitrogen's.
        let y = InertFractions {
            n2: 0.999,
            ..Default::default()
        };
        let gamma = (0.999 * 28.0134 + 0.001 * 16.043) / 28.9647;
        let g_hc = hydrocarbon_gravity(gamma, &y).unwrap();
        assert!((g_hc - 16.043 / 28.9647).abs() < 1e-9, "{g_hc}");
        let mut w = Vec::new();
        let p = pseudo_critical_with_inerts(gamma, &y, GravityCorrelation::Sutton, &mut w).unwrap();
        assert!((p.tpc - 126.2).abs() < 0.2, "{}", p.tpc);
    }

    #[test]
    fn a_gravity_too_low_for_the_inerts_is_refused() {
        let y = InertFractions {
            co2: 0.5,
            ..Default::default()
        };
        let mut w = Vec::new();
        let e = pseudo_critical_with_inerts(0.6, &y, GravityCorrelation::Sutton, &mut w);
        assert!(e.is_err());
        let all = InertFractions {
            n2: 0.5,
            co2: 0.3,
            h2s: 0.2,
        };
        assert!(hydrocarbon_gravity(1.0, &all).is_err());
    }
}
