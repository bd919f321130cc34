//! Reading one worksheet of an .xlsx workbook row by row, so that memory does not grow with
//! the sheet.
//!
//! The workbook's cells are read in file order by calamine's cell reader, on a thread of
//! their own that owns the workbook; complete rows come back over a bounded channel
//! ([`AHEAD`] rows at most wait in it). A row's cells sit at their absolute column (column A
//! is cell 0); a row without any cell between rows with cells comes as an empty row, as
//! the sheet shows it. A row that crosses a merged region carries the problem with it.

use crate::sheet_rows::{column_letter, BadCell, RawRow};
use calamine::{open_workbook, Data, Dimensions, Reader, Xlsx};
use std::path::Path;
use std::sync::mpsc::{sync_channel, Receiver};

/// Rows read ahead of the audit at most.
const AHEAD: usize = 32_768;

/// What the reading thread sends: a row (its 1-based row number and its cells) or why the
/// sheet cannot be read further.
type Message = Result<(usize, Vec<String>), String>;

/// A worksheet being read.
pub struct Sheet {
    /// The sheet's name.
    pub name: String,
    /// The header row (the first row with a cell), trimmed.
    pub headers: Vec<String>,
    rows: Receiver<Message>,
    merged: Vec<Dimensions>,
    /// The row number of the last row given out.
    last: usize,
    /// A row read but not given out yet (blank rows before it come first).
    held: Option<(usize, Vec<String>)>,
    /// True once reading has stopped on an error.
    failed: bool,
}

impl Sheet {
    /// Opens sheet `sheet` (default: the first) of the workbook at `path`.
    pub fn open(path: &Path, sheet: Option<&str>) -> Result<Sheet, String> {
        let mut wb: Xlsx<_> = open_workbook(path).map_err(|e| format!("{e}"))?;
        let names = wb.sheet_names();
        let name =
            match sheet {
                Some(s) => names.iter().find(|n| *n == s).cloned().ok_or_else(|| {
                    format!("no sheet \"{s}\"; the sheets are: {}", names.join(", "))
                })?,
                None => names
                    .first()
                    .cloned()
                    .ok_or_else(|| "the workbook has no sheet".to_string())?,
            };
        let merged = wb
            .worksheet_merge_cells(&name)
            .transpose()
            .map_err(|e| format!("{e}"))?
            .unwrap_or_default();
        let (tx, rows) = sync_channel::<Message>(AHEAD);
        let sheet_name = name.clone();
        std::thread::spawn(move || {
            let mut cells = match wb.worksheet_cells_reader(&sheet_name) {
                Ok(c) => c,
                Err(e) => {
                    let _ = tx.send(Err(format!("{e}")));
                    return;
                }
            };
            let mut current: Option<(u32, Vec<String>)> = None;
            loop {
                match cells.next_cell() {
                    Ok(Some(cell)) => {
                        let (r, c) = cell.get_position();
                        if current.as_ref().is_some_and(|(row, _)| *row != r) {
                            if let Some((row, texts)) = current.take() {
                                if tx.send(Ok((row as usize + 1, texts))).is_err() {
                                    return;
                                }
                            }
                        }
                        let (_, texts) = current.get_or_insert_with(|| (r, Vec::new()));
                        let c = c as usize;
                        if texts.len() <= c {
                            texts.resize(c + 1, String::new());
                        }
                        texts[c] = cell_text(&Data::from(cell.get_value().clone()));
                    }
                    Ok(None) => break,
                    Err(e) => {
                        let _ = tx.send(Err(format!("{e}")));
                        return;
                    }
                }
            }
            if let Some((row, texts)) = current {
                let _ = tx.send(Ok((row as usize + 1, texts)));
            }
        });
        let (header_row, headers) = match rows.recv() {
            Ok(Ok((r, h))) => (r, h.into_iter().map(|s| s.trim().to_string()).collect()),
            Ok(Err(e)) => return Err(e),
            Err(_) => return Err(format!("sheet \"{name}\" is empty")),
        };
        Ok(Sheet {
            name,
            headers,
            rows,
            merged,
            last: header_row,
            held: None,
            failed: false,
        })
    }

    /// Up to `n` more rows into `out`. Rows without any cell between two rows with cells
    /// come as empty rows (a blank row is reported, as the sheet shows it). A sheet that
    /// cannot be read to its end gives one last row that carries the problem.
    pub fn next_rows(&mut self, n: usize, out: &mut Vec<RawRow>) {
        while out.len() < n {
            let (row, cells) = match self.held.take() {
                Some(r) => r,
                None if self.failed => break,
                None => match self.rows.recv() {
                    Ok(Ok(r)) => r,
                    Ok(Err(e)) => {
                        self.failed = true;
                        let row = self.last + 1;
                        out.push((
                            row,
                            csv::StringRecord::new(),
                            Some(BadCell {
                                row,
                                column: "-".to_string(),
                                message: format!("the sheet cannot be read from here on: {e}"),
                            }),
                        ));
                        break;
                    }
                    Err(_) => break,
                },
            };
            if row > self.last + 1 {
                // A blank row first; the row read waits.
                self.last += 1;
                let blank = self.last;
                out.push((blank, csv::StringRecord::new(), self.merged_at(blank)));
                self.held = Some((row, cells));
                continue;
            }
            self.last = row;
            out.push((row, csv::StringRecord::from(cells), self.merged_at(row)));
        }
    }

    /// The problem of a row (1-based) that crosses a merged region.
    fn merged_at(&self, row: usize) -> Option<BadCell> {
        let abs = row - 1;
        self.merged
            .iter()
            .find(|d| d.start.0 as usize <= abs && abs <= d.end.0 as usize && d.start != d.end)
            .map(|d| BadCell {
                row,
                column: column_letter(d.start.1 as usize),
                message: format!(
                    "merged cells {}{}:{}{}",
                    column_letter(d.start.1 as usize),
                    d.start.0 + 1,
                    column_letter(d.end.1 as usize),
                    d.end.0 + 1
                ),
            })
    }
}

/// Text of a workbook cell; numbers in their shortest exact form.
fn cell_text(d: &Data) -> String {
    match d {
        Data::Empty => String::new(),
        Data::String(s) => s.clone(),
        Data::Float(f) => format!("{f}"),
        Data::Int(i) => format!("{i}"),
        Data::Bool(b) => format!("{b}"),
        Data::DateTime(t) => format!("{t}"),
        Data::DateTimeIso(s) | Data::DurationIso(s) => s.clone(),
        Data::Error(e) => format!("#{e:?}"),
    }
}
