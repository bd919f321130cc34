//! zfactor: real-gas Z, density and energy properties from the command line.
//!
//! `main` only runs the command, prints one error message and maps it to an exit code; all
//! the work is in [`zfactor::run`].

use std::process::ExitCode;

fn main() -> ExitCode {
    match zfactor::run(std::env::args_os()) {
        Ok(code) => code.into(),
        Err(e) => {
            eprintln!("zfactor: {e}");
            e.exit_code().into()
        }
    }
}
