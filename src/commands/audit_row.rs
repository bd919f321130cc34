//! One spreadsheet row of an audit: the column mapping by header names, reading a row into
//! SI (every bad cell reported with its row and column), and its recomputation with the
//! causes of a deviation ([`eos::jobs::audit`]).

use crate::cli::Basis;
use crate::commands::jobs_common;
use crate::error::CliError;
use crate::feed::{self, Feed};
use crate::feed_input;
use crate::models::{self, BuiltModel};
use crate::sheet_rows::{column_letter, BadCell};
use crate::units;
use eos::ideal::IdealGas;
use eos::jobs::audit::{self, Quantity, Row};
use eos::jobs::BaseConditions;
use std::collections::HashMap;
use std::sync::Arc;

/// The fields an audit reads.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Field {
    Fluid,
    Temperature,
    Pressure,
    Value,
    Quantity,
    Volume,
    Mass,
    Basis,
    Base,
}

impl Field {
    /// Every field with the header names it is found by (normalised: lower case, letters
    /// and digits only).
    const NAMES: [(Field, &'static [&'static str]); 9] = [
        (
            Field::Fluid,
            &[
                "fluid",
                "gas",
                "composition",
                "mixture",
                "component",
                "stream",
            ],
        ),
        (Field::Temperature, &["temperature", "temp", "t"]),
        (Field::Pressure, &["pressure", "press", "p"]),
        (
            Field::Value,
            &[
                "value",
                "result",
                "computed",
                "sheetvalue",
                "answer",
                "density",
                "rho",
                "z",
                "zfactor",
                "compressibility",
            ],
        ),
        (Field::Quantity, &["quantity", "what", "kind"]),
        (Field::Volume, &["volume", "vesselvolume", "v"]),
        (Field::Mass, &["mass", "m"]),
        (Field::Basis, &["basis", "fractionbasis"]),
        (Field::Base, &["base", "baseconditions", "reference"]),
    ];

    /// The field named in a `--columns` override.
    pub fn parse(name: &str) -> Option<Field> {
        let n = normalise(name);
        Self::NAMES
            .iter()
            .find(|(f, _)| field_name(*f) == n)
            .map(|(f, _)| *f)
    }
}

fn field_name(f: Field) -> &'static str {
    match f {
        Field::Fluid => "fluid",
        Field::Temperature => "temperature",
        Field::Pressure => "pressure",
        Field::Value => "value",
        Field::Quantity => "quantity",
        Field::Volume => "volume",
        Field::Mass => "mass",
        Field::Basis => "basis",
        Field::Base => "base",
    }
}

fn normalise(s: &str) -> String {
    s.chars()
        .filter(|c| c.is_alphanumeric())
        .flat_map(char::to_lowercase)
        .collect()
}

/// Splits "Temperature (degC)" or "T [K]" into the name (letters and digits only) and the
/// unit.
fn split_header(h: &str) -> (String, Option<String>) {
    let (name, unit) = crate::file_header::split(h);
    (normalise(&name), unit)
}

/// A mapped column.
#[derive(Debug, Clone)]
pub struct Column {
    /// 0-based index.
    pub index: usize,
    /// The header as written.
    pub header: String,
    /// The unit in the header, if any.
    pub unit: Option<String>,
}

impl Column {
    fn label(&self) -> String {
        format!("{} ({})", column_letter(self.index), self.header)
    }
}

/// Which column holds which field.
#[derive(Debug, Clone)]
pub struct Mapping {
    pub columns: HashMap<Field, Column>,
    /// The quantity implied by the value column's header (density, z), if any.
    pub implied_quantity: Option<Quantity>,
    /// Affine maps x -> a x + b to SI of bare numbers in columns whose header states the
    /// unit (temperature, pressure with its gauge offset, a mass density).
    pub affine: HashMap<Field, (f64, f64)>,
}

impl Mapping {
    /// Works out the affine maps of the header units once (from the values at 1 and 2).
    pub fn prepare_units(&mut self, ambient: f64) {
        let mut add = |f: Field, conv: &dyn Fn(&str) -> Option<f64>| {
            if let Some(u) = self.columns.get(&f).and_then(|c| c.unit.clone()) {
                if let (Some(y1), Some(y2)) = (conv(&format!("1 {u}")), conv(&format!("2 {u}"))) {
                    self.affine.insert(f, (y2 - y1, 2.0 * y1 - y2));
                }
            }
        };
        add(Field::Temperature, &|t| units::temperature(t).ok());
        add(Field::Pressure, &|t| {
            units::pressure_reading(t, ambient).map(|r| r.0).ok()
        });
        add(Field::Value, &|t| match units::density(t).ok()? {
            units::Density::Mass(v) => Some(v),
            units::Density::Molar(_) => None,
        });
    }
}

