//! Writing an output file safely: never over an input file, never over an existing file
//! unless asked, and atomically (a temporary file in the same folder, then a rename, so a
//! reader sees either the old file or the complete new one, never a partial one).

use crate::error::CliError;
use std::fs;
use std::io::Write;
use std::path::{Path, PathBuf};
use std::sync::{Mutex, Once};

/// Temporary files being written; an interrupt removes them before the process exits.
static PENDING: Mutex<Vec<PathBuf>> = Mutex::new(Vec::new());

fn pending() -> std::sync::MutexGuard<'static, Vec<PathBuf>> {
    PENDING
        .lock()
        .unwrap_or_else(|poisoned| poisoned.into_inner())
}

/// Registers a temporary file written outside [`write_with`] (for example the audit's
/// streamed copy), so that an interrupt removes it.
pub fn track(path: &Path) {
    pending().push(path.to_path_buf());
}

/// Forgets a temporary file registered with [`track`] (renamed into place, or removed).
pub fn untrack(path: &Path) {
    pending().retain(|p| p != path);
}

/// Installs (once) the Ctrl-C handler that removes every temporary output file and exits with
/// status 130, so an interrupted run leaves no partial file behind.
pub fn clean_up_on_interrupt() {
    static ONCE: Once = Once::new();
    ONCE.call_once(|| {
        // If a handler cannot be installed (one exists already), the default behaviour
        // stays: the temporary file, never the output, may remain.
        let _ = ctrlc::set_handler(|| {
            for p in pending().drain(..) {
                let _ = fs::remove_file(p);
            }
            eprintln!("zfactor: interrupted; no output file was written");
            std::process::exit(130);
        });
    });
}

/// True when `a` and `b` name the same existing file.
fn same_file(a: &Path, b: &Path) -> bool {
    match (fs::canonicalize(a), fs::canonicalize(b)) {
        (Ok(x), Ok(y)) => x == y,
        _ => false,
    }
}

/// Writes `bytes` to `path`. Refuses a path that is one of `inputs`, and an existing file
/// unless `force`.
pub fn write(path: &Path, bytes: &[u8], force: bool, inputs: &[&Path]) -> Result<(), CliError> {
    write_with(path, force, inputs, |f, _| {
        f.write_all(bytes)
            .map_err(|e| CliError::Output(format!("{}: {e}", path.display())))
    })
}

/// Like [`write`], but `fill` writes the temporary file: through the open handle, or by the
/// temporary path it is given (for writers that open the file themselves).
pub fn write_with<F>(path: &Path, force: bool, inputs: &[&Path], fill: F) -> Result<(), CliError>
where
    F: FnOnce(&mut fs::File, &Path) -> Result<(), CliError>,
{
    let shown = path.display();
    if inputs.iter().any(|i| same_file(i, path)) {
        return Err(CliError::BadInput(format!(
            "--output \"{shown}\" is one of the input files; choose another name"
        )));
    }
    if path.is_dir() {
        return Err(CliError::BadInput(format!(
            "--output \"{shown}\" is a folder; give a file name"
        )));
    }
    if path.exists() && !force {
        return Err(CliError::BadInput(format!(
            "\"{shown}\" exists already; pass --force to overwrite it"
        )));
    }
    let dir = match path.parent() {
        Some(d) if !d.as_os_str().is_empty() => d.to_path_buf(),
        _ => PathBuf::from("."),
    };
    let name = path
        .file_name()
        .map(|n| n.to_string_lossy().into_owned())
        .ok_or_else(|| CliError::BadInput(format!("\"{shown}\" has no file name")))?;
    let out_err = |e: std::io::Error| CliError::Output(format!("{shown}: {e}"));
    let mut tmp = None;
    for k in 0..100u32 {
        // The temporary name keeps the final extension (some writers choose the file type
        // by it).
        let candidate = dir.join(format!(".tmp-{}-{k}-{name}", std::process::id()));
        match fs::OpenOptions::new()
            .write(true)
            .create_new(true)
            .open(&candidate)
        {
            Ok(f) => {
                pending().push(candidate.clone());
                tmp = Some((candidate, f));
                break;
            }
            Err(e) if e.kind() == std::io::ErrorKind::AlreadyExists => continue,
            Err(e) => return Err(out_err(e)),
        }
    }
    let (tmp_path, mut f) = tmp.ok_or_else(|| {
        CliError::Output(format!(
            "{shown}: no free temporary name in {}",
            dir.display()
        ))
    })?;
    let done = |ok: bool| {
        if !ok {
            let _ = fs::remove_file(&tmp_path);
        }
        pending().retain(|p| p != &tmp_path);
    };
    if let Err(e) = fill(&mut f, &tmp_path) {
        done(false);
        return Err(e);
    }
    let result = f.sync_all().and_then(|_| {
        drop(f);
        fs::rename(&tmp_path, path)
    });
    done(result.is_ok());
    result.map_err(out_err)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn refuses_inputs_and_existing_files_and_leaves_no_temporary() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("t.csv");
        write(&p, b"a\n", false, &[]).unwrap();
        assert_eq!(fs::read(&p).unwrap(), b"a\n");
        let e = write(&p, b"b\n", false, &[]).unwrap_err();
        assert!(e.to_string().contains("--force"), "{e}");
        write(&p, b"b\n", true, &[]).unwrap();
        assert_eq!(fs::read(&p).unwrap(), b"b\n");
        let e = write(&p, b"c\n", true, &[p.as_path()]).unwrap_err();
        assert!(e.to_string().contains("input"), "{e}");
        let names: Vec<_> = fs::read_dir(dir.path()).unwrap().collect();
        assert_eq!(names.len(), 1, "a temporary file was left behind");
    }
}
