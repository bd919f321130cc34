//! The user's own components (`--components FILE`): CSV, one component per row, units in the
//! header as in every file the tool reads; registered before the command runs, so that every
//! place that takes a component name (`--fluid`, `--mix`, `--mix-file`, `--kij`, audit
//! sheets) finds them.
//!
//! | column | needed | unit (in brackets) |
//! |---|---|---|
//! | `name` | yes | text; not a built-in component's name |
//! | `molar mass` | yes | g/mol, kg/kmol, kg/mol, lb/lbmol |
//! | `Tc` | yes | any temperature unit |
//! | `Pc` | yes | any absolute pressure unit |
//! | `acentric factor` (or `omega`) | yes | none |
//! | `Vc` | no | cm3/mol, mL/mol, L/mol, dm3/mol, m3/kmol, m3/mol |
//! | `Zc` | no | none |
//! | `Z_RA` | no | none: the Rackett compressibility, from which the volume-translated members (srk-pen, pr-pen, pr78-pen) take the component's Peneloux shift (Peneloux et al. 1982); without it, Z_RA = 0.29056 - 0.08775 omega |
//! | `cp` | one of the two forms | J/(mol K), kJ/(kmol K), or none for `cp/R` |
//! | `cp/R a0` .. `cp/R a4` | | cp0/R = a0 + a1 T + ... + a4 T^4, T in K |
//! | `cp Tmin`, `cp Tmax` | yes | the range of the heat capacity, any temperature unit |
//! | `source` | yes | text: where the values come from |
//!
//! Every value is checked: positive and finite, and within bounds no real substance passes
//! (below); cp0 at least 5/2 R (translation alone; common practice) over its range. An error
//! names the file, the line and the column.

use crate::error::CliError;
use crate::units;
use eos::constants::R;
use fluids::user::{UserComponent, UserCp};

/// Plausible bounds (common practice: every substance in the usual property tables lies
/// well inside): molar mass 1-2000 g/mol, Tc 1-2000 K, Pc 0.01-1000 bar, acentric factor
/// -0.5 to 2, Zc 0.1-0.5.
const M_RANGE: (f64, f64) = (1e-3, 2.0);
const TC_RANGE: (f64, f64) = (1.0, 2000.0);
const PC_RANGE: (f64, f64) = (1e3, 1e8);
const OMEGA_RANGE: (f64, f64) = (-0.5, 2.0);
const ZC_RANGE: (f64, f64) = (0.1, 0.5);

/// Column kinds.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Kind {
    Name,
    MolarMass,
    Tc,
    Pc,
    Omega,
    Vc,
    Zc,
    ZRa,
    Cp,
    CpA(usize),
    CpTmin,
    CpTmax,
    Source,
}

fn kind_of(name: &str) -> Option<Kind> {
    let n: String = name.split_whitespace().collect::<Vec<_>>().join(" ");
    Some(match n.as_str() {
        "name" | "component" => Kind::Name,
        "molar mass" | "m" | "molecular weight" | "mw" => Kind::MolarMass,
        "tc" | "critical temperature" => Kind::Tc,
        "pc" | "critical pressure" => Kind::Pc,
        "acentric factor" | "omega" | "w" => Kind::Omega,
        "vc" | "critical volume" => Kind::Vc,
        "zc" => Kind::Zc,
        "z_ra" | "zra" | "rackett z" | "rackett z_ra" => Kind::ZRa,
        "cp" | "cp/r" => Kind::Cp,
        "cp tmin" => Kind::CpTmin,
        "cp tmax" => Kind::CpTmax,
        "source" => Kind::Source,
        other => match other.strip_prefix("cp/r a") {
            Some(d) => Kind::CpA(d.parse().ok().filter(|k: &usize| *k <= 4)?),
            None => return None,
        },
    })
}

/// Factor to SI of a molar-mass unit.
fn molar_mass_factor(u: &str) -> Option<f64> {
    match u.replace(' ', "").to_ascii_lowercase().as_str() {
        "g/mol" | "kg/kmol" | "lb/lbmol" => Some(1e-3),
        "kg/mol" => Some(1.0),
        _ => None,
    }
}

/// Factor to SI of a molar-volume unit.
fn volume_factor(u: &str) -> Option<f64> {
    match u.replace(' ', "").as_str() {
        "cm3/mol" | "mL/mol" | "ml/mol" => Some(1e-6),
        "L/mol" | "l/mol" | "dm3/mol" | "m3/kmol" => Some(1e-3),
        "m3/mol" => Some(1.0),
        _ => None,
    }
}

/// Factor to cp0/R of a heat-capacity unit ("" for a cp/R column).
fn cp_factor(u: &str, header: &str) -> Option<f64> {
    match u.replace(' ', "").as_str() {
        "J/(molK)" | "J/mol/K" | "kJ/(kmolK)" | "kJ/kmol/K" => Some(1.0 / R),
        "" if header.to_ascii_lowercase().contains("/r") => Some(1.0),
        _ => None,
    }
}

