//! Loading of the embedded tables (`data/*.csv`, compiled in with `include_str!`), parsed and
//! cross-checked once on first use.
//!
//! Heat-capacity rows come in three forms, all meaning cp0/R = a0 + a1 T + a2 T^2 + a3 T^3 +
//! a4 T^4 (T in K):
//! - `nasa7`: the first five NASA 7-coefficient numbers (McBride, Gordon & Reno, NASA TM-4513,
//!   1993), low range first, as in GRI-Mech 3.0;
//! - `poling-scaled`: as printed in Poling, Prausnitz & O'Connell (2001) App. A, i.e. the
//!   columns are a0, a1 x 1e3, a2 x 1e5, a3 x 1e8, a4 x 1e11, unscaled here;
//! - `plain`: a0..a4 as they stand (derived fits).
//!
//! Loading checks that every source key resolves, ids and look-up names are unique, every
//! component has a contiguous heat-capacity correlation, and numbers are finite. A fault is
//! kept as a [`DataError`] and reported by [`data_status`] and by every look-up.

use std::collections::HashMap;
use std::sync::LazyLock;

use serde::Deserialize;

use crate::error::DataError;
use crate::kij_entry::{KijEntry, KijFamily};
use crate::name::normalize;
use crate::record::Source;
use crate::record::{ComponentRecord, Confidence, CpSegmentRecord};

const COMPONENTS_CSV: &str = include_str!("../data/components.csv");
const IDEAL_CP_CSV: &str = include_str!("../data/ideal_cp.csv");
const KIJ_CSV: &str = include_str!("../data/kij.csv");
const SOURCES_CSV: &str = include_str!("../data/sources.csv");

/// Everything loaded, with the look-up indexes.
pub(crate) struct Database {
    pub components: Vec<ComponentRecord>,
    pub sources: Vec<Source>,
    pub kij: Vec<KijEntry>,
    /// Normalised id, name, alias or CAS number -> component index (unique by construction).
    pub names: HashMap<String, usize>,
    /// Normalised formula -> component indexes (several for isomers).
    pub formulas: HashMap<String, Vec<usize>>,
}

static DB: LazyLock<Result<Database, DataError>> = LazyLock::new(load);

pub(crate) fn db() -> Result<&'static Database, &'static DataError> {
    DB.as_ref()
}

/// `Ok` when the embedded tables loaded and passed their cross-checks; otherwise the fault.
pub fn data_status() -> Result<(), DataError> {
    db().map(|_| ()).map_err(Clone::clone)
}

#[derive(Deserialize)]
struct SourceRow {
    key: String,
    citation: String,
    remark: String,
}

#[derive(Deserialize)]
struct ComponentRow {
    id: String,
    name: String,
    aliases: String,
    formula: String,
    cas: String,
    molar_mass_g_mol: f64,
    tc_k: f64,
    pc_bar: f64,
    omega: f64,
    vc_cm3_mol: Option<f64>,
    zc: Option<f64>,
    tb_k: Option<f64>,
    ttriple_k: Option<f64>,
    source: String,
    source_detail: String,
    confidence: String,
    notes: String,
}

#[derive(Deserialize)]
struct CpRow {
    id: String,
    segment: u32,
    t_lo_k: f64,
    t_hi_k: f64,
    form: String,
    c0: f64,
    c1: f64,
    c2: f64,
    c3: f64,
    c4: f64,
    source: String,
    confidence: String,
    notes: String,
}

#[derive(Deserialize)]
struct KijRow {
    a: String,
    b: String,
    family: String,
    value: f64,
    source: String,
    confidence: String,
    plausible_range: String,
    notes: String,
}

fn err(file: &'static str, message: String) -> DataError {
    DataError { file, message }
}

fn parse<T: for<'de> Deserialize<'de>>(
    file: &'static str,
    text: &str,
) -> Result<Vec<T>, DataError> {
    let mut rd = csv::ReaderBuilder::new()
        .trim(csv::Trim::All)
        .from_reader(text.as_bytes());
    rd.deserialize()
        .enumerate()
        .map(|(i, r)| r.map_err(|e| err(file, format!("data row {}: {e}", i + 1))))
        .collect()
}

fn confidence(file: &'static str, row: &str, s: &str) -> Result<Confidence, DataError> {
    Confidence::parse(s).ok_or_else(|| err(file, format!("{row}: bad confidence mark \"{s}\"")))
}

/// Splits `a;b;c`, dropping blanks.
pub(crate) fn split_list(s: &str) -> Vec<String> {
    s.split(';')
        .map(str::trim)
        .filter(|x| !x.is_empty())
        .map(str::to_string)
        .collect()
}

