//! The component record: constants, ideal-gas heat capacity and provenance of one fluid, and
//! its conversion to the model-ready [`eos::Component`] (kg/mol, Pa, m3/mol).

use serde::Serialize;

/// How sure the data are, as marked in the data files.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Confidence {
    /// Sure of the value to the digits given (several sources agree, or a check confirms it).
    High,
    /// Probably right to about one unit in the last digit, or to the spread between sources.
    Medium,
    /// Uncertain; fit for sanity checks or as an input, not as a tight test value.
    Low,
}

impl Confidence {
    pub(crate) fn parse(s: &str) -> Option<Self> {
        match s.trim() {
            "high" => Some(Confidence::High),
            "medium" => Some(Confidence::Medium),
            "low" => Some(Confidence::Low),
            _ => None,
        }
    }
}

/// One segment of the ideal-gas heat capacity: cp0/R = a0 + a1 T + a2 T^2 + a3 T^3 + a4 T^4
/// (T in K) over `[t_lo_k, t_hi_k]`, coefficients already unscaled.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct CpSegmentRecord {
    /// Lower end, K.
    pub t_lo_k: f64,
    /// Upper end, K.
    pub t_hi_k: f64,
    /// Coefficients a0..a4 of cp0/R in powers of T (K).
    pub a: [f64; 5],
}

/// One component with its data and where they come from.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ComponentRecord {
    /// Short unique key, lowercase (e.g. `methane`, `n-butane`, `co2`).
    pub id: String,
    /// Display name.
    pub name: String,
    /// Other names accepted by [`crate::find`] (e.g. `C1`, `R-50`).
    pub aliases: Vec<String>,
    /// Molecular formula; `None` for mixtures (air).
    pub formula: Option<String>,
    /// CAS registry number.
    pub cas: String,
    /// Molar mass, kg/mol.
    pub molar_mass_kg_mol: f64,
    /// Critical temperature, K.
    pub tc_k: f64,
    /// Critical pressure, Pa.
    pub pc_pa: f64,
    /// Pitzer acentric factor.
    pub omega: f64,
    /// Critical molar volume, m3/mol.
    pub vc_m3_mol: Option<f64>,
    /// Critical compressibility factor as tabulated.
    pub zc: Option<f64>,
    /// Normal boiling point, K (`None` where the substance sublimes at 1 atm, or for air).
    pub tb_k: Option<f64>,
    /// Triple-point temperature, K, where a source was at hand.
    pub ttriple_k: Option<f64>,
    /// Rackett compressibility Z_RA, where given (user components); the volume-translated
    /// members take their Peneloux shift from it, or from Z_RA = 0.29056 - 0.08775 omega.
    pub z_ra: Option<f64>,
    /// Key of the main source (the first of `source_keys`).
    pub source_key: String,
    /// Keys of every source used for this row.
    pub source_keys: Vec<String>,
    /// Citations of `source_keys`, resolved, joined by " | ".
    pub source: String,
    /// Which value comes from which source, and whether it was recalled from memory.
    pub source_detail: String,
    /// Confidence mark of the constants.
    pub confidence: Confidence,
    /// Remarks: alternative values, consistency checks, caveats.
    pub notes: String,
    /// Key(s) of the heat-capacity source, `;`-separated.
    pub cp_source_key: String,
    /// Citation(s) of the heat-capacity source, resolved.
    pub cp_source: String,
    /// Temperature range of the heat-capacity correlation, K.
    pub cp_range_k: (f64, f64),
    /// Heat-capacity segments, lowest temperature first.
    pub cp_segments: Vec<CpSegmentRecord>,
    /// Confidence mark of the heat-capacity correlation (the lowest of its segments).
    pub cp_confidence: Confidence,
    /// How the correlation was obtained and checked.
    pub cp_notes: String,
    #[serde(skip)]
    pub(crate) cp_model: eos::IdealGasCp,
}

impl ComponentRecord {
    /// The model-ready component, in SI units, with its ideal-gas heat capacity.
    pub fn to_component(&self) -> eos::Component {
        eos::Component {
            name: self.name.clone(),
            molar_mass: self.molar_mass_kg_mol,
            tc: self.tc_k,
            pc: self.pc_pa,
            omega: self.omega,
            vc: self.vc_m3_mol,
            cp: self.cp_model.clone(),
        }
    }

    /// The ideal-gas heat capacity as the models use it.
    pub fn ideal_cp(&self) -> &eos::IdealGasCp {
        &self.cp_model
    }
}

/// One literature source.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct Source {
    /// Short key used in the data files, e.g. `poling5`.
    pub key: String,
    /// Full citation.
    pub citation: String,
    /// How the source was used (e.g. "from memory", cross-checks made).
    pub remark: String,
}
