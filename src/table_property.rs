//! The properties a design-basis table can hold: names, SI and display units, and how each
//! is taken from a computed state.
//!
//! Display units (terminal, Markdown, xlsx) are those engineers read: bar, kg/m3, kJ/kg,
//! kJ/(kg K), K/bar; CSV and JSON stay SI. Conversions are exact (1 bar = 1e5 Pa,
//! 1 kJ = 1e3 J).

use crate::error::CliError;
use eos::properties::Properties;

/// One property.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Property {
    /// Name on the command line.
    pub id: &'static str,
    /// Key in CSV and JSON (with the SI unit in it).
    pub key: &'static str,
    /// Name for people.
    pub name: &'static str,
    /// SI unit.
    pub unit_si: &'static str,
    /// Display unit.
    pub unit_display: &'static str,
    /// Display value = SI value x this.
    pub display_factor: f64,
    /// True when Z alone gives it (the fast grid path can serve it).
    pub from_z: bool,
}

/// Every property, in the order of "all".
pub const ALL: [Property; 12] = [
    p("z", "z", "Z", "-", "-", 1.0, true),
    p(
        "density",
        "mass_density_kg_m3",
        "density",
        "kg/m3",
        "kg/m3",
        1.0,
        true,
    ),
    p(
        "molar-density",
        "molar_density_mol_m3",
        "molar density",
        "mol/m3",
        "mol/m3",
        1.0,
        true,
    ),
    p(
        "volume",
        "specific_volume_m3_kg",
        "specific volume",
        "m3/kg",
        "m3/kg",
        1.0,
        true,
    ),
    p(
        "ideal-error",
        "ideal_gas_error_pct",
        "ideal-gas density error",
        "%",
        "%",
        1.0,
        true,
    ),
    p(
        "h",
        "enthalpy_j_kg",
        "enthalpy",
        "J/kg",
        "kJ/kg",
        1e-3,
        false,
    ),
    p(
        "s",
        "entropy_j_kg_k",
        "entropy",
        "J/(kg K)",
        "kJ/(kg K)",
        1e-3,
        false,
    ),
    p(
        "cp",
        "cp_j_kg_k",
        "cp",
        "J/(kg K)",
        "kJ/(kg K)",
        1e-3,
        false,
    ),
    p(
        "cv",
        "cv_j_kg_k",
        "cv",
        "J/(kg K)",
        "kJ/(kg K)",
        1e-3,
        false,
    ),
    p(
        "w",
        "speed_of_sound_m_s",
        "speed of sound",
        "m/s",
        "m/s",
        1.0,
        false,
    ),
    p(
        "jt",
        "joule_thomson_k_pa",
        "Joule-Thomson coefficient",
        "K/Pa",
        "K/bar",
        1e5,
        false,
    ),
    p(
        "kappa",
        "isentropic_exponent",
        "isentropic exponent",
        "-",
        "-",
        1.0,
        false,
    ),
];

const fn p(
    id: &'static str,
    key: &'static str,
    name: &'static str,
    unit_si: &'static str,
    unit_display: &'static str,
    display_factor: f64,
    from_z: bool,
) -> Property {
    Property {
        id,
        key,
        name,
        unit_si,
        unit_display,
        display_factor,
        from_z,
    }
}

/// The selection: properties in the order asked, and whether the phase is asked for.
#[derive(Debug, Clone, PartialEq)]
pub struct Selection {
    pub properties: Vec<Property>,
    pub phase: bool,
}

/// Reads "z,density,phase" (or "all").
pub fn parse(text: &str) -> Result<Selection, CliError> {
    let known = || {
        let mut ids: Vec<&str> = ALL.iter().map(|p| p.id).collect();
        ids.push("phase");
        ids.join(", ")
    };
    if text.trim().eq_ignore_ascii_case("all") {
        return Ok(Selection {
            properties: ALL.to_vec(),
            phase: true,
        });
    }
    let mut sel = Selection {
        properties: Vec::new(),
        phase: false,
    };
    for part in text.split(',').map(str::trim).filter(|s| !s.is_empty()) {
        let id = part.to_ascii_lowercase();
        if id == "phase" {
            sel.phase = true;
            continue;
        }
        let prop = ALL.iter().find(|p| p.id == id).ok_or_else(|| {
            CliError::BadInput(format!(
                "--properties \"{text}\": unknown property \"{part}\"; known: {}, or all",
                known()
            ))
        })?;
        if !sel.properties.contains(prop) {
            sel.properties.push(*prop);
        }
    }
    if sel.properties.is_empty() && !sel.phase {
        return Err(CliError::BadInput(format!(
            "--properties \"{text}\" names no property; known: {}, or all",
            known()
        )));
    }
    Ok(sel)
}

/// The SI value of `prop` from Z alone at (T, P) for molar mass `mm` (kg/mol).
pub fn from_z(prop: &Property, z: f64, t: f64, p: f64, mm: f64) -> Option<f64> {
    let rho = p / (z * eos::constants::R * t);
    let v = match prop.id {
        "z" => z,
        "density" => rho * mm,
        "molar-density" => rho,
        "volume" => 1.0 / (rho * mm),
        // rho_ig / rho - 1 = Z - 1 (see crate::compare::ideal_map).
        "ideal-error" => 100.0 * (z - 1.0),
        _ => return None,
    };
    v.is_finite().then_some(v)
}

/// The SI value of `prop` from a full state.
pub fn from_state(prop: &Property, s: &Properties) -> Option<f64> {
    let mm = s.molar_mass;
    let v = match prop.id {
        "h" => Some(s.h / mm),
        "s" => Some(s.s / mm),
        "cp" => s.cp.map(|c| c / mm),
        "cv" => Some(s.cv / mm),
        "w" => s.w,
        "jt" => s.jt,
        "kappa" => s.isentropic_exponent,
        _ => from_z(prop, s.z, s.t, s.p, mm),
    };
    v.filter(|v| v.is_finite())
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn selection_and_values_from_z() {
        let s = parse("Z, density ,phase,z").unwrap();
        assert_eq!(s.properties.len(), 2);
        assert!(s.phase);
        assert_eq!(parse("all").unwrap().properties.len(), ALL.len());
        assert!(parse("z,enthalpy")
            .unwrap_err()
            .to_string()
            .contains("\"enthalpy\""));
        assert!(parse(" , ").is_err());
        // Ideal gas at 273.15 K and 101.325 kPa: Vm = 22.413 969 54 L/mol (CODATA 2018,
        // from memory; = R T / P with the exact R).
        let d = from_z(&ALL[2], 1.0, 273.15, 101_325.0, 0.028).unwrap();
        assert_relative_eq!(1.0 / d, 22.413_969_54e-3, max_relative = 1e-9);
        assert_relative_eq!(
            from_z(&ALL[4], 0.98, 300.0, 1e5, 0.016).unwrap(),
            -2.0,
            max_relative = 1e-12
        );
    }
}
