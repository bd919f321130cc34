//! Specific enthalpy and entropy with units, read from the command line for the (P, h) and
//! (P, s) flashes and converted once to SI molar values.
//!
//! Accepted: enthalpy in J/mol, kJ/mol, kJ/kmol, MJ/kmol, J/kg, kJ/kg, MJ/kg, Btu/lb and
//! Btu/lbmol; entropy in J/(mol K), kJ/(mol K), kJ/(kmol K), J/(kg K), kJ/(kg K),
//! Btu/(lb R) and Btu/(lbmol R) (written with or without parentheses, "J/mol/K", "J/(mol.K)"
//! and "J/(mol·K)" too). Conversion factors: the international table Btu, 1 Btu =
//! 1055.055 852 62 J, and 1 lb = 0.453 592 37 kg (NIST SP 811, 2008 edition, appendix B);
//! 1 R = 5/9 K. A bare number is refused, as for every quantity of the tool. The values are
//! relative to the tool's reference state: ideal-gas h = 0 and s = 0 for every pure
//! component at 298.15 K and 101.325 kPa, but water, which is on the steam-table zero
//! (IAPWS-95: u = 0 and s = 0 for the saturated liquid at the triple point).

use crate::units::KG_PER_LB;

/// Joules per international table Btu.
pub const J_PER_BTU: f64 = 1_055.055_852_62;

const ENTHALPY_UNITS: &str = "a number with J/mol, kJ/mol, kJ/kmol, MJ/kmol (molar), J/kg, \
kJ/kg, MJ/kg (mass) or Btu/lb, Btu/lbmol, for example \"-2.5 kJ/mol\" or \"350 kJ/kg\"";
const ENTROPY_UNITS: &str = "a number with J/(mol K), kJ/(kmol K) (molar), J/(kg K), \
kJ/(kg K) (mass) or Btu/(lb R), Btu/(lbmol R), for example \"-12 J/(mol K)\" or \
\"1.2 kJ/(kg K)\"";

/// A specific enthalpy or entropy that could not be read: the tool's one unit error.
pub type EnergyUnitError = crate::units::UnitError;

/// A value per mole or per kilogram, in SI (J/mol, J/kg, J/(mol K) or J/(kg K)).
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Specific {
    /// Per mole.
    Molar(f64),
    /// Per kilogram.
    Mass(f64),
}

impl Specific {
    /// The molar value for a fluid of molar mass `m` (kg/mol).
    pub fn molar(self, m: f64) -> f64 {
        match self {
            Specific::Molar(v) => v,
            Specific::Mass(v) => v * m,
        }
    }
}

/// Splits "12.5 kJ/kg" into (12.5, "kJ/kg").
fn split(
    input: &str,
    quantity: &'static str,
    accepted: &'static str,
) -> Result<(f64, String), EnergyUnitError> {
    crate::units::split(input, quantity, accepted)
}

/// The unit in a canonical spelling: lower case, no spaces, parentheses or product signs,
/// "/" between every factor ("J/(mol K)" -> "j/mol/k").
fn canonical(unit: &str) -> String {
    let mut u = String::new();
    let mut after_slash = false;
    for c in unit.chars() {
        match c {
            '(' | ')' => {}
            '/' => {
                u.push('/');
                after_slash = true;
            }
            ' ' | '.' | '*' | '·' | '-' if after_slash => {
                if !u.ends_with('/') {
                    u.push('/');
                }
            }
            ' ' => {}
            c => u.extend(c.to_lowercase()),
        }
    }
    u
}

fn finish(
    input: &str,
    quantity: &'static str,
    accepted: &'static str,
    v: Specific,
) -> Result<Specific, EnergyUnitError> {
    let raw = match v {
        Specific::Molar(x) | Specific::Mass(x) => x,
    };
    if raw.is_finite() {
        Ok(v)
    } else {
        Err(EnergyUnitError {
            input: input.to_string(),
            quantity,
            problem: "the value overflows once converted to SI units".to_string(),
            accepted,
        })
    }
}

/// Reads a specific enthalpy (any sign: it is relative to the reference state).
pub fn enthalpy(input: &str) -> Result<Specific, EnergyUnitError> {
    let (v, unit) = split(input, "enthalpy", ENTHALPY_UNITS)?;
    // m is milli, M mega: "mJ/kg" is a millijoule per kilogram, read as such and noted.
    let milli = |s: Specific| {
        crate::input_notes::push(format!(
            "\"{}\" is read with m as milli (a millijoule is 1e-3 J); for megajoules write MJ",
            input.trim()
        ));
        s
    };
    let s = match canonical(&unit).as_str() {
        "mj/kg" if unit.starts_with('m') => milli(Specific::Mass(v * 1e-3)),
        "mj/kmol" if unit.starts_with('m') => milli(Specific::Molar(v * 1e-6)),
        "j/mol" => Specific::Molar(v),
        "kj/mol" => Specific::Molar(v * 1e3),
        "kj/kmol" => Specific::Molar(v),
        "j/g" => Specific::Mass(v * 1e3),
        "mj/kmol" => Specific::Molar(v * 1e3),
        "j/kg" => Specific::Mass(v),
        "kj/kg" => Specific::Mass(v * 1e3),
        "mj/kg" => Specific::Mass(v * 1e6),
        "btu/lb" | "btu/lbm" => Specific::Mass(v * J_PER_BTU / KG_PER_LB),
        "btu/lbmol" => Specific::Molar(v * J_PER_BTU / (KG_PER_LB * 1e3)),
        _ => {
            return Err(EnergyUnitError {
                input: input.to_string(),
                quantity: "enthalpy",
                problem: format!("unknown unit \"{unit}\""),
                accepted: ENTHALPY_UNITS,
            })
        }
    };
    finish(input, "enthalpy", ENTHALPY_UNITS, s)
}

