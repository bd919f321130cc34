//! Recomputing one spreadsheet row and testing the usual causes of a wrong number.
//!
//! A row states a feed, T, P and a value the sheet computed. The value is recomputed from the
//! model's Z at (T, P) (the root of lowest Gibbs energy, as a single-phase sheet formula would
//! take it):
//!
//! ```text
//! density = P M / (Z R T)          z = Z
//! mass    = V P M / (Z R T)        volume = m Z R T / (P M)
//! std_volume = V [P / (Z T)] / [P_b / (Z_b T_b)]   (gas in V at (T, P), stated at base b)
//! ```
//!
//! For a row off by more than the tolerance, each cause is tested by recomputing the value as
//! the sheet would have with the mistake; a cause reconciles the row when that value matches
//! the sheet's within the tolerance:
//!
//! - gauge read as absolute: P - P_ambient used as P (and the reverse, absolute read as
//!   gauge: P + P_ambient);
//! - degC read as K: T - 273.15 used as T (and K read as degC: T + 273.15);
//! - a different base temperature: each other named base of
//!   [`crate::jobs::base_conditions::NAMED`] (standard volumes only);
//! - mass fractions read as mole fractions (or the reverse): the entered numbers taken on the
//!   other basis;
//! - the wrong gas constant: a common wrong number in place of R = 8.314 462 618 J/(mol K)
//!   (results scale with 1/R for density and mass, with R for volume);
//! - Z forced to 1: the ideal gas.

use crate::composition::mass_to_mole;
use crate::constants::R;
use crate::error::{positive, Error, Result};
use crate::jobs::base_conditions::{BaseConditions, NAMED};
use crate::model::Model;
use crate::state::refined_densities;

/// What a sheet computed.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Quantity {
    /// Mass density, kg/m3.
    Density,
    /// Compressibility factor.
    Z,
    /// Mass in a stated volume, kg.
    Mass,
    /// Volume of a stated mass, m3.
    Volume,
    /// Standard volume (at a base) of the gas in a stated volume, m3.
    StdVolume,
}

impl Quantity {
    /// Reads a name: density, z, mass, volume, std_volume (case-insensitive; spaces and
    /// hyphens as underscores).
    pub fn parse(text: &str) -> Option<Quantity> {
        let k = text.trim().to_ascii_lowercase().replace([' ', '-'], "_");
        Some(match k.as_str() {
            "density" | "rho" => Quantity::Density,
            "z" | "compressibility" => Quantity::Z,
            "mass" => Quantity::Mass,
            "volume" => Quantity::Volume,
            "std_volume" | "standard_volume" => Quantity::StdVolume,
            _ => return None,
        })
    }

    /// The name.
    pub fn as_str(self) -> &'static str {
        match self {
            Quantity::Density => "density",
            Quantity::Z => "z",
            Quantity::Mass => "mass",
            Quantity::Volume => "volume",
            Quantity::StdVolume => "std_volume",
        }
    }
}

/// One row in SI units.
#[derive(Debug, Clone, PartialEq)]
pub struct Row {
    /// What the sheet computed.
    pub quantity: Quantity,
    /// Temperature, K.
    pub t: f64,
    /// Absolute pressure, Pa.
    pub p: f64,
    /// Ambient pressure of gauge readings, Pa.
    pub ambient: f64,
    /// The fractions as entered (normalised to sum to one).
    pub entered: Vec<f64>,
    /// True when the entered fractions are mass fractions.
    pub mass_basis: bool,
    /// Stated volume, m3 (mass and std_volume rows).
    pub volume: Option<f64>,
    /// Stated mass, kg (volume rows).
    pub mass: Option<f64>,
    /// Base conditions (std_volume rows).
    pub base: BaseConditions,
}

/// Mole fractions of a row.
pub fn mole_fractions(model: &dyn Model, row: &Row) -> Vec<f64> {
    if row.mass_basis {
        mass_to_mole(&row.entered, &molar_masses(model))
    } else {
        row.entered.clone()
    }
}

fn molar_masses(model: &dyn Model) -> Vec<f64> {
    model.components().iter().map(|c| c.molar_mass).collect()
}

