//! A gas analysis from a file (`--mix-file FILE`, CSV or .xlsx): one component per row, as a
//! laboratory or an online chromatograph reports it.
//!
//! Two columns are needed, found by their header (any case, units in brackets or
//! parentheses like every file the tool reads):
//! - the component: `component`, `name`, `compound` or `species`; any name the component
//!   lookup accepts, and the trade's labels (C1, C2, C3, iC4, nC4, neoC5, iC5, nC5, N2, CO2,
//!   H2S, He, H2, O2, H2O). C6 to C10 without a plus are read as the normal alkane of that
//!   carbon number (the isomers lumped, common practice), with a warning that says so;
//! - the amount: a header that is its unit, or a name with the unit: `mol %`, `mole %`,
//!   `mol/mol`, `mole fraction`, `mass %`, `wt %`, `mass fraction`, `amount [mol %]`, ...
//!   The unit sets the basis (mole or mass) and the scale (percent or fraction).
//!
//! Rows with an amount of zero (components looked for and not found) and blank rows are
//! passed over; a row labelled `total` or `sum` is checked against the sum of the rows
//! above it. A plus fraction (C6+, C7+) is refused: it needs a characterisation, which the
//! tool does not do yet. The sum must lie within [`SUM_TOLERANCE`] of 100 % (or one), the
//! rounding of an analysis printed to three decimals in mole percent; beyond it the file is
//! refused with its sum unless `--normalize` is given. The sum as read is always kept and
//! printed with the normalised composition.

use crate::cli::Basis;
use crate::error::CliError;
use crate::feed::{self, Amounts, Feed};
use crate::sheet_rows::{kind_of, Kind};
use fluids::ComponentRecord;
use std::path::Path;

/// Relative miss of the sum that is taken as rounding: 0.1 % (an analysis of 10-25 lines
/// printed to three decimals in mole percent misses 100 by up to about 0.01; laboratories
/// normalise to 100; common practice).
pub const SUM_TOLERANCE: f64 = 1e-3;

/// The unit of the amount column: basis and percent.
fn amount_unit(text: &str) -> Option<(Basis, bool)> {
    let t: String = text
        .to_ascii_lowercase()
        .chars()
        .filter(|c| !c.is_whitespace() && *c != '-' && *c != '_')
        .collect();
    match t.as_str() {
        "mol%" | "mole%" | "molpercent" | "molepercent" | "%mol" | "mol.%" => {
            Some((Basis::Mole, true))
        }
        "molefraction" | "molfraction" | "mol/mol" | "molefrac" | "x" | "y" => {
            Some((Basis::Mole, false))
        }
        "mass%" | "wt%" | "weight%" | "masspercent" | "%wt" | "%mass" | "wt.%" => {
            Some((Basis::Mass, true))
        }
        "massfraction" | "weightfraction" | "kg/kg" | "g/g" | "massfrac" => {
            Some((Basis::Mass, false))
        }
        _ => None,
    }
}

/// The component of a label: the lookup's, or a lumped carbon number (C6..C10), with the
/// warning that says so.
fn component(label: &str) -> Result<(&'static ComponentRecord, Option<String>), String> {
    let l = label.trim();
    if l.ends_with('+') || l.to_ascii_lowercase().contains("plus") {
        return Err(format!(
            "\"{l}\" is a plus fraction: it needs a characterisation (critical constants \
             from its molar mass and specific gravity), which this version does not do; \
             replace it by a defined component (for example n-heptane for C7+) and record \
             that choice in your basis"
        ));
    }
    let found = fluids::find(l);
    if let Ok(r) = found {
        return Ok((r, None));
    }
    let lumped = match l.to_ascii_uppercase().as_str() {
        "C6" => Some("n-hexane"),
        "C7" => Some("n-heptane"),
        "C8" => Some("n-octane"),
        "C9" => Some("n-nonane"),
        "C10" => Some("n-decane"),
        _ => None,
    };
    match lumped {
        Some(id) => {
            let r = fluids::find(id).map_err(|e| e.to_string())?;
            Ok((
                r,
                Some(format!(
                    "\"{l}\" is read as {} (the C{} isomers lumped as the normal alkane)",
                    r.name,
                    &l[1..]
                )),
            ))
        }
        None => fluids::find(l)
            .map(|r| (r, None))
            .map_err(|e| e.to_string()),
    }
}

/// The rows of a CSV or .xlsx file as (row number, cells), header first.
fn rows_of(path: &Path) -> Result<Vec<(usize, Vec<String>)>, String> {
    match kind_of(path).map_err(|e| e.to_string())? {
        Kind::Csv => {
            let mut rdr = csv::ReaderBuilder::new()
                .has_headers(false)
                .flexible(true)
                .trim(csv::Trim::All)
                .from_path(path)
                .map_err(|e| e.to_string())?;
            let mut out = Vec::new();
            for (k, rec) in rdr.records().enumerate() {
                let rec = rec.map_err(|e| format!("row {}: {e}", k + 1))?;
                out.push((k + 1, rec.iter().map(str::to_string).collect()));
            }
            Ok(out)
        }
        Kind::Xlsx => {
            let mut sheet = crate::xlsx_rows::Sheet::open(path, None)?;
            let mut out = vec![(0, sheet.headers.clone())];
            let mut rows = Vec::new();
            sheet.next_rows(usize::MAX, &mut rows);
            for (row, cells, problem) in rows {
                if let Some(p) = problem {
                    return Err(format!("row {row}: {}", p.message));
                }
                out.push((row, cells.iter().map(str::to_string).collect()));
            }
            Ok(out)
        }
    }
}

