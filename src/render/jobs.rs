//! Rendering of the engineering-job reports: a side-by-side terminal table (one column per
//! model, each value with the ideal-gas answer and its error under it), JSON as the report
//! struct is, and CSV with one row per model (nested fields flattened to dotted names).

use crate::error::CliError;
use serde::Serialize;
use serde_json::Value;

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