/// Z at (T, P): the density root of lowest Gibbs energy. No allocation.
pub fn z_tp(model: &dyn Model, t: f64, p: f64, x: &[f64]) -> Result<f64> {
    positive("temperature (K)", t)?;
    positive("pressure (Pa)", p)?;
    let roots = refined_densities(model, t, p, x);
    let r = roots.as_slice();
    let g = |rho: f64| {
        let res = model.residual(t, rho, x);
        let z = p / (rho * R * t);
        res.a + z - 1.0 - z.ln()
    };
    let rho = match r {
        [] => {
            return Err(Error::NoSolution(format!(
                "{} has no density root at T = {t} K, P = {p} Pa",
                model.id()
            )))
        }
        [one] => *one,
        many => many
            .iter()
            .copied()
            .min_by(|a, b| g(*a).total_cmp(&g(*b)))
            .unwrap_or(many[0]),
    };
    let z = p / (rho * R * t);
    if z.is_finite() && z > 0.0 {
        Ok(z)
    } else {
        Err(Error::NoSolution(format!(
            "{} gives no finite Z at T = {t} K, P = {p} Pa",
            model.id()
        )))
    }
}

/// The row's value from a model, with temperature, pressure and mole fractions as given
/// (the causes pass altered ones), and `r_gas` in place of R in the final formula.
#[allow(clippy::too_many_arguments)]
fn value_with(
    model: &dyn Model,
    row: &Row,
    t: f64,
    p: f64,
    x: &[f64],
    base: BaseConditions,
    r_gas: f64,
) -> Result<f64> {
    let z = z_tp(model, t, p, x)?;
    let m = model.molar_mass(x);
    let density = p * m / (z * r_gas * t);
    let need = |v: Option<f64>, what: &'static str| {
        v.ok_or_else(|| Error::InvalidInput {
            what,
            value: "missing".to_string(),
            accepted: format!("a value for a {} row", row.quantity.as_str()),
        })
    };
    Ok(match row.quantity {
        Quantity::Density => density,
        Quantity::Z => z,
        Quantity::Mass => need(row.volume, "volume")? * density,
        Quantity::Volume => need(row.mass, "mass")? / density,
        Quantity::StdVolume => {
            let zb = z_tp(model, base.t, base.p, x)?;
            need(row.volume, "volume")? * (p / (z * t)) / (base.p / (zb * base.t))
        }
    })
}

/// The row recomputed with `model`.
pub fn recompute(model: &dyn Model, row: &Row) -> Result<f64> {
    let x = mole_fractions(model, row);
    value_with(model, row, row.t, row.p, &x, row.base, R)
}

