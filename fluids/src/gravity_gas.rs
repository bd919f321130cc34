//! The hydrocarbon part of a natural gas known only by its specific gravity, as a record the
//! gas-gravity Z correlations can take beside the gas's nitrogen, carbon dioxide and hydrogen
//! sulfide: the molar mass its gravity implies (gravity times 28.9647 g/mol, the molar mass of
//! dry air) and, for naming phases, the pseudo-critical point of Sutton's correlation.
//!
//! A gravity gives no acentric factor and no ideal-gas heat capacity: both are NaN in the
//! record, so that a calculation needing them fails loudly instead of printing a number; the
//! commands offer such a gas to the gas-gravity correlations only, for Z and density. The
//! record is not found by name; one record is kept per gravity asked for.

use crate::record::{ComponentRecord, Confidence};
use eos::gas_gravity::{pseudo_critical, GravityCorrelation, M_AIR};
use std::sync::Mutex;

/// Id of the record.
pub const ID: &str = "hydrocarbons";

static MADE: Mutex<Vec<&'static ComponentRecord>> = Mutex::new(Vec::new());

/// The record of a hydrocarbon gas of gravity `gravity` (methane's, 0.553, to 2), or the
/// reason it cannot be one.
pub fn hydrocarbon_gas(gravity: f64) -> Result<&'static ComponentRecord, String> {
    let pc = pseudo_critical(gravity, GravityCorrelation::Sutton, &mut Vec::new())
        .map_err(|e| e.to_string())?;
    let mut made = MADE.lock().unwrap_or_else(|p| p.into_inner());
    let molar_mass = gravity * M_AIR;
    if let Some(r) = made
        .iter()
        .find(|r| r.molar_mass_kg_mol.to_bits() == molar_mass.to_bits())
    {
        return Ok(r);
    }
    let record = ComponentRecord {
        id: ID.to_string(),
        name: format!("hydrocarbons (gravity {})", eos_number(gravity)),
        aliases: Vec::new(),
        formula: None,
        cas: String::new(),
        molar_mass_kg_mol: molar_mass,
        tc_k: pc.tpc,
        pc_pa: pc.ppc,
        omega: f64::NAN,
        vc_m3_mol: None,
        zc: None,
        tb_k: None,
        ttriple_k: None,
        z_ra: None,
        source_key: "sutton1985".to_string(),
        source_keys: vec!["sutton1985".to_string()],
        source: "R. P. Sutton, Compressibility factors for high-molecular-weight reservoir \
                 gases, SPE 14265 (1985): pseudo-critical point from the gas gravity"
            .to_string(),
        source_detail: "molar mass from the gravity given; Tc and Pc are Sutton's \
                        pseudo-critical point (from memory of the paper)"
            .to_string(),
        confidence: Confidence::Low,
        notes: String::new(),
        cp_source_key: String::new(),
        cp_source: "none: a gravity gives no ideal-gas heat capacity".to_string(),
        cp_range_k: (f64::NAN, f64::NAN),
        cp_segments: Vec::new(),
        cp_confidence: Confidence::Low,
        cp_notes: String::new(),
        cp_model: eos::IdealGasCp::constant(f64::NAN),
    };
    let leaked: &'static ComponentRecord = Box::leak(Box::new(record));
    made.push(leaked);
    Ok(leaked)
}

/// A gravity as typed back: up to six significant digits, no trailing zeros.
fn eos_number(v: f64) -> String {
    let s = format!("{v:.6}");
    s.trim_end_matches('0').trim_end_matches('.').to_string()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_record_carries_the_gravity_and_no_heat_capacity() {
        let r = hydrocarbon_gas(0.65).unwrap();
        assert!((r.molar_mass_kg_mol - 0.65 * 0.028_964_7).abs() < 1e-15);
        // Sutton (1985): Tpc = 169.2 + 349.5 g - 74.0 g^2 R at g = 0.65: 365.11 R = 202.84 K
        assert!((r.tc_k - 365.11 / 1.8).abs() < 1e-9, "{}", r.tc_k);
        assert!(r.to_component().cp.cp_r(300.0).is_nan());
        assert_eq!(r.name, "hydrocarbons (gravity 0.65)");
        // the same gravity gives the same record
        assert!(std::ptr::eq(r, hydrocarbon_gas(0.65).unwrap()));
        assert!(hydrocarbon_gas(0.4).is_err());
        assert!(crate::find("hydrocarbons").is_err());
    }
}
