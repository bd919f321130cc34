//! The IF97 coefficient tables, embedded from `eos/data/if97/*.csv` and parsed once.
//!
//! Each CSV starts with `#` lines that name its source (IAPWS R7-97(2012), table numbers) and
//! its confidence; then a header line and one row per term. Parsing happens on first use and is
//! cached; a malformed table is reported as a typed error, never a panic.

use crate::error::{Error, Result};
use std::sync::OnceLock;

/// One term n x^I y^J of a power series.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Term {
    pub i: i32,
    pub j: i32,
    pub n: f64,
}

/// Most distinct powers one series needs (J runs over at most 59 consecutive integers).
const MAX_POWERS: usize = 64;

/// A power series sum n a^I b^J with the exponent ranges needed to build the powers of a and b
/// by repeated multiplication (cheaper than one `powi` per term).
#[derive(Debug, Clone)]
pub struct Series {
    pub terms: Vec<Term>,
    i_min: i32,
    i_len: usize,
    j_min: i32,
    j_len: usize,
}

impl Series {
    fn new(table: &str, terms: Vec<Term>) -> Result<Self> {
        let i_min = terms.iter().map(|t| t.i).min().unwrap_or(0);
        let i_max = terms.iter().map(|t| t.i).max().unwrap_or(0);
        let j_min = terms.iter().map(|t| t.j).min().unwrap_or(0);
        let j_max = terms.iter().map(|t| t.j).max().unwrap_or(0);
        let (i_len, j_len) = ((i_max - i_min + 1) as usize, (j_max - j_min + 1) as usize);
        if i_len > MAX_POWERS || j_len > MAX_POWERS {
            return Err(Error::NoSolution(format!(
                "embedded IF97 table {table} spans more than {MAX_POWERS} exponents"
            )));
        }
        Ok(Series {
            terms,
            i_min,
            i_len,
            j_min,
            j_len,
        })
    }

    /// The six sums over the terms t = n a^I b^J: (sum t, sum I t, sum I(I-1) t, sum J t,
    /// sum J(J-1) t, sum I J t). a and b must be non-zero.
    #[inline]
    pub fn sums(&self, a: f64, b: f64) -> [f64; 6] {
        let mut pa = [0.0; MAX_POWERS];
        let mut pb = [0.0; MAX_POWERS];
        powers(a, self.i_min, &mut pa[..self.i_len]);
        powers(b, self.j_min, &mut pb[..self.j_len]);
        let mut s = [0.0; 6];
        for term in &self.terms {
            let t =
                term.n * pa[(term.i - self.i_min) as usize] * pb[(term.j - self.j_min) as usize];
            let (i, j) = (f64::from(term.i), f64::from(term.j));
            s[0] += t;
            s[1] += i * t;
            s[2] += i * (i - 1.0) * t;
            s[3] += j * t;
            s[4] += j * (j - 1.0) * t;
            s[5] += i * j * t;
        }
        s
    }
}

/// out[k] = x^(first + k).
#[inline]
fn powers(x: f64, first: i32, out: &mut [f64]) {
    let mut v = x.powi(first);
    for o in out.iter_mut() {
        *o = v;
        v *= x;
    }
}

/// Every IF97 table the formulation needs.
#[derive(Debug, Clone)]
pub struct Tables {
    pub region1: Series,
    /// Ideal part of region 2: `i` = 0, `j` = J0.
    pub region2_ideal: Series,
    pub region2_residual: Series,
    /// Coefficient of ln(delta) in region 3 (n1 of Table 30).
    pub region3_n1: f64,
    /// Terms 2..40 of region 3.
    pub region3: Series,
    /// n1..n10 of the saturation line.
    pub region4: [f64; 10],
    /// n1..n5 of the B23 boundary.
    pub b23: [f64; 5],
    /// Ideal part of region 5: `i` = 0, `j` = J0.
    pub region5_ideal: Series,
    pub region5_residual: Series,
}

const REGION1: &str = include_str!("../../data/if97/region1.csv");
const REGION2_IDEAL: &str = include_str!("../../data/if97/region2_ideal.csv");
const REGION2_RESIDUAL: &str = include_str!("../../data/if97/region2_residual.csv");
const REGION3: &str = include_str!("../../data/if97/region3.csv");
const REGION4: &str = include_str!("../../data/if97/region4.csv");
const B23: &str = include_str!("../../data/if97/b23.csv");
const REGION5_IDEAL: &str = include_str!("../../data/if97/region5_ideal.csv");
const REGION5_RESIDUAL: &str = include_str!("../../data/if97/region5_residual.csv");

/// Data rows of a table: comment lines and the header skipped, fields split on commas.
fn rows(text: &str) -> impl Iterator<Item = Vec<&str>> {
    text.lines()
        .map(str::trim)
        .filter(|l| !l.is_empty() && !l.starts_with('#'))
        .skip(1)
        .map(|l| l.split(',').map(str::trim).collect())
}

