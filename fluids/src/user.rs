//! Components the user defines (a plant's own pseudo-component, a refrigerant the table
//! lacks), registered for the life of the process so that every look-up finds them by name
//! like the built-in ones.
//!
//! A registered record is kept for as long as the process runs (it is shared by every model
//! and report that names it, as the built-in records are); registering the same name again
//! with the same data gives back the record already there, with other data it is refused.

use crate::error::LookupError;
use crate::name::normalize;
use crate::record::{ComponentRecord, Confidence, CpSegmentRecord};
use std::sync::Mutex;

/// The ideal-gas heat capacity of a user component.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum UserCp {
    /// cp0/R constant over the range.
    Constant { cp_r: f64, t_lo_k: f64, t_hi_k: f64 },
    /// cp0/R = a0 + a1 T + a2 T^2 + a3 T^3 + a4 T^4 (T in K) over the range.
    Polynomial {
        a: [f64; 5],
        t_lo_k: f64,
        t_hi_k: f64,
    },
}

/// What the user gives for a component, SI units.
#[derive(Debug, Clone, PartialEq)]
pub struct UserComponent {
    pub name: String,
    pub molar_mass_kg_mol: f64,
    pub tc_k: f64,
    pub pc_pa: f64,
    pub omega: f64,
    pub vc_m3_mol: Option<f64>,
    pub zc: Option<f64>,
    /// Rackett compressibility Z_RA, for the Peneloux shift of the translated members.
    pub z_ra: Option<f64>,
    pub cp: UserCp,
    /// The user's source text.
    pub source: String,
    /// Where it was defined (file and line).
    pub origin: String,
}

static REGISTRY: Mutex<Vec<&'static ComponentRecord>> = Mutex::new(Vec::new());

/// The registered records.
pub fn registered() -> Vec<&'static ComponentRecord> {
    REGISTRY
        .lock()
        .map_or_else(|p| p.into_inner().clone(), |r| r.clone())
}

/// The registered record that `query` names (its name, any case and separators).
pub(crate) fn find(query: &str) -> Option<&'static ComponentRecord> {
    let q = normalize(query);
    registered()
        .into_iter()
        .find(|r| normalize(&r.id) == q || normalize(&r.name) == q)
}

/// Registers `c` (see the module documentation); the name must not be one of a built-in
/// component's names.
pub fn register(c: UserComponent) -> Result<&'static ComponentRecord, String> {
    if c.name.trim().is_empty() {
        return Err("the name is empty".to_string());
    }
    match crate::lookup::find_built_in(&c.name) {
        Ok(b) => {
            return Err(format!(
                "\"{}\" is a name of the built-in component {}; give yours another name",
                c.name, b.id
            ))
        }
        Err(LookupError::Ambiguous { .. }) => {
            return Err(format!(
                "\"{}\" is a formula of built-in components; give yours another name",
                c.name
            ))
        }
        Err(_) => {}
    }
    let (t_lo, t_hi, a) = match c.cp {
        UserCp::Constant {
            cp_r,
            t_lo_k,
            t_hi_k,
        } => (t_lo_k, t_hi_k, [cp_r, 0.0, 0.0, 0.0, 0.0]),
        UserCp::Polynomial { a, t_lo_k, t_hi_k } => (t_lo_k, t_hi_k, a),
    };
    let segment = eos::ideal_cp::CpSegment { t_lo, t_hi, a };
    let cp_model = eos::IdealGasCp::piecewise(vec![segment])
        .ok_or_else(|| "the heat capacity's range or coefficients are not usable".to_string())?;
    let id = c.name.trim().to_ascii_lowercase();
    let record = ComponentRecord {
        id: id.clone(),
        name: c.name.trim().to_string(),
        aliases: Vec::new(),
        formula: None,
        cas: String::new(),
        molar_mass_kg_mol: c.molar_mass_kg_mol,
        tc_k: c.tc_k,
        pc_pa: c.pc_pa,
        omega: c.omega,
        vc_m3_mol: c.vc_m3_mol,
        zc: c.zc,
        tb_k: None,
        ttriple_k: None,
        z_ra: c.z_ra,
        source_key: "user".to_string(),
        source_keys: vec!["user".to_string()],
        source: format!("user component, {}: {}", c.origin, c.source),
        source_detail: format!("defined by the user in {}", c.origin),
        confidence: Confidence::Low,
        notes: String::new(),
        cp_source_key: "user".to_string(),
        cp_source: format!("user component, {}", c.origin),
        cp_range_k: (t_lo, t_hi),
        cp_segments: vec![CpSegmentRecord {
            t_lo_k: t_lo,
            t_hi_k: t_hi,
            a,
        }],
        cp_confidence: Confidence::Low,
        cp_notes: String::new(),
        cp_model,
    };
    let mut reg = REGISTRY.lock().unwrap_or_else(|p| p.into_inner());
    if let Some(old) = reg.iter().find(|r| r.id == id) {
        // The same data, bit for bit.
        let bits =
            |r: &ComponentRecord| [r.molar_mass_kg_mol, r.tc_k, r.pc_pa, r.omega].map(f64::to_bits);
        let same = bits(old) == bits(&record) && old.cp_segments == record.cp_segments;
        return if same {
            Ok(old)
        } else {
            Err(format!(
                "\"{}\" is already defined with other data ({})",
                record.name, old.source
            ))
        };
    }
    let leaked: &'static ComponentRecord = Box::leak(Box::new(record));
    reg.push(leaked);
    Ok(leaked)
}