fn resolve(
    file: &'static str,
    row: &str,
    keys: &[String],
    sources: &[Source],
) -> Result<String, DataError> {
    if keys.is_empty() {
        return Err(err(file, format!("{row}: no source key")));
    }
    let cites: Result<Vec<&str>, DataError> = keys
        .iter()
        .map(|k| {
            sources
                .iter()
                .find(|s| &s.key == k)
                .map(|s| s.citation.as_str())
                .ok_or_else(|| {
                    err(
                        file,
                        format!("{row}: source key \"{k}\" not in sources.csv"),
                    )
                })
        })
        .collect();
    Ok(cites?.join(" | "))
}

struct CpData {
    segments: Vec<CpSegmentRecord>,
    keys: Vec<String>,
    confidence: Confidence,
    notes: Vec<String>,
}

fn load_cp(sources: &[Source]) -> Result<HashMap<String, CpData>, DataError> {
    const F: &str = "ideal_cp.csv";
    let rows: Vec<CpRow> = parse(F, IDEAL_CP_CSV)?;
    let mut map: HashMap<String, CpData> = HashMap::new();
    for r in rows {
        let tag = format!("{} segment {}", r.id, r.segment);
        let keys = split_list(&r.source);
        resolve(F, &tag, &keys, sources)?;
        let c = [r.c0, r.c1, r.c2, r.c3, r.c4];
        let a = match r.form.as_str() {
            "nasa7" | "plain" => c,
            "poling-scaled" => [c[0], c[1] * 1e-3, c[2] * 1e-5, c[3] * 1e-8, c[4] * 1e-11],
            other => return Err(err(F, format!("{tag}: unknown form \"{other}\""))),
        };
        let conf = confidence(F, &tag, &r.confidence)?;
        let seg = CpSegmentRecord {
            t_lo_k: r.t_lo_k,
            t_hi_k: r.t_hi_k,
            a,
        };
        let entry = map.entry(r.id.clone()).or_insert_with(|| CpData {
            segments: Vec::new(),
            keys: Vec::new(),
            confidence: conf,
            notes: Vec::new(),
        });
        if entry.segments.len() + 1 != r.segment as usize {
            return Err(err(F, format!("{tag}: segments out of order")));
        }
        entry.segments.push(seg);
        for k in keys {
            if !entry.keys.contains(&k) {
                entry.keys.push(k);
            }
        }
        if conf_rank(conf) < conf_rank(entry.confidence) {
            entry.confidence = conf;
        }
        if !r.notes.is_empty() {
            entry.notes.push(r.notes);
        }
    }
    Ok(map)
}

fn conf_rank(c: Confidence) -> u8 {
    match c {
        Confidence::Low => 0,
        Confidence::Medium => 1,
        Confidence::High => 2,
    }
}

fn load_components(
    sources: &[Source],
    mut cp: HashMap<String, CpData>,
) -> Result<Vec<ComponentRecord>, DataError> {
    const F: &str = "components.csv";
    let rows: Vec<ComponentRow> = parse(F, COMPONENTS_CSV)?;
    let mut out = Vec::with_capacity(rows.len());
    for r in rows {
        let tag = r.id.clone();
        let numbers = [r.molar_mass_g_mol, r.tc_k, r.pc_bar, r.omega];
        let optional = [r.vc_cm3_mol, r.zc, r.tb_k, r.ttriple_k];
        if numbers
            .iter()
            .chain(optional.iter().flatten())
            .any(|x| !x.is_finite())
        {
            return Err(err(F, format!("{tag}: non-finite number")));
        }
        let source_keys = split_list(&r.source);
        let source = resolve(F, &tag, &source_keys, sources)?;
        let c = cp
            .remove(&r.id)
            .ok_or_else(|| err(F, format!("{tag}: no heat-capacity correlation")))?;
        let segs: Vec<eos::ideal_cp::CpSegment> = c
            .segments
            .iter()
            .map(|s| eos::ideal_cp::CpSegment {
                t_lo: s.t_lo_k,
                t_hi: s.t_hi_k,
                a: s.a,
            })
            .collect();
        let cp_model = eos::IdealGasCp::piecewise(segs)
            .ok_or_else(|| err("ideal_cp.csv", format!("{tag}: segments not contiguous")))?;
        let cp_model = on_fluid_zero(&r.id, cp_model)?;
        let cp_source = resolve("ideal_cp.csv", &tag, &c.keys, sources)?;
        out.push(ComponentRecord {
            aliases: split_list(&r.aliases),
            formula: (!r.formula.is_empty()).then_some(r.formula),
            cas: r.cas,
            molar_mass_kg_mol: r.molar_mass_g_mol * 1e-3,
            tc_k: r.tc_k,
            pc_pa: r.pc_bar * 1e5,
            omega: r.omega,
            vc_m3_mol: r.vc_cm3_mol.map(|v| v * 1e-6),
            zc: r.zc,
            tb_k: r.tb_k,
            ttriple_k: r.ttriple_k,
            z_ra: None,
            source_key: source_keys[0].clone(),
            source_keys,
            source,
            source_detail: r.source_detail,
            confidence: confidence(F, &tag, &r.confidence)?,
            notes: r.notes,
            cp_source_key: c.keys.join(";"),
            cp_source,
            cp_range_k: cp_model.range(),
            cp_segments: c.segments,
            cp_confidence: c.confidence,
            cp_notes: c.notes.join("; "),
            cp_model,
            id: r.id,
            name: r.name,
        });
    }
    if let Some(id) = cp.keys().next() {
        return Err(err("ideal_cp.csv", format!("{id}: no such component")));
    }
    Ok(out)
}

