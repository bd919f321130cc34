//! The fluid of a request: one component, or a mixture read from "name=fraction" pairs on a
//! mole or mass basis, in fractions or percent. Fractions that do not sum to one are refused
//! (the message gives the sum) unless the user asks for normalisation.

use crate::cli::Basis;
use crate::error::CliError;
use fluids::ComponentRecord;

/// How far the entered fractions may sum from one (or percentages from 100) and still be
/// taken as entered: rounding in the last of six printed digits.
const SUM_TOLERANCE: f64 = 1e-6;

/// A validated fluid: components, the composition as entered, and both bases.
#[derive(Debug, Clone)]
pub struct Feed {
    /// The components, in the order entered.
    pub records: Vec<&'static ComponentRecord>,
    /// The numbers as entered (fractions or percent, on `basis`).
    pub as_entered: Vec<f64>,
    /// Basis of `as_entered`.
    pub basis: Basis,
    /// True when `as_entered` is in percent.
    pub percent: bool,
    /// Sum of the entered values when they were normalised (None when taken as entered).
    pub normalized_from: Option<f64>,
    /// Mole fractions, summing to one.
    pub mole: Vec<f64>,
    /// Mass fractions, summing to one.
    pub mass: Vec<f64>,
    /// Interaction parameters the user set (`--kij`, `--kij-file`), over the built-in ones.
    pub kij: Vec<fluids::UserKij>,
    /// Set when the gas is known by its specific gravity (`--gravity`): the first record is
    /// then its hydrocarbon part ([`fluids::gravity_gas`]), and only Z and density can be had.
    pub gravity: Option<GravityGas>,
}

/// A natural gas given by its specific gravity and its non-hydrocarbons (mole fractions).
#[derive(Debug, Clone, PartialEq)]
pub struct GravityGas {
    /// The gravity as typed.
    pub typed: String,
    /// Gas gravity, M / M_air.
    pub gravity: f64,
    /// Nitrogen, carbon dioxide and hydrogen sulfide mole fractions.
    pub n2: f64,
    pub co2: f64,
    pub h2s: f64,
}

impl Feed {
    /// The model-ready components.
    pub fn components(&self) -> Vec<eos::Component> {
        self.records.iter().map(|r| r.to_component()).collect()
    }

    /// Component ids.
    pub fn ids(&self) -> Vec<&str> {
        self.records.iter().map(|r| r.id.as_str()).collect()
    }

    /// True for a single component.
    pub fn is_pure(&self) -> bool {
        self.records.len() == 1
    }

    /// Molar mass of the mixture, kg/mol.
    pub fn molar_mass(&self) -> f64 {
        self.records
            .iter()
            .zip(&self.mole)
            .map(|(r, x)| x * r.molar_mass_kg_mol)
            .sum()
    }

    /// False for a gas known by its gravity: it has no ideal-gas heat capacity, so only Z
    /// and density (and what follows from them) can be computed.
    pub fn energy_known(&self) -> bool {
        self.gravity.is_none()
    }

    /// The zero of enthalpy and entropy, in words: the same for every model of the feed.
    pub fn caloric_zero(&self) -> String {
        if !self.energy_known() {
            return "none: a gas known by its gravity has Z and density only".to_string();
        }
        const IDEAL: &str = "h = 0 and s = 0 for the ideal gas at 298.15 K and 101.325 kPa";
        const STEAM: &str = "the steam-table zero (u = 0 and s = 0 for saturated liquid water at \
                             the triple point, IAPWS-95)";
        let water = self.records.iter().any(|r| r.id == "water");
        match (self.is_pure(), water) {
            (true, true) => format!("{STEAM}, for every model"),
            (true, false) => format!("{IDEAL}, for every model"),
            (false, false) => format!("{IDEAL} of each pure component, for every model"),
            (false, true) => format!(
                "{IDEAL} of each pure component but water, which is on {STEAM}; for every model"
            ),
        }
    }

    /// A short label: the component name, or "mixture of N components".
    pub fn label(&self) -> String {
        if let Some(g) = &self.gravity {
            let inerts: Vec<String> = [("N2", g.n2), ("CO2", g.co2), ("H2S", g.h2s)]
                .iter()
                .filter(|(_, y)| *y > 0.0)
                .map(|(name, y)| format!("{name} {y:.4}"))
                .collect();
            return if inerts.is_empty() {
                format!("natural gas of gravity {}", g.typed)
            } else {
                format!(
                    "natural gas of gravity {} ({} mole fractions)",
                    g.typed,
                    inerts.join(", ")
                )
            };
        }
        if self.is_pure() {
            self.records[0].name.clone()
        } else {
            let parts: Vec<String> = self
                .records
                .iter()
                .zip(&self.mole)
                .map(|(r, x)| format!("{} {:.4}", r.id, x))
                .collect();
            format!("mixture ({} mole fractions)", parts.join(", "))
        }
    }
}