fn bad(table: &str, line: &[&str]) -> Error {
    Error::NoSolution(format!(
        "embedded IF97 table {table} has a malformed row: {}",
        line.join(",")
    ))
}

fn num<T: std::str::FromStr>(table: &str, row: &[&str], k: usize) -> Result<T> {
    row.get(k)
        .and_then(|s| s.parse::<T>().ok())
        .ok_or_else(|| bad(table, row))
}

/// Rows `i, I, J, n`.
fn terms_ijn(table: &str, text: &str) -> Result<Vec<Term>> {
    rows(text)
        .map(|r| {
            Ok(Term {
                i: num(table, &r, 1)?,
                j: num(table, &r, 2)?,
                n: num(table, &r, 3)?,
            })
        })
        .collect()
}

/// Rows `i, J0, n0`.
fn terms_jn(table: &str, text: &str) -> Result<Vec<Term>> {
    rows(text)
        .map(|r| {
            Ok(Term {
                i: 0,
                j: num(table, &r, 1)?,
                n: num(table, &r, 2)?,
            })
        })
        .collect()
}

/// Rows `i, n` into a fixed array.
fn coefficients<const N: usize>(table: &str, text: &str) -> Result<[f64; N]> {
    let mut out = [0.0; N];
    let mut count = 0;
    for r in rows(text) {
        let i: usize = num(table, &r, 0)?;
        if i == 0 || i > N {
            return Err(bad(table, &r));
        }
        out[i - 1] = num(table, &r, 1)?;
        count += 1;
    }
    if count == N {
        Ok(out)
    } else {
        Err(Error::NoSolution(format!(
            "embedded IF97 table {table} has {count} rows, expected {N}"
        )))
    }
}

fn expect_len(table: &str, v: Vec<Term>, n: usize) -> Result<Series> {
    if v.len() == n {
        Series::new(table, v)
    } else {
        Err(Error::NoSolution(format!(
            "embedded IF97 table {table} has {} terms, expected {n}",
            v.len()
        )))
    }
}

fn parse() -> Result<Tables> {
    let mut r3 = rows(REGION3);
    let first = r3
        .next()
        .ok_or_else(|| Error::NoSolution("embedded IF97 table region3 is empty".into()))?;
    let region3_n1: f64 = num("region3", &first, 3)?;
    let region3 = r3
        .map(|r| {
            Ok(Term {
                i: num("region3", &r, 1)?,
                j: num("region3", &r, 2)?,
                n: num("region3", &r, 3)?,
            })
        })
        .collect::<Result<Vec<_>>>()?;
    Ok(Tables {
        region1: expect_len("region1", terms_ijn("region1", REGION1)?, 34)?,
        region2_ideal: expect_len(
            "region2_ideal",
            terms_jn("region2_ideal", REGION2_IDEAL)?,
            9,
        )?,
        region2_residual: expect_len(
            "region2_residual",
            terms_ijn("region2_residual", REGION2_RESIDUAL)?,
            43,
        )?,
        region3_n1,
        region3: expect_len("region3", region3, 39)?,
        region4: coefficients("region4", REGION4)?,
        b23: coefficients("b23", B23)?,
        region5_ideal: expect_len(
            "region5_ideal",
            terms_jn("region5_ideal", REGION5_IDEAL)?,
            6,
        )?,
        region5_residual: expect_len(
            "region5_residual",
            terms_ijn("region5_residual", REGION5_RESIDUAL)?,
            6,
        )?,
    })
}

/// The parsed tables (parsed on the first call, then shared).
pub fn tables() -> Result<&'static Tables> {
    static TABLES: OnceLock<Result<Tables>> = OnceLock::new();
    TABLES.get_or_init(parse).as_ref().map_err(Clone::clone)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_table_parses_with_the_release_term_counts() {
        // Term counts of IAPWS R7-97(2012) Tables 2, 10, 11, 30, 34, 1, 37, 38.
        let t = tables().unwrap();
        assert_eq!(t.region1.terms.len(), 34);
        assert_eq!(t.region2_ideal.terms.len(), 9);
        assert_eq!(t.region2_residual.terms.len(), 43);
        assert_eq!(t.region3.terms.len() + 1, 40);
        assert_eq!(t.region5_ideal.terms.len(), 6);
        assert_eq!(t.region5_residual.terms.len(), 6);
    }

    #[test]
    fn b23_coefficients_satisfy_the_identities_of_eqs_5_and_6() {
        // T = n4 + sqrt((p - n5)/n3) inverts p = n1 + n2 T + n3 T^2 exactly when
        // n4 = -n2/(2 n3) and n5 = n1 - n2^2/(4 n3) (IAPWS R7-97(2012) Eqs. 5 and 6).
        let n = tables().unwrap().b23;
        approx::assert_relative_eq!(n[3], -n[1] / (2.0 * n[2]), max_relative = 1e-12);
        approx::assert_relative_eq!(
            n[4],
            n[0] - n[1] * n[1] / (4.0 * n[2]),
            max_relative = 1e-11
        );
    }
}
