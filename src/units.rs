//! Quantities with units, read from the command line and converted once to SI.
//!
//! Every quantity must carry its unit ("300 K", "25 degC", "70 barg", "0.9 g/cm3"); a bare
//! number is refused, because a pressure without "abs" or "g" and a temperature without a
//! scale are the classic sources of spreadsheet errors. Errors quote the input and list what
//! is accepted. Conversion factors are exact by definition (NIST SP 811, 2008 edition,
//! appendix B: 1 atm = 101 325 Pa, 1 psi = 6 894.757 293 168 Pa (from the exact inch and
//! pound-force), 1 lb = 0.453 592 37 kg, 1 ft = 0.3048 m; the Rankine and Fahrenheit scales
//! from T/K = (5/9) T/R and T/degF = 1.8 t/degC + 32).

use std::fmt;

/// Pascals per unit.
pub const PA_PER_KPA: f64 = 1e3;
pub const PA_PER_MPA: f64 = 1e6;
pub const PA_PER_BAR: f64 = 1e5;
pub const PA_PER_ATM: f64 = 101_325.0;
pub const PA_PER_PSI: f64 = 6_894.757_293_168_361;
/// Kelvin offset of the Celsius scale.
pub const KELVIN_AT_0_DEGC: f64 = 273.15;
/// Kelvin per rankine.
pub const K_PER_R: f64 = 5.0 / 9.0;
/// Kilograms per pound (avoirdupois).
pub const KG_PER_LB: f64 = 0.453_592_37;
/// Cubic metres per cubic foot.
pub const M3_PER_FT3: f64 = 0.3048 * 0.3048 * 0.3048;
/// Densities above these are refused at once: the densest liquids are near 2e4 kg/m3 and
/// 1.5e5 mol/m3 (common practice), and larger inputs would overflow unit conversions.
pub const MAX_MASS_DENSITY: f64 = 1e5;
pub const MAX_MOLAR_DENSITY: f64 = 1e7;
/// Default ambient pressure for gauge readings: one standard atmosphere.
pub const DEFAULT_AMBIENT_PA: f64 = PA_PER_ATM;

/// A quantity that could not be read.
#[derive(Debug, Clone, PartialEq)]
pub struct UnitError {
    /// The text as given.
    pub input: String,
    /// What kind of quantity was expected.
    pub quantity: &'static str,
    /// What is wrong with it.
    pub problem: String,
    /// What would be accepted.
    pub accepted: &'static str,
}

impl fmt::Display for UnitError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let article = match self.quantity.chars().next() {
            Some('a' | 'e' | 'i' | 'o' | 'u') => "an",
            _ => "a",
        };
        write!(
            f,
            "cannot read \"{}\" as {article} {}: {}; accepted: {}",
            self.input, self.quantity, self.problem, self.accepted
        )
    }
}

impl std::error::Error for UnitError {}

const TEMPERATURE_UNITS: &str =
    "a number with K, degC (or C), degF (or F) or R, for example \"300 K\" or \"25 degC\"";
const PRESSURE_UNITS: &str = "a number with Pa, hPa, kPa, MPa, GPa, mbar, bar, atm or psi for \
absolute pressure (also bara, psia), or barg, psig, kPag, MPag for gauge pressure (\"bar(g)\" and \
\"bar g\" too), for example \"70 barg\" or \"5 MPa\"; SI prefixes keep their case (mPa is a \
millipascal, MPa a megapascal)";
const DENSITY_UNITS: &str = "a number with kg/m3, g/cm3, g/L, lb/ft3 (mass) or mol/m3, mol/L, \
kmol/m3, lbmol/ft3 (molar), for example \"50 kg/m3\"";
const VOLUME_UNITS: &str = "a number with m3, L, cm3, ft3 or USgal, for example \"1 m3\"";