/// Reads the analysis in `path` (see the module documentation).
pub fn read(path: &str, normalize: bool) -> Result<Feed, CliError> {
    let fail = |m: String| CliError::BadInput(format!("--mix-file {path}: {m}"));
    let rows = rows_of(Path::new(path)).map_err(fail)?;
    let Some(((_, header), body)) = rows.split_first() else {
        return Err(fail("the file is empty".to_string()));
    };
    let mut name_col = None;
    let mut amount_col = None;
    for (i, h) in header.iter().enumerate() {
        let (name, unit) = crate::file_header::split(h);
        if matches!(
            name.as_str(),
            "component" | "name" | "compound" | "species" | "fluid"
        ) {
            name_col = Some(i);
        } else if let Some(u) = unit.as_deref().and_then(amount_unit) {
            amount_col = Some((i, u));
        } else if let Some(u) = amount_unit(h) {
            amount_col = Some((i, u));
        }
    }
    let (Some(ic), Some((ia, (basis, percent)))) = (name_col, amount_col) else {
        return Err(fail(format!(
            "the header needs a component column (\"component\") and an amount column whose \
             unit says mole or mass, percent or fraction (\"mol %\", \"mole fraction\", \
             \"mass %\", \"amount [mol %]\"); it has: {}",
            header.join(", ")
        )));
    };
    let mut records: Vec<&'static ComponentRecord> = Vec::new();
    let mut values: Vec<f64> = Vec::new();
    let mut first_row: Vec<usize> = Vec::new();
    let mut total: Option<(usize, f64)> = None;
    for (row, cells) in body {
        let cell = |i: usize| cells.get(i).map_or("", |s| s.trim());
        let (label, amount) = (cell(ic), cell(ia));
        if label.is_empty() && amount.is_empty() {
            continue;
        }
        let at = |m: String| fail(format!("row {row}: {m}"));
        let v: f64 = amount.trim_end_matches('%').trim().parse().map_err(|_| {
            at(format!(
                "the amount of \"{label}\" is \"{amount}\", not a number"
            ))
        })?;
        if !v.is_finite() || v < 0.0 {
            return Err(at(format!(
                "the amount of \"{label}\" is {amount}: amounts are finite and not negative"
            )));
        }
        if matches!(label.to_ascii_lowercase().as_str(), "total" | "sum") {
            total = Some((*row, v));
            continue;
        }
        if label.is_empty() {
            return Err(at(format!("an amount ({amount}) without a component")));
        }
        let (rec, note) = component(label).map_err(&at)?;
        if v == 0.0 {
            continue;
        }
        if let Some(k) = records.iter().position(|r| r.id == rec.id) {
            return Err(at(format!(
                "{} is listed twice (rows {} and {row})",
                rec.name, first_row[k]
            )));
        }
        if let Some(n) = note {
            crate::input_notes::push(format!("--mix-file {path}, row {row}: {n}"));
        }
        records.push(rec);
        values.push(v);
        first_row.push(*row);
    }
    if records.is_empty() {
        return Err(fail("no component with an amount above zero".to_string()));
    }
    let sum: f64 = values.iter().sum();
    if let Some((row, t)) = total {
        let full = if percent { 100.0 } else { 1.0 };
        if (t - sum).abs() > SUM_TOLERANCE * full {
            return Err(fail(format!(
                "row {row}: the total says {t} but the rows above it sum to {sum}"
            )));
        }
    }
    feed::from_amounts(
        records,
        values,
        Amounts {
            percent,
            basis,
            normalize,
            tolerance: SUM_TOLERANCE,
        },
    )
    .map_err(|m| fail(format!("{m} (threshold: 0.1 % of the whole)")))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn units_of_the_amount_column() {
        assert_eq!(amount_unit("mol %"), Some((Basis::Mole, true)));
        assert_eq!(amount_unit("Mole Fraction"), Some((Basis::Mole, false)));
        assert_eq!(amount_unit("wt%"), Some((Basis::Mass, true)));
        assert_eq!(amount_unit("kg/m3"), None);
    }

    #[test]
    fn trade_labels_and_lumped_carbon_numbers() {
        assert_eq!(component("iC4").unwrap().0.id, "isobutane");
        assert_eq!(component("neoC5").unwrap().0.id, "neopentane");
        let (r, note) = component("C6").unwrap();
        assert_eq!(r.id, "n-hexane");
        assert!(note.unwrap().contains("lumped"));
        assert!(component("C7+").unwrap_err().contains("plus fraction"));
        assert!(component("unobtainium").is_err());
    }
}
