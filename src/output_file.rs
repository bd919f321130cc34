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

/// Installs (once) the handler of Ctrl-C and of the termination signals (SIGTERM, SIGHUP) that
/// removes every temporary output file and exits with status 130, so an interrupted or killed
/// run leaves no partial file behind.
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

/// Refuses to write over anything but a regular file (a folder, a symbolic link, a named
/// pipe, a device, a socket: each named), and over an existing file unless `force`.
pub fn check_target(path: &Path, force: bool) -> Result<(), CliError> {
    let shown = path.display();
    let Ok(meta) = fs::symlink_metadata(path) else {
        return Ok(());
    };
    let ft = meta.file_type();
    let what = if ft.is_dir() {
        Some("a folder")
    } else if ft.is_symlink() {
        Some("a symbolic link")
    } else if ft.is_file() {
        None
    } else {
        Some(special_kind(&ft))
    };
    if let Some(what) = what {
        return Err(CliError::BadInput(format!(
            "--output \"{shown}\" is {what}; zfactor writes only regular files and never \
             replaces anything else, even with --force; give a file name"
        )));
    }
    if !force {
        return Err(CliError::BadInput(format!(
            "\"{shown}\" exists already; pass --force to overwrite it"
        )));
    }
    Ok(())
}

/// The kind of a file that is neither a regular file, a folder nor a link.
#[cfg(unix)]
fn special_kind(ft: &fs::FileType) -> &'static str {
    use std::os::unix::fs::FileTypeExt;
    if ft.is_fifo() {
        "a named pipe (FIFO)"
    } else if ft.is_char_device() || ft.is_block_device() {
        "a device file"
    } else if ft.is_socket() {
        "a socket"
    } else {
        "not a regular file"
    }
}

/// The kind of a file that is neither a regular file, a folder nor a link.
#[cfg(not(unix))]
fn special_kind(_ft: &fs::FileType) -> &'static str {
    "not a regular file"
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
    check_target(path, force)?;
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