/// Splits "12.5 kPa" into (12.5, "kPa"). The number must be finite and the unit present.
pub fn split(
    input: &str,
    quantity: &'static str,
    accepted: &'static str,
) -> Result<(f64, String), UnitError> {
    let err = |problem: String| UnitError {
        input: input.to_string(),
        quantity,
        problem,
        accepted,
    };
    let s = input.trim();
    let end = s
        .char_indices()
        .find(|&(i, c)| {
            !(c.is_ascii_digit()
                || c == '.'
                || c == '+'
                || c == '-'
                || ((c == 'e' || c == 'E')
                    && s[i + 1..]
                        .chars()
                        .next()
                        .is_some_and(|n| n.is_ascii_digit() || n == '-' || n == '+')))
        })
        .map_or(s.len(), |(i, _)| i);
    let (num, unit) = s.split_at(end);
    if num.is_empty() {
        return Err(err("it does not start with a number".to_string()));
    }
    let value: f64 = num
        .parse()
        .map_err(|_| err(format!("\"{num}\" is not a number")))?;
    if !value.is_finite() {
        return Err(err("the number is not finite".to_string()));
    }
    let unit = unit.trim();
    if unit.is_empty() {
        return Err(err("the unit is missing".to_string()));
    }
    Ok((value, unit.to_string()))
}

/// The error for a number that overflows once converted to SI.
fn too_large(input: &str, quantity: &'static str, accepted: &'static str) -> UnitError {
    UnitError {
        input: input.to_string(),
        quantity,
        problem: "the value overflows once converted to SI units".to_string(),
        accepted,
    }
}

/// `x` to 15 significant digits, the most a double holds for every decimal: a typed value
/// converted to SI keeps its decimal form (-20 degC is 253.15 K, not 253.14999999999998 K;
/// 70 barg with 101.325 kPa is 7101325 Pa) and loses nothing it was typed with.
pub fn decimal(x: f64) -> f64 {
    if !x.is_finite() || x == 0.0 {
        return x;
    }
    format!("{x:.14e}").parse().unwrap_or(x)
}

/// Reads a temperature and returns it in kelvin (must be above absolute zero).
pub fn temperature(input: &str) -> Result<f64, UnitError> {
    let (v, unit) = split(input, "temperature", TEMPERATURE_UNITS)?;
    let u = unit.replace('°', "deg").to_ascii_lowercase();
    let k = match u.as_str() {
        "k" | "kelvin" => v,
        "degc" | "c" | "deg c" | "celsius" => v + KELVIN_AT_0_DEGC,
        "degf" | "f" | "deg f" | "fahrenheit" => (v - 32.0) * K_PER_R + KELVIN_AT_0_DEGC,
        "r" | "degr" | "deg r" | "rankine" => v * K_PER_R,
        _ => {
            return Err(UnitError {
                input: input.to_string(),
                quantity: "temperature",
                problem: format!("unknown unit \"{unit}\""),
                accepted: TEMPERATURE_UNITS,
            })
        }
    };
    if !k.is_finite() {
        return Err(too_large(input, "temperature", TEMPERATURE_UNITS));
    }
    let k = decimal(k);
    if k <= 0.0 {
        return Err(UnitError {
            input: input.to_string(),
            quantity: "temperature",
            problem: format!("it is {k} K, at or below absolute zero"),
            accepted: TEMPERATURE_UNITS,
        });
    }
    Ok(k)
}

/// A pressure as entered: absolute or gauge, in Pa.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Pressure {
    /// Absolute pressure, Pa.
    Absolute(f64),
    /// Gauge pressure (above ambient), Pa.
    Gauge(f64),
}

impl Pressure {
    /// Absolute pressure in Pa, with gauge readings referred to `ambient_pa`.
    pub fn absolute(self, ambient_pa: f64) -> f64 {
        match self {
            Pressure::Absolute(p) => p,
            Pressure::Gauge(p) => p + ambient_pa,
        }
    }

    /// True for a gauge reading.
    pub fn is_gauge(self) -> bool {
        matches!(self, Pressure::Gauge(_))
    }
}

