//! `POST /api/xlsx`: what the page shows, as an .xlsx workbook built in memory (nothing is
//! written on the server). The body: `{"sheets": [{"name": "state", "rows": [["model", "Z"],
//! ["pr", 0.8995]]}]}`; a cell is a text, a number or null (empty).

use crate::json_call::request::Refusal;
use rust_xlsxwriter::Workbook;
use serde::Deserialize;
use serde_json::Value;

/// The media type of an .xlsx workbook.
pub const CONTENT_TYPE: &str = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

/// The most sheets, and cells in all, of one workbook.
const MAX_SHEETS: usize = 16;
const MAX_CELLS: usize = 200_000;

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct Sheets {
    sheets: Vec<Sheet>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct Sheet {
    name: String,
    rows: Vec<Vec<Value>>,
}

/// The workbook of a request body.
pub fn from_json(body: &[u8]) -> Result<Vec<u8>, Refusal> {
    let sheets: Sheets = serde_json::from_slice(body).map_err(|e| {
        Refusal::new(
            400,
            format!(
                "the body must be {{\"sheets\": [{{\"name\": ..., \"rows\": [[...], ...]}}]}}: {e}"
            ),
        )
    })?;
    let cells: usize = sheets
        .sheets
        .iter()
        .flat_map(|s| s.rows.iter().map(Vec::len))
        .sum();
    if sheets.sheets.is_empty() || sheets.sheets.len() > MAX_SHEETS || cells > MAX_CELLS {
        return Err(Refusal::new(
            413,
            format!(
                "a workbook has 1 to {MAX_SHEETS} sheets and at most {MAX_CELLS} cells; this one \
                 has {} sheets and {cells} cells",
                sheets.sheets.len()
            ),
        ));
    }
    let fail = |e: rust_xlsxwriter::XlsxError| Refusal::new(422, e.to_string());
    let mut book = Workbook::new();
    for sheet in &sheets.sheets {
        let ws = book.add_worksheet();
        ws.set_name(&sheet.name).map_err(fail)?;
        for (r, row) in sheet.rows.iter().enumerate() {
            let r = u32::try_from(r).map_err(|e| Refusal::new(413, e.to_string()))?;
            for (c, cell) in row.iter().enumerate() {
                let c = u16::try_from(c).map_err(|e| Refusal::new(413, e.to_string()))?;
                match cell {
                    Value::Null => {}
                    Value::Number(n) => match n.as_f64() {
                        Some(x) if x.is_finite() => {
                            ws.write_number(r, c, x).map_err(fail)?;
                        }
                        _ => {
                            ws.write_string(r, c, n.to_string()).map_err(fail)?;
                        }
                    },
                    Value::String(s) => {
                        ws.write_string(r, c, s).map_err(fail)?;
                    }
                    Value::Bool(b) => {
                        ws.write_boolean(r, c, *b).map_err(fail)?;
                    }
                    Value::Array(_) | Value::Object(_) => {
                        return Err(Refusal::new(
                            400,
                            format!(
                                "sheet \"{}\": a cell is a text, a number or null",
                                sheet.name
                            ),
                        ))
                    }
                }
            }
        }
    }
    book.save_to_buffer().map_err(fail)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_workbook_reads_back_with_its_cells() {
        use calamine::{Data, Reader, Xlsx};
        let body = br#"{"sheets": [{"name": "state", "rows": [["model", "Z"], ["pr", 0.8995], [null, "x"]]}]}"#;
        let bytes = from_json(body).unwrap();
        let mut book: Xlsx<_> = Xlsx::new(std::io::Cursor::new(bytes)).unwrap();
        let range = book.worksheet_range("state").unwrap();
        assert_eq!(range.get_value((1, 1)), Some(&Data::Float(0.8995)));
        assert_eq!(
            range.get_value((1, 0)),
            Some(&Data::String("pr".to_string()))
        );
    }

    #[test]
    fn bad_bodies_are_refused() {
        assert_eq!(from_json(b"[]").unwrap_err().status, 400);
        assert_eq!(from_json(br#"{"sheets": []}"#).unwrap_err().status, 413);
        let nested = br#"{"sheets": [{"name": "a", "rows": [[[1]]]}]}"#;
        assert_eq!(from_json(nested).unwrap_err().status, 400);
        let bad_name = br#"{"sheets": [{"name": "a/b[1]", "rows": []}]}"#;
        assert_eq!(from_json(bad_name).unwrap_err().status, 422);
    }
}
