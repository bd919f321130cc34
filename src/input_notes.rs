//! Notes about how an input was read, gathered while the command line and files are parsed
//! and printed once when the command ends, as warnings with exit code 3.
//!
//! Only readings that are accepted but deserve a second look land here (a pressure written in
//! millipascals, an enthalpy in millijoules): the unit parsers are plain functions used by
//! every command, file header and grid, so a note is gathered here rather than threaded
//! through every caller's return type. The web server answers many requests at once: each
//! request gathers its own notes with [`scoped`], on the thread that reads its input.

use std::cell::RefCell;
use std::sync::Mutex;

static NOTES: Mutex<Vec<String>> = Mutex::new(Vec::new());

thread_local! {
    /// The notes of the request running on this thread, inside [`scoped`].
    static SCOPE: RefCell<Option<Vec<String>>> = const { RefCell::new(None) };
}

/// Adds `note` to `notes` unless it is there already.
fn add(notes: &mut Vec<String>, note: String) {
    if !notes.contains(&note) {
        notes.push(note);
    }
}

/// Records a note (once: a note already recorded is not repeated).
pub fn push(note: String) {
    let note = SCOPE.with(|s| match s.borrow_mut().as_mut() {
        Some(notes) => {
            add(notes, note);
            None
        }
        None => Some(note),
    });
    if let Some(note) = note {
        add(&mut NOTES.lock().unwrap_or_else(|p| p.into_inner()), note);
    }
}

/// Takes every note recorded so far.
pub fn take() -> Vec<String> {
    let mut notes = NOTES.lock().unwrap_or_else(|p| p.into_inner());
    std::mem::take(&mut *notes)
}

/// Runs `f` with the notes recorded on this thread kept apart from every other thread's, and
/// returns them with its result.
pub fn scoped<T>(f: impl FnOnce() -> T) -> (T, Vec<String>) {
    SCOPE.with(|s| *s.borrow_mut() = Some(Vec::new()));
    let out = f();
    let notes = SCOPE.with(|s| s.borrow_mut().take()).unwrap_or_default();
    (out, notes)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_scope_keeps_its_notes_from_the_process_and_other_threads() {
        let (_, mine) = scoped(|| {
            push("first".to_string());
            push("first".to_string());
            std::thread::spawn(|| {
                let (_, theirs) = scoped(|| push("theirs".to_string()));
                assert_eq!(theirs, vec!["theirs".to_string()]);
            })
            .join()
            .unwrap();
        });
        assert_eq!(mine, vec!["first".to_string()]);
        assert!(!take().iter().any(|n| n == "first" || n == "theirs"));
    }
}