/// Reads a pressure, absolute or gauge. Absolute values must be above zero; gauge values are
/// checked once the ambient pressure is known ([`absolute_pressure`]).
pub fn pressure(input: &str) -> Result<Pressure, UnitError> {
    let (v, unit) = split(input, "pressure", PRESSURE_UNITS)?;
    let mut u: String = unit
        .chars()
        .filter(|c| !c.is_whitespace() && *c != '(' && *c != ')')
        .collect::<String>();
    let gauge = if let Some(base) = u
        .strip_suffix('g')
        .or_else(|| u.strip_suffix('G'))
        .filter(|b| !b.is_empty())
    {
        u = base.to_string();
        true
    } else if let Some(base) = u
        .strip_suffix('a')
        .or_else(|| u.strip_suffix('A'))
        .filter(|b| b.eq_ignore_ascii_case("bar") || b.eq_ignore_ascii_case("psi"))
    {
        u = base.to_string();
        false
    } else {
        false
    };
    let factor = match pressure_factor(&u) {
        Some(f) if !(gauge && u.eq_ignore_ascii_case("atm")) => f,
        _ => {
            return Err(UnitError {
                input: input.to_string(),
                quantity: "pressure",
                problem: format!("unknown unit \"{unit}\""),
                accepted: PRESSURE_UNITS,
            })
        }
    };
    let pa = v * factor;
    if !pa.is_finite() {
        return Err(too_large(input, "pressure", PRESSURE_UNITS));
    }
    if factor < 1.0 {
        crate::input_notes::push(format!(
            "\"{}\" is read as {pa:e} Pa: m is milli (a millipascal is 1e-3 Pa); for \
             megapascals write MPa",
            input.trim()
        ));
    }
    if gauge {
        Ok(Pressure::Gauge(pa))
    } else if pa <= 0.0 {
        Err(UnitError {
            input: input.to_string(),
            quantity: "pressure",
            problem: "an absolute pressure must be above zero".to_string(),
            accepted: PRESSURE_UNITS,
        })
    } else {
        Ok(Pressure::Absolute(pa))
    }
}

/// Pascals per unit of a pressure unit without its gauge or absolute mark. The prefix keeps
/// its SI case where case changes the meaning (m milli, M mega); the rest of the symbol is
/// read in any case ("kPa", "KPA", "bar", "BAR"), since no other unit shares it.
fn pressure_factor(unit: &str) -> Option<f64> {
    let lower = unit.to_ascii_lowercase();
    let milli = unit.starts_with('m');
    Some(match lower.as_str() {
        "pa" => 1.0,
        "hpa" => 100.0,
        "kpa" => PA_PER_KPA,
        "mpa" if milli => 1e-3,
        "mpa" => PA_PER_MPA,
        "gpa" => 1e9,
        "mbar" if milli => 100.0,
        "bar" => PA_PER_BAR,
        "atm" => PA_PER_ATM,
        "psi" => PA_PER_PSI,
        _ => return None,
    })
}

/// Absolute pressure in Pa of a reading, refusing gauge readings at or below a vacuum.
pub fn absolute_pressure(input: &str, p: Pressure, ambient_pa: f64) -> Result<f64, UnitError> {
    let abs = decimal(p.absolute(ambient_pa));
    if abs > 0.0 {
        Ok(abs)
    } else {
        Err(UnitError {
            input: input.to_string(),
            quantity: "pressure",
            problem: format!(
                "with the ambient pressure of {ambient_pa} Pa it is {abs} Pa absolute, at or below a perfect vacuum"
            ),
            accepted: PRESSURE_UNITS,
        })
    }
}

/// The ambient pressure that gauge readings are referred to, Pa (itself absolute).
pub fn ambient_pressure(input: &str) -> Result<f64, UnitError> {
    pressure(input).and_then(|p| absolute_pressure(input, p, 0.0))
}

/// An absolute pressure in Pa, and whether it was read as a gauge pressure.
pub type PressureReading = (f64, bool);

/// A temperature (K) and an absolute pressure (Pa, with the gauge flag), each where given:
/// the temperature is read first, so its error is the one reported when both are bad.
pub fn optional_tp(
    temperature_text: Option<&str>,
    pressure_text: Option<&str>,
    ambient_pa: f64,
) -> Result<(Option<f64>, Option<PressureReading>), UnitError> {
    let t = temperature_text.map(temperature).transpose()?;
    let p = pressure_text
        .map(|text| pressure_reading(text, ambient_pa))
        .transpose()?;
    Ok((t, p))
}

/// An absolute pressure in Pa from a reading that may be gauge, with the gauge flag.
pub fn pressure_reading(input: &str, ambient_pa: f64) -> Result<PressureReading, UnitError> {
    let reading = pressure(input)?;
    Ok((
        absolute_pressure(input, reading, ambient_pa)?,
        reading.is_gauge(),
    ))
}

