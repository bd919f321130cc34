//! Reading a user's states or reference data from CSV, with the units in the header.
//!
//! The first line names the columns; a column that carries a quantity has its unit in square
//! brackets or parentheses (`T [degC]`, `T (degC)`). Columns are found by name, case-insensitively, in any order:
//!
//! | column | names | units |
//! |---|---|---|
//! | temperature | `T`, `temperature` | any temperature unit of [`crate::units`], e.g. `T [K]`, `T [degC]` |
//! | pressure | `P`, `pressure` | any pressure unit, absolute or gauge, e.g. `P [bar]`, `P [psig]` |
//! | compression factor | `Z` | none, or `[-]` |
//! | density | `density`, `rho` | any density unit, mass or molar, e.g. `density [kg/m3]` |
//! | source | `source` | text: where the value comes from |
//! | phase | `phase` (optional) | text; `two-phase` excludes the row from the statistics |
//! | component | `component` (optional) | a component name; rows of other fluids are left out |
//!
//! A reference file needs T, P, one of Z or density, and source; a list of states needs T and
//! P only. Every error names the file, the line (the header is line 1) and the column. With
//! `skip_bad_rows` a bad row is skipped and its message kept, so the caller can report the
//! count; errors in the header are always fatal.

use crate::units::{self, Density};
use std::fmt;

/// A value given by the reference for one state.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum RefValue {
    /// Compression factor.
    Z(f64),
    /// Molar density, mol/m3 (mass densities are converted with the fluid's molar mass).
    MolarDensity(f64),
}

/// One row read.
#[derive(Debug, Clone, PartialEq)]
pub struct Row {
    /// Line number in the file (header = 1).
    pub line: usize,
    /// Temperature, K.
    pub t: f64,
    /// Absolute pressure, Pa.
    pub p: f64,
    /// The reference value, when the file has a Z or density column.
    pub value: Option<RefValue>,
    /// The source text ("" when the file has no source column).
    pub source: String,
    /// True when the row's phase column says two-phase.
    pub two_phase: bool,
    /// The component column, when present.
    pub component: Option<String>,
}

/// What a file gave.
#[derive(Debug, Clone, Default)]
pub struct Contents {
    /// Rows read.
    pub rows: Vec<Row>,
    /// Messages of rows skipped (only with `skip_bad_rows`).
    pub skipped: Vec<String>,
    /// The temperature column's header as written.
    pub t_column: String,
    /// The pressure column's header as written.
    pub p_column: String,
}

/// A file that could not be read.
#[derive(Debug, Clone, PartialEq)]
pub struct FileError {
    /// Where the data came from (a path, or the name of a built-in data set).
    pub origin: String,
    /// Line number (header = 1), when the fault is in one line.
    pub line: Option<usize>,
    /// Column name as written, when the fault is in one column.
    pub column: Option<String>,
    /// What is wrong.
    pub problem: String,
}

impl fmt::Display for FileError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}", self.origin)?;
        if let Some(l) = self.line {
            write!(f, ", line {l}")?;
        }
        if let Some(c) = &self.column {
            write!(f, ", column \"{c}\"")?;
        }
        write!(f, ": {}", self.problem)
    }
}

impl std::error::Error for FileError {}

/// What the caller needs from the file.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Need {
    /// T, P, Z or density, and source.
    Reference,
    /// T and P; the rest is read when present.
    States,
}

/// Reading options.
#[derive(Debug, Clone, Copy)]
pub struct Options {
    /// What the file must contain.
    pub need: Need,
    /// Molar mass of the fluid, kg/mol, for mass densities.
    pub molar_mass: f64,
    /// Ambient pressure for gauge readings, Pa.
    pub ambient_pa: f64,
    /// Keep going past bad rows.
    pub skip_bad_rows: bool,
}

/// Kinds of columns.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Kind {
    T,
    P,
    Z,
    Density,
    Source,
    Phase,
    Component,
}

/// A recognised column: its index, kind, header as written and unit text.
struct Column {
    index: usize,
    kind: Kind,
    header: String,
    unit: String,
}

fn kind_of(name: &str) -> Option<Kind> {
    match name {
        "t" | "temperature" => Some(Kind::T),
        "p" | "pressure" => Some(Kind::P),
        "z" | "compression factor" | "compressibility factor" => Some(Kind::Z),
        "density" | "rho" => Some(Kind::Density),
        "source" => Some(Kind::Source),
        "phase" => Some(Kind::Phase),
        "component" | "fluid" => Some(Kind::Component),
        _ => None,
    }
}

