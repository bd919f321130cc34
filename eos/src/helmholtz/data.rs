//! Reader of the formulation data files in `eos/data/helmholtz/` (format described in each
//! file's header). Files are embedded with `include_str!` and read once.

use super::ancillary::{Ancillary, AncillaryForm};
use super::derivs::MAX_L;
use super::exponential::ExponentialTerm;
use super::formulation::{Formulation, Tier, Validity};
use super::gaussian::GaussianTerm;
use super::ideal_part::{IdealPart, IdealTerm};
use super::nonanalytic::NonAnalyticTerm;
use super::power::PowerTerm;
use super::residual_part::ResidualPart;
use crate::error::{Error, Result};

/// Names a data file gives a formulation that the file itself does not carry.
#[derive(Debug, Clone, Copy)]
pub struct Meta {
    /// Key, e.g. `water-iapws95`.
    pub key: &'static str,
    /// Fluid name.
    pub fluid: &'static str,
    /// Short title.
    pub title: &'static str,
    /// Reference or technical.
    pub tier: Tier,
}

fn bad(line: usize, text: &str, why: &str) -> Error {
    Error::InvalidInput {
        what: "formulation data line",
        value: format!("{line}: {text}"),
        accepted: why.to_string(),
    }
}

/// A number, or a fraction `a/b` of two numbers.
fn number(s: &str) -> Option<f64> {
    let s = s.trim();
    let v = match s.split_once('/') {
        Some((a, b)) => a.trim().parse::<f64>().ok()? / b.trim().parse::<f64>().ok()?,
        None => s.parse::<f64>().ok()?,
    };
    v.is_finite().then_some(v)
}

/// Parses one data file.
/// The citation a data file opens with: its first comment lines (up to the one that starts
/// "Coefficients"), joined, without the fluid's name before the first colon.
fn citation(text: &str) -> String {
    let lines: Vec<&str> = text
        .lines()
        .map_while(|l| l.strip_prefix('#'))
        .map(str::trim)
        .take_while(|l| !l.is_empty() && !l.starts_with("Coefficients"))
        .collect();
    let joined = lines.join(" ");
    let cited = joined.split_once(": ").map_or(joined.as_str(), |(_, c)| c);
    cited.trim().trim_end_matches('.').to_string()
}