/// A density as entered.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Density {
    /// kg/m3.
    Mass(f64),
    /// mol/m3.
    Molar(f64),
}

impl Density {
    /// Molar density in mol/m3 for a fluid of molar mass `m` (kg/mol).
    pub fn molar(self, m: f64) -> f64 {
        match self {
            Density::Mass(d) => d / m,
            Density::Molar(d) => d,
        }
    }
}

/// Reads a mass or molar density (must be above zero).
pub fn density(input: &str) -> Result<Density, UnitError> {
    let d = density_reading(input)?;
    let beyond = match d {
        Density::Mass(x) => x > MAX_MASS_DENSITY,
        Density::Molar(x) => x > MAX_MOLAR_DENSITY,
    };
    if beyond {
        return Err(UnitError {
            input: input.to_string(),
            quantity: "density",
            problem: format!(
                "no fluid is that dense (limits: {MAX_MASS_DENSITY:e} kg/m3, {MAX_MOLAR_DENSITY:e} mol/m3)"
            ),
            accepted: DENSITY_UNITS,
        });
    }
    Ok(d)
}

/// Reads a density as written, however large: for values that are findings rather than
/// inputs (a spreadsheet's density computed with a gas constant in the wrong units is the
/// audit's best catch, not an unreadable cell). Only a non-finite or non-positive value is
/// refused.
pub fn density_reading(input: &str) -> Result<Density, UnitError> {
    let (v, unit) = split(input, "density", DENSITY_UNITS)?;
    let u: String = unit
        .chars()
        .filter(|c| !c.is_whitespace())
        .collect::<String>()
        .to_ascii_lowercase()
        .replace('³', "3")
        .replace("^3", "3");
    let d = match u.as_str() {
        "kg/m3" => Density::Mass(v),
        "g/cm3" | "g/ml" | "kg/l" => Density::Mass(v * 1e3),
        "g/l" | "g/dm3" => Density::Mass(v),
        "lb/ft3" => Density::Mass(v * KG_PER_LB / M3_PER_FT3),
        "mol/m3" => Density::Molar(v),
        "mol/l" | "mol/dm3" | "kmol/m3" => Density::Molar(v * 1e3),
        "lbmol/ft3" => Density::Molar(v * KG_PER_LB * 1e3 / M3_PER_FT3),
        _ => {
            return Err(UnitError {
                input: input.to_string(),
                quantity: "density",
                problem: format!("unknown unit \"{unit}\""),
                accepted: DENSITY_UNITS,
            })
        }
    };
    let raw = match d {
        Density::Mass(x) | Density::Molar(x) => x,
    };
    if !raw.is_finite() {
        return Err(too_large(input, "density", DENSITY_UNITS));
    }
    if raw <= 0.0 {
        return Err(UnitError {
            input: input.to_string(),
            quantity: "density",
            problem: "a density must be above zero".to_string(),
            accepted: DENSITY_UNITS,
        });
    }
    Ok(d)
}

/// Reads a volume and returns it in m3 (must be above zero).
pub fn volume(input: &str) -> Result<f64, UnitError> {
    let (v, unit) = split(input, "volume", VOLUME_UNITS)?;
    let u = unit.to_ascii_lowercase().replace('³', "3");
    let m3 = match u.as_str() {
        "m3" => v,
        "l" | "dm3" | "litre" | "liter" => v * 1e-3,
        "cm3" => v * 1e-6,
        "ml" if unit.starts_with('m') => v * 1e-6,
        "ft3" => v * M3_PER_FT3,
        "usgal" | "gal" => v * 3.785_411_784e-3,
        _ => {
            return Err(UnitError {
                input: input.to_string(),
                quantity: "volume",
                problem: format!("unknown unit \"{unit}\""),
                accepted: VOLUME_UNITS,
            })
        }
    };
    if !m3.is_finite() {
        return Err(too_large(input, "volume", VOLUME_UNITS));
    }
    if m3 <= 0.0 {
        return Err(UnitError {
            input: input.to_string(),
            quantity: "volume",
            problem: "a volume must be above zero".to_string(),
            accepted: VOLUME_UNITS,
        });
    }
    Ok(m3)
}