/// Skip messages kept in full; beyond these only the count grows, so a file of millions of
/// bad rows read with `skip_bad_rows` stays bounded in memory.
pub const MAX_SKIP_MESSAGES: usize = 1_000;

/// Rows skipped with `skip_bad_rows`: every one counted, the first [`MAX_SKIP_MESSAGES`]
/// kept with their message.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct Skipped {
    /// Rows skipped.
    pub count: usize,
    /// Their messages, the first [`MAX_SKIP_MESSAGES`] of them.
    pub messages: Vec<String>,
}

impl Skipped {
    /// Counts a skipped row and keeps its message while there is room.
    pub fn push(&mut self, message: String) {
        self.count += 1;
        if self.messages.len() < MAX_SKIP_MESSAGES {
            self.messages.push(message);
        }
    }
}

/// A file read row by row: the header is checked on opening, rows are read in chunks with
/// [`Reader::next_rows`], so memory does not grow with the file.
pub struct Reader<R: std::io::Read> {
    rdr: csv::Reader<R>,
    record: csv::StringRecord,
    cols: Vec<Column>,
    opts: Options,
    origin: String,
    rows_read: usize,
    /// The temperature column's header as written.
    pub t_column: String,
    /// The pressure column's header as written.
    pub p_column: String,
}

impl<R: std::io::Read> Reader<R> {
    /// Reads and checks the header of `input` from `origin`.
    pub fn new(input: R, origin: &str, opts: Options) -> Result<Self, FileError> {
        let ferr = |line: Option<usize>, column: Option<&str>, problem: String| FileError {
            origin: origin.to_string(),
            line,
            column: column.map(str::to_string),
            problem,
        };
        let mut rdr = csv::ReaderBuilder::new()
            .flexible(true)
            .trim(csv::Trim::All)
            .from_reader(input);
        let headers = rdr
            .headers()
            .map_err(|e| ferr(Some(1), None, format!("the header cannot be read: {e}")))?
            .clone();
        let mut cols: Vec<Column> = Vec::new();
        for (i, h) in headers.iter().enumerate() {
            let (name, unit) = crate::file_header::split(h);
            let unit = unit.unwrap_or_default();
            let Some(kind) = kind_of(&name) else { continue };
            if let Some(c) = cols.iter().find(|c| c.kind == kind) {
                return Err(ferr(
                    Some(1),
                    Some(h),
                    format!("the same quantity as column \"{}\"", c.header),
                ));
            }
            check_unit(kind, &unit).map_err(|p| ferr(Some(1), Some(h), p))?;
            cols.push(Column {
                index: i,
                kind,
                header: h.to_string(),
                unit,
            });
        }
        let found: Vec<&str> = headers.iter().collect();
        let missing = |what: &str| {
            ferr(
                Some(1),
                None,
                format!(
                    "no {what} column; the header has: {}; write e.g. \
                     \"T [K],P [bar],Z,source\" or \"T [degC],P [MPa],density [kg/m3],source\"",
                    found.join(", ")
                ),
            )
        };
        let has = |k: Kind| cols.iter().any(|c| c.kind == k);
        if !has(Kind::T) {
            return Err(missing("temperature (T [unit])"));
        }
        if !has(Kind::P) {
            return Err(missing("pressure (P [unit])"));
        }
        if opts.need == Need::Reference {
            if !has(Kind::Z) && !has(Kind::Density) {
                return Err(missing("Z or density [unit]"));
            }
            if has(Kind::Z) && has(Kind::Density) {
                return Err(ferr(
                    Some(1),
                    None,
                    "both Z and density columns; keep one as the reference value".to_string(),
                ));
            }
            if !has(Kind::Source) {
                return Err(missing("source"));
            }
        }
        let header_of = |k: Kind| {
            cols.iter()
                .find(|c| c.kind == k)
                .map_or_else(String::new, |c| c.header.clone())
        };
        Ok(Self {
            rdr,
            record: csv::StringRecord::new(),
            t_column: header_of(Kind::T),
            p_column: header_of(Kind::P),
            cols,
            opts,
            origin: origin.to_string(),
            rows_read: 0,
        })
    }

    fn error(&self, line: Option<usize>, column: Option<&str>, problem: String) -> FileError {
        FileError {
            origin: self.origin.clone(),
            line,
            column: column.map(str::to_string),
            problem,
        }
    }

