//! Reading an audited sheet (CSV streamed in chunks; .xlsx row by row through
//! [`crate::xlsx_rows`], with merged cells found) and writing its annotated copy atomically: a temporary file in the same
//! folder, renamed over the output only when complete. The input is never written.

use crate::error::CliError;
use crate::sheet_rows::{kind_of, BadCell, Kind, RawRow};
use crate::xlsx_rows::Sheet;
use std::fs::File;
use std::io::BufReader;
use std::path::{Path, PathBuf};

/// A sheet being read.
pub enum Source {
    Csv {
        reader: csv::Reader<BufReader<File>>,
        headers: Vec<String>,
        /// Spreadsheet row number of the next record (one row per record, as a spreadsheet
        /// program shows a CSV file; the header is row 1).
        next_row: usize,
    },
    /// A worksheet, read row by row.
    Xlsx(Sheet),
}

impl Source {
    /// Opens `path`; `sheet` names the worksheet of a workbook (default: the first).
    pub fn open(path: &Path, sheet: Option<&str>) -> Result<Source, CliError> {
        let err =
            |e: String| CliError::BadInput(format!("cannot read \"{}\": {e}", path.display()));
        match kind_of(path)? {
            Kind::Csv => {
                let f = File::open(path).map_err(|e| err(e.to_string()))?;
                let mut reader = csv::ReaderBuilder::new()
                    .flexible(true)
                    .has_headers(true)
                    .from_reader(BufReader::with_capacity(1 << 20, f));
                let headers = reader
                    .headers()
                    .map_err(|e| err(e.to_string()))?
                    .iter()
                    .map(|h| h.trim().to_string())
                    .collect();
                Ok(Source::Csv {
                    reader,
                    headers,
                    next_row: 2,
                })
            }
            Kind::Xlsx => {
                not_a_workbook(path).map_err(err)?;
                Ok(Source::Xlsx(Sheet::open(path, sheet).map_err(err)?))
            }
        }
    }

    /// The header row.
    pub fn headers(&self) -> &[String] {
        match self {
            Source::Csv { headers, .. } => headers,
            Source::Xlsx(sheet) => &sheet.headers,
        }
    }

    /// The worksheet read, for a workbook.
    pub fn sheet(&self) -> Option<&str> {
        match self {
            Source::Csv { .. } => None,
            Source::Xlsx(sheet) => Some(&sheet.name),
        }
    }

    /// Up to `n` more rows; empty at the end.
    pub fn next_chunk(&mut self, n: usize) -> Vec<RawRow> {
        let mut out = Vec::with_capacity(n);
        match self {
            Source::Csv {
                reader, next_row, ..
            } => {
                while out.len() < n {
                    let line = *next_row;
                    let mut rec = csv::StringRecord::with_capacity(64, 8);
                    match reader.read_record(&mut rec) {
                        Ok(true) => {
                            *next_row += 1;
                            out.push((line, rec, None));
                        }
                        Ok(false) => break,
                        Err(e) => {
                            *next_row += 1;
                            out.push((
                                line,
                                csv::StringRecord::new(),
                                Some(BadCell {
                                    row: line,
                                    column: "-".to_string(),
                                    message: format!("unreadable record: {e}"),
                                }),
                            ));
                            if !matches!(e.kind(), csv::ErrorKind::Utf8 { .. }) {
                                break;
                            }
                        }
                    }
                }
            }
            Source::Xlsx(sheet) => sheet.next_rows(n, &mut out),
        }
        out
    }
}

/// Ok when the file starts as an .xlsx workbook does (a zip archive, "PK\x03\x04"); else a
/// message that says what it looks like instead (a CSV file renamed .xlsx is the usual case).
fn not_a_workbook(path: &Path) -> Result<(), String> {
    use std::io::Read;
    let mut head = [0u8; 512];
    let n = File::open(path)
        .and_then(|mut f| f.read(&mut head))
        .map_err(|e| e.to_string())?;
    let head = &head[..n];
    if head.starts_with(b"PK\x03\x04") {
        return Ok(());
    }
    let text = std::str::from_utf8(head).is_ok_and(|t| !t.contains('\0'));
    Err(if text && head.contains(&b',') {
        "this is not an .xlsx workbook; it looks like CSV text: give it a .csv name".to_string()
    } else if text {
        "this is not an .xlsx workbook; it looks like plain text".to_string()
    } else {
        "this is not an .xlsx workbook (an .xlsx file is a zip archive; this one is not: an \
         old .xls workbook must be saved as .xlsx first)"
            .to_string()
    })
}

/// The annotated copy being written to a temporary file.
pub enum Sink {
    Csv {
        file: Box<std::io::BufWriter<File>>,
        tmp: PathBuf,
        dest: PathBuf,
    },
    /// A workbook whose one sheet is written row by row to a temporary file ("constant
    /// memory" mode of rust_xlsxwriter), so memory does not grow with the sheet.
    Xlsx {
        book: Box<rust_xlsxwriter::Workbook>,
        row: u32,
        tmp: PathBuf,
        dest: PathBuf,
    },
}

