//! Notes about how an input was read, gathered while the command line and files are parsed
//! and printed once when the command ends, as warnings with exit code 3.
//!
//! Only readings that are accepted but deserve a second look land here (a pressure written in
//! millipascals, an enthalpy in millijoules): the unit parsers are plain functions used by
//! every command, file header and grid, so a note is gathered here rather than threaded
//! through every caller's return type.

use std::sync::Mutex;

static NOTES: Mutex<Vec<String>> = Mutex::new(Vec::new());

/// Records a note (once: a note already recorded is not repeated).
pub fn push(note: String) {
    let mut notes = NOTES.lock().unwrap_or_else(|p| p.into_inner());
    if !notes.contains(&note) {
        notes.push(note);
    }
}

/// Takes every note recorded so far.
pub fn take() -> Vec<String> {
    let mut notes = NOTES.lock().unwrap_or_else(|p| p.into_inner());
    std::mem::take(&mut *notes)
}