/// Maps headers to fields; `overrides` are (field, header) pairs from `--columns`.
pub fn map_headers(headers: &[String], overrides: &[(Field, String)]) -> Result<Mapping, CliError> {
    let mut columns: HashMap<Field, Column> = HashMap::new();
    let split: Vec<(String, Option<String>)> = headers.iter().map(|h| split_header(h)).collect();
    for (field, header) in overrides {
        let want = normalise(header);
        let i = headers
            .iter()
            .position(|h| normalise(h) == want || split_header(h).0 == want)
            .ok_or_else(|| {
                CliError::BadInput(format!(
                    "--columns: no header \"{header}\" for {}; the headers are: {}",
                    field_name(*field),
                    headers.join(", ")
                ))
            })?;
        columns.insert(
            *field,
            Column {
                index: i,
                header: headers[i].clone(),
                unit: split[i].1.clone(),
            },
        );
    }
    for (field, names) in Field::NAMES {
        if columns.contains_key(&field) {
            continue;
        }
        if let Some(i) = split.iter().enumerate().position(|(i, (n, _))| {
            names.contains(&n.as_str()) && !columns.values().any(|c| c.index == i)
        }) {
            columns.insert(
                field,
                Column {
                    index: i,
                    header: headers[i].clone(),
                    unit: split[i].1.clone(),
                },
            );
        }
    }
    let missing: Vec<&str> = [
        Field::Fluid,
        Field::Temperature,
        Field::Pressure,
        Field::Value,
    ]
    .into_iter()
    .filter(|f| !columns.contains_key(f))
    .map(field_name)
    .collect();
    if !missing.is_empty() {
        return Err(CliError::BadInput(format!(
            "no column found for {}; the headers are: {}; name them (e.g. \"Temperature \
             (degC)\") or map them with --columns \"value=My header,...\"",
            missing.join(", "),
            headers.join(", ")
        )));
    }
    let implied_quantity =
        columns
            .get(&Field::Value)
            .and_then(|c| match split_header(&c.header).0.as_str() {
                "density" | "rho" => Some(Quantity::Density),
                "z" | "zfactor" | "compressibility" => Some(Quantity::Z),
                _ => None,
            });
    Ok(Mapping {
        columns,
        implied_quantity,
        affine: HashMap::new(),
    })
}

/// Settings that apply to rows without their own.
#[derive(Debug, Clone)]
pub struct Defaults {
    pub quantity: Option<Quantity>,
    pub basis: Basis,
    pub base: BaseConditions,
    pub ambient: f64,
    pub model: String,
    pub tolerance: f64,
    /// Interaction parameters the user set (`--kij`, `--kij-file`), for every row's mixture.
    pub kij: Vec<fluids::UserKij>,
}

/// A fluid read from a cell: its feed and the key of its model.
pub struct FluidEntry {
    pub feed: Feed,
    pub model_key: String,
}

/// A model with the ideal gas of the same components.
pub struct ModelEntry {
    pub built: BuiltModel,
    pub ideal: IdealGas,
}

/// Fluids and models met so far; filled serially between chunks, read in parallel.
#[derive(Default)]
pub struct Cache {
    /// Fluids by cell text: [mole basis, mass basis].
    pub fluids: [HashMap<String, Result<Arc<FluidEntry>, String>>; 2],
    pub models: HashMap<String, Result<Arc<ModelEntry>, String>>,
}

/// The basis of a row, from its basis cell or the default.
fn row_basis(cells: &csv::StringRecord, map: &Mapping, d: &Defaults) -> Result<Basis, String> {
    match map.columns.get(&Field::Basis).map(|c| cell(cells, c.index)) {
        Some(t) if !t.is_empty() => match t.to_ascii_lowercase().as_str() {
            "mole" | "molar" | "mol" => Ok(Basis::Mole),
            "mass" | "weight" | "wt" => Ok(Basis::Mass),
            other => Err(format!("\"{other}\" is not a basis (mole or mass)")),
        },
        _ => Ok(d.basis),
    }
}

fn cell(cells: &csv::StringRecord, i: usize) -> &str {
    cells.get(i).map_or("", str::trim)
}