/// Reads a specific entropy (any sign: it is relative to the reference state).
pub fn entropy(input: &str) -> Result<Specific, EnergyUnitError> {
    let (v, unit) = split(input, "entropy", ENTROPY_UNITS)?;
    // 1 Btu/(lb R) = 1055.056 J / (0.4536 kg * 5/9 K).
    let btu_per_lb_r = J_PER_BTU / (KG_PER_LB * crate::units::K_PER_R);
    let s = match canonical(&unit).as_str() {
        "j/mol/k" | "j/k/mol" => Specific::Molar(v),
        "kj/mol/k" | "kj/k/mol" => Specific::Molar(v * 1e3),
        "kj/kmol/k" | "kj/k/kmol" => Specific::Molar(v),
        "j/kg/k" | "j/k/kg" => Specific::Mass(v),
        "kj/kg/k" | "kj/k/kg" | "j/g/k" => Specific::Mass(v * 1e3),
        "btu/lb/r" | "btu/lbm/r" => Specific::Mass(v * btu_per_lb_r),
        "btu/lbmol/r" => Specific::Molar(v * btu_per_lb_r * 1e-3),
        _ => {
            return Err(EnergyUnitError {
                input: input.to_string(),
                quantity: "entropy",
                problem: format!("unknown unit \"{unit}\""),
                accepted: ENTROPY_UNITS,
            })
        }
    };
    finish(input, "entropy", ENTROPY_UNITS, s)
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn molar(s: Specific) -> f64 {
        match s {
            Specific::Molar(v) => v,
            Specific::Mass(_) => f64::NAN,
        }
    }

    fn mass(s: Specific) -> f64 {
        match s {
            Specific::Mass(v) => v,
            Specific::Molar(_) => f64::NAN,
        }
    }

    #[test]
    fn mega_and_milli_joules_are_told_apart() {
        // SI brochure (BIPM, 9th ed., 2019, table 7): M is 1e6, m is 1e-3. "mJ/kg" was once
        // read as megajoules per kilogram.
        assert_relative_eq!(mass(enthalpy("2.5 MJ/kg").unwrap()), 2.5e6);
        assert_relative_eq!(mass(enthalpy("2.5 mJ/kg").unwrap()), 2.5e-3);
        assert_relative_eq!(molar(enthalpy("3 MJ/kmol").unwrap()), 3e3);
        assert_relative_eq!(molar(enthalpy("3 mJ/kmol").unwrap()), 3e-6);
    }

    #[test]
    fn enthalpy_units() {
        assert_relative_eq!(molar(enthalpy("-2.5 kJ/mol").unwrap()), -2500.0);
        assert_relative_eq!(molar(enthalpy("12 J/mol").unwrap()), 12.0);
        assert_relative_eq!(molar(enthalpy("7 kJ/kmol").unwrap()), 7.0);
        assert_relative_eq!(mass(enthalpy("350 kJ/kg").unwrap()), 350e3);
        assert_relative_eq!(mass(enthalpy("1e3 J/kg").unwrap()), 1e3);
        // 1 Btu/lb = 2326 J/kg exactly (NIST SP 811, 2008, appendix B.8).
        assert_relative_eq!(
            mass(enthalpy("1 Btu/lb").unwrap()),
            2326.0,
            max_relative = 1e-12
        );
    }

    #[test]
    fn entropy_units() {
        for text in [
            "-12 J/(mol K)",
            "-12 J/mol/K",
            "-12 J/(mol.K)",
            "-12 J/(mol·K)",
            "-12 kJ/(kmol K)",
        ] {
            assert_relative_eq!(molar(entropy(text).unwrap()), -12.0);
        }
        assert_relative_eq!(mass(entropy("1.2 kJ/(kg K)").unwrap()), 1200.0);
        assert_relative_eq!(mass(entropy("1.2 kJ/kg/K").unwrap()), 1200.0);
        // 1 Btu/(lb R) = 4186.8 J/(kg K) exactly (NIST SP 811, 2008, appendix B.8).
        assert_relative_eq!(
            mass(entropy("1 Btu/(lb R)").unwrap()),
            4186.8,
            max_relative = 1e-12
        );
    }

    #[test]
    fn errors_quote_the_input() {
        for (text, what) in [
            ("12", "unit is missing"),
            ("kJ/kg", "does not start with a number"),
            ("12 kJ", "unknown unit"),
            ("1e400 kJ/kg", "not finite"),
        ] {
            let e = enthalpy(text).unwrap_err().to_string();
            assert!(
                e.contains(&format!("\"{text}\"")) && e.contains(what),
                "{e}"
            );
        }
        let e = entropy("3 kJ/kg").unwrap_err().to_string();
        assert!(
            e.contains("\"3 kJ/kg\"") && e.contains("unknown unit"),
            "{e}"
        );
        assert!(enthalpy("1e306 MJ/kg").is_err());
    }
}