fn load_kij(sources: &[Source], comps: &[ComponentRecord]) -> Result<Vec<KijEntry>, DataError> {
    const F: &str = "kij.csv";
    let rows: Vec<KijRow> = parse(F, KIJ_CSV)?;
    let mut out: Vec<KijEntry> = Vec::with_capacity(rows.len());
    for r in rows {
        let tag = format!("{}/{}", r.a, r.b);
        for id in [&r.a, &r.b] {
            if !comps.iter().any(|c| &c.id == id) {
                return Err(err(F, format!("{tag}: unknown id \"{id}\"")));
            }
        }
        if r.a == r.b || !r.value.is_finite() {
            return Err(err(F, format!("{tag}: bad pair or value")));
        }
        let family = KijFamily::from_key(&r.family)
            .ok_or_else(|| err(F, format!("{tag}: unknown family \"{}\"", r.family)))?;
        let keys = split_list(&r.source);
        let source = resolve(F, &tag, &keys, sources)?;
        let dup = out.iter().any(|e| {
            e.family == family && ((e.a == r.a && e.b == r.b) || (e.a == r.b && e.b == r.a))
        });
        if dup {
            return Err(err(F, format!("{tag}: pair listed twice")));
        }
        out.push(KijEntry {
            a: r.a,
            b: r.b,
            family,
            value: r.value,
            source_key: keys.join(";"),
            source,
            confidence: confidence(F, &tag, &r.confidence)?,
            plausible_range: r.plausible_range,
            notes: r.notes,
        });
    }
    Ok(out)
}

fn index(comps: &[ComponentRecord]) -> Result<Index, DataError> {
    let mut names: HashMap<String, usize> = HashMap::new();
    let mut formulas: HashMap<String, Vec<usize>> = HashMap::new();
    for (i, c) in comps.iter().enumerate() {
        let keys = [&c.id, &c.name, &c.cas].into_iter().chain(c.aliases.iter());
        for k in keys {
            let n = normalize(k);
            if n.is_empty() {
                return Err(err("components.csv", format!("{}: empty name", c.id)));
            }
            match names.insert(n, i) {
                Some(j) if j != i => {
                    return Err(err(
                        "components.csv",
                        format!("\"{k}\" names both {} and {}", comps[j].id, c.id),
                    ))
                }
                _ => {}
            }
        }
        if let Some(f) = &c.formula {
            formulas.entry(normalize(f)).or_default().push(i);
        }
    }
    Ok((names, formulas))
}

type Index = (HashMap<String, usize>, HashMap<String, Vec<usize>>);

fn load() -> Result<Database, DataError> {
    let sources: Vec<Source> = parse::<SourceRow>("sources.csv", SOURCES_CSV)?
        .into_iter()
        .map(|r| Source {
            key: r.key,
            citation: r.citation,
            remark: r.remark,
        })
        .collect();
    for (i, s) in sources.iter().enumerate() {
        if sources[..i].iter().any(|t| t.key == s.key) {
            return Err(err(
                "sources.csv",
                format!("key \"{}\" listed twice", s.key),
            ));
        }
    }
    let cp = load_cp(&sources)?;
    let components = load_components(&sources, cp)?;
    let kij = load_kij(&sources, &components)?;
    let (names, formulas) = index(&components)?;
    Ok(Database {
        components,
        sources,
        kij,
        names,
        formulas,
    })
}

/// The heat capacity on the component's zero of enthalpy and entropy: water's is the
/// steam-table zero (IAPWS-95: u = 0 and s = 0 for the saturated liquid at the triple point),
/// so that every model of water, the cubics as much as IAPWS-95 and IF97, reports and reads
/// h and s as steam tables do; every other component keeps the ideal gas at 298.15 K and
/// 101.325 kPa.
fn on_fluid_zero(id: &str, cp: eos::IdealGasCp) -> Result<eos::IdealGasCp, DataError> {
    if id != "water" {
        return Ok(cp);
    }
    let (h0_r, s0_r) = eos::helmholtz::steam_table_zero()
        .map_err(|e| err("components.csv", format!("water: steam-table zero: {e}")))?;
    Ok(cp.with_zero(h0_r, s0_r))
}