/// Reads a fraction written as a fraction or as a percentage with % ("0.78", "78%",
/// "78 %"); `what` names the quantity in messages. A number above one without % is refused
/// (it is most likely a percentage without its sign).
pub fn fraction(input: &str, what: &'static str, accepted: &'static str) -> Result<f64, UnitError> {
    let err = |problem: String| UnitError {
        input: input.to_string(),
        quantity: what,
        problem,
        accepted,
    };
    let s = input.trim();
    let (num, percent) = match s.strip_suffix('%') {
        Some(n) => (n.trim(), true),
        None => (s, false),
    };
    let scale = if percent { 0.01 } else { 1.0 };
    let v: f64 = num
        .parse()
        .map_err(|_| err(format!("\"{num}\" is not a number")))?;
    if !v.is_finite() {
        return Err(err("it is not a finite number".to_string()));
    }
    if !percent && v > 1.0 && v <= 100.0 {
        return Err(err(format!(
            "{v} is above one: write {v}% for a percentage, or the fraction {}",
            v / 100.0
        )));
    }
    Ok(v * scale)
}

/// Reads a machine efficiency (isentropic or polytropic): above 0 and at most 1, as a
/// fraction or a percentage ("0.78", "78%"). Used as a command-line value parser.
pub fn efficiency(input: &str) -> Result<f64, String> {
    const ACCEPTED: &str = "a fraction above 0 and at most 1, or a percentage, e.g. 0.78 or 78%";
    let e = fraction(input, "efficiency", ACCEPTED).map_err(|e| e.to_string())?;
    if e > 0.0 && e <= 1.0 {
        Ok(e)
    } else {
        Err(format!(
            "efficiency \"{input}\" must lie above 0 and at most 1 (100 %)"
        ))
    }
}