impl Cache {
    /// Reads the fluid cell of every row and builds the models they need.
    pub fn prepare(&mut self, rows: &[crate::sheet_rows::RawRow], map: &Mapping, d: &Defaults) {
        let Some(fc) = map.columns.get(&Field::Fluid) else {
            return;
        };
        for (_, cells, _) in rows {
            let text = cell(cells, fc.index);
            if text.is_empty() {
                continue;
            }
            let Ok(basis) = row_basis(cells, map, d) else {
                continue;
            };
            let slot = usize::from(basis == Basis::Mass);
            if self.fluids[slot].contains_key(text) {
                continue;
            }
            let entry = read_fluid(text, basis).map(|mut feed| {
                feed.kij.clone_from(&d.kij);
                Arc::new(FluidEntry {
                    model_key: feed.ids().join(","),
                    feed,
                })
            });
            if let Ok(e) = &entry {
                if !self.models.contains_key(&e.model_key) {
                    let m = models::build(&model_for(&d.model, &e.feed), &e.feed)
                        .map(|built| {
                            Arc::new(ModelEntry {
                                built,
                                ideal: IdealGas::new(&e.feed.components()),
                            })
                        })
                        .map_err(|err| err.to_string());
                    self.models.insert(e.model_key.clone(), m);
                }
            }
            self.fluids[slot].insert(text.to_string(), entry);
        }
    }
}

/// The model of a fluid: the one asked, or with "auto" the fluid's reference formulation
/// where it has one (a pure fluid among methane, nitrogen, CO2, argon, hydrogen, water),
/// otherwise Peng-Robinson.
fn model_for(asked: &str, feed: &Feed) -> String {
    if asked != crate::cli::audit_args::AUTO {
        asked.to_string()
    } else if models::applies("reference", feed) {
        "reference".to_string()
    } else {
        "pr".to_string()
    }
}

/// How far a row's fractions may sum from one (or 100 %) and be scaled to it: the rounding
/// of fractions printed to three or four digits (common practice). A larger miss is a bad
/// row that quotes the sum.
const AUDIT_SUM_TOLERANCE: f64 = 1e-3;

/// A fluid cell: a component name, or "name=fraction,..." pairs (scaled to sum to one when
/// they miss it by rounding only, refused otherwise).
fn read_fluid(text: &str, basis: Basis) -> Result<Feed, String> {
    if text.contains('=') || text.contains(':') {
        let feed = feed::parse_mix(text, basis, true).map_err(|e| e.to_string())?;
        let full = if feed.percent { 100.0 } else { 1.0 };
        match feed.normalized_from {
            Some(sum) if (sum - full).abs() > AUDIT_SUM_TOLERANCE * full => Err(format!(
                "the fractions of \"{text}\" sum to {sum}, not {full}: more than rounding \
                 (0.1 %); correct the composition"
            )),
            _ => Ok(feed),
        }
    } else {
        let args = crate::cli::FluidArgs {
            fluid: Some(text.to_string()),
            mix: None,
            basis,
            normalize: false,
            mix_file: None,
            kij: None,
            kij_file: None,
        };
        feed_input::read(&args).map_err(|e| e.to_string())
    }
}

/// The outcome of one row.
#[derive(Debug, Clone)]
pub enum Outcome {
    /// Recomputed: the model's value, the ideal-gas value, the deviation
    /// (sheet - model)/model, whether it is flagged, and the causes that reconcile it.
    Audited {
        /// The id of the model that recomputed the row.
        model: String,
        value: f64,
        /// The ideal-gas value of the same row.
        ideal: f64,
        deviation: f64,
        flagged: bool,
        causes: Vec<String>,
        /// Why no cause is named on a flagged row, where that is known.
        note: Option<String>,
    },
    /// The row could not be read or computed.
    Bad(BadCell),
}

/// Reads and recomputes one row.
pub fn audit_row(
    row_no: usize,
    cells: &csv::StringRecord,
    map: &Mapping,
    d: &Defaults,
    cache: &Cache,
) -> Outcome {
    match read_and_compute(row_no, cells, map, d, cache) {
        Ok(o) => o,
        Err(b) => Outcome::Bad(b),
    }
}