    /// Up to `n` more rows (none at the end of the file). A bad row is an error, or, with
    /// `skip_bad_rows`, counted in `skipped`. At the end of a file that gave no usable row
    /// at all, the error says so.
    pub fn next_rows(&mut self, n: usize, skipped: &mut Skipped) -> Result<Vec<Row>, FileError> {
        let mut out = Vec::with_capacity(n.min(1 << 16));
        while out.len() < n {
            match self.rdr.read_record(&mut self.record) {
                Ok(false) => break,
                Ok(true) => {}
                Err(e) => {
                    let line = e.position().map(|p| p.line() as usize);
                    let err = self.error(line, None, format!("the line cannot be read: {e}"));
                    if self.opts.skip_bad_rows {
                        skipped.push(err.to_string());
                        continue;
                    }
                    return Err(err);
                }
            }
            let line = self.record.position().map_or(0, |p| p.line() as usize);
            if self.record.iter().all(str::is_empty) {
                continue;
            }
            match read_row(&self.record, line, &self.cols, self.opts) {
                Ok(row) => out.push(row),
                Err((column, problem)) => {
                    let err = self.error(Some(line), Some(&column), problem);
                    if self.opts.skip_bad_rows {
                        skipped.push(err.to_string());
                    } else {
                        return Err(err);
                    }
                }
            }
        }
        self.rows_read += out.len();
        if out.is_empty() && self.rows_read == 0 {
            return Err(self.error(None, None, "no usable rows".to_string()));
        }
        Ok(out)
    }
}

/// Reads `text` (the file's contents) from `origin`, every row at once (for small inputs
/// such as the built-in data set; files are read with [`Reader`]).
pub fn read(text: &str, origin: &str, opts: Options) -> Result<Contents, FileError> {
    let mut reader = Reader::new(text.as_bytes(), origin, opts)?;
    let mut skipped = Skipped::default();
    let rows = reader.next_rows(usize::MAX, &mut skipped)?;
    Ok(Contents {
        rows,
        skipped: skipped.messages,
        t_column: reader.t_column,
        p_column: reader.p_column,
    })
}

/// Checks a header unit by reading a sample value with it.
fn check_unit(kind: Kind, unit: &str) -> Result<(), String> {
    let sample = format!("1 {unit}");
    let r = match kind {
        Kind::T => units::temperature(&sample).map(|_| ()),
        Kind::P => units::pressure(&sample).map(|_| ()),
        Kind::Density => units::density(&sample).map(|_| ()),
        Kind::Z => {
            return if unit.is_empty() || unit == "-" || unit == "1" {
                Ok(())
            } else {
                Err(format!(
                    "Z has no unit (write \"Z\" or \"Z [-]\"), not \"{unit}\""
                ))
            };
        }
        Kind::Source | Kind::Phase | Kind::Component => return Ok(()),
    };
    r.map_err(|e| {
        if unit.is_empty() {
            format!(
                "the unit is missing: write it in brackets, e.g. \"T [K]\"; accepted: {}",
                e.accepted
            )
        } else {
            format!("unknown unit \"{unit}\"; accepted: {}", e.accepted)
        }
    })
}

