//! A spreadsheet file as the readers see it: its kind (CSV or workbook, by extension), a row
//! as read, and a bad cell or row with its spreadsheet address.

use crate::error::CliError;
use std::path::Path;

/// A row as read: its spreadsheet row number, its cells as text, and a problem found while
/// reading it (a merged cell, an unreadable record).
pub type RawRow = (usize, csv::StringRecord, Option<BadCell>);

/// The kind of file.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Kind {
    Csv,
    Xlsx,
}

/// The kind of a path by its extension.
pub fn kind_of(path: &Path) -> Result<Kind, CliError> {
    match path
        .extension()
        .and_then(|e| e.to_str())
        .map(str::to_ascii_lowercase)
        .as_deref()
    {
        Some("csv") | Some("txt") => Ok(Kind::Csv),
        Some("xlsx") | Some("xlsm") => Ok(Kind::Xlsx),
        _ => Err(CliError::BadInput(format!(
            "\"{}\": give a .csv or .xlsx file",
            path.display()
        ))),
    }
}

/// A bad cell or row.
#[derive(Debug, Clone, PartialEq)]
pub struct BadCell {
    /// Spreadsheet row number (1 is the header).
    pub row: usize,
    /// Column letter and header, or "-" for the whole row.
    pub column: String,
    pub message: String,
}

/// Spreadsheet column letters of a 0-based index (A, B, ..., Z, AA, ...).
pub fn column_letter(mut i: usize) -> String {
    let mut s = Vec::new();
    loop {
        s.push(b'A' + (i % 26) as u8);
        if i < 26 {
            break;
        }
        i = i / 26 - 1;
    }
    s.reverse();
    String::from_utf8(s).unwrap_or_default()
}