/// A cause of a wrong number.
#[derive(Debug, Clone, PartialEq)]
pub enum Cause {
    /// A gauge pressure used as absolute.
    GaugeAsAbsolute,
    /// An absolute pressure used as gauge.
    AbsoluteAsGauge,
    /// A Celsius temperature used as kelvin.
    CelsiusAsKelvin,
    /// A kelvin temperature used as Celsius.
    KelvinAsCelsius,
    /// Another base condition (its id).
    BaseCondition(&'static str),
    /// Mass fractions used as mole fractions.
    MassAsMoleFractions,
    /// Mole fractions used as mass fractions.
    MoleAsMassFractions,
    /// A wrong gas constant (the number used, and its usual unit).
    GasConstant(f64, &'static str),
    /// Z set to one.
    ZForcedToOne,
}

impl Cause {
    /// A short description.
    pub fn describe(&self) -> String {
        match self {
            Cause::GaugeAsAbsolute => "gauge pressure read as absolute".to_string(),
            Cause::AbsoluteAsGauge => "absolute pressure read as gauge".to_string(),
            Cause::CelsiusAsKelvin => "degC read as K".to_string(),
            Cause::KelvinAsCelsius => "K read as degC".to_string(),
            Cause::BaseCondition(id) => format!("base conditions {id} instead of the stated"),
            Cause::MassAsMoleFractions => "mass fractions read as mole fractions".to_string(),
            Cause::MoleAsMassFractions => "mole fractions read as mass fractions".to_string(),
            Cause::GasConstant(r, unit) => format!("gas constant {r} ({unit}) used as J/(mol K)"),
            Cause::ZForcedToOne => "Z forced to 1 (ideal gas)".to_string(),
        }
    }
}

/// Wrong gas constants seen in sheets: numbers of other units or of one gas, used where
/// R in J/(mol K) belongs (values from memory of the usual unit tables).
pub const WRONG_GAS_CONSTANTS: [(f64, &str); 10] = [
    (8_314.462_618, "J/(kmol K)"),
    (0.083_144_626, "L bar/(mol K)"),
    (0.082_057_366, "L atm/(mol K)"),
    (8.205_736_6e-5, "m3 atm/(mol K)"),
    (8.314_462_6e-5, "m3 bar/(mol K)"),
    (82.057_366, "cm3 atm/(mol K)"),
    (10.731_577, "psia ft3/(lbmol R)"),
    (1.987_204, "cal/(mol K)"),
    (8.314, "J/(mol K) rounded"),
    (287.05, "J/(kg K), air"),
];

/// One tested cause.
#[derive(Debug, Clone, PartialEq)]
pub struct CauseCheck {
    /// The cause.
    pub cause: Cause,
    /// The value the sheet would show with that mistake.
    pub value: f64,
    /// (sheet - value) / value.
    pub deviation: f64,
    /// True when |deviation| <= tolerance.
    pub reconciles: bool,
}

/// Tests every applicable cause for a row whose sheet value is `sheet`, with relative
/// tolerance `tol`. `ideal` is the ideal gas of the same components.
pub fn causes(
    model: &dyn Model,
    ideal: &dyn Model,
    row: &Row,
    sheet: f64,
    tol: f64,
) -> Vec<CauseCheck> {
    let x = mole_fractions(model, row);
    let mut out = Vec::new();
    let mut push = |cause: Cause, v: Result<f64>| {
        if let Ok(value) = v {
            if value.is_finite() && value != 0.0 {
                let deviation = (sheet - value) / value;
                out.push(CauseCheck {
                    cause,
                    value,
                    deviation,
                    reconciles: deviation.abs() <= tol,
                });
            }
        }
    };
    let b = row.base;
    let with = |t: f64, p: f64, x: &[f64], base: BaseConditions, r: f64| {
        value_with(model, row, t, p, x, base, r)
    };
    if row.p - row.ambient > 0.0 {
        push(
            Cause::GaugeAsAbsolute,
            with(row.t, row.p - row.ambient, &x, b, R),
        );
    }
    push(
        Cause::AbsoluteAsGauge,
        with(row.t, row.p + row.ambient, &x, b, R),
    );
    if row.t - 273.15 > 0.0 {
        push(
            Cause::CelsiusAsKelvin,
            with(row.t - 273.15, row.p, &x, b, R),
        );
    }
    push(
        Cause::KelvinAsCelsius,
        with(row.t + 273.15, row.p, &x, b, R),
    );
    if row.quantity == Quantity::StdVolume {
        for other in NAMED.iter().filter(|n| n.id != b.id) {
            push(
                Cause::BaseCondition(other.id),
                with(row.t, row.p, &x, *other, R),
            );
        }
    }
    if row.entered.len() > 1 {
        let m = molar_masses(model);
        let (cause, alt) = if row.mass_basis {
            (Cause::MassAsMoleFractions, row.entered.clone())
        } else {
            (Cause::MoleAsMassFractions, mass_to_mole(&row.entered, &m))
        };
        push(cause, with(row.t, row.p, &alt, b, R));
    }
    if matches!(
        row.quantity,
        Quantity::Density | Quantity::Mass | Quantity::Volume
    ) {
        for (r, unit) in WRONG_GAS_CONSTANTS {
            if (r / R - 1.0).abs() > 2.0 * tol {
                push(Cause::GasConstant(r, unit), with(row.t, row.p, &x, b, r));
            }
        }
    }
    push(
        Cause::ZForcedToOne,
        value_with(ideal, row, row.t, row.p, &x, b, R),
    );
    out
}
