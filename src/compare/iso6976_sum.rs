//! The compression factor of a natural-gas mixture at the ISO 6976 reference conditions by
//! the summation method of ISO 6976:1995 (clause 6; the same method in the 2016 edition):
//!
//!   Z_mix = 1 - (sum_i x_i sqrt(b_i))^2
//!
//! at 101.325 kPa and 0, 15 or 20 degC, with each component's summation factor sqrt(b_i)
//! from the standard's Table 2. Every factor in `data/iso6976_summation_factors.csv` is
//! recalled from memory of that table and carries the confidence given it in the project's
//! reference collection (high for methane, ethane, propane, nitrogen and CO2; lower for the
//! butanes, oxygen, argon and carbon monoxide, whose recalled values follow a less regular
//! trend). A mixture with a component the data lack has no summation value; the message
//! names the components.

use crate::error::CliError;

/// Name of the method in reports.
pub const METHOD: &str = "ISO 6976:1995 summation method, Z = 1 - (sum x_i sqrt(b_i))^2 at \
101.325 kPa, sqrt(b_i) from Table 2 recalled from memory";

/// The reference pressure of the factors, Pa.
pub const P_REF: f64 = 101_325.0;

/// The reference temperatures of the factors, K (0, 15 and 20 degC).
pub const TEMPERATURES: [f64; 3] = [273.15, 288.15, 293.15];

const CSV: &str = include_str!("data/iso6976_summation_factors.csv");

/// The embedded factors, read once.
fn factors() -> Result<&'static [Factor], String> {
    static FACTORS: std::sync::LazyLock<Result<Vec<Factor>, String>> =
        std::sync::LazyLock::new(parse);
    FACTORS.as_deref().map_err(Clone::clone)
}

/// One summation factor.
#[derive(Debug, Clone, PartialEq)]
struct Factor {
    id: String,
    t: f64,
    sqrt_b: f64,
    confidence: String,
}

fn parse() -> Result<Vec<Factor>, String> {
    let mut rdr = csv::Reader::from_reader(CSV.as_bytes());
    let mut out = Vec::new();
    for rec in rdr.records() {
        let rec = rec.map_err(|e| format!("built-in summation factors: {e}"))?;
        let num = |i: usize| {
            rec.get(i)
                .and_then(|s| s.trim().parse::<f64>().ok())
                .ok_or_else(|| format!("built-in summation factors: bad number in {rec:?}"))
        };
        out.push(Factor {
            id: rec.get(0).unwrap_or_default().to_string(),
            t: num(1)?,
            sqrt_b: num(2)?,
            confidence: rec.get(3).unwrap_or_default().to_string(),
        });
    }
    Ok(out)
}

/// The summation value of one mixture at one reference temperature.
#[derive(Debug, Clone, PartialEq)]
pub struct Summation {
    /// Temperature, K.
    pub t: f64,
    /// Compression factor at `t` and 101.325 kPa.
    pub z: f64,
    /// The lowest confidence mark among the factors used.
    pub confidence: String,
}

/// Z of the mixture of component ids `ids` with mole fractions `x` at `t` (one of
/// [`TEMPERATURES`]); an error names the components without a factor there.
pub fn z_mix(ids: &[&str], x: &[f64], t: f64) -> Result<Summation, String> {
    let all = factors()?;
    let mut sum = 0.0;
    let mut missing = Vec::new();
    let mut lowest = "high";
    let rank = |c: &str| match c {
        "high" => 2,
        "medium" => 1,
        _ => 0,
    };
    for (id, xi) in ids.iter().zip(x) {
        match all.iter().find(|f| f.id == *id && (f.t - t).abs() < 1e-6) {
            Some(f) => {
                sum += xi * f.sqrt_b;
                if rank(&f.confidence) < rank(lowest) {
                    lowest = match rank(&f.confidence) {
                        1 => "medium",
                        _ => "low",
                    };
                }
            }
            None => missing.push(id.to_string()),
        }
    }
    if !missing.is_empty() {
        let have: Vec<String> = {
            let mut v: Vec<String> = all.iter().map(|f| f.id.clone()).collect();
            v.dedup();
            v
        };
        return Err(format!(
            "no ISO 6976 summation factor at hand for {} at {t} K; the built-in factors are for \
             {}",
            missing.join(", "),
            have.join(", ")
        ));
    }
    Ok(Summation {
        t,
        z: 1.0 - sum * sum,
        confidence: lowest.to_string(),
    })
}

/// The summation values of a mixture at the three reference temperatures.
pub fn all_temperatures(ids: &[&str], x: &[f64]) -> Result<Vec<Summation>, CliError> {
    TEMPERATURES
        .iter()
        .map(|&t| z_mix(ids, x, t))
        .collect::<Result<_, _>>()
        .map_err(CliError::BadInput)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_pure_gas_gives_back_its_tabulated_factor() {
        // ISO 6976:1995 Table 2 (from memory): methane sqrt(b) = 0.0447 at 15 degC, so
        // Z = 1 - 0.0447^2 = 0.998002.
        let s = z_mix(&["methane"], &[1.0], 288.15).unwrap();
        assert!((s.z - (1.0 - 0.0447_f64.powi(2))).abs() < 1e-15);
        assert_eq!(s.confidence, "high");
    }

    #[test]
    fn the_summation_is_over_x_sqrt_b_and_names_what_is_missing() {
        // By hand: 0.9 x 0.0447 + 0.1 x 0.0922 = 0.04945; Z = 1 - 0.04945^2 = 0.9975547.
        let s = z_mix(&["methane", "ethane"], &[0.9, 0.1], 288.15).unwrap();
        assert!((s.z - (1.0 - 0.04945_f64.powi(2))).abs() < 1e-12);
        let e = z_mix(&["methane", "n-pentane"], &[0.9, 0.1], 288.15).unwrap_err();
        assert!(e.contains("n-pentane"), "{e}");
        // The butane factors are marked low or medium: the mixture says so.
        let b = z_mix(&["methane", "n-butane"], &[0.9, 0.1], 273.15).unwrap();
        assert_eq!(b.confidence, "low");
    }
}