/// Reads a vapour quality: a fraction from 0 to 1, or a percentage with %.
pub fn quality(input: &str) -> Result<f64, UnitError> {
    const ACCEPTED: &str =
        "a number from 0 (saturated liquid) to 1 (saturated vapour), or 0% to 100%";
    let x = fraction(input, "vapour quality", ACCEPTED)?;
    if !(0.0..=1.0).contains(&x) {
        return Err(UnitError {
            input: input.to_string(),
            quantity: "vapour quality",
            problem: "it is outside 0 to 1".to_string(),
            accepted: ACCEPTED,
        });
    }
    Ok(x)
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn si_prefixes_keep_their_case() {
        // SI brochure (BIPM, 9th ed., 2019, table 7): m is milli (1e-3), M mega (1e6), h
        // hecto, k kilo, G giga. "1 mPa" was once read as a megapascal.
        let pa = |s: &str| pressure(s).unwrap().absolute(0.0);
        assert_relative_eq!(pa("1 mPa"), 1e-3);
        assert_relative_eq!(pa("1 mpa"), 1e-3);
        assert_relative_eq!(pa("1 MPa"), 1e6);
        assert_relative_eq!(pa("1 MPA"), 1e6);
        assert_relative_eq!(pa("1 Mpa"), 1e6);
        assert_relative_eq!(pa("1 KPA"), 1e3);
        assert_relative_eq!(pa("1013.25 hPa"), 101_325.0);
        assert_relative_eq!(pa("1013.25 mbar"), 101_325.0);
        assert_relative_eq!(pa("0.1 GPa"), 1e8);
        assert_relative_eq!(pa("70 BAR"), 7e6);
        assert!(pressure("1 Mbar").is_err(), "a megabar is no gas pressure");
        assert_relative_eq!(pressure("5 MPag").unwrap().absolute(1e5), 5.1e6);
        assert_relative_eq!(pressure("5 BARG").unwrap().absolute(1e5), 6e5);
        // Litres: mL is a millilitre; ML (a megalitre) is not read as one.
        assert_relative_eq!(volume("500 mL").unwrap(), 5e-4);
        assert!(volume("1 ML").is_err());
    }

    #[test]
    fn temperatures_on_every_scale() {
        // Definitions of the scales (NIST SP 811 appendix B).
        assert_relative_eq!(temperature("300 K").unwrap(), 300.0);
        assert_relative_eq!(temperature("25 degC").unwrap(), 298.15);
        assert_relative_eq!(temperature("25°C").unwrap(), 298.15);
        assert_relative_eq!(
            temperature("32 degF").unwrap(),
            273.15,
            max_relative = 1e-14
        );
        assert_relative_eq!(temperature("-40 F").unwrap(), 233.15, max_relative = 1e-14);
        assert_relative_eq!(
            temperature("491.67 R").unwrap(),
            273.15,
            max_relative = 1e-14
        );
        assert_relative_eq!(temperature("1e3 K").unwrap(), 1000.0);
    }

    #[test]
    fn bad_temperatures_quote_the_input() {
        for bad in [
            "300",
            "300 Q",
            "-300 degC",
            "0 K",
            "abc K",
            "nan K",
            "inf K",
        ] {
            let e = temperature(bad).unwrap_err();
            assert!(e.to_string().contains(bad.trim()), "{e}");
        }
    }

    #[test]
    fn pressures_absolute_and_gauge() {
        assert_relative_eq!(pressure("5 MPa").unwrap().absolute(0.0), 5e6);
        assert_relative_eq!(pressure("70 bara").unwrap().absolute(0.0), 70e5);
        assert_eq!(pressure("70 barg").unwrap(), Pressure::Gauge(70e5));
        assert_eq!(pressure("70 bar(g)").unwrap(), Pressure::Gauge(70e5));
        assert_eq!(pressure("70 bar g").unwrap(), Pressure::Gauge(70e5));
        assert_eq!(pressure("1 atm").unwrap(), Pressure::Absolute(101_325.0));
        assert_relative_eq!(
            pressure("14.696 psia").unwrap().absolute(0.0),
            101_325.0,
            max_relative = 2e-5
        );
        assert!(pressure("100 psig").unwrap().is_gauge());
        assert!(pressure("0 bar").is_err());
        assert!(pressure("-1 kPa").is_err());
        assert!(pressure("3 atmg").is_err());
        assert!(pressure("3").is_err());
    }

    #[test]
    fn gauge_and_absolute_round_trip_exactly() {
        // p_abs = p_gauge + p_ambient and back, for binary-exact values (common practice).
        let ambient = 101_325.0;
        for g in [0.0, 1e5, 7e6, 12_345.5] {
            let abs = Pressure::Gauge(g).absolute(ambient);
            assert_eq!((abs - ambient).to_bits(), g.to_bits());
        }
        let e = absolute_pressure("-2 barg", pressure("-2 barg").unwrap(), ambient).unwrap_err();
        assert!(e.to_string().contains("-2 barg"));
    }

    #[test]
    fn qualities() {
        assert!((quality("25%").unwrap() - 0.25).abs() < 1e-15);
        assert!((quality("0.4").unwrap() - 0.4).abs() < 1e-15);
        assert!(quality("1.2").is_err());
        assert!((efficiency("78%").unwrap() - 0.78).abs() < 1e-15);
        assert!((efficiency("78 %").unwrap() - 0.78).abs() < 1e-15);
        assert!((efficiency("0.78").unwrap() - 0.78).abs() < 1e-15);
        for bad in ["78", "0", "-0.5", "120%", "x", "inf"] {
            assert!(efficiency(bad).is_err(), "{bad}");
        }
        assert!(efficiency("78").unwrap_err().contains("78%"));
        assert!(quality("abc").is_err());
    }

    #[test]
    fn densities_and_volumes() {
        assert_eq!(density("50 kg/m3").unwrap(), Density::Mass(50.0));
        assert_eq!(density("0.9 g/cm3").unwrap(), Density::Mass(900.0));
        assert_eq!(density("2 mol/L").unwrap(), Density::Molar(2000.0));
        assert_relative_eq!(
            density("1 lb/ft3").unwrap().molar(1.0),
            16.018_463_373_960_14,
            max_relative = 1e-12
        );
        assert!(density("5 kg").is_err());
        assert_relative_eq!(volume("50 L").unwrap(), 0.05);
        assert!(volume("-1 m3").is_err());
        // Regression (found by tests/fuzz_parsers.rs): values that overflow after conversion.
        assert!(pressure("1e308 MPa").is_err());
        assert!(density("0.91E308g/cm3").is_err());
        assert!(density("1e308kg/m3").is_err());
    }
}
