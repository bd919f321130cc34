//! The formulations shipped with the crate, parsed once from the embedded data files, and the
//! lookup by fluid name.
//!
//! | key | fluid | equation |
//! |---|---|---|
//! | `water-iapws95` | water | IAPWS-95, IAPWS R6-95(2018) |
//! | `nitrogen-span2000` | nitrogen | Span et al. (2000) |
//! | `carbon-dioxide-span-wagner1996` | carbon dioxide | Span & Wagner (1996) |
//! | `methane-setzmann-wagner1991` | methane | Setzmann & Wagner (1991) |
//! | `argon-tegeler1999` | argon | Tegeler et al. (1999) |
//! | `hydrogen-normal-leachman2009` | normal hydrogen | Leachman et al. (2009) |
//! | `hydrogen-para-leachman2009` | parahydrogen | Leachman et al. (2009) |
//! | `nitrogen-sw2003`, `carbon-dioxide-sw2003`, `methane-sw2003`, `argon-sw2003` | | Span & Wagner (2003), 12 terms |

use std::sync::LazyLock;

use super::data::{parse, Meta};
use super::fluid::{HelmholtzFluid, STEAM_TABLE_KEY};
use super::formulation::{Formulation, Tier};
use crate::error::{Error, Result};

struct Entry {
    meta: Meta,
    text: &'static str,
    /// Names recognised for the fluid (normalised: lower case, '-' and '_' read as spaces).
    names: &'static [&'static str],
}

macro_rules! entry {
    ($key:literal, $fluid:literal, $title:literal, $tier:expr, $file:literal, $names:expr) => {
        Entry {
            meta: Meta {
                key: $key,
                fluid: $fluid,
                title: $title,
                tier: $tier,
            },
            text: include_str!(concat!("../../data/helmholtz/", $file)),
            names: $names,
        }
    };
}

const WATER: &[&str] = &["water", "steam", "h2o"];
const N2: &[&str] = &["nitrogen", "n2"];
const CO2: &[&str] = &["carbon dioxide", "co2"];
const CH4: &[&str] = &["methane", "ch4"];
const AR: &[&str] = &["argon", "ar"];
const H2: &[&str] = &["hydrogen", "h2", "normal hydrogen", "n h2", "nh2"];
const PH2: &[&str] = &["parahydrogen", "para hydrogen", "p h2", "ph2"];

static ENTRIES: [Entry; 11] = [
    entry!(
        "water-iapws95",
        "water",
        "IAPWS-95",
        Tier::Reference,
        "water_iapws95.csv",
        WATER
    ),
    entry!(
        "nitrogen-span2000",
        "nitrogen",
        "Span et al. (2000) nitrogen",
        Tier::Reference,
        "nitrogen_span2000.csv",
        N2
    ),
    entry!(
        "carbon-dioxide-span-wagner1996",
        "carbon dioxide",
        "Span & Wagner (1996) carbon dioxide",
        Tier::Reference,
        "carbon_dioxide_span_wagner1996.csv",
        CO2
    ),
    entry!(
        "methane-setzmann-wagner1991",
        "methane",
        "Setzmann & Wagner (1991) methane",
        Tier::Reference,
        "methane_setzmann_wagner1991.csv",
        CH4
    ),
    entry!(
        "argon-tegeler1999",
        "argon",
        "Tegeler et al. (1999) argon",
        Tier::Reference,
        "argon_tegeler1999.csv",
        AR
    ),
    entry!(
        "hydrogen-normal-leachman2009",
        "hydrogen",
        "Leachman et al. (2009) normal hydrogen",
        Tier::Reference,
        "hydrogen_normal_leachman2009.csv",
        H2
    ),
    entry!(
        "hydrogen-para-leachman2009",
        "parahydrogen",
        "Leachman et al. (2009) parahydrogen",
        Tier::Reference,
        "hydrogen_para_leachman2009.csv",
        PH2
    ),
    entry!(
        "nitrogen-sw2003",
        "nitrogen",
        "Span & Wagner (2003) nitrogen, 12 terms",
        Tier::Technical,
        "nitrogen_sw2003.csv",
        N2
    ),
    entry!(
        "carbon-dioxide-sw2003",
        "carbon dioxide",
        "Span & Wagner (2003) carbon dioxide, 12 terms",
        Tier::Technical,
        "carbon_dioxide_sw2003.csv",
        CO2
    ),
    entry!(
        "methane-sw2003",
        "methane",
        "Span & Wagner (2003) methane, 12 terms",
        Tier::Technical,
        "methane_sw2003.csv",
        CH4
    ),
    entry!(
        "argon-sw2003",
        "argon",
        "Span & Wagner (2003) argon, 12 terms",
        Tier::Technical,
        "argon_sw2003.csv",
        AR
    ),
];

static PARSED: LazyLock<Vec<Result<Formulation>>> =
    LazyLock::new(|| ENTRIES.iter().map(|e| parse(e.text, e.meta)).collect());

/// Keys of every shipped formulation.
pub fn keys() -> impl Iterator<Item = &'static str> {
    ENTRIES.iter().map(|e| e.meta.key)
}

/// The formulation with key `key`.
pub fn formulation(key: &str) -> Result<&'static Formulation> {
    let i = ENTRIES
        .iter()
        .position(|e| e.meta.key == key)
        .ok_or_else(|| Error::InvalidInput {
            what: "formulation key",
            value: key.to_string(),
            accepted: keys().collect::<Vec<_>>().join(", "),
        })?;
    PARSED[i].as_ref().map_err(Clone::clone)
}

fn normalise(name: &str) -> String {
    name.trim()
        .to_lowercase()
        .replace(['-', '_'], " ")
        .split_whitespace()
        .collect::<Vec<_>>()
        .join(" ")
}

fn find(name: &str, tier: Tier) -> Option<HelmholtzFluid> {
    find_formulation(name, tier).map(HelmholtzFluid::new)
}

fn find_formulation(name: &str, tier: Tier) -> Option<&'static Formulation> {
    let n = normalise(name);
    ENTRIES
        .iter()
        .zip(PARSED.iter())
        .find(|(e, _)| e.meta.tier == tier && (e.names.contains(&n.as_str()) || e.meta.key == name))
        .and_then(|(_, f)| f.as_ref().ok())
}

/// The reference formulation's constants (triple point, range, ...) of a fluid by name,
/// formula or key, without building the fluid (no density solves).
pub fn reference_formulation(component_name_or_id: &str) -> Option<&'static Formulation> {
    find_formulation(component_name_or_id, Tier::Reference)
}

/// The reference formulation of a fluid by name, formula or key: water/steam/h2o,
/// nitrogen/n2, carbon dioxide/co2, methane/ch4, argon/ar, hydrogen/h2 (normal hydrogen),
/// parahydrogen.
pub fn reference_for(component_name_or_id: &str) -> Option<HelmholtzFluid> {
    find(component_name_or_id, Tier::Reference)
}

/// The Span & Wagner (2003) 12-term technical equation of a fluid (nitrogen, carbon dioxide,
/// methane, argon).
pub fn technical_for(component_name_or_id: &str) -> Option<HelmholtzFluid> {
    find(component_name_or_id, Tier::Technical)
}

/// h0/R (K) and s0/R of water's ideal gas at T_REF and P_REF on the steam-table zero (IAPWS
/// R6-95(2018): u = 0 and s = 0 for the saturated liquid at the triple point), from the
/// ideal part of IAPWS-95: the zero every model of water carries.
pub fn steam_table_zero() -> Result<(f64, f64)> {
    Ok(HelmholtzFluid::new(formulation(STEAM_TABLE_KEY)?).zero())
}
