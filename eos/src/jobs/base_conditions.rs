//! Named reference (base) conditions for standard and normal volumes, and conversions between
//! amount, mass and the volume of gas at any condition.
//!
//! A volume of gas is an amount of substance stated at a temperature and pressure. With the
//! model's compressibility factor at that condition,
//!
//! ```text
//! V = n Z(T, P) R T / P,   m = n M
//! ```
//!
//! so a flow converts between bases b1 and b2 as Q2 = Q1 (Z2 T2 / P2) / (Z1 T1 / P1). Some
//! contracts state standard volumes as ideal-gas volumes (Z = 1 at base); the ideal-gas model
//! gives exactly that. The named conditions (all values exact by definition of the unit):
//!
//! | id | T | P | where it is used |
//! |---|---|---|---|
//! | `0degC` | 273.15 K | 101 325 Pa | "normal" volumes (Nm3) |
//! | `15degC` | 288.15 K | 101 325 Pa | ISO 13443 standard reference conditions |
//! | `20degC` | 293.15 K | 101 325 Pa | some European contracts |
//! | `60degF-14.696psia` | 288.705 556 K | 101 325.353 Pa | US standard cubic feet |
//! | `60degF-14.73psia` | 288.705 556 K | 101 559.775 Pa | US gas-industry base |
//!
//! 60 degF = (60 + 459.67) x 5/9 K; 1 psi = 6 894.757 293 168 Pa (NIST SP 811, appendix B);
//! the pressures are the stated psia values times that factor.

use crate::error::{positive, Result};
use crate::jobs::equilibrium_state::{at_tp, EqState};
use crate::model::Model;

/// Pascals per psi (exact from the inch and the pound-force).
pub const PA_PER_PSI: f64 = 6_894.757_293_168_361;

/// A reference condition.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct BaseConditions {
    /// Identifier (`15degC`, ...), or "custom".
    pub id: &'static str,
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
}

/// The named reference conditions.
pub const NAMED: [BaseConditions; 5] = [
    BaseConditions {
        id: "0degC",
        t: 273.15,
        p: 101_325.0,
    },
    BaseConditions {
        id: "15degC",
        t: 288.15,
        p: 101_325.0,
    },
    BaseConditions {
        id: "20degC",
        t: 293.15,
        p: 101_325.0,
    },
    BaseConditions {
        id: "60degF-14.696psia",
        t: (60.0 + 459.67) * 5.0 / 9.0,
        p: 14.696 * PA_PER_PSI,
    },
    BaseConditions {
        id: "60degF-14.73psia",
        t: (60.0 + 459.67) * 5.0 / 9.0,
        p: 14.73 * PA_PER_PSI,
    },
];

impl BaseConditions {
    /// A named condition by id (case-insensitive; "normal" is `0degC`, "standard" and "iso"
    /// are `15degC`, "scf" is `60degF-14.696psia`).
    pub fn named(id: &str) -> Option<BaseConditions> {
        let k = id.trim().to_ascii_lowercase();
        let k = match k.as_str() {
            "normal" | "n" => "0degc",
            "standard" | "iso" | "s" => "15degc",
            "scf" => "60degf-14.696psia",
            other => other,
        }
        .to_string();
        NAMED
            .iter()
            .copied()
            .find(|b| b.id.to_ascii_lowercase() == k)
    }

    /// A custom condition.
    pub fn custom(t: f64, p: f64) -> Result<BaseConditions> {
        positive("base temperature (K)", t)?;
        positive("base pressure (Pa)", p)?;
        Ok(BaseConditions { id: "custom", t, p })
    }
}

/// Volume of one mole at a condition, m3/mol, with the equilibrium state there.
pub fn molar_volume(model: &dyn Model, t: f64, p: f64, x: &[f64]) -> Result<(f64, EqState)> {
    let s = at_tp(model, t, p, x)?;
    Ok((1.0 / s.rho, s))
}

/// Amounts equivalent to one flow (or one quantity) of gas.
#[derive(Debug, Clone, PartialEq)]
pub struct Equivalents {
    /// Amount, mol (or mol/s for a flow).
    pub moles: f64,
    /// Mass, kg (or kg/s).
    pub mass: f64,
    /// Volume at each requested condition, m3 (or m3/s), in the order asked.
    pub volumes: Vec<f64>,
    /// Z at each requested condition.
    pub z: Vec<f64>,
}

/// Mass, amount and volume at each of `conditions` ((T, P) pairs) of `moles` of gas.
pub fn equivalents(
    model: &dyn Model,
    moles: f64,
    x: &[f64],
    conditions: &[(f64, f64)],
) -> Result<Equivalents> {
    if !(moles.is_finite() && moles >= 0.0) {
        return Err(crate::Error::invalid(
            "amount (mol)",
            moles,
            "a finite number, zero or above",
        ));
    }
    let mut volumes = Vec::with_capacity(conditions.len());
    let mut z = Vec::with_capacity(conditions.len());
    for &(t, p) in conditions {
        let (v, s) = molar_volume(model, t, p, x)?;
        volumes.push(moles * v);
        z.push(s.z);
    }
    Ok(Equivalents {
        moles,
        mass: moles * model.molar_mass(x),
        volumes,
        z,
    })
}
