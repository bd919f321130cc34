//! Lists and ranges of quantities for temperature and pressure grids.
//!
//! A grid axis is a comma-separated list of items; each item is either one quantity with its
//! unit, or a range written
//!
//! ```text
//! FROM..TO UNIT step STEP        e.g. "250..350 K step 25"   -> 250, 275, 300, 325, 350 K
//! FROM..TO UNIT n COUNT          e.g. "1..100 bar n 5"       -> 5 evenly spaced values
//! FROM..TO UNIT n COUNT log      e.g. "1..100 bar n 3 log"   -> 1, 10, 100 bar
//! ```
//!
//! Items may be mixed: `"250..350 K step 50, 400 K"`. A stepped range includes its end when
//! the end lies on a step (within 1e-9 of a step, to absorb decimal rounding); it never goes
//! past it. Every value is converted by the caller's unit reader ([`crate::units`]), so the
//! same units, gauge pressures and checks apply as to a single quantity. The values are kept
//! in the order written; duplicates are kept (a user's grid is taken as given).
//!
//! Errors quote the whole input and the item at fault.

use crate::units::UnitError;
use std::fmt;

/// The most values one axis may have (a 1000 x 1000 grid is well inside it).
pub const MAX_AXIS_VALUES: usize = 100_000;

/// Most states a grid may have: the results of every state are held in memory for the
/// report (a few hundred bytes each per model), so larger grids are refused rather than
/// risk running out of memory on an ordinary machine.
pub const MAX_GRID_STATES: usize = 4_000_000;

/// Refuses a T-P grid of more than [`MAX_GRID_STATES`] states with a message that says how
/// to proceed.
pub fn check_size(nt: usize, np: usize) -> Result<(), String> {
    let n = nt.saturating_mul(np);
    if n > MAX_GRID_STATES {
        return Err(format!(
            "the grid has {nt} temperatures x {np} pressures = {n} states, more than the \
             {MAX_GRID_STATES} zfactor holds in memory at once; split it into smaller grids"
        ));
    }
    Ok(())
}

/// A grid axis that could not be read.
#[derive(Debug, Clone, PartialEq)]
pub struct GridError {
    /// The whole input.
    pub input: String,
    /// What is wrong.
    pub problem: String,
}

impl fmt::Display for GridError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(
            f,
            "cannot read \"{}\" as a list of values: {}; write values with units separated by \
             commas (\"250 K,300 K\") or ranges \"FROM..TO UNIT step STEP\" \
             (\"250..350 K step 25\") or \"FROM..TO UNIT n COUNT [log]\" (\"1..100 bar n 12 log\")",
            self.input, self.problem
        )
    }
}

impl std::error::Error for GridError {}

/// How a range is divided.
#[derive(Debug, Clone, Copy, PartialEq)]
enum Spacing {
    Step(f64),
    Count { n: usize, log: bool },
}

/// Reads an axis: every item converted to SI by `convert` (which receives text such as
/// "275 K" and returns the value in SI or a unit error).
pub fn parse_axis<F>(input: &str, convert: F) -> Result<Vec<f64>, GridError>
where
    F: Fn(&str) -> Result<f64, UnitError>,
{
    let err = |problem: String| GridError {
        input: input.to_string(),
        problem,
    };
    let items: Vec<&str> = input
        .split([',', ';'])
        .map(str::trim)
        .filter(|s| !s.is_empty())
        .collect();
    if items.is_empty() {
        return Err(err("no values given".to_string()));
    }
    let mut out = Vec::new();
    for item in items {
        if item.contains("..") {
            let raw = range_values(item).map_err(|p| err(format!("in \"{item}\": {p}")))?;
            if out.len() + raw.values.len() > MAX_AXIS_VALUES {
                return Err(err(format!("more than {MAX_AXIS_VALUES} values")));
            }
            for v in raw.values {
                let text = format!("{v} {}", raw.unit);
                let si = convert(&text)
                    .map_err(|e| err(format!("in \"{item}\", the value {text}: {}", e.problem)))?;
                out.push(si);
            }
        } else {
            let si = convert(item).map_err(|e| err(format!("\"{item}\": {}", e.problem)))?;
            if out.len() + 1 > MAX_AXIS_VALUES {
                return Err(err(format!("more than {MAX_AXIS_VALUES} values")));
            }
            out.push(si);
        }
    }
    Ok(out)
}