struct Column {
    index: usize,
    kind: Kind,
    header: String,
    unit: String,
}

/// Reads `path` and registers every component in it.
pub fn load(path: &str) -> Result<Vec<&'static fluids::ComponentRecord>, CliError> {
    let fail = |line: Option<usize>, column: Option<&str>, m: String| {
        let at = crate::file_header::place(path, line, column);
        CliError::BadInput(format!("--components {at}: {m}"))
    };
    let mut rdr = csv::ReaderBuilder::new()
        .trim(csv::Trim::All)
        .flexible(true)
        .from_path(path)
        .map_err(|e| fail(None, None, e.to_string()))?;
    let headers: Vec<String> = rdr
        .headers()
        .map_err(|e| fail(Some(1), None, format!("the header cannot be read: {e}")))?
        .iter()
        .map(str::to_string)
        .collect();
    let mut cols: Vec<Column> = Vec::new();
    for (i, h) in headers.iter().enumerate() {
        let (name, unit) = crate::file_header::split(h);
        let unit = unit.unwrap_or_default();
        let Some(kind) = kind_of(&name) else { continue };
        if cols.iter().any(|c| c.kind == kind) {
            return Err(fail(
                Some(1),
                Some(h),
                "a second column of the same quantity".into(),
            ));
        }
        let unit_ok = match kind {
            Kind::MolarMass => molar_mass_factor(&unit).is_some(),
            Kind::Vc => volume_factor(&unit).is_some(),
            Kind::Cp => cp_factor(&unit, h).is_some(),
            Kind::Tc | Kind::CpTmin | Kind::CpTmax => {
                units::temperature(&format!("1 {unit}")).is_ok()
            }
            Kind::Pc => units::pressure(&format!("1 {unit}")).is_ok_and(|p| !p.is_gauge()),
            Kind::Omega | Kind::Zc | Kind::ZRa | Kind::CpA(_) => unit.is_empty() || unit == "-",
            Kind::Name | Kind::Source => true,
        };
        if !unit_ok {
            return Err(fail(
                Some(1),
                Some(h),
                format!("the unit \"{unit}\" is missing or not accepted for this column"),
            ));
        }
        cols.push(Column {
            index: i,
            kind,
            header: h.clone(),
            unit,
        });
    }
    let has = |k: Kind| cols.iter().any(|c| c.kind == k);
    for (k, what) in [
        (Kind::Name, "name"),
        (Kind::MolarMass, "molar mass [g/mol]"),
        (Kind::Tc, "Tc [K]"),
        (Kind::Pc, "Pc [bar]"),
        (Kind::Omega, "acentric factor"),
        (Kind::CpTmin, "cp Tmin [K]"),
        (Kind::CpTmax, "cp Tmax [K]"),
        (Kind::Source, "source"),
    ] {
        if !has(k) {
            return Err(fail(
                Some(1),
                None,
                format!(
                    "no {what} column; the header has: {}; see the README for the columns",
                    headers.join(", ")
                ),
            ));
        }
    }
    let poly = (0..5).filter(|&k| has(Kind::CpA(k))).count();
    if has(Kind::Cp) == (poly > 0) || (poly > 0 && poly < 5) {
        return Err(fail(
            Some(1),
            None,
            "give the ideal-gas heat capacity either as one \"cp [J/(mol K)]\" (or \"cp/R\") \
             column, or as the five columns \"cp/R a0\" to \"cp/R a4\""
                .to_string(),
        ));
    }
    let mut out = Vec::new();
    for rec in rdr.records() {
        let rec = rec.map_err(|e| {
            fail(
                e.position().map(|p| p.line() as usize),
                None,
                format!("the line cannot be read: {e}"),
            )
        })?;
        let line = rec.position().map_or(0, |p| p.line() as usize);
        if rec.iter().all(str::is_empty) {
            continue;
        }
        let col = |k: Kind| cols.iter().find(|c| c.kind == k);
        let text = |k: Kind| col(k).map_or("", |c| rec.get(c.index).unwrap_or("").trim());
        let bad = |k: Kind, m: String| fail(Some(line), col(k).map(|c| c.header.as_str()), m);
        let number = |k: Kind| -> Result<Option<f64>, CliError> {
            let t = text(k);
            if t.is_empty() {
                return Ok(None);
            }
            t.parse::<f64>()
                .ok()
                .filter(|v| v.is_finite())
                .map(Some)
                .ok_or_else(|| bad(k, format!("\"{t}\" is not a number")))
        };
        let need = |k: Kind| -> Result<f64, CliError> {
            number(k)?.ok_or_else(|| bad(k, "the cell is empty".to_string()))
        };
        let within = |k: Kind, v: f64, (lo, hi): (f64, f64), shown: &str| {
            if v > lo && v < hi {
                Ok(v)
            } else {
                Err(bad(k, format!("{shown} is outside the plausible range")))
            }
        };
        let unit = |k: Kind| col(k).map_or("", |c| c.unit.as_str());
        let temp = |k: Kind| -> Result<f64, CliError> {
            let v = need(k)?;
            units::temperature(&format!("{v} {}", unit(k))).map_err(|e| bad(k, e.problem))
        };
        let name = text(Kind::Name).to_string();
        if name.is_empty() {
            return Err(bad(Kind::Name, "the cell is empty".to_string()));
        }
        let m = need(Kind::MolarMass)? * molar_mass_factor(unit(Kind::MolarMass)).unwrap_or(1.0);
        let m = within(Kind::MolarMass, m, M_RANGE, &format!("{} g/mol", m * 1e3))?;
        let tc = within(Kind::Tc, temp(Kind::Tc)?, TC_RANGE, "Tc")?;
        let pc = {
            let v = need(Kind::Pc)?;
            let p = units::pressure(&format!("{v} {}", unit(Kind::Pc)))
                .map_err(|e| bad(Kind::Pc, e.problem))?
                .absolute(0.0);
            within(Kind::Pc, p, PC_RANGE, &format!("{p} Pa"))?
        };
        let omega = within(
            Kind::Omega,
            need(Kind::Omega)?,
            OMEGA_RANGE,
            "the acentric factor",
        )?;
        let vc = match number(Kind::Vc)? {
            Some(v) if v > 0.0 => Some(v * volume_factor(unit(Kind::Vc)).unwrap_or(1.0)),
            Some(_) => return Err(bad(Kind::Vc, "Vc must be above zero".to_string())),
            None => None,
        };
        let zc = match number(Kind::Zc)? {
            Some(z) => Some(within(Kind::Zc, z, ZC_RANGE, "Zc")?),
            None => None,
        };
        let z_ra = match number(Kind::ZRa)? {
            Some(z) => Some(within(Kind::ZRa, z, ZC_RANGE, "Z_RA")?),
            None => None,
        };
        let (t_lo, t_hi) = (temp(Kind::CpTmin)?, temp(Kind::CpTmax)?);
        if !(t_lo > 0.0 && t_hi > t_lo) {
            return Err(bad(
                Kind::CpTmax,
                "the heat capacity's range must run from a lower to a higher temperature"
                    .to_string(),
            ));
        }
        let cp = if has(Kind::Cp) {
            let f = col(Kind::Cp)
                .and_then(|c| cp_factor(&c.unit, &c.header))
                .unwrap_or(1.0);
            UserCp::Constant {
                cp_r: need(Kind::Cp)? * f,
                t_lo_k: t_lo,
                t_hi_k: t_hi,
            }
        } else {
            let mut a = [0.0; 5];
            for (k, ak) in a.iter_mut().enumerate() {
                *ak = need(Kind::CpA(k))?;
            }
            UserCp::Polynomial {
                a,
                t_lo_k: t_lo,
                t_hi_k: t_hi,
            }
        };
        let cp_r = |t: f64| match cp {
            UserCp::Constant { cp_r, .. } => cp_r,
            UserCp::Polynomial { a, .. } => a.iter().rev().fold(0.0, |s, c| s * t + c),
        };
        let cp_col = if has(Kind::Cp) {
            Kind::Cp
        } else {
            Kind::CpA(0)
        };
        for k in 0..=20 {
            let t = t_lo + (t_hi - t_lo) * f64::from(k) / 20.0;
            let v = cp_r(t);
            if v.is_nan() || v < 2.5 - 1e-9 {
                return Err(bad(
                    cp_col,
                    format!(
                        "cp0 = {:.4} R at {t:.1} K: an ideal gas has at least 5/2 R \
                         (translation alone)",
                        cp_r(t)
                    ),
                ));
            }
        }
        let source = text(Kind::Source).to_string();
        if source.is_empty() {
            return Err(bad(
                Kind::Source,
                "say where the values come from".to_string(),
            ));
        }
        let rec = fluids::user::register(UserComponent {
            name,
            molar_mass_kg_mol: m,
            tc_k: tc,
            pc_pa: pc,
            omega,
            vc_m3_mol: vc,
            zc,
            z_ra,
            cp,
            source,
            origin: format!("{path} line {line}"),
        })
        .map_err(|m| bad(Kind::Name, m))?;
        out.push(rec);
    }
    if out.is_empty() {
        return Err(fail(None, None, "no component in the file".to_string()));
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn headers_and_units() {
        assert_eq!(kind_of("cp/r a3"), Some(Kind::CpA(3)));
        assert_eq!(kind_of("cp/r a5"), None);
        assert_eq!(kind_of("acentric factor"), Some(Kind::Omega));
        assert_eq!(molar_mass_factor("g/mol"), Some(1e-3));
        assert_eq!(volume_factor("cm3/mol"), Some(1e-6));
        assert!(cp_factor("J/(mol K)", "cp [J/(mol K)]").is_some());
        assert_eq!(cp_factor("", "cp/R"), Some(1.0));
        assert_eq!(cp_factor("", "cp"), None);
    }
}