/// The temporary path beside `dest`.
fn tmp_path(dest: &Path) -> PathBuf {
    let name = dest
        .file_name()
        .map_or_else(|| "audit".into(), |n| n.to_string_lossy().to_string());
    let ext = dest
        .extension()
        .map_or_else(String::new, |e| format!(".{}", e.to_string_lossy()));
    dest.with_file_name(format!(".{name}.{}.tmp{ext}", std::process::id()))
}

/// Refuses an output that is the input (by canonical path).
pub fn check_output(input: &Path, output: &Path, force: bool) -> Result<(), CliError> {
    let canon_in = std::fs::canonicalize(input).ok();
    let parent = output
        .parent()
        .filter(|p| !p.as_os_str().is_empty())
        .unwrap_or(Path::new("."));
    let canon_out = std::fs::canonicalize(parent)
        .ok()
        .zip(output.file_name())
        .map(|(p, n)| p.join(n));
    if canon_in.is_some() && canon_in == canon_out {
        return Err(CliError::BadInput(format!(
            "--output \"{}\" is the input file; the audit never overwrites its input",
            output.display()
        )));
    }
    crate::output_file::check_target(output, force)
}

fn out_err(e: impl std::fmt::Display) -> CliError {
    CliError::Output(e.to_string())
}

impl Sink {
    /// Starts the copy of kind `kind` bound for `dest`.
    pub fn create(dest: &Path, kind: Kind) -> Result<Sink, CliError> {
        let tmp = tmp_path(dest);
        crate::output_file::track(&tmp);
        Ok(match kind {
            Kind::Csv => {
                let f = File::create(&tmp).map_err(|e| {
                    CliError::Output(format!("cannot create \"{}\": {e}", tmp.display()))
                })?;
                Sink::Csv {
                    file: Box::new(std::io::BufWriter::with_capacity(1 << 20, f)),
                    tmp,
                    dest: dest.to_path_buf(),
                }
            }
            Kind::Xlsx => {
                let mut book = rust_xlsxwriter::Workbook::new();
                book.add_worksheet_with_constant_memory();
                Sink::Xlsx {
                    book: Box::new(book),
                    row: 0,
                    tmp,
                    dest: dest.to_path_buf(),
                }
            }
        })
    }

    /// True when rows can be handed over as CSV bytes ([`Sink::write_csv_bytes`]).
    pub fn takes_bytes(&self) -> bool {
        matches!(self, Sink::Csv { .. })
    }

    /// Writes rows already serialised as CSV (a CSV sink only; a workbook refuses).
    pub fn write_csv_bytes(&mut self, bytes: &[u8]) -> Result<(), CliError> {
        use std::io::Write;
        match self {
            Sink::Csv { file, .. } => file.write_all(bytes).map_err(out_err),
            Sink::Xlsx { .. } => Err(CliError::Output(
                "a workbook copy takes rows, not CSV text".to_string(),
            )),
        }
    }

    /// Writes one row (numbers as numbers in a workbook; `emphasis` in bold).
    pub fn write(&mut self, cells: &csv::StringRecord, emphasis: bool) -> Result<(), CliError> {
        match self {
            Sink::Csv { .. } => {
                let mut w = csv::WriterBuilder::new()
                    .flexible(true)
                    .from_writer(Vec::new());
                w.write_record(cells).map_err(out_err)?;
                let bytes = w.into_inner().map_err(out_err)?;
                self.write_csv_bytes(&bytes)
            }
            Sink::Xlsx { book, row, .. } => {
                let sheet = book.worksheet_from_index(0).map_err(out_err)?;
                let bold = rust_xlsxwriter::Format::new().set_bold();
                for (c, text) in cells.iter().enumerate() {
                    let text = text.to_string();
                    let c = c as u16;
                    let r = match text.parse::<f64>() {
                        Ok(v) if v.is_finite() => sheet.write_number(*row, c, v),
                        _ if emphasis => sheet.write_string_with_format(*row, c, &text, &bold),
                        _ => sheet.write_string(*row, c, &text),
                    };
                    r.map_err(out_err)?;
                }
                *row += 1;
                Ok(())
            }
        }
    }

    /// Completes the file and renames it over the destination.
    pub fn finish(self) -> Result<PathBuf, CliError> {
        let (tmp, dest) = match self {
            Sink::Csv { file, tmp, dest } => {
                file.into_inner()
                    .map_err(out_err)?
                    .sync_all()
                    .map_err(out_err)?;
                (tmp, dest)
            }
            Sink::Xlsx {
                mut book,
                tmp,
                dest,
                ..
            } => {
                if let Err(e) = book.save(&tmp) {
                    let _ = std::fs::remove_file(&tmp);
                    return Err(out_err(e));
                }
                (tmp, dest)
            }
        };
        let renamed = std::fs::rename(&tmp, &dest).map_err(|e| {
            let _ = std::fs::remove_file(&tmp);
            CliError::Output(format!("cannot rename to \"{}\": {e}", dest.display()))
        });
        crate::output_file::untrack(&tmp);
        renamed?;
        Ok(dest)
    }

    /// Removes the temporary file after a failure.
    pub fn abandon(self) {
        let tmp = match self {
            Sink::Csv { tmp, .. } | Sink::Xlsx { tmp, .. } => tmp,
        };
        let _ = std::fs::remove_file(&tmp);
        crate::output_file::untrack(&tmp);
    }
}
