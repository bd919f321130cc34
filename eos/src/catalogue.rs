//! The model catalogue: for every model id, what it is, where it comes from, where it holds
//! and what it is good and poor at, as data.
//!
//! Claims are either cited or marked "common practice" (a fact of the trade, stated in the
//! usual textbooks, e.g. Poling, Prausnitz & O'Connell, *The Properties of Gases and Liquids*,
//! 5th ed., 2001, ch. 4-6). Numeric ranges are those the code enforces, where it enforces one.

/// Numeric validity range; `None` where a bound is not defined.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Range {
    /// Lowest temperature, K (or reduced, see `reduced`).
    pub t_min: Option<f64>,
    /// Highest temperature, K (or reduced).
    pub t_max: Option<f64>,
    /// Highest pressure, Pa (or reduced).
    pub p_max: Option<f64>,
    /// True when the bounds are reduced (T/Tc, P/Pc) rather than absolute.
    pub reduced: bool,
}

/// One catalogue entry.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ModelInfo {
    /// Model id as used everywhere.
    pub id: &'static str,
    /// Display name.
    pub name: &'static str,
    /// The paper or standard.
    pub citation: &'static str,
    /// Validity in words.
    pub validity: &'static str,
    /// Validity in numbers.
    pub range: Range,
    /// Typical relative uncertainty of its gas densities inside its range (a fraction): what
    /// its own error can make of a correct value, so that an audit names no cause within
    /// it. Zero for the ideal gas, whose error is the quantity measured.
    pub density_uncertainty: f64,
    /// What the model does well.
    pub good_at: &'static [&'static str],
    /// Where it should not be trusted.
    pub poor_at: &'static [&'static str],
}

const NONE: Range = Range {
    t_min: None,
    t_max: None,
    p_max: None,
    reduced: false,
};

const CUBIC_POOR: &[&str] = &[
    "liquid densities without volume translation: errors of several percent to over 10 % \
     (common practice; e.g. PR 1976 saturated liquids at Tb are 5-14 % too dense for C1-C4, \
     N2 and Ar, measured in this crate's Peneloux tests)",
    "hydrogen and helium (quantum gases): the acentric-factor alpha functions were not fitted \
     to them (common practice)",
    "strongly polar or associating fluids (water, alcohols, ammonia) with plain k_ij = 0 mixing \
     (common practice)",
    "near the critical point: a classical equation gives the wrong critical exponents and \
     over-predicts Zc (common practice)",
];