fn read_and_compute(
    row_no: usize,
    cells: &csv::StringRecord,
    map: &Mapping,
    d: &Defaults,
    cache: &Cache,
) -> Result<Outcome, BadCell> {
    if cells.iter().all(|c| c.trim().is_empty()) {
        return Err(BadCell {
            row: row_no,
            column: "-".to_string(),
            message: "blank row".to_string(),
        });
    }
    let col = |f: Field| map.columns.get(&f);
    let bad = |c: &Column, message: String| BadCell {
        row: row_no,
        column: c.label(),
        message,
    };
    let text = |c: &Column| -> Result<&str, BadCell> {
        let t = cell(cells, c.index);
        if t.is_empty() {
            Err(bad(c, "empty cell".to_string()))
        } else {
            Ok(t)
        }
    };
    // "12.5" with the header's unit, or the cell's own "12.5 degC".
    let with_unit = |c: &Column, default: Option<&str>| -> Result<String, BadCell> {
        let t = text(c)?;
        if t.parse::<f64>().is_ok() {
            match (&c.unit, default) {
                (Some(u), _) => Ok(format!("{t} {u}")),
                (None, Some(u)) => Ok(format!("{t} {u}")),
                (None, None) => Err(bad(
                    c,
                    format!("\"{t}\" has no unit (none in the cell or the header)"),
                )),
            }
        } else {
            Ok(t.to_string())
        }
    };
    // A bare number in a column whose header states the unit: the cached affine map.
    let fast = |c: &Column, f: Field| -> Option<f64> {
        let (a, b) = map.affine.get(&f)?;
        let x: f64 = cell(cells, c.index).parse().ok()?;
        Some(a * x + b)
    };
    let fc = col(Field::Fluid).ok_or_else(|| BadCell {
        row: row_no,
        column: "-".into(),
        message: "no fluid column".into(),
    })?;
    let fluid_text = text(fc)?;
    let basis = match col(Field::Basis) {
        Some(bc) => row_basis(cells, map, d).map_err(|m| bad(bc, m))?,
        None => d.basis,
    };
    let entry = match cache.fluids[usize::from(basis == Basis::Mass)].get(fluid_text) {
        Some(Ok(e)) => e.clone(),
        Some(Err(m)) => return Err(bad(fc, m.clone())),
        None => return Err(bad(fc, "fluid not read".to_string())),
    };
    let model = match cache.models.get(&entry.model_key) {
        Some(Ok(m)) => m.clone(),
        Some(Err(m)) => return Err(bad(fc, m.clone())),
        None => return Err(bad(fc, "model not built".to_string())),
    };
    let tc = col(Field::Temperature).ok_or_else(|| bad(fc, "no temperature column".into()))?;
    let t = match fast(tc, Field::Temperature).filter(|t| *t > 0.0) {
        Some(t) => t,
        None => units::temperature(&with_unit(tc, None)?).map_err(|e| bad(tc, e.to_string()))?,
    };
    let pc = col(Field::Pressure).ok_or_else(|| bad(fc, "no pressure column".into()))?;
    let p = match fast(pc, Field::Pressure).filter(|p| *p > 0.0) {
        Some(p) => p,
        None => {
            let ptext = with_unit(pc, None)?;
            units::pressure_reading(&ptext, d.ambient)
                .map(|r| r.0)
                .map_err(|e| bad(pc, e.to_string()))?
        }
    };
    let quantity = match col(Field::Quantity) {
        Some(qc) => {
            let q = text(qc)?;
            Quantity::parse(q).ok_or_else(|| {
                bad(
                    qc,
                    format!("\"{q}\" is not a quantity (density, z, mass, volume, std_volume)"),
                )
            })?
        }
        None => d
            .quantity
            .or(map.implied_quantity)
            .ok_or_else(|| bad(fc, "no quantity column and no --quantity".to_string()))?,
    };
    let base = match col(Field::Base) {
        Some(bc) if !cell(cells, bc.index).is_empty() => {
            let b = cell(cells, bc.index);
            BaseConditions::named(b).ok_or_else(|| {
                bad(
                    bc,
                    format!(
                        "\"{b}\" is not a base; accepted: {}",
                        jobs_common::BASE_NAMES
                    ),
                )
            })?
        }
        _ => d.base,
    };
    let volume = match col(Field::Volume) {
        Some(vc) if !cell(cells, vc.index).is_empty() => {
            let v = with_unit(vc, Some("m3"))?;
            Some(units::volume(&v).map_err(|e| bad(vc, e.to_string()))?)
        }
        _ => None,
    };
    let mass = match col(Field::Mass) {
        Some(mc) if !cell(cells, mc.index).is_empty() => {
            let v = with_unit(mc, Some("kg"))?;
            Some(jobs_common::mass(&v, &mc.label()).map_err(|e| bad(mc, e.to_string()))?)
        }
        _ => None,
    };
    let vc = col(Field::Value).ok_or_else(|| bad(fc, "no value column".into()))?;
    let mm = entry.feed.molar_mass();
    let sheet = match quantity {
        Quantity::Density if fast(vc, Field::Value).is_some_and(|v| v > 0.0) => {
            fast(vc, Field::Value).unwrap_or(f64::NAN)
        }
        Quantity::Density => {
            let v = with_unit(vc, Some("kg/m3"))?;
            units::density_reading(&v)
                .map(|d| d.molar(mm) * mm)
                .map_err(|e| bad(vc, e.to_string()))?
        }
        Quantity::Z => {
            let t = text(vc)?;
            let t = t.trim_end_matches('-').trim();
            t.parse::<f64>()
                .ok()
                .filter(|v| v.is_finite() && *v > 0.0)
                .ok_or_else(|| bad(vc, format!("\"{t}\" is not a positive number")))?
        }
        Quantity::Mass => {
            let v = with_unit(vc, Some("kg"))?;
            jobs_common::mass(&v, &vc.label()).map_err(|e| bad(vc, e.to_string()))?
        }
        Quantity::Volume | Quantity::StdVolume => {
            let v = with_unit(vc, Some("m3"))?;
            let v = v.replace("Sm3", "m3").replace("Nm3", "m3");
            units::volume(&v).map_err(|e| bad(vc, e.to_string()))?
        }
    };
    let needs = match quantity {
        Quantity::Mass | Quantity::StdVolume if volume.is_none() => Some("volume"),
        Quantity::Volume if mass.is_none() => Some("mass"),
        _ => None,
    };
    if let Some(what) = needs {
        return Err(bad(
            vc,
            format!("a {} row needs a {what} column", quantity.as_str()),
        ));
    }
    let feed = &entry.feed;
    let row = Row {
        quantity,
        t,
        p,
        ambient: d.ambient,
        entered: if basis == Basis::Mass {
            feed.mass.clone()
        } else {
            feed.mole.clone()
        },
        mass_basis: basis == Basis::Mass,
        volume,
        mass,
        base,
    };
    let m = model.built.model().map_err(|e| bad(fc, e.to_string()))?;
    let value = audit::recompute(m, &row).map_err(|e| bad(fc, e.to_string()))?;
    let deviation = (sheet - value) / value;
    let flagged = deviation.is_nan() || deviation.abs() > d.tolerance;
    // A cause is named only where the deviation exceeds what the model's own error could
    // make of a correct sheet; within it, the flag says so instead of guessing a cause.
    let own = eos::catalogue::find(&model.built.id).map_or(0.0, |i| i.density_uncertainty);
    let beyond_model = deviation.is_nan() || deviation.abs() > d.tolerance + own;
    let note = (flagged && !beyond_model).then(|| {
        format!(
            "no cause named: the deviation is within the recomputing model's own uncertainty \
             (about {:.1} % in density for {}); recompute with a more accurate model",
            100.0 * own,
            model.built.id
        )
    });
    let causes = if flagged && beyond_model {
        audit::causes(m, &model.ideal, &row, sheet, d.tolerance)
            .into_iter()
            .filter(|c| c.reconciles)
            .map(|c| c.cause.describe())
            .collect()
    } else {
        Vec::new()
    };
    let ideal = audit::recompute(&model.ideal, &row).unwrap_or(f64::NAN);
    Ok(Outcome::Audited {
        model: model.built.id.clone(),
        value,
        ideal,
        deviation,
        flagged,
        causes,
        note,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn column_letters_follow_the_spreadsheet_convention() {
        // A..Z, then AA..AZ, BA...; column 703 (0-based 702) is AAA.
        assert_eq!(column_letter(0), "A");
        assert_eq!(column_letter(25), "Z");
        assert_eq!(column_letter(26), "AA");
        assert_eq!(column_letter(51), "AZ");
        assert_eq!(column_letter(52), "BA");
        assert_eq!(column_letter(701), "ZZ");
        assert_eq!(column_letter(702), "AAA");
    }

    #[test]
    fn headers_give_their_field_and_unit() {
        let h: Vec<String> = [
            "Gas",
            "Temp [degF]",
            "P (psig)",
            "Rho calc (lb/ft3)",
            "Basis",
        ]
        .iter()
        .map(|s| s.to_string())
        .collect();
        let m = map_headers(&h, &[(Field::Value, "Rho calc (lb/ft3)".to_string())]).unwrap();
        assert_eq!(m.columns[&Field::Fluid].index, 0);
        assert_eq!(m.columns[&Field::Temperature].unit.as_deref(), Some("degF"));
        assert_eq!(m.columns[&Field::Pressure].unit.as_deref(), Some("psig"));
        assert_eq!(m.columns[&Field::Value].index, 3);
        assert_eq!(m.columns[&Field::Basis].index, 4);
        let none: Vec<String> = vec!["a".into(), "b".into()];
        assert!(map_headers(&none, &[]).is_err());
    }
}