/// Parses "methane=0.9,ethane=0.1" (pairs separated by ',' or ';', '=' or ':' between name
/// and value; values in percent when every one ends with '%').
pub fn parse_mix(text: &str, basis: Basis, normalize: bool) -> Result<Feed, CliError> {
    let bad = |msg: String| CliError::BadInput(format!("--mix \"{text}\": {msg}"));
    let mut records: Vec<&'static ComponentRecord> = Vec::new();
    let mut values = Vec::new();
    let mut percents = 0;
    let pairs: Vec<&str> = text
        .split([',', ';'])
        .map(str::trim)
        .filter(|s| !s.is_empty())
        .collect();
    if pairs.is_empty() {
        return Err(bad(
            "no components given; write name=fraction pairs".to_string()
        ));
    }
    for pair in &pairs {
        let (name, value) = pair
            .split_once(['=', ':'])
            .ok_or_else(|| bad(format!("\"{pair}\" is not a name=fraction pair")))?;
        let rec = fluids::find(name.trim())?;
        if records.iter().any(|r| r.id == rec.id) {
            return Err(bad(format!("{} is listed twice", rec.name)));
        }
        let value = value.trim();
        let (num, is_pct) = match value.strip_suffix('%') {
            Some(n) => (n.trim(), true),
            None => (value, false),
        };
        percents += usize::from(is_pct);
        let v: f64 = num
            .parse()
            .map_err(|_| bad(format!("\"{value}\" (for {}) is not a number", rec.name)))?;
        if !v.is_finite() || v < 0.0 {
            return Err(bad(format!(
                "the fraction of {} is {value}; fractions must be finite and not negative",
                rec.name
            )));
        }
        if v == 0.0 {
            return Err(bad(format!(
                "the fraction of {} is zero; leave the component out instead",
                rec.name
            )));
        }
        records.push(rec);
        values.push(v);
    }
    if percents != 0 && percents != pairs.len() {
        return Err(bad(
            "some values end with % and some do not; use one form for all".to_string(),
        ));
    }
    from_amounts(
        records,
        values,
        Amounts {
            percent: percents > 0,
            basis,
            normalize,
            tolerance: SUM_TOLERANCE,
        },
    )
    .map_err(bad)
}

/// How a list of amounts is to be read.
#[derive(Debug, Clone, Copy)]
pub struct Amounts {
    /// True when the amounts are percentages.
    pub percent: bool,
    /// Mole or mass.
    pub basis: Basis,
    /// Scale a sum that misses one (or 100 %) by more than `tolerance` instead of refusing.
    pub normalize: bool,
    /// Relative miss of the sum that is scaled away without `normalize` (rounding).
    pub tolerance: f64,
}

/// The feed of `records` in the given `values` (positive; checked by the caller). A sum that
/// misses one (or 100 %) by more than the tolerance is refused with its sum unless
/// normalisation is asked for; `normalized_from` keeps the sum whenever it was not exactly
/// one. Errors are the message alone; the caller says where the amounts came from.
pub fn from_amounts(
    records: Vec<&'static ComponentRecord>,
    values: Vec<f64>,
    how: Amounts,
) -> Result<Feed, String> {
    let Amounts {
        percent,
        basis,
        normalize,
        tolerance,
    } = how;
    let full = if percent { 100.0 } else { 1.0 };
    let sum: f64 = values.iter().sum();
    let normalized_from = if (sum - full).abs() > tolerance * full {
        if !normalize {
            let hint = if !percent && (sum - 100.0).abs() < 1e-3 {
                " (they look like percentages: add % to each value)"
            } else {
                ""
            };
            return Err(format!(
                "the {} fractions sum to {sum}, not {full}{hint}; correct them, or pass \
                 --normalize to scale them",
                basis_name(basis)
            ));
        }
        Some(sum)
    } else if (sum - full).abs() > SUM_TOLERANCE * full {
        Some(sum)
    } else {
        None
    };
    let fractions: Vec<f64> = values.iter().map(|v| v / sum).collect();
    let m: Vec<f64> = records.iter().map(|r| r.molar_mass_kg_mol).collect();
    let (mole, mass) = match basis {
        Basis::Mole => {
            let mass = eos::composition::mole_to_mass(&fractions, &m);
            (fractions, mass)
        }
        Basis::Mass => {
            let mole = eos::composition::mass_to_mole(&fractions, &m);
            (mole, fractions)
        }
    };
    Ok(Feed {
        records,
        as_entered: values,
        basis,
        percent,
        normalized_from,
        mole,
        mass,
        kij: Vec::new(),
        gravity: None,
    })
}

/// "mole" or "mass".
pub fn basis_name(b: Basis) -> &'static str {
    match b {
        Basis::Mole => "mole",
        Basis::Mass => "mass",
    }
}