/// Every model.
pub const ALL: &[ModelInfo] = &[
    ModelInfo {
        id: "ideal",
        name: "Ideal gas",
        citation: "P v = R T (the ideal-gas law)",
        validity: "the low-pressure limit of every gas; error grows about linearly with P",
        range: NONE,
        // no bound: its error, Z - 1, is what the tool measures.
        density_uncertainty: 0.0,
        good_at: &[
            "dilute gases: Z - 1 is about B P/(RT), below 1e-3 for light gases near 1 atm \
                    (ISO 6976 compression factors)",
        ],
        poor_at: &[
            "any dense state; heavier gases even at 1 atm (propane Z = 0.982 at 15 C, ISO \
                    6976)",
        ],
    },
    ModelInfo {
        id: "vdw",
        name: "van der Waals",
        citation: "J. D. van der Waals, thesis, Leiden (1873)",
        validity: "qualitative everywhere; Zc = 3/8",
        range: NONE,
        // qualitative only (common practice).
        density_uncertainty: 0.10,
        good_at: &["teaching and qualitative phase behaviour (common practice)"],
        poor_at: &[
            "quantitative work of any kind: Zc = 0.375 against 0.23-0.29 for real fluids \
                    (common practice)",
        ],
    },
    ModelInfo {
        id: "rk",
        name: "Redlich-Kwong",
        citation: "O. Redlich, J. N. S. Kwong, Chem. Rev. 44 (1949) 233-244",
        validity: "gases at Tr above about 1; no acentric factor",
        range: NONE,
        // common practice.
        density_uncertainty: 0.05,
        good_at: &["gas-phase Z of simple fluids above the critical temperature (common practice)"],
        poor_at: &[
            "vapour pressures and liquids, which need the acentric factor (common practice)",
        ],
    },
    ModelInfo {
        id: "srk",
        name: "Soave-Redlich-Kwong",
        citation: "G. Soave, Chem. Eng. Sci. 27 (1972) 1197-1203",
        validity: "hydrocarbons and light gases, vapour and liquid; alpha fitted to vapour \
                   pressures down to Tr = 0.7",
        range: NONE,
        // gas densities away from the critical region, typically 1-3 % (common practice).
        density_uncertainty: 0.02,
        good_at: &[
            "vapour pressures of non-polar fluids: exact at Tr = 0.7 by construction (Soave 1972)",
            "gas-phase Z at low and moderate pressure (ISO 6976 values met to 2.5e-4 at 1 atm for \
             CH4, C2H6, N2, O2, CO2, shared reference checks)",
        ],
        poor_at: CUBIC_POOR,
    },
    ModelInfo {
        id: "pr",
        name: "Peng-Robinson (1976)",
        citation: "D.-Y. Peng, D. B. Robinson, Ind. Eng. Chem. Fundam. 15 (1976) 59-64",
        validity: "hydrocarbons and light gases, vapour and liquid; kappa(omega) fitted to \
                   omega <= 0.5",
        range: NONE,
        // gas densities away from the critical region, typically 1-3 % (common practice).
        density_uncertainty: 0.02,
        good_at: &[
            "vapour-liquid equilibria of natural-gas and refinery mixtures with k_ij (common \
             practice)",
            "liquid densities nearer the critical volume than SRK's (Zc = 0.307 against 1/3, \
             derived from the equation), though light liquids at Tb come out 5-14 % too dense \
             (this crate's Peneloux tests)",
        ],
        poor_at: CUBIC_POOR,
    },
    ModelInfo {
        id: "pr78",
        name: "Peng-Robinson (1978)",
        citation: "D. B. Robinson, D.-Y. Peng, GPA Research Report RR-28 (1978)",
        validity: "as PR 1976, with kappa revised for omega > 0.491 (heavy fractions)",
        range: NONE,
        // as PR 1976 for gases (common practice).
        density_uncertainty: 0.02,
        good_at: &["heavy hydrocarbon fractions (omega > 0.49) (Robinson & Peng 1978)"],
        poor_at: CUBIC_POOR,
    },
    ModelInfo {
        id: "srk-pen",
        name: "SRK with Peneloux volume translation",
        citation: "A. Peneloux, E. Rauzy, R. Freze, Fluid Phase Equilib. 8 (1982) 7-23",
        validity: "as SRK; the translation changes volumes only",
        range: NONE,
        // the translation changes gas densities little (common practice).
        density_uncertainty: 0.02,
        good_at: &[
            "saturated liquid densities: within 3 % at Tb for C1-C4, N2, Ar (this crate's tests \
             against handbook values)",
            "phase equilibria identical to SRK (Peneloux et al. 1982)",
        ],
        poor_at: &[
            "simple fluids (omega near 0), where SRK liquids are already close and the shift \
             overshoots by 1-3 % (this crate's tests)",
            "near-critical liquid densities: a constant shift cannot fix the critical volume \
             (common practice)",
        ],
    },
    ModelInfo {
        id: "pr-pen",
        name: "PR 1976 with Peneloux-type volume translation",
        citation: "Peneloux et al. (1982) applied to PR with c = 0.50033 (0.25969 - Z_RA) R Tc/Pc",
        validity: "as PR 1976; the translation changes volumes only",
        range: NONE,
        // the translation changes gas densities little (common practice).
        density_uncertainty: 0.02,
        good_at: &[
            "saturated liquid densities: within 2.5 % at Tb for C1-C4, N2, Ar, against \
                    5-14 % untranslated (this crate's tests)",
        ],
        poor_at: &["near-critical liquid densities (common practice)"],
    },
    ModelInfo {
        id: "pr78-pen",
        name: "PR 1978 with Peneloux-type volume translation",
        citation: "Peneloux et al. (1982) applied to PR 1978, shift as for pr-pen",
        validity: "as PR 1978; the translation changes volumes only",
        range: NONE,
        // the translation changes gas densities little (common practice).
        density_uncertainty: 0.02,
        good_at: &["liquid densities of heavier hydrocarbons (common practice)"],
        poor_at: &["near-critical liquid densities (common practice)"],
    },
    ModelInfo {
        id: "reference",
        name: "Reference multiparameter equations of state",
        citation: "IAPWS R6-95(2018) (IAPWS-95) water; Setzmann & Wagner (1991) methane; \
                   Span & Wagner (1996) CO2; Span et al. (2000) N2; Tegeler, Span & Wagner (1999) argon; Leachman et al. (2009) \
                   hydrogen",
        validity: "each fluid's published range (e.g. CO2 from the triple point to 1100 K and \
                   800 MPa, Span & Wagner 1996)",
        range: NONE,
        // the cited papers state 0.02-0.1 % in gas density over most of their range.
        density_uncertainty: 0.001,
        good_at: &[
            "the most accurate properties available for their fluid, including near the \
                    critical point (the cited papers)",
        ],
        poor_at: &["mixtures (pure fluids only); cost per state (dozens of terms)"],
    },
    ModelInfo {
        id: "sw12",
        name: "Span-Wagner short technical equations (12 terms)",
        citation: "R. Span, W. Wagner, Int. J. Thermophys. 24 (2003) 1-39, 41-109",
        validity: "technical accuracy over wide ranges for non-polar and polar fluids",
        range: NONE,
        // Span & Wagner (2003) state about 0.2-0.5 % in gas density.
        density_uncertainty: 0.005,
        good_at: &[
            "technical accuracy over the fluid surface at a fraction of the reference \
                    equations' cost (Span & Wagner 2003)",
        ],
        poor_at: &["the immediate critical region (Span & Wagner 2003)"],
    },
    ModelInfo {
        id: "lk",
        name: "Lee-Kesler",
        citation: "B. I. Lee, M. G. Kesler, AIChE J. 21 (1975) 510-527; mixtures: Plocker, Knapp, \
                   Prausnitz, Ind. Eng. Chem. Process Des. Dev. 17 (1978) 324",
        validity: "0.3 <= Tr <= 4, Pr <= 10 (the Lee-Kesler tables)",
        range: Range {
            t_min: Some(0.3),
            t_max: Some(4.0),
            p_max: Some(10.0),
            reduced: true,
        },
        // about 1-2 % in Z for non-polar gases (common practice).
        density_uncertainty: 0.02,
        good_at: &[
            "enthalpy and entropy departures of non-polar fluids and hydrocarbon mixtures \
                    (Lee & Kesler 1975)",
        ],
        poor_at: &[
            "polar and quantum fluids (common practice)",
            "phase equilibrium: the two-fluid interpolation is at fixed (Tr, Pr), not a single \
             Helmholtz function",
        ],
    },
    ModelInfo {
        id: "virial",
        name: "Truncated virial equation",
        citation: "B from Tsonopoulos, AIChE J. 20 (1974) 263 or Pitzer & Curl, J. Am. Chem. Soc. \
                   79 (1957) 2369",
        validity: "rho <= rho_c/2 (V/Vc >= 2, roughly Pr <= Tr/2) (common practice)",
        range: NONE,
        // within its range, half the critical density (common practice).
        density_uncertainty: 0.01,
        good_at: &[
            "gases at low pressure: ISO 6976 Z at 1 atm met to 1e-4 for CH4, C2H6, N2, O2, \
                    CO2 with Z = 1 + BP/RT (this crate's tests)",
        ],
        poor_at: &["dense gases and any liquid (common practice)"],
    },
    ModelInfo {
        id: "if97",
        name: "IAPWS-IF97",
        citation: "IAPWS R7-97(2012), Revised Release on the IAPWS Industrial Formulation 1997",
        validity: "water and steam, 273.15-1073.15 K up to 100 MPa and 1073.15-2273.15 K up to \
                   50 MPa",
        range: Range {
            t_min: Some(273.15),
            t_max: Some(2273.15),
            p_max: Some(100e6),
            reduced: false,
        },
        // 0.057 % from IAPWS-95 away from the critical point, measured.
        density_uncertainty: 0.001,
        good_at: &[
            "water and steam for industrial calculation, fast and consistent with \
                    IAPWS-95 within the release's tolerances (IAPWS R7-97)",
            "density within 0.057 % of IAPWS-95 away from the critical point, enthalpy \
                    within 3.9 kJ/kg (measured over its range in eos/tests/if97_vs_iapws95.rs)",
        ],
        poor_at: &[
            "anything but pure water; the immediate critical point (region 3 is less \
                    accurate there, IAPWS R7-97; up to 0.86 % in density from IAPWS-95 within \
                    5 % of Tc, measured)",
        ],
    },
    ModelInfo {
        id: "dak",
        name: "Dranchuk-Abou-Kassem",
        citation: "P. M. Dranchuk, J. H. Abou-Kassem, J. Can. Pet. Technol. 14 (1975) 34",
        validity: "1.0 <= Tpr <= 3.0, 0.2 <= Ppr <= 30 (and 0.7 <= Tpr < 1 for Ppr < 1)",
        range: Range {
            t_min: Some(1.0),
            t_max: Some(3.0),
            p_max: Some(30.0),
            reduced: true,
        },
        // fits of the Standing-Katz chart, about 1 % (common practice).
        density_uncertainty: 0.01,
        good_at: &[
            "sweet natural gas Z from gravity alone (fit of the Standing-Katz chart, \
                    Dranchuk & Abou-Kassem 1975)",
        ],
        poor_at: &[
            "Tpr near 1 at Ppr above 1 (common practice)",
            "gases rich in non-hydrocarbons without the Wichert-Aziz correction (Wichert & Aziz \
             1972)",
        ],
    },
    ModelInfo {
        id: "hy",
        name: "Hall-Yarborough",
        citation: "K. R. Hall, L. Yarborough, Oil Gas J. 71 (1973) 82",
        validity: "1.2 <= Tpr <= 3.0, 0.1 <= Ppr <= 24 (from memory of secondary sources)",
        range: Range {
            t_min: Some(1.2),
            t_max: Some(3.0),
            p_max: Some(24.0),
            reduced: true,
        },
        // fits of the Standing-Katz chart, about 1 % (common practice).
        density_uncertainty: 0.01,
        good_at: &["sweet natural gas Z from gravity alone (fit of the Standing-Katz chart)"],
        poor_at: &["Tpr below 1 (Hall & Yarborough 1973)"],
    },
];

