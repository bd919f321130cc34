//! A command run from one JSON object of its long options, answered with the JSON report the
//! command line prints for `--format json`: the web API (`crate::serve`) and the Python
//! binding call the commands this way, so both have the command line's validation, units,
//! messages and warnings by construction.
//!
//! - [`request`]: the commands served and their options (none names a file), and the body
//!   read as the command line it stands for;
//! - [`call`]: parse, check the size, run, and the report as JSON with the input notes.

pub mod request;

use crate::cli::{Cli, Command};
use crate::commands::{compare, envelope, flash, saturation, state, table};
use crate::compare::grid;
use crate::error::CliError;
use crate::exit::Exit;
use crate::render::json;
use crate::render::output::Output;
use crate::{input_notes, units};
use clap::Parser;
use request::{Endpoint, Refusal};

/// The most states a comparison or a table computes for one call (the command line has no
/// such limit; a page or a notebook call that wants more should use the command line or the
/// array functions).
pub const MAX_STATES: usize = 10_000;

/// A report: the command line's JSON, with the input notes among its warnings, and the exit
/// code the command line gives (0, or 3 with warnings).
#[derive(Debug, Clone)]
pub struct Answer {
    pub json: String,
    pub exit: Exit,
}

/// Why a call gave no report: the message (the command line's own where it has one), the
/// exit code the command line would give, and the HTTP status the web API answers with.
#[derive(Debug, Clone)]
pub struct Failure {
    pub message: String,
    pub exit: Exit,
    pub status: u16,
}

impl From<Refusal> for Failure {
    fn from(r: Refusal) -> Failure {
        Failure {
            message: r.message,
            exit: Exit::BadInput,
            status: r.status,
        }
    }
}

impl From<&CliError> for Failure {
    fn from(e: &CliError) -> Failure {
        let exit = e.exit_code();
        Failure {
            message: e.to_string(),
            exit,
            status: if exit == Exit::BadInput { 422 } else { 500 },
        }
    }
}

/// Runs `command` with the options of the JSON object `body`.
pub fn call(command: &str, body: &[u8]) -> Result<Answer, Failure> {
    let endpoint = Endpoint::named(command).ok_or_else(|| {
        Refusal::new(
            404,
            format!(
                "no command \"{command}\" here; there are: {}",
                request::ENDPOINTS.map(|e| e.command).join(", ")
            ),
        )
    })?;
    let words = request::argv(endpoint, body)?;
    let cli = Cli::try_parse_from(&words)
        .map_err(|e| Refusal::new(422, e.to_string().trim_end().to_string()))?;
    let (outcome, notes) = input_notes::scoped(|| {
        check_size(&cli.command).map_err(Failure::from)?;
        report(&cli.command).map_err(|e| Failure::from(&e))
    });
    finish(outcome, &notes)
}

/// The answer of a report and its warnings, with the input notes gathered meanwhile.
fn finish(
    outcome: Result<(String, Vec<String>), Failure>,
    notes: &[String],
) -> Result<Answer, Failure> {
    let (text, warnings) = outcome?;
    let exit = if warnings.is_empty() && notes.is_empty() {
        Exit::Success
    } else {
        Exit::SuccessWithWarnings
    };
    Ok(Answer {
        json: with_notes(text, notes),
        exit,
    })
}

/// Audits the sheet `file` (CSV or .xlsx) with the options of the JSON object `body` (those of
/// [`request::AUDIT`]) and writes its annotated copy to `output` (replacing a file there):
/// the Python binding's audit of a data frame, which it writes to `file` first. The answer
/// is the audit's JSON summary.
pub fn audit(
    file: &std::path::Path,
    output: &std::path::Path,
    body: &[u8],
) -> Result<Answer, Failure> {
    let leading = [
        file.display().to_string(),
        format!("--output={}", output.display()),
        "--force".to_string(),
    ];
    let words = request::argv_with(request::AUDIT, &leading, body)?;
    let cli = Cli::try_parse_from(&words)
        .map_err(|e| Refusal::new(422, e.to_string().trim_end().to_string()))?;
    let Command::Audit(args) = &cli.command else {
        return Err(Refusal::new(500, "not an audit").into());
    };
    let (outcome, notes) = input_notes::scoped(|| {
        let r = crate::commands::audit::run(args).map_err(|e| Failure::from(&e))?;
        let text = json::to_string(&r).map_err(|e| Failure::from(&e))?;
        Ok::<_, Failure>((text, r.warnings.clone()))
    });
    finish(outcome, &notes)
}

/// The report's JSON with the input notes added to its `warnings` (the command line prints
/// them on stderr as warnings).
fn with_notes(text: String, notes: &[String]) -> String {
    if notes.is_empty() {
        return text;
    }
    let Ok(mut value) = serde_json::from_str::<serde_json::Value>(&text) else {
        return text;
    };
    if let Some(serde_json::Value::Array(w)) = value.get_mut("warnings") {
        w.extend(notes.iter().cloned().map(serde_json::Value::String));
    }
    json::to_string(&value).unwrap_or(text)
}

/// Refuses a comparison or table of more than [`MAX_STATES`] states (413). Axes that cannot
/// be read are left to the command, which says why.
fn check_size(command: &Command) -> Result<(), Refusal> {
    let (t, p, ambient) = match command {
        Command::Compare(a) => match (&a.temperatures, &a.pressures) {
            (Some(t), Some(p)) => (t, p, &a.ambient),
            _ => return Ok(()),
        },
        Command::Table(a) => (&a.temperatures, &a.pressures, &a.ambient),
        _ => return Ok(()),
    };
    let Ok(ambient) = units::ambient_pressure(ambient) else {
        return Ok(());
    };
    let nt = grid::parse_axis(t, units::temperature).map_or(0, |v| v.len());
    let np = grid::parse_axis(p, |s| units::pressure_reading(s, ambient).map(|r| r.0))
        .map_or(0, |v| v.len());
    if nt.saturating_mul(np) > MAX_STATES {
        return Err(Refusal::new(
            413,
            format!(
                "{nt} temperatures x {np} pressures = {} states; one call computes at most \
                 {MAX_STATES} (the command line has no such limit)",
                nt.saturating_mul(np)
            ),
        ));
    }
    Ok(())
}

/// The report of a command as JSON, with its warnings.
fn report(command: &Command) -> Result<(String, Vec<String>), CliError> {
    fn out<R: Output>(r: &R) -> Result<(String, Vec<String>), CliError> {
        Ok((json::to_string(r)?, r.warnings().to_vec()))
    }
    match command {
        Command::State(a) => out(&state::run(a)?),
        Command::Saturation(a) => out(&saturation::run(a)?),
        Command::Flash(a) => out(&flash::run(a)?),
        Command::Envelope(a) => out(&envelope::run(a)?),
        Command::Compare(a) => {
            let r = compare::run(a)?;
            Ok((json::to_string(&r)?, r.warnings.clone()))
        }
        Command::Table(a) => {
            let mut text = Vec::new();
            let warnings = table::write(a, &mut text, None)?;
            let text = String::from_utf8(text).map_err(|e| CliError::Output(e.to_string()))?;
            Ok((text, warnings))
        }
        _ => Err(CliError::BadInput(
            "this command is not run from JSON options".to_string(),
        )),
    }
}