pub fn parse(text: &str, meta: Meta) -> Result<Formulation> {
    let mut consts: Vec<(String, f64, String)> = Vec::new();
    let mut ideal = IdealPart::default();
    let mut residual = ResidualPart::default();
    let (mut ps, mut rhol, mut rhov): (Option<Ancillary>, Option<Ancillary>, Option<Ancillary>) =
        (None, None, None);
    for (k, raw) in text.lines().enumerate() {
        let line = raw.trim();
        if line.is_empty() || line.starts_with('#') {
            continue;
        }
        let f: Vec<&str> = line.split(',').map(str::trim).collect();
        let num = |i: usize| -> Result<f64> {
            f.get(i)
                .and_then(|s| number(s))
                .ok_or_else(|| bad(k + 1, line, &format!("a number in field {}", i + 1)))
        };
        match f[0] {
            "const" => {
                let name = f
                    .get(1)
                    .ok_or_else(|| bad(k + 1, line, "a constant name"))?;
                let unit = f.get(3).copied().unwrap_or("");
                consts.push((name.to_string(), num(2)?, unit.to_string()));
            }
            "ideal" => {
                let kind = f.get(1).copied().unwrap_or("");
                let n = num(2)?;
                let term = match kind {
                    "log_delta" => IdealTerm::LogDelta(n),
                    "constant" => IdealTerm::Constant(n),
                    "tau" => IdealTerm::Tau(n),
                    "log_tau" => IdealTerm::LogTau(n),
                    "power" => IdealTerm::Power { n, t: num(3)? },
                    "planck" => IdealTerm::Planck { n, gamma: num(3)? },
                    _ => return Err(bad(k + 1, line, "a known ideal-part kind")),
                };
                ideal.terms.push(term);
            }
            "residual" => {
                let kind = f.get(1).copied().unwrap_or("");
                let n = num(2)?;
                match kind {
                    "power" => residual.power.push(PowerTerm {
                        n,
                        d: num(3)?,
                        t: num(4)?,
                    }),
                    "exponential" => {
                        let l = num(5)?;
                        if l.fract() != 0.0 || l < 1.0 || l > MAX_L as f64 {
                            return Err(bad(k + 1, line, "an integer l from 1 to 8"));
                        }
                        residual.exponential.push(ExponentialTerm {
                            n,
                            d: num(3)?,
                            t: num(4)?,
                            l: l as usize,
                        })
                    }
                    "gaussian" => residual.gaussian.push(GaussianTerm {
                        n,
                        d: num(3)?,
                        t: num(4)?,
                        alpha: num(6)?,
                        beta: num(7)?,
                        gamma: num(8)?,
                        epsilon: num(9)?,
                    }),
                    "nonanalytic" => residual.nonanalytic.push(NonAnalyticTerm {
                        n,
                        a: num(10)?,
                        b: num(11)?,
                        beta: num(12)?,
                        big_a: num(13)?,
                        big_b: num(14)?,
                        big_c: num(15)?,
                        big_d: num(16)?,
                    }),
                    _ => return Err(bad(k + 1, line, "a known residual term kind")),
                }
            }
            "ancillary" => {
                let form = match f.get(2).copied().unwrap_or("") {
                    "ln_tc" => AncillaryForm::LnTc,
                    "ln" => AncillaryForm::Ln,
                    "linear" => AncillaryForm::Linear,
                    _ => return Err(bad(k + 1, line, "form ln_tc, ln or linear")),
                };
                let slot = match f.get(1).copied().unwrap_or("") {
                    "ps" => &mut ps,
                    "rhol" => &mut rhol,
                    "rhov" => &mut rhov,
                    _ => return Err(bad(k + 1, line, "quantity ps, rhol or rhov")),
                };
                let anc = slot.get_or_insert_with(|| Ancillary {
                    form,
                    terms: Vec::new(),
                });
                if anc.form != form {
                    return Err(bad(k + 1, line, "one form per ancillary"));
                }
                anc.terms.push((num(3)?, num(4)?));
            }
            _ => {
                return Err(bad(
                    k + 1,
                    line,
                    "a record const, ideal, residual or ancillary",
                ))
            }
        }
    }
    let get = |name: &str| -> Result<(f64, &str)> {
        consts
            .iter()
            .find(|(n, _, _)| n == name)
            .map(|(_, v, u)| (*v, u.as_str()))
            .ok_or_else(|| bad(0, name, "this constant in the file"))
    };
    let pressure = |name: &str| -> Result<f64> {
        let (v, u) = get(name)?;
        match u {
            "Pa" => Ok(v),
            "kPa" => Ok(v * 1e3),
            "MPa" => Ok(v * 1e6),
            _ => Err(bad(0, name, "a pressure unit Pa, kPa or MPa")),
        }
    };
    let kelvin = |name: &str| -> Result<f64> {
        let (v, u) = get(name)?;
        (u == "K")
            .then_some(v)
            .ok_or_else(|| bad(0, name, "a temperature in K"))
    };
    let (m, mu) = get("molar_mass")?;
    if mu != "g/mol" {
        return Err(bad(0, "molar_mass", "g/mol"));
    }
    let molar_mass = m / 1000.0;
    let (rc, rcu) = get("rhoc")?;
    let rhoc = match rcu {
        "kg/m3" => rc / molar_mass,
        "mol/dm3" => rc * 1000.0,
        _ => return Err(bad(0, "rhoc", "kg/m3 or mol/dm3")),
    };
    let (r, ru) = get("r")?;
    let r = match ru {
        "J/(mol K)" => r,
        "kJ/(kg K)" => r * 1000.0 * molar_mass,
        _ => return Err(bad(0, "r", "J/(mol K) or kJ/(kg K)")),
    };
    if residual.is_empty() || ideal.terms.is_empty() {
        return Err(bad(0, meta.key, "ideal and residual terms"));
    }
    Ok(Formulation {
        key: meta.key,
        fluid: meta.fluid,
        title: meta.title,
        citation: citation(text),
        tier: meta.tier,
        tc: kelvin("tc")?,
        rhoc,
        pc: pressure("pc")?,
        molar_mass,
        r,
        t_triple: kelvin("t_triple")?,
        p_triple: pressure("p_triple")?,
        validity: Validity {
            t_min: kelvin("t_min")?,
            t_max: kelvin("t_max")?,
            p_max: pressure("p_max")?,
        },
        ideal,
        residual,
        ps_anc: ps,
        rhol_anc: rhol,
        rhov_anc: rhov,
    })
}