/// The entry of a model id.
pub fn find(id: &str) -> Option<&'static ModelInfo> {
    ALL.iter().find(|m| m.id == id)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::cubic::CubicKind;

    #[test]
    fn ids_are_unique_and_cover_every_model_in_the_crate() {
        for (i, a) in ALL.iter().enumerate() {
            assert!(
                ALL[i + 1..].iter().all(|b| b.id != a.id),
                "duplicate {}",
                a.id
            );
            assert!(!a.citation.is_empty() && !a.good_at.is_empty() && !a.poor_at.is_empty());
            let r = a.range;
            if let (Some(lo), Some(hi)) = (r.t_min, r.t_max) {
                assert!(lo < hi, "{}", a.id);
            }
        }
        let mut ids: Vec<&str> = CubicKind::ALL.iter().map(|k| k.spec().id).collect();
        ids.extend([
            "ideal",
            "srk-pen",
            "pr-pen",
            "pr78-pen",
            crate::lee_kesler::ID,
            crate::virial::ID,
            crate::if97::ID,
            crate::gas_gravity::dak::ID,
            crate::gas_gravity::hall_yarborough::ID,
        ]);
        for id in ids {
            assert!(find(id).is_some(), "{id} missing from the catalogue");
        }
    }

    #[test]
    fn enforced_ranges_match_the_code() {
        let lk = find("lk").unwrap().range;
        assert_eq!(
            (lk.t_min, lk.t_max, lk.p_max),
            (
                Some(crate::lee_kesler::TR_MIN),
                Some(crate::lee_kesler::TR_MAX),
                Some(crate::lee_kesler::PR_MAX)
            )
        );
        let w = find("if97").unwrap().range;
        assert_eq!(w.t_max, Some(crate::if97::state::T_MAX_HIGH));
        assert_eq!(w.p_max, Some(crate::if97::state::P_MAX_LOW));
    }
}