/// Reads one row; errors are (column header, problem).
fn read_row(
    rec: &csv::StringRecord,
    line: usize,
    cols: &[Column],
    opts: Options,
) -> Result<Row, (String, String)> {
    let mut row = Row {
        line,
        t: 0.0,
        p: 0.0,
        value: None,
        source: String::new(),
        two_phase: false,
        component: None,
    };
    for c in cols {
        let cell = rec.get(c.index).unwrap_or("").trim();
        let bad = |p: String| (c.header.clone(), p);
        let needed = !matches!(c.kind, Kind::Source | Kind::Phase | Kind::Component);
        if cell.is_empty() && needed {
            return Err(bad("the cell is empty".to_string()));
        }
        let text = format!("{cell} {}", c.unit);
        let non_numeric = |what: &str| {
            if cell.parse::<f64>().is_err() {
                Some(bad(format!("\"{cell}\" is not a number ({what})")))
            } else {
                None
            }
        };
        match c.kind {
            Kind::T => {
                if let Some(e) = non_numeric("temperature") {
                    return Err(e);
                }
                row.t = units::temperature(&text).map_err(|e| bad(e.problem))?;
            }
            Kind::P => {
                if let Some(e) = non_numeric("pressure") {
                    return Err(e);
                }
                let reading = units::pressure(&text).map_err(|e| bad(e.problem))?;
                row.p = units::absolute_pressure(&text, reading, opts.ambient_pa)
                    .map_err(|e| bad(e.problem))?;
            }
            Kind::Z => {
                if let Some(e) = non_numeric("compression factor") {
                    return Err(e);
                }
                let z: f64 = cell.parse().unwrap_or(f64::NAN);
                if !(z.is_finite() && z > 0.0) {
                    return Err(bad(format!(
                        "Z = {cell} is not accepted: a finite number above zero"
                    )));
                }
                row.value = Some(RefValue::Z(z));
            }
            Kind::Density => {
                if let Some(e) = non_numeric("density") {
                    return Err(e);
                }
                let d: Density = units::density(&text).map_err(|e| bad(e.problem))?;
                row.value = Some(RefValue::MolarDensity(d.molar(opts.molar_mass)));
            }
            Kind::Source => row.source = cell.to_string(),
            Kind::Phase => {
                row.two_phase = matches!(
                    cell.to_ascii_lowercase().as_str(),
                    "two-phase" | "two phase" | "2-phase" | "twophase"
                )
            }
            Kind::Component => {
                if !cell.is_empty() {
                    row.component = Some(cell.to_string());
                }
            }
        }
    }
    Ok(row)
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn opts(need: Need, skip: bool) -> Options {
        Options {
            need,
            molar_mass: 0.016_042_46,
            ambient_pa: 101_325.0,
            skip_bad_rows: skip,
        }
    }

    #[test]
    fn reads_units_from_the_header() {
        // Unit definitions: NIST SP 811 appendix B (bar = 1e5 Pa, 0 degC = 273.15 K).
        let text = "source,P [bar],T [degC],density [kg/m3]\n\
                    lab notebook,10,25,7.0\n\
                    lab notebook,20,25,14.5\n";
        let c = read(text, "test.csv", opts(Need::Reference, false)).unwrap();
        assert_eq!(c.rows.len(), 2);
        assert_eq!(c.rows[0].line, 2);
        assert_relative_eq!(c.rows[0].t, 298.15);
        assert_relative_eq!(c.rows[1].p, 20e5);
        match c.rows[0].value {
            Some(RefValue::MolarDensity(r)) => {
                assert_relative_eq!(r, 7.0 / 0.016_042_46, max_relative = 1e-14)
            }
            other => panic!("{other:?}"),
        }
        let g = read(
            "T [K],P [barg],Z,source\n300,0,0.998,x\n",
            "g.csv",
            opts(Need::Reference, false),
        )
        .unwrap();
        assert_relative_eq!(g.rows[0].p, 101_325.0);
        // Units in parentheses read as in brackets (as audit headers are).
        let q = read(
            "T (degC),P (bar),Z,source\n25,10,0.98,x\n",
            "q.csv",
            opts(Need::Reference, false),
        )
        .unwrap();
        assert_relative_eq!(q.rows[0].t, 298.15);
    }

    #[test]
    fn errors_name_the_line_and_the_column() {
        let cases = [
            ("T [K],Z,source\n300,1,x\n", "no pressure"),
            ("T [K],P [bar],source\n300,1,x\n", "no Z or density"),
            ("T [K],P [bar],Z\n300,1,0.9\n", "no source"),
            (
                "T [K],P [furlong],Z,source\n300,1,0.9,x\n",
                "unknown unit \"furlong\"",
            ),
            ("T,P [bar],Z,source\n300,1,0.9,x\n", "unit is missing"),
            (
                "T [K],P [bar],Z,source\n300,1,0.9,x\n300,abc,0.9,x\n",
                "line 3, column \"P [bar]\": \"abc\" is not a number",
            ),
            (
                "T [K],P [bar],Z,source\n300,1,0.9,x\n-5,1,0.9,x\n",
                "line 3, column \"T [K]\"",
            ),
            (
                "T [K],P [bar],Z,source\n300,,0.9,x\n",
                "line 2, column \"P [bar]\": the cell is empty",
            ),
            (
                "T [K],P [bar],Z,density [kg/m3],source\n",
                "both Z and density",
            ),
        ];
        for (text, want) in cases {
            let e = read(text, "ref.csv", opts(Need::Reference, false)).unwrap_err();
            let msg = e.to_string();
            assert!(msg.starts_with("ref.csv"), "{msg}");
            assert!(msg.contains(want), "{msg} lacks {want}");
        }
    }

    #[test]
    fn skipping_bad_rows_counts_them() {
        let text = "T [K],P [bar],Z,source\n300,1,0.99,a\n300,x,0.9,b\n310,1,0,c\n320,2,0.98,d\n";
        let c = read(text, "ref.csv", opts(Need::Reference, true)).unwrap();
        assert_eq!(c.rows.len(), 2);
        assert_eq!(c.skipped.len(), 2);
        assert!(c.skipped[0].contains("line 3"), "{}", c.skipped[0]);
        assert!(c.skipped[1].contains("line 4"), "{}", c.skipped[1]);
        // A list of states needs no value and no source.
        let s = read("T [K],P [MPa]\n300,1\n", "s.csv", opts(Need::States, false)).unwrap();
        assert!(s.rows[0].value.is_none());
    }
}