/// The numbers of a range in the entered unit, and that unit.
struct RawRange {
    values: Vec<f64>,
    unit: String,
}

fn number(text: &str, what: &str) -> Result<f64, String> {
    let v: f64 = text
        .trim()
        .parse()
        .map_err(|_| format!("{what} \"{}\" is not a number", text.trim()))?;
    if v.is_finite() {
        Ok(v)
    } else {
        Err(format!("{what} \"{}\" is not finite", text.trim()))
    }
}

/// Splits "250..350 K step 25" and produces the values.
fn range_values(item: &str) -> Result<RawRange, String> {
    let (from, rest) = item
        .split_once("..")
        .ok_or_else(|| "a range needs FROM..TO".to_string())?;
    let from = number(from, "the start")?;
    let rest = rest.trim();
    let end_len = rest
        .char_indices()
        .find(|&(i, c)| {
            !(c.is_ascii_digit()
                || c == '.'
                || c == '+'
                || (c == '-' && i == 0)
                || ((c == 'e' || c == 'E')
                    && rest[i + 1..]
                        .chars()
                        .next()
                        .is_some_and(|n| n.is_ascii_digit() || n == '-' || n == '+'))
                || ((c == '-' || c == '+') && i > 0 && matches!(&rest[i - 1..i], "e" | "E")))
        })
        .map_or(rest.len(), |(i, _)| i);
    let (to_text, tail) = rest.split_at(end_len);
    if to_text.is_empty() {
        return Err("the end of the range is missing (write FROM..TO UNIT ...)".to_string());
    }
    let to = number(to_text, "the end")?;
    let words: Vec<&str> = tail.split_whitespace().collect();
    let key = words
        .iter()
        .position(|w| w.eq_ignore_ascii_case("step") || w.eq_ignore_ascii_case("n"))
        .ok_or_else(|| "a range needs \"step STEP\" or \"n COUNT\" after its unit".to_string())?;
    let unit = words[..key].join(" ");
    if unit.is_empty() {
        return Err("the unit is missing (write e.g. \"250..350 K step 25\")".to_string());
    }
    let spacing = match (words[key].to_ascii_lowercase().as_str(), &words[key + 1..]) {
        ("step", [s]) => Spacing::Step(number(s, "the step")?),
        ("n", [n]) | ("n", [n, _]) => {
            let log = match words.get(key + 2) {
                None => false,
                Some(w) if w.eq_ignore_ascii_case("log") => true,
                Some(w) => return Err(format!("\"{w}\" after the count is not \"log\"")),
            };
            let count: usize = n
                .parse()
                .map_err(|_| format!("the count \"{n}\" is not a whole number"))?;
            Spacing::Count { n: count, log }
        }
        (_, []) => return Err(format!("\"{}\" needs a value after it", words[key])),
        _ => return Err(format!("unexpected text after \"{}\"", words[key])),
    };
    let values = spaced(from, to, spacing)?;
    Ok(RawRange { values, unit })
}

