//! zfactor: real-gas Z, density and energy properties from the command line.
//!
//! `main` only runs the command, prints one error message and maps it to an exit code; all
//! the work is in [`zfactor::run`].

// User input must never panic: no unwrap or expect outside tests.
#![cfg_attr(not(test), deny(clippy::unwrap_used, clippy::expect_used))]

use std::process::ExitCode;

/// mimalloc's per-thread heaps: the audit and the grids allocate from every core at once, and
/// the system allocator's arena locks showed as a quarter of the audit's time (perf).
#[global_allocator]
static ALLOCATOR: mimalloc::MiMalloc = mimalloc::MiMalloc;

fn main() -> ExitCode {
    match zfactor::run(std::env::args_os()) {
        Ok(code) => code.into(),
        Err(e) => {
            eprintln!("zfactor: {e}");
            e.exit_code().into()
        }
    }
}
