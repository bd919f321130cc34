//! Rendering of the engineering-job reports: a side-by-side terminal table (one column per
//! model, each value with the ideal-gas answer and its error under it), JSON as the report
//! struct is, and CSV with one row per model (nested fields flattened to dotted names).

use crate::error::CliError;
use crate::render::number::{opt, sig};
use crate::report::jobs_common::Compared;
use comfy_table::{CellAlignment, ContentArrangement, LineStyle, Table, TableStyle};
use serde::Serialize;
use serde_json::Value;

const STYLE: TableStyle = TableStyle::new()
    .top_border(LineStyle::none().fill('-').junction('-'))
    .header_separator(LineStyle::none().fill('-').junction('-'))
    .bottom_border(LineStyle::none().fill('-').junction('-'));

/// A table with one column per model.
pub struct Grid {
    table: Table,
    n: usize,
}

impl Grid {
    /// A table with the model ids as column heads.
    pub fn new(models: &[String]) -> Self {
        let mut table = Table::new();
        table
            .load_style(STYLE)
            .set_content_arrangement(ContentArrangement::Disabled);
        let mut head = vec!["quantity".to_string(), "unit".to_string()];
        head.extend(models.iter().cloned());
        table.set_header(head);
        Grid {
            table,
            n: models.len(),
        }
    }

    /// One row of text cells.
    pub fn row(&mut self, name: &str, unit: &str, cells: Vec<String>) {
        let mut c = vec![name.to_string(), unit.to_string()];
        c.extend(cells);
        c.resize(self.n + 2, "-".to_string());
        self.table.add_row(c);
    }

    /// One row of numbers, `scale` dividing SI values into the display unit.
    pub fn nums(&mut self, name: &str, unit: &str, vals: &[Option<f64>], scale: f64) {
        let cells = vals
            .iter()
            .map(|v| v.map_or_else(|| "-".to_string(), |v| sig(v / scale, 6)))
            .collect();
        self.row(name, unit, cells);
    }

    /// A compared value: the model's, the ideal gas's, and the ideal-gas error in percent.
    pub fn compared(&mut self, name: &str, unit: &str, vals: &[Option<Compared>], scale: f64) {
        let f = |g: &dyn Fn(&Compared) -> String| -> Vec<String> {
            vals.iter()
                .map(|v| v.as_ref().map_or_else(|| "-".to_string(), g))
                .collect()
        };
        self.row(name, unit, f(&|c| sig(c.value / scale, 6)));
        self.row("  ideal gas", unit, f(&|c| sig(c.ideal / scale, 6)));
        self.row("  ideal-gas error", "%", f(&|c| opt(c.ideal_error_pct, 3)));
    }

    /// The table as text.
    pub fn finish(mut self) -> String {
        for (i, col) in self.table.column_iter_mut().enumerate() {
            if i >= 2 {
                col.set_cell_alignment(CellAlignment::Right);
            }
        }
        format!("{}\n", self.table)
    }
}

fn flatten(prefix: &str, v: &Value, out: &mut Vec<(String, String)>) {
    match v {
        Value::Object(m) => {
            for (k, x) in m {
                let key = if prefix.is_empty() {
                    k.clone()
                } else {
                    format!("{prefix}.{k}")
                };
                flatten(&key, x, out);
            }
        }
        Value::Array(a) => {
            if a.iter().all(|x| !x.is_object() && !x.is_array()) {
                let parts: Vec<String> = a.iter().map(scalar).collect();
                out.push((prefix.to_string(), parts.join(";")));
            }
        }
        other => out.push((prefix.to_string(), scalar(other))),
    }
}

fn scalar(v: &Value) -> String {
    match v {
        Value::Null => String::new(),
        Value::String(s) => s.clone(),
        other => other.to_string(),
    }
}

/// One CSV row per element of the report's `results`, SI units.
pub fn csv_rows<T: Serialize>(report: &T) -> Result<String, CliError> {
    let v = serde_json::to_value(report).map_err(|e| CliError::Output(e.to_string()))?;
    let rows = v
        .get("results")
        .and_then(Value::as_array)
        .cloned()
        .unwrap_or_default();
    let flat: Vec<Vec<(String, String)>> = rows
        .iter()
        .map(|r| {
            let mut o = Vec::new();
            flatten("", r, &mut o);
            o
        })
        .collect();
    let mut header: Vec<String> = Vec::new();
    for r in &flat {
        for (k, _) in r {
            if !header.contains(k) {
                header.push(k.clone());
            }
        }
    }
    let mut w = csv::Writer::from_writer(Vec::new());
    let err = |e: csv::Error| CliError::Output(e.to_string());
    w.write_record(&header).map_err(err)?;
    for r in &flat {
        let rec: Vec<&str> = header
            .iter()
            .map(|h| {
                r.iter()
                    .find(|(k, _)| k == h)
                    .map_or("", |(_, v)| v.as_str())
            })
            .collect();
        w.write_record(&rec).map_err(err)?;
    }
    let bytes = w
        .into_inner()
        .map_err(|e| CliError::Output(e.to_string()))?;
    String::from_utf8(bytes).map_err(|e| CliError::Output(e.to_string()))
}