/// The values of a range.
fn spaced(from: f64, to: f64, spacing: Spacing) -> Result<Vec<f64>, String> {
    match spacing {
        Spacing::Step(step) => {
            if step <= 0.0 {
                return Err("the step must be above zero".to_string());
            }
            if to < from {
                return Err("the end is below the start; write the range upwards".to_string());
            }
            let span = (to - from) / step;
            // 1e-9 of a step absorbs decimal steps such as 0.1 that are not exact in binary.
            let n = (span + 1e-9).floor();
            if n + 1.0 > MAX_AXIS_VALUES as f64 {
                return Err(format!("it has more than {MAX_AXIS_VALUES} values"));
            }
            let n = n as usize;
            Ok((0..=n)
                .map(|k| {
                    let v = from + k as f64 * step;
                    // The last value is written as the end when it lands on it.
                    if k == n && (v - to).abs() <= 1e-9 * step {
                        to
                    } else {
                        v
                    }
                })
                .collect())
        }
        Spacing::Count { n, log } => {
            if n < 2 {
                return Err("a range needs a count of at least 2".to_string());
            }
            if n > MAX_AXIS_VALUES {
                return Err(format!("it has more than {MAX_AXIS_VALUES} values"));
            }
            if log && (from <= 0.0 || to <= 0.0) {
                return Err("a log range needs a start and an end above zero".to_string());
            }
            let last = (n - 1) as f64;
            Ok((0..n)
                .map(|k| {
                    let f = k as f64 / last;
                    if k == 0 {
                        from
                    } else if k == n - 1 {
                        to
                    } else if log {
                        (from.ln() + f * (to.ln() - from.ln())).exp()
                    } else {
                        from + f * (to - from)
                    }
                })
                .collect())
        }
    }
}

#[cfg(test)]
mod size_tests {
    use super::*;

    #[test]
    fn oversized_grids_are_refused_before_any_allocation() {
        assert!(check_size(2000, 2000).is_ok());
        let e = check_size(100_000, 100_000).unwrap_err();
        assert!(e.contains("10000000000"), "{e}");
        assert!(check_size(usize::MAX, 3).is_err());
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::units;
    use approx::assert_relative_eq;

    fn t(s: &str) -> Result<Vec<f64>, GridError> {
        parse_axis(s, units::temperature)
    }

    #[test]
    fn lists_and_stepped_ranges() {
        // Arithmetic of the definitions above; 0 degC = 273.15 K (ITS-90 / SI definition).
        assert_eq!(t("250 K,300 K, 350 K").unwrap(), vec![250.0, 300.0, 350.0]);
        assert_eq!(
            t("250..350 K step 25").unwrap(),
            vec![250.0, 275.0, 300.0, 325.0, 350.0]
        );
        let c = t("0..20 degC step 10").unwrap();
        assert_relative_eq!(c[2], 293.15, max_relative = 1e-15);
        // The end is not on a step: the range stops below it.
        assert_eq!(t("250..340 K step 25").unwrap().len(), 4);
        // Decimal steps that are inexact in binary still reach the end.
        let d = t("0.1..0.5 K step 0.1").unwrap();
        assert_eq!(d.len(), 5);
        assert_relative_eq!(d[4], 0.5);
        assert_eq!(
            t("250..300 K step 50, 400 K").unwrap(),
            vec![250.0, 300.0, 400.0]
        );
    }

    #[test]
    fn counted_and_logarithmic_ranges() {
        let p = parse_axis("1..100 bar n 3 log", |s| {
            units::pressure(s).map(|p| p.absolute(0.0))
        })
        .unwrap();
        assert_relative_eq!(p[0], 1e5);
        assert_relative_eq!(p[1], 1e6, max_relative = 1e-14);
        assert_relative_eq!(p[2], 1e7);
        let l = t("200..300 K n 5").unwrap();
        assert_eq!(l, vec![200.0, 225.0, 250.0, 275.0, 300.0]);
        // Gauge pressures in ranges go through the same reader.
        let g = parse_axis("0..10 barg n 2", |s| {
            units::pressure(s).map(|p| p.absolute(101_325.0))
        })
        .unwrap();
        assert_relative_eq!(g[0], 101_325.0);
        assert_relative_eq!(g[1], 1_101_325.0);
    }

    #[test]
    fn bad_axes_quote_the_input() {
        for bad in [
            "",
            "250",
            "250 Q",
            "250..350 K",
            "250..350 step 25",
            "350..250 K step 25",
            "250..350 K step 0",
            "250..350 K step -5",
            "250..350 K n 1",
            "250..350 K n x",
            "0..350 K n 3 log",
            "1..5 K n 3 lin",
            "..350 K step 5",
            "250.. K step 5",
            "1..1e9 K step 1",
            "-10..300 K step 10",
        ] {
            let e = t(bad).unwrap_err();
            assert!(e.to_string().contains(&format!("\"{bad}\"")), "{e}");
        }
    }
}
